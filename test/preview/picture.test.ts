/**
 * A share copy's plot as a picture in the file: where it goes on the sheet, and how the file holds it (a PNG part,
 * a drawing anchored at that cell with the picture's size). Drawing the pane's SVG as PNG needs a browser: the
 * browser tests check the picture a saved share copy carries.
 */
import { beforeAll, describe, expect, test } from "vitest";
import ExcelJS from "exceljs";
import * as functions from "../../src/functions/functions";
import { picturePlace } from "../../src/preview/picture";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { PreviewPort } from "../../src/preview/port";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { templateNames, templateSheet } from "../../src/preview/fromTemplate";
import { writeXlsx } from "../../src/preview/xlsx";
import { SHARE_STAMP_ROWS } from "../../src/workbook/port";
import { demoScenario } from "../../src/workbook/scenario";
import { CHART_FROM, estimateTemplate } from "../../src/workbook/template";
import { parseCell, cellAddress } from "../../src/workbook/a1";
import { generatedMetadata } from "./metadataFixture";
import { zipEntry } from "./zipEntry";

let known: string[];
beforeAll(async () => {
  known = registerHeadroomFunctions(await generatedMetadata(), functions).functions.map((f) => f.formulaName);
});

/** A PNG of one pixel, as base64 (the smallest image a picture can be). */
const PIXEL = "iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==";
const png = `data:image/png;base64,${PIXEL}`;

function shareSheet() {
  const t = estimateTemplate(demoScenario("US"));
  const wb = new PreviewWorkbook({ sheets: [templateSheet(t)], names: templateNames(t) });
  const made = new PreviewPort(wb, () => new Date(2026, 4, 4)).shareCopyData();
  if (!made.ok) throw new Error(made.reason);
  return made.sheet;
}

describe("where the plot goes", () => {
  test("on a share copy of an estimate: where the estimate's chart stands, below the stamp", () => {
    const at = parseCell(CHART_FROM);
    expect(picturePlace(shareSheet())).toBe(cellAddress({ row: at.row + SHARE_STAMP_ROWS, col: at.col }));
  });

  test("on a sheet whose cells fill that block: right of its last used column, below the stamp", () => {
    const sheet = shareSheet();
    const at = parseCell(CHART_FROM);
    sheet.cells[cellAddress({ row: at.row + SHARE_STAMP_ROWS + 3, col: at.col + 2 })] = { content: 7 };
    const lastCol = Math.max(...Object.keys(sheet.cells).map((a) => parseCell(a).col));
    expect(picturePlace(sheet)).toBe(cellAddress({ row: SHARE_STAMP_ROWS, col: lastCol + 2 }));
  });
});

test("a share copy saved with the plot holds the PNG, anchored at its cell with its size", async () => {
  const sheet = shareSheet();
  const at = picturePlace(sheet);
  const bytes = await writeXlsx({ sheets: [sheet], names: [] }, known, {
    pictures: [{ sheet: sheet.name, png, at, width: 360, height: 280 }],
  });
  expect(Buffer.from(zipEntry(bytes, "xl/media/image1.png", "latin1"), "latin1").toString("base64")).toBe(PIXEL);
  const drawing = zipEntry(bytes, "xl/drawings/drawing1.xml");
  const a = parseCell(at);
  expect(drawing).toContain(`<xdr:from><xdr:col>${a.col}</xdr:col><xdr:colOff>0</xdr:colOff><xdr:row>${a.row}</xdr:row>`);
  // 360 × 280 px in EMU: 914400 EMU an inch (ECMA-376 Part 1, DrawingML coordinates) at 96 px an inch (common
  // practice): 914400 / 96 = 9525 EMU a pixel
  expect(drawing).toContain(`<xdr:ext cx="${360 * 9525}" cy="${280 * 9525}"/>`);
  const x = new ExcelJS.Workbook();
  await x.xlsx.load(bytes as unknown as ArrayBuffer);
  expect(x.worksheets[0].getImages()).toHaveLength(1);
  let formulas = 0;
  x.worksheets[0].eachRow((row) => row.eachCell((c) => void (c.formula && formulas++)));
  expect(formulas).toBe(0);
});

test("a picture for a sheet the workbook does not hold is refused", async () => {
  await expect(writeXlsx({ sheets: [{ name: "S", cells: {} }], names: [] }, known, { pictures: [{ sheet: "T", png, at: "A1", width: 1, height: 1 }] })).rejects.toThrow(
    /no sheet T for the picture/,
  );
});
