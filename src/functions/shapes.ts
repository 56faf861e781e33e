/**
 * The shape of a spilling cell function's result, known from its formula text alone: each spilling function declares
 * it beside its wrapper (see the topic files), and the preview host sizes its spills from it (src/preview/spill.ts).
 *
 * HyperFormula reserves a spill range when it parses a formula, before any value is known, so the shape may depend
 * only on the arguments as written: a constant, the row count of a range argument, or a number written as a literal
 * (its default when omitted).
 */

/** Rows (or columns) of the result: a constant, the row count of a range argument, or a literal number argument. */
export type Extent =
  | number
  | { rowsOf: string }
  | { literal: string; default: number; min: number; max: number };

export interface SpillShape {
  rows: Extent;
  columns: Extent;
}
