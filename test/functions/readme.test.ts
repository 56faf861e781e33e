/**
 * Every example formula in README.md, written "`=HEADROOM.NAME(literal, ...)` → result", is evaluated here with the
 * cell functions and compared with the result shown, to the precision shown. Results may be a number, a quoted
 * sentence, or an array written as Excel writes array constants: {1, 2; 3, 4}.
 */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import * as functions from "../../src/functions/functions";

const readme = readFileSync(new URL("../../README.md", import.meta.url), "utf8");
const EXAMPLE = /`=HEADROOM\.([A-Z0-9]+)\((.*?)\)`\s*→\s*("[^"]*"|\{[^}]*\}|-?[\d.,]+)/g;

/** Split an argument list on commas outside quotes; "" between commas is an omitted argument (null). */
function parseArgs(text: string): unknown[] {
  if (text.trim() === "") return [];
  const out: unknown[] = [];
  let cur = "";
  let quoted = false;
  for (const ch of text) {
    if (ch === '"') quoted = !quoted;
    if (ch === "," && !quoted) {
      out.push(cur);
      cur = "";
    } else cur += ch;
  }
  out.push(cur);
  return out.map((a) => {
    const t = (a as string).trim();
    if (t === "") return null;
    if (t.startsWith('"')) return t.slice(1, -1);
    const n = Number(t);
    if (Number.isNaN(n)) throw new Error(`README example argument is not a literal: ${t}`);
    return n;
  });
}

function expectShown(actual: unknown, shown: string): void {
  if (shown.startsWith('"')) {
    expect(actual).toBe(shown.slice(1, -1));
    return;
  }
  const value = Number(shown.replace(/,/g, ""));
  const decimals = shown.includes(".") ? shown.split(".")[1].length : 0;
  expect(typeof actual).toBe("number");
  expect(Math.abs((actual as number) - value)).toBeLessThanOrEqual(0.5 * 10 ** -decimals + 1e-9);
}

const examples = [...readme.matchAll(EXAMPLE)].map((m) => ({ name: m[1], args: m[2], shown: m[3], text: m[0] }));

describe("README examples", () => {
  it("there are examples to check", () => {
    expect(examples.length).toBeGreaterThanOrEqual(15);
  });

  it.each(examples)("$text", ({ name, args, shown }) => {
    const fn = (functions as Record<string, unknown>)[name.toLowerCase()];
    expect(typeof fn, `README names a function that does not exist: ${name}`).toBe("function");
    const result = (fn as (...a: unknown[]) => unknown)(...parseArgs(args));
    if (shown.startsWith("{")) {
      const rows = shown.slice(1, -1).split(";").map((r) => r.split(",").map((c) => c.trim()));
      const got = result as unknown[][];
      rows.forEach((row, i) => row.forEach((cell, j) => expectShown(got[i][j], cell)));
    } else {
      expectShown(result, shown);
    }
  });
});
