/**
 * The design area of a tree system, solved sprinkler by sprinkler. US units: gpm, psi, in, ft, ft², gpm/ft².
 *
 * A rectangular design area at the far end of a tree system: end-fed branch lines on one side of a cross main.
 * The method (../shared/spec/functions.md, "AREADEMAND: the solve it must do"):
 *
 * 1. n = ceil(A / coverage) sprinklers flow; m = ceil(1.2 √A / S) per line (at most n); L = ceil(n / m) lines,
 *    the line nearest the feed flowing r = n − (L − 1) m. Line spacing = coverage / S. Plausibility bounds keep
 *    every loop short: n at most MAX_DESIGN_AREA_SPRINKLERS, coverage at least MIN_COVERAGE_FT2, S at least
 *    MIN_HEAD_SPACING_FT, line spacing at least MIN_LINE_SPACING_FT; beyond them the input is an error.
 * 2. The most remote sprinkler flows q1 = max(density × coverage, K √Pmin) at p1 = max((q1 / K)², Pmin).
 * 3. Walking back along the line, each pipe between sprinklers carries the sum of the flows beyond it; its
 *    Hazen-Williams loss over S (branch diameter) gives the next sprinkler's pressure, and that sprinkler flows K √p.
 *    One more S of pipe carrying the whole line's flow reaches the cross main: Q_line, P_line.
 * 4. Each further line, fed at the cross-main pressure P found at it, flows K_line √P, K_line = Q_line / √P_line.
 *    The remote lines are full; the line nearest the feed, when it flows fewer sprinklers, is solved on its own the
 *    same way (its own r-sprinkler walk from q1, p1 gives its own K_line). Between lines the cross main (main
 *    diameter) loses its Hazen-Williams loss over the line spacing, carrying the flow of every line beyond.
 * 5. Result: flow and pressure in the cross main at the last line (the one nearest the feed), sprinklers flowing,
 *    lines, and the end-sprinkler pressure p1. No elevation.
 *
 * A line fed at P instead of P_line flows as the solved line scaled by √(P / P_line): every sprinkler's pressure is
 * multiplied by P / P_line and its flow by √(P / P_line), so each still flows K √p and the line totals K_line √P.
 *
 * A design by number of sprinklers (HEADSDEMAND: storage, high-K and early-suppression sprinklers) walks the same lines
 * (steps 3 to 5) with step 1 given instead of derived: n sprinklers, m on each full line, the line spacing; and the
 * end sprinkler of step 2 at the minimum pressure, q1 = K √Pmin at p1 = Pmin.
 */
import { fail, n, q } from "./errors";
import { type HeadLoss, headLoss } from "./friction";
import type { Quantity } from "./units";
import {
  DESIGN_AREA_LENGTH_FACTOR,
  MAX_DESIGN_AREA_SPRINKLERS,
  MIN_HEAD_SPACING_FT,
  ceilCount,
  headCount,
  headDischarge,
  headFlow,
  headPressure,
  headsPerLine,
} from "./sprinkler";

/**
 * The closest spacing of the branch lines (coverage ÷ head spacing), ft.
 *
 * The same floor as MIN_HEAD_SPACING_FT, half the usual 6 ft between sprinklers: closer lines are a typing error, not
 * a layout.
 * @see (common practice)
 */
export const MIN_LINE_SPACING_FT = 3;

/**
 * The smallest floor area one sprinkler may protect, ft².
 *
 * The closest head spacing by the closest line spacing, 3 ft × 3 ft = 9 ft². A smaller coverage is a typing error (a
 * coverage in m² is still above it: 9.3 m² is 100 ft²), and it would make the design area hold absurdly many
 * sprinklers.
 * @see (common practice)
 */
export const MIN_COVERAGE_FT2 = MIN_HEAD_SPACING_FT * MIN_LINE_SPACING_FT;

/**
 * Hazen-Williams C of AREADEMAND when none is given: black or galvanized steel, wet, dimensionless.
 * @see [NFPA 13] Hazen-Williams C value table
 */
export const DEFAULT_C_FACTOR = 120;

/** The sprinklers and pipes of a tree system's design area, US units: what every walk of its lines needs. */
export interface TreePipes {
  /** sprinkler K-factor, gpm/psi^0.5 */
  kFactor: number;
  /** distance between sprinklers along a branch line, ft */
  headSpacing: number;
  /** internal diameter of the branch lines, in */
  branchDiameter: number;
  /** internal diameter of the cross main, in */
  mainDiameter: number;
  /** Hazen-Williams C of both */
  cFactor: number;
}

/** The inputs of a design-area solve, US units. */
export interface AreaDemandInput extends TreePipes {
  /** design density, gpm/ft² */
  density: number;
  /** design area, ft² */
  area: number;
  /** floor area per sprinkler, ft² */
  coverage: number;
  /** minimum sprinkler operating pressure, psi */
  minPressure: number;
}

/** The inputs of a design by number of sprinklers, US units. */
export interface HeadsDemandInput extends TreePipes {
  /** sprinklers flowing, a whole number from 1 to MAX_DESIGN_AREA_SPRINKLERS */
  heads: number;
  /** sprinklers on each full line, a whole number from 1 to heads */
  headsPerLine: number;
  /** pressure of the most remote sprinkler, psi */
  minPressure: number;
  /** distance between branch lines along the cross main, ft */
  lineSpacing: number;
}

/** One flowing sprinkler of the solved area. */
export interface SolvedSprinkler {
  /** 1 = the most remote line */
  line: number;
  /** 1 = the end sprinkler of its line */
  position: number;
  /** gpm */
  flow: number;
  /** psi */
  pressure: number;
}

/** The solved design area. */
export interface AreaDemand {
  /** flow in the cross main at the last line of the area, gpm */
  flow: number;
  /** pressure in the cross main there, psi */
  pressure: number;
  /** sprinklers flowing, n */
  heads: number;
  /** branch lines flowing, L */
  lines: number;
  /** pressure at the most remote sprinkler, psi */
  endPressure: number;
  /** sprinklers on each full line, m */
  headsPerLine: number;
  /** coverage / head spacing, ft */
  lineSpacing: number;
  /** each line's flow, gpm, most remote first */
  lineFlows: number[];
  /** the cross-main pressure at each line, psi, most remote first */
  linePressures: number[];
  /** every flowing sprinkler, when asked for (detail = true) */
  sprinklers?: SolvedSprinkler[];
}

/** A branch line solved from its end sprinkler. */
interface SolvedLine {
  flows: number[];
  pressures: number[];
  /** flow at the cross main, gpm */
  inletFlow: number;
  /** pressure at the cross main, psi */
  inletPressure: number;
}

/**
 * Walk one branch line of `count` sprinklers from the end sprinkler (q1 at p1) to the cross main.
 * @see [NFPA 13] hydraulic calculation, Q = K √P and Hazen-Williams between sprinklers
 */
function solveLine(count: number, q1: number, p1: number, inp: TreePipes, hl: HeadLoss): SolvedLine {
  const flows = [q1];
  const pressures = [p1];
  let carried = q1;
  let p = p1;
  for (let i = 1; i < count; i++) {
    p += hl.loss(carried, inp.branchDiameter, inp.cFactor, inp.headSpacing);
    const q = headDischarge(inp.kFactor, p);
    flows.push(q);
    pressures.push(p);
    carried += q;
  }
  const inletPressure = p + hl.loss(carried, inp.branchDiameter, inp.cFactor, inp.headSpacing);
  return { flows, pressures, inletFlow: carried, inletPressure };
}

function checkInput(inp: AreaDemandInput): void {
  const positive: Array<[keyof AreaDemandInput, string, Quantity | null]> = [
    ["density", "density", "density"],
    ["area", "area", "area"],
    ["coverage", "coverage", "area"],
    ["kFactor", "k_factor", "kfactor"],
    ["headSpacing", "head_spacing", "length"],
    ["branchDiameter", "branch_diameter", "diameter"],
    ["mainDiameter", "main_diameter", "diameter"],
    ["cFactor", "c_factor", null],
    ["minPressure", "min_pressure", "pressure"],
  ];
  requirePositive(inp, positive);
  checkAreaLayout(inp);
}

/**
 * Refuse any of a solve's arguments that is not a finite number above 0, naming it as the user does.
 *
 * Each entry names a field of `inp`, the argument's name and its quantity (null for a plain number, such as C).
 *
 * @param inp the solve's inputs, US units
 * @param fields [field, argument name, quantity] for each argument that must be above 0
 * @see (common practice) a length, flow or pressure of 0 or less is an input error
 * @example
 * requirePositive({ density: 0 }, [["density", "density", "density"]]) // throws "density: got 0 gpm/ft²; must be greater than 0"
 */
export function requirePositive<T>(inp: T, fields: ReadonlyArray<readonly [keyof T, string, Quantity | null]>): void {
  for (const [key, name, quantity] of fields) {
    const v = inp[key] as unknown as number;
    if (!(v > 0) || !Number.isFinite(v)) fail(name, quantity ? q(quantity, v) : n(v), "must be greater than 0");
  }
}

/**
 * Refuse a design area's layout that no sprinklers could be: the checks a tree and a grid share.
 *
 * Coverage within the area and not below the smallest plausible, a head spacing that gives branch lines at least the
 * smallest spacing apart, and no more than MAX_DESIGN_AREA_SPRINKLERS sprinklers (every loop of a solve runs at most
 * that many times). Throws a HeadroomError naming the argument at fault. US units.
 *
 * @param inp the design area (ft²), the coverage per sprinkler (ft²) and the head spacing along a line (ft), each
 *   already checked to be greater than 0
 * @see [NFPA 13] design area and sprinkler spacing (the bounds are common practice)
 * @example
 * checkAreaLayout({ area: 100, coverage: 130, headSpacing: 13 }) // throws "coverage: got 130 ft²; must not exceed the design area 100 ft²"
 */
export function checkAreaLayout(inp: { area: number; coverage: number; headSpacing: number }): void {
  if (inp.coverage > inp.area) fail("coverage", q("area", inp.coverage), "must not exceed the design area {0}", q("area", inp.area));
  if (inp.coverage < MIN_COVERAGE_FT2) {
    fail(
      "coverage",
      q("area", inp.coverage),
      "must be at least {0}: a sprinkler protecting less than {1} × {2} is an input error",
      q("area", MIN_COVERAGE_FT2),
      q("length", MIN_HEAD_SPACING_FT),
      q("length", MIN_LINE_SPACING_FT),
    );
  }
  headsPerLine(inp.area, inp.headSpacing, DESIGN_AREA_LENGTH_FACTOR); // refuses a head spacing below MIN_HEAD_SPACING_FT
  if (inp.coverage / inp.headSpacing < MIN_LINE_SPACING_FT) {
    fail(
      "head_spacing",
      q("length", inp.headSpacing),
      "must be at most coverage ÷ {0} = {1}: branch lines closer than {0} are an input error",
      q("length", MIN_LINE_SPACING_FT),
      q("length", inp.coverage / MIN_LINE_SPACING_FT),
    );
  }
  if (ceilCount(inp.area / inp.coverage) > MAX_DESIGN_AREA_SPRINKLERS) {
    fail(
      "area",
      q("area", inp.area),
      `must be at most {0} with a coverage of {1}: a design area of more than ${MAX_DESIGN_AREA_SPRINKLERS} sprinklers is an input error`,
      q("area", MAX_DESIGN_AREA_SPRINKLERS * inp.coverage),
      q("area", inp.coverage),
    );
  }
}

/**
 * Solve the design area of a tree system sprinkler by sprinkler (the method in the file comment).
 *
 *   n = ceil(A / coverage),   m = ceil(1.2 √A / S),   L = ceil(n / m),   q1 = max(density × coverage, K √Pmin)
 *
 * 0.15 gpm/ft² over 1500 ft², 130 ft² per sprinkler, K 5.6, 13 ft spacing, 1.38 in branch lines (1¼ Schedule 40),
 * 2.469 in cross main (2½ Schedule 40), C 120, 7 psi: n = ceil(11.54) = 12 sprinklers, m = ceil(1.2 × 38.73 / 13)
 * = ceil(3.58) = 4 on a line, L = 3 lines; q1 = 0.15 × 130 = 19.5 gpm at (19.5 / 5.6)² = 12.13 psi; → 254.3 gpm at
 * 25.16 psi in the cross main. A two-line example is worked through by hand in test/engine/tree.test.ts.
 *
 * @param inp the design area, sprinklers and pipes, US units (gpm/ft², ft², gpm/psi^0.5, ft, in, psi)
 * @param hl the head loss of the user's unit system (headLoss(units)); default the [NFPA 13] US form
 * @param detail also list every flowing sprinkler
 * @returns the cross-main flow (gpm) and pressure (psi) at the last line, counts, and the end-sprinkler pressure (psi)
 * @see [NFPA 13] density/area method and hydraulic calculation procedure
 * @example
 * solveAreaDemand({ density: 0.15, area: 1500, coverage: 130, kFactor: 5.6, headSpacing: 13,
 *   branchDiameter: 1.38, mainDiameter: 2.469, cFactor: 120, minPressure: 7 })
 * // .heads → 12
 * // .headsPerLine → 4
 * // .lines → 3
 * // .endPressure ≈ 12.13 psi
 * // .flow ≈ 254.3 gpm
 * // .pressure ≈ 25.16 psi
 */
export function solveAreaDemand(inp: AreaDemandInput, hl: HeadLoss = headLoss("US"), detail = false): AreaDemand {
  checkInput(inp);
  const n = headCount(inp.area, inp.coverage);
  const m = Math.min(headsPerLine(inp.area, inp.headSpacing, DESIGN_AREA_LENGTH_FACTOR), n);
  const q1 = headFlow(inp.density, inp.coverage, inp.kFactor, inp.minPressure);
  const p1 = headPressure(q1, inp.kFactor, inp.minPressure);
  if (!Number.isFinite(p1)) {
    fail("k_factor", q("kfactor", inp.kFactor), "must be larger: the end sprinkler would need more than any pressure to flow {0}", q("flow", q1));
  }
  return solveLayout({ heads: n, headsPerLine: m, lineSpacing: inp.coverage / inp.headSpacing, endFlow: q1, endPressure: p1 }, inp, hl, detail);
}

/** Refuse a design by number of sprinklers that no sprinkler layout could be, naming the argument. */
function checkHeadsInput(inp: HeadsDemandInput): void {
  const positive: Array<[keyof HeadsDemandInput, string, Quantity | null]> = [
    ["kFactor", "k_factor", "kfactor"],
    ["minPressure", "min_pressure", "pressure"],
    ["headSpacing", "head_spacing", "length"],
    ["lineSpacing", "line_spacing", "length"],
    ["branchDiameter", "branch_diameter", "diameter"],
    ["mainDiameter", "main_diameter", "diameter"],
    ["cFactor", "c_factor", null],
  ];
  for (const [key, name, quantity] of positive) {
    const v = inp[key];
    if (!(v > 0) || !Number.isFinite(v)) fail(name, quantity ? q(quantity, v) : n(v), "must be greater than 0");
  }
  for (const [count, name] of [[inp.heads, "heads"], [inp.headsPerLine, "heads_per_line"]] as const) {
    if (!(Number.isInteger(count) && count >= 1)) fail(name, n(count), "must be a whole number of sprinklers, at least 1");
  }
  // The plausible-count bound: every loop of the walk runs at most MAX_DESIGN_AREA_SPRINKLERS times.
  if (inp.heads > MAX_DESIGN_AREA_SPRINKLERS) {
    fail(
      "heads",
      n(inp.heads),
      `must be at most ${MAX_DESIGN_AREA_SPRINKLERS}: a design of more than ${MAX_DESIGN_AREA_SPRINKLERS} sprinklers is an input error`,
    );
  }
  if (inp.headsPerLine > inp.heads) fail("heads_per_line", n(inp.headsPerLine), "must be at most heads, {0}", n(inp.heads));
  if (inp.headSpacing < MIN_HEAD_SPACING_FT) {
    fail("head_spacing", q("length", inp.headSpacing), "must be at least {0}: sprinklers closer than that on a line are an input error", q("length", MIN_HEAD_SPACING_FT));
  }
  if (inp.lineSpacing < MIN_LINE_SPACING_FT) {
    fail("line_spacing", q("length", inp.lineSpacing), "must be at least {0}: branch lines closer than that are an input error", q("length", MIN_LINE_SPACING_FT));
  }
}

/**
 * Solve a design by number of sprinklers on a tree system, sprinkler by sprinkler (AREADEMAND's walk, layout given).
 *
 *   L = ceil(n / m),   the line nearest the feed flowing n − (L − 1) m,   q1 = K √Pmin at p1 = Pmin
 *
 * The layout is given rather than derived from an area, as storage, high-K and early-suppression sprinklers are
 * designed: a number of sprinklers at the listing's minimum pressure. 12 sprinklers K 16.8 at 52 psi, 4 on each of 3 lines, 10 ft × 10 ft, 3 in branch lines (3.068 in) and a
 * 6 in cross main (6.065 in), Schedule 40, C 120: q1 = 16.8 × √52 = 121.15 gpm; the most remote line reaches the
 * cross main with 488.63 gpm at 56.99 psi; → 1468.1 gpm at 57.42 psi at the last line. Worked through sprinkler by
 * sprinkler in test/engine/tree.test.ts.
 *
 * @param inp the sprinklers, their layout and the pipes, US units (gpm/psi^0.5, psi, ft, in)
 * @param hl the head loss of the user's unit system (headLoss(units)); default the [NFPA 13] US form
 * @param detail also list every flowing sprinkler
 * @returns the cross-main flow (gpm) and pressure (psi) at the last line, counts, and the end-sprinkler pressure (psi)
 * @see [NFPA 13] design by number of sprinklers (storage and early-suppression sprinklers) and hydraulic calculation procedure
 * @example
 * solveHeadsDemand({ heads: 12, headsPerLine: 4, kFactor: 16.8, minPressure: 52, headSpacing: 10, lineSpacing: 10,
 *   branchDiameter: 3.068, mainDiameter: 6.065, cFactor: 120 })
 * // .lines → 3
 * // .endPressure → 52 psi
 * // .lineFlows[0] ≈ 488.63 gpm
 * // .flow ≈ 1468.1 gpm
 * // .pressure ≈ 57.42 psi
 */
export function solveHeadsDemand(inp: HeadsDemandInput, hl: HeadLoss = headLoss("US"), detail = false): AreaDemand {
  checkHeadsInput(inp);
  const layout = {
    heads: inp.heads,
    headsPerLine: inp.headsPerLine,
    lineSpacing: inp.lineSpacing,
    endFlow: headDischarge(inp.kFactor, inp.minPressure),
    endPressure: inp.minPressure,
  };
  return solveLayout(layout, inp, hl, detail);
}

/** Where the sprinklers of a tree design area are and how the most remote one flows (checked by its caller). */
interface TreeLayout {
  /** sprinklers flowing, n (1 to MAX_DESIGN_AREA_SPRINKLERS) */
  heads: number;
  /** sprinklers on each full line, m (1 to n) */
  headsPerLine: number;
  /** distance between branch lines along the cross main, ft */
  lineSpacing: number;
  /** flow of the most remote sprinkler, q1, gpm */
  endFlow: number;
  /** its pressure, p1, psi */
  endPressure: number;
}

/**
 * The walk both design-area solves share (steps 3 to 5 of the file comment): L = ceil(n / m) lines, the most remote
 * ones full and the line nearest the feed flowing the remainder, each solved sprinkler by sprinkler from q1 at p1,
 * then the cross main line by line.
 */
function solveLayout(layout: TreeLayout, pipes: TreePipes, hl: HeadLoss, detail: boolean): AreaDemand {
  const { heads: n, headsPerLine: m, lineSpacing, endFlow: q1, endPressure: p1 } = layout;
  const lines = Math.ceil(n / m);
  const last = n - (lines - 1) * m;
  const full = solveLine(m, q1, p1, pipes, hl);
  const partial = last === m ? full : solveLine(last, q1, p1, pipes, hl);
  if (!Number.isFinite(full.inletPressure) || !Number.isFinite(partial.inletPressure)) {
    fail("branch_diameter", q("diameter", pipes.branchDiameter), "must be larger: the friction loss along a branch line has no finite value");
  }

  const lineFlows: number[] = [];
  const linePressures: number[] = [];
  const sprinklers: SolvedSprinkler[] = [];
  let flow = 0;
  let pressure = full.inletPressure;
  for (let j = 1; j <= lines; j++) {
    if (j > 1) pressure += hl.loss(flow, pipes.mainDiameter, pipes.cFactor, lineSpacing);
    const solved = j === lines ? partial : full;
    const scale = pressure / solved.inletPressure; // pressure ratio; flows scale by its square root
    const lineFlow = j === 1 ? solved.inletFlow : (solved.inletFlow / Math.sqrt(solved.inletPressure)) * Math.sqrt(pressure);
    if (detail) {
      const root = Math.sqrt(scale);
      solved.flows.forEach((q, i) =>
        sprinklers.push({ line: j, position: i + 1, flow: j === 1 ? q : q * root, pressure: j === 1 ? solved.pressures[i] : solved.pressures[i] * scale }),
      );
    }
    lineFlows.push(lineFlow);
    linePressures.push(pressure);
    flow += lineFlow;
  }
  if (!Number.isFinite(flow) || !Number.isFinite(pressure)) {
    fail("main_diameter", q("diameter", pipes.mainDiameter), "must be larger: the friction loss in the cross main has no finite value");
  }
  const result: AreaDemand = { flow, pressure, heads: n, lines, endPressure: p1, headsPerLine: m, lineSpacing, lineFlows, linePressures };
  if (detail) result.sprinklers = sprinklers;
  return result;
}
