/**
 * The cell function UNIT: conversions between the units of the trade, done by mathjs's unit system. Only mathjs's
 * Unit code is built in (create + unitDependencies), not its expression parser: user text is never evaluated, only
 * looked up in the list below.
 */
import { create, unitDependencies } from "mathjs";
import { fail, finiteOr, n as plain } from "../engine/errors";
import { codeArg, numberArg } from "./args";
import { cell } from "./bridge";

const math = create({ unitDependencies });

type Kind = "flow" | "pressure" | "length" | "area" | "density" | "K-factor";

interface UnitEntry {
  kind: Kind;
  /** the unit in mathjs's own notation; for K-factors, the flow and pressure units it is made of */
  mathjs: string | { flow: string; pressure: string };
  aliases: string[];
}

/** The units UNIT accepts, by the names users type. */
export const UNITS: Record<string, UnitEntry> = {
  gpm: { kind: "flow", mathjs: "gal/min", aliases: ["gal/min", "usgpm"] },
  "L/min": { kind: "flow", mathjs: "L/min", aliases: ["lpm", "l/m"] },
  "m3/h": { kind: "flow", mathjs: "m^3/h", aliases: ["m³/h", "m^3/h", "m3/hr"] },
  psi: { kind: "pressure", mathjs: "psi", aliases: [] },
  bar: { kind: "pressure", mathjs: "bar", aliases: [] },
  kPa: { kind: "pressure", mathjs: "kPa", aliases: [] },
  ft: { kind: "length", mathjs: "ft", aliases: ["foot", "feet"] },
  m: { kind: "length", mathjs: "m", aliases: ["metre", "meter"] },
  in: { kind: "length", mathjs: "in", aliases: ["inch", '"'] },
  mm: { kind: "length", mathjs: "mm", aliases: [] },
  ft2: { kind: "area", mathjs: "ft^2", aliases: ["ft²", "ft^2", "sq ft", "sqft"] },
  m2: { kind: "area", mathjs: "m^2", aliases: ["m²", "m^2", "sq m"] },
  "gpm/ft2": { kind: "density", mathjs: "gal/min/ft^2", aliases: ["gpm/ft²", "gpm/ft^2", "gpm/sqft"] },
  "mm/min": { kind: "density", mathjs: "mm/min", aliases: ["l/min/m2", "l/min/m²", "lpm/m2"] },
  "K-US": { kind: "K-factor", mathjs: { flow: "gal/min", pressure: "psi" }, aliases: ["kus", "k us", "k-gpm"] },
  "K-SI": { kind: "K-factor", mathjs: { flow: "L/min", pressure: "bar" }, aliases: ["ksi", "k si", "k-metric", "k-lpm"] },
};

/** The spellings of each unit name, for the one code matcher. */
const UNIT_CODES: Readonly<Record<string, readonly string[]>> = Object.fromEntries(
  Object.entries(UNITS).map(([key, entry]) => [key, entry.aliases]),
);

function lookup(value: unknown, name: string): [string, UnitEntry] {
  const key = codeArg(value, name, UNIT_CODES);
  return [key, UNITS[key]];
}

/** Size of one `entry` unit expressed in SI base units (a K-factor as m³/s per Pa^0.5). */
function baseValue(entry: UnitEntry): number {
  if (typeof entry.mathjs === "string") return math.unit(1, entry.mathjs).value as number;
  const flow = math.unit(1, entry.mathjs.flow).value as number;
  const pressure = math.unit(1, entry.mathjs.pressure).value as number;
  return flow / Math.sqrt(pressure);
}

/** Convert `value` from one unit to another of the same kind. */
export function convertUnit(value: number, from: unknown, to: unknown): number {
  const [fromKey, a] = lookup(from, "from");
  const [toKey, b] = lookup(to, "to");
  if (a.kind !== b.kind) fail("to", { cell: to }, `must be a unit of ${a.kind} like ${fromKey}; ${toKey} is a unit of ${b.kind}`);
  // to the same unit: the value itself, every digit (the estimate sheet reads a typed number this way)
  if (fromKey === toKey) return value;
  return (value * baseValue(a)) / baseValue(b);
}

/**
 * Converts a value between units of the same kind: flow "gpm", "L/min", "m3/h"; pressure "psi", "bar", "kPa";
 * length "ft", "m", "in", "mm"; area "ft2", "m2"; density "gpm/ft2", "mm/min"; K-factors "K-US", "K-SI".
 * @customfunction
 * @param value The value to convert (0 or more).
 * @param from Its unit, e.g. "gpm".
 * @param to The unit wanted, e.g. "L/min".
 * @returns The converted value.
 */
export function unit(value: any, from: any, to: any): number {
  return cell(null, () => {
    const v = numberArg(value, "value", { min: 0 });
    return finiteOr(convertUnit(v, from, to), "value", plain(v));
  });
}
