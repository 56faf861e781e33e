/**
 * Cell functions of the piping: Hazen-Williams friction (FRICTION, FRICTIONRATE), velocity, elevation, a run of pipe
 * segment by segment (PIPERUN), pipe sizing (SIZEFOR) and the pipe, C-factor and fitting tables (PIPEID, CFACTOR,
 * FITTINGLENGTH, FITTINGS). Friction comes from the engine's one head-loss interface (headLoss(units)): the NFPA 13
 * form in US work, the EN 12845 form in SI work, the same in every function.
 */
import { hazenWilliamsC } from "../engine/cfactor";
import { fail, finiteOr, notInTable, q, q as qty } from "../engine/errors";
import { TABLE_C_FACTOR, equivalentLength } from "../engine/fittings";
import { elevationPressure, headLoss, velocity as pipeVelocity } from "../engine/friction";
import { internalDiameter, scheduleInfo, scheduleSizes } from "../engine/pipes";
import { type RunInput, type RunStep, type Segment, segmentLosses, walkRun } from "../engine/run";
import { type UnitSystem, fromUS } from "../engine/units";
import { SIGNED, ZERO_ALLOWED, isBlank, isBlankRow, optionalQuantityArg, quantityArg, quantityIn, quantitySpan, rangeArg } from "./args";
import { cell, cellRow } from "./bridge";
import { cFactorArg } from "./common";
import { fittingArg, fittingListArg } from "./fittingList";
import { nominalArg } from "./nominal";
import type { SpillShape } from "./shapes";
import { materialArg, scheduleArg, systemArg } from "./tableCodes";

// ─── Friction, velocity, elevation ───────────────────────────────────────────────────────────────────────────────────────
/**
 * Friction loss over a length of pipe, Hazen-Williams: 4.52 Q^1.85 / (C^1.85 d^4.87) psi/ft × length (NFPA 13);
 * in SI the EN 12845 form 6.05e5 Q^1.85 / (C^1.85 d^4.87) bar/m.
 * @customfunction
 * @param flow Flow in the pipe (gpm; SI: L/min).
 * @param diameter Actual internal diameter (in; SI: mm); use PIPEID for a nominal size.
 * @param c_factor Hazen-Williams C (e.g. 120 for wet steel; CFACTOR gives the table value).
 * @param length Pipe length plus fitting equivalent length (ft; SI: m).
 * @param units "US" (default) or "SI".
 * @returns Friction loss (psi; SI: bar).
 */
export function friction(flow: any, diameter: any, c_factor: any, length: any, units?: any): number {
  return cell(units, frictionLoss, flow, diameter, c_factor, length);
}

/** The spans of a pipe's flow (0 allowed), internal diameter and length (0 allowed). */
const PIPE_FLOW = quantitySpan("flow", ZERO_ALLOWED);
const PIPE_DIAMETER = quantitySpan("diameter");
const PIPE_LENGTH = quantitySpan("length", ZERO_ALLOWED);

/** FRICTION's body (a constant of the module, so that a recalculation makes no closure and it inlines). */
const frictionLoss = (u: UnitSystem, flow: unknown, diameter: unknown, cFactor: unknown, length: unknown): number => {
  const q = quantityIn(flow, "flow", PIPE_FLOW, u);
  const d = quantityIn(diameter, "diameter", PIPE_DIAMETER, u);
  const c = cFactorArg(cFactor);
  const l = quantityIn(length, "length", PIPE_LENGTH, u);
  return fromUS("pressure", frictionResult(headLoss(u).loss(q, d, c, l), d), u);
};

/**
 * Friction loss per unit length of pipe, Hazen-Williams (NFPA 13; SI: EN 12845).
 * @customfunction
 * @param flow Flow in the pipe (gpm; SI: L/min).
 * @param diameter Actual internal diameter (in; SI: mm).
 * @param c_factor Hazen-Williams C.
 * @param units "US" (default) or "SI".
 * @returns Loss per length (psi/ft; SI: bar/m).
 */
export function frictionrate(flow: any, diameter: any, c_factor: any, units?: any): number {
  return cell(units, frictionRateOf, flow, diameter, c_factor);
}

/** FRICTIONRATE's body (a constant of the module, as FRICTION's). */
const frictionRateOf = (u: UnitSystem, flow: unknown, diameter: unknown, cFactor: unknown): number => {
  const q = quantityIn(flow, "flow", PIPE_FLOW, u);
  const d = quantityIn(diameter, "diameter", PIPE_DIAMETER, u);
  const c = cFactorArg(cFactor);
  return fromUS("frictionRate", frictionResult(headLoss(u).rate(q, d, c), d), u);
};

/**
 * A friction result as a cell may show it, 0 or more and finite; otherwise the problem, named on the diameter (the
 * input whose smallness drives a loss past any number). The comparisons first: the problem is built only when one
 * fails.
 */
function frictionResult(x: number, d: number): number {
  return x >= 0 && x <= Number.MAX_VALUE ? x : finiteOr(x, "diameter", qty("diameter", d));
}

/**
 * Mean water velocity in a pipe: flow ÷ bore area (v = 0.4085 Q / d² ft/s).
 * @customfunction
 * @param flow Flow in the pipe (gpm; SI: L/min).
 * @param diameter Actual internal diameter (in; SI: mm).
 * @param units "US" (default) or "SI".
 * @returns Velocity (ft/s; SI: m/s).
 */
export function velocity(flow: any, diameter: any, units?: any): number {
  return cell(units, (u) => {
    const q = quantityArg(flow, "flow", "flow", u, ZERO_ALLOWED);
    const d = quantityArg(diameter, "diameter", "diameter", u);
    return fromUS("velocity", finiteOr(pipeVelocity(q, d), "diameter", qty("diameter", d)), u);
  });
}

/**
 * Pressure to lift water through a rise: 0.433 psi per ft (NFPA 13). A negative rise (a drop) gives a gain: a
 * negative result, allowed here alone.
 * @customfunction
 * @param rise Height from the lower to the upper point (ft; SI: m); negative for a drop.
 * @param units "US" (default) or "SI".
 * @returns Elevation pressure (psi; SI: bar).
 */
export function elevation(rise: any, units?: any): number {
  return cell(units, (u) => {
    const h = quantityArg(rise, "rise", "length", u, SIGNED);
    return fromUS("pressure", elevationPressure(h), u);
  });
}

// ─── PIPERUN ─────────────────────────────────────────────────────────────────────────────────────────────────────────────
/** The columns of a PIPERUN segment row, in order; the first four are required. */
export const PIPERUN_COLUMNS = ["flow", "diameter", "c_factor", "length", "fitting_length", "rise", "fixed_loss"] as const;
const PIPERUN_REQUIRED = 4;
/** PIPERUN's output columns, one row per segment row. */
export const PIPERUN_OUTPUT_COLUMNS = ["friction", "elevation", "fixed", "pressure_after"] as const;
/** PIPERUN spills one row per row of `segments`. */
export const PIPERUN_SPILL: SpillShape = { rows: { rowsOf: "segments" }, columns: PIPERUN_OUTPUT_COLUMNS.length };

/**
 * A run of pipe, segment by segment, from the design area back to the supply: friction (Hazen-Williams, NFPA 13;
 * SI: EN 12845), elevation (0.433 psi per ft) and fixed losses of each row, and the pressure needed after it,
 * start_pressure plus every loss so far. One output row per row of the range; a blank row gives blank cells.
 * @customfunction
 * @param segments Range, one row a segment: flow (gpm; SI: L/min), internal diameter (in; SI: mm), C factor, length (ft; SI: m), and optionally fitting equivalent length (ft; SI: m), rise towards the design area (ft; SI: m; negative for a drop) and a fixed loss (psi; SI: bar).
 * @param start_pressure Pressure needed where the run begins, e.g. the design area's inlet (psi; SI: bar); default 0.
 * @param units "US" (default) or "SI".
 * @returns Rows of [friction, elevation, fixed, pressure_after] (psi; SI: bar).
 */
export function piperun(segments: any[][], start_pressure?: any, units?: any): any[][] {
  return cell(units, (u) => pipeRunRows(segments, start_pressure, u));
}

/** Read one used row of `segments` into a segment in US units; errors name the row (1-based) and the column. */
function readSegment(row: readonly unknown[], r: number, u: UnitSystem): Segment {
  const name = (i: number) => `segments row ${r} ${PIPERUN_COLUMNS[i]}`;
  const cellAt = (i: number) => (i < row.length ? row[i] : null);
  const optional = (i: number, read: (v: unknown, n: string) => number) => (isBlank(cellAt(i)) ? 0 : read(cellAt(i), name(i)));
  return {
    flow: quantityArg(cellAt(0), name(0), "flow", u, ZERO_ALLOWED),
    diameter: quantityArg(cellAt(1), name(1), "diameter", u),
    cFactor: cFactorArg(cellAt(2), name(2)),
    length: quantityArg(cellAt(3), name(3), "length", u, ZERO_ALLOWED),
    fittingLength: optional(4, (v, n) => quantityArg(v, n, "length", u, ZERO_ALLOWED)),
    rise: optional(5, (v, n) => quantityArg(v, n, "length", u, SIGNED)),
    fixedLoss: optional(6, (v, n) => quantityArg(v, n, "pressure", u, ZERO_ALLOWED)),
  };
}

/**
 * PIPERUN: one output row per row of `segments`: [friction, elevation, fixed, pressure_after] in the user's units.
 * A blank row gives a row of "" cells; a row that cannot be read gives its error in its 4 cells; a pressure that
 * cannot be known (it would go below 0, or an earlier row has an error) is an error in that row's pressure cell.
 */
function pipeRunRows(segments: unknown, startPressure: unknown, u: UnitSystem): unknown[][] {
  const rows = rangeArg(segments, "segments");
  const width = rows[0].length;
  if (width < PIPERUN_REQUIRED || width > PIPERUN_COLUMNS.length) {
    fail(
      "segments",
      { text: `a range ${width} column${width === 1 ? "" : "s"} wide` },
      "must be 4 to 7 columns: flow, diameter, c_factor, length, [fitting_length], [rise], [fixed_loss]",
    );
  }
  const start = optionalQuantityArg(startPressure, "start_pressure", "pressure", u, 0, ZERO_ALLOWED);
  const hl = headLoss(u);

  const inputs: RunInput[] = [];
  const problems = new Map<number, unknown>();
  rows.forEach((row, i) => {
    if (isBlankRow(row)) {
      inputs.push({ kind: "blank" });
      return;
    }
    try {
      inputs.push({ kind: "segment", losses: segmentLosses(readSegment(row, i + 1, u), hl) });
    } catch (e) {
      problems.set(i, e);
      inputs.push({ kind: "unreadable" });
    }
  });

  const p = (psi: number) => fromUS("pressure", psi, u);
  return walkRun(start, inputs).map((step, i) => {
    const r = i + 1;
    if (step.kind === "blank") return ["", "", "", ""];
    if (step.kind === "unreadable") {
      return cellRow(PIPERUN_OUTPUT_COLUMNS.length, u, () => {
        throw problems.get(i);
      });
    }
    const { friction, elevation, fixed } = step.losses;
    // finite: every input is bounded (diameter ≥ 0.1 in, C ≥ 10, flow and length at most 100,000)
    const losses = [p(friction), p(elevation), p(fixed)];
    return [...losses, pressureCell(step, r, u)];
  });
}

/** The pressure_after cell of a segment row: the pressure, or an error value saying why it is not known. */
function pressureCell(step: Extract<RunStep, { kind: "segment" }>, r: number, u: UnitSystem): number | string | CustomFunctions.Error {
  return cellRow(1, u, () => {
    if (step.brokenBy !== null) {
      fail(`segments row ${r} pressure_after`, undefined, `is not known, because row ${step.brokenBy} has an error`);
    }
    if (step.pressureAfter < 0) {
      fail(
        `segments row ${r} pressure_after`,
        q("pressure", step.pressureAfter),
        "must not fall below 0: the drops gain more than start_pressure and the losses before them; " +
          "check rise (negative for a drop) or raise start_pressure",
      );
    }
    return [fromUS("pressure", step.pressureAfter, u)];
  })[0];
}

// ─── SIZEFOR ─────────────────────────────────────────────────────────────────────────────────────────────────────────────
/**
 * Smallest nominal size of a pipe schedule whose Hazen-Williams friction loss over the length stays within the
 * allowed loss; #N/A when even the largest size loses more. The result is a nominal size PIPEID takes.
 * @customfunction
 * @param flow Flow in the pipe (gpm; SI: L/min).
 * @param length Pipe length plus fitting equivalent length (ft; SI: m).
 * @param c_factor Hazen-Williams C.
 * @param allowed_loss Largest friction loss allowed over the length (psi; SI: bar).
 * @param schedule "10", "40" (default), "CPVC", "K", "L", "M", "DR14" or "DR18".
 * @param units "US" (default) or "SI".
 * @returns Nominal size (NPS in inches, e.g. 2.5; SI: DN, e.g. 65).
 */
export function sizefor(flow: any, length: any, c_factor: any, allowed_loss: any, schedule?: any, units?: any): number {
  return cell(units, (u) => sizeFor(flow, length, c_factor, allowed_loss, schedule, u));
}

/**
 * SIZEFOR: the smallest nominal size of the schedule whose friction loss over `length` is within `allowed_loss`,
 * as a number a nominal-size argument takes (NPS in US work, e.g. 2.5; DN in SI work, e.g. 65). `#N/A` when even
 * the largest size loses more.
 */
function sizeFor(flow: unknown, length: unknown, cFactor: unknown, allowedLoss: unknown, schedule: unknown, u: UnitSystem): number {
  const qf = quantityArg(flow, "flow", "flow", u);
  const l = quantityArg(length, "length", "length", u);
  const c = cFactorArg(cFactor);
  const allowed = quantityArg(allowedLoss, "allowed_loss", "pressure", u);
  const s = scheduleArg(schedule);
  const hl = headLoss(u);
  const sizes = scheduleSizes(s);
  const lossOf = (id: number) => hl.loss(qf, id, c, l);
  const found = sizes.find((size) => lossOf(size.id) <= allowed * (1 + 1e-12));
  if (!found) {
    const largest = sizes[sizes.length - 1];
    const label = u === "SI" ? `DN ${largest.dn}` : `${largest.label} in`;
    notInTable(
      "allowed_loss",
      q("pressure", allowed),
      `even the largest ${scheduleInfo(s).name}, ${label} ({0} bore), loses {1} over {2} at {3}`,
      q("diameter", largest.id),
      q("pressure", lossOf(largest.id)),
      q("length", l),
      q("flow", qf),
    );
  }
  return u === "SI" ? found.dn : found.nominal;
}

// ─── Pipe, C-factor and fitting tables ───────────────────────────────────────────────────────────────────────────────────
/**
 * Internal diameter of a pipe from its nominal size and schedule, read from the pipe tables (ASME B36.10M steel;
 * ASTM F442 CPVC, ASTM B88 copper, AWWA C900 PVC with ID = OD × (1 − 2/DR)).
 * @customfunction
 * @param nominal Nominal size: 2, 2.5, "2-1/2", "2 1/2" or "2½" (SI: DN, e.g. 65).
 * @param schedule "10", "40" (default), "CPVC" (SDR 13.5), "K", "L", "M" (copper), "DR14" or "DR18" (C900 PVC).
 * @param units "US" (default) or "SI".
 * @returns Internal diameter (in; SI: mm).
 */
export function pipeid(nominal: any, schedule?: any, units?: any): number {
  return cell(units, (u) => {
    const s = scheduleArg(schedule);
    const n = nominalArg(nominal, "nominal", s, u);
    return fromUS("diameter", internalDiameter(n, s), u);
  });
}

/**
 * Hazen-Williams C of new pipe from the NFPA 13 C table, by material and system type.
 * @customfunction
 * @param material "steel" (black), "galvanized", "plastic", "cpvc", "copper", "stainless", "brass", "ductile" or "cast" (unlined), "lined ductile" (cement-lined), "asbestos cement", "concrete".
 * @param system "wet" (default; deluge reads as wet) or "dry" (preaction, single or double interlock, reads as dry).
 * @returns C factor.
 */
export function cfactor(material: any, system?: any): number {
  return cell(null, () => hazenWilliamsC(materialArg(material), systemArg(system)));
}

/**
 * Equivalent pipe length of one fitting or valve (NFPA 13 chart, Schedule 40 steel at C 120), adjusted by
 * (C / 120)^1.85 and by (internal diameter / Schedule 40 internal diameter)^4.87. #N/A where the chart has no value.
 * @customfunction
 * @param fitting EE (45° elbow), E (elbow), LtE (long-turn elbow), T (tee or cross), BV (butterfly), GV (gate) or CV (check); plain words too.
 * @param nominal Nominal size: 2, 2.5, "2-1/2", "2½" (SI: DN, e.g. 65).
 * @param c_factor Hazen-Williams C of the pipe; default 120.
 * @param schedule Pipe the fitting sits in: "40" (default), "10", "CPVC", "K", "L", "M", "DR14", "DR18".
 * @param units "US" (default) or "SI".
 * @returns Equivalent length (ft; SI: m).
 */
export function fittinglength(fitting: any, nominal: any, c_factor?: any, schedule?: any, units?: any): number {
  return cell(units, (u) => {
    const f = fittingArg(fitting);
    const s = scheduleArg(schedule);
    const n = nominalArg(nominal, "nominal", s, u);
    const c = isBlank(c_factor) ? TABLE_C_FACTOR : cFactorArg(c_factor);
    return fromUS("length", equivalentLength(f, n, c, s), u);
  });
}

/**
 * Total equivalent pipe length of a list of fittings and valves such as "2E T GV", "E, E, T, CV" or
 * "elbow tee check" (counts lead: "2E" is two elbows), each adjusted as in FITTINGLENGTH.
 * @customfunction
 * @param list Fittings: codes EE, E, LtE, T, BV, GV, CV or plain words, separated by spaces or commas, with counts.
 * @param nominal Nominal size: 2, 2.5, "2-1/2", "2½" (SI: DN, e.g. 65).
 * @param c_factor Hazen-Williams C of the pipe; default 120.
 * @param schedule Pipe the fittings sit in: "40" (default), "10", "CPVC", "K", "L", "M", "DR14", "DR18".
 * @param units "US" (default) or "SI".
 * @returns Total equivalent length (ft; SI: m).
 */
export function fittings(list: any, nominal: any, c_factor?: any, schedule?: any, units?: any): number {
  return cell(units, (u) => {
    const items = fittingListArg(list);
    const s = scheduleArg(schedule);
    const n = nominalArg(nominal, "nominal", s, u);
    const c = isBlank(c_factor) ? TABLE_C_FACTOR : cFactorArg(c_factor);
    const total = items.reduce((sum, { fitting, count }) => sum + count * equivalentLength(fitting, n, c, s), 0);
    return fromUS("length", total, u);
  });
}
