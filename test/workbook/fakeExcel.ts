/**
 * A small in-memory workbook behind office-addin-mock, for testing the Office.js side of the Workbook port.
 *
 * office-addin-mock gives the load/sync semantics of Office.js objects (a property read before load and sync is an
 * error string) but no Excel behaviour and no collections. This fake supplies the behaviour the port relies on:
 * sheets of cells (value, formula, number format, look), merged blocks, row heights, workbook names and names scoped to
 * a sheet, used ranges, sheet copy, copyFrom values, row insertion, charts and events. A sheet's `names` collection
 * holds its own names only, as the reference describes worksheet.names ("names scoped to the current worksheet",
 * https://learn.microsoft.com/javascript/api/excel/excel.worksheet#excel-excel-worksheet-names-member), and the
 * workbook's holds the workbook's only (office-js #1011 reports that on the web a sheet's collection also listed the
 * workbook's names; a port that looks at the sheet first and the workbook second reads the same either way). Every Office.js object the port asks for is a fresh OfficeMockObject hung under
 * the context (so that context.sync() reaches it); property writes the port queues are applied to the model at the
 * next sync, method calls at once. The fake does not calculate: a formula shows whatever value it was given, and a
 * formula written by the port shows #BUSY! (as a custom function does before Excel has its result).
 *
 * What it models of calculation is when a formula is recalculated, not what it computes: a recalculated formula shows
 * #BUSY! until a test gives it a value. A batch that adds or deletes a workbook name recalculates every formula that
 * mentions the name, as automatic calculation would, unless the batch called suspendApiCalculationUntilNextSync():
 * then those formulas keep their old result and are listed in `stale`, because "once set, it is the developer's
 * responsibility to re-calc the workbook, to ensure that any dependencies are propagated"
 * (https://learn.microsoft.com/javascript/api/excel/excel.application, suspendApiCalculationUntilNextSync).
 * application.calculate("Full" | "FullRebuild"), queued in a later batch, recalculates every formula and clears
 * `stale`; a calculation queued in a suspended batch is taken as suspended too.
 */
import { OfficeMockObject } from "office-addin-mock";
import { cellAddress, parseCell, parseRange, quoteSheet, splitSheet } from "../../src/workbook/a1";

export interface FakeCell {
  value: number | string | boolean;
  /** an error shown by the cell, e.g. "#BUSY!" (value is then that text) */
  error?: boolean;
  formula?: string;
  numberFormat?: string;
  style?: Record<string, unknown>;
}

export interface FakeSheet {
  id: number;
  name: string;
  cells: Map<string, FakeCell>;
  columnWidths: Map<string, number>;
  /** row heights in points, by row number (1-based, as in "2:2") */
  rowHeights: Map<number, number>;
  /** merged blocks, "A2:D2" */
  merges: string[];
  charts: FakeChart[];
  tabColor?: string;
  /** names scoped to this sheet */
  names: Map<string, NameTarget>;
  /** what the port set of the sheet's page layout */
  print?: { area?: string; titleRows?: string; orientation?: string; zoom?: unknown };
}

export interface FakeChart {
  type: string;
  source: string;
  seriesBy: string;
  props: Record<string, unknown>;
  position?: [string, string];
  series: Array<{ name: string; x?: string; y?: string; props: Record<string, unknown> }>;
}

type NameTarget = { sheetId: number; address: string; comment?: string };
type Handler = (args: unknown) => Promise<unknown> | unknown;

interface Proxy {
  mock: OfficeMockObject;
  baseline: Map<string, unknown>;
  onWrite: (path: string, value: unknown) => void;
}

const NOT_READ = /^Error, /;

/** The parts of office-addin-mock's objects the fake works with (addMock and populate are public in its README). */
interface MockNode {
  addMock(name: string): void;
  populate(seed: object): void;
  _properties: Map<string, MockNode & { _isObject?: boolean }>;
  [key: string]: unknown;
}
const node = (m: OfficeMockObject): MockNode => m as unknown as MockNode;

/** Every scalar property of a mock and its nested objects: [path, value shown]. */
function leaves(mock: OfficeMockObject | MockNode, prefix = ""): Array<[string, unknown]> {
  const m = mock as MockNode;
  const out: Array<[string, unknown]> = [];
  for (const [key, child] of m._properties) {
    if (child._isObject) out.push(...leaves(child, `${prefix}${key}/`));
    else out.push([`${prefix}${key}`, m[key]]);
  }
  return out;
}

export class FakeExcel {
  sheets: FakeSheet[] = [];
  names = new Map<string, NameTarget>();
  activeId = 0;
  changed = new Set<Handler>();
  calculated = new Set<Handler>();
  activated = new Set<Handler>();
  /** every batch run, for tests that count round trips */
  syncs = 0;
  /** the calculation types the port asked for, in order */
  calculations: string[] = [];
  /**
   * formula cells ("Sheet!A1") whose shown result predates a change of a name they mention: left so by a batch that
   * suspended calculation, until a full calculation
   */
  stale = new Set<string>();
  private nextId = 1;

  constructor(sheetNames: string[] = ["Sheet1"]) {
    for (const n of sheetNames) this.addSheet(n);
    this.activeId = this.sheets[0].id;
  }

  // ── model ──
  addSheet(name: string, after?: FakeSheet): FakeSheet {
    if (this.sheetByName(name)) throw new Error(`A resource with the same name or identifier already exists: ${name}`);
    const s: FakeSheet = {
      id: this.nextId++,
      name,
      cells: new Map(),
      columnWidths: new Map(),
      rowHeights: new Map(),
      merges: [],
      charts: [],
      names: new Map(),
    };
    if (after) this.sheets.splice(this.sheets.indexOf(after) + 1, 0, s);
    else this.sheets.push(s);
    return s;
  }

  sheetByName(name: string): FakeSheet | undefined {
    return this.sheets.find((s) => s.name.toLowerCase() === name.toLowerCase());
  }

  sheetById(id: number): FakeSheet {
    const s = this.sheets.find((x) => x.id === id);
    if (!s) throw new Error(`sheet ${id} was deleted`);
    return s;
  }

  /**
   * Set a cell as a user would; fires the change events, with the change's details (the value before and after, as
   * Excel gives them for a change of one cell: WorksheetChangedEventArgs.details, ExcelApi 1.9).
   */
  setCell(sheet: string, address: string, cell: FakeCell | null): void {
    const s = this.sheetByName(sheet)!;
    const before = s.cells.get(address)?.value ?? "";
    if (cell === null) s.cells.delete(address);
    else s.cells.set(address, cell);
    const details = { valueBefore: before, valueAfter: cell?.value ?? "" };
    void this.fire(this.changed, { address: `${sheet}!${address}`, worksheetId: String(s.id), changeType: "RangeEdited", source: "Local", details });
    if (cell?.formula) void this.fire(this.calculated, { address: `${sheet}!${address}` });
  }

  /**
   * Set a block of cells as a user would in one step (a paste, a fill, Ctrl+Enter): one change event for the block,
   * without details, which Excel gives for a change of one cell only (WorksheetChangedEventArgs.details, ExcelApi 1.9).
   */
  setBlock(sheet: string, range: string, cells: Array<Array<FakeCell | null>>): void {
    const s = this.sheetByName(sheet)!;
    const r = parseRange(range);
    cells.forEach((row, i) =>
      row.forEach((cell, j) => {
        const a = cellAddress({ row: r.start.row + i, col: r.start.col + j });
        if (cell === null) s.cells.delete(a);
        else s.cells.set(a, cell);
      }),
    );
    void this.fire(this.changed, { address: `${sheet}!${range}`, worksheetId: String(s.id), changeType: "RangeEdited", source: "Local" });
  }

  /** Activate a sheet as a user would (clicking its tab); fires the activation events. */
  activate(sheet: string): void {
    const s = this.sheetByName(sheet)!;
    this.activeId = s.id;
    void this.fire(this.activated, { worksheetId: String(s.id), type: "WorksheetActivated" });
  }

  private async fire(set: Set<Handler>, args: unknown): Promise<void> {
    for (const h of [...set]) await h(args);
  }

  /** Values of a block of a sheet in Office.js shape. */
  block(sheet: FakeSheet, range: string) {
    const r = parseRange(range);
    const values: unknown[][] = [];
    const valueTypes: string[][] = [];
    const formulas: unknown[][] = [];
    for (let i = 0; i < r.rows; i++) {
      values.push([]);
      valueTypes.push([]);
      formulas.push([]);
      for (let j = 0; j < r.cols; j++) {
        const c = sheet.cells.get(cellAddress({ row: r.start.row + i, col: r.start.col + j }));
        values[i].push(c ? c.value : "");
        formulas[i].push(c ? (c.formula ?? c.value) : "");
        valueTypes[i].push(
          !c ? "Empty" : c.error ? "Error" : typeof c.value === "number" ? "Double" : typeof c.value === "boolean" ? "Boolean" : c.value === "" ? "Empty" : "String",
        );
      }
    }
    return { values, valueTypes, formulas, rowCount: r.rows, columnCount: r.cols };
  }

  usedRange(sheet: FakeSheet): string | null {
    let r0 = Infinity;
    let c0 = Infinity;
    let r1 = -1;
    let c1 = -1;
    for (const [a, c] of sheet.cells) {
      if (c.value === "" && !c.formula) continue;
      const p = parseCell(a);
      r0 = Math.min(r0, p.row);
      c0 = Math.min(c0, p.col);
      r1 = Math.max(r1, p.row);
      c1 = Math.max(c1, p.col);
    }
    if (r1 < 0) return null;
    return `${cellAddress({ row: r0, col: c0 })}:${cellAddress({ row: r1, col: c1 })}`;
  }

  /** Every formula cell of the workbook: [sheet, address, cell]. */
  formulaCells(): Array<[FakeSheet, string, FakeCell]> {
    const out: Array<[FakeSheet, string, FakeCell]> = [];
    for (const s of this.sheets) for (const [a, c] of s.cells) if (c.formula) out.push([s, a, c]);
    return out;
  }

  /** A formula recalculated: pending (#BUSY!) until a test gives it its value. */
  recalculate(sheet: FakeSheet, address: string, cell: FakeCell): void {
    Object.assign(cell, { value: "#BUSY!", error: true });
    this.stale.delete(`${sheet.name}!${address}`);
  }

  /** After a batch: what calculation its changes of names set off (see the header). */
  afterBatch(suspended: boolean, namesChanged: Set<string>, calculations: string[]): void {
    if (namesChanged.size > 0) {
      const mentions = [...namesChanged].map((n) => new RegExp(`(^|[^A-Za-z0-9_.])${n}($|[^A-Za-z0-9_.(])`, "i"));
      for (const [sheet, a, c] of this.formulaCells()) {
        if (!mentions.some((m) => m.test(c.formula!))) continue;
        if (suspended) this.stale.add(`${sheet.name}!${a}`);
        else this.recalculate(sheet, a, c);
      }
    }
    for (const type of calculations) {
      this.calculations.push(type);
      if (suspended) continue;
      if (type !== "Full" && type !== "FullRebuild") throw new Error(`the fake calculates "Full" or "FullRebuild" only, not "${type}"`);
      for (const [sheet, a, c] of this.formulaCells()) this.recalculate(sheet, a, c);
      this.stale.clear();
    }
  }

  // ── Office.js surface ──
  /** Excel.run over the fake: a fresh context each batch. */
  run = async <T>(batch: (ctx: Excel.RequestContext) => Promise<T>): Promise<T> => {
    const ctx = new Session(this).context;
    return batch(ctx as unknown as Excel.RequestContext);
  };

  runIn = async <T>(ctx: Excel.RequestContext, batch: (ctx: Excel.RequestContext) => Promise<T>): Promise<T> => batch(ctx);

  // ── test helpers ──
  cellsOf(sheet: string): Record<string, { value: unknown; formula?: string }> {
    const s = this.sheetByName(sheet);
    if (!s) throw new Error(`no sheet ${sheet}`);
    const out: Record<string, { value: unknown; formula?: string }> = {};
    for (const [a, c] of s.cells) {
      if (c.value === "" && !c.formula) continue;
      out[a] = c.formula ? { value: c.value, formula: c.formula } : { value: c.value };
    }
    return out;
  }

  /**
   * The cells and blocks a formula on `sheet` refers to, "Sheet!A1:B2" each: references written in it (text in
   * quotes aside) and the workbook names it mentions.
   */
  references(formula: string, sheet: FakeSheet): string[] {
    const body = formula.replace(/"(?:[^"]|"")*"/g, '""');
    const out: string[] = [];
    const ref = /(?:('(?:[^']|'')+'|[A-Za-z_][A-Za-z0-9_.]*)!)?\$?([A-Z]{1,3})\$?(\d+)(?::\$?([A-Z]{1,3})\$?(\d+))?(?![A-Za-z0-9_(])/g;
    for (const m of body.matchAll(ref)) {
      const before = m.index > 0 ? body[m.index - 1] : "";
      if (/[A-Za-z0-9_.]/.test(before)) continue;
      const on = m[1] ? this.sheetByName(m[1].replace(/^'|'$/g, "").replace(/''/g, "'")) : sheet;
      if (!on) continue;
      out.push(`${quoteSheet(on.name)}!${m[2]}${m[3]}${m[4] ? `:${m[4]}${m[5]}` : ""}`);
    }
    // whole columns (B:B) and whole rows (3:3), which Excel's getDirectPrecedents gives as "Sheet1!$B:$B", "Sheet1!$3:$3"
    const whole = /(?:('(?:[^']|'')+'|[A-Za-z_][A-Za-z0-9_.]*)!)?(\$?[A-Z]{1,3}:\$?[A-Z]{1,3}|\$?\d+:\$?\d+)(?![A-Za-z0-9_(])/g;
    for (const m of body.matchAll(whole)) {
      const before = m.index > 0 ? body[m.index - 1] : "";
      if (/[A-Za-z0-9_.:$]/.test(before)) continue;
      const on = m[1] ? this.sheetByName(m[1].replace(/^'|'$/g, "").replace(/''/g, "'")) : sheet;
      if (!on) continue;
      const [a, b] = m[2].replace(/\$/g, "").split(":");
      out.push(`${quoteSheet(on.name)}!$${a}:$${b}`);
    }
    for (const [n, t] of this.names) {
      if (!new RegExp(`(^|[^A-Za-z0-9_.])${n}($|[^A-Za-z0-9_.(])`, "i").test(body)) continue;
      const on = this.sheets.find((s) => s.id === t.sheetId);
      if (on) out.push(`${quoteSheet(on.name)}!${t.address}`);
    }
    return out;
  }

  nameTarget(n: string): { sheet: string; address: string } | null {
    const t = this.names.get(n);
    if (!t) return null;
    return { sheet: this.sheetById(t.sheetId).name, address: splitSheet(t.address).range };
  }
}

/** One Excel.run batch: its context, and the Office.js objects handed out in it. */
class Session {
  readonly context: OfficeMockObject;
  private proxies: Proxy[] = [];
  private pool: OfficeMockObject;
  private poolKey = 0;
  /** an error the next sync throws (a request of the batch failed, as getDirectPrecedents without precedents) */
  private failing: Error | null = null;
  /** what the batch under way asked of calculation */
  private suspended = false;
  private namesChanged = new Set<string>();
  private calculations: string[] = [];

  constructor(private readonly x: FakeExcel) {
    // eslint-disable-next-line @typescript-eslint/no-this-alias
    const session = this;
    const ctx = new OfficeMockObject({
      pool: {},
      application: {
        suspendApiCalculationUntilNextSync: () => {
          this.suspended = true;
        },
        calculate: (type: string) => {
          this.calculations.push(type);
        },
      },
      workbook: {},
      sync: async function (this: OfficeMockObject) {
        if (session.failing) {
          const e = session.failing;
          session.failing = null;
          throw e;
        }
        session.commit();
        x.afterBatch(session.suspended, session.namesChanged, session.calculations);
        session.suspended = false;
        session.namesChanged = new Set();
        session.calculations = [];
        x.syncs++;
        await OfficeMockObject.prototype.sync.call(this);
        await new Promise((r) => setTimeout(r, 0));
        session.rebaseline();
      },
    });
    this.context = ctx;
    this.pool = (ctx as unknown as { pool: OfficeMockObject }).pool;
    const wb = (ctx as unknown as { workbook: OfficeMockObject }).workbook;
    node(wb).populate({
      names: {
        getItemOrNullObject: (n: string) => this.nameItem(n),
        add: (n: string, ref: unknown, comment?: string) => {
          if (this.x.names.has(n)) throw new Error(`A resource with the same name or identifier already exists: ${n}`);
          const target = (ref as { _ref?: NameTarget })._ref;
          if (!target) throw new Error("names.add: the fake takes a Range");
          this.x.names.set(n, { ...target, comment });
          this.namesChanged.add(n);
          return this.nameItem(n);
        },
      },
      worksheets: {
        getItemOrNullObject: (n: string) => {
          const s = this.x.sheetByName(n);
          return s ? this.sheetProxy(s) : this.nullProxy();
        },
        add: (n: string) => this.sheetProxy(this.x.addSheet(n)),
        // by name or by id, as WorksheetCollection.getItem takes either
        getItem: (n: string) => {
          const s = this.x.sheetByName(n) ?? this.x.sheets.find((x) => String(x.id) === n);
          if (!s) throw new Error(`ItemNotFound: no sheet ${n}`);
          return this.sheetProxy(s);
        },
        getActiveWorksheet: () => this.sheetProxy(this.x.sheetById(this.x.activeId)),
        onChanged: { add: (h: Handler) => this.handler(this.x.changed, h, ctx) },
        onCalculated: { add: (h: Handler) => this.handler(this.x.calculated, h, ctx) },
        onActivated: { add: (h: Handler) => this.handler(this.x.activated, h, ctx) },
      },
    });
  }

  private handler(set: Set<Handler>, h: Handler, ctx: OfficeMockObject) {
    set.add(h);
    const p = this.proxy({ remove: () => set.delete(h) });
    (p as unknown as { context: unknown }).context = ctx;
    return p;
  }

  private proxy(seed: Record<string, unknown>, onWrite: (path: string, value: unknown) => void = () => {}, plain: Record<string, unknown> = {}): OfficeMockObject {
    const key = `p${this.poolKey++}`;
    node(this.pool).addMock(key);
    const mock = node(this.pool)[key] as OfficeMockObject;
    node(mock).populate(seed);
    Object.assign(mock, { isNullObject: false }, plain);
    const p: Proxy = { mock, baseline: new Map(), onWrite };
    for (const [path, v] of leaves(mock)) p.baseline.set(path, v);
    this.proxies.push(p);
    return mock;
  }

  private nullProxy(): OfficeMockObject {
    return this.proxy({ name: "", type: "", value: "" }, undefined, { isNullObject: true });
  }

  /** A name of the workbook, or of `scope` (a sheet's own names) when given. */
  private nameItem(n: string, scope?: FakeSheet): OfficeMockObject {
    const names = scope ? scope.names : this.x.names;
    const t = [...names].find(([k]) => k.toLowerCase() === n.toLowerCase())?.[1];
    if (!t) {
      const nul = this.nullProxy();
      Object.assign(nul, { getRangeOrNullObject: () => this.nullProxy() });
      return nul;
    }
    const sheet = this.x.sheets.find((s) => s.id === t.sheetId);
    return this.proxy(
      {
        name: n,
        type: sheet ? "Range" : "Error",
        value: sheet ? `=${quoteSheet(sheet.name)}!${t.address}` : "#REF!",
        getRange: () => this.rangeProxy(this.x.sheetById(t.sheetId), t.address),
        getRangeOrNullObject: () => (sheet ? this.rangeProxy(sheet, t.address) : this.nullProxy()),
        delete: () => {
          names.delete(n);
          this.namesChanged.add(n);
        },
      },
      undefined,
    );
  }

  private sheetProxy(sheet: FakeSheet): OfficeMockObject {
    const seed = {
      name: sheet.name,
      position: this.x.sheets.indexOf(sheet),
      tabColor: sheet.tabColor ?? "",
      getRange: (a: string) => this.rangeProxy(sheet, a),
      names: { getItemOrNullObject: (n: string) => this.nameItem(n, sheet) },
      pageLayout: {
        orientation: "",
        // a scalar in the seed, so that the object the port assigns (zoom is set as a whole) is seen at the sync
        zoom: "",
        setPrintArea: (area: string) => void (sheet.print = { ...sheet.print, area }),
        setPrintTitleRows: (rows: string) => void (sheet.print = { ...sheet.print, titleRows: rows }),
      },
      getUsedRange: () => {
        const u = this.x.usedRange(sheet);
        if (!u) throw new Error("the sheet is empty");
        return this.rangeProxy(sheet, u);
      },
      getUsedRangeOrNullObject: () => {
        const u = this.x.usedRange(sheet);
        return u ? this.rangeProxy(sheet, u) : this.nullProxy();
      },
      activate: () => {
        this.x.activeId = sheet.id;
      },
      delete: () => {
        this.x.sheets.splice(this.x.sheets.indexOf(sheet), 1);
      },
      copy: (_position: string, relativeTo?: { _sheetId?: number }) => {
        const after = relativeTo?._sheetId ? this.x.sheetById(relativeTo._sheetId) : sheet;
        const copy = this.x.addSheet(this.copyName(sheet.name), after);
        for (const [a, c] of sheet.cells) copy.cells.set(a, structuredClone(c));
        copy.columnWidths = new Map(sheet.columnWidths);
        copy.rowHeights = new Map(sheet.rowHeights);
        copy.merges = [...sheet.merges];
        copy.charts = structuredClone(sheet.charts);
        // the sheet's own names come along, pointing at the copy where they pointed at the sheet
        for (const [n, t] of sheet.names) copy.names.set(n, t.sheetId === sheet.id ? { ...t, sheetId: copy.id } : { ...t });
        return this.sheetProxy(copy);
      },
      charts: {
        add: (type: string, source: { _ref?: NameTarget }, seriesBy: string) => {
          const chart: FakeChart = { type, source: source._ref!.address, seriesBy, props: {}, series: [{ name: "", props: {} }] };
          sheet.charts.push(chart);
          return this.chartProxy(sheet, chart);
        },
        // the first chart of that name, else a null object (ChartCollection.getItemOrNullObject)
        getItemOrNullObject: (name: string) => {
          const chart = sheet.charts.find((c) => c.props.name === name);
          return chart ? this.chartProxy(sheet, chart) : this.nullProxy();
        },
      },
    };
    return this.proxy(
      seed,
      (path, v) => {
        if (path === "name") {
          if (this.x.sheetByName(String(v)) && this.x.sheetByName(String(v)) !== sheet) throw new Error(`sheet name taken: ${v}`);
          sheet.name = String(v);
        } else if (path === "tabColor") sheet.tabColor = String(v);
        else if (path === "pageLayout/orientation") sheet.print = { ...sheet.print, orientation: String(v) };
        else if (path === "pageLayout/zoom") sheet.print = { ...sheet.print, zoom: structuredClone(v) };
      },
      { _sheetId: sheet.id },
    );
  }

  /** Excel names a copy "Name (2)". */
  private copyName(name: string): string {
    for (let i = 2; ; i++) if (!this.x.sheetByName(`${name} (${i})`)) return `${name} (${i})`;
  }

  private rangeProxy(sheet: FakeSheet, address: string): OfficeMockObject {
    const rowOrColumn = /^(\d+):(\d+)$|^([A-Z]+):([A-Z]+)$/.exec(address);
    const block = rowOrColumn ? { values: [], valueTypes: [], formulas: [], rowCount: 0, columnCount: 0 } : this.x.block(sheet, address);
    const range = rowOrColumn ? null : parseRange(address);
    const fullAddress = `${quoteSheet(sheet.name)}!${address.replace(/\$/g, "")}`;
    const seed = {
      address: fullAddress,
      ...block,
      numberFormat: [] as unknown[],
      format: {
        columnWidth: 0,
        rowHeight: 0,
        wrapText: false,
        verticalAlignment: "",
        fill: {
          color: "",
          // RangeFill.clear: the fill goes (ExcelApi 1.1)
          clear: () => {
            if (!range) return;
            for (let i = 0; i < range.rows; i++)
              for (let j = 0; j < range.cols; j++) {
                const c = sheet.cells.get(cellAddress({ row: range.start.row + i, col: range.start.col + j }));
                if (c?.style) delete c.style["fill/color"];
              }
          },
        },
        font: { color: "", bold: false, italic: false, size: 11 },
      },
      merge: () => {
        if (!range) throw new Error("the fake merges blocks only");
        sheet.merges.push(address.replace(/\$/g, ""));
      },
      copyFrom: (src: { _ref?: NameTarget }, type: string) => {
        if (type !== "Values" || !src._ref || !range) throw new Error("the fake copies values between blocks only");
        const from = this.x.sheetById(src._ref.sheetId);
        const s = parseRange(src._ref.address);
        for (let i = 0; i < s.rows; i++)
          for (let j = 0; j < s.cols; j++) {
            const c = from.cells.get(cellAddress({ row: s.start.row + i, col: s.start.col + j }));
            const to = cellAddress({ row: range.start.row + i, col: range.start.col + j });
            if (!c) sheet.cells.delete(to);
            else sheet.cells.set(to, { ...structuredClone(c), formula: undefined });
          }
      },
      // the cells the block's formulas read: references to cells and blocks, and workbook names (ExcelApi 1.12)
      getDirectPrecedents: () => {
        if (!range) throw new Error("the fake finds precedents of blocks only");
        const found: string[] = [];
        for (let i = 0; i < range.rows; i++)
          for (let j = 0; j < range.cols; j++) {
            const formula = sheet.cells.get(cellAddress({ row: range.start.row + i, col: range.start.col + j }))?.formula;
            if (formula) found.push(...this.x.references(formula, sheet));
          }
        if (found.length === 0) {
          this.failing = new Error("ItemNotFound: no precedents were found");
        }
        return this.proxy({ addresses: [...new Set(found)] });
      },
      // the fake holds no spill: every cell's spill parent is a null object
      getSpillParentOrNullObject: () => this.proxy({ address: "" }, undefined, { isNullObject: true }),
      // each cell's fill and font as the port wrote them (ExcelApi 1.9)
      getCellProperties: () => ({
        value: Array.from({ length: range?.rows ?? 0 }, (_, i) =>
          Array.from({ length: range?.cols ?? 0 }, (_, j) => {
            const style = sheet.cells.get(cellAddress({ row: range!.start.row + i, col: range!.start.col + j }))?.style ?? {};
            return {
              format: {
                fill: { color: (style["fill/color"] as string | undefined) ?? "#FFFFFF" },
                font: { color: (style["font/color"] as string | undefined) ?? "#000000", italic: Boolean(style["font/italic"]) },
              },
            };
          }),
        ),
      }),
      getResizedRange: (rows: number, cols: number) => {
        if (!range) throw new Error("the fake resizes blocks only");
        const end = cellAddress({ row: range.start.row + range.rows - 1 + rows, col: range.start.col + range.cols - 1 + cols });
        return this.rangeProxy(sheet, `${cellAddress(range.start)}:${end}`);
      },
      insert: (shift: string) => {
        const m = /^(\d+):(\d+)$/.exec(address);
        if (!m || shift !== "Down") throw new Error("the fake inserts whole rows only");
        const first = Number(m[1]) - 1;
        const n = Number(m[2]) - first;
        const moved = new Map<string, FakeCell>();
        for (const [a, c] of sheet.cells) {
          const p = parseCell(a);
          moved.set(cellAddress(p.row >= first ? { row: p.row + n, col: p.col } : p), c);
        }
        sheet.cells = moved;
        const down = (row: number) => (row - 1 >= first ? row + n : row);
        sheet.rowHeights = new Map([...sheet.rowHeights].map(([row, h]) => [down(row), h]));
        sheet.merges = sheet.merges.map((m) => {
          const b = parseRange(m);
          const top = { row: down(b.start.row + 1) - 1, col: b.start.col };
          return `${cellAddress(top)}:${cellAddress({ row: top.row + b.rows - 1, col: b.start.col + b.cols - 1 })}`;
        });
        return this.rangeProxy(sheet, address);
      },
    };
    const mock = this.proxy(
      seed,
      (path, v) => this.writeRange(sheet, address, path, v),
      { _ref: { sheetId: sheet.id, address: address.replace(/\$/g, "") } },
    );
    // the range's worksheet: made when first asked for (a plain property, so that sync leaves it alone)
    let ws: OfficeMockObject | undefined;
    Object.defineProperty(mock, "worksheet", { get: () => (ws ??= this.sheetProxy(sheet)) });
    return mock;
  }

  private writeRange(sheet: FakeSheet, address: string, path: string, v: unknown): void {
    if (path === "format/columnWidth") {
      const m = /^([A-Z]+):([A-Z]+)$/.exec(address);
      if (m) sheet.columnWidths.set(m[1], Number(v));
      return;
    }
    if (path === "format/rowHeight") {
      // the height of every row the range touches
      const r = parseRange(address);
      for (let i = 0; i < r.rows; i++) sheet.rowHeights.set(r.start.row + 1 + i, Number(v));
      return;
    }
    const r = parseRange(address);
    const each = (f: (cell: FakeCell, i: number, j: number) => void) => {
      for (let i = 0; i < r.rows; i++)
        for (let j = 0; j < r.cols; j++) {
          const a = cellAddress({ row: r.start.row + i, col: r.start.col + j });
          const cell = sheet.cells.get(a) ?? { value: "" };
          f(cell, i, j);
          sheet.cells.set(a, cell);
        }
    };
    const grid = v as unknown[][];
    if (path === "values") {
      each((c, i, j) => {
        const x = grid[i][j];
        if (x === null) return;
        c.value = typeof x === "string" && x.startsWith("'") ? x.slice(1) : (x as number | string);
        c.formula = undefined;
        c.error = false;
      });
    } else if (path === "formulas") {
      each((c, i, j) => {
        const x = grid[i][j];
        if (typeof x === "string" && x.startsWith("=")) {
          c.formula = x;
          c.value = "#BUSY!";
          c.error = true;
        } else if (x !== null) {
          c.value = x as number | string;
          c.formula = undefined;
        }
      });
    } else if (path === "numberFormat") {
      each((c, i, j) => (c.numberFormat = String(grid[i][j])));
    } else if (path.startsWith("format/")) {
      each((c) => (c.style = { ...c.style, [path.slice("format/".length)]: v }));
    }
  }

  private chartProxy(sheet: FakeSheet, chart: FakeChart): OfficeMockObject {
    const seriesProxy = (s: FakeChart["series"][number]) =>
      this.proxy(
        {
          name: s.name,
          chartType: "",
          markerStyle: "",
          markerSize: 0,
          markerBackgroundColor: "",
          markerForegroundColor: "",
          format: { line: { color: "" } },
          setXAxisValues: (r: { _ref: NameTarget }) => (s.x = r._ref.address),
          setValues: (r: { _ref: NameTarget }) => (s.y = r._ref.address),
        },
        (path, v) => (path === "name" ? (s.name = String(v)) : (s.props[path] = v)),
      );
    return this.proxy(
      {
        name: chart.props.name ?? "",
        title: { text: "" },
        legend: { position: "" },
        delete: () => void sheet.charts.splice(sheet.charts.indexOf(chart), 1),
        axes: { categoryAxis: { minimum: 0, title: { text: "" } }, valueAxis: { minimum: 0, title: { text: "" } } },
        setPosition: (a: string, b: string) => (chart.position = [a, b]),
        series: {
          getItemAt: (i: number) => seriesProxy(chart.series[i]),
          add: (name: string) => {
            const s = { name, props: {} };
            chart.series.push(s);
            return seriesProxy(s);
          },
        },
      },
      (path, v) => (chart.props[path] = v),
    );
  }

  /** Apply the property writes queued since the last sync. */
  private commit(): void {
    for (const p of this.proxies) {
      for (const [path, v] of leaves(p.mock)) {
        if (v === p.baseline.get(path)) continue;
        if (typeof v === "string" && NOT_READ.test(v)) continue;
        p.onWrite(path, v);
        p.baseline.set(path, v);
      }
    }
  }

  private rebaseline(): void {
    for (const p of this.proxies) for (const [path, v] of leaves(p.mock)) p.baseline.set(path, v);
  }
}
