/**
 * The one error type of the engine and of the argument layer.
 *
 * `kind` says how a cell shows it: "value" becomes `#VALUE!` (wrong type, out of range, unknown code, no answer),
 * "na" becomes `#N/A` (a table has no entry). The message is one line that names the argument, the value given and
 * what is allowed; Excel shows it on hover.
 */
export type HeadroomErrorKind = "value" | "na";

export class HeadroomError extends Error {
  readonly kind: HeadroomErrorKind;
  constructor(kind: HeadroomErrorKind, message: string) {
    super(message);
    this.name = "HeadroomError";
    this.kind = kind;
  }
}

/** Throw a `#VALUE!`-kind error with a message. */
export function fail(message: string): never {
  throw new HeadroomError("value", message);
}

/** Throw a `#N/A`-kind error: the table has no entry for these inputs. */
export function notInTable(message: string): never {
  throw new HeadroomError("na", message);
}

/** Format a number for a message: up to 4 significant decimals, no exponent noise for ordinary values. */
export function show(x: unknown): string {
  if (typeof x === "number") {
    if (!Number.isFinite(x)) return String(x);
    const r = Number(x.toPrecision(6));
    return String(r);
  }
  if (typeof x === "string") return JSON.stringify(x);
  if (x === null || x === undefined) return "empty";
  if (typeof x === "boolean") return x ? "TRUE" : "FALSE";
  return String(x);
}
