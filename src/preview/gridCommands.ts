/**
 * What the preview's grid does beyond drawing and typing, through the Grid's public methods and the workbook:
 *   Ctrl+C / Ctrl+X / Ctrl+V copy, cut and paste the selected block (the system clipboard gets tab-separated text, and
 *   text pasted from another program goes in cell by cell as typed) · Insert rows / Delete rows (the buttons, or
 *   Ctrl+Shift+= and Ctrl+-) act on the selection's rows · the name box above the sheet goes to a cell, a block, another
 *   sheet's cell or a workbook name, and names the selection with a new name · focus: Tab from a cell not being edited
 *   goes on to the pane, Shift+Tab back to the formula bar; F6 and Shift+F6 cycle toolbar → name box and formula bar →
 *   grid → pane, so the keyboard never stays caught in the grid.
 */
import { absoluteRef, cellAddress, parseRange } from "../workbook/a1";
import type { Grid } from "./grid";
import { readNameBox } from "./nameBox";
import type { PreviewWorkbook } from "./workbook";

export interface CommandElements {
  /** the grid's scrolling element (focusable) */
  sheet: HTMLElement;
  nameBox: HTMLInputElement;
  formulaBar: HTMLInputElement;
  /** the message line under the formula bar */
  message: HTMLElement;
  /** the page's toolbar */
  toolbar: HTMLElement;
  /** the task pane */
  pane: HTMLElement;
  insertRows: HTMLButtonElement;
  deleteRows: HTMLButtonElement;
}

const FOCUSABLE = 'button:not([disabled]), select:not([disabled]), input:not([disabled]):not([type="hidden"]), textarea, a[href], [tabindex]:not([tabindex="-1"])';

/** The first element of `root` the keyboard can reach, where it is shown. */
function firstFocusable(root: HTMLElement): HTMLElement | null {
  for (const el of root.querySelectorAll<HTMLElement>(FOCUSABLE)) {
    if (!el.hidden && el.getClientRects().length) return el;
  }
  return null;
}

/** Attach the commands to `grid`; returns the function that takes them away again. */
export function attachGridCommands(grid: Grid, wb: PreviewWorkbook, el: CommandElements): () => void {
  const undo: Array<() => void> = [];
  const on = <K extends keyof DocumentEventMap>(target: Document | HTMLElement, type: K, f: (e: DocumentEventMap[K]) => void, capture = false) => {
    target.addEventListener(type, f as EventListener, capture);
    undo.push(() => target.removeEventListener(type, f as EventListener, capture));
  };

  const say = (text: string, error = false) => {
    el.message.textContent = text;
    el.message.classList.toggle("is-error", error);
  };
  /** Do `f`; a refusal (an Error) goes to the message line. */
  const attempt = (f: () => void) => {
    try {
      f();
    } catch (e) {
      say((e as Error).message, true);
    }
  };
  /** The selection as a block: its sheet, top-left cell and size. */
  const selection = () => {
    const { sheet, range } = grid.selectionRange();
    const r = parseRange(range);
    return { sheet, range, ...r };
  };
  const gridFocused = () => document.activeElement === el.sheet;

  // ─── Rows ──────────────────────────────────────────────────────────────────────────────────────────────────────
  const rowsText = (top: number, n: number) => (n === 1 ? `row ${top + 1}` : `rows ${top + 1} to ${top + n}`);
  const insertRows = () =>
    attempt(() => {
      grid.commitEdit();
      const s = selection();
      wb.insertRows(s.sheet, s.start.row, s.rows);
      say(`Inserted ${s.rows === 1 ? "an empty row" : `${s.rows} empty rows`} as ${rowsText(s.start.row, s.rows)}; the rows below moved down. Ctrl+Z takes ${s.rows === 1 ? "it" : "them"} back.`);
      el.sheet.focus({ preventScroll: true });
    });
  const deleteRows = () =>
    attempt(() => {
      grid.commitEdit();
      const s = selection();
      wb.deleteRows(s.sheet, s.start.row, s.rows);
      grid.select(cellAddress(s.start));
      say(`Deleted ${rowsText(s.start.row, s.rows)}; Ctrl+Z brings ${s.rows === 1 ? "it" : "them"} back.`);
      el.sheet.focus({ preventScroll: true });
    });
  on(el.insertRows, "click", insertRows);
  on(el.deleteRows, "click", deleteRows);

  // ─── Clipboard ─────────────────────────────────────────────────────────────────────────────────────────────────
  const take = (e: ClipboardEvent, cut: boolean) => {
    if (!gridFocused()) return;
    e.preventDefault();
    attempt(() => {
      grid.commitEdit();
      const s = selection();
      const text = cut ? wb.cutRange(s.sheet, s.range) : wb.copyRange(s.sheet, s.range);
      e.clipboardData?.setData("text/plain", text);
      say(`${cut ? "Cut" : "Copied"} ${s.range.replace(/^(\w+):\1$/, "$1")}: select where it goes and press Ctrl+V.`);
    });
  };
  on(document, "copy", (e) => take(e, false));
  on(document, "cut", (e) => take(e, true));
  on(document, "paste", (e) => {
    if (!gridFocused()) return;
    e.preventDefault();
    const text = e.clipboardData?.getData("text/plain") ?? "";
    attempt(() => {
      grid.commitEdit();
      const s = selection();
      const at = cellAddress(s.start);
      const ours = wb.clipboardText;
      // the block this workbook copied last: its formulas and styles; anything else: text, each cell as typed
      const same = (a: string, b: string) => a.replace(/\r\n/g, "\n").replace(/\n$/, "") === b.replace(/\r\n/g, "\n").replace(/\n$/, "");
      let rows = 1;
      let cols = 1;
      if (ours !== null && same(text, ours)) {
        const lines = ours.split("\r\n");
        rows = lines.length;
        cols = lines[0].split("\t").length;
        wb.paste(s.sheet, at);
      } else if (text) {
        ({ rows, cols } = wb.pasteText(s.sheet, at, text));
        if (!rows) {
          say("Nothing to paste: the clipboard's text holds no cell.", true);
          return;
        }
      } else {
        say("Nothing to paste: the clipboard holds no text.", true);
        return;
      }
      const end = cellAddress({ row: s.start.row + rows - 1, col: s.start.col + cols - 1 });
      grid.selectRange(end, at);
      say(`Pasted into ${rows * cols === 1 ? at : `${at}:${end}`}; Ctrl+Z takes it back.`);
    });
  });

  // ─── Name box ──────────────────────────────────────────────────────────────────────────────────────────────────
  const showActive = () => (el.nameBox.value = grid.selection);
  on(el.nameBox, "focus", () => el.nameBox.select());
  on(el.nameBox, "keydown", (e) => {
    if (e.key === "Escape") {
      e.preventDefault();
      showActive();
      el.sheet.focus();
    } else if (e.key === "Enter") {
      e.preventDefault();
      const typed = el.nameBox.value;
      // a cell being edited is committed first: going elsewhere or naming the selection keeps what was typed
      try {
        grid.commitEdit();
      } catch (err) {
        say((err as Error).message, true);
        return;
      }
      el.nameBox.value = typed; // the commit moved the focus through the grid, which showed the active cell here
      const action = readNameBox(wb, typed, grid.sheet);
      if (action.kind === "problem") {
        say(action.message, true);
        el.nameBox.select();
        return;
      }
      if (action.kind === "define") {
        const { sheet, range } = grid.selectionRange();
        const cells = range.replace(/^(\w+):\1$/, "$1");
        wb.setName(action.name, absoluteRef(sheet, cells));
        showActive();
        el.sheet.focus();
        say(`${action.name} now names ${sheet}!${cells}.`);
        return;
      }
      if (action.sheet !== wb.activeSheet) wb.activate(action.sheet);
      const r = parseRange(action.range);
      const end = cellAddress({ row: r.start.row + r.rows - 1, col: r.start.col + r.cols - 1 });
      grid.selectRange(end, cellAddress(r.start));
      el.sheet.focus();
    }
  });
  on(el.nameBox, "blur", showActive);

  // ─── Keys: rows, and the keyboard leaving the grid ─────────────────────────────────────────────────────────────
  const regions = () => [el.toolbar, el.nameBox.parentElement ?? el.nameBox, el.sheet, el.pane];
  const regionOf = (node: Element | null) => regions().findIndex((r) => !!node && r.contains(node));
  const enter = (i: number) => {
    const region = regions()[i];
    if (region === el.sheet) el.sheet.focus();
    else if (region.contains(el.nameBox)) el.nameBox.focus();
    else firstFocusable(region)?.focus();
  };
  // capture: the page hears F6 before any control; the grid's own keys come after these
  on(
    document,
    "keydown",
    (e) => {
      if (e.key !== "F6") return;
      e.preventDefault();
      // a cell being edited is committed first, as a click elsewhere would
      const editor = document.activeElement;
      if (editor instanceof HTMLInputElement && editor.dataset.role === "cell-editor") grid.commitEdit();
      const n = regions().length;
      const from = regionOf(document.activeElement);
      const start = from < 0 ? (e.shiftKey ? 0 : n - 1) : from;
      enter((start + (e.shiftKey ? n - 1 : 1)) % n);
    },
    true,
  );
  on(
    el.sheet,
    "keydown",
    (e) => {
      if (e.target !== el.sheet) return; // a cell being edited keeps its keys (Tab commits and moves, as before)
      const ctrl = e.ctrlKey || e.metaKey;
      if (e.key === "Tab" && !ctrl && !e.altKey) {
        e.preventDefault();
        e.stopImmediatePropagation();
        if (e.shiftKey) el.formulaBar.focus();
        else firstFocusable(el.pane)?.focus();
      } else if (ctrl && (e.key === "+" || (e.key === "=" && e.shiftKey))) {
        e.preventDefault();
        e.stopImmediatePropagation();
        insertRows();
      } else if (ctrl && e.key === "-") {
        e.preventDefault();
        e.stopImmediatePropagation();
        deleteRows();
      }
    },
    true,
  );

  return () => undo.forEach((f) => f());
}
