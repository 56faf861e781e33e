/**
 * A looped pipe network of sprinklers, fixed-pressure sources and Hazen-Williams pipes, solved by the global gradient
 * method. US units inside: gpm, psi, in, ft.
 *
 * The network: nodes with an elevation, each either a source held at a fixed pressure (a riser, a connection to a
 * main) or a junction that may carry a sprinkler (flowing K √p for p > 0, nothing for p ≤ 0) and a fixed outflow (a
 * hose allowance); pipes between two nodes with an internal diameter, a Hazen-Williams C and a length (pipe plus
 * fitting equivalent length). A node's head is its pressure plus 0.433 psi per ft of its elevation, H = p + 0.433 z
 * (psi); water in a pipe runs from the higher head to the lower and loses its Hazen-Williams loss on the way.
 *
 * The method (Todini & Pilati's global gradient method, the one EPANET uses): Newton's method on the pipe flows and
 * the junction heads together. Each sprinkler is a pseudo-pipe from its node to a source at the node's elevation whose
 * "loss" is p = (q / K)²; a pipe (or sprinkler) carrying Q with loss h(Q) and slope g = dh/dQ is linearised as
 *
 *   Q' = Q − h(Q) / g + (H_from − H_to) / g
 *
 * and putting these Q' into the flow balance of every junction gives one linear system in the unknown heads,
 *
 *   Σ_pipes at i (1/g) H_i − Σ_pipes i–j (1/g) H_j = Σ_in (Q − h/g) − Σ_out (Q − h/g) − demand_i (+ (1/g) H of a source)
 *
 * whose matrix is the network's Laplacian weighted by 1/g: symmetric and positive definite while every junction
 * reaches a source. It is factored by a sparse Cholesky factorisation, the junctions ordered once per network by
 * minimum degree (see `prepareNetwork`); no dense matrix is ever formed. The new heads give the new flows; repeat
 * until the flows balance at every junction and every pipe loses what the heads across it say. Pipes in a row through
 * closed sprinklers carry one flow, and its power |Q|^0.85 is worked out once for the row.
 *
 * Below a flow at which the water moves at 0.001 ft/s (Q_lin = 0.002448 d² gpm) a pipe's loss is taken as the straight
 * line through zero and the Hazen-Williams loss at Q_lin (its slope would vanish at no flow, and the system with it);
 * a sprinkler likewise below 0.0001 gpm. A sprinkler whose pressure falls to 0 or below is shut (it flows nothing)
 * until its pressure rises above 0 again.
 */
import { HeadroomError, fail, n, q } from "./errors";
import { HW_FLOW_EXPONENT, headLoss, velocity } from "./friction";
import { PSI_PER_FT_WATER, type UnitSystem } from "./units";

/** One node of a network, US units. */
export interface NetworkNode {
  /** elevation, ft (any sign) */
  elevation: number;
  /** psi: a source (riser, connection to a main) held at this pressure; absent for a junction */
  fixedPressure?: number;
  /** sprinkler K, gpm/psi^0.5: flows K·√p for p > 0, nothing for p ≤ 0; absent or 0: no sprinkler / closed */
  k?: number;
  /** fixed outflow, gpm (e.g. a hose allowance); absent = 0 */
  demand?: number;
}

/** One pipe of a network: its two ends (indices into the nodes), internal diameter in, Hazen-Williams C, length ft. */
export interface NetworkPipe {
  /** index of the node at the pipe's start (a flow from → to is positive) */
  from: number;
  /** index of the node at the pipe's end */
  to: number;
  /** internal diameter, in */
  diameter: number;
  /** Hazen-Williams C, dimensionless */
  cFactor: number;
  /** pipe plus fitting equivalent length, ft */
  length: number;
}

/** A network: nodes and the pipes between them (a pipe names its ends by their index in `nodes`, from 0). */
export interface Network {
  readonly nodes: readonly NetworkNode[];
  readonly pipes: readonly NetworkPipe[];
}

/** A solved network. */
export interface NetworkSolution {
  /** psi at each node */
  pressure: Float64Array;
  /** gpm in each pipe, positive from → to */
  flow: Float64Array;
  /**
   * gpm leaving the network at each node: at a junction its sprinkler's K √p (p > 0) plus its demand; at a
   * fixed-pressure node, minus the flow it supplies to the pipes (a sprinkler or demand at a source is served by the
   * source itself and left out)
   */
  outflow: Float64Array;
  /** the linear systems solved */
  iterations: number;
  /**
   * gpm, the residual at the end: the larger of the largest flow imbalance at a junction (what its pipes bring minus
   * its outflow) and the largest flow correction a pipe's head-loss mismatch calls for (|h(Q) − (H_from − H_to)| ÷
   * dh/dQ, the change the next Newton step would make)
   */
  residual: number;
}

/**
 * A network's topology made ready for solving: the junctions' elimination order and the sparse Cholesky factor's
 * structure. Valid while the pipes and which nodes are fixed-pressure stay the same.
 */
export interface PreparedNetwork {
  /** nodes of the network it was prepared for */
  readonly nodeCount: number;
  /** pipes of the network it was prepared for */
  readonly pipeCount: number;
  /** junctions: the unknown heads, one row of the system each */
  readonly unknowns: number;
  /** stored entries of the Cholesky factor (its diagonal included) */
  readonly factorEntries: number;
  /** multiply-adds of one factorisation */
  readonly factorWork: number;
  /** the junctions' node indices in elimination order */
  readonly order: Int32Array;
  /** each node's row in the system (its place in `order`), or −1 for a fixed-pressure node */
  readonly row: Int32Array;
  /** each pipe's ends, as given (to tell the network it belongs to) */
  readonly from: Int32Array;
  readonly to: Int32Array;
  /** the factor by columns: column j holds its diagonal at colStart[j], then its rows below, rising */
  readonly colStart: Int32Array;
  readonly rowIndex: Int32Array;
  /** where each pipe between two junctions adds to the matrix (its entry below the diagonal), or −1 */
  readonly pipeEntry: Int32Array;
  /** the factorisation's updates, column by column: the entry each product of two entries is taken from */
  readonly updates: Int32Array;
  /** the pipes in an order that runs along each chain of junctions joined to two pipes (a branch line), end to end */
  readonly pipeOrder: Int32Array;
}

/** Solve options. */
export interface SolveNetworkOptions {
  /** head-loss form: "US" the [NFPA 13] form, "SI" the [EN 12845] form; default "US" */
  units?: UnitSystem;
  /** the residual accepted, as a fraction of the flow through the network (at least 1 gpm); default 1e-6 */
  tolerance?: number;
  /** linear systems solved at most before giving up; default 100 */
  maxIterations?: number;
  /** the topology prepared once for many solves of one network (prepareNetwork) */
  prepared?: PreparedNetwork;
  /** a solution of a neighbouring problem (same pipes and nodes) to start from */
  warmStart?: NetworkSolution;
}

/** Default of `tolerance`: the residual accepted as a fraction of the flow through the network. */
const DEFAULT_TOLERANCE = 1e-6;
/** Default of `maxIterations`. */
const DEFAULT_MAX_ITERATIONS = 100;
/** Below this velocity (ft/s) a pipe's loss is linear in its flow. */
const LINEAR_VELOCITY_FT_S = 0.001;
/** Below this flow (gpm) a sprinkler's pressure is linear in its flow. */
const SPRINKLER_LINEAR_GPM = 1e-4;
/** The velocity (ft/s) of the pipes' first guess of flow: a sprinkler system's mains and lines run at a few ft/s. */
const START_VELOCITY_FT_S = 4;
/** The sprinklers' first guess of pressure, as a fraction of the static pressure at them (the highest source's). */
const START_PRESSURE_FRACTION = 0.5;
/** The rounding allowed in a flow made of heads and flows, as a multiple of their magnitudes. */
const ROUNDING = 32 * Number.EPSILON;
/** Flows within this fraction of each other share one power |Q|^0.85 (pipes in a row through closed sprinklers). */
const SAME_FLOW = 1e-13;
/** How many node numbers an error message lists before it says how many there are in all. */
const LISTED_NODES = 10;

// ---------------------------------------------------------------------------------------------------------------------
// Checks

function wholeIndex(x: number, count: number): boolean {
  return Number.isInteger(x) && x >= 0 && x < count;
}

/** Nodes named in a message: "node 7" or "nodes 7, 8, …, 30 (25 in all)". */
function nodeList(nodes: number[]): string {
  if (nodes.length === 1) return `node ${nodes[0]}`;
  const shown = nodes.slice(0, LISTED_NODES).join(", ");
  return nodes.length > LISTED_NODES ? `nodes ${shown}, … (${nodes.length} in all)` : `nodes ${shown}`;
}

function checkTopology(net: Network): void {
  const nodes = net.nodes;
  const pipes = net.pipes;
  const count = nodes.length;
  for (let i = 0; i < pipes.length; i++) {
    const p = pipes[i];
    for (const end of ["from", "to"] as const) {
      if (!wholeIndex(p[end], count)) {
        fail(
          `pipes[${i}].${end}`,
          n(p[end]),
          count === 0 ? "must be the index of a node, and the network has none" : "must be the index of a node, a whole number from 0 to {0}",
          n(count - 1),
        );
      }
    }
    if (p.from === p.to) fail(`pipes[${i}].to`, n(p.to), "must differ from pipes[{0}].from: a pipe joins two nodes", n(i));
  }
  // Every node must reach a source through pipes, or its head is not determined.
  const first = new Int32Array(count).fill(-1);
  const next = new Int32Array(2 * pipes.length);
  const other = new Int32Array(2 * pipes.length);
  for (let i = 0; i < pipes.length; i++) {
    const p = pipes[i];
    other[2 * i] = p.to;
    next[2 * i] = first[p.from];
    first[p.from] = 2 * i;
    other[2 * i + 1] = p.from;
    next[2 * i + 1] = first[p.to];
    first[p.to] = 2 * i + 1;
  }
  const reached = new Uint8Array(count);
  const stack: number[] = [];
  for (let i = 0; i < count; i++) {
    if (nodes[i].fixedPressure !== undefined) {
      reached[i] = 1;
      stack.push(i);
    }
  }
  if (stack.length === 0) fail("network", undefined, "has no fixed-pressure node: give at least one node a fixedPressure");
  while (stack.length > 0) {
    const v = stack.pop() as number;
    for (let e = first[v]; e >= 0; e = next[e]) {
      if (!reached[other[e]]) {
        reached[other[e]] = 1;
        stack.push(other[e]);
      }
    }
  }
  const lost: number[] = [];
  for (let i = 0; i < count; i++) if (!reached[i]) lost.push(i);
  if (lost.length > 0) {
    fail("network", undefined, `${nodeList(lost)} ${lost.length === 1 ? "is" : "are"} connected to no fixed-pressure node`);
  }
}

function checkValues(net: Network): void {
  const nodes = net.nodes;
  for (let i = 0; i < nodes.length; i++) {
    const node = nodes[i];
    if (!Number.isFinite(node.elevation)) fail(`nodes[${i}].elevation`, q("length", node.elevation), "must be a finite number");
    const p = node.fixedPressure;
    if (p !== undefined && !(Number.isFinite(p) && p >= 0)) fail(`nodes[${i}].fixedPressure`, q("pressure", p), "must be 0 or more");
    const k = node.k;
    if (k !== undefined && !(Number.isFinite(k) && k >= 0)) fail(`nodes[${i}].k`, q("kfactor", k), "must be 0 or more (0: no sprinkler)");
    const d = node.demand;
    if (d !== undefined && !(Number.isFinite(d) && d >= 0)) fail(`nodes[${i}].demand`, q("flow", d), "must be 0 or more");
  }
  const pipes = net.pipes;
  for (let i = 0; i < pipes.length; i++) {
    const p = pipes[i];
    if (!(Number.isFinite(p.diameter) && p.diameter > 0)) fail(`pipes[${i}].diameter`, q("diameter", p.diameter), "must be greater than 0");
    if (!(Number.isFinite(p.cFactor) && p.cFactor > 0)) fail(`pipes[${i}].cFactor`, n(p.cFactor), "must be greater than 0");
    if (!(Number.isFinite(p.length) && p.length > 0)) fail(`pipes[${i}].length`, q("length", p.length), "must be greater than 0");
  }
}

/** Whether `prep` was prepared for this network's topology (the same pipes, the same fixed-pressure nodes). */
function preparedFor(prep: PreparedNetwork, net: Network): boolean {
  if (prep.nodeCount !== net.nodes.length || prep.pipeCount !== net.pipes.length) return false;
  for (let i = 0; i < prep.nodeCount; i++) if ((prep.row[i] < 0) !== (net.nodes[i].fixedPressure !== undefined)) return false;
  for (let j = 0; j < prep.pipeCount; j++) if (prep.from[j] !== net.pipes[j].from || prep.to[j] !== net.pipes[j].to) return false;
  return true;
}

// ---------------------------------------------------------------------------------------------------------------------
// Ordering and the factor's structure

/**
 * Order the junctions by minimum degree and lay out the Cholesky factor: eliminate, one at a time, the junction that
 * touches the fewest others still standing (the lowest-numbered on a tie). Eliminating a junction joins all its
 * neighbours to one another, and those neighbours are the rows of its column of the factor; taking the least-connected
 * first keeps that fill small. A branch line's sprinklers go first, one after another, each joining only its two
 * neighbours (no fill), and what is left is the mains.
 *
 * @returns the junctions in elimination order, and the factor by columns (diagonal first, then the rows below, rising)
 */
function minimumDegree(adjacency: number[][]): { order: Int32Array; colStart: Int32Array; rowIndex: Int32Array } {
  const m = adjacency.length;
  // a binary heap of degree × m + junction; an entry whose degree is out of date is skipped when popped
  const heap: number[] = [];
  const push = (key: number) => {
    let i = heap.length;
    heap.push(key);
    while (i > 0) {
      const parent = (i - 1) >> 1;
      if (heap[parent] <= key) break;
      heap[i] = heap[parent];
      i = parent;
    }
    heap[i] = key;
  };
  const pop = (): number => {
    const top = heap[0];
    const last = heap.pop() as number;
    if (heap.length > 0) {
      let i = 0;
      for (;;) {
        let child = 2 * i + 1;
        if (child >= heap.length) break;
        if (child + 1 < heap.length && heap[child + 1] < heap[child]) child++;
        if (heap[child] >= last) break;
        heap[i] = heap[child];
        i = child;
      }
      heap[i] = last;
    }
    return top;
  };
  for (let v = 0; v < m; v++) push(adjacency[v].length * m + v);
  const order = new Int32Array(m);
  const place = new Int32Array(m).fill(-1);
  const mark = new Int32Array(m).fill(-1);
  const colStart = new Int32Array(m + 1);
  const rows: number[] = [];
  let stamp = 0;
  for (let k = 0; k < m; k++) {
    let v: number;
    for (;;) {
      const key = pop();
      v = key % m;
      if (place[v] < 0 && (key - v) / m === adjacency[v].length) break;
    }
    order[k] = v;
    place[v] = k;
    const touched = adjacency[v];
    colStart[k] = rows.length;
    rows.push(v);
    for (const a of touched) rows.push(a);
    // each neighbour loses v and gains the others
    for (const a of touched) {
      const list = adjacency[a];
      stamp++;
      mark[a] = stamp;
      for (let i = 0; i < list.length; i++) {
        if (list[i] === v) {
          list[i] = list[list.length - 1];
          list.pop();
          i--;
        } else mark[list[i]] = stamp;
      }
      for (const b of touched) {
        if (mark[b] !== stamp) {
          list.push(b);
          mark[b] = stamp;
        }
      }
      push(list.length * m + a);
    }
    adjacency[v] = [];
  }
  colStart[m] = rows.length;
  // junctions → places, each column's rows below the diagonal rising
  const rowIndex = new Int32Array(rows.length);
  for (let e = 0; e < rows.length; e++) rowIndex[e] = place[rows[e]];
  for (let k = 0; k < m; k++) {
    // insertion sort: a column holds few rows
    for (let e = colStart[k] + 2; e < colStart[k + 1]; e++) {
      const x = rowIndex[e];
      let f = e - 1;
      while (f > colStart[k] && rowIndex[f] > x) {
        rowIndex[f + 1] = rowIndex[f];
        f--;
      }
      rowIndex[f + 1] = x;
    }
  }
  return { order, colStart, rowIndex };
}

/**
 * The pipes in an order that follows every chain: a run of pipes through junctions that each join exactly two pipe
 * ends (a branch line's sprinklers) comes end to end, so that where the sprinklers are closed and every pipe of the
 * run carries the same flow, the solve works out that flow's power once for the whole run.
 */
function chainOrder(net: Network, junction: Int32Array): Int32Array {
  const count = net.nodes.length;
  const pipes = net.pipes;
  const ends = new Int32Array(count);
  for (const p of pipes) {
    ends[p.from]++;
    ends[p.to]++;
  }
  // each node's pipes
  const start = new Int32Array(count + 1);
  for (let i = 0; i < count; i++) start[i + 1] = start[i] + ends[i];
  const fillAt = start.slice(0, count);
  const incident = new Int32Array(2 * pipes.length);
  for (let j = 0; j < pipes.length; j++) {
    incident[fillAt[pipes[j].from]++] = j;
    incident[fillAt[pipes[j].to]++] = j;
  }
  const through = (v: number) => junction[v] >= 0 && ends[v] === 2;
  const placed = new Uint8Array(pipes.length);
  const order = new Int32Array(pipes.length);
  let t = 0;
  // walk from pipe j away from node `back`, along junctions of two pipe ends
  const walk = (j: number, back: number) => {
    for (;;) {
      placed[j] = 1;
      order[t++] = j;
      const p = pipes[j];
      const v = p.from === back ? p.to : p.from;
      if (!through(v)) return;
      const k = incident[start[v]] === j ? incident[start[v] + 1] : incident[start[v]];
      if (placed[k]) return;
      back = v;
      j = k;
    }
  };
  // chains from their ends first: a pipe leaving a node that is not a pass-through, into one that is
  for (let j = 0; j < pipes.length; j++) {
    if (placed[j]) continue;
    const p = pipes[j];
    if (!through(p.from)) walk(j, p.from);
    else if (!through(p.to)) walk(j, p.to);
  }
  // what is left: closed rings of pass-through junctions
  for (let j = 0; j < pipes.length; j++) if (!placed[j]) walk(j, pipes[j].from);
  return order;
}

/**
 * Prepare a network's topology for solving: its checks, its junctions' order and its system's factor layout.
 *
 *   matrix A (one row per junction): A_ii = Σ 1/g over the pipes and sprinkler at i, A_ij = −Σ 1/g over pipes i–j
 *
 * A's pattern is the pipes between junctions; its Cholesky factor L (A = L Lᵀ) also fills in, as each junction is
 * eliminated, between all the junctions it still touches, so the order decides the work. Junctions are eliminated by
 * minimum degree (the one touching the fewest others first): a branch line's sprinklers, each touching two, go first
 * and add nothing, leaving the mains. A grid of 40 lines × 48 sprinklers with two cross mains (2,000 junctions,
 * 2,000 pipes) factors with 5,997 entries and 5,995 multiply-adds. The work is done once: the result serves every
 * solve of a network with the same pipes and the same fixed-pressure nodes (pressures, elevations, K factors, demands,
 * diameters, C and lengths may all change), and keeps the working arrays and each pipe's resistance between solves.
 * A source feeding one sprinkler has one junction: one row, one stored entry and no update.
 *
 * @param net the network (pipes name their ends by index into nodes)
 * @returns the prepared topology, for `solveNetwork`'s `prepared` option
 * @see [Todini 1988] the system of the global gradient method
 * @example
 * prepareNetwork({ nodes: [{ elevation: 0, fixedPressure: 50 }, { elevation: 0, k: 5.6 }], pipes: [{ from: 0, to: 1, diameter: 1.049, cFactor: 120, length: 100 }] }).factorEntries // → 1
 * prepareNetwork({ nodes: [{ elevation: 0 }, { elevation: 0, k: 5.6 }], pipes: [{ from: 0, to: 1, diameter: 1.049, cFactor: 120, length: 100 }] })
 * // throws "network has no fixed-pressure node: give at least one node a fixedPressure"
 */
export function prepareNetwork(net: Network): PreparedNetwork {
  checkTopology(net);
  const nodes = net.nodes;
  const count = nodes.length;
  // junctions numbered in the order given
  const junction = new Int32Array(count).fill(-1);
  const junctionNode: number[] = [];
  for (let i = 0; i < count; i++) {
    if (nodes[i].fixedPressure === undefined) {
      junction[i] = junctionNode.length;
      junctionNode.push(i);
    }
  }
  const m = junctionNode.length;
  const adjacency: number[][] = [];
  for (let j = 0; j < m; j++) adjacency.push([]);
  for (const p of net.pipes) {
    const a = junction[p.from], b = junction[p.to];
    // parallel pipes join the same two junctions once
    if (a >= 0 && b >= 0 && !adjacency[a].includes(b)) {
      adjacency[a].push(b);
      adjacency[b].push(a);
    }
  }
  const { order: elimination, colStart, rowIndex } = minimumDegree(adjacency);
  const order = new Int32Array(m);
  for (let k = 0; k < m; k++) order[k] = junctionNode[elimination[k]];
  const row = new Int32Array(count).fill(-1);
  for (let k = 0; k < m; k++) row[order[k]] = k;

  // where a row sits in its column
  const entryOf = (r: number, c: number): number => {
    let lo = colStart[c], hi = colStart[c + 1] - 1;
    while (lo <= hi) {
      const mid = (lo + hi) >> 1;
      if (rowIndex[mid] === r) return mid;
      if (rowIndex[mid] < r) lo = mid + 1;
      else hi = mid - 1;
    }
    throw new Error(`network: entry (${r}, ${c}) is not in the factor`);
  };
  const pipeCount = net.pipes.length;
  const pipeEntry = new Int32Array(pipeCount);
  const from = new Int32Array(pipeCount), to = new Int32Array(pipeCount);
  for (let j = 0; j < pipeCount; j++) {
    const p = net.pipes[j];
    from[j] = p.from;
    to[j] = p.to;
    const a = row[p.from], b = row[p.to];
    pipeEntry[j] = a >= 0 && b >= 0 ? entryOf(Math.max(a, b), Math.min(a, b)) : -1;
  }
  const pipeOrder = chainOrder(net, junction);
  // each product of two entries of column k updates the entry at their two rows
  let pairs = 0;
  for (let k = 0; k < m; k++) {
    const below = colStart[k + 1] - colStart[k] - 1;
    pairs += (below * (below + 1)) / 2;
  }
  const updates = new Int32Array(pairs);
  let t = 0;
  for (let k = 0; k < m; k++) {
    const s = colStart[k] + 1, e = colStart[k + 1];
    for (let b = s; b < e; b++) for (let a = b; a < e; a++) updates[t++] = entryOf(rowIndex[a], rowIndex[b]);
  }
  return {
    nodeCount: count,
    pipeCount,
    unknowns: m,
    factorEntries: rowIndex.length,
    factorWork: pairs,
    order,
    row,
    from,
    to,
    colStart,
    rowIndex,
    pipeEntry,
    updates,
    pipeOrder,
  };
}

// ---------------------------------------------------------------------------------------------------------------------
// The linear algebra

/** Factor in place: `values` holds A in the factor's layout on entry and L (A = L Lᵀ) on return. */
function factor(prep: PreparedNetwork, values: Float64Array): boolean {
  const { colStart, updates, unknowns } = prep;
  let t = 0;
  for (let k = 0; k < unknowns; k++) {
    const s = colStart[k], e = colStart[k + 1];
    const d = values[s];
    if (!(d > 0)) return false;
    const l = Math.sqrt(d);
    values[s] = l;
    const inv = 1 / l;
    for (let a = s + 1; a < e; a++) values[a] *= inv;
    for (let b = s + 1; b < e; b++) {
      const lb = values[b];
      for (let a = b; a < e; a++) values[updates[t++]] -= values[a] * lb;
    }
  }
  return true;
}

/** Solve L Lᵀ x = b in place (`x` holds b on entry). */
function substitute(prep: PreparedNetwork, values: Float64Array, x: Float64Array): void {
  const { colStart, rowIndex, unknowns } = prep;
  for (let k = 0; k < unknowns; k++) {
    const s = colStart[k], e = colStart[k + 1];
    const xk = (x[k] /= values[s]);
    for (let a = s + 1; a < e; a++) x[rowIndex[a]] -= values[a] * xk;
  }
  for (let k = unknowns - 1; k >= 0; k--) {
    const s = colStart[k], e = colStart[k + 1];
    let sum = x[k];
    for (let a = s + 1; a < e; a++) sum -= values[a] * x[rowIndex[a]];
    x[k] = sum / values[s];
  }
}

// ---------------------------------------------------------------------------------------------------------------------
// The solve

function checkOptions(options: SolveNetworkOptions, net: Network): void {
  const { units, tolerance, maxIterations, warmStart } = options;
  if (units !== undefined && units !== "US" && units !== "SI") fail("options.units", { cell: units }, 'must be "US" or "SI"');
  if (tolerance !== undefined && !(Number.isFinite(tolerance) && tolerance > 0)) fail("options.tolerance", n(tolerance), "must be greater than 0");
  if (maxIterations !== undefined && !(Number.isInteger(maxIterations) && maxIterations >= 1)) {
    fail("options.maxIterations", n(maxIterations), "must be a whole number, 1 or more");
  }
  if (warmStart !== undefined) {
    if (warmStart.pressure.length !== net.nodes.length || warmStart.flow.length !== net.pipes.length) {
      fail(
        "options.warmStart",
        { text: `a solution of ${warmStart.pressure.length} nodes and ${warmStart.flow.length} pipes` },
        "must solve a network of {0} nodes and {1} pipes",
        n(net.nodes.length),
        n(net.pipes.length),
      );
    }
    if (!warmStart.pressure.every(Number.isFinite) || !warmStart.flow.every(Number.isFinite)) {
      fail("options.warmStart", { text: "a solution with a number that is not finite" }, "must hold finite pressures and flows");
    }
  }
}

/**
 * The working arrays of the solves of one prepared topology, and each pipe's resistance as last worked out: made once
 * per topology and reused (a solve writes every entry it reads before reading it).
 */
interface Scratch {
  /** the unit system the resistances were worked out in */
  units: UnitSystem | undefined;
  /** per pipe: the diameter, C and length the resistances were worked out for */
  diameter: Float64Array;
  cFactor: Float64Array;
  length: Float64Array;
  /** per pipe: r (loss = r Q |Q|^0.85), the flow below which the loss is linear, the loss per gpm there */
  resistance: Float64Array;
  linearFlow: Float64Array;
  linearSlope: Float64Array;
  /** per pipe: 1/g and the flow correction h/g of the present step */
  conductance: Float64Array;
  correction: Float64Array;
  /** per node, psi: elevation head and head (from the highest source's head), flow in (gpm), its rounding (gpm) */
  elevationHead: Float64Array;
  head: Float64Array;
  inflow: Float64Array;
  rounding: Float64Array;
  /** per junction (by row): K, K², demand, the sprinkler's flow, 1/g, h/g and whether it is open; the system's right side */
  kOf: Float64Array;
  k2: Float64Array;
  demand: Float64Array;
  sprinklerFlow: Float64Array;
  sprinklerConductance: Float64Array;
  sprinklerCorrection: Float64Array;
  open: Uint8Array;
  rhs: Float64Array;
  /** the matrix, then its factor, in the factor's layout */
  values: Float64Array;
}

const SCRATCH = new WeakMap<PreparedNetwork, Scratch>();

function scratchOf(prep: PreparedNetwork): Scratch {
  let w = SCRATCH.get(prep);
  if (w === undefined) {
    const nodes = () => new Float64Array(prep.nodeCount);
    const pipes = () => new Float64Array(prep.pipeCount);
    const rows = () => new Float64Array(prep.unknowns);
    w = {
      units: undefined,
      diameter: pipes().fill(Number.NaN),
      cFactor: pipes(),
      length: pipes(),
      resistance: pipes(),
      linearFlow: pipes(),
      linearSlope: pipes(),
      conductance: pipes(),
      correction: pipes(),
      elevationHead: nodes(),
      head: nodes(),
      inflow: nodes(),
      rounding: nodes(),
      kOf: rows(),
      k2: rows(),
      demand: rows(),
      sprinklerFlow: rows(),
      sprinklerConductance: rows(),
      sprinklerCorrection: rows(),
      open: new Uint8Array(prep.unknowns),
      rhs: rows(),
      values: new Float64Array(prep.factorEntries),
    };
    SCRATCH.set(prep, w);
  }
  return w;
}

/**
 * Solve a pipe network: the pressure at every node and the flow in every pipe, by the global gradient method.
 *
 *   each pipe:       H_from − H_to = r Q |Q|^0.85,   r = K L / (C^1.85 d^4.87)   (Hazen-Williams, K = 4.52 US form)
 *   each node:       H = p + 0.433 z
 *   each junction:   Σ Q in − Σ Q out = K √p (p > 0; else 0) + demand
 *   each source:     p = its fixed pressure
 *
 * Newton's method on flows and heads together (see the module's comment), each step one sparse symmetric positive
 * definite system in the junction heads, until the residual (see `NetworkSolution.residual`) is at most `tolerance` ×
 * the flow through the network (half the sum of every node's |outflow|, at least 1 gpm), rounding aside: a stiff pipe
 * (short, wide, carrying almost nothing) turns the last digit of a head into a flow (1/g × that digit), and so much of
 * the residual as the rounding of its heads and flows explains is not counted against the tolerance.
 *
 * A 50 psi source feeding one K 5.6 sprinkler through 100 ft of 1 in Schedule 40 pipe (1.049 in) at C 120, level: the
 * pipe loses r Q^1.85 with r = 4.52 × 100 / (120^1.85 × 1.049^4.87) = 452 / (7022.40 × 1.262341) = 0.0509890, so
 * p = 50 − 0.0509890 (5.6 √p)^1.85; p = 25.395 psi solves it: Q = 5.6 × 5.03937 = 28.220 gpm, 28.220^1.85 = 482.55,
 * loss 0.0509890 × 482.55 = 24.605 psi, 50 − 24.605 = 25.395.
 *
 * Bad input is an error naming it: a pipe whose end is not a node or joins a node to itself, a diameter, C or length
 * not above 0, a negative K, demand or fixed pressure, anything not finite, no fixed-pressure node, or nodes that no
 * pipe path joins to a fixed-pressure node. A solve that does not converge within `maxIterations` is a "converge"
 * error stating the residual reached.
 *
 * @param net the network (pipes name their ends by index into nodes)
 * @param options units ("US" or "SI" head-loss form), tolerance, maxIterations, prepared (from prepareNetwork),
 *   warmStart (a neighbouring solution)
 * @returns pressures (psi) at the nodes, flows (gpm) in the pipes, outflows (gpm) at the nodes, iterations, residual (gpm)
 * @see [Todini 1988] the global gradient method; [NFPA 13] Hazen-Williams, Q = K √p and 0.433 psi per ft;
 *   [EN 12845] the SI form of Hazen-Williams
 * @example
 * solveNetwork({ nodes: [{ elevation: 0, fixedPressure: 50 }, { elevation: 0, k: 5.6 }], pipes: [{ from: 0, to: 1, diameter: 1.049, cFactor: 120, length: 100 }] }).pressure[1] // ≈ 25.40 psi
 */
export function solveNetwork(net: Network, options?: SolveNetworkOptions): NetworkSolution {
  const opts = options ?? {};
  checkOptions(opts, net);
  let prep = opts.prepared;
  if (prep === undefined) prep = prepareNetwork(net);
  else if (!preparedFor(prep, net)) {
    fail("options.prepared", undefined, "was prepared for another network: its pipes or its fixed-pressure nodes differ");
  }
  checkValues(net);
  const hl = headLoss(opts.units ?? "US");
  const tolerance = opts.tolerance ?? DEFAULT_TOLERANCE;
  const maxIterations = opts.maxIterations ?? DEFAULT_MAX_ITERATIONS;

  const nodes = net.nodes;
  const pipes = net.pipes;
  const nodeCount = nodes.length;
  const pipeCount = pipes.length;
  const m = prep.unknowns;
  const { row, order, colStart, pipeEntry, pipeOrder } = prep;
  const from = prep.from, to = prep.to;
  const exponent = HW_FLOW_EXPONENT - 1;
  const w = scratchOf(prep);
  const { elevationHead, head, inflow, rounding, kOf, k2, demand, sprinklerFlow, open, rhs, values } = w;
  const { sprinklerConductance, sprinklerCorrection, conductance, correction, resistance, linearFlow, linearSlope } = w;

  // per node: elevation head and head, both measured from the highest source's head (so that the heads the solve
  // carries are small numbers, and rounding moves them little)
  let datum = -Infinity;
  for (let i = 0; i < nodeCount; i++) {
    const p = nodes[i].fixedPressure;
    if (p !== undefined) datum = Math.max(datum, p + PSI_PER_FT_WATER * nodes[i].elevation);
  }
  for (let i = 0; i < nodeCount; i++) {
    const node = nodes[i];
    elevationHead[i] = PSI_PER_FT_WATER * node.elevation - datum;
    head[i] = node.fixedPressure !== undefined ? node.fixedPressure + elevationHead[i] : 0;
  }
  // per junction (by row): K, K², demand, the sprinkler's flow and whether it is open
  for (let r = 0; r < m; r++) {
    const node = nodes[order[r]];
    kOf[r] = node.k ?? 0;
    k2[r] = kOf[r] * kOf[r];
    demand[r] = node.demand ?? 0;
    open[r] = 0;
    sprinklerFlow[r] = 0;
  }
  // per pipe: resistance r (loss = r Q |Q|^0.85), the flow below which the loss is linear and its slope there; kept
  // from the last solve of this topology while the pipe and the unit system stay the same
  if (w.units !== hl.units) w.diameter.fill(Number.NaN);
  w.units = hl.units;
  // the loss per ft at 1 gpm and the linear flow's power depend on the size alone: worked out once for a run of pipes
  // of one size
  let lastDiameter = Number.NaN, lastC = Number.NaN, lastRate = 0, lastLinearFlow = 0, lastLinearPower = 0;
  for (let j = 0; j < pipeCount; j++) {
    const p = pipes[j];
    if (p.diameter === w.diameter[j] && p.cFactor === w.cFactor[j] && p.length === w.length[j]) continue;
    w.diameter[j] = p.diameter;
    w.cFactor[j] = p.cFactor;
    w.length[j] = p.length;
    if (p.diameter !== lastDiameter || p.cFactor !== lastC) {
      if (p.diameter !== lastDiameter) {
        lastLinearFlow = LINEAR_VELOCITY_FT_S / velocity(1, p.diameter);
        lastLinearPower = Math.pow(lastLinearFlow, exponent);
      }
      lastDiameter = p.diameter;
      lastC = p.cFactor;
      lastRate = hl.rate(1, p.diameter, p.cFactor);
    }
    resistance[j] = lastRate * p.length;
    linearFlow[j] = lastLinearFlow;
    linearSlope[j] = resistance[j] * lastLinearPower;
  }

  const flow = new Float64Array(pipeCount);
  let haveHeads = false;
  const warm = opts.warmStart;
  if (warm !== undefined) {
    flow.set(warm.flow);
    for (let r = 0; r < m; r++) {
      const i = order[r];
      head[i] = warm.pressure[i] + elevationHead[i];
      const p = warm.pressure[i];
      if (kOf[r] > 0 && p > 0) {
        open[r] = 1;
        sprinklerFlow[r] = kOf[r] * Math.sqrt(p);
      }
    }
    haveHeads = true;
  } else {
    for (let j = 0; j < pipeCount; j++) flow[j] = START_VELOCITY_FT_S / velocity(1, pipes[j].diameter);
    for (let r = 0; r < m; r++) {
      if (kOf[r] > 0) {
        open[r] = 1;
        sprinklerFlow[r] = kOf[r] * Math.sqrt(Math.max(1, -START_PRESSURE_FRACTION * elevationHead[order[r]]));
      }
    }
  }

  let iterations = 0;
  let residual = Infinity;

  for (;;) {
    // coefficients at the present flows
    let lastFlow = -1, lastPower = 0;
    for (let t = 0; t < pipeCount; t++) {
      const j = pipeOrder[t];
      const Q = flow[j];
      const a = Math.abs(Q);
      if (a <= linearFlow[j]) {
        conductance[j] = 1 / linearSlope[j];
        correction[j] = Q;
      } else {
        if (Math.abs(a - lastFlow) > SAME_FLOW * a) {
          lastFlow = a;
          lastPower = Math.pow(a, exponent);
        }
        conductance[j] = 1 / (HW_FLOW_EXPONENT * resistance[j] * lastPower);
        correction[j] = Q / HW_FLOW_EXPONENT;
      }
    }
    if (haveHeads) {
      // reopen a shut sprinkler whose pressure has risen above 0
      for (let r = 0; r < m; r++) {
        if (kOf[r] > 0 && !open[r]) {
          const p = head[order[r]] - elevationHead[order[r]];
          if (p > 0) {
            open[r] = 1;
            sprinklerFlow[r] = kOf[r] * Math.sqrt(p);
          }
        }
      }
      // The residual: the flow correction each pipe's head-loss mismatch calls for, and the flow imbalance at each
      // junction. Each is allowed, beyond the tolerance, the rounding of the numbers it is made of: a stiff pipe (short,
      // wide, carrying almost nothing) turns a change in the last digit of a head into a flow (1/g × that change).
      residual = 0;
      let excess = 0;
      inflow.fill(0);
      rounding.fill(0);
      for (let j = 0; j < pipeCount; j++) {
        const a = from[j], b = to[j];
        const Q = flow[j];
        inflow[a] -= Q;
        inflow[b] += Q;
        const c = conductance[j];
        const noise = ROUNDING * (c * (Math.abs(head[a]) + Math.abs(head[b])) + Math.abs(Q));
        rounding[a] += noise;
        rounding[b] += noise;
        const change = Math.abs(c * (head[a] - head[b]) - correction[j]);
        if (change > residual || change !== change) residual = change;
        if (change - noise > excess || change !== change) excess = change - noise;
      }
      let through = 0;
      for (let i = 0; i < nodeCount; i++) {
        const r = row[i];
        if (r < 0) {
          through += Math.abs(inflow[i]);
          continue;
        }
        const p = head[i] - elevationHead[i];
        const out = (p > 0 ? kOf[r] * Math.sqrt(p) : 0) + demand[r];
        through += out;
        const imbalance = Math.abs(inflow[i] - out);
        if (imbalance > residual || imbalance !== imbalance) residual = imbalance;
        if (imbalance - rounding[i] > excess || imbalance !== imbalance) excess = imbalance - rounding[i];
      }
      if (!Number.isFinite(residual)) {
        throw new HeadroomError({
          kind: "converge",
          argument: "network",
          rule: "did not converge: the solve broke down after {0} iterations",
          amounts: [n(iterations)],
        });
      }
      if (excess <= tolerance * Math.max(1, through / 2)) break;
    }
    if (iterations >= maxIterations) {
      throw new HeadroomError({
        kind: "converge",
        argument: "network",
        rule: `did not converge in {0} ${iterations === 1 ? "iteration" : "iterations"}: the largest flow imbalance or correction was still {1}`,
        amounts: [n(iterations), q("flow", residual)],
      });
    }

    // assemble A H = F
    values.fill(0);
    for (let r = 0; r < m; r++) {
      const i = order[r];
      let f = -demand[r];
      if (open[r]) {
        const Qs = sprinklerFlow[r];
        let c: number, y: number;
        if (Qs <= SPRINKLER_LINEAR_GPM) {
          c = k2[r] / SPRINKLER_LINEAR_GPM;
          y = Qs;
        } else {
          c = k2[r] / (2 * Qs);
          y = Qs / 2;
        }
        sprinklerConductance[r] = c;
        sprinklerCorrection[r] = y;
        values[colStart[r]] += c;
        f += c * elevationHead[i] - (Qs - y);
      }
      rhs[r] = f;
    }
    for (let j = 0; j < pipeCount; j++) {
      const a = from[j], b = to[j];
      const ra = row[a], rb = row[b];
      const c = conductance[j];
      const passed = flow[j] - correction[j];
      if (ra >= 0) {
        values[colStart[ra]] += c;
        rhs[ra] -= passed;
        if (rb < 0) rhs[ra] += c * head[b];
      }
      if (rb >= 0) {
        values[colStart[rb]] += c;
        rhs[rb] += passed;
        if (ra < 0) rhs[rb] += c * head[a];
      }
      const e = pipeEntry[j];
      if (e >= 0) values[e] -= c;
    }
    if (!factor(prep, values)) {
      throw new HeadroomError({
        kind: "converge",
        argument: "network",
        rule: "did not converge: the solve broke down after {0} iterations",
        amounts: [n(iterations)],
      });
    }
    substitute(prep, values, rhs);
    for (let r = 0; r < m; r++) head[order[r]] = rhs[r];
    iterations++;
    haveHeads = true;

    // the new flows
    for (let j = 0; j < pipeCount; j++) {
      flow[j] += conductance[j] * (head[from[j]] - head[to[j]]) - correction[j];
    }
    for (let r = 0; r < m; r++) {
      if (!open[r]) continue;
      const i = order[r];
      const Qs = sprinklerFlow[r] - sprinklerCorrection[r] + sprinklerConductance[r] * (head[i] - elevationHead[i]);
      if (Qs > 0) sprinklerFlow[r] = Qs;
      else {
        open[r] = 0;
        sprinklerFlow[r] = 0;
      }
    }
  }

  const pressure = new Float64Array(nodeCount);
  const outflow = new Float64Array(nodeCount);
  for (let i = 0; i < nodeCount; i++) {
    const r = row[i];
    if (r < 0) {
      pressure[i] = nodes[i].fixedPressure as number;
      outflow[i] = inflow[i] + 0;
    } else {
      const p = head[i] - elevationHead[i] + 0;
      pressure[i] = p;
      outflow[i] = (p > 0 ? kOf[r] * Math.sqrt(p) : 0) + demand[r];
    }
  }
  for (let j = 0; j < pipeCount; j++) flow[j] += 0;
  return { pressure, flow, outflow, iterations, residual };
}
