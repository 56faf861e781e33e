/**
 * The preview's grid: one sheet of the preview workbook as a table, with a formula bar, a message line, sheet tabs
 * and keyboard editing. Our own simple design; a spreadsheet's familiar gestures:
 *   click or arrow keys select · Shift+click, Shift+arrows or a drag select a block · Home, Ctrl+Home, Ctrl+End,
 *   PageUp/PageDown and Ctrl+arrows move (Shift extends) · type to replace, F2 or double-click to edit in place · Enter
 *   commits and moves down, Tab moves right, Escape cancels · Delete clears · Ctrl+Z / Ctrl+Y undo and redo · the
 *   formula bar edits the selected cell too.
 * Only the rows in view (and a few around them) are drawn, by @tanstack/virtual-core's measurements; the rest are two
 * spacer rows. Every drawn cell carries data-address ("B7"); inputs, computed cells, spilled cells and errors each have
 * their class; an error cell's message is its title and shows on the message line when selected. A change redraws
 * only the drawn cells whose look changed; a click, only the cells leaving and entering the selection.
 */
import { Virtualizer, elementScroll, observeElementOffset, observeElementRect } from "@tanstack/virtual-core";
import { cellAddress, columnLetters, parseCell, parseRange } from "../workbook/a1";
import { DEFAULT_COLUMN_WIDTH_PT } from "../workbook/look";
import { contentText } from "./format";
import { isFormula } from "./model";
import type { CellView, PreviewWorkbook, WorkbookChange } from "./workbook";
import { isShareStamp } from "../workbook/port";

/** Points to CSS pixels. */
const PX_PER_PT = 96 / 72;
/** Rows and columns shown beyond the used area, so there is room to type. */
const SPARE_ROWS = 12;
const SPARE_COLS = 3;
const MIN_ROWS = 40;
const MIN_COLS = 10;
/** Horizontal padding of a cell, px (preview.css). */
const CELL_PADDING_PX = 8;
/** Width of the row numbers' column, px. */
const ROW_HEAD_PX = 44;

export interface GridElements {
  /** where the table goes (scrolls) */
  sheet: HTMLElement;
  /** the sheet tabs */
  tabs: HTMLElement;
  /** the selected cell's address */
  nameBox: HTMLElement;
  /** the formula bar */
  formulaBar: HTMLInputElement;
  /** the message line under the formula bar */
  message: HTMLElement;
}

function isEmpty(v: CellView): boolean {
  return (v.value === null || v.value === "") && v.content === null;
}

/** What a demo value's cell says, as its title and on the message line. */
const DEMO_NOTE = "Demo value of a new estimate sheet: type your own over it (F2, then Enter, keeps this one as yours).";

/** What any cell of a share copy's sheet says on the message line. */
const FROZEN_CELL = "A frozen value of this share copy: change the estimate sheet and make a new copy.";

function describeRole(v: CellView): string {
  if (v.style?.demo) return DEMO_NOTE;
  switch (v.style?.role) {
    case "input":
      return "Input: type a new value.";
    case "computed":
      return "Calculated by a formula: the formula bar shows it.";
    default:
      return "Click a cell and type to replace it; F2 or a double click edits it; Enter commits, Escape cancels; Ctrl+Z undoes.";
  }
}

/** A block of cells: its top-left and bottom-right corners, 0-based. */
interface Block {
  top: number;
  left: number;
  bottom: number;
  right: number;
}

function blockOf(a: string, b: string): Block {
  const x = parseCell(a);
  const y = parseCell(b);
  return { top: Math.min(x.row, y.row), left: Math.min(x.col, y.col), bottom: Math.max(x.row, y.row), right: Math.max(x.col, y.col) };
}

/** A row of the table as drawn: its <tr>, its row number and its cells by column. */
interface DrawnRow {
  tr: HTMLTableRowElement;
  th: HTMLTableCellElement;
  cells: Map<number, HTMLTableCellElement>;
}

/** What a cell shows, all of it but the selection: drawn again only when this changes. */
interface CellLook {
  classes: string;
  text: string;
  title: string;
  demo: boolean;
  overflowPx: number;
}

const sameLook = (a: CellLook, b: CellLook) =>
  a.classes === b.classes && a.text === b.text && a.title === b.title && a.demo === b.demo && a.overflowPx === b.overflowPx;

/** The sheet's frame: what, changed, means the table is laid out again (the rows in view drawn anew). */
interface Frame {
  key: string;
  sheet: string;
  nRows: number;
  nCols: number;
  colPx: number[];
  heights: Record<number, number>;
  /** merged blocks: each covered cell → the block's size at its top-left cell, null elsewhere in it */
  covered: Map<string, { rows: number; cols: number } | null>;
  merges: Block[];
}

/** Rows drawn above and below those in view. */
const OVERSCAN_ROWS = 8;
/** A row's height when the sheet does not set one, px (preview.css: td height). */
const ROW_PX = 21;

type Direction = "down" | "up" | "left" | "right";

export class Grid {
  /** the active cell (where typing goes) and the anchor: the selection is the block between them */
  private selected = "A1";
  private anchor = "A1";
  private editor: HTMLInputElement | null = null;
  private editorCell: HTMLTableCellElement | null = null;
  private editorOriginal = "";
  /** a change came while the editor was open: every row in view is looked at again when it closes */
  private staleWhileEditing = false;
  private table: HTMLTableElement | null = null;
  private frame: Frame | null = null;
  private head: HTMLTableSectionElement | null = null;
  private colHeads: HTMLTableCellElement[] = [];
  private topSpacer: HTMLTableCellElement | null = null;
  private bottomSpacer: HTMLTableCellElement | null = null;
  private body: HTMLTableSectionElement | null = null;
  /** the rows drawn, first to last (a contiguous run), and each drawn cell by address */
  private drawn = new Map<number, DrawnRow>();
  private first = 0;
  private last = -1;
  private readonly cellEls = new Map<string, HTMLTableCellElement>();
  private readonly looks = new WeakMap<HTMLTableCellElement, CellLook>();
  private tabsKey = "";
  /** frames laid out so far */
  private frames = 0;
  private dragging = false;
  private readonly virtualizer: Virtualizer<HTMLElement, HTMLTableRowElement>;
  private readonly stop: () => void;
  private readonly unmount: () => void;

  constructor(
    private readonly wb: PreviewWorkbook,
    private readonly el: GridElements,
  ) {
    this.virtualizer = new Virtualizer<HTMLElement, HTMLTableRowElement>({
      count: 0,
      getScrollElement: () => el.sheet,
      estimateSize: (i) => this.rowPx(i),
      // a new frame (another sheet, other heights) measures its rows anew
      getItemKey: (i) => `${this.frames}:${i}`,
      scrollToFn: elementScroll,
      observeElementRect,
      observeElementOffset,
      overscan: OVERSCAN_ROWS,
      initialRect: { width: el.sheet.clientWidth, height: el.sheet.clientHeight },
      // scrolled or resized, or a row measured: the rows in view may be others
      onChange: () => this.drawWindow(),
    });
    this.unmount = this.virtualizer._didMount();
    this.stop = wb.onChange((change) => this.changed(change));
    el.sheet.tabIndex = 0;
    el.sheet.addEventListener("keydown", (e) => this.onKey(e));
    el.sheet.addEventListener("mousedown", (e) => this.onMouse(e));
    el.sheet.addEventListener("mouseover", (e) => this.onDrag(e));
    window.addEventListener("mouseup", () => (this.dragging = false));
    el.sheet.addEventListener("dblclick", (e) => {
      const a = this.addressOf(e.target);
      if (a) this.startEdit(null);
    });
    el.formulaBar.addEventListener("keydown", (e) => {
      if (e.key === "Enter") {
        e.preventDefault();
        this.commit(el.formulaBar.value, "down");
        el.sheet.focus();
      } else if (e.key === "Escape") {
        e.preventDefault();
        this.showSelection();
        el.sheet.focus();
      }
    });
    this.virtualizer._willUpdate();
    this.render();
  }

  dispose(): void {
    this.stop();
    this.unmount();
  }

  get sheet(): string {
    return this.wb.activeSheet;
  }

  get selection(): string {
    return this.selected;
  }

  /** Select a cell of the active sheet (the selection becomes that one cell). */
  select(address: string): void {
    this.selectRange(address, address);
  }

  /**
   * The selection: the block between the anchor and the active cell, written top-left:bottom-right even for one cell
   * ("B3:D7", "B3:B3"), and the active cell (where typing goes; one corner of the block).
   */
  selectionRange(): { sheet: string; range: string; active: string } {
    const b = blockOf(this.anchor, this.selected);
    const range = `${cellAddress({ row: b.top, col: b.left })}:${cellAddress({ row: b.bottom, col: b.right })}`;
    return { sheet: this.wb.activeSheet, range, active: this.selected };
  }

  /** Select the block between `anchor` and `active` on the active sheet; `active` becomes the active cell. */
  selectRange(anchor: string, active: string): void {
    const a = cellAddress(parseCell(anchor));
    const b = cellAddress(parseCell(active));
    this.cancelEdit();
    this.setSelection(a, b);
  }

  // ─── Drawing ───────────────────────────────────────────────────────────────────────────────────────────────────

  /** Draw again whatever changed in view: the sheet's frame, then every cell in view against what it shows. */
  render(): void {
    this.changed({});
  }

  /** The workbook changed: lay the table out again if its frame changed, else draw the cells that changed anew. */
  private changed(change: WorkbookChange): void {
    if (this.editor) {
      // the editor stays under the user's fingers; what changed meanwhile is drawn when it closes
      this.staleWhileEditing = true;
      return;
    }
    if (!change.cells) this.renderTabs();
    const frame = this.makeFrame();
    if (!this.frame || frame.key !== this.frame.key) {
      this.layOut(frame);
      this.showSelection();
      return;
    }
    if (change.cells) {
      const touched = change.cells.get(this.wb.activeSheet);
      if (!touched) return;
      const rows = new Set<number>();
      for (const address of touched) {
        const r = parseCell(address).row;
        if (this.drawn.has(r)) rows.add(r);
      }
      for (const r of rows) this.refreshRow(r);
      if (touched.has(this.selected)) this.showSelection(false);
    } else {
      for (const r of this.drawn.keys()) this.refreshRow(r);
      this.showSelection(false);
    }
  }

  private makeFrame(): Frame {
    const sheets = this.wb.sheetNames();
    if (!sheets.includes(this.wb.activeSheet)) this.wb.activeSheet = sheets[0];
    const sheet = this.wb.activeSheet;
    const { rows, cols } = this.wb.extent(sheet);
    const nRows = Math.max(rows + SPARE_ROWS, MIN_ROWS);
    const nCols = Math.max(cols + SPARE_COLS, MIN_COLS);
    const widths = this.wb.columnWidths(sheet);
    const heights = this.wb.rowHeights(sheet);
    const mergedRanges = this.wb.mergedRanges(sheet);
    const colPx = Array.from({ length: nCols }, (_, c) => Math.round((widths[c] ?? DEFAULT_COLUMN_WIDTH_PT) * PX_PER_PT));
    const covered = new Map<string, { rows: number; cols: number } | null>();
    const merges: Block[] = [];
    for (const m of mergedRanges) {
      const r = parseRange(m);
      merges.push({ top: r.start.row, left: r.start.col, bottom: r.start.row + r.rows - 1, right: r.start.col + r.cols - 1 });
      for (let i = 0; i < r.rows; i++)
        for (let k = 0; k < r.cols; k++) covered.set(cellAddress({ row: r.start.row + i, col: r.start.col + k }), i || k ? null : { rows: r.rows, cols: r.cols });
    }
    const key = JSON.stringify([sheet, nRows, colPx, heights, mergedRanges]);
    return { key, sheet, nRows, nCols, colPx, heights, covered, merges };
  }

  private rowPx(r: number): number {
    const h = this.frame?.heights[r];
    return h ? Math.round(h * PX_PER_PT) : ROW_PX;
  }

  /** A new table for a new frame (another sheet, rows or columns added, widths, heights or merges changed). */
  private layOut(frame: Frame): void {
    const sameSheet = this.frame?.sheet === frame.sheet;
    this.frame = frame;
    this.frames++;
    const { nRows, nCols, colPx } = frame;
    const sel = parseCell(this.selected);
    if (sel.row >= nRows || sel.col >= nCols) this.selected = this.anchor = "A1";
    const anchor = parseCell(this.anchor);
    if (anchor.row >= nRows || anchor.col >= nCols) this.anchor = this.selected;

    const table = document.createElement("table");
    table.className = "grid";
    const colgroup = document.createElement("colgroup");
    const corner = document.createElement("col");
    corner.style.width = `${ROW_HEAD_PX}px`;
    colgroup.append(corner);
    let total = ROW_HEAD_PX;
    for (const px of colPx) {
      const col = document.createElement("col");
      col.style.width = `${px}px`;
      total += px;
      colgroup.append(col);
    }
    // a fixed layout needs the table's own width: then columns keep their widths whatever the text in them
    table.style.width = `${total}px`;
    table.append(colgroup);

    const head = document.createElement("thead");
    const hr = document.createElement("tr");
    hr.append(Object.assign(document.createElement("th"), { className: "corner" }));
    this.colHeads = [];
    for (let c = 0; c < nCols; c++) {
      const th = document.createElement("th");
      th.textContent = columnLetters(c);
      this.colHeads.push(th);
      hr.append(th);
    }
    head.append(hr);
    table.append(head);

    // the rows out of view are two spacers, above and below those drawn
    const body = document.createElement("tbody");
    const spacer = () => {
      const tr = document.createElement("tr");
      tr.className = "spacer";
      const td = document.createElement("td");
      td.colSpan = nCols + 1;
      tr.append(td);
      body.append(tr);
      return td;
    };
    this.topSpacer = spacer();
    this.bottomSpacer = spacer();
    table.append(body);

    this.table = table;
    this.head = head;
    this.body = body;
    this.drawn.clear();
    this.cellEls.clear();
    this.first = 0;
    this.last = -1;
    const scroll = sameSheet ? { top: this.el.sheet.scrollTop, left: this.el.sheet.scrollLeft } : { top: 0, left: 0 };
    this.el.sheet.replaceChildren(table);
    this.virtualizer.setOptions({ ...this.virtualizer.options, count: nRows, scrollMargin: head.offsetHeight });
    this.virtualizer.measure();
    this.el.sheet.scrollTop = scroll.top;
    this.el.sheet.scrollLeft = scroll.left;
    this.drawWindow();
    this.paintHeads(null);
  }

  /** The rows in view (with the overscan), widened to take in whole every merged block they cut. */
  private wantedRows(): { first: number; last: number } {
    const frame = this.frame!;
    const v = this.virtualizer;
    const margin = v.options.scrollMargin;
    const top = this.el.sheet.scrollTop;
    const height = this.el.sheet.clientHeight || v.options.initialRect?.height || 600;
    let first = (v.getVirtualItemForOffset(top + margin)?.index ?? 0) - OVERSCAN_ROWS;
    let last = (v.getVirtualItemForOffset(top + height)?.index ?? 0) + OVERSCAN_ROWS;
    first = Math.max(0, first);
    last = Math.min(frame.nRows - 1, Math.max(first, last));
    for (let grew = true; grew; ) {
      grew = false;
      for (const m of frame.merges) {
        if (m.bottom < first || m.top > last) continue;
        if (m.top < first) [first, grew] = [m.top, true];
        if (m.bottom > last) [last, grew] = [Math.min(frame.nRows - 1, m.bottom), true];
      }
    }
    return { first, last };
  }

  private drawing = false;

  /** Draw the rows now in view, drop those out of it, and size the spacers. */
  private drawWindow(): void {
    if (!this.frame || !this.body || this.drawing) return;
    this.drawing = true;
    try {
      const { first, last } = this.wantedRows();
      if (first !== this.first || last !== this.last) {
        for (const [r, row] of [...this.drawn]) {
          if (r >= first && r <= last) continue;
          if (this.editorCell && row.tr.contains(this.editorCell)) continue; // never pull the editor away
          this.dropRow(r, row);
        }
        const above: HTMLTableRowElement[] = [];
        const below: HTMLTableRowElement[] = [];
        const overlap = this.drawn.size > 0;
        for (let r = first; r <= last; r++) {
          if (this.drawn.has(r)) continue;
          const tr = this.drawRow(r);
          (overlap && r < this.first ? above : below).push(tr);
        }
        if (above.length) this.topSpacer!.parentElement!.after(...above);
        if (below.length) this.bottomSpacer!.parentElement!.before(...below);
        // the edited row kept outside the window stays in sheet order: the window's rows move around it (moving the
        // editor's own row would take the focus from it)
        const kept = this.keptRow(first, last);
        if (kept) {
          const rows = [...this.drawn].filter(([r]) => r !== kept.r).sort(([a], [b]) => a - b).map(([, row]) => row.tr);
          if (kept.r < first) kept.tr.after(...rows);
          else kept.tr.before(...rows);
        }
        this.first = first;
        this.last = last;
      }
      const items = this.virtualizer.measurementsCache;
      const margin = this.virtualizer.options.scrollMargin;
      // the kept row's own height comes off the spacer on its side, so the window's rows stay where they belong
      const kept = this.keptRow(first, last);
      const keptPx = kept ? (items[kept.r]?.size ?? 0) : 0;
      const topPx = Math.max(0, (items[first] ? items[first].start - margin : 0) - (kept && kept.r < first ? keptPx : 0));
      const bottomPx = Math.max(0, (items[last] && items.length ? items[items.length - 1].end - items[last].end : 0) - (kept && kept.r > last ? keptPx : 0));
      setHeight(this.topSpacer!, topPx);
      setHeight(this.bottomSpacer!, bottomPx);
    } finally {
      this.drawing = false;
    }
  }

  /** The drawn row holding the editor when it lies outside the window `first`..`last`. */
  private keptRow(first: number, last: number): { r: number; tr: HTMLTableRowElement } | undefined {
    if (!this.editorCell) return undefined;
    for (const [r, row] of this.drawn) {
      if ((r < first || r > last) && row.tr.contains(this.editorCell)) return { r, tr: row.tr };
    }
    return undefined;
  }

  private dropRow(r: number, row: DrawnRow): void {
    for (const td of row.cells.values()) this.cellEls.delete(td.dataset.address!);
    row.tr.remove();
    this.drawn.delete(r);
  }

  /** A row of the table, its cells filled and the selection marked. */
  private drawRow(r: number): HTMLTableRowElement {
    const frame = this.frame!;
    const tr = document.createElement("tr");
    tr.dataset.index = String(r);
    const h = frame.heights[r];
    if (h) tr.style.height = `${Math.round(h * PX_PER_PT)}px`;
    const th = document.createElement("th");
    th.textContent = String(r + 1);
    tr.append(th);
    const block = this.block();
    if (r >= block.top && r <= block.bottom) th.classList.add("current");
    const cells = new Map<number, HTMLTableCellElement>();
    const looks = this.rowLooks(r);
    for (const [c, look] of looks) {
      const address = cellAddress({ row: r, col: c });
      const td = document.createElement("td");
      const merge = frame.covered.get(address);
      if (merge) {
        td.colSpan = merge.cols;
        td.rowSpan = merge.rows;
      }
      td.dataset.address = address;
      td.append(Object.assign(document.createElement("span"), { className: "v" }));
      this.fill(td, look);
      cells.set(c, td);
      this.cellEls.set(address, td);
      tr.append(td);
    }
    this.drawn.set(r, { tr, th, cells });
    this.virtualizer.measureElement(tr);
    return tr;
  }

  /** Look at a drawn row's cells again and draw anew those whose look changed. */
  private refreshRow(r: number): void {
    const row = this.drawn.get(r);
    if (!row) return;
    for (const [c, look] of this.rowLooks(r)) {
      const td = row.cells.get(c);
      if (td && td !== this.editorCell) this.fill(td, look);
    }
  }

  /** What each cell of row `r` shows (merged-over cells left out): its classes, text, title, overflow. */
  private rowLooks(r: number): Map<number, CellLook> {
    const frame = this.frame!;
    const { nCols, colPx, covered } = frame;
    const sheet = frame.sheet;
    const views = Array.from({ length: nCols }, (_, c) => this.wb.cell(sheet, cellAddress({ row: r, col: c })));
    const out = new Map<number, CellLook>();
    for (let c = 0; c < nCols; c++) {
      const address = cellAddress({ row: r, col: c });
      const merge = covered.get(address);
      if (merge === null) continue;
      const view = views[c];
      let room = 0;
      if (!merge && typeof view.value === "string" && view.value) {
        let k = c + 1;
        while (k < nCols && isEmpty(views[k]) && !covered.has(cellAddress({ row: r, col: k }))) k++;
        if (k > c + 1) for (let j = c; j < k; j++) room += colPx[j];
        room = Math.max(0, room - CELL_PADDING_PX);
      }
      out.set(c, this.lookOf(view, room, merge !== undefined));
    }
    return out;
  }

  /** `overflowPx`: the width text may take, own cell and the empty cells after it (0: its own cell only). */
  private lookOf(v: CellView, overflowPx: number, merged: boolean): CellLook {
    const classes: string[] = [];
    let title = "";
    let demo = false;
    if (merged) classes.push("merged");
    const role = v.style?.role;
    if (role) classes.push(`role-${role}`);
    else if (isFormula(v.content)) classes.push("role-computed");
    if (v.style?.bold) classes.push("bold");
    if (v.style?.italic) classes.push("italic");
    if (v.style?.wrap) classes.push("wrap");
    if (v.style?.demo) {
      classes.push("demo");
      demo = true;
      title = DEMO_NOTE;
    }
    const value = v.value;
    let text = v.display;
    if (value !== null && typeof value === "object") {
      classes.push("error");
      title = value.message ? `${value.error} ${value.message}` : value.error;
      // a whole spill that failed repeats its anchor's error in every cell: show it once, at the anchor
      if (v.spilledFrom) {
        const anchor = this.wb.value(this.wb.activeSheet, v.spilledFrom);
        if (anchor !== null && typeof anchor === "object" && anchor.error === value.error && anchor.message === value.message) {
          classes.push("error-echo");
          text = "";
        }
      }
    } else if (typeof value === "number") {
      classes.push("number");
    } else if (typeof value === "boolean") {
      classes.push("boolean");
    }
    if (v.spilledFrom) {
      classes.push("spilled");
      if (!title) title = `Spilled from ${v.spilledFrom}`;
    }
    if (v.spillRange) classes.push("spill-anchor");
    // text runs on over the empty cells to its right, as in a spreadsheet, and stops at the next one in use
    let overflow = 0;
    if (overflowPx > 0 && typeof value === "string" && value && !v.style?.wrap && !merged) {
      classes.push("overflow");
      overflow = overflowPx;
    }
    return { classes: classes.join(" "), text, title, demo, overflowPx: overflow };
  }

  /** Draw `look` into a cell, touching only what differs from what it shows. */
  private fill(td: HTMLTableCellElement, look: CellLook, force = false): void {
    const before = this.looks.get(td);
    if (!force && before && sameLook(before, look)) return;
    this.looks.set(td, look);
    const address = td.dataset.address!;
    const classes = this.withSelection(look.classes, address);
    if (td.className !== classes) td.className = classes;
    if (td.title !== look.title) {
      if (look.title) td.title = look.title;
      else td.removeAttribute("title");
    }
    if (look.demo && td.dataset.demo !== "true") td.dataset.demo = "true";
    else if (!look.demo && td.dataset.demo !== undefined) delete td.dataset.demo;
    let span = td.firstElementChild as HTMLElement | null;
    if (!span || span.tagName !== "SPAN" || td.childNodes.length !== 1) {
      span = Object.assign(document.createElement("span"), { className: "v" });
      td.replaceChildren(span);
    }
    if (span.textContent !== look.text) span.textContent = look.text;
    const width = look.overflowPx ? `${look.overflowPx}px` : "";
    if (span.style.width !== width) span.style.width = width;
  }

  /** A cell's classes with the selection's marks. */
  private withSelection(classes: string, address: string): string {
    const b = this.block();
    const { row, col } = parseCell(address);
    const several = b.bottom > b.top || b.right > b.left;
    let out = classes;
    if (several && row >= b.top && row <= b.bottom && col >= b.left && col <= b.right) out += " in-range";
    if (address === this.selected) out += " selected";
    if (this.editorCell && this.cellEls.get(address) === this.editorCell) out += " editing";
    return out.trim();
  }

  private block(): Block {
    return blockOf(this.anchor, this.selected);
  }

  /** Move the selection: only the cells leaving or entering it, and the headers, are drawn again. */
  private setSelection(anchor: string, active: string): void {
    const before = this.block();
    this.anchor = anchor;
    this.selected = active;
    const after = this.block();
    for (const b of [before, after]) {
      for (let r = Math.max(b.top, this.first); r <= Math.min(b.bottom, this.last); r++) {
        const row = this.drawn.get(r);
        if (!row) continue;
        for (let c = b.left; c <= b.right; c++) {
          const td = row.cells.get(c);
          const look = td && this.looks.get(td);
          if (td && look) {
            const classes = this.withSelection(look.classes, td.dataset.address!);
            if (td.className !== classes) td.className = classes;
          }
        }
      }
    }
    this.paintHeads(before);
    this.showSelection();
  }

  /** The headers of the selection's rows and columns marked "current" (`before`: the block they marked so far). */
  private paintHeads(before: Block | null): void {
    const b = this.block();
    this.colHeads.forEach((th, c) => {
      const on = c >= b.left && c <= b.right;
      if (th.classList.contains("current") !== on) th.classList.toggle("current", on);
    });
    const rows = before ? [before, b] : [{ top: this.first, bottom: this.last }];
    for (const x of rows) {
      for (let r = Math.max(x.top, this.first); r <= Math.min(x.bottom, this.last); r++) {
        const th = this.drawn.get(r)?.th;
        const on = r >= b.top && r <= b.bottom;
        if (th && th.classList.contains("current") !== on) th.classList.toggle("current", on);
      }
    }
  }

  private renderTabs(): void {
    const key = JSON.stringify([this.wb.sheetNames(), this.wb.activeSheet]);
    if (key === this.tabsKey) return;
    this.tabsKey = key;
    const tabs = this.wb.sheetNames().map((name) => {
      const b = document.createElement("button");
      b.type = "button";
      b.className = "tab";
      b.textContent = name;
      b.dataset.sheet = name;
      b.setAttribute("role", "tab");
      b.setAttribute("aria-selected", String(name === this.wb.activeSheet));
      b.addEventListener("click", () => {
        this.cancelEdit();
        if (name !== this.wb.activeSheet) {
          this.selected = this.anchor = "A1";
          this.wb.activate(name);
        }
      });
      return b;
    });
    const add = document.createElement("button");
    add.type = "button";
    add.className = "tab add";
    add.textContent = "+";
    add.title = "Add an empty sheet";
    add.addEventListener("click", () => {
      const name = this.wb.addSheet({ name: `Sheet${this.wb.sheetNames().length + 1}`, cells: {} });
      this.selected = this.anchor = "A1";
      this.wb.activate(name);
    });
    this.el.tabs.replaceChildren(...tabs, add);
  }

  /** Formula bar, name box and message line for the selected cell; `scroll`: bring it into view. */
  private showSelection(scroll = true): void {
    const v = this.wb.cell(this.wb.activeSheet, this.selected);
    const box = this.el.nameBox;
    if (box instanceof HTMLInputElement) {
      if (document.activeElement !== box && box.value !== this.selected) box.value = this.selected;
    } else if (box.textContent !== this.selected) box.textContent = this.selected;
    if (document.activeElement !== this.el.formulaBar) {
      const text = contentText(v.content);
      if (this.el.formulaBar.value !== text) this.el.formulaBar.value = text;
    }
    const value = v.value;
    let message: string;
    const isError = value !== null && typeof value === "object";
    if (isError) {
      message = `${value.error}  ${value.message ?? "(no message)"}`;
    } else if (v.spilledFrom) {
      const anchor = this.wb.content(this.wb.activeSheet, v.spilledFrom);
      message = `Spilled from ${v.spilledFrom}: ${String(anchor)}`;
    } else {
      message = isShareStamp(this.wb.value(this.wb.activeSheet, "A1")) ? FROZEN_CELL : describeRole(v);
    }
    if (this.el.message.classList.contains("is-error") !== isError) this.el.message.classList.toggle("is-error", isError);
    if (this.el.message.textContent !== message) this.el.message.textContent = message;
    if (scroll) this.scrollToCell(this.selected);
  }

  /**
   * Scroll the active sheet so that a cell is in view, drawing its row if it was out of view (the selection stays);
   * returns its <td> (a merged block's top-left cell for a cell under it), or null past the grid's last row.
   */
  scrollToCell(address: string): HTMLTableCellElement | null {
    address = cellAddress(parseCell(address));
    const { row } = parseCell(address);
    if (!this.frame || row >= this.frame.nRows) return null;
    if (row < this.first || row > this.last || !this.cellEls.has(address)) {
      // out of view: scroll the row to the nearest edge by the virtualiser's offsets, then draw what is now in view
      const item = this.virtualizer.measurementsCache[row];
      const margin = this.virtualizer.options.scrollMargin;
      const view = this.el.sheet.clientHeight - margin;
      if (item) {
        const top = item.start - margin;
        this.el.sheet.scrollTop = top < this.el.sheet.scrollTop ? top : Math.max(0, item.end - margin - view);
      }
      this.drawWindow();
    }
    const td = this.cellElement(address);
    td?.scrollIntoView({ block: "nearest", inline: "nearest" });
    return td;
  }

  private cellElement(address: string): HTMLTableCellElement | null {
    const td = this.cellEls.get(address);
    if (td) return td;
    // a cell under a merged block: its top-left cell
    const frame = this.frame;
    if (!frame || !frame.covered.has(address)) return null;
    const { row, col } = parseCell(address);
    const m = frame.merges.find((b) => row >= b.top && row <= b.bottom && col >= b.left && col <= b.right);
    return m ? (this.cellEls.get(cellAddress({ row: m.top, col: m.left })) ?? null) : null;
  }

  // ─── Editing ───────────────────────────────────────────────────────────────────────────────────────────────────

  private addressOf(target: EventTarget | null): string | undefined {
    const td = (target as HTMLElement | null)?.closest?.("td[data-address]") as HTMLElement | null;
    return td?.dataset.address;
  }

  private onMouse(e: MouseEvent): void {
    if (e.target instanceof HTMLInputElement) return;
    const a = this.addressOf(e.target);
    if (!a) return;
    if (this.editor) this.commit(this.editor.value, null);
    this.setSelection(e.shiftKey ? this.anchor : a, a);
    this.dragging = e.button === 0;
    this.el.sheet.focus({ preventScroll: true });
    e.preventDefault();
  }

  /** A drag with the button held: the block runs from where it started to the cell under the pointer. */
  private onDrag(e: MouseEvent): void {
    if (!this.dragging || this.editor) return;
    if (!(e.buttons & 1)) {
      this.dragging = false;
      return;
    }
    const a = this.addressOf(e.target);
    if (a && a !== this.selected) this.setSelection(this.anchor, a);
  }

  /** Start editing the selected cell: with `initial` typed text replacing it, or its content (null). */
  startEdit(initial: string | null): void {
    const td = this.scrollToCell(this.selected);
    if (!td) return;
    const content = contentText(this.wb.content(this.wb.activeSheet, this.selected));
    const input = document.createElement("input");
    input.className = "cell-editor";
    input.dataset.role = "cell-editor";
    input.value = initial ?? content;
    this.editorOriginal = content;
    input.addEventListener("keydown", (e) => {
      e.stopPropagation();
      if (e.key === "Enter") {
        e.preventDefault();
        this.commit(input.value, e.shiftKey ? "up" : "down");
      } else if (e.key === "Tab") {
        e.preventDefault();
        this.commit(input.value, e.shiftKey ? "left" : "right");
      } else if (e.key === "Escape") {
        e.preventDefault();
        this.cancelEdit();
        this.el.sheet.focus();
      }
    });
    input.addEventListener("input", () => (this.el.formulaBar.value = input.value));
    td.replaceChildren(input);
    td.classList.add("editing");
    this.editor = input;
    this.editorCell = td;
    this.el.formulaBar.value = input.value;
    input.focus();
    input.setSelectionRange(input.value.length, input.value.length);
  }

  /** Close the editor: its cell shows its value again, and what changed meanwhile is drawn. */
  private closeEditor(): void {
    const td = this.editorCell;
    this.editor = null;
    this.editorCell = null;
    if (td?.isConnected) {
      const r = parseCell(td.dataset.address!).row;
      const look = this.frame && this.drawn.has(r) ? this.rowLooks(r).get(parseCell(td.dataset.address!).col) : undefined;
      if (look) this.fill(td, look, true);
      else td.remove();
    }
    if (this.staleWhileEditing) {
      this.staleWhileEditing = false;
      this.render();
    }
  }

  private cancelEdit(): void {
    if (!this.editor) return;
    this.closeEditor();
    this.showSelection();
  }

  /** Write `typed` into the selected cell and move. */
  commit(typed: string, move: Direction | null): void {
    const editing = this.editor;
    if (editing) this.closeEditor();
    // the same text committed again changes nothing, except that a demo value becomes the user's own
    const unchanged = editing && typed === this.editorOriginal && !this.wb.style(this.wb.activeSheet, this.selected)?.demo;
    if (!unchanged) this.wb.setTyped(this.wb.activeSheet, this.selected, typed);
    if (move) this.move(move);
    else this.showSelection();
    if (editing) this.el.sheet.focus({ preventScroll: true });
  }

  /**
   * Commit the cell being edited, if any, into its own cell (as a click elsewhere would), before a command changes
   * the sheet or the selection; the keyboard focus stays where it was, unless it was in the editor.
   */
  commitEdit(): void {
    const editor = this.editor;
    if (!editor) return;
    const focused = document.activeElement;
    this.commit(editor.value, null);
    if (focused instanceof HTMLElement && focused !== editor && focused.isConnected) focused.focus({ preventScroll: true });
  }

  /** Move the active cell to `to`; `extend` keeps the anchor (the block grows or shrinks), else the block is one cell. */
  private moveTo(to: { row: number; col: number }, extend: boolean): void {
    const frame = this.frame;
    const row = Math.max(0, Math.min(to.row, (frame?.nRows ?? 1) - 1));
    const col = Math.max(0, Math.min(to.col, (frame?.nCols ?? 1) - 1));
    const active = cellAddress({ row, col });
    this.setSelection(extend ? this.anchor : active, active);
  }

  /** One step; `extend` keeps the anchor. */
  private move(dir: Direction, extend = false): void {
    const a = parseCell(this.selected);
    this.moveTo({ row: a.row + (dir === "down" ? 1 : dir === "up" ? -1 : 0), col: a.col + (dir === "right" ? 1 : dir === "left" ? -1 : 0) }, extend);
  }

  /** Whether a cell of the active sheet holds nothing (no content, no value). */
  private blank(row: number, col: number): boolean {
    const address = cellAddress({ row, col });
    const sheet = this.wb.activeSheet;
    const v = this.wb.value(sheet, address);
    return (v === null || v === "") && this.wb.content(sheet, address) === null;
  }

  /**
   * Where Ctrl+arrow goes from the active cell, as in a spreadsheet: from a cell in use with its neighbour in use, to
   * the last cell in use before a blank; otherwise to the next cell in use; with none, to the grid's edge.
   */
  private dataEdge(dir: Direction): { row: number; col: number } {
    const frame = this.frame!;
    const { row, col } = parseCell(this.selected);
    const dr = dir === "down" ? 1 : dir === "up" ? -1 : 0;
    const dc = dir === "right" ? 1 : dir === "left" ? -1 : 0;
    const inside = (r: number, c: number) => r >= 0 && c >= 0 && r < frame.nRows && c < frame.nCols;
    let r = row + dr;
    let c = col + dc;
    if (!inside(r, c)) return { row, col };
    if (!this.blank(row, col) && !this.blank(r, c)) {
      while (inside(r + dr, c + dc) && !this.blank(r + dr, c + dc)) [r, c] = [r + dr, c + dc];
      return { row: r, col: c };
    }
    while (inside(r, c) && this.blank(r, c)) [r, c] = [r + dr, c + dc];
    return inside(r, c) ? { row: r, col: c } : { row: r - dr, col: c - dc };
  }

  /** The row one screen up or down from `row`: as many rows as fit in the view, by the virtualiser's row sizes. */
  private pageRow(row: number, dir: 1 | -1): number {
    const v = this.virtualizer;
    const items = v.measurementsCache;
    const page = Math.max(ROW_PX, this.el.sheet.clientHeight - v.options.scrollMargin);
    let to = row;
    let used = 0;
    while (items[to + dir] && used + items[to + dir].size <= page) {
      to += dir;
      used += items[to].size;
    }
    return to === row ? row + dir : to;
  }

  private onKey(e: KeyboardEvent): void {
    if (e.target !== this.el.sheet) return;
    // an editor left open while the grid itself has the keys (a button took the focus) is committed first
    this.commitEdit();
    const moves: Record<string, Direction> = {
      ArrowDown: "down",
      ArrowUp: "up",
      ArrowLeft: "left",
      ArrowRight: "right",
    };
    const ctrl = e.ctrlKey || e.metaKey;
    const here = parseCell(this.selected);
    if (ctrl && (e.key === "z" || e.key === "Z")) {
      e.preventDefault();
      if (e.shiftKey) this.wb.redo();
      else this.wb.undo();
      return;
    }
    if (ctrl && (e.key === "y" || e.key === "Y")) {
      e.preventDefault();
      this.wb.redo();
      return;
    }
    if (e.key === "Tab") {
      e.preventDefault();
      this.move(e.shiftKey ? "left" : "right");
    } else if (e.key === "Enter") {
      e.preventDefault();
      this.move(e.shiftKey ? "up" : "down");
    } else if (moves[e.key]) {
      e.preventDefault();
      if (ctrl) this.moveTo(this.dataEdge(moves[e.key]), e.shiftKey);
      else this.move(moves[e.key], e.shiftKey);
    } else if (e.key === "Home") {
      e.preventDefault();
      this.moveTo(ctrl ? { row: 0, col: 0 } : { row: here.row, col: 0 }, e.shiftKey);
    } else if (e.key === "End" && ctrl) {
      e.preventDefault();
      const { rows, cols } = this.wb.extent(this.wb.activeSheet);
      this.moveTo({ row: rows - 1, col: cols - 1 }, e.shiftKey);
    } else if (e.key === "PageDown" || e.key === "PageUp") {
      e.preventDefault();
      const dir = e.key === "PageDown" ? 1 : -1;
      const to = this.pageRow(here.row, dir);
      // the view moves by the same screen, so that the active cell keeps its place on it
      this.el.sheet.scrollTop += (this.virtualizer.measurementsCache[Math.max(0, Math.min(to, (this.frame?.nRows ?? 1) - 1))]?.start ?? 0) - (this.virtualizer.measurementsCache[here.row]?.start ?? 0);
      this.drawWindow();
      this.moveTo({ row: to, col: here.col }, e.shiftKey);
    } else if (e.key === "F2") {
      e.preventDefault();
      this.startEdit(null);
    } else if (e.key === "Delete" || e.key === "Backspace") {
      e.preventDefault();
      this.wb.setContent(this.wb.activeSheet, this.selected, null);
    } else if (e.key.length === 1 && !ctrl && !e.altKey) {
      e.preventDefault();
      this.startEdit(e.key);
    }
  }
}

function setHeight(td: HTMLTableCellElement, px: number): void {
  const h = `${Math.max(0, Math.round(px))}px`;
  if (td.style.height !== h) td.style.height = h;
}
