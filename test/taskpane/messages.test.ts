/**
 * The pane's messages point where the user can act: a missing name is fixed by the Name Box in Excel and by the name
 * box above the sheet in the preview (or a new estimate sheet in either); a name defined on a blank cell is reported as
 * that blank cell, not as a name to define.
 */
import { describe, expect, it } from "vitest";
import { type Estimate, type InputsBehind, buildModel, errorAddresses } from "../../src/taskpane/model";
import { marginLine, suctionLine } from "../../src/taskpane/pane";
import { BASE, FakePort, type Values } from "./fakePort";

function problems(v: Values, host: "excel" | "preview"): string[] {
  const m = buildModel(new FakePort(v).readings, host);
  if (m.kind !== "problems") throw new Error(JSON.stringify(m));
  return m.problems.map((p) => p.message);
}

function ready(v: Values): Estimate {
  const m = buildModel(new FakePort(v).readings);
  if (m.kind !== "ready") throw new Error(JSON.stringify(m));
  return m.estimate;
}

describe("a name the workbook does not define", () => {
  const withoutPressure: Values = { ...BASE };
  delete withoutPressure.Demand_Pressure;

  it("in Excel: select the cell, type the name in the Name Box, or insert a new estimate sheet", () => {
    expect(problems(withoutPressure, "excel")).toEqual([
      "Demand_Pressure is not defined. Select the cell that holds the pressure the system needs at the supply, type Demand_Pressure in the Name Box and press Enter, or use New estimate sheet.",
    ]);
  });

  it("in the preview: its name box above the sheet (which defines a new name on the selection), or a new estimate sheet", () => {
    const [message] = problems(withoutPressure, "preview");
    expect(message).not.toMatch(/Name Box|Name Manager/);
    expect(message).toBe(
      "Demand_Pressure is not defined in this workbook. Select the cell that holds the pressure the system needs at the supply, type Demand_Pressure in the name box above the sheet and press Enter, or use New estimate sheet, which defines every name the pane reads.",
    );
  });

  it("a name on several cells: Excel's Name Manager, or in the preview a new estimate sheet", () => {
    const several = { kind: "invalid", reason: "Demand_Pressure refers to several cells (Estimate!B5:B6); point it at one cell", address: "Estimate!B5:B6" } as const;
    expect(problems({ ...BASE, Demand_Pressure: several }, "excel")[0]).toMatch(/Formulas > Name Manager/);
    expect(problems({ ...BASE, Demand_Pressure: several }, "preview")[0]).toMatch(/use New estimate sheet/);
    expect(problems({ ...BASE, Demand_Pressure: several }, "preview")[0]).not.toMatch(/Name Manager/);
  });
});

describe("an optional name on a blank cell", () => {
  it("says the required margin's cell is blank (none required), not that the name should be defined", () => {
    const blank = ready({ ...BASE, Required_Margin: null });
    expect(marginLine(blank)).toMatch(/no margin required: Required_Margin \(Estimate!B\d+\) is blank\.$/);
    expect(marginLine(blank)).not.toMatch(/define/);
    // and without the name at all, that it is not defined
    const missing = ready(BASE);
    expect(marginLine(missing)).toMatch(/no required margin set \(no Required_Margin name\)\.$/);
  });

  it("says the main's minimum cell is blank and the common-practice 20 psi is used", () => {
    // a pump is needed: 100 psi at 562 gpm on BASE's supply of 67.96 psi there [NFPA 291]
    const e = ready({ ...BASE, Demand_Pressure: 100, Suction_Minimum: null });
    expect(suctionLine(e)).toMatch(/20\.0 psi \(common practice: Suction_Minimum \(Estimate!B\d+\) is blank\)/);
    const missing = ready({ ...BASE, Demand_Pressure: 100 });
    expect(suctionLine(missing)).toMatch(/20\.0 psi \(common practice: no Suction_Minimum name\)/);
  });
});

describe("one cause, said once", () => {
  it("counts two names that show the same error as one thing to fix, naming both", () => {
    // text typed in test 1's static reaches SITETEST, whose spill feeds both Supply_Static and Supply_Residual
    const error = (address: string) => ({ kind: "error", code: "#VALUE!", message: 'static_pressure: got "abc"; must be a number', address }) as const;
    const found = problems({ ...BASE, Supply_Static: error("Estimate!B70"), Supply_Residual: error("Estimate!B71") }, "excel");
    expect(found).toEqual([
      'Supply_Static (Estimate!B70) and Supply_Residual (Estimate!B71) show #VALUE! static_pressure: got "abc"; must be a number: one cause; fix the cells they are calculated from (Excel shows the message when you point at the cell).',
    ]);
  });

  it("keeps two different errors apart", () => {
    const found = problems(
      {
        ...BASE,
        Supply_Static: { kind: "error", code: "#VALUE!", message: "one", address: "Estimate!B70" },
        Supply_Residual: { kind: "error", code: "#VALUE!", message: "two", address: "Estimate!B71" },
      },
      "excel",
    );
    expect(found).toHaveLength(2);
  });
});

describe("an error that comes from an input: the message names the input to change", () => {
  // text typed into a flow test's input reaches SITETEST, whose spill feeds the three supply names
  const message = 'residual: got "1250 gpm"; must be a number';
  const error = (address: string) => ({ kind: "error", code: "#VALUE!", message, address }) as const;
  const supplyErrors: Values = { ...BASE, Supply_Static: error("Estimate!B112"), Supply_Residual: error("Estimate!B113"), Supply_TestFlow: error("Estimate!B114") };
  /** what the port finds behind each of the three names: the test's inputs, nearest first */
  const inputs = (text: string): InputsBehind => {
    const sources = [
      { address: "Estimate!B13", reading: { kind: "number", value: 72, address: "Estimate!B13" } },
      { address: "Estimate!B14", reading: { kind: "text", value: text, address: "Estimate!B14" } },
      { address: "Estimate!B9", reading: { kind: "text", value: "US", address: "Estimate!B9" } },
    ] as const;
    return { "Estimate!B112": sources, "Estimate!B113": sources, "Estimate!B114": sources };
  };
  const model = (v: Values, behind: InputsBehind, host: "excel" | "preview" = "preview") => {
    const m = buildModel(new FakePort(v).readings, host, behind);
    if (m.kind !== "problems") throw new Error(JSON.stringify(m));
    return m.problems;
  };

  it("names the input cell whose text the message quotes, once for every name it reaches, never the formula cells as the place to act", () => {
    const found = model(supplyErrors, inputs("1250 gpm"));
    expect(found).toEqual([
      {
        name: "Supply_Static",
        cell: "Estimate!B14",
        message:
          `Estimate!B14 holds "1250 gpm": ${message}. Change that input; Supply_Static (Estimate!B112), Supply_Residual (Estimate!B113) ` +
          "and Supply_TestFlow (Estimate!B114) are calculated from it and show #VALUE! until then.",
      },
    ]);
  });

  it("names an input that shows an error itself", () => {
    const behind: InputsBehind = {
      "Estimate!B114": [
        { address: "Estimate!B13", reading: { kind: "number", value: 72 } },
        { address: "Estimate!B15", reading: { kind: "error", code: "#N/A", address: "Estimate!B15" } },
      ],
    };
    const found = model({ ...BASE, Supply_TestFlow: { kind: "error", code: "#N/A", address: "Estimate!B114" } }, behind, "excel");
    expect(found).toEqual([
      {
        name: "Supply_TestFlow",
        cell: "Estimate!B15",
        message: "Estimate!B15 shows #N/A: fix that input. Supply_TestFlow (Estimate!B114) is calculated from it and shows #N/A until then.",
      },
    ]);
  });

  it("keeps to the formula cells where no input behind them holds the text quoted (or where the host found none)", () => {
    for (const behind of [inputs("1250"), {}]) {
      const [only] = model(supplyErrors, behind, "excel");
      expect(only.message).toMatch(/^Supply_Static \(Estimate!B112\), Supply_Residual \(Estimate!B113\) and Supply_TestFlow \(Estimate!B114\) show #VALUE! /);
      expect(only.message).toMatch(/fix the cells they are calculated from/);
    }
  });

  it("asks the port about the named cells that show an error, #BUSY! aside, each once", () => {
    const readings = new FakePort({ ...supplyErrors, Demand_Flow: { kind: "error", code: "#BUSY!", address: "Estimate!B40" } }).readings;
    expect(errorAddresses(readings)).toEqual(["Estimate!B112", "Estimate!B113", "Estimate!B114"]);
  });
});
