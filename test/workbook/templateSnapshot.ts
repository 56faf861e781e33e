/**
 * What the estimate template produces for a set of scenarios, as one JSON value: the template itself (every cell,
 * formula, format, spill, name, chart series, column width), the cells its spills fill, its extent, and the sheet and
 * names the preview builds from it (roles, merges, row heights, wrapping).
 *
 * test/workbook/template.snapshot.test.ts compares this with the committed test/workbook/snapshots/estimate-template.json,
 * so that the estimate sheet changes only on purpose. After changing the sheet on purpose, rewrite the file with
 *   npx tsx test/workbook/templateSnapshot.ts
 * and look at the diff before committing it.
 */
import { writeFile } from "node:fs/promises";
import { fileURLToPath } from "node:url";
import { SAMPLES } from "../../samples/scenarios";
import { templateNames, templateSheet } from "../../src/preview/fromTemplate";
import { type Scenario, demoScenario } from "../../src/workbook/scenario";
import { type SheetTemplate, spillCells, templateExtent } from "../../src/workbook/sheet";
import { estimateTemplate } from "../../src/workbook/template";

export const SNAPSHOT_FILE = fileURLToPath(new URL("./snapshots/estimate-template.json", import.meta.url));

/** The scenarios the snapshot covers: both demos, every sample, and variants that take the template's other branches. */
export function snapshotScenarios(): Record<string, Scenario> {
  const us = demoScenario("US");
  const si = demoScenario("SI");
  const out: Record<string, Scenario> = { "demo US": us, "demo SI": si };
  for (const s of SAMPLES) out[`sample ${s.file}`] = s.scenario;
  // flow measured directly, a chosen design area, a chosen pump, a one-segment run, text with quotes in it
  out["US variant: direct flow, chosen area and pump, one segment"] = {
    ...us,
    site: 'Bay "North"',
    flowTests: [{ ...us.flowTests[0], flow: 1100, pitot: null }],
    designArea: 2000,
    pump: { ratedFlow: 750, ratedPressure: 50 },
    run: [us.run[0]],
  };
  // three flow tests carried to the site with a derating, hydrants downstream of the pump, chosen hose and duration
  out["US variant: three flow tests, derated, hydrants downstream"] = {
    ...us,
    flowTests: [
      { ...us.flowTests[0], rise: 12 },
      { ...us.flowTests[0], when: "second hydrant (demo)", static: 70, residual: 60, flow: 900, pitot: null, rise: -4 },
      { ...us.flowTests[0], when: "third hydrant (demo)", static: 75, residual: 50, rise: 0 },
    ],
    derate: 0.1,
    hydrantsDownstream: true,
    insideHose: 50,
    duration: 75,
  };
  // a longer run, the rows after it move down
  out["SI variant: six segments"] = { ...si, run: [...si.run, ...si.run.slice(0, 2)] };
  return out;
}

/**
 * What the preview adds to the template when it builds its sheet: column widths by index, merges, row heights, the
 * cells it wraps, and the number formats it gives the cells a spill fills. (The rest of each cell is the template's.)
 */
function previewExtras(t: SheetTemplate) {
  const sheet = templateSheet(t);
  const listed = new Set(t.cells.map((c) => c.address));
  const styles = Object.entries(sheet.cells);
  return {
    name: sheet.name,
    columnWidths: sheet.columnWidths,
    merges: sheet.merges,
    rowHeights: sheet.rowHeights,
    wrapped: styles.filter(([, c]) => c.style?.wrap).map(([a]) => a),
    bold: styles.filter(([, c]) => c.style?.bold).map(([a]) => a),
    italic: styles.filter(([, c]) => c.style?.italic).map(([a]) => a),
    spillFormats: Object.fromEntries(styles.filter(([a]) => !listed.has(a)).map(([a, c]) => [a, c.style?.numFmt])),
  };
}

export function takeSnapshot(): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, s] of Object.entries(snapshotScenarios())) {
    const t = estimateTemplate(s);
    out[key] = {
      template: t,
      spillCells: spillCells(t),
      extent: templateExtent(t),
      preview: previewExtras(t),
      previewNames: templateNames(t),
    };
  }
  // through JSON, as the committed file holds it (undefined properties dropped)
  return JSON.parse(JSON.stringify(out)) as Record<string, unknown>;
}

/** JSON with one cell (or other small object) a line, so that a diff shows what changed. */
export function snapshotText(value: unknown): string {
  const lines: string[] = [];
  const walk = (v: unknown, indent: string, key: string, last: boolean): void => {
    const head = `${indent}${key}`;
    const tail = last ? "" : ",";
    const flat = JSON.stringify(v);
    if (v === null || typeof v !== "object" || flat.length <= 160) {
      lines.push(`${head}${flat}${tail}`);
      return;
    }
    const entries = Array.isArray(v) ? v.map((x, i) => [String(i), x] as const) : Object.entries(v);
    lines.push(`${head}${Array.isArray(v) ? "[" : "{"}`);
    entries.forEach(([k, x], i) => walk(x, `${indent}  `, Array.isArray(v) ? "" : `${JSON.stringify(k)}: `, i === entries.length - 1));
    lines.push(`${indent}${Array.isArray(v) ? "]" : "}"}${tail}`);
  };
  walk(value, "", "", true);
  return `${lines.join("\n")}\n`;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  await writeFile(SNAPSHOT_FILE, snapshotText(takeSnapshot()));
  console.log(`wrote ${SNAPSHOT_FILE}`);
}
