/**
 * The estimate template (../workbook/template.ts) as preview workbook data: its cells with their roles and number
 * formats, its column widths, its print setup, and its names pointing at the sheet.
 */
import { absoluteRef, cellAddress, columnIndex, parseCell } from "../workbook/a1";
import { ROLE_STYLES, wrappedLines } from "../workbook/look";
import type { SheetTemplate } from "../workbook/sheet";
import { type CellData, type DefinedName, type SheetData, textContent } from "./model";

/** The template's sheet, named `sheetName` (the host may have had to rename it). */
export function templateSheet(t: SheetTemplate, sheetName = t.sheetName): SheetData {
  const cells: Record<string, CellData> = {};
  for (const c of t.cells) {
    const look = ROLE_STYLES[c.role];
    const content = c.formula ?? (c.value === undefined ? null : typeof c.value === "string" ? textContent(c.value) : c.value);
    cells[c.address] = {
      content: content === "" ? null : content,
      style: {
        role: c.role,
        ...(c.format ? { numFmt: c.format } : {}),
        ...(look?.bold ? { bold: true } : {}),
        ...(look?.italic ? { italic: true } : {}),
      },
    };
  }
  // the cells a spill fills hold nothing but the number format of their column
  for (const c of t.cells) {
    if (!c.spill?.formats) continue;
    const a = parseCell(c.address);
    for (let r = 0; r < c.spill.rows; r++) {
      for (let k = 0; k < c.spill.cols; k++) {
        const format = c.spill.formats[k];
        const address = cellAddress({ row: a.row + r, col: a.col + k });
        if ((r === 0 && k === 0) || !format || cells[address]) continue;
        cells[address] = { content: null, style: { role: "computed", numFmt: format } };
      }
    }
  }
  const columnWidths: Record<number, number> = {};
  for (const [letters, points] of Object.entries(t.columnWidths)) columnWidths[columnIndex(letters)] = points;
  // the caution and the longer notes: merged, wrapped and as tall as their lines, by the rule the Excel side follows
  const merges: string[] = [];
  const rowHeights: Record<number, number> = {};
  for (const line of wrappedLines(t.cells, t.columnWidths)) {
    merges.push(line.merge);
    cells[line.address].style = { ...cells[line.address].style, wrap: true };
    rowHeights[parseCell(line.address).row] = line.height;
  }
  return { name: sheetName, cells, columnWidths, merges, rowHeights, print: { ...t.print } };
}

/**
 * A sheet built from the demo scenario (a new estimate sheet) with its demo values marked: every input holding a value,
 * but the Units cell, which the user chose in the pane.
 */
export function markDemoValues(sheet: SheetData, t: SheetTemplate): SheetData {
  const units = t.names.find((n) => n.name === "Units")?.address;
  const cells: Record<string, CellData> = {};
  for (const [address, c] of Object.entries(sheet.cells)) {
    const demo = c.style?.role === "input" && c.content !== null && address !== units;
    cells[address] = demo ? { ...c, style: { ...c.style, demo: true } } : c;
  }
  return { ...sheet, cells };
}

/** The template's names, pointing at `sheetName`. */
export function templateNames(t: SheetTemplate, sheetName = t.sheetName): DefinedName[] {
  return t.names.map((n) => ({ name: n.name, ref: absoluteRef(sheetName, n.address) }));
}
