/**
 * Equivalent pipe length of fittings and valves, with the adjustments for a C factor other than 120 and for pipe
 * other than Schedule 40 steel.
 *
 * Pure data and arithmetic, US units (nominal size in inches, lengths in feet). The fitting codes are the
 * abbreviations of the standard's hydraulic calculation form; plain-word aliases ("elbow", "gate", ...) and lists
 * ("2E T GV") are read in the cell layer (src/functions/fittingList.ts).
 */
import { fail, n, notInTable } from "./errors";
import { HW_DIAMETER_EXPONENT, HW_FLOW_EXPONENT } from "./friction";
import { type Schedule, findPipeSize, internalDiameter, listSizes, nominalLabel, scheduleInfo } from "./pipes";

/** Fitting codes: 45° elbow, 90° standard elbow, 90° long-turn elbow, tee or cross (flow turned 90°), butterfly, gate and swing check valves. */
export type Fitting = "EE" | "E" | "LtE" | "T" | "BV" | "GV" | "CV";

/** Every fitting code, in the table's order. */
export const FITTING_CODES: readonly Fitting[] = ["EE", "E", "LtE", "T", "BV", "GV", "CV"];

/**
 * What each code stands for, as the table names it.
 * @see [NFPA 13] equivalent Schedule 40 steel pipe length chart
 */
export const FITTING_NAMES: Readonly<Record<Fitting, string>> = {
  EE: "45° elbow",
  E: "90° standard elbow",
  LtE: "90° long-turn elbow",
  T: "tee or cross (flow turned 90°)",
  BV: "butterfly valve",
  GV: "gate valve",
  CV: "swing check valve",
};

/**
 * The nominal sizes of the table's columns, in (NPS).
 * @see [NFPA 13] equivalent Schedule 40 steel pipe length chart (from memory)
 */
export const FITTING_TABLE_SIZES: readonly number[] = [0.75, 1, 1.25, 1.5, 2, 2.5, 3, 3.5, 4, 5, 6, 8, 10, 12];

/**
 * Equivalent length in ft of Schedule 40 steel pipe at C = 120, one value per column of FITTING_TABLE_SIZES;
 * null where the table gives no value ("–"): that is #N/A, never 0.
 * [NFPA 13] equivalent Schedule 40 steel pipe length chart (from memory)
 */
const EQUIVALENT_LENGTH_FT: Readonly<Record<Fitting, ReadonlyArray<number | null>>> = {
  //    ¾     1     1¼    1½    2   2½  3   3½    4   5   6   8   10  12
  EE: [1, 1, 1, 2, 2, 3, 3, 3, 4, 5, 7, 9, 11, 13], // [NFPA 13] (from memory)
  E: [2, 2, 3, 4, 5, 6, 7, 8, 10, 12, 14, 18, 22, 27], // [NFPA 13] (from memory)
  LtE: [1, 2, 2, 2, 3, 4, 5, 5, 6, 8, 9, 13, 16, 18], // [NFPA 13] (from memory)
  T: [4, 5, 6, 8, 10, 12, 15, 17, 20, 25, 30, 35, 50, 60], // [NFPA 13] (from memory; ¾ in: two recollections give 4)
  BV: [null, null, null, null, 6, 7, 10, null, 12, 9, 10, 12, 19, 21], // [NFPA 13] (from memory)
  GV: [null, null, null, null, 1, 1, 1, 1, 2, 2, 3, 4, 5, 6], // [NFPA 13] (from memory)
  CV: [null, 5, 7, 9, 11, 14, 16, 19, 22, 27, 32, 45, 55, 65], // [NFPA 13] (from memory)
};

/**
 * The C factor the table is written for, dimensionless.
 * @see [NFPA 13] equivalent Schedule 40 steel pipe length chart
 */
export const TABLE_C_FACTOR = 120;

/**
 * The nominal sizes at which the table has a value for a fitting.
 *
 * @param fitting the fitting code: "EE", "E", "LtE", "T", "BV", "GV" or "CV"
 * @returns the nominal sizes, in (NPS), ascending
 * @see [NFPA 13] equivalent Schedule 40 steel pipe length chart (from memory)
 * @example
 * fittingSizes("GV") // → [2, 2.5, 3, 3.5, 4, 5, 6, 8, 10, 12] in
 */
export function fittingSizes(fitting: Fitting): number[] {
  const row = EQUIVALENT_LENGTH_FT[fitting];
  return FITTING_TABLE_SIZES.filter((_, i) => row[i] !== null);
}

/**
 * Equivalent length straight from the table: ft of Schedule 40 steel pipe at C = 120.
 *
 * A size outside the table's columns is #VALUE! listing the columns; a gap ("–") is #N/A naming the fitting and the
 * sizes it has.
 *
 * @param fitting the fitting code: "EE", "E", "LtE", "T", "BV", "GV" or "CV"
 * @param nominal the nominal size, in (NPS)
 * @returns the equivalent length, ft
 * @see [NFPA 13] equivalent Schedule 40 steel pipe length chart (from memory)
 * @example
 * tableLength("E", 2) // → 5 ft
 */
export function tableLength(fitting: Fitting, nominal: number): number {
  const row = EQUIVALENT_LENGTH_FT[fitting];
  if (!row) fail("fitting", { cell: fitting }, `must be one of ${FITTING_CODES.join(", ")}`);
  const i = FITTING_TABLE_SIZES.findIndex((s) => Math.abs(s - nominal) < 1e-9);
  if (i < 0) fail("nominal", n(nominal, "in"), `the equivalent length table covers ${FITTING_TABLE_SIZES.map(nominalLabel).join(", ")} (in)`);
  const length = row[i];
  if (length === null) {
    notInTable(
      "nominal",
      n(nominal, "in"),
      `the equivalent length table has no ${FITTING_NAMES[fitting]} (${fitting}) at this size, only at ${fittingSizes(fitting).map(nominalLabel).join(", ")} in`,
    );
  }
  return length;
}

/**
 * Multiplier of a table length for a C factor other than 120.
 *
 *   m = (C / 120)^1.85
 *
 * The standard's adjustment table rounds these to C 100 → 0.713, 130 → 1.16, 140 → 1.33, 150 → 1.51.
 * C 150: (150 / 120)^1.85 = 1.25^1.85 = 1.5111; C 100: (100 / 120)^1.85 = 0.83333^1.85 = 0.7137.
 *
 * @param cFactor C, the Hazen-Williams C of the pipe, dimensionless (> 0)
 * @returns m, dimensionless
 * @see [NFPA 13] equivalent length adjustment table for C
 * @example
 * cFactorMultiplier(150) // ≈ 1.5111
 * cFactorMultiplier(100) // ≈ 0.7137 (the table writes 0.713)
 */
export function cFactorMultiplier(cFactor: number): number {
  if (!(cFactor > 0) || !Number.isFinite(cFactor)) fail("c_factor", n(cFactor), "must be greater than 0");
  return Math.pow(cFactor / TABLE_C_FACTOR, HW_FLOW_EXPONENT);
}

/**
 * Multiplier of a table length for pipe other than Schedule 40 steel of the same nominal size.
 *
 *   m = (d_actual / d_sch40)^4.87
 *
 * d from the schedule tables of ./pipes. 2 in Schedule 10: (2.157 / 2.067)^4.87 = 1.04354^4.87 = 1.2307.
 *
 * @param nominal the nominal size, in (NPS)
 * @param schedule the schedule code of the pipe: "10", "40", "CPVC", "K", "L", "M", "DR14" or "DR18"
 * @returns m, dimensionless
 * @see [NFPA 13] note to the equivalent length table; internal diameters [ASME B36.10M] and the other schedules'
 *   sources
 * @example
 * diameterMultiplier(2, "10") // ≈ 1.2307
 * diameterMultiplier(2, "40") // → 1
 */
export function diameterMultiplier(nominal: number, schedule: Schedule): number {
  const actual = internalDiameter(nominal, schedule);
  const sch40 = findPipeSize(nominal, "40");
  if (!sch40) fail("nominal", n(nominal, "in"), `Schedule 40 steel, the table's reference pipe, comes in ${listSizes("40")} (in)`);
  return Math.pow(actual / sch40.id, HW_DIAMETER_EXPONENT);
}

/**
 * Equivalent pipe length of one fitting or valve in the pipe it sits in.
 *
 *   L = L_table × (C / 120)^1.85 × (d_schedule / d_sch40)^4.87
 *
 * L_table in ft of Schedule 40 steel at C 120. A size the schedule lacks is #VALUE! (listing its sizes); a table gap
 * is #N/A. A 2-1/2 in tee in Schedule 10 steel at C 120: 12 × 1 × (2.635 / 2.469)^4.87 = 12 × 1.3728 = 16.47 ft.
 *
 * @param fitting the fitting code: "EE", "E", "LtE", "T", "BV", "GV" or "CV"
 * @param nominal the nominal size, in (NPS)
 * @param cFactor C, the Hazen-Williams C of the pipe, dimensionless (default 120)
 * @param schedule the schedule code of the pipe (default "40")
 * @returns L, the equivalent length, ft
 * @see [NFPA 13] equivalent length chart (from memory), its C adjustment table and its note for pipe other than
 *   Schedule 40
 * @example
 * equivalentLength("T", 2.5, 120, "10") // ≈ 16.47 ft
 * equivalentLength("E", 2) // → 5 ft
 */
export function equivalentLength(fitting: Fitting, nominal: number, cFactor: number = TABLE_C_FACTOR, schedule: Schedule = "40"): number {
  scheduleInfo(schedule);
  if (!findPipeSize(nominal, schedule)) {
    fail("nominal", n(nominal, "in"), `${scheduleInfo(schedule).name} comes in ${listSizes(schedule)} (in)`);
  }
  return tableLength(fitting, nominal) * cFactorMultiplier(cFactor) * diameterMultiplier(nominal, schedule);
}
