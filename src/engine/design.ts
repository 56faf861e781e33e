/**
 * The density/area method's design criteria by occupancy hazard: the density/area curves, the design-area adjustment
 * by system type, hose stream allowances and water supply durations.
 *
 * Pure data and arithmetic, US units (density gpm/ft², area ft², flow gpm, time min). Hazard codes are the
 * vocabulary's (LH, OH1, OH2, EH1, EH2); plain-word aliases are matched in the cell layer
 * (src/functions/tableCodes.ts). HAZARDS is the metadata the task pane and the preview read.
 */
import { fail, n, q } from "./errors";

/** Occupancy hazard codes: light, ordinary group 1 and 2, extra group 1 and 2. */
export type Hazard = "LH" | "OH1" | "OH2" | "EH1" | "EH2";

/** Every hazard code, lightest first. */
export const HAZARD_CODES: readonly Hazard[] = ["LH", "OH1", "OH2", "EH1", "EH2"];

/** One end of a density/area curve. */
export interface DensityAreaPoint {
  /** gpm/ft² */
  readonly density: number;
  /** ft² */
  readonly area: number;
}

/** The design criteria of one hazard. */
export interface HazardInfo {
  readonly code: Hazard;
  /** the standard's name of the occupancy class */
  readonly name: string;
  /** the curve's upper point: highest density at the smallest design area */
  readonly upper: DensityAreaPoint;
  /** the curve's lower point: lowest density at the largest design area */
  readonly lower: DensityAreaPoint;
  /** hose stream allowance, inside + outside, gpm */
  readonly hoseTotal: number;
  /** the inside hose allowances the standard offers, gpm */
  readonly insideHoseOptions: readonly number[];
  /** required water supply duration, min: the range's lower and upper bound */
  readonly duration: { readonly min: number; readonly max: number };
}

/**
 * The design criteria of each hazard: density gpm/ft², area ft², hose allowance gpm, duration min.
 *
 * The density/area curves, each a straight line between its two points, with the hose stream allowance and water
 * supply duration table.
 *
 * @see [NFPA 13] density/area curves, hose stream allowance and water supply duration table (from memory)
 */
export const HAZARDS: Readonly<Record<Hazard, HazardInfo>> = {
  LH: {
    code: "LH",
    name: "light hazard",
    upper: { density: 0.1, area: 1500 }, // [NFPA 13] (from memory)
    lower: { density: 0.07, area: 3000 }, // [NFPA 13] (from memory)
    hoseTotal: 100, // [NFPA 13] (from memory)
    insideHoseOptions: [0, 50, 100], // [NFPA 13] (from memory)
    duration: { min: 30, max: 30 }, // [NFPA 13] (from memory)
  },
  OH1: {
    code: "OH1",
    name: "ordinary hazard group 1",
    upper: { density: 0.15, area: 1500 }, // [NFPA 13] (from memory)
    lower: { density: 0.12, area: 4000 }, // [NFPA 13] (from memory)
    hoseTotal: 250, // [NFPA 13] (from memory)
    insideHoseOptions: [0, 50, 100], // [NFPA 13] (from memory)
    duration: { min: 60, max: 90 }, // [NFPA 13] (from memory)
  },
  OH2: {
    code: "OH2",
    name: "ordinary hazard group 2",
    upper: { density: 0.2, area: 1500 }, // [NFPA 13] (from memory)
    lower: { density: 0.17, area: 4000 }, // [NFPA 13] (from memory)
    hoseTotal: 250, // [NFPA 13] (from memory)
    insideHoseOptions: [0, 50, 100], // [NFPA 13] (from memory)
    duration: { min: 60, max: 90 }, // [NFPA 13] (from memory)
  },
  EH1: {
    code: "EH1",
    name: "extra hazard group 1",
    upper: { density: 0.3, area: 2500 }, // [NFPA 13] (from memory)
    lower: { density: 0.28, area: 5000 }, // [NFPA 13] (from memory)
    hoseTotal: 500, // [NFPA 13] (from memory)
    insideHoseOptions: [0, 50, 100], // [NFPA 13] (from memory)
    duration: { min: 90, max: 120 }, // [NFPA 13] (from memory)
  },
  EH2: {
    code: "EH2",
    name: "extra hazard group 2",
    upper: { density: 0.4, area: 2500 }, // [NFPA 13] (from memory)
    lower: { density: 0.38, area: 5000 }, // [NFPA 13] (from memory)
    hoseTotal: 500, // [NFPA 13] (from memory)
    insideHoseOptions: [0, 50, 100], // [NFPA 13] (from memory)
    duration: { min: 90, max: 120 }, // [NFPA 13] (from memory)
  },
};

/**
 * Relative slack accepted at each end of a curve's area span, dimensionless: 0.5 %.
 *
 * So that an area typed as the standard's rounded metric equivalent still lands on the curve: the metric edition
 * writes 1500 ft² as 139 m², which is 1496 ft² (0.25 % short). An area within the slack is read as the end point
 * itself; anything further off is an error.
 */
export const AREA_SPAN_SLACK = 0.005;

/**
 * Design criteria of a hazard.
 *
 * @param hazard the occupancy hazard code: "LH", "OH1", "OH2", "EH1" or "EH2"
 * @returns the hazard's name, curve points (gpm/ft², ft²), hose allowances (gpm) and durations (min)
 * @see [NFPA 13] density/area curves, hose stream allowance and water supply duration table (from memory)
 * @example
 * hazardInfo("OH2").name // → "ordinary hazard group 2"
 * hazardInfo("OH2").upper // → { density: 0.2, area: 1500 } gpm/ft², ft²
 * hazardInfo("XH") // throws "hazard: got \"XH\"; must be one of LH, OH1, OH2, EH1, EH2"
 */
export function hazardInfo(hazard: Hazard): HazardInfo {
  const info = HAZARDS[hazard];
  if (!info) fail("hazard", { cell: hazard }, `must be one of ${HAZARD_CODES.join(", ")}`);
  return info;
}

/**
 * The area span of a hazard's curve: from the upper point's area to the lower point's.
 *
 * @param hazard the occupancy hazard code: "LH", "OH1", "OH2", "EH1" or "EH2"
 * @returns the smallest and the largest design area, ft²
 * @see [NFPA 13] density/area curves (from memory)
 * @example
 * areaSpan("OH1") // → { min: 1500, max: 4000 } ft²
 */
export function areaSpan(hazard: Hazard): { min: number; max: number } {
  const h = hazardInfo(hazard);
  return { min: h.upper.area, max: h.lower.area };
}

/**
 * An area placed on a hazard's curve, or undefined when it is off the curve.
 *
 * The area itself inside the span; the end point within AREA_SPAN_SLACK of an end. OH1 spans 1500 to 4000 ft²:
 * 1496 ft² is short of 1500 but not of 1500 × (1 − 0.005) = 1492.5 ft², so it reads as 1500 ft²; 1400 ft² is off.
 *
 * @param hazard the occupancy hazard code: "LH", "OH1", "OH2", "EH1" or "EH2"
 * @param area the design area, ft²
 * @returns the area on the curve, ft², or undefined
 * @see [NFPA 13] density/area curves (from memory); the slack is Headroom's own
 * @example
 * areaOnCurve("OH1", 2000) // → 2000 ft²
 * areaOnCurve("OH1", 1496) // → 1500 ft²
 * areaOnCurve("OH1", 1400) // → undefined
 */
export function areaOnCurve(hazard: Hazard, area: number): number | undefined {
  const { min, max } = areaSpan(hazard);
  if (!Number.isFinite(area)) return undefined;
  if (area >= min && area <= max) return area;
  if (area < min && area >= min * (1 - AREA_SPAN_SLACK)) return min;
  if (area > max && area <= max * (1 + AREA_SPAN_SLACK)) return max;
  return undefined;
}

/**
 * Design density of a hazard at a design area, read from the straight density/area line.
 *
 *   D(A) = D_u + (D_l − D_u) × (A − A_u) / (A_l − A_u)
 *
 * (D_u, A_u) is the upper point, (D_l, A_l) the lower one. An area off the curve is an error stating the span.
 * Without an area, the curve's smallest area (the upper point) is used. OH2 at 2000 ft²:
 * 0.20 + (0.17 − 0.20) × (2000 − 1500) / (4000 − 1500) = 0.20 − 0.006 = 0.194 gpm/ft².
 *
 * @param hazard the occupancy hazard code: "LH", "OH1", "OH2", "EH1" or "EH2"
 * @param area A, the design area, ft² (omitted: the upper point's area)
 * @returns D, the design density, gpm/ft²
 * @see [NFPA 13] density/area curves (from memory)
 * @example
 * designDensity("OH2", 2000) // ≈ 0.194 gpm/ft²
 * designDensity("OH2") // → 0.2 gpm/ft²
 */
export function designDensity(hazard: Hazard, area?: number): number {
  const h = hazardInfo(hazard);
  if (area === undefined) return h.upper.density;
  const a = areaOnCurve(hazard, area);
  if (a === undefined) {
    fail("area", q("area", area), `the ${hazard} (${h.name}) curve spans {0} to {1}`, q("area", h.upper.area), q("area", h.lower.area));
  }
  return h.upper.density + ((h.lower.density - h.upper.density) * (a - h.upper.area)) / (h.lower.area - h.upper.area);
}

/**
 * The smallest design area of a hazard's curve (its upper point).
 *
 * @param hazard the occupancy hazard code: "LH", "OH1", "OH2", "EH1" or "EH2"
 * @returns the design area, ft²
 * @see [NFPA 13] density/area curves (from memory)
 * @example
 * designArea("EH1") // → 2500 ft²
 */
export function designArea(hazard: Hazard): number {
  return hazardInfo(hazard).upper.area;
}

/**
 * System types of the design-area adjustment: "preaction" is single interlock, "double interlock" the double-interlock
 * preaction system. A deluge system is adjusted as a wet one (the cell layer reads "deluge" as "wet").
 */
export type AreaSystem = "wet" | "preaction" | "dry" | "double interlock";

/** Every system type of the design-area adjustment, those flowed over the area as read first. */
export const AREA_SYSTEM_CODES: readonly AreaSystem[] = ["wet", "preaction", "dry", "double interlock"];

/**
 * Design-area multiplier of dry-pipe and double-interlock preaction systems, dimensionless.
 *
 * 30 % more area at the same density: the water reaches the fire later, so more sprinklers open.
 * @see [NFPA 13] design-area adjustment by system type (from memory)
 */
export const DRY_AREA_FACTOR = 1.3;

/** The design-area multiplier of each system type, dimensionless [NFPA 13] (from memory). */
const AREA_FACTOR: Readonly<Record<AreaSystem, number>> = {
  wet: 1,
  preaction: 1,
  dry: DRY_AREA_FACTOR,
  "double interlock": DRY_AREA_FACTOR,
};

/**
 * The design area adjusted for the system type: the area to flow, at the density read at the unadjusted area.
 *
 *   A' = f A,   f = 1.3 for dry-pipe and double-interlock preaction systems, 1 for wet and single-interlock preaction
 *
 * A dry system over OH2's 1500 ft²: 1.3 × 1500 = 1950 ft², still at 0.20 gpm/ft². The area keeps its unit (m² in, m²
 * out).
 *
 * @param area A, the design area read from the curve, ft² (or any unit of area: the result has the same unit)
 * @param system "wet", "preaction" (single interlock), "dry" or "double interlock"
 * @returns A', the design area to flow, in the unit of `area`
 * @see [NFPA 13] design-area adjustment by system type (from memory)
 * @example
 * adjustedArea(1500, "dry") // ≈ 1950 ft²
 * adjustedArea(1500, "preaction") // → 1500 ft²
 * adjustedArea(1500, "foam") // throws "system: got \"foam\"; must be one of \"wet\", \"preaction\", \"dry\", \"double interlock\""
 */
export function adjustedArea(area: number, system: AreaSystem): number {
  if (!AREA_SYSTEM_CODES.includes(system)) fail("system", { cell: system }, `must be one of ${AREA_SYSTEM_CODES.map((s) => `"${s}"`).join(", ")}`);
  if (!(area > 0 && area < Infinity)) fail("area", n(area), "must be greater than 0");
  return AREA_FACTOR[system] * area;
}

/** Parts of the hose stream allowance: the total, the inside hose part, the outside hose part. */
export type HosePart = "total" | "inside" | "outside";

/**
 * Hose stream allowance of a hazard.
 *
 *   total = inside + outside (the table's total),   inside = the largest inside allowance offered (100 gpm),
 *   outside = total − inside
 *
 * OH1 outside: 250 − 100 = 150 gpm.
 *
 * @param hazard the occupancy hazard code: "LH", "OH1", "OH2", "EH1" or "EH2"
 * @param part "total", "inside" or "outside"
 * @returns the allowance, gpm
 * @see [NFPA 13] hose stream allowance table (from memory)
 * @example
 * hoseAllowance("OH1", "outside") // → 150 gpm
 * hoseAllowance("OH1") // → 250 gpm
 */
export function hoseAllowance(hazard: Hazard, part: HosePart = "total"): number {
  const h = hazardInfo(hazard);
  const inside = Math.max(...h.insideHoseOptions);
  switch (part) {
    case "total":
      return h.hoseTotal;
    case "inside":
      return inside;
    case "outside":
      return h.hoseTotal - inside;
    default:
      fail("part", { cell: part }, `must be "total", "inside" or "outside"`);
  }
}

/** Which end of a duration range. */
export type DurationBound = "min" | "max";

/**
 * Required water supply duration of a hazard: the lower ("min") or upper ("max") end of the table's range.
 *
 * @param hazard the occupancy hazard code: "LH", "OH1", "OH2", "EH1" or "EH2"
 * @param bound "min" or "max"
 * @returns the duration, min
 * @see [NFPA 13] water supply duration table (from memory)
 * @example
 * supplyDuration("EH2", "max") // → 120 min
 * supplyDuration("EH2") // → 90 min
 */
export function supplyDuration(hazard: Hazard, bound: DurationBound = "min"): number {
  const h = hazardInfo(hazard);
  if (bound !== "min" && bound !== "max") fail("bound", { cell: bound }, `must be "min" or "max"`);
  return h.duration[bound];
}
