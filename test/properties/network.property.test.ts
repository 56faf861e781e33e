/**
 * Properties of the network solver on random small connected networks: whatever the layout, the solution balances
 * the flow at every node, every sprinkler flows K √p (nothing at p ≤ 0) [NFPA 13], every pipe loses its Hazen-Williams
 * loss [NFPA 13], and every fixed-pressure node keeps its pressure.
 */
import { describe, expect } from "vitest";
import { fc, test } from "@fast-check/vitest";
import { type Network, type NetworkNode, type NetworkPipe, solveNetwork } from "../../src/engine/network";
import { departures } from "../engine/networks";

const RUNS = { numRuns: 300 };
const d = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

const node = fc.record({
  elevation: d(-10, 40),
  k: fc.oneof(fc.constant(0), d(1.4, 25.2)),
  demand: fc.oneof(fc.constant(0), d(0, 50)),
  fixed: fc.oneof({ weight: 4, arbitrary: fc.constant(undefined) }, { weight: 1, arbitrary: d(5, 175) }),
});
const pipeSize = fc.record({ diameter: d(1, 8.3), cFactor: d(100, 150), length: d(2, 400) });

/**
 * A connected network of 2 to 16 nodes: node 0 is a source (5 to 175 psi), each later node hangs off an earlier one
 * (a spanning tree), and up to as many pipes again join random pairs (loops, parallel pipes). Pipes of 1 to 8.3 in,
 * demands up to 50 gpm: a demand far beyond what its pipes carry drives heads to minus thousands of psi, and then the
 * rounding of a head (its last digit times a stiff pipe's 1/g) is worth more than the tolerance.
 */
const network: fc.Arbitrary<Network> = fc.integer({ min: 2, max: 16 }).chain((count) =>
  fc
    .record({
      nodes: fc.array(node, { minLength: count, maxLength: count }),
      source: d(5, 175),
      parents: fc.array(fc.nat(), { minLength: count - 1, maxLength: count - 1 }),
      tree: fc.array(pipeSize, { minLength: count - 1, maxLength: count - 1 }),
      extra: fc.array(fc.record({ a: fc.nat(count - 1), b: fc.nat(count - 1), size: pipeSize }), { maxLength: count }),
    })
    .map(({ nodes, source, parents, tree, extra }) => {
      const ns: NetworkNode[] = nodes.map((x, i) => {
        const fixedPressure = i === 0 ? source : x.fixed;
        return fixedPressure === undefined ? { elevation: x.elevation, k: x.k, demand: x.demand } : { elevation: x.elevation, fixedPressure };
      });
      const ps: NetworkPipe[] = parents.map((p, i) => ({ from: p % (i + 1), to: i + 1, ...tree[i] }));
      for (const e of extra) if (e.a !== e.b) ps.push({ from: e.a, to: e.b, ...e.size });
      return { nodes: ns, pipes: ps };
    }),
);

describe("network solve on random networks", () => {
  test.prop([network], RUNS)("balances the flow at every node, and each sprinkler flows K √p [NFPA 13]", (net) => {
    const s = solveNetwork(net);
    const dep = departures(net, s);
    const scale = Math.max(1, dep.supplied);
    expect(dep.imbalance).toBeLessThanOrEqual(1e-6 * scale * (1 + 1e-9) + dep.rounding);
    expect(dep.discharge).toBeLessThanOrEqual(1e-9 * scale);
    expect(dep.fixed).toBe(0);
    expect(s.residual).toBeLessThanOrEqual(1e-6 * scale);
    for (const x of [...s.pressure, ...s.flow, ...s.outflow]) expect(Number.isFinite(x)).toBe(true);
  });

  test.prop([network], RUNS)("every pipe loses its Hazen-Williams loss, to the tolerance asked [NFPA 13]", (net) => {
    const s = solveNetwork(net, { tolerance: 1e-10 });
    const dep = departures(net, s);
    // 1e-10 of the flow asked, checked to 1e-7 of it, plus what rounding a head drives through the stiffest pipes (a
    // short, wide pipe carrying nothing turns a head's last digit into a flow)
    expect(dep.imbalance).toBeLessThanOrEqual(1e-7 * Math.max(1, dep.supplied) + dep.rounding);
    // the loss is linear below 0.001 ft/s (a loss of a few 1e-7 psi at most here), and the heads carry rounding
    expect(dep.headLoss).toBeLessThan(1e-5);
  });
});
