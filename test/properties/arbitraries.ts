/**
 * Shared generators for the property tests: plausible inputs of each kind, and the values no argument of that kind
 * may turn into a number.
 */
import { fc } from "@fast-check/vitest";

const d = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

export const arb = {
  flow: d(1, 5000), // gpm
  smallFlow: d(1, 300),
  pressure: d(1, 200), // psi
  diameter: d(0.5, 24), // in
  length: d(0, 2000), // ft
  cFactor: d(60, 150),
  kFactor: d(1.4, 33.6),
  density: d(0.05, 0.6),
  coverage: d(50, 400),
  area: d(500, 6000),
  spacing: d(6, 15),
  rise: d(-300, 300),
  /** a flow test: static above residual, test flow */
  flowTest: fc
    .record({ s: d(20, 150), frac: d(0.05, 0.95), q: d(200, 4000) })
    .map(({ s, frac, q }) => ({ static: s, residual: s * frac, testFlow: q })),
  units: fc.constantFrom("US", "SI", "us", " si ", null),
};

/** Values no numeric argument may accept. */
export const NOT_NUMBERS: unknown[] = [NaN, Infinity, -Infinity, "abc", "12 psi", true, false, [[1]], {}, 1e308, -1e308];
/** Values a required argument may not accept: empty. */
export const BLANKS: unknown[] = [null, undefined, "", "   "];
/** Values a positive quantity may not accept. */
export const NOT_POSITIVE: unknown[] = [0, -1, -0.001, "-5"];
/** Values a non-negative quantity may not accept. */
export const NEGATIVE: unknown[] = [-1, -0.001, "-5"];
/** Units codes that are not "US" or "SI". */
export const BAD_UNITS: unknown[] = ["metres", "usa", 5, true, [[1]]];

/** True when calling gives a cell error with a message, false when it gives anything else. */
export function givesError(call: () => unknown): boolean {
  try {
    const v = call();
    return v instanceof Error && typeof (v as { code?: string }).code === "string" && (v as Error).message.length > 0;
  } catch (e) {
    const err = e as { code?: string; message?: string };
    return typeof err.code === "string" && err.code.startsWith("#") && typeof err.message === "string" && err.message.length > 0;
  }
}

/** The value a spill, or a scalar, holds in every cell: all numbers finite. */
export function allFinite(v: unknown): boolean {
  if (Array.isArray(v)) return v.every(allFinite);
  return typeof v === "number" ? Number.isFinite(v) : typeof v === "string";
}
