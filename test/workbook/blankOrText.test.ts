/**
 * The estimate sheet's "leave blank to use …" inputs, calculated by the preview's formula engine with the real cell
 * functions: a blank input takes the fallback; text (or anything else that is not a number) is an error in the cell
 * that would have used it, with a message that quotes what was typed, never a silent fallback.
 */
import { beforeAll, describe, expect, it } from "vitest";
import * as functions from "../../src/functions/functions";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import type { Scenario } from "../../src/workbook/scenario";
import { generatedMetadata } from "../preview/metadataFixture";
import { calculatedSheet, usDemo } from "./calculatedSheet";

beforeAll(async () => {
  registerHeadroomFunctions(await generatedMetadata(), functions);
});

const sheet = calculatedSheet;
const us = usDemo;

/** `v` is a #VALUE! whose message quotes `typed` and says a number belongs there. */
function saysNotANumber(v: unknown, typed: string): void {
  expect(v).toMatchObject({ error: "#VALUE!" });
  expect((v as { message?: string }).message).toContain(`got "${typed}"; must be a number`);
}

/** A design by number of sprinklers (the rack-storage kind), in the demo's US units. */
const storage = (change: (s: Scenario) => void = () => {}) =>
  us((s) => {
    s.design = { kind: "heads", storage: "rack storage (demo)", heads: 12, headsPerLine: 4, lineSpacing: 10, hose: 250, duration: 60 };
    s.sprinkler = { kFactor: 16.8, coverage: 100, spacing: 10, minPressure: 52 };
    change(s);
  });

/** A second flow test that runs dry before the demand flow: a suction tank is needed (see supplySide.test.ts). */
const dryTest = (s: Scenario) =>
  s.flowTests.push({ ...s.flowTests[0], when: "weak hydrant (demo)", static: 60, residual: 5, flow: 300, pitot: null });

describe("the flow measured directly", () => {
  it("blank: the test flow is the pitot reading's; a number: that number", async () => {
    // the demo's pitot reading, 14 psi at a 2.5 in outlet, coefficient 0.90: Q = 29.83 × 0.9 × 2.5² × √14 [NFPA 291]
    const pitot = 29.83 * 0.9 * 2.5 ** 2 * Math.sqrt(14);
    expect((await sheet(us())).at("Test flow used (gpm)")).toBeCloseTo(pitot, 6);
    expect((await sheet(us((s) => (s.flowTests[0].flow = 1250)))).at("Test flow used (gpm)")).toBe(1250);
  });

  it("text: the test flow used is an error quoting it, and so is every reading of it, never the pitot flow", async () => {
    const { at, readings } = await sheet(us((s) => (s.flowTests[0].flow = "1250 gpm" as unknown as number)));
    saysNotANumber(at("Test flow used (gpm)"), "1250 gpm");
    const r = readings.Supply_TestFlow;
    expect(r.kind).toBe("error");
    expect(r.kind === "error" && r.message).toContain('got "1250 gpm"');
  });
});

describe("the hazard's design area, inside hose and duration", () => {
  it("blank: the hazard's own values (DESIGNAREA, HOSEALLOWANCE inside, DURATION max)", async () => {
    const { at } = await sheet(us());
    expect(at("Design area")).toBe(functions.designarea("OH2"));
    expect(at("Inside hose allowance")).toBe(functions.hoseallowance("OH2", "inside"));
    expect(at("Supply duration")).toBe(functions.duration("OH2", "max"));
  });

  it("text in the design area chosen: the design area is an error quoting it", async () => {
    saysNotANumber((await sheet(us((s) => (s.designArea = "big" as unknown as number)))).at("Design area"), "big");
  });

  it("text in the inside hose allowance chosen: the inside hose allowance is an error quoting it", async () => {
    saysNotANumber((await sheet(us((s) => (s.insideHose = "some" as unknown as number)))).at("Inside hose allowance"), "some");
  });

  it("text in the duration chosen: the duration says so, and so does a suction tank's volume", async () => {
    const { at } = await sheet(
      us((s) => {
        s.duration = "an hour" as unknown as number;
        dryTest(s);
      }),
    );
    expect(at("Supply duration")).toMatch(/^type a number of minutes in B\d+$/);
    expect(at("Suction tank, estimated volume")).toBe(at("Supply duration"));
  });
});

describe("a design by number of sprinklers", () => {
  it("text in the inside hose allowance chosen: an error quoting it, not 0", async () => {
    saysNotANumber((await sheet(storage((s) => (s.insideHose = "100 gpm" as unknown as number)))).at("Inside hose allowance"), "100 gpm");
  });

  it("text in the supply duration: a suction tank's volume says where a number of minutes belongs", async () => {
    const s = storage((s) => {
      (s.design as { duration: unknown }).duration = "60 min";
      dryTest(s);
    });
    const { at, row } = await sheet(s);
    expect(at("Suction tank, estimated volume")).toBe(`type a number of minutes in B${row("Supply duration")}`);
    // and with a number, the volume: demand flow × duration
    const ok = await sheet(storage(dryTest));
    expect(ok.at("Suction tank, estimated volume")).toBeCloseTo((ok.at("Demand flow, sprinklers + hose") as number) * 60, 6);
  });
});

describe("the flow through a pump and the pump chosen", () => {
  it("text in a candidate's flow through a pump: the controlling area's flow through a pump is an error quoting it", async () => {
    const { at } = await sheet(us((s) => (s.candidates = [{ name: "Dock", flow: 900, pressure: 200, pumpFlow: "lots" as unknown as number }])));
    expect(at("Controlling design area")).toBe("Dock");
    saysNotANumber(at("Its flow through a pump"), "lots");
  });

  it("blank flow through a pump in the table: the area's demand flow", async () => {
    const { at } = await sheet(us((s) => (s.candidates = [{ name: "Dock", flow: 900, pressure: 200, pumpFlow: null }])));
    expect(at("Its flow through a pump")).toBe(900);
  });

  it("text in the chosen pump's rating: the pump checked is an error quoting it, never the suggestion", async () => {
    const { at } = await sheet(us((s) => (s.pump = { ratedFlow: "750 gpm" as unknown as number, ratedPressure: "60 psi" as unknown as number })));
    saysNotANumber(at("Pump checked"), "750 gpm");
    saysNotANumber(at("Pump checked", "C"), "60 psi");
  });
});
