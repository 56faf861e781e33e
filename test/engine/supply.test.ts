import { describe, expect, it } from "vitest";
import { HeadroomError } from "../../src/engine/errors";
import { exhaustionFlow, flowAt, pitotFlow, siteTest, supplyAt } from "../../src/engine/supply";
import { errorOf } from "./engineError";

const test70 = { static: 70, residual: 50, testFlow: 1000 };

describe("supply curve [NFPA 291]", () => {
  it("passes through the static pressure at no flow and the residual at the test flow [NFPA 291]", () => {
    expect(supplyAt(0, test70)).toBe(70);
    expect(supplyAt(1000, test70)).toBeCloseTo(50, 12);
  });

  it("follows P = Ps − (Ps − Pr)(Q/Qt)^1.85 between and beyond the test point [NFPA 291]", () => {
    // 600 gpm: 70 − 20 × 0.6^1.85 = 70 − 20 × 0.38867 = 62.227
    expect(supplyAt(600, test70)).toBeCloseTo(62.227, 3);
    // 1500 gpm (extrapolated): 70 − 20 × 1.5^1.85 = 70 − 20 × 2.1172 = 27.655
    expect(supplyAt(1500, test70)).toBeCloseTo(27.655, 3);
  });

  it("gives the flow at a pressure, Q = Qt ((Ps − P)/(Ps − Pr))^0.54 [NFPA 291]", () => {
    // fire flow at 20 psi: 1000 × (50/20)^0.54 = 1000 × 1.6403 = 1640 gpm with the published 0.54;
    // the engine uses the exact 1/1.85 = 0.5405 (1641 gpm): within 0.1 %
    const published = 1000 * (50 / 20) ** 0.54;
    expect(Math.abs(flowAt(20, test70) / published - 1)).toBeLessThan(0.001);
    expect(flowAt(50, test70)).toBeCloseTo(1000, 9);
    expect(flowAt(70, test70)).toBe(0);
  });

  it("is its own inverse: flowAt(supplyAt(Q)) = Q", () => {
    for (const q of [0, 1, 250, 999, 1000, 1700]) expect(flowAt(supplyAt(q, test70), test70)).toBeCloseTo(q, 8);
  });

  it("reaches 0 psi at Qt (Ps/(Ps − Pr))^(1/1.85) and refuses flows beyond [NFPA 291]", () => {
    // 1000 × (70/20)^0.5405 = 1968 gpm
    expect(exhaustionFlow(test70)).toBeCloseTo(1968.3, 1);
    expect(() => supplyAt(2000, test70)).toThrow(HeadroomError);
    expect(() => supplyAt(2000, test70)).toThrow(/flow: got 2000 gpm; this supply reaches 0 psi at 1968\.\d+ gpm/);
  });

  it("rejects a residual at or above the static pressure, with a message", () => {
    expect(() => supplyAt(100, { static: 50, residual: 50, testFlow: 1000 })).toThrow(/residual.*below the static/);
  });
});

describe("pitot flow [NFPA 291]", () => {
  it("is Q = 29.83 c d² √p [NFPA 291]", () => {
    // 2.5 in outlet, c 0.90, 16 psi: 29.83 × 0.90 × 6.25 × 4 = 671.175 gpm
    expect(pitotFlow(16, 2.5, 0.9)).toBeCloseTo(671.175, 9);
    // 4.5 in pumper outlet, c 0.80 (square and sharp), 9 psi: 29.83 × 0.80 × 20.25 × 3 = 1449.74 gpm
    expect(pitotFlow(9, 4.5, 0.8)).toBeCloseTo(1449.738, 3);
  });
});

describe("the flow test carried to the site (SITETEST)", () => {
  // P_site = P × (1 − derate) − 0.433 × rise: the derate (common practice), 0.433 psi per ft of rise [NFPA 13]
  it("derates both readings, then takes off the elevation pressure of the rise (by hand)", () => {
    // static 72 × 0.9 − 0.433 × 20 = 64.8 − 8.66 = 56.14; residual 58 × 0.9 − 8.66 = 52.2 − 8.66 = 43.54
    const s = siteTest({ static: 72, residual: 58 }, 20, 0.1);
    expect(s.static).toBeCloseTo(56.14, 10);
    expect(s.residual).toBeCloseTo(43.54, 10);
  });

  it("adds the elevation pressure where the site is below the gauge (by hand)", () => {
    // 10 ft lower, no derate: 72 + 0.433 × 10 = 76.33; 58 + 4.33 = 62.33
    expect(siteTest({ static: 72, residual: 58 }, -10, 0)).toEqual({ static: expect.closeTo(76.33, 10), residual: expect.closeTo(62.33, 10) });
    // and lets a test with no residual at the gauge be carried down to a positive one: 0 + 4.33
    expect(siteTest({ static: 72, residual: 0 }, -10, 0).residual).toBeCloseTo(4.33, 10);
  });

  it("leaves the test unchanged with no rise and no derate", () => {
    expect(siteTest({ static: 86, residual: 42 }, 0, 0)).toEqual({ static: 86, residual: 42 });
  });

  it("refuses a rise that leaves no residual at the site, saying the residual there and the rise", () => {
    // 58 − 0.433 × 140 = 58 − 60.62 = −2.62 psi
    const e = errorOf(() => siteTest({ static: 72, residual: 58 }, 140, 0));
    expect(e.message).toBe("rise: got 140 ft; leaves the residual at the site at -2.62 psi; it must stay above 0 psi");
    // the last rise that leaves some: 58 − 0.433 × 133 = 58 − 57.589 = 0.411 psi
    expect(siteTest({ static: 72, residual: 58 }, 133, 0).residual).toBeCloseTo(0.411, 10);
    // with a derate the derated residual is what is left: 58 × 0.5 − 0.433 × 70 = 29 − 30.31 = −1.31 psi
    expect(errorOf(() => siteTest({ static: 72, residual: 58 }, 70, 0.5)).message).toMatch(/^rise: got 70 ft; leaves the residual at the site at -1\.31 psi/);
  });

  it("refuses a residual of 0 that no rise carries above 0, naming the residual", () => {
    expect(errorOf(() => siteTest({ static: 72, residual: 0 }, 0, 0)).message).toBe(
      "residual: got 0 psi; must be greater than 0 to carry the test to the site (or the site lower than the gauge)",
    );
  });

  it("refuses a derate outside 0 ≤ derate < 1", () => {
    for (const derate of [-0.1, 1, 10, NaN]) {
      expect(errorOf(() => siteTest({ static: 72, residual: 58 }, 0, derate)).message).toMatch(
        /^derate: got \S+; must be from 0 to less than 1 \(a fraction: 0\.1 for 10 %\)$/,
      );
    }
    expect(siteTest({ static: 72, residual: 58 }, 0, 0.99).residual).toBeCloseTo(0.58, 10); // 58 × 0.01
  });

  it("refuses a residual above static, as a flow test does", () => {
    expect(errorOf(() => siteTest({ static: 50, residual: 60 }, 0, 0)).message).toBe("residual: got 60 psi; must be below the static pressure 50 psi");
    expect(errorOf(() => siteTest({ static: 0, residual: 0 }, 0, 0)).message).toBe("static_pressure: got 0 psi; must be greater than 0");
    expect(errorOf(() => siteTest({ static: 72, residual: 58 }, Infinity, 0)).message).toMatch(/^rise: got Infinity ft; must be a finite number/);
  });
});
