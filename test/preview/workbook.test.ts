/**
 * The preview workbook: what typing does, text kept as text, spills found, names, reloading, undo; and how values are
 * shown. Expectations are spreadsheet conventions (common practice) or a direct call of the same cell function.
 */
import { beforeAll, describe, expect, test } from "vitest";
import * as functions from "../../src/functions/functions";
import { contentText, formatNumber, formatValue, generalNumber, parseTyped } from "../../src/preview/format";
import { isFormula } from "../../src/preview/model";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { PreviewWorkbook } from "../../src/preview/workbook";
import type { WorkbookData } from "../../src/preview/model";
import { generatedMetadata } from "./metadataFixture";

beforeAll(async () => {
  registerHeadroomFunctions(await generatedMetadata(), functions);
});

const blank = () => new PreviewWorkbook({ sheets: [{ name: "S", cells: {} }], names: [] });

describe("typing into a cell", () => {
  test("numbers, grouped numbers, percents, booleans, formulas and text, as a spreadsheet reads them", () => {
    expect(parseTyped("12.5")).toBe(12.5);
    expect(parseTyped(" 1,250 ")).toBe(1250);
    expect(parseTyped("15%")).toBeCloseTo(0.15, 12);
    expect(parseTyped("1e3")).toBe(1000);
    expect(parseTyped("true")).toBe(true);
    expect(parseTyped("=A1*2")).toBe("=A1*2");
    expect(parseTyped("'40")).toBe("40");
    expect(parseTyped("")).toBeNull();
    expect(parseTyped("2-1/2")).toBe("2-1/2");
  });

  test("text stays text in the engine: a nominal size is not a date, a schedule code is not a number", () => {
    const wb = blank();
    wb.setContent("S", "A1", "1-1/4");
    wb.setContent("S", "A2", "40");
    wb.setContent("S", "A3", "=HEADROOM.PIPEID(A1,A2)");
    expect(wb.value("S", "A1")).toBe("1-1/4");
    expect(wb.content("S", "A1")).toBe("1-1/4");
    expect(wb.value("S", "A2")).toBe("40");
    expect(wb.value("S", "A3")).toBe(functions.pipeid("1-1/4", "40"));
  });

  test("text typed behind an apostrophe stays text, a leading \"=\" included, as in a spreadsheet (common practice)", () => {
    const wb = blank();
    wb.setTyped("S", "A1", "'=1+1");
    wb.setTyped("S", "A2", "''quoted");
    wb.setTyped("S", "A3", "=1+1");
    expect(wb.value("S", "A1")).toBe("=1+1");
    expect(wb.value("S", "A2")).toBe("'quoted");
    expect(wb.value("S", "A3")).toBe(2);
    // the formula bar shows what to type to get the same cell again
    expect(contentText(wb.content("S", "A1"))).toBe("'=1+1");
    wb.setTyped("S", "A4", contentText(wb.content("S", "A1")));
    expect(wb.value("S", "A4")).toBe("=1+1");
    // and saving the sheet keeps it text: no formula in the data
    const cells = wb.sheetData("S").cells;
    expect(cells.A1.cached).toBe("=1+1");
    expect(isFormula(cells.A1.content)).toBe(false);
    expect(isFormula(cells.A3.content)).toBe(true);
  });

  test("a typed formula with an uppercase exponent computes", () => {
    const wb = blank();
    wb.setTyped("S", "A1", "=1E3*2");
    expect(wb.value("S", "A1")).toBe(2000);
  });

  test("clearing a cell, and undo and redo", () => {
    const wb = blank();
    wb.setTyped("S", "A1", "5");
    wb.setTyped("S", "A1", "");
    expect(wb.value("S", "A1")).toBeNull();
    expect(wb.undo()).toBe(true);
    expect(wb.value("S", "A1")).toBe(5);
    expect(wb.redo()).toBe(true);
    expect(wb.value("S", "A1")).toBeNull();
  });
});

describe("spills, names and reloading", () => {
  test("a spilled block is found with its anchor, and its cells say where they come from", () => {
    const wb = blank();
    wb.setContent("S", "B2", "=HEADROOM.PUMPSIZE(587,37.7)");
    expect(wb.cell("S", "B2").spillRange).toBe("B2:C2");
    expect(wb.cell("S", "C2").spilledFrom).toBe("B2");
    expect(wb.cell("S", "D2").spilledFrom).toBeUndefined();
    expect(wb.toData().sheets[0].cells.B2.spill).toBe("B2:C2");
  });

  test("a supply curve that runs out before max_flow spills a number into every cell, down to the last row", () => {
    const wb = blank();
    wb.setContent("S", "A1", "=HEADROOM.SUPPLYCURVE(58,44,1050,4200,5)");
    expect(wb.cell("S", "A1").spillRange).toBe("A1:B5");
    // 0 psi at 1050 × (58 / 14)^(1/1.85) = 1050 × 4.1429^0.54054 = 2264 gpm [NFPA 291]: before 3150, the fourth row
    for (const row of [4, 5]) {
      expect(wb.value("S", `A${row}`)).toBeCloseTo(2264, 0);
      expect(wb.value("S", `B${row}`)).toBe(0);
    }
    for (const address of ["A1", "B1", "A2", "B2", "A3", "B3", "A4", "B4", "A5", "B5"]) expect(typeof wb.value("S", address), address).toBe("number");
  });

  test("names point at cells, can move, and are read case-insensitively", () => {
    const wb = blank();
    wb.setContent("S", "B3", 72);
    wb.setNameToCell("Supply_Static", "S", "B3");
    expect(wb.nameTarget("supply_static")).toEqual({ kind: "cell", sheet: "S", address: "B3" });
    wb.setNameToCell("Supply_Static", "S", "B4");
    expect(wb.nameTarget("Supply_Static")).toEqual({ kind: "cell", sheet: "S", address: "B4" });
    wb.removeName("Supply_Static");
    expect(wb.nameTarget("Supply_Static")).toBeNull();
  });

  test("loading another workbook keeps the listeners and replaces the sheets", () => {
    const wb = blank();
    let calls = 0;
    wb.onChange(() => calls++);
    wb.load({ sheets: [{ name: "Other", cells: { A1: { content: 3 } } }], names: [] });
    expect(calls).toBeGreaterThan(0);
    expect(wb.sheetNames()).toEqual(["Other"]);
    const before = calls;
    wb.setContent("Other", "A2", "=A1*2");
    expect(calls).toBeGreaterThan(before);
    expect(wb.value("Other", "A2")).toBe(6);
  });

  test("an edit tells its listeners which cells changed: the one written and those it recalculated, nothing else", () => {
    const wb = new PreviewWorkbook({
      sheets: [
        { name: "S", cells: { A1: { content: 2 }, A2: { content: "=A1*3" }, A3: { content: 7 }, B1: { content: "=SEQUENCE(2)" } } },
        { name: "T", cells: { A1: { content: "=S!A2+1" } } },
      ],
      names: [],
    });
    const heard: Array<Record<string, string[]> | "everything"> = [];
    wb.onChange((c) => heard.push(c.cells ? Object.fromEntries([...c.cells].map(([s, set]) => [s, [...set].sort()])) : "everything"));
    wb.setContent("S", "A1", 4);
    // A1 written; A2 = A1 × 3 and T!A1 = S!A2 + 1 follow it (spreadsheet dependency, common practice); A3 and B1:B2 do not
    expect(heard).toEqual([{ S: ["A1", "A2"], T: ["A1"] }]);
    expect(wb.value("T", "A1")).toBe(13); // 4 × 3 + 1 (hand arithmetic)
    heard.length = 0;
    // the same value typed again: still told, for the cell written alone
    wb.setContent("S", "A3", 7);
    expect(heard).toEqual([{ S: ["A3"] }]);
    heard.length = 0;
    wb.activate("T");
    expect(heard).toEqual(["everything"]);
    heard.length = 0;
    wb.undo();
    expect(heard).toEqual(["everything"]);
  });

  test("the spilled blocks are found again after an edit that changes them", () => {
    const wb = blank();
    wb.setContent("S", "A1", 2);
    wb.setContent("S", "A2", 3);
    wb.setContent("S", "A3", 5);
    wb.setContent("S", "B1", "=A1:A2*2");
    expect(wb.spills("S").get("B2")).toEqual({ anchor: "B1", range: "B1:B2" });
    expect(wb.spills("S").get("B3")).toBeUndefined();
    wb.setContent("S", "B1", "=A1:A3*2");
    expect(wb.spills("S").get("B3")).toEqual({ anchor: "B1", range: "B1:B3" });
    expect(wb.cell("S", "B3")).toMatchObject({ spilledFrom: "B1", value: 10 }); // 5 × 2 (hand arithmetic)
  });

  test("a sheet added under a taken name gets the next free one", () => {
    const wb = blank();
    expect(wb.addSheet({ name: "S", cells: {} })).toBe("S 2");
  });
});

describe("showing values", () => {
  test("the template's number formats", () => {
    expect(formatNumber(72, "0.0")).toBe("72.0");
    expect(formatNumber(1234.5, "#,##0")).toBe("1,235");
    expect(formatNumber(-0.04, "0.0")).toBe("0.0"); // our choice: no "-0.0"
    expect(formatNumber(-0.26, "0%")).toBe("-26%");
    expect(formatNumber(2.469, "0.000")).toBe("2.469");
  });

  test("numbers without a format: six significant digits, whole numbers in full", () => {
    expect(generalNumber(42.19290155142652)).toBe("42.1929");
    expect(generalNumber(42.19290155142652, 4)).toBe("42.19");
    expect(generalNumber(1234567)).toBe("1234567");
    expect(generalNumber(0)).toBe("0");
    expect(formatValue({ error: "#VALUE!", message: "x" })).toBe("#VALUE!");
    expect(formatValue(true)).toBe("TRUE");
  });
});

describe("a file that fails to open leaves the open workbook as it was", () => {
  /** A workbook with shading, a width, a merge, a name and an unsaved edit. */
  function edited(): PreviewWorkbook {
    const wb = new PreviewWorkbook({
      sheets: [
        {
          name: "Estimate",
          cells: { A1: { content: "Static pressure (psi)", style: { role: "label" } }, B1: { content: 72, style: { role: "input", numFmt: "0.0" } }, B2: { content: "=B1*2" } },
          columnWidths: { 0: 180 },
          merges: ["A3:C3"],
          rowHeights: { 2: 30 },
        },
      ],
      names: [{ name: "Supply_Static", ref: "Estimate!$B$1" }],
    });
    wb.setTyped("Estimate", "B1", "65"); // the unsaved edit
    return wb;
  }

  function expectUnchanged(wb: PreviewWorkbook): void {
    expect(wb.sheetNames()).toEqual(["Estimate"]);
    expect(wb.value("Estimate", "B1")).toBe(65);
    expect(wb.value("Estimate", "B2")).toBe(130); // 65 × 2 (hand arithmetic)
    expect(wb.style("Estimate", "B1")).toEqual({ role: "input", numFmt: "0.0" });
    expect(wb.columnWidths("Estimate")).toEqual({ 0: 180 });
    expect(wb.mergedRanges("Estimate")).toEqual(["A3:C3"]);
    expect(wb.rowHeights("Estimate")).toEqual({ 2: 30 });
    expect(wb.nameTarget("Supply_Static")).toEqual({ kind: "cell", sheet: "Estimate", address: "B1" });
    // the edit is still the one to undo
    expect(wb.undo()).toBe(true);
    expect(wb.value("Estimate", "B1")).toBe(72);
  }

  test("a sheet beyond the rows the engine holds: refused with the sheet and the row named, nothing replaced", () => {
    const wb = edited();
    let calls = 0;
    wb.onChange(() => calls++);
    const big: WorkbookData = { sheets: [{ name: "Big", cells: { A1: { content: 1, style: { role: "input" } }, A50001: { content: 2 } } }], names: [] };
    expect(() => wb.load(big)).toThrow(/^sheet "Big" reaches row 50,001; the preview holds at most 40,000 rows$/);
    expect(calls).toBe(0);
    expectUnchanged(wb);
  });

  test("two sheets whose names differ only in case: refused by the engine, nothing replaced", () => {
    const wb = edited();
    const bad: WorkbookData = { sheets: [{ name: "Other", cells: { A1: { content: 1, style: { role: "input" } } } }, { name: "OTHER", cells: {} }], names: [] };
    expect(() => wb.load(bad)).toThrow(/OTHER/);
    expectUnchanged(wb);
  });
});

describe("names Excel accepts that the engine reads as cell references", () => {
  // Excel's rule (from memory): a name starts with a letter, "_" or "\", goes on with letters, digits, "." and "_", and
  // is not a cell reference of Excel's grid (columns A to XFD): FLOW1 is column FLOW, beyond XFD, so a name
  const data = (): WorkbookData => ({
    sheets: [{ name: "Estimate", cells: { B1: { content: 1250 }, B2: { content: 60 }, B3: { content: "=Flow1*2" }, B4: { content: "=pump1+Area2+ΔP" }, B5: { content: 7 } } }],
    names: [
      { name: "Flow1", ref: "Estimate!$B$1" },
      { name: "Pump1", ref: "Estimate!$B$2" },
      { name: "Area2", ref: "Estimate!$B$5" },
      { name: "ΔP", ref: "=3" },
    ],
  });

  test("are defined, compute in formulas, and keep their spelling in names, formulas and saved data", () => {
    const wb = new PreviewWorkbook(data());
    expect(wb.value("Estimate", "B3")).toBe(2500); // 1250 × 2 (hand arithmetic)
    expect(wb.value("Estimate", "B4")).toBe(70); // 60 + 7 + 3 (hand arithmetic)
    expect(wb.content("Estimate", "B3")).toBe("=Flow1*2");
    expect(wb.content("Estimate", "B4")).toBe("=Pump1+Area2+ΔP");
    expect(wb.names().map((n) => n.name).sort()).toEqual(["Area2", "Flow1", "Pump1", "ΔP"]);
    expect(wb.nameTarget("flow1")).toEqual({ kind: "cell", sheet: "Estimate", address: "B1" });
    expect(wb.nameValue("ΔP")).toBe(3);
    const saved = wb.toData();
    expect(saved.sheets[0].cells.B3.content).toBe("=Flow1*2");
    expect(saved.names.find((n) => n.name === "Flow1")?.ref).toBe("Estimate!$B$1");
  });

  test("typing a formula with such a name uses it; names can be set, moved and removed", () => {
    const wb = new PreviewWorkbook(data());
    wb.setTyped("Estimate", "C1", "=FLOW1+1");
    expect(wb.value("Estimate", "C1")).toBe(1251); // 1250 + 1 (hand arithmetic)
    expect(wb.content("Estimate", "C1")).toBe("=Flow1+1");
    wb.setNameToCell("Tank10", "Estimate", "B2");
    wb.setTyped("Estimate", "C2", "=Tank10/2");
    expect(wb.value("Estimate", "C2")).toBe(30); // 60 / 2 (hand arithmetic)
    wb.setNameToCell("Flow1", "Estimate", "B5");
    expect(wb.value("Estimate", "B3")).toBe(14); // 7 × 2 (hand arithmetic)
    wb.removeName("Flow1");
    expect(wb.nameTarget("Flow1")).toBeNull();
    expect(wb.names().map((n) => n.name)).not.toContain("Flow1");
  });
});
