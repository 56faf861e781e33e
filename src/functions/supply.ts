/**
 * Cell functions of the water supply: the supply curve through a hydrant flow test (SUPPLYAT, FLOWAT, SUPPLYCURVE),
 * a hydrant outlet's flow from a pitot reading (PITOTFLOW) and the flow test carried to the site (SITETEST). Each wrapper reads its arguments (./args, ./common),
 * calls the engine (src/engine/supply.ts, curve.ts) and converts the result to the user's units; a spilling
 * function's output columns and spill shape are declared beside it.
 */
import { SUPPLY_CURVE_FLOW_FACTOR, SUPPLY_CURVE_MAX_POINTS, SUPPLY_CURVE_POINTS, supplyCurvePoints } from "../engine/curve";
import { PITOT_COEFFICIENT_SMOOTH, flowAt, pitotFlow, siteTest, supplyAt } from "../engine/supply";
import { type UnitSystem, fromUS } from "../engine/units";
import { SIGNED, ZERO_ALLOWED, optionalNumberArg, optionalQuantityArg, quantityArg, quantityIn, quantitySpan } from "./args";
import { cell } from "./bridge";
import { flowTestArgs } from "./common";
import type { SpillShape } from "./shapes";

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
  return cell(units, supplyPressure, flow, static_pressure, residual, test_flow);
}

/** The span of a flow drawn from the supply: from 0. */
const DRAWN_FLOW = quantitySpan("flow", ZERO_ALLOWED);

/** SUPPLYAT's body (a constant of the module, so that a recalculation makes no closure and it inlines). */
const supplyPressure = (u: UnitSystem, flow: unknown, staticP: unknown, residual: unknown, testFlow: unknown): number => {
  const t = flowTestArgs(staticP, residual, testFlow, u);
  const q = quantityIn(flow, "flow", DRAWN_FLOW, u);
  return fromUS("pressure", supplyAt(q, t), u); // finite: every input is bounded and the engine checks p > 0
};

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

// ─── SUPPLYCURVE ─────────────────────────────────────────────────────────────────────────────────────────────────────────
/** SUPPLYCURVE's output columns. */
export const SUPPLYCURVE_COLUMNS = ["flow", "pressure"] as const;
/** SUPPLYCURVE spills `points` rows (a literal in the formula, default 16) of [flow, pressure]. */
export const SUPPLYCURVE_SPILL: SpillShape = {
  rows: { literal: "points", default: SUPPLY_CURVE_POINTS, min: 2, max: SUPPLY_CURVE_MAX_POINTS },
  columns: SUPPLYCURVE_COLUMNS.length,
};

/**
 * Points of the water supply curve through the hydrant flow test, for a native chart: P = static − (static −
 * residual) × (Q / test_flow)^1.85 (NFPA 291) at flows evenly spaced from 0 to max_flow. Where the supply reaches
 * 0 before max_flow, that row and every row after it hold [that flow, 0], so that a chart draws every row.
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

/** SUPPLYCURVE: exactly `points` rows of [flow, pressure]; from the flow where the supply reaches 0, [that flow, 0]. */
function supplyCurveRows(
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
  return supplyCurvePoints(t, qMax, n).map((pt) => [fromUS("flow", pt[0], u), fromUS("pressure", pt[1], u)]);
}

// ─── SITETEST ────────────────────────────────────────────────────────────────────────────────────────────────────────────
/** SITETEST's output columns (one row): the flow test's two readings at the site. */
export const SITETEST_COLUMNS = ["static", "residual"] as const;
/** SITETEST spills one row of its columns. */
export const SITETEST_SPILL: SpillShape = { rows: 1, columns: SITETEST_COLUMNS.length };

/**
 * The hydrant flow test carried to the point where the demand is computed: each reading is reduced by derate (seasonal
 * and future loss, e.g. 0.1 for 10 %), then by the elevation pressure of rise, P_site = P × (1 − derate) − 0.433 ×
 * rise (NFPA 13). Feed the result to SUPPLYAT, FLOWAT, MARGIN and VERDICT. An error where no residual pressure is
 * left at the site.
 * @customfunction
 * @param static_pressure Static pressure at the test gauge, no flow (psi; SI: bar).
 * @param residual Residual pressure at the test gauge while the test flow runs (psi; SI: bar).
 * @param rise Height of the site above the test gauge (ft; SI: m); below 0 where the site is lower.
 * @param derate Fraction taken off both readings, from 0 to less than 1 (0.1 for 10 %); default 0.
 * @param units "US" (default) or "SI".
 * @returns One row: [static, residual] at the site (psi; SI: bar).
 */
export function sitetest(static_pressure: any, residual: any, rise: any, derate?: any, units?: any): any[][] {
  return cell(units, (u) => siteTestRow(static_pressure, residual, rise, derate, u));
}

/** SITETEST: one row [static, residual] at the site, in the user's units. */
function siteTestRow(staticP: unknown, residual: unknown, rise: unknown, derate: unknown, u: UnitSystem): unknown[][] {
  const t = {
    static: quantityArg(staticP, "static_pressure", "pressure", u),
    residual: quantityArg(residual, "residual", "pressure", u, ZERO_ALLOWED),
  };
  const h = quantityArg(rise, "rise", "length", u, SIGNED);
  const d = optionalNumberArg(derate, "derate", 0); // the engine holds it to 0 ≤ derate < 1
  const site = siteTest(t, h, d); // the residual at the site is above 0, the static above it
  return [[fromUS("pressure", site.static, u), fromUS("pressure", site.residual, u)]];
}
