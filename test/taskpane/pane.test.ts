// @vitest-environment happy-dom
import { afterEach, describe, expect, it, vi } from "vitest";
import { verdict as verdictCell } from "../../src/functions/functions";
import { BUSY_REREAD_MS, type PaneHandle, type SummaryRequest, mountPane } from "../../src/taskpane/pane";
import { CAUTION, PALETTE } from "../../src/workbook/look";
import { BASE, FakePort, SHORT_105, type Values, siBreakdown } from "./fakePort";

let mounted: PaneHandle[] = [];
afterEach(async () => {
  for (const p of mounted) await p.destroy();
  mounted = [];
  document.body.replaceChildren();
});

async function mount(values: Values, options: Parameters<typeof mountPane>[2] = { width: 320 }) {
  const port = new FakePort(values);
  const root = document.createElement("div");
  document.body.appendChild(root);
  const pane = mountPane(root, port, options);
  mounted.push(pane);
  await pane.ready;
  await pane.idle();
  const $ = <T extends Element = HTMLElement>(role: string) => root.querySelector<T>(`[data-role="${role}"]`);
  const $$ = (role: string) => [...root.querySelectorAll(`[data-role="${role}"]`)];
  return { port, root, pane, $, $$ };
}

/** The vertices of an SVG path "M x,y L x,y ...". */
function vertices(d: string): Array<[number, number]> {
  return [...d.matchAll(/[ML](-?[\d.]+),(-?[\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])]);
}

function translate(el: Element): [number, number] {
  const m = /translate\((-?[\d.]+),(-?[\d.]+)\)/.exec(el.getAttribute("transform") ?? "");
  if (!m) throw new Error("no translate");
  return [Number(m[1]), Number(m[2])];
}

/**
 * Where a flow and a pressure should land, worked from the plot's stated ranges, independently of d3:
 * x = x0 + (x1 − x0) (q / qMax)^e with e = 1 on the linear axis and 1.85 on the Q^1.85 axis; y likewise, linear.
 */
function expected(svg: Element, q: number, p: number): [number, number] {
  const [x0, x1] = svg.getAttribute("data-x-range")!.split(",").map(Number);
  const [y0, y1] = svg.getAttribute("data-y-range")!.split(",").map(Number);
  const qMax = Number(svg.getAttribute("data-q-max"));
  const pMax = Number(svg.getAttribute("data-p-max"));
  const e = svg.getAttribute("data-axis") === "pow" ? 1.85 : 1;
  return [x0 + (x1 - x0) * Math.pow(q / qMax, e), y0 + (y1 - y0) * (p / pMax)];
}

function expectNear(actual: [number, number], want: [number, number], tol = 0.02): void {
  expect(Math.abs(actual[0] - want[0]), `x ${actual[0]} vs ${want[0]}`).toBeLessThanOrEqual(tol);
  expect(Math.abs(actual[1] - want[1]), `y ${actual[1]} vs ${want[1]}`).toBeLessThanOrEqual(tol);
}

function hasVertexNear(d: string, want: [number, number]): boolean {
  return vertices(d).some(([x, y]) => Math.abs(x - want[0]) <= 0.02 && Math.abs(y - want[1]) <= 0.02);
}

describe("the plot", () => {
  for (const axis of ["linear", "pow"] as const) {
    it(`passes the supply curve through the static and test points on the ${axis} axis [NFPA 291]`, async () => {
      const { $ } = await mount(BASE, { width: 320, axis });
      const svg = $("plot")!;
      expect(svg.getAttribute("data-axis")).toBe(axis);
      const d = $("supply-curve")!.getAttribute("d")!;
      expect(hasVertexNear(d, expected(svg, 0, 72))).toBe(true); // static 72 psi at no flow
      expect(hasVertexNear(d, expected(svg, 1100, 58))).toBe(true); // residual 58 psi at 1100 gpm
    });

    it(`puts the demand points at their flow and pressure on the ${axis} axis`, async () => {
      const { $, $$ } = await mount({ ...BASE, Demand_HoseFlow: 250 }, { width: 320, axis });
      const svg = $("plot")!;
      const points = $$("demand-point");
      expect(points.map((p) => p.getAttribute("data-id"))).toEqual(["sprinklers", "total"]);
      expectNear(translate(points[0]), expected(svg, 562 - 250, 48));
      expectNear(translate(points[1]), expected(svg, 562, 48));
    });
  }

  it("draws the supply curve as a straight line on the Q^1.85 axis, and bent on the linear one", async () => {
    const off = async (axis: "linear" | "pow") => {
      const { $ } = await mount(BASE, { width: 320, axis });
      const v = vertices($("supply-curve")!.getAttribute("d")!);
      const [a, b] = [v[0], v[v.length - 1]];
      // largest distance of a vertex from the chord through the curve's ends, px
      return Math.max(...v.map(([x, y]) => Math.abs((b[0] - a[0]) * (a[1] - y) - (a[0] - x) * (b[1] - a[1])) / Math.hypot(b[0] - a[0], b[1] - a[1])));
    };
    expect(await off("pow")).toBeLessThan(0.05);
    expect(await off("linear")).toBeGreaterThan(5);
  });

  it("switches the axis with the toggle and moves the demand point", async () => {
    const { $ } = await mount(BASE);
    const before = translate($("demand-point")!);
    $<HTMLButtonElement>("axis-pow")!.click();
    const svg = $("plot")!;
    expect(svg.getAttribute("data-axis")).toBe("pow");
    expect($("axis-pow")!.getAttribute("aria-pressed")).toBe("true");
    const after = translate($("demand-point")!);
    expectNear(after, expected(svg, 562, 48));
    expect(after[0]).toBeLessThan(before[0]); // Q^1.85 squeezes the lower flows to the left
  });

  it("labels round flows, thinned near 0 on the Q^1.85 axis, and titles both axes with units", async () => {
    for (const axis of ["linear", "pow"] as const) {
      const { root } = await mount(BASE, { width: 320, axis });
      const ticks = [...root.querySelectorAll(".axis.x .tick")];
      const labels = ticks.map((t) => t.textContent);
      expect(labels[0]).toBe("0");
      for (const l of labels) expect(Number(l!.replace(/,/g, "")) % 100).toBe(0);
      const xs = ticks.map((t) => translate(t)[0]);
      for (let i = 1; i < xs.length; i++) expect(xs[i] - xs[i - 1], `${axis}: ${labels[i - 1]} to ${labels[i]}`).toBeGreaterThanOrEqual(24);
      // thinning keeps one step: only the low end gives way
      const values = labels.slice(1).map(Number);
      const steps = new Set(values.slice(1).map((v, i) => v - values[i]));
      expect(steps.size, labels.join(" ")).toBe(1);
      expect(values.length).toBeGreaterThanOrEqual(3);
      const titles = [...root.querySelectorAll(".axis .title")].map((t) => t.textContent);
      expect(titles).toEqual([axis === "pow" ? "Flow (gpm), Q^1.85 scale" : "Flow (gpm)", "Pressure (psi)"]);
    }
  });

  it("speaks SI on an SI sheet", async () => {
    const { root } = await mount({ Units: "SI", Supply_Static: 5, Supply_Residual: 4, Supply_TestFlow: 4000, Demand_Flow: 2000, Demand_Pressure: 3 });
    expect([...root.querySelectorAll(".axis .title")].map((t) => t.textContent)).toEqual(["Flow (L/min)", "Pressure (bar)"]);
  });

  it("draws the margin band and the pump when they are given, with legend entries", async () => {
    const plain = await mount(BASE);
    expect(plain.$("margin-band")).toBeNull();
    expect(plain.$("pump-curve")).toBeNull();
    const full = await mount({ ...BASE, Required_Margin: 10, Pump_RatedFlow: 750, Pump_RatedPressure: 25 });
    expect(full.$("margin-band")).not.toBeNull();
    expect(full.$("pump-curve")).not.toBeNull();
    const legend = [...full.root.querySelectorAll('[data-role="legend"] li')].map((l) => l.textContent);
    expect(legend).toEqual(["Water supply (flow test)", "Required margin 10.0 psi", "Demand", "Supply + chosen pump 750 gpm at 25.0 psi"]);
  });

  it("stays readable at 320 px: full width, no text under 10.5 px", async () => {
    const { $, root } = await mount(BASE, { width: 320 - 24 });
    const svg = $("plot")!;
    expect(Number(svg.getAttribute("width"))).toBe(296);
    for (const t of root.querySelectorAll("svg[data-role=plot] text")) {
      let size: string | null = null;
      for (let e: Element | null = t; e && !size; e = e.parentElement) size = e.getAttribute("font-size");
      expect(Number(size), t.textContent ?? "").toBeGreaterThanOrEqual(10.5);
    }
  });
});

describe("the verdict and the caution", () => {
  it("writes VERDICT's sentence, the margin in psi and percent, and the caution beneath", async () => {
    const { $ } = await mount({ ...BASE, Required_Margin: 10 });
    expect($("verdict")!.textContent).toBe(verdictCell(562, 48, 72, 58, 1100, 10, "US"));
    expect($("verdict")!.textContent).toBe("No pump needed: 20.0 psi to spare at 562 gpm (10.0 psi margin required).");
    // 19.958 / 48 = 41.6 % → 42 %
    expect($("margin")!.textContent).toBe("Margin 20.0 psi, 42 % of the 48.0 psi demand pressure; required 10.0 psi.");
    expect($("pump")!.hidden).toBe(true);
    const caution = $("caution")!;
    expect(caution.textContent).toBe(CAUTION);
    expect(caution.hidden).toBe(false);
    expect($("verdict")!.compareDocumentPosition(caution) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
  });

  it("redraws on a change event: a higher demand turns the verdict and moves the point", async () => {
    const { port, pane, $ } = await mount({ ...BASE, Required_Margin: 10 });
    const y0 = translate($("demand-point")!)[1];
    port.set({ Demand_Pressure: 78 });
    await pane.idle();
    expect($("verdict")!.textContent).toBe(verdictCell(562, 78, 72, 58, 1100, 10, "US"));
    expect($("verdict")!.textContent).toBe("Pump needed: the supply is 10.0 psi short at 562 gpm.");
    expect(translate($("demand-point")!)[1]).toBeLessThan(y0);
    // boost 78 + 10 − 67.958 = 20.0 psi → 25 psi; 562 gpm → 750 gpm [NFPA 20] (from memory)
    expect($("pump")!.textContent).toBe("Suggested pump: 750 gpm rated at 25.0 psi, the smallest standard rating for 562 gpm through it and a boost of 20.0 psi.");
    // margin 67.958 − 78 = −10.04 psi; −10.04 / 78 = −12.9 % → −13 %
    expect($("margin")!.textContent).toBe("Margin −10.0 psi, −13 % of the 78.0 psi demand pressure; required 10.0 psi.");
  });

  it("counts the inputs to change, not the names that show their errors", async () => {
    // one input's text reaches the three supply names; Demand_Flow holds text of its own
    const message = 'residual: got "1250 gpm"; must be a number';
    const error = (address: string) => ({ kind: "error", code: "#VALUE!", message, address }) as const;
    const port = new FakePort({ ...BASE, Supply_Static: error("Estimate!B112"), Supply_Residual: error("Estimate!B113"), Supply_TestFlow: error("Estimate!B114"), Demand_Flow: "abc" });
    const input = [{ address: "Estimate!B14", reading: { kind: "text", value: "1250 gpm", address: "Estimate!B14" } }] as const;
    port.behind = { "Estimate!B112": [...input], "Estimate!B113": [...input], "Estimate!B114": [...input] };
    const root = document.createElement("div");
    document.body.appendChild(root);
    const pane = mountPane(root, port, { width: 320 });
    mounted.push(pane);
    await pane.ready;
    await pane.idle();
    expect(port.askedBehind.at(-1)).toEqual(["Estimate!B112", "Estimate!B113", "Estimate!B114"]);
    expect(root.querySelector('[data-role="verdict"]')!.textContent).toBe("2 inputs need attention");
    const items = [...root.querySelectorAll('[data-role="problems"] li')].map((i) => i.textContent);
    expect(items).toHaveLength(2);
    expect(items[0]).toMatch(/^Estimate!B14 holds "1250 gpm"/);
    expect(items[1]).toMatch(/^Demand_Flow \(Estimate!B\d+\): /);
  });

  it("says which names are missing and how to fix them, keeping the caution", async () => {
    const { port, pane, $, root } = await mount({ Units: "US", Supply_Static: 72, Supply_Residual: 58 });
    expect($("verdict")!.textContent).toBe("3 inputs need attention");
    const items = [...root.querySelectorAll('[data-role="problems"] li')];
    expect(items.map((i) => i.getAttribute("data-name"))).toEqual(["Supply_TestFlow", "Demand_Flow", "Demand_Pressure"]);
    expect(items[0].textContent).toMatch(/^Supply_TestFlow is not defined\. .*Name Box.*New estimate sheet\.$/);
    expect($("plot")).toBeNull();
    expect($("caution")!.textContent).toBe(CAUTION);
    port.set({ Supply_TestFlow: 1100, Demand_Flow: 562, Demand_Pressure: 48 });
    await pane.idle();
    expect($("problems")!.children).toHaveLength(0);
    expect($("plot")).not.toBeNull();
  });

  it("keeps the last picture while Excel calculates", async () => {
    const { port, pane, $ } = await mount(BASE);
    const sentence = $("verdict")!.textContent;
    port.set({ Demand_Pressure: { kind: "error", code: "#BUSY!", address: "Estimate!B57" } });
    await pane.idle();
    expect($("verdict")!.textContent).toBe(sentence);
    expect($("calc-note")!.hidden).toBe(false);
    expect($("calc-note")!.textContent).toBe("Excel is still calculating Demand_Pressure…");
    expect($("caution")!.hidden).toBe(false);
  });
});

describe("waiting out #BUSY! without a calculation event", () => {
  afterEach(() => {
    vi.useRealTimers();
  });
  const BUSY = { kind: "error", code: "#BUSY!", address: "Estimate!B57" } as const;

  it("reads again on a back-off timer while an input shows #BUSY!, and stops once it has a number", async () => {
    vi.useFakeTimers();
    const { port, pane, $ } = await mount({ ...BASE, Demand_Pressure: BUSY });
    expect(pane.model()?.kind).toBe("busy");
    expect(port.reads).toBe(1);
    // nothing tells the pane that anything changed: each delay of the back-off brings one more reading
    for (const [i, delay] of BUSY_REREAD_MS.entries()) {
      await vi.advanceTimersByTimeAsync(delay - 1);
      expect(port.reads, `before re-read ${i + 1}`).toBe(1 + i);
      await vi.advanceTimersByTimeAsync(1);
      expect(port.reads, `re-read ${i + 1}`).toBe(2 + i);
    }
    const longest = BUSY_REREAD_MS[BUSY_REREAD_MS.length - 1];
    await vi.advanceTimersByTimeAsync(longest);
    expect(port.reads).toBe(2 + BUSY_REREAD_MS.length);
    // the function answers; no event is raised (the web case of office-js #587)
    port.readings.Demand_Pressure = { kind: "number", value: 48, address: "Estimate!B57" };
    await vi.advanceTimersByTimeAsync(longest);
    await pane.idle();
    expect(pane.model()?.kind).toBe("ready");
    expect($("calc-note")!.hidden).toBe(true);
    expect($("verdict")!.textContent).toMatch(/^No pump needed/);
    const reads = port.reads;
    await vi.advanceTimersByTimeAsync(10 * longest);
    expect(port.reads).toBe(reads);
  });

  it("keeps one timer when change events arrive while waiting, and stops when the pane is closed", async () => {
    vi.useFakeTimers();
    const { port, pane } = await mount({ ...BASE, Demand_Pressure: BUSY });
    port.set({ Demand_Flow: 570 }); // a change event: one reading of its own, still busy
    await pane.idle();
    expect(port.reads).toBe(2);
    await vi.advanceTimersByTimeAsync(BUSY_REREAD_MS[0]);
    expect(port.reads).toBe(3);
    await pane.destroy();
    mounted = mounted.filter((p) => p !== pane);
    await vi.advanceTimersByTimeAsync(BUSY_REREAD_MS.reduce((a, b) => a + b, 0));
    expect(port.reads).toBe(3);
  });
});

describe("the actions", () => {
  it("inserts an estimate sheet in the units chosen", async () => {
    const { port, pane, $ } = await mount(BASE);
    const units = $<HTMLSelectElement>("units")!;
    expect(units.value).toBe("US");
    units.value = "SI";
    units.dispatchEvent(new Event("change"));
    $<HTMLButtonElement>("new-sheet")!.click();
    await new Promise((r) => setTimeout(r, 0));
    await pane.idle();
    expect(port.inserted).toEqual(["SI"]);
    expect($("status")!.textContent).toBe("Added the sheet Estimate 2 with a demo scenario: overwrite the shaded cells. The named cells now point to it.");
  });

  it("shows why a share copy was refused", async () => {
    const { port, pane, $ } = await mount(BASE);
    port.shareResult = { ok: false, reason: "No share copy made: Estimate!B57 shows #BUSY!; Excel is still calculating: wait until no cell shows #BUSY!, then try again." };
    $<HTMLButtonElement>("share-copy")!.click();
    await new Promise((r) => setTimeout(r, 0));
    await pane.idle();
    expect($("status")!.textContent).toBe(port.shareResult.reason);
    expect($("status")!.getAttribute("data-tone")).toBe("refused");
  });

  it("hands the host its plot with a share copy: the legend's series, the supply through the flow test, the demand", async () => {
    const { port, pane, $ } = await mount(BASE);
    $<HTMLButtonElement>("share-copy")!.click();
    await new Promise((r) => setTimeout(r, 0));
    await pane.idle();
    expect(port.sharedPlots).toHaveLength(1);
    const plot = port.sharedPlots[0]!;
    expect([plot.xTitle, plot.yTitle]).toEqual(["Flow (gpm)", "Pressure (psi)"]);
    const legend = [...$("legend")!.querySelectorAll("li")].map((li) => li.textContent);
    expect(plot.series.map((s) => s.name)).toEqual(legend);
    const supply = plot.series[0];
    expect(supply).toMatchObject({ style: "line", color: PALETTE.supply });
    // the curve starts at the static pressure and passes through the flow test's residual pressure at the test flow
    // (BASE's invented flow test: 72 psi static, 58 psi residual at 1100 gpm)
    expect(supply.points[0]).toEqual([0, 72]);
    expect(supply.points.some(([q, p]) => Math.abs(q - 1100) < 1e-9 && Math.abs(p - 58) < 1e-9)).toBe(true);
    // BASE's demand: 562 gpm at 48 psi, one point (no hose flow given)
    expect(plot.series.find((s) => s.style === "marker")).toMatchObject({ points: [[562, 48]], marker: "diamond", color: PALETTE.demand });
  });

  it("reports a share copy made", async () => {
    const { pane, $ } = await mount(BASE);
    $<HTMLButtonElement>("share-copy")!.click();
    await new Promise((r) => setTimeout(r, 0));
    await pane.idle();
    expect($("status")!.textContent).toMatch(/^Added Estimate values 2026-05-04: the numbers of Estimate with values frozen/);
  });
});

describe("where the pressure goes", () => {
  /** Parts of BASE's 48 psi, invented: 15 + 8.5 + 17.3 + 4.33 + 2.87 = 48.00 psi. */
  const PARTS: Values = { Pressure_EndSprinkler: 15, Pressure_AreaFriction: 8.5, Pressure_RunFriction: 17.3, Pressure_Elevation: 4.33, Pressure_Devices: 2.87 };
  const SHORT = SHORT_105;

  it("draws one row a part, label, pressure and share of the demand pressure, each with its bar", async () => {
    const { $, root } = await mount({ ...BASE, ...PARTS });
    const block = $("breakdown")!;
    expect(block.hidden).toBe(false);
    const rows = [...root.querySelectorAll<HTMLElement>('[data-role="breakdown-row"]')];
    // 15/48 = 31.3 %, 8.5/48 = 17.7 %, 17.3/48 = 36.0 %, 4.33/48 = 9.0 %, 2.87/48 = 6.0 %
    expect(rows.map((r) => [r.dataset.id, r.querySelector(".hr-part-label")!.textContent, r.querySelector(".hr-part-value")!.textContent])).toEqual([
      ["end-sprinkler", "End sprinkler", "15.0 psi (31 %)"],
      ["area-friction", "Friction in the design area", "8.5 psi (18 %)"],
      ["run-friction", "Friction in the pipe run", "17.3 psi (36 %)"],
      ["elevation", "Elevation", "4.3 psi (9 %)"],
      ["devices", "Devices (backflow preventer, meter)", "2.9 psi (6 %)"],
    ]);
    const widths = rows.map((r) => parseFloat(r.querySelector<HTMLElement>(".hr-part-bar")!.style.width));
    [15, 8.5, 17.3, 4.33, 2.87].forEach((p, i) => expect(widths[i]).toBeCloseTo((p / 48) * 100, 1));
    // the bars say nothing to a screen reader that the text does not
    for (const r of rows) expect(r.querySelector(".hr-part-track")!.getAttribute("aria-hidden")).toBe("true");
    // under the pump and suction lines, above what to do next
    // below the verdict, its next steps and the caution (which stays right beneath the verdict), above the plot
    expect($("next-steps")!.compareDocumentPosition(block) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    expect($("caution")!.compareDocumentPosition(block) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    expect(block.compareDocumentPosition($("plot")!) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    expect($("verdict")!.closest("section")!.nextElementSibling).toBe($("caution"));
    expect($("worst")!.hidden).toBe(true);
  });

  it("draws a negative elevation as a gain, its bar outlined", async () => {
    // 15 + 8.5 + 25.8 − 4.33 + 3.03 = 48.00 psi; −4.33/48 = −9.0 %
    const { root } = await mount({ ...BASE, ...PARTS, Pressure_RunFriction: 25.8, Pressure_Elevation: -4.33, Pressure_Devices: 3.03 });
    const row = root.querySelector<HTMLElement>('[data-role="breakdown-row"][data-id="elevation"]')!;
    expect(row.querySelector(".hr-part-value")!.textContent).toBe("−4.3 psi (−9 %)");
    const bar = row.querySelector<HTMLElement>(".hr-part-bar")!;
    expect(bar.dataset.sign).toBe("negative");
    expect(parseFloat(bar.style.width)).toBeCloseTo((4.33 / 48) * 100, 1);
  });

  it("names the segment that loses the most, above the 20 ft/s limit of common practice, and what to do", async () => {
    const { $ } = await mount(SHORT);
    expect($("worst")!.textContent).toBe(
      "Most lost in one segment: 42.6 psi in Cross main to the riser, water at 22.6 ft/s (above the 20 ft/s limit, common practice): a larger pipe there is the cheapest fix.",
    );
    expect($("next-steps")!.textContent).toBe("Upsize Cross main to the riser (loses 42.6 psi), or budget the pump.");
  });

  it("says no more than the facts under the limit, and names the sheet's limit where it gives one", async () => {
    const under = await mount({ ...SHORT, Velocity_Limit: 25 });
    expect(under.$("worst")!.textContent).toBe("Most lost in one segment: 42.6 psi in Cross main to the riser, water at 22.6 ft/s.");
    const over = await mount({ ...SHORT, Velocity_Limit: 18 });
    expect(over.$("worst")!.textContent).toBe(
      "Most lost in one segment: 42.6 psi in Cross main to the riser, water at 22.6 ft/s (above the 18 ft/s limit): a larger pipe there is the cheapest fix.",
    );
  });

  it("speaks SI: bar, m/s and the 6 m/s of common practice", async () => {
    const { $, root } = await mount(siBreakdown());
    // 15 psi = 1.03 bar; 15/105 = 14 %
    expect(root.querySelector('[data-id="end-sprinkler"] .hr-part-value')!.textContent).toBe("1.03 bar (14 %)");
    // 42.6 psi = 2.94 bar; 22.6 ft/s = 6.89 m/s
    expect($("worst")!.textContent).toBe(
      "Most lost in one segment: 2.94 bar in Cross main to the riser, water at 6.9 m/s (above the 6 m/s limit, common practice): a larger pipe there is the cheapest fix.",
    );
  });

  it("is hidden where the workbook names no breakdown, and goes when the names go", async () => {
    const plain = await mount(BASE);
    expect(plain.$("breakdown")!.hidden).toBe(true);
    expect(plain.root.querySelectorAll('[data-role="breakdown-row"]')).toHaveLength(0);
    const { port, pane, $, root } = await mount({ ...BASE, ...PARTS });
    expect($("breakdown")!.hidden).toBe(false);
    port.set({ Pressure_Devices: undefined });
    await pane.idle();
    expect($("breakdown")!.hidden).toBe(true);
    expect(root.querySelectorAll('[data-role="breakdown-row"]')).toHaveLength(0);
  });

  it("lists the parts and the segment among the inputs read", async () => {
    const { $, root } = await mount(SHORT);
    const dl = $("readings")!;
    const rows = new Map([...dl.querySelectorAll("dt")].map((dt) => [dt.textContent, dt.nextElementSibling!.textContent]));
    expect(rows.get("End sprinkler")).toBe("15.0 psi");
    expect(rows.get("Elevation")).toBe("13.0 psi");
    expect(rows.get("Segment losing the most")).toBe("Cross main to the riser: 42.6 psi at 22.6 ft/s");
    expect(rows.get("Velocity limit")).toBe("20 ft/s (common practice: no Velocity_Limit name)");
    const plain = await mount(BASE);
    const plainRows = new Map([...plain.$("readings")!.querySelectorAll("dt")].map((dt) => [dt.textContent, dt.nextElementSibling!.textContent]));
    expect(plainRows.get("Where the pressure goes")).toBe("not given (no Pressure_ names)");
    expect(root.querySelector(".hr-breakdown-title")!.textContent).toBe("Where the pressure goes");
  });
});

describe("the one-page summary button", () => {
  it("is there only where the host can show a summary", async () => {
    const { $ } = await mount(BASE);
    expect($("print-summary")).toBeNull();
  });

  it("hands the host the estimate on show and the readings it came from", async () => {
    const onPrintSummary = vi.fn(async () => ({ shown: true as const }));
    const { $, pane } = await mount({ ...BASE, Project_Site: "Unit 7" }, { width: 320, onPrintSummary });
    const button = $<HTMLButtonElement>("print-summary")!;
    expect(button.disabled).toBe(false);
    button.click();
    await vi.waitFor(() => expect(onPrintSummary).toHaveBeenCalledTimes(1));
    const [request] = onPrintSummary.mock.calls[0] as unknown as [SummaryRequest];
    const m = pane.model();
    expect(m?.kind).toBe("ready");
    if (m?.kind === "ready") expect(request.estimate).toEqual(m.estimate);
    expect(request.readings.Project_Site).toMatchObject({ kind: "text", value: "Unit 7" });
  });

  it("says in the status line why the host could not show it", async () => {
    const reason = "The summary could not open: print the estimate sheet instead.";
    const { $ } = await mount(BASE, { width: 320, onPrintSummary: async () => ({ shown: false, reason }) });
    $<HTMLButtonElement>("print-summary")!.click();
    await vi.waitFor(() => expect($("status")!.textContent).toBe(reason));
    expect($("status")!.dataset.tone).toBe("refused");
  });

  it("is disabled while the inputs need attention, so there is no estimate to print", async () => {
    const { $, port, pane } = await mount({ ...BASE, Supply_Static: "abc" }, { width: 320, onPrintSummary: async () => ({ shown: true }) });
    expect($<HTMLButtonElement>("print-summary")!.disabled).toBe(true);
    port.set({ Supply_Static: 72 });
    await pane.idle();
    expect($<HTMLButtonElement>("print-summary")!.disabled).toBe(false);
  });
});

describe("several design areas", () => {
  it("says which one the verdict is for, lists them all, plots each and marks the one that controls", async () => {
    const { port, pane, $, $$ } = await mount(SHORT_105);
    // the sheet's own area needs 105 psi at 562 gpm (SHORT_105); an invented office needs 30 psi at 300 gpm
    port.setTable([["Print hall", 562, 105, null], ["Office", 300, 30, null], [null, null, null, null]]);
    await pane.idle();
    expect($("controlling")!.textContent).toBe("For Print hall: the least margin of the 2 design areas compared.");
    expect($$("candidate-row").map((r) => [r.getAttribute("data-name"), r.getAttribute("data-controls")])).toEqual([
      ["Print hall", "true"],
      ["Office", "false"],
    ]);
    expect($$("candidate-point").map((p) => [p.getAttribute("data-name"), p.getAttribute("data-controls")])).toEqual([
      ["Print hall", "true"],
      ["Office", "false"],
    ]);
    expect($$("demand-point")).toHaveLength(0);
    // the sheet's own area controls: its breakdown stays
    expect($("breakdown")!.hidden).toBe(false);
    expect($("breakdown-elsewhere")!.hidden).toBe(true);
    expect($("verdict")!.textContent).toBe(verdictCell(562, 105, 72, 58, 1100, "", "US"));
  });

  it("judges another area where it has less margin, and says the breakdown is the sheet's own area's", async () => {
    const { port, pane, $ } = await mount(SHORT_105);
    port.setTable([["Print hall", 562, 105, null], ["Paper store", 1000, 120, null]]);
    await pane.idle();
    expect($("controlling")!.textContent).toBe("For Paper store: the least margin of the 2 design areas compared.");
    expect($("verdict")!.textContent).toBe(verdictCell(1000, 120, 72, 58, 1100, "", "US"));
    expect($("breakdown")!.hidden).toBe(true);
    expect($("breakdown-elsewhere")!.textContent).toBe("Where the pressure goes is worked out on the sheet for Print hall only, which does not control.");
  });

  it("shows nothing of a comparison for one demand", async () => {
    const { port, pane, $, $$ } = await mount(SHORT_105);
    port.setTable([["Print hall", 562, 105, null]]);
    await pane.idle();
    expect($("controlling")!.hidden).toBe(true);
    expect($("candidates")!.hidden).toBe(true);
    expect($$("candidate-point")).toHaveLength(0);
    expect($$("demand-point")).toHaveLength(1);
  });
});
