/**
 * The Workbook port over Office.js (Excel JavaScript API): named cells, change and calculation events, the estimate
 * sheet, the values-only share copy (with the pane's plot as a chart of frozen values).
 *
 * Requirement sets used: ExcelApi 1.1 (application.calculate, charts.add, chart.delete), 1.2 (range.merge), 1.4
 * (names.getItemOrNullObject, NamedItem.getRangeOrNullObject, worksheet.names, charts.getItemOrNullObject), 1.6
 * (application.suspendApiCalculationUntilNextSync), 1.7 (chart series, worksheet.copy, worksheets.onActivated), 1.8
 * (worksheets.onCalculated), 1.9 (worksheets.onChanged and its details, range.copyFrom, range.getCellProperties,
 * worksheet.pageLayout); where Excel has it, 1.12 (range.getDirectPrecedents, range.getSpillParentOrNullObject: the
 * inputs behind a formula), checked with isSetSupported first.
 * Everything goes through an ExcelHost so that tests can run it against office-addin-mock.
 */
import type { UnitSystem } from "../engine/units";
import { cellAddress, freeSheetName, parseCell, parseRange, quoteSheet, splitSheet } from "./a1";
import {
  CANDIDATES_NAME,
  INPUT_NAMES,
  type InsertResult,
  SHARE_REFUSAL_LIST,
  SHARE_STAMP_ROWS,
  SOURCE_WALK_LIMIT,
  type Reading,
  type Readings,
  type ShareCopyResult,
  type SharePlot,
  type SourceInput,
  type TableReading,
  type WorkbookName,
  type WorkbookPort,
  candidatesShapeProblem,
  demoRefusal,
  isoDate,
  shareRefusal,
  shareStamp,
} from "./port";
import { type Scenario, demoScenario } from "./scenario";
import { DEMO_LOOK, FROZEN_NOTE, INPUT_NOTES, ROLE_STYLES, wrappedLines } from "./look";
import type { ChartSeries, SheetTemplate, TemplateChart, TemplatePrint } from "./sheet";
import { CHART_FROM, CHART_TO, estimateTemplate } from "./template";

type Ctx = Excel.RequestContext;

/** How the port reaches Excel: Excel.run in the add-in, a mock in tests. */
export interface ExcelHost {
  run<T>(batch: (context: Ctx) => Promise<T>): Promise<T>;
  /** Run a batch in an existing context (event handlers must be removed in the context that added them). */
  runIn<T>(context: Ctx, batch: (context: Ctx) => Promise<T>): Promise<T>;
  /** today, for the share copy's stamp */
  now(): Date;
  /** quiet time before a burst of change events becomes one call, ms */
  settleMs: number;
  /** whether Excel supports a requirement set at a version (Office.context.requirements.isSetSupported) */
  supports(set: string, version: string): boolean;
}

/** The host of a running add-in. */
export function officeExcelHost(): ExcelHost {
  return {
    run: (batch) => Excel.run(batch),
    runIn: (context, batch) => Excel.run(context, batch),
    now: () => new Date(),
    settleMs: 150,
    supports: (set, version) => Office.context.requirements.isSetSupported(set, version),
  };
}

/** How many "Estimate", "Estimate 2"... names are probed for a free sheet name in one round trip. */
const NAME_PROBES = 40;

export function createExcelPort(host: ExcelHost = officeExcelHost()): WorkbookPort {
  return {
    host: "excel",
    readInputs: () => host.run(readInputs),
    inputsBehind: (addresses) => inputsBehind(host, addresses),
    subscribe: (onChange) => subscribe(host, onChange),
    insertEstimateSheet: (units, scenario) => host.run((ctx) => insertEstimateSheet(ctx, units, scenario)),
    makeShareCopy: (plot) => host.run((ctx) => makeShareCopy(ctx, host.now(), plot)),
  };
}

// ─── Reading ─────────────────────────────────────────────────────────────────────────────────────────────────────

/**
 * A name as the active sheet sees it, queued for the next sync: the sheet's own definition (a name scoped to the
 * sheet) first, else the workbook's. `workbook.names` holds the names scoped to the workbook only
 * (https://learn.microsoft.com/javascript/api/excel/excel.workbook#excel-excel-workbook-names-member; office-js #1011,
 * https://github.com/OfficeDev/office-js/issues/1011); `worksheet.names` is the "collection of names scoped to the
 * current worksheet" (ExcelApi 1.4, https://learn.microsoft.com/javascript/api/excel/excel.worksheet#excel-excel-worksheet-names-member).
 * #1011 reports that on the web a sheet's collection also lists the workbook's names; looking at the sheet first and
 * the workbook second finds the same name either way. The returned function picks, after the sync.
 */
function lookUpName(ctx: Ctx, sheet: Excel.Worksheet, name: string, load: string): () => Excel.NamedItem {
  const own = sheet.names.getItemOrNullObject(name);
  own.load(load);
  const workbook = ctx.workbook.names.getItemOrNullObject(name);
  workbook.load(load);
  return () => (own.isNullObject ? workbook : own);
}

async function readInputs(ctx: Ctx): Promise<Readings> {
  const active = ctx.workbook.worksheets.getActiveWorksheet();
  const names = [...INPUT_NAMES, CANDIDATES_NAME];
  const found = names.map((n) => lookUpName(ctx, active, n, "type,value"));
  await ctx.sync();
  const items = found.map((pick) => pick());
  const ranges = items.map((item) => {
    if (item.isNullObject || item.type !== "Range") return null;
    const range = item.getRangeOrNullObject();
    range.load("address,values,valueTypes,rowCount,columnCount");
    return range;
  });
  await ctx.sync();
  const out = {} as Readings;
  INPUT_NAMES.forEach((n, i) => {
    out[n] = reading(items[i], ranges[i]);
  });
  out[CANDIDATES_NAME] = tableReading(items[INPUT_NAMES.length], ranges[INPUT_NAMES.length]);
  return out;
}

/** A table name (the candidates), row by row: each cell read as a one-cell name is, with its own address. */
function tableReading(item: Excel.NamedItem, range: Excel.Range | null): TableReading {
  if (item.isNullObject) return { kind: "missing" };
  if (item.type !== "Range" || !range || range.isNullObject) {
    return { kind: "invalid", reason: `${CANDIDATES_NAME} refers to ${String(item.value)}, not a block of cells` };
  }
  const address = range.address;
  const problem = candidatesShapeProblem(range.rowCount, range.columnCount, address);
  if (problem) return { kind: "invalid", reason: problem, address };
  const { sheet, range: block } = splitSheet(address);
  const start = parseRange(block.replace(/\$/g, "")).start;
  const prefix = sheet === null ? "" : `${quoteSheet(sheet)}!`;
  const rows = range.values.map((row, i) =>
    row.map((v, j) => cellReading(v, range.valueTypes[i][j], `${prefix}${cellAddress({ row: start.row + i, col: start.col + j })}`)),
  );
  return { kind: "table", address, rows };
}

function reading(item: Excel.NamedItem, range: Excel.Range | null): Reading {
  if (item.isNullObject) return { kind: "missing" };
  if (item.type !== "Range") return constantReading(item);
  if (!range || range.isNullObject) return { kind: "invalid", reason: `its reference ${String(item.value)} is not a cell` };
  const address = range.address;
  const cells = range.rowCount * range.columnCount;
  if (cells !== 1) return { kind: "invalid", reason: `it refers to ${cells} cells (${address}); it must refer to one cell`, address };
  return cellReading(range.values[0][0], range.valueTypes[0][0], address);
}

/** A name defined as a constant (=10, ="SI") rather than a cell. */
function constantReading(item: Excel.NamedItem): Reading {
  const v = item.value as unknown;
  switch (item.type) {
    case "Double":
    case "Integer":
      return typeof v === "number" ? { kind: "number", value: v } : { kind: "invalid", reason: `its value ${String(v)} is not a number` };
    case "String":
      return { kind: "text", value: String(v) };
    case "Boolean":
      return { kind: "text", value: v ? "TRUE" : "FALSE" };
    case "Error":
      return { kind: "error", code: String(v) };
    default:
      return { kind: "invalid", reason: `it is ${String(item.type).toLowerCase()}, not one cell` };
  }
}

/** What one cell holds, from its value and Excel's value type. */
export function cellReading(value: unknown, type: string, address?: string): Reading {
  switch (type) {
    case "Empty":
      return { kind: "empty", address };
    case "Double":
    case "Integer":
      return typeof value === "number" && Number.isFinite(value)
        ? { kind: "number", value, address }
        : { kind: "text", value: String(value), address };
    case "String":
      return { kind: "text", value: String(value), address };
    case "Boolean":
      return { kind: "text", value: value ? "TRUE" : "FALSE", address };
    case "Error":
      return { kind: "error", code: String(value), address };
    default:
      return { kind: "invalid", reason: `it holds a ${type.toLowerCase()} value, not a number or text`, address };
  }
}

// ─── What a formula is calculated from ─────────────────────────────────────────────────────────────────────────────

/**
 * Range.getDirectPrecedents, WorkbookRangeAreas.addresses and Range.getSpillParentOrNullObject are ExcelApi 1.12
 * (https://learn.microsoft.com/javascript/api/excel/excel.range#excel-excel-range-getdirectprecedents-member(1),
 * https://learn.microsoft.com/javascript/api/excel/excel.workbookrangeareas), above the 1.9 the pane needs: where
 * Excel lacks them, the pane names the formula cell instead of the input behind it.
 */
const PRECEDENTS_API = "1.12";

async function inputsBehind(host: ExcelHost, addresses: readonly string[]): Promise<Record<string, SourceInput[]>> {
  const none = () => Object.fromEntries(addresses.map((a) => [a, [] as SourceInput[]]));
  if (addresses.length === 0 || !host.supports("ExcelApi", PRECEDENTS_API)) return none();
  // best effort: what is found only sharpens the pane's messages, so a walk Excel fails maps its address to no
  // input (the pane then names the formula cell) and never keeps the pane from showing its problems
  try {
    return await host.run(async (ctx) => {
      const out: Record<string, SourceInput[]> = {};
      for (const a of addresses) out[a] = await sourcesOf(ctx, a).catch(() => []);
      return out;
    });
  } catch {
    return none();
  }
}

/** A block's cells, or null for a whole column or row ("K:K", "3:3") and anything else that is not a block of cells. */
function cellBlock(range: string): ReturnType<typeof parseRange> | null {
  try {
    return parseRange(range);
  } catch {
    return null;
  }
}

/** "Sheet1!A1:B4, 'Pipe run'!D1" → its blocks, each with its sheet (a comma inside a quoted sheet name stays). */
function splitAreas(addresses: string): Array<{ sheet: string; range: string }> {
  const parts: string[] = [];
  let quoted = false;
  let part = "";
  for (const ch of addresses) {
    if (ch === "'") quoted = !quoted;
    if (ch === "," && !quoted) {
      parts.push(part);
      part = "";
    } else part += ch;
  }
  parts.push(part);
  return parts
    .map((p) => splitSheet(p.trim()))
    .filter((p): p is { sheet: string; range: string } => p.sheet !== null && p.range !== "")
    .map((p) => ({ sheet: p.sheet, range: p.range.replace(/\$/g, "") }));
}

/**
 * The input cells behind one cell, level by level: each formula cell's direct precedents in one batch (a cell
 * without any makes the batch fail with ItemNotFound: that level is then asked cell by cell), then what the cells
 * found hold, their formulas and their fill (Range.getCellProperties, ExcelApi 1.9) in the next. A cell of the input
 * role (its fill is the input's, ROLE_STYLES.input) ends the walk there; a cell a spill fills continues at the
 * spill's anchor.
 */
async function sourcesOf(ctx: Ctx, address: string): Promise<SourceInput[]> {
  const start = splitAreas(address)[0];
  if (!start) return [];
  const key = (sheet: string, cell: string) => `${quoteSheet(sheet)}!${cell}`;
  const first = cellAddress(parseRange(start.range).start);
  const seen = new Set<string>([key(start.sheet, first)]);
  const found: SourceInput[] = [];
  let formulas: Array<{ sheet: string; cell: string }> = [{ sheet: start.sheet, cell: first }];
  let spilled: Array<{ sheet: string; cell: string }> = [];
  const inputFill = ROLE_STYLES.input.fill!.toUpperCase();
  while ((formulas.length > 0 || spilled.length > 0) && seen.size < SOURCE_WALK_LIMIT) {
    const sheetOf = (name: string) => ctx.workbook.worksheets.getItem(name);
    // the cells the formulas read
    const ask = () =>
      formulas.map((f) => {
        const p = sheetOf(f.sheet).getRange(f.cell).getDirectPrecedents();
        p.load("addresses");
        return p;
      });
    let areas: string[] = [];
    const asked = ask();
    try {
      await ctx.sync();
      areas = asked.flatMap((p) => p.addresses);
    } catch {
      for (const f of formulas) {
        const p = sheetOf(f.sheet).getRange(f.cell).getDirectPrecedents();
        p.load("addresses");
        try {
          await ctx.sync();
          areas.push(...p.addresses);
        } catch {
          // a formula that reads no cell
        }
      }
    }
    // the spills' anchors
    const parents = spilled.map((c) => {
      const parent = sheetOf(c.sheet).getRange(c.cell).getSpillParentOrNullObject();
      parent.load("address");
      return parent;
    });
    if (parents.length) await ctx.sync();
    for (const parent of parents) if (!parent.isNullObject) areas.push(parent.address);

    // what the cells found hold
    const blocks: Array<{ sheet: string; start: ReturnType<typeof parseRange>["start"]; cells: string[] }> = [];
    for (const area of areas.flatMap(splitAreas)) {
      // a whole column or row read by a formula (SUM(K:K)) is passed over: its cells are not walked
      const r = cellBlock(area.range);
      if (!r) continue;
      const cells: string[] = [];
      for (let i = 0; i < r.rows; i++)
        for (let j = 0; j < r.cols; j++) {
          const cell = cellAddress({ row: r.start.row + i, col: r.start.col + j });
          if (seen.size >= SOURCE_WALK_LIMIT || seen.has(key(area.sheet, cell))) continue;
          seen.add(key(area.sheet, cell));
          cells.push(cell);
        }
      if (cells.length) blocks.push({ sheet: area.sheet, start: r.start, cells });
    }
    const loaded = blocks.map((b) => {
      const range = sheetOf(b.sheet).getRange(areaOf(b.cells));
      range.load("formulas,values,valueTypes");
      return { ...b, range, look: range.getCellProperties({ format: { fill: { color: true } } }) };
    });
    if (loaded.length) await ctx.sync();
    formulas = [];
    spilled = [];
    for (const b of loaded) {
      const top = parseRange(areaOf(b.cells)).start;
      for (const cell of b.cells) {
        const p = parseCell(cell);
        const [i, j] = [p.row - top.row, p.col - top.col];
        const fill = String(b.look.value[i]?.[j]?.format?.fill?.color ?? "").toUpperCase();
        const formula = b.range.formulas[i]?.[j];
        if (fill === inputFill) {
          found.push({ address: key(b.sheet, cell), reading: cellReading(b.range.values[i][j], b.range.valueTypes[i][j], key(b.sheet, cell)) });
        } else if (typeof formula === "string" && formula.startsWith("=")) formulas.push({ sheet: b.sheet, cell });
        else if (b.range.valueTypes[i]?.[j] !== "Empty") spilled.push({ sheet: b.sheet, cell });
      }
    }
  }
  return found;
}

/** The smallest block holding these cells of one sheet, "B3:D9". */
function areaOf(cells: readonly string[]): string {
  const refs = cells.map(parseCell);
  const top = Math.min(...refs.map((r) => r.row));
  const left = Math.min(...refs.map((r) => r.col));
  const bottom = Math.max(...refs.map((r) => r.row));
  const right = Math.max(...refs.map((r) => r.col));
  return `${cellAddress({ row: top, col: left })}:${cellAddress({ row: bottom, col: right })}`;
}

// ─── Events ──────────────────────────────────────────────────────────────────────────────────────────────────────

async function subscribe(host: ExcelHost, onChange: () => void): Promise<() => Promise<void>> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  let live = true;
  const poke = async () => {
    if (!live) return;
    if (timer !== undefined) clearTimeout(timer);
    timer = setTimeout(() => {
      timer = undefined;
      if (live) onChange();
    }, host.settleMs);
  };
  const { context, handlers } = await host.run(async (ctx) => {
    const changed = ctx.workbook.worksheets.onChanged.add(async (e) => {
      await poke();
      if (live) await typedOver(host, e);
    });
    const calculated = ctx.workbook.worksheets.onCalculated.add(poke);
    // the names the pane reads depend on the active sheet (its own names first): another sheet activated, read again
    // (WorksheetCollection.onActivated, ExcelApi 1.7, https://learn.microsoft.com/office/dev/add-ins/excel/excel-add-ins-events)
    const activated = ctx.workbook.worksheets.onActivated.add(poke);
    await ctx.sync();
    return { context: ctx, handlers: [changed, calculated, activated] };
  });
  return async () => {
    live = false;
    if (timer !== undefined) clearTimeout(timer);
    await host.runIn(context, async (ctx) => {
      for (const h of handlers) h.remove();
      await ctx.sync();
    });
  };
}

/**
 * A value typed over a demo value is the user's: the cell loses the demo look (DEMO_LOOK) for the input's own. Excel
 * keeps a cell's format when a value is typed into it, so the port does it, on the change event of one cell whose
 * value before was not empty (WorksheetChangedEventArgs.details, "the information about the change detail ... when
 * the Changed event is triggered on a single cell", ExcelApi 1.9,
 * https://learn.microsoft.com/javascript/api/excel/excel.worksheetchangedeventargs): the same value typed again
 * counts, and the add-in's own writes into a new sheet's empty cells do not. A change of many cells comes without
 * details: replacedOver.
 */
async function typedOver(host: ExcelHost, e: Excel.WorksheetChangedEventArgs): Promise<void> {
  if (e.changeType !== "RangeEdited") return;
  if (!e.details) return replacedOver(host, e);
  const before = e.details.valueBefore;
  if (before === undefined || before === null || before === "") return;
  try {
    await host.run(async (ctx) => {
      const range = ctx.workbook.worksheets.getItem(e.worksheetId).getRange(splitSheet(e.address).range);
      const look = range.getCellProperties({ format: { font: { color: true, italic: true } } });
      await ctx.sync();
      const font = look.value[0]?.[0]?.format?.font;
      if (!isDemoLook(font)) return;
      range.format.font.color = ROLE_STYLES.input.font!;
      range.format.font.italic = false;
      await ctx.sync();
    });
  } catch {
    // the sheet went meanwhile: nothing to mark
  }
}

/**
 * A change of more than one cell (a paste, a fill, Ctrl+Enter, Delete over a block) comes without details: the port
 * reads the changed cells that can hold a demo value (the template's demo cells' block) in one round trip, and a cell
 * of the demo look whose value is no longer its demo value (either unit system's) is the user's. A cell still
 * holding its demo value keeps the look: the add-in's own writes of a new sheet, a demo value pasted back. A block
 * the demo cells lie outside of costs no round trip.
 */
async function replacedOver(host: ExcelHost, e: Excel.WorksheetChangedEventArgs): Promise<void> {
  const changed = blockBounds(splitSheet(e.address).range);
  const demo = demoValues();
  if (!changed) return;
  const top = Math.max(changed.top, demo.bounds.top);
  const left = Math.max(changed.left, demo.bounds.left);
  const bottom = Math.min(changed.bottom, demo.bounds.bottom);
  const right = Math.min(changed.right, demo.bounds.right);
  if (top > bottom || left > right) return;
  try {
    await host.run(async (ctx) => {
      const sheet = ctx.workbook.worksheets.getItem(e.worksheetId);
      const range = sheet.getRange(`${cellAddress({ row: top, col: left })}:${cellAddress({ row: bottom, col: right })}`);
      range.load("values");
      const look = range.getCellProperties({ format: { font: { color: true, italic: true } } });
      await ctx.sync();
      let cleared = 0;
      for (let i = 0; i <= bottom - top; i++)
        for (let j = 0; j <= right - left; j++) {
          const cell = cellAddress({ row: top + i, col: left + j });
          const was = demo.values.get(cell);
          if (!was || !isDemoLook(look.value[i]?.[j]?.format?.font) || was.includes(range.values[i]?.[j] as string | number | boolean)) continue;
          const font = sheet.getRange(cell).format.font;
          font.color = ROLE_STYLES.input.font!;
          font.italic = false;
          cleared++;
        }
      if (cleared > 0) await ctx.sync();
    });
  } catch {
    // the sheet went meanwhile: nothing to mark
  }
}

/** "B3:D9", "B:D" (whole columns), "3:9" (whole rows) → its rows and columns from 0, a whole one's end at Infinity. */
function blockBounds(range: string): { top: number; left: number; bottom: number; right: number } | null {
  const r = range.replace(/\$/g, "");
  const cols = /^([A-Z]+):([A-Z]+)$/.exec(r);
  if (cols) {
    const [a, b] = [parseCell(`${cols[1]}1`).col, parseCell(`${cols[2]}1`).col];
    return { top: 0, left: Math.min(a, b), bottom: Infinity, right: Math.max(a, b) };
  }
  const rows = /^(\d+):(\d+)$/.exec(r);
  if (rows) {
    const [a, b] = [Number(rows[1]) - 1, Number(rows[2]) - 1];
    return { top: Math.min(a, b), left: 0, bottom: Math.max(a, b), right: Infinity };
  }
  const block = cellBlock(r);
  return block && { top: block.start.row, left: block.start.col, bottom: block.start.row + block.rows - 1, right: block.start.col + block.cols - 1 };
}

let demoValuesMade: { values: Map<string, Array<string | number | boolean>>; bounds: { top: number; left: number; bottom: number; right: number } } | undefined;

/** The demo value of each cell a new sheet marks (markDemoValues), in either unit system, and their block. */
function demoValues(): NonNullable<typeof demoValuesMade> {
  if (demoValuesMade) return demoValuesMade;
  const values = new Map<string, Array<string | number | boolean>>();
  for (const units of ["US", "SI"] as const) {
    for (const c of demoCellsOf(estimateTemplate(demoScenario(units)))) values.set(c.address, [...(values.get(c.address) ?? []), c.value]);
  }
  const refs = [...values.keys()].map(parseCell);
  const bounds = {
    top: Math.min(...refs.map((r) => r.row)),
    left: Math.min(...refs.map((r) => r.col)),
    bottom: Math.max(...refs.map((r) => r.row)),
    right: Math.max(...refs.map((r) => r.col)),
  };
  demoValuesMade = { values, bounds };
  return demoValuesMade;
}

/** Whether a cell's font is the demo look. */
function isDemoLook(font: { color?: string; italic?: boolean } | undefined): boolean {
  return String(font?.color ?? "").toUpperCase() === DEMO_LOOK.font.toUpperCase() && font?.italic === DEMO_LOOK.italic;
}

// ─── New estimate sheet ──────────────────────────────────────────────────────────────────────────────────────────

/** Candidate sheet names "base", "base 2", ... probed in one round trip; the first free one. */
async function freeName(ctx: Ctx, base: string): Promise<string> {
  const candidates: string[] = [];
  for (let i = 0; i < NAME_PROBES; i++) candidates.push(freeSheetName(base, candidates));
  const probes = candidates.map((c) => ctx.workbook.worksheets.getItemOrNullObject(c));
  await ctx.sync();
  const i = probes.findIndex((p) => p.isNullObject);
  if (i < 0) throw new Error(`every sheet name from "${candidates[0]}" to "${candidates[candidates.length - 1]}" is taken; rename or delete some sheets`);
  return candidates[i];
}

/** A constant for range.values: text that Excel would read as a formula or a number keeps its text with a '. */
/**
 * A template constant as Office.js must receive it. Excel reads assigned values as if typed, so text such as
 * "1-1/4", "40" or "2026-02-19 14:40" would turn into a date or a number; a leading apostrophe keeps every text
 * constant text (Excel stores the apostrophe as the cell's prefix, not in its value).
 */
function cellConstant(v: string | number): string | number {
  return typeof v === "number" ? v : `'${v}`;
}

async function insertEstimateSheet(ctx: Ctx, units: UnitSystem, scenario?: Scenario): Promise<InsertResult> {
  const template = estimateTemplate(scenario ?? demoScenario(units));
  const wb = ctx.workbook;
  const sheetName = await freeName(ctx, template.sheetName);
  const existing = template.names.map((n) => wb.names.getItemOrNullObject(n.name));
  await ctx.sync();

  // Hundreds of cells are written in one batch: calculation waits until it is done (ExcelApi 1.6; "Suspend
  // calculation temporarily", https://learn.microsoft.com/office/dev/add-ins/excel/performance).
  ctx.application.suspendApiCalculationUntilNextSync();
  const sheet = wb.worksheets.add(sheetName);
  writeCells(sheet, template);
  // the demo's values are invented: marked, as the preview marks them, until the user types over them (a given
  // scenario's are its own)
  if (!scenario) markDemoValues(sheet, template);
  const namesMoved: WorkbookName[] = [];
  template.names.forEach((n, i) => {
    if (!existing[i].isNullObject) {
      existing[i].delete();
      namesMoved.push(n.name);
    }
    wb.names.add(n.name, sheet.getRange(n.address), n.comment);
  });
  addChart(sheet, template.chart);
  setPrint(sheet, template.print);
  sheet.activate();
  await ctx.sync();
  // Suspending makes recalculation the add-in's duty: "once set, it is the developer's responsibility to re-calc the
  // workbook, to ensure that any dependencies are propagated"
  // (https://learn.microsoft.com/javascript/api/excel/excel.application#excel-excel-application-suspendapicalculationuntilnextsync-member(1)).
  // The names were deleted and added again, so any formula anywhere in the workbook that reads them depends on the
  // new sheet now: a full calculation marks every cell dirty and recalculates it (CalculationType "Full", ExcelApi 1.1,
  // https://learn.microsoft.com/javascript/api/excel/excel.calculationtype), in a batch of its own, after the one
  // that suspended calculation.
  ctx.application.calculate("Full");
  await ctx.sync();
  return { sheetName, namesMoved };
}

function writeCells(sheet: Excel.Worksheet, t: SheetTemplate): void {
  for (const [col, width] of Object.entries(t.columnWidths)) sheet.getRange(`${col}:${col}`).format.columnWidth = width;
  for (const c of t.cells) {
    const r = sheet.getRange(c.address);
    if (c.formula !== undefined) r.formulas = [[c.formula]];
    else if (c.value !== undefined && c.value !== "") r.values = [[cellConstant(c.value)]];
    if (c.spill?.formats) {
      const block = sheet.getRange(c.address).getResizedRange(c.spill.rows - 1, c.spill.cols - 1);
      block.numberFormat = Array.from({ length: c.spill.rows }, () => c.spill!.formats!.slice(0, c.spill!.cols));
    } else if (c.format) r.numberFormat = [[c.format]];
    const style = ROLE_STYLES[c.role];
    if (style.fill) r.format.fill.color = style.fill;
    if (style.font) r.format.font.color = style.font;
    if (style.bold) r.format.font.bold = true;
    if (style.italic) r.format.font.italic = true;
    if (style.size) r.format.font.size = style.size;
  }
  // the caution and the longer notes: merged, wrapped and as tall as their lines, by the rule the preview follows
  for (const line of wrappedLines(t.cells, t.columnWidths)) {
    const block = sheet.getRange(line.merge);
    block.merge(false);
    block.format.wrapText = true;
    block.format.verticalAlignment = "Top";
    block.format.rowHeight = line.height;
  }
}

/** The demo look on every input holding a value, but the Units cell, which the user chose in the pane. */
function markDemoValues(sheet: Excel.Worksheet, t: SheetTemplate): void {
  for (const c of demoCellsOf(t)) {
    const font = sheet.getRange(c.address).format.font;
    font.color = DEMO_LOOK.font;
    font.italic = DEMO_LOOK.italic;
  }
}

/** The template's inputs holding a value, but the Units cell: the cells a new sheet marks as demo values. */
function demoCellsOf(t: SheetTemplate): Array<SheetTemplate["cells"][number] & { value: string | number }> {
  const units = t.names.find((n) => n.name === "Units")?.address;
  return t.cells.filter((c): c is SheetTemplate["cells"][number] & { value: string | number } => c.role === "input" && c.value !== undefined && c.value !== "" && c.address !== units);
}

/**
 * The template's print setup as the sheet's page layout (ExcelApi 1.9, like the rest of the port's needs): print area
 * and print title rows through PageLayout.setPrintArea / setPrintTitleRows, as in "Page layout and print settings"
 * (https://learn.microsoft.com/office/dev/add-ins/excel/excel-add-ins-worksheet-display); the fit through `zoom`,
 * which "must be set as a JSON object" (https://learn.microsoft.com/javascript/api/excel/excel.pagelayout#excel-excel-pagelayout-zoom-member,
 * https://learn.microsoft.com/javascript/api/excel/excel.pagelayoutzoomoptions).
 */
function setPrint(sheet: Excel.Worksheet, print: TemplatePrint): void {
  const layout = sheet.pageLayout;
  layout.setPrintArea(print.area);
  const [first, last] = print.titleRows.split(":");
  layout.setPrintTitleRows(`$${first}:$${last}`);
  layout.orientation = print.orientation === "portrait" ? "Portrait" : "Landscape";
  layout.zoom = { horizontalFitToPages: print.fitWide, verticalFitToPages: print.fitTall };
}

const MARKERS = { none: "None", circle: "Circle", square: "Square", diamond: "Diamond", triangle: "Triangle" } as const;

/** The name of the add-in's supply-and-demand chart on a sheet. */
const CHART_NAME = "Headroom supply and demand";

function addChart(sheet: Excel.Worksheet, spec: TemplateChart): void {
  const [first, ...rest] = spec.series;
  const chart = sheet.charts.add("XYScatterLinesNoMarkers", sheet.getRange(pairRange(first.x, first.y)), "Columns");
  chart.name = CHART_NAME;
  chart.title.text = spec.title;
  chart.axes.categoryAxis.title.text = spec.xTitle;
  chart.axes.valueAxis.title.text = spec.yTitle;
  chart.axes.categoryAxis.minimum = 0;
  chart.axes.valueAxis.minimum = 0;
  chart.legend.position = "Bottom";
  chart.setPosition(spec.from, spec.to);
  const s0 = chart.series.getItemAt(0);
  s0.name = first.name;
  s0.setXAxisValues(sheet.getRange(first.x));
  s0.setValues(sheet.getRange(first.y));
  s0.format.line.color = first.color;
  for (const s of rest) {
    const series = chart.series.add(s.name);
    series.setXAxisValues(sheet.getRange(s.x));
    series.setValues(sheet.getRange(s.y));
    series.chartType = s.style === "line" ? "XYScatterLinesNoMarkers" : "XYScatter";
    if (s.style === "line") series.format.line.color = s.color;
    series.markerStyle = MARKERS[s.marker];
    series.markerSize = 9;
    series.markerBackgroundColor = s.color;
    series.markerForegroundColor = s.color;
  }
}

/** "B74:B89" and "C74:C89" → "B74:C89": the x and y columns of the first series as one block. */
function pairRange(x: string, y: string): string {
  const a = parseRange(x).start;
  const b = parseRange(y);
  return `${cellAddress(a)}:${cellAddress({ row: b.start.row + b.rows - 1, col: b.start.col + b.cols - 1 })}`;
}

// ─── Share copy ──────────────────────────────────────────────────────────────────────────────────────────────────

async function makeShareCopy(ctx: Ctx, now: Date, plot?: SharePlot): Promise<ShareCopyResult> {
  const wb = ctx.workbook;
  const active = wb.worksheets.getActiveWorksheet();
  active.load("name");
  const found = lookUpName(ctx, active, "Supply_Static", "type");
  await ctx.sync();
  const item = found();
  let source = active;
  if (!item.isNullObject && item.type === "Range") source = item.getRange().worksheet;
  source.load("name");
  const used = source.getUsedRangeOrNullObject();
  used.load("address,values,valueTypes,rowCount,columnCount");
  await ctx.sync();
  if (used.isNullObject) return { ok: false, reason: `No share copy made: the sheet ${source.name} is empty.` };

  const errors = errorCells(used);
  if (errors.length > 0) return { ok: false, reason: shareRefusal(errors.slice(0, SHARE_REFUSAL_LIST), errors.length) };

  // each cell's look (Range.getCellProperties, ExcelApi 1.9): demo values refuse the copy; inputs lose their shading
  const looks = used.getCellProperties({ format: { fill: { color: true }, font: { color: true, italic: true } } });
  await ctx.sync();
  const sourceName = source.name;
  const { demo, inputs, notes } = lookOf(used, looks.value);
  if (demo.length > 0) {
    return { ok: false, reason: demoRefusal(demo.slice(0, SHARE_REFUSAL_LIST).map((a) => `${sourceName}!${a}`), demo.length) };
  }

  const copyName = await freeName(ctx, `${sourceName} values ${isoDate(now)}`);
  const copy = source.copy("After", source);
  copy.name = copyName;
  const area = splitSheet(used.address).range;
  copy.getRange(area).copyFrom(used, "Values");
  copy.getRange(`1:${SHARE_STAMP_ROWS}`).insert("Down");
  // frozen: an input is a value like any other, unshaded, and the note asking to overwrite the inputs says there are none
  const down = (a: string) => cellAddress({ row: parseCell(a).row + SHARE_STAMP_ROWS, col: parseCell(a).col });
  for (const a of inputs) {
    const format = copy.getRange(down(a)).format;
    format.fill.clear();
    format.font.color = ROLE_STYLES.computed.font!;
    format.font.italic = false;
  }
  for (const a of notes) copy.getRange(down(a)).values = [[cellConstant(FROZEN_NOTE)]];
  const stamp = copy.getRange("A1");
  stamp.values = [[shareStamp(sourceName, now)]];
  stamp.format.font.bold = true;
  stamp.format.fill.color = ROLE_STYLES.caution.fill!;
  stamp.format.font.color = ROLE_STYLES.caution.font!;
  copy.activate();
  await ctx.sync();

  // The copy must hold values alone and no error: if a cell recalculated in between, undo and say so.
  const check = copy.getUsedRange();
  check.load("address,formulas,values,valueTypes,rowCount,columnCount");
  await ctx.sync();
  const stillFormulas = formulaCells(check);
  const copyErrors = errorCells(check);
  if (stillFormulas.length > 0 || copyErrors.length > 0) {
    copy.delete();
    source.activate();
    await ctx.sync();
    if (copyErrors.length > 0) return { ok: false, reason: shareRefusal(copyErrors.slice(0, SHARE_REFUSAL_LIST), copyErrors.length) };
    return { ok: false, reason: `No share copy made: ${stillFormulas.slice(0, SHARE_REFUSAL_LIST).join(", ")} kept a formula; try again.` };
  }
  const drawn = plot ? plot.series.filter((s) => s.points.length > 0) : [];
  if (plot && drawn.length > 0 && drawn[0].style === "line") await addSharePlot(ctx, copy, used, { ...plot, series: drawn });
  return { ok: true, sheetName: copyName, sourceSheet: sourceName };
}

/** Where the source's cells in `block` (A1 coordinates of the source sheet) are all empty, as `used` shows them. */
function blockEmpty(used: Excel.Range, block: ReturnType<typeof parseRange>): boolean {
  const start = parseRange(splitSheet(used.address).range).start;
  for (let i = 0; i < block.rows; i++) {
    for (let j = 0; j < block.cols; j++) {
      const v = used.values[block.start.row + i - start.row]?.[block.start.col + j - start.col];
      if (v !== undefined && v !== "") return false;
    }
  }
  return true;
}

/**
 * The pane's plot on a share copy, as a native chart of frozen values: the plot's points written into the copy as
 * values, right of the copied cells and below the stamp (a title row, then for each series its name, the axis titles
 * and its points in two columns), and a chart of them drawn as insertEstimateSheet draws the estimate's (addChart).
 * The chart stands where the estimate's chart stands, below the stamp, when the source's cells there are empty, else
 * right of the points. A chart of the add-in's that came along with the sheet is replaced.
 */
async function addSharePlot(ctx: Ctx, copy: Excel.Worksheet, used: Excel.Range, plot: SharePlot): Promise<void> {
  // the add-in's chart on the copy, if any: ChartCollection.getItemOrNullObject (ExcelApi 1.4) "Gets a chart using its
  // name. ... If the chart doesn't exist, then this method returns an object with its isNullObject property set to
  // true" (https://learn.microsoft.com/javascript/api/excel/excel.chartcollection#excel-excel-chartcollection-getitemornullobject-member(1))
  const carried = copy.charts.getItemOrNullObject(CHART_NAME);
  await ctx.sync();
  // Chart.delete (ExcelApi 1.1): "Deletes the chart object" (https://learn.microsoft.com/javascript/api/excel/excel.chart#excel-excel-chart-delete-member(1))
  if (!carried.isNullObject) carried.delete();

  const area = parseRange(splitSheet(used.address).range);
  const left = area.start.col + area.cols + 1; // one empty column after the copied cells
  const top = SHARE_STAMP_ROWS;
  const at = (row: number, col: number) => cellAddress({ row, col });
  // Range.values (ExcelApi 1.1): a 2-D array of the range's shape; text through cellConstant, so that it stays text
  // (https://learn.microsoft.com/javascript/api/excel/excel.range#excel-excel-range-values-member)
  copy.getRange(at(top, left)).values = [[cellConstant("Plot data: the supply-versus-demand plot of the pane, values frozen")]];
  const series: ChartSeries[] = plot.series.map((s, i) => {
    const col = left + 2 * i;
    const first = top + 3;
    const last = first + s.points.length - 1;
    copy.getRange(`${at(top + 1, col)}:${at(last, col + 1)}`).values = [
      [cellConstant(s.name), ""],
      [cellConstant(plot.xTitle), cellConstant(plot.yTitle)],
      ...s.points.map(([q, p]) => [q, p]),
    ];
    return { name: s.name, x: `${at(first, col)}:${at(last, col)}`, y: `${at(first, col + 1)}:${at(last, col + 1)}`, style: s.style, marker: s.marker, color: s.color };
  });
  const place = parseRange(`${CHART_FROM}:${CHART_TO}`);
  const from = blockEmpty(used, place)
    ? { row: place.start.row + SHARE_STAMP_ROWS, col: place.start.col }
    : { row: top, col: left + 2 * plot.series.length + 1 };
  const to = { row: from.row + place.rows - 1, col: from.col + place.cols - 1 };
  addChart(copy, { title: plot.title, xTitle: plot.xTitle, yTitle: plot.yTitle, series, from: at(from.row, from.col), to: at(to.row, to.col) });
  await ctx.sync();
}

/**
 * The cells of a loaded range that hold a demo value (the demo look, not empty), that are inputs (the input's fill)
 * and that hold the note saying which cells are inputs: addresses (A1) of the range's sheet.
 */
function lookOf(range: Excel.Range, looks: Excel.CellProperties[][]): { demo: string[]; inputs: string[]; notes: string[] } {
  const start = parseRange(splitSheet(range.address).range).start;
  const inputFill = ROLE_STYLES.input.fill!.toUpperCase();
  const out = { demo: [] as string[], inputs: [] as string[], notes: [] as string[] };
  range.values.forEach((row, i) =>
    row.forEach((v, j) => {
      const a = cellAddress({ row: start.row + i, col: start.col + j });
      const format = looks[i]?.[j]?.format;
      if (isDemoLook(format?.font) && range.valueTypes[i][j] !== "Empty") out.demo.push(a);
      if (String(format?.fill?.color ?? "").toUpperCase() === inputFill) out.inputs.push(a);
      if (typeof v === "string" && INPUT_NOTES.includes(v)) out.notes.push(a);
    }),
  );
  return out;
}

/** Addresses (Sheet!A1) and shown errors of every error cell of a loaded range. */
function errorCells(range: Excel.Range): Array<[string, string]> {
  const { sheet, range: area } = splitSheet(range.address);
  const start = parseRange(area).start;
  const out: Array<[string, string]> = [];
  range.valueTypes.forEach((row, i) =>
    row.forEach((type, j) => {
      if (type === "Error") {
        const a = cellAddress({ row: start.row + i, col: start.col + j });
        out.push([sheet ? `${sheet}!${a}` : a, String(range.values[i][j])]);
      }
    }),
  );
  return out;
}

/** Addresses of cells of a loaded range that still hold a formula. */
function formulaCells(range: Excel.Range): string[] {
  const start = parseRange(splitSheet(range.address).range).start;
  const out: string[] = [];
  range.formulas.forEach((row, i) =>
    row.forEach((f, j) => {
      if (typeof f === "string" && f.startsWith("=")) out.push(cellAddress({ row: start.row + i, col: start.col + j }));
    }),
  );
  return out;
}
