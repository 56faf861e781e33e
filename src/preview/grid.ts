/**
 * The preview's grid: one sheet of the preview workbook as a table, with a formula bar, a message line, sheet tabs
 * and keyboard editing. Our own simple design; a spreadsheet's familiar gestures:
 *   click or arrow keys select · type to replace, F2 or double-click to edit in place · Enter commits and moves down,
 *   Tab moves right, Escape cancels · Delete clears · Ctrl+Z / Ctrl+Y undo and redo · the formula bar edits the
 *   selected cell too.
 * Every cell of the active sheet carries data-address ("B7"); inputs, computed cells, spilled cells and errors each
 * have their class; an error cell's message is its title and shows on the message line when selected.
 */
import { cellAddress, columnLetters, parseCell, parseRange } from "../workbook/a1";
import { DEFAULT_COLUMN_WIDTH_PT } from "../workbook/look";
import { contentText } from "./format";
import { isFormula } from "./model";
import type { CellView, PreviewWorkbook } from "./workbook";

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

export class Grid {
  /** the active cell (where typing goes) and the anchor: the selection is the block between them */
  private selected = "A1";
  private anchor = "A1";
  private editor: HTMLInputElement | null = null;
  private editorOriginal = "";
  private table: HTMLTableElement | null = null;
  private readonly stop: () => void;

  constructor(
    private readonly wb: PreviewWorkbook,
    private readonly el: GridElements,
  ) {
    this.stop = wb.onChange(() => this.render());
    el.sheet.tabIndex = 0;
    el.sheet.addEventListener("keydown", (e) => this.onKey(e));
    el.sheet.addEventListener("mousedown", (e) => this.onMouse(e));
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
    this.render();
  }

  dispose(): void {
    this.stop();
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
    this.cancelEdit();
    this.anchor = cellAddress(parseCell(anchor));
    this.selected = cellAddress(parseCell(active));
    this.render();
  }

  // ─── Drawing ───────────────────────────────────────────────────────────────────────────────────────────────────

  render(): void {
    if (this.editor) return; // don't pull the editor from under the user; redraw on commit
    const sheet = this.wb.activeSheet;
    if (!this.wb.sheetNames().includes(sheet)) this.wb.activeSheet = this.wb.sheetNames()[0];
    this.renderTabs();
    const { rows, cols } = this.wb.extent(this.wb.activeSheet);
    const nRows = Math.max(rows + SPARE_ROWS, MIN_ROWS);
    const nCols = Math.max(cols + SPARE_COLS, MIN_COLS);
    const sel = parseCell(this.selected);
    if (sel.row >= nRows || sel.col >= nCols) this.selected = this.anchor = "A1";
    const anchor = parseCell(this.anchor);
    if (anchor.row >= nRows || anchor.col >= nCols) this.anchor = this.selected;
    const block = blockOf(this.anchor, this.selected);
    const several = block.bottom > block.top || block.right > block.left;

    const widths = this.wb.columnWidths(this.wb.activeSheet);
    const heights = this.wb.rowHeights(this.wb.activeSheet);
    const covered = new Map<string, { rows: number; cols: number } | null>();
    for (const m of this.wb.mergedRanges(this.wb.activeSheet)) {
      const r = parseRange(m);
      for (let i = 0; i < r.rows; i++)
        for (let k = 0; k < r.cols; k++) covered.set(cellAddress({ row: r.start.row + i, col: r.start.col + k }), i || k ? null : { rows: r.rows, cols: r.cols });
    }

    const table = document.createElement("table");
    table.className = "grid";
    const colgroup = document.createElement("colgroup");
    const corner = document.createElement("col");
    corner.style.width = `${ROW_HEAD_PX}px`;
    colgroup.append(corner);
    let total = ROW_HEAD_PX;
    const colPx: number[] = [];
    for (let c = 0; c < nCols; c++) {
      const col = document.createElement("col");
      const px = Math.round((widths[c] ?? DEFAULT_COLUMN_WIDTH_PT) * PX_PER_PT);
      col.style.width = `${px}px`;
      colPx.push(px);
      total += px;
      colgroup.append(col);
    }
    // a fixed layout needs the table's own width: then columns keep their widths whatever the text in them
    table.style.width = `${total}px`;
    table.append(colgroup);

    const head = document.createElement("thead");
    const hr = document.createElement("tr");
    hr.append(Object.assign(document.createElement("th"), { className: "corner" }));
    for (let c = 0; c < nCols; c++) {
      const th = document.createElement("th");
      th.textContent = columnLetters(c);
      if (c >= block.left && c <= block.right) th.classList.add("current");
      hr.append(th);
    }
    head.append(hr);
    table.append(head);

    const body = document.createElement("tbody");
    for (let r = 0; r < nRows; r++) {
      const tr = document.createElement("tr");
      if (heights[r]) tr.style.height = `${Math.round(heights[r] * PX_PER_PT)}px`;
      const th = document.createElement("th");
      th.textContent = String(r + 1);
      if (r >= block.top && r <= block.bottom) th.classList.add("current");
      tr.append(th);
      const views = Array.from({ length: nCols }, (_, c) => this.wb.cell(this.wb.activeSheet, cellAddress({ row: r, col: c })));
      for (let c = 0; c < nCols; c++) {
        const address = cellAddress({ row: r, col: c });
        const merge = covered.get(address);
        if (merge === null) continue;
        const td = document.createElement("td");
        if (merge) {
          td.colSpan = merge.cols;
          td.rowSpan = merge.rows;
          td.classList.add("merged");
        }
        td.dataset.address = address;
        const view = views[c];
        let room = 0;
        if (!merge && typeof view.value === "string" && view.value) {
          let k = c + 1;
          while (k < nCols && isEmpty(views[k]) && !covered.has(cellAddress({ row: r, col: k }))) k++;
          if (k > c + 1) for (let j = c; j < k; j++) room += colPx[j];
          room = Math.max(0, room - CELL_PADDING_PX);
        }
        this.fillCell(td, view, room);
        if (address === this.selected) td.classList.add("selected");
        if (several && r >= block.top && r <= block.bottom && c >= block.left && c <= block.right) td.classList.add("in-range");
        tr.append(td);
      }
      body.append(tr);
    }
    table.append(body);

    const scroll = { top: this.el.sheet.scrollTop, left: this.el.sheet.scrollLeft };
    this.el.sheet.replaceChildren(table);
    this.el.sheet.scrollTop = scroll.top;
    this.el.sheet.scrollLeft = scroll.left;
    this.table = table;
    this.showSelection();
  }

  /** `overflowPx`: the width text may take, own cell and the empty cells after it (0: its own cell only). */
  private fillCell(td: HTMLTableCellElement, v: CellView, overflowPx: number): void {
    const role = v.style?.role;
    if (role) td.classList.add(`role-${role}`);
    else if (isFormula(v.content)) td.classList.add("role-computed");
    if (v.style?.bold) td.classList.add("bold");
    if (v.style?.italic) td.classList.add("italic");
    if (v.style?.wrap) td.classList.add("wrap");
    if (v.style?.demo) {
      td.classList.add("demo");
      td.dataset.demo = "true";
      td.title = DEMO_NOTE;
    }
    const value = v.value;
    let shownText = v.display;
    if (value !== null && typeof value === "object") {
      td.classList.add("error");
      td.title = value.message ? `${value.error} ${value.message}` : value.error;
      // a whole spill that failed repeats its anchor's error in every cell: show it once, at the anchor
      if (v.spilledFrom) {
        const anchor = this.wb.value(this.wb.activeSheet, v.spilledFrom);
        if (anchor !== null && typeof anchor === "object" && anchor.error === value.error && anchor.message === value.message) {
          td.classList.add("error-echo");
          shownText = "";
        }
      }
    } else if (typeof value === "number") {
      td.classList.add("number");
    } else if (typeof value === "boolean") {
      td.classList.add("boolean");
    }
    if (v.spilledFrom) {
      td.classList.add("spilled");
      if (!td.title) td.title = `Spilled from ${v.spilledFrom}`;
    }
    if (v.spillRange) td.classList.add("spill-anchor");
    const span = document.createElement("span");
    span.className = "v";
    span.textContent = shownText;
    // text runs on over the empty cells to its right, as in a spreadsheet, and stops at the next one in use
    if (overflowPx > 0 && typeof value === "string" && value && !v.style?.wrap && td.colSpan === 1) {
      td.classList.add("overflow");
      span.style.width = `${overflowPx}px`;
    }
    td.append(span);
  }

  private renderTabs(): void {
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

  /** Formula bar, name box and message line for the selected cell. */
  private showSelection(): void {
    const v = this.wb.cell(this.wb.activeSheet, this.selected);
    this.el.nameBox.textContent = this.selected;
    if (document.activeElement !== this.el.formulaBar) this.el.formulaBar.value = contentText(v.content);
    const value = v.value;
    this.el.message.classList.remove("is-error");
    if (value !== null && typeof value === "object") {
      this.el.message.classList.add("is-error");
      this.el.message.textContent = `${value.error}  ${value.message ?? "(no message)"}`;
    } else if (v.spilledFrom) {
      const anchor = this.wb.content(this.wb.activeSheet, v.spilledFrom);
      this.el.message.textContent = `Spilled from ${v.spilledFrom}: ${String(anchor)}`;
    } else {
      this.el.message.textContent = describeRole(v);
    }
    const td = this.cellElement(this.selected);
    td?.scrollIntoView({ block: "nearest", inline: "nearest" });
  }

  private cellElement(address: string): HTMLTableCellElement | null {
    return this.table?.querySelector<HTMLTableCellElement>(`td[data-address="${address}"]`) ?? null;
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
    this.selected = a;
    if (!e.shiftKey) this.anchor = a;
    this.render();
    this.el.sheet.focus({ preventScroll: true });
    e.preventDefault();
  }

  /** Start editing the selected cell: with `initial` typed text replacing it, or its content (null). */
  startEdit(initial: string | null): void {
    const td = this.cellElement(this.selected);
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
    this.el.formulaBar.value = input.value;
    input.focus();
    input.setSelectionRange(input.value.length, input.value.length);
  }

  private cancelEdit(): void {
    if (!this.editor) return;
    this.editor = null;
    this.render();
  }

  /** Write `typed` into the selected cell and move. */
  commit(typed: string, move: "down" | "up" | "left" | "right" | null): void {
    const editing = this.editor;
    this.editor = null;
    // the same text committed again changes nothing, except that a demo value becomes the user's own
    const unchanged = editing && typed === this.editorOriginal && !this.wb.style(this.wb.activeSheet, this.selected)?.demo;
    if (!unchanged) this.wb.setTyped(this.wb.activeSheet, this.selected, typed);
    if (move) this.move(move);
    this.render();
    if (editing) this.el.sheet.focus({ preventScroll: true });
  }

  /** Move the active cell one step; `extend` keeps the anchor (the block grows or shrinks), else the block is one cell. */
  private move(dir: "down" | "up" | "left" | "right", extend = false): void {
    const a = parseCell(this.selected);
    const row = Math.max(0, a.row + (dir === "down" ? 1 : dir === "up" ? -1 : 0));
    const col = Math.max(0, a.col + (dir === "right" ? 1 : dir === "left" ? -1 : 0));
    this.selected = cellAddress({ row, col });
    if (!extend) this.anchor = this.selected;
  }

  private onKey(e: KeyboardEvent): void {
    if (this.editor || e.target !== this.el.sheet) return;
    const moves: Record<string, "down" | "up" | "left" | "right"> = {
      ArrowDown: "down",
      ArrowUp: "up",
      ArrowLeft: "left",
      ArrowRight: "right",
      Enter: "down",
    };
    const ctrl = e.ctrlKey || e.metaKey;
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
      this.render();
    } else if (moves[e.key]) {
      e.preventDefault();
      if (e.key === "Enter") this.move(e.shiftKey ? "up" : "down");
      else this.move(moves[e.key], e.shiftKey);
      this.render();
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
