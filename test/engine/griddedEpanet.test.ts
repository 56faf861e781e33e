/**
 * GRIDDEMAND's grids against an outside engine: epanet-js (EPANET 2.3 as WebAssembly; a test dependency only). The
 * placement the search finds is built as the whole grid (every sprinkler a node, the closed ones K 0) with its riser
 * held at the pressure found, then solved by EPANET (test/engine/epanet.ts builds it: emitter coefficient = K, accuracy
 * 1e-6) and by Headroom's network solver. EPANET's Hazen-Williams uses the exponents 1.852 and 4.871 where [NFPA 13]
 * writes 1.85 and 4.87, so the two agree within about 0.5 %, not exactly (reference.md, "Outside checks").
 */
import { describe, expect, it } from "vitest";
import { type GridDemandInput, gridLayout, gridNetwork, solveGridDemand } from "../../src/engine/gridded";
import { solveNetwork } from "../../src/engine/network";
import { solveWithEpanet } from "./epanet";
import { OH1_GRID } from "./networks";

/** 10 lines × 12 sprinklers: the OH1 grid of ./networks.ts. */
const grid: GridDemandInput = OH1_GRID;

/**
 * The placement found, as the whole grid, solved by both engines: the largest relative difference of the node
 * pressures, and of the pipe flows, each flow measured against the larger of itself and 1 % of the riser's flow (the
 * cross flows between lines, under 1 gpm here, carry what the small difference of the exponents shifts between the
 * paths: a few hundredths of a gpm, more than 0.5 % of themselves).
 */
function compare(inp: GridDemandInput) {
  const r = solveGridDemand(inp);
  const g = gridNetwork(gridLayout(inp), { firstLine: r.firstLine, firstHead: r.firstHead }, r.pressure);
  const ours = solveNetwork(g.network, { tolerance: 1e-10 });
  const epanet = solveWithEpanet(g.network);
  let pressure = 0;
  ours.pressure.forEach((p, i) => (pressure = Math.max(pressure, Math.abs(epanet.pressure[i] - p) / p)));
  let flow = 0;
  ours.flow.forEach((q, j) => (flow = Math.max(flow, Math.abs(epanet.flow[j] - q) / Math.max(Math.abs(q), 0.01 * r.flow))));
  let sprinklers = 0;
  for (const i of g.flowing) sprinklers += inp.kFactor * Math.sqrt(epanet.pressure[i]);
  return { r, nodes: g.network.nodes.length, pipes: g.network.pipes.length, pressure, flow, sprinklers };
}

describe("GRIDDEMAND's grid against EPANET (epanet-js)", () => {
  it("a 10-line × 12-sprinkler grid fed at a corner: pressures and flows within 0.5 %", () => {
    const c = compare(grid);
    // 10 × (12 + 2) = 140 nodes; 10 × 13 line pipes and 2 × 9 on the mains = 148 pipes
    expect([c.nodes, c.pipes]).toEqual([140, 148]);
    expect([c.r.firstLine, c.r.firstHead]).toEqual([8, 6]);
    expect(c.pressure).toBeLessThan(0.005);
    expect(c.flow).toBeLessThan(0.005);
    // the sprinklers' flows in EPANET add up to the riser's flow Headroom found
    expect(Math.abs(c.sprinklers / c.r.flow - 1)).toBeLessThan(0.005);
  });

  it("the same grid fed at its middle line: pressures and flows within 0.5 %", () => {
    const c = compare({ ...grid, feedLine: 5 });
    expect(c.pressure).toBeLessThan(0.005);
    expect(c.flow).toBeLessThan(0.005);
    expect(Math.abs(c.sprinklers / c.r.flow - 1)).toBeLessThan(0.005);
  });
});
