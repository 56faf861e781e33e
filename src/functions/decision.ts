/**
 * Cell functions of the decision: the margin of the supply over the demand (MARGIN), the verdict (VERDICT)
 * and the pressure a pump must add (PUMPBOOST). They read their arguments through `decisionArgs` (./common), the
 * very reader the task pane uses, so the pane and the sheet say the same about the same inputs.
 */
import { assess, margin as supplyMargin, pumpBoost, verdictSentence } from "../engine/decision";
import { fromUS } from "../engine/units";
import { cell } from "./bridge";
import { decisionArgs, demandArgs } from "./common";

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
 * A plain sentence for a project manager, in one of three states: "No pump needed: 12.4 psi to spare at 562 gpm (10.0
 * psi margin required).", "Marginal: 6.3 psi to spare at 562 gpm, less than the 10.0 psi margin required." or "Pump
 * needed: the supply is 10.7 psi short at 562 gpm."; where the supply reaches 0 psi before the demand flow, a pump
 * alone cannot serve. A second sentence follows when the flow test dropped under 25 % of static and the demand flow
 * is above the test flow (NFPA 291). A preliminary estimate: the adopted codes, the authority having jurisdiction
 * and a licensed fire-protection professional decide.
 * @customfunction
 * @param demand_flow Total demand flow at the supply connection (gpm; SI: L/min).
 * @param demand_pressure Pressure the system needs there (psi; SI: bar).
 * @param static_pressure Static pressure of the flow test (psi; SI: bar).
 * @param residual Residual pressure while the test flow runs (psi; SI: bar).
 * @param test_flow Flow during the test (gpm; SI: L/min).
 * @param required_margin Safety margin the supply must exceed the demand by (psi; SI: bar); default 0.
 * @param units "US" (default) or "SI".
 * @returns The verdict: one sentence, or two with the flow-test caveat.
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
