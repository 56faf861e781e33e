/**
 * A1 addresses and sheet names: the small bits of spreadsheet grammar both Workbook hosts share.
 */

/** Column letters of a 0-based column index: 0 → "A", 25 → "Z", 26 → "AA". */
export function columnLetters(index: number): string {
  let n = index + 1;
  let s = "";
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

/** 0-based column index of column letters: "A" → 0, "AA" → 26. */
export function columnIndex(letters: string): number {
  let n = 0;
  for (const ch of letters.toUpperCase()) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n - 1;
}

export interface CellRef {
  /** 0-based */
  row: number;
  /** 0-based */
  col: number;
}

/** "B10" (or "$B$10") → { row: 9, col: 1 }. Throws on anything else. */
export function parseCell(address: string): CellRef {
  const m = /^\$?([A-Za-z]{1,3})\$?(\d+)$/.exec(address.trim());
  if (!m) throw new Error(`not a cell address: ${address}`);
  return { row: Number(m[2]) - 1, col: columnIndex(m[1]) };
}

/** { row: 9, col: 1 } → "B10". */
export function cellAddress(ref: CellRef): string {
  return `${columnLetters(ref.col)}${ref.row + 1}`;
}

/** Split "Sheet 1!B10" or "'Sheet 1'!$B$10:$C$11" into the sheet name (unquoted) and the range part. */
export function splitSheet(address: string): { sheet: string | null; range: string } {
  const bang = address.lastIndexOf("!");
  if (bang < 0) return { sheet: null, range: address };
  let sheet = address.slice(0, bang);
  if (sheet.startsWith("'") && sheet.endsWith("'")) sheet = sheet.slice(1, -1).replace(/''/g, "'");
  return { sheet, range: address.slice(bang + 1) };
}

/** The top-left cell and size of "B10", "B10:C12", "$B$10:$C$12". */
export function parseRange(range: string): { start: CellRef; rows: number; cols: number } {
  const [a, b] = range.split(":");
  const start = parseCell(a);
  const end = b ? parseCell(b) : start;
  return {
    start: { row: Math.min(start.row, end.row), col: Math.min(start.col, end.col) },
    rows: Math.abs(end.row - start.row) + 1,
    cols: Math.abs(end.col - start.col) + 1,
  };
}

/** A sheet name as it appears in a formula: quoted when it holds anything but letters, digits and underscores. */
export function quoteSheet(name: string): string {
  return /^[A-Za-z_][A-Za-z0-9_]*$/.test(name) ? name : `'${name.replace(/'/g, "''")}'`;
}

/** "Estimate", "B10" → "Estimate!$B$10" (absolute, for a name's reference). */
export function absoluteRef(sheet: string, address: string): string {
  const r = parseRange(address);
  const a = (c: CellRef) => `$${columnLetters(c.col)}$${c.row + 1}`;
  const end = { row: r.start.row + r.rows - 1, col: r.start.col + r.cols - 1 };
  const body = r.rows === 1 && r.cols === 1 ? a(r.start) : `${a(r.start)}:${a(end)}`;
  return `${quoteSheet(sheet)}!${body}`;
}

/** Longest worksheet name Excel accepts. */
export const MAX_SHEET_NAME = 31;

/**
 * A worksheet name not yet taken (compared case-insensitively, as Excel does): `base`, then "base 2", "base 3"...
 * Characters Excel forbids in sheet names ([ ] : * ? / \) become spaces; the result is at most 31 characters.
 */
export function freeSheetName(base: string, taken: readonly string[]): string {
  const clean = base.replace(/[[\]:*?/\\]/g, " ").replace(/^'+|'+$/g, "").trim() || "Sheet";
  const lower = new Set(taken.map((t) => t.toLowerCase()));
  for (let i = 1; ; i++) {
    const suffix = i === 1 ? "" : ` ${i}`;
    const name = clean.slice(0, MAX_SHEET_NAME - suffix.length).trimEnd() + suffix;
    if (!lower.has(name.toLowerCase())) return name;
  }
}
