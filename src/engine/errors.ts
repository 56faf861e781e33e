/**
 * The one error type of the engine and of the argument layer: a problem as data, never a sentence in units.
 *
 * A `HeadroomError` says which argument is at fault, the value it held (a quantity in US units, a plain number, or
 * what a cell handed over), the rule it broke (a phrase whose `{0}`, `{1}` … slots are further amounts, again in US
 * units) and its kind. The cell layer's one formatter (src/functions/bridge.ts, `formatProblem`) writes it as a
 * one-line message in the user's units and maps the kind to the host's error:
 *
 *   "value"    → #VALUE!  wrong type, out of range, unknown code, no answer
 *   "na"       → #N/A     a table has no entry
 *   "number"   → #NUM!    outside a physical envelope (a fire pump curve beyond 150 % flow)
 *   "converge" → #NUM!    an iterative solve did not converge (the rule states the residual reached)
 *
 * `message` is the US wording, for logs and for engine callers that never speak SI.
 */
import { type Quantity, type UnitSystem, fromUS, unitName } from "./units";

export type HeadroomErrorKind = "value" | "na" | "number" | "converge";

/**
 * A number or a thing as a message shows it:
 * - `{ quantity, us }`: a physical quantity in US units, shown in the user's units ("1968 gpm", "135.7 bar");
 * - `{ number, unit? }`: a number shown as it is, with a fixed unit if any ("150 %", "1.2");
 * - `{ text }`: a description shown verbatim ("a range 3 columns wide");
 * - `{ cell }`: what a cell handed over, shown by `show` ("\"abc\"", "TRUE", "empty").
 */
export type Shown =
  | { quantity: Quantity; us: number }
  | { number: number; unit?: string }
  | { text: string }
  | { cell: unknown };

/** The parts of a problem. */
export interface Problem {
  kind: HeadroomErrorKind;
  /** the argument at fault as the user names it: "static_pressure", "segments row 3 flow" */
  argument: string;
  /** what the argument held; absent when nothing was given (the rule then follows the name directly) */
  got?: Shown;
  /** the rule broken: "must be greater than 0 and at most {0}"; slots {i} are filled from `amounts` */
  rule: string;
  amounts?: readonly Shown[];
}

/** A problem thrown: its message is the US wording, `messageIn` gives it in either unit system. */
export class HeadroomError extends Error {
  readonly kind: HeadroomErrorKind;
  readonly argument: string;
  readonly got: Shown | undefined;
  readonly rule: string;
  readonly amounts: readonly Shown[];
  constructor(p: Problem) {
    super(formatProblem(p, "US"));
    this.name = "HeadroomError";
    this.kind = p.kind;
    this.argument = p.argument;
    this.got = p.got;
    this.rule = p.rule;
    this.amounts = p.amounts ?? [];
  }
  /** The one-line message in `units`. */
  messageIn(units: UnitSystem): string {
    return units === "US" ? this.message : formatProblem(this, units);
  }
}

/**
 * A quantity in US units, for `got` and `amounts`.
 *
 * @param quantity what it measures: "flow", "pressure", "diameter", "length", ...
 * @param us the value, in the quantity's US unit (gpm, psi, in, ft, ...)
 * @returns the quantity, shown in the user's units
 * @example
 * q("flow", 500) // → { quantity: "flow", us: 500 }
 */
export function q(quantity: Quantity, us: number): Shown {
  return { quantity, us };
}

/**
 * A plain number (no unit conversion), for `got` and `amounts`.
 *
 * @param number the number, shown as it is
 * @param unit a fixed unit written after it, if any
 * @returns the number to show
 * @example
 * n(150, "%") // → { number: 150, unit: "%" }
 * n(1.2) // → { number: 1.2 }
 */
export function n(number: number, unit?: string): Shown {
  return unit === undefined ? { number } : { number, unit };
}

/**
 * Throw a `#VALUE!`-kind problem.
 *
 * @param argument the argument at fault, as the user names it
 * @param got what it held (US units), or undefined when nothing was given
 * @param rule the rule broken, with {0}, {1} … slots for `amounts`
 * @param amounts further amounts (US units)
 * @example
 * fail("flow", { quantity: "flow", us: -1 }, "must be 0 or more") // throws "flow: got -1 gpm; must be 0 or more"
 */
export function fail(argument: string, got: Shown | undefined, rule: string, ...amounts: Shown[]): never {
  throw new HeadroomError({ kind: "value", argument, got, rule, amounts });
}

/**
 * Throw a `#N/A`-kind problem: the table has no entry for these inputs.
 *
 * @param argument the argument at fault, as the user names it
 * @param got what it held (US units), or undefined when nothing was given
 * @param rule the rule broken, with {0}, {1} … slots for `amounts`
 * @param amounts further amounts (US units)
 * @example
 * notInTable("nominal", { number: 3.5, unit: "in" }, "the table has no gate valve at this size")
 * // throws "nominal: got 3.5 in; the table has no gate valve at this size"
 */
export function notInTable(argument: string, got: Shown | undefined, rule: string, ...amounts: Shown[]): never {
  throw new HeadroomError({ kind: "na", argument, got, rule, amounts });
}

/**
 * Throw a `#NUM!`-kind problem: outside a physical envelope.
 *
 * @param argument the argument at fault, as the user names it
 * @param got what it held (US units), or undefined when nothing was given
 * @param rule the rule broken, with {0}, {1} … slots for `amounts`
 * @param amounts further amounts (US units)
 * @example
 * outsideEnvelope("shutoff_ratio", { number: 1.5 }, "must be at most {0} × rated", { number: 1.4 })
 * // throws "shutoff_ratio: got 1.5; must be at most 1.4 × rated"
 */
export function outsideEnvelope(argument: string, got: Shown | undefined, rule: string, ...amounts: Shown[]): never {
  throw new HeadroomError({ kind: "number", argument, got, rule, amounts });
}

/**
 * Require a finite, non-negative (unless `signed`) result of a computation whose inputs were checked.
 *
 * A result that overflows still names the argument whose size caused it (`argument`, `got`), and what would fix it.
 * −0 comes back as 0.
 *
 * @param x the result, in whatever unit it has
 * @param argument the argument to blame, as the user names it
 * @param got what that argument held (US units)
 * @param signed whether a negative result is allowed
 * @returns x, the same unit (never −0)
 * @example
 * finiteOr(-0, "flow", { quantity: "flow", us: 0 }) // → 0
 * finiteOr(-4.33, "rise", { quantity: "length", us: -10 }, true) // → -4.33
 * finiteOr(-1, "flow", { quantity: "flow", us: 5 }) // throws "flow: got 5 gpm; must give a result of 0 or more"
 */
export function finiteOr(x: number, argument: string, got: Shown, signed = false): number {
  if (!Number.isFinite(x)) fail(argument, got, "must be smaller: the result is too large to compute");
  if (!signed && x < 0) fail(argument, got, "must give a result of 0 or more");
  return x === 0 ? 0 : x; // never −0
}

/**
 * Format a value for a message: numbers to 6 significant digits, never "-0"; text quoted; cells as Excel says them.
 *
 * A data type (an object cell value such as `{ type: "Entity", text }`) is named by its type and text, an error value
 * by its error text.
 *
 * @param x a number, or what a cell handed over
 * @returns the text
 * @example
 * show(0.333333333) // → "0.333333"
 * show(-0) // → "0"
 * show("abc") // → "\"abc\""
 * show(null) // → "empty"
 * show(true) // → "TRUE"
 * show([[1, 2]]) // → "a range"
 * show({ type: "Entity", text: "Pump house" }) // → "a data type (Entity \"Pump house\")"
 * show({ type: "Error", basicValue: "#DIV/0!" }) // → "#DIV/0!"
 */
export function show(x: unknown): string {
  if (typeof x === "number") {
    if (!Number.isFinite(x)) return String(x);
    const r = Number(x.toPrecision(6));
    return r === 0 ? "0" : String(r);
  }
  if (typeof x === "string") return JSON.stringify(x);
  if (x === null || x === undefined) return "empty";
  if (typeof x === "boolean") return x ? "TRUE" : "FALSE";
  if (Array.isArray(x)) return "a range";
  if (typeof x === "object") return showCellObject(x as { type?: unknown; basicValue?: unknown; text?: unknown });
  return String(x);
}

/**
 * A cell value that is an object, as Excel's data types are (Excel.CellValue: `{ type: "Entity", text, ... }`): an
 * error as its error text, another data type by its type and its text, anything else as "an object".
 */
function showCellObject(x: { type?: unknown; basicValue?: unknown; text?: unknown }): string {
  if (typeof x.type !== "string") return "an object";
  if (x.type === "Error" && typeof x.basicValue === "string") return x.basicValue;
  return `a data type (${x.type}${typeof x.text === "string" ? ` ${JSON.stringify(x.text)}` : ""})`;
}

/**
 * One shown thing in `units`: a quantity converted with its unit name, a number with its fixed unit, text as it is.
 *
 * @param s the thing to show (a quantity in US units)
 * @param units the unit system of the message, "US" or "SI"
 * @returns the text
 * @example
 * showShown({ quantity: "pressure", us: 100 }, "SI") // → "6.89476 bar" (100 × 0.0689476)
 * showShown({ number: 150, unit: "%" }, "SI") // → "150 %"
 */
export function showShown(s: Shown, units: UnitSystem): string {
  if ("quantity" in s) return `${show(fromUS(s.quantity, s.us, units))} ${unitName(s.quantity, units)}`;
  if ("number" in s) return s.unit === undefined ? show(s.number) : `${show(s.number)} ${s.unit}`;
  if ("text" in s) return s.text;
  return show(s.cell);
}

/**
 * The one-line message of a problem in `units`.
 *
 *   "<argument>: got <value>; <rule>"   or, when nothing was given,   "<argument> <rule>"
 *
 * @param p the problem: argument, what it held and the rule with its amounts (US units)
 * @param units the unit system of the message, "US" or "SI"
 * @returns the message
 * @example
 * formatProblem({ argument: "residual", got: { quantity: "pressure", us: 80 },
 *   rule: "must be below the static pressure {0}", amounts: [{ quantity: "pressure", us: 70 }] }, "US")
 * // → "residual: got 80 psi; must be below the static pressure 70 psi"
 * formatProblem({ argument: "segments", rule: "must have at least one row" }, "SI")
 * // → "segments must have at least one row"
 */
export function formatProblem(p: Pick<Problem, "argument" | "got" | "rule" | "amounts">, units: UnitSystem): string {
  const amounts = p.amounts ?? [];
  const rule = p.rule.replace(/\{(\d+)\}/g, (_, i: string) => {
    const a = amounts[Number(i)];
    return a === undefined ? "" : showShown(a, units);
  });
  return p.got === undefined ? `${p.argument} ${rule}` : `${p.argument}: got ${showShown(p.got, units)}; ${rule}`;
}
