/**
 * The one place that turns an engine or argument error into the host's error type.
 *
 * In Excel, `CustomFunctions` is the runtime's global. In the unit tests and in the preview host a small stand-in of
 * the same shape is installed (test/setup.ts, src/preview/customFunctionsShim.ts), so this file is the same everywhere.
 */
import { HeadroomError } from "../engine/errors";

/** Map a thrown value to a CustomFunctions.Error: HeadroomError keeps its kind and message; anything else is #VALUE!. */
export function toCellError(e: unknown): CustomFunctions.Error {
  if (e instanceof CustomFunctions.Error) return e;
  if (e instanceof HeadroomError) {
    const code = e.kind === "na" ? CustomFunctions.ErrorCode.notAvailable : CustomFunctions.ErrorCode.invalidValue;
    return new CustomFunctions.Error(code, e.message);
  }
  const message = e instanceof Error ? e.message : String(e);
  return new CustomFunctions.Error(CustomFunctions.ErrorCode.invalidValue, `unexpected error: ${message}`);
}

/** Run a cell function's body; any error leaves as a CustomFunctions.Error with its message. */
export function cell<T>(body: () => T): T {
  try {
    return body();
  } catch (e) {
    throw toCellError(e);
  }
}

/**
 * For spilling functions: run one row's body; an error becomes an error value in each of that row's `width` cells,
 * so the other rows still compute.
 */
export function cellRow(width: number, body: () => (number | string)[]): (number | string | CustomFunctions.Error)[] {
  try {
    return body();
  } catch (e) {
    const err = toCellError(e);
    return Array.from({ length: width }, () => err);
  }
}
