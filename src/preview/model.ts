/**
 * A workbook as plain data: what an .xlsx file holds for the preview, what the estimate template produces, and what
 * the preview engine is built from and saved back to. No engine, no DOM, no file format here.
 *
 * Formulas are written as the engine reads them: "=HEADROOM.FRICTION(B2,B3,B4,B5)" (./formulaText maps to and from
 * the file's spelling).
 */
import type { CellRole as TemplateRole } from "../workbook/look";

/**
 * What a cell holds as typed: a number, text, a boolean, a formula ("=…"), or nothing. Text that would read as a
 * formula is written as a user types it, behind an apostrophe: "'=1+1" is the text "=1+1" (and "''x" the text "'x");
 * `textContent` writes text so, `textOf` reads it back. Any other string is text as it stands.
 */
export type CellContent = number | string | boolean | null;

/** True for a formula ("=…"); text beginning with "=" is held behind an apostrophe and is not one. */
export function isFormula(content: CellContent | undefined): content is string {
  return typeof content === "string" && content.startsWith("=");
}

/** Text as a cell's content: behind an apostrophe where it begins with "=" or an apostrophe. */
export function textContent(text: string): string {
  return text.startsWith("=") || text.startsWith("'") ? `'${text}` : text;
}

/** The text a (non-formula) string content stands for: the apostrophe off. */
export function textOf(content: string): string {
  return content.startsWith("'") ? content.slice(1) : content;
}

/** A computed value as a file caches it: a number, text, boolean, or an error code with its message. */
export type CachedValue = number | string | boolean | null | { error: string; message?: string };

/**
 * What a cell is for on an estimate sheet (the template's roles): inputs are the values a user types; computed cells
 * hold formulas; the rest are words around them. The grid and the saved file show each role its own way.
 */
export type CellRole = TemplateRole;

export interface CellStyle {
  role?: CellRole;
  /** Excel number format, e.g. "0.0", "#,##0", "0.00%" */
  numFmt?: string;
  bold?: boolean;
  italic?: boolean;
  /** wrap long text within the cell's width */
  wrap?: boolean;
  /**
   * An input still holding the demo value a new estimate sheet was given: drawn apart (DEMO_LOOK) until the user types
   * into the cell; a share copy is refused while any remains. Sample sheets hold their own values and carry none.
   */
  demo?: boolean;
}

export interface CellData {
  content: CellContent;
  style?: CellStyle;
  /** The last computed value (from a file, or written on save). */
  cached?: CachedValue;
  /** For a formula whose result spills: the block it fills, anchor included ("M48:P51"). */
  spill?: string;
}

/** How a sheet prints, as far as the preview keeps it: the print area and what goes with it. */
export interface PrintSetup {
  /** "A1:P89" (a file may give several blocks, "A1:D9&&F1:H9") */
  area: string;
  /** rows repeated at the top of every page, "1:2" */
  titleRows?: string;
  /** pages across and down the area is scaled to fit, where the sheet is fitted rather than scaled */
  fitWide?: number;
  fitTall?: number;
  orientation?: "portrait" | "landscape";
}

export interface SheetData {
  name: string;
  /** Keyed by A1 address ("B7"). */
  cells: Record<string, CellData>;
  /** Column widths in points, by 0-based column. */
  columnWidths?: Record<number, number>;
  /** Cells spanning several columns, as "A1:F1". */
  merges?: string[];
  /** Row heights in points, by 0-based row (rows not listed have the default height). */
  rowHeights?: Record<number, number>;
  print?: PrintSetup;
}

/** A workbook-scoped defined name: `ref` like "Estimate!$B$8" (or a constant such as "=0"). */
export interface DefinedName {
  name: string;
  ref: string;
}

export interface WorkbookData {
  sheets: SheetData[];
  names: DefinedName[];
  /** name of the sheet shown first */
  activeSheet?: string;
}
