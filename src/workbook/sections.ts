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
import { cellAddress, columnLetters, parseCell } from "./a1";
import { CAUTION, type CellRole, INPUTS_NOTE, PALETTE, SAMPLE_NOTE } from "./look";
import { CANDIDATES_NAME, type WorkbookName } from "./port";
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

/**
 * A number typed into an input that may be left blank, as a formula: the number itself (numeric text as its number),
 * anything else an error in the cell that reads it, with UNIT's own message quoting what was typed
 * (`value: got "1250 gpm"; must be a number`). UNIT from a unit to the same unit changes nothing. Blank is the
 * caller's business: `IF(ISBLANK(cell), fallback, typedNumber(cell, unit))`, so that text never takes the fallback.
 */
function typedNumber(address: string, unit: string): string {
  const code = text(unit.replace("²", "2")); // UNIT's own spelling, plain ASCII in the formula
  return hr("UNIT", address, code, code);
}

/**
 * Minutes typed into an input (no cell function reads a duration, so no function's message can say what is wrong):
 * the number, an error that comes with it, or a sentence naming the cell to type a number into.
 */
function typedMinutes(value: string, input: string, whenNumber = value): string {
  return `IF(ISNUMBER(${value}),${whenNumber},IF(ISERROR(${value}),${value},"type a number of minutes in ${input}"))`;
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

  name(name: WorkbookName, address: string, comment: string): void {
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

/** One flow test's cells: its label, and the test carried to the site (SITETEST's spill). */
export interface FlowTestRefs {
  /** the test's header cell ("Test 1") */
  label: string;
  /** SITETEST's anchor: the static pressure at the site ("" while the test is not filled in) */
  static: string;
  /** the residual pressure at the site */
  residual: string;
  /** the test flow used (measured directly or from the pitot reading) */
  testFlow: string;
  /** when and where the test was made (text) */
  when: string;
}

/** The flow tests, each carried to the site. */
export interface SupplyRefs {
  tests: FlowTestRefs[];
}

/** The flow test the verdict uses: the one giving the lowest supply at the demand flow, carried to the site. */
export interface UsedTestRefs {
  static: string;
  residual: string;
  testFlow: string;
}

/** The design criteria: the hose allowance and the duration; by the density/area method, the hazard, area and density. */
export interface HazardRefs {
  /** the hazard code cell, for the density/area method; null for a design by number of sprinklers */
  hazard: string | null;
  /** the design area before any adjustment for the system type (density/area method) */
  area: string | null;
  /** the density read at that area (density/area method) */
  density: string | null;
  /** hose stream allowance, inside + outside */
  hose: string;
  /** the inside hose allowance used: the one typed, or HOSEALLOWANCE(hazard, "inside") */
  insideHose: string;
  /** minutes the supply must last */
  duration: string;
  /** the cell a duration is typed into (the duration itself, or the duration chosen) */
  durationInput: string;
}

/** The design area's demand where the run back to the supply starts, whichever way a section finds it. */
export interface AreaDemandRefs {
  /** sprinkler flow of the design area */
  flow: string;
  /** pressure needed where the run starts: the design area's inlet, its fittings included */
  pressure: string;
  /** the most remote sprinkler's pressure */
  endPressure: string;
  /** the system type cell the run's C factors read */
  system: string;
  /** the cell function that finds the demand, for the notes that quote it ("AREADEMAND") */
  source: string;
}

/** The run's result: the pressure needed at the supply end, and the columns the breakdown sums. */
export interface RunRefs {
  pressureAfter: string;
  /** the segments' labels, friction, elevation and fixed losses and velocities: one range each */
  labels: string;
  friction: string;
  elevation: string;
  fixed: string;
  velocity: string;
  /** the velocity limit cell */
  velocityLimit: string;
}

/** The demand at the supply. */
export interface DemandRefs {
  sprinklerFlow: string;
  hoseFlow: string;
  flow: string;
  pressure: string;
  /** the flow that passes through a pump: sprinklers, inside hose, and outside hose where hydrants are downstream */
  pumpFlow: string;
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
  sh.put("A", "note", s.values === "sample" ? SAMPLE_NOTE : INPUTS_NOTE);
  sh.row++;
  sh.skip();

  sh.heading("Project");
  sh.name("Project_Site", sh.line("Site", "input", s.site), "Site of the project, for the one-page summary");
  sh.name("Project_Address", sh.line("Address", "input", s.address), "Address of the site, for the one-page summary");
  sh.name("Project_PreparedBy", sh.line("Prepared by", "input", s.preparedBy), "Who prepared the estimate, for the one-page summary");
  const unitsCell = sh.line("Units of this sheet", "input", s.units, "", "US or SI: every number below is in these units");
  sh.name("Units", unitsCell, "Units of the estimate: US or SI");
  return sh.done({ units: abs(unitsCell) });
}

/** Flow tests the sheet holds side by side, in columns B, C and D. */
export const FLOW_TESTS = 3;

/**
 * The hydrant flow tests, one column each (up to three): static and residual pressure, the flow measured directly or
 * from a pitot reading, the height of the site above the test gauge; then each test carried to the site (SITETEST)
 * with one derating for them all.
 */
export function waterSupplySection(s: Scenario, row: number, { units: U }: UnitsRefs): Section<SupplyRefs> {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
  const cols = Array.from({ length: FLOW_TESTS }, (_, i) => columnLetters(1 + i));
  const tests = cols.map((_, i) => s.flowTests[i]);
  sh.heading("Water supply: hydrant flow tests");
  sh.put("A", "header", "Reading");
  const labels = cols.map((c, i) => sh.put(c, "header", `Test ${i + 1}`));
  sh.row++;
  /** One reading of every test: a row of input cells; returns their addresses. */
  const reading = (label: string, value: (t: Scenario["flowTests"][number]) => number | string | null, format?: string) => {
    sh.put("A", "label", label);
    const cells = cols.map((c, i) => sh.put(c, "input", tests[i] ? value(tests[i]) : null, { format }));
    sh.row++;
    return cells;
  };
  const stat = reading(`Static pressure (${u.pressure})`, (t) => t.static, f.pressure);
  const resid = reading(`Residual pressure (${u.pressure})`, (t) => t.residual, f.pressure);
  const direct = reading(`Flow measured directly (${u.flow})`, (t) => t.flow, f.flow);
  const pitot = reading(`Pitot pressure at the outlet (${u.pressure})`, (t) => t.pitot, f.pressure);
  const outlet = reading(`Outlet internal diameter (${u.diameter})`, (t) => t.outletDiameter, s.units === "SI" ? "0.0" : "0.00");
  const coef = reading("Outlet coefficient", (t) => t.outletCoefficient, "0.00");
  const rise = reading(`Site above the test gauge (${u.length})`, (t) => t.rise, s.units === "SI" ? "0.0" : "0");
  const when = reading("When and where tested", (t) => t.when);
  sh.put("A", "label", `Flow from the pitot reading (${u.flow})`);
  const pitotFlow = cols.map((c, i) => sh.put(c, "computed", `=IF(ISBLANK(${pitot[i]}),"",${hr("PITOTFLOW", pitot[i], outlet[i], coef[i], U)})`, { format: f.flow }));
  sh.row++;
  sh.put("A", "label", `Test flow used (${u.flow})`);
  const testFlow = cols.map((c, i) => sh.put(c, "computed", `=IF(ISBLANK(${direct[i]}),${pitotFlow[i]},${typedNumber(direct[i], u.flow)})`, { format: f.flow }));
  sh.row++;
  sh.put(
    "A",
    "note",
    "Leave the flow measured directly blank to use the pitot reading (PITOTFLOW; for two outlets, add their flows and type the sum). " +
      "Outlet coefficient [NFPA 291]: 0.90 smooth rounded, 0.80 square and sharp, 0.70 square projecting. " +
      "Site above the test gauge: the height of the point where the pipe run meets the main above the hydrant's gauge, negative when lower. " +
      "Flow tests vary with season, time of day and future development.",
  );
  sh.row++;
  const derate = sh.line(
    "Derate for seasonal and future loss",
    "input",
    s.derate,
    "",
    "(common practice) 10 % is typical: every reading is reduced by it; 0 % takes the tests as read",
    "0%",
  );
  sh.put("A", "header", "Carried to the site (SITETEST)");
  sh.put("B", "header", `Static (${u.pressure})`);
  sh.put("C", "header", `Residual (${u.pressure})`);
  sh.row++;
  const carried = cols.map((c, i) => {
    sh.put("A", "label", `Test ${i + 1}`);
    const site = sh.put("B", "computed", `=IF(AND(ISBLANK(${stat[i]}),ISBLANK(${resid[i]})),"",${hr("SITETEST", stat[i], resid[i], rise[i], derate, U)})`, {
      format: f.pressure,
      spill: { rows: 1, cols: 2, formats: [f.pressure, f.pressure] },
    });
    sh.row++;
    const a = parseCell(site);
    return { label: labels[i], static: site, residual: `${columnLetters(a.col + 1)}${a.row + 1}`, testFlow: testFlow[i], when: when[i] };
  });
  return sh.done({ tests: carried });
}

/** The occupancy hazard, the design area and density, the hose stream allowance and the duration. */
export function hazardSection(s: Scenario, row: number, { units: U }: UnitsRefs): Section<HazardRefs> {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
  sh.heading("Hazard and design area");
  const classes =
    s.units === "SI"
      ? "LH, OH1, OH2, EH1 or EH2: NFPA 13's classes with their values converted to SI, not another standard's classes of the same name"
      : "LH, OH1, OH2, EH1 or EH2: NFPA 13's occupancy classes (not storage: design storage by number of sprinklers)";
  const hazard = sh.line("Occupancy hazard", "input", s.hazard, "", classes);
  const areaChosen = sh.line("Design area chosen", "input", s.designArea, u.area, "leave blank for the smallest area on the hazard's curve", f.area);
  const area = sh.line("Design area", "computed", `=IF(ISBLANK(${areaChosen}),${hr("DESIGNAREA", hazard, U)},${typedNumber(areaChosen, u.area)})`, u.area, "DESIGNAREA", f.area);
  sh.name("Design_Hazard", hazard, "Occupancy hazard of the design, for the one-page summary");
  const density = sh.line("Design density", "computed", `=${hr("DESIGNDENSITY", hazard, area, U)}`, u.density, "DESIGNDENSITY, read at the design area", f.density);
  const hose = sh.line("Hose stream allowance, inside + outside", "computed", `=${hr("HOSEALLOWANCE", hazard, text("total"), U)}`, u.flow, "HOSEALLOWANCE", f.flow);
  const insideChosen = sh.line("Inside hose allowance chosen", "input", s.insideHose, u.flow, "leave blank for the hazard's largest inside allowance", f.flow);
  const insideHose = sh.line(
    "Inside hose allowance",
    "computed",
    `=IF(ISBLANK(${insideChosen}),${hr("HOSEALLOWANCE", hazard, text("inside"), U)},${typedNumber(insideChosen, u.flow)})`,
    u.flow,
    "HOSEALLOWANCE inside: part of the total above",
    f.flow,
  );
  const durationChosen = sh.line("Supply duration chosen", "input", s.duration, "min", "leave blank for the upper end of the hazard's range", "0");
  const duration = sh.line(
    "Supply duration",
    "computed",
    `=IF(ISBLANK(${durationChosen}),${hr("DURATION", hazard, text("max"))},${typedMinutes(durationChosen, durationChosen)})`,
    "min",
    "DURATION [NFPA 13]",
    "0",
  );
  return sh.done({ hazard, area, density, hose, insideHose, duration, durationInput: durationChosen });
}

/**
 * The design criteria of a design by number of sprinklers (storage, high-K and early-suppression sprinklers): what is
 * stored, and the hose allowance and duration the storage chapter gives, typed in (no hidden storage table).
 */
export function storageCriteriaSection(s: Scenario, row: number): Section<HazardRefs> {
  if (s.design.kind !== "heads") throw new Error("storageCriteriaSection needs a design by number of sprinklers");
  const d = s.design;
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
  sh.heading("Storage design criteria");
  const stored = sh.line("Storage", "input", d.storage, "", "what is stored, how and how high: the storage chapter of NFPA 13 that applies gives the criteria below");
  sh.name("Design_Hazard", stored, "What is stored, for the one-page summary");
  const hose = sh.line("Hose stream allowance, inside + outside", "input", d.hose, u.flow, "from the storage chapter (often 250 to 500 gpm)", f.flow);
  const insideChosen = sh.line("Inside hose allowance chosen", "input", s.insideHose, u.flow, "part of the total above; leave blank for none", f.flow);
  const insideHose = sh.line("Inside hose allowance", "computed", `=IF(ISBLANK(${insideChosen}),0,${typedNumber(insideChosen, u.flow)})`, u.flow, "", f.flow);
  const duration = sh.line("Supply duration", "input", d.duration, "min", "from the storage chapter (often 60 to 150 min)", "0");
  return sh.done({ hazard: null, area: null, density: null, hose, insideHose, duration, durationInput: duration });
}

/** The pipes of the design area (branch lines, cross main), their material, the system and C: rows both demand sections share. */
function areaPipes(s: Scenario, sh: SectionWriter, U: string) {
  const u = SHEET_UNITS[s.units];
  sh.put("A", "header", "Pipe");
  sh.put("B", "header", `Nominal (${u.nominal})`);
  sh.put("C", "header", "Schedule");
  sh.put("D", "header", `Internal diameter (${u.diameter})`);
  sh.row++;
  const pipeRow = (label: string, p: { nominal: number | string; schedule: string }) => {
    sh.put("A", "label", label);
    const nominal = sh.put("B", "input", p.nominal);
    const schedule = sh.put("C", "input", p.schedule);
    const id = sh.put("D", "computed", `=${hr("PIPEID", nominal, schedule, U)}`, { format: u.fmt.diameter });
    sh.row++;
    return { nominal, schedule, id };
  };
  const branch = pipeRow("Branch lines", s.branch);
  const main = pipeRow("Cross main", s.crossMain);
  const material = sh.line("Pipe material", "input", s.material, "", "steel, galvanized, plastic, cpvc, copper, ductile...");
  const system = sh.line("System", "input", s.system, "", "wet, dry, preaction (single interlock) or double interlock: C and the design area read it");
  const c = sh.line("Hazen-Williams C", "computed", `=${hr("CFACTOR", material, system)}`, "", "CFACTOR", "0");
  return { branch, main, system, c };
}

/**
 * The solve's row (AREADEMAND or HEADSDEMAND: [flow, pressure, sprinklers, lines, end sprinkler]), then the fittings
 * in the design area that the line-by-line walk leaves out (the tee where a line joins the cross main, riser nipples):
 * their loss at an average line's flow is added where the run starts.
 */
function areaSolve(
  s: Scenario,
  sh: SectionWriter,
  U: string,
  fn: string,
  formula: string,
  pipes: ReturnType<typeof areaPipes>,
  { where = "at the cross main", placement = false }: { where?: string; placement?: boolean } = {},
): AreaDemandRefs {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  sh.put("A", "header", `Design area demand ${where}`);
  const demandHeaders = [`Flow (${u.flow})`, `Pressure (${u.pressure})`, "Sprinklers", "Lines", `End sprinkler (${u.pressure})`];
  // GRIDDEMAND says where it placed the area: its first line and, along the lines, its first sprinkler
  if (placement) demandHeaders.push("First line", "First sprinkler");
  demandHeaders.forEach((h, i) => sh.put(columnLetters(1 + i), "header", h));
  sh.row++;
  sh.put("A", "label", fn);
  const formats = [f.flow, f.pressure, "0", "0", f.pressure, ...(placement ? ["0", "0"] : [])];
  const solved = sh.put("B", "computed", formula, { format: f.flow, spill: { rows: 1, cols: formats.length, formats } });
  sh.row++;
  const r = parseCell(solved).row + 1;
  const [flow, pressure, lines, end] = [`B${r}`, `C${r}`, `E${r}`, `F${r}`];
  const fittings = sh.line(
    "Fittings in the design area",
    "input",
    s.areaFittings,
    "",
    "left out of the line-by-line walk, at the branch-line size: by default the tee where a line joins the cross main",
  );
  const length = sh.line(
    "Their equivalent length",
    "computed",
    `=IF(TRIM(${fittings})="",0,${hr("FITTINGS", fittings, pipes.branch.nominal, pipes.c, pipes.branch.schedule, U)})`,
    u.length,
    "FITTINGS",
    "0.0",
  );
  const loss = sh.line(
    "Their loss",
    "computed",
    `=${hr("FRICTION", `${flow}/${lines}`, pipes.branch.id, pipes.c, length, U)}`,
    u.pressure,
    "FRICTION at an average line's flow (flow ÷ lines) in the branch-line pipe",
    f.pressure,
  );
  const start = sh.line("Pressure where the run starts", "computed", `=${pressure}+${loss}`, u.pressure, `${fn}'s pressure + the fittings' loss`, f.pressure);
  return { flow, pressure: start, endPressure: end, system: pipes.system, source: fn };
}

/**
 * The sprinkler rows of a design by the density/area method (K, coverage, spacing along a line, minimum pressure and
 * HEADFLOW's most remote flow): the tree's and the grid's alike.
 */
function sprinklerRows(s: Scenario, sh: SectionWriter, U: string, density: string, spacingNote = "") {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const k = sh.line("Sprinkler K-factor", "input", s.sprinkler.kFactor, u.kfactor, "", f.kfactor);
  const coverage = sh.line("Coverage per sprinkler", "input", s.sprinkler.coverage, u.area, "", f.area);
  const spacing = sh.line("Spacing along a branch line", "input", s.sprinkler.spacing, u.length, spacingNote, s.units === "SI" ? "0.00" : "0.0");
  const minP = sh.line("Minimum operating pressure", "input", s.sprinkler.minPressure, u.pressure, s.units === "SI" ? "0.5 bar unless the listing says more" : "7 psi unless the listing says more", f.pressure);
  sh.line("Most remote sprinkler flow", "computed", `=${hr("HEADFLOW", density, coverage, k, minP, U)}`, u.flow, "HEADFLOW", "0.0");
  return { k, coverage, spacing, minP };
}

/** The design area flowed: the hazard's, adjusted for the system type (ADJUSTAREA); named for the one-page summary. */
function areaFlowed(s: Scenario, sh: SectionWriter, area: string, system: string): string {
  const u = SHEET_UNITS[s.units];
  const flowed = sh.line(
    "Design area flowed",
    "computed",
    `=${hr("ADJUSTAREA", area, system)}`,
    u.area,
    "ADJUSTAREA: dry and double-interlock systems flow 30 % more area [NFPA 13], at the density read above",
    u.fmt.area,
  );
  sh.name("Design_Area", flowed, "Design area flowed, for the one-page summary");
  return flowed;
}

/**
 * The design area as a tree by the density/area method: sprinklers on branch lines fed by a cross main, their pipes
 * and C, the area adjusted for the system type (ADJUSTAREA), and AREADEMAND's flow and pressure at the cross main.
 */
export const treeDemandSection: AreaDemandSection = (s, row, { units: U, hazard: { area, density } }) => {
  if (area === null || density === null) throw new Error("the tree demand section needs the hazard's design area and density");
  const sh = new SectionWriter(row);
  sh.heading("Sprinklers and the design area's pipes");
  const { k, coverage, spacing, minP } = sprinklerRows(s, sh, U, density);
  const pipes = areaPipes(s, sh, U);
  const flowed = areaFlowed(s, sh, area, pipes.system);
  const formula = `=${hr("AREADEMAND", density, flowed, coverage, k, spacing, pipes.branch.id, pipes.main.id, pipes.c, minP, U)}`;
  return sh.done(areaSolve(s, sh, U, "AREADEMAND", formula, pipes));
};

/**
 * The design area of a gridded system by the density/area method (GRIDDEMAND): sprinklers on branch lines tied at
 * both ends into cross mains, the grid's size and where the riser feeds it, the area adjusted for the system type
 * (ADJUSTAREA), and the area placed where it needs the most pressure, with its flow and pressure at the riser.
 */
export const gridDemandSection: AreaDemandSection = (s, row, { units: U, hazard: { area, density } }) => {
  if (area === null || density === null) throw new Error("the grid demand section needs the hazard's design area and density");
  if (s.design.kind !== "grid") throw new Error("the grid demand section needs a gridded design");
  const d = s.design;
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const len = s.units === "SI" ? "0.00" : "0.0";
  const sh = new SectionWriter(row);
  sh.heading("Sprinklers and the gridded system's pipes");
  const { k, coverage, spacing, minP } = sprinklerRows(s, sh, U, density, "the lines stand coverage ÷ spacing apart");
  const lines = sh.line("Branch lines in the grid", "input", d.lines, "", "each tied at both ends into a cross main", "0");
  const lineLength = sh.line("Length of a branch line", "input", d.lineLength, u.length, "between the two cross mains", len);
  const feedLine = sh.line("Line where the riser feeds", "input", d.feedLine, "", "1 for a corner; the middle line for a centre feed", "0");
  const pipes = areaPipes(s, sh, U);
  const flowed = areaFlowed(s, sh, area, pipes.system);
  const formula = `=${hr("GRIDDEMAND", density, flowed, coverage, k, spacing, lines, lineLength, pipes.branch.id, pipes.main.id, pipes.c, minP, feedLine, U)}`;
  const refs = areaSolve(s, sh, U, "GRIDDEMAND", formula, pipes, { where: "at the riser, placed where it needs the most", placement: true });
  // the same area as a tree of end-fed lines, for comparison: what piping the grid saves
  sh.put("A", "header", "For comparison: the same area as a tree");
  [`Flow (${u.flow})`, `Pressure (${u.pressure})`, "Sprinklers", "Lines", `End sprinkler (${u.pressure})`].forEach((h, i) => sh.put(columnLetters(1 + i), "header", h));
  sh.row++;
  sh.put("A", "label", "AREADEMAND");
  const tree = sh.put("B", "computed", `=${hr("AREADEMAND", density, flowed, coverage, k, spacing, pipes.branch.id, pipes.main.id, pipes.c, minP, U)}`, {
    format: f.flow,
    spill: { rows: 1, cols: 5, formats: [f.flow, f.pressure, "0", "0", f.pressure] },
  });
  sh.row++;
  const treePressure = cellAddress({ ...parseCell(tree), col: parseCell(tree).col + 1 });
  const gridPressure = cellAddress({ ...parseCell(refs.flow), col: parseCell(refs.flow).col + 1 });
  sh.line("Pressure the grid saves", "computed", `=${treePressure}-${gridPressure}`, u.pressure, "the tree's pressure at its cross main less the grid's at the riser", f.pressure);
  sh.put(
    "A",
    "note",
    "GRIDDEMAND solves the grid as a network (water reaches each sprinkler from both ends of its line) for every place the design area " +
      "can stand, and keeps the one needing the most pressure at the riser: its first line and first sprinkler are shown beside it. " +
      "AREADEMAND's tree feeds each line from one end only, so it needs more: the run and the verdict below take the grid's.",
  );
  sh.row++;
  return sh.done(refs);
};

/**
 * The design area by number of sprinklers (HEADSDEMAND): so many sprinklers at a minimum pressure, so many on each
 * branch line, the lines a given spacing apart on the cross main.
 */
export const headsDemandSection: AreaDemandSection = (s, row, { units: U }) => {
  if (s.design.kind !== "heads") throw new Error("the heads demand section needs a design by number of sprinklers");
  const d = s.design;
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const len = s.units === "SI" ? "0.00" : "0.0";
  const sh = new SectionWriter(row);
  sh.heading("Sprinklers by number and the design area's pipes");
  const heads = sh.line("Sprinklers flowing", "input", d.heads, "", "from the storage chapter, e.g. 12 early-suppression sprinklers", "0");
  const perLine = sh.line("Sprinklers on each branch line", "input", d.headsPerLine, "", "the line nearest the feed flows the remainder", "0");
  const k = sh.line("Sprinkler K-factor", "input", s.sprinkler.kFactor, u.kfactor, "", f.kfactor);
  const minP = sh.line("Minimum operating pressure", "input", s.sprinkler.minPressure, u.pressure, "the pressure the storage chapter or the listing gives", f.pressure);
  const spacing = sh.line("Spacing along a branch line", "input", s.sprinkler.spacing, u.length, "", len);
  const lineSpacing = sh.line("Spacing between branch lines", "input", d.lineSpacing, u.length, "", len);
  const pipes = areaPipes(s, sh, U);
  const formula = `=${hr("HEADSDEMAND", heads, perLine, k, minP, spacing, lineSpacing, pipes.branch.id, pipes.main.id, pipes.c, U)}`;
  return sh.done(areaSolve(s, sh, U, "HEADSDEMAND", formula, pipes));
};

/**
 * The pipe run from the design area back to the supply, one row a segment, into PIPERUN: each segment carries the
 * design area's flow, plus the inside hose where it says so; beside PIPERUN's results, each segment's velocity and
 * friction per 100 ft (m), flagged above the velocity limit.
 */
export function pipeRunSection(
  s: Scenario,
  row: number,
  { units: U, area, hazard }: UnitsRefs & { area: AreaDemandRefs; hazard: HazardRefs },
): Section<RunRefs> {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
  sh.heading("Pipe run from the design area back to the water supply");
  sh.put(
    "A",
    "note",
    "One row a segment, from the design area towards the supply. Rise: the height the water climbs in the segment on its way to the sprinklers. Inside hose: yes where the segment carries the inside hose too (from where the hose stations connect: the riser and everything upstream). To add a segment, insert a row inside the table.",
  );
  sh.row++;
  const limit = sh.line(
    "Velocity limit",
    "input",
    s.velocityLimit,
    `${u.length}/s`,
    "(common practice) a segment faster than this is flagged: a larger pipe there is often the cheapest fix",
    s.units === "SI" ? "0.0" : "0",
  );
  sh.name("Velocity_Limit", limit, "Velocity above which a run segment is flagged");
  const per = s.units === "SI" ? "100 m" : "100 ft";
  const runHeaders: Array<[string, string]> = [
    ["Segment", ""],
    ["Nominal", u.nominal],
    ["Schedule", ""],
    ["Material", ""],
    ["Fittings", "e.g. 2E T GV"],
    ["Inside hose", "yes or no"],
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
    ["Velocity", `${u.length}/s`],
    [`Friction per ${per}`, u.pressure],
    ["Check", ""],
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
    sh.put("F", "input", seg.insideHose ? "yes" : "no");
    const yes = `TRIM(F${r})="yes"`;
    sh.put("G", "computed", `=IF(OR(${yes},TRIM(F${r})="no"),${abs(area.flow)}+IF(${yes},${abs(hazard.insideHose)},0),"type yes or no in F${r}")`, { format: f.flow });
    sh.put("H", "computed", `=${hr("PIPEID", `B${r}`, `C${r}`, U)}`, { format: f.diameter });
    sh.put("I", "computed", `=${hr("CFACTOR", `D${r}`, abs(area.system))}`, { format: "0" });
    sh.put("J", "input", seg.length, { format: f.length });
    sh.put("K", "computed", `=IF(E${r}="",0,${hr("FITTINGS", `E${r}`, `B${r}`, `I${r}`, `C${r}`, U)})`, { format: f.length });
    sh.put("L", "input", seg.rise, { format: s.units === "SI" ? "0.0" : "0" });
    sh.put("M", "input", seg.fixedLoss, { format: f.pressure });
    if (i === 0) {
      sh.put("N", "computed", `=${hr("PIPERUN", `G${r}:M${r + n - 1}`, area.pressure, U)}`, { format: f.pressure, spill: { rows: n, cols: 4, formats: [f.pressure, f.pressure, f.pressure, f.pressure] } });
    }
    sh.put("R", "computed", `=${hr("VELOCITY", `G${r}`, `H${r}`, U)}`, { format: "0.0" });
    sh.put("S", "computed", `=100*${hr("FRICTIONRATE", `G${r}`, `H${r}`, `I${r}`, U)}`, { format: f.pressure });
    sh.put("T", "computed", `=IF(ISNUMBER(${abs(limit)}),IF(R${r}>${abs(limit)},"faster than the limit",""),"type a number in ${limit}")`);
    sh.row++;
  });
  const lastSeg = firstSeg + n - 1;
  const col = (c: string) => `${c}${firstSeg}:${c}${lastSeg}`;
  return sh.done({
    pressureAfter: `Q${lastSeg}`,
    labels: col("A"),
    friction: col("N"),
    elevation: col("O"),
    fixed: col("P"),
    velocity: col("R"),
    velocityLimit: limit,
  });
}

/**
 * Where the demand pressure goes: the end sprinkler, friction in the design area and in the run, elevation and the
 * devices (they add up to the demand pressure at the supply), and the segment losing the most.
 */
export function breakdownSection(s: Scenario, row: number, { area, run }: { area: AreaDemandRefs; run: RunRefs }): Section<Record<string, never>> {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
  sh.heading("Where the pressure goes");
  const end = sh.line("End sprinkler", "computed", `=${area.endPressure}`, u.pressure, "the most remote sprinkler's pressure", f.pressure);
  const inArea = sh.line("Friction in the design area", "computed", `=${area.pressure}-${area.endPressure}`, u.pressure, "its fittings included", f.pressure);
  const friction = sh.line("Friction in the pipe run", "computed", `=SUM(${run.friction})`, u.pressure, "", f.pressure);
  const elevation = sh.line("Elevation", "computed", `=SUM(${run.elevation})`, u.pressure, "", f.pressure);
  const devices = sh.line("Devices (backflow preventer, meter)", "computed", `=SUM(${run.fixed})`, u.pressure, "", f.pressure);
  sh.line("Total: the demand pressure at the supply", "computed", `=${end}+${inArea}+${friction}+${elevation}+${devices}`, u.pressure, "", f.pressure);
  const which = `MATCH(MAX(${run.friction}),${run.friction},0)`;
  const worst = sh.line("Segment losing the most", "computed", `=INDEX(${run.labels},${which},1)`, "", "the first to upsize where the supply is short or marginal");
  const worstLoss = sh.line("Its friction", "computed", `=MAX(${run.friction})`, u.pressure, "", f.pressure);
  const worstVelocity = sh.line("Its velocity", "computed", `=INDEX(${run.velocity},${which},1)`, `${u.length}/s`, "", "0.0");
  sh.name("Pressure_EndSprinkler", end, "Pressure of the most remote sprinkler");
  sh.name("Pressure_AreaFriction", inArea, "Friction inside the design area, its fittings included");
  sh.name("Pressure_RunFriction", friction, "Friction in the pipe run back to the supply");
  sh.name("Pressure_Elevation", elevation, "Elevation pressure of the pipe run");
  sh.name("Pressure_Devices", devices, "Fixed losses in the pipe run (backflow preventer, meter)");
  sh.name("Run_WorstSegment", worst, "The run segment losing the most friction");
  sh.name("Run_WorstLoss", worstLoss, "Friction of the run segment losing the most");
  sh.name("Run_WorstVelocity", worstVelocity, "Water velocity in the run segment losing the most");
  return sh.done({});
}

/**
 * The demand at the water supply: the sprinkler flow plus the hose allowance, at the pressure the run needs; and the
 * flow that passes through a pump, which carries the outside hose only where hydrants are downstream of it.
 */
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
  const inside = sh.line("Inside hose allowance", "computed", `=${hazard.insideHose}`, u.flow, "hose stations inside the building", f.flow);
  const outside = sh.line("Outside hose allowance", "computed", `=MAX(0,${hazard.hose}-${inside})`, u.flow, "the total hose allowance less the inside hose: hydrants on the public main", f.flow);
  const hoseFlow = sh.line("Hose stream allowance, inside + outside", "computed", `=${inside}+${outside}`, u.flow, "", f.flow);
  const demandFlow = sh.line("Demand flow, sprinklers + hose", "computed", `=${sprinklerFlow}+${hoseFlow}`, u.flow, "", f.flow);
  const demandPressure = sh.line("Demand pressure at the supply", "computed", `=${run.pressureAfter}`, u.pressure, "from PIPERUN: the pressure after the last segment", f.pressure);
  const downstream = sh.line("Hydrants downstream of the pump", "input", s.hydrantsDownstream ? "yes" : "no", "", "yes where hydrants are fed from the pump's discharge: their hose then flows through it");
  const yes = `TRIM(${downstream})="yes"`;
  const pumpFlow = sh.line(
    "Flow through a pump",
    "computed",
    `=IF(OR(${yes},TRIM(${downstream})="no"),${sprinklerFlow}+${inside}+IF(${yes},${outside},0),"type yes or no in ${downstream}")`,
    u.flow,
    "[NFPA 20] sprinklers + inside hose, + outside hose only where hydrants are downstream",
    f.flow,
  );
  sh.name("Demand_HoseFlow", hoseFlow, "Hose stream allowance included in Demand_Flow");
  sh.name("Demand_Flow", demandFlow, "Demand flow at the supply, sprinklers plus hose");
  sh.name("Demand_Pressure", demandPressure, "Pressure the system needs at the supply");
  sh.name("Pump_Flow", pumpFlow, "Flow that passes through a pump: sprinklers, inside hose, and outside hose where hydrants are downstream");
  // the system cell of whichever section found the design area's demand
  sh.name("Design_System", area.system, "System type, for the one-page summary");
  return sh.done({ sprinklerFlow, hoseFlow, flow: demandFlow, pressure: demandPressure, pumpFlow });
}

/** Rows of the table of candidate design areas: this sheet's own and four more to type (more where a scenario has them). */
export const CANDIDATE_ROWS = 5;

/** The demand the verdict judges: the controlling candidate's. */
export interface JudgedDemandRefs {
  /** its name */
  name: string;
  flow: string;
  pressure: string;
  pumpFlow: string;
  /** the typed candidates' flows and pressures (rows 2 on), for the chart */
  othersFlow: string;
  othersPressure: string;
}

/**
 * The building's candidate design areas side by side (occupancies, storage sections, dry parts): this sheet's own
 * demand first, then the others typed from their own estimates. Each row's margin is taken on the weakest flow test at
 * its flow, and the one with the least margin controls the verdict (the first on a tie). The name Design_Candidates
 * covers the four columns the pane reads: name, demand flow, pressure at the supply, flow through a pump.
 *
 * A row's cells go through VERDICT's own checks before any arithmetic, so text, a blank beside a typed name or a
 * negative pressure shows VERDICT's message in the margin cell, and the error carries on into the verdict: a row is
 * never dropped for being wrong.
 */
export function candidatesSection(
  s: Scenario,
  row: number,
  { units: U, supply, demand }: UnitsRefs & { supply: SupplyRefs; demand: DemandRefs },
): Section<JudgedDemandRefs> {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
  const typed = s.candidates ?? [];
  const rows = Math.max(CANDIDATE_ROWS, 1 + typed.length);
  sh.heading("Design areas compared");
  sh.put(
    "A",
    "note",
    "One row per candidate design area: the first is this sheet's own; type the others' demand at the supply from their estimates. " +
      "The one with the least margin controls the verdict below.",
  );
  sh.row++;
  sh.put("A", "header", "Design area");
  sh.put("B", "header", `Demand flow, sprinklers + hose (${u.flow})`);
  sh.put("C", "header", `Pressure at the supply (${u.pressure})`);
  sh.put("D", "header", `Flow through a pump (${u.flow})`);
  sh.put("E", "header", `Weakest supply at its flow (${u.pressure})`);
  sh.put("F", "header", `Margin (${u.pressure})`);
  sh.row++;
  const first = sh.row;
  const tests = supply.tests;
  const t1 = tests[0];
  for (let i = 0; i < rows; i++) {
    const r = sh.row;
    const [A, B, C, D] = ["A", "B", "C", "D"].map((c) => `${c}${r}`);
    if (i === 0) {
      sh.put("A", "input", s.areaName || "This sheet's design area");
      sh.put("B", "computed", `=${demand.flow}`, { format: f.flow });
      sh.put("C", "computed", `=${demand.pressure}`, { format: f.pressure });
      sh.put("D", "computed", `=${demand.pumpFlow}`, { format: f.flow });
    } else {
      const c = typed[i - 1];
      sh.put("A", "input", c ? c.name : null);
      sh.put("B", "input", c ? c.flow : null, { format: f.flow });
      sh.put("C", "input", c ? c.pressure : null, { format: f.pressure });
      sh.put("D", "input", c && c.pumpFlow !== null ? c.pumpFlow : null, { format: f.flow });
    }
    // each test's supply at the row's flow, 0 where it runs dry first; a test not filled in counts for nothing (a
    // pressure no supply reaches, written out: not every formula engine reads 1E+9)
    const at = (t: FlowTestRefs) => {
      const test = [t.static, t.residual, t.testFlow];
      return `IF(${t.static}="",1000000000,IF(VALUE(${B})>=${hr("FLOWAT", "0", ...test, U)},0,${hr("SUPPLYAT", B, ...test, U)}))`;
    };
    const check = hr("VERDICT", B, C, t1.static, t1.residual, t1.testFlow, "0", U);
    const blank = `AND(${A}="",${B}="",${C}="",${D}="")`;
    const weakest = sh.put("E", "computed", `=IF(${blank},"",IF(ISTEXT(${check}),MIN(${tests.map(at).join(",")}),${check}))`, { format: f.pressure });
    sh.put("F", "computed", `=IF(${weakest}="","",${weakest}-${C})`, { format: f.pressure });
    sh.row++;
  }
  const last = sh.row - 1;
  const col = (c: string, from = first) => `${abs(`${c}${from}`)}:${abs(`${c}${last}`)}`;
  sh.name(CANDIDATES_NAME, `A${first}:D${last}`, "Candidate design areas: name, demand flow, pressure at the supply, flow through a pump");
  const which = `MATCH(MIN(${col("F")}),${col("F")},0)`;
  const pick = (c: string) => `INDEX(${col(c)},${which},1)`;
  // &"" keeps a blank name blank and a number as its text (INDEX of an empty cell gives 0)
  const name = sh.line("Controlling design area", "computed", `=${pick("A")}&""`, "", "the least margin; the first on a tie");
  const flow = sh.line("Its demand flow, sprinklers + hose", "computed", `=${pick("B")}`, u.flow, "", f.flow);
  const pressure = sh.line("Its pressure at the supply", "computed", `=${pick("C")}`, u.pressure, "", f.pressure);
  const pumpFlow = sh.line("Its flow through a pump", "computed", `=IF(${pick("D")}&""="",${flow},${typedNumber(pick("D"), u.flow)})`, u.flow, "blank in the table: its demand flow", f.flow);
  return sh.done({ name, flow, pressure, pumpFlow, othersFlow: `B${first + 1}:B${last}`, othersPressure: `C${first + 1}:C${last}` });
}

/**
 * The verdict: the flow test that governs (the lowest supply at the demand flow), the margin and VERDICT; the pump
 * (chosen or suggested), its suction check and, where the main cannot feed a pump, a suction tank's volume.
 */
export function verdictSection(
  s: Scenario,
  row: number,
  { units: U, supply, hazard, demand }: UnitsRefs & { supply: SupplyRefs; hazard: HazardRefs; demand: JudgedDemandRefs },
): Section<{ used: UsedTestRefs }> {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
  const Q = demand.flow;
  const P = demand.pressure;
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

  // Each test carried to the site, at the demand flow; 0 where that supply reaches 0 before it.
  const atDemand = supply.tests.map((t, i) => {
    const test = [t.static, t.residual, t.testFlow];
    return sh.line(
      `Supply at the demand flow, Test ${i + 1}`,
      "computed",
      `=IF(${t.static}="","",IF(${Q}>=${hr("FLOWAT", "0", ...test, U)},0,${hr("SUPPLYAT", Q, ...test, U)}))`,
      u.pressure,
      i === 0 ? "SUPPLYAT, each test carried to the site; 0 where it runs dry first" : "",
      f.pressure,
    );
  });
  const span = `${atDemand[0]}:${atDemand[atDemand.length - 1]}`;
  const which = `MATCH(MIN(${span}),${span},0)`;
  // the tests' cells side by side (labels, test flows: one row) or one above the other (SITETEST's rows)
  const column = (pick: (t: FlowTestRefs) => string) => `${pick(supply.tests[0])}:${pick(supply.tests[supply.tests.length - 1])}`;
  sh.line("Flow test used", "computed", `=INDEX(${column((t) => abs(t.label))},1,${which})`, "", "the lowest supply at the demand flow governs");
  // &"" keeps a blank description blank (INDEX of an empty cell gives 0)
  const usedWhen = sh.line("When and where tested, test used", "computed", `=INDEX(${column((t) => t.when)},1,${which})&""`);
  sh.name("Supply_When", usedWhen, "When and where the flow test used was made, for the one-page summary");
  const usedStatic = sh.line("Static pressure at the site, test used", "computed", `=INDEX(${column((t) => t.static)},${which},1)`, u.pressure, "", f.pressure);
  const usedResidual = sh.line("Residual pressure at the site, test used", "computed", `=INDEX(${column((t) => t.residual)},${which},1)`, u.pressure, "", f.pressure);
  const usedFlow = sh.line("Test flow, test used", "computed", `=INDEX(${column((t) => t.testFlow)},1,${which})`, u.flow, "", f.flow);
  sh.name("Supply_Static", usedStatic, "Static pressure of the flow test used, carried to the site");
  sh.name("Supply_Residual", usedResidual, "Residual pressure of the flow test used, carried to the site");
  sh.name("Supply_TestFlow", usedFlow, "Flow during the flow test used");
  const test = [usedStatic, usedResidual, usedFlow];

  const dryAt = sh.line("Flow where the supply reaches 0", "computed", `=${hr("FLOWAT", "0", ...test, U)}`, u.flow, "FLOWAT at 0", f.flow);
  sh.line("Supply pressure at the demand flow", "computed", `=IF(${Q}>=${dryAt},0,${hr("SUPPLYAT", Q, ...test, U)})`, u.pressure, "SUPPLYAT", f.pressure);
  const marginCell = sh.line(
    "Margin",
    "computed",
    `=IF(${Q}>=${dryAt},"none: the supply runs dry first",${hr("MARGIN", Q, P, ...test, U)})`,
    u.pressure,
    "MARGIN: supply minus demand",
    f.pressure,
  );
  sh.line("Margin, share of the demand pressure", "computed", `=IF(AND(ISNUMBER(${marginCell}),${P}>0),${marginCell}/${P},"")`, "", "", "0%");
  sh.line("Verdict", "computed", `=${hr("VERDICT", Q, P, ...test, margin, U)}`);
  const boost = sh.line(
    "Pump boost needed",
    "computed",
    `=IF(${Q}>=${dryAt},"none: the supply runs dry first",${hr("PUMPBOOST", Q, P, ...test, margin, U)})`,
    u.pressure,
    "PUMPBOOST: demand + required margin − supply",
    f.pressure,
  );

  sh.put("B", "header", `Rated flow (${u.flow})`);
  sh.put("C", "header", `Rated pressure (${u.pressure})`);
  sh.row++;
  sh.put("A", "label", "Pump you choose (optional)");
  const chosenFlow = sh.put("B", "input", s.pump ? s.pump.ratedFlow : null, { format: f.flow });
  const chosenPressure = sh.put("C", "input", s.pump ? s.pump.ratedPressure : null, { format: f.pressure });
  sh.put("D", "note", "leave blank for the suggestion below");
  sh.row++;
  sh.name("Pump_RatedFlow", chosenFlow, "Rated flow of the pump chosen");
  sh.name("Pump_RatedPressure", chosenPressure, "Rated pressure of the pump chosen");
  // a rated flow typed is a chosen pump, text included: its error shows where it is used, never "no pump"
  const chosen = `NOT(ISBLANK(${chosenFlow}))`;
  sh.put("A", "label", "Suggested pump, smallest standard rating");
  const size = sh.put(
    "B",
    "computed",
    `=IF(${chosen},"a pump is chosen",IF(ISNUMBER(${boost}),IF(${boost}>0,${hr("PUMPSIZE", demand.pumpFlow, boost, U)},"none needed"),"none: a pump alone cannot serve"))`,
    { format: f.flow, spill: { rows: 1, cols: 2, formats: [f.flow, f.pressure] } },
  );
  sh.put("D", "note", "PUMPSIZE for the flow through a pump");
  sh.row++;
  const sizeAt = parseCell(size);
  const sizePressure = cellAddress({ row: sizeAt.row, col: sizeAt.col + 1 });
  sh.put("A", "label", "Pump checked");
  const ratedFlow = sh.put("B", "computed", `=IF(${chosen},${typedNumber(chosenFlow, u.flow)},IF(ISNUMBER(${size}),${size},""))`, { format: f.flow });
  sh.put("C", "computed", `=IF(${chosen},${typedNumber(chosenPressure, u.pressure)},IF(ISNUMBER(${sizePressure}),${sizePressure},""))`, { format: f.pressure });
  sh.put("D", "note", "the pump chosen, else the suggestion");
  sh.row++;
  const pumped = `OR(${chosen},ISNUMBER(${size}))`;

  const minimum = sh.line(
    "Least pressure the main must keep",
    "input",
    s.suctionMinimum,
    u.pressure,
    "(common practice) many water purveyors want at least 20 psi left in the main while a pump draws from it",
    f.pressure,
  );
  sh.name("Suction_Minimum", minimum, "Least pressure the public main must keep while a pump draws from it");
  const suction = sh.line(
    "Pressure left in the main at 150 % of rated flow",
    "computed",
    `=IF(${pumped},${hr("PUMPSUCTION", ratedFlow, ...test, `${Q}-${demand.pumpFlow}`, U)},"no pump")`,
    u.pressure,
    "PUMPSUCTION, with the hose drawn from the main beside the pump",
    f.pressure,
  );
  const suctionShort = `AND(ISNUMBER(${suction}),ISNUMBER(${minimum}),${suction}<${minimum})`;
  sh.line(
    "Suction check",
    "computed",
    `=IF(ISNUMBER(${suction}),IF(ISNUMBER(${minimum}),IF(${suction}>=${minimum},"Enough left in the main for the pump","Below the least the main must keep: a pump alone cannot serve; a suction tank or a stronger main is needed"),"type a number in ${minimum}"),"")`,
  );
  const spare = sh.line(
    "Chosen pump: pressure to spare at the demand",
    "computed",
    `=IF(${chosen},IF(${Q}>=${dryAt},"none: the supply runs dry first",${hr("SUPPLYAT", Q, ...test, U)}+${hr("PUMPCURVE", demand.pumpFlow, chosenFlow, chosenPressure, "", "", U)}-${P}-${margin}),"")`,
    u.pressure,
    "SUPPLYAT + PUMPCURVE − demand − required margin",
    f.pressure,
  );
  sh.line(
    "Chosen pump check",
    "computed",
    `=IF(ISNUMBER(${spare}),IF(${spare}>=0,"The chosen pump meets the demand and the required margin","The chosen pump falls short of the demand and the required margin"),"")`,
  );
  const duration = hazard.duration;
  const volume = s.units === "SI" ? `${Q}*${duration}/1000` : `${Q}*${duration}`;
  sh.line(
    "Suction tank, estimated volume",
    "computed",
    `=IF(OR(${Q}>=${dryAt},${suctionShort}),${typedMinutes(duration, hazard.durationInput, volume)},"not needed")`,
    s.units === "SI" ? "m³" : "gal",
    "where the main cannot feed a pump: demand flow (sprinklers + hose) × duration",
    s.units === "SI" ? "0.0" : "#,##0",
  );
  return sh.done({ used: { static: usedStatic, residual: usedResidual, testFlow: usedFlow } });
}

/** The chart a section gives: titles and series (where it stands on the sheet is the sheet's business). */
export interface ChartRefs {
  chart: { title: string; xTitle: string; yTitle: string; series: ChartSeries[] };
}

/** The supply curve the chart draws (SUPPLYCURVE), and the chart's series: the supply against the demand points. */
export function supplyCurveSection(
  s: Scenario,
  row: number,
  { units: U, supply, demand, judged }: UnitsRefs & { supply: UsedTestRefs; demand: DemandRefs; judged: JudgedDemandRefs },
): Section<ChartRefs> {
  const u = SHEET_UNITS[s.units];
  const f = u.fmt;
  const sh = new SectionWriter(row);
  sh.heading("Supply curve for the chart");
  const chartMax = sh.line(
    "Chart flow up to",
    "computed",
    `=MAX(${CHART_TEST_FLOW_FACTOR}*${supply.testFlow},${CHART_DEMAND_FLOW_FACTOR}*MAX(${demand.flow},${judged.othersFlow}))`,
    u.flow,
    `${CHART_TEST_FLOW_FACTOR} × test flow or ${CHART_DEMAND_FLOW_FACTOR} × the largest demand flow compared, the larger`,
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
        { name: "Other design areas", x: judged.othersFlow, y: judged.othersPressure, style: "marker", marker: "circle", color: PALETTE.candidate },
      ],
    },
  });
}
