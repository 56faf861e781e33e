/**
 * The network solver against an outside engine: epanet-js (EPANET 2.3 as WebAssembly), the same networks built in it
 * by test/engine/epanet.ts (emitter coefficient = K, accuracy 1e-6, Hazen-Williams, GPM).
 *
 * The two are not expected to agree exactly: EPANET's Hazen-Williams uses the exponents 1.852 and 4.871 where
 * [NFPA 13] uses 1.85 and 4.87 (reference.md, "Outside checks"), a difference of a few tenths of a percent in each
 * pipe's loss. Node pressures and pipe flows must agree within 0.5 %. The elevations are scaled so that both count the
 * same pressure per foot of rise (EPANET's 0.4333 psi against 0.433), leaving Hazen-Williams as the only difference.
 */
import { readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { type Network, type NetworkPipe, solveNetwork } from "../../src/engine/network";
import { solveWithEpanet } from "./epanet";

/** The largest relative departures of our pressures and flows from EPANET's. */
function compare(net: Network) {
  const ours = solveNetwork(net, { tolerance: 1e-10 });
  const theirs = solveWithEpanet(net);
  const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
  return {
    ours,
    theirs,
    pressure: Math.max(...net.nodes.map((_, i) => relative(ours.pressure[i], theirs.pressure[i]))),
    flow: Math.max(...net.pipes.map((_, j) => relative(ours.flow[j], theirs.flow[j]))),
  };
}

describe("network solve against EPANET (epanet-js)", () => {
  it("a 3-loop toy: four sprinklers at three elevations, fed by a 65 psi riser: within 0.5 %", () => {
    // node 0 the riser (65 psi, elevation 0); node 1 the top of the riser; sprinklers K 5.6 at 2 (10 ft), 3 (12 ft) and
    // 5 (10 ft), K 8.0 at 4 (12 ft); node 6 a bare tee at 11 ft. Schedule 40 [ASME B36.10M]: 2½ in 2.469, 1¼ in 1.38,
    // 1 in 1.049. Loops: 1-2-3-4-5-1, 2-6-4-3-2, 6-5-4-6 (9 pipes, 7 nodes: 9 − 7 + 1 = 3).
    const p = (from: number, to: number, diameter: number, length: number): NetworkPipe => ({ from, to, diameter, cFactor: 120, length });
    const toy: Network = {
      nodes: [
        { elevation: 0, fixedPressure: 65 },
        { elevation: 0 },
        { elevation: 10, k: 5.6 },
        { elevation: 12, k: 5.6 },
        { elevation: 12, k: 8.0 },
        { elevation: 10, k: 5.6 },
        { elevation: 11 },
      ],
      pipes: [p(0, 1, 2.469, 30), p(1, 2, 1.38, 25), p(2, 3, 1.049, 12), p(3, 4, 1.049, 12), p(4, 5, 1.049, 15), p(5, 1, 1.38, 25), p(2, 6, 1.049, 14), p(6, 4, 1.049, 14), p(6, 5, 1.049, 20)],
    };
    const c = compare(toy);
    expect(c.pressure).toBeLessThan(0.005);
    expect(c.flow).toBeLessThan(0.005);
    // the toy is a real test: every pipe flows, some against their from → to, and the sprinklers differ
    expect(Math.min(...[...c.ours.flow].map(Math.abs))).toBeGreaterThan(1);
    expect(c.ours.flow.some((x) => x < 0)).toBe(true);
    expect(c.theirs.flow.every((x, j) => Math.sign(x) === Math.sign(c.ours.flow[j]))).toBe(true);
  });

  it("a looped site main fed from two points at different pressures: within 0.5 %", () => {
    // Connections to the public main: node 0 at 72 psi (elevation 0), node 1 at 65 psi (8 ft). A ring of 8 in and 6 in
    // PVC (AWWA C900 DR18: 8 in 9.05 × (1 − 2/18) = 8.044 in, 6 in 6.90 × (1 − 2/18) = 6.133 in [AWWA C900]) at C 140
    // around a building, with a 6 in cross-connection: a 250 gpm hose allowance at node 3, the sprinkler riser's
    // 750 gpm at node 4, a hydrant flowing through a 2½ in outlet at node 6 (K = 29.83 × 0.90 × 2.5² = 168 gpm/psi^0.5
    // [NFPA 291]).
    const p = (from: number, to: number, diameter: number, length: number): NetworkPipe => ({ from, to, diameter, cFactor: 140, length });
    const site: Network = {
      nodes: [
        { elevation: 0, fixedPressure: 72 },
        { elevation: 8, fixedPressure: 65 },
        { elevation: 2 },
        { elevation: 3, demand: 250 },
        { elevation: 5, demand: 750 },
        { elevation: 6 },
        { elevation: 4, k: 168 },
        { elevation: 3 },
      ],
      pipes: [p(0, 2, 8.044, 120), p(1, 5, 6.133, 200), p(2, 3, 8.044, 400), p(3, 4, 8.044, 300), p(4, 5, 6.133, 350), p(5, 6, 6.133, 250), p(6, 7, 8.044, 300), p(7, 2, 8.044, 450), p(3, 6, 6.133, 500)],
    };
    const c = compare(site);
    expect(c.pressure).toBeLessThan(0.005);
    expect(c.flow).toBeLessThan(0.005);
    // both connections supply water, and the hydrant flows K √p
    expect(c.ours.outflow[0]).toBeLessThan(-100);
    expect(c.ours.outflow[1]).toBeLessThan(-100);
    expect(c.ours.outflow[6]).toBeCloseTo(168 * Math.sqrt(c.ours.pressure[6]), 9);
  });
});

describe("epanet-js", () => {
  it("stays a test dependency: nothing in src/ imports it", () => {
    const SRC = fileURLToPath(new URL("../../src/", import.meta.url));
    const files = readdirSync(SRC, { recursive: true, encoding: "utf8" }).filter((f) => /\.(ts|js|mjs)$/.test(f));
    expect(files.length).toBeGreaterThan(10);
    const importing = files.filter((f) => /["']epanet-js["'/]/.test(readFileSync(join(SRC, f), "utf8")));
    expect(importing).toEqual([]);
  });
});
