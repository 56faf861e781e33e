/**
 * Demo values and the share copy, in the preview: a new estimate sheet (built from the demo scenario) marks every
 * input still holding its demo value until the user types into it; the marks survive saving and opening the file;
 * a share copy is refused while any remains. A share copy looks frozen: no input shading, no note asking to
 * overwrite demo values. Samples are not demos: their values are their own.
 */
import { beforeAll, describe, expect, test } from "vitest";
import * as functions from "../../src/functions/functions";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { PreviewPort } from "../../src/preview/port";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { readXlsx, writeXlsx } from "../../src/preview/xlsx";
import { SAMPLES } from "../../samples/scenarios";
import { FROZEN_NOTE, INPUTS_NOTE, SAMPLE_NOTE } from "../../src/workbook/look";
import { demoScenario } from "../../src/workbook/scenario";
import { generatedMetadata } from "./metadataFixture";

let known: string[];
beforeAll(async () => {
  known = registerHeadroomFunctions(await generatedMetadata(), functions).functions.map((f) => f.formulaName);
});

const empty = () => new PreviewWorkbook({ sheets: [{ name: "Sheet1", cells: { A1: { content: "notes" } } }], names: [] });

/** The addresses of a sheet's cells marked as holding a demo value. */
const marked = (wb: PreviewWorkbook, sheet: string) =>
  wb
    .cells(sheet)
    .filter((v) => v.style?.demo)
    .map((v) => v.address);

/** A new estimate sheet from the pane's button: the demo scenario. */
async function newSheet(units: "US" | "SI" = "US") {
  const wb = empty();
  const port = new PreviewPort(wb, () => new Date(2026, 4, 4));
  const { sheetName } = await port.insertEstimateSheet(units);
  return { wb, port, sheetName };
}

describe("demo values are marked until overwritten", () => {
  test("a new estimate sheet marks every input holding a demo value, the units chosen in the pane aside", async () => {
    const { wb, sheetName } = await newSheet();
    const inputs = wb.cells(sheetName).filter((v) => v.style?.role === "input");
    const units = wb.nameTarget("Units")!;
    const withValue = inputs.filter((v) => v.content !== null).map((v) => v.address);
    expect(withValue.length).toBeGreaterThan(30);
    expect(marked(wb, sheetName).sort()).toEqual(withValue.filter((a) => units.kind === "cell" && a !== units.address).sort());
    // an input left blank on purpose holds no demo value
    expect(inputs.some((v) => v.content === null && !v.style?.demo)).toBe(true);
  });

  test("a sample's sheet is not a demo: no marks", async () => {
    const wb = empty();
    const { sheetName } = await new PreviewPort(wb).insertEstimateSheet("US", SAMPLES[0].scenario);
    expect(marked(wb, sheetName)).toEqual([]);
  });

  test("typing into a marked cell (or clearing it) takes its mark away, and only its", async () => {
    const { wb, sheetName } = await newSheet();
    const [a, b, c] = marked(wb, sheetName);
    const before = marked(wb, sheetName).length;
    wb.setTyped(sheetName, a, "80");
    wb.setContent(sheetName, b, null);
    expect(wb.style(sheetName, a)?.demo).toBeFalsy();
    expect(wb.style(sheetName, b)?.demo).toBeFalsy();
    expect(wb.style(sheetName, c)?.demo).toBe(true);
    expect(wb.style(sheetName, a)?.role).toBe("input");
    expect(marked(wb, sheetName)).toHaveLength(before - 2);
  });

  test("the marks survive saving the workbook and opening it again", async () => {
    const { wb, sheetName } = await newSheet("SI");
    const first = marked(wb, sheetName)[0];
    wb.setTyped(sheetName, first, "3");
    const want = marked(wb, sheetName).sort();
    const { workbook } = await readXlsx(await writeXlsx(wb.toData(), known), known);
    const reopened = new PreviewWorkbook(workbook);
    expect(marked(reopened, sheetName).sort()).toEqual(want);
    expect(reopened.style(sheetName, first)?.role).toBe("input");
    expect(reopened.style(sheetName, want[0])?.role).toBe("input");
  });

  test("a share copy is refused while demo values remain, naming the first cells and how many more", async () => {
    const { wb, port, sheetName } = await newSheet();
    const demo = marked(wb, sheetName);
    const made = port.shareCopyData();
    expect(made.ok).toBe(false);
    if (made.ok) return;
    expect(made.reason).toMatch(new RegExp(`^No share copy made: ${demo.slice(0, 5).join(", ")} and ${demo.length - 5} more still hold the demo values of a new estimate sheet`));
    expect((await port.makeShareCopy()).ok).toBe(false);
    expect(wb.sheetNames()).toHaveLength(2);
    // every demo value overwritten (here: typed again as it is, which keeps it as the user's own)
    for (const a of demo) wb.setTyped(sheetName, a, String(wb.content(sheetName, a)));
    expect(port.shareCopyData().ok).toBe(true);
  });
});

describe("a share copy looks frozen", () => {
  test("the note of a new estimate sheet, like a sample's, gives way to the frozen note", async () => {
    const wb = empty();
    // the demo scenario given as the user's own: nothing marked as a demo value, the new sheet's note
    const { sheetName } = await new PreviewPort(wb).insertEstimateSheet("US", demoScenario("US"));
    const note = wb.cells(sheetName).find((v) => v.content === INPUTS_NOTE)!;
    const made = new PreviewPort(wb, () => new Date(2026, 4, 4)).shareCopyData();
    if (!made.ok) throw new Error(made.reason);
    expect(made.sheet.cells[note.address.replace(/\d+$/, (r) => String(Number(r) + 2))].content).toBe(FROZEN_NOTE);
  });

  test("no input shading and no note asking to overwrite the demo values; numbers keep their formats", async () => {
    const wb = empty();
    const { sheetName } = await new PreviewPort(wb).insertEstimateSheet("US", SAMPLES[0].scenario);
    const note = wb.cells(sheetName).find((v) => v.content === SAMPLE_NOTE);
    expect(note, "the sample's estimate sheet says which cells are inputs").toBeDefined();
    const inputs = wb.cells(sheetName).filter((v) => v.style?.role === "input" && typeof v.value === "number" && v.style.numFmt);
    expect(inputs.length).toBeGreaterThan(10);
    const made = new PreviewPort(wb, () => new Date(2026, 4, 4)).shareCopyData();
    if (!made.ok) throw new Error(made.reason);
    const cells = Object.values(made.sheet.cells);
    expect(cells.filter((c) => c.style?.role === "input" || c.style?.role === "computed")).toEqual([]);
    expect(cells.filter((c) => typeof c.content === "string" && /^Shaded cells are inputs/.test(c.content))).toEqual([]);
    expect(made.sheet.cells[note!.address.replace(/\d+$/, (r) => String(Number(r) + 2))].content).toMatch(/frozen value/);
    expect(cells.filter((c) => c.style?.demo)).toEqual([]);
    // the values of the inputs are still there, two rows down under the stamp, in their number formats
    const first = inputs[0];
    const at = `${first.address.replace(/\d+$/, "")}${Number(first.address.replace(/^[A-Z]+/, "")) + 2}`;
    expect(made.sheet.cells[at]).toMatchObject({ content: first.value, style: { numFmt: first.style!.numFmt } });
  });
});
