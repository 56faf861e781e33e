/**
 * A run of pipe, segment by segment: friction, elevation and fixed losses, and the pressure accumulated along it.
 * US units: gpm, in, ft, psi.
 *
 * The run is walked from the design area back towards the water supply: the first segment starts where the demand
 * is known (start pressure, e.g. the inlet of the design area), and each segment's pressure_after is the pressure
 * needed at its supply-side end:
 *
 *   pressure_after(i) = start + Σ_{j ≤ i} (friction_j + elevation_j + fixed_j)
 *
 * A segment's rise is the height the water climbs through it on its way to the design area (negative for a drop,
 * which gives a gain).
 */
import { fail, n, q } from "./errors";
import { type HeadLoss, elevationPressure, headLoss } from "./friction";
import type { UnitSystem } from "./units";

/**
 * Velocity above which a segment of the run is flagged, in each unit system's own velocity: 20 ft/s, 6 m/s.
 *
 * The visible default of the estimate sheet's velocity limit and of the pane where a workbook gives none.
 * @see (common practice)
 */
export const DEFAULT_VELOCITY_LIMIT: Readonly<Record<UnitSystem, number>> = { US: 20, SI: 6 };


/** One segment of a run. */
export interface Segment {
  /** flow in the segment, gpm (≥ 0) */
  flow: number;
  /** internal diameter, in (> 0) */
  diameter: number;
  /** Hazen-Williams C (> 0) */
  cFactor: number;
  /** pipe length, ft (≥ 0) */
  length: number;
  /** equivalent length of the segment's fittings and valves, ft (≥ 0) */
  fittingLength: number;
  /** height the water climbs through the segment, ft (negative for a drop) */
  rise: number;
  /** a fixed pressure loss in the segment (a backflow preventer, a meter), psi (≥ 0) */
  fixedLoss: number;
}

/** The three losses of one segment, psi (elevation is negative for a drop). */
export interface SegmentLosses {
  friction: number;
  elevation: number;
  fixed: number;
}

/**
 * The losses of one segment: friction, elevation and fixed.
 *
 *   friction  = loss(Q, d, C, length + fitting_length)      loss = 4.52 Q^1.85 / (C^1.85 d^4.87) × L psi
 *   elevation = 0.433 × rise
 *   fixed     = fixed_loss
 *
 * 500 gpm, 4.026 in, C 120, 80 ft + 20 ft of fittings, rise 10 ft, fixed 5 psi: friction 0.07178 × 100 = 7.18 psi,
 * elevation 0.433 × 10 = 4.33 psi, fixed 5 psi.
 *
 * @param s the segment: flow gpm, diameter in, C, lengths and rise ft, fixed loss psi
 * @param hl the head loss of the user's unit system (headLoss(units)), default the [NFPA 13] US form, so that
 *   PIPERUN in SI agrees with FRICTION in SI
 * @returns the three losses, psi
 * @see [NFPA 13] Hazen-Williams and 0.433 psi per ft
 * @example
 * segmentLosses({ flow: 500, diameter: 4.026, cFactor: 120, length: 80, fittingLength: 20, rise: 10, fixedLoss: 5 })
 * // ≈ { friction: 7.18, elevation: 4.33, fixed: 5 } psi
 */
export function segmentLosses(s: Segment, hl: HeadLoss = headLoss("US")): SegmentLosses {
  if (!(s.flow >= 0)) fail("flow", q("flow", s.flow), "must be 0 or more");
  if (!(s.diameter > 0)) fail("diameter", q("diameter", s.diameter), "must be greater than 0");
  if (!(s.cFactor > 0)) fail("c_factor", n(s.cFactor), "must be greater than 0");
  if (!(s.length >= 0)) fail("length", q("length", s.length), "must be 0 or more");
  if (!(s.fittingLength >= 0)) fail("fitting_length", q("length", s.fittingLength), "must be 0 or more");
  if (!Number.isFinite(s.rise)) fail("rise", q("length", s.rise), "must be a finite number");
  if (!(s.fixedLoss >= 0)) fail("fixed_loss", q("pressure", s.fixedLoss), "must be 0 or more");
  return {
    friction: hl.loss(s.flow, s.diameter, s.cFactor, s.length + s.fittingLength),
    elevation: elevationPressure(s.rise),
    fixed: s.fixedLoss,
  };
}

/** What one row of a run holds: nothing, a row that could not be read, or a segment's losses. */
export type RunInput = { kind: "blank" } | { kind: "unreadable" } | { kind: "segment"; losses: SegmentLosses };

/** One row of a walked run. */
export type RunStep =
  | { kind: "blank" }
  | { kind: "unreadable" }
  | {
      kind: "segment";
      losses: SegmentLosses;
      /** start + the losses of every segment up to and including this one, psi (may be below 0: the caller decides) */
      pressureAfter: number;
      /**
       * 1-based row of the first earlier row that broke the chain (unreadable, or its pressure went below 0), or
       * null: where it is set, pressureAfter is not a valid pressure.
       */
      brokenBy: number | null;
    };

/**
 * Walk a run: accumulate the losses of each segment row from the start pressure.
 *
 *   pressure_after(i) = start + Σ_{j ≤ i} (friction_j + elevation_j + fixed_j)
 *
 * Blank rows pass through (a sheet keeps room for more segments); an unreadable row, or a row whose pressure would go
 * below 0, breaks the chain for every later row's pressure (their losses still stand). Start 40 psi; segments of
 * 7.18 + 4.33 + 5 and 2 + (−4.33) + 0 psi: 40 + 16.51 = 56.51 psi, then 56.51 − 2.33 = 54.18 psi.
 *
 * @param start the pressure where the run begins (the demand end), psi (≥ 0)
 * @param rows the rows in order, losses in psi
 * @returns one step per row: the pressure after each segment, psi, and the row that broke the chain, if any
 * @see [NFPA 13] hydraulic calculation procedure (losses summed node by node)
 * @example
 * walkRun(40, [{ kind: "segment", losses: { friction: 7.18, elevation: 4.33, fixed: 5 } },
 *   { kind: "blank" }, { kind: "segment", losses: { friction: 2, elevation: -4.33, fixed: 0 } }])
 * // [0].pressureAfter ≈ 56.51 psi
 * // [1] → { kind: "blank" }
 * // [2].pressureAfter ≈ 54.18 psi
 * // [2].brokenBy → null
 * walkRun(40, [{ kind: "unreadable" }, { kind: "segment", losses: { friction: 2, elevation: 0, fixed: 0 } }])
 * // [1] ≈ { pressureAfter: 42, brokenBy: 1 } psi, row 1
 */
export function walkRun(start: number, rows: readonly RunInput[]): RunStep[] {
  if (!(start >= 0)) fail("start_pressure", q("pressure", start), "must be 0 or more");
  let pressure = start;
  let brokenBy: number | null = null;
  return rows.map((row, i): RunStep => {
    if (row.kind === "blank") return row;
    if (row.kind === "unreadable") {
      brokenBy ??= i + 1;
      return row;
    }
    const { friction, elevation, fixed } = row.losses;
    pressure += friction + elevation + fixed;
    const step: RunStep = { kind: "segment", losses: row.losses, pressureAfter: pressure, brokenBy };
    if (pressure < 0) brokenBy ??= i + 1;
    return step;
  });
}
