/**
 * The engine's doc comments, in one format, and their worked values evaluated.
 *
 * Every exported function of src/engine/*.ts carries a JSDoc comment whose lines read:
 *
 *   One-line summary.
 *
 *     formula, indented (where there is one)
 *
 *   Further prose: conditions, errors, the arithmetic of the example worked by hand.
 *
 *   @param name meaning, unit          one per parameter, every parameter, in the signature's order
 *   @returns meaning, unit             unless the function returns void or never
 *   @see [NFPA 13] what is taken       the source: a key of docs/references.md, "(common practice)" or "definition"
 *   @example
 *   frictionRate(500, 4.026, 120) // ≈ 0.0718 psi/ft
 *
 * Tags come in that order. Prose labels ("Source:", "Worked value:", "Example:", "Formula:", "Units:") are not used in
 * the engine's doc comments. An exported constant has a doc comment whose first line is its summary (with its unit)
 * and, where it is a published value, an @see line; a derived constant may carry an @example.
 *
 * The grammar of an @example block (every line up to the next tag):
 *
 *   - An expression, on one line or continued on the following lines until its brackets close. It is parsed with
 *     TypeScript's parser and interpreted here node by node, never run as code: it may hold number literals (a minus
 *     sign before one), strings, true, false, null, undefined, array literals, object literals with plain keys,
 *     the names the module exports (a constant, or a function called with such arguments), and on a value `.name`,
 *     `[0]` and a call of a function that value holds as its own property, or as a method of its own class
 *     (headLoss("US").loss(...)). Nothing else: no operators, no other names, no properties inherited beyond that.
 *   - Its checks: a `//` comment after its last line, and any further lines that begin with `//`. A check is
 *
 *       [path] ≈ value [text]     numbers within half a unit of the last decimal written (1968 means ±0.5, 0.0718
 *                                 means ±0.00005); in an array every element, in an object only the keys written
 *       [path] → value [text]     exactly equal (numbers Object.is, arrays and objects deeply and completely)
 *       throws "message" [text]   the expression throws an error with exactly this message
 *
 *     `path` reads into the result: `.flow`, `[1][1]`, `.lineFlows[0]`. `value` is a number, a "string", true, false,
 *     null, undefined, or an array or object literal of those. `text` after the value (a unit, the arithmetic) is
 *     for the reader and is not read.
 *
 * The few exported functions that have no @example, or no @see, are listed below with the reason; a listed function
 * that gains one fails the test, so the lists stay true.
 */
import { readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import ts from "typescript";
import { describe, expect, it } from "vitest";

const ENGINE = fileURLToPath(new URL("../../src/engine/", import.meta.url));

/** Whether `target` holds `key` itself, not through its prototype (Object.hasOwn, which lib ES2021 lacks). */
const hasOwn = (target: object, key: PropertyKey): boolean => Object.prototype.hasOwnProperty.call(target, key);

/**
 * Whether `key` is a method of the class `target` is an instance of (an engine class such as the head loss): found on
 * its own prototype, which is not a built-in one, and not the constructor. Nothing further up the chain.
 */
function classMethod(target: object, key: PropertyKey): boolean {
  const proto: unknown = Object.getPrototypeOf(target);
  if (proto === null || proto === Object.prototype || proto === Function.prototype || proto === Array.prototype) return false;
  return key !== "constructor" && hasOwn(proto as object, key) && typeof (proto as Record<PropertyKey, unknown>)[key] === "function";
}

/** Exported functions with no @example, and why. */
const NO_EXAMPLE: Readonly<Record<string, string>> = {};

/** Exported functions with no @see, and why: there is no published source for what they do. */
const NO_SOURCE: Readonly<Record<string, string>> = {
  "errors.ts q": "builds the data of an error message",
  "errors.ts n": "builds the data of an error message",
  "errors.ts fail": "throws an error; no engineering value",
  "errors.ts notInTable": "throws an error; no engineering value",
  "errors.ts outsideEnvelope": "throws an error; no engineering value",
  "errors.ts finiteOr": "guards a result; no engineering value",
  "errors.ts show": "writes a number for a message",
  "errors.ts showShown": "writes a quantity for a message",
  "errors.ts formatProblem": "writes an error message",
  "decision.ts formatPressure": "writes a pressure for the verdict sentence; the rounding is Headroom's own",
  "decision.ts formatFlow": "writes a flow for the verdict sentence; the rounding is Headroom's own",
  "decision.ts stateSentence": "the verdict's wording is Headroom's own",
  "decision.ts verdictSentence": "joins the verdict's sentences; the wording is Headroom's own",
  "pipes.ts listSizes": "writes a schedule's sizes for a message",
  "sprinkler.ts ceilCount": "rounding arithmetic",
  "pump.ts roundUpToStep": "rounding arithmetic; the steps it is given carry their own source",
};

/** Exported constants that are not published values, and why (every other exported constant has an @see line). */
const OWN_VALUES: Readonly<Record<string, string>> = {
  "cfactor.ts MATERIAL_CODES": "the vocabulary's codes",
  "design.ts HAZARD_CODES": "the vocabulary's codes",
  "design.ts AREA_SYSTEM_CODES": "the vocabulary's codes",
  "fittings.ts FITTING_CODES": "the vocabulary's codes",
  "pipes.ts SCHEDULE_CODES": "the vocabulary's codes",
  "design.ts AREA_SPAN_SLACK": "Headroom's tolerance for an area typed in rounded metric",
  "curve.ts SUPPLY_CURVE_POINTS": "a chart default",
  "curve.ts SUPPLY_CURVE_FLOW_FACTOR": "a chart default",
  "pump.ts RATED_PRESSURE_STEP_PSI": "the vocabulary's rounding rule for PUMPSIZE",
  "pump.ts RATED_PRESSURE_STEP_BAR": "the vocabulary's rounding rule for PUMPSIZE",
  "units.ts QUANTITIES": "unit names, with the factors defined above it",
  "gridded.ts GRID_SEARCH_TOLERANCE": "the grid search's own tolerance",
  "gridded.ts GRID_FLOOR_TOLERANCE": "the grid search's own tolerance where the network solve's floor is reached",
  "gridded.ts DEFAULT_FEED_LINE": "the vocabulary's default",
  "gridded.ts GRID_TIE_TOLERANCE": "the grid search's own tolerance",
};

const PROSE_LABEL = /\b(Source|Worked value|Example|Formula|Units?):/;
const SOURCE_START = /^(\[[A-Z][^\]]*\]|\(common practice\)|definition\b)/;
const TAG_ORDER = ["param", "returns", "see", "example"];

// ---------------------------------------------------------------------------------------------------------------------
// Reading the doc comments

interface Tag {
  name: string;
  /** the text after the tag name, continuation lines joined with "\n" */
  text: string;
  /** the text after the tag name on the tag's own line */
  head: string;
  /** 1-based line in the file of the tag */
  line: number;
  /** each line of the tag after the first, as written (for @example) */
  lines: { text: string; line: number }[];
}

interface Doc {
  /** the comment's lines without the leading " * " */
  body: string[];
  tags: Tag[];
  /** 1-based line of the comment's first line */
  line: number;
}

interface Exported {
  file: string;
  name: string;
  kind: "function" | "constant";
  doc: Doc | undefined;
  params: string[];
  returnType: string | undefined;
}

function parseDoc(comment: string, firstLine: number): Doc {
  const raw = comment.replace(/^\/\*\*/, "").replace(/\*\/$/, "").split("\n");
  const body = raw.map((l) => l.replace(/^\s*\* ?/, "").replace(/\s+$/, ""));
  if (body.length > 0 && body[0].trim() === "") body.shift();
  else if (body.length > 0) body[0] = body[0].trim();
  const startOffset = raw.length - body.length;
  if (body.length > 0 && body[body.length - 1].trim() === "") body.pop();
  const tags: Tag[] = [];
  body.forEach((text, i) => {
    const line = firstLine + i + startOffset;
    const m = /^@(\w+)\s?(.*)$/.exec(text.trim());
    if (m) tags.push({ name: m[1], text: m[2], head: m[2], line, lines: [] });
    else if (tags.length > 0) {
      const tag = tags[tags.length - 1];
      tag.lines.push({ text, line });
      tag.text += `\n${text.trim()}`;
    }
  });
  return { body, tags, line: firstLine };
}

/** The JSDoc comment just before a statement (line comments such as eslint's may stand between). */
function docOf(node: ts.Node, sf: ts.SourceFile): Doc | undefined {
  const ranges = ts.getLeadingCommentRanges(sf.text, node.getFullStart()) ?? [];
  const docs = ranges.filter((r) => sf.text.startsWith("/**", r.pos));
  const last = docs[docs.length - 1];
  if (!last) return undefined;
  return parseDoc(sf.text.slice(last.pos, last.end), sf.getLineAndCharacterOfPosition(last.pos).line + 1);
}

function isExported(node: ts.Node): boolean {
  return (ts.canHaveModifiers(node) ? ts.getModifiers(node) ?? [] : []).some((m) => m.kind === ts.SyntaxKind.ExportKeyword);
}

function readEngineFile(file: string): { exported: Exported[]; allDocs: Doc[] } {
  const text = readFileSync(join(ENGINE, file), "utf8");
  const sf = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true, ts.ScriptKind.TS);
  const exported: Exported[] = [];
  for (const st of sf.statements) {
    if (!isExported(st)) continue;
    if (ts.isFunctionDeclaration(st) && st.name) {
      exported.push({
        file,
        name: st.name.text,
        kind: "function",
        doc: docOf(st, sf),
        params: st.parameters.map((p) => p.name.getText(sf)),
        returnType: st.type?.getText(sf),
      });
    } else if (ts.isVariableStatement(st)) {
      for (const d of st.declarationList.declarations) {
        exported.push({ file, name: d.name.getText(sf), kind: "constant", doc: docOf(st, sf), params: [], returnType: undefined });
      }
    }
  }
  const allDocs = [...text.matchAll(/\/\*\*[\s\S]*?\*\//g)].map((m) =>
    parseDoc(m[0], sf.getLineAndCharacterOfPosition(m.index).line + 1),
  );
  return { exported, allDocs };
}

/** What is wrong with the layout of one exported function's or constant's doc comment. */
function layoutProblems(e: Exported): string[] {
  const key = `${e.file} ${e.name}`;
  const doc = e.doc;
  if (!doc) return [`${key}: no doc comment`];
  const problems: string[] = [];
  const say = (what: string) => problems.push(`${key}: ${what}`);
  const [summary, second] = doc.body;
  if (!summary || summary.startsWith("@")) say("no one-line summary");
  else if (second !== undefined && second.trim() !== "" && !second.trim().startsWith("@")) {
    say("the summary runs onto a second line (one line, then a blank line)");
  }
  const order = doc.tags.map((t) => TAG_ORDER.indexOf(t.name));
  const unknown = doc.tags.filter((t) => !TAG_ORDER.includes(t.name)).map((t) => `@${t.name}`);
  if (unknown.length > 0) say(`tags outside the format: ${unknown.join(", ")}`);
  if (order.some((o, i) => i > 0 && o >= 0 && o < order[i - 1])) say(`tags out of order (${TAG_ORDER.map((t) => `@${t}`).join(", ")})`);
  const sees = doc.tags.filter((t) => t.name === "see");
  for (const s of sees) if (!SOURCE_START.test(s.text)) say(`@see starts with a source key, "(common practice)" or "definition": ${s.text}`);
  const examples = doc.tags.filter((t) => t.name === "example");
  if (e.kind === "function") {
    const documented = doc.tags.filter((t) => t.name === "param").map((t) => t.text.split(/\s/)[0]);
    if (documented.join(",") !== e.params.join(",")) say(`@param ${documented.join(", ")} against parameters ${e.params.join(", ")}`);
    for (const p of doc.tags.filter((t) => t.name === "param")) if (!/^\S+ \S/.test(p.text)) say(`@param ${p.text} says nothing`);
    const returnsNothing = e.returnType === "void" || e.returnType === "never";
    const returns = doc.tags.filter((t) => t.name === "returns");
    if (!returnsNothing && returns.length !== 1) say("no @returns (or more than one)");
    if (sees.length === 0 && !(key in NO_SOURCE)) say("no @see source");
    if (sees.length > 0 && key in NO_SOURCE) say("has an @see: take it off NO_SOURCE");
    if (examples.length === 0 && !(key in NO_EXAMPLE)) say("no @example");
    if (examples.length > 0 && key in NO_EXAMPLE) say("has an @example: take it off NO_EXAMPLE");
  } else {
    if (sees.length === 0 && !(key in OWN_VALUES)) say("a published value with no @see source (or list it in OWN_VALUES)");
    if (sees.length > 0 && key in OWN_VALUES) say("has an @see: take it off OWN_VALUES");
    if (doc.tags.some((t) => t.name === "param" || t.name === "returns")) say("a constant has no @param or @returns");
  }
  return problems;
}

// ---------------------------------------------------------------------------------------------------------------------
// The example grammar

/** A number written in a check, with the half unit of its last written decimal. */
class Approx {
  constructor(
    readonly value: number,
    readonly text: string,
  ) {}
  get tolerance(): number {
    const m = /^-?\d*(?:\.(\d+))?(?:[eE]([-+]?\d+))?$/.exec(this.text);
    if (!m) throw new Error(`not a number as written: ${this.text}`);
    const decimals = (m[1]?.length ?? 0) - Number(m[2] ?? 0);
    return 0.5 * 10 ** -decimals;
  }
}

type Exports = Readonly<Record<string, unknown>>;

/** Interpret one node of an example expression; `exports` null for a check's value (literals only). */
function interpret(node: ts.Node, exports: Exports | null, approx: boolean, sf: ts.SourceFile): unknown {
  const refuse = (): never => {
    throw new Error(`the example grammar does not allow ${ts.SyntaxKind[node.kind]}: ${node.getText(sf)}`);
  };
  const own = (target: unknown, key: string | number): unknown => {
    if (target === null || (typeof target !== "object" && typeof target !== "function") || !(hasOwn(target, key) || classMethod(target, key))) {
      throw new Error(`${node.getText(sf)}: ${String(key)} is not an own property of the value`);
    }
    return (target as Record<string | number, unknown>)[key];
  };
  const value = (n: ts.Node): unknown => interpret(n, exports, approx, sf);
  if (ts.isParenthesizedExpression(node)) return value(node.expression);
  if (ts.isNumericLiteral(node)) return approx ? new Approx(Number(node.text), node.getText(sf)) : Number(node.text);
  if (ts.isPrefixUnaryExpression(node) && node.operator === ts.SyntaxKind.MinusToken && ts.isNumericLiteral(node.operand)) {
    return approx ? new Approx(-Number(node.operand.text), node.getText(sf)) : -Number(node.operand.text);
  }
  if (ts.isStringLiteral(node) || ts.isNoSubstitutionTemplateLiteral(node)) return node.text;
  if (node.kind === ts.SyntaxKind.TrueKeyword) return true;
  if (node.kind === ts.SyntaxKind.FalseKeyword) return false;
  if (node.kind === ts.SyntaxKind.NullKeyword) return null;
  if (ts.isIdentifier(node) && node.text === "undefined") return undefined;
  if (ts.isArrayLiteralExpression(node)) {
    return node.elements.map((el) => (ts.isSpreadElement(el) || ts.isOmittedExpression(el) ? refuse() : value(el)));
  }
  if (ts.isObjectLiteralExpression(node)) {
    const out: Record<string, unknown> = {};
    for (const p of node.properties) {
      if (!ts.isPropertyAssignment(p) || !(ts.isIdentifier(p.name) || ts.isStringLiteral(p.name))) return refuse();
      if (p.name.text === "__proto__") return refuse();
      out[p.name.text] = value(p.initializer);
    }
    return out;
  }
  if (exports === null) return refuse();
  if (ts.isIdentifier(node)) {
    if (!hasOwn(exports, node.text)) throw new Error(`${node.text} is not an export of the module`);
    return exports[node.text];
  }
  if (ts.isPropertyAccessExpression(node) && ts.isIdentifier(node.name)) return own(value(node.expression), node.name.text);
  if (ts.isElementAccessExpression(node) && ts.isNumericLiteral(node.argumentExpression)) {
    return own(value(node.expression), Number(node.argumentExpression.text));
  }
  if (ts.isCallExpression(node)) {
    let self: unknown = undefined;
    let fn: unknown;
    if (ts.isPropertyAccessExpression(node.expression) && ts.isIdentifier(node.expression.name)) {
      self = value(node.expression.expression);
      fn = own(self, node.expression.name.text);
    } else {
      fn = value(node.expression);
    }
    if (typeof fn !== "function") throw new Error(`${node.expression.getText(sf)} is not a function`);
    const args = node.arguments.map((a) => (ts.isSpreadElement(a) ? refuse() : value(a)));
    return Reflect.apply(fn, self, args);
  }
  return refuse();
}

/** Parse `text` as one expression and interpret it. */
function evaluate(text: string, exports: Exports | null, approx = false): unknown {
  const sf = ts.createSourceFile("example.ts", `(${text}\n)`, ts.ScriptTarget.Latest, true, ts.ScriptKind.TS);
  const [statement, ...rest] = sf.statements;
  if (!statement || rest.length > 0 || !ts.isExpressionStatement(statement)) throw new Error(`not one expression: ${text}`);
  return interpret(statement.expression, exports, approx, sf);
}

interface Check {
  path: (string | number)[];
  op: "≈" | "→" | "throws";
  /** the value as written */
  value: string;
}

/** Where the brackets of `text` stand after it: their depth, or a string left open. */
function bracketDepth(text: string): number {
  let depth = 0;
  let quote: string | null = null;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (quote) {
      if (ch === "\\") i++;
      else if (ch === quote) quote = null;
    } else if (ch === '"' || ch === "'") quote = ch;
    else if ("([{".includes(ch)) depth++;
    else if (")]}".includes(ch)) depth--;
  }
  return quote ? Number.NaN : depth;
}

/** Split a code line at a `//` outside strings. */
function splitComment(line: string): [code: string, comment: string | undefined] {
  let quote: string | null = null;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i];
    if (quote) {
      if (ch === "\\") i++;
      else if (ch === quote) quote = null;
    } else if (ch === '"' || ch === "'") quote = ch;
    else if (ch === "/" && line[i + 1] === "/") return [line.slice(0, i), line.slice(i + 2)];
  }
  return [line, undefined];
}

/** The value written at the start of `text` (a number, a string, a keyword, a bracketed literal), and the rest. */
function leadingValue(text: string): [value: string, rest: string] {
  const number = /^-?\d+(?:\.\d+)?(?:[eE][-+]?\d+)?/.exec(text);
  if (number) return [number[0], text.slice(number[0].length)];
  const keyword = /^(true|false|null|undefined)\b/.exec(text);
  if (keyword) return [keyword[0], text.slice(keyword[0].length)];
  if (text.startsWith('"')) {
    const str = /^"(?:[^"\\]|\\.)*"/.exec(text);
    if (str) return [str[0], text.slice(str[0].length)];
  }
  if (text.startsWith("[") || text.startsWith("{")) {
    for (let end = 1; end <= text.length; end++) {
      if (bracketDepth(text.slice(0, end)) === 0) return [text.slice(0, end), text.slice(end)];
    }
  }
  throw new Error(`no value written in the check: ${text}`);
}

function parseCheck(comment: string): Check {
  const m = /^\s*((?:\.\w+|\[\d+\])*)\s*(≈|→|throws)\s+(.*)$/.exec(comment);
  if (!m) throw new Error(`a check is "[path] ≈ value", "[path] → value" or "throws \\"message\\"": ${comment.trim()}`);
  const path = [...m[1].matchAll(/\.(\w+)|\[(\d+)\]/g)].map((p) => (p[1] !== undefined ? p[1] : Number(p[2])));
  const [value, rest] = leadingValue(m[3]);
  if (rest !== "" && !/^[\s,:;)]/.test(rest)) throw new Error(`the value runs into the text after it: ${m[3]}`);
  if (m[2] === "throws" && (path.length > 0 || !value.startsWith('"'))) throw new Error(`throws takes a message and no path: ${comment}`);
  return { path, op: m[2] as Check["op"], value };
}

interface Example {
  file: string;
  owner: string;
  expression: string;
  checks: Check[];
  line: number;
}

/** The examples of one @example tag of `owner`. */
function parseExamples(file: string, owner: string, tag: Tag): Example[] {
  if (tag.head.trim() !== "") throw new Error(`${file}:${tag.line}: the example starts on the line after @example`);
  const out: Example[] = [];
  let code = "";
  let start = 0;
  for (const { text, line } of tag.lines) {
    const trimmed = text.trim();
    if (trimmed === "") throw new Error(`${file}:${line}: no blank line inside an @example`);
    if (trimmed.startsWith("//")) {
      const last = out[out.length - 1];
      if (code !== "" || !last) throw new Error(`${file}:${line}: a check with no expression before it`);
      last.checks.push(parseCheck(trimmed.slice(2)));
      continue;
    }
    const [part, comment] = splitComment(text);
    if (code === "") start = line;
    code += (code === "" ? "" : " ") + part.trim();
    const depth = bracketDepth(code);
    if (depth === 0) {
      out.push({ file, owner, expression: code, checks: comment === undefined ? [] : [parseCheck(comment)], line: start });
      code = "";
    } else if (comment !== undefined || !(depth > 0)) {
      throw new Error(`${file}:${line}: the brackets of the expression do not close: ${code}`);
    }
  }
  if (code !== "") throw new Error(`${file}:${start}: the expression does not end: ${code}`);
  for (const e of out) if (e.checks.length === 0) throw new Error(`${file}:${e.line}: ${e.expression} checks nothing`);
  return out;
}

function follow(result: unknown, path: (string | number)[]): unknown {
  let v = result;
  for (const key of path) {
    if (v === null || typeof v !== "object" || !hasOwn(v, key)) throw new Error(`the result has no ${String(key)}`);
    v = (v as Record<string | number, unknown>)[key];
  }
  return v;
}

/** Compare `actual` with a value written after ≈: numbers to their written precision, objects on the keys written. */
function expectApprox(actual: unknown, written: unknown, where: string): void {
  if (written instanceof Approx) {
    expect(typeof actual, `${where}: a number`).toBe("number");
    const off = Math.abs((actual as number) - written.value);
    expect(off, `${where}: ${String(actual)} against ${written.text} ± ${written.tolerance}`).toBeLessThanOrEqual(written.tolerance * (1 + 1e-9));
  } else if (Array.isArray(written)) {
    expect(Array.isArray(actual), `${where}: an array`).toBe(true);
    expect((actual as unknown[]).length, `${where}: length`).toBe(written.length);
    written.forEach((w, i) => expectApprox((actual as unknown[])[i], w, `${where}[${i}]`));
  } else if (written !== null && typeof written === "object") {
    expect(actual !== null && typeof actual === "object", `${where}: an object`).toBe(true);
    for (const [k, w] of Object.entries(written)) expectApprox((actual as Record<string, unknown>)[k], w, `${where}.${k}`);
  } else {
    expect(actual, where).toBe(written);
  }
}

/** Evaluate an example against `exports` and apply its checks. */
function runExample(e: Pick<Example, "expression" | "checks">, exports: Exports): void {
  const thrown = e.checks.find((c) => c.op === "throws");
  if (thrown) {
    expect(e.checks.length, "a throws check stands alone").toBe(1);
    expect(() => evaluate(e.expression, exports)).toThrow(
      // an exact message: the whole text, not a part of it
      new RegExp(`^${(evaluate(thrown.value, null) as string).replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}$`),
    );
    return;
  }
  const result = evaluate(e.expression, exports);
  for (const c of e.checks) {
    const where = `${e.expression}${c.path.map((k) => (typeof k === "number" ? `[${k}]` : `.${k}`)).join("")}`;
    const actual = follow(result, c.path);
    if (c.op === "≈") expectApprox(actual, evaluate(c.value, null, true), where);
    else if (typeof actual === "number") expect(Object.is(actual, evaluate(c.value, null)), `${where}: ${actual} → ${c.value}`).toBe(true);
    else expect(actual, where).toStrictEqual(evaluate(c.value, null));
  }
}

// ---------------------------------------------------------------------------------------------------------------------
// The engine

const files = readdirSync(ENGINE)
  .filter((f) => f.endsWith(".ts"))
  .sort();
const read = files.map((file) => ({ file, ...readEngineFile(file) }));
const exported = read.flatMap((r) => r.exported);
const examples = exported.flatMap((e) =>
  (e.doc?.tags ?? []).filter((t) => t.name === "example").flatMap((t) => parseExamples(e.file, e.name, t)),
);

describe("the example grammar", () => {
  const fake: Exports = {
    double: (x: number) => 2 * x,
    pair: (a: unknown, b: unknown) => ({ a, b, list: [a, b] }),
    make: () => ({ times: (x: number) => 3 * x }),
    LIMIT: 7,
  };

  it("reads literals, exported names, calls, fields and elements", () => {
    expect(evaluate(`pair(-1.5, { static: 70, "test flow": [1, "a", null, true] })`, fake)).toEqual({
      a: -1.5,
      b: { static: 70, "test flow": [1, "a", null, true] },
      list: [-1.5, { static: 70, "test flow": [1, "a", null, true] }],
    });
    expect(evaluate("make().times(double(LIMIT))", fake)).toBe(42); // by hand: 3 × (2 × 7)
    expect(evaluate("pair(1, 2).list[1]", fake)).toBe(2);
  });

  it("refuses anything beyond literals and the module's own exports", () => {
    for (const text of [
      "double(1 + 2)",
      "process.exit(1)",
      "globalThis",
      "double.constructor",
      "pair(1, 2).hasOwnProperty('a')",
      "make()['times'](1)",
      "double(...[1])",
      "({ __proto__: null })",
      "double(1), double(2)",
      "LIMIT; double(1)",
      "(() => 1)()",
      "new Date()",
    ]) {
      expect(() => evaluate(text, fake), text).toThrow();
    }
    expect(() => evaluate("double(1)", null), "a check's value holds no call").toThrow();
  });

  it("parses checks and finds where the value ends", () => {
    expect(parseCheck(" ≈ 0.0718 psi/ft")).toEqual({ path: [], op: "≈", value: "0.0718" });
    expect(parseCheck(" .lineFlows[0] → [1, 2] gpm")).toEqual({ path: ["lineFlows", 0], op: "→", value: "[1, 2]" });
    expect(parseCheck(' throws "flow: got -1 gpm; must be 0 or more"')).toEqual({
      path: [],
      op: "throws",
      value: '"flow: got -1 gpm; must be 0 or more"',
    });
    expect(() => parseCheck(" = 5")).toThrow();
    expect(() => parseCheck(" ≈ 5psi")).toThrow();
    expect(() => parseCheck(" .a throws \"x\"")).toThrow();
  });

  it("reads an example block: continued expressions, trailing and following checks", () => {
    const tag: Tag = {
      name: "example",
      text: "",
      head: "",
      line: 1,
      lines: [
        { text: "pair(1,", line: 2 },
        { text: "  2) // .a → 1", line: 3 },
        { text: "// .b → 2", line: 4 },
        { text: "double(3) // ≈ 6", line: 5 },
      ],
    };
    const parsed = parseExamples("f.ts", "pair", tag);
    expect(parsed.map((e) => [e.expression, e.checks.length, e.line])).toEqual([
      ["pair(1, 2)", 2, 2],
      ["double(3)", 1, 5],
    ]);
    expect(() => parseExamples("f.ts", "x", { ...tag, lines: [{ text: "double(3)", line: 2 }] })).toThrow(/checks nothing/);
  });

  it("≈ holds to half a unit of the last written decimal, and fails beyond it", () => {
    // by hand: 0.0718 written to 4 decimals allows ± 0.00005; 1968 allows ± 0.5; 6.05e5 allows ± 500
    const at = (x: number) => ({ value: () => x });
    runExample({ expression: "value()", checks: [parseCheck("≈ 0.0718")] }, at(0.07184));
    expect(() => runExample({ expression: "value()", checks: [parseCheck("≈ 0.0718")] }, at(0.07186))).toThrow();
    runExample({ expression: "value()", checks: [parseCheck("≈ 1968")] }, at(1968.3));
    expect(() => runExample({ expression: "value()", checks: [parseCheck("≈ 1968")] }, at(1968.6))).toThrow();
    runExample({ expression: "value()", checks: [parseCheck("≈ 6.05e5")] }, at(605_400));
    expect(() => runExample({ expression: "value()", checks: [parseCheck("≈ 6.05e5")] }, at(605_600))).toThrow();
  });

  it("→ is exact, ≈ on an object reads the keys written, throws compares the whole message", () => {
    const fns: Exports = {
      value: () => ({ flow: 254.31, kind: "segment", list: [0, -0] }),
      boom: () => {
        throw new Error("flow: got -1 gpm; must be 0 or more");
      },
    };
    runExample({ expression: "value()", checks: [parseCheck("≈ { flow: 254.3 }"), parseCheck(".kind → \"segment\"")] }, fns);
    expect(() => runExample({ expression: "value()", checks: [parseCheck(".flow → 254.3")] }, fns)).toThrow();
    expect(() => runExample({ expression: "value()", checks: [parseCheck(".list[1] → 0")] }, fns)).toThrow();
    expect(() => runExample({ expression: "value()", checks: [parseCheck(".list → [0, 0]")] }, fns)).toThrow();
    runExample({ expression: "boom()", checks: [parseCheck('throws "flow: got -1 gpm; must be 0 or more"')] }, fns);
    expect(() => runExample({ expression: "boom()", checks: [parseCheck('throws "flow: got -1 gpm"')] }, fns)).toThrow();
    expect(() => runExample({ expression: "value()", checks: [parseCheck('throws "x"')] }, fns)).toThrow();
  });
});

describe("engine doc comments", () => {
  it("are read from every engine file", () => {
    expect(files.length).toBeGreaterThanOrEqual(14);
    expect(exported.filter((e) => e.kind === "function").length).toBeGreaterThanOrEqual(60);
  });

  it.each(read.map((r) => [r.file, r] as const))("%s: every export in the one format", (_, r) => {
    expect(r.exported.flatMap(layoutProblems)).toEqual([]);
  });

  it.each(read.map((r) => [r.file, r] as const))("%s: no prose labels", (file, r) => {
    const labelled = r.allDocs.flatMap((d) => d.body.map((text, i) => ({ text, line: d.line + i })).filter((l) => PROSE_LABEL.test(l.text)));
    expect(labelled.map((l) => `${file}:${l.line} ${l.text.trim()}`)).toEqual([]);
  });

  it("the exception lists name exported functions and constants", () => {
    const names = new Set(exported.map((e) => `${e.file} ${e.name}`));
    const stale = [...Object.keys(NO_EXAMPLE), ...Object.keys(NO_SOURCE), ...Object.keys(OWN_VALUES)].filter((k) => !names.has(k));
    expect(stale).toEqual([]);
  });
});

describe("engine examples, evaluated", () => {
  it("there are examples to evaluate", () => {
    expect(examples.length).toBeGreaterThanOrEqual(exported.filter((e) => e.kind === "function").length);
  });

  it.each(examples.map((e) => [`${e.file}:${e.line} ${e.expression}`, e] as const))("%s", async (_, e) => {
    const module = (await import(`../../src/engine/${e.file.replace(/\.ts$/, "")}.ts`)) as Exports;
    runExample(e, module);
  });
});
