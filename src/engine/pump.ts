/**
 * Fire pumps: picking a standard rating for a demand, and the pressure a pump gives along its curve.
 * US units: gpm, psi.
 */
import { fail, n, notInTable, outsideEnvelope, q } from "./errors";
import { ceilCount } from "./sprinkler";
import { type UnitSystem, fromUS } from "./units";

/**
 * Standard rated capacities of centrifugal fire pumps, gpm, ascending.
 * [NFPA 20] (from memory)
 */
export const STANDARD_RATED_CAPACITIES_GPM: readonly number[] = [
  25, 50, 100, 150, 200, 250, 300, 400, 450, 500, 750, 1000, 1250, 1500, 2000, 2500, 3000, 3500, 4000, 4500, 5000,
]; // [NFPA 20] (from memory)

/** PUMPSIZE rounds the boost up to a whole number of these steps in US work, psi (the vocabulary's rule). */
export const RATED_PRESSURE_STEP_PSI = 5;
/** PUMPSIZE rounds the boost up to a whole number of these steps in SI work, bar (the vocabulary's rule). */
export const RATED_PRESSURE_STEP_BAR = 0.5;

/** Flow of the overload point as a multiple of rated flow. [NFPA 20] */
export const OVERLOAD_FLOW_RATIO = 1.5;
/** Churn (shutoff) pressure may be at most this multiple of rated pressure. [NFPA 20] */
export const MAX_SHUTOFF_RATIO = 1.4;
/** At 150 % of rated flow the pump must give at least this multiple of rated pressure. [NFPA 20] */
export const MIN_OVERLOAD_RATIO = 0.65;
/** Default curve shape when only the rating is known: shutoff at 120 % of rated pressure. (common practice) */
export const DEFAULT_SHUTOFF_RATIO = 1.2;
/** Default curve shape: 70 % of rated pressure at 150 % of rated flow. (common practice) */
export const DEFAULT_OVERLOAD_RATIO = 0.7;

/**
 * The smallest standard rated capacity not below the demand flow.
 *
 * @param demandFlow gpm (> 0)
 * @returns gpm, one of STANDARD_RATED_CAPACITIES_GPM; `#N/A` kind above the largest (5000 gpm)
 * Source: [NFPA 20] standard rated capacities (from memory). Worked value: 562 gpm → 750 gpm; 500 gpm → 500 gpm.
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
 * Round a value up to a whole number of steps; an exact multiple stays as it is.
 *
 *   rounded = step × ceil(value / step)
 *
 * @param value ≥ 0; @param step > 0 (same unit)
 * Worked value: 22.0 psi in 5 psi steps → 25 psi; 25 psi → 25 psi; 1.52 bar in 0.5 bar steps → 2.0 bar.
 */
export function roundUpToStep(value: number, step: number): number {
  if (!(step > 0)) fail("step", n(step), "must be greater than 0");
  if (!(value >= 0) || !Number.isFinite(value)) fail("value", n(value), "must be 0 or more");
  return step * ceilCount(value / step);
}

/**
 * PUMPSIZE's rating: the smallest standard rated capacity not below the demand flow, and the boost rounded up to the
 * next 5 psi in US work or the next 0.5 bar in SI work (rounded in bar, so that SI ratings are whole steps of bar).
 *
 * @param demandFlowGpm gpm (> 0); @param boostPsi psi (> 0); @param units the unit system of the rated pressure
 * @returns ratedFlowGpm in gpm; ratedPressure in `units` (psi or bar)
 * Source: [NFPA 20] standard rated capacities (from memory); the steps are common practice.
 * Worked value: 475 gpm, 21.3 psi, US → 500 gpm at 25 psi.
 */
export function pumpRating(demandFlowGpm: number, boostPsi: number, units: UnitSystem): { ratedFlowGpm: number; ratedPressure: number } {
  const step = units === "SI" ? RATED_PRESSURE_STEP_BAR : RATED_PRESSURE_STEP_PSI;
  return { ratedFlowGpm: ratedCapacity(demandFlowGpm), ratedPressure: roundUpToStep(fromUS("pressure", boostPsi, units), step) };
}

/**
 * A pump's net pressure along a curve shaped as the parabola through three points: shutoff (0, s·Pr), rated
 * (Qr, Pr) and overload (1.5 Qr, o·Pr). With x = Q / Qr:
 *
 *   P / Pr = s + b x + c x²,   c = (o − 1.5 + 0.5 s) / 0.75,   b = 1 − s − c
 *
 * (from P/Pr = 1 at x = 1 and P/Pr = o at x = 1.5). For the defaults s = 1.2, o = 0.7: c = −0.26667, b = 0.06667, so
 * the curve rises a little (to 1.2042 Pr at x = 0.125) before it falls; that is the parabola through those points.
 *
 * Inputs are held to the centrifugal fire pump envelope: 1 < s ≤ 1.4 and 0.65 ≤ o < 1; flow from 0 to 1.5 Qr.
 * Outside that the error is of kind "number" (`#NUM!` in a cell).
 *
 * @param flow Q, gpm (≥ 0, at most 1.5 Qr)
 * @param ratedFlow Qr, gpm (> 0); @param ratedPressure Pr, psi (> 0)
 * @param shutoffRatio s; @param overloadRatio o
 * @returns psi
 * Source: envelope [NFPA 20]; the three-point shape with s = 1.2 and o = 0.7 (common practice).
 * Worked value: rated 500 gpm at 100 psi, defaults: 0 gpm → 120 psi, 250 gpm → 116.67 psi, 500 gpm → 100 psi,
 * 750 gpm → 70 psi.
 */
export function pumpPressure(flow: number, ratedFlow: number, ratedPressure: number, shutoffRatio: number, overloadRatio: number): number {
  if (!(ratedFlow > 0) || !Number.isFinite(ratedFlow)) fail("rated_flow", q("flow", ratedFlow), "must be greater than 0");
  if (!(ratedPressure > 0) || !Number.isFinite(ratedPressure)) fail("rated_pressure", q("pressure", ratedPressure), "must be greater than 0");
  if (!(flow >= 0) || !Number.isFinite(flow)) fail("flow", q("flow", flow), "must be 0 or more");
  const [a, b, c] = pumpCurveShape(shutoffRatio, overloadRatio);
  const x = flow / ratedFlow;
  if (x > OVERLOAD_FLOW_RATIO * (1 + 1e-9)) {
    outsideEnvelope("flow", n(Math.round(x * 1000) / 10, "% of rated flow"), "a fire pump curve runs from 0 to 150 % of rated flow");
  }
  return ratedPressure * (a + b * x + c * x * x);
}

/**
 * The coefficients [s, b, c] of P / Pr = s + b x + c x² (x = Q / Qr) through shutoff, rated and overload points,
 * after checking the ratios against the [NFPA 20] envelope. See pumpPressure.
 * Worked value: s 1.2, o 0.7 → [1.2, 0.066667, −0.266667].
 */
export function pumpCurveShape(shutoffRatio: number, overloadRatio: number): [number, number, number] {
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
  const x2 = OVERLOAD_FLOW_RATIO;
  // Through (0, s), (1, 1), (x2, o): s + b + c = 1 and s + b x2 + c x2² = o.
  const c = (overloadRatio - shutoffRatio - (1 - shutoffRatio) * x2) / (x2 * x2 - x2);
  const b = 1 - shutoffRatio - c;
  return [shutoffRatio, b, c];
}
