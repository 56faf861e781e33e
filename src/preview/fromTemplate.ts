/**
 * The estimate template (../workbook/template.ts) as preview workbook data: its cells with their roles and number
 * formats, its column widths, and its names pointing at the sheet.
 */
import { absoluteRef, columnIndex } from "../workbook/a1";
import { ROLE_STYLES, type SheetTemplate } from "../workbook/template";
import type { CellData, DefinedName, SheetData } from "./model";

/** The template's sheet, named `sheetName` (the host may have had to rename it). */
export function templateSheet(t: SheetTemplate, sheetName = t.sheetName): SheetData {
  const cells: Record<string, CellData> = {};
  for (const c of t.cells) {
    const look = ROLE_STYLES[c.role];
    const content = c.formula ?? (c.value === undefined ? null : c.value);
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
  const columnWidths: Record<number, number> = {};
  for (const [letters, points] of Object.entries(t.columnWidths)) columnWidths[columnIndex(letters)] = points;
  return { name: sheetName, cells, columnWidths };
}

/** The template's names, pointing at `sheetName`. */
export function templateNames(t: SheetTemplate, sheetName = t.sheetName): DefinedName[] {
  return t.names.map((n) => ({ name: n.name, ref: absoluteRef(sheetName, n.address) }));
}
