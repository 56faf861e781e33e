/**
 * Fire pumps: picking a standard rating for a demand, the pressure a pump gives along its curve, and the pressure it
 * leaves in the public main it draws from. US units: gpm, psi.
 */
import { fail, n, notInTable, outsideEnvelope, q } from "./errors";
import { ceilCount } from "./sprinkler";
import { type FlowTest, checkFlowTest, exhaustionFlow, supplyBefore } from "./supply";
import { type UnitSystem, fromUS } from "./units";

/**
 * Standard rated capacities of centrifugal fire pumps, gpm, ascending.
 * @see [NFPA 20] standard rated capacities (from memory)
 */
export const STANDARD_RATED_CAPACITIES_GPM: readonly number[] = [
  25, 50, 100, 150, 200, 250, 300, 400, 450, 500, 750, 1000, 1250, 1500, 2000, 2500, 3000, 3500, 4000, 4500, 5000,
]; // [NFPA 20] (from memory)

/** PUMPSIZE rounds the boost up to a whole number of these steps in US work, psi (the vocabulary's rule). */
export const RATED_PRESSURE_STEP_PSI = 5;
/** PUMPSIZE rounds the boost up to a whole number of these steps in SI work, bar (the vocabulary's rule). */
export const RATED_PRESSURE_STEP_BAR = 0.5;

/** A fire pump's rating, US units: rated flow, gpm, and rated net pressure, psi. */
export interface PumpRating {
  ratedFlow: number;
  ratedPressure: number;
}

/**
 * Flow of the overload point as a multiple of rated flow, dimensionless.
 * @see [NFPA 20] centrifugal pump performance
 */
export const OVERLOAD_FLOW_RATIO = 1.5;
/**
 * Churn (shutoff) pressure may be at most this multiple of rated pressure, dimensionless.
 * @see [NFPA 20] centrifugal pump performance
 */
export const MAX_SHUTOFF_RATIO = 1.4;
/**
 * At 150 % of rated flow the pump must give at least this multiple of rated pressure, dimensionless.
 * @see [NFPA 20] centrifugal pump performance
 */
export const MIN_OVERLOAD_RATIO = 0.65;
/**
 * Default curve shape when only the rating is known: shutoff at 120 % of rated pressure, dimensionless.
 * @see (common practice)
 */
export const DEFAULT_SHUTOFF_RATIO = 1.2;
/**
 * Default curve shape: 70 % of rated pressure at 150 % of rated flow, dimensionless.
 * @see (common practice)
 */
export const DEFAULT_OVERLOAD_RATIO = 0.7;

/**
 * The smallest standard rated capacity not below the demand flow.
 *
 * @param demandFlow the demand flow, gpm (> 0)
 * @returns the rated capacity, gpm, one of STANDARD_RATED_CAPACITIES_GPM; `#N/A` kind above the largest (5000 gpm)
 * @see [NFPA 20] standard rated capacities (from memory)
 * @example
 * ratedCapacity(562) // → 750 gpm
 * ratedCapacity(500) // → 500 gpm
 */
export function ratedCapacity(demandFlow: number): number {
  if (!(demandFlow > 0) || !Number.isFinite(demandFlow)) fail("demand_flow", q("flow", demandFlow), "must be greater than 0");
  const tolerance = 1e-9 * demandFlow; // a flow converted from L/min may land a hair above a rating
  const found = STANDARD_RATED_CAPACITIES_GPM.find((c) => c >= demandFlow - tolerance);
  if (found === undefined) {
    const largest = STANDARD_RATED_CAPACITIES_GPM[STANDARD_RATED_CAPACITIES_GPM.length - 1];
    notInTable("demand_flow", q("flow", demandFlow), "the standard rated capacities go up to {0}: split the demand between pumps", q("flow", largest));
  }
  return found;
}

/**
 * Round a value up to a whole number of steps; an exact multiple stays as it is, a positive value takes at least one.
 *
 *   rounded = step × ceil(value / step)
 *
 * @param value the value, any unit (≥ 0)
 * @param step the step, the value's unit (> 0)
 * @returns the rounded value, the value's unit
 * @example
 * roundUpToStep(22.0, 5) // → 25 psi
 * roundUpToStep(25, 5) // → 25 psi
 * roundUpToStep(1.52, 0.5) // → 2 bar
 * roundUpToStep(1e-10, 5) // → 5 psi
 */
export function roundUpToStep(value: number, step: number): number {
  if (!(step > 0)) fail("step", n(step), "must be greater than 0");
  if (!(value >= 0) || !Number.isFinite(value)) fail("value", n(value), "must be 0 or more");
  // a positive value takes at least one step: ceilCount forgives noise of 1e-9 steps, which would round a tiny boost
  // down to a 0 rating
  return value > 0 ? step * Math.max(1, ceilCount(value / step)) : 0;
}

/**
 * PUMPSIZE's rating: a standard rated capacity, and the boost rounded up to a whole step.
 *
 *   rated flow = the smallest standard rated capacity ≥ demand flow
 *   rated pressure = step × ceil(boost / step),   step 5 psi (US) or 0.5 bar (SI, rounded in bar)
 *
 * Rounding in bar makes SI ratings whole steps of bar. 475 gpm, 21.3 psi, US: 500 gpm at 5 × ceil(4.26) = 25 psi;
 * in SI, 21.3 × 0.0689476 = 1.469 bar → 0.5 × ceil(2.94) = 1.5 bar.
 *
 * @param demandFlowGpm the demand flow, gpm (> 0)
 * @param boostPsi the boost the pump must add, psi (> 0)
 * @param units the unit system of the rated pressure, "US" or "SI"
 * @returns ratedFlowGpm in gpm; ratedPressure in `units` (psi or bar)
 * @see [NFPA 20] standard rated capacities (from memory); the steps (common practice)
 * @example
 * pumpRating(475, 21.3, "US") // → { ratedFlowGpm: 500, ratedPressure: 25 } gpm, psi
 * pumpRating(475, 21.3, "SI") // → { ratedFlowGpm: 500, ratedPressure: 1.5 } gpm, bar
 */
export function pumpRating(demandFlowGpm: number, boostPsi: number, units: UnitSystem): { ratedFlowGpm: number; ratedPressure: number } {
  const step = units === "SI" ? RATED_PRESSURE_STEP_BAR : RATED_PRESSURE_STEP_PSI;
  return { ratedFlowGpm: ratedCapacity(demandFlowGpm), ratedPressure: roundUpToStep(fromUS("pressure", boostPsi, units), step) };
}

/**
 * A pump's net pressure along a monotone curve through shutoff, rated and overload points.
 *
 * The three points are shutoff (0, s·Pr), rated (Qr, Pr) and overload (1.5 Qr, o·Pr):
 *
 *   P = s·Pr − k Q^n,   n = ln((s − o) / (s − 1)) / ln 1.5,   k = (s − 1) Pr / Qr^n
 *
 * (P = Pr at Q = Qr gives k; P = o·Pr at Q = 1.5 Qr gives (s − 1) 1.5^n = s − o, hence n). It is computed as
 * P = Pr (s − (s − 1) x^n) with x = Q / Qr, which is the same curve and keeps Qr^n from overflowing. Since o < 1 < s,
 * (s − o) / (s − 1) > 1 and n > 0: the pressure falls monotonically from shutoff and is never above it.
 *
 * Inputs are held to the centrifugal fire pump envelope: 1 < s ≤ 1.4 and 0.65 ≤ o < 1; flow from 0 to 1.5 Qr.
 * Outside that the error is of kind "number" (`#NUM!` in a cell).
 *
 * Rated 500 gpm at 100 psi, defaults s = 1.2, o = 0.7:
 *
 *   n = ln(0.5 / 0.2) / ln 1.5 = 0.916291 / 0.405465 = 2.259851
 *   k = 0.2 × 100 / 500^2.259851 = 20 / 1 256 811 = 1.5913e−5 psi/gpm^n
 *   0 gpm → 120 psi; 62.5 gpm → 120 − 20 × 0.125^2.259851 = 120 − 20 × 0.009102 = 119.82 psi
 *   250 gpm → 120 − 20 × 0.5^2.259851 = 120 − 20 × 0.208794 = 115.82 psi; 500 gpm → 120 − 20 × 1 = 100 psi
 *   750 gpm → 120 − 20 × 1.5^2.259851 = 120 − 20 × 2.5 = 70 psi
 *
 * @param flow Q, the flow, gpm (≥ 0, at most 1.5 Qr)
 * @param ratedFlow Qr, the rated flow, gpm (> 0)
 * @param ratedPressure Pr, the rated net pressure, psi (> 0)
 * @param shutoffRatio s, shutoff pressure over rated pressure, dimensionless (1 < s ≤ 1.4)
 * @param overloadRatio o, pressure at 150 % flow over rated pressure, dimensionless (0.65 ≤ o < 1)
 * @returns P, the net pressure, psi
 * @see [NFPA 20] the envelope; the three-point shape with s = 1.2 and o = 0.7 (common practice); the form
 *   P = shutoff − k Q^n through the three points is the one reference.md gives ("Pumps")
 * @example
 * pumpPressure(0, 500, 100, 1.2, 0.7) // ≈ 120.00 psi
 * pumpPressure(62.5, 500, 100, 1.2, 0.7) // ≈ 119.82 psi
 * pumpPressure(250, 500, 100, 1.2, 0.7) // ≈ 115.82 psi
 * pumpPressure(500, 500, 100, 1.2, 0.7) // ≈ 100.00 psi
 * pumpPressure(750, 500, 100, 1.2, 0.7) // ≈ 70.00 psi
 * pumpPressure(800, 500, 100, 1.2, 0.7)
 * // throws "flow: got 160 % of rated flow; a fire pump curve runs from 0 to 150 % of rated flow"
 */
export function pumpPressure(flow: number, ratedFlow: number, ratedPressure: number, shutoffRatio: number, overloadRatio: number): number {
  if (!(ratedFlow > 0) || !Number.isFinite(ratedFlow)) fail("rated_flow", q("flow", ratedFlow), "must be greater than 0");
  if (!(ratedPressure > 0) || !Number.isFinite(ratedPressure)) fail("rated_pressure", q("pressure", ratedPressure), "must be greater than 0");
  if (!(flow >= 0) || !Number.isFinite(flow)) fail("flow", q("flow", flow), "must be 0 or more");
  const [s, exponent] = pumpCurveShape(shutoffRatio, overloadRatio);
  const x = flow / ratedFlow;
  if (x > OVERLOAD_FLOW_RATIO * (1 + 1e-9)) {
    outsideEnvelope("flow", n(Math.round(x * 1000) / 10, "% of rated flow"), "a fire pump curve runs from 0 to 150 % of rated flow");
  }
  // s − (s − 1) x^n is at most s (the subtracted term is ≥ 0) and never rounds above it, so P ≤ Pr·s = shutoff.
  return ratedPressure * (s - (s - 1) * x ** exponent);
}

/**
 * The shape [s, n] of a pump curve through shutoff, rated and overload points (see pumpPressure).
 *
 *   P / Pr = s − (s − 1) (Q / Qr)^n,   n = ln((s − o) / (s − 1)) / ln 1.5
 *
 * The ratios are checked against the [NFPA 20] envelope first. s 1.2, o 0.7: n = ln 2.5 / ln 1.5
 * = 0.916291 / 0.405465 = 2.259851; s 1.4, o 0.65: n = ln(0.75 / 0.4) / ln 1.5 = 0.628609 / 0.405465 = 1.550340.
 *
 * @param shutoffRatio s, shutoff pressure over rated pressure, dimensionless (1 < s ≤ 1.4)
 * @param overloadRatio o, pressure at 150 % flow over rated pressure, dimensionless (0.65 ≤ o < 1)
 * @returns [s, n], both dimensionless
 * @see [NFPA 20] the envelope; the three-point shape (common practice)
 * @example
 * pumpCurveShape(1.2, 0.7) // ≈ [1.2, 2.259851]
 * pumpCurveShape(1.4, 0.65) // ≈ [1.4, 1.550340]
 * pumpCurveShape(1.5, 0.7)
 * // throws "shutoff_ratio: got 1.5; a fire pump's shutoff pressure must be above rated pressure and at most 1.4 × rated"
 */
export function pumpCurveShape(shutoffRatio: number, overloadRatio: number): [number, number] {
  if (!(shutoffRatio > 1 && shutoffRatio <= MAX_SHUTOFF_RATIO)) {
    outsideEnvelope(
      "shutoff_ratio",
      n(shutoffRatio),
      "a fire pump's shutoff pressure must be above rated pressure and at most {0} × rated",
      n(MAX_SHUTOFF_RATIO),
    );
  }
  if (!(overloadRatio >= MIN_OVERLOAD_RATIO && overloadRatio < 1)) {
    outsideEnvelope(
      "overload_ratio",
      n(overloadRatio),
      "at 150 % of rated flow a fire pump gives at least {0} × rated pressure and less than rated",
      n(MIN_OVERLOAD_RATIO),
    );
  }
  // Through (1, 1) and (1.5, o): (s − 1) 1.5^n = s − o. With o < 1 < s the ratio is above 1, so n > 0.
  const exponent = Math.log((shutoffRatio - overloadRatio) / (shutoffRatio - 1)) / Math.log(OVERLOAD_FLOW_RATIO);
  return [shutoffRatio, exponent];
}

/**
 * Pressure many water purveyors want left in the main while a fire pump draws from it, psi.
 *
 * The visible default that PUMPSUCTION's result is compared with.
 * @see (common practice)
 */
export const MIN_SUCTION_PRESSURE_PSI = 20;

/**
 * Pressure left in the public main while a pump draws 150 % of its rated flow plus other flow from it.
 *
 *   Q = 1.5 Qr + Q_other,   P = Ps − (Ps − Pr) (Q / Qt)^1.85
 *
 * The other flow is what is drawn from the same main at the same time (hose streams from hydrants upstream of the
 * pump). Where Q is at or beyond the flow where the main reaches 0 psi, an error naming both flows: a pump alone
 * cannot serve, a suction tank or a stronger main is needed. Rated 500 gpm, 250 gpm other, against static 72,
 * residual 58 psi at 1100 gpm: Q = 750 + 250 = 1000 gpm; P = 72 − 14 × (1000 / 1100)^1.85 = 72 − 14 × 0.838346 =
 * 60.26 psi.
 *
 * @param ratedFlow Qr, the pump's rated flow, gpm (> 0)
 * @param t the flow test: static Ps and residual Pr, psi; test flow Qt, gpm
 * @param otherFlow Q_other, other flow drawn from the main at the same time, gpm (≥ 0)
 * @returns P, the pressure left in the main, psi (> 0)
 * @see [NFPA 291] water supply curve; [NFPA 20] the 150 % point of a fire pump; the purveyor's minimum (common
 *   practice)
 * @example
 * pumpSuction(500, { static: 72, residual: 58, testFlow: 1100 }, 250) // ≈ 60.26 psi
 * pumpSuction(1500, { static: 72, residual: 58, testFlow: 1100 }, 500)
 * // throws "rated_flow: got 1500 gpm; 150 % of it plus other_flow is 2750 gpm, at or beyond 2665.8 gpm, where this supply reaches 0 psi"
 */
export function pumpSuction(ratedFlow: number, t: FlowTest, otherFlow: number): number {
  checkFlowTest(t);
  if (!(ratedFlow > 0) || !Number.isFinite(ratedFlow)) fail("rated_flow", q("flow", ratedFlow), "must be greater than 0");
  if (!(otherFlow >= 0) || !Number.isFinite(otherFlow)) fail("other_flow", q("flow", otherFlow), "must be 0 or more");
  const drawn = OVERLOAD_FLOW_RATIO * ratedFlow + otherFlow;
  const p = supplyBefore(drawn, t);
  if (p === null) {
    fail(
      "rated_flow",
      q("flow", ratedFlow),
      "150 % of it plus other_flow is {0}, at or beyond {1}, where this supply reaches {2}",
      q("flow", drawn),
      q("flow", exhaustionFlow(t)),
      q("pressure", 0),
    );
  }
  return p;
}
