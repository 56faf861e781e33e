/**
 * Spills stored as Excel stores dynamic arrays: the array formula's cell is marked cm="1", other cells are left
 * alone, and a workbook without an array formula gets no cell-metadata part.
 */
import { describe, expect, test, vi } from "vitest";
import ExcelJS from "exceljs";
import { markArrayCells, storeDynamicArrays } from "../../src/preview/dynamicArrays";
import { writeXlsx } from "../../src/preview/xlsx";
import { zipEntry } from "./zipEntry";

describe("markArrayCells", () => {
  test("marks the cell of each array formula, and only those", () => {
    const xml =
      '<sheetData><row r="1"><c r="A1" s="2"/><c r="B1" s="11"><f t="array" ref="B1:C1">X(1)</f><v>1</v></c><c r="C1"><v>2</v></c></row>' +
      '<row r="2"><c r="A2"><f>1+1</f><v>2</v></c><c r="B2" t="e"><f t="array" ref="B2">Y()</f><v>#N/A</v></c></row></sheetData>';
    const { xml: out, marked } = markArrayCells(xml);
    expect(marked).toBe(2);
    expect(out).toContain('<c r="B1" s="11" cm="1"><f t="array" ref="B1:C1">');
    expect(out).toContain('<c r="B2" t="e" cm="1"><f t="array" ref="B2">');
    expect(out).toContain('<c r="A1" s="2"/>');
    expect(out).toContain('<c r="C1"><v>2</v></c>');
    expect(out).toContain('<c r="A2"><f>1+1</f>');
  });

  test("leaves a cell that already carries cell metadata as it is", () => {
    const xml = '<c r="B1" cm="1"><f t="array" ref="B1:B3">X()</f></c>';
    expect(markArrayCells(xml)).toEqual({ xml, marked: 0 });
  });
});

test("a workbook without an array formula gets no metadata part, and no calculation-engine id", async () => {
  const wb = new ExcelJS.Workbook();
  wb.addWorksheet("S").getCell("A1").value = { formula: "1+1", result: 2 };
  const bytes = await storeDynamicArrays(new Uint8Array((await wb.xlsx.writeBuffer()) as ArrayBuffer), new Date(Date.UTC(2026, 0, 1)));
  expect(() => zipEntry(bytes, "xl/metadata.xml")).toThrow(/no xl\/metadata.xml/);
  expect(zipEntry(bytes, "[Content_Types].xml")).not.toContain("metadata.xml");
  expect(zipEntry(bytes, "xl/workbook.xml")).toContain("<calcPr/>");
  expect(zipEntry(bytes, "xl/worksheets/sheet1.xml")).not.toContain(' cm="');
});

test("the same workbook saved twice on the same date gives the same bytes", async () => {
  const data = {
    sheets: [{ name: "S", cells: { A1: { content: 3 }, B1: { content: "=SEQUENCE(2)", cached: 1, spill: "B1:B2" }, B2: { content: null, cached: 2 } } }],
    names: [],
  };
  const date = new Date(Date.UTC(2026, 0, 1));
  // the clock moves a day between the two saves: ExcelJS dates the zip's parts with the time of writing
  vi.useFakeTimers({ toFake: ["Date"] });
  try {
    vi.setSystemTime(new Date(Date.UTC(2026, 5, 1, 9)));
    const first = await writeXlsx(data, [], { date });
    vi.setSystemTime(new Date(Date.UTC(2026, 5, 2, 15)));
    expect(Buffer.from(await writeXlsx(data, [], { date })).equals(Buffer.from(first))).toBe(true);
    expect(zipEntry(first, "xl/worksheets/sheet1.xml")).toMatch(/<c r="B1"[^>]* cm="1"><f t="array" ref="B1:B2">_xlfn.SEQUENCE\(2\)<\/f>/);
  } finally {
    vi.useRealTimers();
  }
});
