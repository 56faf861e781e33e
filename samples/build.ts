/**
 * Builds the sample estimate workbooks from their description (./scenarios.ts): each scenario is filled into the
 * estimate template, computed by the preview engine running the real cell functions (registered from the metadata
 * the generator writes for the cell-function files, as in the build), and saved as .xlsx with formulas, cached
 * values, roles, names and an "About" sheet. `npm run samples` writes them here; test/preview/samples.test.ts
 * rebuilds them in memory and compares with the committed files.
 */
import { mkdir, writeFile } from "node:fs/promises";
import path from "node:path";
import { generateCustomFunctionsMetadata } from "custom-functions-metadata";
import { functionFiles } from "../scripts/function-files.mjs";
import { installCustomFunctionsShim } from "../src/preview/customFunctionsShim";
import type { FunctionsMetadata } from "../src/preview/metadata";
import type { SheetData, WorkbookData } from "../src/preview/model";
import { templateNames, templateSheet } from "../src/preview/fromTemplate";
import { registerHeadroomFunctions } from "../src/preview/plugin";
import { PreviewWorkbook } from "../src/preview/workbook";
import { writeXlsx } from "../src/preview/xlsx";
import { CAUTION, wrappedHeight } from "../src/workbook/look";
import { estimateTemplate } from "../src/workbook/template";
import { SAMPLES, type SampleSpec } from "./scenarios";

/** The date written into the samples' file properties, so that rebuilding them changes nothing. */
export const SAMPLE_DATE = new Date(Date.UTC(2026, 0, 1));

export interface BuiltSample {
  spec: SampleSpec;
  workbook: PreviewWorkbook;
  data: WorkbookData;
  bytes: Uint8Array;
}

/** Register the cell functions with the engine, from the generated metadata; returns their formula names. */
export async function registerFunctions(): Promise<string[]> {
  installCustomFunctionsShim();
  const result = await generateCustomFunctionsMetadata(functionFiles());
  if (result.errors.length) throw new Error(`metadata generator: ${result.errors.join("; ")}`);
  const metadata = JSON.parse(result.metadataJson) as FunctionsMetadata;
  const functions = await import("../src/functions/functions");
  return registerHeadroomFunctions(metadata, functions as unknown as Record<string, unknown>).functions.map((f) => f.formulaName);
}

/** Width of the About sheet's one column, points. */
const ABOUT_WIDTH_PT = 620;

/** The second sheet of every sample: what it shows and how to use it. */
function aboutSheet(spec: SampleSpec): SheetData {
  const lines: Array<[string, "title" | "label" | "caution" | "note"]> = [
    [`Sample estimate: ${spec.title}`, "title"],
    [CAUTION, "caution"],
    ["", "label"],
    [spec.story, "label"],
    ["Every site, firm and flow test in this workbook is invented, for demonstration only.", "note"],
    ["", "label"],
    ["The Estimate sheet: shaded cells are inputs; the other values are calculated by the HEADROOM cell functions.", "label"],
    ["Change an input (a pipe size, the flow test, the required margin) and the verdict and the plot follow.", "label"],
    ["In Excel the HEADROOM functions need the Headroom add-in; without it, use a share copy (values only).", "label"],
  ];
  const cells: SheetData["cells"] = {};
  lines.forEach(([text, role], i) => {
    if (text) cells[`A${i + 1}`] = { content: text, style: { role, ...(role === "caution" ? { wrap: true } : {}) } };
  });
  // one wide column; the caution wraps in it by the rule of the estimate sheet
  return { name: "About", cells, columnWidths: { 0: ABOUT_WIDTH_PT }, rowHeights: { 1: wrappedHeight(CAUTION, ABOUT_WIDTH_PT).height } };
}

/** Build one sample in memory (functions must be registered). */
export async function buildSample(spec: SampleSpec, known: readonly string[]): Promise<BuiltSample> {
  const t = estimateTemplate(spec.scenario);
  const workbook = new PreviewWorkbook({
    sheets: [templateSheet(t), aboutSheet(spec)],
    names: templateNames(t),
    activeSheet: t.sheetName,
  });
  const data = workbook.toData();
  const bytes = await writeXlsx(data, known, { date: SAMPLE_DATE });
  return { spec, workbook, data, bytes };
}

/** Build every sample; with `outDir`, write the files and samples/index.json there. */
export async function buildSamples(outDir?: string): Promise<BuiltSample[]> {
  const known = await registerFunctions();
  const built: BuiltSample[] = [];
  for (const spec of SAMPLES) built.push(await buildSample(spec, known));
  if (outDir) {
    await mkdir(outDir, { recursive: true });
    for (const b of built) await writeFile(path.join(outDir, b.spec.file), b.bytes);
    const index = { samples: SAMPLES.map((s) => ({ file: s.file, title: s.title })) };
    await writeFile(path.join(outDir, "index.json"), `${JSON.stringify(index, null, 2)}\n`);
  }
  return built;
}
