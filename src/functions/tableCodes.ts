/**
 * The text codes of the trade-table functions and the plain-word spellings accepted for each: schedules, materials,
 * system types (of the C table and of the design-area adjustment), hazards, hose allowance parts and duration
 * bounds, matched by the one code matcher (args.codeArg): case-insensitive, inner white space folded, hyphens, dots
 * and underscores counting as spaces, so "OH-1", "Sch. 40" and "cement-lined" all match. An unknown code is #VALUE!
 * listing the accepted codes.
 */
import type { Material, SystemType } from "../engine/cfactor";
import type { AreaSystem, DurationBound, Hazard, HosePart } from "../engine/design";
import type { Schedule } from "../engine/pipes";
import { codeArg, isBlank } from "./args";

/** Spellings of each pipe schedule code. */
export const SCHEDULE_ALIASES: Readonly<Record<Schedule, readonly string[]>> = {
  "10": ["sch 10", "sch10", "schedule 10", "s10", "sch 10 steel", "schedule 10 steel"],
  "40": ["sch 40", "sch40", "schedule 40", "s40", "sch 40 steel", "schedule 40 steel"],
  CPVC: ["sdr 13.5", "sdr13.5", "cpvc sdr 13.5", "cpvc sdr13.5"],
  K: ["type k", "copper k", "k copper", "copper type k"],
  L: ["type l", "copper l", "l copper", "copper type l"],
  M: ["type m", "copper m", "m copper", "copper type m"],
  DR14: ["dr 14", "c900 dr14", "c900 dr 14", "pvc dr14", "pvc dr 14"],
  DR18: ["dr 18", "c900 dr18", "c900 dr 18", "pvc dr18", "pvc dr 18"],
};

/** Spellings of each material code: "steel" is black steel, "ductile"/"cast" unlined iron, "lined ductile" cement-lined. */
export const MATERIAL_ALIASES: Readonly<Record<Material, readonly string[]>> = {
  steel: ["black", "black steel", "carbon steel"],
  galvanized: ["galvanised", "galvanized steel", "galvanised steel", "galv"],
  plastic: ["listed plastic", "pvc", "c900"],
  cpvc: [],
  copper: ["copper tube", "copper tubing"],
  stainless: ["stainless steel"],
  brass: [],
  ductile: ["ductile iron", "unlined ductile", "unlined ductile iron"],
  cast: ["cast iron", "unlined cast", "unlined cast iron"],
  "lined ductile": [
    "lined ductile iron",
    "cement lined",
    "cement lined ductile",
    "cement lined ductile iron",
    "cement lined cast",
    "cement lined cast iron",
    "lined cast",
    "lined cast iron",
  ],
  "asbestos cement": [],
  concrete: [],
};

/**
 * System types of the design-area adjustment: "preaction" is the single-interlock system, adjusted as a wet one;
 * deluge is adjusted as wet [NFPA 13] (from memory).
 */
export const AREA_SYSTEM_ALIASES: Readonly<Record<AreaSystem, readonly string[]>> = {
  wet: ["wet pipe", "deluge"],
  preaction: ["pre action", "single interlock", "single interlock preaction", "preaction single interlock"],
  dry: ["dry pipe"],
  "double interlock": ["double interlock preaction", "preaction double interlock", "double interlocked"],
};

/**
 * System types of the C table: deluge reads the wet column and preaction (single or double interlock) the dry one, as
 * the table says. Every spelling of the design-area adjustment reads here too, so that one system cell feeds both
 * CFACTOR and ADJUSTAREA.
 */
export const SYSTEM_ALIASES: Readonly<Record<SystemType, readonly string[]>> = {
  wet: AREA_SYSTEM_ALIASES.wet,
  dry: [
    ...AREA_SYSTEM_ALIASES.dry,
    "preaction",
    ...AREA_SYSTEM_ALIASES.preaction,
    "double interlock",
    ...AREA_SYSTEM_ALIASES["double interlock"],
  ],
};

/** Hazard codes and their names ("ordinary 1", "ordinary group 1", "OH-1", ...). */
export const HAZARD_ALIASES: Readonly<Record<Hazard, readonly string[]>> = {
  LH: ["light", "light hazard"],
  OH1: ["ordinary 1", "ordinary group 1", "ordinary hazard group 1", "ordinary hazard 1", "oh 1", "oh i", "ordinary i"],
  OH2: ["ordinary 2", "ordinary group 2", "ordinary hazard group 2", "ordinary hazard 2", "oh 2", "oh ii", "ordinary ii"],
  EH1: ["extra 1", "extra group 1", "extra hazard group 1", "extra hazard 1", "eh 1", "eh i", "extra i"],
  EH2: ["extra 2", "extra group 2", "extra hazard group 2", "extra hazard 2", "eh 2", "eh ii", "extra ii"],
};

/** Parts of the hose stream allowance. */
export const HOSE_PART_ALIASES: Readonly<Record<HosePart, readonly string[]>> = {
  total: ["all", "combined", "inside + outside", "inside and outside"],
  inside: ["in", "interior"],
  outside: ["out", "exterior"],
};

/** Ends of a duration range. */
export const BOUND_ALIASES: Readonly<Record<DurationBound, readonly string[]>> = {
  min: ["minimum", "low", "lower"],
  max: ["maximum", "high", "upper"],
};

/** The `schedule` argument, default "40". */
export function scheduleArg(value: unknown, name = "schedule"): Schedule {
  return isBlank(value) ? "40" : codeArg(value, name, SCHEDULE_ALIASES);
}

/** The `material` argument (required). */
export function materialArg(value: unknown, name = "material"): Material {
  return codeArg(value, name, MATERIAL_ALIASES);
}

/** The `system` argument, default "wet". */
export function systemArg(value: unknown, name = "system"): SystemType {
  return isBlank(value) ? "wet" : codeArg(value, name, SYSTEM_ALIASES);
}

/** The `system` argument of ADJUSTAREA (required): the four systems, listed with their plain words when unknown. */
export function areaSystemArg(value: unknown, name = "system"): AreaSystem {
  return codeArg(value, name, AREA_SYSTEM_ALIASES, ' (or "wet pipe", "deluge", "single interlock", "dry pipe", "double interlock preaction")');
}

/** The `hazard` argument (required). */
export function hazardArg(value: unknown, name = "hazard"): Hazard {
  return codeArg(value, name, HAZARD_ALIASES, ' (or "light", "ordinary 1", "ordinary 2", "extra 1", "extra 2")');
}

/** The `part` argument of HOSEALLOWANCE, default "total". */
export function hosePartArg(value: unknown, name = "part"): HosePart {
  return isBlank(value) ? "total" : codeArg(value, name, HOSE_PART_ALIASES);
}

/** The `bound` argument of DURATION, default "min". */
export function boundArg(value: unknown, name = "bound"): DurationBound {
  return isBlank(value) ? "min" : codeArg(value, name, BOUND_ALIASES);
}
