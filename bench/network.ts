/**
 * The network solver's share of the benchmark: one solve of a gridded system by the engine against epanet-js's
 * solveH (EPANET 2.3 as WebAssembly) on the same network, a 2,000-node network, and how the cost grows with the
 * number of nodes.
 *
 * The networks are gridded systems as GRIDDEMAND solves them: branch lines of 1¼ in Schedule 40 (1.38 in) tied at
 * both ends to 4 in cross mains (4.026 in), K 5.6 sprinklers 10 ft apart on lines 12 ft apart, a 50 psi riser at the
 * first line, and a design area of 4 lines × 5 sprinklers flowing at the far corner (every other sprinkler closed).
 *
 * "Ours" is a whole solve as a caller without a prepared topology makes it: the checks, the ordering and the Newton
 * steps; EPANET's solveH likewise opens, orders, initialises and solves its hydraulics each time. "Prepared" reuses
 * prepareNetwork's topology, as GRIDDEMAND does across its placements.
 */
import { type Network, prepareNetwork, solveNetwork } from "../src/engine/network";
import { epanetModel } from "../test/engine/epanet";
import { gridNetwork } from "../test/engine/networks";
import { compare as compareRounds, median, round } from "./timing";

interface Figure { name: string; value: number; unit: string; goal?: string; ok?: boolean }

/** Milliseconds per call of `fn`, one round of `n` calls. */
const roundMs = (fn: () => unknown, n: number) => round(fn, n) / 1e6;

/** Two ways of doing the same work side by side, 11 rounds: each one's median ms per call and the median ratio a/b. */
function compare(a: () => unknown, b: () => unknown, n: number) {
  const c = compareRounds(a, b, n, 11);
  return { a: c.a / 1e6, b: c.b / 1e6, ratio: c.ratio };
}

/** A gridded system of `lines` × `heads` sprinklers, the design area's 4 × 5 flowing at the far corner. */
function grid(lines: number, heads: number): Network {
  return gridNetwork({
    lines, heads, k: 5.6, headSpacing: 10, lineSpacing: 12, branchDiameter: 1.38, mainDiameter: 4.026, pressure: 50, feedLine: 0,
    flowing: (l, h) => l >= lines - 4 && h >= heads - 5,
  });
}

/** Our solve and EPANET's of `net`: milliseconds each, cold and prepared, and how far apart their pressures are. */
function sideBySide(net: Network, calls: number) {
  const epanet = epanetModel(net);
  try {
    epanet.solve();
    const theirs = epanet.read();
    const ours = solveNetwork(net);
    const gap = Math.max(...theirs.pressure.map((p, i) => Math.abs(ours.pressure[i] - p) / p));
    const cold = compare(() => solveNetwork(net), () => epanet.solve(), calls);
    const prepared = prepareNetwork(net);
    const warm = compare(() => solveNetwork(net, { prepared }), () => epanet.solve(), calls);
    return { cold, warm, gap, iterations: ours.iterations, epanetIterations: epanet.iterations() };
  } finally {
    epanet.close();
  }
}

export function networkBench(): Figure[] {
  const figures: Figure[] = [];
  const record = (f: Figure) => figures.push(f);

  // ── one solve against EPANET: a 20 × 20 grid ──────────────────────────────────────────────────────────────────────
  {
    const net = grid(20, 20);
    const s = sideBySide(net, 40);
    const label = `network 20×20 grid (${net.nodes.length} nodes)`;
    record({ name: `${label}, ours ms/solve`, value: s.cold.a, unit: "ms" });
    record({ name: `${label}, epanet-js solveH ms/solve`, value: s.cold.b, unit: "ms" });
    record({ name: `${label}, ratio ours/EPANET`, value: s.cold.ratio, unit: "×", goal: "≤ 1.0", ok: s.cold.ratio <= 1 });
    record({ name: `${label}, prepared, ms/solve`, value: s.warm.a, unit: "ms" });
    record({ name: `${label}, ratio prepared/EPANET`, value: s.warm.ratio, unit: "×" });
    record({ name: `${label}, Newton steps ours / EPANET trials`, value: s.iterations / s.epanetIterations, unit: `(${s.iterations}/${s.epanetIterations})` });
    record({ name: `${label}, largest pressure gap vs EPANET`, value: 100 * s.gap, unit: "%", goal: "≤ 0.5", ok: s.gap <= 0.005 });
  }

  // ── a 2,000-node network ──────────────────────────────────────────────────────────────────────────────────────────
  {
    const net = grid(40, 48);
    const prepared = prepareNetwork(net);
    const cold = median(Array.from({ length: 9 }, () => roundMs(() => solveNetwork(net), 10)));
    const warm = median(Array.from({ length: 9 }, () => roundMs(() => solveNetwork(net, { prepared }), 10)));
    const label = `network 40×48 grid (${net.nodes.length} nodes)`;
    record({ name: `${label}, ms/solve`, value: cold, unit: "ms", goal: "≤ 20", ok: cold <= 20 });
    record({ name: `${label}, prepared, ms/solve`, value: warm, unit: "ms" });
  }

  // ── how the cost grows with the number of nodes ──────────────────────────────────────────────────────────────────
  {
    const sizes: Array<[number, number]> = [[10, 23], [14, 34], [20, 48], [28, 69], [40, 98]]; // ≈ 250 … 4,000 nodes
    const points: Array<[number, number]> = [];
    for (const [lines, heads] of sizes) {
      const net = grid(lines, heads);
      const calls = Math.max(4, Math.round(8000 / net.nodes.length));
      const s = sideBySide(net, calls);
      points.push([net.nodes.length, s.cold.a]);
      record({ name: `network ${net.nodes.length} nodes (${lines}×${heads}), ours ms/solve`, value: s.cold.a, unit: "ms" });
      record({ name: `network ${net.nodes.length} nodes (${lines}×${heads}), epanet-js ms/solve`, value: s.cold.b, unit: "ms" });
      record({ name: `network ${net.nodes.length} nodes (${lines}×${heads}), ratio ours/EPANET`, value: s.cold.ratio, unit: "×" });
    }
    // the exponent x of t ∝ n^x, fitted through the smallest and the largest
    const [[n0, t0], [n1, t1]] = [points[0], points[points.length - 1]];
    record({ name: "network cost growth, t ∝ n^x: x", value: Math.log(t1 / t0) / Math.log(n1 / n0), unit: "" });
  }
  return figures;
}
