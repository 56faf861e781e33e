import { Window } from "happy-dom";
import { afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import * as functions from "../../src/functions/functions";
import type { CellData } from "../../src/preview/model";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { BUSY_REREAD_MS, mountPane } from "../../src/taskpane/pane";
import { cellAddress, parseCell, parseRange } from "../../src/workbook/a1";
import { createExcelPort } from "../../src/workbook/excel";
import { CANDIDATES_NAME, INPUT_NAMES, type InputName, SHARE_STAMP, SHARE_STAMP_ROWS, type SharePlot, demoRefusal } from "../../src/workbook/port";
import { demoScenario } from "../../src/workbook/scenario";
import { CAUTION, DEMO_LOOK, FROZEN_NOTE, INPUTS_NOTE, PALETTE, ROLE_STYLES } from "../../src/workbook/look";
import { spillCells } from "../../src/workbook/sheet";
import { estimateTemplate } from "../../src/workbook/template";
import { portContract, type PortHarness } from "./contract";
import { type FakeCell, FakeExcel } from "./fakeExcel";
import { generatedMetadata } from "../preview/metadataFixture";

beforeAll(async () => {
  registerHeadroomFunctions(await generatedMetadata(), functions);
});

const SETTLE_MS = 5;
const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));

function excelPort(fake: FakeExcel, now = new Date()) {
  return createExcelPort({ run: fake.run, runIn: fake.runIn, now: () => now, settleMs: SETTLE_MS, supports: () => true });
}

/** The harness keeps hand-defined names on a sheet "Inputs": name i of INPUT_NAMES in B(i+1). */
function harness(fake = new FakeExcel(["Inputs"])): PortHarness {
  const target = (name: InputName) => {
    if (!fake.names.has(name)) {
      const row = INPUT_NAMES.indexOf(name);
      fake.names.set(name, { sheetId: fake.sheetByName("Inputs")!.id, address: cellAddress({ row, col: 1 }) });
      fake.setCell("Inputs", cellAddress({ row, col: 0 }), { value: name });
    }
    return fake.nameTarget(name)!;
  };
  return {
    port: excelPort(fake),
    put: async (name, content) => {
      const t = target(name);
      fake.setCell(t.sheet, t.address, content === null ? null : { value: content });
    },
    putFormula: async (name, formula, value) => {
      const t = target(name);
      fake.setCell(t.sheet, t.address, { value, formula });
    },
    putError: async (name) => {
      const t = target(name);
      fake.setCell(t.sheet, t.address, { value: "#VALUE!", error: true, formula: "=HEADROOM.FLOWAT(-1,1,1,1)" });
    },
    putTable: async (name, rows) => {
      // tables stand right of the one-cell names, from column D down
      const top = [...fake.names.values()].filter((t) => /^D/.test(t.address)).length * 10;
      const end = cellAddress({ row: top + rows.length - 1, col: 2 + rows[0].length });
      fake.names.set(name, { sheetId: fake.sheetByName("Inputs")!.id, address: `D${top + 1}:${end}` });
      rows.forEach((row, i) => row.forEach((v, j) => fake.setCell("Inputs", cellAddress({ row: top + i, col: 3 + j }), v === null ? null : { value: v })));
    },
    putInput: async (cell, content) => {
      fake.setCell("Inputs", cell, { value: content, style: { "fill/color": ROLE_STYLES.input.fill } });
      return `Inputs!${cell}`;
    },
    putCell: async (cell, content, value) => {
      fake.setCell("Inputs", cell, typeof content === "string" && content.startsWith("=") ? { value: value ?? 0, formula: content } : { value: content });
    },
    remove: async (name) => {
      fake.names.delete(name);
    },
    settle: async () => {
      await wait(SETTLE_MS * 4);
    },
    sheetNames: async () => fake.sheets.map((s) => s.name),
    cells: async (sheet) => fake.cellsOf(sheet),
    nameTarget: async (name) => fake.nameTarget(name),
  };
}

portContract("Excel (office-addin-mock)", async () => harness());

/** Give every formula cell of a sheet a calculated value, as Excel would once the functions have answered. */
function calculate(fake: FakeExcel, sheet: string, value: (address: string) => number | string = () => 1): void {
  for (const [a, c] of fake.sheetByName(sheet)!.cells) {
    if (c.formula) Object.assign(c, { value: value(a), error: false });
  }
}

/**
 * Calculate a sheet of the fake as Excel does once the functions have answered, with the real cell functions (run by
 * the preview's formula engine): every formula cell shows its value, and every cell a spill fills shows its part.
 */
function calculateWithFunctions(fake: FakeExcel, sheet: string): void {
  const s = fake.sheetByName(sheet)!;
  const cells: Record<string, CellData> = {};
  for (const [a, c] of s.cells) cells[a] = { content: c.formula ?? (c.value === "" ? null : c.value) };
  const wb = new PreviewWorkbook({ sheets: [{ name: s.name, cells }], names: [] });
  for (const v of wb.cells(s.name)) {
    const formula = typeof v.content === "string" && v.content.startsWith("=");
    if (!formula && !v.spilledFrom) continue;
    const cell = s.cells.get(v.address) ?? { value: "" };
    const error = v.value !== null && typeof v.value === "object";
    Object.assign(cell, { value: error ? (v.value as { error: string }).error : (v.value ?? ""), error });
    s.cells.set(v.address, cell);
  }
}

/** The addresses of a block, row by row. */
function blockCells(range: string): string[] {
  const r = parseRange(range);
  const out: string[] = [];
  for (let i = 0; i < r.rows; i++) for (let j = 0; j < r.cols; j++) out.push(cellAddress({ row: r.start.row + i, col: r.start.col + j }));
  return out;
}

describe("Excel port: reading names", () => {
  it("reads all ten names in two round trips", async () => {
    const fake = new FakeExcel(["Inputs"]);
    const h = harness(fake);
    await h.put("Supply_Static", 72);
    const before = fake.syncs;
    const r = await h.port.readInputs();
    expect(fake.syncs - before).toBe(2);
    expect(r.Supply_Static).toEqual({ kind: "number", value: 72, address: "Inputs!B2" });
    expect(r.Supply_Residual).toEqual({ kind: "missing" });
  });

  it("reports #BUSY! as an error the pane can wait out", async () => {
    const fake = new FakeExcel(["Inputs"]);
    const h = harness(fake);
    await h.put("Demand_Flow", 1);
    fake.setCell("Inputs", fake.nameTarget("Demand_Flow")!.address, { value: "#BUSY!", error: true, formula: "=HEADROOM.AREADEMAND(1)" });
    expect((await h.port.readInputs()).Demand_Flow).toMatchObject({ kind: "error", code: "#BUSY!" });
  });

  it("says a name that spans several cells is invalid", async () => {
    const fake = new FakeExcel(["Inputs"]);
    fake.names.set("Supply_Static", { sheetId: fake.sheetByName("Inputs")!.id, address: "B2:C3" });
    const r = await excelPort(fake).readInputs();
    expect(r.Supply_Static.kind).toBe("invalid");
    if (r.Supply_Static.kind === "invalid") expect(r.Supply_Static.reason).toMatch(/refers to 4 cells/);
  });

  it("says a name whose sheet was deleted is invalid, not missing", async () => {
    const fake = new FakeExcel(["Inputs", "Old"]);
    fake.names.set("Supply_Static", { sheetId: fake.sheetByName("Old")!.id, address: "B2" });
    fake.sheets.splice(1, 1);
    const r = await excelPort(fake).readInputs();
    expect(r.Supply_Static.kind).toBe("error");
  });
});

describe("Excel port: names scoped to a sheet", () => {
  /** Workbook names on "Inputs" (Supply_Static 72) and a sheet "Site B" with names of its own. */
  async function twoSites() {
    const fake = new FakeExcel(["Inputs", "Site B"]);
    const h = harness(fake);
    await h.put("Supply_Static", 72);
    const siteB = fake.sheetByName("Site B")!;
    siteB.names.set("Supply_Static", { sheetId: siteB.id, address: "B2" });
    siteB.names.set("Demand_Flow", { sheetId: siteB.id, address: "B3" });
    fake.setCell("Site B", "B2", { value: 65 });
    fake.setCell("Site B", "B3", { value: 480 });
    return { fake, h };
  }

  it("reads the active sheet's own definition of a name before the workbook's", async () => {
    const { fake, h } = await twoSites();
    fake.activate("Site B");
    const r = await h.port.readInputs();
    expect(r.Supply_Static).toEqual({ kind: "number", value: 65, address: "'Site B'!B2" });
    expect(r.Demand_Flow).toEqual({ kind: "number", value: 480, address: "'Site B'!B3" });
  });

  it("leaves another sheet's names out, and still reads the workbook's", async () => {
    const { fake, h } = await twoSites();
    fake.activate("Inputs");
    const r = await h.port.readInputs();
    expect(r.Supply_Static).toEqual({ kind: "number", value: 72, address: "Inputs!B2" });
    expect(r.Demand_Flow).toEqual({ kind: "missing" });
  });

  it("reads them in two round trips, as before", async () => {
    const { fake, h } = await twoSites();
    const before = fake.syncs;
    await h.port.readInputs();
    expect(fake.syncs - before).toBe(2);
  });

  it("reads again when another sheet is activated", async () => {
    const { fake, h } = await twoSites();
    let calls = 0;
    const stop = await h.port.subscribe(() => calls++);
    expect(fake.activated.size).toBe(1);
    fake.activate("Site B");
    await h.settle();
    expect(calls).toBe(1);
    await stop();
    expect(fake.activated.size).toBe(0);
  });

  it("makes the share copy of the active sheet when its own names point at it", async () => {
    const { fake, h } = await twoSites();
    fake.activate("Site B");
    const result = await excelPort(fake, new Date(2026, 4, 4)).makeShareCopy();
    expect(result).toMatchObject({ ok: true, sourceSheet: "Site B", sheetName: "Site B values 2026-05-04" });
    // Supply_Static of the workbook still points at Inputs
    expect((await h.nameTarget("Supply_Static"))?.sheet).toBe("Inputs");
  });
});

describe("Excel port: events", () => {
  it("listens to both change and calculation events and makes one call of a burst", async () => {
    const fake = new FakeExcel(["Inputs"]);
    const h = harness(fake);
    let calls = 0;
    const stop = await h.port.subscribe(() => calls++);
    expect(fake.changed.size).toBe(1);
    expect(fake.calculated.size).toBe(1);
    for (let i = 0; i < 5; i++) await h.put("Demand_Flow", 500 + i);
    await h.putFormula("Demand_Pressure", "=B1+1", 3);
    await wait(SETTLE_MS * 6);
    expect(calls).toBe(1);
    await stop();
    expect(fake.changed.size).toBe(0);
    expect(fake.calculated.size).toBe(0);
  });
});

describe("Excel port under the pane: an input that reads #BUSY!", () => {
  afterEach(() => {
    vi.useRealTimers();
  });

  /**
   * Run the fake clock a millisecond at a time until `p` settles: each batch of the fake workbook resolves on a timer
   * tick, which the fake clock schedules a millisecond on.
   */
  async function settled<T>(p: Promise<T>): Promise<T> {
    let done = false;
    void p.finally(() => (done = true));
    while (!done) await vi.advanceTimersByTimeAsync(1);
    return p;
  }

  it("is read again when its function answers without an onCalculated event", async () => {
    vi.useFakeTimers();
    const fake = new FakeExcel(["Inputs"]);
    const h = harness(fake);
    // the flow-test and demand inputs of the engine's decision tests [NFPA 291]: supply at 562 gpm is
    // 72 − 14 × (562/1100)^1.85 = 67.96 psi, above the 48 psi demand
    for (const [name, value] of [["Units", "US"], ["Supply_Static", 72], ["Supply_Residual", 58], ["Supply_TestFlow", 1100], ["Demand_Flow", 562]] as const) {
      await h.put(name, value);
    }
    await h.putFormula("Demand_Pressure", "=HEADROOM.AREADEMAND(1)", 0); // a function that has not answered yet
    const cell = fake.sheetByName("Inputs")!.cells.get(fake.nameTarget("Demand_Pressure")!.address)!;
    Object.assign(cell, { value: "#BUSY!", error: true });

    // a DOM of its own for the pane (happy-dom's types are its own; the pane sees a standard document)
    const doc = new Window().document as unknown as Document;
    const root = doc.createElement("div");
    doc.body.appendChild(root);
    const pane = mountPane(root, excelPort(fake), { width: 320 });
    await settled(pane.ready);
    await settled(pane.idle());
    expect(pane.model()).toEqual({ kind: "busy", names: ["Demand_Pressure"] });
    expect(fake.calculated.size).toBe(1);

    // the function answers; the fake raises no event at all, as on the web in office-js #587
    Object.assign(cell, { value: 48, error: false });
    await vi.advanceTimersByTimeAsync(BUSY_REREAD_MS[0]);
    await settled(pane.idle());
    expect(pane.model()?.kind).toBe("ready");
    expect(root.querySelector('[data-role="verdict"]')!.textContent).toMatch(/^No pump needed/);
    await settled(pane.destroy());
    expect(fake.calculated.size).toBe(0);
  });
});

describe("Excel port: the inputs behind a formula", () => {
  it("walks the estimate sheet it inserted back from Supply_TestFlow to the flow test's inputs, shaded as inputs", async () => {
    const fake = new FakeExcel(["Sheet1"]);
    const port = excelPort(fake);
    const { sheetName } = await port.insertEstimateSheet("US", demoScenario("US"));
    const t = estimateTemplate(demoScenario("US"));
    const label = t.cells.find((c) => typeof c.value === "string" && c.value.startsWith("Flow measured directly"))!;
    const input = `B${label.address.slice(1)}`;
    fake.setCell(sheetName, input, { ...fake.sheetByName(sheetName)!.cells.get(input)!, value: "1250 gpm" });
    const at = `${sheetName}!${fake.nameTarget("Supply_TestFlow")!.address}`;
    const behind = (await port.inputsBehind([at]))[at];
    expect(behind.find((s) => s.address === `${sheetName}!${input}`)?.reading).toMatchObject({ kind: "text", value: "1250 gpm" });
    // inputs only: every cell found has the input's fill
    for (const s of behind) expect(fake.sheetByName(sheetName)!.cells.get(s.address.split("!")[1])?.style?.["fill/color"], s.address).toBe(ROLE_STYLES.input.fill);
  });

  it("asks a formula that reads no cell on its own (getDirectPrecedents throws ItemNotFound for it) and carries on", async () => {
    const fake = new FakeExcel(["Inputs"]);
    fake.setCell("Inputs", "J1", { value: "abc", style: { "fill/color": ROLE_STYLES.input.fill } });
    fake.setCell("Inputs", "J2", { value: 2, formula: "=1+1" });
    fake.setCell("Inputs", "J3", { value: "#VALUE!", error: true, formula: "=J1+1" });
    fake.setCell("Inputs", "J4", { value: "#VALUE!", error: true, formula: "=J2+J3" });
    const behind = await excelPort(fake).inputsBehind(["Inputs!J4"]);
    expect(behind).toEqual({ "Inputs!J4": [{ address: "Inputs!J1", reading: { kind: "text", value: "abc", address: "Inputs!J1" } }] });
  });

  it("passes over a whole column or row a formula reads (getDirectPrecedents gives Sheet!$K:$K) and finds the inputs beside it", async () => {
    const fake = new FakeExcel(["Inputs"]);
    fake.setCell("Inputs", "J1", { value: "abc", style: { "fill/color": ROLE_STYLES.input.fill } });
    fake.setCell("Inputs", "K1", { value: 5 });
    fake.setCell("Inputs", "J2", { value: "#VALUE!", error: true, formula: "=J1+SUM(K:K)+SUM(3:3)" });
    const behind = await excelPort(fake).inputsBehind(["Inputs!J2"]);
    expect(Object.keys(behind)).toEqual(["Inputs!J2"]);
    expect(behind["Inputs!J2"]).toContainEqual({ address: "Inputs!J1", reading: { kind: "text", value: "abc", address: "Inputs!J1" } });
  });

  it("is best effort: where Excel fails the walk, the address maps to no input and the call does not fail", async () => {
    const fake = new FakeExcel(["Inputs"]);
    fake.setCell("Inputs", "J1", { value: "abc", style: { "fill/color": ROLE_STYLES.input.fill } });
    fake.setCell("Inputs", "J2", { value: "#VALUE!", error: true, formula: "=J1+1" });
    const failing = createExcelPort({
      run: () => Promise.reject(new Error("GeneralException: the request failed")),
      runIn: fake.runIn,
      now: () => new Date(),
      settleMs: SETTLE_MS,
      supports: () => true,
    });
    expect(await failing.inputsBehind(["Inputs!J2"])).toEqual({ "Inputs!J2": [] });
  });

  it("under the pane: a name reading a whole column shows its problem, naming the input behind it", async () => {
    const fake = new FakeExcel(["Inputs"]);
    const h = harness(fake);
    // the flow-test and demand inputs of the engine's decision tests [NFPA 291]
    for (const [name, value] of [["Units", "US"], ["Supply_Static", 72], ["Supply_TestFlow", 1100], ["Demand_Flow", 562], ["Demand_Pressure", 48]] as const) {
      await h.put(name, value);
    }
    // an input that shows an error itself: the problem names it rather than the name's formula cell
    fake.setCell("Inputs", "J1", { value: "#N/A", error: true, style: { "fill/color": ROLE_STYLES.input.fill } });
    await h.putFormula("Supply_Residual", "=J1+SUM(K:K)", 0);
    const residual = fake.nameTarget("Supply_Residual")!.address;
    Object.assign(fake.sheetByName("Inputs")!.cells.get(residual)!, { value: "#VALUE!", error: true });
    const doc = new Window().document as unknown as Document;
    const root = doc.createElement("div");
    doc.body.appendChild(root);
    const pane = mountPane(root, excelPort(fake), { width: 320 });
    await pane.ready;
    await pane.idle();
    const m = pane.model();
    if (m?.kind !== "problems") throw new Error(JSON.stringify(m));
    expect(m.problems.map((p) => p.cell)).toContain("Inputs!J1");
    await pane.destroy();
  });

  it("finds nothing, and asks Excel nothing, where Excel lacks ExcelApi 1.12", async () => {
    const fake = new FakeExcel(["Inputs"]);
    fake.setCell("Inputs", "J1", { value: "abc", style: { "fill/color": ROLE_STYLES.input.fill } });
    fake.setCell("Inputs", "J2", { value: "#VALUE!", error: true, formula: "=J1+1" });
    const asked: string[] = [];
    const port = createExcelPort({ run: fake.run, runIn: fake.runIn, now: () => new Date(), settleMs: SETTLE_MS, supports: (set, v) => (asked.push(`${set} ${v}`), false) });
    const before = fake.syncs;
    expect(await port.inputsBehind(["Inputs!J2"])).toEqual({ "Inputs!J2": [] });
    expect(asked).toEqual(["ExcelApi 1.12"]);
    expect(fake.syncs).toBe(before);
  });
});

describe("Excel port: the estimate sheet", () => {
  it("writes every formula, value, number format and input shading of the template", async () => {
    const fake = new FakeExcel(["Sheet1"]);
    const { sheetName } = await excelPort(fake).insertEstimateSheet("US");
    const sheet = fake.sheetByName(sheetName)!;
    const t = estimateTemplate(demoScenario("US"));
    let formulas = 0;
    for (const c of t.cells) {
      const cell = sheet.cells.get(c.address);
      if (c.formula) {
        formulas++;
        expect(cell?.formula, c.address).toBe(c.formula);
      } else if (c.value !== undefined && c.value !== "") {
        expect(cell?.value, c.address).toBe(c.value);
      }
      if (c.format) expect(cell?.numberFormat, c.address).toBe(c.format);
      if (c.role === "input") expect(cell?.style?.["fill/color"], c.address).toBe(ROLE_STYLES.input.fill);
    }
    expect(formulas).toBeGreaterThan(30);
    expect(sheet.cells.get("A2")?.value).toBe(CAUTION);
    // spilled blocks are left free for their formulas, formatted column by column
    for (const a of spillCells(t)) expect(sheet.cells.get(a)?.value ?? "", a).toBe("");
    const curve = t.cells.find((c) => c.formula?.startsWith("=HEADROOM.SUPPLYCURVE("))!;
    const last = parseCell(curve.address);
    expect(sheet.cells.get(cellAddress({ row: last.row + 15, col: last.col + 1 }))?.numberFormat).toBe("0.0");
    expect(sheet.columnWidths.get("A")).toBe(t.columnWidths.A);
    expect(fake.sheetById(fake.activeId).name).toBe(sheetName);
  });

  it("defines every named cell of the template on the new sheet", async () => {
    const fake = new FakeExcel(["Sheet1"]);
    const { sheetName, namesMoved } = await excelPort(fake).insertEstimateSheet("SI");
    expect(namesMoved).toEqual([]);
    const t = estimateTemplate(demoScenario("SI"));
    expect(t.names.map((n) => n.name).sort()).toEqual([...INPUT_NAMES, CANDIDATES_NAME].sort());
    for (const n of t.names) expect(fake.nameTarget(n.name)).toEqual({ sheet: sheetName, address: n.address });
    expect(fake.sheetByName(sheetName)!.cells.get(t.names.find((n) => n.name === "Units")!.address)?.value).toBe("SI");
  });

  it("gives the new sheet the template's print area, repeated title rows and one-page fit", async () => {
    const fake = new FakeExcel(["Sheet1"]);
    const { sheetName } = await excelPort(fake).insertEstimateSheet("SI");
    const t = estimateTemplate(demoScenario("SI"));
    const [first, last] = t.print.titleRows.split(":");
    expect(fake.sheetByName(sheetName)!.print).toEqual({
      area: t.print.area,
      titleRows: `$${first}:$${last}`,
      orientation: "Portrait",
      zoom: { horizontalFitToPages: 1, verticalFitToPages: 1 },
    });
  });

  it("adds an XY scatter chart of the supply curve against the demand points", async () => {
    const fake = new FakeExcel(["Sheet1"]);
    const { sheetName } = await excelPort(fake).insertEstimateSheet("US");
    const [chart] = fake.sheetByName(sheetName)!.charts;
    const t = estimateTemplate(demoScenario("US"));
    expect(chart.type).toBe("XYScatterLinesNoMarkers");
    expect(chart.series.map((s) => ({ name: s.name, x: s.x, y: s.y }))).toEqual(t.chart.series.map((s) => ({ name: s.name, x: s.x, y: s.y })));
    expect(chart.series[1].props.chartType).toBe("XYScatter");
    expect(chart.series[2].props.markerStyle).toBe("Diamond");
    expect(chart.props["axes/categoryAxis/title/text"]).toBe("Flow (gpm)");
    expect(chart.props["axes/valueAxis/title/text"]).toBe("Pressure (psi)");
    expect(chart.position).toEqual([t.chart.from, t.chart.to]);
  });

  it("charts a number on every row of a supply curve that reaches 0 psi before the chart's last flow", async () => {
    // a weak main: residual 20 of a static 72 psi (below about half of static); it reaches 0 psi at
    // Qt × (72 / (72 − 20))^(1/1.85) = Qt × 1.3846^0.5405 = 1.192 Qt [NFPA 291], well before the chart's 1.5 Qt
    const s = demoScenario("US");
    s.flowTests[0].residual = 20;
    const fake = new FakeExcel(["Sheet1"]);
    const { sheetName } = await excelPort(fake).insertEstimateSheet("US", s);
    calculateWithFunctions(fake, sheetName);
    const sheet = fake.sheetByName(sheetName)!;
    const supply = sheet.charts[0].series[0];
    expect(supply.name).toBe("Water supply");
    const xs = blockCells(supply.x!).map((a) => sheet.cells.get(a));
    const ys = blockCells(supply.y!).map((a) => sheet.cells.get(a));
    expect(xs).toHaveLength(16);
    expect(ys).toHaveLength(16);
    for (const [i, c] of [...xs, ...ys].entries()) {
      expect(typeof c?.value, `${i < 16 ? "flow" : "pressure"} of row ${i % 16}: ${JSON.stringify(c?.value)}`).toBe("number");
    }
    // the supply runs out inside the chart, and the last rows stay at [that flow, 0]
    const testFlow = sheet.cells.get(fake.nameTarget("Supply_TestFlow")!.address)!.value as number;
    const exhaustion = testFlow * Math.pow(72 / 52, 1 / 1.85);
    expect(ys.filter((c) => c!.value === 0).length).toBeGreaterThan(1);
    expect(xs.at(-1)!.value).toBeCloseTo(exhaustion, 6);
    expect(ys.at(-1)!.value).toBe(0);
  });

  it("leaves no formula elsewhere in the workbook with a result of the names' old cells", async () => {
    const fake = new FakeExcel(["Inputs", "Summary"]);
    const h = harness(fake);
    await h.put("Supply_Static", 72);
    // a hand-made summary that reads the name, calculated before: 72 × 2 = 144 (arithmetic)
    fake.setCell("Summary", "A1", { value: 144, formula: "=Supply_Static*2" });
    const { namesMoved } = await excelPort(fake).insertEstimateSheet("US");
    expect(namesMoved).toContain("Supply_Static");
    expect([...fake.stale]).toEqual([]);
    // recalculated against the new sheet: pending until its functions answer, no longer the old 144
    expect(fake.sheetByName("Summary")!.cells.get("A1")).toMatchObject({ value: "#BUSY!", error: true });
  });

  it("keeps text that looks like a formula as text", async () => {
    const fake = new FakeExcel(["Sheet1"]);
    const s = demoScenario("US");
    s.site = "-North yard";
    const { sheetName } = await excelPort(fake).insertEstimateSheet("US", s);
    const siteCell = estimateTemplate(s).cells.find((c) => c.value === "-North yard")!;
    expect(fake.sheetByName(sheetName)!.cells.get(siteCell.address)).toMatchObject({ value: "-North yard", formula: undefined });
  });
});

describe("Excel port: demo values", () => {
  const hasDemoLook = (c: FakeCell | undefined) => c?.style?.["font/color"] === DEMO_LOOK.font && c?.style?.["font/italic"] === true;
  /** The cells of a new sheet that hold a demo value: its inputs holding a value, the Units the user chose aside. */
  const demoCells = (units: "US" | "SI") => {
    const t = estimateTemplate(demoScenario(units));
    const unitsCell = t.names.find((n) => n.name === "Units")!.address;
    return t.cells.filter((c) => c.role === "input" && c.value !== undefined && c.value !== "" && c.address !== unitsCell).map((c) => c.address);
  };

  it("a new estimate sheet marks its demo values with the preview's look: italic, brown, over the input's fill", async () => {
    const fake = new FakeExcel(["Sheet1"]);
    const { sheetName } = await excelPort(fake).insertEstimateSheet("US");
    const sheet = fake.sheetByName(sheetName)!;
    const demo = demoCells("US");
    expect(demo.length).toBeGreaterThan(30);
    for (const a of demo) {
      expect(hasDemoLook(sheet.cells.get(a)), a).toBe(true);
      expect(sheet.cells.get(a)?.style?.["fill/color"], a).toBe(ROLE_STYLES.input.fill);
    }
    const marked = [...sheet.cells].filter(([, c]) => hasDemoLook(c)).map(([a]) => a);
    expect(marked.sort()).toEqual([...demo].sort());
    // a scenario of the user's own holds no demo value
    const own = await excelPort(fake).insertEstimateSheet("US", demoScenario("US"));
    expect([...fake.sheetByName(own.sheetName)!.cells.values()].filter(hasDemoLook)).toEqual([]);
  });

  it("refuses a share copy while demo values remain, naming them; a value typed over one (the same again too) is the user's", async () => {
    const fake = new FakeExcel(["Sheet1"]);
    const port = excelPort(fake, new Date(2026, 4, 4));
    const { sheetName } = await port.insertEstimateSheet("US");
    calculate(fake, sheetName, (a) => parseCell(a).row + 1);
    const demo = demoCells("US");
    const sheetsBefore = fake.sheets.map((s) => s.name);
    const refused = await port.makeShareCopy();
    expect(refused).toEqual({ ok: false, reason: demoRefusal(demo.slice(0, 5).map((a) => `${sheetName}!${a}`), demo.length) });
    expect(fake.sheets.map((s) => s.name)).toEqual(sheetsBefore);

    // the user types over each one, with the pane listening
    const stop = await port.subscribe(() => {});
    const sheet = fake.sheetByName(sheetName)!;
    for (const a of demo) fake.setCell(sheetName, a, { ...structuredClone(sheet.cells.get(a)!) });
    await vi.waitFor(() => expect([...sheet.cells.values()].filter(hasDemoLook)).toEqual([]));
    // typed over: the input's own look again
    expect(sheet.cells.get(demo[0])?.style).toMatchObject({ "font/color": ROLE_STYLES.input.font, "font/italic": false, "fill/color": ROLE_STYLES.input.fill });
    await stop();
    expect((await port.makeShareCopy()).ok).toBe(true);
  });
});

describe("Excel port: demo values replaced a block at a time", () => {
  const hasDemoLook = (c: FakeCell | undefined) => c?.style?.["font/color"] === DEMO_LOOK.font && c?.style?.["font/italic"] === true;

  it("a paste, fill or Ctrl+Enter over demo values (a change of many cells, without details) leaves the demo look only on cells still holding their demo value", async () => {
    const fake = new FakeExcel(["Sheet1"]);
    const port = excelPort(fake, new Date(2026, 4, 4));
    const { sheetName } = await port.insertEstimateSheet("US");
    calculate(fake, sheetName, (a) => parseCell(a).row + 1);
    const sheet = fake.sheetByName(sheetName)!;
    const marked = () => [...sheet.cells].filter(([, c]) => hasDemoLook(c)).map(([a]) => a);
    const demo = marked();
    // two demo cells one above the other: the first replaced, the second given its own demo value again
    const [first, second] = demo
      .map((a) => [a, cellAddress({ row: parseCell(a).row + 1, col: parseCell(a).col })])
      .find(([, below]) => demo.includes(below))!;
    const stop = await port.subscribe(() => {});
    const cell = (a: string, value: string | number) => ({ ...structuredClone(sheet.cells.get(a)!), value });
    const own = typeof sheet.cells.get(first)!.value === "number" ? (sheet.cells.get(first)!.value as number) + 1 : "typed by the user";
    fake.setBlock(sheetName, `${first}:${second}`, [[cell(first, own)], [cell(second, sheet.cells.get(second)!.value as number | string)]]);
    await vi.waitFor(() => expect(hasDemoLook(sheet.cells.get(first))).toBe(false));
    expect(sheet.cells.get(first)?.style).toMatchObject({ "font/color": ROLE_STYLES.input.font, "font/italic": false, "fill/color": ROLE_STYLES.input.fill });
    expect(hasDemoLook(sheet.cells.get(second))).toBe(true);
    expect(marked().sort()).toEqual(demo.filter((a) => a !== first).sort());

    // a block the demo values lie outside of: no round trip to Excel
    const syncs = fake.syncs;
    fake.setBlock(sheetName, "AA200:AB201", [[{ value: 1 }, { value: 2 }], [{ value: 3 }, { value: 4 }]]);
    await wait(4 * SETTLE_MS);
    expect(fake.syncs).toBe(syncs);
    await stop();

    // the share copy is refused for the demo values left, no longer for the one replaced
    const left = demo
      .filter((a) => a !== first)
      .map(parseCell)
      .sort((a, b) => a.row - b.row || a.col - b.col)
      .map((r) => `${sheetName}!${cellAddress(r)}`);
    expect(await port.makeShareCopy()).toEqual({ ok: false, reason: demoRefusal(left.slice(0, 5), demo.length - 1) });
  });
});

describe("Excel port: share copy", () => {
  async function calculatedEstimate() {
    const fake = new FakeExcel(["Sheet1"]);
    const port = excelPort(fake, new Date(2026, 4, 4));
    // the demo scenario given as the user's own: no demo value marked, nothing to refuse the copy for
    const { sheetName } = await port.insertEstimateSheet("US", demoScenario("US"));
    // what Excel shows once every function has answered: a number per formula cell (its row, to tell them apart)
    calculate(fake, sheetName, (a) => parseCell(a).row + 1);
    return { fake, port, sheetName };
  }

  it("copies values only, two rows down under the stamp, and leaves the source untouched", async () => {
    const { fake, port, sheetName } = await calculatedEstimate();
    const source = structuredClone([...fake.sheetByName(sheetName)!.cells]);
    const result = await port.makeShareCopy();
    expect(result).toEqual({ ok: true, sheetName: `${sheetName} values 2026-05-04`, sourceSheet: sheetName });
    if (!result.ok) return;
    expect([...fake.sheetByName(sheetName)!.cells]).toEqual(source);
    const copy = fake.sheetByName(result.sheetName)!;
    expect(fake.sheets.map((s) => s.name)).toEqual(["Sheet1", sheetName, result.sheetName]);
    expect(copy.cells.get("A1")?.value).toBe(`Share copy of ${sheetName}, 2026-05-04: ${SHARE_STAMP}.`);
    for (const [a, c] of source) {
      const p = parseCell(a);
      const moved = copy.cells.get(cellAddress({ row: p.row + 2, col: p.col }));
      expect(moved?.formula, a).toBeUndefined();
      // the note asking to overwrite the inputs says the cells are frozen instead
      expect(moved?.value, a).toEqual(c.value === INPUTS_NOTE ? FROZEN_NOTE : c.value);
    }
    // the names still point at the source
    expect(fake.nameTarget("Supply_Static")?.sheet).toBe(sheetName);
    expect(copy.charts).toHaveLength(1);
  });

  it("looks frozen: no input shading, and the frozen note where the inputs note was", async () => {
    const { fake, port, sheetName } = await calculatedEstimate();
    const note = [...fake.sheetByName(sheetName)!.cells].find(([, c]) => c.value === INPUTS_NOTE)![0];
    const inputs = [...fake.sheetByName(sheetName)!.cells].filter(([, c]) => c.style?.["fill/color"] === ROLE_STYLES.input.fill);
    expect(inputs.length).toBeGreaterThan(30);
    const result = await port.makeShareCopy();
    if (!result.ok) throw new Error(result.reason);
    const copy = fake.sheetByName(result.sheetName)!;
    const down = (a: string) => cellAddress({ row: parseCell(a).row + SHARE_STAMP_ROWS, col: parseCell(a).col });
    expect(copy.cells.get(down(note))?.value).toBe(FROZEN_NOTE);
    expect([...copy.cells].filter(([, c]) => c.style?.["fill/color"] === ROLE_STYLES.input.fill)).toEqual([]);
    // the inputs' values stay, in the calculated cells' ink
    for (const [a, c] of inputs) {
      expect(copy.cells.get(down(a))?.value, a).toEqual(c.value);
      expect(copy.cells.get(down(a))?.style?.["font/color"], a).toBe(ROLE_STYLES.computed.font);
    }
    // the source keeps its look
    expect(fake.sheetByName(sheetName)!.cells.get(inputs[0][0])?.style?.["fill/color"]).toBe(ROLE_STYLES.input.fill);
  });

  it("refuses while cells show #BUSY!, says so, and adds no sheet", async () => {
    const fake = new FakeExcel(["Sheet1"]);
    const port = excelPort(fake);
    const { sheetName } = await port.insertEstimateSheet("US"); // fresh formulas show #BUSY!
    const before = structuredClone([...fake.sheetByName(sheetName)!.cells]);
    const result = await port.makeShareCopy();
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.reason).toMatch(/^No share copy made: Estimate!B\d+ shows #BUSY!/);
      expect(result.reason).toMatch(/and \d+ more; Excel is still calculating/);
    }
    expect(fake.sheets.map((s) => s.name)).toEqual(["Sheet1", sheetName]);
    expect([...fake.sheetByName(sheetName)!.cells]).toEqual(before);
  });

  it("refuses while a cell shows an error, naming it", async () => {
    const { fake, port, sheetName } = await calculatedEstimate();
    const margin = estimateTemplate(demoScenario("US")).cells.find((c) => c.formula?.includes("HEADROOM.MARGIN("))!;
    Object.assign(fake.sheetByName(sheetName)!.cells.get(margin.address)!, { value: "#VALUE!", error: true });
    const result = await port.makeShareCopy();
    expect(result).toEqual({
      ok: false,
      reason: `No share copy made: ${sheetName}!${margin.address} shows #VALUE!; fix those cells first, so that the copy holds numbers.`,
    });
  });

  /** A plot as the pane hands it over (invented points: the tests check that they are written and charted as given). */
  const PLOT: SharePlot = {
    title: "Water supply and sprinkler demand",
    xTitle: "Flow (gpm)",
    yTitle: "Pressure (psi)",
    series: [
      { name: "Water supply (flow test)", points: [[0, 72], [550, 68.5], [1100, 58]], style: "line", marker: "none", color: PALETTE.supply },
      { name: "Sprinklers + hose", points: [[562, 48]], style: "marker", marker: "diamond", color: PALETTE.demand },
    ],
  };

  /** The last column the sheet's cells use, 0-based. */
  const lastColumn = (fake: FakeExcel, sheet: string) => Math.max(...[...fake.sheetByName(sheet)!.cells.keys()].map((a) => parseCell(a).col));

  it("with the pane's plot: its points as values right of the copied cells, and a chart of them where the estimate's chart stands", async () => {
    const { fake, port, sheetName } = await calculatedEstimate();
    const left = lastColumn(fake, sheetName) + 2; // one empty column after the copied cells
    const result = await port.makeShareCopy(PLOT);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const copy = fake.sheetByName(result.sheetName)!;
    const cells = fake.cellsOf(result.sheetName);
    const at = (row: number, col: number) => cellAddress({ row, col });
    // below the stamp's two rows: a title, then each series in two columns: its name, the axes' titles, its points
    expect(cells[at(2, left)]?.value).toBe("Plot data: the supply-versus-demand plot of the pane, values frozen");
    PLOT.series.forEach((s, i) => {
      const col = left + 2 * i;
      expect(cells[at(3, col)]?.value).toBe(s.name);
      expect([cells[at(4, col)]?.value, cells[at(4, col + 1)]?.value]).toEqual(["Flow (gpm)", "Pressure (psi)"]);
      s.points.forEach(([q, p], k) => expect([cells[at(5 + k, col)]?.value, cells[at(5 + k, col + 1)]?.value]).toEqual([q, p]));
    });
    expect(Object.values(cells).filter((c) => c.formula)).toEqual([]);

    // one chart: the one the copied sheet carried is replaced by the chart of the frozen points
    expect(copy.charts).toHaveLength(1);
    const chart = copy.charts[0];
    expect(chart.props.name).toBe("Headroom supply and demand");
    expect(chart.props["title/text"]).toBe(PLOT.title);
    expect(chart.position).toEqual(["F7", "N26"]); // the estimate's chart block F5:N24, two rows down
    const col = (i: number, k: number) => cellAddress({ row: 0, col: left + 2 * i + k }).replace(/\d+$/, "");
    expect(chart.series.map((s) => [s.name, s.x, s.y])).toEqual([
      ["Water supply (flow test)", `${col(0, 0)}6:${col(0, 0)}8`, `${col(0, 1)}6:${col(0, 1)}8`],
      ["Sprinklers + hose", `${col(1, 0)}6:${col(1, 0)}6`, `${col(1, 1)}6:${col(1, 1)}6`],
    ]);
    expect(chart.series[0].props["format/line/color"]).toBe(PALETTE.supply);
    expect(chart.series[1].props).toMatchObject({ chartType: "XYScatter", markerStyle: "Diamond", markerBackgroundColor: PALETTE.demand });
  });

  it("with the pane's plot on a sheet whose cells fill the chart's block: the chart stands right of the points", async () => {
    const fake = new FakeExcel(["Notes"]);
    fake.setCell("Notes", "A1", { value: "hand-made" });
    fake.setCell("Notes", "G6", { value: 12, formula: "=6*2" });
    const result = await excelPort(fake, new Date(2026, 0, 9)).makeShareCopy(PLOT);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const copy = fake.sheetByName(result.sheetName)!;
    const left = parseCell("G6").col + 2;
    const from = cellAddress({ row: 2, col: left + 2 * PLOT.series.length + 1 });
    expect(copy.charts).toHaveLength(1);
    expect(copy.charts[0].position?.[0]).toBe(from);
    expect(fake.cellsOf(result.sheetName)[cellAddress({ row: 5, col: left + 1 })]?.value).toBe(72);
  });

  it("copies the active sheet when no estimate names are defined", async () => {
    const fake = new FakeExcel(["Notes"]);
    fake.setCell("Notes", "A1", { value: "hand-made" });
    fake.setCell("Notes", "B3", { value: 12, formula: "=6*2" });
    const result = await excelPort(fake, new Date(2026, 0, 9)).makeShareCopy();
    expect(result).toMatchObject({ ok: true, sourceSheet: "Notes", sheetName: "Notes values 2026-01-09" });
    expect(fake.cellsOf("Notes values 2026-01-09")).toEqual({
      A1: { value: `Share copy of Notes, 2026-01-09: ${SHARE_STAMP}.` },
      A3: { value: "hand-made" },
      B5: { value: 12 },
    });
  });
});
