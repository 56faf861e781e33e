/**
 * The design area of a gridded system, placed where it demands most. US units: gpm, psi, in, ft, ft², gpm/ft².
 *
 * A gridded system ties both ends of every branch line into a cross main, so that water reaches each sprinkler from
 * both ends. The method (../shared/spec/functions.md, "GRIDDEMAND: the solve it must do"):
 *
 * 1. The grid: `lines` parallel branch lines, coverage ÷ head_spacing apart, each `line_length` long, joined at both
 *    ends to a cross main (the near main at one end, the far main at the other; between adjacent lines each main runs
 *    one line spacing). Each line carries N = floor(line_length / head_spacing) sprinklers, head_spacing apart and
 *    centred, so both end gaps are (line_length − (N − 1) × head_spacing) / 2. Lines are numbered 1 … lines across the
 *    grid, sprinklers 1 … N from the near main. The riser feeds the near main where line `feed_line` joins it.
 * 2. The design area: n = ceil(area / coverage) sprinklers, m = min(N, ceil(1.2 √area / head_spacing)) along each
 *    line, l = ceil(n / m) adjacent lines; the area's line nearest the feed line (the lower-numbered on a tie) flows the
 *    remainder r = n − (l − 1) m. A placement (first_line, first_head) opens sprinklers first_head … first_head + m − 1
 *    on lines first_line … first_line + l − 1 (first_head … first_head + r − 1 on the remainder line); every other
 *    sprinkler stays closed.
 * 3. One placement: the riser pressure P at which the least-favoured flowing sprinkler flows exactly
 *    q_req = max(density × coverage, K √Pmin), every flowing sprinkler K √p, every pipe its Hazen-Williams loss, flows
 *    balanced at every node (the network solver, ./network.ts). The least-favoured flow rises with P, so P is found by a
 *    safeguarded secant on log P against log q (flows grow about as √P: q ∝ P^(1/α), α between 1.85 and 2).
 * 4. The result is the placement needing the highest P over first_line = 1 … lines − l + 1 and first_head =
 *    1 … N − m + 1, in that order (the first found on a tie, within GRID_TIE_TOLERANCE), each placement started
 *    from the solution of its neighbour (the previous first_head; for first_head 1, the previous first_line's). A
 *    placement whose least-favoured sprinkler already flows more than q_req at the highest P found so far needs less,
 *    and is not searched further (solveGridDemand).
 *
 * The network solved for a placement holds the mains' junctions and the flowing sprinklers only: the pipe between two
 * of them, through closed sprinklers, carries one flow along its whole length, so its Hazen-Williams loss is that of
 * one pipe of the summed length, exactly, and the pressure along it falls linearly. The full grid (every sprinkler a
 * node) gives the same pressures and flows: gridNetwork builds it, and a test solves both.
 * No elevation and no fittings: add them with ELEVATION, FITTINGS and PIPERUN.
 */
import { HeadroomError, fail, n, q } from "./errors";
import { type HeadLoss, headLoss } from "./friction";
import { type Network, type NetworkNode, type NetworkPipe, type NetworkSolution, type PreparedNetwork, prepareNetwork, solveNetwork } from "./network";
import {
  DESIGN_AREA_LENGTH_FACTOR,
  headCount,
  headFlow,
  headPressure,
  headsPerLine,
} from "./sprinkler";
import { checkAreaLayout, requirePositive } from "./tree";
import type { Quantity } from "./units";

/** The line where the riser joins the near main when none is given: line 1, at a corner of the grid. */
export const DEFAULT_FEED_LINE = 1;

/**
 * The most sprinklers a grid may hold, lines × N.
 *
 * A sprinkler system serves at most about 52,000 ft² from one riser ([NFPA 13] system protection area limitation,
 * from memory): some 520 sprinklers at 100 ft² each. Four times that is room for any real grid; more is a typing
 * error, and the bound keeps the placement search (one network solve per placement) within a second.
 * @see (common practice)
 */
export const MAX_GRID_SPRINKLERS = 2000;

/**
 * The most branch lines a grid may hold.
 *
 * 52,000 ft² ([NFPA 13] system protection area limitation, from memory) on lines 8 ft apart and 32 ft long is some
 * 200 lines; more is a typing error. Each placement's network holds both mains, two junctions a line, so the bound
 * keeps every solve small.
 * @see (common practice)
 */
export const MAX_GRID_LINES = 200;

/**
 * Relative tolerance of the riser pressure search, dimensionless.
 *
 * The least-favoured sprinkler's flow is within this fraction of its required flow, so the pressure found is within
 * about twice this fraction of the exact one.
 */
export const GRID_SEARCH_TOLERANCE = 1e-7;

/**
 * The least-favoured flow's relative miss accepted where the search's bracket has closed (CLOSED_BRACKET), dimensionless.
 *
 * At riser pressures of thousands of psi (small branch lines at the hazard's flows) the network solve settles each flow
 * only to about 1e-7 of itself, whatever tolerance it is asked: the search then closes its bracket on a pressure as exact
 * as a double holds, and the flow there is as near q_req as the network solve can tell (found by the property tests:
 * 1 in branch lines of K 11.2 sprinklers, 17,526 psi at the riser, the flow 1.3e-7 short).
 */
export const GRID_FLOOR_TOLERANCE = 10 * GRID_SEARCH_TOLERANCE;
/** Relative width of a closed bracket: a few units in the last place of a double, dimensionless. */
const CLOSED_BRACKET = 1e-14;

/**
 * Relative difference of two placements' riser pressures below which they are a tie, dimensionless.
 *
 * Ten times the search's own reach in pressure, so that two placements alike by symmetry always tie.
 */
export const GRID_TIE_TOLERANCE = 1e-6;

/**
 * Relative tolerance asked of the network solver inside the search, per sprinkler flowing: the solver's tolerance is a
 * fraction of the whole flow, n times the least-favoured one's, which must be well inside GRID_SEARCH_TOLERANCE.
 */
const NETWORK_TOLERANCE = GRID_SEARCH_TOLERANCE / 10;
/**
 * Relative tolerance asked of the network solver where a placement is only compared with the highest pressure so far,
 * per sprinkler flowing: the solver's tolerance is a fraction of the whole flow, n times the least-favoured one's, and
 * the comparison needs that one within a tenth of PRUNE_MARGIN.
 */
const COMPARE_TOLERANCE = 3e-4;
/** Secant steps allowed for one placement: a few suffice from a neighbour's pressure; the rest is bisection's room. */
const MAX_SEARCH_STEPS = 100;
/** The highest riser pressure the search tries, psi: beyond it the pipes are too small for any finite answer. */
const MAX_RISER_PRESSURE_PSI = 1e12;

/** The inputs of a gridded design-area solve, US units. */
export interface GridDemandInput {
  /** design density, gpm/ft² */
  density: number;
  /** design area, ft² */
  area: number;
  /** floor area per sprinkler, ft² */
  coverage: number;
  /** sprinkler K-factor, gpm/psi^0.5 */
  kFactor: number;
  /** distance between sprinklers along a branch line, ft */
  headSpacing: number;
  /** branch lines in the grid, a whole number */
  lines: number;
  /** length of each branch line between the cross mains, ft */
  lineLength: number;
  /** internal diameter of the branch lines, in */
  branchDiameter: number;
  /** internal diameter of both cross mains, in */
  mainDiameter: number;
  /** Hazen-Williams C of all pipes */
  cFactor: number;
  /** minimum sprinkler operating pressure, psi */
  minPressure: number;
  /** the line where the riser joins the near main, a whole number from 1 to lines */
  feedLine: number;
}

/** The grid and its design area, laid out (step 1 and 2 of the file comment). */
export interface GridLayout {
  /** branch lines in the grid */
  lines: number;
  /** sprinklers on every line, N */
  lineHeads: number;
  /** coverage / head spacing, ft */
  lineSpacing: number;
  /** ft */
  lineLength: number;
  /** ft */
  headSpacing: number;
  /** from each main to the nearest sprinkler, ft */
  endGap: number;
  /** the line where the riser joins the near main */
  feedLine: number;
  /** the design area, ft² */
  area: number;
  /** sprinklers flowing, n */
  heads: number;
  /** sprinklers flowing on each full line of the area, m */
  headsPerLine: number;
  /** lines of the area, l */
  areaLines: number;
  /** sprinklers flowing on the area's line nearest the feed, r */
  remainderHeads: number;
  /** flow each sprinkler must reach, q_req, gpm */
  requiredFlow: number;
  /** pressure of a sprinkler flowing q_req, psi */
  requiredPressure: number;
  /** gpm/psi^0.5 */
  kFactor: number;
  /** in */
  branchDiameter: number;
  /** in */
  mainDiameter: number;
  cFactor: number;
}

/** Where the design area lies: its first line and, on every one of its lines, its first sprinkler (both from 1). */
export interface GridPlacement {
  firstLine: number;
  firstHead: number;
}

/** A grid's pipes and sprinklers as a network, and where the design area's parts sit in it. */
export interface GridNetwork {
  network: Network;
  /** the node the riser feeds (fixed pressure) */
  riser: number;
  /** the flowing sprinklers' nodes */
  flowing: number[];
  /** each node's line (from 1) and sprinkler position (0 = the near main, 1 … N, N + 1 = the far main); mains' nodes too */
  nodeAt: Array<{ line: number; position: number }>;
}

/** One placement solved. */
export interface GridPlacementSolution {
  placement: GridPlacement;
  /** riser pressure, psi */
  pressure: number;
  /** the riser's flow: the flowing sprinklers' flows summed, gpm */
  flow: number;
  /** the least-favoured flowing sprinkler's pressure, psi */
  endPressure: number;
  /** the least-favoured flowing sprinkler's node */
  least: number;
  /** the network solved (the mains' junctions and the flowing sprinklers) and its solution */
  grid: GridNetwork;
  solution: NetworkSolution;
  /** log P against log q_least near the answer: P ∝ q^alpha */
  alpha: number;
}

/** The solved grid: the placement needing the highest riser pressure. */
export interface GridDemand {
  /** the riser's flow, gpm */
  flow: number;
  /** the riser pressure, psi */
  pressure: number;
  /** sprinklers flowing, n */
  heads: number;
  /** lines of the area, l */
  lines: number;
  /** the least-favoured flowing sprinkler's pressure, psi */
  endPressure: number;
  /** where the area landed */
  firstLine: number;
  firstHead: number;
  /** sprinklers flowing on each full line of the area, m */
  headsPerLine: number;
  /** sprinklers on every line of the grid, N */
  lineHeads: number;
  /** placements solved */
  placements: number;
  /** the winning placement in full, when asked for (detail = true) */
  solved?: GridPlacementSolution;
}

/** Round down, forgiving floating-point noise just below a whole number (120 / 12 stays 10). */
function floorCount(x: number): number {
  const k = Math.floor(x + 1e-9);
  return k === 0 ? 0 : k;
}

/** Refuse grid inputs that no sprinkler layout could be, naming the argument. */
function checkInput(inp: GridDemandInput): void {
  const positive: Array<[keyof GridDemandInput, string, Quantity | null]> = [
    ["density", "density", "density"],
    ["area", "area", "area"],
    ["coverage", "coverage", "area"],
    ["kFactor", "k_factor", "kfactor"],
    ["headSpacing", "head_spacing", "length"],
    ["lineLength", "line_length", "length"],
    ["branchDiameter", "branch_diameter", "diameter"],
    ["mainDiameter", "main_diameter", "diameter"],
    ["cFactor", "c_factor", null],
    ["minPressure", "min_pressure", "pressure"],
  ];
  requirePositive(inp, positive);
  if (!(Number.isInteger(inp.lines) && inp.lines >= 1 && inp.lines <= MAX_GRID_LINES)) {
    fail("lines", n(inp.lines), `must be a whole number of branch lines from 1 to ${MAX_GRID_LINES}`);
  }
  if (!(Number.isInteger(inp.feedLine) && inp.feedLine >= 1 && inp.feedLine <= inp.lines)) {
    fail("feed_line", n(inp.feedLine), "must be a whole number from 1 to lines, {0}", n(inp.lines));
  }
  checkAreaLayout(inp);
  if (floorCount(inp.lineLength / inp.headSpacing) < 1) {
    fail(
      "line_length",
      q("length", inp.lineLength),
      "must be at least head_spacing, {0}: a line shorter than one head spacing holds no sprinkler",
      q("length", inp.headSpacing),
    );
  }
  const lineHeads = floorCount(inp.lineLength / inp.headSpacing);
  if (inp.lines * lineHeads > MAX_GRID_SPRINKLERS) {
    fail(
      "line_length",
      q("length", inp.lineLength),
      `must be below {0} with ${inp.lines} lines and a head_spacing of {1}: a grid of more than ${MAX_GRID_SPRINKLERS} sprinklers is an input error`,
      q("length", (Math.floor(MAX_GRID_SPRINKLERS / inp.lines) + 1) * inp.headSpacing),
      q("length", inp.headSpacing),
    );
  }
}

/**
 * Lay out a grid and its design area (steps 1 and 2 of the file comment), refusing inputs no grid could be.
 *
 *   N = floor(line_length / S),   gap = (line_length − (N − 1) S) / 2,   n = ceil(A / coverage),
 *   m = min(N, ceil(1.2 √A / S)),   l = ceil(n / m),   r = n − (l − 1) m,   q_req = max(density × coverage, K √Pmin)
 *
 * 0.15 gpm/ft² over 1500 ft², 130 ft² per sprinkler, 13 ft spacing, 10 lines 160 ft long: N = floor(160 / 13) =
 * floor(12.31) = 12, gap = (160 − 11 × 13) / 2 = 8.5 ft; n = ceil(11.54) = 12, m = min(12, ceil(3.58)) = 4, l = 3,
 * r = 12 − 2 × 4 = 4; q_req = 0.15 × 130 = 19.5 gpm. A design area needing more lines than the grid has, a feed line
 * outside 1 … lines and a line shorter than one head spacing are errors that say so.
 *
 * @param inp the grid, its design area, sprinklers and pipes, US units (gpm/ft², ft², gpm/psi^0.5, ft, in, psi)
 * @returns the counts (N, n, m, l, r), the line spacing and end gap (ft) and the required flow (gpm) and pressure (psi)
 * @see [NFPA 13] density/area method (n, 1.2 √A, q_req); the grid's layout is the vocabulary's
 * @example
 * gridLayout({ density: 0.15, area: 1500, coverage: 130, kFactor: 5.6, headSpacing: 13, lines: 10, lineLength: 160,
 *   branchDiameter: 1.38, mainDiameter: 2.469, cFactor: 120, minPressure: 7, feedLine: 1 })
 * // .lineHeads → 12
 * // .endGap → 8.5 ft
 * // .heads → 12
 * // .headsPerLine → 4
 * // .areaLines → 3
 * // .requiredFlow ≈ 19.5 gpm
 */
export function gridLayout(inp: GridDemandInput): GridLayout {
  checkInput(inp);
  const lineHeads = floorCount(inp.lineLength / inp.headSpacing);
  const heads = headCount(inp.area, inp.coverage);
  const m = Math.min(lineHeads, headsPerLine(inp.area, inp.headSpacing, DESIGN_AREA_LENGTH_FACTOR));
  const areaLines = Math.ceil(heads / m);
  if (areaLines > inp.lines) {
    fail(
      "lines",
      n(inp.lines),
      `must be at least ${areaLines}: the design area's ${heads} sprinklers, at most ${m} on a line of ${lineHeads}, need ${areaLines} lines`,
    );
  }
  const requiredFlow = headFlow(inp.density, inp.coverage, inp.kFactor, inp.minPressure);
  const requiredPressure = headPressure(requiredFlow, inp.kFactor, inp.minPressure);
  if (!Number.isFinite(requiredPressure)) {
    fail("k_factor", q("kfactor", inp.kFactor), "must be larger: a sprinkler would need more than any pressure to flow {0}", q("flow", requiredFlow));
  }
  return {
    lines: inp.lines,
    lineHeads,
    lineSpacing: inp.coverage / inp.headSpacing,
    lineLength: inp.lineLength,
    headSpacing: inp.headSpacing,
    endGap: (inp.lineLength - (lineHeads - 1) * inp.headSpacing) / 2,
    feedLine: inp.feedLine,
    area: inp.area,
    heads,
    headsPerLine: m,
    areaLines,
    remainderHeads: heads - (areaLines - 1) * m,
    requiredFlow,
    requiredPressure,
    kFactor: inp.kFactor,
    branchDiameter: inp.branchDiameter,
    mainDiameter: inp.mainDiameter,
    cFactor: inp.cFactor,
  };
}

/** The area's line nearest the feed line (the lower-numbered on a tie): the one flowing the remainder. */
function remainderLine(layout: GridLayout, firstLine: number): number {
  const last = firstLine + layout.areaLines - 1;
  return Math.min(Math.max(layout.feedLine, firstLine), last);
}

/** Sprinklers flowing on `line` (from 1) under a placement: 0 off the area. */
function flowingOn(layout: GridLayout, p: GridPlacement, line: number): number {
  if (line < p.firstLine || line >= p.firstLine + layout.areaLines) return 0;
  return line === remainderLine(layout, p.firstLine) ? layout.remainderHeads : layout.headsPerLine;
}

/** Length of the pipe from position t to t + 1 along a line (0 the near main, N + 1 the far main), ft. */
function segmentLength(layout: GridLayout, t: number): number {
  return t === 0 || t === layout.lineHeads ? layout.endGap : layout.headSpacing;
}

/**
 * Build a grid as a network, keeping as nodes the mains' junctions and the sprinkler positions `kept(line)` returns
 * (sorted, 1 … N); the pipe between two kept neighbours on a line is one pipe of their summed length.
 */
function buildNetwork(layout: GridLayout, p: GridPlacement, riserPressure: number, kept: (line: number) => number[]): GridNetwork {
  const nodes: NetworkNode[] = [];
  const pipes: NetworkPipe[] = [];
  const nodeAt: GridNetwork["nodeAt"] = [];
  const flowing: number[] = [];
  const near: number[] = [];
  const far: number[] = [];
  const { branchDiameter, mainDiameter, cFactor, kFactor } = layout;
  for (let line = 1; line <= layout.lines; line++) {
    const open = flowingOn(layout, p, line);
    const positions = [0, ...kept(line), layout.lineHeads + 1];
    let previous = -1;
    let from = 0;
    for (const position of positions) {
      const node = nodes.length;
      const isOpen = position >= p.firstHead && position < p.firstHead + open;
      nodes.push({ elevation: 0, k: isOpen ? kFactor : 0 });
      nodeAt.push({ line, position });
      if (isOpen) flowing.push(node);
      if (position === 0) near.push(node);
      if (position === layout.lineHeads + 1) far.push(node);
      if (previous >= 0) {
        let length = 0;
        for (let t = from; t < position; t++) length += segmentLength(layout, t);
        pipes.push({ from: previous, to: node, diameter: branchDiameter, cFactor, length });
      }
      previous = node;
      from = position;
    }
  }
  for (const main of [near, far]) {
    for (let i = 0; i + 1 < main.length; i++) {
      pipes.push({ from: main[i], to: main[i + 1], diameter: mainDiameter, cFactor, length: layout.lineSpacing });
    }
  }
  const riser = near[layout.feedLine - 1];
  nodes[riser].fixedPressure = riserPressure;
  return { network: { nodes, pipes }, riser, flowing, nodeAt };
}

/**
 * The whole grid as a network, every sprinkler a node.
 *
 * K on the placement's flowing sprinklers and 0 on the closed ones; the mains' junctions, every pipe between them, and
 * the riser's node at a fixed pressure:
 *
 *   nodes: per line the near main's junction, sprinklers 1 … N, the far main's junction (line by line);
 *   pipes: along each line gap, S, …, S, gap; then the near main and the far main, one line spacing each
 *
 * A 2-line grid 30 ft long at 10 ft spacing: N = 3, gap = (30 − 2 × 10) / 2 = 5 ft; 2 × 5 = 10 nodes, 2 × 4 line
 * pipes and one pipe on each main = 10 pipes; the riser at line 1 is node 0.
 *
 * @param layout the grid and its design area (gridLayout)
 * @param placement the area's first line and first sprinkler on each of its lines, both from 1
 * @param riserPressure the pressure the riser holds at the near main, psi
 * @returns the network, the riser's node, the flowing sprinklers' nodes and each node's line and position
 * @see [NFPA 13] hydraulic calculation of gridded systems; the layout is the vocabulary's
 * @example
 * gridNetwork(gridLayout({ density: 0.2, area: 200, coverage: 100, kFactor: 5.6, headSpacing: 10, lines: 2,
 *   lineLength: 30, branchDiameter: 1.049, mainDiameter: 2.067, cFactor: 120, minPressure: 7, feedLine: 1 }),
 *   { firstLine: 1, firstHead: 2 }, 20).flowing
 * // → [2, 3]
 */
export function gridNetwork(layout: GridLayout, placement: GridPlacement, riserPressure: number): GridNetwork {
  const all = Array.from({ length: layout.lineHeads }, (_, i) => i + 1);
  return buildNetwork(layout, placement, riserPressure, () => all);
}

/** The network the search solves: the mains' junctions and the flowing sprinklers only (see the file comment). */
function areaNetwork(layout: GridLayout, placement: GridPlacement, riserPressure: number): GridNetwork {
  return buildNetwork(layout, placement, riserPressure, (line) => {
    const open = flowingOn(layout, placement, line);
    return Array.from({ length: open }, (_, i) => placement.firstHead + i);
  });
}

/**
 * A placement's solution carried onto the whole grid by position: the flow of every line segment and main pipe, and
 * the pressure at every position (linear along a merged pipe, whose flow is one). Full-grid numbering: node
 * (line − 1)(N + 2) + position; line pipe (line − 1)(N + 1) + t; then the near main's and the far main's pipes.
 */
interface GridState {
  flow: Float64Array;
  pressure: Float64Array;
}

function expand(layout: GridLayout, g: GridNetwork, s: NetworkSolution): GridState {
  const N = layout.lineHeads;
  const L = layout.lines;
  const flow = new Float64Array(L * (N + 1) + 2 * (L - 1));
  const pressure = new Float64Array(L * (N + 2));
  const linePipes = g.network.pipes.length - 2 * (L - 1);
  for (let j = 0; j < linePipes; j++) {
    const pipe = g.network.pipes[j];
    const a = g.nodeAt[pipe.from], b = g.nodeAt[pipe.to];
    const base = (a.line - 1) * (N + 2);
    const pa = s.pressure[pipe.from], pb = s.pressure[pipe.to];
    let x = 0;
    for (let t = a.position; t < b.position; t++) {
      flow[(a.line - 1) * (N + 1) + t] = s.flow[j];
      if (t > a.position) pressure[base + t] = pa + ((pb - pa) * x) / pipe.length;
      x += segmentLength(layout, t);
    }
    pressure[base + a.position] = pa;
    pressure[base + b.position] = pb;
  }
  for (let j = linePipes; j < g.network.pipes.length; j++) flow[L * (N + 1) + (j - linePipes)] = s.flow[j];
  return { flow, pressure };
}

/** A starting solution for a placement's network, read from a grid state by position. */
function contract(layout: GridLayout, g: GridNetwork, state: GridState): NetworkSolution {
  const N = layout.lineHeads;
  const L = layout.lines;
  const { nodes, pipes } = g.network;
  const pressure = new Float64Array(nodes.length);
  const outflow = new Float64Array(nodes.length);
  const flow = new Float64Array(pipes.length);
  let supplied = 0;
  for (let i = 0; i < nodes.length; i++) {
    const at = g.nodeAt[i];
    pressure[i] = state.pressure[(at.line - 1) * (N + 2) + at.position];
    const k = nodes[i].k ?? 0;
    if (k > 0) {
      outflow[i] = k * Math.sqrt(Math.max(pressure[i], 0));
      supplied += outflow[i];
    }
  }
  outflow[g.riser] = -supplied;
  const linePipes = pipes.length - 2 * (L - 1);
  for (let j = 0; j < linePipes; j++) {
    const a = g.nodeAt[pipes[j].from];
    flow[j] = state.flow[(a.line - 1) * (N + 1) + a.position];
  }
  for (let j = linePipes; j < pipes.length; j++) flow[j] = state.flow[L * (N + 1) + (j - linePipes)];
  return { pressure, flow, outflow, iterations: 0, residual: 0 };
}

/** A solution with every pressure times `ratio` and every flow times √ratio: the start for a riser pressure `ratio` × higher. */
function scaled(s: NetworkSolution, ratio: number): NetworkSolution {
  const root = Math.sqrt(ratio);
  return {
    pressure: s.pressure.map((p) => p * ratio),
    flow: s.flow.map((x) => x * root),
    outflow: s.outflow.map((x) => x * root),
    iterations: 0,
    residual: 0,
  };
}

/** The problem of pipes too small for any finite riser pressure, blaming the pipe that loses most. */
function tooSmall(layout: GridLayout, g: GridNetwork, s: NetworkSolution, hl: HeadLoss): never {
  let branch = 0, main = 0;
  g.network.pipes.forEach((pipe, j) => {
    const loss = hl.loss(Math.abs(s.flow[j]), pipe.diameter, pipe.cFactor, pipe.length);
    if (g.nodeAt[pipe.from].position === g.nodeAt[pipe.to].position) main += loss; // a main joins two lines' ends
    else branch += loss;
  });
  const [name, diameter] = main > branch ? ["main_diameter", layout.mainDiameter] : ["branch_diameter", layout.branchDiameter];
  fail(name, q("diameter", diameter), "must be larger: the riser would need more than {0}", q("pressure", MAX_RISER_PRESSURE_PSI));
}

/** Solve a placement's network at the riser pressure its node holds, naming GRIDDEMAND's arguments on failure. */
function solveAt(
  layout: GridLayout,
  g: GridNetwork,
  pressure: number,
  hl: HeadLoss,
  prepared: PreparedNetwork,
  warm?: NetworkSolution,
  tolerance = NETWORK_TOLERANCE / layout.heads,
): NetworkSolution {
  g.network.nodes[g.riser].fixedPressure = pressure;
  try {
    return solveNetwork(g.network, { units: hl.units, tolerance, prepared, warmStart: warm });
  } catch (e) {
    if (e instanceof HeadroomError && e.kind === "converge") {
      throw new HeadroomError({
        kind: "converge",
        argument: "branch_diameter",
        got: q("diameter", layout.branchDiameter),
        // the solver's own amounts follow main_diameter's: its slots move up by one
        rule: `with main_diameter {0}: the grid's flows ${e.rule.replace(/\{(\d+)\}/g, (_, i: string) => `{${Number(i) + 1}}`)}`,
        amounts: [q("diameter", layout.mainDiameter), ...e.amounts],
      });
    }
    throw e;
  }
}

/** The least-favoured flowing sprinkler of a solution: its node and its flow K √p, gpm. */
function leastFavoured(layout: GridLayout, g: GridNetwork, s: NetworkSolution): { node: number; flow: number } {
  let node = g.flowing[0];
  let flow = Infinity;
  for (const i of g.flowing) {
    const qi = layout.kFactor * Math.sqrt(Math.max(s.pressure[i], 0));
    if (qi < flow) {
      flow = qi;
      node = i;
    }
  }
  return { node, flow };
}

/** A placement being searched: its network, prepared once, and where its search starts. */
interface Search {
  placement: GridPlacement;
  g: GridNetwork;
  prepared: PreparedNetwork;
  /** the first riser pressure to try, psi */
  pressure: number;
  /** P ∝ q^alpha near the answer, as a neighbour found it (2 when none did) */
  alpha: number;
  /** a starting solution near `pressure`, if any */
  warm?: NetworkSolution;
}

/**
 * Solve one placement: the riser pressure at which the least-favoured flowing sprinkler flows exactly q_req.
 *
 * A safeguarded secant on log P against log q_least: the bracket [lo, hi] holds the answer (lo starts at the required
 * pressure itself, below which no sprinkler can flow q_req), and a step outside it is replaced by the bracket's
 * geometric middle. Each network solve starts from the last one scaled to the new pressure.
 */
function searchPlacement(layout: GridLayout, s: Search, hl: HeadLoss): GridPlacementSolution {
  const { g, placement } = s;
  const qReq = layout.requiredFlow;
  let warm = s.warm;
  let lo = layout.requiredPressure;
  let hi = Infinity;
  let pressure = Math.max(s.pressure, lo * (1 + 1e-6));
  let alpha = s.alpha;
  let previous: { pressure: number; flow: number } | undefined;
  for (let step = 0; step < MAX_SEARCH_STEPS; step++) {
    const solution = solveAt(layout, g, pressure, hl, s.prepared, warm);
    const least = leastFavoured(layout, g, solution);
    const miss = Math.abs(least.flow / qReq - 1);
    if (least.flow < qReq) lo = Math.max(lo, pressure);
    else hi = Math.min(hi, pressure);
    // found; or the bracket closed to a double's last digits, where the network solve's own floor decides the flow
    if (miss <= GRID_SEARCH_TOLERANCE || (hi / lo - 1 <= CLOSED_BRACKET && miss <= GRID_FLOOR_TOLERANCE)) {
      let flow = 0;
      for (const i of g.flowing) flow += layout.kFactor * Math.sqrt(Math.max(solution.pressure[i], 0));
      return { placement, pressure, flow, endPressure: solution.pressure[least.node], least: least.node, grid: g, solution, alpha };
    }
    if (previous && previous.flow !== least.flow && least.flow > 0) {
      const measured = Math.log(pressure / previous.pressure) / Math.log(least.flow / previous.flow);
      if (measured >= 1 && measured <= 3) alpha = measured;
    }
    previous = { pressure, flow: least.flow };
    let next = least.flow > 0 ? pressure * Math.pow(qReq / least.flow, alpha) : 2 * pressure;
    if (!(next > lo && next < hi)) next = hi === Infinity ? 2 * Math.max(lo, pressure) : Math.sqrt(lo * hi);
    if (!(next <= MAX_RISER_PRESSURE_PSI)) tooSmall(layout, g, solution, hl);
    warm = scaled(solution, next / pressure);
    pressure = next;
  }
  throw new HeadroomError({
    kind: "converge",
    argument: "area",
    got: q("area", layout.area),
    rule: `placed at line ${placement.firstLine}, sprinkler ${placement.firstHead}: the search for the riser pressure did not converge in ${MAX_SEARCH_STEPS} steps`,
  });
}

/** A placement's search from nothing: its network, prepared, starting at the required pressure itself. */
function coldSearch(layout: GridLayout, placement: GridPlacement): Search {
  const g = areaNetwork(layout, placement, layout.requiredPressure);
  return { placement, g, prepared: prepareNetwork(g.network), pressure: layout.requiredPressure, alpha: 2 };
}

/**
 * Solve one placement of the design area: the riser pressure at which the least-favoured sprinkler flows q_req.
 *
 * Step 3 of the file comment:
 *
 *   find P:  min over flowing sprinklers of K √p(P) = q_req,   flow = Σ K √p
 *
 * Two lines of 3 sprinklers 10 ft apart, 30 ft long (gaps 5 ft), 1 in Schedule 40 (1.049 in) lines on a 2 in (2.067 in)
 * main, C 120, K 5.6, 0.20 gpm/ft² at 100 ft² each: 200 ft² flows n = 2 sprinklers, m = ceil(1.2 √200 / 10) =
 * ceil(1.70) = 2 on line 1 at sprinklers 2 and 3; q_req = 20 gpm at (20 / 5.6)² = 12.76 psi. Sprinkler 3 is the
 * least favoured; the network gives 40.06 gpm at 15.68 psi at the riser.
 *
 * @param layout the grid and its design area (gridLayout)
 * @param placement the area's first line and first sprinkler on each of its lines, both from 1
 * @param hl the head loss of the user's unit system (headLoss(units)); default the [NFPA 13] US form
 * @returns the riser pressure (psi) and flow (gpm), the least-favoured sprinkler's pressure (psi), the network solved
 * @see [NFPA 13] density/area method and hydraulic calculation of gridded systems
 * @example
 * solveGridPlacement(gridLayout({ density: 0.2, area: 200, coverage: 100, kFactor: 5.6, headSpacing: 10, lines: 2,
 *   lineLength: 30, branchDiameter: 1.049, mainDiameter: 2.067, cFactor: 120, minPressure: 7, feedLine: 1 }),
 *   { firstLine: 1, firstHead: 2 })
 * // .endPressure ≈ 12.76 psi
 * // .flow ≈ 40.06 gpm
 * // .pressure ≈ 15.68 psi
 */
export function solveGridPlacement(layout: GridLayout, placement: GridPlacement, hl: HeadLoss = headLoss("US")): GridPlacementSolution {
  const { firstLine, firstHead } = placement;
  if (!(Number.isInteger(firstLine) && firstLine >= 1 && firstLine <= layout.lines - layout.areaLines + 1)) {
    fail("first_line", n(firstLine), "must be a whole number from 1 to {0}", n(layout.lines - layout.areaLines + 1));
  }
  if (!(Number.isInteger(firstHead) && firstHead >= 1 && firstHead <= layout.lineHeads - layout.headsPerLine + 1)) {
    fail("first_head", n(firstHead), "must be a whole number from 1 to {0}", n(layout.lineHeads - layout.headsPerLine + 1));
  }
  return searchPlacement(layout, coldSearch(layout, placement), hl);
}

/**
 * A placement whose least-favoured sprinkler flows more than q_req × (1 + PRUNE_MARGIN) at the highest riser pressure
 * found so far needs less than that pressure: the least-favoured flow rises with the riser pressure.
 */
const PRUNE_MARGIN = 3e-3;

/**
 * Solve the design area of a gridded system: every placement, and the one needing the highest riser pressure.
 *
 *   P = max over first_line = 1 … lines − l + 1, first_head = 1 … N − m + 1 of P(first_line, first_head)
 *
 * The placement farthest from the riser (the far end of the grid's lines, sprinklers in the middle) is solved first.
 * Every placement is then solved once at the highest riser pressure P* found so far, from its neighbour's solution
 * (the previous first_head; for first_head 1, the previous first_line's): where its least-favoured sprinkler flows more
 * than q_req there, the placement needs less than P* (flows rise with the riser pressure) and its own P is not needed;
 * otherwise it is searched in full and may raise P*. The answer is the first placement, in the order above, whose P is
 * the highest (within GRID_TIE_TOLERANCE): the same as solving every placement in full.
 *
 * 0.15 gpm/ft² over 1500 ft², 130 ft² per sprinkler, K 5.6, 13 ft spacing, 10 lines 160 ft long (N = 12), 1¼ in
 * Schedule 40 lines (1.38 in) on 2½ in mains (2.469 in), C 120, fed at line 1: n = 12, m = 4, l = 3 (gridLayout's
 * worked value); 8 × 9 = 72 placements. The area lands at the far side of the grid from the riser (lines 8 to 10),
 * sprinklers 6 to 9, past the middle of the lines: the near main carries all the water, so the far main's end of a line
 * is the longer way round.
 *
 * @param inp the grid, its design area, sprinklers and pipes, US units (gpm/ft², ft², gpm/psi^0.5, ft, in, psi)
 * @param hl the head loss of the user's unit system (headLoss(units)); default the [NFPA 13] US form
 * @param detail also return the winning placement's network and solution
 * @returns the riser's flow (gpm) and pressure (psi), n, l, the least-favoured pressure (psi) and the placement
 * @see [NFPA 13] density/area method and hydraulic calculation of gridded systems
 * @example
 * solveGridDemand({ density: 0.15, area: 1500, coverage: 130, kFactor: 5.6, headSpacing: 13, lines: 10,
 *   lineLength: 160, branchDiameter: 1.38, mainDiameter: 2.469, cFactor: 120, minPressure: 7, feedLine: 1 })
 * // .heads → 12
 * // .lines → 3
 * // .placements → 72
 * // .endPressure ≈ 12.13 psi
 * // .firstLine → 8
 * // .firstHead → 6
 * // .flow ≈ 236.86 gpm
 * // .pressure ≈ 28.20 psi
 */
export function solveGridDemand(inp: GridDemandInput, hl: HeadLoss = headLoss("US"), detail = false): GridDemand {
  const layout = gridLayout(inp);
  const lastLine = layout.lines - layout.areaLines + 1;
  const lastHead = layout.lineHeads - layout.headsPerLine + 1;
  const seed: GridPlacement = {
    firstLine: layout.feedLine - 1 >= layout.lines - layout.feedLine ? 1 : lastLine,
    firstHead: Math.ceil((lastHead + 1) / 2),
  };
  const seedSolved = searchPlacement(layout, coldSearch(layout, seed), hl);
  let top = seedSolved.pressure;
  const candidates: GridPlacementSolution[] = [];
  /** A placement solved at some riser pressure: where the next ones start. */
  interface Reached {
    placement: GridPlacement;
    pressure: number;
    alpha: number;
    g: GridNetwork;
    solution: NetworkSolution;
  }
  let lineStart: Reached | undefined;
  let placements = 0;
  for (let firstLine = 1; firstLine <= lastLine; firstLine++) {
    let neighbour = lineStart;
    let prepared: PreparedNetwork | undefined;
    for (let firstHead = 1; firstHead <= lastHead; firstHead++) {
      placements++;
      const placement = { firstLine, firstHead };
      let solved: GridPlacementSolution | undefined;
      let reached: Reached | undefined;
      if (firstLine === seed.firstLine && firstHead === seed.firstHead) {
        solved = seedSolved;
      } else {
        const g = areaNetwork(layout, placement, top);
        prepared ??= prepareNetwork(g.network); // the same pipes join the same nodes for every first_head of a first_line
        let warm: NetworkSolution | undefined;
        if (neighbour) {
          // along a line the neighbour's network has the same nodes and pipes, its area one sprinkler back: its
          // solution, moving with the area, is the closer start; across lines it is carried over by position
          const near = neighbour.placement.firstLine === firstLine ? neighbour.solution : contract(layout, g, expand(layout, neighbour.g, neighbour.solution));
          warm = scaled(near, top / neighbour.pressure);
        }
        const atTop = solveAt(layout, g, top, hl, prepared, warm, COMPARE_TOLERANCE / layout.heads);
        if (leastFavoured(layout, g, atTop).flow > layout.requiredFlow * (1 + PRUNE_MARGIN)) {
          reached = { placement, pressure: top, alpha: neighbour?.alpha ?? 2, g, solution: atTop };
        } else {
          solved = searchPlacement(layout, { placement, g, prepared, pressure: top, alpha: neighbour?.alpha ?? 2, warm: atTop }, hl);
        }
      }
      if (solved) {
        candidates.push(solved);
        top = Math.max(top, solved.pressure);
        reached = { placement, pressure: solved.pressure, alpha: solved.alpha, g: solved.grid, solution: solved.solution };
      }
      neighbour = reached;
      if (firstHead === 1) lineStart = neighbour;
    }
  }
  // the first, in the order searched, of the placements needing the highest pressure (a tie within GRID_TIE_TOLERANCE)
  const highest = Math.max(...candidates.map((c) => c.pressure));
  const best = candidates.find((c) => c.pressure >= highest / (1 + GRID_TIE_TOLERANCE))!;
  const result: GridDemand = {
    flow: best.flow,
    pressure: best.pressure,
    heads: layout.heads,
    lines: layout.areaLines,
    endPressure: best.endPressure,
    firstLine: best.placement.firstLine,
    firstHead: best.placement.firstHead,
    headsPerLine: layout.headsPerLine,
    lineHeads: layout.lineHeads,
    placements,
  };
  if (detail) result.solved = best;
  return result;
}
