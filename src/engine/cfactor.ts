/**
 * Hazen-Williams C factors of new pipe by material and system type.
 *
 * Pure data and one look-up. The material codes are the vocabulary's (../shared/spec/functions.md); plain-word
 * aliases ("black", "cement-lined", ...) are matched in the cell layer (src/functions/tableCodes.ts).
 */
import { fail } from "./errors";

/** Material codes of the vocabulary. "ductile" and "cast" are unlined iron; "lined ductile" is cement-lined iron. */
export type Material =
  | "steel"
  | "galvanized"
  | "plastic"
  | "cpvc"
  | "copper"
  | "stainless"
  | "brass"
  | "ductile"
  | "cast"
  | "lined ductile"
  | "asbestos cement"
  | "concrete";

/** System types of the table: "wet" includes deluge, "dry" includes preaction. */
export type SystemType = "wet" | "dry";

/** Every material code, in the vocabulary's order. */
export const MATERIAL_CODES: readonly Material[] = [
  "steel",
  "galvanized",
  "plastic",
  "cpvc",
  "copper",
  "stainless",
  "brass",
  "ductile",
  "cast",
  "lined ductile",
  "asbestos cement",
  "concrete",
];

/** One row of the C table: what the standard calls the material and its C in wet and dry systems. */
export interface CFactorRow {
  readonly description: string;
  readonly wet: number;
  readonly dry: number;
}

/**
 * [NFPA 13] Hazen-Williams C value table (new pipe). "wet" covers wet-pipe and deluge systems, "dry" covers
 * dry-pipe and preaction systems.
 */
const C_TABLE = {
  unlinedIron: { description: "unlined cast or ductile iron", wet: 100, dry: 100 }, // [NFPA 13]
  blackSteel: { description: "black steel", wet: 120, dry: 100 }, // [NFPA 13]
  galvanizedSteel: { description: "galvanized steel", wet: 120, dry: 100 }, // [NFPA 13]
  plastic: { description: "plastic (listed), all", wet: 150, dry: 150 }, // [NFPA 13]
  cementLinedIron: { description: "cement-lined cast or ductile iron", wet: 140, dry: 140 }, // [NFPA 13]
  copperBrassStainless: { description: "copper tube, brass or stainless steel", wet: 150, dry: 150 }, // [NFPA 13]
  asbestosCement: { description: "asbestos cement", wet: 140, dry: 140 }, // [NFPA 13]
  concrete: { description: "concrete", wet: 140, dry: 140 }, // [NFPA 13]
} as const satisfies Record<string, CFactorRow>;

/** Which row of the table each material code reads. */
const ROW_OF_MATERIAL: Readonly<Record<Material, CFactorRow>> = {
  steel: C_TABLE.blackSteel,
  galvanized: C_TABLE.galvanizedSteel,
  plastic: C_TABLE.plastic,
  cpvc: C_TABLE.plastic, // CPVC sprinkler pipe is listed plastic
  copper: C_TABLE.copperBrassStainless,
  stainless: C_TABLE.copperBrassStainless,
  brass: C_TABLE.copperBrassStainless,
  ductile: C_TABLE.unlinedIron,
  cast: C_TABLE.unlinedIron,
  "lined ductile": C_TABLE.cementLinedIron,
  "asbestos cement": C_TABLE.asbestosCement,
  concrete: C_TABLE.concrete,
};

/**
 * The table row a material reads: its description and both C values.
 *
 * @param material the material code: "steel", "galvanized", "plastic", "cpvc", "copper", ...
 * @returns the row: the standard's description and C in wet and dry systems, dimensionless
 * @see [NFPA 13] Hazen-Williams C value table
 * @example
 * cFactorRow("cpvc") // → { description: "plastic (listed), all", wet: 150, dry: 150 }
 */
export function cFactorRow(material: Material): CFactorRow {
  const row = ROW_OF_MATERIAL[material];
  if (!row) fail("material", { cell: material }, `must be one of ${MATERIAL_CODES.map((m) => `"${m}"`).join(", ")}`);
  return row;
}

/**
 * Hazen-Williams C of new pipe of a material in a system, by table look-up.
 *
 * @param material the material code: "steel", "galvanized", "plastic", "cpvc", "copper", ...
 * @param system "wet" (wet-pipe and deluge) or "dry" (dry-pipe and preaction)
 * @returns C, dimensionless
 * @see [NFPA 13] Hazen-Williams C value table
 * @example
 * hazenWilliamsC("steel", "dry") // → 100 (black steel in a dry system)
 * hazenWilliamsC("steel") // → 120
 */
export function hazenWilliamsC(material: Material, system: SystemType = "wet"): number {
  const row = cFactorRow(material);
  if (system !== "wet" && system !== "dry") fail("system", { cell: system }, `must be "wet" or "dry"`);
  return row[system];
}
