/**
 * Showing cell values as text, the way a spreadsheet does, for the grid and for tests. Handles the number formats
 * the estimate template uses ("0", "0.0", "0.000", "#,##0", "0%", "0.0%") and a general format for the rest;
 * parsing what a user types into a cell.
 */
import { type CellContent, isFormula, textContent } from "./model";

/** A value as the engine gives it. */
export type ShownValue = number | string | boolean | null | { error: string; message?: string };

/**
 * A number without a format of its own: six significant digits (whole numbers in full up to 10^11), no trailing
 * zeros, plain notation where reasonable; what a spreadsheet's General format shows in a column of ordinary width.
 * The formula bar and saved files keep every digit.
 */
export function generalNumber(x: number, digits = 6): string {
  if (x === 0) return "0";
  const ax = Math.abs(x);
  if (ax >= 1e11 || ax < 1e-6) return x.toExponential(Math.max(1, digits - 2)).replace(/\.?0+e/, "e");
  if (ax >= 10 ** digits) return String(Math.round(x));
  return String(Number(x.toPrecision(digits)));
}

/** Significant digits of a spilled number without a format of its own: a table of results, read at a glance. */
export const SPILL_DIGITS = 4;

/** A number in an Excel number format; unknown formats fall back to the general one. */
export function formatNumber(x: number, numFmt?: string, generalDigits = 6): string {
  const fmt = (numFmt ?? "").trim();
  if (!fmt || fmt.toLowerCase() === "general") return generalNumber(x, generalDigits);
  const m = /^(#,##)?0(?:\.(0+))?(%)?$/.exec(fmt);
  if (!m) return generalNumber(x);
  const decimals = m[2]?.length ?? 0;
  const percent = Boolean(m[3]);
  const v = percent ? x * 100 : x;
  let s = v.toFixed(decimals);
  if (/^-0(\.0*)?$/.test(s)) s = s.slice(1); // no "-0.0"
  if (m[1]) {
    const [int, frac] = s.split(".");
    const sign = int.startsWith("-") ? "-" : "";
    const grouped = int.replace("-", "").replace(/\B(?=(\d{3})+(?!\d))/g, ",");
    s = sign + grouped + (frac !== undefined ? `.${frac}` : "");
  }
  return percent ? `${s}%` : s;
}

/** A value as the cell shows it. */
export function formatValue(v: ShownValue, numFmt?: string, generalDigits = 6): string {
  if (v === null) return "";
  if (typeof v === "number") return formatNumber(v, numFmt, generalDigits);
  if (typeof v === "boolean") return v ? "TRUE" : "FALSE";
  if (typeof v === "string") return v;
  return v.error;
}

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)(e[+-]?\d+)?$/i;
const GROUPED = /^[+-]?\d{1,3}(,\d{3})+(\.\d*)?$/;
const PERCENT = /^([+-]?(\d+(\.\d*)?|\.\d+))\s*%$/;

/**
 * What a user typed into a cell → its content: a formula ("=…"), a number ("12.5", "1,250", "1e3", "15%"), TRUE or
 * FALSE, text (a leading apostrophe keeps what follows text as it is: numeric-looking text, and "'=1+1" the text
 * "=1+1", held behind its apostrophe: ./model's textContent), or null for nothing.
 */
export function parseTyped(typed: string): CellContent {
  if (typed.startsWith("'")) return textContent(typed.slice(1));
  const t = typed.trim();
  if (t === "") return null;
  if (t.startsWith("=") && t.length > 1) return t;
  if (NUMBER.test(t)) return Number(t);
  if (GROUPED.test(t)) return Number(t.replace(/,/g, ""));
  const p = PERCENT.exec(t);
  if (p) return Number(p[1]) / 100;
  const upper = t.toUpperCase();
  if (upper === "TRUE") return true;
  if (upper === "FALSE") return false;
  return typed;
}

/** Content as the formula bar shows it for editing. */
export function contentText(c: CellContent): string {
  if (c === null) return "";
  if (typeof c === "boolean") return c ? "TRUE" : "FALSE";
  if (typeof c === "number") return String(c);
  // numeric-looking text keeps its apostrophe so that committing it again leaves it text (text held behind one,
  // "'=1+1", is shown as it is held)
  if (parseTyped(c) !== c && !isFormula(c)) return `'${c}`;
  return c;
}
