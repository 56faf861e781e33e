import { describe, expect, it } from "vitest";
import { headLoss } from "../../src/engine/friction";
import { headPressure } from "../../src/engine/sprinkler";
import { MAX_DESIGN_AREA_SPRINKLERS } from "../../src/engine/sprinkler";
import { type AreaDemandInput, type HeadsDemandInput, solveAreaDemand, solveHeadsDemand } from "../../src/engine/tree";
import { errorOf } from "./engineError";

// Hazen-Williams, US form [NFPA 13]: psi/ft = 4.52 Q^1.85 / (C^1.85 d^4.87), written out here so the test does not
// lean on the engine's own formula.
const hw = (q: number, d: number, c = 120) => (4.52 * q ** 1.85) / (c ** 1.85 * d ** 4.87);

const base: AreaDemandInput = {
  density: 0.15, // OH1 upper point [NFPA 13] (from memory)
  area: 1500, // [NFPA 13] (from memory)
  coverage: 130,
  kFactor: 5.6,
  headSpacing: 13,
  branchDiameter: 1.38, // 1¼ Schedule 40 [ASME B36.10M]
  mainDiameter: 2.469, // 2½ Schedule 40 [ASME B36.10M]
  cFactor: 120, // black steel, wet [NFPA 13]
  minPressure: 7, // [NFPA 13]
};

describe("AREADEMAND solve: a worked two-line example [NFPA 13]", () => {
  // 300 ft² at 0.20 gpm/ft², 100 ft² per sprinkler, K 5.6, 12 ft between sprinklers, 1.049 in branch lines
  // (1 in Schedule 40 [ASME B36.10M]), 1.38 in cross main (1¼ Schedule 40 [ASME B36.10M]), C 120, Pmin 7 psi.
  const r = solveAreaDemand(
    { density: 0.2, area: 300, coverage: 100, kFactor: 5.6, headSpacing: 12, branchDiameter: 1.049, mainDiameter: 1.38, cFactor: 120, minPressure: 7 },
    headLoss("US"),
    true,
  );

  it("counts sprinklers, sprinklers per line and lines [NFPA 13]", () => {
    // n = ceil(300 / 100) = 3; m = ceil(1.2 √300 / 12) = ceil(1.2 × 17.3205 / 12) = ceil(1.7321) = 2;
    // L = ceil(3 / 2) = 2, the line nearest the feed flowing 3 − 2 = 1; line spacing 100 / 12 = 8.3333 ft
    expect(r.heads).toBe(3);
    expect(r.headsPerLine).toBe(2);
    expect(r.lines).toBe(2);
    expect(r.lineSpacing).toBeCloseTo(8.3333, 4);
  });

  it("solves the most remote line sprinkler by sprinkler [NFPA 13]", () => {
    // end sprinkler: q1 = max(0.20 × 100, 5.6 √7) = max(20, 14.82) = 20 gpm; p1 = (20 / 5.6)² = 12.7551 psi
    expect(r.endPressure).toBeCloseTo(12.7551, 4);
    // pipe 1→2 carries 20 gpm: 4.52 × 20^1.85 / (120^1.85 × 1.049^4.87) = 4.52 × 255.215 / (7022.40 × 1.26234)
    //   = 0.130131 psi/ft; × 12 ft = 1.56158 psi
    expect(hw(20, 1.049)).toBeCloseTo(0.130131, 6);
    // p2 = 12.7551 + 1.56158 = 14.3167 psi; q2 = 5.6 √14.3167 = 5.6 × 3.78374 = 21.1889 gpm
    const s = r.sprinklers!;
    expect(s[1]).toMatchObject({ line: 1, position: 2 });
    expect(s[1].pressure).toBeCloseTo(14.3167, 4);
    expect(s[1].flow).toBeCloseTo(21.1889, 4);
    // to the cross main: 20 + 21.1889 = 41.1889 gpm; 4.52 × 41.1889^1.85 / (7022.40 × 1.26234) = 4.52 × 971.279 / 8864.69
    //   = 0.495246 psi/ft; × 12 ft = 5.94295 psi; P_line = 14.3167 + 5.9429 = 20.2596 psi
    expect(hw(41.1889, 1.049)).toBeCloseTo(0.495246, 5);
    expect(r.lineFlows[0]).toBeCloseTo(41.1889, 4);
    expect(r.linePressures[0]).toBeCloseTo(20.2596, 4);
  });

  it("adds the cross-main loss and the partial line nearest the feed [NFPA 13]", () => {
    // cross main over 8.3333 ft carrying 41.1889 gpm in 1.38 in: 4.52 × 971.279 / (7022.40 × 4.79967) = 0.130252 psi/ft;
    //   × 8.3333 ft = 1.08544 psi; pressure at line 2: 20.2596 + 1.0854 = 21.3451 psi
    expect(hw(41.1889, 1.38) * (100 / 12)).toBeCloseTo(1.08544, 4);
    expect(r.pressure).toBeCloseTo(21.3451, 4);
    // line 2 (1 sprinkler) solved on its own: 20 gpm; inlet 12.7551 + 1.56158 = 14.3167 psi; K_line = 20 / √14.3167
    //   = 5.28578; fed at 21.3451 psi it flows 5.28578 × √21.3451 = 5.28578 × 4.62008 = 24.4207 gpm
    expect(r.lineFlows[1]).toBeCloseTo(24.4207, 4);
    // total 41.1889 + 24.4207 = 65.6096 gpm in the cross main at the last line
    expect(r.flow).toBeCloseTo(65.6096, 4);
    // never below density × area: 0.20 × 300 = 60 gpm
    expect(r.flow).toBeGreaterThanOrEqual(60);
  });
});

describe("AREADEMAND solve: invariants [NFPA 13]", () => {
  const cases: AreaDemandInput[] = [
    base,
    { ...base, density: 0.05 }, // the minimum pressure governs the end sprinkler
    { ...base, area: 1950 }, // a partial line
    { ...base, density: 0.3, area: 2500, coverage: 100, kFactor: 8, headSpacing: 10, branchDiameter: 1.61, mainDiameter: 3.068 },
    { ...base, density: 0.4, area: 4000, coverage: 100, kFactor: 11.2, headSpacing: 10, branchDiameter: 2.067, mainDiameter: 4.026 },
    { ...base, density: 0.1, area: 3000, coverage: 225, kFactor: 5.6, headSpacing: 15, branchDiameter: 1.049, mainDiameter: 2.067 },
  ];

  it("flow equals the sum of the individual sprinkler flows, each K √p [NFPA 13]", () => {
    for (const c of cases) {
      const r = solveAreaDemand(c, headLoss("US"), true);
      const s = r.sprinklers!;
      expect(s.length).toBe(r.heads);
      for (const h of s) expect(h.flow).toBeCloseTo(c.kFactor * Math.sqrt(h.pressure), 9);
      const sum = s.reduce((a, h) => a + h.flow, 0);
      expect(r.flow / sum).toBeCloseTo(1, 12);
      expect(r.lineFlows.reduce((a, q) => a + q, 0) / r.flow).toBeCloseTo(1, 12);
    }
  });

  it("flow is never below density × area [NFPA 13]", () => {
    for (const c of cases) {
      const r = solveAreaDemand(c);
      expect(r.flow).toBeGreaterThanOrEqual(c.density * c.area);
    }
  });

  it("pressure rises as either pipe shrinks", () => {
    for (const c of cases) {
      const r = solveAreaDemand(c);
      const smallerBranch = solveAreaDemand({ ...c, branchDiameter: c.branchDiameter * 0.9 });
      const smallerMain = solveAreaDemand({ ...c, mainDiameter: c.mainDiameter * 0.9 });
      expect(smallerBranch.pressure).toBeGreaterThan(r.pressure);
      if (r.lines > 1) expect(smallerMain.pressure).toBeGreaterThan(r.pressure);
      else expect(smallerMain.pressure).toBe(r.pressure); // one line: no cross main between lines
    }
  });

  it("a single line with a single sprinkler is HEADPRESSURE plus one Hazen-Williams step [NFPA 13]", () => {
    // 100 ft² at 100 ft² per sprinkler: n = 1; m = ceil(1.2 √100 / 15) = ceil(0.8) = 1
    const c: AreaDemandInput = { ...base, density: 0.2, area: 100, coverage: 100, headSpacing: 15, branchDiameter: 1.049 };
    const r = solveAreaDemand(c);
    expect([r.heads, r.lines]).toEqual([1, 1]);
    // q = 0.20 × 100 = 20 gpm; HEADPRESSURE = (20 / 5.6)² = 12.7551 psi;
    // one step: 4.52 × 20^1.85 / (120^1.85 × 1.049^4.87) × 15 ft = 0.130131 × 15 = 1.95197 psi → 14.7071 psi
    expect(r.flow).toBe(20);
    expect(r.pressure).toBeCloseTo(headPressure(20, 5.6, 7) + 0.130131 * 15, 4);
    expect(r.pressure).toBeCloseTo(14.7071, 4);
    expect(r.endPressure).toBeCloseTo(12.7551, 4);
  });

  it("with the minimum pressure governing, the end sprinkler sits at 7 psi [NFPA 13]", () => {
    // 0.05 × 130 = 6.5 gpm < 5.6 √7 = 14.82 gpm: q1 = 14.82 gpm at 7 psi
    const r = solveAreaDemand({ ...base, density: 0.05 }, headLoss("US"), true);
    expect(r.endPressure).toBeCloseTo(7, 12);
    expect(r.sprinklers![0].flow).toBeCloseTo(14.816, 3);
  });

  it("no line flows more sprinklers than the area holds", () => {
    // 100 ft², 100 ft² per sprinkler, 10 ft spacing: ceil(1.2 × 10 / 10) = 2 per line, but only 1 sprinkler flows
    const r = solveAreaDemand({ ...base, area: 100, coverage: 100, headSpacing: 10 });
    expect([r.heads, r.headsPerLine, r.lines]).toEqual([1, 1, 1]);
  });

  it("rejects inputs that are not positive, naming them", () => {
    expect(() => solveAreaDemand({ ...base, headSpacing: 0 })).toThrow(/head_spacing: got 0 ft; must be greater than 0/);
    expect(() => solveAreaDemand({ ...base, mainDiameter: -1 })).toThrow(/main_diameter/);
    expect(() => solveAreaDemand({ ...base, density: Number.NaN })).toThrow(/density/);
  });
});

describe("AREADEMAND solve: every loop is bounded by a plausible count", () => {
  // 0.20 gpm/ft² over 1500 ft², K 8.0, 12 ft spacing, 1¼ and 2½ Schedule 40 [ASME B36.10M], C 120, 7 psi
  const oh2: AreaDemandInput = { ...base, density: 0.2, kFactor: 8, headSpacing: 12 };

  it("AREADEMAND(0.2, 1500, 1E-300, 8, 12, 1.38, 2.469) looped 1.5e303 times: a coverage below 9 ft² is refused", () => {
    expect(errorOf(() => solveAreaDemand({ ...oh2, coverage: 1e-300 })).message).toBe(
      "coverage: got 1e-300 ft²; must be at least 9 ft²: a sprinkler protecting less than 3 ft × 3 ft is an input error",
    );
    // 1e-5 ft² gave 150 million sprinklers (seconds and a gigabyte); 8.9 ft² gave 169: both refused alike
    expect(errorOf(() => solveAreaDemand({ ...oh2, coverage: 1e-5 })).message).toMatch(/^coverage: got 0.00001 ft²; must be at least 9 ft²/);
    expect(errorOf(() => solveAreaDemand({ ...oh2, coverage: 8.9 })).message).toMatch(/^coverage: got 8.9 ft²; must be at least 9 ft²/);
  });

  it("a head spacing below 3 ft is refused, naming head_spacing", () => {
    expect(errorOf(() => solveAreaDemand({ ...oh2, headSpacing: 1e-10 })).message).toBe(
      "head_spacing: got 1e-10 ft; must be at least 3 ft: sprinklers closer than that on a line are an input error",
    );
  });

  it("branch lines closer than 3 ft (coverage ÷ head_spacing) are refused, naming head_spacing", () => {
    // 130 ft² at 50 ft along the line puts the lines 130 / 50 = 2.6 ft apart; at most 130 / 3 = 43.3333 ft
    expect(errorOf(() => solveAreaDemand({ ...oh2, headSpacing: 50 })).message).toBe(
      "head_spacing: got 50 ft; must be at most coverage ÷ 3 ft = 43.3333 ft: branch lines closer than 3 ft are an input error",
    );
    // 130 / 43 = 3.02 ft: allowed
    expect(solveAreaDemand({ ...oh2, headSpacing: 43 }).lineSpacing).toBeCloseTo(130 / 43, 12);
  });

  it("a design area of more than 5000 sprinklers is refused, naming area", () => {
    // 5000 × 130 = 650000 ft² holds exactly 5000 sprinklers; 650130 ft² would hold 5001
    expect(solveAreaDemand({ ...oh2, area: 650_000, branchDiameter: 12, mainDiameter: 24 }).heads).toBe(5000);
    expect(errorOf(() => solveAreaDemand({ ...oh2, area: 650_130 })).message).toBe(
      "area: got 650130 ft²; must be at most 650000 ft² with a coverage of 130 ft²: a design area of more than 5000 sprinklers is an input error",
    );
  });
});

describe("AREADEMAND solve: a result beyond any number names the argument behind it", () => {
  // Hazen-Williams divides by d^4.87: (1e-70)^4.87 = 1e-341 underflows to 0, so the loss is Infinity
  it("a branch line too small for any finite loss names branch_diameter", () => {
    expect(errorOf(() => solveAreaDemand({ ...base, branchDiameter: 1e-70 })).message).toBe(
      "branch_diameter: got 1e-70 in; must be larger: the friction loss along a branch line has no finite value",
    );
  });
  it("a cross main too small for any finite loss names main_diameter", () => {
    // it was "AREADEMAND: the inputs give no finite result (a pipe far too small for the flow?); check the diameters"
    expect(errorOf(() => solveAreaDemand({ ...base, mainDiameter: 1e-70 })).message).toBe(
      "main_diameter: got 1e-70 in; must be larger: the friction loss in the cross main has no finite value",
    );
  });
  it("a K-factor so small that the end sprinkler needs more than any pressure names k_factor", () => {
    // q1 = 0.15 × 130 = 19.5 gpm; (19.5 / 1e-300)² = 3.8e602 overflows to Infinity
    expect(errorOf(() => solveAreaDemand({ ...base, kFactor: 1e-300 })).message).toBe(
      "k_factor: got 1e-300 gpm/psi^0.5; must be larger: the end sprinkler would need more than any pressure to flow 19.5 gpm",
    );
  });
});

// ─── HEADSDEMAND ─────────────────────────────────────────────────────────────────────────────────────────────────

/** 12 sprinklers K 16.8 at 52 psi, 4 on each line, 10 ft × 10 ft; 3 in branch lines, 6 in cross main. */
const storage: HeadsDemandInput = {
  heads: 12,
  headsPerLine: 4,
  kFactor: 16.8,
  minPressure: 52,
  headSpacing: 10,
  lineSpacing: 10,
  branchDiameter: 3.068, // 3 Schedule 40 [ASME B36.10M]
  mainDiameter: 6.065, // 6 Schedule 40 [ASME B36.10M]
  cFactor: 120, // black steel, wet [NFPA 13]
};

describe("HEADSDEMAND solve: 12 sprinklers K 16.8 at 52 psi, 4 a line, 10 ft × 10 ft, worked by hand [NFPA 13]", () => {
  // Hazen-Williams [NFPA 13] over 10 ft: loss = 4.52 Q^1.85 / (C^1.85 d^4.87) × 10, C^1.85 = 120^1.85 = 7022.40;
  //   branch line 3.068^4.87 = 234.955, so C^1.85 d^4.87 = 1 649 950; cross main 6.065^4.87 = 6492.11, 45 590 182.
  const r = solveHeadsDemand(storage, headLoss("US"), true);
  const s = r.sprinklers!;

  it("puts 4 sprinklers on each of 3 lines, 10 ft apart, the end sprinkler at 52 psi", () => {
    // L = ceil(12 / 4) = 3 lines, all full (12 − 2 × 4 = 4)
    expect([r.heads, r.headsPerLine, r.lines, r.lineSpacing]).toEqual([12, 4, 3, 10]);
    expect(r.endPressure).toBe(52);
    expect(s.map((h) => h.line)).toEqual([1, 1, 1, 1, 2, 2, 2, 2, 3, 3, 3, 3]);
  });

  it("walks the most remote line sprinkler by sprinkler [NFPA 13]", () => {
    // sprinkler 1 (the end): q1 = 16.8 √52 = 16.8 × 7.21110 = 121.1465 gpm at 52 psi
    expect(s[0].pressure).toBe(52);
    expect(s[0].flow).toBeCloseTo(121.1465, 4);
    expect(hw(121.1465, 3.068) * 10).toBeCloseTo(0.19579, 5);
    // 1→2 carries 121.1465 gpm: 4.52 × 121.1465^1.85 / 1 649 950 = 4.52 × 7147.0 / 1 649 950 = 0.019579 psi/ft;
    //   × 10 ft = 0.19579 psi. Sprinkler 2: 52 + 0.19579 = 52.1958 psi; 16.8 √52.1958 = 16.8 × 7.22467 = 121.3744 gpm
    expect(s[1].pressure).toBeCloseTo(52.1958, 4);
    expect(s[1].flow).toBeCloseTo(121.3744, 4);
    // 2→3 carries 121.1465 + 121.3744 = 242.5209 gpm: 4.52 × 25 809.9 / 1 649 950 = 0.070706 psi/ft; × 10 = 0.70706 psi.
    //   Sprinkler 3: 52.1958 + 0.70706 = 52.9028 psi; 16.8 × 7.27343 = 122.1937 gpm
    expect(hw(242.5209, 3.068) * 10).toBeCloseTo(0.70706, 5);
    expect(s[2].pressure).toBeCloseTo(52.9028, 4);
    expect(s[2].flow).toBeCloseTo(122.1937, 4);
    // 3→4 carries 242.5209 + 122.1937 = 364.7146 gpm: 4.52 × 54 905.2 / 1 649 950 = 0.150411 psi/ft; × 10 = 1.50411 psi.
    //   Sprinkler 4: 52.9028 + 1.50411 = 54.4070 psi; 16.8 × 7.37611 = 123.9186 gpm
    expect(hw(364.7146, 3.068) * 10).toBeCloseTo(1.50411, 5);
    expect(s[3].pressure).toBeCloseTo(54.407, 4);
    expect(s[3].flow).toBeCloseTo(123.9186, 4);
    // 4→cross main carries 364.7146 + 123.9186 = 488.6332 gpm: 4.52 × 94 323.2 / 1 649 950 = 0.258396 psi/ft;
    //   × 10 = 2.58396 psi. Line 1 at the cross main: 488.6332 gpm at 54.4070 + 2.58396 = 56.9909 psi
    expect(hw(488.6332, 3.068) * 10).toBeCloseTo(2.58396, 5);
    expect(r.lineFlows[0]).toBeCloseTo(488.6332, 4);
    expect(r.linePressures[0]).toBeCloseTo(56.9909, 4);
  });

  it("feeds the further lines by their line K through the cross main [NFPA 13]", () => {
    // line K = 488.6332 / √56.9909 = 488.6332 / 7.549233 = 64.7262 gpm/psi^0.5
    // cross main, line 1 → 2, carries 488.6332 gpm: 4.52 × 94 323.2 / 45 590 182 = 0.0093516 psi/ft; × 10 = 0.09352 psi.
    //   Line 2: 56.9909 + 0.09352 = 57.0844 psi; 64.7262 × √57.0844 = 64.7262 × 7.555424 = 489.0339 gpm
    expect(hw(488.6332, 6.065) * 10).toBeCloseTo(0.09352, 5);
    expect(r.linePressures[1]).toBeCloseTo(57.0844, 4);
    expect(r.lineFlows[1]).toBeCloseTo(489.0339, 4);
    // line 2 → 3 carries 488.6332 + 489.0339 = 977.6671 gpm: 4.52 × 340 293.3 / 45 590 182 = 0.0337381 psi/ft;
    //   × 10 = 0.33738 psi. Line 3: 57.0844 + 0.33738 = 57.4218 psi; 64.7262 × 7.577719 = 490.4770 gpm
    expect(hw(977.6671, 6.065) * 10).toBeCloseTo(0.33738, 5);
    expect(r.linePressures[2]).toBeCloseTo(57.4218, 4);
    expect(r.lineFlows[2]).toBeCloseTo(490.477, 4);
    // at the last line: 488.6332 + 489.0339 + 490.4770 = 1468.1441 gpm at 57.4218 psi
    expect(r.flow).toBeCloseTo(1468.1441, 4);
    expect(r.pressure).toBeCloseTo(57.4218, 4);
    // line 2's end sprinkler: its line fed at 57.0844 instead of 56.9909 psi, every pressure × 57.0844 / 56.9909 =
    //   1.001641: 52 × 1.001641 = 52.0853 psi, flowing 16.8 √52.0853 = 16.8 × 7.217017 = 121.2459 gpm
    expect(s[4].pressure).toBeCloseTo(52.0853, 4);
    expect(s[4].flow).toBeCloseTo(121.2459, 4);
  });

  it("flow is the sum of the sprinklers' flows, each K √p, each at least K √min_pressure [NFPA 13]", () => {
    for (const h of s) {
      expect(h.flow).toBeCloseTo(16.8 * Math.sqrt(h.pressure), 9);
      expect(h.pressure).toBeGreaterThanOrEqual(52);
    }
    expect(s.reduce((a, h) => a + h.flow, 0) / r.flow).toBeCloseTo(1, 12);
    expect(r.flow).toBeGreaterThanOrEqual(12 * 16.8 * Math.sqrt(52)); // 12 × 121.1465 = 1453.76 gpm
  });
});

describe("HEADSDEMAND solve: the line nearest the feed flows the remainder [NFPA 13]", () => {
  // 10 sprinklers, 4 a line: L = ceil(10 / 4) = 3 lines, the last flowing 10 − 2 × 4 = 2
  const r = solveHeadsDemand({ ...storage, heads: 10 }, headLoss("US"), true);

  it("solves the two-sprinkler line on its own, then feeds it from the cross main", () => {
    expect([r.heads, r.headsPerLine, r.lines]).toEqual([10, 4, 3]);
    expect(r.sprinklers!.map((h) => h.line)).toEqual([1, 1, 1, 1, 2, 2, 2, 2, 3, 3]);
    // lines 1 and 2 as in the 12-sprinkler case above: 488.6332 gpm at 56.9909 psi, 489.0339 gpm at 57.0844 psi, and
    //   line 3 fed at 57.4218 psi (the cross main carries the same 977.6671 gpm to it)
    expect(r.lineFlows[0]).toBeCloseTo(488.6332, 4);
    expect(r.lineFlows[1]).toBeCloseTo(489.0339, 4);
    expect(r.linePressures[2]).toBeCloseTo(57.4218, 4);
    // the two-sprinkler line from 52 psi: 121.1465 gpm; + 0.19579 psi → 52.1958 psi, 121.3744 gpm; to the cross main
    //   242.5209 gpm, + 0.70706 psi → 52.9028 psi. Its K = 242.5209 / √52.9028 = 242.5209 / 7.273431 = 33.3434;
    //   fed at 57.4218 psi: 33.3434 × 7.577719 = 252.6668 gpm
    expect(r.lineFlows[2]).toBeCloseTo(252.6668, 4);
    // 488.6332 + 489.0339 + 252.6668 = 1230.3339 gpm at 57.4218 psi
    expect(r.flow).toBeCloseTo(1230.3339, 4);
    expect(r.pressure).toBeCloseTo(57.4218, 4);
  });

  it("walks the same lines AREADEMAND walks for the same layout", () => {
    // AREADEMAND over 1200 ft² at 100 ft² a sprinkler, 10 ft along the lines: n = 12, m = ceil(1.2 √1200 / 10) =
    //   ceil(4.157) = 5 (5 + 5 + 2), lines 100 / 10 = 10 ft apart; 0.05 gpm/ft² × 100 = 5 gpm < 16.8 √52, so the end
    //   sprinkler sits at 52 psi: the very layout of 12 sprinklers 5 a line
    const area = solveAreaDemand(
      { density: 0.05, area: 1200, coverage: 100, kFactor: 16.8, headSpacing: 10, branchDiameter: 3.068, mainDiameter: 6.065, cFactor: 120, minPressure: 52 },
      headLoss("US"),
      true,
    );
    const heads = solveHeadsDemand({ ...storage, headsPerLine: 5 }, headLoss("US"), true);
    expect([area.heads, area.headsPerLine, area.lines]).toEqual([12, 5, 3]);
    expect(heads).toEqual(area);
  });

  it("one line of every sprinkler, and one sprinkler: HEADPRESSURE plus one Hazen-Williams step", () => {
    const line = solveHeadsDemand({ ...storage, heads: 4 });
    expect([line.lines, line.flow, line.pressure]).toEqual([1, r.lineFlows[0], r.linePressures[0]]);
    // one sprinkler: 121.1465 gpm at 52 + 0.19579 = 52.1958 psi
    const one = solveHeadsDemand({ ...storage, heads: 1, headsPerLine: 1 });
    expect([one.heads, one.lines]).toEqual([1, 1]);
    expect(one.flow).toBeCloseTo(121.1465, 4);
    expect(one.pressure).toBeCloseTo(52.1958, 4);
  });
});

describe("HEADSDEMAND solve: bad input is an error naming the argument, the value and what is allowed", () => {
  const message = (inp: Partial<HeadsDemandInput>) => errorOf(() => solveHeadsDemand({ ...storage, ...inp })).message;

  it("heads: a whole number from 1 to the most sprinklers a design may hold", () => {
    expect(message({ heads: 0 })).toBe("heads: got 0; must be a whole number of sprinklers, at least 1");
    expect(message({ heads: 12.5 })).toBe("heads: got 12.5; must be a whole number of sprinklers, at least 1");
    expect(message({ heads: -3 })).toBe("heads: got -3; must be a whole number of sprinklers, at least 1");
    expect(message({ heads: Number.NaN })).toBe("heads: got NaN; must be a whole number of sprinklers, at least 1");
    expect(MAX_DESIGN_AREA_SPRINKLERS).toBe(5000);
    expect(message({ heads: 5001 })).toBe("heads: got 5001; must be at most 5000: a design of more than 5000 sprinklers is an input error");
    expect(message({ heads: 1e300, headsPerLine: 1 })).toMatch(/^heads: got 1e\+300; must be at most 5000/);
    expect(solveHeadsDemand({ ...storage, heads: 5000, headsPerLine: 100, branchDiameter: 12, mainDiameter: 24 }).heads).toBe(5000);
  });

  it("heads_per_line: a whole number from 1 to heads", () => {
    expect(message({ headsPerLine: 0 })).toBe("heads_per_line: got 0; must be a whole number of sprinklers, at least 1");
    expect(message({ headsPerLine: 2.5 })).toBe("heads_per_line: got 2.5; must be a whole number of sprinklers, at least 1");
    expect(message({ headsPerLine: 13 })).toBe("heads_per_line: got 13; must be at most heads, 12");
  });

  it("spacings: no closer than 3 ft along a line or between lines", () => {
    expect(message({ headSpacing: 2 })).toBe("head_spacing: got 2 ft; must be at least 3 ft: sprinklers closer than that on a line are an input error");
    expect(message({ lineSpacing: 1e-10 })).toBe("line_spacing: got 1e-10 ft; must be at least 3 ft: branch lines closer than that are an input error");
    expect(message({ lineSpacing: 0 })).toBe("line_spacing: got 0 ft; must be greater than 0");
  });

  it("quantities that are not positive, and pipes too small for any finite loss", () => {
    expect(message({ kFactor: 0 })).toBe("k_factor: got 0 gpm/psi^0.5; must be greater than 0");
    expect(message({ minPressure: -1 })).toBe("min_pressure: got -1 psi; must be greater than 0");
    expect(message({ cFactor: Infinity })).toBe("c_factor: got Infinity; must be greater than 0");
    expect(message({ branchDiameter: 1e-70 })).toBe("branch_diameter: got 1e-70 in; must be larger: the friction loss along a branch line has no finite value");
    expect(message({ mainDiameter: 1e-70 })).toBe("main_diameter: got 1e-70 in; must be larger: the friction loss in the cross main has no finite value");
  });
});
