/**
 * The estimate sheet's gridded demand section, calculated by the preview's formula engine with the real cell
 * functions: GRIDDEMAND on the sheet's own inputs, its placement shown, the same area as a tree beside it, and the
 * gridded sample whose verdict a grid turns from "Pump needed" (as a tree) into "Marginal".
 */
import { beforeAll, describe, expect, it } from "vitest";
import { SAMPLES } from "../../samples/scenarios";
import * as functions from "../../src/functions/functions";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { CAUTION } from "../../src/workbook/look";
import type { Scenario } from "../../src/workbook/scenario";
import { generatedMetadata } from "../preview/metadataFixture";
import { calculatedSheet } from "./calculatedSheet";

beforeAll(async () => {
  registerHeadroomFunctions(await generatedMetadata(), functions);
});

const GRID = SAMPLES.find((x) => x.scenario.design.kind === "grid")!;

/** The gridded sample, changed. */
function grid(change: (s: Scenario) => void = () => {}): Scenario {
  const s = structuredClone(GRID.scenario);
  change(s);
  return s;
}

describe("the gridded demand section", () => {
  it("spills GRIDDEMAND on the sheet's own inputs: flow, pressure, sprinklers, lines, end sprinkler and where the area landed", async () => {
    const { at } = await calculatedSheet(grid());
    const s = GRID.scenario;
    if (s.design.kind !== "grid") throw new Error("not a grid");
    // OH2 [NFPA 13]: 0.20 gpm/ft² over 1500 ft², the smallest area on the curve (a wet system flows it as it is)
    const density = at("Design density") as number;
    const area = at("Design area flowed") as number;
    expect(density).toBeCloseTo(0.2, 9);
    expect(area).toBe(1500);
    const expected = functions.griddemand(
      density,
      area,
      s.sprinkler.coverage,
      s.sprinkler.kFactor,
      s.sprinkler.spacing,
      s.design.lines,
      s.design.lineLength,
      functions.pipeid(s.branch.nominal, s.branch.schedule),
      functions.pipeid(s.crossMain.nominal, s.crossMain.schedule),
      functions.cfactor(s.material, s.system),
      s.sprinkler.minPressure,
      s.design.feedLine,
      "US",
    ) as number[][];
    const cols = ["B", "C", "D", "E", "F", "G", "H"];
    cols.forEach((c, i) => expect(at("GRIDDEMAND", c), `column ${c}`).toBeCloseTo(expected[0][i], 9));
    // never less than density × area [NFPA 13]: 0.20 × 1500 = 300 gpm
    expect(at("GRIDDEMAND") as number).toBeGreaterThanOrEqual(300);
    // the placement lies inside the grid
    expect(at("GRIDDEMAND", "G") as number).toBeGreaterThanOrEqual(1);
    expect((at("GRIDDEMAND", "G") as number) + (at("GRIDDEMAND", "E") as number) - 1).toBeLessThanOrEqual(s.design.lines);
  });

  it("sets the same area as a tree beside it, and says how much pressure the grid saves", async () => {
    const { at } = await calculatedSheet(grid());
    const tree = at("AREADEMAND", "C") as number;
    const gridP = at("GRIDDEMAND", "C") as number;
    // water reaching each sprinkler from both ends of its line needs less pressure than a tree's end-fed lines
    expect(tree).toBeGreaterThan(gridP);
    expect(at("Pressure the grid saves")).toBeCloseTo(tree - gridP, 9);
  });

  it("carries the grid's demand into the run and the verdict, not the tree's", async () => {
    const { at, num } = await calculatedSheet(grid());
    expect(at("Sprinkler flow")).toBeCloseTo(at("GRIDDEMAND") as number, 9);
    expect(at("Pressure where the run starts") as number).toBeGreaterThanOrEqual(at("GRIDDEMAND", "C") as number);
    expect(num("Demand_Flow")).toBeCloseTo((at("GRIDDEMAND") as number) + num("Demand_HoseFlow"), 9);
  });

  it("a bad grid input shows GRIDDEMAND's message where the demand is solved", async () => {
    // the riser fed at line 20 of a 14-line grid
    const { at } = await calculatedSheet(grid((s) => s.design.kind === "grid" && (s.design.feedLine = 20)));
    const e = at("GRIDDEMAND") as { error: string; message?: string };
    expect(e.error).toBe("#VALUE!");
    expect(e.message).toMatch(/feed_line/);
    expect(at("Verdict")).toMatchObject({ error: "#VALUE!" });
  });
});

describe("the gridded sample", () => {
  it("is Marginal as a grid, where the same building as a tree needs a pump", async () => {
    const asGrid = await calculatedSheet(grid());
    const asTree = await calculatedSheet(grid((s) => (s.design = { kind: "area" })));
    expect(asGrid.at("Verdict")).toMatch(/^Marginal: \d+\.\d psi to spare at \d+ gpm, less than the 10\.0 psi margin required\.$/);
    expect(asTree.at("Verdict")).toMatch(/^Pump needed: the supply is \d+\.\d psi short at \d+ gpm\.$/);
    // the caution stands near the top of the gridded sheet as of every other
    const caution = asGrid.t.cells.find((c) => c.role === "caution")!;
    expect(caution.value).toBe(CAUTION);
    expect(asGrid.wb.value("Estimate", caution.address)).toBe(CAUTION);
  });
});
