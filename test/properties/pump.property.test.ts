/**
 * Properties of the pump curve over the whole centrifugal fire pump envelope [NFPA 20]: shutoff ratio s with
 * 1 < s ≤ 1.4, 150 % point ratio o with 0.65 ≤ o < 1, flow from 0 to 150 % of rated flow; in the engine and through
 * the cell function PUMPCURVE, in US and SI units.
 */
import { describe, expect } from "vitest";
import { fc, test } from "@fast-check/vitest";
import { pumpPressure } from "../../src/engine/pump";
import { pumpcurve } from "../../src/functions/functions";
import { BAR_PER_PSI, L_PER_GAL } from "../../src/engine/units";

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

describe("PUMPCURVE, the cell function, over the whole [NFPA 20] envelope", () => {
  /** A sweep of 61 flows from 0 to 150 % of rated, through the cell, in `units` (SI: L/min and bar in and out). */
  function sweep(qr: number, pr: number, s: number | null, o: number | null, units: "US" | "SI"): number[] {
    const [fq, fp] = units === "SI" ? [L_PER_GAL, BAR_PER_PSI] : [1, 1];
    return Array.from({ length: 61 }, (_, i) => pumpcurve((i / 40) * qr * fq, qr * fq, pr * fp, s, o, units) as number);
  }
  const ratios = fc.oneof(
    fc.record({ s: d(1, 1.4, { minExcluded: true }), o: d(0.65, 1, { maxExcluded: true }) }),
    fc.constant({ s: null, o: null }), // the defaults, 1.2 and 0.7 (common practice)
  );
  const rating = fc.record({ qr: d(25, 5000), pr: d(5, 300) });
  test.prop([rating, ratios, fc.constantFrom<"US" | "SI">("US", "SI")], RUNS)(
    "falls monotonically from 0 to 150 % of rated flow and is never above its shutoff pressure",
    ({ qr, pr }, { s, o }, units) => {
      const p = sweep(qr, pr, s, o, units);
      const shutoff = (s ?? 1.2) * pr * (units === "SI" ? BAR_PER_PSI : 1);
      expect(p[0]).toBeCloseTo(shutoff, 9);
      p.forEach((x, i) => {
        expect(Number.isFinite(x), `at ${(i / 40) * 100} % of rated flow`).toBe(true);
        expect(x, `at ${(i / 40) * 100} % of rated flow`).toBeLessThanOrEqual(p[0]);
        if (i > 0) expect(x, `at ${(i / 40) * 100} % of rated flow`).toBeLessThanOrEqual(p[i - 1]);
      });
      // and ends on its 150 % point, o × rated
      expect(p[60]).toBeCloseTo((o ?? 0.7) * pr * (units === "SI" ? BAR_PER_PSI : 1), 9);
    },
  );
});
