import { describe, expect, it } from "vitest";
import {
  HW_CONSTANT_SI_AS_US,
  elevationPressure,
  frictionRate,
  frictionRateSI,
  headLoss,
  velocity,
} from "../../src/engine/friction";
import { BARM_PER_PSIFT, L_PER_GAL, MM_PER_IN } from "../../src/engine/units";

describe("Hazen-Williams friction", () => {
  it("follows the US form p = 4.52 Q^1.85 / (C^1.85 d^4.87) [NFPA 13]", () => {
    // [NFPA 13] with the arithmetic written out: 500 gpm, d 4.026 in, C 120
    // 500^1.85 = 98 422.5; 120^1.85 = 7 022.4; 4.026^4.87 = 882.54  →  4.52 × 98 422.5 / (7 022.4 × 882.54) = 0.07178
    expect(500 ** 1.85).toBeCloseTo(98422.5, 0);
    expect(frictionRate(500, 4.026, 120)).toBeCloseTo((4.52 * 500 ** 1.85) / (120 ** 1.85 * 4.026 ** 4.87), 12);
    expect(frictionRate(500, 4.026, 120)).toBeCloseTo(0.0718, 4);
    // over 100 ft: 7.18 psi [NFPA 13]
    expect(headLoss("US").loss(500, 4.026, 120, 100)).toBeCloseTo(7.178, 2);
    expect(headLoss("US").rate(500, 4.026, 120)).toBe(frictionRate(500, 4.026, 120));
  });

  it("follows the SI form p = 6.05e5 Q^1.85 / (C^1.85 d^4.87) bar/m [EN 12845]", () => {
    expect(frictionRateSI(1000, 100, 120)).toBeCloseTo((6.05e5 * 1000 ** 1.85) / (120 ** 1.85 * 100 ** 4.87), 14);
  });

  it("US and SI forms agree within 0.2 % after unit conversion [NFPA 13] [EN 12845]", () => {
    for (const [q, d, c] of [[20, 1.049, 120], [150, 2.067, 100], [500, 4.026, 120], [1500, 7.981, 140], [3000, 11.938, 150]]) {
      const us = frictionRate(q, d, c);
      const si = frictionRateSI(q * L_PER_GAL, d * MM_PER_IN, c) / BARM_PER_PSIFT;
      expect(Math.abs(si / us - 1)).toBeLessThan(0.002);
      // the SI head loss on US quantities is the EN 12845 formula on L/min and mm, to rounding
      expect(headLoss("SI").rate(q, d, c) / si).toBeCloseTo(1, 12);
    }
  });

  it("rises with flow and falls with diameter and C", () => {
    expect(frictionRate(200, 2.067, 120)).toBeGreaterThan(frictionRate(100, 2.067, 120));
    expect(frictionRate(200, 2.469, 120)).toBeLessThan(frictionRate(200, 2.067, 120));
    expect(frictionRate(200, 2.067, 150)).toBeLessThan(frictionRate(200, 2.067, 120));
    // doubling the flow multiplies the loss by 2^1.85 = 3.605 [NFPA 13] exponent
    expect(frictionRate(200, 2.067, 120) / frictionRate(100, 2.067, 120)).toBeCloseTo(2 ** 1.85, 10);
  });
});

describe("the head-loss interface: loss and its derivative with respect to flow", () => {
  it("carries the EN 12845 constant into US quantities [EN 12845]", () => {
    // 3.785411784^1.85 = 11.7357; 25.4^4.87 = 6 942 889; 0.0689476 / 0.3048 = 0.226206 bar/m per psi/ft
    // → 6.05e5 × 11.7357 / 6 942 889 / 0.226206 = 4.5209 against the [NFPA 13] 4.52
    expect(HW_CONSTANT_SI_AS_US).toBeCloseTo(4.5209, 4);
    expect(Math.abs(HW_CONSTANT_SI_AS_US / 4.52 - 1)).toBeLessThan(0.002); // within 0.2 % [NFPA 13] [EN 12845]
  });
  for (const units of ["US", "SI"] as const) {
    it(`${units}: slope = 1.85 × loss / Q, and matches a central difference of the loss [NFPA 13]`, () => {
      const hl = headLoss(units);
      for (const [q, d, c, l] of [[20, 1.049, 120, 12], [500, 4.026, 120, 100], [1500, 7.981, 140, 300]]) {
        expect(hl.slope(q, d, c, l)).toBeCloseTo((1.85 * hl.loss(q, d, c, l)) / q, 12);
        const h = q * 1e-6;
        const numeric = (hl.loss(q + h, d, c, l) - hl.loss(q - h, d, c, l)) / (2 * h);
        expect(hl.slope(q, d, c, l) / numeric).toBeCloseTo(1, 6);
      }
      expect(hl.slope(0, 2.067, 120, 10)).toBe(0); // no flow, no slope (the network solver linearises there)
      expect(hl.loss(0, 2.067, 120, 10)).toBe(0);
    });
  }
});

describe("velocity", () => {
  it("matches the trade form v = 0.4085 Q / d² ft/s (definition Q / area)", () => {
    expect(velocity(500, 4.026) / ((0.4085 * 500) / 4.026 ** 2)).toBeCloseTo(1, 4);
  });
  it("matches the SI form v = 21.22 Q / d² m/s with Q L/min, d mm (definition Q / area)", () => {
    const q = 500, d = 4.026;
    const siForm = (21.22 * q * L_PER_GAL) / (d * MM_PER_IN) ** 2; // m/s
    expect((velocity(q, d) * 0.3048) / siForm).toBeCloseTo(1, 3);
  });
});

describe("elevation", () => {
  it("is 0.433 psi per ft of rise [NFPA 13]", () => {
    expect(elevationPressure(1)).toBe(0.433);
    expect(elevationPressure(30)).toBeCloseTo(12.99, 10);
    expect(elevationPressure(-10)).toBeCloseTo(-4.33, 10);
  });
});
