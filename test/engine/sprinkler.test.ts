import { describe, expect, it } from "vitest";
import {
  ceilCount,
  headCount,
  headDischarge,
  headFlow,
  headPressure,
  headsPerLine,
} from "../../src/engine/sprinkler";
import { errorOf } from "./engineError";

describe("sprinkler discharge [NFPA 13]", () => {
  it("is Q = K √P [NFPA 13]", () => {
    // K 5.6 at the 7 psi minimum: 5.6 × 2.6458 = 14.82 gpm
    expect(headDischarge(5.6, 7)).toBeCloseTo(14.816, 3);
  });
  it("a K 8.0 sprinkler flowing 24 gpm needs 9 psi (common practice)", () => {
    expect(headPressure(24, 8.0, 7)).toBeCloseTo(9, 12);
  });
  it("never asks less than the minimum operating pressure, 7 psi [NFPA 13]", () => {
    // K 8.0 flowing 16 gpm would need (16/8)² = 4 psi: the minimum 7 psi governs
    expect(headPressure(16, 8.0, 7)).toBe(7);
  });
  it("design flow is the larger of density × coverage and K √Pmin [NFPA 13]", () => {
    // OH1 0.15 gpm/ft² × 130 ft² = 19.5 gpm > 5.6 √7 = 14.8 gpm
    expect(headFlow(0.15, 130, 5.6, 7)).toBeCloseTo(19.5, 12);
    // LH 0.10 × 100 ft² = 10 gpm < 14.8 gpm: the minimum pressure governs
    expect(headFlow(0.1, 100, 5.6, 7)).toBeCloseTo(5.6 * Math.sqrt(7), 12);
  });
});

describe("design-area counts [NFPA 13]", () => {
  it("sprinklers in the area round up: n = ceil(A / coverage) [NFPA 13]", () => {
    expect(headCount(1500, 130)).toBe(12); // 11.54 → 12
    expect(headCount(1500, 150)).toBe(10); // exactly 10
    expect(headCount(1500, 225)).toBe(7); // 6.67 → 7
  });
  it("sprinklers on a line: ceil(1.2 √A / S) [NFPA 13]", () => {
    // 1.2 × √1500 / 12 = 1.2 × 38.73 / 12 = 3.87 → 4
    expect(headsPerLine(1500, 12, 1.2)).toBe(4);
    // 1.2 × √1500 / 10 = 4.65 → 5
    expect(headsPerLine(1500, 10, 1.2)).toBe(5);
    // 1.2 × √2500 / 15 = 60 / 15 = 4 exactly
    expect(headsPerLine(2500, 15, 1.2)).toBe(4);
  });
});

describe("counts never come out as -0 or as 0 sprinklers for a positive area", () => {
  it("rounding up a value within the noise allowance of 0 gives +0, not -0", () => {
    // ceil(1e-12 - 1e-9) = ceil(-9.99e-10) is -0 in IEEE arithmetic; a count or a step count must read 0
    expect(Object.is(ceilCount(1e-12), 0)).toBe(true);
    expect(Object.is(ceilCount(0), 0)).toBe(true);
  });
  it("a positive design area, however small, holds at least one sprinkler", () => {
    // 1e-10 ft² / 130 ft² = 7.7e-13 sprinklers: rounded up, 1 (it was -0)
    expect(headCount(1e-10, 130)).toBe(1);
    // 1.2 × √1e-20 / 12 = 1e-11 sprinklers on a line: rounded up, 1 (it was -0)
    expect(headsPerLine(1e-20, 12, 1.2)).toBe(1);
  });
});

describe("counts stay finite: a tiny coverage or spacing is an input error naming it", () => {
  it("HEADCOUNT(1000000, 1E-303) was Infinity: now coverage must be at least area ÷ 5000", () => {
    // 1e6 / 1e-303 = 1e309 overflows to Infinity; the smallest coverage for 1e6 is 1e6 / 5000 = 200
    expect(errorOf(() => headCount(1_000_000, 1e-303)).message).toBe(
      "coverage: got 1e-303; must be at least area ÷ 5000 = 200 (in the unit of area): a design area of more than 5000 sprinklers is an input error",
    );
    // 1500 / 1e-300 = 1.5e303 sprinklers was finite but absurd: the same error
    expect(errorOf(() => headCount(1500, 1e-300)).message).toMatch(/^coverage: got 1e-300; must be at least area ÷ 5000 = 0.3 \(in the unit of area\):/);
  });
  it("keeps every count up to 5000 and refuses 5001", () => {
    // 5000 × 130 = 650000 ft² at 130 ft² is exactly 5000 sprinklers; 650130 ft² would be 5001
    expect(headCount(650_000, 130)).toBe(5000);
    expect(errorOf(() => headCount(650_130, 130)).message).toMatch(/^coverage: got 130; must be at least area ÷ 5000 = 130.026 \(in the unit of area\):/);
  });
  it("refuses an area or coverage that is not a positive finite number", () => {
    expect(errorOf(() => headCount(1500, 0)).message).toBe("coverage: got 0; must be greater than 0");
    expect(errorOf(() => headCount(NaN, 130)).message).toBe("area: got NaN; must be greater than 0");
    expect(errorOf(() => headCount(Infinity, 130)).message).toBe("area: got Infinity; must be greater than 0");
  });
  it("HEADSPERLINE(1000000, 1E-305, 10) was Infinity: a head spacing below 3 ft is refused", () => {
    // 10 × √1e6 / 1e-305 = 1e309 overflows to Infinity
    expect(errorOf(() => headsPerLine(1_000_000, 1e-305, 10)).message).toBe(
      "head_spacing: got 1e-305 ft; must be at least 3 ft: sprinklers closer than that on a line are an input error",
    );
    expect(headsPerLine(1500, 3, 1.2)).toBe(16); // 1.2 × 38.73 / 3 = 15.49 → 16: 3 ft itself is allowed
  });
  it("a line of more than 5000 sprinklers is refused, naming the area", () => {
    // at 3 ft and factor 1.2, 5000 sprinklers need 1.2 √A / 3 ≤ 5000, √A ≤ 12500, A ≤ 1.5625e8 ft²
    expect(headsPerLine(1.5625e8, 3, 1.2)).toBe(5000);
    expect(errorOf(() => headsPerLine(1e300, 3, 1.2)).message).toBe(
      "area: got 1e+300 ft²; must be at most 156250000 ft² with head_spacing 3 ft and factor 1.2: a line of more than 5000 sprinklers is an input error",
    );
  });
});
