import { describe, expect, it } from "vitest";
import { errorOf } from "./engineError";
import {
  FITTING_CODES,
  FITTING_TABLE_SIZES,
  cFactorMultiplier,
  diameterMultiplier,
  equivalentLength,
  fittingSizes,
  tableLength,
} from "../../src/engine/fittings";


describe("equivalent length table", () => {
  it("has seven fittings over fourteen sizes", () => {
    expect(FITTING_CODES).toEqual(["EE", "E", "LtE", "T", "BV", "GV", "CV"]);
    expect(FITTING_TABLE_SIZES).toEqual([0.75, 1, 1.25, 1.5, 2, 2.5, 3, 3.5, 4, 5, 6, 8, 10, 12]);
  });

  it("a ¾ in tee is 4 ft [NFPA 13] (from memory)", () => {
    expect(tableLength("T", 0.75)).toBe(4); // [NFPA 13] (from memory)
    // in copper Type L ¾ in, ID 0.785 [ASTM B88] (from memory) against Sch 40 0.824 [ASME B36.10M], C 120:
    // 4 × (0.785 / 0.824)^4.87 = 4 × 0.952670^4.87 = 4 × 0.789677 = 3.15871 ft
    expect(equivalentLength("T", 0.75, 120, "L")).toBeCloseTo(3.15871, 4);
  });

  it("reads single values", () => {
    expect(tableLength("E", 2)).toBe(5); // [NFPA 13] (from memory)
    expect(tableLength("T", 12)).toBe(60); // [NFPA 13] (from memory)
    expect(tableLength("BV", 5)).toBe(9); // [NFPA 13] (from memory)
  });

  it("a gap is #N/A naming the fitting and the sizes it has, never 0", () => {
    const e = errorOf(() => tableLength("BV", 1));
    expect(e.kind).toBe("na");
    expect(e.message).toBe(
      "nominal: got 1 in; the equivalent length table has no butterfly valve (BV) at this size, only at 2, 2-1/2, 3, 4, 5, 6, 8, 10, 12 in",
    );
    expect(errorOf(() => tableLength("BV", 3.5)).kind).toBe("na"); // "–" at 3½ [NFPA 13] (from memory)
    expect(errorOf(() => tableLength("GV", 1.5)).kind).toBe("na"); // "–" below 2 [NFPA 13] (from memory)
    expect(errorOf(() => tableLength("CV", 0.75)).kind).toBe("na"); // "–" at ¾ [NFPA 13] (from memory)
    expect(fittingSizes("CV")).toEqual([1, 1.25, 1.5, 2, 2.5, 3, 3.5, 4, 5, 6, 8, 10, 12]);
  });

  it("a size outside the columns is #VALUE! listing the columns", () => {
    const e = errorOf(() => tableLength("E", 14));
    expect(e.kind).toBe("value");
    expect(e.message).toBe("nominal: got 14 in; the equivalent length table covers 3/4, 1, 1-1/4, 1-1/2, 2, 2-1/2, 3, 3-1/2, 4, 5, 6, 8, 10, 12 (in)");
  });
});

describe("adjustments", () => {
  it("C factor multiplier (C/120)^1.85 matches the standard's rounded table", () => {
    // [NFPA 13] equivalent length adjustment table: C 100 → 0.713, 130 → 1.16, 140 → 1.33, 150 → 1.51
    // (the table cuts (100/120)^1.85 = 0.71370 to 0.713, so compare within 0.001)
    expect(Math.abs(cFactorMultiplier(100) - 0.713)).toBeLessThan(0.001);
    expect(cFactorMultiplier(130)).toBeCloseTo(1.16, 2);
    expect(cFactorMultiplier(140)).toBeCloseTo(1.33, 2);
    expect(cFactorMultiplier(150)).toBeCloseTo(1.51, 2);
    expect(cFactorMultiplier(120)).toBe(1);
    expect(() => cFactorMultiplier(0)).toThrow(/c_factor: got 0/);
  });

  it("diameter multiplier (d/d_sch40)^4.87", () => {
    // [NFPA 13] note; IDs [ASME B36.10M]: (2.157 / 2.067)^4.87 = 1.043541^4.87 = 1.23067
    expect(diameterMultiplier(2, "10")).toBeCloseTo(Math.pow(2.157 / 2.067, 4.87), 12);
    expect(diameterMultiplier(2, "10")).toBeCloseTo(1.23067, 5);
    expect(diameterMultiplier(2, "40")).toBe(1);
    // copper Type L 1 in [ASTM B88] (from memory) vs Sch 40 1.049: (1.025 / 1.049)^4.87 = 0.97712^4.87 = 0.89336
    expect(diameterMultiplier(1, "L")).toBeCloseTo(0.89336, 4);
  });

  it("equivalent length applies both adjustments", () => {
    // 2-1/2 tee, Schedule 10, C 120: 12 [NFPA 13] (from memory) × (2.635 / 2.469)^4.87 [ASME B36.10M] = 12 × 1.37285 = 16.4742
    expect(equivalentLength("T", 2.5, 120, "10")).toBeCloseTo(16.4742, 3);
    // 4 in gate, Schedule 40, C 100: 2 [NFPA 13] (from memory) × (100/120)^1.85 = 2 × 0.713698 = 1.427397
    expect(equivalentLength("GV", 4, 100, "40")).toBeCloseTo(1.427397, 5);
    // 2 in elbow, CPVC at C 150: 5 [NFPA 13] (from memory) × 1.511066 × (2.003 [ASTM F442] (from memory) / 2.067)^4.87
    const expected = 5 * Math.pow(150 / 120, 1.85) * Math.pow(2.003 / 2.067, 4.87);
    expect(equivalentLength("E", 2, 150, "CPVC")).toBeCloseTo(expected, 12);
    expect(expected).toBeCloseTo(6.4823, 3); // 5 × 1.511066 × 0.969037^4.87 = 5 × 1.511066 × 0.857982 = 6.48234
    // defaults: C 120, Schedule 40 → the table value
    expect(equivalentLength("CV", 6)).toBe(32); // [NFPA 13] (from memory)
  });

  it("a size the schedule lacks is #VALUE! listing its sizes; a gap stays #N/A after adjustment", () => {
    const e = errorOf(() => equivalentLength("E", 4, 120, "CPVC"));
    expect(e.kind).toBe("value");
    expect(e.message).toBe("nominal: got 4 in; CPVC SDR 13.5 comes in 3/4, 1, 1-1/4, 1-1/2, 2, 2-1/2, 3 (in)");
    expect(errorOf(() => equivalentLength("BV", 1.5, 150, "L")).kind).toBe("na");
  });
});
