/**
 * The decision: does the water supply meet the sprinkler demand, by how much, and what must a pump add?
 * US units inside (gpm, psi); the sentence is written in the user's units.
 */
import { fail, q } from "./errors";
import { type FlowTest, checkFlowTest, exhaustionFlow, supplyCurve } from "./supply";
import { type UnitSystem, fromUS, unitName } from "./units";

/** The comparison of one demand point with the supply curve. */
export interface Assessment {
  demandFlow: number;
  demandPressure: number;
  requiredMargin: number;
  /** flow at which the supply curve reaches 0 psi */
  exhaustedAt: number;
  /** supply pressure at the demand flow; null where the supply is exhausted before the demand flow */
  supplyPressure: number | null;
  /** supplyPressure − demandPressure; null where the supply is exhausted */
  margin: number | null;
  /** true when the margin is below the required margin, or the supply is exhausted */
  pumpNeeded: boolean;
}

/**
 * Compare a demand point with the supply curve.
 *
 *   supply = Ps − (Ps − Pr) (Q / Qt)^1.85,   margin = supply − demand pressure,   pump needed: margin < required
 *
 * The required margin is a visible input (common practice: often 10 psi or 10 %). 562 gpm at 48 psi against static
 * 72, residual 58 psi at 1100 gpm: supply = 72 − 14 × (562 / 1100)^1.85 = 72 − 14 × 0.28868 = 68.0 psi; margin
 * = 68.0 − 48 = 20.0 psi; the supply reaches 0 at 1100 × (72 / 14)^(1/1.85) = 1100 × 2.42345 = 2665.8 gpm.
 *
 * @param demandFlow the demand flow, gpm (> 0)
 * @param demandPressure the demand pressure, psi (≥ 0)
 * @param t the flow test: static and residual pressure, psi; test flow, gpm
 * @param requiredMargin the margin required, psi (≥ 0)
 * @returns the assessment: flows in gpm, pressures and margins in psi (null where the supply is exhausted)
 * @see [NFPA 291] water supply curve; the required margin (common practice)
 * @example
 * assess(562, 48, { static: 72, residual: 58, testFlow: 1100 }, 10)
 * // .supplyPressure ≈ 68.0 psi
 * // .margin ≈ 20.0 psi
 * // .exhaustedAt ≈ 2665.8 gpm
 * // .pumpNeeded → false
 * assess(3000, 48, { static: 72, residual: 58, testFlow: 1100 }, 10)
 * // ≈ { supplyPressure: null, margin: null, pumpNeeded: true }
 */
export function assess(demandFlow: number, demandPressure: number, t: FlowTest, requiredMargin: number): Assessment {
  checkFlowTest(t);
  if (!(demandFlow > 0)) fail("demand_flow", q("flow", demandFlow), "must be greater than 0");
  if (!(demandPressure >= 0)) fail("demand_pressure", q("pressure", demandPressure), "must be 0 or more");
  if (!(requiredMargin >= 0)) fail("required_margin", q("pressure", requiredMargin), "must be 0 or more");
  const exhaustedAt = exhaustionFlow(t);
  const supplyPressure = supplyCurve(demandFlow, t);
  // a pressure that rounds to 0 short of the exhaustion flow (a static of a few denormals) is exhausted too
  if (!(demandFlow < exhaustedAt && supplyPressure > 0)) {
    return { demandFlow, demandPressure, requiredMargin, exhaustedAt, supplyPressure: null, margin: null, pumpNeeded: true };
  }
  const margin = supplyPressure - demandPressure;
  return { demandFlow, demandPressure, requiredMargin, exhaustedAt, supplyPressure, margin, pumpNeeded: margin < requiredMargin };
}

/** The sentence of an exhausted supply, for VERDICT (flows rounded to whole units). */
function exhaustedMessage(a: Assessment, units: UnitSystem): string {
  return `the supply reaches 0 at ${formatFlow(a.exhaustedAt, units)}, below the demand flow of ${formatFlow(a.demandFlow, units)}`;
}

/** The problem of a demand flow beyond the flow where the supply reaches 0, with what it prevents. */
function exhausted(a: Assessment, consequence: string): never {
  fail("demand_flow", q("flow", a.demandFlow), `this supply reaches {0} at {1}; ${consequence}`, q("pressure", 0), q("flow", a.exhaustedAt));
}

/**
 * Supply pressure at the demand flow minus the demand pressure (negative: the supply falls short).
 *
 *   margin = Ps − (Ps − Pr) (Q / Qt)^1.85 − demand pressure
 *
 * An error where the supply is exhausted before the demand flow: no pressure remains to compare. 562 gpm at 48 psi
 * against static 72, residual 58 psi at 1100 gpm: 68.0 − 48 = 20.0 psi (worked in assess).
 *
 * @param demandFlow the demand flow, gpm (> 0)
 * @param demandPressure the demand pressure, psi (≥ 0)
 * @param t the flow test: static and residual pressure, psi; test flow, gpm
 * @returns the margin, psi (negative where the supply falls short)
 * @see [NFPA 291] water supply curve
 * @example
 * margin(562, 48, { static: 72, residual: 58, testFlow: 1100 }) // ≈ 20.0 psi
 * margin(3000, 48, { static: 72, residual: 58, testFlow: 1100 })
 * // throws "demand_flow: got 3000 gpm; this supply reaches 0 psi at 2665.8 gpm; no margin exists"
 */
export function margin(demandFlow: number, demandPressure: number, t: FlowTest): number {
  const a = assess(demandFlow, demandPressure, t, 0);
  if (a.margin === null) exhausted(a, "no margin exists");
  return a.margin;
}

/**
 * Pressure a pump must add at the demand flow to give the demand pressure plus the required margin.
 *
 *   boost = max(0, demand pressure + required margin − supply pressure)
 *
 * 0 where none is needed. An error where the supply is exhausted before the demand flow: a pump cannot draw flow the
 * main cannot deliver. 562 gpm at 80 psi, required margin 10 psi, against supply 68.0 psi (static 72, residual 58
 * psi at 1100 gpm, worked in assess): 80 + 10 − 68.0 = 22.0 psi.
 *
 * @param demandFlow the demand flow, gpm (> 0)
 * @param demandPressure the demand pressure, psi (≥ 0)
 * @param t the flow test: static and residual pressure, psi; test flow, gpm
 * @param requiredMargin the margin required, psi (≥ 0)
 * @returns the boost, psi (≥ 0)
 * @see [NFPA 291] water supply curve; the required margin (common practice)
 * @example
 * pumpBoost(562, 80, { static: 72, residual: 58, testFlow: 1100 }, 10) // ≈ 22.0 psi
 * pumpBoost(562, 40, { static: 72, residual: 58, testFlow: 1100 }, 10) // → 0 psi
 */
export function pumpBoost(demandFlow: number, demandPressure: number, t: FlowTest, requiredMargin: number): number {
  const a = assess(demandFlow, demandPressure, t, requiredMargin);
  if (a.supplyPressure === null) exhausted(a, "a pump cannot draw more than the main delivers");
  return Math.max(0, demandPressure + requiredMargin - a.supplyPressure);
}

/**
 * A pressure for a sentence: psi to 0.1, bar to 0.01; values that round to zero are said as "less than".
 *
 * @param psi the pressure, psi (its sign is dropped: the sentence says "short" or "to spare")
 * @param units the unit system of the sentence, "US" or "SI"
 * @returns the pressure with its unit, in `units`
 * @example
 * formatPressure(12.44, "US") // → "12.4 psi"
 * formatPressure(0.01, "SI") // → "less than 0.01 bar"
 */
export function formatPressure(psi: number, units: UnitSystem): string {
  const v = Math.abs(fromUS("pressure", psi, units));
  const digits = units === "SI" ? 2 : 1;
  const step = 10 ** -digits;
  const text = v > 0 && v < step / 2 ? `less than ${step.toFixed(digits)}` : v.toFixed(digits);
  return `${text} ${unitName("pressure", units)}`;
}

/**
 * A flow for a sentence: whole gpm or L/min.
 *
 * @param gpm the flow, gpm
 * @param units the unit system of the sentence, "US" or "SI"
 * @returns the flow with its unit, in `units`
 * @example
 * formatFlow(500, "SI") // → "1893 L/min" (500 × 3.785411784 = 1892.7)
 */
export function formatFlow(gpm: number, units: UnitSystem): string {
  return `${Math.round(fromUS("flow", gpm, units))} ${unitName("flow", units)}`;
}

/**
 * One plain sentence for a project manager, in the user's units.
 *
 *   "No pump needed: 12.4 psi to spare at 562 gpm."
 *   "Pump needed: the supply is 10.7 psi short at 562 gpm."
 *   "Pump needed: 6.2 psi to spare at 562 gpm, less than the 10.0 psi margin required."
 *   "Pump needed: the supply reaches 0 at 950 gpm, below the demand flow of 1200 gpm."
 *
 * With a required margin, a passing sentence says which margin it met.
 *
 * @param a the assessment (assess), US units
 * @param units the unit system of the sentence, "US" or "SI"
 * @returns the sentence
 * @example
 * verdictSentence(assess(562, 48, { static: 72, residual: 58, testFlow: 1100 }, 10), "US")
 * // → "No pump needed: 20.0 psi to spare at 562 gpm (10.0 psi margin required)."
 * verdictSentence(assess(562, 60, { static: 72, residual: 58, testFlow: 1100 }, 10), "US")
 * // → "Pump needed: 8.0 psi to spare at 562 gpm, less than the 10.0 psi margin required."
 * verdictSentence(assess(562, 80, { static: 72, residual: 58, testFlow: 1100 }, 10), "SI")
 * // → "Pump needed: the supply is 0.83 bar short at 2127 L/min."
 * verdictSentence(assess(3000, 60, { static: 72, residual: 58, testFlow: 1100 }, 10), "US")
 * // → "Pump needed: the supply reaches 0 at 2666 gpm, below the demand flow of 3000 gpm."
 */
export function verdictSentence(a: Assessment, units: UnitSystem): string {
  const at = formatFlow(a.demandFlow, units);
  if (a.margin === null) return `Pump needed: ${exhaustedMessage(a, units)}.`;
  const m = formatPressure(a.margin, units);
  const required = formatPressure(a.requiredMargin, units);
  if (a.margin < 0) return `Pump needed: the supply is ${m} short at ${at}.`;
  if (a.pumpNeeded) return `Pump needed: ${m} to spare at ${at}, less than the ${required} margin required.`;
  const met = a.requiredMargin > 0 ? ` (${required} margin required)` : "";
  return `No pump needed: ${m} to spare at ${at}${met}.`;
}
