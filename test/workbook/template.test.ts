/**
 * The estimate sheet template: its shape (names, roles, spills, chart), its formulas against the vocabulary, and its
 * results when the preview's formula engine calculates it with the real cell functions: no cell in error, and the
 * task pane, reading the named cells, says what the sheet's own VERDICT and PUMPSIZE cells say.
 */
import { beforeAll, describe, expect, it } from "vitest";
import * as functions from "../../src/functions/functions";
import { templateNames, templateSheet } from "../../src/preview/fromTemplate";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { buildModel } from "../../src/taskpane/model";
import { cellAddress, columnLetters, parseCell, parseRange } from "../../src/workbook/a1";
import { CANDIDATES_NAME, INPUT_NAMES, SUMMARY_NAMES } from "../../src/workbook/port";
import { SAMPLES } from "../../samples/scenarios";
import { PreviewPort } from "../../src/preview/port";
import { type Scenario, demoScenario } from "../../src/workbook/scenario";
import { CAUTION, INPUTS_NOTE, SAMPLE_NOTE } from "../../src/workbook/look";
import { type SheetTemplate, spillCells, templateExtent } from "../../src/workbook/sheet";
import { estimateTemplate } from "../../src/workbook/template";
import { generatedMetadata } from "../preview/metadataFixture";

beforeAll(async () => {
  registerHeadroomFunctions(await generatedMetadata(), functions);
});

function cellAt(t: SheetTemplate, address: string) {
  return t.cells.find((c) => c.address === address);
}

function calculated(s: Scenario) {
  const t = estimateTemplate(s);
  const wb = new PreviewWorkbook({ sheets: [templateSheet(t)], names: templateNames(t) });
  return { t, wb, port: new PreviewPort(wb) };
}

/** Split the arguments of the first call to `fn` in a formula at its top-level commas. */
function callArgs(formula: string, fn: string): string[] {
  const start = formula.indexOf(`HEADROOM.${fn}(`) + `HEADROOM.${fn}(`.length;
  const args: string[] = [];
  let depth = 0;
  let quoted = false;
  let cur = "";
  for (const ch of formula.slice(start)) {
    if (ch === '"') quoted = !quoted;
    if (!quoted && ch === "(") depth++;
    if (!quoted && ch === ")") {
      if (depth === 0) break;
      depth--;
    }
    if (!quoted && depth === 0 && ch === ",") {
      args.push(cur);
      cur = "";
    } else cur += ch;
  }
  args.push(cur);
  return args;
}

describe.each(["US", "SI"] as const)("estimate template, %s", (units) => {
  const s = demoScenario(units);
  const t = estimateTemplate(s);

  it("puts the caution at the top", () => {
    expect(t.cells[0]).toMatchObject({ address: "A1", role: "title" });
    expect(cellAt(t, "A2")).toMatchObject({ role: "caution", value: CAUTION });
  });

  it("defines every name the pane reads, once, on a cell of the right role", () => {
    expect(t.names.map((n) => n.name).sort()).toEqual([...INPUT_NAMES, CANDIDATES_NAME].sort());
    const inputs = {
      Units: s.units,
      Required_Margin: s.requiredMargin,
      Suction_Minimum: s.suctionMinimum,
      Velocity_Limit: s.velocityLimit,
      Project_Site: s.site,
      Project_Address: s.address,
      Project_PreparedBy: s.preparedBy,
      Design_Hazard: s.hazard,
      Design_System: s.system,
    };
    const chosen = ["Pump_RatedFlow", "Pump_RatedPressure"]; // blank inputs: no pump chosen in the demo
    for (const n of t.names) {
      if (n.name === CANDIDATES_NAME) continue; // a block of rows: its own test below
      const c = cellAt(t, n.address);
      expect(c, n.name).toBeDefined();
      if (n.name in inputs) expect(c).toMatchObject({ role: "input", value: inputs[n.name as keyof typeof inputs] });
      else if (chosen.includes(n.name)) expect(c).toEqual({ address: n.address, role: "input", format: expect.any(String) });
      else expect(c!.role, n.name).toBe("computed");
    }
  });

  it("has one cell an address, and none inside a spilled block or under the chart", () => {
    const addresses = t.cells.map((c) => c.address);
    expect(new Set(addresses).size).toBe(addresses.length);
    const spilled = new Set(spillCells(t));
    for (const a of addresses) expect(spilled.has(a), a).toBe(false);
    const from = parseCell(t.chart.from);
    const to = parseCell(t.chart.to);
    for (const c of t.cells) {
      const p = parseCell(c.address);
      const under = p.row >= from.row && p.row <= to.row && p.col >= from.col && p.col <= to.col;
      expect(under, c.address).toBe(false);
    }
  });

  it("calls only functions of the vocabulary, with no more arguments than they take", () => {
    const known = functions as unknown as Record<string, (...a: unknown[]) => unknown>;
    const used = new Set<string>();
    for (const c of t.cells) {
      for (const m of (c.formula ?? "").matchAll(/HEADROOM\.([A-Z]+)\(/g)) {
        const fn = known[m[1].toLowerCase()];
        expect(fn, m[1]).toBeTypeOf("function");
        expect(callArgs(c.formula!, m[1]).length, `${c.address} ${m[1]}`).toBeLessThanOrEqual(fn.length);
        used.add(m[1]);
      }
    }
    // the functions the estimate is built from
    for (const f of ["PITOTFLOW", "DESIGNAREA", "DESIGNDENSITY", "HOSEALLOWANCE", "HEADFLOW", "AREADEMAND", "PIPEID", "CFACTOR", "FITTINGS", "PIPERUN", "SUPPLYAT", "MARGIN", "VERDICT", "PUMPBOOST", "PUMPSIZE", "SUPPLYCURVE"]) {
      expect(used.has(f), f).toBe(true);
    }
  });

  it("charts the SUPPLYCURVE spill and the demand cells", () => {
    const curve = t.cells.find((c) => c.formula?.startsWith("=HEADROOM.SUPPLYCURVE("))!;
    const a = parseCell(curve.address);
    const [supply, sprinklers, total] = t.chart.series;
    expect(parseRange(supply.x)).toEqual({ start: a, rows: curve.spill!.rows, cols: 1 });
    expect(parseRange(supply.y)).toEqual({ start: { row: a.row, col: a.col + 1 }, rows: curve.spill!.rows, cols: 1 });
    const name = (n: string) => t.names.find((x) => x.name === n)!.address;
    expect(total).toMatchObject({ x: name("Demand_Flow"), y: name("Demand_Pressure"), style: "marker" });
    expect(sprinklers.y).toBe(name("Demand_Pressure"));
    expect(t.chart.xTitle).toBe(units === "US" ? "Flow (gpm)" : "Flow (L/min)");
  });

  it("prints every cell on one page, the caution and the verdict with it, title and caution repeated on any page", () => {
    const area = parseRange(t.print.area);
    const inside = (address: string) => {
      const p = parseCell(address);
      return p.row >= area.start.row && p.row < area.start.row + area.rows && p.col >= area.start.col && p.col < area.start.col + area.cols;
    };
    const { rows, cols } = templateExtent(t);
    expect(t.print.area).toBe(`A1:${columnLetters(cols - 1)}${rows}`);
    for (const c of t.cells) expect(inside(c.address), c.address).toBe(true);
    for (const a of spillCells(t)) expect(inside(a), a).toBe(true);
    expect(inside(t.chart.from) && inside(t.chart.to), "the chart").toBe(true);
    const title = t.cells.find((c) => c.role === "title")!;
    const caution = t.cells.find((c) => c.role === "caution")!;
    const verdict = t.cells.find((c) => c.formula?.startsWith("=HEADROOM.VERDICT("))!;
    expect(inside(caution.address) && inside(verdict.address)).toBe(true);
    // one page wide and one tall: whatever the paper, page 1 holds the caution and the verdict
    expect(t.print).toMatchObject({ fitWide: 1, fitTall: 1, orientation: "portrait" });
    expect(t.print.titleRows).toBe(`${parseCell(title.address).row + 1}:${parseCell(caution.address).row + 1}`);
  });

  it("calculates without a single error cell", () => {
    const { wb } = calculated(s);
    const errors = wb.cells("Estimate").filter((c) => c.value !== null && typeof c.value === "object");
    expect(errors.map((c) => `${c.address} ${c.content}`)).toEqual([]);
  });

  it("gives the pane the verdict, margin and pump size the sheet shows", async () => {
    const { t, wb, port } = calculated(s);
    const m = buildModel(await port.readInputs());
    expect(m.kind).toBe("ready");
    if (m.kind !== "ready") return;
    // the cell whose formula is the call itself, else the first that makes it (the table of candidates checks its
    // rows with VERDICT inside IF: the verdict's own cell is the one that starts with it)
    const at = (call: string) => (t.cells.find((c) => c.formula?.startsWith(call)) ?? t.cells.find((c) => c.formula?.includes(call.slice(1))))!.address;
    expect(m.estimate.verdict).toBe(wb.value("Estimate", at("=HEADROOM.VERDICT(")));
    const margin = wb.value("Estimate", at("=HEADROOM.MARGIN(")) as number;
    const toSheet = units === "SI" ? 0.0689475729316836 : 1;
    expect(m.estimate.assessment.margin! * toSheet).toBeCloseTo(margin, 9);
    const size = parseCell(t.cells.find((c) => c.formula?.includes("HEADROOM.PUMPSIZE("))!.address);
    if (m.estimate.pumpSize) {
      const flowToSheet = units === "SI" ? 3.785411784 : 1;
      expect(m.estimate.pumpSize.ratedFlow * flowToSheet).toBeCloseTo(wb.value("Estimate", cellAddress(size)) as number, 6);
      expect(m.estimate.pumpSize.ratedPressure * toSheet).toBeCloseTo(wb.value("Estimate", cellAddress({ ...size, col: size.col + 1 })) as number, 9);
    } else {
      expect(wb.value("Estimate", cellAddress(size))).toBe("none needed");
    }
  });
});

describe("estimate template, the US demo worked through", () => {
  it("converts the pitot reading with PITOTFLOW and uses it as the test flow [NFPA 291]", async () => {
    const { port } = calculated(demoScenario("US"));
    const r = await port.readInputs();
    // 29.83 × 0.90 × 2.5² × √14 = 29.83 × 0.90 × 6.25 × 3.74166 = 627.8 gpm
    expect(r.Supply_TestFlow).toMatchObject({ kind: "number" });
    if (r.Supply_TestFlow.kind === "number") expect(r.Supply_TestFlow.value).toBeCloseTo(29.83 * 0.9 * 6.25 * Math.sqrt(14), 6);
  });

  it("adds the hose allowance to the sprinkler flow, and takes the pressure after the last segment", async () => {
    const { t, wb, port } = calculated(demoScenario("US"));
    const r = await port.readInputs();
    const area = t.cells.find((c) => c.formula?.includes("HEADROOM.AREADEMAND("))!;
    const sprinklers = wb.value("Estimate", area.address) as number;
    // OH2 hose stream allowance, inside + outside: 250 gpm [NFPA 13] (from memory)
    expect(r.Demand_HoseFlow).toMatchObject({ kind: "number", value: 250 });
    if (r.Demand_Flow.kind === "number") expect(r.Demand_Flow.value).toBeCloseTo(sprinklers + 250, 9);
    // density × area: 0.20 gpm/ft² × 1500 ft² = 300 gpm, the least the sprinklers may flow [NFPA 13] (from memory)
    expect(sprinklers).toBeGreaterThanOrEqual(300);
    const run = t.cells.find((c) => c.formula?.includes("HEADROOM.PIPERUN("))!;
    const a = parseCell(run.address);
    const last = wb.value("Estimate", cellAddress({ row: a.row + run.spill!.rows - 1, col: a.col + 3 }));
    expect(r.Demand_Pressure).toMatchObject({ kind: "number", value: last });
  });
});

describe.each(SAMPLES.map((x) => [x.file, x.scenario] as const))("the names the one-page summary reads, %s", (_, s) => {
  /** The value beside a label of column A on the calculated sheet. */
  const beside = (t: SheetTemplate, wb: PreviewWorkbook, label: string) => {
    const a = t.cells.find((c) => c.address.startsWith("A") && c.value === label);
    expect(a, label).toBeDefined();
    return wb.value("Estimate", `B${parseCell(a!.address).row + 1}`);
  };

  it("reads the project, the governing test's date and place and the design as text, the design area as a number", async () => {
    const { t, wb, port } = calculated(s);
    const r = await port.readInputs();
    expect(r.Project_Site).toMatchObject({ kind: "text", value: s.site });
    expect(r.Project_Address).toMatchObject({ kind: "text", value: s.address });
    expect(r.Project_PreparedBy).toMatchObject({ kind: "text", value: s.preparedBy });
    // the hazard, or what is stored in a design by number of sprinklers; the area flowed (ADJUSTAREA), which such a
    // design has none of
    expect(r.Design_Hazard).toMatchObject({ kind: "text", value: s.design.kind === "heads" ? s.design.storage : s.hazard });
    expect(r.Design_System).toMatchObject({ kind: "text", value: s.system });
    if (s.design.kind === "heads") expect(r.Design_Area).toEqual({ kind: "missing" });
    else expect(r.Design_Area).toMatchObject({ kind: "number", value: beside(t, wb, "Design area flowed") });
    // the test that governs gives the lowest supply at the demand flow, as the sheet's own rows say
    const supplies = s.flowTests.map((_, i) => beside(t, wb, `Supply at the demand flow, Test ${i + 1}`) as number);
    const governing = supplies.indexOf(Math.min(...supplies));
    expect(beside(t, wb, "Flow test used")).toBe(`Test ${governing + 1}`);
    expect(r.Supply_When).toMatchObject({ kind: "text", value: s.flowTests[governing].when });
  });

  it("leaves the pane's verdict as it is, with or without them", async () => {
    const { port } = calculated(s);
    const r = await port.readInputs();
    const without = { ...r };
    for (const n of SUMMARY_NAMES) without[n] = { kind: "missing" };
    expect(buildModel(without)).toEqual(buildModel(r));
  });
});

describe("the flow test's description on the sheet", () => {
  it("reads blank where the test used has none (not 0)", async () => {
    const s = demoScenario("US");
    const { port } = calculated({ ...s, flowTests: s.flowTests.map((t) => ({ ...t, when: "" })) });
    const r = await port.readInputs();
    expect(r.Supply_When).toMatchObject({ kind: "text", value: "" });
  });
});

describe("the note under the caution says whose values the inputs hold", () => {
  const notes = (t: SheetTemplate) => t.cells.filter((c) => c.role === "note" && typeof c.value === "string" && /^Shaded cells are inputs/.test(c.value)).map((c) => c.value);

  it.each(["US", "SI"] as const)("a new estimate sheet (the %s demo): overwrite the demo values", (units) => {
    expect(notes(estimateTemplate(demoScenario(units)))).toEqual([INPUTS_NOTE]);
  });

  it.each(SAMPLES.map((x) => [x.file, x.scenario] as const))("a sample (%s): its values are the sample's, never demo values to overwrite", (_, s) => {
    const t = estimateTemplate(s);
    expect(notes(t)).toEqual([SAMPLE_NOTE]);
    expect(t.cells.filter((c) => typeof c.value === "string" && /demo values/.test(c.value))).toEqual([]);
  });
});
