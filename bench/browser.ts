/**
 * `npm run bench:browser`: the preview grid's speed in a real browser (Debian's /usr/bin/chromium driven by
 * playwright-core, the built dist/ served on loopback as the browser tests serve it). A benchmark, not a test: it prints
 * medians beside their goals and never fails on a timing.
 *
 *   edit → verdict redraw   a value typed into Supply_Static and committed with Enter, timed in the page from the
 *                           commit's keystroke until the grid has patched and the pane has read the workbook again and
 *                           drawn (pane.idle(), then the page's layout forced): on the sample sheet and on the sample
 *                           with a 10,000-row friction table below its estimate, whose last column the edit recalculates
 *   engine alone            the same edit on a copy of the same workbook in a second HyperFormula, with nothing
 *                           listening: timed in the same round, beside it, as a ratio (the rules: ratios side by side)
 *   selection click         a mousedown on another cell, timed until the page's layout is done
 *   opening large files     a file at the preview's cell limit and one of two million cells, opened with the Open
 *                           button's file input: the time to the answer and the longest stall of the page
 *                           (./browserOpen.ts)
 *
 * Options (environment): BENCH_DIST=<dir> serves another build (e.g. an older checkout's dist/, for a before/after);
 * BENCH_EDITS (default 15) and BENCH_BIG_EDITS (default 15) set the number of timed edits; BENCH_BIG_ROWS (10000) the
 * table's length. Without BENCH_DIST, dist/ is built first when it is missing or older than src/.
 */
import { execFileSync } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import { chromium, type Page } from "playwright-core";
import { startServer } from "../scripts/start-server.mjs";
import { openBench } from "./browserOpen";
import { median } from "./timing";

const CHROMIUM = "/usr/bin/chromium";
const SAMPLE = "tinker-row-manufacturing-pump-needed.xlsx";
const GOALS = { sample: 50, big: 300 };
const EDITS = Number(process.env.BENCH_EDITS ?? 15);
const BIG_EDITS = Number(process.env.BENCH_BIG_EDITS ?? 15);
const BIG_ROWS = Number(process.env.BENCH_BIG_ROWS ?? 10_000);
const CLICKS = 15;

/** The newest modification time under `dir`, ms. */
function newest(dir: string): number {
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, e.name);
    t = Math.max(t, e.isDirectory() ? newest(p) : statSync(p).mtimeMs);
  }
  return t;
}

function distDir(): string {
  if (process.env.BENCH_DIST) return path.resolve(process.env.BENCH_DIST);
  const index = "dist/preview/index.html";
  if (!existsSync(index) || statSync(index).mtimeMs < newest("src")) {
    console.log("dist/ is missing or older than src/: building (webpack --mode production) …");
    execFileSync("npx", ["webpack", "--mode", "production"], { stdio: ["ignore", "ignore", "inherit"] });
  }
  return path.resolve("dist");
}

/** What the page offers the benchmark (main.ts puts the live objects on window.headroomPreview). */
const PAGE_HELPERS = () => {
  type Wb = {
    activeSheet: string;
    hf: {
      constructor: { buildFromSheets(s: unknown, c: unknown, n: unknown): Hf };
      getAllSheetsSerialized(): unknown;
      getConfig(): unknown;
      getAllNamedExpressionsSerialized(): unknown;
    };
    nameTarget(n: string): { sheet: string; address: string } | null;
    contentData(): { sheets: Array<{ name: string; cells: Record<string, { content: unknown }> }>; names: unknown; activeSheet: string };
    load(d: unknown): void;
    extent(s: string): { rows: number; cols: number };
  };
  type Hf = { setCellContents(a: unknown, v: unknown): void; getSheetId(n: string): number; destroy(): void };
  type Grid = { select(a: string): void; startEdit(s: string | null): void };
  const w = window as unknown as {
    headroomPreview: { workbook: Wb; grid: Grid; pane: { idle(): Promise<void> }; keeper: { idle(): Promise<void> } };
    bench: unknown;
  };
  const { workbook: wb, grid, pane, keeper } = w.headroomPreview;
  const sheetEl = document.querySelector<HTMLElement>('[data-role="grid"]')!;
  const verdict = () => document.querySelector('[data-role="verdict"]')?.textContent ?? "";
  const quiet = async () => {
    await keeper.idle();
    await new Promise((r) => setTimeout(r, 50));
  };
  let copy: Hf | null = null;
  w.bench = {
    /** A copy of the workbook in a second engine, with nothing listening. */
    copyEngine() {
      copy?.destroy();
      const hf = wb.hf;
      copy = hf.constructor.buildFromSheets(hf.getAllSheetsSerialized(), hf.getConfig(), hf.getAllNamedExpressionsSerialized());
    },
    /** One edit typed and committed with Enter: ms until the pane has drawn; whether the verdict changed. */
    async edit(typed: string) {
      const t = wb.nameTarget("Supply_Static")!;
      grid.select(t.address);
      grid.startEdit(typed);
      const input = document.querySelector<HTMLInputElement>('[data-role="cell-editor"]')!;
      const before = verdict();
      const t0 = performance.now();
      input.dispatchEvent(new KeyboardEvent("keydown", { key: "Enter", bubbles: true, cancelable: true }));
      await pane.idle();
      void sheetEl.getBoundingClientRect().height; // the page's style and layout, as the next frame needs them
      const ms = performance.now() - t0;
      const changed = verdict() !== before;
      await quiet();
      return { ms, changed };
    },
    /** The same edit on the engine copy alone: ms. */
    engineEdit(typed: string) {
      const t = wb.nameTarget("Supply_Static")!;
      const m = /^([A-Z]+)(\d+)$/.exec(t.address)!;
      let col = 0;
      for (const ch of m[1]) col = col * 26 + ch.charCodeAt(0) - 64;
      const address = { sheet: copy!.getSheetId(t.sheet), row: Number(m[2]) - 1, col: col - 1 };
      const t0 = performance.now();
      copy!.setCellContents(address, Number(typed));
      return performance.now() - t0;
    },
    /** Cells near the input the edits go to (in view after them, in every build). */
    near() {
      const row = Number(/\d+$/.exec(wb.nameTarget("Supply_Static")!.address)![0]);
      return [`A${row}`, `C${row + 1}`, `B${row - 1}`, `C${row + 2}`];
    },
    /** A selection click (mousedown) on the cell `address`: ms until the layout is done. */
    async click(address: string) {
      const td = sheetEl.querySelector<HTMLElement>(`td[data-address="${address}"]`);
      if (!td) throw new Error(`no cell ${address} drawn`);
      const t0 = performance.now();
      td.dispatchEvent(new MouseEvent("mousedown", { bubbles: true, cancelable: true, button: 0 }));
      void sheetEl.getBoundingClientRect().height;
      const ms = performance.now() - t0;
      await new Promise((r) => setTimeout(r, 20));
      return ms;
    },
    /** The sample with `n` rows of friction formulas below its estimate; returns the first table row. */
    async bigSheet(n: number) {
      const data = wb.contentData();
      const sheet = data.sheets.find((s) => s.name === wb.activeSheet)!;
      const first = wb.extent(sheet.name).rows + 3;
      sheet.cells[`A${first - 1}`] = { content: "Friction table (flow gpm, C, inside diameter in, length ft, loss psi, static less loss psi)" };
      for (let i = 0; i < n; i++) {
        const r = first + i;
        sheet.cells[`A${r}`] = { content: 50 + (i % 400) };
        sheet.cells[`B${r}`] = { content: 120 };
        sheet.cells[`C${r}`] = { content: 1.049 + (i % 7) * 0.5 };
        sheet.cells[`D${r}`] = { content: 100 };
        sheet.cells[`E${r}`] = { content: `=HEADROOM.FRICTION(A${r},C${r},B${r},D${r})` };
        sheet.cells[`F${r}`] = { content: `=Supply_Static-E${r}` };
      }
      wb.load(data);
      await pane.idle();
      await quiet();
      return first;
    },
    cellsDrawn: () => sheetEl.querySelectorAll("td[data-address]").length,
    /** What keeping the unsaved workbook costs each time (the workbook written out as data), ms: median of 3. */
    keepCost() {
      const ms = [0, 1, 2].map(() => {
        const t0 = performance.now();
        wb.contentData();
        return performance.now() - t0;
      });
      return ms.sort((a, b) => a - b)[1];
    },
  };
};

type Bench = {
  copyEngine(): void;
  edit(typed: string): Promise<{ ms: number; changed: boolean }>;
  engineEdit(typed: string): number;
  click(address: string): Promise<number>;
  near(): string[];
  bigSheet(n: number): Promise<number>;
  cellsDrawn(): number;
  keepCost(): number;
};

/** Edits alternating with the engine-alone edit, `n` timed (after two untimed), as medians and the ratio's median. */
async function edits(page: Page, n: number) {
  await page.evaluate(() => (window as unknown as { bench: Bench }).bench.copyEngine());
  const ui: number[] = [];
  const engine: number[] = [];
  const ratios: number[] = [];
  let unchanged = 0;
  for (let k = -2; k < n; k++) {
    const typed = String(90 + (((k % 4) + 4) % 4) * 2); // 90, 92, 94, 96 psi (above the residual): each edit moves the shortfall
    const e = await page.evaluate((t) => (window as unknown as { bench: Bench }).bench.engineEdit(t), typed);
    const u = await page.evaluate((t) => (window as unknown as { bench: Bench }).bench.edit(t), typed);
    if (k < 0) continue;
    if (!u.changed) unchanged++;
    ui.push(u.ms);
    engine.push(e);
    ratios.push(u.ms / e);
  }
  return { ui: median(ui), engine: median(engine), ratio: median(ratios), unchanged, n };
}

async function clicks(page: Page) {
  const addresses = await page.evaluate(() => (window as unknown as { bench: Bench }).bench.near());
  const ms: number[] = [];
  for (let k = 0; k < CLICKS; k++) ms.push(await page.evaluate((a) => (window as unknown as { bench: Bench }).bench.click(a), addresses[k % addresses.length]));
  return median(ms);
}

const f1 = (x: number) => x.toFixed(1);

async function main() {
  if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: apt-get install -y --no-install-recommends chromium`);
  const dir = distDir();
  const { server, url } = await startServer({ dir, port: 0 });
  const browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: ["--disable-gpu", "--disable-quic"] });
  try {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    page.on("pageerror", (e) => console.error(`page error: ${e.message}`));
    await page.goto(`${url}preview/?sample=${encodeURIComponent(SAMPLE)}`);
    await page.waitForSelector("body[data-ready]", { timeout: 120_000 });
    if (await page.locator('[data-role="restore-offer"]').isVisible()) await page.click('[data-role="restore-decline"]');
    // tsx keeps functions' names with a helper of its own, which the page lacks: a stand-in first
    await page.evaluate("window.__name = (f) => f");
    await page.evaluate(PAGE_HELPERS);
    console.log(`Preview grid in Chromium, build ${dir}`);

    const small = await edits(page, EDITS);
    const smallClick = await clicks(page);
    const smallCells = await page.evaluate(() => (window as unknown as { bench: Bench }).bench.cellsDrawn());
    const smallKeep = await page.evaluate(() => (window as unknown as { bench: Bench }).bench.keepCost());

    const first = await page.evaluate((n) => (window as unknown as { bench: Bench }).bench.bigSheet(n), BIG_ROWS);
    const bigCells = await page.evaluate(() => (window as unknown as { bench: Bench }).bench.cellsDrawn());
    const bigKeep = await page.evaluate(() => (window as unknown as { bench: Bench }).bench.keepCost());
    const big = await edits(page, BIG_EDITS);
    const bigClick = await clicks(page);

    const line = (what: string, r: Awaited<ReturnType<typeof edits>>, goal: number) =>
      `  ${what.padEnd(46)} ${f1(r.ui).padStart(8)} ms  (goal ≤ ${goal} ms)  engine alone ${f1(r.engine)} ms, ratio ${f1(r.ratio)}  [median of ${r.n}${r.unchanged ? `; ${r.unchanged} left the verdict unchanged` : ""}]`;
    console.log("edit → verdict redraw (Supply_Static typed, Enter; until the pane has drawn and the layout is done):");
    console.log(line(`sample estimate (${SAMPLE})`, small, GOALS.sample));
    console.log(line(`same + ${BIG_ROWS.toLocaleString("en-US")}-row FRICTION table (rows ${first}…)`, big, GOALS.big));
    console.log("selection click (mousedown until the layout is done):");
    console.log(`  ${"sample estimate".padEnd(46)} ${f1(smallClick).padStart(8)} ms  [median of ${CLICKS}]`);
    console.log(`  ${`same + ${BIG_ROWS.toLocaleString("en-US")}-row table`.padEnd(46)} ${f1(bigClick).padStart(8)} ms  [median of ${CLICKS}]`);
    console.log(`cells in the DOM: sample ${smallCells}, with the table ${bigCells}`);
    console.log(`keeping unsaved work (the workbook written out as data, once per burst of changes): sample ${f1(smallKeep)} ms, with the table ${f1(bigKeep)} ms`);
    console.log("The table: each row flow (50…449 gpm), C 120, inside diameter (1.049…4.049 in), 100 ft,");
    console.log("=HEADROOM.FRICTION(flow, diameter, C, length) and =Supply_Static-loss: every edit recalculates the");
    console.log(`${BIG_ROWS.toLocaleString("en-US")} differences (the FRICTION cells stay). Timings on this shared machine vary: compare the ratios of one run.`);

    // opening large files: each from a fresh page (a change left unsaved is let go)
    page.on("dialog", (d) => void d.accept());
    const reload = async () => {
      await page.goto(`${url}preview/?sample=${encodeURIComponent(SAMPLE)}`);
      await page.waitForSelector("body[data-ready]", { timeout: 120_000 });
      if (await page.locator('[data-role="restore-offer"]').isVisible()) await page.click('[data-role="restore-decline"]');
    };
    for (const l of await openBench(page, reload)) console.log(l);
  } finally {
    await browser.close();
    server.close();
  }
}

await main();
