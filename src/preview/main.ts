/**
 * The preview page `npm start` serves: the estimate workbook in a grid, recalculated by HyperFormula running the very
 * cell functions of the add-in (registered from the functions.json the build generates), and the task pane beside it
 * through the preview side of the Workbook port. Opens a sample estimate (samples/index.json; `?sample=<file>` picks
 * one), opens and saves .xlsx files, saves a values-only share copy (with the pane's plot as a picture), and shows the
 * one-page summary in its print view (from the toolbar or the pane's button).
 *
 * Nothing is lost: a file that cannot be opened leaves the workbook as it was (PreviewWorkbook.load builds aside);
 * replacing a workbook that holds unsaved changes (another sample, a file, a reload, closing the page) asks first;
 * unsaved work is kept in the browser after each change (./keep) and offered back after a reload or a crash; Save
 * asks for the file's name, and never suggests a sample's.
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
import { attachGridCommands } from "./gridCommands";
import { Keeper, type KeptWork, cleanFileName, keptWork } from "./keep";
import type { FunctionsMetadata } from "./metadata";
import type { WorkbookData } from "./model";
import { registerHeadroomFunctions } from "./plugin";
import { picturePlace, plotPng } from "./picture";
import { PreviewPort } from "./port";
import { readOffPage } from "./reader";
import { type Recheck, StatusLine, showInPicker } from "./status";
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

let line: StatusLine | undefined;
/** What the last action did, or (error) what is wrong; `recheck` says whether an error still holds after a change. */
function status(text: string, error = false, recheck?: Recheck): void {
  line ??= new StatusLine($("preview-status"));
  if (error) line.error(text, recheck);
  else line.show(text);
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

  // files are unzipped and parsed off the page (./reader), which keeps answering meanwhile
  const readBytes = (bytes: ArrayBuffer): Promise<{ workbook: WorkbookData; notes: string[] }> => readOffPage(bytes, known);
  const opened = (name: string, notes: string[]) => status(notes.length ? `Opened ${name}. ${notes.join("; ")}` : `Opened ${name}.`);

  const first = await readBytes(await (await fetchOk(`samples/${current.file}`)).arrayBuffer());
  const wb = new PreviewWorkbook(first.workbook);
  opened(current.file, first.notes);
  let fileName = current.file;
  /** the sample the workbook was opened from, until it is saved under a name of the user's */
  let sample: string | null = current.file;
  const picker = $<HTMLSelectElement>("sample-picker");
  for (const s of samples) picker.append(new Option(s.title, s.file, false, s.file === current.file));
  // the file's name in the bar, and the sample menu: a sample's title only while that sample is what the grid shows
  const showName = () => {
    $("file-name").textContent = fileName;
    showInPicker(picker, sample, fileName);
  };
  showName();
  // an error in the status line is checked again after each change, and goes once it no longer holds
  let recheckQueued = false;
  wb.onChange(() => {
    if (recheckQueued) return;
    recheckQueued = true;
    queueMicrotask(() => {
      recheckQueued = false;
      void line?.changed();
    });
  });

  // unsaved work, kept in the browser; nothing is written until a copy kept earlier has been looked for
  const notKept = (e: Error) => `Your changes could not be kept in this browser (${e.message}): save them to a file.`;
  const keeper: Keeper = new Keeper(wb, () => ({ fileName, sample }), (e) =>
    status(notKept(e), true, async () => {
      await keeper.idle();
      return keeper.failing ? notKept(keeper.failing) : null;
    }),
  );
  keeper.hold(true);
  const unsavedMark = $("unsaved-mark");
  keeper.onDirty((dirty) => (unsavedMark.hidden = !dirty));
  window.addEventListener("beforeunload", (e) => {
    if (keeper.dirty) e.preventDefault(); // the browser asks whether to leave
  });

  const grid = new Grid(wb, {
    sheet: $("grid"),
    tabs: $("sheet-tabs"),
    nameBox: $<HTMLInputElement>("name-box"),
    formulaBar: $<HTMLInputElement>("formula-bar"),
    message: $("cell-message"),
  });
  attachGridCommands(grid, wb, {
    sheet: $("grid"),
    nameBox: $<HTMLInputElement>("name-box"),
    formulaBar: $<HTMLInputElement>("formula-bar"),
    message: $("cell-message"),
    toolbar: document.querySelector<HTMLElement>("header.bar") ?? document.body,
    pane: $("pane-host"),
    insertRows: $<HTMLButtonElement>("insert-rows"),
    deleteRows: $<HTMLButtonElement>("delete-rows"),
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
    const noSummary = "No summary yet: fix the inputs the pane lists first, then try again.";
    if (m.kind === "ready") showSummary(m.estimate, readings);
    else status(noSummary, true, async () => (buildModel(await port.readInputs(), port.host).kind === "ready" ? null : noSummary));
  });

  /** Before the open workbook is replaced: true if it holds no unsaved change, or the user agrees to lose them. */
  const mayReplace = (question: string): boolean =>
    !keeper.dirty || window.confirm(`${question}\n\nThe changes to ${fileName} that are not saved will be lost. To keep them, cancel and use Save .xlsx first.`);

  /** Put `data` in the workbook's place (throws, changing nothing, if it cannot be read), under `name`. */
  const replace = (data: WorkbookData, name: string, from: string | null): void => {
    wb.load(data);
    loads++;
    fileName = name;
    sample = from;
    showName();
    grid.select("A1");
  };

  /** Opens begun: each takes the next number, and an answer that a later open has overtaken is dropped. */
  let opens = 0;
  /** Workbooks put in place so far: a save that finishes after another workbook came does not rename it. */
  let loads = 0;

  /**
   * Open the workbook `read` gives in place of the open one, under `name`. Asked first while there are unsaved
   * changes; the file is read off the page, which keeps answering, so if the workbook changed meanwhile it is asked
   * again; an open overtaken by a later one is dropped; one that fails leaves the workbook as it was. True if opened.
   */
  const openWorkbook = async (question: string, read: () => Promise<{ workbook: WorkbookData; notes: string[] }>, name: string, from: string | null): Promise<boolean> => {
    if (!mayReplace(question)) return false;
    const ticket = ++opens;
    const revision = wb.revision;
    status(`Opening ${name}…`);
    let result: { workbook: WorkbookData; notes: string[] };
    try {
      result = await read();
      if (ticket !== opens) return false;
      const changed = wb.revision !== revision && keeper.dirty;
      if (changed && !window.confirm(`The workbook changed while ${name} was being read.\n\nOpen ${name} in its place? The changes to ${fileName} that are not saved will be lost.`)) {
        status(`Did not open ${name}: the workbook is as you left it.`);
        return false;
      }
      // the workbook is built aside: if that fails, the open workbook stays as it was
      replace(result.workbook, name, from);
    } catch (e) {
      if (ticket === opens) status(`Could not open ${name}: ${(e as Error).message}`, true);
      return false;
    }
    opened(name, result.notes);
    await keeper.markClean();
    return true;
  };

  picker.addEventListener("change", async () => {
    const s = samples.find((x) => x.file === picker.value);
    if (!s) return;
    const done = await openWorkbook(`Open the sample "${s.title}"?`, async () => readBytes(await (await fetchOk(`samples/${s.file}`)).arrayBuffer()), s.file, s.file);
    if (done) current = s;
    showName();
  });

  const input = $<HTMLInputElement>("file-input");
  $("open-file").addEventListener("click", () => input.click());
  input.addEventListener("change", async () => {
    const file = input.files?.[0];
    input.value = "";
    if (!file) return;
    await openWorkbook(`Open ${file.name}?`, async () => readBytes(await file.arrayBuffer()), file.name, null);
  });

  /** The name Save suggests for a workbook opened from a sample: the estimate's site, never the sample's file. */
  const suggestedName = (): string => {
    const site = wb.nameValue("Project_Site");
    const name = typeof site === "string" ? cleanFileName(site) : "";
    return name && !samples.some((s) => s.file.toLowerCase() === name.toLowerCase()) ? name : "estimate.xlsx";
  };

  $("save-file").addEventListener("click", async () => {
    const typed = window.prompt("Save the workbook as (the browser puts the file with your downloads):", sample === null ? fileName : suggestedName());
    if (typed === null) {
      status("Not saved.");
      return;
    }
    const name = cleanFileName(typed);
    if (!name) {
      status(`Not saved: "${typed}" leaves no file name. Save again and type one.`, true);
      return;
    }
    const revision = wb.revision;
    const loaded = loads;
    const data = wb.toData();
    const { writeXlsx } = await xlsx();
    download(await writeXlsx(data, known), name);
    status(`Saved ${name} with formulas and their values.`);
    // another workbook opened while this one was written keeps its own name
    if (loads !== loaded) return;
    fileName = name;
    sample = null;
    showName();
    await keeper.markClean(revision);
  });

  $("save-share-copy").addEventListener("click", async () => {
    const made = port.shareCopyData();
    if (!made.ok) {
      status(made.reason, true, () => {
        const again = port.shareCopyData();
        return again.ok ? null : again.reason;
      });
      return;
    }
    const { writeXlsx } = await xlsx();
    // named after what is open: the name Save suggests for a sample's workbook, never the sample's file
    const name = `${(sample === null ? fileName : suggestedName()).replace(/\.xlsx$/i, "")} share copy.xlsx`;
    // the pane's plot goes with the numbers, as a picture (ExcelJS writes no chart)
    const plot = await plotPng(document.querySelector<SVGSVGElement>('[data-role="pane-host"] svg[data-role="plot"]'));
    const pictures = plot ? [{ sheet: made.sheet.name, at: picturePlace(made.sheet), ...plot }] : [];
    download(await writeXlsx({ sheets: [made.sheet], names: [], activeSheet: made.sheet.name }, known, { pictures }), name);
    const withPlot = plot ? ", with the supply-versus-demand plot as a picture" : "";
    status(`Saved ${name}: values only${withPlot}, for someone without the Headroom add-in.`);
  });

  // a copy kept by an earlier visit (a reload, a crash): offered back, and nothing else is kept until it is answered
  const offer = $("restore-offer");
  const offerBack = (kept: KeptWork): void => {
    $("restore-text").textContent = `Changes to ${kept.fileName} that were not saved to a file are kept in this browser (${new Date(kept.keptAt).toLocaleString()}).`;
    offer.hidden = false;
    const answered = () => {
      offer.hidden = true;
      keeper.hold(false);
    };
    $("restore-accept").onclick = () => {
      if (!mayReplace(`Restore the changes to ${kept.fileName} kept in this browser?`)) return;
      try {
        replace(kept.data, kept.fileName, kept.sample);
      } catch (e) {
        status(`Could not restore the changes to ${kept.fileName}: ${(e as Error).message}`, true);
        return;
      }
      status(`Restored the changes to ${kept.fileName}; they are not saved to a file yet.`);
      answered();
    };
    $("restore-decline").onclick = () => {
      // the copy goes before anything typed since is kept: the keeper does one thing at a time, in order
      void keeper.forget();
      status(`Discarded the changes to ${kept.fileName} kept in this browser.`);
      answered();
    };
  };
  let kept: KeptWork | undefined;
  try {
    kept = await keptWork();
  } catch (e) {
    status(`This browser keeps no copy of unsaved work (${(e as Error).message}): save to a file as you go.`, true);
  }
  if (kept) offerBack(kept);
  else keeper.hold(false);

  // for the browser tests and for curious developers: the live objects
  // (readOnPage: the file read on the page itself, as it was before ./reader, for the benchmark's comparison)
  const readOnPage = async (bytes: ArrayBuffer) => (await xlsx()).readXlsx(bytes, known);
  (window as unknown as { headroomPreview: unknown }).headroomPreview = { workbook: wb, grid, port, pane, keeper, readOnPage };
  document.body.dataset.ready = "1";
}

main().catch((e: unknown) => {
  console.error(e);
  status(`The preview could not start: ${(e as Error).message}`, true);
  document.body.dataset.ready = "error";
});
