/**
 * The preview's grid as a person uses it, in headless Chromium (as test/browser/preview.test.ts): rows inserted inside
 * the pipe-run table and deleted, copy and paste (the workbook's own block and tab-separated text from elsewhere), the
 * name box, the keyboard leaving the grid (Tab, F6), and Ctrl+Z bringing a demo value's mark back.
 *
 * Run with `npm run test:browser` (it builds first).
 */
import type { JSHandle, Page } from "playwright-core";
import { describe, expect, test } from "vitest";
import { parseRange } from "../../src/workbook/a1";
import { openSample, usePreview } from "./previewPage";

const PUMP_SAMPLE = "tinker-row-manufacturing-pump-needed.xlsx";
const OFFICE_SAMPLE = "quill-street-office-supply-suffices.xlsx";

let page: Page;
const session = usePreview((s) => (page = s.page));

/** Open the preview on a sample, declining work an earlier test left kept in the browser. */
async function open(sample: string): Promise<void> {
  await openSample(session(), sample);
  workbook = await page.evaluateHandle(() => (window as unknown as { headroomPreview: { workbook: Wb } }).headroomPreview.workbook);
  await settle();
}

/** Wait until the pane has read the workbook again and drawn. */
async function settle(): Promise<void> {
  await page.evaluate(async () => {
    await new Promise((r) => setTimeout(r, 0));
    await (window as unknown as { headroomPreview: { pane: { idle(): Promise<void> } } }).headroomPreview.pane.idle();
  });
}

/** The live workbook of the page (window.headroomPreview.workbook), as far as the tests ask it. */
type Wb = {
  activeSheet: string;
  content(s: string, a: string): unknown;
  value(s: string, a: string): unknown;
  style(s: string, a: string): { demo?: boolean } | undefined;
  cell(s: string, a: string): { spillRange?: string; display: string };
  cells(s: string): Array<{ address: string; content: unknown; style?: { demo?: boolean } }>;
  nameValue(n: string): unknown;
  nameTarget(n: string): { kind: string; sheet: string; address: string } | null;
};
let workbook: JSHandle<Wb>;
/** Ask the live workbook something: `f` runs in the page with the workbook and `arg`. */
function ask<T, A>(f: (wb: Wb, arg: A) => T, arg: A): Promise<T> {
  return workbook.evaluate(f as never, arg) as Promise<T>;
}
const activeContent = (address: string) => ask((wb, a) => wb.content(wb.activeSheet, a), address);
const activeValue = (address: string) => ask((wb, a) => wb.value(wb.activeSheet, a), address);
const selection = () => page.evaluate(() => (window as unknown as { headroomPreview: { grid: { selectionRange(): { sheet: string; range: string; active: string } } } }).headroomPreview.grid.selectionRange());
const verdict = async () => ((await page.locator('[data-role="pane-host"] [data-role="verdict"]').textContent()) ?? "").trim();
const message = async () => ((await page.locator('[data-role="cell-message"]').textContent()) ?? "").trim();

/** Go to a cell with the name box: click it, type, Enter. */
async function goTo(where: string): Promise<void> {
  await page.click('[data-role="name-box"]');
  await page.keyboard.type(where);
  await page.keyboard.press("Enter");
}

/** Type into the selected cell and press `then`. */
async function typeHere(text: string, then = "Enter"): Promise<void> {
  await page.keyboard.type(text);
  await page.keyboard.press(then);
}

describe("rows", () => {
  test("a row inserted inside the pipe-run table takes a typed segment: the run's friction, the sheet's verdict and the pane's include it; undo takes it back", async () => {
    await open(PUMP_SAMPLE);
    const anchor = await ask((wb) => wb.cells(wb.activeSheet).find((c) => typeof c.content === "string" && c.content.startsWith("=HEADROOM.PIPERUN("))!.address, null);
    const spill = (await ask((wb, a) => wb.cell(wb.activeSheet, a).spillRange, anchor))!;
    const run = parseRange(spill);
    const verdictCell = await ask((wb) => wb.cells(wb.activeSheet).find((c) => typeof c.content === "string" && c.content.startsWith("=HEADROOM.VERDICT("))!.address, null);
    const before = { verdict: await verdict(), friction: (await ask((wb) => wb.nameValue("Pressure_RunFriction"), null)) as number };

    // the second segment's row selected, Insert rows: a new row above it, inside the table
    await goTo(`A${run.start.row + 2}`);
    await page.click('[data-role="insert-rows"]');
    await settle();
    const row = run.start.row + 2;
    expect(await ask((wb, a) => wb.cell(wb.activeSheet, a).spillRange, anchor)).toBe(`N${run.start.row + 1}:Q${run.start.row + run.rows + 1}`);
    expect(await message()).toBe(`Inserted an empty row as row ${row}; the rows below moved down. Ctrl+Z takes it back.`);
    // a segment typed into it as a user would: 60 ft of 4 in schedule 10 steel, no fittings, level
    await goTo(`A${row}`);
    for (const text of ["Added segment", "4", "10", "steel"]) await typeHere(text, "Tab");
    await goTo(`F${row}`);
    await typeHere("no", "Enter");
    for (const [col, text] of [["J", "60"], ["L", "0"], ["M", "0"]]) {
      await goTo(`${col}${row}`);
      await typeHere(text);
    }
    await settle();
    const loss = (await activeValue(`N${row}`)) as number;
    expect(typeof loss).toBe("number");
    expect(loss).toBeGreaterThan(0);
    // the run's friction is its segments' sum, the new one in it (hand arithmetic: a sum of the N column)
    const losses = (await Promise.all(Array.from({ length: run.rows + 1 }, (_, i) => activeValue(`N${run.start.row + 1 + i}`)))) as number[];
    const friction = (await ask((wb) => wb.nameValue("Pressure_RunFriction"), null)) as number;
    expect(friction).toBeCloseTo(losses.reduce((a, b) => a + b, 0), 9);
    expect(friction).toBeCloseTo(before.friction + loss, 9);
    // the sheet's verdict and the pane's agree, and both moved
    const now = await verdict();
    expect(now).not.toBe(before.verdict);
    expect(await ask((wb, a) => wb.cell(wb.activeSheet, a).display, verdictCell.replace(/\d+$/, (n) => String(Number(n) + 1)))).toBe(now);

    // Ctrl+Z, once per typed cell and once for the row: everything as it was
    await page.focus('[data-role="grid"]');
    for (let i = 0; i < 9; i++) await page.keyboard.press("Control+z"); // eight typed cells and the row
    await settle();
    expect(await ask((wb, a) => wb.cell(wb.activeSheet, a).spillRange, anchor)).toBe(spill);
    expect(await ask((wb) => wb.nameValue("Pressure_RunFriction"), null)).toBe(before.friction);
    expect(await verdict()).toBe(before.verdict);
  });

  test("Delete rows takes the selected segment's row out of the table; Ctrl+Z brings it back", async () => {
    await open(PUMP_SAMPLE);
    const anchor = await ask((wb) => wb.cells(wb.activeSheet).find((c) => typeof c.content === "string" && c.content.startsWith("=HEADROOM.PIPERUN("))!.address, null);
    const spill = (await ask((wb, a) => wb.cell(wb.activeSheet, a).spillRange, anchor))!;
    const run = parseRange(spill);
    const before = await verdict();
    await goTo(`A${run.start.row + 2}`);
    await page.click('[data-role="delete-rows"]');
    await settle();
    expect(await ask((wb, a) => wb.cell(wb.activeSheet, a).spillRange, anchor)).toBe(`N${run.start.row + 1}:Q${run.start.row + run.rows - 1}`);
    expect(await message()).toBe(`Deleted row ${run.start.row + 2}; Ctrl+Z brings it back.`);
    expect(await verdict()).toMatch(/psi/);
    await page.focus('[data-role="grid"]');
    await page.keyboard.press("Control+z");
    await settle();
    expect(await ask((wb, a) => wb.cell(wb.activeSheet, a).spillRange, anchor)).toBe(spill);
    expect(await verdict()).toBe(before);
  });
});

describe("a cell being edited", () => {
  test("Insert rows, Delete rows and the name box commit the typed text to its own cell first", async () => {
    await open(OFFICE_SAMPLE);
    await page.click('[data-role="sheet-tabs"] .tab.add');
    await goTo("A1");
    await typeHere("top", "Enter");
    await goTo("A3");
    await typeHere("below", "Enter");
    // typing in A2, then Insert rows: the text stays in its cell, which moves down to A3 with the row
    await goTo("A2");
    await page.keyboard.type("typed");
    await page.click('[data-role="insert-rows"]');
    await settle();
    expect(await activeContent("A2")).toBeNull();
    expect(await activeContent("A3")).toBe("typed");
    expect(await activeContent("A4")).toBe("below");
    // a click elsewhere afterwards writes nothing more
    await page.click('td[data-address="C1"]');
    await settle();
    expect(await activeContent("A2")).toBeNull();
    expect(await activeContent("A3")).toBe("typed");

    // typing in A3, then Delete rows: the text is committed, then its row goes; the row under it moves up
    await goTo("A3");
    await page.keyboard.type("gone with its row");
    await page.click('[data-role="delete-rows"]');
    await settle();
    expect(await activeContent("A3")).toBe("below");
    await page.click('td[data-address="C1"]');
    await settle();
    expect(await activeContent("A3")).toBe("below");

    // typing in B1, then going to a cell with the name box: the text is kept
    await goTo("B1");
    await page.keyboard.type("kept");
    await goTo("D4");
    expect(await activeContent("B1")).toBe("kept");
    expect((await selection()).active).toBe("D4");

    // typing in B2, then naming the selection with the name box: the text is kept and the editor closed
    await goTo("B2");
    await page.keyboard.type("named");
    await goTo("Edited_Cell");
    expect(await activeContent("B2")).toBe("named");
    expect(await ask((wb) => wb.nameTarget("Edited_Cell"), null)).toMatchObject({ kind: "cell", address: "B2" });
    expect(await page.locator('[data-role="cell-editor"]').count()).toBe(0);
  });
});

describe("scrolling while a cell is edited", () => {
  test("the edited cell's row stays drawn and every drawn row stays in sheet order", async () => {
    await open(PUMP_SAMPLE);
    await goTo("A1");
    await page.keyboard.type("typed");
    const drawnRows = () =>
      page.evaluate(() => [...document.querySelectorAll('[data-role="grid"] tbody tr')].map((tr) => tr.querySelector("td[data-address]")?.getAttribute("data-address")).filter((a): a is string => !!a).map((a) => Number(a.replace(/^[A-Z]+/, ""))));
    const scrollTo = async (part: number) => {
      await page.evaluate((p) => {
        const sheet = document.querySelector<HTMLElement>('[data-role="grid"]')!;
        sheet.scrollTop = (sheet.scrollHeight - sheet.clientHeight) * p;
      }, part);
      await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r))));
    };
    for (const part of [1, 0.5, 0.8, 0.3, 1]) {
      await scrollTo(part);
      const rows = await drawnRows();
      expect(rows).toContain(1);
      expect(rows, `scrolled to ${part}`).toEqual([...rows].sort((a, b) => a - b));
    }
    expect(await page.locator('[data-role="cell-editor"]').inputValue()).toBe("typed");
  });
});

describe("copy and paste", () => {
  test("a copied block pastes elsewhere with its references moved; tab-separated text goes in as typed; each one Ctrl+Z", async () => {
    await open(OFFICE_SAMPLE);
    await page.click('[data-role="sheet-tabs"] .tab.add');
    await goTo("A1");
    await typeHere("2", "Tab");
    await typeHere("=A1*3", "Enter");
    await goTo("A1:B1");
    expect((await selection()).range).toBe("A1:B1");
    await page.keyboard.press("Control+c");
    expect(await message()).toBe("Copied A1:B1: select where it goes and press Ctrl+V.");
    await goTo("A4");
    await page.keyboard.press("Control+v");
    expect(await activeContent("B4")).toBe("=A4*3");
    expect(await activeValue("B4")).toBe(6); // 2 × 3 (hand arithmetic)
    expect((await selection()).range).toBe("A4:B4");

    // text from another program: tab-separated, as a spreadsheet puts it on the clipboard
    await goTo("D1");
    await page.evaluate(() => {
      const data = new DataTransfer();
      data.setData("text/plain", "5\t=D1*2\r\n2-1/2\tTRUE\r\n");
      document.querySelector('[data-role="grid"]')!.dispatchEvent(new ClipboardEvent("paste", { clipboardData: data, bubbles: true }));
    });
    expect(await activeValue("E1")).toBe(10); // 5 × 2 (hand arithmetic)
    expect(await activeValue("D2")).toBe("2-1/2"); // a nominal size stays text (common practice)
    expect(await activeValue("E2")).toBe(true);
    await page.keyboard.press("Control+z");
    for (const a of ["D1", "E1", "D2", "E2"]) expect(await activeContent(a), a).toBeNull();
    expect(await activeContent("B4")).toBe("=A4*3");
    await page.keyboard.press("Control+z");
    expect(await activeContent("B4")).toBeNull();
  });
});

describe("the name box", () => {
  test("goes to a cell, to a name on another sheet (showing that sheet), says so of nonsense, and Escape returns to the grid", async () => {
    await open(OFFICE_SAMPLE);
    const box = page.locator('[data-role="name-box"]');
    await goTo("b14");
    expect((await selection()).active).toBe("B14");
    expect(await box.inputValue()).toBe("B14");
    expect(await page.evaluate(() => document.activeElement?.getAttribute("data-role"))).toBe("grid");

    await page.click('[data-role="sheet-tabs"] .tab.add');
    const target = (await ask((wb) => wb.nameTarget("Supply_Static"), null))!;
    expect(target.kind).toBe("cell");
    await goTo("Supply_Static");
    expect(await page.getAttribute(`[data-role="sheet-tabs"] [data-sheet="${target.sheet}"]`, "aria-selected")).toBe("true");
    expect(await selection()).toEqual({ sheet: target.sheet, range: `${target.address}:${target.address}`, active: target.address });

    await goTo("Nowhere!B2");
    expect(await message()).toMatch(/^Name box: got "Nowhere!B2"; the workbook has no sheet named "Nowhere"/);
    expect(await page.locator('[data-role="cell-message"]').getAttribute("class")).toMatch(/is-error/);
    expect((await selection()).active).toBe(target.address);
    await page.keyboard.press("Escape");
    expect(await page.evaluate(() => document.activeElement?.getAttribute("data-role"))).toBe("grid");
    expect(await box.inputValue()).toBe(target.address);
  });
});

describe("the keyboard", () => {
  const focused = () =>
    page.evaluate(() => {
      const el = document.activeElement as HTMLElement | null;
      const region = el?.closest("header.bar") ? "toolbar" : el?.closest('[data-role="pane-host"]') ? "pane" : (el?.dataset.role ?? el?.tagName ?? "");
      return region;
    });

  test("Tab and F6 leave the grid: Tab to the pane, Shift+Tab to the formula bar; F6 cycles toolbar, name box, grid, pane", async () => {
    await open(OFFICE_SAMPLE);
    await goTo("B14");
    expect(await focused()).toBe("grid");
    await page.keyboard.press("Tab");
    expect(await focused()).toBe("pane");
    await page.keyboard.press("Shift+F6");
    expect(await focused()).toBe("grid");
    await page.keyboard.press("Shift+Tab");
    expect(await focused()).toBe("formula-bar");
    await page.keyboard.press("F6");
    expect(await focused()).toBe("grid");
    const cycle: string[] = [];
    for (let i = 0; i < 4; i++) {
      await page.keyboard.press("F6");
      cycle.push(await focused());
    }
    expect(cycle).toEqual(["pane", "toolbar", "name-box", "grid"]);
    // while a cell is edited, Tab still commits it and moves right
    await page.keyboard.type("x");
    await page.keyboard.press("Tab");
    expect((await selection()).active).toBe("C14");
    expect(await focused()).toBe("grid");
    expect(await activeValue("B14")).toBe("x");
    // F6 from a cell being edited commits it first, then leaves
    await page.keyboard.type("y");
    await page.keyboard.press("F6");
    expect(await focused()).toBe("pane");
    expect(await activeValue("C14")).toBe("y");
  });

  test("ten inputs of a new estimate sheet by keyboard alone, with the name box and Enter: the key presses counted", async () => {
    await open(OFFICE_SAMPLE);
    await page.selectOption('[data-role="units"]', "US");
    await page.click('[data-role="new-sheet"]');
    await page.waitForSelector('[data-role="sheet-tabs"] [data-sheet="Estimate 2"][aria-selected="true"]');
    await settle();
    // the first ten demo values of the sheet, in column B, top to bottom; each typed over with its own text
    const inputs = await ask(
      (wb) =>
        wb
          .cells(wb.activeSheet)
          .filter((c) => c.style?.demo && /^B\d+$/.test(c.address) && typeof c.content === "number")
          .map((c) => ({ address: c.address, text: String(c.content) }))
          .sort((a, b) => Number(a.address.slice(1)) - Number(b.address.slice(1)))
          .slice(0, 10),
      null,
    );
    expect(inputs.length).toBe(10);
    let presses = 0;
    const press = async (key: string) => {
      presses++;
      await page.keyboard.press(key);
    };
    const type = async (text: string) => {
      presses += text.length;
      await page.keyboard.type(text);
    };
    // from the pane's button the keyboard reaches the grid with Shift+F6, the name box with another
    await press("Shift+F6");
    expect(await focused()).toBe("grid");
    let at = "";
    for (const { address, text } of inputs) {
      if (at !== address) {
        await press("Shift+F6");
        expect(await focused()).toBe("name-box");
        await type(address);
        await press("Enter");
      }
      await type(text);
      await press("Enter");
      at = `B${Number(address.slice(1)) + 1}`; // Enter moves down
    }
    await settle();
    for (const { address } of inputs) expect(await ask((wb, a) => wb.style(wb.activeSheet, a)?.demo, address), address).toBeUndefined();
    console.log(`ten inputs of a new estimate sheet: ${presses} key presses (102 before the name box and Tab/F6)`);
    expect(presses).toBeLessThan(102); // the count measured with the grid before the name box and Tab/F6
  });
});

describe("a demo value's mark", () => {
  test("Ctrl+Z over an overwritten demo value brings its mark back; Ctrl+Y takes it away again", async () => {
    await open(OFFICE_SAMPLE);
    await page.selectOption('[data-role="units"]', "US");
    await page.click('[data-role="new-sheet"]');
    await page.waitForSelector('[data-role="sheet-tabs"] [data-sheet="Estimate 2"][aria-selected="true"]');
    await settle();
    const address = await ask((wb) => wb.cells(wb.activeSheet).find((c) => c.style?.demo && typeof c.content === "number")!.address, null);
    const td = page.locator(`[data-role="grid"] td[data-address="${address}"]`);
    await goTo(address);
    expect(await td.getAttribute("data-demo")).toBe("true");
    await typeHere("7");
    expect(await td.getAttribute("data-demo")).toBeNull();
    await page.keyboard.press("Control+z");
    expect(await td.getAttribute("data-demo")).toBe("true");
    await page.keyboard.press("Control+y");
    expect(await td.getAttribute("data-demo")).toBeNull();
    expect(await activeValue(address)).toBe(7);
  });
});
