/**
 * The one-page summary, printed by a real browser: for each sample of samples/index.json, the preview opens it, the
 * toolbar's "One-page summary" opens the print view, and Chromium prints it to PDF (page.pdf, print media) on A4 and
 * on Letter. Each PDF must be exactly one page (pdfinfo, Debian's poppler-utils) whose text (pdftotext) holds the
 * verdict sentence the pane shows, the caution, and the plot's axis title (the svg's text, so the plot was drawn).
 * Each A4 page is rendered to PNG at 60 dpi (pdftoppm) under test-results/summary-<sample>.png: copy them to docs/
 * after a visual change of the summary.
 *
 * The clock is fixed (4 May 2026) so that the printed date, and so the pictures, do not change from day to day.
 *
 * Run with `npm run test:browser` (it builds first).
 */
import { execFile } from "node:child_process";
import { existsSync } from "node:fs";
import { mkdir, readFile, writeFile } from "node:fs/promises";
import type { Server } from "node:http";
import path from "node:path";
import { promisify } from "node:util";
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { setNamed } from "./previewPage";
import { startServer } from "../../scripts/start-server.mjs";
import { CAUTION } from "../../src/workbook/look";

const run = promisify(execFile);
const CHROMIUM = "/usr/bin/chromium";
const RESULTS = "test-results";
const FORMATS = ["A4", "Letter"] as const;
/** The date the summary prints, for pictures that stay the same. */
const TODAY = new Date(2026, 4, 4, 10, 0, 0);

let server: Server;
let base: string;
let browser: Browser;
let context: BrowserContext;
let page: Page;
const problems: string[] = [];

const samples: Array<{ file: string; title: string }> = JSON.parse(await readFile("samples/index.json", "utf8")).samples;

beforeAll(async () => {
  if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: apt-get install -y --no-install-recommends chromium`);
  for (const tool of ["pdfinfo", "pdftotext", "pdftoppm"]) {
    if (!existsSync(`/usr/bin/${tool}`)) throw new Error(`/usr/bin/${tool} is missing: apt-get install -y --no-install-recommends poppler-utils`);
  }
  if (!existsSync("dist/preview/index.html")) throw new Error("dist/preview/index.html is missing: run npm run build");
  await mkdir(RESULTS, { recursive: true });
  const started = await startServer({ dir: "dist", port: 0 });
  server = started.server;
  base = started.url;
  browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: ["--disable-gpu", "--disable-quic"] });
  context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
  await context.clock.setFixedTime(TODAY);
  page = await context.newPage();
  page.on("pageerror", (e) => problems.push(`page error: ${e.message}`));
  page.on("console", (m) => {
    if (m.type() === "error") problems.push(`console: ${m.text()}`);
  });
});

afterAll(async () => {
  await browser?.close();
  await new Promise((r) => (server ? server.close(r) : r(undefined)));
});

async function open(sample: string): Promise<void> {
  await page.goto(`${base}preview/?sample=${encodeURIComponent(sample)}`);
  await page.waitForSelector("body[data-ready]", { timeout: 60_000 });
  expect(await page.getAttribute("body", "data-ready")).toBe("1");
  await page.evaluate(async () => {
    const w = window as unknown as { headroomPreview: { pane: { idle(): Promise<void> } } };
    await new Promise((r) => setTimeout(r, 0));
    await w.headroomPreview.pane.idle();
  });
}

/** Whitespace as one space: pdftotext breaks lines where the page does. */
const flat = (s: string) => s.replace(/\s+/g, " ").trim();

async function pdfPages(file: string): Promise<number> {
  const { stdout } = await run("pdfinfo", [file]);
  const m = /^Pages:\s+(\d+)$/m.exec(stdout);
  if (!m) throw new Error(`pdfinfo gave no page count for ${file}`);
  return Number(m[1]);
}

async function pdfText(file: string): Promise<string> {
  return (await run("pdftotext", ["-enc", "UTF-8", file, "-"])).stdout;
}

/** The page size pdfinfo reports, in points. */
async function pdfSize(file: string): Promise<[number, number]> {
  const m = /^Page size:\s+([\d.]+) x ([\d.]+) pts/m.exec((await run("pdfinfo", [file])).stdout);
  if (!m) throw new Error(`pdfinfo gave no page size for ${file}`);
  return [Number(m[1]), Number(m[2])];
}

describe.each(samples.map((s) => [s.file] as const))("the one-page summary of %s", (file) => {
  const stem = file.replace(/\.xlsx$/, "");

  test("opens from the toolbar in a print view that shows the pane's verdict, and goes back", async () => {
    await open(file);
    const paneVerdict = flat((await page.locator('[data-role="pane-host"] [data-role="verdict"]').textContent()) ?? "");
    await page.locator('.bar [data-role="print-summary"]').click();
    const summary = page.locator('[data-role="summary-view"] [data-role="summary"]');
    await summary.waitFor();
    expect(flat((await summary.locator('[data-role="summary-verdict"]').textContent()) ?? "")).toBe(paneVerdict);
    expect(await summary.locator('[data-role="summary-printed"]').textContent()).toBe("Printed 2026-05-04");
    await page.locator('[data-role="summary-close"]').click();
    await expect(page.locator('[data-role="summary-view"]').count()).resolves.toBe(0);
    // the pane's own button opens the same view
    await page.locator('[data-role="pane-host"] [data-role="print-summary"]').click();
    await summary.waitFor();
    expect(problems).toEqual([]);
  });

  test.each(FORMATS.map((f) => [f] as const))("prints on exactly one %s page with the verdict, the caution and the plot", async (format) => {
    const summary = page.locator('[data-role="summary-view"] [data-role="summary"]');
    if ((await summary.count()) === 0) {
      await open(file);
      await page.locator('.bar [data-role="print-summary"]').click();
      await summary.waitFor();
    }
    const verdict = flat((await summary.locator('[data-role="summary-verdict"]').textContent()) ?? "");
    const xTitle = (await summary.locator('[data-role="plot"] .axis.x text.title').textContent()) ?? "";
    expect(xTitle).toMatch(/^Flow \((gpm|L\/min)\)$/);

    const pdf = path.join(RESULTS, `summary-${stem}-${format}.pdf`);
    await writeFile(pdf, await page.pdf({ format, printBackground: true }));
    const [w, h] = await pdfSize(pdf);
    // A4 is 210 × 297 mm = 595.3 × 841.9 pt (ISO 216), Letter 8.5 × 11 in = 612 × 792 pt; Chromium rounds A4 to
    // 8.27 × 11.7 in and a little over, hence the 2 pt
    const [pw, ph] = format === "A4" ? [595.3, 841.9] : [612, 792];
    expect(Math.abs(w - pw), `width ${w} pt`).toBeLessThan(2);
    expect(Math.abs(h - ph), `height ${h} pt`).toBeLessThan(2);
    expect(await pdfPages(pdf)).toBe(1);
    const text = flat(await pdfText(pdf));
    expect(text).toContain(verdict);
    expect(text).toContain(flat(CAUTION));
    expect(text.toLowerCase()).toContain("preliminary estimate");
    expect(text).toContain(xTitle);
    if (format === "A4") {
      await run("pdftoppm", ["-png", "-r", "60", "-singlefile", pdf, path.join(RESULTS, `summary-${stem}`)]);
      expect(existsSync(path.join(RESULTS, `summary-${stem}.png`))).toBe(true);
    }
  });
});

describe("the longest summary", () => {

  /** Type into column B beside a label of column A. */
  async function setBeside(label: string, typed: string): Promise<void> {
    await page.evaluate(
      ({ label, typed }) => {
        type View = { address: string; value: unknown };
        type Wb = { activeSheet: string; cells(s: string): View[]; setTyped(s: string, a: string, t: string): void };
        const wb = (window as unknown as { headroomPreview: { workbook: Wb } }).headroomPreview.workbook;
        const found = wb.cells(wb.activeSheet).filter((c) => c.address.startsWith("A") && c.value === label);
        if (found.length !== 1) throw new Error(`${found.length} labels read ${label}`);
        wb.setTyped(wb.activeSheet, `B${found[0].address.slice(1)}`, typed);
      },
      { label, typed },
    );
    await page.evaluate(() => (window as unknown as { headroomPreview: { pane: { idle(): Promise<void> } } }).headroomPreview.pane.idle());
  }

  test.each(FORMATS.map((f) => [f] as const))(
    "still one %s page: a pump alone cannot serve, a chosen pump short, the flow-test caveat, long project words",
    async (format) => {
      await open(samples[0].file);
      // the main must keep more than it can while a pump draws from it; a pump chosen too weak; the longest words
      await setNamed(page, "Suction_Minimum", "75");
      // a test that flowed little: the demand lies beyond it and the residual dropped under 25 % of static
      await setBeside("Flow measured directly (gpm)", "300");
      await setNamed(page, "Pump_RatedFlow", "750");
      await setNamed(page, "Pump_RatedPressure", "5");
      await setNamed(page, "Project_Site", "Unit 4 and the mezzanine store, Tinker Row light manufacturing and assembly (sample, extended)");
      await setNamed(page, "Project_Address", "Building C, 4 Tinker Row, Exampleton Industrial Estate, Sampleshire SA1 2BC, behind the loading yard");
      await page.locator('.bar [data-role="print-summary"]').click();
      const summary = page.locator('[data-role="summary-view"] [data-role="summary"]');
      await summary.waitFor();
      expect(await summary.getAttribute("data-state")).toBe("cannot-serve");
      expect(await summary.locator('[data-role="summary-next-steps"] li').count()).toBeGreaterThan(1);
      expect(await summary.locator('[data-role="summary-caveat"]').count()).toBe(1);
      const pdf = path.join(RESULTS, `summary-longest-${format}.pdf`);
      await writeFile(pdf, await page.pdf({ format, printBackground: true }));
      expect(await pdfPages(pdf)).toBe(1);
      const text = flat(await pdfText(pdf));
      expect(text).toContain(flat((await summary.locator('[data-role="summary-verdict"]').textContent()) ?? ""));
      expect(text).toContain(flat(CAUTION));
      if (format === "A4") await run("pdftoppm", ["-png", "-r", "60", "-singlefile", pdf, path.join(RESULTS, "summary-longest")]);
    },
  );
});

/**
 * The built dialog page (dist/summary.html) in the browser, under its own Content-Security-Policy. Office.js cannot
 * be fetched here, so its address is answered with a stand-in that gives the dialog's side of the API
 * (Office.onReady, ui.addHandlerAsync, ui.messageParent) and lets the test play the pane: the readings of a sample, as
 * the pane would send them with messageChild.
 */
describe("the summary's dialog page, built", () => {
  const OFFICE_JS = "https://officeapis.public.onecdn.static.microsoft/1/office.js";
  const STAND_IN = `
    window.__toParent = [];
    window.Office = {
      EventType: { DialogParentMessageReceived: "dialogParentMessageReceived" },
      AsyncResultStatus: { Succeeded: "succeeded", Failed: "failed" },
      onReady: function (cb) { setTimeout(function () { cb({ host: "Excel" }); }, 0); return Promise.resolve({ host: "Excel" }); },
      context: { ui: {
        addHandlerAsync: function (type, handler, cb) { window.__fromParent = function (m) { handler({ message: m, type: type }); }; cb({ status: "succeeded" }); },
        messageParent: function (m) { window.__toParent.push(m); },
      } },
    };`;

  test("says ready, shows the summary it is sent, prints it on one page, and asks to be closed", async () => {
    await open(samples[0].file);
    const readings = await page.evaluate(async () => {
      const w = window as unknown as { headroomPreview: { port: { readInputs(): Promise<unknown> } } };
      return w.headroomPreview.port.readInputs();
    });
    const paneVerdict = flat((await page.locator('[data-role="pane-host"] [data-role="verdict"]').textContent()) ?? "");

    const dialog = await context.newPage();
    const errors: string[] = [];
    dialog.on("pageerror", (e) => errors.push(e.message));
    dialog.on("console", (m) => {
      if (m.type() === "error") errors.push(m.text());
    });
    await dialog.route(OFFICE_JS, (route) => route.fulfill({ status: 200, contentType: "text/javascript", body: STAND_IN }));
    await dialog.goto(`${base}summary.html`);
    await dialog.waitForFunction(() => (window as unknown as { __toParent: string[] }).__toParent.length > 0);
    expect(await dialog.evaluate(() => (window as unknown as { __toParent: string[] }).__toParent)).toEqual(['{"type":"ready"}']);
    await dialog.evaluate((m) => (window as unknown as { __fromParent(m: string): void }).__fromParent(m), JSON.stringify({ type: "summary", readings }));
    const summary = dialog.locator('[data-role="summary-view"] [data-role="summary"]');
    await summary.waitFor();
    expect(flat((await summary.locator('[data-role="summary-verdict"]').textContent()) ?? "")).toBe(paneVerdict);

    const pdf = path.join(RESULTS, "summary-dialog-Letter.pdf");
    await writeFile(pdf, await dialog.pdf({ format: "Letter", printBackground: true }));
    expect(await pdfPages(pdf)).toBe(1);
    const text = flat(await pdfText(pdf));
    expect(text).toContain(paneVerdict);
    expect(text).toContain(flat(CAUTION));
    // the loading note, which also carries the caution, does not print: the caution appears once
    expect(text.split(flat(CAUTION)).length - 1).toBe(1);

    await dialog.locator('[data-role="summary-close"]').click();
    expect(await dialog.evaluate(() => (window as unknown as { __toParent: string[] }).__toParent)).toEqual(['{"type":"ready"}', '{"type":"close"}']);
    expect(errors).toEqual([]);
    await dialog.close();
  });
});
