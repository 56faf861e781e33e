/**
 * How big a spilling function's result is, known from the formula text alone.
 *
 * HyperFormula reserves a spill range when it parses a formula, before any value is known (a function's
 * `sizeOfResultArrayMethod` sees only the syntax tree), so the preview must predict each spilling function's shape
 * from its arguments as written: the dimensions of a range argument, a number literal, or the default when the
 * argument is omitted. functions.json says which functions spill (result dimensionality "matrix") but not how much:
 * each spilling function declares its shape beside its wrapper (src/functions/, collected as SPILL_SHAPES); the
 * plugin refuses to start when a spilling function in the metadata has no shape, or a shape names a parameter the
 * function does not have.
 *
 * Excel sizes spills after computing; the preview cannot, so `points` of SUPPLYCURVE must be a literal number (or
 * omitted) in the preview. A cell reference there gives a #VALUE! that says so.
 */
import { SPILL_SHAPES } from "../functions/functions";
import type { Extent, SpillShape } from "../functions/shapes";
import type { FunctionMetadata } from "./metadata";

export { SPILL_SHAPES };
export type { Extent, SpillShape };

/** A minimal view of HyperFormula's syntax tree nodes (its AST types are not exported from the package root). */
export interface AstNode {
  type: string;
  value?: unknown;
  args?: AstNode[] | AstNode[][];
  expression?: AstNode;
  start?: unknown;
  end?: unknown;
}

/** The predicted shape, or why it cannot be predicted (a message for the cell). */
export type PredictedShape = { rows: number; columns: number } | { error: string };

/**
 * Check the declared shapes against the metadata: every spilling function has one, and every parameter a shape
 * names exists. Returns the problems found (empty when all is well).
 */
export function checkShapes(functions: FunctionMetadata[], shapes: Readonly<Record<string, SpillShape>> = SPILL_SHAPES): string[] {
  const problems: string[] = [];
  for (const f of functions) {
    const spills = f.result?.dimensionality === "matrix";
    const shape = shapes[f.id];
    if (spills && !shape) problems.push(`${f.id} spills but declares no spill shape (SPILL_SHAPES in src/functions/functions.ts)`);
    if (!spills && shape) problems.push(`${f.id} has a spill shape but does not return a matrix`);
    if (!shape) continue;
    for (const extent of [shape.rows, shape.columns]) {
      if (typeof extent === "number") continue;
      const name = "rowsOf" in extent ? extent.rowsOf : extent.literal;
      const param = f.parameters.find((p) => p.name === name);
      if (!param) problems.push(`${f.id}: spill shape names parameter "${name}", which the function does not have`);
      else if ("rowsOf" in extent && param.dimensionality !== "matrix")
        problems.push(`${f.id}: spill shape reads the rows of "${name}", which is not a range parameter`);
    }
  }
  return problems;
}

function unwrap(node: AstNode | undefined): AstNode | undefined {
  let n = node;
  while (n && n.type === "PARENTHESES" && n.expression) n = n.expression;
  return n;
}

/**
 * The number a literal argument stands for: a number, a unary minus/plus of one, or undefined for anything else
 * (references, names, expressions).
 */
function literalNumber(node: AstNode | undefined): number | undefined {
  const n = unwrap(node);
  if (!n) return undefined;
  if (n.type === "NUMBER" && typeof n.value === "number") return n.value;
  if ((n.type === "MINUS_UNARY_OP" || n.type === "PLUS_UNARY_OP") && (n as { value?: AstNode }).value) {
    const inner = literalNumber((n as unknown as { value: AstNode }).value);
    return inner === undefined ? undefined : n.type === "MINUS_UNARY_OP" ? -inner : inner;
  }
  return undefined;
}

/**
 * Predict one extent. `rangeHeight(node)` gives the height of a range argument's syntax node (undefined when the
 * node is not a range whose size is known from the text).
 */
function predictExtent(
  extent: Extent,
  meta: FunctionMetadata,
  args: AstNode[],
  rangeHeight: (node: AstNode) => number | undefined,
): number | { error: string } {
  if (typeof extent === "number") return extent;
  const name = "rowsOf" in extent ? extent.rowsOf : extent.literal;
  const index = meta.parameters.findIndex((p) => p.name === name);
  const node = index >= 0 ? unwrap(args[index]) : undefined;
  const fname = `${meta.name}`;
  if ("rowsOf" in extent) {
    if (!node || node.type === "EMPTY") return { error: `${fname}: ${name} is missing; give a range of cells such as A10:G14` };
    const h = rangeHeight(node);
    if (h === undefined || h < 1)
      return { error: `${fname}: in the preview, ${name} must be written as a range of cells such as A10:G14` };
    return h;
  }
  if (!node || node.type === "EMPTY") return extent.default;
  const v = literalNumber(node);
  if (v === undefined)
    return {
      error: `${fname}: in the preview, ${name} must be a number written in the formula (or left out for ${extent.default}), not a reference or expression`,
    };
  if (!Number.isInteger(v) || v < extent.min || v > extent.max)
    return { error: `${fname}: ${name} is ${v}; allowed: a whole number from ${extent.min} to ${extent.max}` };
  return v;
}

/** Predict the shape of a spilling call from its written arguments. */
export function predictShape(
  shape: SpillShape,
  meta: FunctionMetadata,
  args: AstNode[],
  rangeHeight: (node: AstNode) => number | undefined,
): PredictedShape {
  if (args.length > meta.parameters.length)
    return { error: `${meta.name}: ${args.length} arguments given; it takes at most ${meta.parameters.length}` };
  const rows = predictExtent(shape.rows, meta, args, rangeHeight);
  if (typeof rows !== "number") return rows;
  const columns = predictExtent(shape.columns, meta, args, rangeHeight);
  if (typeof columns !== "number") return columns;
  return { rows, columns };
}
