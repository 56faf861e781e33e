/**
 * The Workbook port (../workbook/port.ts) over the preview's own workbook (./workbook.ts): the same task pane runs
 * beside the preview grid as in Excel, reading the same named cells, and its two actions work on the preview's sheets.
 *
 * It passes the same contract tests as the Excel side (test/workbook/contract.ts, run by test/preview/port.test.ts).
 */
import type { UnitSystem } from "../engine/units";
import { cellAddress, freeSheetName, parseCell, parseRange, splitSheet } from "../workbook/a1";
import {
  CANDIDATES_NAME,
  INPUT_NAMES,
  type InsertResult,
  type InputName,
  SHARE_REFUSAL_LIST,
  SHARE_STAMP_ROWS,
  SOURCE_WALK_LIMIT,
  type Reading,
  type Readings,
  type ShareCopyResult,
  type SourceInput,
  type TableReading,
  type WorkbookName,
  type WorkbookPort,
  candidatesShapeProblem,
  demoRefusal,
  isoDate,
  shareRefusal,
  shareStamp,
} from "../workbook/port";
import { demoScenario, type Scenario } from "../workbook/scenario";
import { estimateTemplate } from "../workbook/template";
import { markDemoValues, templateNames, templateSheet } from "./fromTemplate";
import { type CellData, type CellStyle, type SheetData, textContent } from "./model";
import { FROZEN_NOTE, INPUT_NOTES } from "../workbook/look";
import type { PreviewWorkbook } from "./workbook";

export class PreviewPort implements WorkbookPort {
  readonly host = "preview" as const;
  /** `now` gives the date a share copy is stamped with (a parameter for tests). */
  constructor(
    readonly workbook: PreviewWorkbook,
    private readonly now: () => Date = () => new Date(),
  ) {}

  async readInputs(): Promise<Readings> {
    const out = {} as Readings;
    for (const name of INPUT_NAMES) out[name] = this.read(name);
    out[CANDIDATES_NAME] = this.readTable(CANDIDATES_NAME);
    return out;
  }

  /** A table name's cells, row by row, each read as a one-cell name is. */
  private readTable(name: string): TableReading {
    const wb = this.workbook;
    const target = wb.nameTarget(name);
    if (!target) return { kind: "missing" };
    if (target.kind === "other") return { kind: "invalid", reason: `${name} refers to ${target.expression}, not a block of cells of this workbook` };
    const range = target.kind === "cell" ? target.address : target.range;
    const address = `${target.sheet}!${range}`;
    const r = parseRange(range);
    const problem = candidatesShapeProblem(r.rows, r.cols, address);
    if (problem) return { kind: "invalid", reason: problem, address };
    const rows: Reading[][] = [];
    for (let i = 0; i < r.rows; i++) {
      const row: Reading[] = [];
      for (let j = 0; j < r.cols; j++) {
        const at = cellAddress({ row: r.start.row + i, col: r.start.col + j });
        row.push(shownReading(wb.value(target.sheet, at), `${target.sheet}!${at}`));
      }
      rows.push(row);
    }
    return { kind: "table", address, rows };
  }

  private read(name: InputName): Reading {
    const wb = this.workbook;
    const target = wb.nameTarget(name);
    if (!target) return { kind: "missing" };
    if (target.kind === "range") {
      return {
        kind: "invalid",
        reason: `${name} refers to several cells (${target.sheet}!${target.range}); point it at one cell`,
        address: `${target.sheet}!${target.range}`,
      };
    }
    const address = target.kind === "cell" ? `${target.sheet}!${target.address}` : undefined;
    const value = target.kind === "cell" ? wb.value(target.sheet, target.address) : wb.nameValue(name);
    if (target.kind === "other" && value !== null && typeof value === "object" && value.error === "#REF!") {
      return { kind: "invalid", reason: `${name} refers to ${target.expression}, which is not a cell of this workbook` };
    }
    return shownReading(value, address);
  }

  async inputsBehind(addresses: readonly string[]): Promise<Record<string, SourceInput[]>> {
    const out: Record<string, SourceInput[]> = {};
    for (const a of addresses) out[a] = this.sourcesOf(a);
    return out;
  }

  /**
   * The input cells behind one cell, breadth first through the engine's precedents (HyperFormula's
   * getCellPrecedents: the cells and blocks a formula reads), a cell a spill fills standing for its anchor.
   */
  private sourcesOf(address: string): SourceInput[] {
    const wb = this.workbook;
    const hf = wb.hf;
    const { sheet, range } = splitSheet(address);
    if (sheet === null || !wb.sheetNames().includes(sheet)) return [];
    const spills = new Map<string, ReturnType<PreviewWorkbook["spills"]>>();
    const spillsOf = (s: string) => spills.get(s) ?? spills.set(s, wb.spills(s)).get(s)!;
    const sizes = new Map<number, { width: number; height: number }>();
    const sizeOf = (id: number) => sizes.get(id) ?? sizes.set(id, hf.getSheetDimensions(id)).get(id)!;
    const start = cellAddress(parseRange(range.replace(/\$/g, "")).start);
    const seen = new Set<string>([`${sheet}!${start}`]);
    const queue: Array<[string, string]> = [[sheet, start]];
    const push = (s: string, a: string) => {
      const key = `${s}!${a}`;
      if (seen.has(key) || seen.size >= SOURCE_WALK_LIMIT) return;
      seen.add(key);
      queue.push([s, a]);
    };
    const found: SourceInput[] = [];
    for (let i = 0; i < queue.length; i++) {
      const [s, a] = queue[i];
      const key = `${s}!${a}`;
      if (i > 0 && wb.style(s, a)?.role === "input") {
        found.push({ address: key, reading: shownReading(wb.value(s, a), key) });
        continue;
      }
      const spill = spillsOf(s).get(a);
      if (spill && spill.anchor !== a) {
        push(s, spill.anchor);
        continue;
      }
      const id = hf.getSheetId(s);
      if (id === undefined) continue;
      const at = { sheet: id, ...parseCell(a) };
      if (!hf.doesCellHaveFormula(at)) continue;
      for (const p of hf.getCellPrecedents(at)) {
        const [from, to] = "start" in p ? [p.start, p.end] : [p, p];
        const name = hf.getSheetName(from.sheet);
        if (name === undefined) continue;
        // a whole column (B:B) ends at row Infinity, a whole row (3:3) at column Infinity: the sheet's filled part
        // bounds the block, and the walk's limit ends it
        const { width, height } = sizeOf(from.sheet);
        const lastRow = Math.min(to.row, height - 1);
        const lastCol = Math.min(to.col, width - 1);
        for (let row = from.row; row <= lastRow && seen.size < SOURCE_WALK_LIMIT; row++)
          for (let col = from.col; col <= lastCol && seen.size < SOURCE_WALK_LIMIT; col++) push(name, cellAddress({ row, col }));
      }
    }
    return found;
  }

  async subscribe(onChange: () => void): Promise<() => Promise<void>> {
    // bursts of engine events (one edit recalculates many cells) reach the subscriber as one call
    let pending = false;
    let active = true;
    const stop = this.workbook.onChange(() => {
      if (pending || !active) return;
      pending = true;
      queueMicrotask(() => {
        pending = false;
        if (active) onChange();
      });
    });
    return async () => {
      active = false;
      stop();
    };
  }

  async insertEstimateSheet(units: UnitSystem, scenario?: Scenario): Promise<InsertResult> {
    const wb = this.workbook;
    const t = estimateTemplate(scenario ?? demoScenario(units));
    const data = templateSheet(t, freeSheetName(t.sheetName, wb.sheetNames()));
    // the sheet, its names and showing it: one step, which one undo takes back
    return wb.group(() => {
      // the demo's values are invented: marked until the user types over them (a given scenario's are its own)
      const sheetName = wb.addSheet(scenario ? data : markDemoValues(data, t));
      const namesMoved: WorkbookName[] = [];
      for (const n of templateNames(t, sheetName)) {
        const before = wb.nameTarget(n.name);
        if (before) namesMoved.push(n.name as WorkbookName);
        wb.setName(n.name, n.ref);
      }
      wb.activate(sheetName);
      return { sheetName, namesMoved };
    });
  }

  /** The sheet a share copy is made of: the one Supply_Static refers to, else the active one. */
  estimateSheet(): string {
    const t = this.workbook.nameTarget("Supply_Static");
    return t && (t.kind === "cell" || t.kind === "range") ? t.sheet : this.workbook.activeSheet;
  }

  /** The share copy's sheet data (not added to the workbook), or why there is none. */
  shareCopyData(): { ok: true; sheet: SheetData; sourceSheet: string } | { ok: false; reason: string } {
    const wb = this.workbook;
    const source = this.estimateSheet();
    const views = wb.cells(source);
    const bad = views.filter((v) => v.value !== null && typeof v.value === "object");
    if (bad.length) {
      const shown = bad.slice(0, SHARE_REFUSAL_LIST).map((v) => [v.address, (v.value as { error: string }).error] as [string, string]);
      return { ok: false, reason: shareRefusal(shown, bad.length) };
    }
    const demo = views.filter((v) => v.style?.demo).map((v) => v.address);
    if (demo.length) return { ok: false, reason: demoRefusal(demo.slice(0, SHARE_REFUSAL_LIST), demo.length) };
    const cells: Record<string, CellData> = {};
    const stampAt = "A1";
    cells[stampAt] = { content: shareStamp(source, this.now()), style: { role: "caution", bold: true } };
    for (const v of views) {
      const a = parseCell(v.address);
      const to = cellAddress({ row: a.row + SHARE_STAMP_ROWS, col: a.col });
      // frozen: the note asking to overwrite the inputs says there are none
      const value = typeof v.content === "string" && INPUT_NOTES.includes(v.content) ? FROZEN_NOTE : (v.value as number | string | boolean | null);
      const style = frozenStyle(v.style);
      // text as text: "=HYPERLINK(…)" shown by a cell is held behind an apostrophe, never a live formula in the copy
      cells[to] = { content: typeof value === "string" ? textContent(value) : value, ...(style ? { style } : {}) };
    }
    const merges = wb.mergedRanges(source).map((m) =>
      m
        .split(":")
        .map((x) => {
          const a = parseCell(x);
          return cellAddress({ row: a.row + SHARE_STAMP_ROWS, col: a.col });
        })
        .join(":"),
    );
    const heights = Object.fromEntries(Object.entries(wb.rowHeights(source)).map(([r, h]) => [Number(r) + SHARE_STAMP_ROWS, h]));
    const sheet: SheetData = {
      name: freeSheetName(`${source} values ${isoDate(this.now())}`, wb.sheetNames()),
      cells,
      columnWidths: { ...wb.columnWidths(source) },
      ...(merges.length ? { merges } : {}),
      ...(Object.keys(heights).length ? { rowHeights: heights } : {}),
    };
    return { ok: true, sheet, sourceSheet: source };
  }

  async makeShareCopy(): Promise<ShareCopyResult> {
    const made = this.shareCopyData();
    if (!made.ok) return made;
    const wb = this.workbook;
    const sheetName = wb.group(() => {
      const name = wb.addSheet(made.sheet);
      wb.activate(name);
      return name;
    });
    return { ok: true, sheetName, sourceSheet: made.sourceSheet };
  }
}

/**
 * A cell's style in a share copy: an input or a calculated cell is a frozen value like any other, neither shaded nor
 * marked as calculated; number formats stay.
 */
function frozenStyle(style: CellStyle | undefined): CellStyle | undefined {
  if (!style) return undefined;
  const kept: CellStyle = { ...style };
  delete kept.demo;
  if (kept.role === "input" || kept.role === "computed") delete kept.role;
  return Object.keys(kept).length ? kept : undefined;
}

/** What a cell shows, as a reading. */
function shownReading(value: ReturnType<PreviewWorkbook["value"]>, address: string | undefined): Reading {
  const at = address ? { address } : {};
  if (value === null) return { kind: "empty", ...at };
  if (typeof value === "number") return { kind: "number", value, ...at };
  if (typeof value === "string") return { kind: "text", value, ...at };
  if (typeof value === "boolean") return { kind: "text", value: value ? "TRUE" : "FALSE", ...at };
  return { kind: "error", code: value.error, ...(value.message ? { message: value.message } : {}), ...at };
}
