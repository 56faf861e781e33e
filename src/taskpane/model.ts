/**
 * The pane's logic, free of the DOM: what the named cells say, what is wrong with them, the verdict, and the points
 * of the supply/demand picture.
 *
 * Inputs arrive in the sheet's units (Units: "US" or "SI"); they are converted to US for the engine, as the cell
 * functions do, so the pane's verdict is the very sentence VERDICT writes and its margin the number MARGIN gives.
 */
import { type Assessment, MIN_TEST_DROP_SHARE, assess, caveatSentence, chosenPumpCheck, formatFlow, formatPressure, pumpBoost, stateSentence, verdictSentence } from "../engine/decision";
import { HeadroomError } from "../engine/errors";
import {
  DEFAULT_OVERLOAD_RATIO,
  DEFAULT_SHUTOFF_RATIO,
  MIN_SUCTION_PRESSURE_PSI,
  OVERLOAD_FLOW_RATIO,
  type PumpRating,
  pumpPressure,
  pumpRating,
  pumpSuction,
} from "../engine/pump";
import { CURVE_DEMAND_FLOW_FACTOR, type CurvePoint, SUPPLY_CURVE_FLOW_FACTOR, sampleFlows } from "../engine/curve";
import { DEFAULT_VELOCITY_LIMIT } from "../engine/run";
import { type FlowTest, exhaustionFlow, supplyAt, supplyBefore } from "../engine/supply";
import { type Quantity, type UnitSystem, fromUS, toUS, unitName } from "../engine/units";
import { type QuantityRule, SIGNED, ZERO_ALLOWED, quantityArg, toNumber, unitsArg } from "../functions/args";
import { decisionArgs, demandPointArgs, pumpRatingArgs } from "../functions/common";
import {
  CANDIDATES_NAME,
  INPUT_NAMES,
  type InputName,
  type PortHost,
  REQUIRED_NAMES,
  type Reading,
  type Readings,
  SUMMARY_NAMES,
  type SourceInput,
  type TableReading,
  type WorkbookName,
} from "../workbook/port";

/** What each name should hold, for messages: a description and its quantity ("text" for a label). */
export const NAME_MEANINGS: Record<Exclude<InputName, "Units">, { what: string; quantity: Quantity | "text" }> = {
  Supply_Static: { what: "the static pressure of the flow test", quantity: "pressure" },
  Supply_Residual: { what: "the residual pressure of the flow test", quantity: "pressure" },
  Supply_TestFlow: { what: "the flow during the flow test", quantity: "flow" },
  Demand_Flow: { what: "the demand flow at the supply, sprinklers plus hose", quantity: "flow" },
  Demand_Pressure: { what: "the pressure the system needs at the supply", quantity: "pressure" },
  Demand_HoseFlow: { what: "the hose stream allowance included in Demand_Flow", quantity: "flow" },
  Required_Margin: { what: "the safety margin the supply must exceed the demand by", quantity: "pressure" },
  Pump_RatedFlow: { what: "the rated flow of the pump chosen", quantity: "flow" },
  Pump_RatedPressure: { what: "the rated pressure of the pump chosen", quantity: "pressure" },
  Pump_Flow: { what: "the flow that passes through a pump", quantity: "flow" },
  Suction_Minimum: { what: "the least pressure the public main must keep while a pump draws from it", quantity: "pressure" },
  Pressure_EndSprinkler: { what: "the pressure at the most remote sprinkler", quantity: "pressure" },
  Pressure_AreaFriction: { what: "the friction inside the design area, its fittings included", quantity: "pressure" },
  Pressure_RunFriction: { what: "the friction in the pipe run back to the supply", quantity: "pressure" },
  Pressure_Elevation: { what: "the elevation pressure of the pipe run (negative where the sprinklers are below the supply)", quantity: "pressure" },
  Pressure_Devices: { what: "the fixed losses of the run: backflow preventer, meter", quantity: "pressure" },
  Run_WorstSegment: { what: "the label of the run segment that loses the most friction", quantity: "text" },
  Run_WorstLoss: { what: "the friction loss of the run segment that loses the most", quantity: "pressure" },
  Run_WorstVelocity: { what: "the water velocity in the run segment that loses the most", quantity: "velocity" },
  Velocity_Limit: { what: "the velocity above which the estimate sheet flags a segment", quantity: "velocity" },
  // read by the one-page summary alone (src/summary/), never by the verdict
  Project_Site: { what: "the site of the project", quantity: "text" },
  Project_Address: { what: "the address of the site", quantity: "text" },
  Project_PreparedBy: { what: "who prepared the estimate", quantity: "text" },
  Supply_When: { what: "when and where the flow test used was made", quantity: "text" },
  Design_Hazard: { what: "the occupancy hazard (or what is stored)", quantity: "text" },
  Design_System: { what: "the system type: wet, dry, preaction", quantity: "text" },
  Design_Area: { what: "the design area", quantity: "area" },
};

/** The parts of the demand pressure, in the order the pane shows them; they add up to Demand_Pressure. */
export const BREAKDOWN_PARTS = [
  { id: "end-sprinkler", name: "Pressure_EndSprinkler", label: "End sprinkler" },
  { id: "area-friction", name: "Pressure_AreaFriction", label: "Friction in the design area" },
  { id: "run-friction", name: "Pressure_RunFriction", label: "Friction in the pipe run" },
  { id: "elevation", name: "Pressure_Elevation", label: "Elevation" },
  { id: "devices", name: "Pressure_Devices", label: "Devices (backflow preventer, meter)" },
] as const;


/**
 * How far the parts may be from Demand_Pressure, for the rounding of a sheet: 0.5 % of it, and at least 0.05 psi.
 * Beyond that the sheet is inconsistent. (common practice)
 */
export const BREAKDOWN_TOLERANCE = { ratio: 0.005, psi: 0.05 } as const;

export interface Problem {
  name: WorkbookName;
  message: string;
  /**
   * the cell the user must change, where known: the input found behind a named formula, else the named cell; problems
   * with the same cell are one input to fix
   */
  cell?: string;
}

/** A candidate design area as the pane judges it, US units: a row of the table of candidates. */
export interface Candidate {
  /** its name on the sheet ("Row 3" where the row has none) */
  name: string;
  /** gpm, sprinklers + hose */
  flow: number;
  /** psi at the supply */
  pressure: number;
  /** gpm through a pump: the row's own, else its demand flow */
  pumpFlow: number;
  /** psi: the supply at its flow (0 where the supply runs dry first) less its pressure */
  margin: number;
  /** true for the one with the least margin (the first on a tie) */
  controls: boolean;
  /** the cell of its flow, for messages */
  address?: string;
}

export type { PumpRating };

/** One part of the demand pressure. */
export interface BreakdownPart {
  id: (typeof BREAKDOWN_PARTS)[number]["id"];
  /** the named cell it is read from */
  name: (typeof BREAKDOWN_PARTS)[number]["name"];
  label: string;
  /** psi; the elevation may be negative */
  pressure: number;
}

/** The run segment that loses the most friction, as the estimate sheet names it. */
export interface WorstSegment {
  /** its label on the sheet */
  segment: string;
  /** psi */
  loss: number;
  /** ft/s */
  velocity: number;
  /** true where the velocity is above the limit */
  overLimit: boolean;
  /** ft/s: Velocity_Limit, else DEFAULT_VELOCITY_LIMIT of the sheet's units */
  limit: number;
  limitGiven: boolean;
}

/** Where the demand pressure goes: its parts, which add up to it, and the segment that loses the most. */
export interface Breakdown {
  parts: BreakdownPart[];
  /** null where the sheet does not name the segment, its loss and its velocity */
  worst: WorstSegment | null;
}

/** A readable estimate, US units inside; `units` is how the sheet speaks. */
export interface Estimate {
  units: UnitSystem;
  /** true when the workbook defines no Units name and US was assumed */
  unitsAssumed: boolean;
  test: FlowTest;
  /** gpm, sprinklers plus hose */
  demandFlow: number;
  /** psi */
  demandPressure: number;
  /** gpm, or null when Demand_HoseFlow is not given */
  hoseFlow: number | null;
  /** psi */
  requiredMargin: number;
  /** false when Required_Margin is not given and 0 was used (VERDICT's default) */
  requiredMarginGiven: boolean;
  /**
   * the optional names the workbook defines on a blank cell, with the cell's address: a blank is said as a blank
   * cell, not as a name to define
   */
  blankAt: Partial<Record<InputName, string>>;
  /** the pump the sheet names, if any */
  pump: PumpRating | null;
  assessment: Assessment;
  /** VERDICT's sentence, with its flow-test caveat where there is one */
  verdict: string;
  /** VERDICT's first sentence: the state, without the caveat */
  headline: string;
  /** margin as a percentage of the demand pressure, or null (no margin, or demand pressure 0) */
  marginPercent: number | null;
  /** PUMPBOOST's number where a pump is needed and the supply is not exhausted, psi */
  boost: number | null;
  /** PUMPSIZE's suggestion for the flow through a pump and the boost, where a pump is needed and none is chosen */
  pumpSize: PumpRating | null;
  /** why no pump size is given where a pump is needed */
  pumpSizeNote: string | null;
  /** gpm: the flow that passes through a pump (Pump_Flow; the demand flow where that name is not given) */
  pumpFlow: number;
  pumpFlowGiven: boolean;
  /** psi: the least pressure the main must keep while a pump draws from it (Suction_Minimum, else 20 psi) */
  suctionMinimum: number;
  suctionMinimumGiven: boolean;
  /** the suction check of the pump chosen, else of the suggestion; null where no pump is needed or chosen */
  suction: SuctionCheck | null;
  /** the chosen pump against the demand and the required margin; null where no pump is chosen */
  chosen: ChosenPump | null;
  /** the state the pane shows */
  state: PaneState;
  /** the flow-test caveat (VERDICT's second sentence), or null */
  caveat: string | null;
  /** what to do next, for a marginal, caveated or unservable verdict */
  nextSteps: string[];
  /**
   * the design areas compared (the rows of the table of candidates, blank rows left out), the controlling one marked;
   * empty where the workbook has no such table. The verdict, the pump and the suction check are the controlling one's.
   */
  candidates: Candidate[];
  /**
   * true where the demand judged is the sheet's own (Demand_Flow, Demand_Pressure): its breakdown and hose allowance
   * belong to it. False where another candidate controls.
   */
  judgesOwn: boolean;
  /** where the demand pressure goes, or null where the workbook does not name all five parts or another area controls */
  breakdown: Breakdown | null;
  /** the parts the workbook does not name (empty where there is a breakdown) */
  breakdownMissing: InputName[];
}

/**
 * What the pane shows: the supply suffices with the margin; it suffices but with less than the margin; it falls
 * short and a pump would close the gap; or a pump alone cannot serve (the main runs dry before the demand flow, or
 * falls below the least it must keep at the pump's 150 % point).
 */
export type PaneState = "enough" | "marginal" | "short" | "cannot-serve";

/** PUMPSUCTION for a pump against the least pressure the main must keep. */
export interface SuctionCheck {
  /** gpm: the rated flow of the pump checked */
  ratedFlow: number;
  /** true where the pump checked is the one the user chose */
  chosen: boolean;
  /** gpm drawn from the main: 150 % of the rated flow plus the hose drawn beside the pump */
  drawn: number;
  /** psi left in the main at 150 % of the rated flow, or null where the main runs dry first */
  pressure: number | null;
  /** PUMPSUCTION's message where the main runs dry first */
  problem: string | null;
  /** true where the pressure is below the minimum, or the main runs dry */
  below: boolean;
}

/** The chosen pump: supply at the demand flow + the pump's net pressure at the flow through it, against the demand. */
export interface ChosenPump {
  /** psi to spare (negative: short) over the demand pressure plus the required margin; null where it cannot be said */
  surplus: number | null;
  meets: boolean;
  /** why the check cannot be made (the pump's curve ends before the flow through it, the supply runs dry) */
  problem: string | null;
}

export type PaneModel =
  | { kind: "ready"; estimate: Estimate }
  | { kind: "problems"; problems: Problem[] }
  /** some inputs are still being calculated (#BUSY!) */
  | { kind: "busy"; names: WorkbookName[] };

/** The named cell each argument of the shared checks reads, for attributing a problem to its cell. */
const ARGUMENT_NAMES: Record<string, Exclude<InputName, "Units">> = {
  demand_flow: "Demand_Flow",
  demand_pressure: "Demand_Pressure",
  static_pressure: "Supply_Static",
  residual: "Supply_Residual",
  test_flow: "Supply_TestFlow",
  required_margin: "Required_Margin",
  rated_flow: "Pump_RatedFlow",
  rated_pressure: "Pump_RatedPressure",
  Demand_HoseFlow: "Demand_HoseFlow",
  Pump_Flow: "Pump_Flow",
  Suction_Minimum: "Suction_Minimum",
  Pressure_EndSprinkler: "Pressure_EndSprinkler",
  Pressure_AreaFriction: "Pressure_AreaFriction",
  Pressure_RunFriction: "Pressure_RunFriction",
  Pressure_Elevation: "Pressure_Elevation",
  Pressure_Devices: "Pressure_Devices",
  Run_WorstLoss: "Run_WorstLoss",
  Run_WorstVelocity: "Run_WorstVelocity",
  Velocity_Limit: "Velocity_Limit",
};

/** The argument of the shared checks that reads a named cell (the name itself for the pane's own Demand_HoseFlow). */
function argumentOf(name: Exclude<InputName, "Units">): string {
  return Object.keys(ARGUMENT_NAMES).find((a) => ARGUMENT_NAMES[a] === name) ?? name;
}

function where(r: Reading): string {
  return "address" in r && r.address ? ` (${r.address})` : "";
}

/**
 * Why a reading cannot be read at all (a missing name, an error in the cell, a name on several cells), or null: text
 * and empty cells go through the cell functions' own reader instead.
 */
function numberProblem(name: Exclude<InputName, "Units">, r: Reading, host: PortHost): string | null {
  const m = NAME_MEANINGS[name];
  switch (r.kind) {
    case "number":
      return null;
    case "missing":
      return host === "excel"
        ? `${name} is not defined. Select the cell that holds ${m.what}, type ${name} in the Name Box and press Enter, or use New estimate sheet.`
        : `${name} is not defined in this workbook. Select the cell that holds ${m.what}, type ${name} in the name box above the sheet and press Enter, or use New estimate sheet, which defines every name the pane reads.`;
    case "empty":
    case "text":
      return null; // read by the cell functions' own reader (toNumber)
    case "error":
      return `${name}${where(r)} shows ${r.code}${r.message ? ` ${r.message}` : ""}: fix the cells it is calculated from ${pointAt(host)}.`;
    case "invalid":
      return `${name}: ${r.reason}. ${pointAtOneCell(host)}`;
  }
}

/** What the pane has found behind the cells it asked about (WorkbookPort.inputsBehind): address → input cells. */
export type InputsBehind = Readonly<Record<string, readonly SourceInput[]>>;

/**
 * The addresses of the named cells that show an error other than #BUSY!: the cells whose inputs the pane asks for
 * (WorkbookPort.inputsBehind) before it builds its model.
 */
export function errorAddresses(readings: Readings): string[] {
  const out: string[] = [];
  for (const n of INPUT_NAMES) {
    const r = readings[n];
    if (r.kind === "error" && r.code !== "#BUSY!" && r.address && !out.includes(r.address)) out.push(r.address);
  }
  return out;
}

/**
 * The input behind a named cell's error that the user must change, or null: the nearest input cell it is calculated
 * from that holds the very text the error's message quotes (`got "1250 gpm"`), or that shows an error itself.
 */
function inputBehind(r: Extract<Reading, { kind: "error" }>, behind: InputsBehind): SourceInput | null {
  const sources = (r.address && behind[r.address]) || [];
  return (
    sources.find(
      (s) =>
        (s.reading.kind === "error" && s.reading.code !== "#BUSY!") ||
        (s.reading.kind === "text" && r.message !== undefined && s.reading.value !== "" && r.message.includes(`"${s.reading.value}"`)),
    ) ?? null
  );
}

/** "A", "A and B", "A, B and C". */
function listed(items: readonly string[]): string {
  return items.length < 2 ? items.join("") : `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
}

/**
 * Problems that have one cause are said once, so that "N inputs need attention" counts the cells to change:
 * - names that show an error because of an input they are calculated from (text typed where a number belongs, an
 *   input that shows an error itself) are said as that input, the cell the user must change, with every name it
 *   reaches;
 * - names that show one and the same error with no input found behind it (one input's text reaching both
 *   SITETEST's static and residual, in a host that cannot follow precedents) are said together.
 */
function sameCause(found: Problem[], readings: Readings, host: PortHost, behind: InputsBehind): Problem[] {
  const errorReading = (p: Problem) => {
    const r = p.name === CANDIDATES_NAME ? undefined : readings[p.name];
    return r?.kind === "error" ? r : null;
  };
  const causeOf = (p: Problem): { key: string; input: SourceInput | null } | null => {
    const r = errorReading(p);
    if (!r) return null;
    const input = inputBehind(r, behind);
    if (input) return { key: `input ${input.address}`, input };
    return r.message ? { key: `${r.code} ${r.message}`, input: null } : null;
  };
  const out: Problem[] = [];
  const groups = new Map<string, Problem[]>();
  for (const p of found) {
    const cause = causeOf(p);
    if (cause === null) out.push(p);
    else if (groups.has(cause.key)) groups.get(cause.key)!.push(p);
    else {
      const group = [p];
      groups.set(cause.key, group);
      out.push(p); // the group's place in the list: its first name's
    }
  }
  return out.map((p) => {
    const cause = causeOf(p);
    if (cause === null) return p;
    const group = groups.get(cause.key)!;
    const r = errorReading(p)!;
    if (cause.input) return { name: p.name, cell: cause.input.address, message: inputMessage(cause.input, group.map((g) => g.name as InputName), readings) };
    if (group.length < 2) return p;
    const names = group.map((g) => `${g.name}${where(readings[g.name as InputName])}`);
    return { name: p.name, ...(p.cell ? { cell: p.cell } : {}), message: `${listed(names)} show ${r.code} ${r.message}: one cause; fix the cells they are calculated from ${pointAt(host)}.` };
  });
}

/**
 * The message for an input that makes named cells show an error: the input first (the cell to change), what it
 * holds, the error's own message, then the names it reaches.
 */
function inputMessage(input: SourceInput, names: readonly InputName[], readings: Readings): string {
  const first = readings[names[0]] as Extract<Reading, { kind: "error" }>;
  const shown = names.map((n) => `${n}${where(readings[n])}`);
  const reach = `${listed(shown)} ${names.length === 1 ? "is" : "are"} calculated from it and show${names.length === 1 ? "s" : ""} ${first.code}`;
  if (input.reading.kind === "error") {
    return `${input.address} shows ${input.reading.code}${input.reading.message ? ` ${input.reading.message}` : ""}: fix that input. ${reach} until then.`;
  }
  const holds = input.reading.kind === "text" ? `holds "${input.reading.value}"` : "is not right";
  return `${input.address} ${holds}: ${first.message ?? first.code}. Change that input; ${reach} until then.`;
}

/** Where the user reads a cell's own message. */
function pointAt(host: PortHost): string {
  return host === "excel" ? "(Excel shows the message when you point at the cell)" : "(the preview shows the message when you select the cell)";
}

/** How to point a name at one cell, where the user is. */
function pointAtOneCell(host: PortHost): string {
  return host === "excel" ? "Point the name at one cell (Formulas > Name Manager)." : "The preview cannot change names: use New estimate sheet, which defines them.";
}

function isBlank(r: Reading): boolean {
  return r.kind === "missing" || r.kind === "empty" || (r.kind === "text" && r.value.trim() === "");
}

/** The Units cell read as the cell functions read their `[units]` argument (unitsArg): blank or missing is US. */
function readUnits(r: Reading, host: PortHost): { units: UnitSystem; assumed: boolean } | string {
  if (r.kind === "missing" || r.kind === "empty") return { units: "US", assumed: true };
  if (r.kind === "text" || r.kind === "number") {
    try {
      return { units: unitsArg(r.value), assumed: isBlank(r) };
    } catch (e) {
      if (!(e instanceof HeadroomError)) throw e;
      return `Units${where(r)}: ${e.messageIn("US")}`;
    }
  }
  if (r.kind === "error") return `Units${where(r)} shows ${r.code}${r.message ? ` ${r.message}` : ""}: type US or SI.`;
  return `Units: ${r.reason}. ${pointAtOneCell(host)}`;
}

/**
 * Turn the readings into an estimate, or say what is wrong. Busy cells (#BUSY!) give "busy" rather than a problem:
 * Excel is still working on them.
 */
export function buildModel(readings: Readings, host: PortHost = "excel", behind: InputsBehind = {}): PaneModel {
  const table = readings[CANDIDATES_NAME];
  /**
   * Where a row of the candidates is wrong, the sheet's verdict block (the governing test, Supply_*) shows errors
   * calculated from it: the pane points at the row, the cause, and leaves out the names that only show an error,
   * which are its consequence (an error of their own shows once the row is fixed).
   */
  const rootCauses = (found: Problem[]): Problem[] =>
    sameCause(
      found.some((p) => p.name === CANDIDATES_NAME) ? found.filter((p) => p.name === CANDIDATES_NAME || readings[p.name as InputName]?.kind !== "error") : found,
      readings,
      host,
      behind,
    );
  const busyCell = (r: Reading) => r.kind === "error" && r.code === "#BUSY!";
  const busy: WorkbookName[] = INPUT_NAMES.filter((n) => busyCell(readings[n]));
  if (table?.kind === "table" && table.rows.some((row) => row.some(busyCell))) busy.push(CANDIDATES_NAME);
  if (busy.length > 0) return { kind: "busy", names: busy };

  const problems: Problem[] = [];
  const u = readUnits(readings.Units, host);
  if (typeof u === "string") {
    problems.push({ name: "Units", message: u });
  }
  const units = typeof u === "string" ? "US" : u.units;
  const numbers = new Map<InputName, number>();
  const value = (n: Exclude<InputName, "Units">) => numbers.get(n) as number;

  // A cell that holds text or nothing is read as the cell functions read that argument (toNumber), so the pane says
  // what the sheet's cells say; a name that is missing, points at several cells or shows an error is the pane's own.
  const read = (n: Exclude<InputName, "Units">) => {
    const r = readings[n];
    if (r.kind === "number") return numbers.set(n, r.value);
    if (r.kind === "text" || r.kind === "empty") {
      try {
        numbers.set(n, toNumber(r.kind === "text" ? r.value : null, argumentOf(n)));
      } catch (e) {
        if (!(e instanceof HeadroomError)) throw e;
        problems.push({ name: n, message: `${n}${where(r)}: ${e.messageIn(units)}`, ...(r.address ? { cell: r.address } : {}) });
      }
      return;
    }
    problems.push({ name: n, message: numberProblem(n, r, host) ?? `${n} cannot be read.`, ...("address" in r && r.address ? { cell: r.address } : {}) });
  };
  for (const n of REQUIRED_NAMES as Exclude<InputName, "Units">[]) read(n);
  // every other name of the verdict and its breakdown is optional (Run_WorstSegment, text, is read on its own below;
  // the one-page summary's names are the summary's business: src/summary/)
  const summaryOnly: readonly InputName[] = SUMMARY_NAMES;
  const optional = INPUT_NAMES.filter(
    (n): n is Exclude<InputName, "Units"> => n !== "Units" && n !== "Run_WorstSegment" && !REQUIRED_NAMES.includes(n) && !summaryOnly.includes(n),
  );
  const given = new Set<InputName>();
  const blankAt: Partial<Record<InputName, string>> = {};
  for (const n of optional) {
    const r = readings[n];
    if (isBlank(r)) {
      if (r.kind !== "missing") blankAt[n] = r.address ?? n;
      continue;
    }
    read(n);
    if (numbers.has(n)) given.add(n);
  }
  const segment = readLabel(readings.Run_WorstSegment, host);
  if (segment !== null && typeof segment === "object") problems.push({ name: "Run_WorstSegment", message: segment.problem });
  // the candidates' rows, read before anything that may be calculated from them
  const rows = readCandidateRows(table, units, problems, host);
  if (problems.length > 0) return { kind: "problems", problems: rootCauses(problems) };

  // Magnitudes: read by the very argument checks the cell functions use (VERDICT, PUMPBOOST, PUMPCURVE), so that
  // where a cell on the sheet shows an error the pane shows the same message, never a verdict.
  const v = (n: Exclude<InputName, "Units">) => (given.has(n) || REQUIRED_NAMES.includes(n) ? value(n) : null);
  const check = <T>(read: () => T): T | undefined => {
    try {
      return read();
    } catch (e) {
      if (!(e instanceof HeadroomError)) throw e;
      const name = ARGUMENT_NAMES[e.argument] ?? "Demand_Flow";
      problems.push({ name, message: `${name}${where(readings[name])}: ${e.messageIn(units)}` });
      return undefined;
    }
  };
  const decision = check(() =>
    decisionArgs(v("Demand_Flow"), v("Demand_Pressure"), v("Supply_Static"), v("Supply_Residual"), v("Supply_TestFlow"), v("Required_Margin"), units),
  );
  const hoseFlow = given.has("Demand_HoseFlow") ? check(() => quantityArg(value("Demand_HoseFlow"), "Demand_HoseFlow", "flow", units, ZERO_ALLOWED)) : null;
  if (decision && hoseFlow !== undefined && hoseFlow !== null && !(hoseFlow < decision.demandFlow)) {
    problems.push({
      name: "Demand_HoseFlow",
      message: `Demand_HoseFlow${where(readings.Demand_HoseFlow)} is ${trim(value("Demand_HoseFlow"))} ${unitName("flow", units)}; it must be below Demand_Flow (${trim(value("Demand_Flow"))} ${unitName("flow", units)}).`,
    });
  }
  const pumpFlowRead = given.has("Pump_Flow") ? check(() => quantityArg(value("Pump_Flow"), "Pump_Flow", "flow", units)) : null;
  if (decision && pumpFlowRead !== undefined && pumpFlowRead !== null && pumpFlowRead > decision.demandFlow) {
    problems.push({
      name: "Pump_Flow",
      message: `Pump_Flow${where(readings.Pump_Flow)} is ${trim(value("Pump_Flow"))} ${unitName("flow", units)}; it cannot exceed Demand_Flow (${trim(value("Demand_Flow"))} ${unitName("flow", units)}).`,
    });
  }
  const suctionMinimumRead = given.has("Suction_Minimum")
    ? check(() => quantityArg(value("Suction_Minimum"), "Suction_Minimum", "pressure", units, ZERO_ALLOWED))
    : null;
  const pumpGiven = given.has("Pump_RatedFlow") || given.has("Pump_RatedPressure");
  let pump: PumpRating | null = null;
  if (pumpGiven) {
    for (const [n, other] of [
      ["Pump_RatedFlow", "Pump_RatedPressure"],
      ["Pump_RatedPressure", "Pump_RatedFlow"],
    ] as const) {
      if (!given.has(n)) {
        const unit = unitName(other === "Pump_RatedFlow" ? "flow" : "pressure", units);
        problems.push({ name: n, message: `${n} is empty while ${other} holds ${trim(value(other))} ${unit}: give both or neither.` });
      }
    }
    if (given.has("Pump_RatedFlow") && given.has("Pump_RatedPressure")) {
      const rating = check(() => pumpRatingArgs(value("Pump_RatedFlow"), value("Pump_RatedPressure"), units));
      pump = rating ?? null;
    }
  }
  const breakdownMissing = BREAKDOWN_PARTS.filter((p) => !given.has(p.name)).map((p) => p.name);
  const breakdown =
    decision && breakdownMissing.length === 0
      ? readBreakdown(decision.demandPressure, typeof segment === "string" ? segment : null)
      : null;
  const compared = decision ? judgeCandidates(rows, decision.test) : [];
  if (problems.length > 0 || !decision) return { kind: "problems", problems: rootCauses(problems) };

  const { test, requiredMargin } = decision;
  // the demand judged: the controlling candidate's where the workbook has a table of them, else the sheet's own
  const controlling = compared.find((c) => c.controls);
  const demandFlow = controlling ? controlling.flow : decision.demandFlow;
  const demandPressure = controlling ? controlling.pressure : decision.demandPressure;
  const judgesOwn = !controlling || (same(controlling.flow, decision.demandFlow) && same(controlling.pressure, decision.demandPressure));
  const assessment = assess(demandFlow, demandPressure, test, requiredMargin); // every input checked above
  const verdict = verdictSentence(assessment, units);
  const marginPercent = assessment.margin !== null && demandPressure > 0 ? (assessment.margin / demandPressure) * 100 : null;

  const pumpFlow = controlling ? controlling.pumpFlow : (pumpFlowRead ?? demandFlow);
  const suctionMinimum = suctionMinimumRead ?? MIN_SUCTION_PRESSURE_PSI;

  let boost: number | null = null;
  let pumpSize: PumpRating | null = null;
  let pumpSizeNote: string | null = null;
  if (assessment.pumpNeeded && assessment.supplyPressure !== null) {
    boost = pumpBoost(demandFlow, demandPressure, test, requiredMargin);
    if (!pump) {
      try {
        pumpSize = pumpSizeFor(pumpFlow, boost, units);
      } catch (e) {
        if (!(e instanceof HeadroomError)) throw e;
        pumpSizeNote = e.messageIn(units);
      }
    }
  }
  const checked = pump ?? pumpSize;
  const suction = checked ? suctionCheck(checked.ratedFlow, pump !== null, test, demandFlow - pumpFlow, suctionMinimum, units) : null;
  const chosen = pump ? checkChosen(pump, demandFlow, pumpFlow, demandPressure, requiredMargin, test, units) : null;
  const state: PaneState =
    assessment.state === "exhausted" || (assessment.state === "short" && suction !== null && suction.below) ? "cannot-serve" : assessment.state;
  const caveat = caveatSentence(assessment, units);

  return {
    kind: "ready",
    estimate: {
      units,
      unitsAssumed: typeof u !== "string" && u.assumed,
      test,
      demandFlow,
      demandPressure,
      hoseFlow: judgesOwn ? (hoseFlow ?? null) : null,
      requiredMargin,
      requiredMarginGiven: given.has("Required_Margin"),
      blankAt,
      pump,
      assessment,
      verdict,
      headline: stateSentence(assessment, units),
      marginPercent,
      boost,
      pumpSize,
      pumpSizeNote,
      pumpFlow,
      pumpFlowGiven: controlling ? true : given.has("Pump_Flow"),
      suctionMinimum,
      suctionMinimumGiven: given.has("Suction_Minimum"),
      suction,
      chosen,
      state,
      caveat,
      nextSteps: nextSteps(state, caveat !== null, suction, chosen, upsizeStep(state, assessment.margin, requiredMargin, boost, judgesOwn ? (breakdown?.worst ?? null) : null, units)),
      candidates: compared,
      judgesOwn,
      breakdown: judgesOwn ? (breakdown ?? null) : null,
      breakdownMissing,
    },
  };

  /**
   * The breakdown, read through the same checks as the other names (a cell out of its bounds is a problem with the
   * cell's message), or undefined where something is wrong: parts that do not add up to the demand pressure, or a
   * worst segment that loses more than the whole run, mean an inconsistent sheet, never a picture.
   */
  function readBreakdown(demandPsi: number, label: string | null): Breakdown | undefined {
    const pressure = (n: Exclude<InputName, "Units">, rule?: QuantityRule) => check(() => quantityArg(value(n), n, "pressure", units, rule));
    const parts: BreakdownPart[] = [];
    for (const p of BREAKDOWN_PARTS) {
      // a sprinkler needs a pressure; losses may be 0; the elevation may be a gain
      const rule = p.name === "Pressure_EndSprinkler" ? undefined : p.name === "Pressure_Elevation" ? SIGNED : ZERO_ALLOWED;
      const psi = pressure(p.name, rule);
      if (psi !== undefined) parts.push({ id: p.id, name: p.name, label: p.label, pressure: psi });
    }
    if (parts.length < BREAKDOWN_PARTS.length) return undefined;
    const sum = parts.reduce((a, p) => a + p.pressure, 0);
    if (Math.abs(sum - demandPsi) > Math.max(BREAKDOWN_TOLERANCE.ratio * demandPsi, BREAKDOWN_TOLERANCE.psi)) {
      const names = BREAKDOWN_PARTS.map((p) => p.name);
      const sheetSum = BREAKDOWN_PARTS.reduce((a, p) => a + value(p.name), 0);
      const unit = unitName("pressure", units);
      problems.push({
        name: "Demand_Pressure",
        message:
          `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]} add up to ${trim(sheetSum)} ${unit}, not the ${trim(value("Demand_Pressure"))} ${unit} ` +
          `of Demand_Pressure${where(readings.Demand_Pressure)}: the estimate sheet is inconsistent. Recalculate it, or point these names at the parts of that demand pressure.`,
      });
      return undefined;
    }

    if (label === null || !given.has("Run_WorstLoss") || !given.has("Run_WorstVelocity")) {
      if (given.has("Velocity_Limit")) check(() => quantityArg(value("Velocity_Limit"), "Velocity_Limit", "velocity", units));
      return { parts, worst: null };
    }
    const loss = pressure("Run_WorstLoss", ZERO_ALLOWED);
    const velocity = check(() => quantityArg(value("Run_WorstVelocity"), "Run_WorstVelocity", "velocity", units, ZERO_ALLOWED));
    const limitGiven = given.has("Velocity_Limit");
    const limit = limitGiven
      ? check(() => quantityArg(value("Velocity_Limit"), "Velocity_Limit", "velocity", units))
      : toUS("velocity", DEFAULT_VELOCITY_LIMIT[units], units);
    if (loss === undefined || velocity === undefined || limit === undefined) return undefined;
    const run = parts.find((p) => p.id === "run-friction")!.pressure;
    if (loss > run + Math.max(BREAKDOWN_TOLERANCE.ratio * run, BREAKDOWN_TOLERANCE.psi)) {
      const unit = unitName("pressure", units);
      problems.push({
        name: "Run_WorstLoss",
        message:
          `Run_WorstLoss${where(readings.Run_WorstLoss)} is ${trim(value("Run_WorstLoss"))} ${unit}, more than the ${trim(value("Pressure_RunFriction"))} ${unit} ` +
          "of Pressure_RunFriction, the friction of the whole run: the estimate sheet is inconsistent.",
      });
      return undefined;
    }
    return { parts, worst: { segment: label, loss, velocity, overLimit: velocity > limit, limit, limitGiven } };
  }
}

/** Two numbers read from the same cell through different routes (a name and the table's formula): equal to rounding. */
function same(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
}

/**
 * The table of candidate design areas read as the estimate sheet reads it: blank rows left out; each row's flow and
 * pressure through VERDICT's own checks (the sheet checks its rows with VERDICT), its flow through a pump a flow not
 * above its demand flow (blank: its demand flow). Their margins are judgeCandidates' business.
 */
function readCandidateRows(table: TableReading | undefined, units: UnitSystem, problems: Problem[], host: PortHost): Candidate[] {
  if (!table || table.kind === "missing") return [];
  if (table.kind === "invalid") {
    const fix = host === "excel" ? "Point the name at the table of candidates (Formulas > Name Manager)." : "The preview cannot change names: use New estimate sheet, which defines it.";
    problems.push({ name: CANDIDATES_NAME, message: `${CANDIDATES_NAME}: ${table.reason}. ${fix}` });
    return [];
  }
  const out: Candidate[] = [];
  table.rows.forEach((row, i) => {
    if (row.every(isBlank)) return;
    const [nameCell, flowCell, pressureCell, pumpCell] = row;
    const label = readLabel(nameCell);
    const name = typeof label === "string" ? label : `Row ${i + 1}`;
    const at = (r: Reading) => where(r);
    const say = (r: Reading, what: string) => problems.push({ name: CANDIDATES_NAME, message: `${CANDIDATES_NAME}, ${name}${at(r)}: ${what}` });
    const shown = row.find((r) => r.kind === "error" || r.kind === "invalid");
    if (shown) {
      say(shown, shown.kind === "error" ? `shows ${shown.code}${shown.message ? ` ${shown.message}` : ""}: fix the cells it is calculated from.` : "cannot be read.");
      return;
    }
    const cellValue = (r: Reading) => (r.kind === "number" || r.kind === "text" ? r.value : null);
    let flow: number, pressure: number;
    try {
      [flow, pressure] = demandPointArgs(cellValue(flowCell), cellValue(pressureCell), units);
    } catch (e) {
      if (!(e instanceof HeadroomError)) throw e;
      say(e.argument === "demand_pressure" ? pressureCell : flowCell, `${e.messageIn(units)}`);
      return;
    }
    let pumpFlow = flow;
    if (!isBlank(pumpCell)) {
      try {
        pumpFlow = quantityArg(cellValue(pumpCell), "flow through a pump", "flow", units);
      } catch (e) {
        if (!(e instanceof HeadroomError)) throw e;
        say(pumpCell, e.messageIn(units));
        return;
      }
      if (pumpFlow > flow * (1 + 1e-12)) {
        say(pumpCell, `its flow through a pump cannot exceed its demand flow (${formatFlow(flow, units)}).`);
        return;
      }
    }
    out.push({ name, flow, pressure, pumpFlow, margin: 0, controls: false, ...("address" in flowCell && flowCell.address ? { address: flowCell.address } : {}) });
  });
  return out;
}

/**
 * The candidates' margins, each the supply at its flow (0 where the supply runs dry first) less its pressure, and the
 * one that controls: the least margin, the first on a tie, as the sheet's MATCH(MIN(…)) picks.
 *
 * The sheet takes each row's supply on the weakest flow test at that row's flow; the pane has the test that governs at
 * the controlling flow (Supply_*). Both pick the same row: the controlling row's margin on the weakest test is its
 * margin on the governing test, and no other row's margin on that test is below its margin on the weakest.
 */
function judgeCandidates(rows: readonly Candidate[], test: FlowTest): Candidate[] {
  const out = rows.map((c) => ({ ...c, margin: (supplyBefore(c.flow, test) ?? 0) - c.pressure, controls: false }));
  if (out.length > 0) out.reduce((best, c) => (c.margin < best.margin ? c : best), out[0]).controls = true;
  return out;
}

/**
 * The label of the worst segment: text (trimmed) or a number as its text; null where blank; a problem where the cell
 * shows an error or the name is not one cell.
 */
function readLabel(r: Reading, host: PortHost = "excel"): string | null | { problem: string } {
  if (r.kind === "text") return r.value.trim() === "" ? null : r.value.trim();
  if (r.kind === "number") return String(r.value);
  if (r.kind === "missing" || r.kind === "empty") return null;
  return { problem: numberProblem("Run_WorstSegment", r, host) ?? "Run_WorstSegment cannot be read." };
}

/**
 * Upsizing the segment that loses the most, where the sheet names it and there is pressure to make up (a marginal
 * verdict: the required margin less the margin; pump needed: the boost). Said plainly where that segment alone loses
 * less than the pressure to make up.
 */
function upsizeStep(
  state: PaneState,
  margin: number | null,
  requiredMargin: number,
  boost: number | null,
  worst: WorstSegment | null,
  units: UnitSystem,
): string | null {
  if (!worst) return null;
  const gap = state === "marginal" && margin !== null ? requiredMargin - margin : state === "short" ? boost : null;
  if (gap === null) return null;
  const short = worst.loss < gap ? `, less than the ${formatPressure(gap, units)} to make up` : "";
  return `Upsize ${worst.segment} (loses ${formatPressure(worst.loss, units)}${short}), or budget the pump.`;
}

/** PUMPSUCTION for the pump checked, with the hose drawn beside it, against the minimum (US units). */
function suctionCheck(ratedFlow: number, chosen: boolean, test: FlowTest, otherFlow: number, minimum: number, units: UnitSystem): SuctionCheck {
  const drawn = OVERLOAD_FLOW_RATIO * ratedFlow + otherFlow;
  try {
    const pressure = pumpSuction(ratedFlow, test, otherFlow);
    return { ratedFlow, chosen, drawn, pressure, problem: null, below: pressure < minimum };
  } catch (e) {
    if (!(e instanceof HeadroomError)) throw e;
    return { ratedFlow, chosen, drawn, pressure: null, problem: e.messageIn(units), below: true };
  }
}

/**
 * The chosen pump against the demand (the engine's chosenPumpCheck, US units): the sheet's "Chosen pump: pressure to
 * spare", SUPPLYAT at the demand flow + PUMPCURVE at the flow through the pump − demand pressure − required margin.
 */
function checkChosen(
  pump: PumpRating,
  demandFlow: number,
  pumpFlow: number,
  demandPressure: number,
  requiredMargin: number,
  test: FlowTest,
  units: UnitSystem,
): ChosenPump {
  try {
    const c = chosenPumpCheck(demandFlow, pumpFlow, demandPressure, requiredMargin, test, pump);
    return { surplus: c.surplus, meets: c.meets, problem: null };
  } catch (e) {
    if (!(e instanceof HeadroomError)) throw e;
    return { surplus: null, meets: false, problem: e.messageIn(units) };
  }
}

/**
 * What to do next where the verdict is not a plain yes or no. `upsize` names the segment to upsize where the sheet
 * names it (upsizeStep).
 */
function nextSteps(state: PaneState, caveat: boolean, suction: SuctionCheck | null, chosen: ChosenPump | null, upsize: string | null): string[] {
  const steps: string[] = [];
  if (caveat) {
    const share = Math.round(MIN_TEST_DROP_SHARE * 100);
    steps.push(`Confirm the flow test: ask for one that drops the residual at least ${share} % below static or flows the full demand.`);
  }
  if (upsize) steps.push(upsize);
  else if (state === "marginal") {
    steps.push("Upsize the pipe that loses the most pressure in the run on the estimate sheet, or budget the pump.");
  }
  if (state === "cannot-serve") {
    steps.push("Budget a suction tank (the estimate sheet gives its volume) or ask the water purveyor about a stronger main.");
  } else if (suction && suction.below && state === "marginal") {
    steps.push("A pump here would draw the main below the least it must keep: a suction tank or a stronger main would be needed with it.");
  }
  if (chosen && !chosen.meets && state !== "cannot-serve") steps.push("Choose a pump with a higher rated pressure, or clear the pump to see the suggestion.");
  return steps;
}

function trim(x: number): string {
  return String(Number(x.toPrecision(6)));
}

/**
 * PUMPSIZE's rating for a demand flow and a boost, US units in and out: the engine's pumpRating, which PUMPSIZE
 * uses too (src/engine/pump.ts).
 */
export function pumpSizeFor(demandFlowGpm: number, boostPsi: number, units: UnitSystem): PumpRating {
  const r = pumpRating(demandFlowGpm, boostPsi, units);
  return { ratedFlow: r.ratedFlowGpm, ratedPressure: toUS("pressure", r.ratedPressure, units) };
}

// ─── The picture ─────────────────────────────────────────────────────────────────────────────────────────────────

/** A point of the picture in the sheet's units: flow, pressure (the engine's curve-point type). */
export type Pt = CurvePoint;

export interface DemandPoint {
  id: "sprinklers" | "total";
  label: string;
  q: number;
  p: number;
}

/** A candidate design area on the picture, sheet units. */
export interface CandidatePoint {
  name: string;
  q: number;
  p: number;
  controls: boolean;
}

export interface PlotData {
  units: UnitSystem;
  flowUnit: string;
  pressureUnit: string;
  /** axis ends, sheet units */
  qMax: number;
  pMax: number;
  /** the supply curve from the static pressure to qMax or to where it reaches 0; vertices include static and test */
  supply: Pt[];
  staticPoint: Pt;
  testPoint: Pt;
  /** flow where the supply reaches 0, when that lies on the plot */
  exhaustedAt: number | null;
  /** the supply less the required margin (the band's lower edge), or null when no margin is required */
  band: Pt[] | null;
  requiredMargin: number;
  demand: DemandPoint[];
  /**
   * every design area compared, the controlling one marked, where there are two or more (empty for one demand); the
   * controlling one is also the "total" demand point, named for it
   */
  candidates: CandidatePoint[];
  /** supply pressure at the total demand flow, or null where the supply is exhausted there */
  supplyAtDemand: number | null;
  /** the supply with the pump's net pressure added, or null without a pump */
  pump: Pt[] | null;
  pumpLabel: string | null;
}

/** Points along the curves: enough for a smooth line at any pane width. */
export const CURVE_SAMPLES = 48;
/** The plot runs to the larger of these multiples of the test flow and of the demand flow, as the sheet's chart. */
export const PLOT_TEST_FLOW_FACTOR = SUPPLY_CURVE_FLOW_FACTOR;
export const PLOT_DEMAND_FLOW_FACTOR = CURVE_DEMAND_FLOW_FACTOR;
/** Headroom above the highest point. */
export const PLOT_PRESSURE_FACTOR = 1.1;

/** The picture of an estimate, in the sheet's units. `niceMax` rounds an axis end (the plot's scale does it). */
export function plotData(e: Estimate, niceMax: (v: number) => number = (v) => v): PlotData {
  const u = e.units;
  const f = (gpm: number) => fromUS("flow", gpm, u);
  const p = (psi: number) => fromUS("pressure", psi, u);
  const qe = exhaustionFlow(e.test);
  // the pump drawn: the one chosen, else the suggestion; along the flow at the supply, the hose drawn beside the
  // pump (demand flow − flow through the pump) does not pass through it
  const shown = e.pump ?? e.pumpSize;
  const beside = e.demandFlow - e.pumpFlow;
  const pumpReach = shown ? beside + OVERLOAD_FLOW_RATIO * shown.ratedFlow : 0;
  const compared = e.candidates.length >= 2 ? e.candidates : [];
  const largestFlow = Math.max(e.demandFlow, ...compared.map((c) => c.flow));
  const qMaxUS = Math.max(PLOT_TEST_FLOW_FACTOR * e.test.testFlow, PLOT_DEMAND_FLOW_FACTOR * largestFlow, shown ? Math.min(pumpReach, qe) : 0);
  const qMax = niceMax(f(qMaxUS));
  const qEndUS = Math.min(qe, toUS("flow", qMax, u));

  const supplyP = (q: number) => (q >= qe ? 0 : supplyAt(q, e.test));
  const flows = sampleFlows(qEndUS, CURVE_SAMPLES, [e.test.testFlow]);
  const supply: Pt[] = flows.map((q) => [f(q), p(supplyP(q))]);

  let band: Pt[] | null = null;
  if (e.requiredMargin > 0) {
    band = flows.map((q) => [f(q), p(Math.max(0, supplyP(q) - e.requiredMargin))]);
  }

  let pump: Pt[] | null = null;
  let pumpLabel: string | null = null;
  if (shown) {
    const { ratedFlow, ratedPressure } = shown;
    const end = Math.min(pumpReach, qe, toUS("flow", qMax, u));
    pump = sampleFlows(end, CURVE_SAMPLES, [Math.min(beside + ratedFlow, end), Math.min(e.demandFlow, end)]).map((q) => [
      f(q),
      p(supplyP(q) + pumpPressure(Math.max(0, q - beside), ratedFlow, ratedPressure, DEFAULT_SHUTOFF_RATIO, DEFAULT_OVERLOAD_RATIO)),
    ]);
    pumpLabel = `Supply + ${e.pump ? "chosen" : "suggested"} pump ${formatFlow(ratedFlow, u)} at ${formatPressure(ratedPressure, u)}`;
  }

  const demand: DemandPoint[] = [];
  const controlling = compared.find((c) => c.controls);
  if (controlling) {
    demand.push({ id: "total", label: controlling.name, q: f(e.demandFlow), p: p(e.demandPressure) });
  } else if (e.hoseFlow !== null && e.hoseFlow > 0) {
    demand.push({ id: "sprinklers", label: "Sprinklers", q: f(e.demandFlow - e.hoseFlow), p: p(e.demandPressure) });
    demand.push({ id: "total", label: "+ hose", q: f(e.demandFlow), p: p(e.demandPressure) });
  } else {
    demand.push({ id: "total", label: "Demand", q: f(e.demandFlow), p: p(e.demandPressure) });
  }

  const highest = Math.max(e.test.static, e.demandPressure, ...compared.map((c) => c.pressure), ...(pump ?? []).map((pt) => toUS("pressure", pt[1], u)));
  const pMax = niceMax(p(highest * PLOT_PRESSURE_FACTOR));

  return {
    units: u,
    flowUnit: unitName("flow", u),
    pressureUnit: unitName("pressure", u),
    qMax,
    pMax,
    supply,
    staticPoint: [0, p(e.test.static)],
    testPoint: [f(e.test.testFlow), p(e.test.residual)],
    exhaustedAt: qe <= toUS("flow", qMax, u) ? f(qe) : null,
    band,
    requiredMargin: p(e.requiredMargin),
    demand,
    candidates: compared.map((c) => ({ name: c.name, q: f(c.flow), p: p(c.pressure), controls: c.controls })),
    supplyAtDemand: e.assessment.supplyPressure === null ? null : p(e.assessment.supplyPressure),
    pump,
    pumpLabel,
  };
}
