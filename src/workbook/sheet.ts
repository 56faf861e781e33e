/**
 * An estimate sheet as data: its cells (value or formula, role, number format, spill), the workbook names to define,
 * the chart, the column widths; and what a section of the sheet builds. ./template.ts puts the estimate together
 * from the sections of ./sections.ts; the Excel side (./excel.ts) and the preview (../preview/fromTemplate.ts) write
 * it into their workbooks.
 */
import type { UnitSystem } from "../engine/units";
import { cellAddress, parseCell } from "./a1";
import type { CellRole } from "./look";
import type { WorkbookName } from "./port";

export interface TemplateCell {
  /** A1 address on the estimate sheet, e.g. "B12" */
  address: string;
  role: CellRole;
  /** a constant (an input's demo value, a label) */
  value?: string | number;
  /** a formula starting with "=" (functions in the HEADROOM namespace) */
  formula?: string;
  /** Excel number format, e.g. "0.0" */
  format?: string;
  /**
   * for a formula whose result spills: the size of the spilled block, anchor included, and the number format of each
   * of its columns (hosts format the block; they write nothing into it)
   */
  spill?: { rows: number; cols: number; formats?: string[] };
}

export interface TemplateName {
  name: WorkbookName;
  /** A1 address on the estimate sheet */
  address: string;
  comment: string;
}

export interface ChartSeries {
  name: string;
  /** A1 range of the x (flow) values on the estimate sheet */
  x: string;
  /** A1 range of the y (pressure) values */
  y: string;
  /** a line through the points, or markers alone */
  style: "line" | "marker";
  marker: "none" | "circle" | "square" | "diamond" | "triangle";
  /** hex colour (#RRGGBB) */
  color: string;
}

export interface TemplateChart {
  title: string;
  xTitle: string;
  yTitle: string;
  series: ChartSeries[];
  /** top-left and bottom-right cells the chart covers */
  from: string;
  to: string;
}

/**
 * How the estimate sheet prints: the dependable route to paper. Hosts set it as the sheet's page setup (Excel's page
 * layout, the .xlsx file's print area, print titles and fit).
 */
export interface TemplatePrint {
  /** the printed block, "A1:P89": every cell of the template, spills and chart included (templateExtent) */
  area: string;
  /** the rows printed again at the top of every page, "1:2": the title and the caution */
  titleRows: string;
  /** pages across and down the area is scaled to fit */
  fitWide: number;
  fitTall: number;
  orientation: "portrait" | "landscape";
}

export interface SheetTemplate {
  /** the base of the worksheet name ("Estimate"; a host adds " 2", " 3"... when taken) */
  sheetName: string;
  units: UnitSystem;
  cells: TemplateCell[];
  names: TemplateName[];
  chart: TemplateChart;
  /** column widths in points, by column letter */
  columnWidths: Record<string, number>;
  print: TemplatePrint;
}

/**
 * What one section of the estimate sheet builds from its first row: its cells (each with its number format), the
 * names it defines, how many rows it takes, and `refs`, the addresses later sections refer to (where the demand
 * flow lives, say), so that a section can be replaced by another that gives the same refs.
 */
export interface Section<Refs> {
  cells: TemplateCell[];
  names: TemplateName[];
  /** rows taken, from the first row the section was given */
  rows: number;
  refs: Refs;
}

/** Every cell a spilled formula of the template will fill, anchors excluded: for checks and for hosts. */
export function spillCells(t: Pick<SheetTemplate, "cells">): string[] {
  const out: string[] = [];
  for (const c of t.cells) {
    if (!c.spill) continue;
    const a = parseCell(c.address);
    for (let r = 0; r < c.spill.rows; r++) {
      for (let k = 0; k < c.spill.cols; k++) {
        if (r === 0 && k === 0) continue;
        out.push(cellAddress({ row: a.row + r, col: a.col + k }));
      }
    }
  }
  return out;
}

/** The rectangle the template's cells cover, spills included: "A1:P90". */
export function templateExtent(t: Pick<SheetTemplate, "cells">): { rows: number; cols: number } {
  let rows = 0;
  let cols = 0;
  for (const addr of [...t.cells.map((c) => c.address), ...spillCells(t)]) {
    const a = parseCell(addr);
    rows = Math.max(rows, a.row + 1);
    cols = Math.max(cols, a.col + 1);
  }
  return { rows, cols };
}
