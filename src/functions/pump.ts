/**
 * Cell functions of the fire pump: a standard rating for a demand (PUMPSIZE), the pressure a pump gives along its
 * curve (PUMPCURVE) and the pressure it leaves in the main it draws from (PUMPSUCTION). Engine: src/engine/pump.ts.
 */
import { fail, q } from "../engine/errors";
import { DEFAULT_OVERLOAD_RATIO, DEFAULT_SHUTOFF_RATIO, pumpPressure, pumpRating, pumpSuction } from "../engine/pump";
import { type UnitSystem, fromUS } from "../engine/units";
import { ZERO_ALLOWED, optionalNumberArg, optionalQuantityArg, quantityArg } from "./args";
import { cell } from "./bridge";
import { flowTestArgs, pumpRatingArgs } from "./common";
import type { SpillShape } from "./shapes";

// ─── PUMPSIZE ────────────────────────────────────────────────────────────────────────────────────────────────────────────
/** PUMPSIZE's output columns (one row). */
export const PUMPSIZE_COLUMNS = ["rated_flow", "rated_pressure"] as const;
/** PUMPSIZE spills one row of its columns. */
export const PUMPSIZE_SPILL: SpillShape = { rows: 1, columns: PUMPSIZE_COLUMNS.length };

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

/** PUMPSIZE: one row [rated_flow, rated_pressure] in the user's units. */
function pumpSizeRow(demandFlow: unknown, boost: unknown, u: UnitSystem): unknown[][] {
  const flow = quantityArg(demandFlow, "demand_flow", "flow", u);
  const b = quantityArg(boost, "boost", "pressure", u, ZERO_ALLOWED);
  if (b === 0) fail("boost", q("pressure", 0), "no pump is needed (PUMPBOOST gives 0 where the supply suffices)");
  const rating = pumpRating(flow, b, u);
  return [[fromUS("flow", rating.ratedFlowGpm, u), rating.ratedPressure]];
}

// ─── PUMPCURVE ───────────────────────────────────────────────────────────────────────────────────────────────────────────
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

/**
 * PUMPCURVE: the pump's net pressure at `flow`. Inputs outside the fire pump envelope (a flow beyond 150 % of
 * rated, ratios the envelope does not allow) are `#NUM!`, as the vocabulary says; the error still carries its
 * message (Excel does not show messages on `#NUM!`, the preview host and the tests do). Other bad input is
 * `#VALUE!` with its message.
 */
function pumpCurvePressure(
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

// ─── PUMPSUCTION ─────────────────────────────────────────────────────────────────────────────────────────────────────────
/**
 * Pressure left in the public main while a fire pump draws 150 % of its rated flow plus other_flow (hose streams
 * from the same main), on the supply curve through the flow test (NFPA 291). Compare it with the water purveyor's
 * minimum (often 20 psi): below it, a pump alone cannot serve and a suction tank or a stronger main is needed. An
 * error, naming the flow where the main reaches 0, when that flow is drawn or more.
 * @customfunction
 * @param rated_flow Rated flow of the pump (gpm; SI: L/min).
 * @param static_pressure Static pressure of the flow test (psi; SI: bar).
 * @param residual Residual pressure while the test flow runs (psi; SI: bar).
 * @param test_flow Flow during the test (gpm; SI: L/min).
 * @param other_flow Other flow drawn from the same main at the same time, e.g. outside hose (gpm; SI: L/min); default 0.
 * @param units "US" (default) or "SI".
 * @returns Pressure left in the main (psi; SI: bar).
 */
export function pumpsuction(
  rated_flow: any,
  static_pressure: any,
  residual: any,
  test_flow: any,
  other_flow?: any,
  units?: any,
): number {
  return cell(units, (u) => {
    const qr = quantityArg(rated_flow, "rated_flow", "flow", u);
    const t = flowTestArgs(static_pressure, residual, test_flow, u);
    const other = optionalQuantityArg(other_flow, "other_flow", "flow", u, 0, ZERO_ALLOWED);
    return fromUS("pressure", pumpSuction(qr, t, other), u); // above 0: the engine refuses an exhausted main
  });
}
