/**
 * The preview page `npm start` serves: the estimate workbook in a grid, recalculated by HyperFormula running the very
 * cell functions of the add-in (registered from the functions.json the build generates), and the task pane beside it
 * through the preview side of the Workbook port. Opens a sample estimate (samples/index.json; `?sample=<file>` picks
 * one), opens and saves .xlsx files, saves a values-only share copy (with the pane's plot as a picture), and shows the
 * one-page summary in its print view (from the toolbar or the pane's button).
 */
import "./installShim";
import * as functions from "../functions/functions";
import { summaryFacts } from "../summary/facts";
import { type SummaryView, showSummaryView } from "../summary/view";
import { type Estimate, buildModel } from "../taskpane/model";
import { type SummaryOutcome, mountPane } from "../taskpane/pane";
import type { Readings } from "../workbook/port";
import { DEMO_LOOK, ROLE_STYLES } from "../workbook/look";
import { isShareStamp } from "../workbook/port";
import { Grid } from "./grid";
import type { FunctionsMetadata } from "./metadata";
import type { WorkbookData } from "./model";
import { registerHeadroomFunctions } from "./plugin";
import { picturePlace, plotPng } from "./picture";
import { PreviewPort } from "./port";
import { PreviewWorkbook } from "./workbook";

interface SampleEntry {
  file: string;
  title: string;
}

const $ = <T extends HTMLElement>(role: string): T => {
  const el = document.querySelector<T>(`[data-role="${role}"]`);
  if (!el) throw new Error(`the page has no [data-role="${role}"]`);
  return el;
};

/** The roles' colours as CSS custom properties: one definition (../workbook/look.ts) for the sheet and the file. */
function roleColours(): void {
  const root = document.documentElement.style;
  for (const [role, look] of Object.entries(ROLE_STYLES)) {
    if (look.fill) root.setProperty(`--role-${role}-fill`, look.fill);
    root.setProperty(`--role-${role}-font`, look.font ?? "inherit");
  }
  root.setProperty("--demo-font", DEMO_LOOK.font);
}

/** A button of the toolbar (the pane has buttons of its own with the same roles). */
function toolbarButton(role: string): HTMLButtonElement {
  const el = document.querySelector<HTMLButtonElement>(`.bar [data-role="${role}"]`);
  if (!el) throw new Error(`the toolbar has no [data-role="${role}"]`);
  return el;
}

function status(text: string, error = false): void {
  const el = $("preview-status");
  el.textContent = text;
  el.classList.toggle("is-error", error);
}

async function fetchOk(url: string): Promise<Response> {
  const r = await fetch(url, { cache: "no-store" });
  if (!r.ok) throw new Error(`${url}: ${r.status} ${r.statusText}`);
  return r;
}

function download(bytes: Uint8Array, fileName: string): void {
  const blob = new Blob([bytes as BlobPart], { type: "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet" });
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = fileName;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

async function main(): Promise<void> {
  roleColours();
  const metadata = (await (await fetchOk("../functions.json")).json()) as FunctionsMetadata;
  const { functions: bound } = registerHeadroomFunctions(metadata, functions as unknown as Record<string, unknown>);
  const known = bound.map((f) => f.formulaName);
  const xlsx = () => import(/* webpackChunkName: "xlsx" */ "./xlsx");

  const samples = ((await (await fetchOk("samples/index.json")).json()) as { samples: SampleEntry[] }).samples;
  const wanted = new URLSearchParams(location.search).get("sample");
  let current = samples.find((s) => s.file === wanted) ?? samples[0];
  if (!current) throw new Error("samples/index.json lists no sample");

  const readBytes = async (bytes: ArrayBuffer): Promise<{ workbook: WorkbookData; notes: string[] }> => (await xlsx()).readXlsx(bytes, known);
  const opened = (name: string, notes: string[]) => status(notes.length ? `Opened ${name}. ${notes.join("; ")}` : `Opened ${name}.`);

  const first = await readBytes(await (await fetchOk(`samples/${current.file}`)).arrayBuffer());
  const wb = new PreviewWorkbook(first.workbook);
  opened(current.file, first.notes);
  let fileName = current.file;
  const showName = () => ($("file-name").textContent = fileName);
  showName();

  const grid = new Grid(wb, {
    sheet: $("grid"),
    tabs: $("sheet-tabs"),
    nameBox: $("name-box"),
    formulaBar: $<HTMLInputElement>("formula-bar"),
    message: $("cell-message"),
  });
  const port = new PreviewPort(wb);
  // a share copy's sheet (its stamp in A1) says its cells are frozen values
  const banner = $("frozen-banner");
  const showFrozen = () => (banner.hidden = !isShareStamp(wb.value(wb.activeSheet, "A1")));
  wb.onChange(showFrozen);
  showFrozen();

  // the one-page summary's print view, over the workbook; the way back takes it away
  let summary: SummaryView | null = null;
  const closeSummary = () => {
    summary?.remove();
    summary = null;
  };
  const showSummary = (estimate: Estimate, readings: Readings): SummaryOutcome => {
    closeSummary();
    summary = showSummaryView(document, estimate, summaryFacts(readings), { onClose: closeSummary });
    return { shown: true };
  };
  const pane = mountPane($("pane-host"), port, { onPrintSummary: ({ estimate, readings }) => showSummary(estimate, readings) });
  await pane.ready;
  toolbarButton("print-summary").addEventListener("click", async () => {
    const readings = await port.readInputs();
    const m = buildModel(readings, port.host);
    if (m.kind === "ready") showSummary(m.estimate, readings);
    else status("No summary yet: fix the inputs the pane lists first, then try again.", true);
  });

  const picker = $<HTMLSelectElement>("sample-picker");
  for (const s of samples) picker.append(new Option(s.title, s.file, false, s.file === current.file));
  picker.addEventListener("change", async () => {
    const s = samples.find((x) => x.file === picker.value);
    if (!s) return;
    try {
      // the file is read and the workbook built aside: if either fails, the open workbook stays as it was
      const { workbook, notes } = await readBytes(await (await fetchOk(`samples/${s.file}`)).arrayBuffer());
      wb.load(workbook);
      opened(s.file, notes);
      current = s;
      fileName = s.file;
      showName();
      grid.select("A1");
    } catch (e) {
      picker.value = current.file;
      status(`Could not open ${s.file}: ${(e as Error).message}`, true);
    }
  });

  const input = $<HTMLInputElement>("file-input");
  $("open-file").addEventListener("click", () => input.click());
  input.addEventListener("change", async () => {
    const file = input.files?.[0];
    input.value = "";
    if (!file) return;
    try {
      const { workbook, notes } = await readBytes(await file.arrayBuffer());
      wb.load(workbook);
      opened(file.name, notes);
      fileName = file.name;
      showName();
      grid.select("A1");
    } catch (e) {
      status(`Could not open ${file.name}: ${(e as Error).message}`, true);
    }
  });

  $("save-file").addEventListener("click", async () => {
    const { writeXlsx } = await xlsx();
    download(await writeXlsx(wb.toData(), known), fileName.endsWith(".xlsx") ? fileName : `${fileName}.xlsx`);
    status(`Saved ${fileName} with formulas and their values.`);
  });

  $("save-share-copy").addEventListener("click", async () => {
    const made = port.shareCopyData();
    if (!made.ok) {
      status(made.reason, true);
      return;
    }
    const { writeXlsx } = await xlsx();
    const name = `${fileName.replace(/\.xlsx$/i, "")} share copy.xlsx`;
    // the pane's plot goes with the numbers, as a picture (ExcelJS writes no chart)
    const plot = await plotPng(document.querySelector<SVGSVGElement>('[data-role="pane-host"] svg[data-role="plot"]'));
    const pictures = plot ? [{ sheet: made.sheet.name, at: picturePlace(made.sheet), ...plot }] : [];
    download(await writeXlsx({ sheets: [made.sheet], names: [], activeSheet: made.sheet.name }, known, { pictures }), name);
    const withPlot = plot ? ", with the supply-versus-demand plot as a picture" : "";
    status(`Saved ${name}: values only${withPlot}, for someone without the Headroom add-in.`);
  });

  // for the browser tests and for curious developers: the live objects
  (window as unknown as { headroomPreview: unknown }).headroomPreview = { workbook: wb, grid, port, pane };
  document.body.dataset.ready = "1";
}

main().catch((e: unknown) => {
  console.error(e);
  status(`The preview could not start: ${(e as Error).message}`, true);
  document.body.dataset.ready = "error";
});
