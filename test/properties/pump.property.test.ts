/**
 * Properties of the pump curve over the whole centrifugal fire pump envelope [NFPA 20]: shutoff ratio s with
 * 1 < s ≤ 1.4, 150 % point ratio o with 0.65 ≤ o < 1, flow from 0 to 150 % of rated flow.
 */
import { describe, expect } from "vitest";
import { fc, test } from "@fast-check/vitest";
import { pumpPressure } from "../../src/engine/pump";

const RUNS = { numRuns: 500 };
const d = (min: number, max: number, more: { minExcluded?: boolean; maxExcluded?: boolean } = {}) =>
  fc.double({ min, max, noNaN: true, noDefaultInfinity: true, ...more });

/** A pump inside the [NFPA 20] envelope: rated flow (gpm), rated pressure (psi), s and o. */
const pump = fc.record({
  qr: d(25, 5000),
  pr: d(5, 300),
  s: d(1, 1.4, { minExcluded: true }),
  o: d(0.65, 1, { maxExcluded: true }),
});
/** A fraction of rated flow on the curve, 0 to 1.5. */
const frac = d(0, 1.5);

describe("pump curve over the whole [NFPA 20] envelope", () => {
  test.prop([pump, frac, frac], RUNS)("is non-increasing in flow", ({ qr, pr, s, o }, a, b) => {
    const [lo, hi] = a <= b ? [a, b] : [b, a];
    expect(pumpPressure(hi * qr, qr, pr, s, o)).toBeLessThanOrEqual(pumpPressure(lo * qr, qr, pr, s, o));
  });
  test.prop([pump, frac], RUNS)("is never above its shutoff pressure", ({ qr, pr, s, o }, x) => {
    const shutoff = pumpPressure(0, qr, pr, s, o);
    expect(shutoff).toBeCloseTo(s * pr, 9);
    expect(pumpPressure(x * qr, qr, pr, s, o)).toBeLessThanOrEqual(shutoff);
  });
  test.prop([pump], RUNS)("falls step by step along a sweep of 151 flows from 0 to 150 % of rated", ({ qr, pr, s, o }) => {
    let previous = pumpPressure(0, qr, pr, s, o);
    for (let i = 1; i <= 150; i++) {
      const p = pumpPressure((i / 100) * qr, qr, pr, s, o);
      expect(p, `at ${i} % of rated flow`).toBeLessThanOrEqual(previous);
      previous = p;
    }
  });
});
