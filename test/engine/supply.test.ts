import { describe, expect, it } from "vitest";
import { HeadroomError } from "../../src/engine/errors";
import { exhaustionFlow, flowAt, pitotFlow, supplyAt } from "../../src/engine/supply";

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
