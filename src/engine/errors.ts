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

/** A quantity in US units, for `got` and `amounts`. */
export function q(quantity: Quantity, us: number): Shown {
  return { quantity, us };
}

/** A plain number (no unit conversion), for `got` and `amounts`. */
export function n(number: number, unit?: string): Shown {
  return unit === undefined ? { number } : { number, unit };
}

/** Throw a `#VALUE!`-kind problem. */
export function fail(argument: string, got: Shown | undefined, rule: string, ...amounts: Shown[]): never {
  throw new HeadroomError({ kind: "value", argument, got, rule, amounts });
}

/** Throw a `#N/A`-kind problem: the table has no entry for these inputs. */
export function notInTable(argument: string, got: Shown | undefined, rule: string, ...amounts: Shown[]): never {
  throw new HeadroomError({ kind: "na", argument, got, rule, amounts });
}

/** Throw a `#NUM!`-kind problem: outside a physical envelope. */
export function outsideEnvelope(argument: string, got: Shown | undefined, rule: string, ...amounts: Shown[]): never {
  throw new HeadroomError({ kind: "number", argument, got, rule, amounts });
}

/**
 * Require a finite, non-negative (unless `signed`) result of a computation whose inputs were checked: a result that
 * overflows still names the argument whose size caused it (`argument`, `got`), and what would fix it.
 */
export function finiteOr(x: number, argument: string, got: Shown, signed = false): number {
  if (!Number.isFinite(x)) fail(argument, got, "must be smaller: the result is too large to compute");
  if (!signed && x < 0) fail(argument, got, "must give a result of 0 or more");
  return x === 0 ? 0 : x; // never −0
}

/** Format a number for a message: 6 significant digits, no exponent noise for ordinary values, never "-0". */
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
  return String(x);
}

/** One shown thing in `units`. */
export function showShown(s: Shown, units: UnitSystem): string {
  if ("quantity" in s) return `${show(fromUS(s.quantity, s.us, units))} ${unitName(s.quantity, units)}`;
  if ("number" in s) return s.unit === undefined ? show(s.number) : `${show(s.number)} ${s.unit}`;
  if ("text" in s) return s.text;
  return show(s.cell);
}

/**
 * The one-line message of a problem in `units`:
 *   "<argument>: got <value>; <rule>"   or, when nothing was given,   "<argument> <rule>".
 */
export function formatProblem(p: Pick<Problem, "argument" | "got" | "rule" | "amounts">, units: UnitSystem): string {
  const amounts = p.amounts ?? [];
  const rule = p.rule.replace(/\{(\d+)\}/g, (_, i: string) => {
    const a = amounts[Number(i)];
    return a === undefined ? "" : showShown(a, units);
  });
  return p.got === undefined ? `${p.argument} ${rule}` : `${p.argument}: got ${showShown(p.got, units)}; ${rule}`;
}
