/**
 * The sections of the estimate sheet, one builder each: given the scenario, the row to start on and the addresses
 * earlier sections gave, a builder returns its cells, names, the rows it took and the addresses later sections need
 * (a `Section`, ./sheet.ts). ./template.ts lays them out one after the other.
 *
 * Columns: A label, B value, C unit, D note; the run table uses A to P. Every formula passes the sheet's Units cell as
 * its `units` argument, so the same sections serve US and SI work. Formulas refer to cells, not to the workbook names,
 * so that an older estimate sheet keeps working after a newer one takes the names over. Spilled results (AREADEMAND,
 * PIPERUN, PUMPSIZE, SUPPLYCURVE) are written as their anchor formula only; the cells they spill into are left empty.
 *
 * The design area's demand is one section among others: `treeDemandSection` (AREADEMAND over a tree of branch lines
 * and a cross main) gives the flow and pressure at the start of the run, and the sections after it read only those
 * refs (`AreaDemandRefs`), so that another way of finding the demand can take its place.
 */
import { CURVE_DEMAND_FLOW_FACTOR, SUPPLY_CURVE_FLOW_FACTOR, SUPPLY_CURVE_POINTS } from "../engine/curve";
import { type UnitSystem, unitName } from "../engine/units";
import { columnLetters, parseCell } from "./a1";
import { CAUTION, type CellRole, PALETTE } from "./look";
import type { InputName } from "./port";
import type { Scenario } from "./scenario";
import type { ChartSeries, Section, TemplateCell, TemplateName } from "./sheet";

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

/** Number formats of each quantity on the sheet. */
const SHEET_FORMATS: Record<UnitSystem, SheetUnits["fmt"]> = {
  US: { flow: "0", pressure: "0.0", diameter: "0.000", length: "0", area: "0", density: "0.00", kfactor: "0.0" },
  SI: { flow: "0", pressure: "0.00", diameter: "0.0", length: "0.0", area: "0.0", density: "0.0", kfactor: "0" },
};

/**
 * The sheet's unit labels are the engine's unit names (src/engine/units.ts), the K-factor's square root written ½;
 * nominal sizes are inches in US work and DN in SI work.
 */
function sheetUnits(units: UnitSystem): SheetUnits {
  return {
    flow: unitName("flow", units),
    pressure: unitName("pressure", units),
    diameter: unitName("diameter", units),
    length: unitName("length", units),
    area: unitName("area", units),
    density: unitName("density", units),
    kfactor: unitName("kfactor", units).replace("^0.5", "½"),
    nominal: units === "SI" ? "DN" : unitName("diameter", units),
    fmt: SHEET_FORMATS[units],
  };
}

const SHEET_UNITS: Record<UnitSystem, SheetUnits> = { US: sheetUnits("US"), SI: sheetUnits("SI") };

/**
 * The chart's supply curve: SUPPLYCURVE's own default number of rows, and a flow up to the larger of its default
 * multiple of the test flow and this multiple of the demand flow. (common practice)
 */
const CHART_POINTS = SUPPLY_CURVE_POINTS;
const CHART_TEST_FLOW_FACTOR = SUPPLY_CURVE_FLOW_FACTOR;
const CHART_DEMAND_FLOW_FACTOR = CURVE_DEMAND_FLOW_FACTOR;

// ─── Writing cells ───────────────────────────────────────────────────────────────────────────────────────────────

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

/** One section's cells and names as they are written, row by row from its first row. */
class SectionWriter {
  readonly cells: TemplateCell[] = [];
  readonly names: TemplateName[] = [];
  row: number;

  constructor(private readonly first: number) {
    this.row = first;
  }

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

  name(name: InputName, address: string, comment: string): void {
    this.names.push({ name, address, comment });
  }

  /** The section as written: every row up to the current one. */
  done<R>(refs: R): Section<R> {
    return { cells: this.cells, names: this.names, rows: this.row - this.first, refs };
  }
}

// ─── What sections give each other ───────────────────────────────────────────────────────────────────────────────

/** The sheet's Units cell, absolute ("$B$9"): every formula passes it as its `units` argument. */
export interface UnitsRefs {
  units: string;
}

/** The flow test's cells. */
export interface SupplyRefs {
  static: string;
  residual: string;
  testFlow: string;
}

/** The hazard and the design criteria it gives. */
export interface HazardRefs {
  hazard: string;
  area: string;
  density: string;
  /** hose stream allowance, inside + outside */
  hose: string;
}

/** The design area's demand where the run back to the supply starts, whichever way a section finds it. */
export interface AreaDemandRefs {
  /** sprinkler flow of the design area */
  flow: string;
  /** pressure needed where the run starts */
  pressure: string;
  /** the system type cell ("wet" or "dry") the run's C factors read */
  system: string;
  /** the cell function that finds the demand, for the notes that quote it ("AREADEMAND") */
  source: string;
}

/** The run's result: the pressure needed at the supply end. */
export interface RunRefs {
  pressureAfter: string;
}

/** The demand at the supply. */
export interface DemandRefs {
  sprinklerFlow: string;
  hoseFlow: string;
  flow: string;
  pressure: string;
}

/** A section that finds the design area's demand: the tree section below, or another that gives the same refs. */
export type AreaDemandSection = (s: Scenario, row: number, needs: UnitsRefs & { hazard: HazardRefs }) => Section<AreaDemandRefs>;

// ─── The sections ────────────────────────────────────────────────────────────────────────────────────────────────

/** Title, caution, how to use the sheet; the project and the Units cell. */
export function projectSection(s: Scenario, row: number): Section<UnitsRefs> {
  const sh = new SectionWriter(row);
  sh.put("A", "title", "Headroom estimate: does the water supply meet the sprinkler demand?");
  sh.row++;
  sh.put("A", "caution", CAUTION);
  sh.row++;
  sh.put("A", "note", "Shaded cells are inputs: overwrite the demo values. White cells are calculated by the HEADROOM functions.");
  sh.row++;
  sh.skip();

  sh.heading("Project");
  sh.line("Site", "input", s.site);
  sh.line("Address", "input", s.address);
  sh.line("Prepared by", "input", s.preparedBy);
  const unitsCell = sh.line("Units of this sheet", "input", s.units, "", "US or SI: every number below is in these units");
  sh.name("Units", unitsCell, "Units of the estimate: US or SI");
  return sh.done({ units: abs(unitsCell) });
}

/** The hydrant flow test: static and residual pressure, the flow measured directly or from a pitot reading. */
export function waterSupplySection(s: Scenario, row: number, { units: U }: UnitsRefs): Section<SupplyRefs> {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
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
  sh.name("Supply_Static", stat, "Static pressure of the flow test");
  sh.name("Supply_Residual", resid, "Residual pressure of the flow test");
  sh.name("Supply_TestFlow", testFlow, "Flow during the flow test");
  return sh.done({ static: stat, residual: resid, testFlow });
}

/** The occupancy hazard, the design area and density, the hose stream allowance. */
export function hazardSection(s: Scenario, row: number, { units: U }: UnitsRefs): Section<HazardRefs> {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
  sh.heading("Hazard and design area");
  const hazard = sh.line("Occupancy hazard", "input", s.hazard, "", "LH, OH1, OH2, EH1 or EH2");
  const areaChosen = sh.line("Design area chosen", "input", s.designArea, u.area, "leave blank for the smallest area on the hazard's curve", f.area);
  const area = sh.line("Design area", "computed", `=IF(ISNUMBER(${areaChosen}),${areaChosen},${hr("DESIGNAREA", hazard, U)})`, u.area, "DESIGNAREA", f.area);
  const density = sh.line("Design density", "computed", `=${hr("DESIGNDENSITY", hazard, area, U)}`, u.density, "DESIGNDENSITY", f.density);
  const hose = sh.line("Hose stream allowance, inside + outside", "computed", `=${hr("HOSEALLOWANCE", hazard, text("total"), U)}`, u.flow, "HOSEALLOWANCE", f.flow);
  return sh.done({ hazard, area, density, hose });
}

/**
 * The design area as a tree: sprinklers on branch lines fed by a cross main, their pipes and C factor, and
 * AREADEMAND's flow and pressure at the cross main.
 */
export const treeDemandSection: AreaDemandSection = (s, row, { units: U, hazard: { area, density } }) => {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
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
  return sh.done({ flow: `B${areaRow}`, pressure: `C${areaRow}`, system, source: "AREADEMAND" });
};

/** The pipe run from the design area back to the supply, one row a segment, into PIPERUN. */
export function pipeRunSection(s: Scenario, row: number, { units: U, area }: UnitsRefs & { area: AreaDemandRefs }): Section<RunRefs> {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
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
    sh.put("F", "computed", `=${abs(area.flow)}`, { format: f.flow });
    sh.put("G", "computed", `=${hr("PIPEID", `B${r}`, `C${r}`, U)}`, { format: f.diameter });
    sh.put("H", "computed", `=${hr("CFACTOR", `D${r}`, abs(area.system))}`, { format: "0" });
    sh.put("I", "input", seg.length, { format: f.length });
    sh.put("J", "computed", `=IF(E${r}="",0,${hr("FITTINGS", `E${r}`, `B${r}`, `H${r}`, `C${r}`, U)})`, { format: f.length });
    sh.put("K", "input", seg.rise, { format: s.units === "SI" ? "0.0" : "0" });
    sh.put("L", "input", seg.fixedLoss, { format: f.pressure });
    if (i === 0) {
      sh.put("M", "computed", `=${hr("PIPERUN", `F${r}:L${r + n - 1}`, area.pressure, U)}`, { format: f.pressure, spill: { rows: n, cols: 4, formats: [f.pressure, f.pressure, f.pressure, f.pressure] } });
    }
    sh.row++;
  });
  const lastSeg = firstSeg + n - 1;
  return sh.done({ pressureAfter: `P${lastSeg}` });
}

/** The demand at the water supply: the sprinkler flow plus the hose allowance, at the pressure the run needs. */
export function supplyDemandSection(
  s: Scenario,
  row: number,
  { area, hazard, run }: { area: AreaDemandRefs; hazard: HazardRefs; run: RunRefs },
): Section<DemandRefs> {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
  sh.heading("Demand at the water supply");
  const sprinklerFlow = sh.line("Sprinkler flow", "computed", `=${area.flow}`, u.flow, `from ${area.source}`, f.flow);
  const hoseFlow = sh.line("Hose stream allowance", "computed", `=${hazard.hose}`, u.flow, "", f.flow);
  const demandFlow = sh.line("Demand flow, sprinklers + hose", "computed", `=${sprinklerFlow}+${hoseFlow}`, u.flow, "", f.flow);
  const demandPressure = sh.line("Demand pressure at the supply", "computed", `=${run.pressureAfter}`, u.pressure, "from PIPERUN: the pressure after the last segment", f.pressure);
  sh.name("Demand_HoseFlow", hoseFlow, "Hose stream allowance included in Demand_Flow");
  sh.name("Demand_Flow", demandFlow, "Demand flow at the supply, sprinklers plus hose");
  sh.name("Demand_Pressure", demandPressure, "Pressure the system needs at the supply");
  return sh.done({ sprinklerFlow, hoseFlow, flow: demandFlow, pressure: demandPressure });
}

/** The verdict: required margin, supply at the demand flow, margin, VERDICT, pump boost and size, the pump to plot. */
export function verdictSection(
  s: Scenario,
  row: number,
  { units: U, supply, demand }: UnitsRefs & { supply: SupplyRefs; demand: DemandRefs },
): Section<Record<string, never>> {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
  const demandFlow = demand.flow;
  const demandPressure = demand.pressure;
  sh.heading("Verdict");
  const margin = sh.line(
    "Required margin",
    "input",
    s.requiredMargin,
    u.pressure,
    "(common practice) many designers and insurers want the supply above the demand by about 10 psi or 10 %: set your own",
    f.pressure,
  );
  sh.name("Required_Margin", margin, "Safety margin the supply must exceed the demand by");
  const test = [supply.static, supply.residual, supply.testFlow];
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
  sh.name("Pump_RatedFlow", pumpFlow, "Rated flow of the pump to plot");
  sh.name("Pump_RatedPressure", pumpPressure, "Rated pressure of the pump to plot");
  return sh.done({});
}

/** The chart a section gives: titles and series (where it stands on the sheet is the sheet's business). */
export interface ChartRefs {
  chart: { title: string; xTitle: string; yTitle: string; series: ChartSeries[] };
}

/** The supply curve the chart draws (SUPPLYCURVE), and the chart's series: the supply against the demand points. */
export function supplyCurveSection(
  s: Scenario,
  row: number,
  { units: U, supply, demand }: UnitsRefs & { supply: SupplyRefs; demand: DemandRefs },
): Section<ChartRefs> {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
  sh.heading("Supply curve for the chart");
  const chartMax = sh.line(
    "Chart flow up to",
    "computed",
    `=MAX(${CHART_TEST_FLOW_FACTOR}*${supply.testFlow},${CHART_DEMAND_FLOW_FACTOR}*${demand.flow})`,
    u.flow,
    `${CHART_TEST_FLOW_FACTOR} × test flow or ${CHART_DEMAND_FLOW_FACTOR} × demand flow, the larger`,
    f.flow,
  );
  sh.put("B", "header", `Flow (${u.flow})`);
  sh.put("C", "header", `Pressure (${u.pressure})`);
  sh.row++;
  sh.put("A", "label", "SUPPLYCURVE");
  const curve = sh.put("B", "computed", `=${hr("SUPPLYCURVE", supply.static, supply.residual, supply.testFlow, chartMax, String(CHART_POINTS), U)}`, {
    format: f.flow,
    spill: { rows: CHART_POINTS, cols: 2, formats: [f.flow, f.pressure] },
  });
  const c0 = parseCell(curve).row + 1;
  const c1 = c0 + CHART_POINTS - 1;
  sh.row += CHART_POINTS;
  return sh.done({
    chart: {
      title: "Water supply and sprinkler demand",
      xTitle: `Flow (${u.flow})`,
      yTitle: `Pressure (${u.pressure})`,
      series: [
        { name: "Water supply", x: `B${c0}:B${c1}`, y: `C${c0}:C${c1}`, style: "line", marker: "none", color: PALETTE.supply },
        { name: "Sprinklers", x: demand.sprinklerFlow, y: demand.pressure, style: "marker", marker: "square", color: PALETTE.sprinklers },
        { name: "Sprinklers + hose", x: demand.flow, y: demand.pressure, style: "marker", marker: "diamond", color: PALETTE.demand },
      ],
    },
  });
}
