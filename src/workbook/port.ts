/**
 * The Workbook port: everything the task pane needs from a workbook, and nothing of Office.js.
 *
 * Two hosts implement it: ./excel.ts over Office.js, and the preview host over its embedded formula engine. Both
 * pass the same contract tests (test/workbook/contract.ts). The pane reads the named cells listed here, watches for
 * changes, and asks for two actions: insert an estimate sheet, make a values-only share copy.
 *
 * The port reports what a cell holds; it does not judge it. Whether text in Supply_Static is wrong, or an empty
 * Pump_RatedFlow means "no pump", is the pane's decision (src/taskpane/model.ts).
 */
import type { UnitSystem } from "../engine/units";
import type { Scenario } from "./scenario";

/** The summary's names that hold text, read as text ("OH2", "wet", a date and a hydrant). */
export const SUMMARY_TEXT_NAMES = ["Project_Site", "Project_Address", "Project_PreparedBy", "Supply_When", "Design_Hazard", "Design_System"] as const;

/** Names the one-page summary reads beside the verdict's own: the project, the flow test's date and place, the design. */
export const SUMMARY_NAMES = [...SUMMARY_TEXT_NAMES, "Design_Area"] as const;

/**
 * The named cells the pane reads. Units holds "US" or "SI", Run_WorstSegment a segment's label, and the project's,
 * the flow test's and the design's descriptions (SUMMARY_TEXT_NAMES) text; every other name holds a number in those
 * units. The pressure breakdown (Pressure_*, Run_*, Velocity_Limit) is optional: a workbook without it gets no
 * breakdown; so are the names the one-page summary alone reads (SUMMARY_NAMES): a workbook without them still gets its
 * verdict.
 */
export const INPUT_NAMES = [
  "Units",
  "Supply_Static",
  "Supply_Residual",
  "Supply_TestFlow",
  "Demand_Flow",
  "Demand_Pressure",
  "Demand_HoseFlow",
  "Required_Margin",
  "Pump_RatedFlow",
  "Pump_RatedPressure",
  "Pump_Flow",
  "Suction_Minimum",
  "Pressure_EndSprinkler",
  "Pressure_AreaFriction",
  "Pressure_RunFriction",
  "Pressure_Elevation",
  "Pressure_Devices",
  "Run_WorstSegment",
  "Run_WorstLoss",
  "Run_WorstVelocity",
  "Velocity_Limit",
  ...SUMMARY_NAMES,
] as const;

export type InputName = (typeof INPUT_NAMES)[number];

/** Names an estimate must define; the others are optional. */
export const REQUIRED_NAMES: readonly InputName[] = [
  "Supply_Static",
  "Supply_Residual",
  "Supply_TestFlow",
  "Demand_Flow",
  "Demand_Pressure",
];

/**
 * What one named cell holds.
 * - number: a numeric value
 * - text: a text value (for a numeric name: "not a number")
 * - empty: the name refers to an empty cell
 * - error: the cell shows an error; `code` is what the cell shows ("#VALUE!", "#BUSY!", "#NAME?"...), `message` the
 *   custom message where the host knows it
 * - missing: the workbook defines no such name
 * - invalid: the name exists but is not one cell or a constant (e.g. it spans several cells, or its reference is
 *   broken); `reason` says how
 * `address` (e.g. "Estimate!B10") is given where the name refers to a cell.
 */
export type Reading =
  | { kind: "number"; value: number; address?: string }
  | { kind: "text"; value: string; address?: string }
  | { kind: "empty"; address?: string }
  | { kind: "error"; code: string; message?: string; address?: string }
  | { kind: "missing" }
  | { kind: "invalid"; reason: string; address?: string };

/**
 * The table of candidate design areas (a building's occupancies, storage sections, dry parts): one row each, four
 * columns: its name, its demand flow at the supply (sprinklers + hose), the pressure it needs at the supply, and the
 * flow that passes through a pump (blank: its demand flow). The estimate sheet's first row is its own demand section;
 * the one with the least margin controls the verdict, on the sheet and in the pane alike.
 */
export const CANDIDATES_NAME = "Design_Candidates";

/** Every name the template defines and the pane reads: the one-cell names and the candidates table. */
export type WorkbookName = InputName | typeof CANDIDATES_NAME;

/** The columns of the candidates table, in order. */
export const CANDIDATE_COLUMNS = ["name", "flow", "pressure", "pumpFlow"] as const;

/**
 * What a table name holds: each row's cells, read as one-cell names are (an empty cell is "empty"); "missing" where the
 * workbook defines no such name, "invalid" where it is not a block of CANDIDATE_COLUMNS columns.
 */
export type TableReading =
  | { kind: "table"; address: string; rows: Reading[][] }
  | { kind: "missing" }
  | { kind: "invalid"; reason: string; address?: string };

/**
 * The readings of a workbook: one per input name, and the candidates table. Both hosts always read the table (a
 * workbook without it: "missing"); a reading made by hand may leave it out, which means the same.
 */
export type Readings = Record<InputName, Reading> & { [CANDIDATES_NAME]?: TableReading };

/** Why a block cannot be the candidates table, or null: it must be CANDIDATE_COLUMNS wide and 1 to 50 rows tall. */
export function candidatesShapeProblem(rows: number, cols: number, address: string): string | null {
  if (cols !== CANDIDATE_COLUMNS.length) {
    return `${CANDIDATES_NAME} refers to ${address}, ${cols} column${cols === 1 ? "" : "s"} wide; it must be ${CANDIDATE_COLUMNS.length} columns wide: name, demand flow, pressure at the supply, flow through a pump`;
  }
  if (rows < 1 || rows > MAX_CANDIDATES) return `${CANDIDATES_NAME} refers to ${address}, ${rows} rows; it may hold 1 to ${MAX_CANDIDATES} rows`;
  return null;
}

/** The most rows the candidates table may hold. */
export const MAX_CANDIDATES = 50;

/** What "New estimate sheet" did. */
export interface InsertResult {
  /** name of the new worksheet */
  sheetName: string;
  /** names that pointed elsewhere before and now point to the new sheet */
  namesMoved: WorkbookName[];
}

/** One series of a share copy's plot: its points (flow, pressure) in the sheet's units, a line or markers alone. */
export interface SharePlotSeries {
  name: string;
  points: ReadonlyArray<readonly [number, number]>;
  style: "line" | "marker";
  marker: "none" | "circle" | "square" | "diamond" | "triangle";
  /** hex colour (#RRGGBB) */
  color: string;
}

/** The pane's supply-versus-demand plot as a share copy carries it: its titles and its series, values frozen. */
export interface SharePlot {
  title: string;
  xTitle: string;
  yTitle: string;
  series: SharePlotSeries[];
}

/** What "Share copy" did, or why it refused. */
export type ShareCopyResult =
  | { ok: true; sheetName: string; sourceSheet: string }
  | { ok: false; reason: string };

/**
 * Which host a port runs in: Excel (its Name Box and Name Manager define names) or the preview (whose name box above
 * the sheet defines a new name on the selection but cannot point an existing one elsewhere: a new estimate sheet
 * defines them all). The pane's messages say what the user can do there.
 */
export type PortHost = "excel" | "preview";

/** An input cell a formula is calculated from: where it is ("Estimate!B15") and what it holds. */
export interface SourceInput {
  address: string;
  reading: Reading;
}

/** The most cells a walk back from one formula looks at (an estimate sheet holds a few hundred). */
export const SOURCE_WALK_LIMIT = 2000;

export interface WorkbookPort {
  /** the host the port runs in, for messages that say where to act */
  readonly host: PortHost;
  /** Read every input name in one go. */
  readInputs(): Promise<Readings>;
  /**
   * The input cells the cells at `addresses` ("Estimate!B112", as readings give them) are calculated from: the cells
   * each one's formula reads (its direct precedents), theirs in turn, through every formula cell (a cell a spill fills
   * counts as its anchor's formula), ending at cells of the input role (shaded as inputs), which are never looked
   * behind. Each address asked about maps to its inputs, nearest first, at most SOURCE_WALK_LIMIT cells looked at; to
   * [] where it reads no input, or where the host cannot follow precedents (Excel before ExcelApi 1.12).
   */
  inputsBehind(addresses: readonly string[]): Promise<Record<string, SourceInput[]>>;
  /**
   * Call `onChange` after any change to or recalculation of the workbook (bursts may be coalesced into one call).
   * Resolves once the host is listening; the returned function stops the calls.
   */
  subscribe(onChange: () => void): Promise<() => Promise<void>>;
  /**
   * Insert a complete estimate worksheet built from ./template.ts for the scenario (the demo scenario of those
   * units if none is given), define its named cells, activate it.
   */
  insertEstimateSheet(units: UnitSystem, scenario?: Scenario): Promise<InsertResult>;
  /**
   * Copy the estimate sheet (the sheet Supply_Static refers to, else the active sheet) to a new sheet whose cells
   * hold values only, stamped with the date and "values frozen; recalculation needs the Headroom add-in". The
   * source is never modified. Refuses, saying why, while any cell of the source shows #BUSY! or another error.
   * With the pane's plot, the copy carries it too, where the host can draw it (Excel: a chart of the plot's points,
   * written into the copy as values; the preview's grid draws no chart, and its saved share copy file carries the
   * plot as a picture instead).
   */
  makeShareCopy(plot?: SharePlot): Promise<ShareCopyResult>;
}

/** Rows a share copy puts above the copied cells: the stamp, then a blank row. */
export const SHARE_STAMP_ROWS = 2;

/** How many cells a refused share copy names by address before "and N more". */
export const SHARE_REFUSAL_LIST = 5;

/** The stamp a share copy carries, after its date. */
export const SHARE_STAMP = "values frozen; recalculation needs the Headroom add-in";

/** The stamp line of a share copy made on `date`: "Share copy of Estimate, 2026-05-04: values frozen; ...". */
export function shareStamp(sourceSheet: string, date: Date): string {
  return `Share copy of ${sourceSheet}, ${isoDate(date)}: ${SHARE_STAMP}.`;
}

/** True for the text of a share copy's stamp (its first cell): the sheet holds frozen values. */
export function isShareStamp(value: unknown): boolean {
  return typeof value === "string" && value.startsWith("Share copy of ") && value.includes(SHARE_STAMP);
}

/**
 * The refusal of a share copy while inputs still hold the demo values of a new estimate sheet; `cells` are their
 * addresses, the first SHARE_REFUSAL_LIST only, of `total`.
 */
export function demoRefusal(cells: string[], total: number): string {
  const more = total > cells.length ? ` and ${total - cells.length} more` : "";
  return (
    `No share copy made: ${cells.join(", ")}${more} still hold the demo values of a new estimate sheet; ` +
    "type your own over them (or type a value again to keep it) first, so that the copy holds no invented data."
  );
}

/** A date as YYYY-MM-DD in local time: one form for every locale. */
export function isoDate(date: Date): string {
  const p = (n: number) => String(n).padStart(2, "0");
  return `${date.getFullYear()}-${p(date.getMonth() + 1)}-${p(date.getDate())}`;
}

/**
 * The refusal of a share copy while cells show errors; `cells` are [address, shown] pairs, the first
 * SHARE_REFUSAL_LIST only, of `total`.
 */
export function shareRefusal(cells: Array<[string, string]>, total: number): string {
  const busy = cells.some(([, shown]) => shown === "#BUSY!");
  const list = cells.map(([a, shown]) => `${a} shows ${shown}`).join(", ");
  const more = total > cells.length ? ` and ${total - cells.length} more` : "";
  const why = busy
    ? "Excel is still calculating: wait until no cell shows #BUSY!, then try again."
    : "fix those cells first, so that the copy holds numbers.";
  return `No share copy made: ${list}${more}; ${why}`;
}
