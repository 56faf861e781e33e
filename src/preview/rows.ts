/**
 * Rows inserted or deleted: where what the engine does not keep (styles, row heights, merges, the print area) goes,
 * and the formulas a table's new rows take from their neighbours. Pure functions of addresses and text.
 *
 * A change is `at` (the 0-based index of the first row inserted or deleted) and `count` (rows inserted, or rows
 * deleted when negative).
 */
import { cellAddress, parseCell, parseRange } from "../workbook/a1";

export interface RowChange {
  /** 0-based index of the first row inserted or deleted */
  at: number;
  /** rows inserted (> 0) or deleted (< 0) */
  count: number;
}

/** Where row `row` goes: its new index, or null where it is deleted. */
export function movedRow(row: number, { at, count }: RowChange): number | null {
  if (row < at) return row;
  if (count >= 0) return row + count;
  const n = -count;
  if (row < at + n) return null;
  return row - n;
}

/**
 * Where a block of rows `first`..`last` goes: rows inserted inside it (below its first row) make it taller, rows
 * deleted from it shorter; null where all of it is deleted.
 */
export function movedSpan(first: number, last: number, change: RowChange): [number, number] | null {
  const { at, count } = change;
  if (count >= 0) return [first >= at ? first + count : first, last >= at ? last + count : last];
  const n = -count;
  const f = first < at ? first : first >= at + n ? first - n : at;
  const l = last < at ? last : last >= at + n ? last - n : at - 1;
  return l < f ? null : [f, l];
}

/** Whether deleting rows cuts through the block (some of its rows go, some stay). */
export function cutsThrough(first: number, last: number, { at, count }: RowChange): boolean {
  if (count >= 0) return false;
  const end = at - count - 1;
  const overlaps = first <= end && last >= at;
  const inside = first >= at && last <= end;
  return overlaps && !inside;
}

/** A map keyed by cell address with its rows moved; cells of deleted rows dropped. */
export function movedCells<T>(cells: ReadonlyMap<string, T>, change: RowChange): Map<string, T> {
  const out = new Map<string, T>();
  for (const [address, v] of cells) {
    const a = parseCell(address);
    const row = movedRow(a.row, change);
    if (row !== null) out.set(cellAddress({ row, col: a.col }), v);
  }
  return out;
}

/** Row heights (keyed by 0-based row) with their rows moved. */
export function movedHeights(heights: Readonly<Record<number, number>>, change: RowChange): Record<number, number> {
  const out: Record<number, number> = {};
  for (const [row, h] of Object.entries(heights)) {
    const to = movedRow(Number(row), change);
    if (to !== null) out[to] = h;
  }
  return out;
}

/** "B3:D7" with its rows moved (taller or shorter), or null where all its rows are deleted. */
export function movedRange(range: string, change: RowChange): string | null {
  const r = parseRange(range);
  const span = movedSpan(r.start.row, r.start.row + r.rows - 1, change);
  if (!span) return null;
  const start = cellAddress({ row: span[0], col: r.start.col });
  const end = cellAddress({ row: span[1], col: r.start.col + r.cols - 1 });
  return range.includes(":") || span[0] !== span[1] ? `${start}:${end}` : start;
}

/** A print area ("A1:P89", several blocks joined by "&&") with its rows moved; null where nothing is left. */
export function movedPrintArea(area: string, change: RowChange): string | null {
  const blocks = area
    .split("&&")
    .map((b) => movedRange(b, change))
    .filter((b): b is string => b !== null);
  return blocks.length ? blocks.join("&&") : null;
}

/** Title rows "1:2" (1-based) with their rows moved; null where they are all deleted. */
export function movedTitleRows(rows: string, change: RowChange): string | null {
  const m = /^(\d+):(\d+)$/.exec(rows);
  if (!m) return rows;
  const span = movedSpan(Number(m[1]) - 1, Number(m[2]) - 1, change);
  return span ? `${span[0] + 1}:${span[1] + 1}` : null;
}

/** Cell references in formula text (A1, $A$1, A$1; a sheet's name before them is left as it is). */
const REF = /(^|[^A-Za-z0-9_.$])(\$?)([A-Za-z]{1,3})(\$?)(\d+)(?![A-Za-z0-9_(])/g;

/**
 * Replace each relative row of the formula's references. With `inText`, references spelt inside double-quoted text
 * count too (a table's formula that names its own row in a message, "type yes or no in F66"); without, text is left
 * as it is.
 */
function eachRelativeRow(formula: string, inText: boolean, row: (r: number) => string): string {
  const replace = (part: string) =>
    part.replace(REF, (all, lead: string, colAbs: string, col: string, rowAbs: string, r: string) => (rowAbs ? all : `${lead}${colAbs}${col}${row(Number(r))}`));
  if (inText) return replace(formula);
  // the text between quotes (a quote inside is doubled) stays as it is
  return formula
    .split(/("(?:[^"]|"")*")/)
    .map((part) => (part.startsWith('"') ? part : replace(part)))
    .join("");
}

/** The formula with every relative row reference moved by `by` rows (absolute rows stay). */
export function shiftFormulaRows(formula: string, by: number, inText = false): string {
  return eachRelativeRow(formula, inText, (r) => String(r + by));
}

/** The formula with each relative row written as its distance from `row` (0-based): equal down a table's column. */
export function relativeForm(formula: string, row: number, inText = false): string {
  return eachRelativeRow(formula, inText, (r) => `R[${r - 1 - row}]`);
}

/**
 * Whether the formulas `above` (at 0-based row `aboveRow`) and `below` (at `belowRow`) are one column's formula,
 * the same relative to their rows: "plain" with text in quotes compared as it is, "text" with text naming rows that
 * follow the row ("type yes or no in F66" above "… in F67"), undefined where they differ. The same kind of shift
 * (`shiftFormulaRows`, `inText` for "text") makes the formula of a row between them.
 */
export function sameColumn(above: string, aboveRow: number, below: string, belowRow: number): "plain" | "text" | undefined {
  if (relativeForm(above, aboveRow) === relativeForm(below, belowRow)) return "plain";
  if (relativeForm(above, aboveRow, true) === relativeForm(below, belowRow, true)) return "text";
  return undefined;
}
