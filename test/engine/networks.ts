/**
 * Networks for the network solver's tests and the bench: a gridded sprinkler system built node by node, and the
 * checks every solution must pass (flow balanced at every node, every sprinkler K √p, every pipe losing what the heads
 * across it say).
 */
import { headLoss, velocity } from "../../src/engine/friction";
import type { GridDemandInput } from "../../src/engine/gridded";
import type { Network, NetworkNode, NetworkPipe, NetworkSolution } from "../../src/engine/network";
import { PSI_PER_FT_WATER, type UnitSystem } from "../../src/engine/units";

/** A gridded system's layout, US units. */
export interface GridLayout {
  /** branch lines */
  lines: number;
  /** sprinklers on each line */
  heads: number;
  /** sprinkler K, gpm/psi^0.5 */
  k: number;
  /** ft between sprinklers along a line (and from each main to the first sprinkler) */
  headSpacing: number;
  /** ft between lines */
  lineSpacing: number;
  /** internal diameters, in */
  branchDiameter: number;
  mainDiameter: number;
  /** riser pressure, psi */
  pressure: number;
  /** the line (0-based) whose near end the riser feeds */
  feedLine: number;
  /** the lines' rise across the grid, ft from the first line to the last (the mains slope with them) */
  rise?: number;
  /** which sprinklers flow (line, head, 0-based); all when absent */
  flowing?: (line: number, head: number) => boolean;
}

/**
 * A gridded system: `lines` branch lines of `heads` sprinklers each, both ends of every line joined to a cross main
 * (near and far), fed by a riser (node 0, fixed pressure) at the near main where line `feedLine` joins it.
 * Nodes: 0 the riser; then near-main node of each line; then far-main node of each line; then the sprinklers line by
 * line. C 120 throughout.
 */
export function gridNetwork(g: GridLayout): Network {
  const nodes: NetworkNode[] = [];
  const pipes: NetworkPipe[] = [];
  const z = (line: number) => (g.lines > 1 ? ((g.rise ?? 0) * line) / (g.lines - 1) : 0);
  nodes.push({ elevation: z(g.feedLine), fixedPressure: g.pressure });
  const near = (l: number) => 1 + l;
  const far = (l: number) => 1 + g.lines + l;
  const head = (l: number, h: number) => 1 + 2 * g.lines + l * g.heads + h;
  for (let l = 0; l < g.lines; l++) nodes.push({ elevation: z(l) });
  for (let l = 0; l < g.lines; l++) nodes.push({ elevation: z(l) });
  for (let l = 0; l < g.lines; l++) {
    for (let h = 0; h < g.heads; h++) nodes.push({ elevation: z(l), k: (g.flowing?.(l, h) ?? true) ? g.k : 0 });
  }
  const pipe = (from: number, to: number, diameter: number, length: number) => pipes.push({ from, to, diameter, cFactor: 120, length });
  pipe(0, near(g.feedLine), g.mainDiameter, 10);
  for (let l = 0; l + 1 < g.lines; l++) {
    pipe(near(l), near(l + 1), g.mainDiameter, g.lineSpacing);
    pipe(far(l), far(l + 1), g.mainDiameter, g.lineSpacing);
  }
  for (let l = 0; l < g.lines; l++) {
    pipe(near(l), head(l, 0), g.branchDiameter, g.headSpacing);
    for (let h = 0; h + 1 < g.heads; h++) pipe(head(l, h), head(l, h + 1), g.branchDiameter, g.headSpacing);
    pipe(head(l, g.heads - 1), far(l), g.branchDiameter, g.headSpacing);
  }
  return { nodes, pipes };
}

/** The largest departures of a solution from the network's equations, each in its own unit. */
export interface Departures {
  /** gpm: |what the pipes bring − outflow| at a junction, the largest */
  imbalance: number;
  /** gpm: |outflow − (K √p⁺ + demand)| at a junction, the largest */
  discharge: number;
  /** psi: |p_fixed − reported pressure| at a fixed-pressure node, the largest */
  fixed: number;
  /** psi: |(H_from − H_to) − sign(Q) loss(|Q|)| over the pipes, the largest (loss from headLoss(units)) */
  headLoss: number;
  /** gpm: the total flow the sources supply */
  supplied: number;
  /**
   * gpm: the flow that rounding the heads by a few units in their last place drives through a junction's pipes at
   * their stiffest (linearised below 0.001 ft/s, as the solver does): an imbalance below it is arithmetic, not the
   * solve. A short, wide pipe carrying nothing conducts some 1e8 gpm per psi, so 2e-14 psi of rounding in an 80 psi
   * head is 2e-6 gpm there.
   */
  rounding: number;
}

/** 0.001 ft/s: the velocity below which a pipe's loss is taken as linear, as the solver takes it (network.ts). */
const LINEAR_VELOCITY_FT_S = 0.001;
/** Units in the last place a head carries after a solve: its own rounding and the factorisation's, generously. */
const HEAD_ULPS = 16;

/** How far a solution departs from each equation of the network (computed here, independently of the solver). */
export function departures(net: Network, s: NetworkSolution, units: UnitSystem = "US"): Departures {
  const hl = headLoss(units);
  const inflow = new Array<number>(net.nodes.length).fill(0);
  let headLossGap = 0;
  net.pipes.forEach((p, j) => {
    const Q = s.flow[j];
    inflow[p.from] -= Q;
    inflow[p.to] += Q;
    const hFrom = s.pressure[p.from] + PSI_PER_FT_WATER * net.nodes[p.from].elevation;
    const hTo = s.pressure[p.to] + PSI_PER_FT_WATER * net.nodes[p.to].elevation;
    const loss = Math.sign(Q) * hl.loss(Math.abs(Q), p.diameter, p.cFactor, p.length);
    headLossGap = Math.max(headLossGap, Math.abs(hFrom - hTo - loss));
  });
  let imbalance = 0, discharge = 0, fixed = 0, supplied = 0;
  net.nodes.forEach((node, i) => {
    if (node.fixedPressure !== undefined) {
      fixed = Math.max(fixed, Math.abs(s.pressure[i] - node.fixedPressure));
      supplied += Math.max(0, -inflow[i]);
      return;
    }
    imbalance = Math.max(imbalance, Math.abs(inflow[i] - s.outflow[i]));
    const p = s.pressure[i];
    const expected = (p > 0 ? (node.k ?? 0) * Math.sqrt(p) : 0) + (node.demand ?? 0);
    discharge = Math.max(discharge, Math.abs(s.outflow[i] - expected));
  });
  // the stiffest conductance at each junction: Σ 1/g over its pipes, g the linearised slope at 0.001 ft/s
  const conductance = new Array<number>(net.nodes.length).fill(0);
  for (const p of net.pipes) {
    const qLin = LINEAR_VELOCITY_FT_S / velocity(1, p.diameter);
    const g = hl.loss(qLin, p.diameter, p.cFactor, p.length) / qLin;
    conductance[p.from] += 1 / g;
    conductance[p.to] += 1 / g;
  }
  const heads = net.nodes.map((node, i) => Math.abs(s.pressure[i] + PSI_PER_FT_WATER * node.elevation));
  const rounding = HEAD_ULPS * Number.EPSILON * Math.max(1, ...heads) * Math.max(0, ...conductance);
  return { imbalance, discharge, fixed, headLoss: headLossGap, supplied, rounding };
}

/**
 * An ordinary hazard group 1 grid for the gridded tests: 0.15 gpm/ft² over 1500 ft² [NFPA 13] (from memory), 130 ft²
 * a sprinkler and K 5.6 (common practice), 13 ft apart on 10 lines 160 ft long (floor(160 / 13) = 12 sprinklers a
 * line), fed at line 1.
 */
export const OH1_GRID: GridDemandInput = {
  density: 0.15, // [NFPA 13] (from memory)
  area: 1500, // [NFPA 13] (from memory)
  coverage: 130, // (common practice)
  kFactor: 5.6, // the standard ½ in orifice [NFPA 13]
  headSpacing: 13, // (common practice)
  lines: 10,
  lineLength: 160,
  branchDiameter: 1.38, // 1¼ Schedule 40 [ASME B36.10M]
  mainDiameter: 2.469, // 2½ Schedule 40 [ASME B36.10M]
  cFactor: 120, // black steel, wet [NFPA 13]
  minPressure: 7, // [NFPA 13]
  feedLine: 1,
};
