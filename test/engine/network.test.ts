import { describe, expect, it } from "vitest";
import { HW_CONSTANT_SI_AS_US, HW_CONSTANT_US } from "../../src/engine/friction";
import { type Network, type NetworkNode, type NetworkPipe, prepareNetwork, solveNetwork } from "../../src/engine/network";
import { errorOf } from "./engineError";
import { departures, gridNetwork } from "./networks";

// Hazen-Williams, US form [NFPA 13]: loss = 4.52 L Q^1.85 / (C^1.85 d^4.87) psi, written out here so that the test does
// not lean on the engine's own formula. C 120 throughout: 120^1.85 = 7022.40.
const r = (length: number, d: number) => (4.52 * length) / (120 ** 1.85 * d ** 4.87);
const pipe = (from: number, to: number, diameter: number, length: number): NetworkPipe => ({ from, to, diameter, cFactor: 120, length });

describe("network solve: two loops worked by hand [NFPA 13]", () => {
  // A 60 psi source (node 0, elevation 0) feeds node 1 through 50 ft of 4 in Schedule 40 (4.026 in [ASME B36.10M]);
  // from node 1 three pipes in parallel (two loops) reach node 2, 10 ft higher, which draws a fixed 300 gpm:
  //   B: 100 ft of 3 in (3.068 in [ASME B36.10M]), C: 400 ft of 3 in, D: 50 ft of 2 in (2.067 in [ASME B36.10M]).
  // Every parallel pipe loses the same h, so Q_i = (h / r_i)^(1/1.85) and Σ Q_i = 300 gives h in closed form.
  //   r = 4.52 L / (7022.40 d^4.87); 4.026^4.87 = 882.542, 3.068^4.87 = 234.955, 2.067^4.87 = 34.3327
  //   r_A = 4.52 × 50 / (7022.40 × 882.542) = 3.64660e-5;  r_B = 452 / (7022.40 × 234.955) = 2.73948e-4
  //   r_C = 4 r_B = 1.09579e-3;  r_D = 226 / (7022.40 × 34.3327) = 9.37379e-4
  //   r^(−1/1.85): B 84.2529, C 39.8242, D 43.3314; sum 167.4086
  //   h = (300 / 167.4086)^1.85 = 1.79202^1.85 = 2.94229 psi
  //   Q_B = 84.2529 × 1.79202 = 150.983, Q_C = 39.8242 × 1.79202 = 71.366, Q_D = 43.3314 × 1.79202 = 77.651 gpm
  //   p1 = 60 − r_A × 300^1.85 = 60 − 3.64660e-5 × 38 253.8 = 60 − 1.39496 = 58.6050 psi
  //   p2 = p1 − h − 0.433 × 10 = 58.6050 − 2.94229 − 4.33 = 51.3327 psi
  const net: Network = {
    nodes: [{ elevation: 0, fixedPressure: 60 }, { elevation: 0 }, { elevation: 10, demand: 300 }],
    pipes: [pipe(0, 1, 4.026, 50), pipe(1, 2, 3.068, 100), pipe(1, 2, 3.068, 400), pipe(1, 2, 2.067, 50)],
  };
  const s = solveNetwork(net);

  it("splits the flow between the parallel pipes as the closed form says", () => {
    expect(s.flow[0]).toBeCloseTo(300, 6);
    expect(s.flow[1]).toBeCloseTo(150.983, 2);
    expect(s.flow[2]).toBeCloseTo(71.366, 2);
    expect(s.flow[3]).toBeCloseTo(77.651, 2);
  });
  it("gives the pressures of the closed form, elevation included", () => {
    expect(s.pressure[0]).toBe(60);
    expect(s.pressure[1]).toBeCloseTo(58.605, 3);
    expect(s.pressure[2]).toBeCloseTo(51.3327, 3);
  });
  it("reports the outflows: the demand, nothing at the bare junction, minus the supply at the source", () => {
    expect([...s.outflow].map((x) => Number(x.toFixed(6)))).toEqual([-300, 0, 300]);
  });
  it("checks its own arithmetic: the resistances as written above", () => {
    expect(r(50, 4.026)).toBeCloseTo(3.6466e-5, 9);
    expect(r(100, 3.068)).toBeCloseTo(2.73948e-4, 9);
    expect(r(50, 2.067)).toBeCloseTo(9.37379e-4, 9);
  });

  it("in SI work uses the EN 12845 constant: every pressure drop × 4.520854 / 4.52, the split unchanged [EN 12845]", () => {
    // The flows are set by the demand and by the ratios of the resistances, which share the constant; each pressure
    // drop scales with it: 6.05e5 × 3.785411784^1.85 / 25.4^4.87 / (0.0689476 / 0.3048) = 4.520854 (friction.ts).
    const si = solveNetwork(net, { units: "SI" });
    const ratio = HW_CONSTANT_SI_AS_US / HW_CONSTANT_US;
    expect(ratio).toBeCloseTo(4.520854 / 4.52, 6);
    expect(si.flow[1]).toBeCloseTo(s.flow[1], 6);
    expect(60 - si.pressure[1]).toBeCloseTo((60 - s.pressure[1]) * ratio, 6);
    expect(si.pressure[1] - si.pressure[2] - 4.33).toBeCloseTo((s.pressure[1] - s.pressure[2] - 4.33) * ratio, 6);
  });
});

describe("network solve: a symmetric ladder [NFPA 13]", () => {
  // A 75 psi source (node 0) feeds node 1 through 20 ft of 4 in (4.026 in); node 1 feeds nodes 2 and 3 through 60 ft
  // of 2½ in each (2.469 in [ASME B36.10M]); 2 and 3 feed node 4 (12 ft higher) through 60 ft of 2 in each
  // (2.067 in), and a 30 ft 1 in cross pipe (1.049 in) joins 2 and 3. Demands: 50 gpm at 2 and at 3, 100 at 4.
  // By symmetry the cross pipe carries nothing and the rest is a tree:
  //   0→1: 200 gpm, loss r(20, 4.026) × 200^1.85 = 1.45864e-5 × 18 067.8 = 0.26354 psi → p1 = 74.7365
  //   1→2, 1→3: 100 gpm, loss r(60, 2.469) × 100^1.85 = 4.73398e-4 × 5011.87 = 2.37261 psi → p2 = p3 = 72.3638
  //   2→4, 3→4: 50 gpm, loss r(60, 2.067) × 50^1.85 = 1.12485e-3 × 1390.26 = 1.56383 psi;
  //   p4 = 72.3638 − 1.56383 − 0.433 × 12 = 65.6040 psi
  const net: Network = {
    nodes: [
      { elevation: 0, fixedPressure: 75 },
      { elevation: 0 },
      { elevation: 0, demand: 50 },
      { elevation: 0, demand: 50 },
      { elevation: 12, demand: 100 },
    ],
    pipes: [pipe(0, 1, 4.026, 20), pipe(1, 2, 2.469, 60), pipe(1, 3, 2.469, 60), pipe(2, 4, 2.067, 60), pipe(4, 3, 2.067, 60), pipe(2, 3, 1.049, 30)],
  };
  const s = solveNetwork(net);
  it("carries nothing in the cross pipe (a zero-flow pipe)", () => {
    expect(Math.abs(s.flow[5])).toBeLessThan(1e-9);
  });
  it("carries the tree's flows elsewhere, signed from → to", () => {
    expect([...s.flow.slice(0, 5)].map((x) => Number(x.toFixed(6)))).toEqual([200, 100, 100, 50, -50]);
  });
  it("gives the tree's pressures", () => {
    expect(s.pressure[1]).toBeCloseTo(74.7365, 3);
    expect(s.pressure[2]).toBeCloseTo(72.3638, 3);
    expect(s.pressure[3]).toBeCloseTo(72.3638, 3);
    expect(s.pressure[4]).toBeCloseTo(65.604, 3);
  });
});

describe("network solve: sprinklers", () => {
  it("one sprinkler at the end of a pipe flows K √p at the pressure the pipe leaves it [NFPA 13]", () => {
    // 50 psi, 100 ft of 1 in (1.049 in), K 5.6: p = 50 − r Q^1.85 with r = 452 / (7022.40 × 1.049^4.87)
    // = 452 / (7022.40 × 1.262341) = 0.0509890, Q = 5.6 √p. Checked by putting the answer back:
    // p = 25.3952: Q = 5.6 × 5.03937 = 28.2205 gpm, 28.2205^1.85 = 482.551, loss 0.0509890 × 482.551 = 24.6048,
    // 50 − 24.6048 = 25.3952.
    const s = solveNetwork({ nodes: [{ elevation: 0, fixedPressure: 50 }, { elevation: 0, k: 5.6 }], pipes: [pipe(0, 1, 1.049, 100)] });
    expect(s.pressure[1]).toBeCloseTo(25.3952, 3);
    expect(s.flow[0]).toBeCloseTo(28.2205, 3);
    expect(s.outflow[1]).toBeCloseTo(5.6 * Math.sqrt(s.pressure[1]), 10);
  });

  // 6 lines × 8 sprinklers, K 5.6, 10 ft by 12 ft, 1¼ in lines (1.38 in), 3 in mains (3.068 in), 60 psi riser at the
  // second line, the grid rising 6 ft across
  const grid = gridNetwork({ lines: 6, heads: 8, k: 5.6, headSpacing: 10, lineSpacing: 12, branchDiameter: 1.38, mainDiameter: 3.068, pressure: 60, feedLine: 1, rise: 6 });
  const s = solveNetwork(grid);
  const d = departures(grid, s);

  it("balances the flow at every node of a grid", () => {
    expect(d.imbalance).toBeLessThanOrEqual(1e-6 * d.supplied);
    expect(d.supplied).toBeGreaterThan(0);
  });
  it("flows K √p at every sprinkler, keeps the riser's pressure, and every pipe loses its Hazen-Williams loss [NFPA 13]", () => {
    expect(d.discharge).toBeLessThan(1e-9);
    expect(d.fixed).toBe(0);
    expect(d.headLoss).toBeLessThan(1e-4);
  });
  it("reports a residual within the tolerance, and tightens to it when asked", () => {
    expect(s.residual).toBeLessThanOrEqual(1e-6 * d.supplied);
    const tight = solveNetwork(grid, { tolerance: 1e-12 });
    expect(tight.residual).toBeLessThanOrEqual(1e-12 * d.supplied);
    expect(departures(grid, tight).imbalance).toBeLessThanOrEqual(1e-11 * d.supplied);
    expect(tight.iterations).toBeGreaterThanOrEqual(s.iterations);
  });
  it("feeds a grid's lines from both mains: the far main carries water from the line at the riser to the last", () => {
    // level, 2 in lines (2.067 in), fed at line 0. gridNetwork lays pipe 2 + 2l from far main node l to l + 1, and
    // each line's last pipe (1 + 2 × 5 + 9l + 8) from its last sprinkler to the far main.
    const level = gridNetwork({ lines: 6, heads: 8, k: 5.6, headSpacing: 10, lineSpacing: 12, branchDiameter: 2.067, mainDiameter: 3.068, pressure: 60, feedLine: 0 });
    const x = solveNetwork(level);
    const lastPipe = (line: number) => 1 + 2 * 5 + line * 9 + 8;
    expect(x.flow[lastPipe(0)]).toBeGreaterThan(0);
    for (let l = 0; l < 5; l++) expect(x.flow[2 + 2 * l]).toBeGreaterThan(0);
    expect(x.flow[lastPipe(5)]).toBeLessThan(0);
  });

  it("a closed sprinkler (K 0) flows nothing, and a dead end behind it carries nothing", () => {
    // 3 lines × 4 sprinklers, only line 0's first two flowing
    const g = gridNetwork({ lines: 3, heads: 4, k: 8, headSpacing: 10, lineSpacing: 10, branchDiameter: 1.049, mainDiameter: 2.067, pressure: 40, feedLine: 0, flowing: (l, h) => l === 0 && h < 2 });
    const x = solveNetwork(g);
    g.nodes.forEach((node, i) => {
      if (node.k === 0) expect(x.outflow[i]).toBe(0);
    });
    expect(x.outflow[1 + 6]).toBeCloseTo(8 * Math.sqrt(x.pressure[1 + 6]), 10);
    const dd = departures(g, x);
    expect(dd.imbalance).toBeLessThanOrEqual(1e-6 * dd.supplied);
    // a dead end: a closed sprinkler hanging off a flowing one
    const dead = solveNetwork({
      nodes: [{ elevation: 0, fixedPressure: 30 }, { elevation: 0, k: 5.6 }, { elevation: 0, k: 0 }],
      pipes: [pipe(0, 1, 1.049, 20), pipe(1, 2, 1.049, 10)],
    });
    expect(Math.abs(dead.flow[1])).toBeLessThan(1e-9);
    expect(dead.pressure[2]).toBeCloseTo(dead.pressure[1], 9);
  });

  it("a sprinkler above the height the source can lift to flows nothing [NFPA 13]", () => {
    // 10 psi at elevation 0 lifts water 10 / 0.433 = 23.09 ft; a K 5.6 sprinkler at 40 ft sits at
    // 10 − 0.433 × 40 = −7.32 psi with no flow
    const s = solveNetwork({ nodes: [{ elevation: 0, fixedPressure: 10 }, { elevation: 40, k: 5.6 }], pipes: [pipe(0, 1, 1.049, 50)] });
    expect(s.outflow[1]).toBe(0);
    expect(Math.abs(s.flow[0])).toBeLessThan(1e-9);
    expect(s.pressure[1]).toBeCloseTo(-7.32, 9);
  });

  it("with no flow, pressure falls 0.433 psi per ft of rise [NFPA 13]", () => {
    // 80 psi at 0 ft; closed sprinklers at 30 ft and at −10 ft: 80 − 0.433 × 30 = 67.01; 80 + 4.33 = 84.33
    const s = solveNetwork({
      nodes: [{ elevation: 0, fixedPressure: 80 }, { elevation: 30, k: 0 }, { elevation: -10 }],
      pipes: [pipe(0, 1, 2.067, 40), pipe(0, 2, 2.067, 40)],
    });
    expect(s.pressure[1]).toBeCloseTo(67.01, 9);
    expect(s.pressure[2]).toBeCloseTo(84.33, 9);
  });
});

describe("network solve: sources", () => {
  it("two sources at different pressures pass water from the higher to the lower [NFPA 13]", () => {
    // 70 psi and 50 psi joined by 200 ft of 4 in (4.026 in) through a bare junction: 20 psi drives
    // Q = (20 / r)^(1/1.85) with r = r(200, 4.026) = 4.52 × 200 / (7022.40 × 882.542) = 1.45864e-4;
    // 20 / 1.45864e-4 = 137 114; 137 114^0.540541 = 598.14 gpm
    const s = solveNetwork({
      nodes: [{ elevation: 0, fixedPressure: 70 }, { elevation: 0 }, { elevation: 0, fixedPressure: 50 }],
      pipes: [pipe(0, 1, 4.026, 100), pipe(1, 2, 4.026, 100)],
    });
    expect(s.flow[0]).toBeCloseTo(598.14, 1);
    expect(s.flow[1]).toBeCloseTo(s.flow[0], 9);
    expect(s.pressure[1]).toBeCloseTo(60, 6);
    expect(s.outflow[0]).toBeCloseTo(-s.flow[0], 9);
    expect(s.outflow[2]).toBeCloseTo(s.flow[0], 9);
    expect(s.pressure[0]).toBe(70);
    expect(s.pressure[2]).toBe(50);
  });
});

describe("network solve: two sources and no junction", () => {
  it("a pipe between two sources carries what their difference drives, and nothing is left to solve for [NFPA 13]", () => {
    // the same 200 ft of 4 in and 20 psi as above: 598.14 gpm
    const s = solveNetwork({
      nodes: [{ elevation: 0, fixedPressure: 70 }, { elevation: 0, fixedPressure: 50 }],
      pipes: [pipe(0, 1, 4.026, 200)],
    });
    expect(s.flow[0]).toBeCloseTo(598.14, 1);
    expect([...s.pressure]).toEqual([70, 50]);
  });
});

describe("network solve: reuse", () => {
  const g = gridNetwork({ lines: 5, heads: 6, k: 5.6, headSpacing: 10, lineSpacing: 12, branchDiameter: 1.38, mainDiameter: 3.068, pressure: 50, feedLine: 2 });
  const cold = solveNetwork(g);

  it("a prepared topology gives the same solution", () => {
    const prepared = prepareNetwork(g);
    const again = solveNetwork(g, { prepared });
    expect([...again.pressure]).toEqual([...cold.pressure]);
    // a new riser pressure, and sprinklers shut, on the same topology
    const changed: Network = {
      nodes: g.nodes.map((node, i) => (i === 0 ? { ...node, fixedPressure: 65 } : i % 3 === 0 ? { ...node, k: 0 } : node)),
      pipes: g.pipes,
    };
    const a = solveNetwork(changed, { prepared });
    const b = solveNetwork(changed);
    for (let i = 0; i < g.nodes.length; i++) expect(a.pressure[i]).toBeCloseTo(b.pressure[i], 9);
  });

  it("a warm start from the solution itself takes no further step, and one from a neighbour converges faster", () => {
    const same = solveNetwork(g, { warmStart: cold });
    expect(same.iterations).toBe(0);
    expect([...same.flow]).toEqual([...cold.flow]);
    const neighbour: Network = { nodes: g.nodes.map((node, i) => (i === 0 ? { ...node, fixedPressure: 52 } : node)), pipes: g.pipes };
    const warm = solveNetwork(neighbour, { warmStart: cold });
    const fresh = solveNetwork(neighbour);
    expect(warm.iterations).toBeLessThan(fresh.iterations);
    for (let i = 0; i < g.nodes.length; i++) expect(warm.pressure[i]).toBeCloseTo(fresh.pressure[i], 4);
  });

  it("a warm start from a solution with other sprinklers flowing gives the cold solution", () => {
    // the design area moved: the first two lines' sprinklers shut, the rest flowing, at a new riser pressure
    const moved: Network = {
      nodes: g.nodes.map((node, i) => (i === 0 ? { ...node, fixedPressure: 70 } : i >= 11 && i < 11 + 12 ? { ...node, k: 0 } : node)),
      pipes: g.pipes,
    };
    const prepared = prepareNetwork(g);
    const warm = solveNetwork(moved, { warmStart: cold, prepared });
    const fresh = solveNetwork(moved);
    for (let i = 0; i < g.nodes.length; i++) expect(warm.pressure[i]).toBeCloseTo(fresh.pressure[i], 4);
    for (let j = 0; j < g.pipes.length; j++) expect(warm.flow[j]).toBeCloseTo(fresh.flow[j], 3);
    expect(warm.outflow[11]).toBe(0);
  });

  it("refuses a topology prepared for another network", () => {
    const other = gridNetwork({ lines: 4, heads: 6, k: 5.6, headSpacing: 10, lineSpacing: 12, branchDiameter: 1.38, mainDiameter: 3.068, pressure: 50, feedLine: 2 });
    const e = errorOf(() => solveNetwork(g, { prepared: prepareNetwork(other) }));
    expect(e.kind).toBe("value");
    expect(e.message).toBe("options.prepared was prepared for another network: its pipes or its fixed-pressure nodes differ");
  });
});

describe("network: ordering", () => {
  it("eliminates a grid's lines first: 40 lines × 48 sprinklers factor with a few entries per junction", () => {
    const g = gridNetwork({ lines: 40, heads: 48, k: 5.6, headSpacing: 10, lineSpacing: 12, branchDiameter: 1.38, mainDiameter: 4.026, pressure: 50, feedLine: 0 });
    const prep = prepareNetwork(g);
    // 40 × 48 sprinklers and 2 × 40 main nodes are the junctions; the riser is fixed
    expect(prep.unknowns).toBe(40 * 48 + 80);
    // Eliminating a sprinkler of a line joins its two neighbours (one new entry), and the mains are a ladder: every
    // column holds at most 2 entries below its diagonal, so at most 3 entries and 3 multiply-adds per junction (a
    // dense factor would hold 2000 × 2001 / 2 = 2 001 000)
    expect(prep.factorEntries).toBeLessThanOrEqual(3 * prep.unknowns);
    expect(prep.factorWork).toBeLessThanOrEqual(3 * prep.unknowns);
    expect(prep.factorEntries).toBeGreaterThanOrEqual(prep.unknowns + g.pipes.length - 1);
    // every junction once in the order, every pipe once in the pipes' order
    expect([...prep.order].sort((a, b) => a - b)).toEqual(Array.from({ length: prep.unknowns }, (_, i) => i + 1));
    expect([...prep.pipeOrder].sort((a, b) => a - b)).toEqual(Array.from({ length: g.pipes.length }, (_, j) => j));
  });
});

describe("network solve: no convergence", () => {
  it("is a converge error stating the residual reached, never a number", () => {
    const g = gridNetwork({ lines: 4, heads: 5, k: 5.6, headSpacing: 10, lineSpacing: 12, branchDiameter: 1.38, mainDiameter: 3.068, pressure: 50, feedLine: 0 });
    const e = errorOf(() => solveNetwork(g, { maxIterations: 1 }));
    expect(e.kind).toBe("converge");
    expect(e.message).toMatch(/^network did not converge in 1 iteration: the largest flow imbalance or correction was still \d+(\.\d+)? gpm$/);
    expect(e.messageIn("SI")).toMatch(/was still \d+(\.\d+)? L\/min$/);
  });
});

describe("network: bad input", () => {
  const base = (): { nodes: NetworkNode[]; pipes: NetworkPipe[] } => ({
    nodes: [{ elevation: 0, fixedPressure: 50 }, { elevation: 0, k: 5.6 }, { elevation: 0 }],
    pipes: [pipe(0, 1, 1.049, 10), pipe(1, 2, 1.049, 10)],
  });
  const message = (change: (n: { nodes: NetworkNode[]; pipes: NetworkPipe[] }) => void, options = {}) => {
    const net = base();
    change(net);
    const e = errorOf(() => solveNetwork(net, options));
    expect(e.kind).toBe("value");
    return e.message;
  };

  it("nodes joined to no fixed-pressure node", () => {
    expect(message((n) => n.pipes.pop())).toBe("network node 2 is connected to no fixed-pressure node");
    expect(message((n) => n.nodes.push({ elevation: 0 }, { elevation: 0 }))).toBe("network nodes 3, 4 are connected to no fixed-pressure node");
    expect(message((n) => n.nodes.push(...Array.from({ length: 12 }, () => ({ elevation: 0 }))))).toBe(
      "network nodes 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, … (12 in all) are connected to no fixed-pressure node",
    );
  });
  it("no fixed-pressure node at all", () => {
    expect(message((n) => delete n.nodes[0].fixedPressure)).toBe("network has no fixed-pressure node: give at least one node a fixedPressure");
  });
  it("a pipe to a missing node, or from a node to itself", () => {
    expect(message((n) => (n.pipes[1].to = 3))).toBe("pipes[1].to: got 3; must be the index of a node, a whole number from 0 to 2");
    expect(message((n) => (n.pipes[0].from = 0.5))).toBe("pipes[0].from: got 0.5; must be the index of a node, a whole number from 0 to 2");
    expect(message((n) => (n.pipes[1].to = 1))).toBe("pipes[1].to: got 1; must differ from pipes[1].from: a pipe joins two nodes");
  });
  it("a diameter, C or length not above 0", () => {
    expect(message((n) => (n.pipes[0].diameter = 0))).toBe("pipes[0].diameter: got 0 in; must be greater than 0");
    expect(message((n) => (n.pipes[1].cFactor = -120))).toBe("pipes[1].cFactor: got -120; must be greater than 0");
    expect(message((n) => (n.pipes[1].length = 0))).toBe("pipes[1].length: got 0 ft; must be greater than 0");
  });
  it("a negative K, demand or fixed pressure", () => {
    expect(message((n) => (n.nodes[1].k = -5.6))).toBe("nodes[1].k: got -5.6 gpm/psi^0.5; must be 0 or more (0: no sprinkler)");
    expect(message((n) => (n.nodes[2].demand = -250))).toBe("nodes[2].demand: got -250 gpm; must be 0 or more");
    expect(message((n) => (n.nodes[0].fixedPressure = -1))).toBe("nodes[0].fixedPressure: got -1 psi; must be 0 or more");
  });
  it("anything not finite", () => {
    expect(message((n) => (n.nodes[2].elevation = Number.NaN))).toBe("nodes[2].elevation: got NaN ft; must be a finite number");
    expect(message((n) => (n.nodes[1].k = Number.POSITIVE_INFINITY))).toBe("nodes[1].k: got Infinity gpm/psi^0.5; must be 0 or more (0: no sprinkler)");
    expect(message((n) => (n.nodes[0].fixedPressure = Number.NaN))).toBe("nodes[0].fixedPressure: got NaN psi; must be 0 or more");
    expect(message((n) => (n.pipes[0].length = Number.POSITIVE_INFINITY))).toBe("pipes[0].length: got Infinity ft; must be greater than 0");
    expect(message((n) => (n.pipes[1].diameter = Number.NaN))).toBe("pipes[1].diameter: got NaN in; must be greater than 0");
    expect(message((n) => (n.pipes[1].from = Number.NaN))).toBe("pipes[1].from: got NaN; must be the index of a node, a whole number from 0 to 2");
  });
  it("options out of range", () => {
    expect(message(() => {}, { maxIterations: 0 })).toBe("options.maxIterations: got 0; must be a whole number, 1 or more");
    expect(message(() => {}, { tolerance: 0 })).toBe("options.tolerance: got 0; must be greater than 0");
    expect(message(() => {}, { units: "metric" })).toBe('options.units: got "metric"; must be "US" or "SI"');
    const s = solveNetwork(base());
    const short = { ...s, flow: s.flow.slice(1) };
    expect(message(() => {}, { warmStart: short })).toBe("options.warmStart: got a solution of 3 nodes and 1 pipes; must solve a network of 3 nodes and 2 pipes");
  });
});
