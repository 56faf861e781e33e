/**
 * How an estimate looks, in one place for every host: the look of each cell role (the Excel side, the preview's grid
 * and its .xlsx files), the colours of the supply/demand picture (the sheet's chart and the pane's plot), the caution
 * text (the sheet and the pane), and the rule that wraps the caution and the longer notes across the first columns
 * of their row (the Excel side and the preview alike).
 */
import { columnLetters, parseCell } from "./a1";

/** What a cell is for: it decides its look. Inputs are the cells a user overwrites. */
export type CellRole = "title" | "caution" | "heading" | "label" | "header" | "input" | "computed" | "note";

/** How each role looks: fill and font colours (#RRGGBB), weight, style. Both hosts use these. */
export const ROLE_STYLES: Record<CellRole, { fill?: string; font?: string; bold?: boolean; italic?: boolean; size?: number }> = {
  title: { bold: true, size: 14, font: "#1B2A3A" },
  caution: { bold: true, fill: "#FDEBD3", font: "#6B2C00" },
  heading: { bold: true, fill: "#DCE6F0", font: "#1B2A3A" },
  label: {},
  header: { bold: true, font: "#3A4A5A" },
  input: { fill: "#FFF2B3", font: "#102F5C" },
  computed: { font: "#1F1F1F" },
  note: { italic: true, font: "#5A5A5A" },
};

/**
 * The colours of the supply/demand picture, shared by the sheet's chart and the pane's plot: the Okabe-Ito palette,
 * which stays distinguishable for the common colour-vision deficiencies; shapes and labels carry the meaning too.
 */
export const PALETTE = {
  supply: "#0072B2",
  band: "#56B4E9",
  sprinklers: "#E69F00",
  demand: "#D55E00",
  pump: "#009E73",
  candidate: "#CC79A7",
  ink: "#1F1F1F",
  grid: "#D9DDE3",
} as const;

/**
 * The look of an input still holding the demo value a new estimate sheet was given, over the input's fill: italic, in
 * a brown apart from the typed inputs' blue. The preview draws it and writes it to files, and reads it back so that the
 * mark survives saving and opening; the user's typing takes it away (src/preview/workbook.ts).
 */
export const DEMO_LOOK = { font: "#8A5A00", italic: true } as const;

/** The note under the caution of a new estimate sheet; a share copy, whose cells are frozen, leaves it out. */
export const INPUTS_NOTE = "Shaded cells are inputs: overwrite the demo values. White cells are calculated by the HEADROOM functions.";

/** The note in its place on a sample's estimate sheet, whose inputs hold the sample's own values, not demo values. */
export const SAMPLE_NOTE =
  "Shaded cells are inputs, holding this sample's values (an invented project): change one and the verdict follows. White cells are calculated by the HEADROOM functions.";

/** Every note that says which cells are inputs: a share copy says FROZEN_NOTE in its place. */
export const INPUT_NOTES: readonly string[] = [INPUTS_NOTE, SAMPLE_NOTE];

/** What a share copy says in the note's place: its cells are values, none to overwrite. */
export const FROZEN_NOTE = "Every cell holds a frozen value: nothing here is an input or recalculates. Change the estimate sheet and make a new copy.";

/** The caution at the top of every estimate sheet and beneath the pane's verdict. */
export const CAUTION =
  "Preliminary estimate only. The adopted codes and standards, the authority having jurisdiction and a licensed " +
  "fire-protection professional decide. Flow tests vary with season, time of day and future development.";

// ─── Long lines ──────────────────────────────────────────────────────────────────────────────────────────────────

/** Width of a column without a width of its own, in points (Excel's default, 8.43 characters). */
export const DEFAULT_COLUMN_WIDTH_PT = 48;

/** Roles whose long text, alone on its row, is wrapped across the first columns instead of running off the sheet. */
const WRAPPED_ROLES: ReadonlySet<CellRole> = new Set<CellRole>(["caution", "note"]);
/** Columns such a line spans: A to D, the label, value, unit and note of the sheet. */
export const WRAP_COLUMNS = 4;
/** Average width of a character of the sheet's text, points (11 pt body text), and one line's height. */
const CHAR_PT = 5.3;
const LINE_PT = 15;
/** Width a wrapped cell loses to its padding, and height its row gets beyond its lines, points. */
const WRAP_PADDING_PT = 8;
const WRAP_EXTRA_PT = 3;

/** The lines `text` takes wrapped within `widthPt` points, and the row height in points that shows every one. */
export function wrappedHeight(text: string, widthPt: number): { lines: number; height: number } {
  const lines = Math.ceil((text.length * CHAR_PT) / (widthPt - WRAP_PADDING_PT));
  return { lines, height: Math.max(1, lines) * LINE_PT + WRAP_EXTRA_PT };
}

/** One wrapped line: its cell, the block it is merged across, and its row's height in points. */
export interface WrappedLine {
  /** the cell holding the text, "A2" */
  address: string;
  /** the merged block, "A2:D2" */
  merge: string;
  /** points */
  height: number;
}

/**
 * The caution and the longer notes of a sheet, each alone in column A of its row: merged across A:D, wrapped (at the
 * top of the cell), with a row height that shows every line, so that the caution reads at a glance in Excel, in the
 * preview and in a saved file. The caution is wrapped even when it fits one line; a note only when it needs two.
 * `columnWidths` in points by column letter (columns not listed have the default width).
 */
export function wrappedLines(
  cells: ReadonlyArray<{ address: string; role: CellRole; value?: string | number }>,
  columnWidths: Readonly<Record<string, number>>,
): WrappedLine[] {
  const rowsUsed = new Map<number, number>();
  for (const c of cells) {
    const row = parseCell(c.address).row;
    rowsUsed.set(row, (rowsUsed.get(row) ?? 0) + 1);
  }
  let span = 0;
  for (let i = 0; i < WRAP_COLUMNS; i++) span += columnWidths[columnLetters(i)] ?? DEFAULT_COLUMN_WIDTH_PT;
  const out: WrappedLine[] = [];
  for (const c of cells) {
    const m = /^A(\d+)$/.exec(c.address);
    if (!m || !WRAPPED_ROLES.has(c.role) || typeof c.value !== "string" || rowsUsed.get(Number(m[1]) - 1) !== 1) continue;
    const { lines, height } = wrappedHeight(c.value, span);
    if (lines < 2 && c.role !== "caution") continue;
    out.push({ address: c.address, merge: `A${m[1]}:${columnLetters(WRAP_COLUMNS - 1)}${m[1]}`, height });
  }
  return out;
}
