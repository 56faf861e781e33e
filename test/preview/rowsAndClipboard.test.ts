/**
 * The preview workbook's rows and clipboard: rows inserted and deleted with formulas, names, spills and the layout
 * following; copy, cut and paste (the workbook's own block, and tab-separated text from elsewhere); each one step that
 * undo and redo take back whole, layout included (a demo value's mark too). Expectations are spreadsheet conventions
 * (common practice) with the arithmetic written beside them.
 */
import { beforeAll, describe, expect, test } from "vitest";
import * as functions from "../../src/functions/functions";
import { fromTabText, toTabText } from "../../src/preview/clipboardText";
import { markDemoValues, templateNames, templateSheet } from "../../src/preview/fromTemplate";
import type { WorkbookData } from "../../src/preview/model";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { movedPrintArea, movedRange, relativeForm, shiftFormulaRows } from "../../src/preview/rows";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { parseRange } from "../../src/workbook/a1";
import { demoScenario } from "../../src/workbook/scenario";
import { estimateTemplate } from "../../src/workbook/template";
import { generatedMetadata } from "./metadataFixture";

beforeAll(async () => {
  registerHeadroomFunctions(await generatedMetadata(), functions);
});

/**
 * A small table: a header, three rows of a length and a computed column, a total under them with a name, a merged
 * caution row, a tall row, a print area with title rows.
 */
function table(): PreviewWorkbook {
  const input = { role: "input" as const, numFmt: "0" };
  const computed = { role: "computed" as const, numFmt: "0.0" };
  const data: WorkbookData = {
    sheets: [
      {
        name: "Run",
        cells: {
          A1: { content: "Length", style: { role: "header" } },
          A2: { content: 10, style: input },
          B2: { content: "=A2*2", style: computed },
          A3: { content: 20, style: input },
          B3: { content: "=A3*2", style: computed },
          A4: { content: 30, style: input },
          B4: { content: "=A4*2", style: computed },
          B6: { content: "=SUM(B2:B4)", style: computed },
          A8: { content: "A caution over three columns", style: { role: "caution", wrap: true } },
        },
        merges: ["A8:C8"],
        rowHeights: { 7: 45 },
        print: { area: "A1:C8", titleRows: "1:1" },
      },
    ],
    names: [{ name: "Run_Total", ref: "Run!$B$6" }],
  };
  return new PreviewWorkbook(data);
}

/** What a test compares before and after: every cell's content and style, the layout, the names. */
function snapshot(wb: PreviewWorkbook, sheet: string) {
  const d = wb.sheetData(sheet);
  return { cells: d.cells, merges: d.merges, heights: d.rowHeights, print: d.print, names: wb.names() };
}

describe("inserting rows", () => {
  test("inside a table: the computed column is filled, the total and its name take the row in, the layout moves", () => {
    const wb = table();
    const before = snapshot(wb, "Run");
    wb.insertRows("Run", 2, 1); // before row 3
    expect(wb.content("Run", "B3")).toBe("=A3*2"); // the computed column's formula, relative to its row
    expect(wb.content("Run", "B4")).toBe("=A4*2"); // the old row 3, one down
    expect(wb.content("Run", "B7")).toBe("=SUM(B2:B5)");
    expect(wb.nameTarget("Run_Total")).toEqual({ kind: "cell", sheet: "Run", address: "B7" });
    expect(wb.style("Run", "A3")).toEqual({ role: "input", numFmt: "0" }); // the row above's look
    expect(wb.style("Run", "B3")).toEqual({ role: "computed", numFmt: "0.0" });
    expect(wb.mergedRanges("Run")).toEqual(["A9:C9"]);
    expect(wb.rowHeights("Run")).toEqual({ 8: 45 });
    expect(wb.sheetData("Run").print).toEqual({ area: "A1:C9", titleRows: "1:1" });
    wb.setTyped("Run", "A3", "15");
    expect(wb.value("Run", "B7")).toBe(150); // (10 + 15 + 20 + 30) × 2 = 150 (hand arithmetic)

    // one undo takes the typing back, the next the whole insertion, layout included; redo brings it again
    expect(wb.undo()).toBe(true);
    expect(wb.value("Run", "B7")).toBe(120); // (10 + 20 + 30) × 2 (hand arithmetic)
    expect(wb.undo()).toBe(true);
    expect(snapshot(wb, "Run")).toEqual(before);
    expect(wb.value("Run", "B6")).toBe(120);
    expect(wb.redo()).toBe(true);
    expect(wb.content("Run", "B3")).toBe("=A3*2");
    expect(wb.mergedRanges("Run")).toEqual(["A9:C9"]);
    expect(wb.style("Run", "A3")).toEqual({ role: "input", numFmt: "0" });
    expect(wb.nameTarget("Run_Total")).toEqual({ kind: "cell", sheet: "Run", address: "B7" });
  });

  test("several rows at once, and rows inside a merged block make it taller", () => {
    const wb = table();
    wb.insertRows("Run", 3, 2); // before row 4: two new rows between 3 and 4
    expect(wb.content("Run", "B4")).toBe("=A4*2");
    expect(wb.content("Run", "B5")).toBe("=A5*2");
    expect(wb.content("Run", "B8")).toBe("=SUM(B2:B6)");
    const wb2 = new PreviewWorkbook({ sheets: [{ name: "S", cells: { A1: { content: "x" } }, merges: ["A1:B3"] }], names: [] });
    wb2.insertRows("S", 1, 1);
    expect(wb2.mergedRanges("S")).toEqual(["A1:B4"]);
  });

  test("past the rows the preview holds: refused with the numbers, nothing changed", () => {
    const wb = table();
    const before = snapshot(wb, "Run");
    expect(() => wb.insertRows("Run", 2, 40_000)).toThrow(/^insert 40,000 rows at row 3: got a sheet of 8 rows; the preview holds at most 40,000 rows$/);
    expect(() => wb.insertRows("Run", -1, 1)).toThrow(/^row: got -1; must be a whole number/);
    expect(() => wb.insertRows("Run", 1, 0)).toThrow(/^count: got 0; must be a whole number of rows, at least 1$/);
    expect(snapshot(wb, "Run")).toEqual(before);
  });
});

describe("deleting rows", () => {
  test("a row of the table: the total shrinks, the layout moves up; undo brings all of it back", () => {
    const wb = table();
    const before = snapshot(wb, "Run");
    wb.deleteRows("Run", 2, 1); // row 3
    expect(wb.content("Run", "B5")).toBe("=SUM(B2:B3)");
    expect(wb.value("Run", "B5")).toBe(80); // (10 + 30) × 2 (hand arithmetic)
    expect(wb.mergedRanges("Run")).toEqual(["A7:C7"]);
    expect(wb.rowHeights("Run")).toEqual({ 6: 45 });
    expect(wb.sheetData("Run").print?.area).toBe("A1:C7");
    expect(wb.nameTarget("Run_Total")).toEqual({ kind: "cell", sheet: "Run", address: "B5" });
    wb.undo();
    expect(snapshot(wb, "Run")).toEqual(before);
    wb.redo();
    expect(wb.value("Run", "B5")).toBe(80);
    expect(wb.mergedRanges("Run")).toEqual(["A7:C7"]);
  });

  test("through part of a merged block: refused, naming the block and its rows; all of it: the merge goes", () => {
    const wb = new PreviewWorkbook({ sheets: [{ name: "S", cells: { A2: { content: "x" } }, merges: ["A2:C3"] }], names: [] });
    expect(() => wb.deleteRows("S", 2, 2)).toThrow(/^delete rows 3 to 4: they cut through the merged cells A2:C3; delete all of its rows \(2 to 3\) or none$/);
    expect(wb.mergedRanges("S")).toEqual(["A2:C3"]);
    wb.deleteRows("S", 1, 2);
    expect(wb.mergedRanges("S")).toEqual([]);
    wb.undo();
    expect(wb.mergedRanges("S")).toEqual(["A2:C3"]);
    expect(wb.value("S", "A2")).toBe("x");
  });

  test("a row inside a spilled block: the spill shrinks, and undo brings it back spilling, not blocked", () => {
    const wb = new PreviewWorkbook({ sheets: [{ name: "S", cells: { A1: { content: 1 }, A2: { content: 2 }, A3: { content: 3 }, A4: { content: 4 }, C1: { content: "=A1:A4*2" } } }], names: [] });
    expect(wb.cell("S", "C1").spillRange).toBe("C1:C4");
    wb.deleteRows("S", 1, 1);
    expect(wb.cell("S", "C1").spillRange).toBe("C1:C3");
    expect(wb.value("S", "C2")).toBe(6); // 3 × 2 (hand arithmetic)
    wb.undo();
    expect(wb.cell("S", "C1").spillRange).toBe("C1:C4");
    expect([1, 2, 3, 4].map((r) => wb.value("S", `C${r}`))).toEqual([2, 4, 6, 8]); // 1..4 × 2 (hand arithmetic)
  });
});

describe("rows and spilling formulas, rows and sheet order", () => {
  test("a row inserted in a column of spilling formulas takes the column's formula as written, and it spills", () => {
    const wb = new PreviewWorkbook({
      sheets: [{ name: "S", cells: { A1: { content: 1 }, A2: { content: 2 }, A3: { content: 3 }, B1: { content: "=A1*{1,2,3}" }, B2: { content: "=A2*{1,2,3}" }, B3: { content: "=A3*{1,2,3}" } } }],
      names: [],
      activeSheet: "S",
    });
    wb.insertRows("S", 1, 1);
    // the rows above and below hold the same formula relative to their rows, so the new row takes it (common practice)
    expect(wb.content("S", "B2")).toBe("=A2*{1,2,3}");
    expect(wb.cell("S", "B2").spillRange).toBe("B2:D2");
    expect(wb.content("S", "B1")).toBe("=A1*{1,2,3}");
    expect(wb.content("S", "B3")).toBe("=A3*{1,2,3}");
    expect(wb.cell("S", "B3").spillRange).toBe("B3:D3");
    expect(wb.value("S", "D3")).toBe(6); // A3 (2, moved down) × 3 (hand arithmetic)
    expect(wb.value("S", "D4")).toBe(9); // A4 (3, moved down) × 3 (hand arithmetic)
    wb.undo();
    expect(wb.content("S", "B2")).toBe("=A2*{1,2,3}");
    expect(wb.value("S", "D2")).toBe(6); // 2 × 3 (hand arithmetic)
    expect(wb.content("S", "B4")).toBeNull();
  });

  test("a sheet named like a number keeps its own cells when rows move on another sheet, and after undo", () => {
    const wb = new PreviewWorkbook({ sheets: [{ name: "Estimate", cells: { A1: { content: "est-a1" }, A2: { content: "est-a2" }, A3: { content: 3 } } }], names: [], activeSheet: "Estimate" });
    wb.addSheet({ name: "7", cells: { A1: { content: "seven-a1" }, A2: { content: 77 } } });
    const cellsOf = (name: string) => Object.fromEntries(Object.entries(wb.contentData().sheets.find((x) => x.name === name)!.cells).map(([a, c]) => [a, c.content]));
    wb.insertRows("Estimate", 1, 1);
    expect(cellsOf("Estimate")).toEqual({ A1: "est-a1", A3: "est-a2", A4: 3 });
    expect(cellsOf("7")).toEqual({ A1: "seven-a1", A2: 77 });
    wb.undo();
    expect(cellsOf("Estimate")).toEqual({ A1: "est-a1", A2: "est-a2", A3: 3 });
    expect(cellsOf("7")).toEqual({ A1: "seven-a1", A2: 77 });
    wb.deleteRows("7", 0, 1);
    expect(cellsOf("Estimate")).toEqual({ A1: "est-a1", A2: "est-a2", A3: 3 });
    expect(cellsOf("7")).toEqual({ A1: 77 });
  });
});

describe("the pipe-run table of a new estimate sheet", () => {
  function estimate(): { wb: PreviewWorkbook; sheet: string; anchor: string } {
    const t = estimateTemplate(demoScenario("US"));
    const wb = new PreviewWorkbook({ sheets: [templateSheet(t)], names: templateNames(t) });
    const sheet = t.sheetName;
    const anchor = wb.cells(sheet).find((c) => typeof c.content === "string" && c.content.startsWith("=HEADROOM.PIPERUN("))!.address;
    return { wb, sheet, anchor };
  }

  test("a row inserted inside it is a segment: PIPERUN spills over it, and the run's friction adds its loss", () => {
    const { wb, sheet, anchor } = estimate();
    const spill = parseRange(wb.cell(sheet, anchor).spillRange!);
    const segments = spill.rows;
    const first = spill.start.row; // 0-based row of the first segment
    const frictionBefore = wb.nameValue("Pressure_RunFriction") as number;
    const demandBefore = wb.nameValue("Demand_Pressure") as number;
    const before = snapshot(wb, sheet);

    wb.insertRows(sheet, first + 1, 1); // between the first and the second segment
    const row = first + 2; // 1-based row of the new segment
    expect(wb.cell(sheet, anchor).spillRange).toBe(`N${first + 1}:Q${first + segments + 1}`);
    // the computed columns are filled: flow, inside diameter, C, fitting length, velocity, friction rate, check
    for (const col of ["H", "I", "K", "R", "S"]) expect(wb.content(sheet, `${col}${row}`), col).toBe(shiftFormulaRows(wb.content(sheet, `${col}${row - 1}`) as string, 1));
    expect(wb.content(sheet, `G${row}`)).toBe(shiftFormulaRows(wb.content(sheet, `G${row - 1}`) as string, 1, true)); // its message names its own row
    expect(wb.content(sheet, `T${row}`)).toBe(shiftFormulaRows(wb.content(sheet, `T${row - 1}`) as string, 1)); // the limit's cell stays
    // a segment typed into it: 4 in schedule 10 steel, 50 ft, no fittings, level, no fixed loss
    for (const [col, typed] of Object.entries({ A: "New segment", B: "4", C: "10", D: "steel", E: "", F: "no", J: "50", L: "0", M: "0" })) wb.setTyped(sheet, `${col}${row}`, typed);
    const segmentLoss = wb.value(sheet, `N${row}`) as number;
    expect(typeof segmentLoss).toBe("number");
    expect(segmentLoss).toBeGreaterThan(0);
    // the run's friction is the sum of its segments' (hand arithmetic: the SUM over the N column, the new row in it)
    let sum = 0;
    for (let r = first + 1; r <= first + segments + 1; r++) sum += wb.value(sheet, `N${r}`) as number;
    expect(wb.nameValue("Pressure_RunFriction")).toBeCloseTo(sum, 9);
    expect(wb.nameValue("Pressure_RunFriction")).toBeCloseTo(frictionBefore + segmentLoss, 9);
    expect(wb.nameValue("Demand_Pressure") as number).toBeGreaterThan(demandBefore);

    // undo the typing and the row: the sheet is as it was, its spill and its numbers too
    for (let i = 0; i < 10; i++) expect(wb.undo()).toBe(true); // nine typed cells and the insertion
    expect(wb.cell(sheet, anchor).spillRange).toBe(`N${first + 1}:Q${first + segments}`);
    expect(wb.nameValue("Demand_Pressure")).toBe(demandBefore);
    expect(wb.nameValue("Pressure_RunFriction")).toBe(frictionBefore);
    expect(snapshot(wb, sheet)).toEqual(before);
  });

  test("deleting a segment's row: PIPERUN spills over one row fewer; undo brings it back", () => {
    const { wb, sheet, anchor } = estimate();
    const spill = wb.cell(sheet, anchor).spillRange!;
    const r = parseRange(spill);
    const before = snapshot(wb, sheet);
    wb.deleteRows(sheet, r.start.row + 1, 1);
    expect(wb.cell(sheet, anchor).spillRange).toBe(movedRange(spill, { at: r.start.row + 1, count: -1 }));
    expect(typeof wb.nameValue("Demand_Pressure")).toBe("number");
    wb.undo();
    expect(wb.cell(sheet, anchor).spillRange).toBe(spill);
    expect(snapshot(wb, sheet)).toEqual(before);
  });
});

describe("a demo value's mark and undo", () => {
  test("typing over a demo value takes its mark; Ctrl+Z brings value and mark back, Ctrl+Y takes both again", () => {
    const t = estimateTemplate(demoScenario("US"));
    const sheet = markDemoValues(templateSheet(t), t);
    const wb = new PreviewWorkbook({ sheets: [sheet], names: templateNames(t) });
    const { address } = wb.cells(sheet.name).find((c) => c.style?.demo && typeof c.value === "number")!;
    const demoValue = wb.value(sheet.name, address);
    expect(wb.style(sheet.name, address)?.demo).toBe(true);
    wb.setTyped(sheet.name, address, "65");
    expect(wb.style(sheet.name, address)?.demo).toBeUndefined();
    wb.undo();
    expect(wb.value(sheet.name, address)).toBe(demoValue);
    expect(wb.style(sheet.name, address)?.demo).toBe(true);
    wb.redo();
    expect(wb.value(sheet.name, address)).toBe(65);
    expect(wb.style(sheet.name, address)?.demo).toBeUndefined();
  });

  test("the layout steps ride on the engine's undo entries: they survive the undo limit and a new edit clears redo", () => {
    const wb = new PreviewWorkbook({ sheets: [{ name: "S", cells: { A1: { content: 1, style: { role: "input", demo: true } } } }], names: [] });
    wb.setTyped("S", "A1", "2");
    for (let i = 0; i < 30; i++) wb.setTyped("S", "B1", String(i)); // past the engine's undo limit (20)
    while (wb.undo());
    // the demo step fell off the history with its engine entry: A1 stays 2 and unmarked, as the engine has it
    expect(wb.value("S", "A1")).toBe(2);
    expect(wb.style("S", "A1")?.demo).toBeUndefined();
    const wb2 = new PreviewWorkbook({ sheets: [{ name: "S", cells: { A1: { content: 1, style: { role: "input", demo: true } } } }], names: [] });
    wb2.setTyped("S", "A1", "2");
    wb2.undo();
    wb2.setTyped("S", "B1", "3"); // a new step: nothing to redo
    expect(wb2.redo()).toBe(false);
    expect(wb2.style("S", "A1")?.demo).toBe(true);
  });
});

describe("copy, cut and paste", () => {
  test("a copied block pastes with its references moved and its styles, as one step", () => {
    const wb = table();
    const text = wb.copyRange("Run", "A2:B3");
    expect(text).toBe("10\t20.0\r\n20\t40.0"); // what the cells show, formats applied
    expect(wb.clipboardText).toBe(text);
    wb.paste("Run", "D10");
    expect(wb.content("Run", "E10")).toBe("=D10*2");
    expect(wb.content("Run", "E11")).toBe("=D11*2");
    expect(wb.value("Run", "E11")).toBe(40); // 20 × 2 (hand arithmetic)
    expect(wb.style("Run", "D10")).toEqual({ role: "input", numFmt: "0" });
    expect(wb.style("Run", "E11")).toEqual({ role: "computed", numFmt: "0.0" });
    wb.undo();
    expect(wb.content("Run", "E10")).toBeNull();
    expect(wb.style("Run", "D10")).toBeUndefined();
    wb.redo();
    expect(wb.content("Run", "E10")).toBe("=D10*2");
    expect(wb.style("Run", "D10")).toEqual({ role: "input", numFmt: "0" });
  });

  test("a cut block moves: formulas that refer to it follow, its old cells are empty and plain", () => {
    const wb = table();
    wb.cutRange("Run", "A2:A4");
    wb.paste("Run", "D2");
    expect(wb.content("Run", "B2")).toBe("=D2*2");
    expect(wb.value("Run", "B6")).toBe(120); // (10 + 20 + 30) × 2, moved, not lost (hand arithmetic)
    expect(wb.content("Run", "A2")).toBeNull();
    expect(wb.style("Run", "A2")).toBeUndefined();
    expect(wb.style("Run", "D2")).toEqual({ role: "input", numFmt: "0" });
    expect(wb.clipboardText).toBeNull();
    expect(() => wb.paste("Run", "F2")).toThrow(/^paste: nothing copied yet/);
    wb.undo();
    expect(wb.content("Run", "B2")).toBe("=A2*2");
    expect(wb.style("Run", "A2")).toEqual({ role: "input", numFmt: "0" });
    expect(wb.style("Run", "D2")).toBeUndefined();
  });

  test("pasting onto a demo value makes it the user's; undo brings the mark back", () => {
    const wb = new PreviewWorkbook({ sheets: [{ name: "S", cells: { A1: { content: 5 }, B1: { content: 1, style: { role: "input", demo: true } } } }], names: [] });
    wb.copyRange("S", "A1");
    wb.paste("S", "B1");
    expect(wb.value("S", "B1")).toBe(5);
    expect(wb.style("S", "B1")).toBeUndefined();
    wb.pasteText("S", "B1", "7");
    wb.undo();
    wb.undo();
    expect(wb.style("S", "B1")).toEqual({ role: "input", demo: true });
    wb.setStyle("S", "C1", { role: "input", demo: true });
    wb.pasteText("S", "C1", "8");
    expect(wb.style("S", "C1")).toEqual({ role: "input" });
  });

  test("a cut followed by an edit: the workbook's block is gone, and its text pastes as typed", () => {
    const wb = new PreviewWorkbook({ sheets: [{ name: "S", cells: { A1: { content: 1, style: { role: "input" } }, A2: { content: 2 }, B1: { content: "=A1*10" } } }], names: [], activeSheet: "S" });
    const text = wb.cutRange("S", "A1:A2");
    expect(wb.clipboardText).toBe(text);
    wb.setTyped("S", "D5", "x");
    // the edit ends the cut (common practice): nothing of the workbook's own to paste, the text is what remains
    expect(wb.clipboardText).toBeNull();
    expect(() => wb.paste("S", "C1")).toThrow("paste: nothing copied yet; select cells and copy them first");
    wb.pasteText("S", "C1", text);
    expect(wb.value("S", "C1")).toBe(1);
    expect(wb.value("S", "C2")).toBe(2);
    expect(wb.content("S", "A1")).toBe(1); // the cut cells stay where they were
    expect(wb.value("S", "B1")).toBe(10); // 1 × 10 (hand arithmetic)
  });

  test("tab-separated text from elsewhere: each cell as typed, one step to undo", () => {
    const wb = new PreviewWorkbook({ sheets: [{ name: "S", cells: {} }], names: [] });
    wb.setTyped("S", "A1", "keep");
    // 3 rows of 2 cells, whatever the text's tabs and line ends inside quotes
    expect(wb.pasteText("S", "B2", "1,250\t=B2*2\r\n2-1/2\tTRUE\r\n'40\t\"two\tcells\"\r\n")).toEqual({ rows: 3, cols: 2 });
    expect(wb.value("S", "B2")).toBe(1250);
    expect(wb.value("S", "C2")).toBe(2500); // 1250 × 2 (hand arithmetic)
    expect(wb.value("S", "B3")).toBe("2-1/2"); // a nominal size stays text (common practice)
    expect(wb.value("S", "C3")).toBe(true);
    expect(wb.value("S", "B4")).toBe("40");
    expect(wb.value("S", "C4")).toBe("two\tcells");
    wb.undo();
    for (const a of ["B2", "C2", "B3", "C3", "B4", "C4"]) expect(wb.content("S", a), a).toBeNull();
    expect(wb.value("S", "A1")).toBe("keep");
    // a quoted cell with a line break in it is one cell: 1 row of 2
    expect(wb.pasteText("S", "B2", '"line\nbreak"\t5')).toEqual({ rows: 1, cols: 2 });
    expect(wb.pasteText("S", "B2", "")).toEqual({ rows: 0, cols: 0 });
  });

  test("tab-separated text: quoting and line ends (common practice)", () => {
    expect(fromTabText("a\tb\r\nc\td\r\n")).toEqual([["a", "b"], ["c", "d"]]);
    expect(fromTabText("a\n\nb")).toEqual([["a"], [""], ["b"]]);
    expect(fromTabText('"x ""y""\nz"\t5')).toEqual([['x "y"\nz', "5"]]);
    expect(fromTabText('5 "in"\t6')).toEqual([['5 "in"', "6"]]);
    const rows = [["a\tb", 'say "hi"'], ["", "line\nbreak"]];
    expect(fromTabText(toTabText(rows))).toEqual(rows);
  });
});

describe("where the layout goes (pure)", () => {
  test("blocks, print areas and formulas", () => {
    expect(movedRange("B3:D7", { at: 4, count: 2 })).toBe("B3:D9");
    expect(movedRange("B3:D7", { at: 0, count: 1 })).toBe("B4:D8");
    expect(movedRange("B3:D7", { at: 2, count: -5 })).toBeNull();
    expect(movedRange("B3:D7", { at: 3, count: -2 })).toBe("B3:D5");
    expect(movedPrintArea("A1:D9&&F1:H3", { at: 5, count: -10 })).toBe("A1:D5&&F1:H3");
    expect(shiftFormulaRows('=IF(F66="yes",$B$9+G66,"type yes in F66")', 1, true)).toBe('=IF(F67="yes",$B$9+G67,"type yes in F67")');
    expect(relativeForm("=A3*2+$B$1", 2)).toBe(relativeForm("=A4*2+$B$1", 3));
    expect(relativeForm("=LOG10(A3)", 2)).toBe("=LOG10(AR[0])");
  });
});
