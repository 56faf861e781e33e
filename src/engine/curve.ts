/**
 * Points of the water supply curve, ready for a chart. US units: gpm, psi.
 */
import { fail, n, q } from "./errors";
import { type FlowTest, checkFlowTest, exhaustionFlow, supplyCurve } from "./supply";

/** Rows of a supply curve by default: enough for a smooth native chart line. */
export const SUPPLY_CURVE_POINTS = 16;
/** The curve runs to this multiple of the test flow by default, dimensionless. */
export const SUPPLY_CURVE_FLOW_FACTOR = 1.5;
/**
 * How far past the demand flow a supply curve is drawn, as a multiple of it, dimensionless.
 *
 * The demand point sits inside the picture with room to read the curve beyond it: the sheet's chart and the pane's
 * plot alike.
 * @see (common practice)
 */
export const CURVE_DEMAND_FLOW_FACTOR = 1.2;
/**
 * The most rows a curve may have (a plausibility bound on `points`).
 * @see (common practice)
 */
export const SUPPLY_CURVE_MAX_POINTS = 1000;

/** One point of the curve: [flow gpm, pressure psi]. */
export type CurvePoint = readonly [flow: number, pressure: number];

/**
 * Evenly spaced flows from 0 to `end`, with given flows added in order: the one sampler of the supply curve.
 *
 * `count` + 1 flows, plus the `extra` flows that lie strictly inside, ascending and without repeats, for the sheet
 * (SUPPLYCURVE) and the pane's plot alike.
 *
 *   Q_i = end × i / count,   i = 0 … count
 *
 * 1500 gpm in 3 steps: 0, 500, 1000, 1500; an extra 1000 is already there, an extra 750 joins in order.
 *
 * @param end the largest flow, gpm (≥ 0)
 * @param count the number of steps, a whole number ≥ 1
 * @param extra flows to include where they lie inside, gpm
 * @returns the flows, gpm, ascending
 * @see definition
 * @example
 * sampleFlows(1500, 3, [1000]) // → [0, 500, 1000, 1500]
 * sampleFlows(1500, 3, [750]) // → [0, 500, 750, 1000, 1500]
 */
export function sampleFlows(end: number, count: number, extra: readonly number[] = []): number[] {
  const flows: number[] = [];
  for (let i = 0; i <= count; i++) flows.push((end * i) / count);
  for (const x of extra) if (x > 0 && x < end && !flows.includes(x)) flows.push(x);
  return extra.length === 0 ? flows : flows.sort((a, b) => a - b);
}

/**
 * `points` evenly spaced points of the supply curve from 0 to `maxFlow`.
 *
 *   Q_i = maxFlow × i / (points − 1),   P_i = Ps − (Ps − Pr) (Q_i / Qt)^1.85,   i = 0 … points − 1
 *
 * If the supply reaches 0 psi before maxFlow (at Qe = Qt (Ps / (Ps − Pr))^(1/1.85)), the first point at or beyond
 * Qe and every later point are [Qe, 0]: every row is a number a chart can plot (a chart reads a blank or text row
 * as a zero, and an XY chart reads text flows as counting numbers), the line ends at the exhaustion point, and the
 * number of rows never depends on the values, only on `points`. Static 70, residual 50 psi at 1000 gpm, 4 points to
 * 1500 gpm: 500 gpm → 70 − 20 × 0.5^1.85 = 70 − 20 × 0.27739 = 64.45 psi; 1500 gpm → 70 − 20 × 1.5^1.85 = 70 − 20 ×
 * 2.1171 = 27.66 psi. To 3000 gpm: 0 psi at 1000 × (70 / 20)^(1/1.85) = 1000 × 3.5^0.54054 = 1968 gpm, before 2000.
 *
 * @param t the flow test: static and residual pressure, psi; test flow, gpm
 * @param maxFlow the last point's flow, gpm (> 0)
 * @param points the number of rows, a whole number from 2 to SUPPLY_CURVE_MAX_POINTS
 * @returns `points` points [flow gpm, pressure psi]
 * @see [NFPA 291] water supply curve
 * @example
 * supplyCurvePoints({ static: 70, residual: 50, testFlow: 1000 }, 1500, 4)
 * // ≈ [[0, 70], [500, 64.45], [1000, 50], [1500, 27.66]] psi
 * supplyCurvePoints({ static: 70, residual: 50, testFlow: 1000 }, 3000, 4)
 * // ≈ [[0, 70], [1000, 50], [1968, 0], [1968, 0]] psi
 */
export function supplyCurvePoints(t: FlowTest, maxFlow: number, points: number): CurvePoint[] {
  checkFlowTest(t);
  if (!(maxFlow > 0) || !Number.isFinite(maxFlow)) fail("max_flow", q("flow", maxFlow), "must be greater than 0");
  if (!(Number.isInteger(points) && points >= 2 && points <= SUPPLY_CURVE_MAX_POINTS)) {
    fail("points", n(points), "must be a whole number from 2 to {0}", n(SUPPLY_CURVE_MAX_POINTS));
  }
  const qe = exhaustionFlow(t);
  const exhausted: CurvePoint = [qe, 0];
  return sampleFlows(maxFlow, points - 1).map((q): CurvePoint => {
    const p = supplyCurve(q, t);
    return q >= qe || !(p > 0) ? exhausted : [q, p];
  });
}
