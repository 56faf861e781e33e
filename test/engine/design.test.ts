import { describe, expect, it } from "vitest";
import { errorOf } from "./engineError";
import {
  AREA_SPAN_SLACK,
  AREA_SYSTEM_CODES,
  DRY_AREA_FACTOR,
  HAZARDS,
  HAZARD_CODES,
  areaOnCurve,
  adjustedArea,
  areaSpan,
  designArea,
  designDensity,
  hazardInfo,
  hoseAllowance,
  supplyDuration,
} from "../../src/engine/design";


describe("hazard metadata", () => {
  it("has five hazards with names", () => {
    expect(HAZARD_CODES).toEqual(["LH", "OH1", "OH2", "EH1", "EH2"]);
    expect(hazardInfo("LH").name).toBe("light hazard");
    expect(hazardInfo("OH1").name).toBe("ordinary hazard group 1");
    expect(hazardInfo("EH2").name).toBe("extra hazard group 2");
    for (const h of HAZARD_CODES) expect(HAZARDS[h].code).toBe(h);
    expect(() => hazardInfo("XH" as never)).toThrow('hazard: got "XH"; must be one of LH, OH1, OH2, EH1, EH2');
  });
});

describe("density/area curves", () => {
  it("returns each end point's density", () => {
    // [NFPA 13] density/area curves (from memory)
    expect(designDensity("LH", 1500)).toBeCloseTo(0.1, 12);
    expect(designDensity("LH", 3000)).toBeCloseTo(0.07, 12);
    expect(designDensity("EH1", 5000)).toBeCloseTo(0.28, 12);
  });

  it("interpolates along the straight line", () => {
    // OH2 (0.20 @ 1500, 0.17 @ 4000) [NFPA 13] (from memory): 0.20 − 0.03 × (2000 − 1500) / 2500 = 0.194
    expect(designDensity("OH2", 2000)).toBeCloseTo(0.194, 12);
    // EH2 (0.40 @ 2500, 0.38 @ 5000) [NFPA 13] (from memory): 0.40 − 0.02 × 1250 / 2500 = 0.39
    expect(designDensity("EH2", 3750)).toBeCloseTo(0.39, 12);
  });

  it("defaults to the upper point, the smallest area", () => {
    expect(designDensity("OH1")).toBe(0.15); // [NFPA 13] (from memory)
    expect(designArea("OH1")).toBe(1500); // [NFPA 13] (from memory)
    expect(designArea("EH1")).toBe(2500); // [NFPA 13] (from memory)
    expect(areaSpan("LH")).toEqual({ min: 1500, max: 3000 }); // [NFPA 13] (from memory)
  });

  it("an area off the curve is an error stating the span", () => {
    const e = errorOf(() => designDensity("OH1", 1000));
    expect(e.kind).toBe("value");
    expect(e.message).toBe("area: got 1000 ft²; the OH1 (ordinary hazard group 1) curve spans 1500 ft² to 4000 ft²");
    expect(() => designDensity("LH", 3100)).toThrow(/spans 1500 ft² to 3000 ft²/);
    expect(() => designDensity("LH", Number.NaN)).toThrow(/spans/);
  });

  it("reads an area within the slack of an end as the end point", () => {
    expect(AREA_SPAN_SLACK).toBe(0.005);
    // 139 m² = 139 / 0.09290304 = 1496.18 ft², 0.25 % short of 1500 (the metric edition's rounding)
    expect(areaOnCurve("OH1", 139 / 0.09290304)).toBe(1500);
    expect(areaOnCurve("OH1", 1500 * (1 - 0.006))).toBeUndefined();
    expect(areaOnCurve("OH1", 4000 * 1.004)).toBe(4000);
    expect(designDensity("OH1", 1493)).toBe(0.15); // 1493 ≥ 1500 × 0.995 = 1492.5 → the upper point
  });
});

describe("hose allowance and duration", () => {
  it("total, inside (largest inside allowance) and outside = total − inside", () => {
    // [NFPA 13] (from memory): totals 100, 250, 250, 500, 500; inside 0, 50 or 100
    expect(hoseAllowance("LH")).toBe(100);
    expect(hoseAllowance("OH1", "inside")).toBe(100);
    expect(hoseAllowance("OH1", "outside")).toBe(150); // 250 − 100
    expect(hoseAllowance("LH", "outside")).toBe(0); // 100 − 100
    expect(hoseAllowance("EH2", "outside")).toBe(400); // 500 − 100
    expect(() => hoseAllowance("LH", "roof" as never)).toThrow('part: got "roof"; must be "total", "inside" or "outside"');
  });

  it("durations, min and max of the range", () => {
    // [NFPA 13] (from memory): LH 30, OH 60–90, EH 90–120
    expect(supplyDuration("LH")).toBe(30);
    expect(supplyDuration("LH", "max")).toBe(30);
    expect(supplyDuration("OH2", "min")).toBe(60);
    expect(supplyDuration("OH2", "max")).toBe(90);
    expect(supplyDuration("EH1", "max")).toBe(120);
    expect(() => supplyDuration("LH", "mid" as never)).toThrow('bound: got "mid"; must be "min" or "max"');
  });
});

describe("design-area adjustment by system type", () => {
  it("dry-pipe and double-interlock preaction systems flow 30 % more area; wet and single-interlock preaction do not", () => {
    expect(DRY_AREA_FACTOR).toBe(1.3); // [NFPA 13] (from memory)
    expect(AREA_SYSTEM_CODES).toEqual(["wet", "preaction", "dry", "double interlock"]);
    // 1.3 × 1500 = 1950 ft² [NFPA 13] (from memory)
    expect(adjustedArea(1500, "dry")).toBeCloseTo(1950, 9);
    expect(adjustedArea(1500, "double interlock")).toBeCloseTo(1950, 9);
    // × 1 [NFPA 13] (from memory)
    expect(adjustedArea(1500, "wet")).toBe(1500);
    expect(adjustedArea(1500, "preaction")).toBe(1500);
    // EH1's 2500 ft² dry: 1.3 × 2500 = 3250 ft²
    expect(adjustedArea(2500, "dry")).toBeCloseTo(3250, 9);
  });

  it("keeps the unit of the area it is given", () => {
    // 139.355 m² (1500 ft²) dry: 1.3 × 139.355 = 181.1615 m², which is 1950 ft² × 0.09290304
    expect(adjustedArea(139.355, "dry")).toBeCloseTo(181.1615, 9);
  });

  it("an unknown system lists the systems; an area that is not positive is an error", () => {
    expect(errorOf(() => adjustedArea(1500, "foam" as never)).message).toBe(
      'system: got "foam"; must be one of "wet", "preaction", "dry", "double interlock"',
    );
    expect(errorOf(() => adjustedArea(0, "dry")).message).toBe("area: got 0; must be greater than 0");
    expect(errorOf(() => adjustedArea(Number.NaN, "dry")).message).toBe("area: got NaN; must be greater than 0");
    expect(errorOf(() => adjustedArea(Infinity, "wet")).message).toBe("area: got Infinity; must be greater than 0");
  });
});
