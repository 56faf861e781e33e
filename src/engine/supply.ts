/**
 * The water supply: the supply curve through a hydrant flow test, and hydrant outlet flow from a pitot reading.
 * US units: gpm, psi, in. All pressures are gauge.
 */
import { fail, q } from "./errors";
import { HW_FLOW_EXPONENT } from "./friction";

/** A hydrant flow test: static pressure, residual pressure at the test flow. */
export interface FlowTest {
  /** static pressure, psi */
  static: number;
  /** residual pressure at testFlow, psi */
  residual: number;
  /** flow during the test, gpm */
  testFlow: number;
}

/** Check a flow test: static > residual ≥ 0, test flow > 0. */
export function checkFlowTest(t: FlowTest): void {
  if (!(t.static > 0)) fail("static_pressure", q("pressure", t.static), "must be greater than 0");
  if (!(t.residual >= 0)) fail("residual", q("pressure", t.residual), "must be 0 or more");
  if (!(t.residual < t.static)) {
    fail("residual", q("pressure", t.residual), "must be below the static pressure {0}", q("pressure", t.static));
  }
  if (!(t.testFlow > 0)) fail("test_flow", q("flow", t.testFlow), "must be greater than 0");
}

/**
 * The flow at which the supply curve reaches 0 psi: Qt (Ps / (Ps − Pr))^(1/1.85).
 * Source: [NFPA 291] supply curve solved for P = 0. Worked value: 70 / 50 at 1000 gpm → 1968 gpm.
 */
export function exhaustionFlow(t: FlowTest): number {
  return t.testFlow * Math.pow(t.static / (t.static - t.residual), 1 / HW_FLOW_EXPONENT);
}

/**
 * The supply curve itself, P(Q) = Ps − (Ps − Pr)(Q/Qt)^1.85, unchecked: for callers that have checked the flow test
 * and the flow, and that handle P ≤ 0 themselves. [NFPA 291]
 */
export function supplyCurve(flow: number, t: FlowTest): number {
  return t.static - (t.static - t.residual) * Math.pow(flow / t.testFlow, HW_FLOW_EXPONENT);
}

/**
 * Pressure the supply delivers at a flow, along the supply curve.
 *
 *   P(Q) = Ps − (Ps − Pr) (Q / Qt)^1.85
 *
 * Flows above the test flow extrapolate along the same curve. Where P(Q) ≤ 0 the supply is exhausted: an error.
 * @param flow Q, gpm (≥ 0)
 * @returns psi (> 0)
 * Source: [NFPA 291]. Worked value: static 70, residual 50 at 1000 gpm; at 600 gpm → 62.2 psi.
 */
export function supplyAt(flow: number, t: FlowTest): number {
  checkFlowTest(t);
  if (!(flow >= 0)) fail("flow", q("flow", flow), "must be 0 or more");
  const p = supplyCurve(flow, t);
  if (!(p > 0)) {
    fail("flow", q("flow", flow), "this supply reaches {0} at {1}", q("pressure", 0), q("flow", exhaustionFlow(t)));
  }
  return p;
}

/**
 * Flow the supply delivers at a pressure, along the supply curve.
 *
 *   Q(P) = Qt ((Ps − P) / (Ps − Pr))^(1/1.85)
 *
 * [NFPA 291] writes the exponent as 0.54, the rounded 1/1.85; the exact reciprocal is used so that
 * flowAt(supplyAt(Q)) = Q.
 * @param pressure P, psi, from 0 to the static pressure
 * @returns gpm
 * Source: [NFPA 291]. Worked value: static 70, residual 50 at 1000 gpm; at 20 psi → 1641 gpm (fire flow at 20 psi).
 */
export function flowAt(pressure: number, t: FlowTest): number {
  checkFlowTest(t);
  if (!(pressure >= 0 && pressure <= t.static)) {
    fail("pressure", q("pressure", pressure), "must be from 0 to the static pressure {0}", q("pressure", t.static));
  }
  return t.testFlow * Math.pow((t.static - pressure) / (t.static - t.residual), 1 / HW_FLOW_EXPONENT);
}

/** Pitot coefficient of a smooth, well-rounded hydrant outlet. [NFPA 291] */
export const PITOT_COEFFICIENT_SMOOTH = 0.9;
/** Pitot flow constant: Q = 29.83 c d² √p with Q gpm, d in, p psi. [NFPA 291] */
export const PITOT_CONSTANT = 29.83;

/**
 * Hydrant outlet flow from a pitot (velocity-head) reading.
 *
 *   Q = 29.83 c d² √p
 *
 * @param pitot p, psi (> 0)
 * @param outletDiameter d, in (> 0)
 * @param coefficient c: 0.90 smooth rounded outlet, 0.80 square and sharp, 0.70 square projecting into the barrel
 * @returns gpm
 * Source: [NFPA 291]. Worked value: 2.5 in outlet, c 0.90, 16 psi → 671 gpm.
 */
export function pitotFlow(pitot: number, outletDiameter: number, coefficient: number): number {
  return PITOT_CONSTANT * coefficient * outletDiameter * outletDiameter * Math.sqrt(pitot);
}
