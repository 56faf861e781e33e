/**
 * The committed sample workbooks (samples/*.xlsx): rebuilt from their description they hold the same formulas and
 * values; every cached value in them is what the preview engine computes from the file's own formulas; no cell
 * evaluates to an error; each carries the caution and the named cells, and tells the story its name says.
 */
import { readFile } from "node:fs/promises";
import path from "node:path";
import { beforeAll, describe, expect, test } from "vitest";
import { buildSample, registerFunctions } from "../../samples/build";
import { SAMPLES } from "../../samples/scenarios";
import type { CachedValue, WorkbookData } from "../../src/preview/model";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { readXlsx } from "../../src/preview/xlsx";
import { REQUIRED_NAMES } from "../../src/workbook/port";
import { buildModel } from "../../src/taskpane/model";
import { PreviewPort } from "../../src/preview/port";
import { CAUTION } from "../../src/workbook/look";
import { estimateTemplate } from "../../src/workbook/template";

let known: string[];
beforeAll(async () => {
  known = await registerFunctions();
});

async function committed(file: string): Promise<WorkbookData> {
  const bytes = await readFile(path.join("samples", file));
  return (await readXlsx(bytes, known)).workbook;
}

/** A value as a file keeps it: an error's code without its message, empty text as no value. */
function asFiled(v: CachedValue | undefined): CachedValue | undefined {
  if (v !== null && typeof v === "object") return { error: v.error };
  return v === "" ? null : v;
}

test("samples/index.json lists every sample in order", async () => {
  const index = JSON.parse(await readFile("samples/index.json", "utf8"));
  expect(index.samples).toEqual(SAMPLES.map((s) => ({ file: s.file, title: s.title })));
});

describe.each(SAMPLES.map((s) => [s.file, s] as const))("%s", (file, spec) => {
  test("rebuilt from its description, it holds the same formulas, values and names as the committed file", async () => {
    const fresh = await buildSample(spec, known);
    const { workbook: rebuilt } = await readXlsx(fresh.bytes, known);
    const onDisk = await committed(file);
    expect(onDisk.sheets.map((s) => s.name)).toEqual(rebuilt.sheets.map((s) => s.name));
    onDisk.sheets.forEach((sheet, i) => {
      const other = rebuilt.sheets[i].cells;
      expect(Object.keys(sheet.cells).sort(), sheet.name).toEqual(Object.keys(other).sort());
      for (const [address, cell] of Object.entries(sheet.cells)) {
        expect(cell.content, `${sheet.name}!${address}`).toEqual(other[address].content);
        expect(cell.cached, `${sheet.name}!${address}`).toEqual(other[address].cached);
      }
    });
    expect(onDisk.names).toEqual(rebuilt.names);
  });

  test("every cached value is what the engine computes from the file's formulas, and no cell is an error", async () => {
    const data = await committed(file);
    const engine = new PreviewWorkbook(data);
    let compared = 0;
    for (const sheet of data.sheets) {
      for (const [address, cell] of Object.entries(sheet.cells)) {
        const value = engine.value(sheet.name, address);
        expect(value === null || typeof value !== "object", `${sheet.name}!${address} shows ${JSON.stringify(value)}`).toBe(true);
        if (cell.cached === undefined) continue;
        expect(cell.cached, `${sheet.name}!${address}`).toEqual(asFiled(value));
        compared++;
      }
    }
    expect(compared).toBeGreaterThan(80);
  });

  test("it prints on one page: the estimate sheet's print area, title rows and fit are in the file", async () => {
    const estimate = (await committed(file)).sheets.find((s) => s.name === "Estimate")!;
    expect(estimate.print).toEqual(estimateTemplate(spec.scenario).print);
  });

  test("it carries the caution and every named cell the pane reads", async () => {
    const engine = new PreviewWorkbook(await committed(file));
    const texts = engine.cells("Estimate").map((c) => c.value);
    expect(texts).toContain(CAUTION);
    const readings = await new PreviewPort(engine).readInputs();
    for (const name of REQUIRED_NAMES) expect(readings[name].kind, name).toBe("number");
    expect(readings.Units).toMatchObject({ kind: "text", value: spec.scenario.units });
    expect(readings.Required_Margin).toMatchObject({ kind: "number", value: spec.scenario.requiredMargin });
  });
});

/** The sample whose file name starts so. */
function sample(start: string) {
  return SAMPLES.find((x) => x.file.startsWith(start))!;
}

describe("each sample tells its story", () => {
  async function verdictOf(file: string): Promise<{ verdict: string; engine: PreviewWorkbook }> {
    const engine = new PreviewWorkbook(await committed(file));
    const cell = engine.cells("Estimate").find((c) => typeof c.content === "string" && c.content.startsWith("=HEADROOM.VERDICT("));
    expect(cell).toBeDefined();
    return { verdict: String(cell!.value), engine };
  }

  test("the light-manufacturing unit needs a pump, PUMPSIZE suggests one, and the main can feed it", async () => {
    const { verdict, engine } = await verdictOf(sample("tinker-row").file);
    expect(verdict).toMatch(/^Pump needed: /);
    const m = buildModel(await new PreviewPort(engine).readInputs());
    expect(m.kind).toBe("ready");
    if (m.kind !== "ready") return;
    // no pump chosen: the suggestion, as the sheet's PUMPSIZE cell shows it, and PUMPSUCTION above the minimum
    expect(m.estimate.pump).toBeNull();
    const size = engine.cells("Estimate").find((c) => typeof c.content === "string" && c.content.includes("HEADROOM.PUMPSIZE("))!;
    expect(m.estimate.pumpSize?.ratedFlow).toBe(engine.value("Estimate", size.address));
    expect(m.estimate.state).toBe("short");
    expect(m.estimate.suction).toMatchObject({ chosen: false, below: false });
    expect(engine.cells("Estimate").some((c) => c.value === "Enough left in the main for the pump")).toBe(true);
  });

  test("in the light-manufacturing unit a 4 in cross main to the riser removes the need for a pump", async () => {
    const { engine } = await verdictOf(sample("tinker-row").file);
    const seg = engine.cells("Estimate").find((c) => c.value === "Cross main to the riser");
    expect(seg).toBeDefined();
    const row = seg!.address.slice(1);
    const verdictCell = engine.cells("Estimate").find((c) => typeof c.content === "string" && c.content.startsWith("=HEADROOM.VERDICT("))!;
    engine.setTyped("Estimate", `B${row}`, "4");
    expect(String(engine.value("Estimate", verdictCell.address))).toMatch(/^No pump needed: /);
  });

  /** The value beside a label in column A. */
  function beside(engine: PreviewWorkbook, label: string, col = "B") {
    const c = engine.cells("Estimate").find((x) => x.value === label && x.address.startsWith("A"))!;
    return engine.value("Estimate", `${col}${c.address.slice(1)}`);
  }

  test("the dry parking deck flows a design area 30 % larger at the density of the unadjusted area, in galvanized pipe at C 100", async () => {
    const { verdict, engine } = await verdictOf(sample("linden-yard").file);
    expect(verdict).toMatch(/^(No pump needed|Marginal|Pump needed): /);
    // OH1: 1500 ft² at 0.15 gpm/ft² [NFPA 13] (from memory); dry: × 1.3 = 1950 ft² [NFPA 13] (from memory)
    expect(beside(engine, "Design area")).toBe(1500);
    expect(beside(engine, "Design density")).toBeCloseTo(0.15, 9);
    expect(beside(engine, "Design area flowed")).toBeCloseTo(1950, 9);
    expect(beside(engine, "Hazen-Williams C")).toBe(100); // galvanized, dry [NFPA 13]
    // the sprinklers flow at least density × flowed area: 0.15 × 1950 = 292.5 gpm
    expect(beside(engine, "AREADEMAND") as number).toBeGreaterThanOrEqual(292.5);
  });

  test("the rack storage is designed by number of sprinklers, its hose and duration typed in", async () => {
    const { verdict, engine } = await verdictOf(sample("harrow-row").file);
    expect(verdict).toMatch(/^Pump needed: /);
    expect(beside(engine, "HEADSDEMAND", "D")).toBe(12); // sprinklers flowing
    expect(beside(engine, "HEADSDEMAND", "E")).toBe(3); // lines of four
    expect(beside(engine, "HEADSDEMAND", "F")).toBe(52); // the end sprinkler at the minimum pressure
    expect(beside(engine, "Hose stream allowance, inside + outside")).toBe(250);
    expect(beside(engine, "Supply duration")).toBe(60);
    expect(engine.cells("Estimate").some((c) => typeof c.content === "string" && c.content.includes("HEADROOM.AREADEMAND("))).toBe(false);
  });

  test("the office building needs no pump, on the weaker of its two flow tests", async () => {
    const { verdict, engine } = await verdictOf(sample("quill-street").file);
    expect(verdict).toMatch(/^No pump needed: /);
    const label = engine.cells("Estimate").find((c) => c.value === "Flow test used")!;
    expect(engine.value("Estimate", `B${label.address.slice(1)}`)).toBe("Test 2");
  });

  test("the SI workshop speaks bar and L/min, and its supply is marginal", async () => {
    const { verdict } = await verdictOf(sample("kiln-lane").file);
    expect(verdict).toMatch(/^Marginal: /);
    expect(verdict).toMatch(/bar/);
    expect(verdict).toMatch(/L\/min/);
  });
});
