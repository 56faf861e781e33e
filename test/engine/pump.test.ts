import { describe, expect, it } from "vitest";
import { HeadroomError } from "../../src/engine/errors";
import { errorOf } from "./engineError";
import {
  STANDARD_RATED_CAPACITIES_GPM,
  pumpCurveShape,
  pumpPressure,
  pumpSuction,
  ratedCapacity,
  roundUpToStep,
} from "../../src/engine/pump";

describe("standard rated capacities [NFPA 20] (from memory)", () => {
  it("holds the list [NFPA 20] gives", () => {
    // [NFPA 20] (from memory)
    expect(STANDARD_RATED_CAPACITIES_GPM).toEqual([
      25, 50, 100, 150, 200, 250, 300, 400, 450, 500, 750, 1000, 1250, 1500, 2000, 2500, 3000, 3500, 4000, 4500, 5000,
    ]);
  });
  it("picks the smallest capacity not below the demand [NFPA 20] (from memory)", () => {
    expect(ratedCapacity(562)).toBe(750);
    expect(ratedCapacity(500)).toBe(500); // an exact rating is kept
    expect(ratedCapacity(500.0000000001)).toBe(500); // a hair above from a unit conversion stays
    expect(ratedCapacity(401)).toBe(450);
    expect(ratedCapacity(1)).toBe(25);
    expect(ratedCapacity(4999)).toBe(5000);
  });
  it("has no rating above 5000 gpm: a not-in-table error [NFPA 20] (from memory)", () => {
    try {
      ratedCapacity(5200);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(HeadroomError);
      expect((e as HeadroomError).kind).toBe("na");
      expect((e as Error).message).toMatch(/demand_flow: got 5200 gpm; the standard rated capacities go up to 5000 gpm/);
    }
  });
  it("rejects a demand that is not positive", () => {
    expect(() => ratedCapacity(0)).toThrow(/demand_flow: got 0/);
  });
});

describe("rounding the boost", () => {
  it("rounds up to the next step; an exact multiple stays", () => {
    expect(roundUpToStep(22.04, 5)).toBe(25);
    expect(roundUpToStep(25, 5)).toBe(25);
    expect(roundUpToStep(25.01, 5)).toBe(30);
    expect(roundUpToStep(1.52, 0.5)).toBe(2);
    expect(roundUpToStep(1.5, 0.5)).toBe(1.5);
  });
  it("a positive boost, however small, takes at least one step; 0 stays 0, never -0", () => {
    // 1e-10 psi is 2e-11 steps of 5 psi: a pump rated at 0 psi for a positive boost would be no rating at all,
    // so it is one step, 5 psi (the vocabulary's steps, common practice)
    expect(roundUpToStep(1e-10, 5)).toBe(5);
    expect(roundUpToStep(1e-12, 0.5)).toBe(0.5);
    expect(Object.is(roundUpToStep(0, 5), 0)).toBe(true);
  });
});

describe("pump curve: P = shutoff − k Q^n through shutoff, rated and 150 % points", () => {
  // (common practice) shape: shutoff 120 % of rated pressure, 70 % at 150 % flow; rated 500 gpm at 100 psi
  it("passes through its three points", () => {
    expect(pumpPressure(0, 500, 100, 1.2, 0.7)).toBeCloseTo(120, 10);
    expect(pumpPressure(500, 500, 100, 1.2, 0.7)).toBeCloseTo(100, 10);
    expect(pumpPressure(750, 500, 100, 1.2, 0.7)).toBeCloseTo(70, 10);
    // and for another shape inside the [NFPA 20] envelope: shutoff 140 %, 65 % at 150 %
    expect(pumpPressure(0, 1000, 80, 1.4, 0.65)).toBeCloseTo(112, 10);
    expect(pumpPressure(1000, 1000, 80, 1.4, 0.65)).toBeCloseTo(80, 10);
    expect(pumpPressure(1500, 1000, 80, 1.4, 0.65)).toBeCloseTo(52, 10);
  });
  it("has the exponent and values worked by hand", () => {
    // s 1.2, o 0.7: n = ln((1.2 − 0.7) / (1.2 − 1)) / ln 1.5 = ln 2.5 / ln 1.5 = 0.916291 / 0.405465 = 2.259851
    const [s, n] = pumpCurveShape(1.2, 0.7);
    expect(s).toBe(1.2);
    expect(n).toBeCloseTo(2.259851, 6);
    // s 1.4, o 0.65: n = ln(0.75 / 0.4) / ln 1.5 = 0.628609 / 0.405465 = 1.550340
    expect(pumpCurveShape(1.4, 0.65)[1]).toBeCloseTo(1.55034, 5);
    // at half the rated flow: 0.5^2.259851 = 0.208794; 120 − 20 × 0.208794 = 115.824 psi
    expect(pumpPressure(250, 500, 100, 1.2, 0.7)).toBeCloseTo(115.824, 3);
    // at 12.5 % of rated flow: 0.125^2.259851 = 0.009102; 120 − 20 × 0.009102 = 119.818 psi
    expect(pumpPressure(62.5, 500, 100, 1.2, 0.7)).toBeCloseTo(119.818, 3);
  });
  it("never rises above its shutoff pressure, even just off shutoff (common practice shape)", () => {
    // shutoff 1.2 × 100 = 120 psi; a curve drawn through the same three points must not exceed it anywhere
    for (let i = 1; i <= 150; i++) expect(pumpPressure(i * 5, 500, 100, 1.2, 0.7)).toBeLessThan(120);
    expect(pumpPressure(62.5, 500, 100, 1.2, 0.7)).toBeLessThan(120); // 12.5 % of rated flow
  });
  it("stays positive over the whole curve anywhere in the envelope [NFPA 20]", () => {
    for (const s of [1.01, 1.1, 1.2, 1.3, 1.4]) {
      for (const o of [0.65, 0.7, 0.8, 0.9, 0.99]) {
        for (let i = 0; i <= 30; i++) expect(pumpPressure(i * 50, 1000, 100, s, o)).toBeGreaterThan(60);
      }
    }
  });
  it("is #NUM!-kind beyond 150 % of rated flow [NFPA 20]", () => {
    expect(errorOf(() => pumpPressure(751, 500, 100, 1.2, 0.7)).kind).toBe("number");
    expect(() => pumpPressure(751, 500, 100, 1.2, 0.7)).toThrow(/flow: got 150.2 % of rated flow; a fire pump curve runs from 0 to 150 % of rated flow/);
  });
  it("holds the ratios to the [NFPA 20] envelope: shutoff ≤ 140 % (and above 100 %), 150 % point ≥ 65 % (and below 100 %)", () => {
    expect(pumpCurveShape(1.4, 0.65)).toHaveLength(2);
    expect(() => pumpCurveShape(1.41, 0.7)).toThrow(/shutoff_ratio: got 1.41; .* at most 1.4 × rated/);
    expect(errorOf(() => pumpCurveShape(1, 0.7)).kind).toBe("number");
    expect(() => pumpCurveShape(1.2, 0.64)).toThrow(/overload_ratio: got 0.64; .* at least 0.65 × rated/);
    expect(errorOf(() => pumpCurveShape(1.2, 1)).kind).toBe("number");
  });
  it("rejects a negative flow or a rating that is not positive (#VALUE! kind)", () => {
    expect(() => pumpPressure(-1, 500, 100, 1.2, 0.7)).toThrow(/flow: got -1 gpm; must be 0 or more/);
    expect(errorOf(() => pumpPressure(-1, 500, 100, 1.2, 0.7)).kind).toBe("value");
    expect(() => pumpPressure(100, 0, 100, 1.2, 0.7)).toThrow(/rated_flow/);
    expect(() => pumpPressure(100, 500, 0, 1.2, 0.7)).toThrow(/rated_pressure/);
  });
});

describe("pressure left in the main while the pump draws 150 % of its rating (PUMPSUCTION)", () => {
  // the [NFPA 291] supply curve static 72, residual 58 psi at 1100 gpm, P(Q) = 72 − 14 (Q / 1100)^1.85
  const t = { static: 72, residual: 58, testFlow: 1100 };
  it("is the supply at 1.5 × rated flow plus the other flow (by hand)", () => {
    // 500 gpm rated draws 750 gpm: 750/1100 = 0.681818, ^1.85 = 0.492352, × 14 = 6.8929; 72 − 6.8929 = 65.107 psi
    expect(pumpSuction(500, t, 0)).toBeCloseTo(65.107, 3);
    // plus 250 gpm of hose from the same main, 1000 gpm: (1000/1100)^1.85 = 0.838346, × 14 = 11.7368; 60.263 psi
    expect(pumpSuction(500, t, 250)).toBeCloseTo(60.263, 3);
  });
  it("is an error naming the flow drawn and the flow where the main reaches 0, at or beyond it", () => {
    // the main reaches 0 at 1100 × (72/14)^(1/1.85) = 1100 × 2.42345 = 2665.8 gpm; 1.5 × 1500 + 500 = 2750 gpm
    const e = errorOf(() => pumpSuction(1500, t, 500));
    expect(e.kind).toBe("value");
    expect(e.message).toBe(
      "rated_flow: got 1500 gpm; 150 % of it plus other_flow is 2750 gpm, at or beyond 2665.8 gpm, where this supply reaches 0 psi",
    );
    // 1.5 × 1777.2 = 2665.8: at the flow where it reaches 0 there is no pressure left either
    expect(() => pumpSuction(2665.799786291329 / 1.5, t, 0)).toThrow(/at or beyond 2665\.8 gpm/);
  });
  it("refuses a rated flow that is not positive, a negative other flow and a bad flow test", () => {
    expect(errorOf(() => pumpSuction(0, t, 0)).message).toBe("rated_flow: got 0 gpm; must be greater than 0");
    expect(errorOf(() => pumpSuction(500, t, -1)).message).toBe("other_flow: got -1 gpm; must be 0 or more");
    expect(errorOf(() => pumpSuction(500, { static: 50, residual: 60, testFlow: 1000 }, 0)).message).toMatch(/^residual: got 60 psi; must be below/);
  });
});
