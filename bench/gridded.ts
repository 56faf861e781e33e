/**
 * GRIDDEMAND's share of the benchmark: the whole placement search of a design area on a 20-line × 20-sprinkler grid
 * (every place the area can take, each solved as a network for its riser pressure), through the cell layer and by the
 * engine alone, fed at a corner and at the middle line; and the search at the grid bound the engine accepts.
 *
 * The grid: the README's design area (OH2 0.20 gpm/ft² over 1500 ft², 120 ft² a sprinkler, K 8.0, 12 ft apart: 13
 * sprinklers, 4 a line) on 20 lines 240 ft long of 1¼ in Schedule 40 (1.38 in), tied at both ends to 4 in cross mains
 * (4.026 in): 17 × 17 = 289 placements.
 */
import * as f from "../src/functions/functions";
import { MAX_GRID_SPRINKLERS, solveGridDemand } from "../src/engine/gridded";
import { headLoss } from "../src/engine/friction";
import { median } from "./timing";

interface Figure { name: string; value: number; unit: string; goal?: string; ok?: boolean }


/** Median milliseconds per call of `fn` over `rounds` rounds of `n` calls, after a warm-up round. */
function msPerCall(fn: (i: number) => unknown, n: number, rounds = 7): number {
  const round = () => {
    const t = performance.now();
    for (let i = 0; i < n; i++) fn(i);
    return (performance.now() - t) / n;
  };
  round();
  return median(Array.from({ length: rounds }, round));
}

export function griddedBench(): Figure[] {
  const figures: Figure[] = [];
  const record = (fig: Figure) => figures.push(fig);
  // the density varies a little from call to call, so that no call repeats another's work
  const density = (i: number) => 0.2 + (i & 7) * 1e-6;
  const input = {
    density: 0.2, area: 1500, coverage: 120, kFactor: 8, headSpacing: 12, lines: 20, lineLength: 240,
    branchDiameter: 1.38, mainDiameter: 4.026, cFactor: 120, minPressure: 7, feedLine: 1,
  };
  const placements = solveGridDemand(input).placements;
  for (const feedLine of [1, 10]) {
    const label = `GRIDDEMAND 20×20 grid, ${placements} placements, fed at line ${feedLine}`;
    const cell = msPerCall((i) => f.griddemand(density(i), 1500, 120, 8, 12, 20, 240, 1.38, 4.026, null, null, feedLine)[0][0], 10);
    const engine = msPerCall((i) => solveGridDemand({ ...input, density: density(i), feedLine }, headLoss("US")).flow, 10);
    record({ name: `${label}, ms (cell layer)`, value: cell, unit: "ms", goal: "≤ 50", ok: cell <= 50 });
    record({ name: `${label}, ms (engine)`, value: engine, unit: "ms" });
  }
  {
    // at the bound: 40 lines of 50 sprinklers (2,000), one sprinkler flowing: 40 × 50 placements
    const bound = { ...input, area: 100, coverage: 100, density: 0.1, lines: 40, lineLength: 50 * 12 + 6 };
    const r = solveGridDemand(bound);
    const ms = msPerCall((i) => solveGridDemand({ ...bound, density: 0.1 + (i & 7) * 1e-6 }).flow, 1, 3);
    record({ name: `GRIDDEMAND at the bound (${MAX_GRID_SPRINKLERS} sprinklers, ${r.placements} placements), ms`, value: ms, unit: "ms" });
  }
  return figures;
}
