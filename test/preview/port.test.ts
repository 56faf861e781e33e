/**
 * The preview side of the Workbook port passes the contract the Excel side passes (test/workbook/contract.ts),
 * over the preview's own workbook and formula engine with the real cell functions.
 */
import { beforeAll, describe, expect, test } from "vitest";
import * as functions from "../../src/functions/functions";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { PreviewPort } from "../../src/preview/port";
import { portContract, type PortHarness } from "../workbook/contract";
import { generatedMetadata } from "./metadataFixture";
import { cellAddress } from "../../src/workbook/a1";
import { demoScenario } from "../../src/workbook/scenario";
import { buildModel, errorAddresses } from "../../src/taskpane/model";

beforeAll(async () => {
  registerHeadroomFunctions(await generatedMetadata(), functions);
});

const INPUT_SHEET = "Inputs";

async function harness(): Promise<PortHarness> {
  const wb = new PreviewWorkbook({ sheets: [{ name: INPUT_SHEET, cells: {} }], names: [] });
  const port = new PreviewPort(wb);
  let nextRow = 1;
  let nextTableRow = 1;
  const cellOf = (name: string) => {
    let t = wb.nameTarget(name);
    if (!t) {
      wb.setContent(INPUT_SHEET, `A${nextRow}`, name);
      wb.setNameToCell(name, INPUT_SHEET, `B${nextRow}`);
      nextRow++;
      t = wb.nameTarget(name);
    }
    if (!t || t.kind !== "cell") throw new Error(`${name} is not one cell`);
    return t;
  };
  return {
    port,
    async put(name, content) {
      const t = cellOf(name);
      wb.setContent(t.sheet, t.address, content);
    },
    async putFormula(name, formula) {
      const t = cellOf(name);
      wb.setContent(t.sheet, t.address, formula);
    },
    async putError(name) {
      const t = cellOf(name);
      // a real cell-function error: a negative flow is refused with a message
      wb.setContent(t.sheet, t.address, "=HEADROOM.SUPPLYAT(-1,72,58,1100)");
    },
    async putTable(name, rows) {
      // tables stand right of the one-cell names, from column D down
      const top = nextTableRow;
      rows.forEach((row, i) => row.forEach((v, j) => wb.setContent(INPUT_SHEET, cellAddress({ row: top - 1 + i, col: 3 + j }), v)));
      const end = cellAddress({ row: top - 2 + rows.length, col: 2 + rows[0].length });
      wb.setName(name, `${INPUT_SHEET}!$D$${top}:$${end.replace(/\d+$/, "")}$${end.replace(/^[A-Z]+/, "")}`);
      nextTableRow += rows.length + 1;
    },
    async putInput(cell, content) {
      wb.setContent(INPUT_SHEET, cell, content);
      wb.setStyle(INPUT_SHEET, cell, { role: "input" });
      return `${INPUT_SHEET}!${cell}`;
    },
    async putCell(cell, content) {
      wb.setContent(INPUT_SHEET, cell, content);
    },
    async remove(name) {
      wb.removeName(name);
    },
    async settle() {
      await new Promise((r) => setTimeout(r, 0));
    },
    async sheetNames() {
      return wb.sheetNames();
    },
    async cells(sheet) {
      const out: Record<string, { value: unknown; formula?: string }> = {};
      for (const v of wb.cells(sheet)) {
        if (v.content === null && v.value === null) continue;
        const value = v.value !== null && typeof v.value === "object" ? v.value.error : v.value;
        out[v.address] = typeof v.content === "string" && v.content.startsWith("=") ? { value, formula: v.content } : { value };
      }
      return out;
    },
    async nameTarget(name) {
      const t = wb.nameTarget(name);
      if (!t || t.kind === "other") return null;
      return { sheet: t.sheet, address: t.kind === "cell" ? t.address : t.range };
    },
  };
}

portContract("preview", harness);

describe("undo after the pane's actions on the preview's workbook", () => {
  /** A workbook with one input named Supply_Static, typed into. */
  function workbook(): { wb: PreviewWorkbook; port: PreviewPort } {
    const wb = new PreviewWorkbook({ sheets: [{ name: INPUT_SHEET, cells: { B1: { content: 72 } } }], names: [{ name: "Supply_Static", ref: `${INPUT_SHEET}!$B$1` }] });
    wb.setTyped(INPUT_SHEET, "B1", "70");
    return { wb, port: new PreviewPort(wb) };
  }

  test("one Ctrl+Z takes a new estimate sheet back: the sheet, its names, the sheet shown; Ctrl+Y brings it again", async () => {
    const { wb, port } = workbook();
    let changes = 0;
    wb.onChange(() => changes++);
    const { sheetName } = await port.insertEstimateSheet("US");
    expect(wb.sheetNames()).toEqual([INPUT_SHEET, sheetName]);
    expect(wb.nameTarget("Supply_Static")?.kind === "cell" && wb.nameTarget("Supply_Static")).toMatchObject({ sheet: sheetName });
    expect(wb.nameTarget("Demand_Flow")).not.toBeNull();
    expect(changes).toBe(1); // the insertion is one change, drawn once

    expect(wb.undo()).toBe(true);
    expect(wb.sheetNames()).toEqual([INPUT_SHEET]);
    expect(wb.nameTarget("Supply_Static")).toEqual({ kind: "cell", sheet: INPUT_SHEET, address: "B1" });
    expect(wb.nameTarget("Demand_Flow")).toBeNull();
    expect(wb.activeSheet).toBe(INPUT_SHEET);
    expect(wb.value(INPUT_SHEET, "B1")).toBe(70); // the edit before the insertion is still there: the next undo

    expect(wb.redo()).toBe(true);
    expect(wb.sheetNames()).toEqual([INPUT_SHEET, sheetName]);
    expect(wb.activeSheet).toBe(sheetName);
    expect(wb.nameTarget("Supply_Static")).toMatchObject({ sheet: sheetName });
    expect(wb.style(sheetName, "B9")?.role).toBe("input"); // the Units cell keeps its shade

    expect(wb.undo()).toBe(true);
    expect(wb.undo()).toBe(true);
    expect(wb.value(INPUT_SHEET, "B1")).toBe(72);
  });

  test("one Ctrl+Z takes a share copy's sheet back", async () => {
    const { wb, port } = workbook();
    // a scenario of the user's own: no demo value left to refuse the copy for
    await port.insertEstimateSheet("US", demoScenario("US"));
    const made = await port.makeShareCopy();
    if (!made.ok) throw new Error(made.reason);
    expect(wb.activeSheet).toBe(made.sheetName);
    expect(wb.undo()).toBe(true);
    expect(wb.sheetNames()).not.toContain(made.sheetName);
    expect(wb.activeSheet).toBe(made.sourceSheet);
  });
});

describe("the pane's messages over the preview's estimate sheet", () => {
  test("text typed into a flow test's input: the message names that input, not the supply names' formula cells", async () => {
    const wb = new PreviewWorkbook({ sheets: [{ name: INPUT_SHEET, cells: {} }], names: [] });
    const port = new PreviewPort(wb);
    const { sheetName } = await port.insertEstimateSheet("US", demoScenario("US"));
    // the input beside the label "Flow measured directly (gpm)", test 1's column
    const label = wb.cells(sheetName).find((c) => typeof c.content === "string" && c.content.startsWith("Flow measured directly"))!;
    const input = `B${label.address.slice(1)}`;
    expect(wb.style(sheetName, input)?.role).toBe("input");
    wb.setTyped(sheetName, input, "1250 gpm");
    const readings = await port.readInputs();
    const asked = errorAddresses(readings);
    expect(asked.length).toBeGreaterThan(0);
    const m = buildModel(readings, port.host, await port.inputsBehind(asked));
    if (m.kind !== "problems") throw new Error(JSON.stringify(m));
    expect(m.problems).toHaveLength(1);
    expect(m.problems[0].cell).toBe(`${sheetName}!${input}`);
    expect(m.problems[0].message).toMatch(new RegExp(`^${sheetName}!${input} holds "1250 gpm": [a-z_]+: got "1250 gpm"; must be a number\\. Change that input; `));
    expect(m.problems[0].message).toMatch(/Supply_TestFlow \(Estimate!B\d+\)/);
  });
});

describe("the preview's walk back to the inputs over a whole column or row", () => {
  // HyperFormula gives B:B as a block ending at row Infinity, 3:3 as one ending at column Infinity
  test(
    "finds the inputs in a column or row a formula reads whole, and ends",
    async () => {
      const { execFile } = await import("node:child_process");
      const script = new URL("./wholeColumnWalk.ts", import.meta.url).pathname;
      // a hang guard, not a timing check: a walk that never ends is killed and the test fails
      const out = await new Promise<string>((resolve, reject) =>
        execFile(process.execPath, ["--import", "tsx", script], { timeout: 15_000 }, (err, stdout) => (err ? reject(err.killed ? new Error("the walk did not end: killed") : err) : resolve(stdout))),
      );
      const behind = JSON.parse(out) as Record<string, Array<{ address: string; reading: unknown }>>;
      expect(behind["S!C1"].map((s) => s.address)).toEqual(["S!A1", "S!B2"]);
      expect(behind["S!C1"][0].reading).toMatchObject({ kind: "text", value: "abc" });
      expect(behind["S!C2"].map((s) => s.address)).toEqual(["S!D3"]);
    },
    30_000,
  );
});
