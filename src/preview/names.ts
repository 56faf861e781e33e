/**
 * Workbook names between the user (and the file) and the preview's engine.
 *
 * Excel takes a name that starts with a letter, "_" or "\" and goes on with letters, digits, ".", "_", "\" and "?",
 * as long as it is not a cell reference of Excel's grid (columns A to XFD) or an R1C1 reference: `Flow1`, `Pump1`,
 * `Area2` and `ΔP` are names there. HyperFormula refuses every letters-then-digits name (it reads `Flow1` as a cell
 * reference, column FLOW) and letters beyond U+02AF (node_modules/hyperformula/es/NamedExpressions.mjs, isNameValid;
 * parser/parser-consts.mjs). Such a name is given an engine spelling of its own (`_hr_Flow1`): the engine only ever sees
 * that spelling, in its names and in formula text, and everything that leaves the workbook (formulas, names, the
 * saved file) carries the user's spelling again. Names the engine takes pass through unchanged.
 */
import { outsideQuotes } from "./formulaText";

/** The names the engine takes (HyperFormula 3.5's rule, see the module comment). */
const ENGINE_NAME = /^[A-Za-z\u00C0-\u02AF_][A-Za-z\u00C0-\u02AF0-9_.]*$/;
const A1_LIKE = /^[A-Za-z]+[0-9]+$/;
const R1C1_LIKE = /^[rR][0-9]*[cC][0-9]*$/;

/** Whether the engine takes `name` as it is. */
export function engineTakesName(name: string): boolean {
  return ENGINE_NAME.test(name) && !A1_LIKE.test(name) && !R1C1_LIKE.test(name);
}

/** The prefix of engine spellings: a name a user would hardly choose, and one the engine takes. */
const PREFIX = "_hr_";

/**
 * A name in formula text: letters (any script), digits, "_", ".", "\" and "?", not part of a longer name, not after
 * "$" or "!" (a reference's column, a sheet's own name), not before "(" (a function) or "!" (a sheet).
 */
const NAME_TOKEN = /(?<![\p{L}\p{N}_.\\?$!])[\p{L}_\\][\p{L}\p{N}_.\\?]*(?![\p{L}\p{N}_.\\?]|\s*[(!])/gu;

/** The user's spelling of names ⇄ the engine's, for names the engine refuses (others are the same in both). */
export class EngineNames {
  /** lower-case user spelling → engine spelling */
  private readonly toEngineName = new Map<string, string>();
  /** lower-case engine spelling → user spelling */
  private readonly toUserName = new Map<string, string>();

  /** `taken`: the names of the workbook, which an engine spelling must not collide with. */
  constructor(private readonly taken: Set<string> = new Set()) {}

  static for(names: Iterable<string>): EngineNames {
    return new EngineNames(new Set([...names].map((n) => n.toLowerCase())));
  }

  /** The engine's spelling of `name`, given one if the engine refuses the name and it has none yet. */
  define(name: string): string {
    this.taken.add(name.toLowerCase());
    const known = this.toEngineName.get(name.toLowerCase());
    if (known) return known;
    if (engineTakesName(name)) return name;
    const base = PREFIX + [...name].map((ch) => (/[A-Za-z\u00C0-\u02AF0-9_.]/.test(ch) ? ch : `_x${ch.codePointAt(0)!.toString(16)}_`)).join("");
    let spelling = base;
    for (let n = 2; this.taken.has(spelling.toLowerCase()) || this.toUserName.has(spelling.toLowerCase()); n++) spelling = `${base}_${n}`;
    this.toEngineName.set(name.toLowerCase(), spelling);
    this.toUserName.set(spelling.toLowerCase(), name);
    return spelling;
  }

  /** The engine's spelling of `name` if it has one, else `name`. */
  engineName(name: string): string {
    return this.toEngineName.get(name.toLowerCase()) ?? name;
  }

  /** The user's spelling of an engine name. */
  userName(engineName: string): string {
    return this.toUserName.get(engineName.toLowerCase()) ?? engineName;
  }

  /** Formula text as the user (or the file) writes it → as the engine reads it. */
  toEngine(formula: string): string {
    if (!this.toEngineName.size) return formula;
    return outsideQuotes(formula, (code) => code.replace(NAME_TOKEN, (t) => this.toEngineName.get(t.toLowerCase()) ?? t));
  }

  /** Formula text of the engine → as the user writes it. */
  fromEngine(formula: string): string {
    if (!this.toUserName.size) return formula;
    return outsideQuotes(formula, (code) => code.replace(NAME_TOKEN, (t) => this.toUserName.get(t.toLowerCase()) ?? t));
  }
}
