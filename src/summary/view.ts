/**
 * The print view of the one-page summary: the page as it will print, with a Print button (window.print()) and a way
 * back, on a grey ground. The preview lays it over the workbook; the Excel dialog page (./dialog-page.ts) is nothing
 * else. When printed, only the summary prints: the view hides every other child of <body> and its own toolbar.
 *
 * Stable hooks: data-role="summary-view" (the view, a child of <body>), "summary-print", "summary-close", and the
 * summary's own (./page.ts).
 */
import type { Estimate } from "../taskpane/model";
import type { SummaryFacts } from "./facts";
import { renderSummary } from "./page";

export const VIEW_CSS = `
.hs-view { position: fixed; inset: 0; z-index: 1000; overflow: auto; background: #E4E7EB; padding: 0 0 24px; }
.hs-toolbar { position: sticky; top: 0; display: flex; flex-wrap: wrap; align-items: center; gap: 10px; padding: 8px 16px;
  background: #1B2A3A; color: #FFFFFF; font: 13px/1.4 system-ui, "Segoe UI", sans-serif; }
.hs-toolbar button { font: inherit; border-radius: 4px; padding: 5px 12px; cursor: pointer; border: 1px solid #FFFFFF; }
.hs-toolbar button[data-role="summary-print"] { background: #FFFFFF; color: #1B2A3A; font-weight: 600; }
.hs-toolbar button[data-role="summary-close"] { background: transparent; color: #FFFFFF; }
.hs-tip { opacity: 0.85; font-size: 12px; }
.hs-sheet { width: max-content; margin: 16px auto 0; padding: 12mm; background: #FFFFFF; box-shadow: 0 1px 4px rgba(27, 42, 58, 0.25); }
@media print {
  html, body { height: auto !important; overflow: visible !important; background: #FFFFFF !important; margin: 0 !important; padding: 0 !important; display: block !important; }
  body > :not(.hs-view) { display: none !important; }
  .hs-view { position: static !important; overflow: visible !important; background: none !important; padding: 0 !important; }
  .hs-toolbar { display: none !important; }
  .hs-sheet { margin: 0 !important; padding: 0 !important; box-shadow: none !important; width: auto !important; }
}
`;

export interface SummaryViewOptions {
  /** the date printed on the page (today by default) */
  printedOn?: Date;
  /** what Print does: window.print() by default */
  print?: () => void;
  /** the way back: close the overlay, or ask Excel to close the dialog */
  onClose: () => void;
  /** the way back's words */
  closeLabel?: string;
}

export interface SummaryView {
  /** the view's element, a child of <body> */
  root: HTMLElement;
  /** take the view away (the way back calls onClose, which decides) */
  remove(): void;
}

/** Show the summary of an estimate in its print view, over everything else in the document. */
export function showSummaryView(doc: Document, e: Estimate, f: SummaryFacts, o: SummaryViewOptions): SummaryView {
  const win = doc.defaultView;
  const print = o.print ?? (() => win?.print());
  const button = (role: string, text: string) => {
    const b = doc.createElement("button");
    b.type = "button";
    b.dataset.role = role;
    b.textContent = text;
    return b;
  };
  const printButton = button("summary-print", "Print");
  const closeButton = button("summary-close", o.closeLabel ?? "Back to the workbook");
  const tip = doc.createElement("span");
  tip.className = "hs-tip";
  tip.textContent = "One page, A4 or Letter. To send it, choose Save as PDF in the print dialog.";
  const toolbar = doc.createElement("div");
  toolbar.className = "hs-toolbar";
  toolbar.setAttribute("role", "toolbar");
  toolbar.append(printButton, closeButton, tip);

  const sheet = doc.createElement("div");
  sheet.className = "hs-sheet";
  sheet.append(renderSummary(doc, e, f, { printedOn: o.printedOn ?? new Date() }));

  const style = doc.createElement("style");
  style.textContent = VIEW_CSS;
  const root = doc.createElement("div");
  root.className = "hs-view";
  root.dataset.role = "summary-view";
  root.setAttribute("role", "dialog");
  root.setAttribute("aria-label", "One-page summary");
  root.append(style, toolbar, sheet);

  const onKey = (ev: KeyboardEvent) => {
    if (ev.key === "Escape") o.onClose();
  };
  printButton.addEventListener("click", () => print());
  closeButton.addEventListener("click", () => o.onClose());
  doc.addEventListener("keydown", onKey);
  doc.body.append(root);
  printButton.focus();
  return {
    root,
    remove: () => {
      doc.removeEventListener("keydown", onKey);
      root.remove();
    },
  };
}
