/**
 * The estimate sheet's supply side and pump, calculated by the preview's formula engine with the real cell
 * functions: up to three flow tests carried to the site (SITETEST) with the governing one named, the flow through a
 * pump, the suction check (PUMPSUCTION), the chosen pump (PUMPCURVE) and a suction tank's volume.
 */
import { beforeAll, describe, expect, it } from "vitest";
import * as functions from "../../src/functions/functions";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { demoScenario } from "../../src/workbook/scenario";
import { generatedMetadata } from "../preview/metadataFixture";
import { calculatedSheet, usDemo } from "./calculatedSheet";

beforeAll(async () => {
  registerHeadroomFunctions(await generatedMetadata(), functions);
});

const sheet = calculatedSheet;
const us = usDemo;

const ELEVATION_PSI_PER_FT = 0.433; // [NFPA 13]

describe("flow tests carried to the site", () => {
  it("reduces each reading by the derate, then by the elevation of the site above the gauge", async () => {
    // the demo's test 72 / 56 psi, the site 12 ft above the gauge, derated 10 % (common practice):
    // static 72 × 0.9 − 0.433 × 12 = 64.8 − 5.196 = 59.604 psi; residual 56 × 0.9 − 5.196 = 50.4 − 5.196 = 45.204 psi
    const { num } = await sheet(
      us((s) => {
        s.flowTests[0].rise = 12;
        s.derate = 0.1;
      }),
    );
    expect(num("Supply_Static")).toBeCloseTo(72 * 0.9 - ELEVATION_PSI_PER_FT * 12, 2);
    expect(num("Supply_Residual")).toBeCloseTo(56 * 0.9 - ELEVATION_PSI_PER_FT * 12, 2);
  });

  it("takes a test as read with no rise and no derate", async () => {
    const { num } = await sheet(demoScenario("US"));
    expect(num("Supply_Static")).toBe(72);
    expect(num("Supply_Residual")).toBe(56);
  });

  it("uses the test that gives the lowest supply at the demand flow, and says which", async () => {
    const second = { ...demoScenario("US").flowTests[0], when: "second hydrant (demo)", static: 70, residual: 40, flow: 900, pitot: null };
    const third = { ...second, when: "third hydrant (demo)", static: 90, residual: 80, flow: 1200 };
    const { at, num } = await sheet(us((s) => s.flowTests.push(second, third)));
    const q = num("Demand_Flow");
    // each test's supply at the demand flow through SUPPLYAT itself [NFPA 291]
    const supply = (st: number, r: number, qt: number) => functions.supplyat(q, st, r, qt);
    const pitotFlow = 29.83 * 0.9 * 2.5 ** 2 * Math.sqrt(14); // the demo's pitot reading [NFPA 291]
    const all = [supply(72, 56, pitotFlow), supply(70, 40, 900), supply(90, 80, 1200)];
    expect(Math.min(...all)).toBe(all[1]);
    expect(at("Supply at the demand flow, Test 1")).toBeCloseTo(all[0], 9);
    expect(at("Supply at the demand flow, Test 2")).toBeCloseTo(all[1], 9);
    expect(at("Supply at the demand flow, Test 3")).toBeCloseTo(all[2], 9);
    expect(at("Flow test used")).toBe("Test 2");
    expect(num("Supply_Static")).toBe(70);
    expect(num("Supply_Residual")).toBe(40);
    expect(num("Supply_TestFlow")).toBe(900);
  });

  it("counts a test that runs dry before the demand flow as 0 psi there, so that it governs", async () => {
    // static 60, residual 5 psi at 300 gpm reaches 0 psi at 300 × (60 / 55)^(1/1.85) = 314 gpm [NFPA 291]
    const dry = { ...demoScenario("US").flowTests[0], when: "weak hydrant (demo)", static: 60, residual: 5, flow: 300, pitot: null };
    const { at } = await sheet(us((s) => s.flowTests.push(dry)));
    expect(at("Supply at the demand flow, Test 2")).toBe(0);
    expect(at("Flow test used")).toBe("Test 2");
    expect(String(at("Verdict"))).toMatch(/^A pump alone cannot serve/);
    expect(at("Suction tank, estimated volume")).toBeTypeOf("number");
  });

  it("shows an error, not a fallback, for text typed where a reading belongs", async () => {
    const { at } = await sheet(us((s) => (s.flowTests[0].flow = "1250 gpm" as unknown as number)));
    expect(at("Flow test used")).toMatchObject({ error: "#VALUE!" });
  });
});

describe("the flow through a pump", () => {
  it("carries sprinklers and inside hose, and the outside hose only where hydrants are downstream [NFPA 20] (from memory)", async () => {
    const no = await sheet(demoScenario("US"));
    const sprinklers = no.at("Sprinkler flow") as number;
    // OH2: 250 gpm total, 100 gpm the largest inside allowance [NFPA 13] (from memory)
    expect(no.num("Demand_HoseFlow")).toBe(250);
    expect(no.num("Pump_Flow")).toBeCloseTo(sprinklers + 100, 9);
    expect(no.num("Demand_Flow")).toBeCloseTo(sprinklers + 250, 9);
    const yes = await sheet(us((s) => (s.hydrantsDownstream = true)));
    expect(yes.num("Pump_Flow")).toBeCloseTo(sprinklers + 250, 9);
  });

  it("takes an inside hose allowance typed in, the outside hose being the rest of the total", async () => {
    const { num, at } = await sheet(us((s) => (s.insideHose = 50)));
    expect(at("Outside hose allowance")).toBe(200); // 250 − 50
    expect(num("Pump_Flow")).toBeCloseTo((at("Sprinkler flow") as number) + 50, 9);
  });

  it("asks for yes or no", async () => {
    const { t, wb, row } = await sheet(demoScenario("US"));
    wb.setContent("Estimate", `B${row("Hydrants downstream of the pump")}`, "maybe");
    expect(wb.value("Estimate", `B${row("Flow through a pump")}`)).toBe(`type yes or no in B${row("Hydrants downstream of the pump")}`);
    expect(t.names.find((n) => n.name === "Pump_Flow")!.address).toBe(`B${row("Flow through a pump")}`);
  });
});

describe("the pump: suggested, chosen, and whether the main can feed it", () => {
  it("suggests PUMPSIZE's rating for the flow through the pump, and checks the main at 150 % of it", async () => {
    const { at, num } = await sheet(us((s) => (s.flowTests[0].residual = 40)));
    const boost = at("Pump boost needed") as number;
    expect(boost).toBeGreaterThan(0);
    const [rated, pressure] = functions.pumpsize(num("Pump_Flow"), boost)[0];
    expect(at("Suggested pump, smallest standard rating")).toBe(rated);
    expect(at("Suggested pump, smallest standard rating", "C")).toBe(pressure);
    // PUMPSUCTION: the main at 1.5 × rated + the hose drawn beside the pump (demand − pump flow)
    const other = num("Demand_Flow") - num("Pump_Flow");
    expect(at("Pressure left in the main at 150 % of rated flow")).toBeCloseTo(functions.pumpsuction(rated, 72, 40, num("Supply_TestFlow"), other), 9);
  });

  it("says a pump alone cannot serve when the main falls below the least it must keep, and sizes a tank", async () => {
    const { at, num } = await sheet(
      us((s) => {
        s.flowTests[0].residual = 40;
        s.suctionMinimum = 60; // a purveyor's minimum set high on purpose
      }),
    );
    expect(at("Suction check")).toMatch(/a pump alone cannot serve; a suction tank or a stronger main is needed/);
    // OH2 duration 60–90 min, the upper end [NFPA 13] (from memory): demand flow × 90 min, gal
    expect(at("Supply duration")).toBe(90);
    expect(at("Suction tank, estimated volume")).toBeCloseTo(num("Demand_Flow") * 90, 6);
  });

  it("needs no tank where the main keeps its minimum", async () => {
    const { at } = await sheet(us((s) => (s.flowTests[0].residual = 50)));
    expect(at("Pump boost needed") as number).toBeGreaterThan(0);
    expect(at("Suction check")).toBe("Enough left in the main for the pump");
    expect(at("Suction tank, estimated volume")).toBe("not needed");
  });

  it("checks the pump the user chose instead of suggesting one", async () => {
    const chosen = { ratedFlow: 500, ratedPressure: 40 };
    const { at, num } = await sheet(
      us((s) => {
        s.flowTests[0].residual = 40;
        s.pump = chosen;
      }),
    );
    expect(num("Pump_RatedFlow")).toBe(500);
    expect(num("Pump_RatedPressure")).toBe(40);
    expect(at("Suggested pump, smallest standard rating")).toBe("a pump is chosen");
    // supply at the demand flow + the pump's net pressure at the flow through it − demand − margin
    const q = num("Demand_Flow");
    const spare =
      functions.supplyat(q, 72, 40, num("Supply_TestFlow")) + functions.pumpcurve(num("Pump_Flow"), 500, 40) - num("Demand_Pressure") - num("Required_Margin");
    expect(at("Chosen pump: pressure to spare at the demand")).toBeCloseTo(spare, 9);
    expect(at("Chosen pump check")).toBe(spare >= 0 ? "The chosen pump meets the demand and the required margin" : "The chosen pump falls short of the demand and the required margin");
  });

  it("says a small chosen pump falls short", async () => {
    const { at } = await sheet(
      us((s) => {
        s.flowTests[0].residual = 40;
        s.pump = { ratedFlow: 500, ratedPressure: 5 };
      }),
    );
    expect(at("Chosen pump: pressure to spare at the demand") as number).toBeLessThan(0);
    expect(at("Chosen pump check")).toBe("The chosen pump falls short of the demand and the required margin");
  });
});

describe("text where a number belongs is said, never read as blank", () => {
  it("a rated flow typed as text is an error where it is used, not 'no pump chosen'", async () => {
    const { at, wb, row, t } = await sheet(us((s) => (s.flowTests[0].residual = 50)));
    const flow = t.names.find((n) => n.name === "Pump_RatedFlow")!.address;
    wb.setContent("Estimate", flow, "750 gpm");
    wb.setContent("Estimate", t.names.find((n) => n.name === "Pump_RatedPressure")!.address, 40);
    expect(at("Suggested pump, smallest standard rating")).toBe("a pump is chosen");
    expect(wb.value("Estimate", `B${row("Pressure left in the main at 150 % of rated flow")}`)).toMatchObject({ error: "#VALUE!" });
    expect(at("Chosen pump: pressure to spare at the demand")).toMatchObject({ error: "#VALUE!" });
  });

  it("a minimum the main must keep typed as text asks for a number, and gives no suction verdict", async () => {
    const { at, wb, row } = await sheet(us((s) => (s.flowTests[0].residual = 50)));
    const minimum = row("Least pressure the main must keep");
    wb.setContent("Estimate", `B${minimum}`, "twenty");
    expect(at("Suction check")).toBe(`type a number in B${minimum}`);
    expect(at("Suction tank, estimated volume")).toBe("not needed");
  });

  it("a design area typed as text is an error, not the curve's smallest area", async () => {
    const { at, wb, row } = await sheet(us());
    wb.setContent("Estimate", `B${row("Design area chosen")}`, "big");
    expect(at("Design area")).toMatchObject({ error: "#VALUE!", message: 'value: got "big"; must be a number' });
    expect(at("Design density")).toMatchObject({ error: "#VALUE!" });
  });

  it("a derate typed as a percentage number says it is a fraction", async () => {
    const { wb, row } = await sheet(us());
    wb.setContent("Estimate", `B${row("Derate for seasonal and future loss")}`, 10);
    const site = wb.value("Estimate", `B${row("Test 1")}`) as { error: string; message?: string };
    expect(site).toMatchObject({ error: "#VALUE!" });
    expect(site.message).toMatch(/0\.1 for 10 %/);
  });
});

describe("SI work", () => {
  it("says the hazard codes are NFPA 13's classes with converted values", async () => {
    const { at } = await sheet(demoScenario("SI"));
    expect(at("Occupancy hazard", "D")).toMatch(/NFPA 13's classes with their values converted to SI/);
  });

  it("gives a tank in m³: L/min × min / 1000", async () => {
    const { at, num } = await sheet(
      (() => {
        const s = demoScenario("SI");
        s.flowTests[0].residual = 2.5;
        s.suctionMinimum = 4.5;
        return s;
      })(),
    );
    expect(at("Suction tank, estimated volume")).toBeCloseTo((num("Demand_Flow") * (at("Supply duration") as number)) / 1000, 6);
  });
});
