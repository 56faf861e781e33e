import { describe, expect, it } from "vitest";
import { errorOf } from "./engineError";
import {
  SCHEDULE_CODES,
  c900InternalDiameter,
  dnOfNominal,
  findPipeSize,
  internalDiameter,
  listSizes,
  nominalLabel,
  nominalOfDn,
  scheduleInfo,
  scheduleSizes,
} from "../../src/engine/pipes";


describe("pipe schedules", () => {
  it("lists the eight schedule codes of the vocabulary", () => {
    expect(SCHEDULE_CODES).toEqual(["10", "40", "CPVC", "K", "L", "M", "DR14", "DR18"]);
  });

  it("gives each schedule's sizes in ascending order with growing internal diameters", () => {
    for (const s of SCHEDULE_CODES) {
      const sizes = scheduleSizes(s);
      expect(sizes.length).toBeGreaterThan(0);
      for (let i = 1; i < sizes.length; i++) {
        expect(sizes[i].nominal).toBeGreaterThan(sizes[i - 1].nominal);
        expect(sizes[i].id).toBeGreaterThan(sizes[i - 1].id);
      }
    }
  });

  it("has the sizes each schedule's standard gives", () => {
    const steel = [0.75, 1, 1.25, 1.5, 2, 2.5, 3, 3.5, 4, 5, 6, 8, 10, 12]; // [ASME B36.10M]
    expect(scheduleSizes("10").map((s) => s.nominal)).toEqual(steel);
    expect(scheduleSizes("40").map((s) => s.nominal)).toEqual(steel);
    expect(scheduleSizes("CPVC").map((s) => s.nominal)).toEqual([0.75, 1, 1.25, 1.5, 2, 2.5, 3]); // [ASTM F442] (from memory)
    for (const t of ["K", "L", "M"] as const) {
      expect(scheduleSizes(t).map((s) => s.nominal)).toEqual([0.75, 1, 1.25, 1.5, 2, 2.5, 3, 4]); // [ASTM B88] (from memory)
    }
    for (const t of ["DR14", "DR18"] as const) {
      expect(scheduleSizes(t).map((s) => s.nominal)).toEqual([4, 6, 8, 10, 12]); // [AWWA C900] (from memory)
    }
  });

  it("reads Schedule 10 and 40 diameters from the table", () => {
    expect(internalDiameter(2.5, "10")).toBe(2.635); // [ASME B36.10M]
    expect(internalDiameter(2.5, "40")).toBe(2.469); // [ASME B36.10M]
    expect(internalDiameter(12, "40")).toBe(11.938); // [ASME B36.10M]
  });

  it("derives C900 internal diameters as OD × (1 − 2/DR), the minimum-wall form", () => {
    // 4 in OD 4.80 [AWWA C900] (from memory): DR14 4.80 × 12/14 = 4.11429; DR18 4.80 × 16/18 = 4.26667
    expect(internalDiameter(4, "DR14")).toBeCloseTo(4.114286, 6);
    expect(internalDiameter(4, "DR18")).toBeCloseTo(4.266667, 6);
    // 6 in OD 6.90 [AWWA C900] (from memory): DR14 6.90 × 12/14 = 5.91429
    expect(c900InternalDiameter(6.9, 14)).toBeCloseTo(5.914286, 6);
    // 12 in OD 13.20 [AWWA C900] (from memory): DR18 13.20 × 16/18 = 11.73333
    expect(internalDiameter(12, "DR18")).toBeCloseTo(11.733333, 6);
    expect(() => c900InternalDiameter(6.9, 2)).toThrow(/dimension_ratio: got 2; must be greater than 2/);
    expect(() => c900InternalDiameter(0, 14)).toThrow(/outside_diameter: got 0 in/);
  });

  it("an unknown size lists the sizes of the schedule", () => {
    const e = errorOf(() => internalDiameter(5, "CPVC"));
    expect(e.kind).toBe("value");
    expect(e.message).toBe("nominal: got 5 in; CPVC SDR 13.5 comes in 3/4, 1, 1-1/4, 1-1/2, 2, 2-1/2, 3 (in)");
    expect(findPipeSize(2.25, "40")).toBeUndefined();
  });

  it("an unknown schedule lists the schedule codes", () => {
    const e = errorOf(() => scheduleInfo("80" as never));
    expect(e.message).toBe('schedule: got "80"; must be one of "10", "40", "CPVC", "K", "L", "M", "DR14", "DR18"');
  });

  it("names each schedule and its source", () => {
    expect(scheduleInfo("10").source).toBe("[ASME B36.10M]");
    expect(scheduleInfo("CPVC").source).toMatch(/\[ASTM F442\] \(from memory\)/);
    expect(scheduleInfo("L").source).toMatch(/\[ASTM B88\] \(from memory\)/);
    expect(scheduleInfo("DR14").source).toMatch(/\[AWWA C900\] \(from memory\).*1 − 2\/14/);
  });
});

describe("nominal labels and DN", () => {
  it("writes sizes as the trade does", () => {
    expect(nominalLabel(0.75)).toBe("3/4");
    expect(nominalLabel(1.25)).toBe("1-1/4");
    expect(nominalLabel(2.5)).toBe("2-1/2");
    expect(nominalLabel(3.5)).toBe("3-1/2");
    expect(nominalLabel(8)).toBe("8");
    expect(listSizes("DR14")).toBe("4, 6, 8, 10, 12");
    expect(listSizes("DR14", true)).toBe("100, 150, 200, 250, 300");
  });

  it("maps NPS to DN both ways", () => {
    // [ASME B36.10M] DN designators (from memory)
    const pairs: [number, number][] = [
      [0.75, 20], [1, 25], [1.25, 32], [1.5, 40], [2, 50], [2.5, 65], [3, 80],
      [3.5, 90], [4, 100], [5, 125], [6, 150], [8, 200], [10, 250], [12, 300],
    ];
    for (const [nps, dn] of pairs) {
      expect(dnOfNominal(nps)).toBe(dn);
      expect(nominalOfDn(dn)).toBe(nps);
    }
    expect(nominalOfDn(55)).toBeUndefined();
    expect(dnOfNominal(2.25)).toBeUndefined();
  });
});
