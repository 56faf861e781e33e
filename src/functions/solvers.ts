/**
 * The bodies of the range functions and solvers (RUN, SUPPLYCURVE, AREADEMAND, SIZEFOR, PUMPSIZE, PUMPCURVE):
 * reading ranges and arguments, converting SI ↔ US, and shaping the spilled results. The wrappers in ./functions.ts
 * call these inside `cell(...)`; the hydraulics are in the engine.
 *
 * Spill shapes depend only on the arguments as written, never on the values (the preview host sizes a spill from the
 * formula text, src/preview/spill.ts): RUN gives one row per row of `segments`, SUPPLYCURVE `points` rows,
 * AREADEMAND one row of 5, PUMPSIZE one row of 2.
 *
 * Friction in SI work uses the EN 12845 form, as FRICTION does, so that a RUN or an AREADEMAND in SI agrees with a
 * column of FRICTION calls in SI.
 */
import { fail, notInTable, q } from "../engine/errors";
import { headLoss } from "../engine/friction";
import { SUPPLY_CURVE_FLOW_FACTOR, SUPPLY_CURVE_MAX_POINTS, SUPPLY_CURVE_POINTS, supplyCurvePoints } from "../engine/curve";
import { scheduleInfo, scheduleSizes } from "../engine/pipes";
import { DEFAULT_OVERLOAD_RATIO, DEFAULT_SHUTOFF_RATIO, pumpPressure, pumpRating } from "../engine/pump";
import { type RunInput, type RunStep, type Segment, segmentLosses, walkRun } from "../engine/run";
import { solveAreaDemand } from "../engine/tree";
import { type UnitSystem, fromUS } from "../engine/units";
import { SIGNED, ZERO_ALLOWED, isBlank, optionalNumberArg, optionalQuantityArg, quantityArg } from "./args";
import { cellRow } from "./bridge";
import { cFactorArg, flowTestArgs, minPressureArg, pumpRatingArgs } from "./common";
import { scheduleArg } from "./tableCodes";

/** Default Hazen-Williams C of AREADEMAND: black or galvanized steel, wet [NFPA 13]. */
export const DEFAULT_C_FACTOR = 120;

// ─── Ranges ──────────────────────────────────────────────────────────────────────────────────────────────────────

/** A range argument as rows of cells: a 2-D array as Excel hands it over; a lone value counts as a 1 × 1 range. */
export function rangeArg(value: unknown, name: string): unknown[][] {
  if (value === null || value === undefined) fail(name, undefined, "is empty: give a range of cells");
  if (!Array.isArray(value)) return [[value]];
  if (value.length === 0) fail(name, { text: "an empty range" }, "give a range of cells");
  return value.map((row) => (Array.isArray(row) ? row : [row]));
}

/** The columns of a RUN segment row, in order; the first four are required. */
export const RUN_COLUMNS = ["flow", "diameter", "c_factor", "length", "fitting_length", "rise", "fixed_loss"] as const;
const RUN_REQUIRED = 4;
/** Cells of one RUN output row. */
export const RUN_WIDTH = 4;

/**
 * True when a row of a range holds nothing: every cell empty (null or empty text), or every cell 0, which is how
 * older Excel desktop builds hand over an untouched row (a row of zeros is no segment: a diameter of 0 is
 * impossible).
 */
export function isBlankRow(row: readonly unknown[]): boolean {
  return row.every((c) => isBlank(c)) || row.every((c) => c === 0);
}

/** Read one used row of `segments` into a segment in US units; errors name the row (1-based) and the column. */
function readSegment(row: readonly unknown[], r: number, u: UnitSystem): Segment {
  const name = (i: number) => `segments row ${r} ${RUN_COLUMNS[i]}`;
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
 * RUN: one output row per row of `segments`: [friction, elevation, fixed, pressure_after] in the user's units.
 * A blank row gives a row of "" cells; a row that cannot be read gives its error in its 4 cells; a pressure that
 * cannot be known (it would go below 0, or an earlier row has an error) is an error in that row's pressure cell.
 */
export function runRows(segments: unknown, startPressure: unknown, u: UnitSystem): unknown[][] {
  const rows = rangeArg(segments, "segments");
  const width = rows[0].length;
  if (width < RUN_REQUIRED || width > RUN_COLUMNS.length) {
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
      return cellRow(RUN_WIDTH, u, () => {
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

// ─── SUPPLYCURVE ─────────────────────────────────────────────────────────────────────────────────────────────────

/** SUPPLYCURVE: exactly `points` rows of [flow, pressure]; after the flow where the supply reaches 0, ["", ""]. */
export function supplyCurveRows(
  staticP: unknown,
  residual: unknown,
  testFlow: unknown,
  maxFlow: unknown,
  points: unknown,
  u: UnitSystem,
): unknown[][] {
  const t = flowTestArgs(staticP, residual, testFlow, u);
  const qMax = optionalQuantityArg(maxFlow, "max_flow", "flow", u, SUPPLY_CURVE_FLOW_FACTOR * t.testFlow);
  const n = optionalNumberArg(points, "points", SUPPLY_CURVE_POINTS, { integer: true, min: 2, max: SUPPLY_CURVE_MAX_POINTS });
  return supplyCurvePoints(t, qMax, n).map((pt) =>
    pt === null ? ["", ""] : [fromUS("flow", pt[0], u), fromUS("pressure", pt[1], u)],
  );
}

// ─── AREADEMAND ──────────────────────────────────────────────────────────────────────────────────────────────────

/** AREADEMAND: one row [flow, pressure, heads, lines, end_pressure] in the user's units. */
export function areaDemandRow(
  density: unknown,
  area: unknown,
  coverage: unknown,
  kFactor: unknown,
  headSpacing: unknown,
  branchDiameter: unknown,
  mainDiameter: unknown,
  cFactor: unknown,
  minPressure: unknown,
  u: UnitSystem,
): unknown[][] {
  const inp = {
    density: quantityArg(density, "density", "density", u),
    area: quantityArg(area, "area", "area", u),
    coverage: quantityArg(coverage, "coverage", "area", u),
    kFactor: quantityArg(kFactor, "k_factor", "kfactor", u),
    headSpacing: quantityArg(headSpacing, "head_spacing", "length", u),
    branchDiameter: quantityArg(branchDiameter, "branch_diameter", "diameter", u),
    mainDiameter: quantityArg(mainDiameter, "main_diameter", "diameter", u),
    cFactor: isBlank(cFactor) ? DEFAULT_C_FACTOR : cFactorArg(cFactor),
    minPressure: minPressureArg(minPressure, u),
  };
  const r = solveAreaDemand(inp, headLoss(u));
  return [
    [
      fromUS("flow", r.flow, u),
      fromUS("pressure", r.pressure, u),
      r.heads,
      r.lines,
      fromUS("pressure", r.endPressure, u),
    ],
  ];
}

// ─── SIZEFOR ─────────────────────────────────────────────────────────────────────────────────────────────────────

/**
 * SIZEFOR: the smallest nominal size of the schedule whose friction loss over `length` is within `allowed_loss`,
 * as a number a nominal-size argument takes (NPS in US work, e.g. 2.5; DN in SI work, e.g. 65). `#N/A` when even
 * the largest size loses more.
 */
export function sizeFor(flow: unknown, length: unknown, cFactor: unknown, allowedLoss: unknown, schedule: unknown, u: UnitSystem): number {
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

// ─── PUMPSIZE and PUMPCURVE ──────────────────────────────────────────────────────────────────────────────────────

/** PUMPSIZE: one row [rated_flow, rated_pressure] in the user's units. */
export function pumpSizeRow(demandFlow: unknown, boost: unknown, u: UnitSystem): unknown[][] {
  const flow = quantityArg(demandFlow, "demand_flow", "flow", u);
  const b = quantityArg(boost, "boost", "pressure", u, ZERO_ALLOWED);
  if (b === 0) fail("boost", q("pressure", 0), "no pump is needed (PUMPBOOST gives 0 where the supply suffices)");
  const rating = pumpRating(flow, b, u);
  return [[fromUS("flow", rating.ratedFlowGpm, u), rating.ratedPressure]];
}

/**
 * PUMPCURVE: the pump's net pressure at `flow`. Inputs outside the fire pump envelope (a flow beyond 150 % of
 * rated, ratios the envelope does not allow) are `#NUM!`, as the vocabulary says; the error still carries its
 * message (Excel does not show messages on `#NUM!`, the preview host and the tests do). Other bad input is
 * `#VALUE!` with its message.
 */
export function pumpCurvePressure(
  flow: unknown,
  ratedFlow: unknown,
  ratedPressure: unknown,
  shutoffRatio: unknown,
  overloadRatio: unknown,
  u: UnitSystem,
): number {
  const q = quantityArg(flow, "flow", "flow", u, ZERO_ALLOWED);
  const { ratedFlow: qr, ratedPressure: pr } = pumpRatingArgs(ratedFlow, ratedPressure, u);
  const s = optionalNumberArg(shutoffRatio, "shutoff_ratio", DEFAULT_SHUTOFF_RATIO);
  const o = optionalNumberArg(overloadRatio, "overload_ratio", DEFAULT_OVERLOAD_RATIO);
  return fromUS("pressure", pumpPressure(q, qr, pr, s, o), u); // outside the envelope: a "number" problem, #NUM!
}
