/**
 * Internal diameters of the pipe a sprinkler or underground system is built from, by nominal size and schedule.
 *
 * Pure data and look-ups, US units (inches). A nominal size is the trade designation as a number of inches
 * (NPS 2-1/2 → 2.5); it is never a diameter. The cell layer (src/functions/nominal.ts) turns what users type
 * ("2-1/2", "2½", DN 65) into that number; this module knows nothing of cell values.
 *
 * Every value carries its source mark beside it, as docs/references.md lists the sources and marks.
 */
import { fail, n, q } from "./errors";

/** Schedule codes: steel Schedule 10 and 40, CPVC SDR 13.5, copper tube Types K/L/M, PVC C900 DR14 and DR18. */
export type Schedule = "10" | "40" | "CPVC" | "K" | "L" | "M" | "DR14" | "DR18";

/** Every schedule code, in the order the vocabulary lists them. */
export const SCHEDULE_CODES: readonly Schedule[] = ["10", "40", "CPVC", "K", "L", "M", "DR14", "DR18"];

/** One row of a schedule: nominal size (in) and its internal diameter (in). */
export interface PipeSize {
  /** nominal size as a number of inches, e.g. 2.5 for NPS 2-1/2 */
  readonly nominal: number;
  /** the trade's written form, e.g. "2-1/2" */
  readonly label: string;
  /** the metric designator DN of the same size, e.g. 65 */
  readonly dn: number;
  /** internal diameter, in */
  readonly id: number;
}

/**
 * Metric designators DN beside each NPS, as the steel pipe dimension table lists them.
 * [ASME B36.10M] DN designators (from memory)
 */
const DN_OF_NPS: ReadonlyArray<readonly [nps: number, dn: number]> = [
  [0.75, 20], // [ASME B36.10M] (from memory)
  [1, 25], // [ASME B36.10M] (from memory)
  [1.25, 32], // [ASME B36.10M] (from memory)
  [1.5, 40], // [ASME B36.10M] (from memory)
  [2, 50], // [ASME B36.10M] (from memory)
  [2.5, 65], // [ASME B36.10M] (from memory)
  [3, 80], // [ASME B36.10M] (from memory)
  [3.5, 90], // [ASME B36.10M] (from memory)
  [4, 100], // [ASME B36.10M] (from memory)
  [5, 125], // [ASME B36.10M] (from memory)
  [6, 150], // [ASME B36.10M] (from memory)
  [8, 200], // [ASME B36.10M] (from memory)
  [10, 250], // [ASME B36.10M] (from memory)
  [12, 300], // [ASME B36.10M] (from memory)
];

/** Steel pipe, Schedule 10, internal diameter (in). [ASME B36.10M]; confirmed by python3-fluids in test/engine/pipes.fluids.test.ts. */
const SCHEDULE_10: ReadonlyArray<readonly [nps: number, id: number]> = [
  [0.75, 0.884], // [ASME B36.10M]
  [1, 1.097], // [ASME B36.10M]
  [1.25, 1.442], // [ASME B36.10M]
  [1.5, 1.682], // [ASME B36.10M]
  [2, 2.157], // [ASME B36.10M]
  [2.5, 2.635], // [ASME B36.10M]
  [3, 3.26], // [ASME B36.10M]
  [3.5, 3.76], // [ASME B36.10M]
  [4, 4.26], // [ASME B36.10M]
  [5, 5.295], // [ASME B36.10M]
  [6, 6.357], // [ASME B36.10M]
  [8, 8.329], // [ASME B36.10M]
  [10, 10.42], // [ASME B36.10M]
  [12, 12.39], // [ASME B36.10M]
];

/** Steel pipe, Schedule 40, internal diameter (in). [ASME B36.10M]; confirmed by python3-fluids in test/engine/pipes.fluids.test.ts. */
const SCHEDULE_40: ReadonlyArray<readonly [nps: number, id: number]> = [
  [0.75, 0.824], // [ASME B36.10M]
  [1, 1.049], // [ASME B36.10M]
  [1.25, 1.38], // [ASME B36.10M]
  [1.5, 1.61], // [ASME B36.10M]
  [2, 2.067], // [ASME B36.10M]
  [2.5, 2.469], // [ASME B36.10M]
  [3, 3.068], // [ASME B36.10M]
  [3.5, 3.548], // [ASME B36.10M]
  [4, 4.026], // [ASME B36.10M]
  [5, 5.047], // [ASME B36.10M]
  [6, 6.065], // [ASME B36.10M]
  [8, 7.981], // [ASME B36.10M]
  [10, 10.02], // [ASME B36.10M]
  [12, 11.938], // [ASME B36.10M]
];

/** CPVC sprinkler pipe, SDR 13.5, average internal diameter (in). [ASTM F442] (from memory) */
const CPVC_SDR_13_5: ReadonlyArray<readonly [nps: number, id: number]> = [
  [0.75, 0.874], // [ASTM F442] (from memory)
  [1, 1.101], // [ASTM F442] (from memory)
  [1.25, 1.394], // [ASTM F442] (from memory)
  [1.5, 1.598], // [ASTM F442] (from memory)
  [2, 2.003], // [ASTM F442] (from memory)
  [2.5, 2.423], // [ASTM F442] (from memory)
  [3, 2.952], // [ASTM F442] (from memory)
];

/** Copper tube Type K, internal diameter (in). [ASTM B88] (from memory) */
const COPPER_K: ReadonlyArray<readonly [nps: number, id: number]> = [
  [0.75, 0.745], // [ASTM B88] (from memory)
  [1, 0.995], // [ASTM B88] (from memory)
  [1.25, 1.245], // [ASTM B88] (from memory)
  [1.5, 1.481], // [ASTM B88] (from memory)
  [2, 1.959], // [ASTM B88] (from memory)
  [2.5, 2.435], // [ASTM B88] (from memory)
  [3, 2.907], // [ASTM B88] (from memory)
  [4, 3.857], // [ASTM B88] (from memory)
];

/** Copper tube Type L, internal diameter (in). [ASTM B88] (from memory) */
const COPPER_L: ReadonlyArray<readonly [nps: number, id: number]> = [
  [0.75, 0.785], // [ASTM B88] (from memory)
  [1, 1.025], // [ASTM B88] (from memory)
  [1.25, 1.265], // [ASTM B88] (from memory)
  [1.5, 1.505], // [ASTM B88] (from memory)
  [2, 1.985], // [ASTM B88] (from memory)
  [2.5, 2.465], // [ASTM B88] (from memory)
  [3, 2.945], // [ASTM B88] (from memory)
  [4, 3.905], // [ASTM B88] (from memory)
];

/** Copper tube Type M, internal diameter (in). [ASTM B88] (from memory) */
const COPPER_M: ReadonlyArray<readonly [nps: number, id: number]> = [
  [0.75, 0.811], // [ASTM B88] (from memory)
  [1, 1.055], // [ASTM B88] (from memory)
  [1.25, 1.291], // [ASTM B88] (from memory)
  [1.5, 1.527], // [ASTM B88] (from memory)
  [2, 2.009], // [ASTM B88] (from memory)
  [2.5, 2.495], // [ASTM B88] (from memory)
  [3, 2.981], // [ASTM B88] (from memory)
  [4, 3.935], // [ASTM B88] (from memory)
];

/**
 * PVC pressure pipe for underground mains: cast-iron outside diameters (in). [AWWA C900] (from memory)
 * The internal diameters of DR14 and DR18 are derived from these below (c900InternalDiameter).
 */
const C900_OUTSIDE_DIAMETER: ReadonlyArray<readonly [nps: number, od: number]> = [
  [4, 4.8], // [AWWA C900] (from memory)
  [6, 6.9], // [AWWA C900] (from memory)
  [8, 9.05], // [AWWA C900] (from memory)
  [10, 11.1], // [AWWA C900] (from memory)
  [12, 13.2], // [AWWA C900] (from memory)
];

/**
 * Internal diameter of C900 PVC pipe from its outside diameter and dimension ratio.
 *
 *   ID = OD × (1 − 2 / DR)
 *
 * DR = OD / t_min, so the wall is t = OD / DR and ID = OD − 2t: this is the minimum-wall derivation (the real average
 * wall is a little thicker, so the real ID is a little smaller, and this ID errs on the large side by a few
 * thousandths of an inch). 6 in DR14: 6.90 × (1 − 2/14) = 6.90 × 12/14 = 5.9143 in.
 *
 * @param outsideDiameter OD, the outside diameter, in (> 0)
 * @param dimensionRatio DR, the dimension ratio, dimensionless (> 2)
 * @returns ID, the internal diameter, in
 * @see [AWWA C900] dimension ratio definition, OD (from memory)
 * @example
 * c900InternalDiameter(6.9, 14) // ≈ 5.9143 in
 */
export function c900InternalDiameter(outsideDiameter: number, dimensionRatio: number): number {
  if (!(outsideDiameter > 0)) fail("outside_diameter", q("diameter", outsideDiameter), "must be greater than 0");
  if (!(dimensionRatio > 2)) fail("dimension_ratio", n(dimensionRatio), "must be greater than 2");
  return outsideDiameter * (1 - 2 / dimensionRatio);
}

/**
 * The trade's written form of a nominal size: quarters as fractions, after a hyphen.
 *
 * @param nominal the nominal size, in (NPS)
 * @returns the written form
 * @see (common practice) the trade's written form of NPS
 * @example
 * nominalLabel(0.75) // → "3/4"
 * nominalLabel(2.5) // → "2-1/2"
 * nominalLabel(4) // → "4"
 */
export function nominalLabel(nominal: number): string {
  const whole = Math.floor(nominal);
  const part = nominal - whole;
  const fractions: ReadonlyArray<readonly [number, string]> = [
    [0.25, "1/4"],
    [0.5, "1/2"],
    [0.75, "3/4"],
  ];
  if (part === 0) return String(whole);
  const f = fractions.find(([v]) => Math.abs(v - part) < 1e-9);
  if (!f) return String(nominal);
  return whole === 0 ? f[1] : `${whole}-${f[1]}`;
}

/**
 * The metric designator DN of an NPS, or undefined when the size has none in the table.
 *
 * @param nominal the nominal size, in (NPS)
 * @returns DN, a designator (nominally mm), or undefined
 * @see [ASME B36.10M] DN designators (from memory)
 * @example
 * dnOfNominal(2.5) // → 65
 * dnOfNominal(7) // → undefined
 */
export function dnOfNominal(nominal: number): number | undefined {
  return DN_OF_NPS.find(([nps]) => nps === nominal)?.[1];
}

/**
 * The NPS of a metric designator DN, or undefined for a DN the table does not list.
 *
 * @param dn the metric designator (nominally mm)
 * @returns the nominal size, in (NPS), or undefined
 * @see [ASME B36.10M] DN designators (from memory)
 * @example
 * nominalOfDn(65) // → 2.5 in
 */
export function nominalOfDn(dn: number): number | undefined {
  return DN_OF_NPS.find(([, d]) => d === dn)?.[0];
}

function rows(table: ReadonlyArray<readonly [number, number]>): readonly PipeSize[] {
  return table.map(([nominal, id]) => {
    const dn = dnOfNominal(nominal);
    if (dn === undefined) throw new Error(`pipe table: NPS ${nominal} has no DN`);
    return Object.freeze({ nominal, label: nominalLabel(nominal), dn, id });
  });
}

/** What each schedule is called and where its numbers come from. */
export interface ScheduleInfo {
  readonly code: Schedule;
  /** the name a message or a label shows, e.g. "Schedule 40 steel" */
  readonly name: string;
  /** the source mark of its values */
  readonly source: string;
  /** the sizes in ascending order with their internal diameters */
  readonly sizes: readonly PipeSize[];
}

const SCHEDULE_TABLE: Readonly<Record<Schedule, ScheduleInfo>> = {
  "10": { code: "10", name: "Schedule 10 steel", source: "[ASME B36.10M]", sizes: rows(SCHEDULE_10) },
  "40": { code: "40", name: "Schedule 40 steel", source: "[ASME B36.10M]", sizes: rows(SCHEDULE_40) },
  CPVC: { code: "CPVC", name: "CPVC SDR 13.5", source: "[ASTM F442] (from memory)", sizes: rows(CPVC_SDR_13_5) },
  K: { code: "K", name: "copper tube Type K", source: "[ASTM B88] (from memory)", sizes: rows(COPPER_K) },
  L: { code: "L", name: "copper tube Type L", source: "[ASTM B88] (from memory)", sizes: rows(COPPER_L) },
  M: { code: "M", name: "copper tube Type M", source: "[ASTM B88] (from memory)", sizes: rows(COPPER_M) },
  DR14: {
    code: "DR14",
    name: "PVC C900 DR14",
    source: "[AWWA C900] (from memory), ID = OD × (1 − 2/14)",
    sizes: rows(C900_OUTSIDE_DIAMETER.map(([nps, od]) => [nps, c900InternalDiameter(od, 14)] as const)),
  },
  DR18: {
    code: "DR18",
    name: "PVC C900 DR18",
    source: "[AWWA C900] (from memory), ID = OD × (1 − 2/18)",
    sizes: rows(C900_OUTSIDE_DIAMETER.map(([nps, od]) => [nps, c900InternalDiameter(od, 18)] as const)),
  },
};

/**
 * Name, source and sizes of a schedule.
 *
 * @param schedule the schedule code: "10", "40", "CPVC", "K", "L", "M", "DR14" or "DR18"
 * @returns the schedule's name, the source of its values and its sizes (internal diameters in in)
 * @see [ASME B36.10M] steel; [ASTM F442] CPVC, [ASTM B88] copper, [AWWA C900] PVC (each from memory)
 * @example
 * scheduleInfo("40").name // → "Schedule 40 steel"
 * scheduleInfo("K").source // → "[ASTM B88] (from memory)"
 */
export function scheduleInfo(schedule: Schedule): ScheduleInfo {
  const info = SCHEDULE_TABLE[schedule];
  if (!info) fail("schedule", { cell: schedule }, `must be one of ${SCHEDULE_CODES.map((c) => `"${c}"`).join(", ")}`);
  return info;
}

/**
 * The nominal sizes of a schedule in ascending order, each with its label, DN and internal diameter.
 *
 * @param schedule the schedule code: "10", "40", "CPVC", "K", "L", "M", "DR14" or "DR18"
 * @returns the sizes: nominal in (NPS), label, DN, internal diameter in
 * @see [ASME B36.10M] steel; [ASTM F442] CPVC, [ASTM B88] copper, [AWWA C900] PVC (each from memory)
 * @example
 * scheduleSizes("CPVC")[0] // → { nominal: 0.75, label: "3/4", dn: 20, id: 0.874 }
 */
export function scheduleSizes(schedule: Schedule): readonly PipeSize[] {
  return scheduleInfo(schedule).sizes;
}

/**
 * The row of a nominal size in a schedule, or undefined when the schedule does not have that size.
 *
 * @param nominal the nominal size, in (NPS)
 * @param schedule the schedule code: "10", "40", "CPVC", "K", "L", "M", "DR14" or "DR18"
 * @returns the row: nominal in (NPS), label, DN, internal diameter in; or undefined
 * @see [ASME B36.10M] steel; [ASTM F442] CPVC, [ASTM B88] copper, [AWWA C900] PVC (each from memory)
 * @example
 * findPipeSize(2.5, "40") // → { nominal: 2.5, label: "2-1/2", dn: 65, id: 2.469 }
 * findPipeSize(3.5, "CPVC") // → undefined
 */
export function findPipeSize(nominal: number, schedule: Schedule): PipeSize | undefined {
  return scheduleSizes(schedule).find((s) => Math.abs(s.nominal - nominal) < 1e-9);
}

/**
 * The nominal sizes of a schedule as the trade writes them, for messages: "3/4, 1, 1-1/4, …" (or DN when `dn`).
 *
 * @param schedule the schedule code: "10", "40", "CPVC", "K", "L", "M", "DR14" or "DR18"
 * @param dn list the metric designators instead
 * @returns the sizes, separated by commas
 * @example
 * listSizes("CPVC") // → "3/4, 1, 1-1/4, 1-1/2, 2, 2-1/2, 3"
 * listSizes("DR14", true) // → "100, 150, 200, 250, 300"
 */
export function listSizes(schedule: Schedule, dn = false): string {
  return scheduleSizes(schedule)
    .map((s) => (dn ? String(s.dn) : s.label))
    .join(", ");
}

/**
 * Internal diameter of a pipe of a nominal size in a schedule, by table look-up.
 *
 * C900 DR14 and DR18 are derived: ID = OD × (1 − 2/DR), see c900InternalDiameter. A size the schedule does not have
 * is an error listing the sizes it has.
 *
 * @param nominal the nominal size, in (NPS)
 * @param schedule the schedule code: "10", "40", "CPVC", "K", "L", "M", "DR14" or "DR18"
 * @returns the internal diameter, in
 * @see [ASME B36.10M] steel; [ASTM F442] CPVC, [ASTM B88] copper, [AWWA C900] PVC (each from memory)
 * @example
 * internalDiameter(2.5, "10") // → 2.635 in
 * internalDiameter(6, "DR14") // ≈ 5.9143 in
 * internalDiameter(3.5, "CPVC")
 * // throws "nominal: got 3.5 in; CPVC SDR 13.5 comes in 3/4, 1, 1-1/4, 1-1/2, 2, 2-1/2, 3 (in)"
 */
export function internalDiameter(nominal: number, schedule: Schedule): number {
  const row = findPipeSize(nominal, schedule);
  if (!row) {
    fail("nominal", n(nominal, "in"), `${scheduleInfo(schedule).name} comes in ${listSizes(schedule)} (in)`);
  }
  return row.id;
}
