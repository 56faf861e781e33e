/**
 * The task pane: the verdict, large and plain; the caution beneath it, always; the supply/demand picture with its
 * axis toggle; the inputs it read; "New estimate sheet" and "Share copy". It talks only to a Workbook port, so the
 * Excel add-in (taskpane.ts) and the preview host mount the same pane: mountPane(root, port).
 *
 * Stable hooks: data-role="state" (the state in words), "verdict" (its box carries data-state: pass, marginal, fail,
 * cannot-serve), "margin",
 * "caveat", "pump", "suction", "breakdown" (where the pressure goes; its rows "breakdown-row" carry data-id, the
 * part), "worst", "controlling" and "candidates" (the design areas compared; rows "candidate-row" with data-name and
 * data-controls), "breakdown-elsewhere", "next-steps", "problems", "caution", "plot" (the svg), "supply-curve", "demand-point",
 * "axis-linear", "axis-pow", "new-sheet", "share-copy", "units", "refresh", "status"; "print-summary" where the host
 * shows the one-page summary (PaneOptions.onPrintSummary).
 */
import { formatFlow, formatPressure } from "../engine/decision";
import { type UnitSystem, fromUS, unitName } from "../engine/units";
import type { InputName, Readings, SharePlot, SharePlotSeries, WorkbookPort } from "../workbook/port";
import { CAUTION, PALETTE } from "../workbook/look";
import { BREAKDOWN_PARTS, type Breakdown, type Estimate, type PaneModel, type PlotData, buildModel, errorAddresses, plotData } from "./model";
import { type FlowAxis, niceMax, renderPlot } from "./plot";
import { PANE_CSS } from "./styles";

export interface PaneOptions {
  /** the pane's width in px for the plot; measured from the root when not given (320 where nothing can be measured) */
  width?: number;
  /** the flow axis to start with */
  axis?: FlowAxis;
  /**
   * Show the one-page summary of the estimate on show (the host decides how: a print view in the preview, an Office
   * dialog in Excel). Without it the pane has no summary button. A refusal's reason goes to the status line.
   */
  onPrintSummary?: (request: SummaryRequest) => Promise<SummaryOutcome> | SummaryOutcome;
}

/** What the pane hands its host for the summary: the estimate it shows and the readings it was built from. */
export interface SummaryRequest {
  estimate: Estimate;
  readings: Readings;
}

/** Whether the host showed the summary; if not, why, in words for the status line. */
export type SummaryOutcome = { shown: true } | { shown: false; reason: string };

export interface PaneHandle {
  /** resolves once the pane listens to the workbook and has drawn its first reading */
  ready: Promise<void>;
  /** read the workbook again and redraw */
  refresh(): Promise<void>;
  /** resolves when no reading is running or asked for (a re-read scheduled while an input is busy is not awaited) */
  idle(): Promise<void>;
  /** the current model (for hosts and tests) */
  model(): PaneModel | null;
  destroy(): Promise<void>;
}

/**
 * While an input shows #BUSY!, the pane reads the workbook again after each of these delays (ms) in turn, then every
 * last delay until no input is busy. It cannot wait for a calculation event alone: in Excel on the web onCalculated
 * was reported not to fire after the last custom-function result was delivered
 * (https://github.com/OfficeDev/office-js/issues/587), and a function whose promise never settles stays #BUSY!
 * (https://learn.microsoft.com/office/dev/add-ins/excel/custom-functions-troubleshooting).
 */
export const BUSY_REREAD_MS: readonly number[] = [250, 500, 1000, 2000, 4000];

const DEFAULT_WIDTH = 320;
/** Horizontal padding of the pane, px: the plot gets the rest. */
const PANE_PADDING = 24;

function h<K extends keyof HTMLElementTagNameMap>(
  doc: Document,
  tag: K,
  attrs: Record<string, string> = {},
  ...children: Array<Node | string>
): HTMLElementTagNameMap[K] {
  const e = doc.createElement(tag);
  for (const [k, v] of Object.entries(attrs)) e.setAttribute(k, v);
  for (const c of children) e.append(c);
  return e;
}

export type LegendKind = "supply" | "band" | "sprinklers" | "total" | "pump" | "candidate";

/** The legend under the plot: each item's icon and its words (the pane's and the summary's). */
export function legendItems(e: Estimate, data: PlotData): Array<[LegendKind, string]> {
  const items: Array<[LegendKind, string]> = [["supply", "Water supply (flow test)"]];
  if (data.band) items.push(["band", `Required margin ${formatPressure(e.requiredMargin, e.units)}`]);
  if (data.candidates.length > 0) {
    items.push(["total", "Controlling design area, sprinklers + hose"], ["candidate", "Other design areas compared"]);
  } else {
    for (const d of data.demand) items.push([d.id, d.id === "sprinklers" ? "Sprinklers alone" : data.demand.length > 1 ? "Sprinklers + hose" : "Demand"]);
  }
  if (data.pumpLabel) items.push(["pump", data.pumpLabel]);
  return items;
}

/**
 * The plot as a share copy carries it (Excel draws it as a chart of these points): one series for each item of the
 * legend, named as the legend names it, in the plot's colours, in the sheet's units.
 */
export function sharePlot(e: Estimate, data: PlotData): SharePlot {
  const line = (points: ReadonlyArray<readonly [number, number]>, color: string) => ({ points, style: "line" as const, marker: "none" as const, color });
  const demand = (id: "sprinklers" | "total") => data.demand.filter((d) => d.id === id).map((d): [number, number] => [d.q, d.p]);
  const drawn: Record<LegendKind, Omit<SharePlotSeries, "name">> = {
    supply: line(data.supply, PALETTE.supply),
    band: line(data.band ?? [], PALETTE.band),
    pump: line(data.pump ?? [], PALETTE.pump),
    sprinklers: { points: demand("sprinklers"), style: "marker", marker: "square", color: PALETTE.sprinklers },
    total: { points: demand("total"), style: "marker", marker: "diamond", color: PALETTE.demand },
    candidate: { points: data.candidates.filter((c) => !c.controls).map((c) => [c.q, c.p]), style: "marker", marker: "circle", color: PALETTE.candidate },
  };
  return {
    title: "Water supply and sprinkler demand",
    xTitle: `Flow (${data.flowUnit})`,
    yTitle: `Pressure (${data.pressureUnit})`,
    series: legendItems(e, data).map(([kind, name]) => ({ name, ...drawn[kind] })),
  };
}

export function legendIcon(doc: Document, kind: LegendKind): SVGSVGElement {
  const ns = "http://www.w3.org/2000/svg";
  const svg = doc.createElementNS(ns, "svg");
  svg.setAttribute("width", "22");
  svg.setAttribute("height", "12");
  svg.setAttribute("aria-hidden", "true");
  const add = (tag: string, attrs: Record<string, string | number>) => {
    const e = doc.createElementNS(ns, tag);
    for (const [k, v] of Object.entries(attrs)) e.setAttribute(k, String(v));
    svg.appendChild(e);
  };
  if (kind === "supply") add("line", { x1: 1, x2: 21, y1: 6, y2: 6, stroke: PALETTE.supply, "stroke-width": 2.5 });
  if (kind === "band") add("rect", { x: 1, y: 2, width: 20, height: 8, fill: PALETTE.band, "fill-opacity": 0.35, stroke: PALETTE.supply, "stroke-dasharray": "2 2" });
  if (kind === "pump") add("line", { x1: 1, x2: 21, y1: 6, y2: 6, stroke: PALETTE.pump, "stroke-width": 2.25, "stroke-dasharray": "7 3 2 3" });
  if (kind === "sprinklers") add("rect", { x: 7, y: 2, width: 8, height: 8, fill: "#FFFFFF", stroke: PALETTE.sprinklers, "stroke-width": 2 });
  if (kind === "total") add("path", { d: "M11,0L17,6L11,12L5,6Z", fill: PALETTE.demand });
  if (kind === "candidate") add("circle", { cx: 11, cy: 6, r: 3.5, fill: "#FFFFFF", stroke: PALETTE.candidate, "stroke-width": 1.5 });
  return svg;
}

/** Where several design areas are compared: which one the verdict is for, and why. */
export function controllingLine(e: Estimate): string | null {
  if (e.candidates.length < 2) return null;
  const c = e.candidates.find((x) => x.controls)!;
  return `For ${c.name}: the least margin of the ${e.candidates.length} design areas compared.`;
}

/** Each design area compared, in the table's order: its demand and its margin on the plotted supply. */
export function candidateLines(e: Estimate): Array<{ name: string; controls: boolean; text: string }> {
  if (e.candidates.length < 2) return [];
  const u = e.units;
  return e.candidates.map((c) => ({
    name: c.name,
    controls: c.controls,
    text: `${c.name}: ${formatFlow(c.flow, u)} at ${formatPressure(c.pressure, u)}, margin ${signed(c.margin, u)}${c.controls ? " (controls)" : ""}`,
  }));
}

/** Where another design area controls: the breakdown on the sheet is of the sheet's own, and the pane says so. */
export function breakdownElsewhereLine(e: Estimate): string | null {
  if (e.judgesOwn || e.candidates.length < 2) return null;
  return `Where the pressure goes is worked out on the sheet for ${e.candidates[0].name} only, which does not control.`;
}

function signed(psi: number, units: UnitSystem): string {
  return `${psi < 0 ? "−" : ""}${formatPressure(psi, units)}`;
}

/** The line under the verdict: the margin in pressure and percent, and the margin required. */
export function marginLine(e: Estimate): string {
  const a = e.assessment;
  const blank = e.blankAt.Required_Margin;
  const required = e.requiredMarginGiven
    ? `required ${formatPressure(e.requiredMargin, e.units)}`
    : blank
      ? `no margin required: Required_Margin (${blank}) is blank`
      : "no required margin set (no Required_Margin name)";
  if (a.margin === null) return `No margin: the supply reaches 0 at ${formatFlow(a.exhaustedAt, e.units)}; ${required}.`;
  const pct = e.marginPercent === null ? "" : `, ${e.marginPercent < 0 ? "−" : ""}${Math.abs(Math.round(e.marginPercent))} % of the ${formatPressure(e.demandPressure, e.units)} demand pressure`;
  return `Margin ${signed(a.margin, e.units)}${pct}; ${required}.`;
}

/**
 * The pump line: the chosen pump against the demand, else, where a pump is needed, the suggested rating for the flow
 * through it and the boost needed.
 */
export function pumpLine(e: Estimate): string | null {
  const u = e.units;
  if (e.pump && e.chosen) {
    const pump = `Chosen pump ${formatFlow(e.pump.ratedFlow, u)} at ${formatPressure(e.pump.ratedPressure, u)}`;
    if (e.chosen.surplus === null) return `${pump} cannot be checked: ${e.chosen.problem}.`;
    return e.chosen.meets
      ? `${pump}: meets the demand and the required margin, ${formatPressure(e.chosen.surplus, u)} to spare.`
      : `${pump}: falls ${formatPressure(e.chosen.surplus, u)} short of the demand and the required margin.`;
  }
  if (!e.assessment.pumpNeeded || e.state === "cannot-serve") return null;
  if (e.pumpSize && e.boost !== null) {
    // the standard ratings are whole gpm (NFPA 20); in SI work, say which one the L/min figure is
    const rating = u === "SI" ? ` (the ${formatFlow(e.pumpSize.ratedFlow, "US")} standard rating)` : "";
    return (
      `Suggested pump: ${formatFlow(e.pumpSize.ratedFlow, u)}${rating} rated at ${formatPressure(e.pumpSize.ratedPressure, u)}, ` +
      `the smallest standard rating for ${formatFlow(e.pumpFlow, u)} through it and a boost of ${formatPressure(e.boost, u)}.`
    );
  }
  return e.pumpSizeNote ? `No pump size: ${e.pumpSizeNote}.` : null;
}

/** The suction line: what the main keeps at 150 % of the pump's rated flow, against the least it must keep. */
export function suctionLine(e: Estimate): string | null {
  const s = e.suction;
  if (!s) return null;
  const u = e.units;
  const which = s.chosen ? "the chosen pump's" : "the suggested pump's";
  const minimum = `${formatPressure(e.suctionMinimum, u)}${e.suctionMinimumGiven ? "" : ` (common practice: ${unset(e, "Suction_Minimum")})`}`;
  if (s.pressure === null) {
    return (
      `Main at 150 % of ${which} rated flow (${formatFlow(s.drawn, u)} with the hose beside it): it runs dry at ` +
      `${formatFlow(e.assessment.exhaustedAt, u)}. A pump alone cannot serve: a suction tank or a stronger main is needed.`
    );
  }
  const at = `Main at 150 % of ${which} rated flow: ${formatPressure(s.pressure, u)}`;
  return s.below
    ? `${at}, below the ${minimum} it must keep. A pump alone cannot serve: a suction tank or a stronger main is needed.`
    : `${at}, above the ${minimum} it must keep.`;
}

/** Why an optional name gave nothing: its cell is blank, or the workbook has no such name. */
function unset(e: Estimate, name: InputName): string {
  const at = e.blankAt[name];
  return at ? `${name} (${at}) is blank` : `no ${name} name`;
}

/** A velocity for a sentence: ft/s or m/s to 0.1. */
function formatVelocity(ftPerS: number, units: UnitSystem): string {
  return `${fromUS("velocity", ftPerS, units).toFixed(1)} ${unitName("velocity", units)}`;
}

/** A limit as it was typed, or a default: "20 ft/s", "6 m/s", "19.5 ft/s". */
function formatLimit(ftPerS: number, units: UnitSystem): string {
  return `${Number(fromUS("velocity", ftPerS, units).toFixed(1))} ${unitName("velocity", units)}`;
}

/** A part's share of the demand pressure, whole percent: "31 %", "−9 %", "less than 1 %". */
function share(pressure: number, demand: number): string {
  const pct = demand > 0 ? (pressure / demand) * 100 : 0;
  if (pct !== 0 && Math.abs(pct) < 0.5) return "less than 1 %";
  return `${pct < 0 ? "−" : ""}${Math.abs(Math.round(pct))} %`;
}

/** Each part of the breakdown as the pane writes it: its pressure and its share of the demand pressure. */
export function partLines(e: Estimate, b: Breakdown): Array<{ id: string; label: string; value: string; width: number; negative: boolean }> {
  return b.parts.map((p) => ({
    id: p.id,
    label: p.label,
    value: `${signed(p.pressure, e.units)} (${share(p.pressure, e.demandPressure)})`,
    width: e.demandPressure > 0 ? Math.min(100, (Math.abs(p.pressure) / e.demandPressure) * 100) : 0,
    negative: p.pressure < 0,
  }));
}

/**
 * The segment that loses the most, in one sentence: its loss, the water's velocity, and where that is above the limit,
 * so; where it is and there is pressure to make up (marginal, pump needed), a larger pipe there is the cheapest fix.
 */
export function worstLine(e: Estimate): string | null {
  const w = e.breakdown?.worst;
  if (!w) return null;
  const u = e.units;
  const above = w.overLimit ? ` (above the ${formatLimit(w.limit, u)} limit${w.limitGiven ? "" : ", common practice"})` : "";
  const fix = w.overLimit && (e.state === "marginal" || e.state === "short") ? ": a larger pipe there is the cheapest fix" : "";
  return `Most lost in one segment: ${formatPressure(w.loss, u)} in ${w.segment}, water at ${formatVelocity(w.velocity, u)}${above}${fix}.`;
}

/** The verdict box's state for the stylesheet and for tests. */
export const BOX_STATE: Record<Estimate["state"], string> = { enough: "pass", marginal: "marginal", short: "fail", "cannot-serve": "cannot-serve" };

/** The state in a few words, above the verdict sentence. */
export const STATE_WORDS: Record<Estimate["state"], string> = {
  enough: "No pump needed",
  marginal: "Marginal",
  short: "Pump needed",
  "cannot-serve": "A pump alone cannot serve",
};

export function mountPane(root: HTMLElement, port: WorkbookPort, options: PaneOptions = {}): PaneHandle {
  const doc = root.ownerDocument;
  let axis: FlowAxis = options.axis ?? "linear";
  let current: PaneModel | null = null;
  let lastReady: Estimate | null = null;
  let lastReadings: Readings | null = null;
  let unitsTouched = false;
  let destroyed = false;

  // ── skeleton ──
  const style = h(doc, "style", {}, PANE_CSS);
  const stateTag = h(doc, "p", { class: "hr-state", "data-role": "state" });
  stateTag.hidden = true;
  const verdict = h(doc, "p", { class: "hr-verdict", "data-role": "verdict", "aria-live": "polite" }, "Reading the workbook…");
  const margin = h(doc, "p", { class: "hr-margin", "data-role": "margin" });
  const caveat = h(doc, "p", { class: "hr-caveat", "data-role": "caveat" });
  const pump = h(doc, "p", { class: "hr-pump", "data-role": "pump" });
  const suction = h(doc, "p", { class: "hr-pump", "data-role": "suction" });
  const parts = h(doc, "ul", { class: "hr-parts" });
  const worst = h(doc, "p", { class: "hr-worst", "data-role": "worst" });
  const breakdown = h(
    doc,
    "section",
    { class: "hr-breakdown", "data-role": "breakdown", "aria-label": "Where the pressure goes" },
    h(doc, "p", { class: "hr-breakdown-title" }, "Where the pressure goes"),
    parts,
    worst,
  );
  breakdown.hidden = true;
  const compared = h(doc, "ul", { class: "hr-candidates" });
  const elsewhere = h(doc, "p", { class: "hr-worst", "data-role": "breakdown-elsewhere" });
  const candidatesBox = h(
    doc,
    "section",
    { class: "hr-breakdown", "data-role": "candidates", "aria-label": "Design areas compared" },
    h(doc, "p", { class: "hr-breakdown-title" }, "Design areas compared"),
    compared,
    elsewhere,
  );
  candidatesBox.hidden = true;
  const controlling = h(doc, "p", { class: "hr-margin", "data-role": "controlling" });
  controlling.hidden = true;
  const steps = h(doc, "ul", { class: "hr-steps", "data-role": "next-steps", "aria-label": "What to do next" });
  const problems = h(doc, "ul", { class: "hr-problems", "data-role": "problems" });
  const box = h(doc, "section", { class: "hr-verdict-box", "data-state": "waiting" }, stateTag, controlling, verdict, margin, caveat, pump, suction, steps, problems);
  const caution = h(doc, "p", { class: "hr-caution", "data-role": "caution" }, CAUTION);
  const calcNote = h(doc, "p", { class: "hr-calc-note", "data-role": "calc-note" });
  calcNote.hidden = true;
  const linear = h(doc, "button", { type: "button", "data-role": "axis-linear" }, "Linear flow");
  const pow = h(doc, "button", { type: "button", "data-role": "axis-pow", title: "Flow axis scaled as Q^1.85: the supply curve is a straight line" }, "Q^1.85 flow");
  const toggle = h(doc, "div", { class: "hr-axis-toggle", role: "group", "aria-label": "Flow axis" }, linear, pow);
  const holder = h(doc, "div", { "data-role": "plot-holder" });
  const legend = h(doc, "ul", { class: "hr-legend", "data-role": "legend" });
  const plotBox = h(doc, "section", { class: "hr-plot-box" }, toggle, holder, legend);
  plotBox.hidden = true;
  const readingsList = h(doc, "dl", { "data-role": "readings" });
  const readingsBox = h(doc, "details", { class: "hr-readings" }, h(doc, "summary", {}, "Inputs read from the workbook"), readingsList);
  readingsBox.hidden = true;
  const unitsSelect = h(doc, "select", { "data-role": "units", "aria-label": "Units of a new estimate sheet" }, h(doc, "option", { value: "US" }, "US"), h(doc, "option", { value: "SI" }, "SI"));
  const newSheet = h(doc, "button", { type: "button", "data-role": "new-sheet" }, "New estimate sheet");
  const shareCopy = h(doc, "button", { type: "button", "data-role": "share-copy", class: "secondary" }, "Share copy");
  const refreshButton = h(doc, "button", { type: "button", "data-role": "refresh", class: "secondary" }, "Read again");
  const summaryButton = options.onPrintSummary
    ? h(doc, "button", { type: "button", "data-role": "print-summary", class: "secondary", title: "The verdict, the plot and the caution on one printable page" }, "One-page summary")
    : null;
  if (summaryButton) summaryButton.disabled = true; // until there is an estimate to print
  const status = h(doc, "p", { class: "hr-status", "data-role": "status", "aria-live": "polite" });
  const actions = h(doc, "section", { class: "hr-actions" }, unitsSelect, newSheet, shareCopy, refreshButton, ...(summaryButton ? [summaryButton] : []), status);
  const head = h(doc, "header", { class: "hr-head" }, h(doc, "span", { class: "hr-brand" }, "Headroom"), h(doc, "span", { class: "hr-sub" }, "water supply against sprinkler demand"));
  // the caution straight beneath the verdict, the breakdown after it: the caution stays in view with the verdict
  const pane = h(doc, "div", { class: "hr-pane" }, style, head, box, caution, calcNote, breakdown, candidatesBox, plotBox, readingsBox, actions);
  root.replaceChildren(pane);

  const width = () => {
    if (options.width) return options.width;
    const measured = root.getBoundingClientRect?.().width || root.clientWidth || 0;
    return measured > 0 ? measured - PANE_PADDING : DEFAULT_WIDTH - PANE_PADDING;
  };

  // ── drawing ──
  function show(p: HTMLElement, text: string | null): void {
    p.textContent = text ?? "";
    p.hidden = text === null;
  }
  function clearLines(): void {
    show(stateTag, null);
    show(controlling, null);
    drawCandidates(null);
    margin.textContent = "";
    for (const p of [caveat, pump, suction]) show(p, null);
    drawBreakdown(null);
    steps.replaceChildren();
    steps.hidden = true;
  }
  function drawPlot(e: Estimate): void {
    const data = plotData(e, niceMax);
    holder.replaceChildren(renderPlot(doc, data, axis, width()));
    linear.setAttribute("aria-pressed", String(axis === "linear"));
    pow.setAttribute("aria-pressed", String(axis === "pow"));
    legend.replaceChildren(...legendItems(e, data).map(([k, label]) => h(doc, "li", {}, legendIcon(doc, k), label)));
    plotBox.hidden = false;
  }

  function drawBreakdown(e: Estimate | null): void {
    const b = e?.breakdown;
    if (!e || !b) {
      parts.replaceChildren();
      show(worst, null);
      breakdown.hidden = true;
      return;
    }
    parts.replaceChildren(
      ...partLines(e, b).map((line) => {
        const bar = h(doc, "span", { class: "hr-part-bar", "data-part": line.id, "data-sign": line.negative ? "negative" : "positive" });
        bar.style.width = `${line.width.toFixed(2)}%`;
        return h(
          doc,
          "li",
          { "data-role": "breakdown-row", "data-id": line.id },
          h(doc, "span", { class: "hr-part-label" }, line.label),
          h(doc, "span", { class: "hr-part-value" }, line.value),
          h(doc, "span", { class: "hr-part-track", "aria-hidden": "true" }, bar),
        );
      }),
    );
    show(worst, worstLine(e));
    breakdown.hidden = false;
  }

  function drawCandidates(e: Estimate | null): void {
    const lines = e ? candidateLines(e) : [];
    compared.replaceChildren(
      ...lines.map((l) => h(doc, "li", { "data-role": "candidate-row", "data-name": l.name, "data-controls": String(l.controls) }, l.text)),
    );
    show(elsewhere, e ? breakdownElsewhereLine(e) : null);
    candidatesBox.hidden = lines.length === 0;
  }

  function drawReadings(e: Estimate): void {
    const u = e.units;
    const rows: Array<[string, string]> = [
      ["Units", e.unitsAssumed ? "US (no Units name: assumed)" : u],
      ["Static pressure", formatPressure(e.test.static, u)],
      ["Residual pressure", formatPressure(e.test.residual, u)],
      ["Test flow", formatFlow(e.test.testFlow, u)],
      ...(e.candidates.length >= 2 ? [["Design area judged", e.candidates.find((c) => c.controls)!.name] as [string, string]] : []),
      ["Demand flow", formatFlow(e.demandFlow, u)],
      ["of which hose", e.hoseFlow === null ? "not given" : formatFlow(e.hoseFlow, u)],
      ["Demand pressure", formatPressure(e.demandPressure, u)],
      ["Flow through a pump", e.pumpFlowGiven ? formatFlow(e.pumpFlow, u) : `${formatFlow(e.pumpFlow, u)} (no Pump_Flow: the demand flow)`],
      ["Required margin", e.requiredMarginGiven ? formatPressure(e.requiredMargin, u) : `0 (${unset(e, "Required_Margin")})`],
      ["Least pressure the main keeps", e.suctionMinimumGiven ? formatPressure(e.suctionMinimum, u) : `${formatPressure(e.suctionMinimum, u)} (common practice: ${unset(e, "Suction_Minimum")})`],
      ["Pump chosen", e.pump ? `${formatFlow(e.pump.ratedFlow, u)} at ${formatPressure(e.pump.ratedPressure, u)}` : "none"],
    ];
    if (u === "SI") rows.push(["Hazard classes", "NFPA 13's, with values converted to SI"]);
    if (e.assessment.supplyPressure !== null) rows.splice(rows.findIndex(([k]) => k === "Flow through a pump"), 0, ["Supply at demand flow", formatPressure(e.assessment.supplyPressure, u)]);
    const b = e.breakdown;
    if (b) {
      for (const p of b.parts) rows.push([p.label, signed(p.pressure, u)]);
      const w = b.worst;
      rows.push(["Segment losing the most", w ? `${w.segment}: ${formatPressure(w.loss, u)} at ${formatVelocity(w.velocity, u)}` : "not given"]);
      if (w) rows.push(["Velocity limit", w.limitGiven ? formatLimit(w.limit, u) : `${formatLimit(w.limit, u)} (common practice: ${unset(e, "Velocity_Limit")})`]);
    } else {
      const missing = e.breakdownMissing.length === BREAKDOWN_PARTS.length ? "Pressure_ names" : e.breakdownMissing.join(", ");
      rows.push(["Where the pressure goes", `not given (no ${missing})`]);
    }
    readingsList.replaceChildren(...rows.flatMap(([k, v]) => [h(doc, "dt", {}, k), h(doc, "dd", {}, v)]));
    readingsBox.hidden = false;
  }

  function draw(m: PaneModel): void {
    current = m;
    if (m.kind === "busy") {
      calcNote.textContent = `Excel is still calculating ${m.names.join(", ")}…`;
      calcNote.hidden = false;
      if (!lastReady) {
        box.dataset.state = "waiting";
        verdict.textContent = "Waiting for Excel to finish calculating…";
        clearLines();
        problems.replaceChildren();
      }
      return;
    }
    calcNote.hidden = true;
    if (m.kind === "problems") {
      lastReady = null;
      box.dataset.state = "problems";
      // inputs, not names: problems that name the same cell to change are one input
      const inputs = new Set(m.problems.map((p, i) => p.cell ?? `problem ${i}`)).size;
      verdict.textContent = inputs === 1 ? "One input needs attention" : `${inputs} inputs need attention`;
      clearLines();
      problems.replaceChildren(...m.problems.map((p) => h(doc, "li", { "data-name": p.name }, p.message)));
      plotBox.hidden = true;
      readingsBox.hidden = true;
      return;
    }
    const e = m.estimate;
    lastReady = e;
    box.dataset.state = BOX_STATE[e.state];
    show(stateTag, STATE_WORDS[e.state]);
    show(controlling, controllingLine(e));
    drawCandidates(e);
    // VERDICT's sentence; its flow-test caveat stands on its own line below
    verdict.textContent = e.headline;
    margin.textContent = marginLine(e);
    show(caveat, e.caveat);
    show(pump, pumpLine(e));
    show(suction, suctionLine(e));
    drawBreakdown(e);
    steps.replaceChildren(...e.nextSteps.map((t) => h(doc, "li", {}, t)));
    steps.hidden = e.nextSteps.length === 0;
    problems.replaceChildren();
    if (!unitsTouched) unitsSelect.value = e.units;
    drawPlot(e);
    drawReadings(e);
  }

  // ── reading, one at a time; a change during a reading asks for one more ──
  let running: Promise<void> | null = null;
  let again = false;
  async function readOnce(): Promise<void> {
    try {
      const readings = await port.readInputs();
      if (destroyed) return;
      // where named cells show errors: the inputs they are calculated from, so that a message names the cell to change
      const asked = errorAddresses(readings);
      const behind = asked.length > 0 ? await port.inputsBehind(asked) : {};
      if (destroyed) return;
      const m = buildModel(readings, port.host, behind);
      draw(m);
      if (m.kind === "ready") lastReadings = readings;
      if (summaryButton && m.kind !== "busy") summaryButton.disabled = m.kind !== "ready";
      followBusy(m);
    } catch (err) {
      setStatus(`Could not read the workbook: ${message(err)}`, "refused");
    }
  }

  // ── while an input is #BUSY!: read again on the back-off timer, one timer at a time ──
  let busyTimer: ReturnType<typeof setTimeout> | undefined;
  let busyRereads = 0;
  function stopBusyTimer(): void {
    if (busyTimer !== undefined) clearTimeout(busyTimer);
    busyTimer = undefined;
  }
  function followBusy(m: PaneModel): void {
    if (m.kind !== "busy") {
      stopBusyTimer();
      busyRereads = 0;
      return;
    }
    if (busyTimer !== undefined || destroyed) return;
    const delay = BUSY_REREAD_MS[Math.min(busyRereads, BUSY_REREAD_MS.length - 1)];
    busyRereads++;
    busyTimer = setTimeout(() => {
      busyTimer = undefined;
      if (!destroyed) void refresh();
    }, delay);
  }
  function refresh(): Promise<void> {
    if (running) {
      again = true;
      return running;
    }
    running = (async () => {
      do {
        again = false;
        await readOnce();
      } while (again && !destroyed);
      running = null;
    })();
    return running;
  }

  function setStatus(text: string, tone: "done" | "refused" = "done"): void {
    status.textContent = text;
    status.dataset.tone = tone;
  }

  async function action(button: HTMLButtonElement, run: () => Promise<void>): Promise<void> {
    newSheet.disabled = true;
    shareCopy.disabled = true;
    try {
      await run();
    } catch (err) {
      setStatus(`${button.textContent} failed: ${message(err)}`, "refused");
    } finally {
      newSheet.disabled = false;
      shareCopy.disabled = false;
    }
    await refresh();
  }

  linear.addEventListener("click", () => setAxis("linear"));
  pow.addEventListener("click", () => setAxis("pow"));
  function setAxis(a: FlowAxis): void {
    axis = a;
    if (lastReady) drawPlot(lastReady);
  }
  unitsSelect.addEventListener("change", () => (unitsTouched = true));
  summaryButton?.addEventListener("click", async () => {
    if (!lastReady || !lastReadings || !options.onPrintSummary) return;
    try {
      const outcome = await options.onPrintSummary({ estimate: lastReady, readings: lastReadings });
      if (!outcome.shown) setStatus(outcome.reason, "refused");
    } catch (err) {
      setStatus(`The one-page summary failed: ${message(err)}`, "refused");
    }
  });
  refreshButton.addEventListener("click", () => void refresh());
  newSheet.addEventListener("click", () =>
    action(newSheet, async () => {
      const r = await port.insertEstimateSheet(unitsSelect.value as UnitSystem);
      const moved = r.namesMoved.length > 0 ? " The named cells now point to it." : "";
      setStatus(`Added the sheet ${r.sheetName} with a demo scenario: overwrite the shaded cells.${moved}`);
    }),
  );
  shareCopy.addEventListener("click", () =>
    action(shareCopy, async () => {
      // the plot of what the sheet holds now: read it again first, then the copy carries the pane's plot
      await refresh();
      const ready = current?.kind === "ready" ? current.estimate : null;
      const r = await port.makeShareCopy(ready ? sharePlot(ready, plotData(ready, niceMax)) : undefined);
      if (r.ok) setStatus(`Added ${r.sheetName}: the numbers of ${r.sourceSheet} with values frozen, for readers without the add-in. ${r.sourceSheet} is unchanged.`);
      else setStatus(r.reason, "refused");
    }),
  );

  let resize: ResizeObserver | null = null;
  let lastWidth = width();
  if (!options.width && typeof ResizeObserver !== "undefined") {
    resize = new ResizeObserver(() => {
      const w = width();
      if (Math.abs(w - lastWidth) >= 4 && lastReady) {
        lastWidth = w;
        drawPlot(lastReady);
      }
    });
    resize.observe(root);
  }

  let unsubscribe: (() => Promise<void>) | null = null;
  const ready = (async () => {
    try {
      unsubscribe = await port.subscribe(() => void refresh());
    } catch (err) {
      setStatus(`The pane will not follow changes (${message(err)}); use Read again.`, "refused");
    }
    await refresh();
  })();

  return {
    ready,
    refresh,
    idle: async () => {
      await ready;
      while (running) await running;
    },
    model: () => current,
    destroy: async () => {
      destroyed = true;
      stopBusyTimer();
      resize?.disconnect();
      await unsubscribe?.();
      root.replaceChildren();
    },
  };
}

function message(err: unknown): string {
  return err instanceof Error ? err.message : String(err);
}
