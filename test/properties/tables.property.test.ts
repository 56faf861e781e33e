/**
 * Properties of the trade-table functions: every size of every schedule reads back a positive diameter; unknown
 * codes, sizes and nonsense give an error with a message; FITTINGS is the sum of its FITTINGLENGTHs; equivalent
 * lengths move with C as (C/120)^1.85 [NFPA 13]; density falls along each curve [NFPA 13]; the adjusted design area is
 * the area or 1.3 × it [NFPA 13] (from memory); SI equals converted US.
 */
import { describe, expect } from "vitest";
import { fc, test } from "@fast-check/vitest";
import * as f from "../../src/functions/functions";
import { SCHEDULE_CODES, scheduleSizes } from "../../src/engine/pipes";
import { FITTING_CODES, fittingSizes } from "../../src/engine/fittings";
import { AREA_SYSTEM_CODES, DRY_AREA_FACTOR, HAZARD_CODES, areaSpan } from "../../src/engine/design";
import { MATERIAL_CODES } from "../../src/engine/cfactor";
import { M2_PER_FT2, MMMIN_PER_GPMFT2, MM_PER_IN, M_PER_FT } from "../../src/engine/units";
import { BLANKS, NOT_NUMBERS, givesError } from "./arbitraries";

const RUNS = { numRuns: 200 };
const NONSENSE: unknown[] = [...NOT_NUMBERS, "xyz", "2-1/2-3", "¼", 7, 0, -2, 13, 99];

const sizeOf = fc.constantFrom(...SCHEDULE_CODES).chain((s) => fc.constantFrom(...scheduleSizes(s)).map((p) => ({ s, p })));
const fittingAt = fc.constantFrom(...FITTING_CODES).chain((code) => fc.constantFrom(...fittingSizes(code)).map((n) => ({ code, n })));
const cFactor = fc.double({ min: 60, max: 150, noNaN: true });

describe("trade tables: valid inputs", () => {
  test.prop([sizeOf], RUNS)("PIPEID gives a positive diameter below the nominal size + 1 in, and SI is DN in mm", ({ s, p }) => {
    const d = f.pipeid(p.nominal, s);
    expect(d > 0 && d < p.nominal + 1).toBe(true);
    expect(f.pipeid(p.dn, s, "SI")).toBeCloseTo(d * MM_PER_IN, 9);
  });
  test.prop([fittingAt, cFactor], RUNS)("FITTINGLENGTH scales as (C/120)^1.85 [NFPA 13]", ({ code, n }, c) => {
    expect(f.fittinglength(code, n, c)).toBeCloseTo(f.fittinglength(code, n, 120) * (c / 120) ** 1.85, 9);
  });
  test.prop([fc.array(fittingAt.map((x) => x.code), { minLength: 1, maxLength: 6 }), fc.constantFrom(2, 2.5, 3, 4, 5, 6, 8, 10, 12)], RUNS)(
    "FITTINGS is the sum of its FITTINGLENGTHs",
    (codes, n) => {
      const known = codes.filter((c) => fittingSizes(c).includes(n));
      if (known.length === 0) return;
      const sum = known.reduce((acc, c) => acc + f.fittinglength(c, n), 0);
      expect(f.fittings(known.join(" "), n)).toBeCloseTo(sum, 9);
      expect(f.fittings(known.join(", "), n, null, null, null)).toBeCloseTo(sum, 9);
    },
  );
  test.prop([fittingAt], RUNS)("FITTINGLENGTH in SI equals the converted US result", ({ code, n }) => {
    const dn = scheduleSizes("40").find((p) => p.nominal === n)!.dn;
    expect(f.fittinglength(code, dn, null, null, "SI")).toBeCloseTo(f.fittinglength(code, n) * M_PER_FT, 9);
  });
  test.prop([fc.constantFrom(...HAZARD_CODES), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })], RUNS)(
    "DESIGNDENSITY falls as the area grows along the curve [NFPA 13], and SI equals converted US",
    (h, a, b) => {
      const { min, max } = areaSpan(h);
      const [lo, hi] = (a < b ? [a, b] : [b, a]).map((x) => min + x * (max - min));
      expect(f.designdensity(h, hi)).toBeLessThanOrEqual(f.designdensity(h, lo) + 1e-12);
      expect(f.designdensity(h, lo * M2_PER_FT2, "SI")).toBeCloseTo(f.designdensity(h, lo) * MMMIN_PER_GPMFT2, 9);
    },
  );
  test.prop([fc.double({ min: 1, max: 1_000_000, noNaN: true }), fc.constantFrom(...AREA_SYSTEM_CODES)], RUNS)(
    "ADJUSTAREA is the area × 1 or × 1.3, whatever the unit of area [NFPA 13] (from memory)",
    (a, s) => {
      const adjusted = f.adjustarea(a, s);
      const factor = s === "dry" || s === "double interlock" ? DRY_AREA_FACTOR : 1;
      expect(adjusted).toBeCloseTo(a * factor, 6);
      expect(f.adjustarea(a * M2_PER_FT2, s) / M2_PER_FT2).toBeCloseTo(adjusted, 6); // m² in, m² out
      expect(typeof f.cfactor("steel", s)).toBe("number"); // one system cell can feed both
    },
  );
  test.prop([fc.constantFrom(...MATERIAL_CODES), fc.constantFrom("wet", "dry", null)], RUNS)("CFACTOR is 100 to 150 [NFPA 13]", (m, s) => {
    const c = f.cfactor(m, s);
    expect(c >= 100 && c <= 150).toBe(true);
  });
});

describe("trade tables: invalid inputs give an error with a message, never a number", () => {
  test.prop([fc.constantFrom(...NONSENSE, ...BLANKS)], RUNS)("PIPEID nominal", (bad) => {
    expect(givesError(() => f.pipeid(bad))).toBe(true);
  });
  test.prop([fc.constantFrom(...NOT_NUMBERS, "20", "sch 80", "XL", 80)], RUNS)("PIPEID schedule", (bad) => {
    expect(givesError(() => f.pipeid(2, bad))).toBe(true);
  });
  test.prop([fc.constantFrom(...NOT_NUMBERS, ...BLANKS, "wood", "iron pipe", 120)], RUNS)("CFACTOR material", (bad) => {
    expect(givesError(() => f.cfactor(bad))).toBe(true);
  });
  test.prop([fc.constantFrom(...NOT_NUMBERS, "damp", "foam")], RUNS)("CFACTOR system", (bad) => {
    expect(givesError(() => f.cfactor("steel", bad))).toBe(true);
  });
  test.prop([fc.constantFrom(...NOT_NUMBERS, ...BLANKS, "damp", "foam", "interlock", "triple interlock", 1.3)], RUNS)("ADJUSTAREA system", (bad) => {
    expect(givesError(() => f.adjustarea(1500, bad))).toBe(true);
  });
  test.prop([fc.constantFrom(...NOT_NUMBERS, ...BLANKS, 0, -1500, 2e6)], RUNS)("ADJUSTAREA area", (bad) => {
    expect(givesError(() => f.adjustarea(bad, "dry"))).toBe(true);
  });
  test.prop([fc.constantFrom(...NOT_NUMBERS, ...BLANKS, "elbw", "3X", "E E Q", "0E", "-1T", "2E, -1T")], RUNS)("FITTINGS list", (bad) => {
    expect(givesError(() => f.fittings(bad, 4))).toBe(true);
  });
  test.prop([fc.constantFrom(...NOT_NUMBERS, 0, -120, 500)], RUNS)("FITTINGLENGTH c_factor", (bad) => {
    expect(givesError(() => f.fittinglength("E", 4, bad))).toBe(true);
  });
  test.prop([fc.constantFrom(...NOT_NUMBERS, ...BLANKS, "OH3", "medium", 2)], RUNS)("hazard codes", (bad) => {
    expect(givesError(() => f.designdensity(bad))).toBe(true);
    expect(givesError(() => f.designarea(bad))).toBe(true);
    expect(givesError(() => f.hoseallowance(bad))).toBe(true);
    expect(givesError(() => f.duration(bad))).toBe(true);
  });
  // areas within AREA_SPAN_SLACK (0.5 %) of an end read as that end; these lie beyond it
  test.prop([fc.constantFrom(...NOT_NUMBERS, 100, 1490, 4100, 1e9, -1500)], RUNS)("DESIGNDENSITY area off the OH1 curve", (bad) => {
    expect(givesError(() => f.designdensity("OH1", bad))).toBe(true);
  });
  test.prop([fc.constantFrom("both", "middle", 1, true)], RUNS)("HOSEALLOWANCE part and DURATION bound", (bad) => {
    expect(givesError(() => f.hoseallowance("LH", bad))).toBe(true);
    expect(givesError(() => f.duration("LH", bad))).toBe(true);
  });
  test("a butterfly valve at 1 in is a missing table entry, #N/A [NFPA 13] (from memory)", () => {
    let code = "";
    try {
      f.fittinglength("BV", 1);
    } catch (e) {
      code = (e as { code: string }).code;
    }
    expect(code).toBe("#N/A");
  });
});
