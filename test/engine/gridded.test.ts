import { describe, expect, it } from "vitest";
import { headLoss } from "../../src/engine/friction";
import {
  GRID_FLOOR_TOLERANCE,
  GRID_TIE_TOLERANCE,
  type GridDemandInput,
  type GridPlacementSolution,
  gridLayout,
  gridNetwork,
  solveGridDemand,
  solveGridPlacement,
} from "../../src/engine/gridded";
import { type Network, type NetworkSolution, solveNetwork } from "../../src/engine/network";
import { solveAreaDemand } from "../../src/engine/tree";
import { errorOf } from "./engineError";
import { OH1_GRID } from "./networks";

// Hazen-Williams, US form [NFPA 13]: psi/ft = 4.52 Q^1.85 / (C^1.85 d^4.87), written out here so the test does not
// lean on the engine's own formula.
const hw = (q: number, d: number, c = 120) => (4.52 * q ** 1.85) / (c ** 1.85 * d ** 4.87);

/** The OH1 grid shared with the outside check (./networks.ts). */
const base: GridDemandInput = OH1_GRID;

/** Every pipe's flow balanced at every junction: what its pipes bring equals what leaves there. */
function imbalance(net: Network, s: NetworkSolution): number {
  const inflow = new Float64Array(net.nodes.length);
  net.pipes.forEach((p, j) => {
    inflow[p.from] -= s.flow[j];
    inflow[p.to] += s.flow[j];
  });
  let worst = 0;
  net.nodes.forEach((node, i) => {
    if (node.fixedPressure === undefined) worst = Math.max(worst, Math.abs(inflow[i] - s.outflow[i]));
  });
  return worst;
}

/** The invariants of one solved placement (file comment of gridded.ts, step 3), for `inp`. */
function expectSolvedPlacement(inp: GridDemandInput, r: GridPlacementSolution): void {
  const layout = gridLayout(inp);
  const qReq = Math.max(inp.density * inp.coverage, inp.kFactor * Math.sqrt(inp.minPressure)); // [NFPA 13]
  const { network, flowing, riser } = r.grid;
  const s = r.solution;
  expect(flowing).toHaveLength(layout.heads);
  let sum = 0;
  let least = Infinity;
  for (const i of flowing) {
    // each flowing sprinkler flows K √p [NFPA 13] and at least q_req
    expect(s.outflow[i] / (inp.kFactor * Math.sqrt(s.pressure[i]))).toBeCloseTo(1, 12);
    expect(s.outflow[i]).toBeGreaterThanOrEqual(qReq * (1 - 1e-7));
    least = Math.min(least, s.outflow[i]);
    sum += s.outflow[i];
  }
  // the least-favoured one exactly at q_req, and at the pressure reported
  expect(Math.abs(least / qReq - 1)).toBeLessThanOrEqual(1e-7);
  expect(r.endPressure / (qReq / inp.kFactor) ** 2).toBeCloseTo(1, 6);
  // the riser's flow is the sum of the flowing sprinklers' flows, never below density × area [NFPA 13]
  expect(r.flow / sum).toBeCloseTo(1, 10);
  expect(-s.outflow[riser] / r.flow).toBeCloseTo(1, 8);
  expect(r.flow).toBeGreaterThanOrEqual(inp.density * inp.area);
  // every closed sprinkler and junction passes on what it gets
  expect(imbalance(network, s)).toBeLessThan(1e-8 * r.flow);
  expect(s.pressure[riser]).toBe(r.pressure);
}

describe("the grid's layout [NFPA 13]", () => {
  it("lays out lines, sprinklers and the design area as the vocabulary says", () => {
    const l = gridLayout(base);
    // N = floor(160 / 13) = floor(12.31) = 12; both end gaps (160 − 11 × 13) / 2 = 8.5 ft; lines 130 / 13 = 10 ft apart
    expect([l.lineHeads, l.endGap, l.lineSpacing]).toEqual([12, 8.5, 10]);
    // n = ceil(1500 / 130) = ceil(11.54) = 12; m = min(12, ceil(1.2 √1500 / 13)) = min(12, ceil(3.58)) = 4;
    // l = ceil(12 / 4) = 3; r = 12 − 2 × 4 = 4 [NFPA 13]
    expect([l.heads, l.headsPerLine, l.areaLines, l.remainderHeads]).toEqual([12, 4, 3, 4]);
    // q_req = max(0.15 × 130, 5.6 √7) = max(19.5, 14.82) = 19.5 gpm at (19.5 / 5.6)² = 12.1253 psi [NFPA 13]
    expect(l.requiredFlow).toBeCloseTo(19.5, 12);
    expect(l.requiredPressure).toBeCloseTo(12.1253, 4);
  });

  it("holds m to the sprinklers a line has, and flows the remainder on the area's line nearest the feed", () => {
    // 3000 ft² at 100 ft², 10 ft apart: ceil(1.2 √3000 / 10) = ceil(6.57) = 7, but a 55 ft line holds
    // floor(55 / 10) = 5: m = 5; n = 30, l = 6, r = 30 − 5 × 5 = 5 [NFPA 13]
    const l = gridLayout({ ...base, area: 3000, coverage: 100, headSpacing: 10, lineLength: 55 });
    expect([l.lineHeads, l.headsPerLine, l.heads, l.areaLines]).toEqual([5, 5, 30, 6]);
    // 1950 ft² at 130 ft²: n = 15, m = ceil(1.2 × 44.16 / 13) = ceil(4.08) = 5, l = 3, r = 15 − 10 = 5: three full
    // lines; 1600 ft²: n = ceil(12.31) = 13, m = ceil(1.2 × 40 / 13) = ceil(3.69) = 4, l = 4, r = 13 − 12 = 1
    const p = gridLayout({ ...base, area: 1600, feedLine: 5 });
    expect([p.heads, p.headsPerLine, p.areaLines, p.remainderHeads]).toEqual([13, 4, 4, 1]);
    // placed on lines 2 … 5 with the riser at line 5, line 5 flows the one sprinkler; on lines 6 … 9, line 6 does
    const a = solveGridPlacement(p, { firstLine: 2, firstHead: 3 });
    const b = solveGridPlacement(p, { firstLine: 6, firstHead: 3 });
    const linesOf = (r: GridPlacementSolution) => r.grid.flowing.map((i) => r.grid.nodeAt[i].line);
    expect(linesOf(a).filter((line) => line === 5)).toHaveLength(1);
    expect(linesOf(a).filter((line) => line === 2)).toHaveLength(4);
    expect(linesOf(b).filter((line) => line === 6)).toHaveLength(1);
    expect(linesOf(b).filter((line) => line === 9)).toHaveLength(4);
    // sprinklers first_head … first_head + m − 1: 3 … 6 (the remainder line's one: 3)
    expect([...new Set(a.grid.flowing.map((i) => a.grid.nodeAt[i].position))].sort()).toEqual([3, 4, 5, 6]);
  });

  it("builds the whole grid as a network: nodes line by line, mains after the lines", () => {
    const l = gridLayout({ ...base, lines: 2, lineLength: 30, headSpacing: 10, coverage: 100, area: 200 });
    const g = gridNetwork(l, { firstLine: 1, firstHead: 2 }, 20);
    // N = floor(30 / 10) = 3, gaps (30 − 2 × 10) / 2 = 5 ft: per line 5 nodes and 4 pipes (5, 10, 10, 5 ft);
    // then one near-main and one far-main pipe of 100 / 10 = 10 ft
    expect(g.network.nodes).toHaveLength(10);
    expect(g.network.pipes.map((p) => p.length)).toEqual([5, 10, 10, 5, 5, 10, 10, 5, 10, 10]);
    expect(g.network.pipes.slice(8).map((p) => [p.from, p.to, p.diameter])).toEqual([[0, 5, 2.469], [4, 9, 2.469]]);
    // n = 2, m = min(3, ceil(1.2 √200 / 10) = ceil(1.70) = 2): sprinklers 2 and 3 of line 1 flow, the rest are closed
    expect(g.flowing).toEqual([2, 3]);
    expect(g.network.nodes.map((n) => n.k ?? 0)).toEqual([0, 0, 5.6, 5.6, 0, 0, 0, 0, 0, 0]);
    expect([g.riser, g.network.nodes[g.riser].fixedPressure]).toEqual([0, 20]);
  });
});

describe("one placement: the riser pressure that gives the least-favoured sprinkler q_req [NFPA 13]", () => {
  it("a one-sprinkler line is HEADPRESSURE plus the loss over the end gap, worked by hand", () => {
    // 100 ft² at 100 ft² a sprinkler on one line 10 ft long, 10 ft spacing: N = 1, end gaps (10 − 0) / 2 = 5 ft;
    // q_req = 0.20 × 100 = 20 gpm at (20 / 5.6)² = 12.7551 psi; the far gap is a dead end (no flow).
    // 4.52 × 20^1.85 / (120^1.85 × 1.049^4.87) = 0.130131 psi/ft; × 5 ft = 0.650655 psi → 13.4058 psi [NFPA 13]
    const inp = { ...base, density: 0.2, area: 100, coverage: 100, headSpacing: 10, lines: 1, lineLength: 10, branchDiameter: 1.049 };
    const r = solveGridDemand(inp, headLoss("US"), true);
    expect(hw(20, 1.049)).toBeCloseTo(0.130131, 6);
    expect(r.pressure).toBeCloseTo(12.7551 + 0.650655, 4);
    expect(r.flow).toBeCloseTo(20, 5);
    expect([r.heads, r.lines, r.firstLine, r.firstHead]).toEqual([1, 1, 1, 1]);
    expect(r.solved!.solution.flow[1]).toBeCloseTo(0, 9); // sprinkler → far main: nothing beyond
  });

  it("the least-favoured sprinkler flows exactly q_req; every other more, each K √p; flows balance", () => {
    const cases: GridDemandInput[] = [
      base,
      { ...base, feedLine: 5 },
      { ...base, density: 0.05 }, // the minimum pressure governs: q_req = 5.6 √7 = 14.82 gpm
      { ...base, area: 1600, feedLine: 10 }, // a remainder line of one sprinkler
      { ...base, density: 0.3, area: 2500, coverage: 100, kFactor: 8, headSpacing: 10, lines: 12, lineLength: 125, branchDiameter: 1.61, mainDiameter: 3.068 },
      { ...base, lines: 3 }, // the area spans every line
    ];
    for (const inp of cases) {
      const r = solveGridDemand(inp, headLoss("US"), true);
      expectSolvedPlacement(inp, r.solved!);
      expect([r.flow, r.pressure, r.endPressure]).toEqual([r.solved!.flow, r.solved!.pressure, r.solved!.endPressure]);
    }
  });

  it("solving only the mains' junctions and the flowing sprinklers gives the whole grid's pressures and flows", () => {
    // a pipe through closed sprinklers carries one flow, so its loss is that of its summed length (file comment)
    const r = solveGridDemand(base, headLoss("US"), true).solved!;
    const layout = gridLayout(base);
    const full = gridNetwork(layout, r.placement, r.pressure);
    const s = solveNetwork(full.network, { tolerance: 1e-12 });
    const N = layout.lineHeads;
    r.grid.nodeAt.forEach((at, i) => {
      expect(s.pressure[(at.line - 1) * (N + 2) + at.position]).toBeCloseTo(r.solution.pressure[i], 8);
    });
    let fullFlow = 0;
    for (const i of full.flowing) fullFlow += s.outflow[i];
    expect(fullFlow).toBeCloseTo(r.flow, 8);
    expect(imbalance(full.network, s)).toBeLessThan(1e-8 * r.flow);
  });

  it("refuses a placement outside the grid", () => {
    const l = gridLayout(base);
    expect(errorOf(() => solveGridPlacement(l, { firstLine: 9, firstHead: 1 })).message).toBe("first_line: got 9; must be a whole number from 1 to 8");
    expect(errorOf(() => solveGridPlacement(l, { firstLine: 1, firstHead: 0 })).message).toBe("first_head: got 0; must be a whole number from 1 to 9");
  });
});

describe("the placement search [NFPA 13]", () => {
  it("finds the placement needing the highest riser pressure, the first in order on a tie", () => {
    // 9 lines fed at the middle one: the grid is the same seen from either side, so lines 1 … 3 and 7 … 9 tie
    const inp = { ...base, lines: 9, feedLine: 5 };
    const r = solveGridDemand(inp);
    const layout = gridLayout(inp);
    const all: GridPlacementSolution[] = [];
    for (let firstLine = 1; firstLine <= 7; firstLine++) {
      for (let firstHead = 1; firstHead <= 9; firstHead++) all.push(solveGridPlacement(layout, { firstLine, firstHead }));
    }
    expect(r.placements).toBe(all.length); // 7 × 9
    const highest = Math.max(...all.map((a) => a.pressure));
    const first = all.find((a) => a.pressure >= highest / (1 + GRID_TIE_TOLERANCE))!;
    expect([r.firstLine, r.firstHead]).toEqual([first.placement.firstLine, first.placement.firstHead]);
    expect(r.pressure / highest).toBeCloseTo(1, 6);
    // the mirror image needs the same pressure: the tie went to the lower first_line
    // lines first_line … first_line + 2 seen from the other side: lines 10 − (first_line + 2) … 10 − first_line
    const mirror = all.find((a) => a.placement.firstLine === 10 - (r.firstLine + 2) && a.placement.firstHead === r.firstHead)!;
    expect(mirror.pressure / r.pressure).toBeCloseTo(1, 6);
    expect(r.firstLine).toBeLessThan(mirror.placement.firstLine);
  });

  it("puts the area where the water travels furthest: the far lines from a corner feed, past the lines' middle", () => {
    // fed at line 1 the area lands on lines 8 … 10, sprinklers 6 … 9 of 12: the near main brings all the water, so the
    // far main's half of each line is reached the longer way round (the engine's worked value in gridded.ts)
    const r = solveGridDemand(base);
    expect([r.firstLine, r.firstHead, r.placements]).toEqual([8, 6, 72]);
    // fed at its middle line, the grid needs less: the water has half as far to go along the near main
    const middle = solveGridDemand({ ...base, feedLine: 5 });
    expect(middle.pressure).toBeLessThan(r.pressure);
  });

  it("the README's example: the print works' design area on a 12-line grid", () => {
    // OH2 0.20 gpm/ft² over 1500 ft² [NFPA 13] (from memory), 120 ft² a sprinkler, K 8.0, 12 ft apart, on 12 lines
    // 120 ft long: N = floor(120 / 12) = 10, gaps (120 − 9 × 12) / 2 = 6 ft, lines 120 / 12 = 10 ft apart; n = 13,
    // m = ceil(1.2 √1500 / 12) = ceil(3.87) = 4, l = 4, the remainder 13 − 12 = 1 [NFPA 13]. The README's figures are
    // the engine's values, checked here to the precision it shows them.
    const inp = { ...base, density: 0.2, coverage: 120, kFactor: 8, headSpacing: 12, lines: 12, lineLength: 120 };
    const r = solveGridDemand(inp, headLoss("US"), true);
    expect([r.heads, r.lines, r.lineHeads, r.firstLine, r.firstHead]).toEqual([13, 4, 10, 9, 4]);
    expect(r.pressure).toBeCloseTo(32.78, 2);
    const s = r.solved!;
    // the one-sprinkler line is line 9, the area's line nearest the riser; the least favoured is sprinkler 6 of line 12
    expect(s.grid.flowing.filter((i) => s.grid.nodeAt[i].line === 9)).toHaveLength(1);
    expect(s.grid.nodeAt[s.least]).toEqual({ line: 12, position: 6 });
    // next to the riser it needs least
    expect(solveGridPlacement(gridLayout(inp), { firstLine: 1, firstHead: 1 }).pressure).toBeCloseTo(18.77, 2);
    // fed at its middle line it needs less, the area a sprinkler further along its lines
    const middle = solveGridDemand({ ...inp, feedLine: 6 });
    expect([middle.firstLine, middle.firstHead]).toEqual([9, 5]);
    expect(middle.pressure).toBeCloseTo(23.8, 2);
  });

  it("needs less pressure than a tree of the same pipes [NFPA 13]", () => {
    // The README's tree design area (Wrenfield Road, OH2): 0.20 gpm/ft² over 1500 ft², 120 ft² a sprinkler, K 8.0,
    // 12 ft apart, 1¼ lines and 2½ cross main (Schedule 40 [ASME B36.10M]): 13 sprinklers on 4 lines (4 + 4 + 4 + 1),
    // 375.2 gpm at 31.76 psi where the last line joins the cross main (README's AREADEMAND example).
    const oh2 = { density: 0.2, area: 1500, coverage: 120, kFactor: 8, headSpacing: 12, branchDiameter: 1.38, mainDiameter: 2.469, cFactor: 120, minPressure: 7 };
    const tree = solveAreaDemand(oh2);
    // The same four lines as a grid: 59.99 ft long they hold floor(59.99 / 12) = 4 sprinklers with end gaps
    // (59.99 − 36) / 2 = 11.995 ft, the tree's 12 ft from the cross main to the first sprinkler; the riser joins the
    // near main at line 4, where AREADEMAND gives its pressure. The only difference is the far main: 2½ in pipe
    // tying the lines' far ends together (and the 12 ft to it past each line's end sprinkler).
    const grid = solveGridDemand({ ...oh2, lines: 4, lineLength: 59.99, feedLine: 4 });
    expect([grid.heads, grid.lines, grid.placements]).toEqual([tree.heads, tree.lines, 1]);
    // In the tree every line's flow enters at one end, through one pipe, and line 4 (one sprinkler) carries little.
    // In the grid, water also runs through line 4 past its sprinkler into the far main and along it to the far ends
    // of lines 1 … 3: each of their sprinklers is fed from both ends, each path carries about half the flow, and
    // Hazen-Williams loss, ∝ Q^1.85, falls to about a quarter on it. The least-favoured sprinkler is reached for
    // 22.58 psi instead of 31.76 (29 % less), and as the other sprinklers run closer to it the flow drops too
    // (341.7 gpm instead of 375.2).
    expect(grid.pressure).toBeLessThan(0.75 * tree.pressure);
    expect(grid.flow).toBeLessThan(tree.flow);
    // the figures above (and in README), the engine's values to the precision shown
    expect([tree.pressure, tree.flow]).toEqual([expect.closeTo(31.76, 2), expect.closeTo(375.2, 1)]);
    expect([grid.pressure, grid.flow]).toEqual([expect.closeTo(22.58, 2), expect.closeTo(341.7, 1)]);
    expect(grid.flow).toBeGreaterThanOrEqual(0.2 * 1500); // never below density × area [NFPA 13]
    expect(grid.endPressure).toBeCloseTo(tree.endPressure, 5); // both at (24 / 8)² = 9 psi [NFPA 13]
  });
});

describe("the search at the network solve's floor", () => {
  it("answers where its bracket closes before the flow is within 1e-7: 1 in lines of K 11.2 sprinklers (property test's case)", () => {
    // A case the property tests found (common practice: a deliberately undersized grid): 0.05 gpm/ft² over 2859 ft²,
    // 81.7 ft² a sprinkler, K 11.2, 8 ft apart, 4 lines 76 ft long of 1 in pipe (1.049 in inside [ASME B36.10M]) on
    // 6.29 in mains, C 100. The riser needs thousands of psi there, where the network solve settles the least-favoured
    // flow only to about 1e-7 of itself: the search used to close its bracket and run out of steps.
    const inp: GridDemandInput = {
      density: 0.05, area: 2859.487427334814, coverage: 81.69964077866041, kFactor: 11.199986514138583, headSpacing: 8,
      lines: 4, lineLength: 76, branchDiameter: 1.049, mainDiameter: 5.989013670477899 * 1.0500000023807308, cFactor: 100,
      minPressure: 7, feedLine: 1,
    };
    const r = solveGridDemand(inp, headLoss("US"), true);
    const s = r.solved!;
    const qReq = Math.max(inp.density * inp.coverage, inp.kFactor * Math.sqrt(7)); // [NFPA 13]
    const least = Math.min(...s.grid.flowing.map((i) => s.solution.outflow[i]));
    expect(Math.abs(least / qReq - 1)).toBeLessThanOrEqual(GRID_FLOOR_TOLERANCE);
    expect(r.pressure).toBeGreaterThan(1000);
    // and the smaller mains of the same grid need more, as they must
    expect(solveGridDemand({ ...inp, mainDiameter: 5.989013670477899 }).pressure).toBeGreaterThan(r.pressure);
  });
});

describe("GRIDDEMAND solve: bad input is an error that says so", () => {
  it("a design area needing more lines than the grid has", () => {
    // n = 12, m = 4: l = 3 lines
    expect(errorOf(() => solveGridDemand({ ...base, lines: 2 })).message).toBe(
      "lines: got 2; must be at least 3: the design area's 12 sprinklers, at most 4 on a line of 12, need 3 lines",
    );
    // a short line holds fewer: 40 ft at 13 ft holds floor(3.08) = 3, so m = 3 and l = 4
    expect(errorOf(() => solveGridDemand({ ...base, lines: 3, lineLength: 40 })).message).toBe(
      "lines: got 3; must be at least 4: the design area's 12 sprinklers, at most 3 on a line of 3, need 4 lines",
    );
  });

  it("a feed line outside 1 … lines", () => {
    expect(errorOf(() => solveGridDemand({ ...base, feedLine: 11 })).message).toBe("feed_line: got 11; must be a whole number from 1 to lines, 10");
    expect(errorOf(() => solveGridDemand({ ...base, feedLine: 0 })).message).toBe("feed_line: got 0; must be a whole number from 1 to lines, 10");
    expect(errorOf(() => solveGridDemand({ ...base, feedLine: 2.5 })).message).toBe("feed_line: got 2.5; must be a whole number from 1 to lines, 10");
  });

  it("a line shorter than one head spacing", () => {
    expect(errorOf(() => solveGridDemand({ ...base, lineLength: 12 })).message).toBe(
      "line_length: got 12 ft; must be at least head_spacing, 13 ft: a line shorter than one head spacing holds no sprinkler",
    );
  });

  it("a count of lines that is not a whole number from 1 to 200, or a grid of more than 2000 sprinklers", () => {
    expect(errorOf(() => solveGridDemand({ ...base, lines: 0 })).message).toBe("lines: got 0; must be a whole number of branch lines from 1 to 200");
    expect(errorOf(() => solveGridDemand({ ...base, lines: 4.5 })).message).toBe("lines: got 4.5; must be a whole number of branch lines from 1 to 200");
    expect(errorOf(() => solveGridDemand({ ...base, lines: 201 })).message).toBe("lines: got 201; must be a whole number of branch lines from 1 to 200");
    // 100 lines of floor(300 / 13) = 23: 2300 sprinklers; at most floor(2000 / 100) = 20 a line, so a line shorter than
    // 21 × 13 = 273 ft
    expect(errorOf(() => solveGridDemand({ ...base, lines: 100, lineLength: 300 })).message).toBe(
      "line_length: got 300 ft; must be below 273 ft with 100 lines and a head_spacing of 13 ft: a grid of more than 2000 sprinklers is an input error",
    );
  });

  it("every numeric argument out of its range, named", () => {
    const named: Array<[Partial<GridDemandInput>, RegExp]> = [
      [{ density: 0 }, /^density: got 0 gpm\/ft²; must be greater than 0$/],
      [{ area: -1 }, /^area: got -1 ft²; must be greater than 0$/],
      [{ coverage: Number.NaN }, /^coverage: got NaN ft²; must be greater than 0$/],
      [{ kFactor: 0 }, /^k_factor: got 0 gpm\/psi\^0.5; must be greater than 0$/],
      [{ headSpacing: 0 }, /^head_spacing: got 0 ft; must be greater than 0$/],
      [{ lineLength: Infinity }, /^line_length: got Infinity ft; must be greater than 0$/],
      [{ branchDiameter: 0 }, /^branch_diameter: got 0 in; must be greater than 0$/],
      [{ mainDiameter: -2 }, /^main_diameter: got -2 in; must be greater than 0$/],
      [{ cFactor: 0 }, /^c_factor: got 0; must be greater than 0$/],
      [{ minPressure: 0 }, /^min_pressure: got 0 psi; must be greater than 0$/],
      [{ coverage: 2000 }, /^coverage: got 2000 ft²; must not exceed the design area 1500 ft²$/],
      [{ coverage: 8 }, /^coverage: got 8 ft²; must be at least 9 ft²/],
      [{ headSpacing: 2 }, /^head_spacing: got 2 ft; must be at least 3 ft/],
      [{ headSpacing: 50 }, /^head_spacing: got 50 ft; must be at most coverage ÷ 3 ft = 43.3333 ft/],
    ];
    for (const [change, message] of named) expect(errorOf(() => solveGridDemand({ ...base, ...change })).message).toMatch(message);
  });
});
