/**
 * Formula text between an .xlsx file and the preview engine.
 *
 * In a file, Excel stores an add-in's custom function as `_xldudf_<NAMESPACE>_<NAME>(…)`: the dots of
 * `HEADROOM.FRICTION` become underscores (../shared/notes/formula-engine-chart-browser.md §2). An underscore can
 * also be part of a name, so the way back is a lookup in the known function list, never a string rule. Newer
 * built-ins carry an `_xlfn.` (or `_xlfn._xlws.`) prefix in files; the engine wants them bare, and Excel wants the
 * prefix back. HyperFormula does not parse an uppercase exponent (`1E3` reads as a cell reference), so number
 * literals are written `1e3` for it.
 *
 * Text inside string literals ("…") and quoted sheet names ('…') is never touched.
 */
import { NAMESPACE } from "./metadata";

/** Built-ins that Excel writes with the `_xlfn.` prefix and that the engine knows (Excel 2010 and later). */
const XLFN_FUNCTIONS = new Set([
  "IFNA",
  "IFS",
  "SWITCH",
  "XOR",
  "XLOOKUP",
  "MAXIFS",
  "MINIFS",
  "CONCAT",
  "TEXTJOIN",
  "SEQUENCE",
  "FILTER",
  "SORT",
  "UNIQUE",
  "CEILING.MATH",
  "FLOOR.MATH",
]);

/** Apply `fn` to each stretch of formula text outside string literals and quoted sheet names. */
export function outsideQuotes(formula: string, fn: (code: string) => string): string {
  let out = "";
  let i = 0;
  while (i < formula.length) {
    const q = formula.slice(i).search(/["']/);
    if (q < 0) {
      out += fn(formula.slice(i));
      break;
    }
    out += fn(formula.slice(i, i + q));
    const quote = formula[i + q];
    let j = i + q + 1;
    // a doubled quote inside is an escaped quote
    while (j < formula.length) {
      if (formula[j] === quote) {
        if (formula[j + 1] === quote) j += 2;
        else break;
      } else j++;
    }
    out += formula.slice(i + q, j + 1);
    i = j + 1;
  }
  return out;
}

/** How a function of the add-in is spelled in a file: HEADROOM.FRICTION → _xldudf_HEADROOM_FRICTION. */
export function fileNameOf(formulaName: string): string {
  return `_xldudf_${formulaName.replace(/\./g, "_")}`;
}

/**
 * A formula as a user types it → formula text the engine parses: uppercase exponents (`=1E3`, which the engine would
 * read as a reference to cell E3) written lowercase. Text in quotes is left alone.
 */
export function normaliseTypedFormula(formula: string): string {
  if (!formula.startsWith("=")) return formula;
  return `=${outsideQuotes(formula.slice(1), lowerExponents)}`;
}

function lowerExponents(code: string): string {
  return code.replace(/(^|[^A-Za-z0-9_.$])(\d+\.?\d*|\.\d+)E([+-]?\d+)/g, (_m, pre, mant, exp) => `${pre}${mant}e${exp}`);
}

/**
 * An `_xldudf_HEADROOM_…` name the known list does not hold (a function of a newer or older Headroom): read as
 * HEADROOM.<rest>, so that the engine says which function it does not know.
 */
function ownNamespace(fileName: string): string | undefined {
  const prefix = `_XLDUDF_${NAMESPACE}_`;
  const upper = fileName.toUpperCase();
  return upper.startsWith(prefix) && upper.length > prefix.length ? `${NAMESPACE}.${upper.slice(prefix.length)}` : undefined;
}

/**
 * A formula as stored in a file (ExcelJS gives it without the leading "=") → formula text for the engine ("=…").
 * `known` lists the add-in's function names as written in cells ("HEADROOM.FRICTION"); an `_xldudf_` name not in
 * it and not in Headroom's namespace is left alone (the engine shows #NAME? for it, as Excel does without the
 * add-in).
 */
export function fromFileFormula(formula: string, known: Iterable<string>): string {
  const byFileName = new Map<string, string>();
  for (const name of known) byFileName.set(fileNameOf(name).toUpperCase(), name);
  const body = formula.startsWith("=") ? formula.slice(1) : formula;
  const mapped = outsideQuotes(body, (code) =>
    lowerExponents(
      code
        .replace(/_xldudf_[A-Za-z0-9_.]+(?=\s*\()/g, (m) => byFileName.get(m.toUpperCase()) ?? ownNamespace(m) ?? m)
        .replace(/_xlfn\.(?:_xlws\.)?/gi, "")
        .replace(/_xlws\./gi, ""),
    ),
  );
  return `=${mapped}`;
}

/**
 * Formula text of the engine ("=…") → the formula as a file stores it (no leading "="): the add-in's functions as
 * `_xldudf_…` (every name in the add-in's namespace, known or not: this direction is unambiguous), newer built-ins
 * with `_xlfn.`.
 */
export function toFileFormula(formula: string, known: Iterable<string>): string {
  const names = new Map<string, string>();
  for (const name of known) names.set(name.toUpperCase(), name);
  const body = formula.startsWith("=") ? formula.slice(1) : formula;
  return outsideQuotes(body, (code) =>
    code.replace(/(^|[^A-Za-z0-9_.])([A-Za-z][A-Za-z0-9_.]*)(?=\s*\()/g, (m, pre: string, name: string) => {
      const upper = name.toUpperCase();
      const own = names.get(upper) ?? (upper.startsWith(`${NAMESPACE}.`) ? upper : undefined);
      if (own) return `${pre}${fileNameOf(own)}`;
      if (XLFN_FUNCTIONS.has(upper)) return `${pre}_xlfn.${upper}`;
      return m;
    }),
  );
}
