/**
 * One look for both hosts: the caution and the longer notes of an estimate sheet are merged, wrapped and given their
 * row height by the one rule of src/workbook/look.ts, and the Excel side (over office-addin-mock and the in-memory
 * workbook of ./fakeExcel.ts) and the preview's sheet carry exactly that geometry, in the sheet and in its share copy.
 */
import { beforeAll, describe, expect, it } from "vitest";
import * as functions from "../../src/functions/functions";
import { templateNames, templateSheet } from "../../src/preview/fromTemplate";
import type { SheetData } from "../../src/preview/model";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { cellAddress, parseCell, parseRange } from "../../src/workbook/a1";
import { createExcelPort } from "../../src/workbook/excel";
import { CAUTION, type WrappedLine, wrappedHeight, wrappedLines } from "../../src/workbook/look";
import { PreviewPort } from "../../src/preview/port";
import { demoScenario } from "../../src/workbook/scenario";
import { estimateTemplate } from "../../src/workbook/template";
import { generatedMetadata } from "../preview/metadataFixture";
import { FakeExcel, type FakeSheet } from "./fakeExcel";

beforeAll(async () => {
  registerHeadroomFunctions(await generatedMetadata(), functions);
});

/** Merged blocks, row heights (by 1-based row) and wrapped cells, however a host keeps them. */
interface Geometry {
  merges: string[];
  heights: Record<number, number>;
  wrapped: string[];
}

function ruleGeometry(lines: WrappedLine[], rowsDown = 0): Geometry {
  const down = (a: string) => a.replace(/\d+/g, (r) => String(Number(r) + rowsDown));
  return {
    merges: lines.map((l) => down(l.merge)).sort(),
    heights: Object.fromEntries(lines.map((l) => [parseCell(l.address).row + 1 + rowsDown, l.height])),
    wrapped: lines.map((l) => down(l.address)).sort(),
  };
}

function previewGeometry(sheet: SheetData): Geometry {
  return {
    merges: [...(sheet.merges ?? [])].sort(),
    heights: Object.fromEntries(Object.entries(sheet.rowHeights ?? {}).map(([r, h]) => [Number(r) + 1, h])),
    wrapped: Object.entries(sheet.cells)
      .filter(([, c]) => c.style?.wrap)
      .map(([a]) => a)
      .sort(),
  };
}

function excelGeometry(sheet: FakeSheet): Geometry {
  // the cells of a merged block other than its first are covered by it: its first cell carries the block's look
  const covered = new Set<string>();
  for (const m of sheet.merges) {
    const b = parseRange(m);
    for (let i = 0; i < b.rows; i++)
      for (let k = 0; k < b.cols; k++) if (i || k) covered.add(cellAddress({ row: b.start.row + i, col: b.start.col + k }));
  }
  return {
    merges: [...sheet.merges].sort(),
    heights: Object.fromEntries(sheet.rowHeights),
    wrapped: [...sheet.cells]
      .filter(([a, c]) => c.style?.wrapText === true && !covered.has(a))
      .map(([a]) => a)
      .sort(),
  };
}

describe.each(["US", "SI"] as const)("the caution wraps alike in both hosts, %s", (units) => {
  const t = estimateTemplate(demoScenario(units));
  const lines = wrappedLines(t.cells, t.columnWidths);

  it("the rule: the caution in A2 across A:D, three lines tall", () => {
    // 210 characters × 5.3 pt = 1113 pt, over A:D less the padding: 230 + 95 + 80 + 95 − 8 = 492 pt → 2.26, so 3 lines;
    // 3 lines × 15 pt + 3 pt = 48 pt (our own layout figures, by hand)
    expect(CAUTION.length).toBe(210);
    expect(t.columnWidths).toMatchObject({ A: 230, B: 95, C: 80, D: 95 });
    expect(lines.find((l) => l.address === "A2")).toEqual({ address: "A2", merge: "A2:D2", height: 48 });
    expect(wrappedHeight(CAUTION, 492 + 8)).toEqual({ lines: 3, height: 48 });
    // a note is wrapped only when one line of A:D cannot hold it
    for (const c of t.cells.filter((x) => x.role === "note" && /^A\d+$/.test(x.address))) {
      const twoLines = wrappedHeight(String(c.value), 500).lines >= 2;
      expect(lines.some((l) => l.address === c.address), c.address).toBe(twoLines);
    }
  });

  it("the preview's sheet and the Excel side carry the rule's merges, row heights and wrapping, and nothing else", async () => {
    const preview = previewGeometry(templateSheet(t));
    const fake = new FakeExcel(["Sheet1"]);
    const { sheetName } = await createExcelPort({ run: fake.run, runIn: fake.runIn, now: () => new Date(), settleMs: 5, supports: () => true }).insertEstimateSheet(units);
    const sheet = fake.sheetByName(sheetName)!;
    const excel = excelGeometry(sheet);
    expect(preview).toEqual(ruleGeometry(lines));
    expect(excel).toEqual(ruleGeometry(lines));
    // wrapped text sits at the top of its block in Excel, as the preview's grid and its saved files put it
    for (const l of lines) expect(sheet.cells.get(l.address)?.style?.verticalAlignment, l.address).toBe("Top");
  });

  it("a share copy keeps the same geometry, two rows down under its stamp, in both hosts", async () => {
    const wb = new PreviewWorkbook({ sheets: [templateSheet(t)], names: templateNames(t) });
    const previewCopy = new PreviewPort(wb, () => new Date(2026, 4, 4)).shareCopyData();
    expect(previewCopy.ok).toBe(true);
    if (!previewCopy.ok) return;

    const fake = new FakeExcel(["Sheet1"]);
    const port = createExcelPort({ run: fake.run, runIn: fake.runIn, now: () => new Date(2026, 4, 4), settleMs: 5, supports: () => true });
    // the demo scenario given as the user's own, as the preview's sheet above: no demo value to refuse the copy for
    const { sheetName } = await port.insertEstimateSheet(units, demoScenario(units));
    // what Excel shows once every function has answered
    for (const c of fake.sheetByName(sheetName)!.cells.values()) if (c.formula) Object.assign(c, { value: 1, error: false });
    const made = await port.makeShareCopy();
    expect(made.ok).toBe(true);
    if (!made.ok) return;

    const want = ruleGeometry(lines, 2);
    expect(previewGeometry(previewCopy.sheet)).toMatchObject({ merges: want.merges, heights: want.heights });
    expect(excelGeometry(fake.sheetByName(made.sheetName)!)).toMatchObject({ merges: want.merges, heights: want.heights });
  });
});
