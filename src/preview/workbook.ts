/**
 * The preview's workbook: sheets, cells, styles and defined names over one HyperFormula engine that runs Headroom's
 * cell functions (./plugin). Built from plain workbook data (./model) and saved back to it with cached values.
 *
 * Call ./plugin's registerHeadroomFunctions (with the CustomFunctions stand-in installed) before creating one.
 */
import { DetailedCellError, HyperFormula } from "hyperformula";
import type { ConfigParams, ExportedChange, RawCellContent, SimpleCellAddress } from "hyperformula";
import { absoluteRef, cellAddress, columnLetters, freeSheetName, parseCell, parseRange, quoteSheet, splitSheet } from "../workbook/a1";
import { type CachedValue, type CellContent, type CellData, type CellStyle, type DefinedName, type PrintSetup, type SheetData, type WorkbookData, isFormula, textContent, textOf } from "./model";
import { SPILL_DIGITS, formatValue, parseTyped, type ShownValue } from "./format";
import { normaliseTypedFormula } from "./formulaText";
import { EngineNames } from "./names";
import { toTabText, fromTabText } from "./clipboardText";
import { type RowChange, cutsThrough, movedCells, movedRow, movedHeights, movedPrintArea, movedRange, movedTitleRows, sameColumn, shiftFormulaRows } from "./rows";

/** The engine's settings: the licence key, Excel's dynamic-array behaviour, and full-precision results. */
export const ENGINE_CONFIG: Partial<ConfigParams> = {
  // HyperFormula is used under the GPL v3 (see README, "Licences"); without the key custom functions give #LIC!.
  licenseKey: "gpl-v3",
  // Spilling formulas behave as in Excel 365: IF(…, PIPERUN(…), …) spills, =A1:A3*2 spills.
  useArrayArithmetic: true,
  // Values exactly as the functions compute them (the grid rounds for display; files get every digit).
  smartRounding: false,
};

/** One cell as the grid and the port see it. */
export interface CellView {
  address: string;
  /** what the cell holds as typed: a formula "=…", a value, or null */
  content: CellContent;
  /** what it evaluates to */
  value: ShownValue;
  /** the value in the cell's number format */
  display: string;
  style?: CellStyle;
  /** for a cell filled by a spilling formula elsewhere: that formula's address */
  spilledFrom?: string;
  /** for a spilling formula: the block it fills, e.g. "M40:P43" */
  spillRange?: string;
}

/**
 * What a change touched: `cells`, sheet name → the addresses whose content, value or style may have changed (an edit
 * and what it recalculated); or everything (`cells` undefined: a workbook loaded, another sheet shown, a sheet added or
 * taken away, an undo or redo, a name changed).
 */
export interface WorkbookChange {
  cells?: ReadonlyMap<string, ReadonlySet<string>>;
}

export type ChangeListener = (change: WorkbookChange) => void;

const EVERYTHING: WorkbookChange = {};

/** Two changes as one. */
function merged(a: WorkbookChange | null, b: WorkbookChange): WorkbookChange {
  if (!a) return b;
  if (!a.cells || !b.cells) return EVERYTHING;
  const cells = new Map<string, Set<string>>();
  for (const c of [a.cells, b.cells]) for (const [sheet, set] of c) cells.set(sheet, new Set([...(cells.get(sheet) ?? []), ...set]));
  return { cells };
}

function shown(v: unknown): ShownValue {
  if (v instanceof DetailedCellError) return v.message ? { error: v.value, message: v.message } : { error: v.value };
  if (v === undefined || v === null) return null;
  if (typeof v === "number" || typeof v === "string" || typeof v === "boolean") return v;
  return String(v);
}

/** What the engine does not keep: each sheet's cell styles, column widths, merges, row heights and print setup. */
class Layout {
  readonly styles = new Map<string, Map<string, CellStyle>>();
  readonly widths = new Map<string, Record<number, number>>();
  readonly merges = new Map<string, string[]>();
  readonly heights = new Map<string, Record<number, number>>();
  readonly prints = new Map<string, PrintSetup>();

  keep(s: SheetData): void {
    const m = new Map<string, CellStyle>();
    for (const [address, cell] of Object.entries(s.cells)) if (cell.style) m.set(address, cell.style);
    this.styles.set(s.name, m);
    this.widths.set(s.name, { ...(s.columnWidths ?? {}) });
    this.merges.set(s.name, [...(s.merges ?? [])]);
    this.heights.set(s.name, { ...(s.rowHeights ?? {}) });
    if (s.print) this.prints.set(s.name, { ...s.print });
    else this.prints.delete(s.name);
  }

  /** A copy to keep (styles are replaced, never changed in place, so they are shared). */
  clone(): Layout {
    const l = new Layout();
    for (const [s, m] of this.styles) l.styles.set(s, new Map(m));
    for (const [s, w] of this.widths) l.widths.set(s, { ...w });
    for (const [s, m] of this.merges) l.merges.set(s, [...m]);
    for (const [s, h] of this.heights) l.heights.set(s, { ...h });
    for (const [s, p] of this.prints) l.prints.set(s, { ...p });
    return l;
  }

  /** Rows inserted or deleted on `sheet`: styles, heights, merges and the print area follow. */
  moveRows(sheet: string, change: RowChange): void {
    this.styles.set(sheet, movedCells(this.styles.get(sheet) ?? new Map(), change));
    this.heights.set(sheet, movedHeights(this.heights.get(sheet) ?? {}, change));
    this.merges.set(sheet, (this.merges.get(sheet) ?? []).map((m) => movedRange(m, change)).filter((m): m is string => m !== null));
    const print = this.prints.get(sheet);
    if (print) {
      const area = movedPrintArea(print.area, change);
      if (!area) this.prints.delete(sheet);
      else {
        const moved: PrintSetup = { ...print, area };
        const titles = print.titleRows ? movedTitleRows(print.titleRows, change) : undefined;
        if (titles) moved.titleRows = titles;
        else delete moved.titleRows;
        this.prints.set(sheet, moved);
      }
    }
  }
}

/** A step of the engine's undo history that changed the layout too: the layout before it and after it. */
interface LayoutStep {
  before: Layout;
  after: Layout;
}

/** What the workbook's own clipboard holds: the block copied or cut, and its cells' styles. */
interface Clip {
  sheet: string;
  /** 0-based top-left cell and size */
  row: number;
  col: number;
  rows: number;
  cols: number;
  styles: (CellStyle | undefined)[][];
  cut: boolean;
  /** the block as tab-separated text, as it went to the system clipboard */
  text: string;
}

/**
 * The engine's undo and redo stacks (HyperFormula keeps them in its CRUD operations; they are not part of its public
 * API). Each entry is an object that stays the same while it moves between the stacks, so a layout step can be
 * attached to it: undo, redo, the undo limit and a new step clearing the redo stack then carry the layout along
 * exactly as the engine carries the contents. test/preview/rowsAndClipboard.test.ts fails if this shape changes.
 */
function undoStacks(hf: HyperFormula): { undoStack: object[]; redoStack: object[] } | undefined {
  const undoRedo = (hf as unknown as { _crudOperations?: { undoRedo?: { undoStack?: unknown; redoStack?: unknown } } })._crudOperations?.undoRedo;
  if (!undoRedo || !Array.isArray(undoRedo.undoStack) || !Array.isArray(undoRedo.redoStack)) return undefined;
  return { undoStack: undoRedo.undoStack as object[], redoStack: undoRedo.redoStack as object[] };
}

const top = (stack: object[] | undefined): object | undefined => (stack?.length ? stack[stack.length - 1] : undefined);

/** A spilling formula held as a formula of one cell while rows move (see `restructure`). */
const HELD = { start: "=INDEX(", end: ",1,1)" };

/** The most rows and columns a sheet may have: the engine's (HyperFormula's maxRows and maxColumns). */
const MAX_ROWS = ENGINE_CONFIG.maxRows ?? HyperFormula.defaultConfig.maxRows;
const MAX_COLUMNS = ENGINE_CONFIG.maxColumns ?? HyperFormula.defaultConfig.maxColumns;

/** Why the engine cannot hold this workbook as it is, before it is asked to (undefined: it can). */
function sizeProblem(data: WorkbookData): string | undefined {
  const seen = new Map<string, string>();
  for (const s of data.sheets) {
    const other = seen.get(s.name.toLowerCase());
    if (other !== undefined) return `the workbook has two sheets named "${other}" and "${s.name}"`;
    seen.set(s.name.toLowerCase(), s.name);
    let rows = 0;
    let cols = 0;
    for (const address of Object.keys(s.cells)) {
      const a = parseCell(address);
      rows = Math.max(rows, a.row + 1);
      cols = Math.max(cols, a.col + 1);
    }
    if (rows > MAX_ROWS) return `sheet "${s.name}" reaches row ${rows.toLocaleString("en-US")}; the preview holds at most ${MAX_ROWS.toLocaleString("en-US")} rows`;
    if (cols > MAX_COLUMNS) {
      return `sheet "${s.name}" reaches column ${columnLetters(cols - 1)}; the preview holds at most ${MAX_COLUMNS.toLocaleString("en-US")} columns (A to ${columnLetters(MAX_COLUMNS - 1)})`;
    }
  }
  return undefined;
}

export class PreviewWorkbook {
  private engine!: HyperFormula;
  private layout = new Layout();
  /** the engine's spellings of names it refuses as they are (./names) */
  private names_ = new EngineNames();
  private readonly listeners = new Set<ChangeListener>();
  private spillCache = new Map<string, Map<string, { anchor: string; range: string }>>();
  /** depth of `group` calls, and the change waiting for the outermost to end */
  private grouping = 0;
  private changeWaiting: WorkbookChange | null = null;
  /** cells written or restyled since the engine last reported (they belong to its next report) */
  private touched = new Map<string, Set<string>>();
  /** for each sheet added: the sheet shown when it was added, shown again when an undo takes it away */
  private readonly shownBefore = new Map<string, string>();
  private revision_ = 0;
  /** the layout's steps, attached to the engine's undo entries they belong with */
  private layoutSteps = new WeakMap<object, LayoutStep>();
  /** while one undo step runs: whether it does, and the layout as it was before its first layout change */
  private inUndoStep = false;
  private layoutBefore: Layout | null = null;
  private clip: Clip | null = null;
  activeSheet = "";

  constructor(data: WorkbookData) {
    this.load(data);
  }

  /**
   * Counts the changes to what the workbook holds (contents, styles, sheets, names, a workbook loaded, undo and redo;
   * not which sheet is shown): equal counts, the same workbook.
   */
  get revision(): number {
    return this.revision_;
  }

  /** The formula engine (replaced by `load`). */
  get hf(): HyperFormula {
    return this.engine;
  }

  /**
   * Replace the whole workbook (a file opened), keeping the listeners. The new workbook is built completely aside
   * and only then takes the old one's place: if anything in `data` cannot be read, this throws and the workbook,
   * its layout, its names and its undo history stay exactly as they were.
   */
  load(data: WorkbookData): void {
    if (!data.sheets.length) throw new Error("a workbook needs at least one sheet");
    const problem = sizeProblem(data);
    if (problem) throw new Error(problem);
    const names = EngineNames.for(data.names.map((n) => n.name));
    const namedExpressions = data.names.map((n) => ({ name: names.define(n.name), expression: names.toEngine(n.ref.startsWith("=") ? n.ref : `=${n.ref}`) }));
    const layout = new Layout();
    const sheets: Record<string, RawCellContent[][]> = {};
    for (const s of data.sheets) {
      sheets[s.name] = toRows(s, names);
      layout.keep(s);
    }
    // names go in with the sheets: they are part of the file, not a first step to undo
    const engine = HyperFormula.buildFromSheets(sheets, ENGINE_CONFIG, namedExpressions);

    const previous = this.engine;
    this.engine = engine;
    this.layout = layout;
    this.names_ = names;
    this.spillCache = new Map();
    this.layoutSteps = new WeakMap();
    this.clip = null;
    this.revision_++;
    this.activeSheet = data.activeSheet && sheets[data.activeSheet] ? data.activeSheet : data.sheets[0].name;
    this.engine.on("valuesUpdated", (changes: ExportedChange[]) => this.recalculated(changes));
    previous?.destroy();
    if (previous) this.changed();
  }

  // ─── Sheets ────────────────────────────────────────────────────────────────────────────────────────────────────

  sheetNames(): string[] {
    return this.hf.getSheetNames();
  }

  private sheetId(sheet: string): number {
    const id = this.hf.getSheetId(sheet);
    if (id === undefined) throw new Error(`no sheet named "${sheet}"`);
    return id;
  }

  /** Show this sheet (the grid follows). */
  activate(sheet: string): void {
    this.sheetId(sheet);
    this.activeSheet = sheet;
    this.changed();
  }

  /** Add a sheet (renamed " 2", " 3"… when the name is taken); returns its name. One step to undo. */
  addSheet(data: SheetData): string {
    const name = freeSheetName(data.name, this.sheetNames());
    const sheet = { ...data, name };
    this.shownBefore.set(name, this.activeSheet);
    this.revision_++;
    this.group(() => {
      this.touchLayout();
      this.layout.keep(sheet);
      this.hf.addSheet(name);
      this.hf.setSheetContent(this.sheetId(name), toRows(sheet, this.names_));
      this.changed();
    });
    return name;
  }

  /**
   * Do `steps` as one: one undo takes them all back, and the listeners hear of them once, at the end. Values cannot
   * be read inside (the engine calculates once, at the end); names, sheets and contents can.
   */
  group<T>(steps: () => T): T {
    if (this.grouping) return steps();
    return this.asUndoStep(() =>
      this.quietly(() => {
        let result: T | undefined;
        this.hf.batch(() => {
          result = steps();
        });
        return result as T;
      }),
    );
  }

  /**
   * Do `steps`, one step of the engine's undo history at most, and attach to it what they changed in the layout, so
   * that undo and redo take the layout back and forth with the contents.
   */
  private asUndoStep<T>(steps: () => T): T {
    if (this.inUndoStep) return steps();
    this.inUndoStep = true;
    this.layoutBefore = null;
    const entryBefore = top(undoStacks(this.hf)?.undoStack);
    try {
      return steps();
    } finally {
      this.inUndoStep = false;
      const entry = top(undoStacks(this.hf)?.undoStack);
      if (this.layoutBefore && entry && entry !== entryBefore) this.layoutSteps.set(entry, { before: this.layoutBefore, after: this.layout.clone() });
      this.layoutBefore = null;
    }
  }

  /** Call before changing the layout: the first change within an undo step keeps the layout as it was. */
  private touchLayout(): void {
    if (this.inUndoStep && !this.layoutBefore) this.layoutBefore = this.layout.clone();
  }

  /** Do `steps`, telling the listeners of their changes once, at the end. */
  private quietly<T>(steps: () => T): T {
    this.grouping++;
    try {
      return steps();
    } finally {
      this.grouping--;
      const waiting = this.changeWaiting;
      if (!this.grouping && waiting) {
        this.changeWaiting = null;
        this.changed(waiting);
      }
    }
  }

  /** Rows and columns in use (at least 1×1), spills included. */
  extent(sheet: string): { rows: number; cols: number } {
    const d = this.hf.getSheetDimensions(this.sheetId(sheet));
    let rows = d.height;
    let cols = d.width;
    for (const addr of this.layout.styles.get(sheet)?.keys() ?? []) {
      const a = parseCell(addr);
      rows = Math.max(rows, a.row + 1);
      cols = Math.max(cols, a.col + 1);
    }
    return { rows: Math.max(rows, 1), cols: Math.max(cols, 1) };
  }

  columnWidths(sheet: string): Record<number, number> {
    return this.layout.widths.get(sheet) ?? {};
  }

  rowHeights(sheet: string): Record<number, number> {
    return this.layout.heights.get(sheet) ?? {};
  }

  mergedRanges(sheet: string): string[] {
    return this.layout.merges.get(sheet) ?? [];
  }

  // ─── Cells ─────────────────────────────────────────────────────────────────────────────────────────────────────

  private addr(sheet: string, address: string): SimpleCellAddress {
    const a = parseCell(address);
    return { sheet: this.sheetId(sheet), row: a.row, col: a.col };
  }

  content(sheet: string, address: string): CellContent {
    const v = this.hf.getCellSerialized(this.addr(sheet, address));
    if (v === undefined || v === null) return null;
    if (typeof v === "string") return v.startsWith("=") ? this.names_.fromEngine(v) : fromEngineText(v);
    if (typeof v === "number" || typeof v === "boolean") return v;
    return String(v);
  }

  value(sheet: string, address: string): ShownValue {
    return shown(this.hf.getCellValue(this.addr(sheet, address)));
  }

  style(sheet: string, address: string): CellStyle | undefined {
    return this.layout.styles.get(sheet)?.get(address);
  }

  cell(sheet: string, address: string): CellView {
    const content = this.content(sheet, address);
    const value = this.value(sheet, address);
    const style = this.style(sheet, address);
    const spill = this.spills(sheet).get(address);
    const spilled = spill !== undefined && spill.anchor !== address;
    const display = formatValue(value, style?.numFmt, spilled ? SPILL_DIGITS : undefined);
    const view: CellView = { address, content, value, display, style };
    if (spill && spill.anchor !== address) view.spilledFrom = spill.anchor;
    if (spill && spill.anchor === address) view.spillRange = spill.range;
    return view;
  }

  /** Put content into a cell (null clears it). A demo value's mark goes: what is there now is the user's. */
  setContent(sheet: string, address: string, content: CellContent): void {
    this.revision_++;
    this.asUndoStep(() => {
      this.ownValue(sheet, address);
      this.touch(sheet, address);
      this.hf.setCellContents(this.addr(sheet, address), [[toEngine(content, this.names_)]]);
      // content that leaves every value as it was (text over equal text) gets no report from the engine: tell of it here
      if (this.touched.size) this.changed({ cells: this.takeTouched() });
    });
  }

  /** A demo value's mark goes: what the cell holds now is the user's. */
  private ownValue(sheet: string, address: string): void {
    const style = this.style(sheet, address);
    if (style?.demo) {
      const own: CellStyle = { ...style };
      delete own.demo;
      this.setStyle(sheet, address, own);
    }
  }

  private touch(sheet: string, address: string): void {
    let set = this.touched.get(sheet);
    if (!set) this.touched.set(sheet, (set = new Set()));
    set.add(address);
  }

  private takeTouched(): Map<string, Set<string>> {
    const t = this.touched;
    this.touched = new Map();
    return t;
  }

  /** Put what a user typed into a cell: formulas, numbers, TRUE/FALSE and text as a spreadsheet reads them. */
  setTyped(sheet: string, address: string, typed: string): void {
    const content = parseTyped(typed);
    this.setContent(sheet, address, isFormula(content) ? normaliseTypedFormula(content) : content);
  }

  setStyle(sheet: string, address: string, style: CellStyle | undefined): void {
    this.revision_++;
    this.touchLayout();
    let m = this.layout.styles.get(sheet);
    if (!m) this.layout.styles.set(sheet, (m = new Map()));
    if (style) m.set(address, style);
    else m.delete(address);
    this.touch(sheet, address);
  }

  /** Every cell of a sheet that holds something or has a style, with its view. */
  cells(sheet: string): CellView[] {
    const out: CellView[] = [];
    const { rows, cols } = this.extent(sheet);
    for (let r = 0; r < rows; r++) {
      for (let c = 0; c < cols; c++) {
        const address = cellAddress({ row: r, col: c });
        const v = this.cell(sheet, address);
        if (v.content !== null || v.value !== null || v.style) out.push(v);
      }
    }
    return out;
  }

  /**
   * The spilled blocks of a sheet: every cell a spilling formula fills → its anchor and block. Read from the engine
   * (cells that are part of an array) after each change.
   */
  spills(sheet: string): Map<string, { anchor: string; range: string }> {
    const cached = this.spillCache.get(sheet);
    if (cached) return cached;
    const map = new Map<string, { anchor: string; range: string }>();
    const id = this.sheetId(sheet);
    const { width, height: rows } = this.hf.getSheetDimensions(id);
    const part = (row: number, col: number) => this.hf.isCellPartOfArray({ sheet: id, row, col });
    const isFilled = (rr: number, cc: number) => part(rr, cc) && this.hf.getCellFormula({ sheet: id, row: rr, col: cc }) === undefined && !map.has(cellAddress({ row: rr, col: cc }));
    // only a formula's own cell anchors a block: the engine's array cells, scanned without writing any formula out
    for (let r = 0; r < rows; r++) {
      for (let c = 0; c < width; c++) {
        if (!part(r, c) || this.hf.getCellFormula({ sheet: id, row: r, col: c }) === undefined) continue;
        let w = 1;
        while (isFilled(r, c + w)) w++;
        let height = 1;
        while (isFilled(r + height, c)) height++;
        const anchor = cellAddress({ row: r, col: c });
        const range = `${anchor}:${cellAddress({ row: r + height - 1, col: c + w - 1 })}`;
        for (let i = 0; i < height; i++) for (let k = 0; k < w; k++) map.set(cellAddress({ row: r + i, col: c + k }), { anchor, range });
      }
    }
    this.spillCache.set(sheet, map);
    return map;
  }

  // ─── Rows ──────────────────────────────────────────────────────────────────────────────────────────────────────

  /**
   * Insert `count` empty rows before row `at` (0-based) of `sheet`, as one step to undo. Formulas, names, spills and
   * the layout follow (styles, row heights, merges and the print area move down; a merge or print area the rows go
   * into grows). The new rows take the styles of the row above, and, inside a table, the formulas the rows above and
   * below share (a computed column: the same formula relative to its row). Throws where the sheet would grow past
   * the rows the preview holds.
   */
  insertRows(sheet: string, at: number, count: number): void {
    const id = this.sheetId(sheet);
    checkRows(at, count);
    if (!this.hf.isItPossibleToAddRows(id, [at, count])) {
      const { rows } = this.extent(sheet);
      throw new Error(`insert ${rowsWord(count)} at row ${at + 1}: got a sheet of ${rows.toLocaleString("en-US")} rows; the preview holds at most ${MAX_ROWS.toLocaleString("en-US")} rows`);
    }
    const change: RowChange = { at, count };
    this.revision_++;
    this.restructure(
      sheet,
      change,
      (engine, sid) => {
        const filled: Fill[] = [];
        const above = at > 0 ? formulasOf(engine, sid, at - 1) : new Map<number, string>();
        const below = formulasOf(engine, sid, at);
        engine.addRows(sid, [at, count]);
        // a computed column: the rows above and below hold the same formula, relative to their rows
        for (const [col, formula] of above) {
          const next = below.get(col);
          const kind = next === undefined ? undefined : sameColumn(formula, at - 1, next, at);
          if (!kind) continue;
          const moved = engine.getCellFormula({ sheet: sid, row: at - 1, col }) ?? formula;
          for (let k = 1; k <= count; k++) {
            engine.setCellContents({ sheet: sid, row: at - 1 + k, col }, [[shiftFormulaRows(moved, k, kind === "text")]]);
            filled.push({ from: { row: at - 1, col }, to: { row: at - 1 + k, col } });
          }
        }
        return filled;
      },
      () => {
        this.layout.moveRows(sheet, change);
        if (at > 0) this.styleNewRows(sheet, at - 1, at, count);
      },
    );
  }

  /**
   * Delete `count` rows from row `at` (0-based) of `sheet`, as one step to undo. Formulas, names, spills and the
   * layout follow; references into the deleted rows become #REF!, as in a spreadsheet. Throws, changing nothing,
   * where the rows cut through a merged block (delete all its rows or none).
   */
  deleteRows(sheet: string, at: number, count: number): void {
    const id = this.sheetId(sheet);
    checkRows(at, count);
    const change: RowChange = { at, count: -count };
    const rows = count === 1 ? `row ${at + 1}` : `rows ${at + 1} to ${at + count}`;
    for (const m of this.mergedRanges(sheet)) {
      const r = parseRange(m);
      if (cutsThrough(r.start.row, r.start.row + r.rows - 1, change)) {
        throw new Error(`delete ${rows}: they cut through the merged cells ${m}; delete all of its rows (${r.start.row + 1} to ${r.start.row + r.rows}) or none`);
      }
    }
    if (!this.hf.isItPossibleToRemoveRows(id, [at, count])) throw new Error(`delete ${rows}: the sheet has no such rows`);
    this.revision_++;
    this.restructure(
      sheet,
      change,
      (engine, sid) => {
        engine.removeRows(sid, [at, count]);
        return [];
      },
      () => this.layout.moveRows(sheet, change),
    );
  }

  /** New rows `at`..`at+count-1` take the styles of row `from` (a demo value's mark stays behind: they are empty). */
  private styleNewRows(sheet: string, from: number, at: number, count: number): void {
    const styles = this.layout.styles.get(sheet);
    if (!styles) return;
    for (const [address, style] of [...styles]) {
      const a = parseCell(address);
      if (a.row !== from) continue;
      const own: CellStyle = { ...style };
      delete own.demo;
      for (let k = 0; k < count; k++) styles.set(cellAddress({ row: at + k, col: a.col }), own);
    }
  }

  /**
   * Rows inserted or deleted on `sheet` as one step to undo. The engine's own moving of spilled blocks fails for some
   * blocks (rows inserted inside one throws; a deletion taken back leaves the block blocked), so the rows move in a
   * second engine where nothing spills (each spilling formula held as a formula of one cell): `rows` moves them there,
   * and that engine moves references, names and ranges as for any formula. Then the cells that differ are written
   * here, in one group: the spilling formulas cleared first and written last, so that undo, which takes the writes
   * back in reverse, finds their blocks empty when it puts them back. `rows` returns the cells it filled from another
   * (after the move): one filled from a spilling formula spills too. `layout` moves the layout, in the same step.
   */
  private restructure(sheet: string, change: RowChange, rows: (engine: HyperFormula, sheet: number) => Fill[], layout: () => void): void {
    const sheets = this.sheetNames();
    const ids = sheets.map((name) => this.sheetId(name));
    const before: RawCellContent[][][] = [];
    const anchors: Array<Set<string>> = [];
    const held: Record<string, RawCellContent[][]> = {};
    sheets.forEach((name, i) => {
      const spills = this.spills(name);
      const own = new Set<string>();
      for (const { anchor } of spills.values()) own.add(anchor);
      const grid = this.hf.getSheetSerialized(ids[i]).map((row, r) =>
        row.map((v, c) => {
          const address = cellAddress({ row: r, col: c });
          return spills.has(address) && !own.has(address) ? null : (v ?? null); // a spilled value is not content
        }),
      );
      before.push(grid);
      anchors.push(own);
      held[name] = grid.map((row, r) => row.map((v, c) => (own.has(cellAddress({ row: r, col: c })) && typeof v === "string" ? `${HELD.start}${v.slice(1)}${HELD.end}` : v)));
    });
    const names = this.hf.listNamedExpressions().map((name) => ({ name, expression: this.hf.getNamedExpressionFormula(name) ?? "" }));
    const engine = HyperFormula.buildFromSheets(held, { ...ENGINE_CONFIG, undoLimit: 0 }, names);
    const after: RawCellContent[][][] = [];
    const afterAnchors: Array<Set<string>> = [];
    let afterNames: Array<{ name: string; expression: string }>;
    try {
      // the second engine's sheets by name: its positions need not follow ours (a name like "7" goes first)
      const engineId = (name: string) => engine.getSheetId(name)!;
      const filled = rows(engine, engineId(sheet));
      sheets.forEach((name, i) => {
        const moved = new Set<string>();
        for (const anchor of anchors[i]) {
          const a = parseCell(anchor);
          const row = name === sheet ? movedRow(a.row, change) : a.row;
          if (row !== null) moved.add(cellAddress({ row, col: a.col }));
        }
        // a cell filled from a spilling formula holds one too: written out as typed, and last, as the others
        if (name === sheet) for (const { from, to } of filled) if (moved.has(cellAddress(from))) moved.add(cellAddress(to));
        afterAnchors.push(moved);
        after.push(
          engine.getSheetSerialized(engineId(name)).map((row, r) =>
            row.map((v, c) => {
              if (typeof v === "string" && moved.has(cellAddress({ row: r, col: c })) && v.startsWith(HELD.start) && v.endsWith(HELD.end)) return `=${v.slice(HELD.start.length, -HELD.end.length)}`;
              return v ?? null;
            }),
          ),
        );
      });
      afterNames = engine.listNamedExpressions().map((name) => ({ name, expression: engine.getNamedExpressionFormula(name) ?? "" }));
    } finally {
      engine.destroy();
    }
    const cellOf = (grid: RawCellContent[][], r: number, c: number): RawCellContent => grid[r]?.[c] ?? null;
    this.group(() => {
      sheets.forEach((_, i) => {
        for (const anchor of anchors[i]) {
          const a = parseCell(anchor);
          this.hf.setCellContents({ sheet: ids[i], row: a.row, col: a.col }, [[null]]);
        }
      });
      sheets.forEach((_, i) => {
        const height = Math.max(before[i].length, after[i].length);
        for (let r = 0; r < height; r++) {
          const width = Math.max(before[i][r]?.length ?? 0, after[i][r]?.length ?? 0);
          for (let c = 0; c < width; c++) {
            const address = cellAddress({ row: r, col: c });
            if (afterAnchors[i].has(address)) continue;
            const old = anchors[i].has(address) ? null : cellOf(before[i], r, c);
            const now = cellOf(after[i], r, c);
            if (old !== now) this.hf.setCellContents({ sheet: ids[i], row: r, col: c }, [[now]]);
          }
        }
      });
      sheets.forEach((_, i) => {
        for (const anchor of afterAnchors[i]) {
          const a = parseCell(anchor);
          this.hf.setCellContents({ sheet: ids[i], row: a.row, col: a.col }, [[cellOf(after[i], a.row, a.col)]]);
        }
      });
      for (const { name, expression } of afterNames) {
        if (this.hf.getNamedExpressionFormula(name) !== expression) this.hf.changeNamedExpression(name, expression);
      }
      this.touchLayout();
      layout();
      this.changed();
    });
  }

  // ─── Clipboard ─────────────────────────────────────────────────────────────────────────────────────────────────

  /**
   * Copy a block ("B3:D7" or "B3") of `sheet`: the workbook keeps its formulas and styles for `paste`. Returns the
   * block as tab-separated text of what its cells show, for the system clipboard.
   */
  copyRange(sheet: string, range: string): string {
    return this.take(sheet, range, false);
  }

  /** Cut a block: `paste` moves it (formulas that refer to it follow), styles and all. Returns its text, as `copyRange`. */
  cutRange(sheet: string, range: string): string {
    return this.take(sheet, range, true);
  }

  /**
   * The text of the block last copied or cut (null: none, a cut already pasted, or a cut the engine let go of: any
   * edit after a cut ends it, and what was cut is then only text on the system clipboard).
   */
  get clipboardText(): string | null {
    if (this.clip && this.hf.isClipboardEmpty()) this.clip = null;
    return this.clip?.text ?? null;
  }

  private take(sheet: string, range: string, cut: boolean): string {
    const id = this.sheetId(sheet);
    const r = parseRange(range);
    const block = { start: { sheet: id, row: r.start.row, col: r.start.col }, end: { sheet: id, row: r.start.row + r.rows - 1, col: r.start.col + r.cols - 1 } };
    if (cut) this.hf.cut(block);
    else this.hf.copy(block);
    const styles: (CellStyle | undefined)[][] = [];
    const texts: string[][] = [];
    for (let i = 0; i < r.rows; i++) {
      styles.push([]);
      texts.push([]);
      for (let k = 0; k < r.cols; k++) {
        const address = cellAddress({ row: r.start.row + i, col: r.start.col + k });
        styles[i].push(this.style(sheet, address));
        texts[i].push(this.cell(sheet, address).display);
      }
    }
    const text = toTabText(texts);
    this.clip = { sheet, row: r.start.row, col: r.start.col, rows: r.rows, cols: r.cols, styles, cut, text };
    return text;
  }

  /**
   * Paste the block last copied or cut with its top-left cell at `address` of `sheet`, as one step to undo: relative
   * references move with it, styles go along (a demo value's mark does not: what is pasted is the user's). A cut
   * block moves, and the clipboard is empty after. Throws where there is nothing to paste or the engine refuses the
   * place (part of a spill, past the sheet's edge).
   */
  paste(sheet: string, address: string): void {
    if (this.clip && this.hf.isClipboardEmpty()) this.clip = null;
    const clip = this.clip;
    if (!clip) throw new Error("paste: nothing copied yet; select cells and copy them first");
    const at = this.addr(sheet, address);
    const end = { row: at.row + clip.rows - 1, col: at.col + clip.cols - 1 };
    if (end.row >= MAX_ROWS || end.col >= MAX_COLUMNS) {
      throw new Error(`paste at ${address}: got a block of ${clip.rows} × ${clip.cols} cells; it must fit within row ${MAX_ROWS.toLocaleString("en-US")} and column ${columnLetters(MAX_COLUMNS - 1)}`);
    }
    this.revision_++;
    try {
      // the engine's paste is one step of its own (it reads values, so it cannot run inside a group)
      this.asUndoStep(() => this.quietly(() => {
        this.hf.paste(at);
        this.touchLayout();
        if (clip.cut) for (let i = 0; i < clip.rows; i++) for (let k = 0; k < clip.cols; k++) this.setStyle(clip.sheet, cellAddress({ row: clip.row + i, col: clip.col + k }), undefined);
        for (let i = 0; i < clip.rows; i++) {
          for (let k = 0; k < clip.cols; k++) {
            const style = clip.styles[i][k];
            const own = style ? { ...style } : undefined;
            if (own) delete own.demo;
            this.setStyle(sheet, cellAddress({ row: at.row + i, col: at.col + k }), own);
          }
        }
        this.changed();
      }));
    } catch (e) {
      throw new Error(`paste at ${address}: ${(e as Error).message}`);
    }
    if (clip.cut) this.clip = null;
  }

  /**
   * Paste tab-separated text (from another program, or typed) with its top-left cell at `address`, as one step to
   * undo: each cell as if typed into it (numbers, TRUE/FALSE, formulas, text), a demo value's mark gone. Returns the
   * block's size (0 × 0 for text that holds no cell).
   */
  pasteText(sheet: string, address: string, text: string): { rows: number; cols: number } {
    const rows = fromTabText(text);
    if (!rows.length) return { rows: 0, cols: 0 };
    const at = parseCell(address);
    const width = rows.reduce((w, r) => Math.max(w, r.length), 0);
    if (at.row + rows.length > MAX_ROWS || at.col + width > MAX_COLUMNS) {
      throw new Error(`paste at ${address}: got ${rows.length} × ${width} cells; they must fit within row ${MAX_ROWS.toLocaleString("en-US")} and column ${columnLetters(MAX_COLUMNS - 1)}`);
    }
    this.sheetId(sheet);
    this.group(() => rows.forEach((r, i) => r.forEach((typed, k) => this.setTyped(sheet, cellAddress({ row: at.row + i, col: at.col + k }), typed))));
    return { rows: rows.length, cols: width };
  }

  // ─── Names ─────────────────────────────────────────────────────────────────────────────────────────────────────

  /** The workbook's names, spelt as the user (or the file) spelt them. */
  names(): DefinedName[] {
    return this.hf.listNamedExpressions().map((name) => ({ name: this.names_.userName(name), ref: this.names_.fromEngine(this.hf.getNamedExpressionFormula(name) ?? "").replace(/^=/, "") }));
  }

  /** The engine's own spelling of a defined name (matched case-insensitively, as in Excel), or undefined. */
  private definedName(name: string): string | undefined {
    const spelling = this.names_.engineName(name).toLowerCase();
    return this.hf.listNamedExpressions().find((n) => n.toLowerCase() === spelling);
  }

  /** Define (or redefine) a workbook name: `ref` like "Estimate!$B$8" or "=Estimate!$B$8". */
  setName(name: string, ref: string, opts: { quiet?: boolean } = {}): void {
    const expression = this.names_.toEngine(ref.startsWith("=") ? ref : `=${ref}`);
    const existing = this.definedName(name);
    this.revision_++;
    if (existing) {
      this.hf.changeNamedExpression(existing, expression);
    } else {
      this.hf.addNamedExpression(this.names_.define(name), expression);
    }
    if (!opts.quiet) this.changed();
  }

  /** Point a name at one cell. */
  setNameToCell(name: string, sheet: string, address: string): void {
    this.setName(name, absoluteRef(sheet, address));
  }

  removeName(name: string): void {
    const existing = this.definedName(name);
    if (existing) {
      this.revision_++;
      this.hf.removeNamedExpression(existing);
      this.changed();
    }
  }

  /**
   * What a name refers to: one cell, a block of cells, something else (a constant or formula), or nothing (the name
   * is not defined). Matching is case-insensitive, as in Excel.
   */
  nameTarget(
    name: string,
  ):
    | { kind: "cell"; sheet: string; address: string }
    | { kind: "range"; sheet: string; range: string }
    | { kind: "other"; expression: string }
    | null {
    const existing = this.definedName(name);
    if (!existing) return null;
    const expression = this.names_.fromEngine(this.hf.getNamedExpressionFormula(existing) ?? "").replace(/^=/, "");
    const { sheet, range } = splitSheet(expression);
    if (sheet && this.hf.getSheetId(sheet) !== undefined && /^\$?[A-Za-z]{1,3}\$?\d+(:\$?[A-Za-z]{1,3}\$?\d+)?$/.test(range)) {
      const r = parseRange(range.replace(/\$/g, ""));
      if (r.rows === 1 && r.cols === 1) return { kind: "cell", sheet, address: cellAddress(r.start) };
      return { kind: "range", sheet, range: range.replace(/\$/g, "") };
    }
    return { kind: "other", expression };
  }

  nameValue(name: string): ShownValue {
    const existing = this.definedName(name);
    return existing ? shown(this.hf.getNamedExpressionValue(existing)) : null;
  }

  // ─── Changes ───────────────────────────────────────────────────────────────────────────────────────────────────

  /** Call `listener` after every change or recalculation; returns the function that stops it. */
  onChange(listener: ChangeListener): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /** The engine's report of the values it recalculated, with the cells written since the last one. */
  private recalculated(changes: ExportedChange[]): void {
    const cells = this.takeTouched();
    for (const c of changes) {
      if (!("address" in c)) continue; // a name's value: the cells using it are reported too
      const sheet = this.hf.getSheetName(c.address.sheet);
      if (sheet === undefined) continue;
      let set = cells.get(sheet);
      if (!set) cells.set(sheet, (set = new Set()));
      set.add(cellAddress(c.address));
    }
    this.changed({ cells });
  }

  private changed(change: WorkbookChange = EVERYTHING): void {
    if (change.cells) for (const sheet of change.cells.keys()) this.spillCache.delete(sheet);
    else this.spillCache = new Map();
    if (this.grouping) {
      this.changeWaiting = merged(this.changeWaiting, change);
      return;
    }
    for (const l of [...this.listeners]) l(change);
  }

  /** Take the last step back (an edit, or a whole group: a sheet added with its names). */
  undo(): boolean {
    if (!this.hf.isThereSomethingToUndo()) return false;
    this.revision_++;
    const step = this.layoutSteps.get(top(undoStacks(this.hf)?.undoStack) ?? {});
    this.quietly(() => {
      this.hf.undo();
      if (step) this.layout = step.before.clone();
      // a sheet taken away: show the one shown when it came
      const sheets = this.sheetNames();
      if (!sheets.includes(this.activeSheet)) {
        const before = this.shownBefore.get(this.activeSheet);
        this.activeSheet = before && sheets.includes(before) ? before : sheets[0];
      }
      this.changed();
    });
    return true;
  }

  /** Do the last step taken back again; a sheet it brings back is shown. */
  redo(): boolean {
    if (!this.hf.isThereSomethingToRedo()) return false;
    this.revision_++;
    this.quietly(() => {
      const before = new Set(this.sheetNames());
      const step = this.layoutSteps.get(top(undoStacks(this.hf)?.redoStack) ?? {});
      this.hf.redo();
      if (step) this.layout = step.after.clone();
      const added = this.sheetNames().find((s) => !before.has(s));
      if (added) this.activeSheet = added;
      this.changed();
    });
    return true;
  }

  // ─── Export ────────────────────────────────────────────────────────────────────────────────────────────────────

  /** The whole workbook as data, every cell with its current value cached. */
  toData(): WorkbookData {
    const sheets: SheetData[] = this.sheetNames().map((name) => this.sheetData(name));
    return { sheets, names: this.names(), activeSheet: this.activeSheet };
  }

  sheetData(name: string): SheetData {
    const cells: Record<string, CellData> = {};
    for (const v of this.cells(name)) {
      const cell: CellData = { content: v.content };
      if (v.style) cell.style = v.style;
      if (v.value !== null || v.content !== null) cell.cached = cachedOf(v.value);
      if (v.spillRange) cell.spill = v.spillRange;
      cells[v.address] = cell;
    }
    return this.withLayout({ name, cells });
  }

  /**
   * The workbook as data without its computed values: what it takes to build it again (`load` computes the rest).
   * Quicker than `toData`, which computes every cell's view: for keeping the workbook after each change.
   */
  contentData(): WorkbookData {
    const sheets = this.sheetNames().map((name) => {
      const cells: Record<string, CellData> = {};
      const spills = this.spills(name);
      this.hf.getSheetSerialized(this.sheetId(name)).forEach((row, r) =>
        row.forEach((v, c) => {
          if (v === null || v === undefined || v === "") return;
          const address = cellAddress({ row: r, col: c });
          const spill = spills.get(address);
          if (spill && spill.anchor !== address) return; // a value a spill put there, not content
          const content = typeof v === "string" ? (v.startsWith("=") ? this.names_.fromEngine(v) : fromEngineText(v)) : typeof v === "number" || typeof v === "boolean" ? v : String(v);
          cells[address] = { content };
        }),
      );
      for (const [address, style] of this.layout.styles.get(name) ?? []) cells[address] = { ...(cells[address] ?? { content: null }), style };
      return this.withLayout({ name, cells });
    });
    return { sheets, names: this.names(), activeSheet: this.activeSheet };
  }

  /** A sheet's data with its widths, merges, heights and print setup. */
  private withLayout(data: SheetData): SheetData {
    const name = data.name;
    const widths = this.layout.widths.get(name);
    if (widths && Object.keys(widths).length) data.columnWidths = { ...widths };
    const merges = this.layout.merges.get(name);
    if (merges?.length) data.merges = [...merges];
    const heights = this.layout.heights.get(name);
    if (heights && Object.keys(heights).length) data.rowHeights = { ...heights };
    const print = this.layout.prints.get(name);
    if (print) data.print = { ...print };
    return data;
  }

  /** A formula that refers to `address` on `sheet` from another sheet. */
  static reference(sheet: string, address: string): string {
    return `${quoteSheet(sheet)}!${address}`;
  }
}

/** The formulas of one row of an engine's sheet, by column. */
/** A cell filled from another when rows are inserted (0-based rows and columns, after the move). */
interface Fill {
  from: { row: number; col: number };
  to: { row: number; col: number };
}

function formulasOf(engine: HyperFormula, id: number, row: number): Map<number, string> {
  const out = new Map<number, string>();
  const { width } = engine.getSheetDimensions(id);
  for (let col = 0; col < width; col++) {
    const f = engine.getCellFormula({ sheet: id, row, col });
    if (f !== undefined) out.set(col, f);
  }
  return out;
}

/** Rows to insert or delete: a row index from 0 and a count from 1, whole numbers. */
function checkRows(at: number, count: number): void {
  if (!Number.isInteger(at) || at < 0 || at >= MAX_ROWS) throw new Error(`row: got ${at}; must be a whole number from 0 to ${MAX_ROWS - 1} (0 is row 1)`);
  if (!Number.isInteger(count) || count < 1) throw new Error(`count: got ${count}; must be a whole number of rows, at least 1`);
}

const rowsWord = (n: number) => (n === 1 ? "1 row" : `${n.toLocaleString("en-US")} rows`);

function cachedOf(v: ShownValue): CachedValue {
  return v;
}

/**
 * Content as the engine takes it. Text goes in behind an apostrophe, the engine's mark for "text as it is": without
 * it the engine reads text the way a user's typing is read, so a nominal size "1-1/4" would become a date and a
 * schedule "40" a number.
 */
function toEngine(content: CellContent, names: EngineNames): RawCellContent {
  if (typeof content === "string") return isFormula(content) ? names.toEngine(content) : `'${textOf(content)}`;
  return content;
}

/** The engine's serialized text → the content: a formula as it is, text from behind the engine's apostrophe. */
function fromEngineText(v: string): CellContent {
  return v.startsWith("'") ? textContent(v.slice(1)) : v;
}

/** A sheet's cells as the engine's rows of raw content. */
function toRows(s: SheetData, names: EngineNames): RawCellContent[][] {
  const rows: RawCellContent[][] = [];
  for (const [address, cell] of Object.entries(s.cells)) {
    if (cell.content === null || cell.content === undefined) continue;
    const a = parseCell(address);
    while (rows.length <= a.row) rows.push([]);
    const row = rows[a.row];
    while (row.length < a.col) row.push(null);
    row[a.col] = toEngine(cell.content, names);
  }
  return rows;
}
