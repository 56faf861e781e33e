/**
 * The estimate sheet's sections (src/workbook/sections.ts): each takes exactly the rows it reports, from wherever it
 * is started, and refers to other sections only through the addresses it is given; and the design area's demand
 * section can be replaced by another that gives the same refs, the other sections untouched.
 */
import { beforeAll, describe, expect, it } from "vitest";
import * as functions from "../../src/functions/functions";
import { templateNames, templateSheet } from "../../src/preview/fromTemplate";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { parseCell } from "../../src/workbook/a1";
import { demoScenario } from "../../src/workbook/scenario";
import { SAMPLES } from "../../samples/scenarios";
import {
  type AreaDemandSection,
  breakdownSection,
  candidatesSection,
  hazardSection,
  headsDemandSection,
  pipeRunSection,
  projectSection,
  storageCriteriaSection,
  supplyCurveSection,
  supplyDemandSection,
  treeDemandSection,
  verdictSection,
  waterSupplySection,
} from "../../src/workbook/sections";
import type { Section } from "../../src/workbook/sheet";
import { estimateTemplate } from "../../src/workbook/template";
import { generatedMetadata } from "../preview/metadataFixture";

beforeAll(async () => {
  registerHeadroomFunctions(await generatedMetadata(), functions);
});

/** Addresses of other sections, far below any section's own rows. */
const units = "$Z$999";
const supply = {
  tests: [
    { label: "B950", static: "B951", residual: "C951", testFlow: "B953", when: "B954" },
    { label: "C950", static: "B952", residual: "C952", testFlow: "C953", when: "C954" },
    { label: "D950", static: "B953", residual: "C953", testFlow: "D953", when: "D954" },
  ],
};
const used = { static: "B901", residual: "B902", testFlow: "B903" };
const hazard = { hazard: "B904", area: "B905", density: "B906", hose: "B907", insideHose: "B915", duration: "B917", durationInput: "B916" };
const area = { flow: "B908", pressure: "C908", endPressure: "F908", system: "B909", source: "AREADEMAND" };
const run = {
  pressureAfter: "Q910",
  labels: "A920:A923",
  friction: "N920:N923",
  elevation: "O920:O923",
  fixed: "P920:P923",
  velocity: "R920:R923",
  velocityLimit: "B919",
};
const demand = { sprinklerFlow: "B911", hoseFlow: "B912", flow: "B913", pressure: "B914", pumpFlow: "B916" };
const judged = { name: "B930", flow: "B931", pressure: "B932", pumpFlow: "B933", othersFlow: "B941:B944", othersPressure: "C941:C944" };

const SHIFT = 100;

/** A section's own addresses (rows first..first+rows−1, relative or absolute) moved down by `by` rows; others left alone. */
function shifted(text: string, first: number, rows: number, by: number): string {
  return text.replace(/(?<![A-Za-z0-9$#])(\$?[A-Z]{1,2}\$?)(\d+)\b/g, (m, col: string, r: string) => {
    const n = Number(r);
    return n >= first && n < first + rows ? `${col}${n + by}` : m;
  });
}

/** The storage sample: a design by number of sprinklers. */
const storage = SAMPLES.find((x) => x.scenario.design.kind === "heads")!.scenario;

describe.each(["US", "SI"] as const)("the sections, %s", (u) => {
  const s = demoScenario(u);
  const builders: Array<[string, (row: number) => Section<unknown>]> = [
    ["project", (row) => projectSection(s, row)],
    ["water supply", (row) => waterSupplySection(s, row, { units })],
    ["hazard", (row) => hazardSection(s, row, { units })],
    ["tree demand", (row) => treeDemandSection(s, row, { units, hazard })],
    ["pipe run", (row) => pipeRunSection(s, row, { units, area, hazard })],
    ["where the pressure goes", (row) => breakdownSection(s, row, { area, run })],
    ["storage criteria", (row) => storageCriteriaSection(storage, row)],
    ["sprinklers by number", (row) => headsDemandSection(storage, row, { units, hazard })],
    ["demand at the supply", (row) => supplyDemandSection(s, row, { area, hazard, run })],
    ["design areas compared", (row) => candidatesSection(s, row, { units, supply, demand })],
    ["verdict", (row) => verdictSection(s, row, { units, supply, hazard, demand: judged })],
    ["supply curve", (row) => supplyCurveSection(s, row, { units, supply: used, demand, judged })],
  ];

  it.each(builders)("%s: its cells lie in the rows it reports, and move with its first row", (_, build) => {
    const first = 3;
    const a = build(first);
    const b = build(first + SHIFT);
    expect(a.rows).toBeGreaterThan(0);
    expect(b.rows).toBe(a.rows);
    for (const c of a.cells) {
      const row = parseCell(c.address).row + 1;
      expect(row, c.address).toBeGreaterThanOrEqual(first);
      expect(row, c.address).toBeLessThan(first + a.rows);
    }
    // the same cells, names and refs, moved down; addresses of other sections unchanged
    const move = (x: unknown) => JSON.parse(shifted(JSON.stringify(x), first, a.rows, SHIFT));
    expect(b.cells).toEqual(move(a.cells));
    expect(b.names).toEqual(move(a.names));
    expect(b.refs).toEqual(move(a.refs));
  });
});

describe("another design-area demand section in place of the tree", () => {
  /** A stand-in: the design area's flow and pressure typed in, as a demand from elsewhere would be. */
  const typed =
    (flow: number, pressure: number, end: number): AreaDemandSection =>
    (s, row) => {
      const r = (k: number) => row + k;
      return {
        cells: [
          { address: `A${r(0)}`, role: "heading", value: "Design area demand, typed in" },
          { address: `A${r(1)}`, role: "label", value: "Sprinkler flow" },
          { address: `B${r(1)}`, role: "input", value: flow },
          { address: `A${r(2)}`, role: "label", value: "Pressure where the run starts" },
          { address: `B${r(2)}`, role: "input", value: pressure },
          { address: `A${r(3)}`, role: "label", value: "System" },
          { address: `B${r(3)}`, role: "input", value: s.system },
          { address: `A${r(4)}`, role: "label", value: "End sprinkler" },
          { address: `B${r(4)}`, role: "input", value: end },
        ],
        names: [],
        rows: 5,
        refs: { flow: `B${r(1)}`, pressure: `B${r(2)}`, endPressure: `B${r(4)}`, system: `B${r(3)}`, source: "the typed demand" },
      };
    };

  function calculated(t: ReturnType<typeof estimateTemplate>) {
    return new PreviewWorkbook({ sheets: [templateSheet(t)], names: templateNames(t) });
  }
  const formulaCell = (t: ReturnType<typeof estimateTemplate>, call: string) => t.cells.find((c) => c.formula?.includes(call.slice(1)))!.address;

  it("gives the same verdict as the tree when it gives the same demand, and the other sections follow it", () => {
    const s = demoScenario("US");
    const tree = estimateTemplate(s);
    const treeBook = calculated(tree);
    const areaDemand = tree.cells.find((c) => c.formula?.includes("HEADROOM.AREADEMAND("))!.address;
    const a = parseCell(areaDemand);
    const flow = treeBook.value("Estimate", areaDemand) as number;
    const startLabel = tree.cells.find((c) => c.value === "Pressure where the run starts")!.address;
    const pressure = treeBook.value("Estimate", `B${startLabel.slice(1)}`) as number;
    const end = treeBook.value("Estimate", `F${a.row + 1}`) as number;

    const other = estimateTemplate(s, { areaDemand: typed(flow, pressure, end) });
    const otherBook = calculated(other);
    const errors = otherBook.cells("Estimate").filter((c) => c.value !== null && typeof c.value === "object");
    expect(errors.map((c) => `${c.address} ${c.content}`)).toEqual([]);
    // every name the pane reads is still defined, and the sections after the demand read the typed cells
    // (but Design_Area, the area the tree section flows, which the one-page summary reads where a section gives it)
    expect(other.names.map((n) => n.name)).toEqual(tree.names.map((n) => n.name).filter((n) => n !== "Design_Area"));
    expect(other.cells.find((c) => c.value === "from the typed demand")).toBeDefined();
    expect(otherBook.value("Estimate", formulaCell(other, "=HEADROOM.VERDICT("))).toBe(treeBook.value("Estimate", formulaCell(tree, "=HEADROOM.VERDICT(")));
    expect(otherBook.value("Estimate", formulaCell(other, "=HEADROOM.MARGIN("))).toBeCloseTo(treeBook.value("Estimate", formulaCell(tree, "=HEADROOM.MARGIN(")) as number, 9);
    // the tree section takes 19 rows (heading, four sprinkler inputs, HEADFLOW, the pipe table's header and two rows,
    // material, system, C, the area flowed, AREADEMAND's header and row, the area's fittings, their length and loss,
    // the pressure where the run starts), the stand-in 5: everything after it moves up 14 rows
    const verdictRow = (t: ReturnType<typeof estimateTemplate>) => parseCell(formulaCell(t, "=HEADROOM.VERDICT(")).row;
    expect(verdictRow(tree) - verdictRow(other)).toBe(19 - 5);
  });
});
