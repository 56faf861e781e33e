/**
 * The one place that turns an engine or argument problem into the host's error: the message in the user's units
 * (`HeadroomError.messageIn`, one formatter for the whole add-in) and the error type its kind asks for.
 *
 * In Excel, `CustomFunctions` is the runtime's global. In the unit tests and in the preview host a small stand-in of
 * the same shape is installed (test/setup.ts, src/preview/customFunctionsShim.ts), so this file is the same everywhere.
 */
import { HeadroomError, type HeadroomErrorKind } from "../engine/errors";
import type { UnitSystem } from "../engine/units";
import { unitsArg } from "./args";

/** The host error code of each kind of problem. */
function errorCode(kind: HeadroomErrorKind): CustomFunctions.ErrorCode {
  switch (kind) {
    case "na":
      return CustomFunctions.ErrorCode.notAvailable;
    case "number":
    case "converge":
      return CustomFunctions.ErrorCode.invalidNumber;
    default:
      return CustomFunctions.ErrorCode.invalidValue;
  }
}

/** The one-line message of any thrown value, in `units`: a problem's own words, anything else said as unexpected. */
export function messageOf(e: unknown, units: UnitSystem): string {
  if (e instanceof HeadroomError) return e.messageIn(units);
  if (e instanceof CustomFunctions.Error) return e.message ?? "";
  return `unexpected error: ${e instanceof Error ? e.message : String(e)}`;
}

/** Map a thrown value to a CustomFunctions.Error with its message in `units`; anything unforeseen is #VALUE!. */
export function toCellError(e: unknown, units: UnitSystem = "US"): CustomFunctions.Error {
  if (e instanceof CustomFunctions.Error) return e;
  const code = e instanceof HeadroomError ? errorCode(e.kind) : CustomFunctions.ErrorCode.invalidValue;
  return new CustomFunctions.Error(code, messageOf(e, units));
}

/** What `cell` hands through to a body besides the unit system: up to six of the cell function's own arguments. */
type Passed = [] | [unknown] | [unknown, unknown] | [unknown, unknown, unknown] | [unknown, unknown, unknown, unknown]
  | [unknown, unknown, unknown, unknown, unknown] | [unknown, unknown, unknown, unknown, unknown, unknown];

/**
 * Run a cell function's body with its `[units]` argument read first; any problem leaves as a CustomFunctions.Error
 * whose message speaks those units (a problem with `units` itself is said in US terms).
 *
 * The body gets the unit system and then `args`, the cell function's own arguments handed through, so that it can
 * be a constant of the module rather than a closure made on every call: `cell(units, frictionLoss, flow, diameter)`
 * allocates nothing on the way through (this runs on every recalculation of every cell). Declare such a body as a
 * `const` arrow function: the optimiser then knows it at the call inside cell() and inlines it, which it cannot do
 * from that call's own record once several cell functions pass through it. A closure `cell(units, (u) => …)` works
 * too, where a call's cost does not matter.
 */
export function cell<T, A extends Passed>(units: unknown, body: (u: UnitSystem, ...args: A) => T, ...args: A): T;
export function cell(
  units: unknown,
  body: (u: UnitSystem, ...args: unknown[]) => unknown,
  a?: unknown,
  b?: unknown,
  c?: unknown,
  d?: unknown,
  e?: unknown,
  f?: unknown,
): unknown {
  let u: UnitSystem = "US";
  try {
    u = unitsArg(units);
    const result = body(u, a, b, c, d, e, f);
    return result === 0 ? 0 : result; // never −0
  } catch (problem) {
    throw toCellError(problem, u);
  }
}

/**
 * For spilling functions: run one row's body; a problem becomes an error value in each of that row's `width` cells,
 * so the other rows still compute.
 */
export function cellRow(
  width: number,
  units: UnitSystem,
  body: () => (number | string)[],
): (number | string | CustomFunctions.Error)[] {
  try {
    return body();
  } catch (e) {
    const err = toCellError(e, units);
    return Array.from({ length: width }, () => err);
  }
}
