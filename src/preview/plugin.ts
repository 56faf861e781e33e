/**
 * Headroom's cell functions inside HyperFormula, driven by the generated metadata.
 *
 * One HyperFormula function plugin is built from functions.json and the functions module (./metadata): each entry
 * becomes `HEADROOM.<NAME>` with parameter metadata mapped from the generator's (optional, matrix → range), values
 * handed to the very function Excel calls, exactly as Excel would hand them (a blank cell or an omitted argument is
 * `null`, a range is a 2-D array rows first), a thrown CustomFunctions.Error turned into a HyperFormula CellError of
 * the same code with its message, and a matrix result turned into a spilled range (per-cell errors kept), sized at
 * parse time (./spill).
 *
 * Install the CustomFunctions stand-in (./customFunctionsShim) before any of these functions is called.
 */
import { ArraySize, CellError, EmptyValue, ErrorType, FunctionArgumentType, FunctionPlugin, HyperFormula, SimpleRangeValue } from "hyperformula";
import type { FunctionArgument, FunctionPluginDefinition, ImplementedFunctions } from "hyperformula";
import { bindFunctions, type BoundFunction, type FunctionsMetadata } from "./metadata";
import { SPILL_SHAPES, checkShapes, predictShape, type AstNode, type PredictedShape, type SpillShape } from "./spill";

/** Excel's error codes (CustomFunctions.ErrorCode values) and HyperFormula's nearest error type. */
const ERROR_TYPES: Record<string, ErrorType> = {
  "#VALUE!": ErrorType.VALUE,
  "#N/A": ErrorType.NA,
  "#NUM!": ErrorType.NUM,
  "#DIV/0!": ErrorType.DIV_BY_ZERO,
  "#NAME?": ErrorType.NAME,
  "#REF!": ErrorType.REF,
  "#NULL!": ErrorType.ERROR,
};

/** Is this a CustomFunctions.Error (the real one or the stand-in): an Error with an Excel error code? */
function errorCode(e: unknown): string | undefined {
  if (e && typeof e === "object" && typeof (e as { code?: unknown }).code === "string") {
    const code = (e as { code: string }).code;
    if (code in ERROR_TYPES) return code;
  }
  return undefined;
}

/** A thrown or returned value → CellError keeping its message. */
export function toCellError(e: unknown, fname: string): CellError {
  const code = errorCode(e);
  if (code) {
    const message = (e as { message?: unknown }).message;
    const text = typeof message === "string" && message !== code ? message : undefined;
    return new CellError(ERROR_TYPES[code], text);
  }
  const message = e instanceof Error ? e.message : String(e);
  return new CellError(ErrorType.VALUE, `${fname}: unexpected error: ${message}`);
}

type Raw = number | string | boolean | null;

/** A HyperFormula value → what Excel hands a custom function: raw number, text, boolean, or null for blank. */
function toExcelScalar(v: unknown): Raw | CellError {
  if (v === EmptyValue || v === undefined || v === null) return null;
  if (v instanceof CellError) return v;
  if (typeof v === "number" || typeof v === "string" || typeof v === "boolean") return v;
  // HyperFormula's rich numbers (dates, percents, currency) carry their raw number in `val`.
  if (typeof v === "object" && typeof (v as { val?: unknown }).val === "number") return (v as { val: number }).val;
  return String(v);
}

/** An argument value → the JS value for the function, or the first error it holds (Excel does not call then). */
function toExcelArg(v: unknown): unknown {
  if (v instanceof SimpleRangeValue) {
    const rows: Raw[][] = [];
    for (const row of v.data) {
      const out: Raw[] = [];
      for (const cellValue of row) {
        const x = toExcelScalar(cellValue);
        if (x instanceof CellError) return x;
        out.push(x);
      }
      rows.push(out);
    }
    return rows;
  }
  return toExcelScalar(v);
}

/** One cell of a function's result → a HyperFormula value. */
function fromResultScalar(v: unknown, fname: string): number | string | boolean | CellError {
  if (errorCode(v)) return toCellError(v, fname);
  if (v instanceof CellError) return v;
  if (v === null || v === undefined) return 0; // Excel shows a returned null as 0 (office-js#1503)
  if (typeof v === "number") {
    return Number.isFinite(v) ? v : new CellError(ErrorType.NUM, `${fname} gave ${v}, not a finite number`);
  }
  if (typeof v === "string" || typeof v === "boolean") return v;
  if (Array.isArray(v)) return new CellError(ErrorType.VALUE, `${fname} returned several values where one was expected`);
  return new CellError(ErrorType.VALUE, `${fname} returned a value of an unknown kind`);
}

/** A matrix result → a spilled range of exactly the reserved size, or one error. */
function fromResultMatrix(v: unknown, fname: string, shape: { rows: number; columns: number }): SimpleRangeValue | CellError {
  if (errorCode(v) || v instanceof CellError) return toCellError(v, fname);
  const rows: unknown[][] = Array.isArray(v) ? (v.every(Array.isArray) ? (v as unknown[][]) : [v]) : [[v]];
  const width = rows[0]?.length ?? 0;
  if (rows.length !== shape.rows || rows.some((r) => r.length !== width) || width !== shape.columns) {
    const got = `${rows.length}×${width}`;
    return new CellError(
      ErrorType.VALUE,
      `${fname} returned ${got} values where the preview reserved ${shape.rows}×${shape.columns}`,
    );
  }
  return SimpleRangeValue.onlyValues(rows.map((r) => r.map((x) => fromResultScalar(x, fname))));
}

/**
 * The arguments of a call whose parameters are all scalars handed over untouched (HyperFormula's NOERROR), evaluated
 * and turned into what Excel hands a function, `total` of them (a missing optional argument is null): what
 * HyperFormula's own argument handling gives in that case, without its per-call lists. The first error among them
 * is returned instead, as HyperFormula would return it. Undefined when an argument is a range: HyperFormula's own
 * path then takes the call (it broadcasts a range over a scalar parameter, or intersects it), evaluating afresh.
 */
function scalarArguments(plugin: FunctionPlugin, asts: AstNode[], state: unknown, total: number): unknown[] | CellError | undefined {
  const evaluate = (plugin as unknown as { evaluateAst(a: AstNode, s: unknown): unknown }).evaluateAst;
  const values: unknown[] = [];
  let error: CellError | undefined;
  for (const ast of asts) {
    const v = evaluate.call(plugin, ast, state);
    if (v instanceof SimpleRangeValue) return undefined;
    if (error === undefined && v instanceof CellError) error = v;
    values.push(v);
  }
  if (error) return error;
  const args: unknown[] = [];
  for (let i = 0; i < total; i++) args.push(i < values.length ? toExcelScalar(values[i]) : null);
  return args;
}

/** The generator's parameter → HyperFormula's argument metadata. */
function argumentFor(p: BoundFunction["meta"]["parameters"][number]): FunctionArgument {
  let argumentType: FunctionArgumentType;
  if (p.dimensionality === "matrix") argumentType = FunctionArgumentType.RANGE;
  else if (p.type === "number") argumentType = FunctionArgumentType.NUMBER;
  else if (p.type === "string") argumentType = FunctionArgumentType.STRING;
  else if (p.type === "boolean") argumentType = FunctionArgumentType.BOOLEAN;
  // `any`: handed over untouched; an error in the argument is the result (Excel does not call the function).
  else argumentType = FunctionArgumentType.NOERROR;
  return p.optional ? { argumentType, optionalArg: true } : { argumentType };
}

/** Height of a range argument written in the formula, or undefined when it is not a range of known size. */
function rangeHeightOf(plugin: FunctionPlugin, state: unknown): (node: AstNode) => number | undefined {
  return (node) => {
    if (!["CELL_RANGE", "CELL_REFERENCE", "ROW_RANGE", "ARRAY"].includes(node.type)) return undefined;
    const size = (plugin as unknown as { arraySizeForAst(a: unknown, s: unknown): ArraySize }).arraySizeForAst(node, state);
    return size.height;
  };
}

export interface HeadroomRegistration {
  functions: BoundFunction[];
  plugin: FunctionPluginDefinition;
}

let registered: FunctionPluginDefinition | undefined;

/**
 * Build the plugin class for these functions. Throws when the metadata and the module disagree or a spilling
 * function has no declared shape.
 */
export function buildHeadroomPlugin(
  metadata: FunctionsMetadata,
  module: Record<string, unknown>,
  shapes: Readonly<Record<string, SpillShape>> = SPILL_SHAPES,
): HeadroomRegistration {
  const functions = bindFunctions(metadata, module);
  const problems = checkShapes(
    functions.map((f) => f.meta),
    shapes,
  );
  if (problems.length) throw new Error(problems.join("; "));

  class HeadroomFunctions extends FunctionPlugin {
    static override implementedFunctions: ImplementedFunctions = {};
  }
  const proto = HeadroomFunctions.prototype as unknown as Record<string, unknown>;
  functions.forEach((f, i) => {
    const method = `headroom${i}`;
    const shape = f.spills ? shapes[f.meta.id] : undefined;
    const predict = (plugin: FunctionPlugin, ast: { args: AstNode[] }, state: unknown): PredictedShape | undefined =>
      shape ? predictShape(shape, { ...f.meta, name: f.formulaName }, ast.args, rangeHeightOf(plugin, state)) : undefined;
    HeadroomFunctions.implementedFunctions[f.formulaName] = {
      method,
      parameters: f.meta.parameters.map(argumentFor),
      ...(shape ? { sizeOfResultArrayMethod: `${method}Size`, vectorizationForbidden: true } : {}),
    };
    const required = f.meta.parameters.filter((p) => !p.optional).length;
    const total = f.meta.parameters.length;
    const signature = f.meta.parameters.map((p) => (p.optional ? `[${p.name}]` : p.name)).join(", ");
    // HyperFormula's metadata of this function, looked up once (not by `this.metadata(name)` on every call)
    const metadata = HeadroomFunctions.implementedFunctions[f.formulaName];
    // every parameter a scalar handed over untouched and a scalar result: such a call may take the direct path
    const scalarOnly = !shape && metadata.parameters!.every((p) => p.argumentType === FunctionArgumentType.NOERROR);
    /** The function on Excel's values → a HyperFormula value: its result (spilled into `reserved`) or its problem. */
    const callWith = (args: unknown[], reserved?: { rows: number; columns: number }): unknown => {
      let result: unknown;
      try {
        result = f.impl(...args);
      } catch (e) {
        return toCellError(e, f.formulaName);
      }
      return reserved ? fromResultMatrix(result, f.formulaName, reserved) : fromResultScalar(result, f.formulaName);
    };
    proto[method] = function (this: FunctionPlugin, ast: { args: AstNode[] }, state: unknown) {
      if (ast.args.length < required || ast.args.length > total) {
        const count = required === total ? `${total}` : `${required} to ${total}`;
        return new CellError(
          ErrorType.NA,
          `${f.formulaName} takes ${count} arguments (${signature}); ${ast.args.length} given`,
        );
      }
      if (scalarOnly) {
        const args = scalarArguments(this, ast.args, state, total);
        if (args !== undefined) return args instanceof CellError ? args : callWith(args);
      }
      const predicted = predict(this, ast, state);
      if (predicted && "error" in predicted) return new CellError(ErrorType.VALUE, predicted.error);
      const run = this.runFunction as unknown as (
        args: unknown,
        state: unknown,
        meta: unknown,
        fn: (...a: unknown[]) => unknown,
      ) => unknown;
      return run(ast.args, state, metadata, (...values: unknown[]) => {
        const args: unknown[] = [];
        for (const v of values) {
          const a = toExcelArg(v);
          if (a instanceof CellError) return a; // the first error an argument holds is the result
          args.push(a);
        }
        return callWith(args, predicted);
      });
    };
    if (shape) {
      proto[`${method}Size`] = function (this: FunctionPlugin, ast: { args: AstNode[] }, state: unknown) {
        const predicted = predict(this, ast, state);
        return !predicted || "error" in predicted ? ArraySize.scalar() : new ArraySize(predicted.columns, predicted.rows);
      };
    }
  });
  return { functions, plugin: HeadroomFunctions };
}

/**
 * Register Headroom's functions with HyperFormula (registration is global to the library), replacing an earlier
 * registration. Returns the bound functions.
 */
export function registerHeadroomFunctions(metadata: FunctionsMetadata, module: Record<string, unknown>): HeadroomRegistration {
  const reg = buildHeadroomPlugin(metadata, module);
  if (registered) HyperFormula.unregisterFunctionPlugin(registered);
  const names = Object.fromEntries(reg.functions.map((f) => [f.formulaName, f.formulaName]));
  HyperFormula.registerFunctionPlugin(reg.plugin, { enGB: names, enUS: names });
  registered = reg.plugin;
  return reg;
}
