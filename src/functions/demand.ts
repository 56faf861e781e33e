/**
 * Cell functions of the sprinkler demand: one sprinkler (HEADFLOW, HEADPRESSURE), the design area's counts
 * (HEADCOUNT, HEADSPERLINE), the tree design-area solves (AREADEMAND, HEADSDEMAND), the gridded one (GRIDDEMAND) and
 * the density/area, system adjustment, hose and duration tables (DESIGNDENSITY, DESIGNAREA, ADJUSTAREA, HOSEALLOWANCE,
 * DURATION). Engine: src/engine/sprinkler.ts, tree.ts, gridded.ts, design.ts.
 */
import { adjustedArea, designArea, designDensity, hoseAllowance, supplyDuration } from "../engine/design";
import { finiteOr, q as qty } from "../engine/errors";
import { headLoss } from "../engine/friction";
import { DEFAULT_FEED_LINE, solveGridDemand } from "../engine/gridded";
import { DESIGN_AREA_LENGTH_FACTOR, headCount, headFlow, headPressure, headsPerLine } from "../engine/sprinkler";
import { type AreaDemand, DEFAULT_C_FACTOR, solveAreaDemand, solveHeadsDemand } from "../engine/tree";
import { type UnitSystem, fromUS } from "../engine/units";
import { LIMITS_US, isBlank, numberArg, optionalNumberArg, quantityArg } from "./args";
import { cell } from "./bridge";
import { cFactorArg, minPressureArg } from "./common";
import type { SpillShape } from "./shapes";
import { areaSystemArg, boundArg, hazardArg, hosePartArg } from "./tableCodes";

// ─── One sprinkler and the design area's counts ──────────────────────────────────────────────────────────────────────────
/**
 * Design flow of the most remote sprinkler: the larger of density × coverage and K × √(minimum pressure) (NFPA 13
 * density/area method).
 * @customfunction
 * @param density Design density (gpm/ft²; SI: mm/min).
 * @param coverage Floor area one sprinkler protects (ft²; SI: m²).
 * @param k_factor Sprinkler K-factor (gpm/psi^0.5; SI: L/min/bar^0.5).
 * @param min_pressure Minimum operating pressure (psi; SI: bar); default 7 psi (SI: 0.5 bar).
 * @param units "US" (default) or "SI".
 * @returns Flow of that sprinkler (gpm; SI: L/min).
 */
export function headflow(density: any, coverage: any, k_factor: any, min_pressure?: any, units?: any): number {
  return cell(units, (u) => {
    const dens = quantityArg(density, "density", "density", u);
    const cov = quantityArg(coverage, "coverage", "area", u);
    const k = quantityArg(k_factor, "k_factor", "kfactor", u);
    const pmin = minPressureArg(min_pressure, u);
    return fromUS("flow", headFlow(dens, cov, k, pmin), u);
  });
}

/**
 * Pressure a sprinkler needs to discharge a flow: (flow / K)², not below the minimum operating pressure (NFPA 13).
 * @customfunction
 * @param flow Flow of the sprinkler (gpm; SI: L/min).
 * @param k_factor Sprinkler K-factor (gpm/psi^0.5; SI: L/min/bar^0.5).
 * @param min_pressure Minimum operating pressure (psi; SI: bar); default 7 psi (SI: 0.5 bar).
 * @param units "US" (default) or "SI".
 * @returns Pressure at the sprinkler (psi; SI: bar).
 */
export function headpressure(flow: any, k_factor: any, min_pressure?: any, units?: any): number {
  return cell(units, (u) => {
    const q = quantityArg(flow, "flow", "flow", u);
    const k = quantityArg(k_factor, "k_factor", "kfactor", u);
    const pmin = minPressureArg(min_pressure, u);
    return fromUS("pressure", finiteOr(headPressure(q, k, pmin), "k_factor", qty("kfactor", k)), u);
  });
}

/**
 * Sprinklers flowing in the design area: design area ÷ coverage per sprinkler, rounded up (NFPA 13).
 * @customfunction
 * @param area Design area (ft² or m²: the same unit as coverage).
 * @param coverage Floor area one sprinkler protects (same unit as area).
 * @returns Number of sprinklers.
 */
export function headcount(area: any, coverage: any): number {
  return cell(null, () => {
    const a = numberArg(area, "area", { gt: 0, max: LIMITS_US.area });
    const c = numberArg(coverage, "coverage", { gt: 0, max: LIMITS_US.area });
    return headCount(a, c);
  });
}

/**
 * Sprinklers along one branch line of the design area: factor × √area ÷ spacing, rounded up (NFPA 13: the long
 * side of the rectangular area, 1.2 √A, runs along the branch lines).
 * @customfunction
 * @param area Design area (ft²; SI: m²).
 * @param head_spacing Distance between sprinklers along the branch line (ft; SI: m).
 * @param factor Long side of the area as a multiple of √area; default 1.2.
 * @param units "US" (default) or "SI".
 * @returns Number of sprinklers on the line.
 */
export function headsperline(area: any, head_spacing: any, factor?: any, units?: any): number {
  return cell(units, (u) => {
    const a = quantityArg(area, "area", "area", u);
    const s = quantityArg(head_spacing, "head_spacing", "length", u);
    const f = optionalNumberArg(factor, "factor", DESIGN_AREA_LENGTH_FACTOR, { gt: 0, max: 10 });
    return headsPerLine(a, s, f);
  });
}

// ─── AREADEMAND ──────────────────────────────────────────────────────────────────────────────────────────────────────────
/** AREADEMAND's output columns (one row). */
export const AREADEMAND_COLUMNS = ["flow", "pressure", "heads", "lines", "end_pressure"] as const;
/** AREADEMAND spills one row of its columns. */
export const AREADEMAND_SPILL: SpillShape = { rows: 1, columns: AREADEMAND_COLUMNS.length };

/**
 * Demand of a tree system's design area, solved sprinkler by sprinkler (NFPA 13 density/area method): the most
 * remote line head by head (Q = K √p, Hazen-Williams between sprinklers), further lines by their line K, the
 * partial line nearest the feed on its own, and the cross-main loss between lines. No elevation: add ELEVATION.
 * @customfunction
 * @param density Design density (gpm/ft²; SI: mm/min).
 * @param area Design area (ft²; SI: m²).
 * @param coverage Floor area one sprinkler protects (ft²; SI: m²).
 * @param k_factor Sprinkler K-factor (gpm/psi^0.5; SI: L/min/bar^0.5).
 * @param head_spacing Distance between sprinklers along a branch line (ft; SI: m); lines are coverage ÷ head_spacing apart.
 * @param branch_diameter Internal diameter of the branch lines (in; SI: mm).
 * @param main_diameter Internal diameter of the cross main (in; SI: mm).
 * @param c_factor Hazen-Williams C of both; default 120.
 * @param min_pressure Minimum sprinkler operating pressure (psi; SI: bar); default 7 psi (SI: 0.5 bar).
 * @param units "US" (default) or "SI".
 * @returns One row: [flow (gpm; SI: L/min), pressure (psi; SI: bar) in the cross main at the last line, sprinklers flowing, lines, end-sprinkler pressure].
 */
export function areademand(
  density: any,
  area: any,
  coverage: any,
  k_factor: any,
  head_spacing: any,
  branch_diameter: any,
  main_diameter: any,
  c_factor?: any,
  min_pressure?: any,
  units?: any,
): any[][] {
  return cell(units, (u) =>
    areaDemandRow(density, area, coverage, k_factor, head_spacing, branch_diameter, main_diameter, c_factor, min_pressure, u),
  );
}

/** AREADEMAND: one row [flow, pressure, heads, lines, end_pressure] in the user's units. */
function areaDemandRow(
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
  return demandRow(solveAreaDemand(inp, headLoss(u)), u);
}

/**
 * A solved design area as AREADEMAND and HEADSDEMAND spill it, and GRIDDEMAND begins its row: [flow, pressure, heads,
 * lines, end_pressure].
 */
function demandRow(r: Pick<AreaDemand, "flow" | "pressure" | "heads" | "lines" | "endPressure">, u: UnitSystem): unknown[][] {
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

// ─── HEADSDEMAND ─────────────────────────────────────────────────────────────────────────────────────────────────────────
/** HEADSDEMAND's output columns (one row): AREADEMAND's. */
export const HEADSDEMAND_COLUMNS = AREADEMAND_COLUMNS;
/** HEADSDEMAND spills one row of its columns. */
export const HEADSDEMAND_SPILL: SpillShape = { rows: 1, columns: HEADSDEMAND_COLUMNS.length };

/**
 * Demand of a design by number of sprinklers on a tree system (NFPA 13: storage, high-K and early-suppression
 * sprinklers): heads sprinklers, heads_per_line on each full line and the remainder on the line nearest the feed, the
 * most remote at min_pressure (flow K √min_pressure), solved sprinkler by sprinkler as AREADEMAND is. No elevation: add
 * ELEVATION.
 * @customfunction
 * @param heads Sprinklers flowing (a whole number).
 * @param heads_per_line Sprinklers on each full branch line (a whole number, at most heads).
 * @param k_factor Sprinkler K-factor (gpm/psi^0.5; SI: L/min/bar^0.5).
 * @param min_pressure Pressure of the most remote sprinkler, the listing's minimum (psi; SI: bar).
 * @param head_spacing Distance between sprinklers along a branch line (ft; SI: m).
 * @param line_spacing Distance between branch lines along the cross main (ft; SI: m).
 * @param branch_diameter Internal diameter of the branch lines (in; SI: mm).
 * @param main_diameter Internal diameter of the cross main (in; SI: mm).
 * @param c_factor Hazen-Williams C of both; default 120.
 * @param units "US" (default) or "SI".
 * @returns One row: [flow (gpm; SI: L/min), pressure (psi; SI: bar) in the cross main at the last line, sprinklers flowing, lines, end-sprinkler pressure].
 */
export function headsdemand(
  heads: any,
  heads_per_line: any,
  k_factor: any,
  min_pressure: any,
  head_spacing: any,
  line_spacing: any,
  branch_diameter: any,
  main_diameter: any,
  c_factor?: any,
  units?: any,
): any[][] {
  return cell(units, (u) => {
    const inp = {
      heads: numberArg(heads, "heads"), // the engine says what counts of sprinklers are allowed
      headsPerLine: numberArg(heads_per_line, "heads_per_line"),
      kFactor: quantityArg(k_factor, "k_factor", "kfactor", u),
      minPressure: quantityArg(min_pressure, "min_pressure", "pressure", u),
      headSpacing: quantityArg(head_spacing, "head_spacing", "length", u),
      lineSpacing: quantityArg(line_spacing, "line_spacing", "length", u),
      branchDiameter: quantityArg(branch_diameter, "branch_diameter", "diameter", u),
      mainDiameter: quantityArg(main_diameter, "main_diameter", "diameter", u),
      cFactor: isBlank(c_factor) ? DEFAULT_C_FACTOR : cFactorArg(c_factor),
    };
    return demandRow(solveHeadsDemand(inp, headLoss(u)), u);
  });
}

// ─── GRIDDEMAND ──────────────────────────────────────────────────────────────────────────────────────────────────────────
/** GRIDDEMAND's output columns (one row): AREADEMAND's, then where the design area landed. */
export const GRIDDEMAND_COLUMNS = [...AREADEMAND_COLUMNS, "first_line", "first_head"] as const;
/** GRIDDEMAND spills one row of its columns. */
export const GRIDDEMAND_SPILL: SpillShape = { rows: 1, columns: GRIDDEMAND_COLUMNS.length };

/**
 * Demand of a gridded system's design area, placed where it demands most (NFPA 13 density/area method): branch lines
 * tied at both ends into cross mains, sprinklers centred on each line, the riser on the near main at feed_line; every
 * placement of the area is solved as a pipe network (Q = K √p, Hazen-Williams in every pipe, flows balanced at every
 * node) for the riser pressure at which the least-favoured sprinkler flows max(density × coverage, K √min_pressure).
 * No elevation and no fittings: add ELEVATION and FITTINGS.
 * @customfunction
 * @param density Design density (gpm/ft²; SI: mm/min).
 * @param area Design area (ft²; SI: m²).
 * @param coverage Floor area one sprinkler protects (ft²; SI: m²).
 * @param k_factor Sprinkler K-factor (gpm/psi^0.5; SI: L/min/bar^0.5).
 * @param head_spacing Distance between sprinklers along a branch line (ft; SI: m); lines are coverage ÷ head_spacing apart.
 * @param lines Branch lines in the grid (a whole number).
 * @param line_length Length of each branch line between the two cross mains (ft; SI: m).
 * @param branch_diameter Internal diameter of the branch lines (in; SI: mm).
 * @param main_diameter Internal diameter of both cross mains (in; SI: mm).
 * @param c_factor Hazen-Williams C of all pipes; default 120.
 * @param min_pressure Minimum sprinkler operating pressure (psi; SI: bar); default 7 psi (SI: 0.5 bar).
 * @param feed_line The line where the riser joins the near cross main, from 1 to lines; default 1.
 * @param units "US" (default) or "SI".
 * @returns One row: [flow (gpm; SI: L/min), pressure (psi; SI: bar) at the riser, sprinklers flowing, lines, least-favoured sprinkler pressure, first line and first sprinkler of the area].
 */
export function griddemand(
  density: any,
  area: any,
  coverage: any,
  k_factor: any,
  head_spacing: any,
  lines: any,
  line_length: any,
  branch_diameter: any,
  main_diameter: any,
  c_factor?: any,
  min_pressure?: any,
  feed_line?: any,
  units?: any,
): any[][] {
  return cell(units, (u) => {
    const inp = {
      density: quantityArg(density, "density", "density", u),
      area: quantityArg(area, "area", "area", u),
      coverage: quantityArg(coverage, "coverage", "area", u),
      kFactor: quantityArg(k_factor, "k_factor", "kfactor", u),
      headSpacing: quantityArg(head_spacing, "head_spacing", "length", u),
      lines: numberArg(lines, "lines"), // the engine says what counts of lines are allowed
      lineLength: quantityArg(line_length, "line_length", "length", u),
      branchDiameter: quantityArg(branch_diameter, "branch_diameter", "diameter", u),
      mainDiameter: quantityArg(main_diameter, "main_diameter", "diameter", u),
      cFactor: isBlank(c_factor) ? DEFAULT_C_FACTOR : cFactorArg(c_factor),
      minPressure: minPressureArg(min_pressure, u),
      feedLine: isBlank(feed_line) ? DEFAULT_FEED_LINE : numberArg(feed_line, "feed_line"),
    };
    const r = solveGridDemand(inp, headLoss(u));
    return [[...demandRow(r, u)[0], r.firstLine, r.firstHead]];
  });
}

// ─── Density/area, hose and duration tables ──────────────────────────────────────────────────────────────────────────────
/**
 * Design density from the NFPA 13 density/area curve of a hazard: the straight line between its two points.
 * An area off the curve is an error stating the curve's span.
 * @customfunction
 * @param hazard LH, OH1, OH2, EH1 or EH2 (or "light", "ordinary 1", "ordinary 2", "extra 1", "extra 2").
 * @param area Design area (ft²; SI: m²); default the curve's smallest area.
 * @param units "US" (default) or "SI".
 * @returns Density (gpm/ft²; SI: mm/min).
 */
export function designdensity(hazard: any, area?: any, units?: any): number {
  return cell(units, (u) => {
    const h = hazardArg(hazard);
    if (isBlank(area)) return fromUS("density", designDensity(h), u);
    const a = quantityArg(area, "area", "area", u);
    return fromUS("density", designDensity(h, a), u); // the engine states the curve's span
  });
}

/**
 * The smallest design area of a hazard's NFPA 13 density/area curve (its upper point).
 * @customfunction
 * @param hazard LH, OH1, OH2, EH1 or EH2 (or "light", "ordinary 1", "ordinary 2", "extra 1", "extra 2").
 * @param units "US" (default) or "SI".
 * @returns Design area (ft²; SI: m²).
 */
export function designarea(hazard: any, units?: any): number {
  return cell(units, (u) => {
    return fromUS("area", designArea(hazardArg(hazard)), u);
  });
}

/**
 * The design area adjusted for the system type (NFPA 13): dry-pipe and double-interlock preaction systems flow 1.3 ×
 * the area, wet and single-interlock preaction (and deluge) the area itself. Take the density from the unadjusted area,
 * then flow it over the adjusted one.
 * @customfunction
 * @param area Design area read from the curve, in any unit of area (ft² or m²): the result has the same unit.
 * @param system "wet", "preaction" (single interlock), "dry" or "double interlock" (or "wet pipe", "deluge", "single interlock", "dry pipe", "double interlock preaction").
 * @returns Design area to flow (the unit of area).
 */
export function adjustarea(area: any, system: any): number {
  return cell(null, () => {
    const a = numberArg(area, "area", { gt: 0, max: LIMITS_US.area });
    return adjustedArea(a, areaSystemArg(system));
  });
}

/**
 * Hose stream allowance of a hazard (NFPA 13): the inside + outside total, the inside part (the largest inside
 * allowance, 100 gpm) or the outside part (total − inside).
 * @customfunction
 * @param hazard LH, OH1, OH2, EH1 or EH2 (or "light", "ordinary 1", "ordinary 2", "extra 1", "extra 2").
 * @param part "total" (default), "inside" or "outside".
 * @param units "US" (default) or "SI".
 * @returns Hose allowance (gpm; SI: L/min).
 */
export function hoseallowance(hazard: any, part?: any, units?: any): number {
  return cell(units, (u) => {
    return fromUS("flow", hoseAllowance(hazardArg(hazard), hosePartArg(part)), u);
  });
}

/**
 * Required water supply duration of a hazard in minutes (NFPA 13): the lower or upper end of the range.
 * @customfunction
 * @param hazard LH, OH1, OH2, EH1 or EH2 (or "light", "ordinary 1", "ordinary 2", "extra 1", "extra 2").
 * @param bound "min" (default) or "max".
 * @returns Duration (min).
 */
export function duration(hazard: any, bound?: any): number {
  return cell(null, () => supplyDuration(hazardArg(hazard), boundArg(bound)));
}
