/**
 * The estimate template (../workbook/template.ts) as preview workbook data: its cells with their roles and number
 * formats, its column widths, and its names pointing at the sheet.
 */
import { absoluteRef, cellAddress, columnIndex, parseCell } from "../workbook/a1";
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
  const { merges, rowHeights } = wrapLongLines(t, cells, columnWidths);
  return { name: sheetName, cells, columnWidths, merges, rowHeights };
}

/** Roles whose long text, alone on its row, is wrapped across the first columns instead of running off the sheet. */
const WRAPPED_ROLES = new Set(["caution", "note"]);
/** Columns such a line spans: A to D, the label, value, unit and note of the sheet. */
const WRAP_COLUMNS = 4;
/** Average width of a character of the sheet's text, points (11 pt body text), and one line's height. */
const CHAR_PT = 5.3;
const LINE_PT = 15;

/**
 * The caution and the longer notes, each alone in column A of its row: merged across A:D with wrapping and a row
 * height that shows every line, so that the caution reads at a glance in the preview and in the saved file.
 */
function wrapLongLines(
  t: SheetTemplate,
  cells: Record<string, CellData>,
  widths: Record<number, number>,
): { merges: string[]; rowHeights: Record<number, number> } {
  const rowsUsed = new Map<number, number>();
  for (const c of t.cells) {
    const row = Number(/\d+$/.exec(c.address)![0]);
    rowsUsed.set(row, (rowsUsed.get(row) ?? 0) + 1);
  }
  const span = Array.from({ length: WRAP_COLUMNS }, (_, i) => widths[i] ?? 48).reduce((a, b) => a + b, 0);
  const merges: string[] = [];
  const rowHeights: Record<number, number> = {};
  for (const c of t.cells) {
    const m = /^A(\d+)$/.exec(c.address);
    if (!m || !WRAPPED_ROLES.has(c.role) || typeof c.value !== "string" || rowsUsed.get(Number(m[1])) !== 1) continue;
    const lines = Math.ceil((c.value.length * CHAR_PT) / (span - 8));
    if (lines < 2 && c.role !== "caution") continue;
    merges.push(`A${m[1]}:${String.fromCharCode(64 + WRAP_COLUMNS)}${m[1]}`);
    cells[c.address].style = { ...cells[c.address].style, wrap: true };
    rowHeights[Number(m[1]) - 1] = Math.max(1, lines) * LINE_PT + 3;
  }
  return { merges, rowHeights };
}

/** The template's names, pointing at `sheetName`. */
export function templateNames(t: SheetTemplate, sheetName = t.sheetName): DefinedName[] {
  return t.names.map((n) => ({ name: n.name, ref: absoluteRef(sheetName, n.address) }));
}
