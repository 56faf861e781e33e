/**
 * What the name box above the sheet does with what is typed into it: a cell (B14), a block (B3:D7), either on another
 * sheet (Estimate!B14, 'Site 2'!B3:D7), or a workbook name: go there; a new name: name the selection with it (as a
 * spreadsheet's name box does); anything else: say what it takes.
 */
import { columnIndex, parseRange, splitSheet } from "../workbook/a1";
import type { PreviewWorkbook } from "./workbook";

export type NameBoxAction =
  /** select `range` ("B14" or "B3:D7") on `sheet` */
  | { kind: "go"; sheet: string; range: string }
  /** define `name` on the selection */
  | { kind: "define"; name: string }
  | { kind: "problem"; message: string };

const RANGE = /^\$?([A-Za-z]{1,3})\$?(\d+)(?::\$?([A-Za-z]{1,3})\$?(\d+))?$/;
/** Excel's last column, XFD (from memory): letters past it are no column, so "FLOW1" can be a name */
const LAST_COLUMN = columnIndex("XFD");
/** A name as Excel takes one (from memory): a letter, "_" or "\" first, then letters, digits, "." and "_". */
const NAME = /^[\p{L}_\\][\p{L}\p{N}_.]*$/u;
/** The longest name Excel takes, in characters (from memory). */
const MAX_NAME_LENGTH = 255;

/** Whether Excel would take `text` as a new name (from memory): the pattern above, no cell, R or C, TRUE or FALSE. */
function newName(text: string): boolean {
  return (
    NAME.test(text) &&
    text.length <= MAX_NAME_LENGTH &&
    !cellLike(text) &&
    !/^[RrCc]$/.test(text) &&
    !/^[Rr]\d*[Cc]\d*$/.test(text) &&
    !/^(true|false)$/i.test(text)
  );
}

const WHAT = "type a cell (B14), a block (B3:D7), a sheet's cell (Estimate!B14) or a workbook name (Supply_Static), then press Enter";

/** A block of cells the grid's columns and the engine's rows hold, without "$": "B3:D7", or undefined. */
function block(text: string, maxRows: number): string | undefined {
  const m = RANGE.exec(text.trim());
  if (!m) return undefined;
  const cols = [m[1], m[3] ?? m[1]].map(columnIndex);
  const rows = [Number(m[2]), Number(m[4] ?? m[2])];
  if (cols.some((c) => c > LAST_COLUMN) || rows.some((r) => r < 1 || r > maxRows)) return undefined;
  const r = parseRange(text.trim().replace(/\$/g, ""));
  const start = `${m[1]}${m[2]}`.toUpperCase();
  return r.rows === 1 && r.cols === 1 && !m[3] ? start : text.trim().replace(/\$/g, "").toUpperCase();
}

/** Whether the text reads as cells of Excel's grid (columns A to XFD), whatever the rows: never a name. */
function cellLike(text: string): boolean {
  const m = RANGE.exec(text);
  return !!m && columnIndex(m[1]) <= LAST_COLUMN && (!m[3] || columnIndex(m[3]) <= LAST_COLUMN);
}

/** What typing `typed` into the name box does, with `sheet` shown. */
export function readNameBox(wb: PreviewWorkbook, typed: string, sheet: string): NameBoxAction {
  const text = typed.trim();
  const maxRows = wb.hf.getConfig().maxRows;
  if (!text) return { kind: "problem", message: `Name box: empty; ${WHAT}.` };
  if (text.includes("!")) {
    const { sheet: named, range } = splitSheet(text);
    const found = wb.sheetNames().find((s) => s.toLowerCase() === (named ?? "").toLowerCase());
    if (!found) return { kind: "problem", message: `Name box: got "${text}"; the workbook has no sheet named "${named}" (its sheets: ${wb.sheetNames().join(", ")}).` };
    const b = block(range, maxRows);
    if (!b) return { kind: "problem", message: `Name box: got "${text}"; after "!" comes a cell or a block of ${found} (B14, B3:D7), rows 1 to ${maxRows.toLocaleString("en-US")}.` };
    return { kind: "go", sheet: found, range: b };
  }
  if (RANGE.test(text)) {
    const b = block(text, maxRows);
    if (b) return { kind: "go", sheet, range: b };
  }
  const target = wb.nameTarget(text);
  if (target?.kind === "cell") return { kind: "go", sheet: target.sheet, range: target.address };
  if (target?.kind === "range") return { kind: "go", sheet: target.sheet, range: target.range };
  if (target?.kind === "other") return { kind: "problem", message: `Name box: ${text} names a value or a formula (${target.expression}), not cells: there is nothing to select.` };
  if (newName(text)) return { kind: "define", name: text };
  return { kind: "problem", message: `Name box: got "${text}"; ${WHAT}.` };
}
