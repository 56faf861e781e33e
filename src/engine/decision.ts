/**
 * The decision: does the water supply meet the sprinkler demand, by how much, what must a pump add, and does the
 * pump the user chose add enough?
 * US units inside (gpm, psi); the sentence is written in the user's units.
 */
import { fail, outsideEnvelope, q } from "./errors";
import { DEFAULT_OVERLOAD_RATIO, DEFAULT_SHUTOFF_RATIO, OVERLOAD_FLOW_RATIO, type PumpRating, pumpPressure } from "./pump";
import { type FlowTest, checkFlowTest, exhaustionFlow, supplyBefore } from "./supply";
import { type UnitSystem, fromUS, unitName } from "./units";

/**
 * Share of static pressure a flow test should drop the residual by to be extrapolated, dimensionless.
 *
 * Below it, a curve read beyond the test flow is uncertain (the verdict's caveat).
 * @see [NFPA 291] a test should drop the residual at least 25 % or flow the full demand (from memory)
 */
export const MIN_TEST_DROP_SHARE = 0.25;

/**
 * The verdict's state: "enough" (margin ≥ required), "marginal" (0 ≤ margin < required), "short" (margin < 0) or
 * "exhausted" (the supply reaches 0 psi before the demand flow).
 */
export type SupplyState = "enough" | "marginal" | "short" | "exhausted";

/** A flow test too weak to extrapolate to the demand flow: its drop, psi, and that drop's share of static. */
export interface FlowTestCaveat {
  /** static − residual, psi */
  drop: number;
  /** (static − residual) / static, a fraction under MIN_TEST_DROP_SHARE */
  dropShare: number;
}

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
  /** the verdict's state (VERDICT's three states, and the supply exhausted) */
  state: SupplyState;
  /** true when the margin is below the required margin, or the supply is exhausted: state is not "enough" */
  pumpNeeded: boolean;
  /** where the flow test dropped under 25 % of static and the demand flow is above the test flow; else null */
  caveat: FlowTestCaveat | null;
}

/**
 * The flow-test caveat: a test whose drop is under 25 % of static, extrapolated beyond its flow.
 *
 *   caveat where (Ps − Pr) / Ps < 0.25 and Q > Qt
 *
 * Static 72, residual 58 psi at 1100 gpm: the drop is 14 psi, 14 / 72 = 0.194444 of static, under 0.25; a demand of
 * 1200 gpm lies beyond the test flow, so the caveat holds; at 1100 gpm or less it does not.
 *
 * @param demandFlow Q, the demand flow, gpm
 * @param t the flow test: static Ps and residual Pr, psi; test flow Qt, gpm (checked by the caller)
 * @returns the drop, psi, and its share of static, a fraction; null where the test is fit to read at that flow
 * @see [NFPA 291] a test should drop the residual at least 25 % or flow the full demand (from memory)
 * @example
 * flowTestCaveat(1200, { static: 72, residual: 58, testFlow: 1100 }) // ≈ { drop: 14, dropShare: 0.194444 }
 * flowTestCaveat(1100, { static: 72, residual: 58, testFlow: 1100 }) // → null
 */
export function flowTestCaveat(demandFlow: number, t: FlowTest): FlowTestCaveat | null {
  const drop = t.static - t.residual;
  const dropShare = drop / t.static;
  return dropShare < MIN_TEST_DROP_SHARE && demandFlow > t.testFlow ? { drop, dropShare } : null;
}

/**
 * Compare a demand point with the supply curve.
 *
 *   supply = Ps − (Ps − Pr) (Q / Qt)^1.85,   margin = supply − demand pressure
 *   state: enough where margin ≥ required; marginal where 0 ≤ margin < required; short where margin < 0;
 *   exhausted where the supply reaches 0 psi at or before Q
 *
 * The required margin is a visible input (common practice: often 10 psi or 10 %). 562 gpm at 48 psi against static
 * 72, residual 58 psi at 1100 gpm: supply = 72 − 14 × (562 / 1100)^1.85 = 72 − 14 × 0.28868 = 68.0 psi; margin
 * = 68.0 − 48 = 20.0 psi; the supply reaches 0 at 1100 × (72 / 14)^(1/1.85) = 1100 × 2.42345 = 2665.8 gpm. The
 * caveat is flowTestCaveat's.
 *
 * @param demandFlow the demand flow, gpm (> 0)
 * @param demandPressure the demand pressure, psi (≥ 0)
 * @param t the flow test: static and residual pressure, psi; test flow, gpm
 * @param requiredMargin the margin required, psi (≥ 0)
 * @returns the assessment: flows in gpm, pressures and margins in psi (null where the supply is exhausted), the
 *   state, and the caveat (drop in psi, its share of static a fraction) or null
 * @see [NFPA 291] water supply curve and the 25 % drop (from memory); the required margin (common practice)
 * @example
 * assess(562, 48, { static: 72, residual: 58, testFlow: 1100 }, 10)
 * // .supplyPressure ≈ 68.0 psi
 * // .margin ≈ 20.0 psi
 * // .exhaustedAt ≈ 2665.8 gpm
 * // .state → "enough"
 * // .pumpNeeded → false
 * // .caveat → null
 * assess(562, 62, { static: 72, residual: 58, testFlow: 1100 }, 10) // .state → "marginal"
 * assess(3000, 48, { static: 72, residual: 58, testFlow: 1100 }, 10)
 * // ≈ { supplyPressure: null, margin: null, state: "exhausted", pumpNeeded: true, caveat: { drop: 14, dropShare: 0.194444 } }
 */
export function assess(demandFlow: number, demandPressure: number, t: FlowTest, requiredMargin: number): Assessment {
  checkFlowTest(t);
  if (!(demandFlow > 0)) fail("demand_flow", q("flow", demandFlow), "must be greater than 0");
  if (!(demandPressure >= 0)) fail("demand_pressure", q("pressure", demandPressure), "must be 0 or more");
  if (!(requiredMargin >= 0)) fail("required_margin", q("pressure", requiredMargin), "must be 0 or more");
  const exhaustedAt = exhaustionFlow(t);
  const caveat = flowTestCaveat(demandFlow, t);
  const supplyPressure = supplyBefore(demandFlow, t);
  if (supplyPressure === null) {
    return {
      demandFlow, demandPressure, requiredMargin, exhaustedAt, supplyPressure: null, margin: null,
      state: "exhausted", pumpNeeded: true, caveat,
    };
  }
  const margin = supplyPressure - demandPressure;
  const state: SupplyState = margin < 0 ? "short" : margin < requiredMargin ? "marginal" : "enough";
  return {
    demandFlow, demandPressure, requiredMargin, exhaustedAt, supplyPressure, margin,
    state, pumpNeeded: state !== "enough", caveat,
  };
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
 * The verdict's state as one sentence for a project manager, in the user's units.
 *
 * One of VERDICT's three states, or a supply that runs out before the demand flow:
 *
 *   enough:    "No pump needed: 12.4 psi to spare at 562 gpm (10.0 psi margin required)."
 *              "No pump needed: 0.3 psi to spare at 562 gpm (no margin required)."
 *   marginal:  "Marginal: 6.3 psi to spare at 562 gpm, less than the 10.0 psi margin required."
 *   short:     "Pump needed: the supply is 10.7 psi short at 562 gpm."
 *   exhausted: "A pump alone cannot serve: the supply reaches 0 psi at 2666 gpm, below the demand flow of 3000 gpm;
 *              a suction tank or a stronger main is needed."
 *
 * The flow-test caveat is a sentence of its own (caveatSentence); verdictSentence joins the two as VERDICT writes
 * them. A pane that shows the caveat on a line of its own shows this sentence above it.
 *
 * @param a the assessment (assess), US units
 * @param units the unit system of the sentence, "US" or "SI"
 * @returns the sentence
 * @example
 * stateSentence(assess(562, 48, { static: 72, residual: 58, testFlow: 1100 }, 10), "US")
 * // → "No pump needed: 20.0 psi to spare at 562 gpm (10.0 psi margin required)."
 * stateSentence(assess(562, 48, { static: 72, residual: 58, testFlow: 1100 }, 0), "US")
 * // → "No pump needed: 20.0 psi to spare at 562 gpm (no margin required)."
 * stateSentence(assess(562, 60, { static: 72, residual: 58, testFlow: 1100 }, 10), "US")
 * // → "Marginal: 8.0 psi to spare at 562 gpm, less than the 10.0 psi margin required."
 * stateSentence(assess(562, 80, { static: 72, residual: 58, testFlow: 1100 }, 10), "SI")
 * // → "Pump needed: the supply is 0.83 bar short at 2127 L/min."
 * stateSentence(assess(3000, 60, { static: 72, residual: 58, testFlow: 1100 }, 10), "US")
 * // → "A pump alone cannot serve: the supply reaches 0 psi at 2666 gpm, below the demand flow of 3000 gpm; a suction tank or a stronger main is needed."
 */
export function stateSentence(a: Assessment, units: UnitSystem): string {
  const at = formatFlow(a.demandFlow, units);
  if (a.state === "exhausted" || a.margin === null) {
    const zero = `0 ${unitName("pressure", units)}`;
    return (
      `A pump alone cannot serve: the supply reaches ${zero} at ${formatFlow(a.exhaustedAt, units)}, below the demand flow ` +
      `of ${at}; a suction tank or a stronger main is needed.`
    );
  }
  const m = formatPressure(a.margin, units);
  const required = formatPressure(a.requiredMargin, units);
  if (a.state === "short") return `Pump needed: the supply is ${m} short at ${at}.`;
  if (a.state === "marginal") return `Marginal: ${m} to spare at ${at}, less than the ${required} margin required.`;
  const met = a.requiredMargin > 0 ? `${required} margin required` : "no margin required";
  return `No pump needed: ${m} to spare at ${at} (${met}).`;
}

/**
 * The flow-test caveat as a sentence, or null where there is none (see flowTestCaveat).
 *
 *   "The flow test dropped only 2.0 psi (3 % of static), so the supply beyond its flow is uncertain."
 *
 * The share is said in whole percent; a share that rounds to 25 % is said as "less than 25 %", one that rounds to 0
 * as "less than 1 %". Static 72, residual 58 psi at 1100 gpm, demand 1200 gpm: 14.0 psi, 14 / 72 = 19.4 % → 19 %.
 *
 * @param a the assessment (assess), US units
 * @param units the unit system of the sentence, "US" or "SI"
 * @returns the sentence, or null
 * @see [NFPA 291] a test should drop the residual at least 25 % or flow the full demand (from memory)
 * @example
 * caveatSentence(assess(1200, 30, { static: 72, residual: 58, testFlow: 1100 }, 0), "US")
 * // → "The flow test dropped only 14.0 psi (19 % of static), so the supply beyond its flow is uncertain."
 * caveatSentence(assess(562, 30, { static: 72, residual: 58, testFlow: 1100 }, 0), "US") // → null
 */
export function caveatSentence(a: Assessment, units: UnitSystem): string | null {
  if (a.caveat === null) return null;
  const percent = Math.round(a.caveat.dropShare * 100);
  const limit = Math.round(MIN_TEST_DROP_SHARE * 100);
  const share = percent < 1 ? "less than 1 %" : percent >= limit ? `less than ${limit} %` : `${percent} %`;
  return `The flow test dropped only ${formatPressure(a.caveat.drop, units)} (${share} of static), so the supply beyond its flow is uncertain.`;
}

/**
 * What VERDICT writes: the state's sentence, then the flow-test caveat where there is one.
 *
 *   verdict = stateSentence + " " + caveatSentence (where the caveat holds)
 *
 * Static 72, residual 58 psi at 1100 gpm; 1200 gpm at 30 psi: supply 72 − 14 × (1200 / 1100)^1.85 = 72 − 14 ×
 * 1.174651 = 55.6 psi, 25.6 psi to spare; the test's 14 psi drop is 19 % of static and 1200 gpm is beyond its flow.
 *
 * @param a the assessment (assess), US units
 * @param units the unit system of the text, "US" or "SI"
 * @returns one or two sentences
 * @example
 * verdictSentence(assess(1200, 30, { static: 72, residual: 58, testFlow: 1100 }, 0), "US")
 * // → "No pump needed: 25.6 psi to spare at 1200 gpm (no margin required). The flow test dropped only 14.0 psi (19 % of static), so the supply beyond its flow is uncertain."
 */
export function verdictSentence(a: Assessment, units: UnitSystem): string {
  const caveat = caveatSentence(a, units);
  return caveat === null ? stateSentence(a, units) : `${stateSentence(a, units)} ${caveat}`;
}

/** What the supply and the pump the user chose give at the demand flow, psi. */
export interface ChosenPumpCheck {
  /** supply pressure at the total flow (the main while everything flows), psi */
  supplyPressure: number;
  /** the pump's net pressure at the flow through it, psi */
  pumpPressure: number;
  /** supplyPressure + pumpPressure, psi */
  delivered: number;
  /** demand pressure + required margin, psi */
  required: number;
  /** delivered − required, psi (below 0: the pump falls short by that much) */
  surplus: number;
  /** surplus ≥ 0 */
  meets: boolean;
}

/**
 * Does the supply plus the pump the user chose meet the demand plus the required margin?
 *
 *   delivered = P_supply(Q_total) + P_pump(Q_pump),   surplus = delivered − (demand pressure + required margin)
 *
 * The supply is read at the total flow (the main delivers everything, outside hose included); the pump adds its net
 * pressure at the flow that passes through it (sprinklers and inside hose, plus outside hose only where hydrants are
 * downstream of the pump), on the monotone curve of pumpPressure. Where the flow through the pump is beyond 150 % of
 * its rating the error (kind "number") names the rating it would need; where the supply reaches 0 psi at or before
 * the total flow the error (kind "value") names that flow: the check throws, as PUMPCURVE and SUPPLYAT do in a cell,
 * and a caller shows the message (HeadroomError.messageIn) in its units. Static 72, residual 58 psi at 1100 gpm; 750
 * gpm in all, 600 gpm through a pump rated 500 gpm at 25 psi (shutoff 1.2, 150 % point 0.7); 80 psi demand, 10 psi
 * margin: supply 72 − 14 × (750 / 1100)^1.85 = 72 − 14 × 0.492352 = 65.107 psi; pump 25 × (1.2 − 0.2 × 1.2^2.259851)
 * = 25 × (1.2 − 0.2 × 1.509864) = 22.451 psi; delivered 87.558 psi; surplus 87.558 − 90 = −2.442 psi.
 *
 * @param totalFlow the demand flow at the supply connection, all of it, gpm (> 0)
 * @param pumpFlow the flow through the pump, gpm (0 to totalFlow, at most 150 % of the rated flow)
 * @param demandPressure the demand pressure, psi (≥ 0)
 * @param requiredMargin the margin required, psi (≥ 0)
 * @param t the flow test: static and residual pressure, psi; test flow, gpm
 * @param rating the pump chosen: rated flow, gpm; rated net pressure, psi
 * @param shutoffRatio shutoff pressure over rated pressure, dimensionless (1 < s ≤ 1.4)
 * @param overloadRatio pressure at 150 % flow over rated pressure, dimensionless (0.65 ≤ o < 1)
 * @returns the supply, pump and delivered pressures, the pressure required and the surplus, psi; whether it meets
 * @see [NFPA 291] water supply curve; [NFPA 20] the pump's envelope and the flow it is sized for (from memory); the
 *   curve's shape and the required margin (common practice)
 * @example
 * chosenPumpCheck(750, 600, 80, 10, { static: 72, residual: 58, testFlow: 1100 }, { ratedFlow: 500, ratedPressure: 25 })
 * // ≈ { supplyPressure: 65.107, pumpPressure: 22.451, delivered: 87.558, required: 90, surplus: -2.442, meets: false }
 * chosenPumpCheck(750, 600, 70, 10, { static: 72, residual: 58, testFlow: 1100 }, { ratedFlow: 500, ratedPressure: 25 })
 * // ≈ { surplus: 7.558, meets: true }
 * chosenPumpCheck(900, 800, 60, 10, { static: 72, residual: 58, testFlow: 1100 }, { ratedFlow: 500, ratedPressure: 25 })
 * // throws "rated_flow: got 500 gpm; the flow through the pump, 800 gpm, is beyond 150 % of it: choose at least 533.333 gpm"
 */
export function chosenPumpCheck(
  totalFlow: number,
  pumpFlow: number,
  demandPressure: number,
  requiredMargin: number,
  t: FlowTest,
  rating: PumpRating,
  shutoffRatio: number = DEFAULT_SHUTOFF_RATIO,
  overloadRatio: number = DEFAULT_OVERLOAD_RATIO,
): ChosenPumpCheck {
  checkFlowTest(t);
  if (!(totalFlow > 0) || !Number.isFinite(totalFlow)) fail("demand_flow", q("flow", totalFlow), "must be greater than 0");
  if (!(pumpFlow >= 0)) fail("pump_flow", q("flow", pumpFlow), "must be 0 or more");
  if (!(pumpFlow <= totalFlow)) fail("pump_flow", q("flow", pumpFlow), "must be at most the demand flow {0}", q("flow", totalFlow));
  if (!(demandPressure >= 0) || !Number.isFinite(demandPressure)) fail("demand_pressure", q("pressure", demandPressure), "must be 0 or more");
  if (!(requiredMargin >= 0) || !Number.isFinite(requiredMargin)) fail("required_margin", q("pressure", requiredMargin), "must be 0 or more");
  const { ratedFlow, ratedPressure } = rating;
  if (ratedFlow > 0 && Number.isFinite(ratedFlow) && pumpFlow > OVERLOAD_FLOW_RATIO * ratedFlow * (1 + 1e-9)) {
    outsideEnvelope(
      "rated_flow",
      q("flow", ratedFlow),
      "the flow through the pump, {0}, is beyond 150 % of it: choose at least {1}",
      q("flow", pumpFlow),
      q("flow", pumpFlow / OVERLOAD_FLOW_RATIO),
    );
  }
  const pump = pumpPressure(pumpFlow, ratedFlow, ratedPressure, shutoffRatio, overloadRatio); // checks the rating
  const supply = supplyBefore(totalFlow, t);
  if (supply === null) {
    fail(
      "demand_flow",
      q("flow", totalFlow),
      "this supply reaches {0} at {1}; a pump cannot draw more than the main delivers",
      q("pressure", 0),
      q("flow", exhaustionFlow(t)),
    );
  }
  const delivered = supply + pump;
  const required = demandPressure + requiredMargin;
  const surplus = delivered - required;
  return { supplyPressure: supply, pumpPressure: pump, delivered, required, surplus, meets: surplus >= 0 };
}
