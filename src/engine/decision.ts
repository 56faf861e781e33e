/**
 * The decision: does the water supply meet the sprinkler demand, by how much, and what must a pump add?
 * US units inside (gpm, psi); the sentence is written in the user's units.
 */
import { fail, q } from "./errors";
import { type FlowTest, checkFlowTest, exhaustionFlow, supplyAt } from "./supply";
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
 * @param demandFlow gpm (> 0); @param demandPressure psi (≥ 0); @param requiredMargin psi (≥ 0)
 * Source: [NFPA 291] supply curve; the required margin is a visible input (common practice: often 10 psi or 10 %).
 * Worked value: 562 gpm at 48 psi against static 72, residual 58 at 1100 gpm → supply 68.0 psi, margin 20.0 psi.
 */
export function assess(demandFlow: number, demandPressure: number, t: FlowTest, requiredMargin: number): Assessment {
  checkFlowTest(t);
  if (!(demandFlow > 0)) fail("demand_flow", q("flow", demandFlow), "must be greater than 0");
  if (!(demandPressure >= 0)) fail("demand_pressure", q("pressure", demandPressure), "must be 0 or more");
  if (!(requiredMargin >= 0)) fail("required_margin", q("pressure", requiredMargin), "must be 0 or more");
  const exhaustedAt = exhaustionFlow(t);
  if (demandFlow >= exhaustedAt) {
    return { demandFlow, demandPressure, requiredMargin, exhaustedAt, supplyPressure: null, margin: null, pumpNeeded: true };
  }
  const supplyPressure = supplyAt(demandFlow, t);
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
 * An error where the supply is exhausted before the demand flow: no pressure remains to compare.
 * Source: [NFPA 291]. Worked value: see assess → 20.0 psi.
 */
export function margin(demandFlow: number, demandPressure: number, t: FlowTest): number {
  const a = assess(demandFlow, demandPressure, t, 0);
  if (a.margin === null) exhausted(a, "no margin exists");
  return a.margin;
}

/**
 * Pressure a pump must add at the demand flow to give the demand pressure plus the required margin; 0 where none
 * is needed:  boost = max(0, demandPressure + requiredMargin − supplyPressure).
 * An error where the supply is exhausted before the demand flow: a pump cannot draw flow the main cannot deliver.
 * Worked value: 562 gpm at 80 psi, required margin 10, against supply 68.0 psi → 22.0 psi.
 */
export function pumpBoost(demandFlow: number, demandPressure: number, t: FlowTest, requiredMargin: number): number {
  const a = assess(demandFlow, demandPressure, t, requiredMargin);
  if (a.supplyPressure === null) exhausted(a, "a pump cannot draw more than the main delivers");
  return Math.max(0, demandPressure + requiredMargin - a.supplyPressure);
}

/** A pressure for a sentence: psi to 0.1, bar to 0.01; values that round to zero are said as "less than". */
export function formatPressure(psi: number, units: UnitSystem): string {
  const v = Math.abs(fromUS("pressure", psi, units));
  const digits = units === "SI" ? 2 : 1;
  const step = 10 ** -digits;
  const text = v > 0 && v < step / 2 ? `less than ${step.toFixed(digits)}` : v.toFixed(digits);
  return `${text} ${unitName("pressure", units)}`;
}

/** A flow for a sentence: whole gpm or L/min. */
export function formatFlow(gpm: number, units: UnitSystem): string {
  return `${Math.round(fromUS("flow", gpm, units))} ${unitName("flow", units)}`;
}

/**
 * One plain sentence for a project manager:
 *   "No pump needed: 12.4 psi to spare at 562 gpm."
 *   "Pump needed: the supply is 10.7 psi short at 562 gpm."
 *   "Pump needed: 6.2 psi to spare at 562 gpm, less than the 10.0 psi margin required."
 *   "Pump needed: the supply reaches 0 at 950 gpm, below the demand flow of 1200 gpm."
 * With a required margin, a passing sentence says which margin it met.
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
