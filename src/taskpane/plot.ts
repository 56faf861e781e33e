/**
 * The supply-versus-demand picture as SVG: the supply curve through the flow test, the required-margin band under
 * it, the demand point(s), the supply with the pump added, and the gap at the demand flow.
 *
 * Two flow axes: linear, or Q^1.85, on which the supply curve P = Ps − (Ps − Pr)(Q/Qt)^1.85 is a straight line (the
 * trade's water-supply graph). d3-scale's power scale maps Q to pixels; its ticks are round numbers in flow units,
 * thinned where the power axis crowds them near 0.
 *
 * Stable hooks for tests: the svg has data-role="plot", the supply curve data-role="supply-curve", each demand point
 * data-role="demand-point" (data-id "sprinklers" or "total") placed by transform="translate(x,y)". Where several design
 * areas are compared, each is a data-role="candidate-point" instead (data-name, data-controls "true" on the one that
 * controls), placed the same way.
 */
import { scaleLinear, scalePow, type ScaleLinear, type ScalePower } from "d3-scale";
import { HW_FLOW_EXPONENT } from "../engine/friction";
import { PALETTE } from "../workbook/look";
import type { PlotData, Pt } from "./model";

export type FlowAxis = "linear" | "pow";

/** A white outline drawn behind label text, so that a curve crossing the label does not cut through it. */
const HALO = { stroke: "#FFFFFF", "stroke-width": 3, "stroke-linejoin": "round", "paint-order": "stroke" } as const;

const SVG = "http://www.w3.org/2000/svg";

/** Space around the plotting area, px. */
const PAD = { left: 46, right: 18, top: 14, bottom: 42 };
/** Smallest gap between two x tick labels, px, on top of the label's own width. */
const TICK_GAP = 10;
/** Approximate width of one digit of the tick labels (11 px system font), px. */
const DIGIT_WIDTH = 6.4;

/** The plot's size for a pane width: readable from 280 px up, never taller than it needs. */
export function plotSize(paneWidth: number): { width: number; height: number } {
  const width = Math.round(Math.min(720, Math.max(280, paneWidth)));
  const height = Math.round(Math.min(420, Math.max(230, width * 0.78)));
  return { width, height };
}

/** Round an axis end up to a round number (0 … 5000 → 0 … 5000, 0 … 1234 → 0 … 1400). */
export function niceMax(v: number): number {
  return scaleLinear().domain([0, v]).nice(5).domain()[1];
}

export function xScale(axis: FlowAxis, qMax: number, width: number): ScaleLinear<number, number> | ScalePower<number, number> {
  const range: [number, number] = [PAD.left, width - PAD.right];
  return axis === "pow"
    ? scalePow().exponent(HW_FLOW_EXPONENT).domain([0, qMax]).range(range)
    : scaleLinear().domain([0, qMax]).range(range);
}

export function yScale(pMax: number, height: number): ScaleLinear<number, number> {
  return scaleLinear().domain([0, pMax]).range([height - PAD.bottom, PAD.top]);
}

/**
 * Thin one set of round ticks so that no two labels collide, keeping the step regular: ticks give way only at the
 * low end, where a power axis crowds them, and 0 always stays. Returns the ticks kept, ascending.
 */
export function thinTicks(ticks: number[], x: (v: number) => number, label: (v: number) => string): number[] {
  const t = [...ticks].sort((a, b) => a - b);
  const room = (a: number, b: number) => Math.abs(x(a) - x(b)) >= (label(a).length + label(b).length) * (DIGIT_WIDTH / 2) + TICK_GAP;
  const rest = t.filter((v) => v !== 0);
  // the longest run at the top end whose neighbours all have room
  let first = rest.length - 1;
  while (first > 0 && room(rest[first - 1], rest[first])) first--;
  let kept = rest.slice(Math.max(first, 0));
  if (t[0] === 0) {
    while (kept.length && !room(0, kept[0])) kept = kept.slice(1);
    kept = [0, ...kept];
  }
  return kept;
}

/** Round flow ticks for an axis: of the tick sets d3 offers for 6 down to 3 ticks, the one that keeps most after thinning. */
export function flowTicks(scale: { ticks(count: number): number[] }, x: (v: number) => number, label: (v: number) => string): number[] {
  let best: number[] = [];
  for (const count of [6, 5, 4, 3]) {
    const kept = thinTicks(scale.ticks(count), x, label);
    if (kept.length > best.length) best = kept;
  }
  return best;
}

function el<K extends keyof SVGElementTagNameMap>(doc: Document, tag: K, attrs: Record<string, string | number>, parent?: Element): SVGElementTagNameMap[K] {
  const e = doc.createElementNS(SVG, tag);
  for (const [k, v] of Object.entries(attrs)) e.setAttribute(k, String(v));
  parent?.appendChild(e);
  return e;
}

const r2 = (v: number) => Math.round(v * 100) / 100;

/** A flow or pressure tick label: plain digits, as the pane writes numbers elsewhere (1500, not 1,500). */
function tickLabel(v: number): string {
  return String(Number(v.toPrecision(6)));
}

/**
 * Approximate width of a character of a label in the 11 px system font at weight 600, px, and the height of its box
 * from above the capitals to below the descenders (measured in Chromium: getBoundingClientRect of the labels).
 */
const CHAR_WIDTH = 6.6;
const LABEL_HEIGHT = 14;

type Box = { x0: number; y0: number; x1: number; y1: number };
type Offset = { dx: number; dy: number; anchor: "start" | "middle" | "end" };

/** Label offsets around a point: above or below it, to its right, left or centred. */
const OFFSETS = {
  ar: { dx: 8, dy: -8, anchor: "start" },
  al: { dx: -8, dy: -8, anchor: "end" },
  br: { dx: 8, dy: 17, anchor: "start" },
  bl: { dx: -8, dy: 17, anchor: "end" },
  ac: { dx: 0, dy: -11, anchor: "middle" },
  bc: { dx: 0, dy: 20, anchor: "middle" },
} as const satisfies Record<string, Offset>;
type Spot = keyof typeof OFFSETS;

/** The same spots one label height further from the point, for where the near ones are all taken. */
const FAR_OFFSETS: Record<Spot, Offset> = Object.fromEntries(
  Object.entries(OFFSETS).map(([k, o]) => [k, { ...o, dy: o.dy + (o.dy < 0 ? -LABEL_HEIGHT : LABEL_HEIGHT) }]),
) as Record<Spot, Offset>;

function labelBox(px: number, py: number, o: Offset, label: string): Box {
  const w = label.length * CHAR_WIDTH;
  const x0 = o.anchor === "start" ? px + o.dx : o.anchor === "end" ? px + o.dx - w : px + o.dx - w / 2;
  const base = py + o.dy;
  return { x0, y0: base - LABEL_HEIGHT + 3, x1: x0 + w, y1: base + 3 };
}

const overlap = (a: Box, b: Box) => Math.max(0, Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0)) * Math.max(0, Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0));
const outside = (b: Box, area: Box) =>
  Math.max(0, area.x0 - b.x0) + Math.max(0, b.x1 - area.x1) + Math.max(0, area.y0 - b.y0) + Math.max(0, b.y1 - area.y1);

/**
 * Place a label at a point: the spot of `prefer` (in that order, near the point, then one label height further) that
 * stays inside `area` and clear of `taken` (other labels and markers), else the one that pokes out and overlaps
 * least. Adds the box chosen to `taken`.
 */
function place(px: number, py: number, label: string, prefer: Spot[], area: Box, taken: Box[]): Offset & { clear: boolean } {
  let best: { o: Offset; b: Box; cost: number } | null = null;
  for (const o of [...prefer.map((k) => OFFSETS[k]), ...prefer.map((k) => FAR_OFFSETS[k])]) {
    const b = labelBox(px, py, o, label);
    const cost = outside(b, area) * LABEL_HEIGHT * 4 + taken.reduce((sum, t) => sum + overlap(b, t), 0);
    if (!best || cost < best.cost) best = { o, b, cost };
    if (cost === 0) break;
  }
  taken.push(best!.b);
  return { ...best!.o, clear: best!.cost === 0 };
}

function pathOf(points: readonly Pt[], x: (q: number) => number, y: (p: number) => number): string {
  return points.map(([q, p], i) => `${i ? "L" : "M"}${r2(x(q))},${r2(y(p))}`).join("");
}

/** The marker shapes, centred on 0,0: shape carries the meaning as well as colour. */
function marker(doc: Document, shape: "square" | "diamond" | "circle", fill: string, stroke: string, parent: Element): void {
  if (shape === "square") el(doc, "rect", { x: -4.5, y: -4.5, width: 9, height: 9, fill, stroke, "stroke-width": 2 }, parent);
  else if (shape === "diamond") el(doc, "path", { d: "M0,-6.5L6.5,0L0,6.5L-6.5,0Z", fill, stroke, "stroke-width": 1.5 }, parent);
  else el(doc, "circle", { r: 3.5, fill, stroke, "stroke-width": 1.5 }, parent);
}

function text(doc: Document, s: string, attrs: Record<string, string | number>, parent: Element): SVGTextElement {
  const t = el(doc, "text", attrs, parent);
  t.textContent = s;
  return t;
}

/** A design area's label on the plot: its name, and "controls" on the one that does. */
function candidateLabel(c: PlotData["candidates"][number]): string {
  return c.controls ? `${c.name} (controls)` : c.name;
}

/** Draw the picture. `width` is the pane's width in px. */
export function renderPlot(doc: Document, d: PlotData, axis: FlowAxis, paneWidth: number): SVGSVGElement {
  const { width, height } = plotSize(paneWidth);
  const x = xScale(axis, d.qMax, width);
  const y = yScale(d.pMax, height);
  const X = (q: number) => x(q) as number;
  const Y = (p: number) => y(p) as number;
  const svg = el(doc, "svg", {
    xmlns: SVG,
    viewBox: `0 0 ${width} ${height}`,
    width,
    height,
    role: "img",
    "data-role": "plot",
    "data-axis": axis,
    "data-exponent": axis === "pow" ? HW_FLOW_EXPONENT : 1,
    "data-q-max": d.qMax,
    "data-p-max": d.pMax,
    "data-x-range": `${PAD.left},${width - PAD.right}`,
    "data-y-range": `${height - PAD.bottom},${PAD.top}`,
    class: "hr-plot",
  });
  const total = d.demand.find((p) => p.id === "total")!;
  const summary =
    `Supply curve from ${r2(d.staticPoint[1])} ${d.pressureUnit} at no flow through ${r2(d.testPoint[1])} ${d.pressureUnit} at ` +
    `${Math.round(d.testPoint[0])} ${d.flowUnit}; demand ${r2(total.p)} ${d.pressureUnit} at ${Math.round(total.q)} ${d.flowUnit}.`;
  el(doc, "title", {}, svg).textContent = summary;

  // grid and axes
  const grid = el(doc, "g", { class: "grid", stroke: PALETTE.grid, "stroke-width": 1 }, svg);
  const xLabel = tickLabel;
  const xTicks = flowTicks(x, X, xLabel);
  const yTicks = y.ticks(5);
  const yLabel = tickLabel;
  for (const t of xTicks) el(doc, "line", { x1: r2(X(t)), x2: r2(X(t)), y1: Y(0), y2: PAD.top }, grid);
  for (const t of yTicks) el(doc, "line", { x1: PAD.left, x2: width - PAD.right, y1: r2(Y(t)), y2: r2(Y(t)) }, grid);

  const ax = el(doc, "g", { class: "axis x", "font-size": 11, fill: PALETTE.ink }, svg);
  el(doc, "line", { x1: PAD.left, x2: width - PAD.right, y1: Y(0), y2: Y(0), stroke: PALETTE.ink }, ax);
  for (const t of xTicks) {
    const g = el(doc, "g", { class: "tick", transform: `translate(${r2(X(t))},${Y(0)})` }, ax);
    el(doc, "line", { y2: 4, stroke: PALETTE.ink }, g);
    text(doc, xLabel(t), { y: 15, "text-anchor": "middle" }, g);
  }
  const xTitle = axis === "pow" ? `Flow (${d.flowUnit}), Q^1.85 scale` : `Flow (${d.flowUnit})`;
  text(doc, xTitle, { class: "title", x: (PAD.left + width - PAD.right) / 2, y: height - 6, "text-anchor": "middle", "font-size": 11.5 }, ax);

  const ay = el(doc, "g", { class: "axis y", "font-size": 11, fill: PALETTE.ink }, svg);
  el(doc, "line", { x1: PAD.left, x2: PAD.left, y1: Y(0), y2: PAD.top, stroke: PALETTE.ink }, ay);
  for (const t of yTicks) {
    const g = el(doc, "g", { class: "tick", transform: `translate(${PAD.left},${r2(Y(t))})` }, ay);
    el(doc, "line", { x2: -4, stroke: PALETTE.ink }, g);
    text(doc, yLabel(t), { x: -7, dy: "0.32em", "text-anchor": "end" }, g);
  }
  text(doc, `Pressure (${d.pressureUnit})`, {
    class: "title",
    transform: `translate(12,${(PAD.top + height - PAD.bottom) / 2}) rotate(-90)`,
    "text-anchor": "middle",
    "font-size": 11.5,
  }, ay);

  // the required-margin band: between the supply curve and the supply less the margin
  if (d.band) {
    const area = pathOf(d.supply, X, Y) + pathOf([...d.band].reverse(), X, Y).replace(/^M/, "L") + "Z";
    el(doc, "path", { "data-role": "margin-band", d: area, fill: PALETTE.band, "fill-opacity": 0.28, stroke: "none" }, svg);
    el(doc, "path", { d: pathOf(d.band, X, Y), fill: "none", stroke: PALETTE.supply, "stroke-width": 1, "stroke-dasharray": "2 3" }, svg);
  }

  // the supply with the pump
  if (d.pump) {
    el(doc, "path", { "data-role": "pump-curve", d: pathOf(d.pump, X, Y), fill: "none", stroke: PALETTE.pump, "stroke-width": 2.25, "stroke-dasharray": "7 3 2 3" }, svg);
  }

  // the supply curve, with its static and test points
  el(doc, "path", { "data-role": "supply-curve", d: pathOf(d.supply, X, Y), fill: "none", stroke: PALETTE.supply, "stroke-width": 2.5, "stroke-linejoin": "round" }, svg);
  for (const [role, pt] of [
    ["static-point", d.staticPoint],
    ["test-point", d.testPoint],
  ] as const) {
    const g = el(doc, "g", { "data-role": role, transform: `translate(${r2(X(pt[0]))},${r2(Y(pt[1]))})` }, svg);
    marker(doc, "circle", "#FFFFFF", PALETTE.supply, g);
  }

  // the gap between supply and demand at the demand flow
  if (d.supplyAtDemand !== null) {
    const gx = r2(X(total.q));
    const short = d.supplyAtDemand < total.p;
    el(doc, "line", {
      "data-role": "margin-gap",
      x1: gx,
      x2: gx,
      y1: r2(Y(total.p)),
      y2: r2(Y(d.supplyAtDemand)),
      stroke: short ? PALETTE.demand : PALETTE.ink,
      "stroke-width": 1.5,
      "stroke-dasharray": short ? "none" : "3 2",
    }, svg);
  }

  // demand points, each with its own shape and a label placed clear of the others (a white halo keeps a label
  // readable where a curve runs behind it)
  const area: Box = { x0: PAD.left + 2, y0: PAD.top, x1: width - PAD.right, y1: height - PAD.bottom - 2 };
  // a marker and a clearance around it (the diamond reaches 6.5 px and its stroke 0.75 px more)
  const markerBox = (q: number, p: number): Box => ({ x0: X(q) - 8, y0: Y(p) - 8, x1: X(q) + 8, y1: Y(p) + 8 });
  const several = d.candidates.length > 0;
  const points = several ? d.candidates.map((c) => markerBox(c.q, c.p)) : d.demand.map((pt) => markerBox(pt.q, pt.p));
  const taken: Box[] = [...points, markerBox(...d.testPoint), markerBox(...d.staticPoint)];
  const ordered = several ? [] : [...d.demand].sort((a, b) => (a.id === "total" ? -1 : b.id === "total" ? 1 : 0));
  const offsets = new Map<string, Offset>();
  // the controlling area's name first, then the others', each where it fits
  const candidateOffsets = new Map<number, Offset & { clear: boolean }>();
  const byControl = d.candidates.map((c, i) => [c, i] as const).sort(([a], [b]) => Number(b.controls) - Number(a.controls));
  for (const [c, i] of byControl) {
    const above = d.supplyAtDemand !== null && c.controls && c.p > d.supplyAtDemand;
    const prefer: Spot[] = above ? ["ar", "ac", "al", "br", "bc", "bl"] : ["br", "bc", "bl", "ar", "ac", "al"];
    candidateOffsets.set(i, place(X(c.q), Y(c.p), candidateLabel(c), prefer, area, taken));
  }
  for (const pt of ordered) {
    const above = d.supplyAtDemand !== null && pt.p > d.supplyAtDemand;
    const prefer: Spot[] =
      pt.id === "total"
        ? above ? ["ar", "ac", "al", "br", "bc", "bl"] : ["br", "bc", "bl", "ar", "ac", "al"]
        : above ? ["al", "ac", "bl", "bc", "ar", "br"] : ["bl", "bc", "al", "ac", "br", "ar"];
    offsets.set(pt.id, place(X(pt.q), Y(pt.p), pt.label, prefer, area, taken));
  }
  const tp = d.testPoint;
  const tpo = place(X(tp[0]), Y(tp[1]), "flow test", ["ar", "ac", "al", "br", "bl", "bc"], area, taken);
  // a name for the test point where there is room for it (the legend names it too)
  if (tpo.clear) text(doc, "flow test", { x: r2(X(tp[0]) + tpo.dx), y: r2(Y(tp[1]) + tpo.dy), "text-anchor": tpo.anchor, "font-size": 10.5, fill: PALETTE.supply, ...HALO }, svg);
  d.candidates.forEach((c, i) => {
    const g = el(doc, "g", {
      "data-role": "candidate-point",
      "data-name": c.name,
      "data-controls": String(c.controls),
      "data-flow": c.q,
      "data-pressure": c.p,
      transform: `translate(${r2(X(c.q))},${r2(Y(c.p))})`,
    }, svg);
    if (c.controls) marker(doc, "diamond", PALETTE.demand, "#FFFFFF", g);
    else marker(doc, "circle", "#FFFFFF", PALETTE.candidate, g);
    const o = candidateOffsets.get(i)!;
    // every name is in the pane's list of the areas compared (and the summary's key inputs); on the plot, the controlling
    // one always, the others where they fit
    if (!c.controls && !o.clear) return;
    text(doc, candidateLabel(c), {
      x: o.dx,
      y: o.dy,
      "text-anchor": o.anchor,
      "font-size": c.controls ? 11 : 10.5,
      "font-weight": c.controls ? 600 : 400,
      fill: c.controls ? PALETTE.demand : "#7A3E63",
      ...HALO,
    }, g);
  });
  for (const pt of several ? [] : d.demand) {
    const px = r2(X(pt.q));
    const py = r2(Y(pt.p));
    const g = el(doc, "g", { "data-role": "demand-point", "data-id": pt.id, "data-flow": pt.q, "data-pressure": pt.p, transform: `translate(${px},${py})` }, svg);
    if (pt.id === "sprinklers") marker(doc, "square", "#FFFFFF", PALETTE.sprinklers, g);
    else marker(doc, "diamond", PALETTE.demand, "#FFFFFF", g);
    const o = offsets.get(pt.id)!;
    text(doc, pt.label, {
      x: o.dx,
      y: o.dy,
      "text-anchor": o.anchor,
      "font-size": 11,
      "font-weight": 600,
      fill: pt.id === "sprinklers" ? "#8A5A00" : PALETTE.demand,
      ...HALO,
    }, g);
  }
  return svg;
}
