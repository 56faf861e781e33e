/**
 * Argument groups that several cell functions share: a flow test, a pipe, a demand point, a minimum pressure.
 * Each returns US values and throws a HeadroomError naming the argument at fault.
 */
import type { PumpRating } from "../engine/pump";
import { MIN_SPRINKLER_PRESSURE_BAR, MIN_SPRINKLER_PRESSURE_PSI } from "../engine/sprinkler";
import { type FlowTest, checkFlowTest } from "../engine/supply";
import { type UnitSystem, toUS } from "../engine/units";
import { LIMITS_US, ZERO_ALLOWED, numberArg, optionalQuantityArg, quantityArg } from "./args";

/** Largest Hazen-Williams C accepted: above every value of the C table. (common practice) */
export const MAX_C_FACTOR = 200;
/** Smallest Hazen-Williams C accepted: below every value of the C table, even for old tuberculated pipe. (common practice) */
export const MIN_C_FACTOR = 10;

/** static, residual, test_flow of a hydrant flow test; residual must be below static. */
export function flowTestArgs(staticP: unknown, residual: unknown, testFlow: unknown, u: UnitSystem): FlowTest {
  // Fast path for the everyday call (plain numbers in US units, all in range): the same checks as below, written as
  // comparisons (NaN and ±Infinity fail them and take the full path, which words the error).
  if (
    u === "US" &&
    typeof staticP === "number" && typeof residual === "number" && typeof testFlow === "number" &&
    staticP > 0 && staticP <= LIMITS_US.pressure && residual >= 0 && residual < staticP &&
    testFlow > 0 && testFlow <= LIMITS_US.flow
  ) {
    return { static: staticP, residual, testFlow };
  }
  const t: FlowTest = {
    static: quantityArg(staticP, "static_pressure", "pressure", u),
    residual: quantityArg(residual, "residual", "pressure", u, ZERO_ALLOWED),
    testFlow: quantityArg(testFlow, "test_flow", "flow", u),
  };
  checkFlowTest(t); // the residual below the static pressure: the engine's own rule
  return t;
}

const C_FACTOR_RULE = Object.freeze({ min: MIN_C_FACTOR, max: MAX_C_FACTOR });

/** The C factor of a pipe: from MIN_C_FACTOR to MAX_C_FACTOR. */
export function cFactorArg(value: unknown, name = "c_factor"): number {
  // the rule's two comparisons on the way through (NaN and ±Infinity fail them); numberArg words any problem
  return typeof value === "number" && value >= MIN_C_FACTOR && value <= MAX_C_FACTOR ? value + 0 : numberArg(value, name, C_FACTOR_RULE);
}

/** A sprinkler's minimum operating pressure: default 7 psi in US work, 0.5 bar in SI work [NFPA 13]. */
export function minPressureArg(value: unknown, u: UnitSystem): number {
  const fallback = u === "SI" ? toUS("pressure", MIN_SPRINKLER_PRESSURE_BAR, u) : MIN_SPRINKLER_PRESSURE_PSI;
  return optionalQuantityArg(value, "min_pressure", "pressure", u, fallback);
}

/** VERDICT's and PUMPBOOST's required_margin: a pressure, 0 or more, 0 when omitted (a visible input, never hidden). */
export function requiredMarginArg(value: unknown, u: UnitSystem): number {
  return optionalQuantityArg(value, "required_margin", "pressure", u, 0, ZERO_ALLOWED);
}

/** demand_flow and demand_pressure, as VERDICT reads them (US units): the pane reads the candidates' rows through it. */
export function demandPointArgs(demandFlow: unknown, demandPressure: unknown, u: UnitSystem): [number, number] {
  return [quantityArg(demandFlow, "demand_flow", "flow", u), quantityArg(demandPressure, "demand_pressure", "pressure", u, ZERO_ALLOWED)];
}

/** demand_flow, demand_pressure and the flow test. */
export function demandArgs(
  demandFlow: unknown,
  demandPressure: unknown,
  staticP: unknown,
  residual: unknown,
  testFlow: unknown,
  u: UnitSystem,
): [number, number, FlowTest] {
  const [q, p] = demandPointArgs(demandFlow, demandPressure, u);
  return [q, p, flowTestArgs(staticP, residual, testFlow, u)];
}

/** The inputs of the decision, US units: the demand point, the flow test and the required margin. */
export interface DecisionInput {
  demandFlow: number;
  demandPressure: number;
  test: FlowTest;
  requiredMargin: number;
}

/**
 * The arguments of VERDICT and PUMPBOOST (and MARGIN, whose required margin is 0): the task pane reads the workbook's
 * named cells through this very function, so that both say the same about the same inputs.
 */
export function decisionArgs(
  demandFlow: unknown,
  demandPressure: unknown,
  staticP: unknown,
  residual: unknown,
  testFlow: unknown,
  requiredMargin: unknown,
  u: UnitSystem,
): DecisionInput {
  const [q, p, test] = demandArgs(demandFlow, demandPressure, staticP, residual, testFlow, u);
  return { demandFlow: q, demandPressure: p, test, requiredMargin: requiredMarginArg(requiredMargin, u) };
}

/** rated_flow and rated_pressure of a pump, as PUMPCURVE reads them (US units). */
export function pumpRatingArgs(ratedFlow: unknown, ratedPressure: unknown, u: UnitSystem): PumpRating {
  return {
    ratedFlow: quantityArg(ratedFlow, "rated_flow", "flow", u),
    ratedPressure: quantityArg(ratedPressure, "rated_pressure", "pressure", u),
  };
}
