/**
 * `npm run bench`: Headroom's speed and size figures, printed as a table and written to bench/results.json.
 * A benchmark, not a test: it prints ratios against goals; only the bundle budgets make it exit non-zero, so CI can
 * run it as a size check. Timings are medians of several rounds on this machine; compare ratios, not seconds.
 *
 *   per call (Node)      FRICTION, SUPPLYAT, AREADEMAND through the cell-function layer vs the same math inline
 *   sheet (preview)      10,000-row sheet in HyperFormula: HEADROOM functions vs native formulas, one edit
 *   solve                AREADEMAND for a 4,000 ft² extra-hazard area, through the cell layer and by the engine alone
 *   network              the network solver against epanet-js's solveH on one grid, a 2,000-node grid, cost vs size
 *   gridded              GRIDDEMAND's whole placement search on a 20 × 20 grid, at a corner and at the middle line
 *   bundles              gzipped production bundles against their budgets (needs `npm run build` first)
 *
 * `BENCH_ONLY=network,solve npx tsx bench/run.ts` runs only the sections named (call, solve, sheet, network, gridded,
 * bundles); the default runs them all.
 */
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { gzipSync } from "node:zlib";
import { installCustomFunctionsShim } from "../src/preview/customFunctionsShim";
import { compare as compareRounds, median, round } from "./timing";

installCustomFunctionsShim();
const f = await import("../src/functions/functions");
const { solveAreaDemand } = await import("../src/engine/tree");
const { headLoss } = await import("../src/engine/friction");
const { sheetBench } = await import("./sheet");

const only = process.env.BENCH_ONLY?.split(",").map((x) => x.trim());
const runs = (section: string) => only === undefined || only.includes(section);

interface Figure { name: string; value: number; unit: string; goal?: string; ok?: boolean }
const figures: Figure[] = [];
const record = (fig: Figure) => figures.push(fig);

/** Median nanoseconds per call of `fn` over `rounds` rounds of `n` calls, after a warm-up round. */
function nsPerCall(fn: (i: number) => unknown, n = 200_000, rounds = 7): number {
  round(fn, n);
  return median(Array.from({ length: rounds }, () => round(fn, n)));
}

/** Two ways of doing the same work side by side (./timing.ts), 200,000 calls a round and 15 rounds unless told. */
const compare = (a: (i: number) => unknown, b: (i: number) => unknown, n = 200_000, rounds = 15) => compareRounds(a, b, n, rounds);

// Inputs vary per call, every one of them, so that neither side gets constants folded or hoisted out of the loop
// (a constant argument would also let the cell layer's checks of it fold away). The "inline math" is the formula
// the cell computes in US units (whose conversions are the identity), with no checks.
const flows = Float64Array.from({ length: 1024 }, (_, i) => 50 + (i % 400));
const diameters = Float64Array.from({ length: 1024 }, (_, i) => 1.049 + (i % 7) * 0.5);
const cs = Float64Array.from({ length: 1024 }, (_, i) => 100 + (i % 6) * 10);
const lengths = Float64Array.from({ length: 1024 }, (_, i) => 10 + (i % 13) * 15);
const statics = Float64Array.from({ length: 1024 }, (_, i) => 60 + (i % 20));
const residuals = Float64Array.from({ length: 1024 }, (_, i) => 20 + (i % 9) * 3); // below every static
const testFlows = Float64Array.from({ length: 1024 }, (_, i) => 800 + (i % 11) * 50);

// ── per call ─────────────────────────────────────────────────────────────────────────────────────────────────────
if (runs("call")) {
  const { a: cell, b: inline, ratio } = compare(
    (i) => f.friction(flows[i & 1023], diameters[i & 1023], cs[i & 1023], lengths[i & 1023]),
    (i) => {
      const k = i & 1023;
      return ((4.52 * Math.pow(flows[k], 1.85)) / (Math.pow(cs[k], 1.85) * Math.pow(diameters[k], 4.87))) * lengths[k];
    },
  );
  record({ name: "FRICTION ns/call (cell layer)", value: cell, unit: "ns" });
  record({ name: "FRICTION ns/call (inline math)", value: inline, unit: "ns" });
  record({ name: "FRICTION ratio cell/inline", value: ratio, unit: "×", goal: "≤ 1.5", ok: ratio <= 1.5 });
}
if (runs("call")) {
  const { a: cell, b: inline, ratio } = compare(
    (i) => f.supplyat(flows[i & 1023], statics[i & 1023], residuals[i & 1023], testFlows[i & 1023]),
    (i) => {
      const k = i & 1023;
      return statics[k] - (statics[k] - residuals[k]) * Math.pow(flows[k] / testFlows[k], 1.85);
    },
  );
  record({ name: "SUPPLYAT ns/call (cell layer)", value: cell, unit: "ns" });
  record({ name: "SUPPLYAT ns/call (inline math)", value: inline, unit: "ns" });
  record({ name: "SUPPLYAT ratio cell/inline", value: ratio, unit: "×", goal: "≤ 1.5", ok: ratio <= 1.5 });
}
if (runs("call")) {
  const input = { density: 0.15, area: 1500, coverage: 130, kFactor: 5.6, headSpacing: 13, branchDiameter: 1.38, mainDiameter: 2.469, cFactor: 120, minPressure: 7 };
  const { a: cell, b: engine, ratio } = compare(
    (i) => f.areademand(0.15, 1500 + (i & 7), 130, 5.6, 13, 1.38, 2.469)[0][0],
    (i) => solveAreaDemand({ ...input, area: 1500 + (i & 7) }, headLoss("US")).flow,
    20_000,
  );
  record({ name: "AREADEMAND µs/call (cell layer)", value: cell / 1000, unit: "µs" });
  record({ name: "AREADEMAND µs/call (engine)", value: engine / 1000, unit: "µs" });
  record({ name: "AREADEMAND ratio cell/engine", value: ratio, unit: "×" });
}

// ── one large solve ──────────────────────────────────────────────────────────────────────────────────────────────
if (runs("solve")) {
  // EH2 0.40 gpm/ft² over 4,000 ft², 100 ft² per sprinkler, K 11.2, 10 ft spacing, 1¼ in lines, 4 in main
  const ns = nsPerCall((i) => f.areademand(0.4, 4000 + (i & 3), 100, 11.2, 10, 1.38, 4.026)[0][0], 5_000);
  record({ name: "AREADEMAND 4,000 ft² extra hazard, ms/solve", value: ns / 1e6, unit: "ms", goal: "< 1", ok: ns / 1e6 < 1 });
}
if (runs("solve")) {
  // the same area solved by the engine alone, 2 in lines (the solve the engine tests check for values)
  const input = { density: 0.4, area: 4000, coverage: 100, kFactor: 11.2, headSpacing: 10, branchDiameter: 2.067, mainDiameter: 4.026, cFactor: 120, minPressure: 7 };
  const ns = nsPerCall((i) => solveAreaDemand({ ...input, density: 0.4 + (i & 1023) * 1e-6 }, headLoss("US")).flow, 5_000);
  record({ name: "AREADEMAND 4,000 ft² extra hazard, engine, ms/solve", value: ns / 1e6, unit: "ms", goal: "< 0.2", ok: ns / 1e6 < 0.2 });
}

// ── the preview engine: a 10,000-row sheet ───────────────────────────────────────────────────────────────────────
if (runs("sheet")) for (const fig of await sheetBench(10_000)) record(fig);

// ── the network solver against EPANET ────────────────────────────────────────────────────────────────────────────
if (runs("network")) {
  const { networkBench } = await import("./network");
  for (const fig of networkBench()) record(fig);
}

// ── GRIDDEMAND: the placement search ─────────────────────────────────────────────────────────────────────────────
if (runs("gridded")) {
  const { griddedBench } = await import("./gridded");
  for (const fig of griddedBench()) record(fig);
}

// ── bundle sizes ─────────────────────────────────────────────────────────────────────────────────────────────────
let budgetExceeded = false;
for (const [file, budgetKB] of runs("bundles") ? ([["dist/functions.js", 120], ["dist/taskpane.js", 200]] as const) : []) {
  if (!existsSync(file)) {
    console.error(`${file} is missing: run \`npm run build\` first`);
    budgetExceeded = true;
    continue;
  }
  const kb = gzipSync(readFileSync(file), { level: 9 }).length / 1024;
  const ok = kb <= budgetKB;
  if (!ok) budgetExceeded = true;
  record({ name: `${file} gzipped`, value: kb, unit: "KB", goal: `≤ ${budgetKB}`, ok });
}

// ── report ───────────────────────────────────────────────────────────────────────────────────────────────────────
const rows = figures.map((x) => [x.name, x.value < 10 ? x.value.toFixed(3) : x.value.toFixed(1), x.unit, x.goal ?? "", x.ok === undefined ? "" : x.ok ? "met" : "MISSED"]);
const widths = [0, 1, 2, 3, 4].map((c) => Math.max(...rows.map((r) => r[c].length), ["figure", "value", "unit", "goal", ""][c].length));
const line = (r: string[]) => r.map((x, c) => (c === 1 ? x.padStart(widths[c]) : x.padEnd(widths[c]))).join("  ");
console.log(line(["figure", "value", "unit", "goal", ""]));
console.log(widths.map((w) => "─".repeat(w)).join("  "));
for (const r of rows) console.log(line(r));
writeFileSync("bench/results.json", JSON.stringify({ date: new Date().toISOString(), node: process.version, figures }, null, 2) + "\n");
console.log("\nwritten: bench/results.json");
if (budgetExceeded) {
  console.error("a bundle budget is exceeded (or the build is missing)");
  process.exit(1);
}
