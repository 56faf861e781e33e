// @vitest-environment happy-dom
/**
 * The one-page summary (src/summary/): for each sample estimate, calculated from the template by the preview's engine
 * with the real cell functions, the page carries the project, the date of printing, "Preliminary estimate", the
 * state and VERDICT's sentence, the pane's own margin, pump and suction lines, the plot at its fixed width, the key
 * inputs and the caution, and no cell-function name. A workbook without the summary's names still gets a page.
 */
import { afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { SAMPLES } from "../../samples/scenarios";
import { hazardInfo, type Hazard } from "../../src/engine/design";
import * as functions from "../../src/functions/functions";
import { templateNames, templateSheet } from "../../src/preview/fromTemplate";
import { registerHeadroomFunctions } from "../../src/preview/plugin";
import { PreviewPort } from "../../src/preview/port";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { areaWords, hazardWords, keyInputs, summaryFacts, systemWords } from "../../src/summary/facts";
import { SUMMARY_PLOT_WIDTH, renderSummary } from "../../src/summary/page";
import { showSummaryView } from "../../src/summary/view";
import { type Estimate, buildModel } from "../../src/taskpane/model";
import { STATE_WORDS, marginLine, pumpLine, suctionLine } from "../../src/taskpane/pane";
import { CAUTION } from "../../src/workbook/look";
import { SUMMARY_NAMES, type Readings } from "../../src/workbook/port";
import type { Scenario } from "../../src/workbook/scenario";
import { estimateTemplate } from "../../src/workbook/template";
import { generatedMetadata } from "../preview/metadataFixture";
import { VOCABULARY } from "../functions/vocabulary";
import { candidatesTable } from "../taskpane/fakePort";

beforeAll(async () => {
  registerHeadroomFunctions(await generatedMetadata(), functions);
});

afterEach(() => {
  document.body.replaceChildren();
});

const PRINTED = new Date(2026, 4, 4); // 4 May 2026, local time

async function readingsOf(s: Scenario): Promise<Readings> {
  const t = estimateTemplate(s);
  return new PreviewPort(new PreviewWorkbook({ sheets: [templateSheet(t)], names: templateNames(t) })).readInputs();
}

function estimateOf(readings: Readings): Estimate {
  const m = buildModel(readings);
  if (m.kind !== "ready") throw new Error(`the sample's model is ${m.kind}`);
  return m.estimate;
}

/** The page's words, each element's text apart (textContent runs block elements together). */
function words(el: Element): string {
  return [...el.querySelectorAll("*")].filter((e) => e.children.length === 0).map((e) => e.textContent ?? "").join("\n");
}

describe.each(SAMPLES.map((x) => [x.file, x.scenario] as const))("the summary of %s", (_, s) => {
  it("says what the pane says, on one element with the project, the date, 'Preliminary estimate' and the caution", async () => {
    const readings = await readingsOf(s);
    const e = estimateOf(readings);
    const page = renderSummary(document, e, summaryFacts(readings), { printedOn: PRINTED });
    expect(page.dataset.role).toBe("summary");
    const text = page.textContent ?? "";
    for (const part of [s.site, s.address, `Prepared by ${s.preparedBy}`, "Printed 2026-05-04", "Preliminary estimate", STATE_WORDS[e.state], e.headline, marginLine(e), CAUTION]) {
      expect(text, part).toContain(part);
    }
    for (const part of [e.caveat, pumpLine(e), suctionLine(e), ...e.nextSteps]) if (part !== null) expect(text).toContain(part);
    expect(page.querySelector('[data-role="summary-caution"]')?.textContent).toBe(CAUTION);
  });

  it("draws the plot at its fixed width, with the demand point (or every design area compared) and the axis titles", async () => {
    const readings = await readingsOf(s);
    const page = renderSummary(document, estimateOf(readings), summaryFacts(readings), { printedOn: PRINTED });
    const svg = page.querySelector('[data-role="plot"]')!;
    expect(svg.getAttribute("width")).toBe(String(SUMMARY_PLOT_WIDTH));
    const compared = 1 + (s.candidates?.length ?? 0);
    if (compared > 1) {
      expect(svg.querySelectorAll('[data-role="candidate-point"]')).toHaveLength(compared);
      expect(svg.querySelectorAll('[data-role="candidate-point"][data-controls="true"]')).toHaveLength(1);
    } else {
      expect(svg.querySelector('[data-role="demand-point"][data-id="total"]')).not.toBeNull();
    }
    const titles = [...svg.querySelectorAll("text.title")].map((t) => t.textContent);
    expect(titles).toEqual(s.units === "SI" ? ["Flow (L/min)", "Pressure (bar)"] : ["Flow (gpm)", "Pressure (psi)"]);
  });

  it("lists the key inputs: the governing test with its date and place, the hazard in words, the system, the design area", async () => {
    const readings = await readingsOf(s);
    const e = estimateOf(readings);
    const inputs = renderSummary(document, e, summaryFacts(readings), { printedOn: PRINTED }).querySelector('[data-role="summary-inputs"]')!;
    const text = inputs.textContent ?? "";
    expect(s.flowTests.map((t) => t.when)).toContain(readings.Supply_When.kind === "text" ? readings.Supply_When.value : null);
    expect(text).toContain((readings.Supply_When as { value: string }).value);
    expect(text).toContain(s.system === "wet" ? "Wet pipe" : s.system);
    if (s.design.kind === "heads") {
      // a design by number of sprinklers: what is stored, as written, and no design area
      expect(text).toContain(s.design.storage);
      expect(readings.Design_Area.kind).toBe("missing");
      return;
    }
    expect(text).toContain(`(${s.hazard})`);
    expect(text.toLowerCase()).toContain(hazardInfo(s.hazard as Hazard).name);
    expect(readings.Design_Area.kind).toBe("number");
    expect(text).toContain(areaWords((readings.Design_Area as { value: number }).value, s.units));
  });

  it("names no cell function: a project manager reads words", async () => {
    const readings = await readingsOf(s);
    const text = words(renderSummary(document, estimateOf(readings), summaryFacts(readings), { printedOn: PRINTED }));
    expect(text).not.toContain("HEADROOM.");
    expect(VOCABULARY.filter((name) => new RegExp(`\\b${name}\\b`).test(text))).toEqual([]);
  });
});

describe("a workbook without the summary's names", () => {
  it("still gets its page: the verdict, the plot and the caution, and says what the sheet does not give", async () => {
    const readings = await readingsOf(SAMPLES[0].scenario);
    for (const n of SUMMARY_NAMES) readings[n] = { kind: "missing" };
    const e = estimateOf(readings);
    const f = summaryFacts(readings);
    expect(Object.values(f).every((v) => v === null)).toBe(true);
    const page = renderSummary(document, e, f, { printedOn: PRINTED });
    const text = page.textContent ?? "";
    expect(text).toContain("Site not given on the sheet");
    expect(text).toContain("date and place not given on the sheet");
    expect(text).toContain(e.headline);
    expect(text).toContain(CAUTION);
    expect(page.querySelector('[data-role="plot"]')).not.toBeNull();
    // the pipe losing the most comes from the pressure breakdown, not from the summary's names
    expect(keyInputs(e, f).map(([k]) => k)).toEqual(["Flow test used", "Tested", "Demand at the supply", "Margin required", "Pipe losing the most"]);
  });

  it("reads blank text as not given, and a number typed as a description as its digits", () => {
    const r = { Project_Site: { kind: "text", value: "  " }, Supply_When: { kind: "number", value: 2026 }, Design_Area: { kind: "text", value: "big" } };
    const f = summaryFacts({ ...Object.fromEntries(SUMMARY_NAMES.map((n) => [n, { kind: "missing" }])), ...r } as unknown as Readings);
    expect(f).toMatchObject({ site: null, testWhen: "2026", designArea: null });
  });
});

describe("the key inputs' words", () => {
  it("names NFPA 13's occupancy classes and leaves a storage description as written", () => {
    expect(hazardWords("LH")).toBe("Light hazard (LH)");
    expect(hazardWords("oh2")).toBe("Ordinary hazard group 2 (OH2)");
    expect(hazardWords("Rack storage, Group A plastics, 6 m")).toBe("Rack storage, Group A plastics, 6 m");
    expect(systemWords("wet")).toBe("Wet pipe");
    expect(systemWords("double interlock")).toBe("Double interlock");
    expect(areaWords(1500, "US")).toBe("1500 ft²");
    expect(areaWords(139.354, "SI")).toBe("139.4 m²");
  });

  it("names the pipe losing the most where the estimate carries the pressure breakdown", async () => {
    const readings = await readingsOf(SAMPLES[0].scenario);
    const base = estimateOf(readings);
    const worst = { segment: "Underground to the street main", loss: 12.34, velocity: 5, overLimit: false, limit: 20, limitGiven: true };
    const e = { ...base, breakdown: { parts: base.breakdown?.parts ?? [], worst } };
    expect(keyInputs(e, summaryFacts(readings))).toContainEqual(["Pipe losing the most", "Underground to the street main, 12.3 psi"]);
  });
});

describe("the print view", () => {
  it("lays the summary over the document with Print and a way back; Escape goes back too", async () => {
    const readings = await readingsOf(SAMPLES[1].scenario);
    const print = vi.fn();
    const onClose = vi.fn();
    document.body.append(document.createElement("main"));
    const view = showSummaryView(document, estimateOf(readings), summaryFacts(readings), { print, onClose, printedOn: PRINTED });
    expect(view.root.parentElement).toBe(document.body);
    expect(view.root.querySelector('[data-role="summary"]')).not.toBeNull();
    (view.root.querySelector('[data-role="summary-print"]') as HTMLButtonElement).click();
    expect(print).toHaveBeenCalledTimes(1);
    (view.root.querySelector('[data-role="summary-close"]') as HTMLButtonElement).click();
    document.dispatchEvent(new KeyboardEvent("keydown", { key: "Escape" }));
    expect(onClose).toHaveBeenCalledTimes(2);
    view.remove();
    expect(document.querySelector('[data-role="summary-view"]')).toBeNull();
    // once removed, Escape is no longer the view's
    document.dispatchEvent(new KeyboardEvent("keydown", { key: "Escape" }));
    expect(onClose).toHaveBeenCalledTimes(2);
  });
});

describe("several design areas on the page", () => {
  it("names the area judged, says whose hazard and design area the sheet gives, and lists the others with their margins", async () => {
    const readings = await readingsOf(SAMPLES[0].scenario);
    const own = estimateOf(readings);
    // an invented second area needing far more than the sample's own: it controls
    readings.Design_Candidates = candidatesTable([
      ["Press hall", own.demandFlow, own.demandPressure, null],
      ["Paper store", 900, 130, null],
    ]);
    const e = estimateOf(readings);
    const rows = keyInputs(e, summaryFacts(readings));
    expect(rows).toContainEqual(["Design area judged", "Paper store: the least margin of the 2 compared"]);
    expect(rows.map(([k]) => k)).toContain("Hazard, Press hall");
    expect(rows.find(([k]) => k === "Demand at the supply")![1]).toBe("900 gpm at 130.0 psi");
    const also = rows.find(([k]) => k === "Also compared")![1];
    expect(also).toMatch(/^Press hall, \d+ gpm at [\d.]+ psi, margin −?[\d.]+ psi$/);
    const page = renderSummary(document, e, summaryFacts(readings), { printedOn: PRINTED });
    expect(page.querySelectorAll('[data-role="candidate-point"]')).toHaveLength(2);
  });
});
