/**
 * The one-page summary: what a project manager prints or sends. The project, the date of printing and the words
 * "Preliminary estimate"; the state and VERDICT's sentence, the margin, the pump (the one chosen, checked, or the one
 * suggested) and the suction check, in the pane's own words (../taskpane/pane.ts); the plot at a fixed width with the
 * pane's legend; the key inputs (./facts.ts); the life-safety caution, always.
 *
 * One page on A4 or Letter: the page box is the smaller of the two (A4's width, Letter's height) less 12 mm margins,
 * 186 × 255 mm, and the summary is laid out inside it; @page sets the margins and leaves the paper to the printer.
 *
 * Stable hooks: the root data-role="summary" (data-state: pass, marginal, fail, cannot-serve), "summary-site",
 * "summary-printed", "summary-preliminary", "summary-state", "summary-verdict", "summary-caveat", "summary-margin",
 * "summary-pump", "summary-suction", "summary-next-steps", "summary-inputs", "summary-caution"; the plot keeps its own
 * (data-role="plot", "supply-curve", "demand-point").
 */
import { BOX_STATE, STATE_WORDS, legendIcon, legendItems, marginLine, pumpLine, suctionLine } from "../taskpane/pane";
import { type Estimate, plotData } from "../taskpane/model";
import { niceMax, renderPlot } from "../taskpane/plot";
import { CAUTION, PALETTE } from "../workbook/look";
import { isoDate } from "../workbook/port";
import { type SummaryFacts, keyInputs } from "./facts";

/** The plot's width on the page, px (CSS px: 96 to the inch, so 440 px is 116 mm); its height follows (plotSize). */
export const SUMMARY_PLOT_WIDTH = 440;

/** The printable box: A4's width and Letter's height, less the page margins, mm. */
export const PAGE_MARGIN_MM = 12;
export const PAGE_BOX_MM = { width: 210 - 2 * PAGE_MARGIN_MM, height: 279.4 - 2 * PAGE_MARGIN_MM } as const;

export const SUMMARY_CSS = `
@page { margin: ${PAGE_MARGIN_MM}mm; }
.hs-page { box-sizing: border-box; width: ${PAGE_BOX_MM.width}mm; margin: 0 auto;
  background: #FFFFFF; color: #1B2A3A; font: 10pt/1.35 system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif;
  -webkit-print-color-adjust: exact; print-color-adjust: exact; }
.hs-page * { box-sizing: border-box; }
.hs-head { display: flex; justify-content: space-between; align-items: baseline; gap: 4mm; border-bottom: 2px solid #1B2A3A; padding-bottom: 1.5mm; }
.hs-head > :last-child { flex: none; white-space: nowrap; }
.hs-brand { font-weight: 700; font-size: 11pt; }
.hs-kind { color: #5A6675; font-size: 8.5pt; }
.hs-prelim { font-weight: 700; font-size: 11pt; letter-spacing: 0.05em; text-transform: uppercase; color: #6B2C00; }
.hs-date { color: #3A4A5A; margin-left: 3mm; }
.hs-site { font-size: 15pt; line-height: 1.2; margin: 3mm 0 0.5mm; }
.hs-meta { margin: 0; color: #3A4A5A; }
.hs-missing { color: #8593A3; font-style: italic; }
.hs-verdict { margin: 3mm 0 0; padding: 2.5mm 4mm; background: #F6F7F9; border-left: 5px solid #9AA5B1; }
.hs-page[data-state="pass"] .hs-verdict { border-left-color: ${PALETTE.pump}; }
.hs-page[data-state="marginal"] .hs-verdict { border-left-color: ${PALETTE.sprinklers}; border-left-style: dashed; }
.hs-page[data-state="fail"] .hs-verdict { border-left-color: ${PALETTE.demand}; }
.hs-page[data-state="cannot-serve"] .hs-verdict { border-left-color: ${PALETTE.demand}; border-left-width: 9px; }
.hs-state { margin: 0; font-size: 9pt; font-weight: 700; letter-spacing: 0.05em; text-transform: uppercase; color: #3A4A5A; }
.hs-sentence { margin: 0.5mm 0 0; font-size: 13pt; font-weight: 700; line-height: 1.25; }
.hs-line { margin: 1.2mm 0 0; }
.hs-caveat { color: #6B2C00; }
.hs-steps { margin: 1.2mm 0 0; padding-left: 5mm; }
.hs-steps li { margin: 0.5mm 0; }
.hs-body { display: flex; gap: 4mm; margin-top: 3mm; align-items: flex-start; }
.hs-figure { margin: 0; flex: none; }
.hs-figure svg.hr-plot { display: block; }
.hs-legend { list-style: none; display: flex; flex-wrap: wrap; gap: 1mm 3.5mm; margin: 1mm 0 0; padding: 0; font-size: 8.5pt; max-width: ${SUMMARY_PLOT_WIDTH}px; }
.hs-legend li { display: flex; align-items: center; gap: 1.5mm; }
.hs-inputs { flex: 1; margin: 0; font-size: 9pt; }
.hs-inputs h2 { font-size: 10pt; margin: 0 0 1.5mm; }
.hs-inputs dl { margin: 0; }
.hs-inputs dt { color: #5A6675; margin-top: 1.5mm; }
.hs-inputs dd { margin: 0; }
.hs-caution { margin: 3mm 0 0; padding: 2mm 3mm; background: #FDEBD3; color: #6B2C00; font-weight: 600; }
.hs-foot { margin: 2mm 0 0; font-size: 8pt; color: #5A6675; }
`;

function h<K extends keyof HTMLElementTagNameMap>(doc: Document, tag: K, attrs: Record<string, string> = {}, ...children: Array<Node | string>): HTMLElementTagNameMap[K] {
  const e = doc.createElement(tag);
  for (const [k, v] of Object.entries(attrs)) e.setAttribute(k, v);
  for (const c of children) e.append(c);
  return e;
}

export interface SummaryOptions {
  /** the date printed on the page */
  printedOn: Date;
}

/** The summary of an estimate as one page: an element to put into a document whose stylesheet it carries. */
export function renderSummary(doc: Document, e: Estimate, f: SummaryFacts, { printedOn }: SummaryOptions): HTMLElement {
  const line = (role: string, text: string | null, cls = "hs-line") => (text === null ? [] : [h(doc, "p", { class: cls, "data-role": role }, text)]);

  const head = h(
    doc,
    "header",
    { class: "hs-head" },
    h(doc, "span", {}, h(doc, "span", { class: "hs-brand" }, "Headroom"), " ", h(doc, "span", { class: "hs-kind" }, "water supply against sprinkler demand")),
    h(
      doc,
      "span",
      {},
      h(doc, "span", { class: "hs-prelim", "data-role": "summary-preliminary" }, "Preliminary estimate"),
      h(doc, "span", { class: "hs-date", "data-role": "summary-printed" }, `Printed ${isoDate(printedOn)}`),
    ),
  );

  const site = f.site
    ? h(doc, "h1", { class: "hs-site", "data-role": "summary-site" }, f.site)
    : h(doc, "h1", { class: "hs-site hs-missing", "data-role": "summary-site" }, "Site not given on the sheet");
  const meta = [...(f.address ? [f.address] : []), f.preparedBy ? `Prepared by ${f.preparedBy}` : "Preparer not given"].join(" · ");
  const project = h(doc, "section", { class: "hs-project" }, site, h(doc, "p", { class: "hs-meta" }, meta));

  const verdict = h(
    doc,
    "section",
    { class: "hs-verdict" },
    h(doc, "p", { class: "hs-state", "data-role": "summary-state" }, STATE_WORDS[e.state]),
    h(doc, "p", { class: "hs-sentence", "data-role": "summary-verdict" }, e.headline),
    ...line("summary-caveat", e.caveat, "hs-line hs-caveat"),
    ...line("summary-margin", marginLine(e)),
    ...line("summary-pump", pumpLine(e)),
    ...line("summary-suction", suctionLine(e)),
    ...(e.nextSteps.length ? [h(doc, "ul", { class: "hs-steps", "data-role": "summary-next-steps", "aria-label": "What to do next" }, ...e.nextSteps.map((s) => h(doc, "li", {}, s)))] : []),
  );

  const data = plotData(e, niceMax);
  const legend = h(doc, "ul", { class: "hs-legend" }, ...legendItems(e, data).map(([k, label]) => h(doc, "li", {}, legendIcon(doc, k), label)));
  const figure = h(doc, "figure", { class: "hs-figure" }, renderPlot(doc, data, "linear", SUMMARY_PLOT_WIDTH), legend);
  const inputs = h(
    doc,
    "section",
    { class: "hs-inputs", "data-role": "summary-inputs" },
    h(doc, "h2", {}, "Key inputs"),
    h(doc, "dl", {}, ...keyInputs(e, f).flatMap(([k, v]) => [h(doc, "dt", {}, k), h(doc, "dd", {}, v)])),
  );
  const body = h(doc, "section", { class: "hs-body" }, figure, inputs);

  const caution = h(doc, "p", { class: "hs-caution", "data-role": "summary-caution", role: "note" }, CAUTION);
  const units = e.units === "SI" ? "SI units (L/min, bar)" : "US units (gpm, psi)";
  const foot = h(doc, "p", { class: "hs-foot" }, `From the estimate sheet's named cells, calculated by the Headroom add-in; ${units}.`);

  return h(doc, "article", { class: "hs-page", "data-role": "summary", "data-state": BOX_STATE[e.state] }, h(doc, "style", {}, SUMMARY_CSS), head, project, verdict, body, caution, foot);
}
