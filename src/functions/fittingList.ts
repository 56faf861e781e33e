/**
 * Fittings as users type them: one fitting ("E", "elbow", "gate valve") or a list with counts ("2E T GV",
 * "E, E, T, CV", "elbow tee check", "2 E", "3 x tee"). The codes are the abbreviations of the standard's hydraulic
 * calculation form (EE, E, LtE, T, BV, GV, CV), case-insensitive; plain words and simple plurals ("2 elbows") are
 * accepted too. A word that is not a fitting is named in the error together with the accepted codes.
 */
import { fail, show } from "../engine/errors";
import { FITTING_CODES, type Fitting } from "../engine/fittings";
import { cellBasicValue, isBlank } from "./args";

/** Spellings of each fitting code (lower case, hyphens and "°" read as spaces). */
export const FITTING_ALIASES: Readonly<Record<Fitting, readonly string[]>> = {
  EE: ["ee", "45", "45 elbow", "45 ell", "45 degree elbow", "45 deg elbow", "elbow 45"],
  E: ["e", "elbow", "ell", "90", "90 elbow", "90 ell", "90 degree elbow", "90 deg elbow", "standard elbow", "std elbow", "elbow 90"],
  LtE: ["lte", "lt elbow", "long elbow", "long turn elbow", "long radius elbow", "long ell", "long turn", "long turn 90", "long turn 90 elbow"],
  T: ["t", "tee", "cross", "tee or cross", "branch tee", "tee branch"],
  BV: ["bv", "butterfly", "butterfly valve", "bfv"],
  GV: ["gv", "gate", "gate valve"],
  CV: ["cv", "check", "check valve", "swing check", "swing check valve"],
};

/** The accepted codes and words, for messages. */
export const FITTING_HELP =
  'EE (45° elbow, "45"), E (elbow), LtE (long-turn elbow), T (tee, cross), BV (butterfly), GV (gate), CV (check, swing check)';

const LOOKUP: ReadonlyMap<string, Fitting> = new Map(
  FITTING_CODES.flatMap((f) => [[f.toLowerCase(), f] as const, ...FITTING_ALIASES[f].map((a) => [a, f] as const)]),
);

/** Longest alias, in words. */
const MAX_WORDS = Math.max(...[...LOOKUP.keys()].map((k) => k.split(" ").length));

/** The largest count one entry may carry. */
const MAX_COUNT = 999;

/** One entry of a list: a fitting and how many of it. */
export interface FittingCount {
  fitting: Fitting;
  count: number;
}

/** The fitting a phrase names, or undefined; a trailing plural "s"/"es" is forgiven ("elbows", "crosses"). */
function lookup(phrase: string): Fitting | undefined {
  const exact = LOOKUP.get(phrase);
  if (exact) return exact;
  if (phrase.endsWith("es") && LOOKUP.has(phrase.slice(0, -2))) return LOOKUP.get(phrase.slice(0, -2));
  if (phrase.endsWith("s") && phrase.length > 2) return LOOKUP.get(phrase.slice(0, -1));
  return undefined;
}

/** The longest fitting phrase starting at words[i] (not crossing a comma): [fitting, words used]. */
function phraseAt(words: readonly string[], i: number, first?: string): [Fitting, number] | undefined {
  for (let n = Math.min(MAX_WORDS, words.length - i); n >= 1; n--) {
    const slice = words.slice(i, i + n);
    if (slice.includes(",")) continue;
    if (first !== undefined) slice[0] = first;
    const f = lookup(slice.join(" "));
    if (f) return [f, n];
  }
  return undefined;
}

function countOf(text: string, list: unknown, name: string): number {
  const n = Number(text);
  if (!Number.isInteger(n) || n < 1 || n > MAX_COUNT) {
    fail(name, { cell: list }, `the count ${text} must be a whole number from 1 to ${MAX_COUNT}`);
  }
  return n;
}

/**
 * Read a list of fittings. Separators: commas, semicolons, "+", "&", "and", or spaces. A count may lead an entry,
 * glued ("2E", "2x E") or apart ("2 E", "2 x E"). The result keeps the order typed; an empty list is an error.
 */
export function fittingListArg(value: unknown, name = "list"): FittingCount[] {
  value = cellBasicValue(value);
  if (isBlank(value)) fail(name, undefined, `is empty: type fittings such as "2E T GV" or "elbow, tee, check"; codes: ${FITTING_HELP}`);
  if (typeof value !== "string" && typeof value !== "number") fail(name, { cell: value }, `must be text such as "2E T GV"`);
  const text = String(value);
  // a hyphen joins words ("long-turn"); before a count it would be a minus sign, and a count is 1 or more
  if (/(^|[\s,;+&])[-−]\s*\d/.test(text)) fail(name, { cell: text }, "a count must be a whole number of 1 or more, never negative");
  const original = text
    .replace(/[,;+&]/g, " , ")
    .replace(/[-_°º]/g, " ")
    .trim()
    .split(/\s+/);
  const words = original.map((w) => (w.toLowerCase() === "and" ? "," : w.toLowerCase()));
  const out: FittingCount[] = [];
  function bad(at: number): never {
    fail(name, { cell: text }, `${show(original[at])} is not a fitting; use ${FITTING_HELP}, with an optional count ("2E")`);
  }
  let i = 0;
  while (i < words.length) {
    const w = words[i];
    if (w === ",") {
      i++;
      continue;
    }
    const plain = phraseAt(words, i);
    if (plain) {
      out.push({ fitting: plain[0], count: 1 });
      i += plain[1];
      continue;
    }
    const apart = /^(\d+)[x×*]?$/.exec(w);
    if (apart) {
      let j = i + 1;
      if (j < words.length && /^[x×*]$/.test(words[j])) j++;
      if (j >= words.length || words[j] === ",") {
        fail(name, { cell: text }, `the count ${show(original[i])} has no fitting after it; use ${FITTING_HELP}`);
      }
      const after = phraseAt(words, j);
      if (!after) bad(j);
      out.push({ fitting: after[0], count: countOf(apart[1], text, name) });
      i = j + after[1];
      continue;
    }
    const glued = /^(\d+)[x×*]?([a-z].*)$/.exec(w);
    if (glued) {
      const rest = phraseAt(words, i, glued[2]);
      if (!rest) bad(i);
      out.push({ fitting: rest[0], count: countOf(glued[1], text, name) });
      i += rest[1];
      continue;
    }
    bad(i);
  }
  if (out.length === 0) fail(name, { cell: text }, `names no fitting; type fittings such as "2E T GV"; codes: ${FITTING_HELP}`);
  return out;
}

/** One fitting (FITTINGLENGTH): a code or plain word, no count; a list is an error that points to FITTINGS. */
export function fittingArg(value: unknown, name = "fitting"): Fitting {
  value = cellBasicValue(value);
  if (isBlank(value)) fail(name, undefined, `is empty: type one of ${FITTING_HELP}`);
  if (typeof value !== "string" && typeof value !== "number") fail(name, { cell: value }, `must be one of ${FITTING_HELP}`);
  let items: FittingCount[];
  try {
    items = fittingListArg(value, name);
  } catch {
    fail(name, { cell: value }, `must be one of ${FITTING_HELP}`);
  }
  if (items.length !== 1 || items[0].count !== 1) {
    fail(name, { cell: value }, "FITTINGLENGTH takes one fitting: use FITTINGS for a list or a count");
  }
  return items[0].fitting;
}
