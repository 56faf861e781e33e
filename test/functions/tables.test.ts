/**
 * The trade-table cell functions: PIPEID, CFACTOR, FITTINGLENGTH, FITTINGS, DESIGNDENSITY, DESIGNAREA, ADJUSTAREA,
 * HOSEALLOWANCE, DURATION. Every table value of the engine is read here through a cell function and checked against
 * the value written out below, with its source mark beside it (the sources: docs/references.md).
 */
import { describe, expect, it } from "vitest";
import * as f from "../../src/functions/functions";
import { L_PER_GAL, M2_PER_FT2, MMMIN_PER_GPMFT2, MM_PER_IN, M_PER_FT } from "../../src/engine/units";
import { errorOf } from "./errors";

const NPS = [0.75, 1, 1.25, 1.5, 2, 2.5, 3, 3.5, 4, 5, 6, 8, 10, 12];

// ─── PIPEID ─────────────────────────────────────────────────────────────────────────────────────────────────────

/** Internal diameters, in, as the pipe standards give them. */
const PIPE_IDS: Record<string, [number, number][]> = {
  // [ASME B36.10M]
  "10": [[0.75, 0.884], [1, 1.097], [1.25, 1.442], [1.5, 1.682], [2, 2.157], [2.5, 2.635], [3, 3.26], [3.5, 3.76], [4, 4.26], [5, 5.295], [6, 6.357], [8, 8.329], [10, 10.42], [12, 12.39]],
  // [ASME B36.10M]
  "40": [[0.75, 0.824], [1, 1.049], [1.25, 1.38], [1.5, 1.61], [2, 2.067], [2.5, 2.469], [3, 3.068], [3.5, 3.548], [4, 4.026], [5, 5.047], [6, 6.065], [8, 7.981], [10, 10.02], [12, 11.938]],
  // [ASTM F442] (from memory)
  CPVC: [[0.75, 0.874], [1, 1.101], [1.25, 1.394], [1.5, 1.598], [2, 2.003], [2.5, 2.423], [3, 2.952]],
  // [ASTM B88] (from memory)
  K: [[0.75, 0.745], [1, 0.995], [1.25, 1.245], [1.5, 1.481], [2, 1.959], [2.5, 2.435], [3, 2.907], [4, 3.857]],
  // [ASTM B88] (from memory)
  L: [[0.75, 0.785], [1, 1.025], [1.25, 1.265], [1.5, 1.505], [2, 1.985], [2.5, 2.465], [3, 2.945], [4, 3.905]],
  // [ASTM B88] (from memory)
  M: [[0.75, 0.811], [1, 1.055], [1.25, 1.291], [1.5, 1.527], [2, 2.009], [2.5, 2.495], [3, 2.981], [4, 3.935]],
};

/** C900 outside diameters, in [AWWA C900] (from memory); ID = OD × (1 − 2/DR). */
const C900_OD: [number, number][] = [[4, 4.8], [6, 6.9], [8, 9.05], [10, 11.1], [12, 13.2]];

describe("PIPEID", () => {
  for (const [schedule, rows] of Object.entries(PIPE_IDS)) {
    it(`reads every size of schedule ${schedule}`, () => {
      for (const [nps, id] of rows) expect(f.pipeid(nps, schedule), `${schedule} ${nps}`).toBe(id);
    });
  }

  it("derives DR14 and DR18 from the C900 outside diameters", () => {
    for (const [nps, od] of C900_OD) {
      expect(f.pipeid(nps, "DR14")).toBeCloseTo(od * (1 - 2 / 14), 10); // [AWWA C900] (from memory)
      expect(f.pipeid(nps, "DR18")).toBeCloseTo(od * (1 - 2 / 18), 10); // [AWWA C900] (from memory)
    }
    // by hand: 8 in DR18, 9.05 × 16/18 = 8.04444 in
    expect(f.pipeid(8, "DR18")).toBeCloseTo(8.04444, 5);
  });

  it("defaults to Schedule 40", () => {
    expect(f.pipeid(2)).toBe(2.067); // [ASME B36.10M]
    expect(f.pipeid(2, null, null)).toBe(2.067); // [ASME B36.10M]
  });

  it("takes a nominal size in every form users type", () => {
    // 2-1/2 Schedule 10 = 2.635 in [ASME B36.10M]
    for (const form of [2.5, "2.5", "2-1/2", "2 1/2", "2½", " 2 - 1/2 ", '2-1/2"', "2 1/2 in", "NPS 2-1/2", "DN65", "dn 65"]) {
      expect(f.pipeid(form, "10"), String(form)).toBe(2.635);
    }
    // 3/4 Schedule 40 = 0.824 in [ASME B36.10M]
    for (const form of [0.75, "0.75", ".75", "3/4", "¾"]) expect(f.pipeid(form, "40"), String(form)).toBe(0.824);
    // 1-1/4 Schedule 40 = 1.380 in [ASME B36.10M]
    for (const form of [1.25, "1-1/4", "1 1/4", "1¼"]) expect(f.pipeid(form), String(form)).toBe(1.38);
    expect(f.pipeid("2", "40")).toBe(2.067); // [ASME B36.10M]
  });

  it("in SI takes the DN and returns mm", () => {
    // [ASME B36.10M] DN designators (from memory) with [ASME B36.10M] IDs × 25.4 mm/in
    const dn = [20, 25, 32, 40, 50, 65, 80, 90, 100, 125, 150, 200, 250, 300];
    dn.forEach((d, i) => {
      expect(f.pipeid(d, "40", "SI"), `DN ${d}`).toBeCloseTo(PIPE_IDS["40"][i][1] * MM_PER_IN, 9);
      expect(f.pipeid(String(d), "10", "SI"), `DN ${d}`).toBeCloseTo(PIPE_IDS["10"][i][1] * MM_PER_IN, 9);
    });
    expect(f.pipeid(65, "10", "SI")).toBeCloseTo(66.929, 3); // 2.635 in × 25.4 = 66.929 mm [ASME B36.10M]
    expect(f.pipeid("DN 100", "DR14", "si")).toBeCloseTo(4.8 * (12 / 14) * 25.4, 9); // [AWWA C900] (from memory)
  });

  it("accepts the schedules' plain names", () => {
    expect(f.pipeid(2, 40)).toBe(2.067); // [ASME B36.10M]
    expect(f.pipeid(2, 10)).toBe(2.157); // [ASME B36.10M]
    expect(f.pipeid(2, "Sch 10")).toBe(2.157); // [ASME B36.10M]
    expect(f.pipeid(2, "schedule 40")).toBe(2.067); // [ASME B36.10M]
    expect(f.pipeid(2, "Sch. 40")).toBe(2.067); // [ASME B36.10M]
    expect(f.pipeid(2, "cpvc")).toBe(2.003); // [ASTM F442] (from memory)
    expect(f.pipeid(2, "SDR 13.5")).toBe(2.003); // [ASTM F442] (from memory)
    expect(f.pipeid(2, "type l")).toBe(1.985); // [ASTM B88] (from memory)
    expect(f.pipeid(2, "k")).toBe(1.959); // [ASTM B88] (from memory)
    expect(f.pipeid(6, "dr 18")).toBeCloseTo(6.9 * (16 / 18), 10); // [AWWA C900] (from memory)
    expect(f.pipeid(6, "C900 DR14")).toBeCloseTo(6.9 * (12 / 14), 10); // [AWWA C900] (from memory)
  });

  it("an unknown size lists what the schedule has", () => {
    let e = errorOf(() => f.pipeid("2-1/4"));
    expect(e.code).toBe("#VALUE!");
    expect(e.message).toBe('nominal: got "2-1/4"; Schedule 40 steel comes in 3/4, 1, 1-1/4, 1-1/2, 2, 2-1/2, 3, 3-1/2, 4, 5, 6, 8, 10, 12 in');
    e = errorOf(() => f.pipeid(4, "CPVC"));
    expect(e.message).toBe("nominal: got 4; CPVC SDR 13.5 comes in 3/4, 1, 1-1/4, 1-1/2, 2, 2-1/2, 3 in");
    e = errorOf(() => f.pipeid(3.5, "K"));
    expect(e.message).toBe("nominal: got 3.5; copper tube Type K comes in 3/4, 1, 1-1/4, 1-1/2, 2, 2-1/2, 3, 4 in");
    e = errorOf(() => f.pipeid(2, "DR14"));
    expect(e.message).toBe("nominal: got 2; PVC C900 DR14 comes in 4, 6, 8, 10, 12 in");
  });

  it("in SI an unknown DN lists the DNs of the schedule", () => {
    let e = errorOf(() => f.pipeid(55, "40", "SI"));
    expect(e.code).toBe("#VALUE!");
    expect(e.message).toBe("nominal: got 55; in SI a nominal size is a DN: Schedule 40 steel comes in DN 20, 25, 32, 40, 50, 65, 80, 90, 100, 125, 150, 200, 250, 300");
    e = errorOf(() => f.pipeid(2, "40", "SI"));
    expect(e.message).toMatch(/^nominal: got 2; in SI a nominal size is a DN: Schedule 40 steel comes in DN 20, 25/);
    e = errorOf(() => f.pipeid(100, "CPVC", "SI"));
    expect(e.message).toBe("nominal: got 100; in SI a nominal size is a DN: CPVC SDR 13.5 comes in DN 20, 25, 32, 40, 50, 65, 80");
    e = errorOf(() => f.pipeid("2-1/2", "40", "SI"));
    expect(e.message).toMatch(/^nominal: got "2-1\/2"; in SI a nominal size is a DN \(or type it as "DN65"\)/);
    e = errorOf(() => f.pipeid("DN 55", "40"));
    expect(e.message).toMatch(/^nominal: got "DN 55"; Schedule 40 steel comes in DN 20, 25/);
  });

  it("a DN typed in US work says how to mean it", () => {
    const e = errorOf(() => f.pipeid(50));
    expect(e.message).toBe(
      'nominal: got 50; Schedule 40 steel comes in 3/4, 1, 1-1/4, 1-1/2, 2, 2-1/2, 3, 3-1/2, 4, 5, 6, 8, 10, 12 in; for DN 50 type "DN50" or set units to "SI"',
    );
  });

  it("a value that is no size at all is #VALUE! saying what to type", () => {
    expect(errorOf(() => f.pipeid("two")).message).toMatch(/^nominal: got "two"; must be a nominal size such as 2, 2\.5, "2-1\/2" or "2½"; Schedule 40/);
    expect(errorOf(() => f.pipeid(null)).message).toMatch(/^nominal is empty: type a nominal size; Schedule 40 steel comes in 3\/4/);
    expect(errorOf(() => f.pipeid(true)).message).toMatch(/^nominal: got TRUE; must be a nominal size/);
    expect(errorOf(() => f.pipeid([[2]])).message).toBe("nominal: got a range; must be a single nominal size");
    expect(errorOf(() => f.pipeid("1/0")).code).toBe("#VALUE!");
  });

  it("an unknown schedule lists the schedule codes", () => {
    const e = errorOf(() => f.pipeid(2, "80"));
    expect(e.code).toBe("#VALUE!");
    expect(e.message).toBe('schedule: got "80"; must be one of "10", "40", "CPVC", "K", "L", "M", "DR14", "DR18"');
    expect(errorOf(() => f.pipeid(2, 80)).message).toBe('schedule: got 80; must be one of "10", "40", "CPVC", "K", "L", "M", "DR14", "DR18"');
  });

  it("a bad units argument is an error", () => {
    expect(errorOf(() => f.pipeid(2, "40", "metric-ish")).message).toMatch(/^units: got "metric-ish"/);
  });
});

// ─── CFACTOR ────────────────────────────────────────────────────────────────────────────────────────────────────

describe("CFACTOR", () => {
  it("reads the C table for every material, wet and dry", () => {
    const table: [string, number, number][] = [
      ["steel", 120, 100], // [NFPA 13] black steel
      ["galvanized", 120, 100], // [NFPA 13] galvanized steel
      ["plastic", 150, 150], // [NFPA 13] plastic (listed), all
      ["cpvc", 150, 150], // [NFPA 13] plastic (listed), all
      ["copper", 150, 150], // [NFPA 13] copper tube, brass or stainless steel
      ["stainless", 150, 150], // [NFPA 13] copper tube, brass or stainless steel
      ["brass", 150, 150], // [NFPA 13] copper tube, brass or stainless steel
      ["ductile", 100, 100], // [NFPA 13] unlined cast or ductile iron
      ["cast", 100, 100], // [NFPA 13] unlined cast or ductile iron
      ["lined ductile", 140, 140], // [NFPA 13] cement-lined cast or ductile iron
      ["asbestos cement", 140, 140], // [NFPA 13] asbestos cement
      ["concrete", 140, 140], // [NFPA 13] concrete
    ];
    for (const [m, wet, dry] of table) {
      expect(f.cfactor(m, "wet"), `${m} wet`).toBe(wet);
      expect(f.cfactor(m, "dry"), `${m} dry`).toBe(dry);
      expect(f.cfactor(m), `${m} default wet`).toBe(wet);
    }
  });

  it("deluge reads as wet and preaction as dry, as the table says", () => {
    expect(f.cfactor("steel", "deluge")).toBe(120); // [NFPA 13] wet (incl. deluge)
    expect(f.cfactor("steel", "preaction")).toBe(100); // [NFPA 13] dry (incl. preaction)
    expect(f.cfactor("galvanized", "Pre-action")).toBe(100); // [NFPA 13]
    expect(f.cfactor("steel", "DRY")).toBe(100); // [NFPA 13]
    expect(f.cfactor("steel", "wet pipe")).toBe(120); // [NFPA 13]
  });

  it("accepts plain-word materials", () => {
    expect(f.cfactor("Black")).toBe(120); // [NFPA 13] black steel
    expect(f.cfactor("black steel", "dry")).toBe(100); // [NFPA 13]
    expect(f.cfactor("Galvanised", "dry")).toBe(100); // [NFPA 13]
    expect(f.cfactor("CPVC")).toBe(150); // [NFPA 13] plastic
    expect(f.cfactor("PVC")).toBe(150); // [NFPA 13] plastic
    expect(f.cfactor("stainless steel")).toBe(150); // [NFPA 13]
    expect(f.cfactor("ductile iron")).toBe(100); // [NFPA 13] unlined
    expect(f.cfactor("cast iron")).toBe(100); // [NFPA 13] unlined
    expect(f.cfactor("cement-lined")).toBe(140); // [NFPA 13] cement-lined
    expect(f.cfactor("Cement-lined ductile iron")).toBe(140); // [NFPA 13]
    expect(f.cfactor("cement lined cast iron")).toBe(140); // [NFPA 13]
    expect(f.cfactor("  Asbestos  Cement ")).toBe(140); // [NFPA 13]
    expect(f.cfactor("asbestos-cement")).toBe(140); // [NFPA 13]
  });

  it("unknown materials and systems list what is accepted", () => {
    let e = errorOf(() => f.cfactor("wood"));
    expect(e.code).toBe("#VALUE!");
    expect(e.message).toBe(
      'material: got "wood"; must be one of "steel", "galvanized", "plastic", "cpvc", "copper", "stainless", "brass", "ductile", "cast", "lined ductile", "asbestos cement", "concrete"',
    );
    e = errorOf(() => f.cfactor("steel", "foam"));
    expect(e.message).toBe('system: got "foam"; must be one of "wet", "dry"');
    expect(errorOf(() => f.cfactor(null)).message).toMatch(/^material is empty: type one of "steel"/);
    expect(errorOf(() => f.cfactor(120)).message).toMatch(/^material: got 120; must be one of/);
  });
});

// ─── FITTINGLENGTH ──────────────────────────────────────────────────────────────────────────────────────────────

/** ft of Schedule 40 steel at C 120; null = "–" (no value). [NFPA 13] equivalent length chart (from memory) */
const CHART: Record<string, (number | null)[]> = {
  //     ¾     1     1¼    1½    2  2½  3   3½    4   5   6   8   10  12
  EE: [1, 1, 1, 2, 2, 3, 3, 3, 4, 5, 7, 9, 11, 13], // [NFPA 13] (from memory)
  E: [2, 2, 3, 4, 5, 6, 7, 8, 10, 12, 14, 18, 22, 27], // [NFPA 13] (from memory)
  LtE: [1, 2, 2, 2, 3, 4, 5, 5, 6, 8, 9, 13, 16, 18], // [NFPA 13] (from memory)
  T: [4, 5, 6, 8, 10, 12, 15, 17, 20, 25, 30, 35, 50, 60], // [NFPA 13] (from memory; ¾ in: two recollections give 4)
  BV: [null, null, null, null, 6, 7, 10, null, 12, 9, 10, 12, 19, 21], // [NFPA 13] (from memory)
  GV: [null, null, null, null, 1, 1, 1, 1, 2, 2, 3, 4, 5, 6], // [NFPA 13] (from memory)
  CV: [null, 5, 7, 9, 11, 14, 16, 19, 22, 27, 32, 45, 55, 65], // [NFPA 13] (from memory)
};

describe("FITTINGLENGTH", () => {
  for (const [code, row] of Object.entries(CHART)) {
    it(`reads every column of ${code}, gaps as #N/A`, () => {
      row.forEach((ft, i) => {
        if (ft === null) {
          const e = errorOf(() => f.fittinglength(code, NPS[i]));
          expect(e.code, `${code} ${NPS[i]}`).toBe("#N/A");
          expect(e.message).toMatch(/^nominal: got [\d.]+ in; the equivalent length table has no .* \(\w+\) at this size, only at /);
        } else {
          expect(f.fittinglength(code, NPS[i]), `${code} ${NPS[i]}`).toBe(ft);
        }
      });
    });
  }

  it("the gap message names the fitting and where the chart has it", () => {
    const e = errorOf(() => f.fittinglength("BV", "3-1/2"));
    expect(e.code).toBe("#N/A");
    expect(e.message).toBe("nominal: got 3.5 in; the equivalent length table has no butterfly valve (BV) at this size, only at 2, 2-1/2, 3, 4, 5, 6, 8, 10, 12 in");
  });

  it("applies the C adjustment (C/120)^1.85", () => {
    // 6 in tee 30 ft [NFPA 13] (from memory); C 100 → × 0.713, C 150 → × 1.51 [NFPA 13] adjustment table
    expect(f.fittinglength("T", 6, 100)).toBeCloseTo(30 * (100 / 120) ** 1.85, 10);
    expect(Math.abs(f.fittinglength("T", 6, 100) - 30 * 0.713)).toBeLessThan(0.03); // 30 × 0.71370 = 21.41
    expect(Math.abs(f.fittinglength("T", 6, 150) - 30 * 1.51)).toBeLessThan(0.05); // 30 × 1.51107 = 45.33
    expect(f.fittinglength("E", 4, 140)).toBeCloseTo(10 * 1.33, 2); // 10 × 1.32999 [NFPA 13]
    expect(f.fittinglength("E", 4, 130)).toBeCloseTo(10 * 1.1596, 3); // 10 × (130/120)^1.85 = 11.596
  });

  it("applies the internal-diameter adjustment (d/d_sch40)^4.87 for the schedule given", () => {
    // 2-1/2 tee in Schedule 10: 12 [NFPA 13] (from memory) × (2.635 / 2.469)^4.87 [ASME B36.10M] = 12 × 1.37285 = 16.474
    expect(f.fittinglength("T", "2-1/2", 120, "10")).toBeCloseTo(16.474, 3);
    // 1 in elbow in copper Type M: 2 × (1.055 [ASTM B88] (from memory) / 1.049)^4.87 = 2 × 1.02818 = 2.0564
    expect(f.fittinglength("E", 1, 150, "M")).toBeCloseTo(2 * 1.5110663 * (1.055 / 1.049) ** 4.87, 6);
    // 6 in gate in C900 DR18: 3 × (6.9 × 16/18 / 6.065)^4.87 = 3 × (6.13333 / 6.065)^4.87 = 3 × 1.05604 = 3.168
    expect(f.fittinglength("GV", 6, 120, "DR18")).toBeCloseTo(3 * ((6.9 * 16) / 18 / 6.065) ** 4.87, 10);
    expect(f.fittinglength("GV", 6, 120, "DR18")).toBeCloseTo(3.168, 3);
    // Schedule 40 is the chart's own pipe: no change
    expect(f.fittinglength("CV", 4, 120, "40")).toBe(22); // [NFPA 13] (from memory)
  });

  it("accepts codes and plain words, case-insensitive", () => {
    const at4: [unknown, number][] = [
      ["EE", 4], ["ee", 4], ["45", 4], [45, 4], ["45 elbow", 4], ["45° elbow", 4], // [NFPA 13] (from memory) 45° elbow at 4
      ["E", 10], ["elbow", 10], ["90 elbow", 10], ["Standard Elbow", 10], // 90° standard elbow at 4
      ["LtE", 6], ["LTE", 6], ["long elbow", 6], ["long-turn elbow", 6], ["Long Turn Elbow", 6], // long-turn elbow at 4
      ["T", 20], ["tee", 20], ["cross", 20], ["TEE", 20], // tee or cross at 4
      ["BV", 12], ["butterfly", 12], ["butterfly valve", 12], // butterfly valve at 4
      ["GV", 2], ["gate", 2], ["gate valve", 2], // gate valve at 4
      ["CV", 22], ["check", 22], ["swing check", 22], ["check valve", 22], ["Swing Check Valve", 22], // swing check at 4
    ];
    for (const [fitting, ft] of at4) expect(f.fittinglength(fitting, 4), String(fitting)).toBe(ft);
  });

  it("in SI takes a DN and returns m", () => {
    // DN 100 tee: 20 ft [NFPA 13] (from memory) × 0.3048 = 6.096 m
    expect(f.fittinglength("T", 100, null, null, "SI")).toBeCloseTo(6.096, 10);
    // DN 65 elbow, Schedule 10, C 100: 6 × 0.713698 × (2.635/2.469)^4.87 × 0.3048 m
    expect(f.fittinglength("E", 65, 100, "10", "SI")).toBeCloseTo(6 * (100 / 120) ** 1.85 * (2.635 / 2.469) ** 4.87 * M_PER_FT, 10);
  });

  it("bad fittings, sizes, C and schedules are errors that list what is accepted", () => {
    let e = errorOf(() => f.fittinglength("globe", 4));
    expect(e.code).toBe("#VALUE!");
    expect(e.message).toBe(
      'fitting: got "globe"; must be one of EE (45° elbow, "45"), E (elbow), LtE (long-turn elbow), T (tee, cross), BV (butterfly), GV (gate), CV (check, swing check)',
    );
    e = errorOf(() => f.fittinglength("2E", 4));
    expect(e.message).toBe('fitting: got "2E"; FITTINGLENGTH takes one fitting: use FITTINGS for a list or a count');
    e = errorOf(() => f.fittinglength("E T", 4));
    expect(e.message).toMatch(/FITTINGLENGTH takes one fitting/);
    e = errorOf(() => f.fittinglength("E", 14));
    expect(e.message).toBe("nominal: got 14; Schedule 40 steel comes in 3/4, 1, 1-1/4, 1-1/2, 2, 2-1/2, 3, 3-1/2, 4, 5, 6, 8, 10, 12 in");
    e = errorOf(() => f.fittinglength("E", 4, 120, "CPVC"));
    expect(e.message).toBe("nominal: got 4; CPVC SDR 13.5 comes in 3/4, 1, 1-1/4, 1-1/2, 2, 2-1/2, 3 in");
    e = errorOf(() => f.fittinglength("E", 4, 0));
    expect(e.message).toBe("c_factor: got 0; must be from 10 to 200");
    e = errorOf(() => f.fittinglength("E", 4, 120, "80"));
    expect(e.message).toMatch(/^schedule: got "80"; must be one of "10", "40"/);
    expect(errorOf(() => f.fittinglength(null, 4)).message).toMatch(/^fitting is empty: type one of EE/);
  });
});

// ─── FITTINGS ───────────────────────────────────────────────────────────────────────────────────────────────────

describe("FITTINGS", () => {
  // 2-1/2 in column [NFPA 13] (from memory): EE 3, E 6, LtE 4, T 12, BV 7, GV 1, CV 14
  it("adds a list such as 2E T GV", () => {
    expect(f.fittings("2E T GV", "2-1/2")).toBe(2 * 6 + 12 + 1); // 25
    expect(f.fittings("E, E, T, CV", 2.5)).toBe(6 + 6 + 12 + 14); // 38
    expect(f.fittings("elbow tee check", 2.5)).toBe(6 + 12 + 14); // 32
    expect(f.fittings("2 E", 2.5)).toBe(12);
    expect(f.fittings("2 x E", 2.5)).toBe(12);
    expect(f.fittings("3xT", 2.5)).toBe(36);
    expect(f.fittings("2 elbows, 3 tees", 2.5)).toBe(2 * 6 + 3 * 12); // 48
    expect(f.fittings("45 elbow, long-turn elbow; butterfly + gate", 2.5)).toBe(3 + 4 + 7 + 1); // 15
    expect(f.fittings("swing check and 2 45", 2.5)).toBe(14 + 2 * 3); // 20
    expect(f.fittings("2EE LtE", 2.5)).toBe(2 * 3 + 4); // 10
    expect(f.fittings("cross", 2.5)).toBe(12);
    expect(f.fittings("2 tees", "3/4")).toBe(2 * 4); // ¾ in column [NFPA 13] (from memory): T 4
    expect(f.fittings("E", 2.5)).toBe(6);
  });

  it("applies C and schedule to every fitting", () => {
    // 2-1/2 Schedule 10 at C 120: (6 + 6 + 12 + 1) × (2.635/2.469)^4.87 = 25 × 1.372853 = 34.321 ft
    expect(f.fittings("2E T GV", "2-1/2", 120, "10")).toBeCloseTo(25 * (2.635 / 2.469) ** 4.87, 10);
    expect(f.fittings("2E T GV", "2-1/2", 120, "10")).toBeCloseTo(34.321, 3);
    // same in C 100 galvanized dry: × 0.713698
    expect(f.fittings("2E T GV", "2-1/2", 100, "10")).toBeCloseTo(25 * (100 / 120) ** 1.85 * (2.635 / 2.469) ** 4.87, 10);
  });

  it("in SI takes a DN and returns m", () => {
    expect(f.fittings("2E T GV", 65, null, null, "SI")).toBeCloseTo(25 * M_PER_FT, 10); // 25 ft = 7.62 m
  });

  it("a fitting the chart lacks at that size makes the total #N/A", () => {
    const e = errorOf(() => f.fittings("E T BV", 1.5));
    expect(e.code).toBe("#N/A");
    expect(e.message).toBe("nominal: got 1.5 in; the equivalent length table has no butterfly valve (BV) at this size, only at 2, 2-1/2, 3, 4, 5, 6, 8, 10, 12 in");
  });

  it("a bad token is named along with the accepted codes", () => {
    let e = errorOf(() => f.fittings("2E T XV", 4));
    expect(e.code).toBe("#VALUE!");
    expect(e.message).toBe(
      'list: got "2E T XV"; "XV" is not a fitting; use EE (45° elbow, "45"), E (elbow), LtE (long-turn elbow), T (tee, cross), BV (butterfly), GV (gate), CV (check, swing check), with an optional count ("2E")',
    );
    e = errorOf(() => f.fittings("elbow, globe valve", 4));
    expect(e.message).toMatch(/^list: got "elbow, globe valve"; "globe" is not a fitting; use EE/);
    e = errorOf(() => f.fittings("3Q", 4));
    expect(e.message).toMatch(/^list: got "3Q"; "3Q" is not a fitting/);
    e = errorOf(() => f.fittings("E 2", 4));
    expect(e.message).toMatch(/^list: got "E 2"; the count "2" has no fitting after it; use EE/);
    e = errorOf(() => f.fittings("0E", 4));
    expect(e.message).toBe('list: got "0E"; the count 0 must be a whole number from 1 to 999');
  });

  it("an empty list is an error that says so", () => {
    expect(errorOf(() => f.fittings("", 4)).message).toMatch(/^list is empty: type fittings such as "2E T GV" or "elbow, tee, check"; codes: EE/);
    expect(errorOf(() => f.fittings(null, 4)).message).toMatch(/^list is empty/);
    expect(errorOf(() => f.fittings(" , ; ", 4)).message).toMatch(/^list: got " , ; "; names no fitting/);
    expect(errorOf(() => f.fittings("E", 5.5)).message).toMatch(/^nominal: got 5\.5; Schedule 40 steel comes in/);
  });
});

// ─── DESIGNDENSITY, DESIGNAREA ──────────────────────────────────────────────────────────────────────────────────

/** [NFPA 13] density/area curves (from memory): upper and lower points, gpm/ft² @ ft². */
const CURVES: Record<string, [number, number, number, number]> = {
  LH: [0.1, 1500, 0.07, 3000], // [NFPA 13] (from memory)
  OH1: [0.15, 1500, 0.12, 4000], // [NFPA 13] (from memory)
  OH2: [0.2, 1500, 0.17, 4000], // [NFPA 13] (from memory)
  EH1: [0.3, 2500, 0.28, 5000], // [NFPA 13] (from memory)
  EH2: [0.4, 2500, 0.38, 5000], // [NFPA 13] (from memory)
};

describe("DESIGNDENSITY and DESIGNAREA", () => {
  for (const [h, [d1, a1, d2, a2]] of Object.entries(CURVES)) {
    it(`${h}: both end points, the midpoint, the default area`, () => {
      expect(f.designdensity(h, a1)).toBeCloseTo(d1, 12);
      expect(f.designdensity(h, a2)).toBeCloseTo(d2, 12);
      expect(f.designdensity(h, (a1 + a2) / 2)).toBeCloseTo((d1 + d2) / 2, 12); // straight line: midpoint → mean
      expect(f.designdensity(h)).toBe(d1); // default: the curve's smallest area
      expect(f.designarea(h)).toBe(a1);
    });
  }

  it("interpolates along the straight line", () => {
    // OH1 at 2500 ft²: 0.15 − 0.03 × (2500 − 1500) / 2500 = 0.138 gpm/ft² [NFPA 13] (from memory)
    expect(f.designdensity("OH1", 2500)).toBeCloseTo(0.138, 12);
    // LH at 2000 ft²: 0.10 − 0.03 × 500 / 1500 = 0.09 [NFPA 13] (from memory)
    expect(f.designdensity("light", 2000)).toBeCloseTo(0.09, 12);
  });

  it("accepts the hazards' names", () => {
    const names: [string, string][] = [
      ["light", "LH"], ["Light Hazard", "LH"], ["lh", "LH"],
      ["ordinary 1", "OH1"], ["ordinary group 1", "OH1"], ["OH-1", "OH1"], ["oh 1", "OH1"], ["Ordinary Hazard Group 1", "OH1"],
      ["ordinary 2", "OH2"], ["ordinary group 2", "OH2"], ["OH-2", "OH2"],
      ["extra 1", "EH1"], ["extra group 1", "EH1"], ["EH-1", "EH1"],
      ["extra 2", "EH2"], ["Extra Group 2", "EH2"], ["eh-2", "EH2"],
    ];
    for (const [name, code] of names) expect(f.designdensity(name), name).toBe(CURVES[code][0]);
  });

  it("in SI takes m² and returns mm/min and m²", () => {
    // OH2 upper point 0.20 gpm/ft² × 40.746 = 8.149 mm/min; 1500 ft² × 0.092903 = 139.35 m² [NFPA 13] (from memory)
    expect(f.designdensity("OH2", null, "SI")).toBeCloseTo(0.2 * MMMIN_PER_GPMFT2, 10);
    expect(f.designdensity("OH2", null, "SI")).toBeCloseTo(8.149, 3);
    expect(f.designarea("OH2", "SI")).toBeCloseTo(1500 * M2_PER_FT2, 10);
    expect(f.designarea("OH2", "SI")).toBeCloseTo(139.35, 2);
    // 2000 ft² in m²: 0.194 gpm/ft² → 7.905 mm/min
    expect(f.designdensity("OH2", 2000 * M2_PER_FT2, "SI")).toBeCloseTo(0.194 * MMMIN_PER_GPMFT2, 10);
    // round trip: the SI design area lands on the curve
    expect(f.designdensity("EH1", f.designarea("EH1", "SI"), "SI")).toBeCloseTo(0.3 * MMMIN_PER_GPMFT2, 10);
    // 139 m² (the metric edition's rounding of 1500 ft²) is the upper point
    expect(f.designdensity("OH1", 139, "SI")).toBeCloseTo(0.15 * MMMIN_PER_GPMFT2, 10);
  });

  it("an area off the curve is an error stating the span in the user's units", () => {
    let e = errorOf(() => f.designdensity("OH1", 1000));
    expect(e.code).toBe("#VALUE!");
    expect(e.message).toBe("area: got 1000 ft²; the OH1 (ordinary hazard group 1) curve spans 1500 ft² to 4000 ft²");
    e = errorOf(() => f.designdensity("EH2", 6000));
    expect(e.message).toBe("area: got 6000 ft²; the EH2 (extra hazard group 2) curve spans 2500 ft² to 5000 ft²");
    e = errorOf(() => f.designdensity("OH1", 100, "SI"));
    // 1500 ft² = 139.355 m², 4000 ft² = 371.612 m²
    expect(e.message).toBe("area: got 100 m²; the OH1 (ordinary hazard group 1) curve spans 139.355 m² to 371.612 m²");
    expect(errorOf(() => f.designdensity("OH1", 0)).message).toMatch(/^area: got 0 ft²; must be greater than 0/);
    expect(errorOf(() => f.designdensity("OH1", "big")).message).toBe('area: got "big"; must be a number');
  });

  it("an unknown hazard lists the codes and names", () => {
    const e = errorOf(() => f.designdensity("storage"));
    expect(e.code).toBe("#VALUE!");
    expect(e.message).toBe(
      'hazard: got "storage"; must be one of "LH", "OH1", "OH2", "EH1", "EH2" (or "light", "ordinary 1", "ordinary 2", "extra 1", "extra 2")',
    );
    expect(errorOf(() => f.designarea("OH3")).message).toMatch(/^hazard: got "OH3"; must be one of "LH"/);
    expect(errorOf(() => f.designarea(null)).message).toMatch(/^hazard is empty: type one of "LH"/);
  });
});

// ─── ADJUSTAREA ──────────────────────────────────────────────────────────────────────────────────────────────────

describe("ADJUSTAREA", () => {
  it("dry and double interlock × 1.3, wet and preaction (single interlock) × 1 [NFPA 13] (from memory)", () => {
    // 1.3 × 1500 = 1950 ft² [NFPA 13] (from memory)
    for (const s of ["dry", "DRY", "dry pipe", "Dry-pipe", "double interlock", "Double-Interlock", "double interlock preaction"]) {
      expect(f.adjustarea(1500, s), s).toBeCloseTo(1950, 9);
    }
    for (const s of ["wet", "wet pipe", "deluge", "preaction", "Pre-action", "single interlock", "single interlock preaction"]) {
      expect(f.adjustarea(1500, s), s).toBe(1500);
    }
  });

  it("gives the area in the unit it was given: no units argument", () => {
    // OH2's 1500 ft² in m²: 139.355 m²; dry: 1.3 × 139.355 = 181.16 m² [NFPA 13] (from memory)
    expect(f.adjustarea(f.designarea("OH2", "SI"), "dry")).toBeCloseTo(1.3 * 1500 * M2_PER_FT2, 9);
    expect(f.adjustarea(f.designarea("OH2", "SI"), "dry")).toBeCloseTo(181.16, 2);
  });

  it("takes every system CFACTOR takes, so one system cell can feed both", () => {
    // galvanized steel: C 120 wet, 100 dry (preaction, single or double interlock, reads the dry column) [NFPA 13]
    const spellings: [string, number, number][] = [
      ["wet", 1500, 120], ["deluge", 1500, 120], ["wet pipe", 1500, 120],
      ["preaction", 1500, 100], ["single interlock", 1500, 100],
      ["dry", 1950, 100], ["dry pipe", 1950, 100], ["double interlock", 1950, 100], ["double interlock preaction", 1950, 100],
    ];
    for (const [s, area, c] of spellings) {
      expect(f.adjustarea(1500, s), s).toBeCloseTo(area, 9);
      expect(f.cfactor("galvanized", s), s).toBe(c);
    }
  });

  it("an unknown system lists the systems; a bad area says what is allowed", () => {
    const e = errorOf(() => f.adjustarea(1500, "foam"));
    expect(e.code).toBe("#VALUE!");
    expect(e.message).toBe(
      'system: got "foam"; must be one of "wet", "preaction", "dry", "double interlock" ' +
        '(or "wet pipe", "deluge", "single interlock", "dry pipe", "double interlock preaction")',
    );
    expect(errorOf(() => f.adjustarea(1500, null)).message).toMatch(/^system is empty: type one of "wet", "preaction", "dry"/);
    expect(errorOf(() => f.adjustarea(0, "dry")).message).toBe("area: got 0; must be greater than 0 and at most 1000000");
    expect(errorOf(() => f.adjustarea(2e6, "dry")).message).toBe("area: got 2000000; must be greater than 0 and at most 1000000");
    expect(errorOf(() => f.adjustarea("big", "dry")).message).toBe('area: got "big"; must be a number');
    expect(errorOf(() => f.adjustarea(null, "dry")).message).toBe("area is empty: type a number");
  });
});

// ─── HOSEALLOWANCE, DURATION ────────────────────────────────────────────────────────────────────────────────────

describe("HOSEALLOWANCE", () => {
  /** [NFPA 13] (from memory): inside + outside totals, gpm; inside hose 0, 50 or 100 gpm. */
  const TOTAL: Record<string, number> = { LH: 100, OH1: 250, OH2: 250, EH1: 500, EH2: 500 };

  it("total, inside and outside for every hazard", () => {
    for (const [h, total] of Object.entries(TOTAL)) {
      expect(f.hoseallowance(h), h).toBe(total); // [NFPA 13] (from memory)
      expect(f.hoseallowance(h, "total"), h).toBe(total);
      expect(f.hoseallowance(h, "inside"), h).toBe(100); // the largest inside allowance [NFPA 13] (from memory)
      expect(f.hoseallowance(h, "outside"), h).toBe(total - 100); // total − inside
    }
    expect(f.hoseallowance("OH2", "Outside")).toBe(150); // 250 − 100
    expect(f.hoseallowance("extra 1", "exterior")).toBe(400); // 500 − 100
    expect(f.hoseallowance("light", "outside")).toBe(0); // 100 − 100
  });

  it("in SI returns L/min", () => {
    expect(f.hoseallowance("OH1", null, "SI")).toBeCloseTo(250 * L_PER_GAL, 10); // 946.35 L/min
    expect(f.hoseallowance("EH2", "inside", "SI")).toBeCloseTo(378.54, 2);
  });

  it("an unknown part lists the parts", () => {
    const e = errorOf(() => f.hoseallowance("OH1", "roof"));
    expect(e.message).toBe('part: got "roof"; must be one of "total", "inside", "outside"');
  });
});

describe("DURATION", () => {
  it("min and max of the range for every hazard", () => {
    const ranges: [string, number, number][] = [
      ["LH", 30, 30], // [NFPA 13] (from memory)
      ["OH1", 60, 90], // [NFPA 13] (from memory)
      ["OH2", 60, 90], // [NFPA 13] (from memory)
      ["EH1", 90, 120], // [NFPA 13] (from memory)
      ["EH2", 90, 120], // [NFPA 13] (from memory)
    ];
    for (const [h, lo, hi] of ranges) {
      expect(f.duration(h), h).toBe(lo);
      expect(f.duration(h, "min"), h).toBe(lo);
      expect(f.duration(h, "max"), h).toBe(hi);
    }
    expect(f.duration("ordinary group 2", "Maximum")).toBe(90); // [NFPA 13] (from memory)
    expect(f.duration("EH-1", "minimum")).toBe(90); // [NFPA 13] (from memory)
  });

  it("an unknown bound lists the bounds", () => {
    expect(errorOf(() => f.duration("LH", "avg")).message).toBe('bound: got "avg"; must be one of "min", "max"');
    expect(errorOf(() => f.duration("XH")).message).toMatch(/^hazard: got "XH"; must be one of "LH"/);
  });
});
