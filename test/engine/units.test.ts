import { describe, expect, it } from "vitest";
import * as math from "mathjs";
import {
  BARM_PER_PSIFT,
  BAR_PER_PSI,
  KSI_PER_KUS,
  L_PER_GAL,
  M2_PER_FT2,
  MMMIN_PER_GPMFT2,
  MM_PER_IN,
  M_PER_FT,
  PSI_PER_FT_WATER,
  fromUS,
  toUS,
} from "../../src/engine/units";

const via = (value: number, from: string, to: string) => math.unit(value, from).toNumber(to);

describe("every US↔SI constant, confirmed by mathjs", () => {
  it("gallon, psi, inch, foot, square foot (mathjs)", () => {
    expect(L_PER_GAL).toBeCloseTo(via(1, "gal", "L"), 12);
    expect(BAR_PER_PSI / via(1, "psi", "bar")).toBeCloseTo(1, 9);
    expect(MM_PER_IN).toBeCloseTo(via(1, "in", "mm"), 12);
    expect(M_PER_FT).toBeCloseTo(via(1, "ft", "m"), 12);
    expect(M2_PER_FT2).toBeCloseTo(via(1, "ft^2", "m^2"), 12);
  });
  it("density gpm/ft² ↔ mm/min (mathjs); 40.746 as [NFPA 13] gives it", () => {
    expect(MMMIN_PER_GPMFT2).toBeCloseTo(via(1, "gal/min/ft^2", "mm/min"), 9);
    expect(MMMIN_PER_GPMFT2).toBeCloseTo(40.746, 3);
  });
  it("K-factor gpm/psi^0.5 ↔ L/min/bar^0.5 (mathjs); K_SI ≈ 14.4 K_US [NFPA 13]", () => {
    const fromMath = via(1, "gal/min", "L/min") / Math.sqrt(via(1, "psi", "bar"));
    expect(KSI_PER_KUS / fromMath).toBeCloseTo(1, 9);
    expect(KSI_PER_KUS).toBeCloseTo(14.4, 1);
    // K 5.6 US ≈ K 80 metric, K 8.0 ≈ K 115 (common practice)
    expect(5.6 * KSI_PER_KUS).toBeCloseTo(80.7, 1);
    expect(8.0 * KSI_PER_KUS).toBeCloseTo(115.3, 1);
  });
  it("friction rate psi/ft ↔ bar/m (mathjs)", () => {
    expect(BARM_PER_PSIFT / (via(1, "psi", "bar") / via(1, "ft", "m"))).toBeCloseTo(1, 9);
  });
  it("0.433 psi lifts water one foot [NFPA 13]; that is 0.098 bar per m [NFPA 13] (mathjs for the conversion)", () => {
    // ρ g h for 1 ft of water at about 15 °C: 999.1 kg/m³ × 9.80665 m/s² × 0.3048 m = 2986 Pa = 0.4331 psi (mathjs)
    expect(via(999.1 * 9.80665 * 0.3048, "Pa", "psi")).toBeCloseTo(PSI_PER_FT_WATER, 3);
    expect(fromUS("pressure", PSI_PER_FT_WATER, "SI") / M_PER_FT).toBeCloseTo(0.098, 3);
  });
  it("toUS and fromUS are inverses", () => {
    for (const q of ["flow", "pressure", "diameter", "length", "area", "density", "kfactor"] as const) {
      expect(toUS(q, fromUS(q, 123.456, "SI"), "SI")).toBeCloseTo(123.456, 10);
      expect(fromUS(q, 5, "US")).toBe(5);
    }
  });
});

describe("conversions never hand out -0", () => {
  it("a zero of either sign converts to +0 in US and SI work", () => {
    // ELEVATION(-0) and VELOCITY(-0, 4) gave -0: a -0 argument went through the arithmetic and out unchanged
    for (const q of ["flow", "pressure", "length", "velocity"] as const) {
      for (const u of ["US", "SI"] as const) {
        expect(Object.is(fromUS(q, -0, u), 0), `fromUS ${q} ${u}`).toBe(true);
        expect(Object.is(toUS(q, -0, u), 0), `toUS ${q} ${u}`).toBe(true);
      }
    }
  });
  it("a tiny negative that underflows in the conversion gives +0", () => {
    // ELEVATION(-2.5E-323, "SI") gave -0: -8.2e-323 ft × 0.433 psi/ft = -3.5e-323 psi; × 0.0689 bar/psi underflows
    // to -0 (the smallest double is 4.9e-324)
    expect(Object.is(fromUS("pressure", -3.5e-323, "SI"), 0)).toBe(true);
    expect(Object.is(toUS("pressure", -1e-323, "SI"), -1e-323 / BAR_PER_PSI)).toBe(true); // no underflow: kept
  });
});
