/**
 * Headroom's cell functions: the add-in's public interface (namespace HEADROOM, e.g. =HEADROOM.FRICTION(...)).
 *
 * This file is the one input of the metadata generator (custom-functions-metadata-plugin), which registers every
 * top-level function here under its upper-cased name. Each is a thin wrapper: it reads its arguments through
 * ./args (checks, defaults with ??, SI → US), calls the pure engine, converts the result back, and leaves every
 * failure as a CustomFunctions.Error with a one-line message (./bridge). Names and argument orders follow
 * the vocabulary; never rename one without keeping the old name working.
 */
import { cell } from "./bridge";
import { LIMITS_US, SIGNED, ZERO_ALLOWED, numberArg, optionalNumberArg, quantityArg } from "./args";
import { decisionArgs, demandArgs, flowTestArgs, minPressureArg, pipeArgs } from "./common";
import { convertUnit } from "./unit";
import { assess, margin as supplyMargin, pumpBoost, verdictSentence } from "../engine/decision";
import { elevationPressure, headLoss, velocity as pipeVelocity } from "../engine/friction";
import { DESIGN_AREA_LENGTH_FACTOR, headCount, headFlow, headPressure, headsPerLine } from "../engine/sprinkler";
import { finiteOr, n as plain, q as qty } from "../engine/errors";
import { PITOT_COEFFICIENT_SMOOTH, flowAt, pitotFlow, supplyAt } from "../engine/supply";
import { fromUS } from "../engine/units";
import { isBlank } from "./args";
import { cFactorArg } from "./common";
import { fittingArg, fittingListArg } from "./fittingList";
import { nominalArg } from "./nominal";
import { boundArg, hazardArg, hosePartArg, materialArg, scheduleArg, systemArg } from "./tableCodes";
import { hazenWilliamsC } from "../engine/cfactor";
import { designArea, designDensity, hoseAllowance, supplyDuration } from "../engine/design";
import { TABLE_C_FACTOR, equivalentLength } from "../engine/fittings";
import { internalDiameter } from "../engine/pipes";
import { areaDemandRow, pumpCurvePressure, pumpSizeRow, runRows, sizeFor, supplyCurveRows } from "./solvers";

// ─── Water supply ────────────────────────────────────────────────────────────────────────────────────────────────
/**
 * Pressure the water supply delivers at a flow, along the supply curve through the hydrant flow test:
 * P = static − (static − residual) × (flow / test_flow)^1.85 (NFPA 291). An error beyond the flow where it reaches 0.
 * @customfunction
 * @param flow Flow drawn from the supply (gpm; SI: L/min).
 * @param static_pressure Static pressure of the flow test, no flow (psi; SI: bar).
 * @param residual Residual pressure while the test flow runs (psi; SI: bar).
 * @param test_flow Flow during the test (gpm; SI: L/min).
 * @param units "US" (default) or "SI".
 * @returns Supply pressure at the flow (psi; SI: bar).
 */
export function supplyat(flow: any, static_pressure: any, residual: any, test_flow: any, units?: any): number {
  return cell(units, (u) => {
    const t = flowTestArgs(static_pressure, residual, test_flow, u);
    const q = quantityArg(flow, "flow", "flow", u, ZERO_ALLOWED);
    return fromUS("pressure", supplyAt(q, t), u); // finite: every input is bounded and the engine checks p > 0
  });
}

/**
 * Flow the water supply delivers at a pressure, along the supply curve: FLOWAT(20, ...) is the fire flow at 20 psi
 * (NFPA 291).
 * @customfunction
 * @param pressure Pressure left in the main (psi; SI: bar), from 0 to the static pressure.
 * @param static_pressure Static pressure of the flow test (psi; SI: bar).
 * @param residual Residual pressure while the test flow runs (psi; SI: bar).
 * @param test_flow Flow during the test (gpm; SI: L/min).
 * @param units "US" (default) or "SI".
 * @returns Flow at that pressure (gpm; SI: L/min).
 */
export function flowat(pressure: any, static_pressure: any, residual: any, test_flow: any, units?: any): number {
  return cell(units, (u) => {
    const t = flowTestArgs(static_pressure, residual, test_flow, u);
    const p = quantityArg(pressure, "pressure", "pressure", u, ZERO_ALLOWED);
    return fromUS("flow", flowAt(p, t), u); // the engine checks p against the static pressure
  });
}

/**
 * Hydrant outlet flow from a pitot reading: Q = 29.83 c d² √p (NFPA 291).
 * @customfunction
 * @param pitot Pitot (velocity) pressure at the outlet (psi; SI: bar).
 * @param outlet_diameter Internal diameter of the hydrant outlet (in; SI: mm).
 * @param coefficient Outlet coefficient: 0.90 smooth rounded (default), 0.80 square and sharp, 0.70 square projecting.
 * @param units "US" (default) or "SI".
 * @returns Flow from the outlet (gpm; SI: L/min).
 */
export function pitotflow(pitot: any, outlet_diameter: any, coefficient?: any, units?: any): number {
  return cell(units, (u) => {
    const p = quantityArg(pitot, "pitot", "pressure", u);
    const d = quantityArg(outlet_diameter, "outlet_diameter", "diameter", u);
    const c = optionalNumberArg(coefficient, "coefficient", PITOT_COEFFICIENT_SMOOTH, { gt: 0, max: 1 });
    return fromUS("flow", pitotFlow(p, d, c), u);
  });
}


// ─── Demand ──────────────────────────────────────────────────────────────────────────────────────────────────────
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


// ─── Piping ──────────────────────────────────────────────────────────────────────────────────────────────────────
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
  return cell(units, (u) => {
    const [q, d, c] = pipeArgs(flow, diameter, c_factor, u);
    const l = quantityArg(length, "length", "length", u, ZERO_ALLOWED);
    return fromUS("pressure", finiteOr(headLoss(u).loss(q, d, c, l), "diameter", qty("diameter", d)), u);
  });
}

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
  return cell(units, (u) => {
    const [q, d, c] = pipeArgs(flow, diameter, c_factor, u);
    return fromUS("frictionRate", finiteOr(headLoss(u).rate(q, d, c), "diameter", qty("diameter", d)), u);
  });
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


// ─── Trade tables: pipes, C factors, fittings, density/area, hose, duration ──────────────────────────────────────
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
 * @param system "wet" (default; deluge reads as wet) or "dry" (preaction reads as dry).
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


// ─── Range functions and solvers: RUN, SUPPLYCURVE, AREADEMAND, SIZEFOR, PUMPSIZE, PUMPCURVE ─────────────────────
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
export function run(segments: any[][], start_pressure?: any, units?: any): any[][] {
  return cell(units, (u) => runRows(segments, start_pressure, u));
}

/**
 * Points of the water supply curve through the hydrant flow test, for a native chart: P = static − (static −
 * residual) × (Q / test_flow)^1.85 (NFPA 291) at flows evenly spaced from 0 to max_flow. Where the supply reaches
 * 0 before max_flow, that row holds [that flow, 0] and the rows after it are blank.
 * @customfunction
 * @param static_pressure Static pressure of the flow test (psi; SI: bar).
 * @param residual Residual pressure while the test flow runs (psi; SI: bar).
 * @param test_flow Flow during the test (gpm; SI: L/min).
 * @param max_flow Largest flow of the curve (gpm; SI: L/min); default 1.5 × test_flow.
 * @param points Number of rows, 2 to 1000; default 16.
 * @param units "US" (default) or "SI".
 * @returns Rows of [flow, pressure] (gpm, psi; SI: L/min, bar).
 */
export function supplycurve(
  static_pressure: any,
  residual: any,
  test_flow: any,
  max_flow?: any,
  points?: any,
  units?: any,
): any[][] {
  return cell(units, (u) => supplyCurveRows(static_pressure, residual, test_flow, max_flow, points, u));
}

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
 * A fire pump rating for a demand: the smallest standard rated capacity not below the demand flow (NFPA 20), and
 * the boost rounded up to the next 5 psi (SI: 0.5 bar).
 * @customfunction
 * @param demand_flow Flow the pump must deliver (gpm; SI: L/min).
 * @param boost Pressure the pump must add at that flow, e.g. from PUMPBOOST (psi; SI: bar).
 * @param units "US" (default) or "SI".
 * @returns One row: [rated_flow (gpm; SI: L/min), rated_pressure (psi; SI: bar)].
 */
export function pumpsize(demand_flow: any, boost: any, units?: any): any[][] {
  return cell(units, (u) => pumpSizeRow(demand_flow, boost, u));
}

/**
 * Net pressure of a fire pump at a flow, on the curve P = shutoff − k Q^n through its shutoff, rated and 150 %
 * points: it falls with flow and is never above shutoff. #NUM! beyond 150 % of rated flow or for ratios outside
 * the NFPA 20 envelope (shutoff at most 140 % of rated pressure, at least 65 % at 150 % flow).
 * @customfunction
 * @param flow Flow through the pump (gpm; SI: L/min), 0 to 1.5 × rated_flow.
 * @param rated_flow Rated flow of the pump (gpm; SI: L/min).
 * @param rated_pressure Rated net pressure (psi; SI: bar).
 * @param shutoff_ratio Shutoff (churn) pressure ÷ rated pressure, above 1 and at most 1.4; default 1.2.
 * @param overload_ratio Pressure at 150 % flow ÷ rated pressure, from 0.65 to below 1; default 0.7.
 * @param units "US" (default) or "SI".
 * @returns Net pump pressure (psi; SI: bar).
 */
export function pumpcurve(
  flow: any,
  rated_flow: any,
  rated_pressure: any,
  shutoff_ratio?: any,
  overload_ratio?: any,
  units?: any,
): number {
  return cell(units, (u) => pumpCurvePressure(flow, rated_flow, rated_pressure, shutoff_ratio, overload_ratio, u));
}


// ─── Decision ────────────────────────────────────────────────────────────────────────────────────────────────────
/**
 * Supply pressure at the demand flow minus the demand pressure: positive is pressure to spare, negative means the
 * supply falls short. An error where the supply reaches 0 before the demand flow.
 * @customfunction
 * @param demand_flow Total demand flow at the supply connection, sprinklers plus hose (gpm; SI: L/min).
 * @param demand_pressure Pressure the system needs there at that flow (psi; SI: bar).
 * @param static_pressure Static pressure of the flow test (psi; SI: bar).
 * @param residual Residual pressure while the test flow runs (psi; SI: bar).
 * @param test_flow Flow during the test (gpm; SI: L/min).
 * @param units "US" (default) or "SI".
 * @returns Margin (psi; SI: bar).
 */
export function margin(demand_flow: any, demand_pressure: any, static_pressure: any, residual: any, test_flow: any, units?: any): number {
  return cell(units, (u) => {
    const [q, p, t] = demandArgs(demand_flow, demand_pressure, static_pressure, residual, test_flow, u);
    return fromUS("pressure", supplyMargin(q, p, t), u);
  });
}

/**
 * A plain sentence for a project manager, e.g. "No pump needed: 12.4 psi to spare at 562 gpm." or "Pump needed: the
 * supply is 10.7 psi short at 562 gpm." A preliminary estimate: the adopted codes, the authority having
 * jurisdiction and a licensed fire-protection professional decide.
 * @customfunction
 * @param demand_flow Total demand flow at the supply connection (gpm; SI: L/min).
 * @param demand_pressure Pressure the system needs there (psi; SI: bar).
 * @param static_pressure Static pressure of the flow test (psi; SI: bar).
 * @param residual Residual pressure while the test flow runs (psi; SI: bar).
 * @param test_flow Flow during the test (gpm; SI: L/min).
 * @param required_margin Safety margin the supply must exceed the demand by (psi; SI: bar); default 0.
 * @param units "US" (default) or "SI".
 * @returns The verdict sentence.
 */
export function verdict(
  demand_flow: any,
  demand_pressure: any,
  static_pressure: any,
  residual: any,
  test_flow: any,
  required_margin?: any,
  units?: any,
): string {
  return cell(units, (u) => {
    const d = decisionArgs(demand_flow, demand_pressure, static_pressure, residual, test_flow, required_margin, u);
    return verdictSentence(assess(d.demandFlow, d.demandPressure, d.test, d.requiredMargin), u);
  });
}

/**
 * Pressure a fire pump must add at the demand flow to give the demand pressure plus the required margin; 0 where the
 * supply suffices. PUMPSIZE rounds it to a rating.
 * @customfunction
 * @param demand_flow Total demand flow at the supply connection (gpm; SI: L/min).
 * @param demand_pressure Pressure the system needs there (psi; SI: bar).
 * @param static_pressure Static pressure of the flow test (psi; SI: bar).
 * @param residual Residual pressure while the test flow runs (psi; SI: bar).
 * @param test_flow Flow during the test (gpm; SI: L/min).
 * @param required_margin Safety margin to include (psi; SI: bar); default 0.
 * @param units "US" (default) or "SI".
 * @returns Pump boost (psi; SI: bar).
 */
export function pumpboost(
  demand_flow: any,
  demand_pressure: any,
  static_pressure: any,
  residual: any,
  test_flow: any,
  required_margin?: any,
  units?: any,
): number {
  return cell(units, (u) => {
    const d = decisionArgs(demand_flow, demand_pressure, static_pressure, residual, test_flow, required_margin, u);
    return fromUS("pressure", pumpBoost(d.demandFlow, d.demandPressure, d.test, d.requiredMargin), u);
  });
}


// ─── Units ───────────────────────────────────────────────────────────────────────────────────────────────────────
/**
 * Converts a value between units of the same kind: flow "gpm", "L/min", "m3/h"; pressure "psi", "bar", "kPa";
 * length "ft", "m", "in", "mm"; area "ft2", "m2"; density "gpm/ft2", "mm/min"; K-factors "K-US", "K-SI".
 * @customfunction
 * @param value The value to convert (0 or more).
 * @param from Its unit, e.g. "gpm".
 * @param to The unit wanted, e.g. "L/min".
 * @returns The converted value.
 */
export function unit(value: any, from: any, to: any): number {
  return cell(null, () => {
    const v = numberArg(value, "value", { min: 0 });
    return finiteOr(convertUnit(v, from, to), "value", plain(v));
  });
}

