/**
 * README.md's "Estimate walk-through", rebuilt and recalculated: the tables of that section are read (cells typed,
 * segment rows typed, results shown), the sheet they describe is built in the preview's formula engine
 * (HyperFormula running Headroom's cell functions, as `npm start` does), and every result shown is compared with
 * what the sheet computes, to the precision shown. Change a number on that page and this test says which.
 *
 * Tables are found by the comment line just above them:
 *   <!-- walkthrough:cells -->  | cell | item | typed | shows |   (a blank "shows" is an input or checked elsewhere)
 *   <!-- walkthrough:typed -->  | row | A: … | B: … | …          (what is typed in each cell of those rows)
 *   <!-- walkthrough:shows -->  | row | I: … | J: … | …          (what those cells show; blank means blank)
 * A shown value is a number (its decimals give the precision), a "quoted sentence", or an array written as Excel
 * writes array constants, {1, 2; 3, 4}, read from the cell it is shown for.
 */
import { readFileSync } from "node:fs";
import { beforeAll, describe, expect, it } from "vitest";
import { DetailedCellError, HyperFormula } from "hyperformula";
import * as functions from "../../src/functions/functions";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { generatedMetadata } from "../preview/metadataFixture";

const readme = readFileSync(new URL("../../README.md", import.meta.url), "utf8");

/** The walk-through section: from its heading to the next second-level heading. */
function section(): string {
  const start = readme.indexOf("## Estimate walk-through");
  if (start < 0) throw new Error("README.md has no '## Estimate walk-through' section");
  const next = readme.indexOf("\n## ", start + 5);
  return readme.slice(start, next < 0 ? undefined : next);
}

type Kind = "cells" | "typed" | "shows";
interface Table {
  kind: Kind;
  header: string[];
  rows: string[][];
}

/** The marked tables of the section, in order. */
function tables(text: string): Table[] {
  const lines = text.split("\n");
  const out: Table[] = [];
  lines.forEach((line, i) => {
    const m = /^<!-- walkthrough:(cells|typed|shows) -->$/.exec(line.trim());
    if (!m) return;
    const body: string[][] = [];
    for (let j = i + 1; j < lines.length && lines[j].trim().startsWith("|"); j++) {
      body.push(lines[j].trim().replace(/^\|/, "").replace(/\|$/, "").split("|").map((c) => c.trim()));
    }
    if (body.length < 3) throw new Error(`walk-through table after line ${i + 1} has no rows`);
    out.push({ kind: m[1] as Kind, header: body[0], rows: body.slice(2) });
  });
  return out;
}

/** What a typed cell holds: a formula, a number or text (backticks stripped); undefined when blank. */
function typedContent(text: string): string | number | undefined {
  const t = text.replace(/^`(.*)`$/, "$1").trim();
  if (t === "") return undefined;
  if (t.startsWith("=")) return t;
  const n = Number(t);
  return Number.isNaN(n) ? t : n;
}

function address(a1: string): { row: number; col: number } {
  const m = /^([A-Z]+)(\d+)$/.exec(a1);
  if (!m) throw new Error(`not a cell address: ${a1}`);
  const col = [...m[1]].reduce((n, ch) => n * 26 + ch.charCodeAt(0) - 64, 0) - 1;
  return { row: Number(m[2]) - 1, col };
}

function a1(row: number, col: number): string {
  let c = "";
  for (let n = col + 1; n > 0; n = Math.floor((n - 1) / 26)) c = String.fromCharCode(65 + ((n - 1) % 26)) + c;
  return `${c}${row + 1}`;
}

interface Expectation {
  cell: string;
  shown: string;
}

/** Read the section into what is typed where and what is shown where. */
function readWalkthrough(): { typed: Map<string, string | number>; shows: Expectation[] } {
  const typed = new Map<string, string | number>();
  const shows: Expectation[] = [];
  for (const t of tables(section())) {
    if (t.kind === "cells") {
      for (const [cell, , content, shown] of t.rows) {
        const c = typedContent(content ?? "");
        if (c !== undefined) typed.set(cell, c);
        if (shown !== undefined && shown !== "") shows.push({ cell, shown });
      }
      continue;
    }
    const letters = t.header.slice(1).map((h) => h.split(":")[0].trim());
    for (const row of t.rows) {
      letters.forEach((letter, j) => {
        const cell = `${letter}${row[0]}`;
        const text = row[j + 1] ?? "";
        if (t.kind === "typed") {
          const c = typedContent(text);
          if (c !== undefined) typed.set(cell, c);
        } else {
          shows.push({ cell, shown: text });
        }
      });
    }
  }
  return { typed, shows };
}

/** Parse a shown value into a grid of shown cells (a single value is a 1 × 1 grid). */
function shownGrid(shown: string): string[][] {
  if (shown.startsWith("{") && shown.endsWith("}")) {
    return shown
      .slice(1, -1)
      .split(";")
      .map((r) => r.split(",").map((c) => c.trim()));
  }
  return [[shown]];
}

/** The difference between a computed value and a shown one, as a message, or undefined when they agree. */
function mismatch(actual: unknown, shown: string): string | undefined {
  if (actual instanceof DetailedCellError) return `error ${actual.value}: ${actual.message}`;
  if (shown === "") return actual === null || actual === "" ? undefined : `expected blank, got ${JSON.stringify(actual)}`;
  if (shown.startsWith('"')) return actual === shown.slice(1, -1) ? undefined : `got ${JSON.stringify(actual)}`;
  const value = Number(shown.replace(/,/g, ""));
  if (Number.isNaN(value)) return `README shows something that is not a value: ${shown} (the sheet computes ${JSON.stringify(actual)})`;
  if (typeof actual !== "number") return `got ${JSON.stringify(actual)}`;
  const decimals = shown.includes(".") ? shown.split(".")[1].length : 0;
  return Math.abs(actual - value) <= 0.5 * 10 ** -decimals + 1e-9 ? undefined : `got ${actual}`;
}

describe("README estimate walk-through", () => {
  let hf: HyperFormula;
  let walk: ReturnType<typeof readWalkthrough>;
  const value = (cell: string) => {
    const { row, col } = address(cell);
    return hf.getCellValue({ sheet: 0, row, col });
  };

  beforeAll(async () => {
    registerHeadroomFunctions(await generatedMetadata(), functions);
    walk = readWalkthrough();
    let rows = 0;
    let cols = 0;
    for (const cell of walk.typed.keys()) {
      const { row, col } = address(cell);
      rows = Math.max(rows, row + 1);
      cols = Math.max(cols, col + 1);
    }
    const grid: (string | number | null)[][] = Array.from({ length: rows }, () => Array.from({ length: cols }, () => null));
    for (const [cell, content] of walk.typed) {
      const { row, col } = address(cell);
      grid[row][col] = content;
    }
    hf = HyperFormula.buildFromSheets({ Estimate: grid }, { licenseKey: "gpl-v3", useArrayArithmetic: true, smartRounding: false });
  });

  it("reads the sheet and its results from the README", () => {
    expect(walk.typed.size).toBeGreaterThanOrEqual(40);
    expect(walk.shows.length).toBeGreaterThanOrEqual(25);
  });

  it("uses the functions together: design area, run, hose allowance, margin, verdict, pump boost and size", () => {
    const formulas = [...walk.typed.values()].filter((c): c is string => typeof c === "string" && c.startsWith("=")).join(" ");
    for (const name of ["AREADEMAND", "PIPERUN", "SIZEFOR", "HOSEALLOWANCE", "MARGIN", "VERDICT", "PUMPBOOST", "PUMPSIZE", "PUMPCURVE", "SUPPLYCURVE", "DESIGNDENSITY", "PIPEID", "CFACTOR"]) {
      expect(formulas, `the walk-through does not use ${name}`).toContain(`HEADROOM.${name}(`);
    }
  });

  it("computes every result shown, to the precision shown", () => {
    const problems: string[] = [];
    for (const { cell, shown } of walk.shows) {
      const start = address(cell);
      shownGrid(shown).forEach((row, i) =>
        row.forEach((s, j) => {
          const at = a1(start.row + i, start.col + j);
          const why = mismatch(value(at), s);
          if (why) problems.push(`${at} shows ${s || "blank"} in the README: ${why}`);
        }),
      );
    }
    expect(problems).toEqual([]);
  });

  it("has no error anywhere on the sheet", () => {
    const errors: string[] = [];
    const values = hf.getSheetValues(0);
    values.forEach((row, r) =>
      row.forEach((v, c) => {
        if (v instanceof DetailedCellError) errors.push(`${a1(r, c)}: ${v.value} ${v.message}`);
      }),
    );
    expect(errors).toEqual([]);
  });

  it("the pump closes the gap: supply plus pump at least the demand pressure plus the 10 psi margin", () => {
    // B33 = supply at the demand flow + the pump's pressure; B27 the demand pressure; 10 psi margin (common practice)
    expect(value("B33") as number).toBeGreaterThanOrEqual((value("B27") as number) + 10);
    // and without the pump the verdict says a pump is needed
    expect(String(value("B29"))).toMatch(/^Pump needed/);
  });
});
