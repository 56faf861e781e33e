/**
 * Names between the user and the engine (src/preview/names.ts): the rule for the names the engine takes agrees with
 * the engine itself, and formula text is rewritten name by name, never inside quotes, references or function names.
 */
import { HyperFormula } from "hyperformula";
import { describe, expect, test } from "vitest";
import { EngineNames, engineTakesName } from "../../src/preview/names";
import { ENGINE_CONFIG } from "../../src/preview/workbook";

// names Excel takes (from memory: a letter, "_" or "\" first, then letters, digits, ".", "_"; not a cell of A1:XFD1048576)
const EXCEL_NAMES = ["Flow1", "Pump1", "Area2", "Tank10", "XFE1", "ΔP", "ΔP_total", "\\Notes", "Supply_Static", "Flow.Rate", "_1", "Flow1.a", "é1", "Pipe_C"];

describe("the names the engine takes", () => {
  test("engineTakesName says what the engine itself says, for every name", () => {
    const hf = HyperFormula.buildEmpty(ENGINE_CONFIG);
    for (const name of EXCEL_NAMES) {
      let took = true;
      try {
        hf.addNamedExpression(name, "=1");
      } catch {
        took = false;
      }
      expect(engineTakesName(name), name).toBe(took);
    }
    hf.destroy();
  });

  test("every name Excel takes, spelt for the engine, is taken and computes in a formula", () => {
    const names = EngineNames.for(EXCEL_NAMES);
    const hf = HyperFormula.buildFromSheets({ S: [[5]] }, ENGINE_CONFIG);
    EXCEL_NAMES.forEach((name, i) => hf.addNamedExpression(names.define(name), `=S!$A$1*${i + 1}`));
    EXCEL_NAMES.forEach((name, i) => {
      hf.setCellContents({ sheet: 0, row: i + 1, col: 0 }, [[names.toEngine(`=${name}+1`)]]);
      expect(hf.getCellValue({ sheet: 0, row: i + 1, col: 0 }), name).toBe(5 * (i + 1) + 1); // A1 × (i + 1) + 1 (hand arithmetic)
      expect(names.fromEngine(hf.getCellFormula({ sheet: 0, row: i + 1, col: 0 })!), name).toBe(`=${name}+1`);
    });
    hf.destroy();
  });
});

describe("formula text", () => {
  const names = EngineNames.for(["Flow1"]);
  names.define("Flow1");

  test("a name is rewritten wherever it stands as a name, in any case", () => {
    expect(names.toEngine("=Flow1*2+FLOW1/flow1")).toBe("=_hr_Flow1*2+_hr_Flow1/_hr_Flow1");
    expect(names.fromEngine("=_hr_Flow1*2")).toBe("=Flow1*2");
    expect(names.toEngine("=SUM(Flow1, A1:B2)")).toBe("=SUM(_hr_Flow1, A1:B2)");
  });

  test("never inside text, a sheet's name, a longer name, a function's name or a reference", () => {
    expect(names.toEngine('="Flow1"&Flow1')).toBe('="Flow1"&_hr_Flow1');
    expect(names.toEngine("='Flow1'!A1+Flow1!B2")).toBe("='Flow1'!A1+Flow1!B2");
    expect(names.toEngine("=Flow12+Flow1.x+x.Flow1")).toBe("=Flow12+Flow1.x+x.Flow1");
    expect(names.toEngine("=Flow1(2)")).toBe("=Flow1(2)");
    expect(names.toEngine("=$Flow1+Sheet1!Flow1")).toBe("=$Flow1+Sheet1!Flow1");
  });

  test("an engine spelling never takes a name the workbook already has", () => {
    const taken = EngineNames.for(["Flow1", "_hr_Flow1"]);
    expect(taken.define("Flow1")).toBe("_hr_Flow1_2");
    expect(taken.define("_hr_Flow1")).toBe("_hr_Flow1");
    expect(taken.userName("_hr_Flow1_2")).toBe("Flow1");
  });
});
