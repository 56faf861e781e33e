/**
 * The water supply: the supply curve through a hydrant flow test, and hydrant outlet flow from a pitot reading.
 * US units: gpm, psi, in. All pressures are gauge.
 */
import { fail, n, q } from "./errors";
import { HW_FLOW_EXPONENT, elevationPressure } from "./friction";

/** A hydrant flow test: static pressure, residual pressure at the test flow. */
export interface FlowTest {
  /** static pressure, psi */
  static: number;
  /** residual pressure at testFlow, psi */
  residual: number;
  /** flow during the test, gpm */
  testFlow: number;
}

/**
 * Check a flow test: static > residual ≥ 0, test flow > 0; an error names the first reading that breaks the rule.
 *
 * @param t the flow test: static and residual pressure, psi; test flow, gpm
 * @see [NFPA 291] hydrant flow test
 * @example
 * checkFlowTest({ static: 70, residual: 50, testFlow: 1000 }) // → undefined
 * checkFlowTest({ static: 70, residual: 80, testFlow: 1000 })
 * // throws "residual: got 80 psi; must be below the static pressure 70 psi"
 */
export function checkFlowTest(t: FlowTest): void {
  // the comparisons alone on the way through (NaN fails them); the wording only when one fails
  if (!(t.static > 0 && t.residual >= 0 && t.residual < t.static && t.testFlow > 0)) flowTestProblem(t);
}

/** The first rule of checkFlowTest that `t` breaks, thrown. */
function flowTestProblem(t: FlowTest): never {
  checkTestPressures(t);
  fail("test_flow", q("flow", t.testFlow), "must be greater than 0");
}

/** The gauge readings of a flow test: static > 0, 0 ≤ residual < static; an error names the first one at fault. */
function checkTestPressures(t: TestPressures): void {
  if (!(t.static > 0)) fail("static_pressure", q("pressure", t.static), "must be greater than 0");
  if (!(t.residual >= 0)) fail("residual", q("pressure", t.residual), "must be 0 or more");
  if (!(t.residual < t.static)) {
    fail("residual", q("pressure", t.residual), "must be below the static pressure {0}", q("pressure", t.static));
  }
}

/** The two gauge readings of a flow test, psi: what SITETEST carries to the site. */
export type TestPressures = Pick<FlowTest, "static" | "residual">;

/**
 * The flow test carried to the site: both readings derated, then lowered by the elevation pressure of the rise.
 *
 *   P_site = P × (1 − derate) − 0.433 × rise
 *
 * The derate allows for seasonal and future loss (common practice; 10 % is typical, 0 takes the test as read); the
 * rise is the height of the point where the demand is computed above the test gauge (negative when it is lower).
 * Static 72, residual 58 psi, site 20 ft above the gauge, 10 % derate: 72 × 0.9 − 0.433 × 20 = 64.8 − 8.66 = 56.14
 * psi; 58 × 0.9 − 8.66 = 52.2 − 8.66 = 43.54 psi. An error where the residual at the site is not above 0 (it names
 * the rise, or the residual where the rise is not to blame), for a derate outside 0 ≤ derate < 1, and for readings
 * a flow test may not have (a residual at or above static).
 *
 * @param t the test's readings: static and residual pressure at the gauge, psi
 * @param rise the height of the site above the test gauge, ft (negative when lower)
 * @param derate the fraction taken off both readings, dimensionless (0 ≤ derate < 1)
 * @returns the readings at the site: static and residual pressure, psi (residual > 0)
 * @see [NFPA 13] 0.433 psi per ft; [NFPA 291] the flow test; the derate (common practice)
 * @example
 * siteTest({ static: 72, residual: 58 }, 20, 0.1) // ≈ { static: 56.14, residual: 43.54 } psi
 * siteTest({ static: 72, residual: 58 }, 140, 0)
 * // throws "rise: got 140 ft; leaves the residual at the site at -2.62 psi; it must stay above 0 psi"
 */
export function siteTest(t: TestPressures, rise: number, derate: number): TestPressures {
  checkTestPressures(t);
  if (!(derate >= 0 && derate < 1)) fail("derate", n(derate), "must be from 0 to less than 1 (a fraction: 0.1 for 10 %)");
  if (!Number.isFinite(rise)) fail("rise", q("length", rise), "must be a finite number");
  const lift = elevationPressure(rise);
  const site = { static: t.static * (1 - derate) - lift, residual: t.residual * (1 - derate) - lift };
  if (!(site.residual > 0)) {
    // a rise of 0 or below can leave no residual only where there was none at the gauge
    if (!(rise > 0)) {
      fail("residual", q("pressure", t.residual), "must be greater than 0 to carry the test to the site (or the site lower than the gauge)");
    }
    fail("rise", q("length", rise), "leaves the residual at the site at {0}; it must stay above {1}", q("pressure", site.residual), q("pressure", 0));
  }
  return site;
}

/**
 * The flow at which the supply curve reaches 0 psi.
 *
 *   Qe = Qt (Ps / (Ps − Pr))^(1/1.85)
 *
 * Static 70, residual 50 psi at 1000 gpm: 1000 × (70 / 20)^(1/1.85) = 1000 × 3.5^0.54054 = 1968 gpm.
 *
 * @param t the flow test: static Ps and residual Pr, psi; test flow Qt, gpm (checked by the caller)
 * @returns Qe, the flow, gpm
 * @see [NFPA 291] supply curve solved for P = 0
 * @example
 * exhaustionFlow({ static: 70, residual: 50, testFlow: 1000 }) // ≈ 1968 gpm
 */
export function exhaustionFlow(t: FlowTest): number {
  return t.testFlow * Math.pow(t.static / (t.static - t.residual), 1 / HW_FLOW_EXPONENT);
}

/**
 * The supply curve itself, unchecked.
 *
 *   P(Q) = Ps − (Ps − Pr) (Q / Qt)^1.85
 *
 * For callers that have checked the flow test and the flow, and that handle P ≤ 0 themselves. Static 70, residual
 * 50 psi at 1000 gpm; at 2500 gpm, past the exhaustion flow: 70 − 20 × 2.5^1.85 = 70 − 20 × 5.4474 = −38.95 psi.
 *
 * @param flow Q, the flow, gpm
 * @param t the flow test: static Ps and residual Pr, psi; test flow Qt, gpm
 * @returns P, the pressure, psi (0 or below past the exhaustion flow)
 * @see [NFPA 291] water supply curve
 * @example
 * supplyCurve(600, { static: 70, residual: 50, testFlow: 1000 }) // ≈ 62.2 psi
 * supplyCurve(2500, { static: 70, residual: 50, testFlow: 1000 }) // ≈ -38.95 psi
 */
export function supplyCurve(flow: number, t: FlowTest): number {
  return t.static - (t.static - t.residual) * Math.pow(flow / t.testFlow, HW_FLOW_EXPONENT);
}

/**
 * The supply pressure at a flow where the supply still has some, else null.
 *
 *   P(Q) = Ps − (Ps − Pr) (Q / Qt)^1.85 where Q < Qe and P > 0;   null otherwise
 *
 * A pressure that rounds to 0 short of the exhaustion flow (a static of a few denormals) counts as none: the callers
 * (the verdict, the suction check, the chosen pump's check) each say in their own words what a missing pressure means.
 * Static 70, residual 50 psi at 1000 gpm: 62.2 psi at 600 gpm (worked in supplyCurve); none at 2000 gpm, past 1968 gpm.
 *
 * @param flow Q, the flow, gpm (≥ 0)
 * @param t the flow test: static Ps and residual Pr, psi; test flow Qt, gpm (checked by the caller)
 * @returns P, the pressure, psi (> 0), or null where the supply is exhausted at `flow`
 * @see [NFPA 291] water supply curve
 * @example
 * supplyBefore(600, { static: 70, residual: 50, testFlow: 1000 }) // ≈ 62.2 psi
 * supplyBefore(2000, { static: 70, residual: 50, testFlow: 1000 }) // → null
 */
export function supplyBefore(flow: number, t: FlowTest): number | null {
  const p = supplyCurve(flow, t);
  return flow < exhaustionFlow(t) && p > 0 ? p : null;
}

/**
 * Pressure the supply delivers at a flow, along the supply curve.
 *
 *   P(Q) = Ps − (Ps − Pr) (Q / Qt)^1.85
 *
 * Flows above the test flow extrapolate along the same curve. Where P(Q) ≤ 0 the supply is exhausted: an error.
 * Static 70, residual 50 psi at 1000 gpm; at 600 gpm: 70 − 20 × 0.6^1.85 = 70 − 20 × 0.38866 = 62.2 psi.
 *
 * @param flow Q, the flow, gpm (≥ 0)
 * @param t the flow test: static Ps and residual Pr, psi; test flow Qt, gpm
 * @returns P, the pressure, psi (> 0)
 * @see [NFPA 291] water supply curve
 * @example
 * supplyAt(600, { static: 70, residual: 50, testFlow: 1000 }) // ≈ 62.2 psi
 * supplyAt(2000, { static: 70, residual: 50, testFlow: 1000 })
 * // throws "flow: got 2000 gpm; this supply reaches 0 psi at 1968.3 gpm"
 */
export function supplyAt(flow: number, t: FlowTest): number {
  checkFlowTest(t);
  // NaN below 0; no NaN written here: a global read on a branch never taken kept the flow test object on the heap
  const p = supplyCurve(flow, t);
  if (!(flow >= 0 && p > 0)) supplyAtProblem(flow, t);
  return p;
}

/** Why supplyAt has no pressure at `flow`: a flow below 0, or one where the supply is exhausted. */
function supplyAtProblem(flow: number, t: FlowTest): never {
  if (!(flow >= 0)) fail("flow", q("flow", flow), "must be 0 or more");
  fail("flow", q("flow", flow), "this supply reaches {0} at {1}", q("pressure", 0), q("flow", exhaustionFlow(t)));
}

/**
 * Flow the supply delivers at a pressure, along the supply curve.
 *
 *   Q(P) = Qt ((Ps − P) / (Ps − Pr))^(1/1.85)
 *
 * [NFPA 291] writes the exponent as 0.54, the rounded 1/1.85; the exact reciprocal is used so that
 * flowAt(supplyAt(Q)) = Q. Static 70, residual 50 psi at 1000 gpm; at 20 psi (the fire flow at 20 psi):
 * 1000 × (50 / 20)^(1/1.85) = 1641 gpm.
 *
 * @param pressure P, the pressure, psi, from 0 to the static pressure
 * @param t the flow test: static Ps and residual Pr, psi; test flow Qt, gpm
 * @returns Q, the flow, gpm
 * @see [NFPA 291] water supply curve
 * @example
 * flowAt(20, { static: 70, residual: 50, testFlow: 1000 }) // ≈ 1641 gpm
 */
export function flowAt(pressure: number, t: FlowTest): number {
  checkFlowTest(t);
  if (!(pressure >= 0 && pressure <= t.static)) {
    fail("pressure", q("pressure", pressure), "must be from 0 to the static pressure {0}", q("pressure", t.static));
  }
  return t.testFlow * Math.pow((t.static - pressure) / (t.static - t.residual), 1 / HW_FLOW_EXPONENT);
}

/**
 * Pitot coefficient of a smooth, well-rounded hydrant outlet, dimensionless.
 * @see [NFPA 291] hydrant outlet coefficients
 */
export const PITOT_COEFFICIENT_SMOOTH = 0.9;
/**
 * Pitot flow constant: Q = 29.83 c d² √p with Q gpm, d in, p psi.
 * @see [NFPA 291] hydrant outlet flow
 */
export const PITOT_CONSTANT = 29.83;

/**
 * Hydrant outlet flow from a pitot (velocity-head) reading.
 *
 *   Q = 29.83 c d² √p
 *
 * 2.5 in outlet, c 0.90, 16 psi: 29.83 × 0.90 × 2.5² × √16 = 29.83 × 0.90 × 6.25 × 4 = 671 gpm.
 *
 * @param pitot p, the pitot (velocity-head) pressure, psi (> 0)
 * @param outletDiameter d, the outlet's internal diameter, in (> 0)
 * @param coefficient c, dimensionless: 0.90 smooth rounded outlet, 0.80 square and sharp, 0.70 square projecting
 *   into the barrel
 * @returns Q, the flow, gpm
 * @see [NFPA 291] hydrant outlet flow from a pitot reading
 * @example
 * pitotFlow(16, 2.5, 0.9) // ≈ 671 gpm
 */
export function pitotFlow(pitot: number, outletDiameter: number, coefficient: number): number {
  return PITOT_CONSTANT * coefficient * outletDiameter * outletDiameter * Math.sqrt(pitot);
}
