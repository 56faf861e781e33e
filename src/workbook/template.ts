/**
 * The estimate worksheet as data: every cell (value or formula, role, number format), the workbook names to define
 * and the chart's series, built from a scenario. The Excel host (./excel.ts) writes it into a workbook, the preview
 * host loads it into its formula engine, and the sample workbooks are built from it.
 *
 * Layout (columns A label, B value, C unit, D note; the run table uses A to P):
 *   caution · project · units · water supply (flow test, or a pitot reading through PITOTFLOW) · hazard and design
 *   area (DESIGNAREA, DESIGNDENSITY, HOSEALLOWANCE) · sprinklers and the design area's pipes (HEADFLOW, PIPEID,
 *   CFACTOR, AREADEMAND) · the pipe run back to the supply (PIPEID, CFACTOR, FITTINGS helper columns into RUN) ·
 *   demand at the supply · verdict (MARGIN, VERDICT, PUMPBOOST, PUMPSIZE) · supply curve for the chart (SUPPLYCURVE).
 *
 * Formulas refer to cells, not to the workbook names, so that an older estimate sheet keeps working after a newer
 * one takes the names over. Spilled results (AREADEMAND, RUN, PUMPSIZE, SUPPLYCURVE) are written as their anchor
 * formula only; the cells they spill into are left empty.
 */
import { cellAddress, columnLetters, parseCell } from "./a1";
import type { UnitSystem } from "../engine/units";
import { CAUTION, type CellRole, PALETTE } from "./look";
import type { InputName } from "./port";
import type { Scenario } from "./scenario";

// ─── Types ───────────────────────────────────────────────────────────────────────────────────────────────────────

export interface TemplateCell {
  /** A1 address on the estimate sheet, e.g. "B12" */
  address: string;
  role: CellRole;
  /** a constant (an input's demo value, a label) */
  value?: string | number;
  /** a formula starting with "=" (functions in the HEADROOM namespace) */
  formula?: string;
  /** Excel number format, e.g. "0.0" */
  format?: string;
  /**
   * for a formula whose result spills: the size of the spilled block, anchor included, and the number format of each
   * of its columns (hosts format the block; they write nothing into it)
   */
  spill?: { rows: number; cols: number; formats?: string[] };
}

export interface TemplateName {
  name: InputName;
  /** A1 address on the estimate sheet */
  address: string;
  comment: string;
}

export interface ChartSeries {
  name: string;
  /** A1 range of the x (flow) values on the estimate sheet */
  x: string;
  /** A1 range of the y (pressure) values */
  y: string;
  /** a line through the points, or markers alone */
  style: "line" | "marker";
  marker: "none" | "circle" | "square" | "diamond" | "triangle";
  /** hex colour (#RRGGBB) */
  color: string;
}

export interface TemplateChart {
  title: string;
  xTitle: string;
  yTitle: string;
  series: ChartSeries[];
  /** top-left and bottom-right cells the chart covers */
  from: string;
  to: string;
}

export interface SheetTemplate {
  /** the base of the worksheet name ("Estimate"; a host adds " 2", " 3"... when taken) */
  sheetName: string;
  units: UnitSystem;
  cells: TemplateCell[];
  names: TemplateName[];
  chart: TemplateChart;
  /** column widths in points, by column letter */
  columnWidths: Record<string, number>;
}

// ─── Units of the sheet ──────────────────────────────────────────────────────────────────────────────────────────

interface SheetUnits {
  flow: string;
  pressure: string;
  diameter: string;
  length: string;
  area: string;
  density: string;
  kfactor: string;
  nominal: string;
  fmt: { flow: string; pressure: string; diameter: string; length: string; area: string; density: string; kfactor: string };
}

const SHEET_UNITS: Record<UnitSystem, SheetUnits> = {
  US: {
    flow: "gpm",
    pressure: "psi",
    diameter: "in",
    length: "ft",
    area: "ft²",
    density: "gpm/ft²",
    kfactor: "gpm/psi½",
    nominal: "in",
    fmt: { flow: "0", pressure: "0.0", diameter: "0.000", length: "0", area: "0", density: "0.00", kfactor: "0.0" },
  },
  SI: {
    flow: "L/min",
    pressure: "bar",
    diameter: "mm",
    length: "m",
    area: "m²",
    density: "mm/min",
    kfactor: "L/min/bar½",
    nominal: "DN",
    fmt: { flow: "0", pressure: "0.00", diameter: "0.0", length: "0.0", area: "0.0", density: "0.0", kfactor: "0" },
  },
};

/** Rows SUPPLYCURVE spills for the chart. */
export const CHART_POINTS = 16;

/** The chart runs to the larger of these multiples of the test flow and of the demand flow. (common practice) */
export const CHART_TEST_FLOW_FACTOR = 1.5;
export const CHART_DEMAND_FLOW_FACTOR = 1.2;

// ─── Building ────────────────────────────────────────────────────────────────────────────────────────────────────

/** A formula calling a Headroom cell function: hr("PIPEID", "B36", "C36", U) → "HEADROOM.PIPEID(B36,C36,$B$9)". */
function hr(name: string, ...args: string[]): string {
  return `HEADROOM.${name}(${args.join(",")})`;
}

/** "B9" → "$B$9". */
function abs(address: string): string {
  const a = parseCell(address);
  return `$${columnLetters(a.col)}$${a.row + 1}`;
}

/** A text constant inside a formula. */
function text(s: string): string {
  return `"${s.replace(/"/g, '""')}"`;
}

class Sheet {
  readonly cells: TemplateCell[] = [];
  row = 1;

  /** Put a cell in the current row; returns its address. */
  put(col: string, role: CellRole, content: string | number | null, extra: { format?: string; spill?: TemplateCell["spill"] } = {}): string {
    const address = `${col}${this.row}`;
    if (content === null) {
      // an input left blank on purpose: still a shaded input cell
      this.cells.push({ address, role, ...extra });
    } else if (typeof content === "string" && content.startsWith("=")) {
      this.cells.push({ address, role, formula: content, ...extra });
    } else {
      this.cells.push({ address, role, value: content, ...extra });
    }
    return address;
  }

  /** A labelled row: label in A, content in B, unit in C, note in D. Returns the address of B. */
  line(label: string, role: CellRole, content: string | number | null, unit = "", note = "", format?: string): string {
    this.put("A", "label", label);
    const b = this.put("B", role, content, { format });
    if (unit) this.put("C", "label", unit);
    if (note) this.put("D", "note", note);
    this.row++;
    return b;
  }

  heading(title: string): void {
    this.put("A", "heading", title);
    for (const c of ["B", "C", "D"]) this.put(c, "heading", "");
    this.row++;
  }

  skip(n = 1): void {
    this.row += n;
  }
}

/**
 * The estimate worksheet for a scenario. Every formula passes the sheet's Units cell as its `units` argument, so the
 * same layout serves US and SI work.
 */
export function estimateTemplate(s: Scenario): SheetTemplate {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new Sheet();
  const names: TemplateName[] = [];
  const name = (n: InputName, address: string, comment: string) => names.push({ name: n, address, comment });

  sh.put("A", "title", "Headroom estimate: does the water supply meet the sprinkler demand?");
  sh.row++;
  sh.put("A", "caution", CAUTION);
  sh.row++;
  sh.put("A", "note", "Shaded cells are inputs: overwrite the demo values. White cells are calculated by the HEADROOM functions.");
  sh.row++;
  sh.skip();

  // Project and units
  sh.heading("Project");
  sh.line("Site", "input", s.site);
  sh.line("Address", "input", s.address);
  sh.line("Prepared by", "input", s.preparedBy);
  const unitsCell = sh.line("Units of this sheet", "input", s.units, "", "US or SI: every number below is in these units");
  name("Units", unitsCell, "Units of the estimate: US or SI");
  const U = abs(unitsCell);
  sh.skip();

  // Water supply
  sh.heading("Water supply: hydrant flow test");
  const stat = sh.line("Static pressure", "input", s.flowTest.static, u.pressure, "no flow", f.pressure);
  const resid = sh.line("Residual pressure", "input", s.flowTest.residual, u.pressure, "while the test flow runs", f.pressure);
  const direct = sh.line("Flow measured directly", "input", s.flowTest.flow, u.flow, "leave blank to use the pitot reading below", f.flow);
  const pitot = sh.line("Pitot pressure at the outlet", "input", s.flowTest.pitot, u.pressure, "or measure the flow directly above", f.pressure);
  const outlet = sh.line("Outlet internal diameter", "input", s.flowTest.outletDiameter, u.diameter, "", s.units === "SI" ? "0.0" : "0.00");
  const coef = sh.line("Outlet coefficient", "input", s.flowTest.outletCoefficient, "", "0.90 smooth rounded, 0.80 square and sharp, 0.70 square projecting", "0.00");
  const pitotRange = `${pitot}:${outlet}`;
  const pitotFlowCell = sh.line(
    "Flow from the pitot reading",
    "computed",
    `=IF(COUNT(${pitotRange})=2,${hr("PITOTFLOW", pitot, outlet, coef, U)},"")`,
    u.flow,
    "PITOTFLOW; for two outlets, add their flows and type the sum above",
    f.flow,
  );
  const testFlow = sh.line("Test flow used", "computed", `=IF(ISNUMBER(${direct}),${direct},${pitotFlowCell})`, u.flow, "", f.flow);
  sh.line("When and where tested", "input", s.flowTest.when, "", "flow tests vary with season, time of day and future development");
  name("Supply_Static", stat, "Static pressure of the flow test");
  name("Supply_Residual", resid, "Residual pressure of the flow test");
  name("Supply_TestFlow", testFlow, "Flow during the flow test");
  sh.skip();

  // Hazard and design area
  sh.heading("Hazard and design area");
  const hazard = sh.line("Occupancy hazard", "input", s.hazard, "", "LH, OH1, OH2, EH1 or EH2");
  const areaChosen = sh.line("Design area chosen", "input", s.designArea, u.area, "leave blank for the smallest area on the hazard's curve", f.area);
  const area = sh.line("Design area", "computed", `=IF(ISNUMBER(${areaChosen}),${areaChosen},${hr("DESIGNAREA", hazard, U)})`, u.area, "DESIGNAREA", f.area);
  const density = sh.line("Design density", "computed", `=${hr("DESIGNDENSITY", hazard, area, U)}`, u.density, "DESIGNDENSITY", f.density);
  const hose = sh.line("Hose stream allowance, inside + outside", "computed", `=${hr("HOSEALLOWANCE", hazard, text("total"), U)}`, u.flow, "HOSEALLOWANCE", f.flow);
  sh.skip();

  // Sprinklers and the design area's pipes
  sh.heading("Sprinklers and the design area's pipes");
  const k = sh.line("Sprinkler K-factor", "input", s.sprinkler.kFactor, u.kfactor, "", f.kfactor);
  const coverage = sh.line("Coverage per sprinkler", "input", s.sprinkler.coverage, u.area, "", f.area);
  const spacing = sh.line("Spacing along a branch line", "input", s.sprinkler.spacing, u.length, "", s.units === "SI" ? "0.00" : "0.0");
  const minP = sh.line("Minimum operating pressure", "input", s.sprinkler.minPressure, u.pressure, s.units === "SI" ? "0.5 bar unless the listing says more" : "7 psi unless the listing says more", f.pressure);
  sh.line("Most remote sprinkler flow", "computed", `=${hr("HEADFLOW", density, coverage, k, minP, U)}`, u.flow, "HEADFLOW", "0.0");
  sh.put("A", "header", "Pipe");
  sh.put("B", "header", `Nominal (${u.nominal})`);
  sh.put("C", "header", "Schedule");
  sh.put("D", "header", `Internal diameter (${u.diameter})`);
  sh.row++;
  const pipeRow = (label: string, p: { nominal: number | string; schedule: string }) => {
    sh.put("A", "label", label);
    const nominal = sh.put("B", "input", p.nominal);
    const schedule = sh.put("C", "input", p.schedule);
    const id = sh.put("D", "computed", `=${hr("PIPEID", nominal, schedule, U)}`, { format: f.diameter });
    sh.row++;
    return id;
  };
  const branchId = pipeRow("Branch lines", s.branch);
  const mainId = pipeRow("Cross main", s.crossMain);
  const material = sh.line("Pipe material", "input", s.material, "", "steel, galvanized, plastic, cpvc, copper, ductile...");
  const system = sh.line("System", "input", s.system, "", "wet or dry");
  const cAddr = sh.line("Hazen-Williams C", "computed", `=${hr("CFACTOR", material, system)}`, "", "CFACTOR", "0");
  sh.put("A", "header", "Design area demand at the cross main");
  const demandHeaders = [`Flow (${u.flow})`, `Pressure (${u.pressure})`, "Sprinklers", "Lines", `End sprinkler (${u.pressure})`];
  demandHeaders.forEach((h, i) => sh.put(columnLetters(1 + i), "header", h));
  sh.row++;
  sh.put("A", "label", "AREADEMAND");
  const areaDemand = sh.put("B", "computed", `=${hr("AREADEMAND", density, area, coverage, k, spacing, branchId, mainId, cAddr, minP, U)}`, {
    format: f.flow,
    spill: { rows: 1, cols: 5, formats: [f.flow, f.pressure, "0", "0", f.pressure] },
  });
  sh.row++;
  const areaRow = parseCell(areaDemand).row + 1;
  const areaFlow = `B${areaRow}`;
  const areaPressure = `C${areaRow}`;
  sh.skip();

  // The run back to the supply
  sh.heading("Pipe run from the design area back to the water supply");
  sh.put("A", "note", "One row a segment, from the design area towards the supply. Rise: the height the water climbs in the segment on its way to the sprinklers. To add a segment, insert a row inside the table.");
  sh.row++;
  const runHeaders: Array<[string, string]> = [
    ["Segment", ""],
    ["Nominal", u.nominal],
    ["Schedule", ""],
    ["Material", ""],
    ["Fittings", "e.g. 2E T GV"],
    ["Flow", u.flow],
    ["Internal diameter", u.diameter],
    ["C", ""],
    ["Length", u.length],
    ["Fitting length", u.length],
    ["Rise", u.length],
    ["Fixed loss", u.pressure],
    ["Friction", u.pressure],
    ["Elevation", u.pressure],
    ["Fixed", u.pressure],
    ["Pressure after", u.pressure],
  ];
  runHeaders.forEach(([h], i) => sh.put(columnLetters(i), "header", h));
  sh.row++;
  runHeaders.forEach(([, unit], i) => (unit ? sh.put(columnLetters(i), "note", unit) : undefined));
  sh.row++;
  const firstSeg = sh.row;
  const n = s.run.length;
  s.run.forEach((seg, i) => {
    const r = sh.row;
    sh.put("A", "input", seg.label);
    sh.put("B", "input", seg.nominal);
    sh.put("C", "input", seg.schedule);
    sh.put("D", "input", seg.material);
    sh.put("E", "input", seg.fittings);
    sh.put("F", "computed", `=${abs(areaFlow)}`, { format: f.flow });
    sh.put("G", "computed", `=${hr("PIPEID", `B${r}`, `C${r}`, U)}`, { format: f.diameter });
    sh.put("H", "computed", `=${hr("CFACTOR", `D${r}`, abs(system))}`, { format: "0" });
    sh.put("I", "input", seg.length, { format: f.length });
    sh.put("J", "computed", `=IF(E${r}="",0,${hr("FITTINGS", `E${r}`, `B${r}`, `H${r}`, `C${r}`, U)})`, { format: f.length });
    sh.put("K", "input", seg.rise, { format: s.units === "SI" ? "0.0" : "0" });
    sh.put("L", "input", seg.fixedLoss, { format: f.pressure });
    if (i === 0) {
      sh.put("M", "computed", `=${hr("RUN", `F${r}:L${r + n - 1}`, areaPressure, U)}`, { format: f.pressure, spill: { rows: n, cols: 4, formats: [f.pressure, f.pressure, f.pressure, f.pressure] } });
    }
    sh.row++;
  });
  const lastSeg = firstSeg + n - 1;
  sh.skip();

  // Demand at the supply
  sh.heading("Demand at the water supply");
  const sprinklerFlow = sh.line("Sprinkler flow", "computed", `=${areaFlow}`, u.flow, "from AREADEMAND", f.flow);
  const hoseFlow = sh.line("Hose stream allowance", "computed", `=${hose}`, u.flow, "", f.flow);
  const demandFlow = sh.line("Demand flow, sprinklers + hose", "computed", `=${sprinklerFlow}+${hoseFlow}`, u.flow, "", f.flow);
  const demandPressure = sh.line("Demand pressure at the supply", "computed", `=P${lastSeg}`, u.pressure, "from RUN: the pressure after the last segment", f.pressure);
  name("Demand_HoseFlow", hoseFlow, "Hose stream allowance included in Demand_Flow");
  name("Demand_Flow", demandFlow, "Demand flow at the supply, sprinklers plus hose");
  name("Demand_Pressure", demandPressure, "Pressure the system needs at the supply");
  sh.skip();

  // Verdict
  sh.heading("Verdict");
  const margin = sh.line(
    "Required margin",
    "input",
    s.requiredMargin,
    u.pressure,
    "(common practice) many designers and insurers want the supply above the demand by about 10 psi or 10 %: set your own",
    f.pressure,
  );
  name("Required_Margin", margin, "Safety margin the supply must exceed the demand by");
  const test = [stat, resid, testFlow];
  sh.line("Supply pressure at the demand flow", "computed", `=${hr("SUPPLYAT", demandFlow, ...test, U)}`, u.pressure, "SUPPLYAT", f.pressure);
  const marginCell = sh.line("Margin", "computed", `=${hr("MARGIN", demandFlow, demandPressure, ...test, U)}`, u.pressure, "MARGIN: supply minus demand", f.pressure);
  sh.line("Margin, share of the demand pressure", "computed", `=IF(${demandPressure}>0,${marginCell}/${demandPressure},"")`, "", "", "0%");
  sh.line("Verdict", "computed", `=${hr("VERDICT", demandFlow, demandPressure, ...test, margin, U)}`);
  const boost = sh.line("Pump boost needed", "computed", `=${hr("PUMPBOOST", demandFlow, demandPressure, ...test, margin, U)}`, u.pressure, "PUMPBOOST: demand + required margin − supply", f.pressure);
  sh.put("B", "header", `Rated flow (${u.flow})`);
  sh.put("C", "header", `Rated pressure (${u.pressure})`);
  sh.row++;
  sh.put("A", "label", "Pump size, smallest standard rating");
  const size = sh.put("B", "computed", `=IF(${boost}>0,${hr("PUMPSIZE", demandFlow, boost, U)},"none needed")`, { format: f.flow, spill: { rows: 1, cols: 2, formats: [f.flow, f.pressure] } });
  sh.put("D", "note", "PUMPSIZE");
  sh.row++;
  const sizeRow = parseCell(size).row + 1;
  sh.put("A", "label", "Pump you choose (optional)");
  const chosenFlow = sh.put("B", "input", s.pump ? s.pump.ratedFlow : null, { format: f.flow });
  const chosenPressure = sh.put("C", "input", s.pump ? s.pump.ratedPressure : null, { format: f.pressure });
  sh.put("D", "note", "leave blank to plot the size above");
  sh.row++;
  sh.put("A", "label", "Pump on the plot");
  const pumpFlow = sh.put("B", "computed", `=IF(ISNUMBER(${chosenFlow}),${chosenFlow},IF(ISNUMBER(B${sizeRow}),B${sizeRow},""))`, { format: f.flow });
  const pumpPressure = sh.put("C", "computed", `=IF(ISNUMBER(${chosenPressure}),${chosenPressure},IF(ISNUMBER(C${sizeRow}),C${sizeRow},""))`, { format: f.pressure });
  sh.row++;
  name("Pump_RatedFlow", pumpFlow, "Rated flow of the pump to plot");
  name("Pump_RatedPressure", pumpPressure, "Rated pressure of the pump to plot");
  sh.skip();

  // Supply curve for the chart
  sh.heading("Supply curve for the chart");
  const chartMax = sh.line(
    "Chart flow up to",
    "computed",
    `=MAX(${CHART_TEST_FLOW_FACTOR}*${testFlow},${CHART_DEMAND_FLOW_FACTOR}*${demandFlow})`,
    u.flow,
    "1.5 × test flow or 1.2 × demand flow, the larger",
    f.flow,
  );
  sh.put("B", "header", `Flow (${u.flow})`);
  sh.put("C", "header", `Pressure (${u.pressure})`);
  sh.row++;
  sh.put("A", "label", "SUPPLYCURVE");
  const curve = sh.put("B", "computed", `=${hr("SUPPLYCURVE", stat, resid, testFlow, chartMax, String(CHART_POINTS), U)}`, {
    format: f.flow,
    spill: { rows: CHART_POINTS, cols: 2, formats: [f.flow, f.pressure] },
  });
  const c0 = parseCell(curve).row + 1;
  const c1 = c0 + CHART_POINTS - 1;
  sh.row += CHART_POINTS;

  const chart: TemplateChart = {
    title: "Water supply and sprinkler demand",
    xTitle: `Flow (${u.flow})`,
    yTitle: `Pressure (${u.pressure})`,
    series: [
      { name: "Water supply", x: `B${c0}:B${c1}`, y: `C${c0}:C${c1}`, style: "line", marker: "none", color: PALETTE.supply },
      { name: "Sprinklers", x: sprinklerFlow, y: demandPressure, style: "marker", marker: "square", color: PALETTE.sprinklers },
      { name: "Sprinklers + hose", x: demandFlow, y: demandPressure, style: "marker", marker: "diamond", color: PALETTE.demand },
    ],
    from: "F5",
    to: "N24",
  };

  return {
    sheetName: "Estimate",
    units: s.units,
    cells: sh.cells,
    names,
    chart,
    columnWidths: { A: 230, B: 95, C: 80, D: 95, E: 70, F: 60, G: 70, H: 40, I: 55, J: 70, K: 50, L: 60, M: 60, N: 60, O: 50, P: 70 },
  };
}

/** Every cell a spilled formula of the template will fill, anchors excluded: for checks and for hosts. */
export function spillCells(t: SheetTemplate): string[] {
  const out: string[] = [];
  for (const c of t.cells) {
    if (!c.spill) continue;
    const a = parseCell(c.address);
    for (let r = 0; r < c.spill.rows; r++) {
      for (let k = 0; k < c.spill.cols; k++) {
        if (r === 0 && k === 0) continue;
        out.push(cellAddress({ row: a.row + r, col: a.col + k }));
      }
    }
  }
  return out;
}

/** The rectangle the template's cells cover, spills included: "A1:P90". */
export function templateExtent(t: SheetTemplate): { rows: number; cols: number } {
  let rows = 0;
  let cols = 0;
  for (const addr of [...t.cells.map((c) => c.address), ...spillCells(t)]) {
    const a = parseCell(addr);
    rows = Math.max(rows, a.row + 1);
    cols = Math.max(cols, a.col + 1);
  }
  return { rows, cols };
}
