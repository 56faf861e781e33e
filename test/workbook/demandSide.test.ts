/**
 * The estimate sheet's demand side, calculated by the preview's formula engine with the real cell functions: the
 * system type read once for C and for the design area (ADJUSTAREA), the fittings inside the design area, the inside
 * hose carried by the segments that carry it, each segment's velocity and friction rate, and where the pressure goes.
 */
import { beforeAll, describe, expect, it } from "vitest";
import * as functions from "../../src/functions/functions";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { generatedMetadata } from "../preview/metadataFixture";
import { calculatedSheet, usDemo } from "./calculatedSheet";

beforeAll(async () => {
  registerHeadroomFunctions(await generatedMetadata(), functions);
});

const sheet = calculatedSheet;
const us = usDemo;

describe("the system type, read once", () => {
  it("flows a dry system's design area 30 % larger at the density of the unadjusted area, and takes the dry C [NFPA 13] (from memory)", async () => {
    const wet = await sheet(us());
    const dry = await sheet(us((s) => (s.system = "dry")));
    // OH2: 1500 ft² at 0.20 gpm/ft²; dry: 1500 × 1.3 = 1950 ft²; black steel dry C 100 [NFPA 13]
    expect(dry.at("Design area")).toBe(1500);
    expect(dry.at("Design density")).toBeCloseTo(0.2, 9);
    expect(dry.at("Design area flowed")).toBeCloseTo(1950, 9);
    expect(wet.at("Design area flowed")).toBe(1500);
    expect(dry.at("Hazen-Williams C")).toBe(100);
    expect(wet.at("Hazen-Williams C")).toBe(120);
    // and the run's C factors read the same system cell: the steel cross main to the riser is C 100 too
    expect(dry.at("Cross main to the riser", "I")).toBe(100);
    // the sprinklers flow at least 0.20 × 1950 = 390 gpm, more than the wet system's 0.20 × 1500 = 300 gpm
    expect(dry.at("AREADEMAND") as number).toBeGreaterThanOrEqual(390);
    expect(dry.num("Demand_Pressure")).toBeGreaterThan(wet.num("Demand_Pressure"));
  });

  it("keeps a double-interlock preaction system's area larger and a single-interlock one's as it is", async () => {
    expect((await sheet(us((s) => (s.system = "double interlock")))).at("Design area flowed")).toBeCloseTo(1950, 9);
    expect((await sheet(us((s) => (s.system = "preaction")))).at("Design area flowed")).toBe(1500);
  });
});

describe("the fittings inside the design area", () => {
  it("adds one tee at the branch-line size, its loss at an average line's flow, where the run starts", async () => {
    const { at } = await sheet(us());
    const flow = at("AREADEMAND") as number;
    const lines = at("AREADEMAND", "E") as number;
    const pressure = at("AREADEMAND", "C") as number;
    // the demo's 1½ in Schedule 40 branch lines, C 120: one tee, 8 ft [NFPA 13] (from memory), through FITTINGS
    const length = functions.fittings("T", 1.5, 120, "40");
    expect(length).toBeCloseTo(8, 9);
    const loss = functions.friction(flow / lines, functions.pipeid(1.5, "40"), 120, length);
    expect(at("Their equivalent length")).toBeCloseTo(length, 9);
    expect(at("Their loss")).toBeCloseTo(loss, 9);
    expect(at("Pressure where the run starts")).toBeCloseTo(pressure + loss, 9);
    expect(loss).toBeGreaterThan(0.2);
  });

  it("adds nothing where the list is emptied", async () => {
    const { at } = await sheet(us((s) => (s.areaFittings = "")));
    expect(at("Their loss")).toBe(0);
    expect(at("Pressure where the run starts")).toBe(at("AREADEMAND", "C"));
  });
});

describe("the inside hose flows where it flows", () => {
  it("carries the sprinklers alone to the riser, sprinklers + inside hose from the riser to the main", async () => {
    const { at } = await sheet(us());
    const sprinklers = at("AREADEMAND") as number;
    expect(at("Cross main to the riser", "G")).toBeCloseTo(sprinklers, 9);
    // OH2's largest inside allowance: 100 gpm [NFPA 13] (from memory)
    for (const seg of ["Riser with its valves", "Backflow preventer", "Underground to the street main"]) {
      expect(at(seg, "G")).toBeCloseTo(sprinklers + 100, 9);
    }
  });

  it("includes the inside hose's friction in the demand pressure at the main, segment by segment", async () => {
    const carried = await sheet(us());
    const none = await sheet(us((s) => s.run.forEach((seg) => (seg.insideHose = false))));
    const q = carried.at("AREADEMAND") as number;
    // the difference is the riser's, the backflow preventer's and the underground's extra friction at q + 100 gpm:
    // FRICTION over each segment's length plus its fitting length, as PIPERUN takes it [NFPA 13]
    let extra = 0;
    for (const seg of ["Riser with its valves", "Backflow preventer", "Underground to the street main"]) {
      const [d, c, len, fit] = ["H", "I", "J", "K"].map((col) => carried.at(seg, col) as number);
      extra += functions.friction(q + 100, d, c, len + fit) - functions.friction(q, d, c, len + fit);
    }
    expect(extra).toBeGreaterThan(0.5);
    expect(carried.num("Demand_Pressure") - none.num("Demand_Pressure")).toBeCloseTo(extra, 9);
  });

  it("asks for yes or no", async () => {
    const { wb, row } = await sheet(us());
    const r = row("Riser with its valves");
    wb.setContent("Estimate", `F${r}`, "sometimes");
    expect(wb.value("Estimate", `G${r}`)).toBe(`type yes or no in F${r}`);
    expect(wb.value("Estimate", `N${r}`)).toMatchObject({ error: "#VALUE!" });
  });
});

describe("each segment's velocity, friction rate and check; where the pressure goes", () => {
  it("gives each segment's velocity and friction per 100 ft, and flags one above the limit (common practice: 20 ft/s)", async () => {
    const { at } = await sheet(us((s) => (s.run[0].nominal = 2)));
    const q = at("Cross main to the riser", "G") as number;
    const d = at("Cross main to the riser", "H") as number;
    // VELOCITY: 0.4085 Q / d² ft/s (definition); FRICTIONRATE × 100 [NFPA 13]
    expect(at("Cross main to the riser", "R")).toBeCloseTo((0.4085 * q) / d ** 2, 2);
    expect(at("Cross main to the riser", "S")).toBeCloseTo(100 * functions.frictionrate(q, d, 120), 9);
    expect(at("Cross main to the riser", "R") as number).toBeGreaterThan(20);
    expect(at("Cross main to the riser", "T")).toBe("faster than the limit");
    expect(at("Underground to the street main", "T")).toBe("");
  });

  it("asks for a number where the velocity limit holds text, rather than flag nothing", async () => {
    const { at, wb, row } = await sheet(us((s) => (s.run[0].nominal = 2)));
    const limit = row("Velocity limit");
    wb.setContent("Estimate", `B${limit}`, "fast");
    expect(at("Cross main to the riser", "T")).toBe(`type a number in B${limit}`);
  });

  it("adds up to the demand pressure and names the segment losing the most", async () => {
    const { num, readings, at } = await sheet(us((s) => (s.run[0].nominal = 2)));
    const parts = ["Pressure_EndSprinkler", "Pressure_AreaFriction", "Pressure_RunFriction", "Pressure_Elevation", "Pressure_Devices"] as const;
    const sum = parts.map((p) => num(p)).reduce((a, b) => a + b, 0);
    expect(sum).toBeCloseTo(num("Demand_Pressure"), 9);
    expect(num("Pressure_EndSprinkler")).toBe(at("AREADEMAND", "F"));
    expect(readings.Run_WorstSegment).toMatchObject({ kind: "text", value: "Cross main to the riser" });
    expect(num("Run_WorstLoss")).toBe(at("Cross main to the riser", "N"));
    expect(num("Run_WorstVelocity")).toBe(at("Cross main to the riser", "R"));
    expect(num("Velocity_Limit")).toBe(20);
  });
});
