/**
 * Runs the custom-functions metadata generator (the package custom-functions-metadata, the same code the webpack
 * plugin runs to write dist/functions.json) on the cell-function files and checks what Excel will show:
 * exactly the vocabulary's functions, each with a description and a description for every parameter.
 * The check itself is first tried on small made-up inputs, so a broken check cannot pass silently.
 */
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { generateCustomFunctionsMetadata } from "custom-functions-metadata";
import { VOCABULARY } from "./vocabulary";
import { functionFiles } from "../../scripts/function-files.mjs";
import * as functionsModule from "../../src/functions/functions";

interface Parameter {
  name: string;
  description?: string;
}
interface RegisteredFunction {
  id: string;
  name: string;
  description?: string;
  parameters: Parameter[];
}

/** Every problem with the metadata generated from `file` against the list of names; empty when all is well. */
async function metadataProblems(file: string | string[], vocabulary: string[]): Promise<string[]> {
  const result = await generateCustomFunctionsMetadata(file);
  const problems = result.errors.map((e) => `generator error: ${e}`);
  if (problems.length > 0) return problems;
  const functions: RegisteredFunction[] = result.metadataJson ? JSON.parse(result.metadataJson).functions : [];
  const byId = new Map(functions.map((f) => [f.id, f]));
  for (const name of vocabulary) {
    const f = byId.get(name);
    if (!f) {
      problems.push(`${name}: not registered`);
      continue;
    }
    if (f.name !== name) problems.push(`${name}: registered under the display name ${f.name}`);
    if (!f.description?.trim()) problems.push(`${name}: no description`);
    for (const p of f.parameters) {
      if (!p.description?.trim()) problems.push(`${name}: parameter ${p.name} has no description`);
    }
  }
  for (const f of functions) {
    if (!vocabulary.includes(f.id)) problems.push(`${f.id}: registered but not in the vocabulary list`);
  }
  return problems;
}

const scratch = mkdtempSync(path.join(tmpdir(), "headroom-metadata-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

function toy(name: string, source: string): string {
  const file = path.join(scratch, name);
  writeFileSync(file, source);
  return file;
}

const GOOD = `
/**
 * Doubles a flow.
 * @customfunction
 * @param flow flow to double (gpm)
 * @param units "US" or "SI"
 */
export function twice(flow: any, units?: any): number {
  return Number(flow) * 2;
}
`;

describe("the metadata check itself, on made-up inputs", () => {
  it("passes a function with its descriptions", async () => {
    expect(await metadataProblems(toy("good.ts", GOOD), ["TWICE"])).toEqual([]);
  });

  it("reports a missing parameter description and a missing function description", async () => {
    const file = toy("bare.ts", `/**\n * @customfunction\n * @param flow\n */\nexport function bare(flow: any): number {\n  return 1;\n}\n`);
    expect(await metadataProblems(file, ["BARE"])).toEqual(["BARE: no description", "BARE: parameter flow has no description"]);
  });

  it("reports a vocabulary function that is missing and one registered outside the vocabulary", async () => {
    expect(await metadataProblems(toy("good2.ts", GOOD), ["HALF"])).toEqual([
      "HALF: not registered",
      "TWICE: registered but not in the vocabulary list",
    ]);
  });

  it("reports generator errors (here a type alias, which the generator rejects)", async () => {
    const file = toy("alias.ts", `type Flow = number;\n/**\n * Flow.\n * @customfunction\n * @param flow a flow (gpm)\n */\nexport function f(flow: Flow): number {\n  return flow;\n}\n`);
    const problems = await metadataProblems(file, ["F"]);
    expect(problems.length).toBeGreaterThan(0);
    expect(problems[0]).toMatch(/^generator error: .*Flow/);
  });
});

describe("the cell-function files (scripts/function-files.mjs)", () => {
  it("are the topic files, and the generator finds exactly the vocabulary in them, each function and parameter described", async () => {
    const files = functionFiles().map((f) => path.basename(f));
    expect(files).toEqual(["decision.ts", "demand.ts", "piping.ts", "pump.ts", "supply.ts", "units.ts"]);
    const problems = await metadataProblems(functionFiles(), VOCABULARY);
    expect(problems).toEqual([]);
  });

  it("every function the functions module exports is a registered cell function", () => {
    // convertUnit is UNIT's converter, exported for the security test that checks it never parses user text
    const notCells = new Set(["convertUnit"]);
    const exported = Object.entries(functionsModule)
      .filter(([name, v]) => typeof v === "function" && !notCells.has(name))
      .map(([name]) => name.toUpperCase())
      .sort();
    expect(exported).toEqual([...VOCABULARY].sort());
  });

  it("the vocabulary list names each function once, in upper case", () => {
    expect(new Set(VOCABULARY).size).toBe(VOCABULARY.length);
    for (const name of VOCABULARY) expect(name).toMatch(/^[A-Z][A-Z0-9.]*$/);
  });

  it("no cell name is one Excel's naming guidance for custom functions rules out", () => {
    // learn.microsoft.com/office/dev/add-ins/excel/custom-functions-naming: at least three characters, a letter first;
    // not a cell (A1 to XFD1048576, R1C1 to R1048576C16384); not an Excel 4.0 macro function "such as RUN, ECHO".
    // The further macro function names below (from memory) are those a hydraulics name could plausibly meet.
    const MACRO_FUNCTIONS = ["RUN", "ECHO", "ALERT", "ARGUMENT", "BEEP", "BREAK", "CALL", "CALLER", "EVALUATE", "EXEC", "FORMULA", "GOTO", "HALT", "INPUT", "MESSAGE", "NEXT", "PAUSE", "REGISTER", "RESTART", "RESULT", "RESUME", "RETURN", "SELECT", "STEP", "VOLATILE", "WAIT", "WHILE"];
    const columnNumber = (letters: string) => [...letters].reduce((n, ch) => n * 26 + ch.charCodeAt(0) - 64, 0);
    const isCell = (name: string) => {
      const a1 = /^([A-Z]{1,3})([0-9]+)$/.exec(name);
      if (a1) return columnNumber(a1[1]) <= 16384 && Number(a1[2]) >= 1 && Number(a1[2]) <= 1048576;
      const r1c1 = /^R([0-9]+)C([0-9]+)$/.exec(name);
      return r1c1 !== null && Number(r1c1[1]) >= 1 && Number(r1c1[1]) <= 1048576 && Number(r1c1[2]) >= 1 && Number(r1c1[2]) <= 16384;
    };
    // the check itself, on names it must refuse and keep
    expect(["XFD1048576", "A1", "R12C3"].map(isCell)).toEqual([true, true, true]);
    expect(["XFE1", "A0", "HEAD2", "R0C1"].map(isCell)).toEqual([false, false, false, false]);
    const problems = VOCABULARY.flatMap((name) => [
      ...(name.length < 3 ? [`${name}: shorter than three characters`] : []),
      ...(isCell(name) ? [`${name}: reads as a cell address`] : []),
      ...(MACRO_FUNCTIONS.includes(name) ? [`${name}: an Excel 4.0 macro function's name`] : []),
    ]);
    expect(problems).toEqual([]);
  });
});
