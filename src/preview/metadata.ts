/**
 * The generated custom-functions metadata (functions.json, written by custom-functions-metadata from
 * src/functions/functions.ts) and its binding to the functions module: the one list of Headroom's cell functions.
 *
 * The preview never keeps a list of its own: every function it knows comes from this metadata, and every entry must
 * have its implementation in the module (a top-level export whose upper-cased name is the entry's id).
 */

/** One parameter of a function, as the generator writes it. */
export interface ParameterMetadata {
  name: string;
  description?: string;
  type?: string;
  dimensionality?: "scalar" | "matrix";
  optional?: boolean;
  repeating?: boolean;
}

/** One function, as the generator writes it. */
export interface FunctionMetadata {
  id: string;
  name: string;
  description?: string;
  parameters: ParameterMetadata[];
  result: { type?: string; dimensionality?: "scalar" | "matrix" };
  options?: Record<string, unknown>;
}

/** The whole functions.json. */
export interface FunctionsMetadata {
  functions: FunctionMetadata[];
}

/** The add-in's function namespace (manifest.xml `Namespace`): cells write `=HEADROOM.FRICTION(...)`. */
export const NAMESPACE = "HEADROOM";

/** A cell function as the module exports it: arguments as Excel passes them (null for omitted), any result. */
export type CellFunction = (...args: unknown[]) => unknown;

/** A metadata entry paired with its implementation. */
export interface BoundFunction {
  meta: FunctionMetadata;
  /** The name in a formula, e.g. "HEADROOM.FRICTION". */
  formulaName: string;
  impl: CellFunction;
  spills: boolean;
}

/**
 * Pair every metadata entry with its implementation in `module`. Throws (naming the entries) when an entry has no
 * implementation, or when an entry asks for something the preview does not do (repeating or streaming functions):
 * a preview that silently drops a function would show #NAME? where Excel shows a value.
 */
export function bindFunctions(metadata: FunctionsMetadata, module: Record<string, unknown>): BoundFunction[] {
  if (!metadata || !Array.isArray(metadata.functions)) throw new Error("functions.json has no `functions` list");
  const byUpperName = new Map<string, CellFunction>();
  for (const [key, value] of Object.entries(module)) {
    if (typeof value === "function") byUpperName.set(key.toUpperCase(), value as CellFunction);
  }
  const missing: string[] = [];
  const unsupported: string[] = [];
  const bound: BoundFunction[] = [];
  for (const meta of metadata.functions) {
    const impl = byUpperName.get(meta.id.toUpperCase());
    if (!impl) {
      missing.push(meta.id);
      continue;
    }
    const opts = meta.options ?? {};
    if (opts.stream || opts.cancelable || meta.parameters.some((p) => p.repeating)) unsupported.push(meta.id);
    bound.push({
      meta,
      formulaName: `${NAMESPACE}.${meta.name.toUpperCase()}`,
      impl,
      spills: meta.result?.dimensionality === "matrix",
    });
  }
  if (missing.length) throw new Error(`functions.json lists functions the module does not export: ${missing.join(", ")}`);
  if (unsupported.length)
    throw new Error(`the preview does not run streaming, cancelable or repeating functions: ${unsupported.join(", ")}`);
  return bound;
}
