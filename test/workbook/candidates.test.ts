/**
 * The estimate sheet's table of candidate design areas, calculated by the preview's formula engine with the real cell
 * functions: this sheet's own demand first, the others typed; the least margin on the weakest flow test controls the
 * verdict, the pump and the suction check; a wrong row is an error that reaches the verdict, never a dropped row.
 */
import { beforeAll, describe, expect, it } from "vitest";
import * as functions from "../../src/functions/functions";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { buildModel } from "../../src/taskpane/model";
import { CANDIDATES_NAME } from "../../src/workbook/port";
import type { Scenario } from "../../src/workbook/scenario";
import { generatedMetadata } from "../preview/metadataFixture";
import { calculatedSheet, usDemo } from "./calculatedSheet";

beforeAll(async () => {
  registerHeadroomFunctions(await generatedMetadata(), functions);
});

/** The sheet with candidates typed below its own design area. */
async function withCandidates(candidates: Scenario["candidates"], change: (s: Scenario) => void = () => {}) {
  const sheet = await calculatedSheet(
    usDemo((s) => {
      s.areaName = "Print hall";
      s.candidates = candidates;
      change(s);
    }),
  );
  const first = sheet.row("Print hall");
  /** a column of the table's row i (0: this sheet's own) */
  const cell = (i: number, col: string) => sheet.wb.value("Estimate", `${col}${first + i}`);
  return { ...sheet, cell, first };
}

/** The demo's test carried to the site (static, residual, test flow), from its named cells. */
function test(num: (n: "Supply_Static" | "Supply_Residual" | "Supply_TestFlow") => number) {
  return [num("Supply_Static"), num("Supply_Residual"), num("Supply_TestFlow")] as const;
}

describe("one design area: the sheet's own demand controls, as before", () => {
  it("puts the sheet's own demand in the first row and judges it", async () => {
    const { at, num, cell } = await withCandidates([]);
    expect(cell(0, "B")).toBeCloseTo(num("Demand_Flow"), 9);
    expect(cell(0, "C")).toBeCloseTo(num("Demand_Pressure"), 9);
    expect(cell(0, "D")).toBeCloseTo(num("Pump_Flow"), 9);
    expect(at("Controlling design area")).toBe("Print hall");
    expect(at("Its demand flow, sprinklers + hose")).toBeCloseTo(num("Demand_Flow"), 9);
    // the verdict is VERDICT on the sheet's own demand and the governing test, with the required margin
    const [ps, pr, qt] = test(num);
    expect(at("Verdict")).toBe(functions.verdict(num("Demand_Flow"), num("Demand_Pressure"), ps, pr, qt, num("Required_Margin"), "US"));
    // its margin on the table: the supply at its flow [NFPA 291] less its pressure
    expect(cell(0, "F")).toBeCloseTo(functions.supplyat(num("Demand_Flow"), ps, pr, qt, "US") - num("Demand_Pressure"), 9);
  });

  it("names the table for the pane: four columns, this sheet's row and the four to type", async () => {
    const { t, first } = await withCandidates([]);
    expect(t.names.find((n) => n.name === CANDIDATES_NAME)?.address).toBe(`A${first}:D${first + 4}`);
  });
});

describe("several design areas: the least margin controls", () => {
  // the demo's supply at the site: static 72, residual 56 psi at the pitot's 627.8 gpm (29.83 × 0.90 × 2.5² × √14,
  // [NFPA 291]); the demo's own area needs about 63 psi at 619 gpm, 6.6 psi more than the supply gives there
  it("judges a typed area with less margin, and sizes the pump on its flow (its flow through a pump left blank)", async () => {
    // an invented area at 900 gpm needing 60 psi: supply there 72 − 16 × (900/627.8)^1.85 = 72 − 16 × 1.947 = 40.85 psi
    // [NFPA 291], 19.2 psi short: more than the own area's 6.6 psi
    const { at, num, cell } = await withCandidates([{ name: "Paper store", flow: 900, pressure: 60, pumpFlow: null }]);
    const [ps, pr, qt] = test(num);
    const supply = functions.supplyat(900, ps, pr, qt, "US");
    expect(supply).toBeCloseTo(72 - 16 * Math.pow(900 / qt, 1.85), 9);
    expect(cell(1, "E")).toBeCloseTo(supply, 9);
    expect(cell(1, "F")).toBeCloseTo(supply - 60, 9);
    expect(at("Controlling design area")).toBe("Paper store");
    expect(at("Its demand flow, sprinklers + hose")).toBe(900);
    expect(at("Its flow through a pump")).toBe(900);
    expect(at("Verdict")).toBe(functions.verdict(900, 60, ps, pr, qt, num("Required_Margin"), "US"));
    expect(at("Verdict")).toMatch(/^Pump needed: the supply is 19\.\d psi short at 900 gpm\./);
    // PUMPBOOST and PUMPSIZE for it: 60 + 10 − 40.85 = 29.15 psi, the 1000 gpm rating for 900 gpm [NFPA 20]
    expect(at("Pump boost needed")).toBeCloseTo(60 + num("Required_Margin") - supply, 9);
    expect(at("Suggested pump, smallest standard rating")).toBe(1000);
  });

  it("carries a typed flow through a pump into the pump and the suction check", async () => {
    const { at } = await withCandidates([{ name: "Paper store", flow: 900, pressure: 60, pumpFlow: 650 }]);
    expect(at("Its flow through a pump")).toBe(650);
    // the 750 gpm rating for 650 gpm [NFPA 20]
    expect(at("Suggested pump, smallest standard rating")).toBe(750);
  });

  it("keeps the sheet's own area where it has the least margin, whatever is typed below it", async () => {
    // an invented office floor at 400 gpm needing 40 psi: the supply there is well above 60 psi [NFPA 291]
    const { at, cell } = await withCandidates([{ name: "Office floor", flow: 400, pressure: 40, pumpFlow: null }]);
    expect(cell(1, "F") as number).toBeGreaterThan(cell(0, "F") as number);
    expect(at("Controlling design area")).toBe("Print hall");
  });

  it("takes the first of two equal margins", async () => {
    const { at, num } = await withCandidates([]);
    const own = { flow: num("Demand_Flow"), pressure: num("Demand_Pressure") };
    const tie = await withCandidates([{ name: "Same again", flow: own.flow, pressure: own.pressure, pumpFlow: null }]);
    expect(at("Controlling design area")).toBe("Print hall");
    expect(tie.at("Controlling design area")).toBe("Print hall");
  });

  it("takes each area's margin on the weakest test at its own flow", async () => {
    // two invented tests whose curves cross (common practice: a strong static with a steep drop, and a weak static
    // with a flat one): Test 1 72 → 40 psi at 800 gpm, Test 2 60 → 55 psi at 1000 gpm
    const { at, cell } = await withCandidates([{ name: "Loading dock", flow: 1400, pressure: 20, pumpFlow: null }], (s) => {
      s.flowTests = [
        { ...s.flowTests[0], static: 72, residual: 40, flow: 800, pitot: null, rise: 0 },
        { ...s.flowTests[0], static: 60, residual: 55, flow: 1000, pitot: null, rise: 0 },
      ];
    });
    const t1 = (q: number) => functions.supplyat(q, 72, 40, 800, "US");
    const t2 = (q: number) => functions.supplyat(q, 60, 55, 1000, "US");
    const own = cell(0, "B") as number;
    // at the own area's flow and at 1400 gpm the weaker test differs or not: the table takes the lower each time
    expect(cell(0, "E")).toBeCloseTo(Math.min(own >= functions.flowat(0, 72, 40, 800, "US") ? 0 : t1(own), t2(own)), 9);
    const dock = Math.min(1400 >= functions.flowat(0, 72, 40, 800, "US") ? 0 : t1(1400), t2(1400));
    expect(cell(1, "E")).toBeCloseTo(dock, 9);
    const ownMargin = (cell(0, "E") as number) - (cell(0, "C") as number);
    expect(at("Controlling design area")).toBe(ownMargin <= dock - 20 ? "Print hall" : "Loading dock");
  });
});

describe("a wrong row is an error that reaches the verdict", () => {
  it.each([
    ["text in the flow", { name: "Dock", flow: "lots" as unknown as number, pressure: 50, pumpFlow: null }, /demand_flow: got "lots"; must be a number/],
    ["a name with no flow", { name: "Dock", flow: null as unknown as number, pressure: 50, pumpFlow: null }, /demand_flow is empty: type a number/],
    ["a negative pressure", { name: "Dock", flow: 500, pressure: -5, pumpFlow: null }, /demand_pressure: got -5 psi/],
  ])("%s: VERDICT's message in its margin, an error in the verdict", async (_, row, message) => {
    const { at, cell } = await withCandidates([row]);
    const e = cell(1, "E") as { error: string; message?: string };
    expect(e).toMatchObject({ error: "#VALUE!" });
    expect(e.message).toMatch(message);
    expect(cell(1, "F")).toMatchObject({ error: "#VALUE!" });
    expect(at("Controlling design area")).toMatchObject({ error: "#VALUE!" });
    expect(at("Verdict")).toMatchObject({ error: "#VALUE!" });
  });

  it("leaves a blank row out, and counts a row with only a name typed as wrong", async () => {
    const blank = await withCandidates([]);
    expect(blank.cell(2, "F")).toBe("");
    const named = await withCandidates([{ name: "Dock", flow: null as unknown as number, pressure: null as unknown as number, pumpFlow: null }]);
    expect(named.at("Verdict")).toMatchObject({ error: "#VALUE!" });
  });
});

describe("the pane reads the table and says what the sheet says", () => {
  it.each([
    ["the sheet's own area controls", [{ name: "Office floor", flow: 400, pressure: 40, pumpFlow: null }]],
    ["a typed area controls", [{ name: "Paper store", flow: 900, pressure: 60, pumpFlow: 700 }, { name: "Office floor", flow: 400, pressure: 40, pumpFlow: null }]],
  ] as const)("%s: the same controlling area, verdict and suggested pump", async (_, rows) => {
    const { at, readings } = await withCandidates(rows.map((r) => ({ ...r })));
    const m = buildModel(readings);
    expect(m.kind).toBe("ready");
    if (m.kind !== "ready") return;
    expect(m.estimate.candidates.find((c) => c.controls)?.name).toBe(at("Controlling design area"));
    expect(m.estimate.verdict).toBe(at("Verdict"));
    expect(m.estimate.pumpSize?.ratedFlow).toBe(at("Suggested pump, smallest standard rating"));
  });
});
