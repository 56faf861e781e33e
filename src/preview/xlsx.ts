/**
 * .xlsx files in and out, through ExcelJS, loaded only when a file is opened or saved (`await import("exceljs")`).
 *
 * Reading: every formula with its cached value (the add-in's functions mapped from `_xldudf_HEADROOM_…` back to
 * `HEADROOM.…` by the known function list, `_xlfn.` dropped, exponents made lowercase: ./formulaText), values,
 * number formats, the cell roles recognised from the styles this module writes, column widths, merges, row heights,
 * a sheet's print area with its print title rows, fit and orientation, and the workbook's defined names of cells (one for a
 * constant, a formula or one sheet is left out, with a note, never changed). A spilled block (an array formula with its `ref`) becomes its anchor formula;
 * the other cells of the block keep only their cached values, so that the engine can spill into them.
 *
 * Writing: formulas in the file's spelling with their current values cached (so that a reader without the add-in,
 * or another spreadsheet, sees the numbers), spills as Excel stores a dynamic array (an array formula over the block,
 * its cell marked with the dynamic-array cell metadata: ./dynamicArrays.ts, which also leaves out the
 * calculation-engine id so that Excel computes every formula on opening the file, without a forced full calculation),
 * roles as fills and fonts (ROLE_STYLES of ../workbook/look.ts), names, print setups (ExcelJS's pageSetup: printArea,
 * printTitlesRow, fitToPage, fitToWidth, fitToHeight, orientation; README "Page Setup",
 * https://github.com/exceljs/exceljs#page-setup), and pictures (a share copy's plot, ./picture.ts) through ExcelJS's
 * images: workbook.addImage with the PNG as base64, worksheet.addImage at a cell with a size in pixels, moving with the
 * cell it stands on (README "Images", https://github.com/exceljs/exceljs#images). ExcelJS cannot write charts.
 */
import type { Workbook as ExcelWorkbook, Worksheet, Cell, CellValue, Fill, Font } from "exceljs";
import type JSZipType from "jszip";
import { cellAddress, parseCell, parseRange } from "../workbook/a1";
import { DEMO_LOOK, ROLE_STYLES } from "../workbook/look";
import { storeDynamicArrays } from "./dynamicArrays";
import { fromFileFormula, toFileFormula } from "./formulaText";
import { type CachedValue, type CellData, type CellRole, type CellStyle, type DefinedName, type PrintSetup, type SheetData, type WorkbookData, isFormula, textContent, textOf } from "./model";
import type { SheetPicture } from "./picture";

type ExcelJSModule = typeof import("exceljs");

let loading: Promise<ExcelJSModule> | undefined;

/** ExcelJS, loaded on first use. */
async function excel(): Promise<ExcelJSModule> {
  loading ??= import("exceljs").then((m) => ((m as unknown as { default?: ExcelJSModule }).default ?? m) as ExcelJSModule);
  return loading;
}

const ERROR_CODES = new Set(["#NULL!", "#DIV/0!", "#VALUE!", "#REF!", "#NAME?", "#NUM!", "#N/A", "#SPILL!", "#CALC!", "#BUSY!", "#ERROR!", "#CYCLE!", "#LIC!"]);

/** Excel stores dates as days since 1899-12-30. */
function dateSerial(d: Date): number {
  return (d.getTime() - Date.UTC(1899, 11, 30)) / 86_400_000;
}

/** The colour of a role's fill or font as ExcelJS writes it (ARGB, opaque). */
const argb = (hex: string) => `FF${hex.replace("#", "").toUpperCase()}`;

/** "FFFFF2B3" or "FFF2B3" → "#FFF2B3"; theme or indexed colours → undefined. */
function hexOf(color: { argb?: string } | undefined): string | undefined {
  const a = color?.argb;
  if (!a) return undefined;
  return `#${a.slice(-6).toUpperCase()}`;
}

/** The role whose look (fill, font colour, bold, italic) is exactly this cell's, if any. */
function roleOfStyle(fill: string | undefined, font: string | undefined, bold: boolean, italic: boolean): CellRole | undefined {
  for (const [role, look] of Object.entries(ROLE_STYLES) as Array<[CellRole, (typeof ROLE_STYLES)[CellRole]]>) {
    if (!look.fill && !look.font && !look.bold && !look.italic) continue; // a role with no look of its own
    if ((look.fill ?? undefined) !== fill) continue;
    if ((look.font ?? undefined) !== font) continue;
    if (Boolean(look.bold) !== bold || Boolean(look.italic) !== italic) continue;
    return role;
  }
  return undefined;
}

/** A cell's typed value as the preview's content (formulas aside). */
function contentOfValue(v: CellValue): CachedValue | string {
  if (v === null || v === undefined) return null;
  if (typeof v === "number" || typeof v === "string" || typeof v === "boolean") return v;
  if (v instanceof Date) return dateSerial(v);
  if (typeof v === "object") {
    if ("richText" in v && Array.isArray(v.richText)) return v.richText.map((r) => r.text).join("");
    if ("error" in v) return { error: String((v as { error: unknown }).error) };
    if ("text" in v && typeof (v as { text: unknown }).text === "string") return (v as { text: string }).text; // hyperlink
  }
  return String(v);
}

function cachedOf(result: unknown): CachedValue {
  if (result === undefined || result === null) return null;
  if (typeof result === "number" || typeof result === "string" || typeof result === "boolean") return result;
  if (result instanceof Date) return dateSerial(result);
  if (typeof result === "object" && "error" in (result as object)) return { error: String((result as { error: unknown }).error) };
  return String(result);
}

export interface ReadResult {
  workbook: WorkbookData;
  /** what could not be read as it was (charts dropped, names skipped…), for the user */
  notes: string[];
}

/**
 * The most cells a file the preview opens may hold. The engine is built from the file in one piece, on the page: at
 * this size that holds the page still for under a second (`npm run bench:browser` measures it); a larger file is
 * refused, before it is parsed, with this limit in the message (Excel with the add-in opens it).
 */
export const MAX_CELLS = 200_000;

/** A worksheet's cells as the file writes them: every <c> element (with or without a namespace prefix). */
const CELL_ELEMENT = /<(?:[A-Za-z_][\w.-]*:)?c[\s/>]/g;

/**
 * The cells the file's worksheets hold, counted in their XML before anything is parsed, so that a file too large to
 * open is refused quickly. Worksheets are the parts under xl/worksheets/.
 */
export async function countCells(data: ArrayBuffer | Uint8Array): Promise<number> {
  const JSZip = await import("jszip").then((m) => ((m as unknown as { default?: typeof JSZipType }).default ?? m) as typeof JSZipType);
  const zip = await JSZip.loadAsync(data);
  let cells = 0;
  for (const entry of Object.values(zip.files)) {
    if (entry.dir || !/^xl\/worksheets\/[^/]+\.xml$/i.test(entry.name)) continue;
    const xml = await entry.async("string");
    cells += xml.match(CELL_ELEMENT)?.length ?? 0;
  }
  return cells;
}

/**
 * Read an .xlsx file. `known` lists the add-in's functions as written in cells ("HEADROOM.FRICTION"). A file of more
 * than `maxCells` cells (MAX_CELLS unless given) is refused before it is parsed.
 */
export async function readXlsx(data: ArrayBuffer | Uint8Array, known: readonly string[], opts: { maxCells?: number } = {}): Promise<ReadResult> {
  const maxCells = opts.maxCells ?? MAX_CELLS;
  const cells = await countCells(data);
  if (cells > maxCells) {
    throw new Error(
      `it holds ${cells.toLocaleString("en-US")} cells; the preview opens files of at most ${maxCells.toLocaleString("en-US")} cells (Excel with the Headroom add-in opens it)`,
    );
  }
  const ExcelJS = await excel();
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(data as ArrayBuffer);
  const notes: string[] = [];
  const sheets: SheetData[] = [];
  wb.eachSheet((ws) => sheets.push(readSheet(ws, known)));
  if (!sheets.length) throw new Error("the file holds no worksheet");

  const names: DefinedName[] = [];
  // ExcelJS keeps of a name only the cells it names: a constant goes, a formula becomes its first reference, a name
  // of one sheet becomes the workbook's. Such names are left out, and said so, rather than changed.
  const asWritten = await definedNamesAsWritten(data);
  for (const n of wb.definedNames.model as Array<{ name: string; ranges: string[] }>) {
    if (n.name.startsWith("_xlnm.")) continue; // print areas and the like
    const written = asWritten.get(n.name.toLowerCase());
    if (written && !written.workbookWide) {
      notes.push(`name ${n.name} belongs to one sheet; the preview keeps the workbook's names only, so it is left out`);
      continue;
    }
    if (written && !PLAIN_REFERENCE.test(written.text)) {
      notes.push(`name ${n.name} refers to ${written.text}; the preview keeps names of cells only, so it is left out`);
      continue;
    }
    if (n.ranges.length !== 1) {
      notes.push(`name ${n.name} refers to ${n.ranges.length} ranges; left out`);
      continue;
    }
    names.push({ name: n.name, ref: n.ranges[0] });
  }
  for (const [key, w] of asWritten) {
    const kept = (wb.definedNames.model as Array<{ name: string }>).some((n) => n.name.toLowerCase() === key);
    if (!kept && !w.name.startsWith("_xlnm.")) notes.push(`name ${w.name} refers to ${w.text}; the preview keeps names of cells only, so it is left out`);
  }
  const activeTab = (wb.views?.[0] as { activeTab?: number } | undefined)?.activeTab ?? 0;
  return { workbook: { sheets, names, activeSheet: sheets[activeTab]?.name ?? sheets[0].name }, notes };
}

/** One cell or one block of a sheet, as a name's reference is written: Estimate!$B$8, 'Pipe run'!$A$2:$D$9. */
const PLAIN_REFERENCE = /^(?:'(?:[^']|'')+'|[^'!\s]+)!\$?[A-Za-z]{1,3}\$?\d+(?::\$?[A-Za-z]{1,3}\$?\d+)?$/;

/** The file's defined names as written in xl/workbook.xml, read with JSZip (ExcelJS's own, and ./dynamicArrays'). */
async function definedNamesAsWritten(data: ArrayBuffer | Uint8Array): Promise<Map<string, { name: string; text: string; workbookWide: boolean }>> {
  const JSZip = await import("jszip").then((m) => ((m as unknown as { default?: typeof JSZipType }).default ?? m) as typeof JSZipType);
  const xml = (await (await JSZip.loadAsync(data)).file("xl/workbook.xml")?.async("string")) ?? "";
  const unescape = (x: string) => x.replace(/&(lt|gt|quot|apos|amp);/g, (_m, e: string) => ({ lt: "<", gt: ">", quot: '"', apos: "'", amp: "&" })[e]!);
  const out = new Map<string, { name: string; text: string; workbookWide: boolean }>();
  for (const m of xml.matchAll(/<definedName\b([^>]*)>([^<]*)<\/definedName>/g)) {
    const name = unescape(/\bname="([^"]*)"/.exec(m[1])?.[1] ?? "");
    const workbookWide = !/\blocalSheetId="/.test(m[1]);
    // a sheet's own name beside a workbook name of the same spelling: the workbook's is the one ExcelJS keeps
    if (name && (workbookWide || !out.has(name.toLowerCase()))) out.set(name.toLowerCase(), { name, text: unescape(m[2]).trim(), workbookWide });
  }
  return out;
}

function readSheet(ws: Worksheet, known: readonly string[]): SheetData {
  const cells: Record<string, CellData> = {};
  const covered = new Set<string>(); // cells of a spilled block other than its anchor
  const merged = new Set<string>(); // cells of a merged range other than its first: ExcelJS repeats its value there
  for (const m of (ws.model as { merges?: string[] }).merges ?? []) {
    const r = parseRange(m);
    for (let i = 0; i < r.rows; i++)
      for (let k = 0; k < r.cols; k++) if (i || k) merged.add(cellAddress({ row: r.start.row + i, col: r.start.col + k }));
  }
  ws.eachRow({ includeEmpty: false }, (row) =>
    row.eachCell({ includeEmpty: false }, (cell) => {
      const v = cell.value as { shareType?: string; ref?: string } | null;
      if (v && typeof v === "object" && v.shareType === "array" && v.ref && v.ref.includes(":")) {
        const r = parseRange(v.ref);
        for (let i = 0; i < r.rows; i++)
          for (let k = 0; k < r.cols; k++) if (i || k) covered.add(cellAddress({ row: r.start.row + i, col: r.start.col + k }));
      }
    }),
  );
  ws.eachRow({ includeEmpty: true }, (row) =>
    row.eachCell({ includeEmpty: true }, (cell) => {
      const address = cell.address;
      if (merged.has(address)) return;
      const style = styleOf(cell);
      const formula = cell.formula as string | undefined;
      let data: CellData | undefined;
      if (formula) {
        data = { content: fromFileFormula(formula, known), cached: cachedOf(cell.result) };
        const ref = (cell.value as { ref?: string; shareType?: string }).ref;
        if ((cell.value as { shareType?: string }).shareType === "array" && ref) data.spill = ref;
      } else {
        const value = contentOfValue(cell.value);
        if (covered.has(address)) {
          data = { content: null, cached: value as CachedValue };
        } else if (value !== null && typeof value === "object") {
          // a constant error typed into a cell
          data = { content: ERROR_CODES.has(value.error) ? value.error : String(value.error) };
        } else if (typeof value === "string" && value !== "") {
          // text as it is, "=1+1" included: held behind an apostrophe, never read as a formula
          data = { content: textContent(value) };
        } else if (value !== null && value !== "") {
          data = { content: value };
        }
      }
      if (!data && !style) return;
      data ??= { content: null };
      if (style) data.style = style;
      if (!data.style?.role) {
        // cells without a look of their own: formulas are computed, text is a label
        const role: CellRole | undefined = formula ? "computed" : typeof data.content === "string" ? "label" : undefined;
        if (role) data.style = { ...(data.style ?? {}), role };
      }
      cells[address] = data;
    }),
  );

  const sheet: SheetData = { name: ws.name, cells };
  const widths: Record<number, number> = {};
  for (let c = 1; c <= ws.columnCount; c++) {
    const w = ws.getColumn(c).width;
    if (w) widths[c - 1] = Math.round(((w * 7 + 5) * 0.75) * 10) / 10;
  }
  if (Object.keys(widths).length) sheet.columnWidths = widths;
  const heights: Record<number, number> = {};
  ws.eachRow({ includeEmpty: true }, (row, n) => {
    if (row.height) heights[n - 1] = row.height;
  });
  if (Object.keys(heights).length) sheet.rowHeights = heights;
  const merges = (ws.model as { merges?: string[] }).merges;
  if (merges?.length) sheet.merges = [...merges];
  const print = printOf(ws);
  if (print) sheet.print = print;
  return sheet;
}

/** A sheet's print setup, where it has a print area (ExcelJS reads the area and title rows from the file's names). */
function printOf(ws: Worksheet): PrintSetup | undefined {
  const setup = ws.pageSetup;
  if (!setup?.printArea) return undefined;
  const print: PrintSetup = { area: setup.printArea.replace(/\$/g, "") };
  if (setup.printTitlesRow) print.titleRows = setup.printTitlesRow.replace(/\$/g, "");
  if (setup.fitToPage) {
    print.fitWide = setup.fitToWidth ?? 1;
    print.fitTall = setup.fitToHeight ?? 1;
  }
  if (setup.orientation === "portrait" || setup.orientation === "landscape") print.orientation = setup.orientation;
  return print;
}

/**
 * A print area as ExcelJS takes it so that the file holds absolute references ("$A$1:$P$89"), as Excel writes them:
 * ExcelJS puts a "$" before each corner itself (lib/xlsx/xform/book/workbook-xform.js), so the rows get theirs here.
 */
function printAreaForFile(area: string): string {
  return area
    .split("&&")
    .map((block) => block.split(":").map((corner) => corner.replace(/^([A-Z]+)(\d+)$/, "$1$$$2")).join(":"))
    .join("&&");
}


function styleOf(cell: Cell): CellStyle | undefined {
  const style: CellStyle = {};
  const numFmt = cell.numFmt;
  if (numFmt && numFmt !== "General") style.numFmt = numFmt;
  const fill = cell.fill as Fill | undefined;
  const fillHex = fill && fill.type === "pattern" && fill.pattern === "solid" ? hexOf(fill.fgColor as { argb?: string }) : undefined;
  const font = cell.font as Partial<Font> | undefined;
  const fontHex = hexOf(font?.color as { argb?: string } | undefined);
  const bold = Boolean(font?.bold);
  const italic = Boolean(font?.italic);
  // an input still holding a demo value: the input's fill under the demo look (DEMO_LOOK)
  const demo = fillHex === ROLE_STYLES.input.fill && fontHex === DEMO_LOOK.font && italic === DEMO_LOOK.italic && !bold;
  const role = demo ? "input" : roleOfStyle(fillHex, fontHex, bold, italic);
  if (role) style.role = role;
  if (demo) style.demo = true;
  if (bold) style.bold = true;
  if (italic && !demo) style.italic = true;
  if (cell.alignment?.wrapText) style.wrap = true;
  return Object.keys(style).length ? style : undefined;
}

/**
 * Write an .xlsx file. `known` lists the add-in's functions as written in cells; `date` sets the file's created and
 * modified dates (now by default); `pictures` go on the sheets they name.
 */
export async function writeXlsx(
  data: WorkbookData,
  known: readonly string[],
  opts: { date?: Date; pictures?: readonly SheetPicture[] } = {},
): Promise<Uint8Array> {
  const ExcelJS = await excel();
  const wb: ExcelWorkbook = new ExcelJS.Workbook();
  wb.creator = "Headroom";
  wb.lastModifiedBy = "Headroom";
  const date = opts.date ?? new Date();
  wb.created = date;
  wb.modified = date;
  for (const s of data.sheets) writeSheet(wb.addWorksheet(s.name), s, known);
  for (const p of opts.pictures ?? []) {
    const ws = wb.getWorksheet(p.sheet);
    if (!ws) throw new Error(`no sheet ${p.sheet} for the picture`);
    const image = wb.addImage({ base64: p.png, extension: "png" });
    const at = parseCell(p.at);
    ws.addImage(image, { tl: { col: at.col, row: at.row }, ext: { width: p.width, height: p.height }, editAs: "oneCell" });
  }
  const active = Math.max(0, data.sheets.findIndex((s) => s.name === data.activeSheet));
  wb.views = [{ x: 0, y: 0, width: 20000, height: 12000, firstSheet: 0, activeTab: active, visibility: "visible" }];
  const buffer = await wb.xlsx.writeBuffer();
  const bytes = await storeDynamicArrays(new Uint8Array(buffer as ArrayBuffer), date);
  return data.names.length ? storeDefinedNames(bytes, data.names, known, date) : bytes;
}

/**
 * The workbook's names, written into xl/workbook.xml as the preview holds them. ExcelJS keeps of a name only the
 * cells it names (a constant such as 10 or a formula such as Estimate!$B$8*2 comes out garbled, or throws), so every
 * name is written here, as Excel writes one: `<definedName name="…">text</definedName>` with the text of its
 * reference or formula (no "=", the add-in's functions as `_xldudf_…`), inside the one <definedNames> that follows
 * <sheets> (ECMA-376 Part 1, 18.2.27 workbook: sheets, functionGroups, externalReferences, definedNames), before the
 * print areas ExcelJS writes there.
 */
async function storeDefinedNames(bytes: Uint8Array, names: readonly DefinedName[], known: readonly string[], date: Date): Promise<Uint8Array> {
  const JSZip = await import("jszip").then((m) => ((m as unknown as { default?: typeof JSZipType }).default ?? m) as typeof JSZipType);
  const zip = await JSZip.loadAsync(bytes);
  const part = "xl/workbook.xml";
  const xml = await zip.file(part)!.async("string");
  const escape = (x: string) => x.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");
  const elements = names.map((n) => `<definedName name="${escape(n.name)}">${escape(toFileFormula(`=${n.ref.replace(/^=/, "")}`, known))}</definedName>`).join("");
  let out: string;
  if (/<definedNames>/.test(xml)) out = xml.replace("<definedNames>", `<definedNames>${elements}`);
  else if (/<definedNames\/>/.test(xml)) out = xml.replace("<definedNames/>", `<definedNames>${elements}</definedNames>`);
  else out = xml.replace("</sheets>", `</sheets><definedNames>${elements}</definedNames>`);
  zip.file(part, out, { date });
  for (const entry of Object.values(zip.files)) entry.date = date;
  return zip.generateAsync({ type: "uint8array", compression: "DEFLATE" });
}

function resultOf(v: CachedValue | undefined): unknown {
  if (v === undefined || v === null) return undefined;
  if (typeof v === "object") return { error: v.error };
  return v;
}

function writeSheet(ws: Worksheet, s: SheetData, known: readonly string[]): void {
  for (const [col, points] of Object.entries(s.columnWidths ?? {})) {
    ws.getColumn(Number(col) + 1).width = Math.max(1, Math.round(((points / 0.75 - 5) / 7) * 100) / 100);
  }
  for (const [address, c] of Object.entries(s.cells)) {
    const cell = ws.getCell(address);
    const content = c.content;
    if (isFormula(content)) {
      const formula = toFileFormula(content, known);
      const result = resultOf(c.cached);
      cell.value = (c.spill
        ? { formula, result, shareType: "array", ref: c.spill }
        : { formula, result }) as CellValue;
    } else if (typeof content === "string") {
      // text, "=1+1" included, as a string: never a formula in the file
      cell.value = textOf(content);
    } else if (content !== null && content !== undefined) {
      cell.value = content;
    } else if (c.cached !== undefined && c.cached !== null) {
      // a cell a spill fills: its value, so the file shows it before Excel recalculates
      cell.value = (typeof c.cached === "object" ? { error: c.cached.error } : c.cached) as CellValue;
    }
    if (c.style) applyStyle(cell, c.style);
  }
  for (const m of s.merges ?? []) ws.mergeCells(m);
  for (const [row, points] of Object.entries(s.rowHeights ?? {})) ws.getRow(Number(row) + 1).height = points;
  if (s.print) {
    const p = s.print;
    ws.pageSetup.printArea = printAreaForFile(p.area);
    if (p.titleRows) ws.pageSetup.printTitlesRow = p.titleRows;
    if (p.fitWide !== undefined || p.fitTall !== undefined) {
      ws.pageSetup.fitToPage = true;
      ws.pageSetup.fitToWidth = p.fitWide ?? 1;
      ws.pageSetup.fitToHeight = p.fitTall ?? 1;
    }
    if (p.orientation) ws.pageSetup.orientation = p.orientation;
  }
}

function applyStyle(cell: Cell, style: CellStyle): void {
  if (style.numFmt) cell.numFmt = style.numFmt;
  const look = style.role ? { ...ROLE_STYLES[style.role], ...(style.demo ? DEMO_LOOK : {}) } : undefined;
  if (look?.fill) cell.fill = { type: "pattern", pattern: "solid", fgColor: { argb: argb(look.fill) } };
  const font: Partial<Font> = {};
  if (look?.font) font.color = { argb: argb(look.font) };
  if (style.bold || look?.bold) font.bold = true;
  if (style.italic || look?.italic) font.italic = true;
  if (look?.size) font.size = look.size;
  if (Object.keys(font).length) cell.font = font as Font;
  if (style.wrap) cell.alignment = { wrapText: true, vertical: "top" };
}
