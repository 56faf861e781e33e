/**
 * Properties of the supply-side cell functions that carry or draw on a flow test: SITETEST (P_site = P × (1 − derate)
 * − 0.433 × rise: 0.433 psi per ft [NFPA 13], the derate (common practice)) and PUMPSUCTION (the [NFPA 291] supply
 * curve at 150 % of a pump's rated flow plus other flow).
 */
import { describe, expect } from "vitest";
import { fc, test } from "@fast-check/vitest";
import * as f from "../../src/functions/functions";
import { BAR_PER_PSI, M_PER_FT } from "../../src/engine/units";
import { arb } from "./arbitraries";

const RUNS = { numRuns: 300 };
const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-12);
const derate = fc.double({ min: 0, max: 0.5, noNaN: true });

describe("SITETEST", () => {
  test.prop([arb.flowTest], RUNS)("with no rise and no derate returns the test unchanged", (t) => {
    expect(f.sitetest(t.static, t.residual, 0, 0)).toEqual([[t.static, t.residual]]);
    expect(f.sitetest(t.static, t.residual, 0)).toEqual([[t.static, t.residual]]);
  });
  test.prop([arb.flowTest, arb.rise, derate], RUNS)(
    "keeps the drop static − residual, derated, and lowers both readings alike by the rise",
    (t, rise, d) => {
      let site: number[][];
      try {
        site = f.sitetest(t.static, t.residual, rise, d);
      } catch {
        // the rise left no residual at the site: an error, tested by hand in test/functions/core.test.ts
        expect(t.residual * (1 - d) - 0.433 * rise).toBeLessThanOrEqual(1e-9);
        return;
      }
      const [[s, r]] = site;
      expect(r).toBeGreaterThan(0);
      expect(s).toBeGreaterThan(r);
      expect(Math.abs(s - r - (t.static - t.residual) * (1 - d))).toBeLessThan(1e-9 * t.static + 1e-9 * Math.abs(rise));
      expect(Math.abs(s - (t.static * (1 - d) - 0.433 * rise))).toBeLessThan(1e-9 * (t.static + Math.abs(rise)));
    },
  );
  test.prop([arb.flowTest, fc.double({ min: -100, max: 0, noNaN: true }), derate], RUNS)("in SI equals the converted US result", (t, rise, d) => {
    // a site at or below the gauge: every such call has an answer
    const [[s, r]] = f.sitetest(t.static, t.residual, rise, d);
    const [[sSI, rSI]] = f.sitetest(t.static * BAR_PER_PSI, t.residual * BAR_PER_PSI, rise * M_PER_FT, d, "SI");
    expect(rel(sSI, s * BAR_PER_PSI)).toBeLessThan(1e-9);
    expect(rel(rSI, r * BAR_PER_PSI)).toBeLessThan(1e-9);
  });
});

describe("PUMPSUCTION", () => {
  const frac = fc.double({ min: 0, max: 1, noNaN: true });
  test.prop([arb.flowTest, fc.double({ min: 0.01, max: 1, noNaN: true }), frac, frac], RUNS)(
    "falls as other_flow grows, and stays below the static pressure",
    (t, rated, a, b) => {
      const qr = (rated * t.testFlow) / 1.5;
      const [lo, hi] = (a <= b ? [a, b] : [b, a]).map((x) => x * t.testFlow);
      let pHi: number;
      try {
        pHi = f.pumpsuction(qr, t.static, t.residual, t.testFlow, hi);
      } catch {
        return; // the main reaches 0 before that flow: an error, tested by hand in test/functions/solvers.test.ts
      }
      const pLo = f.pumpsuction(qr, t.static, t.residual, t.testFlow, lo); // less flow: never an error where more was none
      expect(pHi).toBeLessThanOrEqual(pLo);
      expect(pLo).toBeLessThan(t.static);
      expect(pHi).toBeGreaterThan(0);
    },
  );
});
