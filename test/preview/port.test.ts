/**
 * The preview side of the Workbook port passes the contract the Excel side passes (test/workbook/contract.ts),
 * over the preview's own workbook and formula engine with the real cell functions.
 */
import { beforeAll } from "vitest";
import * as functions from "../../src/functions/functions";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { PreviewPort } from "../../src/preview/port";
import { portContract, type PortHarness } from "../workbook/contract";
import { generatedMetadata } from "./metadataFixture";
import { cellAddress } from "../../src/workbook/a1";

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
