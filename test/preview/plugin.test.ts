/**
 * The HyperFormula adapter: Headroom's functions registered from the generated metadata run exactly as a direct call
 * of the functions module does, with Excel's argument conventions, errors and spills.
 *
 * No hydraulic check values here: every expectation is either "the same as calling the function directly" or a
 * property of the adapter (shape, error code, message, argument passing) shown by a test double.
 */
import { beforeAll, describe, expect, test } from "vitest";
import { DetailedCellError, HyperFormula } from "hyperformula";
import * as functions from "../../src/functions/functions";
import { bindFunctions, type FunctionsMetadata } from "../../src/preview/metadata";
import { buildHeadroomPlugin, registerHeadroomFunctions } from "../../src/preview/plugin";
import { SPILL_SHAPES, checkShapes } from "../../src/preview/spill";
import { ShimCellError } from "../../src/preview/customFunctionsShim";
import { generatedMetadata } from "./metadataFixture";

const LICENCE = { licenseKey: "gpl-v3", smartRounding: false } as const;

function sheet(rows: unknown[][]) {
  return HyperFormula.buildFromArray(rows as never, LICENCE);
}
const at = (hf: HyperFormula, a1: string) => hf.getCellValue(hf.simpleCellAddressFromString(a1, 0)!);

describe("with the real functions module and its generated metadata", () => {
  let meta: FunctionsMetadata;
  beforeAll(async () => {
    meta = await generatedMetadata();
    registerHeadroomFunctions(meta, functions);
  });

  test("every function in functions.json is registered, under HEADROOM.<NAME>, and nothing else", () => {
    const registered = HyperFormula.getRegisteredFunctionNames("enGB").filter((n) => n.startsWith("HEADROOM."));
    expect(registered.sort()).toEqual(meta.functions.map((f) => `HEADROOM.${f.name}`).sort());
    expect(registered.length).toBeGreaterThanOrEqual(15);
  });

  test("every spilling function in the metadata has a declared shape naming its own parameters", () => {
    expect(checkShapes(meta.functions)).toEqual([]);
  });

  test("a scalar function gives what a direct call gives, from cell references and literals", () => {
    const hf = sheet([[500, 100, 80, 1000, "=HEADROOM.SUPPLYAT(A1,B1,C1,D1)", "=headroom.supplyat(500,100,80,1000)"]]);
    const direct = functions.supplyat(500, 100, 80, 1000);
    expect(at(hf, "E1")).toBe(direct);
    expect(at(hf, "F1")).toBe(direct);
  });

  test("an omitted optional argument and an empty one both arrive as null (the default applies)", () => {
    const hf = sheet([[500, 100, 80, 1000, "=HEADROOM.SUPPLYAT(A1,B1,C1,D1)", "=HEADROOM.SUPPLYAT(A1,B1,C1,D1,)", "=HEADROOM.SUPPLYAT(A1,B1,C1,D1,G2)"]]);
    expect(at(hf, "F1")).toBe(at(hf, "E1"));
    expect(at(hf, "G1")).toBe(at(hf, "E1"));
  });

  test("text arguments pass through untouched: SI units give the SI result of a direct call", () => {
    const hf = sheet([["=HEADROOM.SUPPLYAT(2000,7,5.5,3800,\"si\")"]]);
    expect(at(hf, "A1")).toBe(functions.supplyat(2000, 7, 5.5, 3800, "si"));
  });

  test("a text result (VERDICT) arrives as text", () => {
    const hf = sheet([["=HEADROOM.VERDICT(500,60,100,80,1000)"]]);
    expect(at(hf, "A1")).toBe(functions.verdict(500, 60, 100, 80, 1000));
    expect(typeof at(hf, "A1")).toBe("string");
  });

  test("a thrown CustomFunctions.Error becomes a cell error of the same code with its message", () => {
    const hf = sheet([["=HEADROOM.SUPPLYAT(-5,100,80,1000)", "=HEADROOM.SUPPLYAT(500,100,80,1000,\"XX\")"]]);
    let thrown: ShimCellError | undefined;
    try {
      functions.supplyat(-5, 100, 80, 1000);
    } catch (e) {
      thrown = e as ShimCellError;
    }
    expect(thrown?.code).toBe("#VALUE!");
    const a1 = at(hf, "A1") as DetailedCellError;
    expect(a1).toBeInstanceOf(DetailedCellError);
    expect(a1.value).toBe("#VALUE!");
    expect(a1.message).toBe(thrown!.message);
    const b1 = at(hf, "B1") as DetailedCellError;
    expect(b1.value).toBe("#VALUE!");
    expect(b1.message).toMatch(/units/);
  });

  test("a blank required argument gives the function's own message, never a number", () => {
    const hf = sheet([[null, 100, 80, 1000, "=HEADROOM.SUPPLYAT(A1,B1,C1,D1)"]]);
    const e = at(hf, "E1") as DetailedCellError;
    expect(e).toBeInstanceOf(DetailedCellError);
    expect(e.message).toMatch(/flow/);
  });

  test("an error in an argument is the result, with its own code and message", () => {
    const hf = sheet([["=1/0", 100, 80, 1000, "=HEADROOM.SUPPLYAT(A1,B1,C1,D1)"]]);
    expect((at(hf, "E1") as DetailedCellError).value).toBe("#DIV/0!");
  });

  test("the first error among the arguments is the result, before the function reads any of them", () => {
    // "x" would be refused by SUPPLYAT itself; the #DIV/0! of the second argument comes first, as in Excel
    const hf = sheet([[100, 80, 1000, "=HEADROOM.SUPPLYAT(\"x\",1/0,B1,C1)", "=HEADROOM.SUPPLYAT(A1,B1,C1,1/0)"]]);
    expect((at(hf, "D1") as DetailedCellError).value).toBe("#DIV/0!");
    expect((at(hf, "E1") as DetailedCellError).value).toBe("#DIV/0!");
  });

  test("a date or other formatted number arrives as its plain number", () => {
    const hf = sheet([["=DATE(1901,5,1)", "=HEADROOM.SUPPLYAT(DATE(1901,5,1),100,80,1000)"]]);
    const serial = at(hf, "A1") as number;
    expect(typeof serial).toBe("number");
    expect(at(hf, "B1")).toBe(functions.supplyat(serial, 100, 80, 1000));
  });

  test("a range given for a scalar argument: broadcast over its cells with array arithmetic, else its row's cell", () => {
    const rows = [
      [500, 100, 80, 1000, "=HEADROOM.SUPPLYAT(A1:A2,B1,C1,D1)"],
      [600, null, null, null, null, "=HEADROOM.SUPPLYAT(A1:A2,B1,C1,D1)"],
    ];
    const arrays = HyperFormula.buildFromArray(rows as never, { ...LICENCE, useArrayArithmetic: true });
    expect(at(arrays, "E1")).toBe(functions.supplyat(500, 100, 80, 1000));
    expect(at(arrays, "E2")).toBe(functions.supplyat(600, 100, 80, 1000));
    const plain = sheet(rows);
    expect(at(plain, "E1")).toBe(functions.supplyat(500, 100, 80, 1000));
    expect(at(plain, "F2")).toBe(functions.supplyat(600, 100, 80, 1000));
  });

  test("a wrong number of arguments names the function and its parameters", () => {
    const hf = sheet([["=HEADROOM.SUPPLYAT(1,2,3)", "=HEADROOM.SUPPLYAT(1,2,3,4,\"US\",6)"]]);
    for (const a of ["A1", "B1"]) {
      const e = at(hf, a) as DetailedCellError;
      expect(e.value).toBe("#N/A");
      expect(e.message).toContain("HEADROOM.SUPPLYAT takes 4 to 5 arguments (flow, static_pressure, residual, test_flow, [units])");
    }
  });

  test("a change to an input recalculates the dependent cell", () => {
    const hf = sheet([[500, 100, 80, 1000, "=HEADROOM.SUPPLYAT(A1,B1,C1,D1)"]]);
    hf.setCellContents({ sheet: 0, row: 0, col: 0 }, 700);
    expect(at(hf, "E1")).toBe(functions.supplyat(700, 100, 80, 1000));
  });

  test("each spilling function fills exactly what a direct call returns, sized from the formula text", () => {
    // invented demo inputs; the expectation is the direct call of the same function
    const segments = [
      [500, 3.068, 120, 60, 20, 0, 0],
      [500, 4.026, 120, 25, 12, 15, 0],
      [500, 6.065, 140, 200, 0, 3, 5],
    ];
    const hf = sheet([
      ...segments.map((r) => [...r]),
      ["=HEADROOM.PIPERUN(A1:G3,40)", null, null, null, "=HEADROOM.AREADEMAND(0.2,1500,130,5.6,12,1.38,2.469)"],
      [],
      [],
      ["=HEADROOM.SUPPLYCURVE(84,69,920)", null, "=HEADROOM.SUPPLYCURVE(84,69,920,1400,5)", null, "=HEADROOM.PUMPSIZE(587,37.7)"],
    ]);
    const block = (a1: string, rows: number, cols: number) => {
      const s = hf.simpleCellAddressFromString(a1, 0)!;
      return hf.getRangeValues({ start: s, end: { sheet: 0, row: s.row + rows - 1, col: s.col + cols - 1 } });
    };
    expect(block("A4", 3, 4)).toEqual(functions.piperun(segments, 40));
    expect(block("E4", 1, 5)).toEqual(functions.areademand(0.2, 1500, 130, 5.6, 12, 1.38, 2.469));
    expect(block("A7", 16, 2)).toEqual(functions.supplycurve(84, 69, 920));
    expect(block("C7", 5, 2)).toEqual(functions.supplycurve(84, 69, 920, 1400, 5));
    expect(block("E7", 1, 2)).toEqual(functions.pumpsize(587, 37.7));
    // nothing beyond the reserved blocks
    expect(at(hf, "A7")).toBe(0);
    expect(hf.getCellValue({ sheet: 0, row: 22, col: 0 })).toBeNull();
    expect(hf.getCellValue({ sheet: 0, row: 6, col: 7 })).toBeNull();
  });

  test("an unknown HEADROOM name is #NAME?", () => {
    const hf = sheet([["=HEADROOM.NOSUCHTHING(1)"]]);
    expect((at(hf, "A1") as DetailedCellError).value).toBe("#NAME?");
  });
});

describe("binding and shape checks refuse a mismatch loudly", () => {
  const one = (id: string, spills = false) => ({
    id,
    name: id,
    parameters: [{ name: "x", type: "any" }],
    result: spills ? { type: "any", dimensionality: "matrix" as const } : { type: "number" },
  });

  test("an entry without an implementation", () => {
    expect(() => bindFunctions({ functions: [one("ABSENT")] }, { present: () => 1 })).toThrow(/ABSENT/);
  });

  test("a spilling function without a declared shape", () => {
    expect(() => buildHeadroomPlugin({ functions: [one("SPILLER", true)] }, { spiller: () => [[1]] })).toThrow(
      /SPILLER spills but declares no spill shape/,
    );
  });

  test("a shape naming a parameter the function lacks", () => {
    expect(checkShapes([one("PIPERUN", true)], { PIPERUN: SPILL_SHAPES.PIPERUN })).toEqual([
      'PIPERUN: spill shape names parameter "segments", which the function does not have',
    ]);
  });
});

describe("spills, with test doubles standing for the spilling functions", () => {
  // Doubles with the parameter layout of PIPERUN and SUPPLYCURVE (../shared/spec/functions.md); their values only
  // echo their arguments, to show what the adapter hands over and how it lays the result out.
  const meta: FunctionsMetadata = {
    functions: [
      {
        id: "PIPERUN",
        name: "PIPERUN",
        parameters: [
          { name: "segments", type: "any", dimensionality: "matrix" },
          { name: "start_pressure", type: "any", optional: true },
          { name: "units", type: "any", optional: true },
        ],
        result: { type: "any", dimensionality: "matrix" },
      },
      {
        id: "SUPPLYCURVE",
        name: "SUPPLYCURVE",
        parameters: ["static", "residual", "test_flow", "max_flow", "points", "units"].map((name, i) => ({
          name,
          type: "any",
          ...(i >= 3 ? { optional: true } : {}),
        })),
        result: { type: "any", dimensionality: "matrix" },
      },
    ],
  };
  const calls: unknown[][] = [];
  const doubles = {
    piperun(segments: unknown[][], start?: unknown) {
      calls.push([segments, start]);
      if (start === "bad") throw new ShimCellError("#VALUE!", "start_pressure: got \"bad\"; must be a number");
      return segments.map((row, i) =>
        i === 1 ? [1, 2, new ShimCellError("#N/A", "no table entry for row 2"), 4] : [row[0], row[1], null, i],
      );
    },
    supplycurve(_s: unknown, _r: unknown, _q: unknown, _max?: unknown, points?: unknown) {
      const n = (points as number | null) ?? 16;
      return Array.from({ length: n }, (_, i) => [i, n]);
    },
  };
  beforeAll(() => registerHeadroomFunctions(meta, doubles));

  test("a range argument arrives as rows of values, blanks as null, and spills one row per row", () => {
    calls.length = 0;
    const hf = sheet([
      [10, "x", null, null, "=HEADROOM.PIPERUN(A1:B3, 5)"],
      [null, 2],
      [30, true],
    ]);
    expect(calls[0]).toEqual([
      [
        [10, "x"],
        [null, 2],
        [30, true],
      ],
      5,
    ]);
    expect(hf.getRangeValues({ start: { sheet: 0, row: 0, col: 4 }, end: { sheet: 0, row: 2, col: 7 } })).toEqual([
      [10, "x", 0, 0],
      [1, 2, expect.objectContaining({ value: "#N/A", message: "no table entry for row 2" }), 4],
      [30, true, 0, 2],
    ]);
    expect(hf.isCellPartOfArray({ sheet: 0, row: 2, col: 7 })).toBe(true);
  });

  test("the spill follows the range when its rows change, and a blocked spill is #SPILL!", () => {
    const hf = sheet([[1, null, "=HEADROOM.PIPERUN(A1:A2)"], [2], [null, null, "in the way"]]);
    expect(hf.getCellValue({ sheet: 0, row: 1, col: 3 })).toBe(2);
    hf.setCellContents({ sheet: 0, row: 0, col: 2 }, "=HEADROOM.PIPERUN(A1:A3)");
    expect((hf.getCellValue({ sheet: 0, row: 0, col: 2 }) as DetailedCellError).value).toBe("#SPILL!");
  });

  test("a thrown error fills the formula's cell with its code and message", () => {
    const hf = sheet([[1, "=HEADROOM.PIPERUN(A1:A2,\"bad\")"], [2]]);
    const e = hf.getCellValue({ sheet: 0, row: 0, col: 1 }) as DetailedCellError;
    expect(e.value).toBe("#VALUE!");
    expect(e.message).toBe('start_pressure: got "bad"; must be a number');
  });

  test("points: the default, a literal, and a reference (which the preview cannot size) with a clear message", () => {
    const hf = sheet([["=HEADROOM.SUPPLYCURVE(1,2,3)", null, "=HEADROOM.SUPPLYCURVE(1,2,3,,4)", null, "=HEADROOM.SUPPLYCURVE(1,2,3,,G1)", null, 8]]);
    expect(hf.getCellValue({ sheet: 0, row: 15, col: 0 })).toBe(15);
    expect(hf.getCellValue({ sheet: 0, row: 16, col: 0 })).toBeNull();
    expect(hf.getCellValue({ sheet: 0, row: 3, col: 2 })).toBe(3);
    expect(hf.getCellValue({ sheet: 0, row: 4, col: 2 })).toBeNull();
    const e = hf.getCellValue({ sheet: 0, row: 0, col: 4 }) as DetailedCellError;
    expect(e.value).toBe("#VALUE!");
    expect(e.message).toMatch(/points must be a number written in the formula/);
  });

  test("points out of range is refused before anything spills", () => {
    const hf = sheet([["=HEADROOM.SUPPLYCURVE(1,2,3,,1.5)", "=HEADROOM.SUPPLYCURVE(1,2,3,,100000)"]]);
    expect((hf.getCellValue({ sheet: 0, row: 0, col: 0 }) as DetailedCellError).message).toMatch(/points is 1.5; allowed: a whole number from 2 to 1000/);
    expect((hf.getCellValue({ sheet: 0, row: 0, col: 1 }) as DetailedCellError).value).toBe("#VALUE!");
  });

  test("a result of another size than reserved is an error that says so, never a silent cut", () => {
    const hf = sheet([["=HEADROOM.PIPERUN({1,2;3,4})"]]);
    // the double returns two rows of four: as reserved (rows of the array literal), so this one works…
    expect(hf.getCellValue({ sheet: 0, row: 1, col: 3 })).toBe(4);
    const lying = { ...doubles, supplycurve: () => [[1, 2]] };
    registerHeadroomFunctions(meta, lying);
    const hf2 = sheet([["=HEADROOM.SUPPLYCURVE(1,2,3)"]]);
    expect((hf2.getCellValue({ sheet: 0, row: 0, col: 0 }) as DetailedCellError).message).toBe(
      "HEADROOM.SUPPLYCURVE returned 1×2 values where the preview reserved 16×2",
    );
    registerHeadroomFunctions(meta, doubles);
  });
});
