/**
 * The preview's name box: cells, blocks, other sheets' cells and workbook names take the user there; a new name names
 * the selection; anything else is refused with what the box takes (spreadsheet conventions, common practice).
 */
import { beforeAll, describe, expect, test } from "vitest";
import * as functions from "../../src/functions/functions";
import { readNameBox } from "../../src/preview/nameBox";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { generatedMetadata } from "./metadataFixture";

beforeAll(async () => {
  registerHeadroomFunctions(await generatedMetadata(), functions);
});

function workbook(): PreviewWorkbook {
  return new PreviewWorkbook({
    sheets: [
      { name: "Estimate", cells: { B14: { content: 72 } } },
      { name: "Site 2", cells: { C3: { content: 65 } } },
    ],
    names: [
      { name: "Supply_Static", ref: "'Site 2'!$C$3" },
      { name: "Run_Table", ref: "Estimate!$A$5:$T$9" },
      { name: "Margin", ref: "=0.1" },
      { name: "Flow1", ref: "Estimate!$B$14" },
    ],
  });
}

describe("the name box", () => {
  test("goes to cells and blocks of the sheet shown, $ and lower case as typed", () => {
    const wb = workbook();
    expect(readNameBox(wb, "B14", "Estimate")).toEqual({ kind: "go", sheet: "Estimate", range: "B14" });
    expect(readNameBox(wb, " $b$14 ", "Estimate")).toEqual({ kind: "go", sheet: "Estimate", range: "B14" });
    expect(readNameBox(wb, "b3:d7", "Site 2")).toEqual({ kind: "go", sheet: "Site 2", range: "B3:D7" });
  });

  test("goes to another sheet's cells, its name quoted or not, in any case", () => {
    const wb = workbook();
    expect(readNameBox(wb, "estimate!B14", "Site 2")).toEqual({ kind: "go", sheet: "Estimate", range: "B14" });
    expect(readNameBox(wb, "'Site 2'!C3:D4", "Estimate")).toEqual({ kind: "go", sheet: "Site 2", range: "C3:D4" });
  });

  test("goes to what a workbook name points at, on its sheet; Flow1 is a name (FLOW is past column XFD)", () => {
    const wb = workbook();
    expect(readNameBox(wb, "supply_static", "Estimate")).toEqual({ kind: "go", sheet: "Site 2", range: "C3" });
    expect(readNameBox(wb, "Run_Table", "Site 2")).toEqual({ kind: "go", sheet: "Estimate", range: "A5:T9" });
    expect(readNameBox(wb, "Flow1", "Site 2")).toEqual({ kind: "go", sheet: "Estimate", range: "B14" });
  });

  test("a new name names the selection; a cell-like word never does", () => {
    const wb = workbook();
    expect(readNameBox(wb, "Demand_Pressure", "Estimate")).toEqual({ kind: "define", name: "Demand_Pressure" });
    expect(readNameBox(wb, "Tank10", "Estimate")).toEqual({ kind: "define", name: "Tank10" });
    expect(readNameBox(wb, "R1C1", "Estimate").kind).toBe("problem");
    // Excel refuses TRUE and FALSE as names, and names longer than 255 characters (from memory)
    for (const refused of ["TRUE", "false", "A".repeat(10) + "_".repeat(246)]) expect(readNameBox(wb, refused, "Estimate").kind, refused).toBe("problem");
    expect(readNameBox(wb, "A".repeat(10) + "_".repeat(245), "Estimate").kind).toBe("define");
  });

  test("anything else says what the box takes and changes nothing", () => {
    const wb = workbook();
    expect(readNameBox(wb, "Nowhere!B2", "Estimate")).toEqual({ kind: "problem", message: 'Name box: got "Nowhere!B2"; the workbook has no sheet named "Nowhere" (its sheets: Estimate, Site 2).' });
    expect(readNameBox(wb, "B0", "Estimate")).toEqual({
      kind: "problem",
      message: 'Name box: got "B0"; type a cell (B14), a block (B3:D7), a sheet\'s cell (Estimate!B14) or a workbook name (Supply_Static), then press Enter.',
    });
    expect(readNameBox(wb, "B50000", "Estimate").kind).toBe("problem"); // past the 40,000 rows the preview holds
    expect(readNameBox(wb, "two words", "Estimate").kind).toBe("problem");
    expect(readNameBox(wb, "", "Estimate")).toEqual({ kind: "problem", message: expect.stringMatching(/^Name box: empty; type a cell/) });
    expect(readNameBox(wb, "Margin", "Estimate")).toEqual({ kind: "problem", message: "Name box: Margin names a value or a formula (0.1), not cells: there is nothing to select." });
    expect(readNameBox(wb, "Estimate!Z", "Estimate").kind).toBe("problem");
  });
});
