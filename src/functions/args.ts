/**
 * Turns what a cell hands a custom function into checked numbers and codes, or into a HeadroomError whose one-line
 * message names the argument, the value given and what is allowed.
 *
 * Excel hands an omitted optional argument over as null, an empty cell as null (or 0 on older desktop builds),
 * numbers as numbers and text as text; every cell-function parameter is typed `any` so that this module, not the
 * host, decides what a value means. An empty required argument is an error that says so, never a zero.
 */
import { HeadroomError, fail, n, q, show } from "../engine/errors";
import { type Quantity, type UnitSystem, QUANTITIES, toUS } from "../engine/units";

/**
 * The largest value each quantity may take, in US units. These are plausibility bounds of the trade, not design
 * limits: they catch a mistyped 1e308 or a diameter typed in mm while the sheet is in US units. (common practice)
 */
export const LIMITS_US: Readonly<Record<Quantity, number>> = Object.freeze({
  flow: 100_000, // gpm: far above any single fire-protection supply
  pressure: 1_000, // psi
  diameter: 120, // in
  length: 100_000, // ft
  area: 1_000_000, // ft²
  density: 5, // gpm/ft²
  kfactor: 100, // gpm/psi^0.5
  frictionRate: 1_000, // psi/ft (output only)
  velocity: 1_000, // ft/s (output only)
});

/**
 * The smallest value a quantity that must be greater than 0 may take, in US units, where a smaller one could only be
 * a slip and would make a result overflow (d^4.87 or K² in a divisor). (common practice)
 */
export const FLOORS_US: Readonly<Partial<Record<Quantity, number>>> = Object.freeze({
  diameter: 0.1, // in: below every pipe and outlet bore of the trade
  kfactor: 0.1, // gpm/psi^0.5: below every sprinkler K-factor
});

/**
 * The basic value of a data-typed cell value, or the value itself. Excel hands a data-typed cell to an `any`
 * parameter as an object when functions.json allows custom data (the add-in ships without that key, but a check must
 * not depend on it): the cell-value shapes of the Excel JavaScript API (https://learn.microsoft.com/javascript/api/excel/excel.cellvalue).
 * Double and FormattedNumber give their number, String its text, Boolean its TRUE/FALSE, Empty "". Any other value
 * comes back as it is: plain values, ranges, and the data types whose basic value is an error (Entity,
 * LinkedEntity, WebImage, Array, Error, ...), which the checks then refuse, `show` naming the data type.
 */
export function cellBasicValue(value: unknown): unknown {
  if (value === null || typeof value !== "object" || Array.isArray(value)) return value;
  const { type, basicValue } = value as { type?: unknown; basicValue?: unknown };
  if (type === "Double" || type === "FormattedNumber") return typeof basicValue === "number" ? basicValue : value;
  if (type === "String") return typeof basicValue === "string" ? basicValue : value;
  if (type === "Boolean") return typeof basicValue === "boolean" ? basicValue : value;
  return type === "Empty" ? "" : value;
}

/** True when a cell value stands for "nothing here": an omitted argument, an empty cell or empty text. */
export function isBlank(value: unknown): boolean {
  if (value !== null && typeof value === "object") value = cellBasicValue(value);
  return value === null || value === undefined || (typeof value === "string" && value.trim() === "");
}

const NUMERIC_TEXT = /^[+-]?(\d+(\.\d*)?|\.\d+)(e[+-]?\d+)?$/i;

/** Any cell value as a finite number, or an error naming `name`. Numeric text ("12.5") is accepted. */
export function toNumber(value: unknown, name: string): number {
  if (value !== null && typeof value === "object") value = cellBasicValue(value);
  if (isBlank(value)) fail(name, undefined, "is empty: type a number");
  if (typeof value === "number") {
    if (Number.isFinite(value)) return value;
    fail(name, { cell: value }, "must be a finite number");
  }
  if (typeof value === "string") {
    const t = value.trim();
    if (NUMERIC_TEXT.test(t)) {
      const n = Number(t);
      if (Number.isFinite(n)) return n;
    }
    fail(name, { cell: value }, "must be a number");
  }
  if (typeof value === "boolean") fail(name, { cell: value }, "must be a number, not TRUE/FALSE");
  if (Array.isArray(value)) fail(name, { cell: value }, "must be a single value");
  fail(name, { cell: value }, "must be a number");
}

export interface NumberRule {
  /** value must be greater than this */
  gt?: number;
  /** value must be at least this */
  min?: number;
  /** value must be at most this */
  max?: number;
  /** value must be a whole number */
  integer?: boolean;
  /** unit to name in messages, e.g. "%" */
  unit?: string;
}

const NO_NUMBER_RULE: NumberRule = Object.freeze({});

function describeRule(rule: NumberRule): string {
  const u = rule.unit ? ` ${rule.unit}` : "";
  const parts: string[] = [];
  if (rule.integer) parts.push("a whole number");
  if (rule.gt !== undefined && rule.max !== undefined) parts.push(`greater than ${show(rule.gt)} and at most ${show(rule.max)}${u}`);
  else if (rule.min !== undefined && rule.max !== undefined) parts.push(`from ${show(rule.min)} to ${show(rule.max)}${u}`);
  else if (rule.gt !== undefined) parts.push(`greater than ${show(rule.gt)}${u}`);
  else if (rule.min !== undefined) parts.push(`at least ${show(rule.min)}${u}`);
  else if (rule.max !== undefined) parts.push(`at most ${show(rule.max)}${u}`);
  return parts.join(", ");
}

/** A plain number (no unit conversion) checked against `rule`. */
export function numberArg(value: unknown, name: string, rule: NumberRule = NO_NUMBER_RULE): number {
  // The everyday call, a finite number that keeps the rule, in a few comparisons; everything else, and every
  // problem, takes the full reading below. Kept small so that it inlines.
  if (typeof value === "number" && value - value === 0 && keepsRule(value, rule)) return value + 0; // never −0
  return readNumber(value, name, rule);
}

/** True when the number `x` keeps `rule`. */
function keepsRule(x: number, rule: NumberRule): boolean {
  return (
    (rule.gt === undefined || x > rule.gt) &&
    (rule.min === undefined || x >= rule.min) &&
    (rule.max === undefined || x <= rule.max) &&
    (rule.integer !== true || Number.isInteger(x))
  );
}

/** numberArg in full: any cell value, every problem worded. */
function readNumber(value: unknown, name: string, rule: NumberRule): number {
  const x = toNumber(value, name);
  if (!keepsRule(x, rule)) fail(name, n(x, rule.unit), `must be ${describeRule(rule)}`);
  return x === 0 ? 0 : x; // never −0
}

/** Like numberArg, but an omitted or empty argument gives `fallback`. */
export function optionalNumberArg(value: unknown, name: string, fallback: number, rule: NumberRule = NO_NUMBER_RULE): number {
  return isBlank(value) ? fallback : numberArg(value, name, rule);
}

/** How a quantity may range: build one with quantityRule, once, and share it (ZERO_ALLOWED, SIGNED). */
export interface QuantityRule {
  /** zero is allowed (a flow of 0, a length of 0); otherwise the value must be greater than zero */
  readonly zero: boolean;
  /** negative values are allowed (a rise may be a drop) */
  readonly signed: boolean;
  /** the smallest value allowed, US units, where it is not 0 (overrides FLOORS_US) */
  readonly min: number | undefined;
  /** what the rule allows of each quantity, worked out once */
  readonly spans: Readonly<Record<Quantity, QuantitySpan>>;
}

/**
 * What a rule allows of one quantity, in US units, worked out once: from `lowestUS` to `highestUS`, both included
 * ("greater than 0" is "at least the smallest positive number", so that every span is one closed interval).
 */
export interface QuantitySpan {
  readonly quantity: Quantity;
  readonly rule: QuantityRule;
  readonly lowestUS: number;
  readonly highestUS: number;
}

/**
 * A rule with its span of each quantity: from −limit to the limit (`signed`), from 0 (`zero`), else from `min` or
 * the quantity's floor (FLOORS_US) and greater than 0; never above the quantity's limit (LIMITS_US).
 */
export function quantityRule(rule: { zero?: boolean; signed?: boolean; min?: number }): QuantityRule {
  const zero = rule.zero === true, signed = rule.signed === true;
  const spans = {} as Record<Quantity, QuantitySpan>;
  // every rule has every field, and every span too, so that the checks see one object shape of each
  const made: QuantityRule = Object.freeze({ zero, signed, min: rule.min, spans });
  for (const quantity of Object.keys(LIMITS_US) as Quantity[]) {
    const lowestUS = signed
      ? -LIMITS_US[quantity]
      : zero ? 0 : Math.max(Number.MIN_VALUE, rule.min ?? FLOORS_US[quantity] ?? 0);
    spans[quantity] = Object.freeze({ quantity, rule: made, lowestUS, highestUS: LIMITS_US[quantity] });
  }
  Object.freeze(spans);
  return made;
}

/** Rules shared by many calls (one object, not one per call: these checks run on every recalculation). */
const NO_RULE = quantityRule({});
export const ZERO_ALLOWED = quantityRule({ zero: true });
export const SIGNED = quantityRule({ signed: true });

/** The span `rule` allows of `quantity`: for quantityIn, looked up once by a module rather than on every call. */
export function quantitySpan(quantity: Quantity, rule: QuantityRule = NO_RULE): QuantitySpan {
  return rule.spans[quantity];
}

/**
 * A physical quantity given in `units`, checked and returned in US units. Allowed: greater than 0 (or from 0 with
 * `zero`, or either sign with `signed`) up to the plausibility bound of LIMITS_US, stated in the user's units.
 */
export function quantityArg(value: unknown, name: string, quantity: Quantity, units: UnitSystem, rule: QuantityRule = NO_RULE): number {
  return quantityIn(value, name, rule.spans[quantity], units);
}

/**
 * quantityArg with the quantity and its rule given as their span (quantitySpan). A function called on every
 * recalculation keeps its spans as constants and calls this: quantityArg's look-up by the quantity's name is one
 * the optimiser cannot specialise once many quantities pass through it.
 */
export function quantityIn(value: unknown, name: string, span: QuantitySpan, units: UnitSystem): number {
  // The everyday call, a plain number in US units within its span, in two comparisons (NaN and ±Infinity fail
  // them); everything else, and every problem, takes the full reading below. Kept small so that it inlines.
  if (typeof value === "number" && units === "US" && value <= span.highestUS && value >= span.lowestUS) {
    return value + 0; // never −0
  }
  return readQuantity(value, name, span.quantity, units, span.rule);
}

/** quantityArg in full: any cell value, either unit system, every problem worded. */
function readQuantity(value: unknown, name: string, quantity: Quantity, units: UnitSystem, rule: QuantityRule): number {
  const given = typeof value === "number" && Number.isFinite(value) ? value : toNumber(value, name);
  const us = units === "SI" ? toUS(quantity, given, units) : given;
  const limitUS = LIMITS_US[quantity];
  const inRange = rule.signed
    ? us >= -limitUS && us <= limitUS
    : (rule.zero ? us >= 0 : us > 0 && us >= (rule.min ?? FLOORS_US[quantity] ?? 0)) && us <= limitUS;
  if (!inRange) quantityOutOfRange(us, name, quantity, rule);
  return us === 0 ? 0 : us; // never −0
}

/** The problem of a quantity outside its allowed span (kept off the fast path); limits are stated in US units. */
function quantityOutOfRange(us: number, name: string, quantity: Quantity, rule: QuantityRule): never {
  const limit = q(quantity, LIMITS_US[quantity]);
  if (rule.signed) fail(name, q(quantity, us), "must be from {0} to {1}", q(quantity, -LIMITS_US[quantity]), limit);
  if (rule.zero) fail(name, q(quantity, us), "must be from 0 to {0}", limit);
  const floor = rule.min ?? FLOORS_US[quantity];
  if (floor !== undefined) fail(name, q(quantity, us), "must be from {0} to {1}", q(quantity, floor), limit);
  fail(name, q(quantity, us), "must be greater than 0 and at most {0}", limit);
}

/** Like quantityArg, but an omitted or empty argument gives `fallbackUS` (already in US units). */
export function optionalQuantityArg(
  value: unknown,
  name: string,
  quantity: Quantity,
  units: UnitSystem,
  fallbackUS: number,
  rule: QuantityRule = NO_RULE,
): number {
  return isBlank(value) ? fallbackUS : quantityArg(value, name, quantity, units, rule);
}

/** Normalise text for code matching: trimmed, lower case, inner white space folded to one space. */
export function normaliseText(value: string): string {
  return value.trim().toLowerCase().replace(/\s+/g, " ");
}

/** Fold the punctuation users put inside codes ("OH-1", "Sch. 40", "cement-lined", "K-US") into spaces. */
function foldCode(value: string): string {
  const folded = value.replace(/[-_]|\.(?!\d)/g, " ").replace(/\s+/g, " ");
  return folded.trim() === "" ? value : folded;
}

/**
 * A code from a fixed list: the one text-code matcher of the add-in (units, schedules, materials, hazards, UNIT's
 * unit names, ...). `codes` maps each canonical code to the spellings accepted for it; the canonical code itself is
 * always accepted. Matching is case-insensitive with inner white space folded (normaliseText), raw and with the
 * punctuation inside codes folded to spaces (raw first, so that "sdr 13.5" keeps its dot). Numbers are accepted as
 * their text ("40"). Unknown: #VALUE! listing the accepted codes, plus `hint` (e.g. the plain words) when given.
 */
export function codeArg<C extends string>(value: unknown, name: string, codes: Readonly<Record<C, readonly string[]>>, hint = ""): C {
  const list = Object.keys(codes) as C[];
  const allowed = list.map((c) => `"${c}"`).join(", ") + hint;
  if (value !== null && typeof value === "object") value = cellBasicValue(value);
  if (isBlank(value)) fail(name, undefined, `is empty: type one of ${allowed}`);
  if (typeof value !== "string" && typeof value !== "number") fail(name, { cell: value }, `must be one of ${allowed}`);
  const text = String(value);
  const forms = [normaliseText(text), normaliseText(foldCode(text))];
  for (const c of list) {
    const spellings = [c, ...codes[c]].flatMap((a) => [normaliseText(a), normaliseText(foldCode(a))]);
    if (forms.some((f) => spellings.includes(f))) return c;
  }
  fail(name, { cell: value }, `must be one of ${allowed}`);
}

/** Like codeArg, but an omitted or empty argument gives `fallback`. */
export function optionalCodeArg<C extends string>(value: unknown, name: string, codes: Readonly<Record<C, readonly string[]>>, fallback: C): C {
  return isBlank(value) ? fallback : codeArg(value, name, codes);
}

/** The `[units]` argument: "US" (default) or "SI", case-insensitive and trimmed. */
export function unitsArg(value: unknown): UnitSystem {
  if (value === null || value === undefined) return "US"; // the common case, without a code look-up
  return optionalCodeArg<UnitSystem>(value, "units", { US: ["us", "imperial", "customary"], SI: ["si", "metric"] }, "US");
}

// ─── Ranges ──────────────────────────────────────────────────────────────────────────────────────────────────────

/** A range argument as rows of cells: a 2-D array as Excel hands it over; a lone value counts as a 1 × 1 range. */
export function rangeArg(value: unknown, name: string): unknown[][] {
  if (value === null || value === undefined) fail(name, undefined, "is empty: give a range of cells");
  if (!Array.isArray(value)) return [[value]];
  if (value.length === 0) fail(name, { text: "an empty range" }, "give a range of cells");
  return value.map((row) => (Array.isArray(row) ? row : [row]));
}

/**
 * True when a row of a range holds nothing: every cell empty (null or empty text), or every cell 0, which is how
 * older Excel desktop builds hand over an untouched row (a row of zeros is no segment: a diameter of 0 is
 * impossible).
 */
export function isBlankRow(row: readonly unknown[]): boolean {
  return row.every((c) => isBlank(c)) || row.every((c) => c === 0);
}

export { HeadroomError, QUANTITIES };
