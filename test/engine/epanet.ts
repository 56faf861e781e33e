/**
 * The same network in epanet-js (EPANET 2.3 as WebAssembly; a test and bench dependency only, never imported from
 * src/): an outside engine to check the network solver against.
 *
 * How a `Network` becomes an EPANET project (flow units GPM, so pressures in psi, lengths in ft, diameters in in;
 * head loss Hazen-Williams; accuracy 1e-6):
 * - a junction → a junction with its demand as base demand and its K as emitter coefficient (EPANET's emitter flows
 *   C p^0.5 with p in psi: C is K);
 * - a fixed-pressure node → a reservoir whose head is its elevation plus p / 0.4333 ft (EPANET reports
 *   (head − elevation) × 0.4333 psi, so the reservoir's pressure is p);
 * - every elevation × 0.433 / 0.4333: EPANET counts 0.4333 psi per ft and [NFPA 13] 0.433, so the elevation is scaled
 *   to give the same pressure per ft of rise; what remains between the two engines is Hazen-Williams itself: EPANET's
 *   exponents 1.852 and 4.871 against NFPA's 1.85 and 4.87 (reference.md, "Outside checks": about 0.5 % at most);
 * - a pipe → a pipe of the same length, diameter and C, no minor loss.
 * Node and pipe indices are kept: EPANET numbers its junctions before its reservoirs, so each is looked up by its ID.
 */
import {
  AnalysisStatistic,
  FlowUnits,
  HeadLossType,
  LinkProperty,
  LinkType,
  NodeProperty,
  NodeType,
  Option,
  Project,
  Workspace,
} from "epanet-js";
import type { Network } from "../../src/engine/network";

/** EPANET's pressure of a foot of water, psi (its PSIperFT). */
export const EPANET_PSI_PER_FT = 0.4333;
/** [NFPA 13] 0.433 psi per ft. */
const NFPA_PSI_PER_FT = 0.433;

const workspace = new Workspace();
await workspace.loadModule();

/** A network built in EPANET, to be solved (again and again) and read. */
export interface EpanetModel {
  /** run EPANET's hydraulic solve (EN_solveH) */
  solve(): void;
  /** pressures (psi) at the nodes and flows (gpm) in the pipes of the last solve, in the network's own order */
  read(): { pressure: number[]; flow: number[] };
  /** the trials EPANET's last solve took */
  iterations(): number;
  /** release the project */
  close(): void;
}

/** Build `net` in EPANET (see the module's comment for how). */
export function epanetModel(net: Network): EpanetModel {
  const project = new Project(workspace);
  project.init("network.rpt", "network.out", FlowUnits.GPM, HeadLossType.HW);
  const scale = NFPA_PSI_PER_FT / EPANET_PSI_PER_FT;
  net.nodes.forEach((node, i) => {
    const id = `n${i}`;
    const elevation = node.elevation * scale;
    if (node.fixedPressure !== undefined) {
      const index = project.addNode(id, NodeType.Reservoir);
      project.setNodeValue(index, NodeProperty.Elevation, elevation + node.fixedPressure / EPANET_PSI_PER_FT);
    } else {
      const index = project.addNode(id, NodeType.Junction);
      project.setJunctionData(index, elevation, node.demand ?? 0, "");
      if ((node.k ?? 0) > 0) project.setNodeValue(index, NodeProperty.Emitter, node.k as number);
    }
  });
  net.pipes.forEach((p, j) => {
    const index = project.addLink(`p${j}`, LinkType.Pipe, `n${p.from}`, `n${p.to}`);
    project.setPipeData(index, p.length, p.diameter, p.cFactor, 0);
  });
  project.setOption(Option.Accuracy, 1e-6);
  const nodeIndex = net.nodes.map((_, i) => project.getNodeIndex(`n${i}`));
  const linkIndex = net.pipes.map((_, j) => project.getLinkIndex(`p${j}`));
  return {
    solve: () => project.solveH(),
    // EPANET's pressure, (head − elevation) × 0.4333, worked here for every node: a reservoir's "elevation" is its head
    read: () => ({
      pressure: nodeIndex.map((k, i) => (project.getNodeValue(k, NodeProperty.Head) - net.nodes[i].elevation * scale) * EPANET_PSI_PER_FT),
      flow: linkIndex.map((k) => project.getLinkValue(k, LinkProperty.Flow)),
    }),
    iterations: () => project.getStatistic(AnalysisStatistic.Iterations),
    close: () => project.close(),
  };
}

/** Solve `net` with EPANET: pressures (psi) at its nodes and flows (gpm, positive from → to) in its pipes. */
export function solveWithEpanet(net: Network): { pressure: number[]; flow: number[] } {
  const model = epanetModel(net);
  try {
    model.solve();
    return model.read();
  } finally {
    model.close();
  }
}
