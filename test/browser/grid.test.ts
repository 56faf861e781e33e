/**
 * The preview's grid in a real browser (headless Chromium, as test/browser/preview.test.ts runs it): it draws only the
 * rows in view, redraws only what changed, selects blocks, and moves as a spreadsheet does from the keyboard.
 *
 * The DOM is watched with a MutationObserver: what a click or an edit changes in the grid is counted against what
 * really changed. No timings here: those are `npm run bench:browser`'s.
 */
import type { Page } from "playwright-core";
import { beforeAll, beforeEach, describe, expect, test } from "vitest";
import { cellAddress, parseCell } from "../../src/workbook/a1";
import { openSample, usePreview } from "./previewPage";

const PUMP_SAMPLE = "tinker-row-manufacturing-pump-needed.xlsx";
/** Rows of the long sheet: 10,000, the size the grid is meant to keep up with. */
const LONG_ROWS = 10_000;

let page: Page;
const session = usePreview((s) => (page = s.page));

async function open(): Promise<void> {
  await openSample(session(), PUMP_SAMPLE);
  await settle();
}

async function settle(): Promise<void> {
  await page.evaluate(async () => {
    await new Promise((r) => setTimeout(r, 0));
    await (window as unknown as { headroomPreview: { pane: { idle(): Promise<void> } } }).headroomPreview.pane.idle();
  });
}

/** Wait for the next frame (a scroll's event is handled by then). */
const frame = () => page.evaluate(() => new Promise((r) => requestAnimationFrame(() => setTimeout(r, 0))));

const td = (address: string) => page.locator(`[data-role="grid"] td[data-address="${address}"]`);
const drawnCells = () => page.locator('[data-role="grid"] td[data-address]').count();
const selection = () =>
  page.evaluate(() => (window as unknown as { headroomPreview: { grid: { selectionRange(): { sheet: string; range: string; active: string } } } }).headroomPreview.grid.selectionRange());
const nameBox = async () => (await page.locator('[data-role="name-box"]').inputValue()).trim();

type Wb = {
  activeSheet: string;
  setTyped(s: string, a: string, t: string): void;
  addSheet(d: { name: string; cells: Record<string, { content: unknown }> }): string;
  activate(s: string): void;
  extent(s: string): { rows: number; cols: number };
  nameTarget(n: string): { sheet: string; address: string } | null;
};

/** A new sheet of the open workbook with `cells` (address → content), shown. */
async function sheetWith(name: string, cells: Record<string, unknown>): Promise<string> {
  const added = await page.evaluate(
    ({ name, cells }) => {
      const wb = (window as unknown as { headroomPreview: { workbook: Wb } }).headroomPreview.workbook;
      const data = { name, cells: Object.fromEntries(Object.entries(cells).map(([a, content]) => [a, { content }])) };
      const sheet = wb.addSheet(data);
      wb.activate(sheet);
      return sheet;
    },
    { name, cells },
  );
  await settle();
  return added;
}

/**
 * Start watching what changes under the grid: each mutation's cell (its data-address), or "(structure)" for rows or
 * cells added or taken away, "(header)" for the row and column headers. `stopWatching` returns the records.
 */
async function watch(): Promise<void> {
  await page.evaluate(() => {
    const grid = document.querySelector('[data-role="grid"]')!;
    const seen: string[] = [];
    const observer = new MutationObserver((records) => {
      for (const r of records) {
        const el = (r.target.nodeType === Node.ELEMENT_NODE ? r.target : r.target.parentElement) as HTMLElement;
        const cell = el.closest<HTMLElement>("td[data-address]");
        if (cell) seen.push(cell.dataset.address!);
        else if (el.closest("th")) seen.push("(header)");
        else seen.push(`(structure: ${el.tagName.toLowerCase()}${el.className ? `.${el.className}` : ""})`);
      }
    });
    observer.observe(grid, { subtree: true, childList: true, attributes: true, characterData: true });
    (window as unknown as { watching: { observer: MutationObserver; seen: string[] } }).watching = { observer, seen };
  });
}

async function stopWatching(): Promise<string[]> {
  return page.evaluate(() => {
    const w = (window as unknown as { watching: { observer: MutationObserver; seen: string[] } }).watching;
    w.seen.push(...w.observer.takeRecords().map(() => "(late)"));
    w.observer.disconnect();
    return [...new Set(w.seen)].sort();
  });
}

/** What each drawn cell shows: its text, classes and title. */
const drawn = () =>
  page.evaluate(() => {
    const out: Record<string, string> = {};
    for (const el of document.querySelectorAll<HTMLElement>('[data-role="grid"] td[data-address]')) out[el.dataset.address!] = `${el.textContent}|${el.className}|${el.title}`;
    return out;
  });

describe("a long sheet", () => {
  test(`${LONG_ROWS.toLocaleString("en-US")} rows draw only what is in view, and scrolling to row 9,000 shows its cells`, async () => {
    await open();
    const rows: Record<string, unknown> = {};
    for (let r = 1; r <= LONG_ROWS; r++) {
      rows[`A${r}`] = r;
      rows[`B${r}`] = `=A${r}*2`;
      rows[`C${r}`] = `Row ${r}`;
    }
    await sheetWith("Long", rows);
    const cells = await page.evaluate(() => {
      const wb = (window as unknown as { headroomPreview: { workbook: Wb } }).headroomPreview.workbook;
      const e = wb.extent(wb.activeSheet);
      return e.rows * e.cols;
    });
    expect(cells).toBe(LONG_ROWS * 3); // three columns of 10,000 rows (by construction)
    const inDom = await drawnCells();
    expect(inDom).toBeGreaterThan(0);
    expect(inDom).toBeLessThan(cells / 20);
    expect(await td("A9000").count()).toBe(0);
    // scrolled as a user scrolls: the scroll bar dragged to where row 9,000 is
    await page.evaluate(() => {
      const sheet = document.querySelector<HTMLElement>('[data-role="grid"]')!;
      sheet.scrollTop = (sheet.scrollHeight * 8990) / 10012; // row 8,990 at the top: 9,000 ten rows below it
    });
    await frame();
    await expect.poll(() => td("A9000").count()).toBe(1);
    expect((await td("A9000").textContent())?.trim()).toBe("9000");
    expect((await td("B9000").textContent())?.trim()).toBe("18000"); // 9,000 × 2 (hand arithmetic)
    expect((await td("C9000").textContent())?.trim()).toBe("Row 9000");
    const box = (await td("A9000").boundingBox())!;
    const view = (await page.locator('[data-role="grid"]').boundingBox())!;
    expect(box.y).toBeGreaterThanOrEqual(view.y);
    expect(box.y + box.height).toBeLessThanOrEqual(view.y + view.height);
    expect(await drawnCells()).toBeLessThan(cells / 20);
    // Ctrl+End: the last cell in use, drawn and selected
    await td("A9000").click();
    await page.keyboard.press("Control+End");
    expect(await nameBox()).toBe(`C${LONG_ROWS}`);
    expect(await td(`C${LONG_ROWS}`).getAttribute("class")).toMatch(/\bselected\b/);
    await page.keyboard.press("Control+Home");
    expect(await nameBox()).toBe("A1");
    expect(await td("A1").getAttribute("class")).toMatch(/\bselected\b/);
  });
});

describe("redrawing only what changed", () => {
  beforeEach(open);

  test("a selection click changes nothing in the grid but the two cells' selection marks and the headers", async () => {
    await td("B13").click();
    const before = await drawn();
    await watch();
    await td("C15").click();
    const changed = await stopWatching();
    expect(changed).toEqual(["(header)", "B13", "C15"]);
    const after = await drawn();
    const differ = Object.keys(after).filter((a) => after[a] !== before[a]);
    expect(differ.sort()).toEqual(["B13", "C15"]);
    expect(await nameBox()).toBe("C15");
  });

  test("an edit changes only the cells whose value (or selection mark) changed", async () => {
    // a window tall enough to show the input and the verdict it feeds at once
    await page.setViewportSize({ width: 1280, height: 3200 });
    await frame();
    const t = await page.evaluate(() => (window as unknown as { headroomPreview: { workbook: Wb } }).headroomPreview.workbook.nameTarget("Supply_Static")!);
    await td(t.address).click();
    await page.keyboard.type("93");
    const before = await drawn();
    await watch();
    await page.keyboard.press("Enter");
    await settle();
    const changed = await stopWatching();
    const after = await drawn();
    const differ = Object.keys(after).filter((a) => after[a] !== before[a]);
    // the edited cell, the cell below (now selected) and the cells in view that the new pressure recalculated
    expect(differ).toContain(t.address);
    const below = cellAddress({ ...parseCell(t.address), row: parseCell(t.address).row + 1 });
    expect(differ).toContain(below);
    expect(differ.length).toBeGreaterThan(2);
    expect(changed.filter((c) => !c.startsWith("("))).toEqual([...differ].sort());
    expect(changed.filter((c) => c.startsWith("(") && c !== "(header)")).toEqual([]);
    const verdictCell = await page.evaluate(() => {
      const wb = (window as unknown as { headroomPreview: { workbook: { activeSheet: string; cells(s: string): Array<{ address: string; content: unknown }> } } }).headroomPreview.workbook;
      return wb.cells(wb.activeSheet).find((c) => typeof c.content === "string" && c.content.startsWith("=HEADROOM.VERDICT("))!.address;
    });
    expect(differ).toContain(verdictCell);
    await page.setViewportSize({ width: 1280, height: 800 });
  });
});

describe("a block of cells selected", () => {
  beforeEach(open);

  test("Shift+click, Shift+arrows and a drag select a block: in-range on its cells, selected on the active one", async () => {
    await td("B13").click();
    await td("D15").click({ modifiers: ["Shift"] });
    expect(await selection()).toEqual({ sheet: "Estimate", range: "B13:D15", active: "D15" });
    expect(await page.locator('[data-role="grid"] td.in-range').count()).toBe(9); // 3 rows × 3 columns
    expect(await page.locator('[data-role="grid"] td.selected').getAttribute("data-address")).toBe("D15");
    await page.keyboard.press("Shift+ArrowDown");
    await page.keyboard.press("Shift+ArrowLeft");
    expect(await selection()).toEqual({ sheet: "Estimate", range: "B13:C16", active: "C16" });
    expect(await page.locator('[data-role="grid"] td.in-range').count()).toBe(8); // 4 rows × 2 columns
    // an arrow without Shift: one cell again
    await page.keyboard.press("ArrowRight");
    expect(await selection()).toEqual({ sheet: "Estimate", range: "D16:D16", active: "D16" });
    expect(await page.locator('[data-role="grid"] td.in-range').count()).toBe(0);
    // a drag from B20 to C22
    const from = (await td("B20").boundingBox())!;
    const to = (await td("C22").boundingBox())!;
    await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
    await page.mouse.down();
    await page.mouse.move(to.x + to.width / 2, to.y + to.height / 2, { steps: 5 });
    await page.mouse.up();
    expect(await selection()).toEqual({ sheet: "Estimate", range: "B20:C22", active: "C22" });
    expect(await page.locator('[data-role="grid"] th.current').allTextContents()).toEqual(["B", "C", "20", "21", "22"]);
  });

  test("selectRange draws the block it is given; select makes it one cell", async () => {
    await page.evaluate(() => (window as unknown as { headroomPreview: { grid: { selectRange(a: string, b: string): void } } }).headroomPreview.grid.selectRange("c14", "A12"));
    expect(await selection()).toEqual({ sheet: "Estimate", range: "A12:C14", active: "A12" });
    expect(await page.locator('[data-role="grid"] td.in-range').count()).toBeGreaterThan(0);
    expect(await nameBox()).toBe("A12");
    await page.evaluate(() => (window as unknown as { headroomPreview: { grid: { select(a: string): void } } }).headroomPreview.grid.select("B13"));
    expect(await selection()).toEqual({ sheet: "Estimate", range: "B13:B13", active: "B13" });
    expect(await page.locator('[data-role="grid"] td.in-range').count()).toBe(0);
  });
});

describe("keys that move", () => {
  beforeAll(async () => {
    await open();
    // a column of data with a gap, as a spreadsheet's Ctrl+arrows are defined over (common practice)
    await sheetWith("Keys", { A1: 1, A2: 2, A3: 3, A4: 4, A5: 5, A8: 8, A9: 9, D1: "x", F1: "y" });
  });
  const press = async (start: string, ...keys: string[]) => {
    await td(start).click();
    for (const k of keys) await page.keyboard.press(k);
    return nameBox();
  };

  test("Home goes to column A of the row; Ctrl+Home to A1; Ctrl+End to the last cell in use", async () => {
    expect(await press("C4", "Home")).toBe("A4");
    expect(await press("C4", "Control+Home")).toBe("A1");
    expect(await press("C4", "Control+End")).toBe("F9"); // the last row in use (9) and the last column (F)
    expect(await press("C4", "Shift+Home")).toBe("A4");
    expect((await selection()).range).toBe("A4:C4");
  });

  test("Ctrl+arrows go to the edge of the data region, and on to the next one", async () => {
    expect(await press("A1", "Control+ArrowDown")).toBe("A5"); // the last of A1:A5
    expect(await press("A5", "Control+ArrowDown")).toBe("A8"); // over the gap to the next in use
    expect(await press("A8", "Control+ArrowDown")).toBe("A9");
    // past the last in use: the grid's last row (the sheet's 9 rows and 12 spare, at least 40)
    expect(await press("A9", "Control+ArrowDown")).toBe("A40");
    expect(await press("A9", "Control+ArrowUp")).toBe("A8");
    expect(await press("A1", "Control+ArrowRight")).toBe("D1");
    expect(await press("D1", "Control+ArrowRight")).toBe("F1");
    expect(await press("F1", "Control+ArrowLeft")).toBe("D1");
    expect(await press("A3", "Control+Shift+ArrowDown")).toBe("A5");
    expect((await selection()).range).toBe("A3:A5");
  });

  test("PageDown and PageUp move by one screen of rows and bring the cell into view", async () => {
    await td("B2").click();
    const rowsInView = await page.evaluate(() => {
      const sheet = document.querySelector<HTMLElement>('[data-role="grid"]')!;
      const row = sheet.querySelector<HTMLElement>('td[data-address="B2"]')!.getBoundingClientRect().height;
      return Math.floor(sheet.clientHeight / row);
    });
    await page.keyboard.press("PageDown");
    const down = parseCell(await nameBox());
    expect(down.col).toBe(1);
    // one screen, less the header row, give or take a row cut by the edge
    expect(Math.abs(down.row - 1 - (rowsInView - 1))).toBeLessThanOrEqual(2);
    const box = (await td(cellAddress(down)).boundingBox())!;
    const view = (await page.locator('[data-role="grid"]').boundingBox())!;
    expect(box.y + box.height).toBeLessThanOrEqual(view.y + view.height + 1);
    await page.keyboard.press("PageUp");
    expect(await nameBox()).toBe("B2");
    await page.keyboard.press("Shift+PageDown");
    expect((await selection()).range).toBe(`B2:${cellAddress(down)}`);
  });
});
