/**
 * The contract every Workbook port host passes: the Excel side (excel.test.ts, over office-addin-mock) and the
 * preview host (over its formula engine) both call `portContract` with a harness that drives their workbook.
 *
 * The harness does what a user would do in the workbook (type into a named cell, delete a name) and lets the test
 * look at the workbook afterwards; the port under test is only used through its interface.
 */
import { describe, expect, it } from "vitest";
import { CANDIDATES_NAME, INPUT_NAMES, type InputName, REQUIRED_NAMES, SHARE_STAMP, type WorkbookPort, isoDate } from "../../src/workbook/port";
import { demoScenario } from "../../src/workbook/scenario";
import { estimateTemplate } from "../../src/workbook/template";

export interface PortHarness {
  port: WorkbookPort;
  /**
   * Put `content` into the cell `name` refers to, as a user typing it would (null clears the cell), defining the
   * name on a cell of the harness's own input sheet first if the workbook does not define it. Fires the host's
   * change events.
   */
  put(name: InputName, content: number | string | null): Promise<void>;
  /**
   * Put a formula into the cell `name` refers to (defining the name as `put` does). `value` is what the formula
   * evaluates to: hosts that calculate ignore it, hosts that cannot (a mock) show it.
   */
  putFormula(name: InputName, formula: string, value: number): Promise<void>;
  /** Make the cell `name` refers to show an error (whichever error the host can produce). */
  putError(name: InputName): Promise<void>;
  /**
   * Define `name` on a block of cells of the harness's own input sheet, as many rows and columns as `rows`, holding
   * them (null: an empty cell), as a user typing them would.
   */
  putTable(name: string, rows: Array<Array<number | string | null>>): Promise<void>;
  /**
   * Put `content` into the cell `cell` ("J1") of the harness's own input sheet, with the look of an input cell (the
   * input role's fill); returns the cell's address as readings give it ("Inputs!J1").
   */
  putInput(cell: string, content: number | string): Promise<string>;
  /**
   * Put `content` (a constant, or a formula with `value` for hosts that cannot calculate) into the cell `cell` of the
   * harness's own input sheet, with no look of its own.
   */
  putCell(cell: string, content: number | string, value?: number): Promise<void>;
  /** Delete the workbook's definition of `name`. */
  remove(name: InputName): Promise<void>;
  /** Wait until change notifications caused by earlier calls have been delivered. */
  settle(): Promise<void>;
  /** Names of the worksheets, in order. */
  sheetNames(): Promise<string[]>;
  /** Every non-empty cell of a sheet: address ("B10") → { value shown, formula if any }. */
  cells(sheet: string): Promise<Record<string, { value: unknown; formula?: string }>>;
  /** The sheet and cell a workbook name refers to, or null when it is not defined. */
  nameTarget(name: string): Promise<{ sheet: string; address: string } | null>;
  dispose?(): Promise<void>;
}

const REQUIRED_VALUES: Record<string, number> = {
  Supply_Static: 72,
  Supply_Residual: 58,
  Supply_TestFlow: 1100,
  Demand_Flow: 562,
  Demand_Pressure: 48,
};

async function fillRequired(h: PortHarness): Promise<void> {
  for (const name of REQUIRED_NAMES) await h.put(name, REQUIRED_VALUES[name]);
  await h.put("Units", "US");
}

export function portContract(host: string, makeHarness: () => Promise<PortHarness>): void {
  const withHarness = (body: (h: PortHarness) => Promise<void>) => async () => {
    const h = await makeHarness();
    try {
      await body(h);
    } finally {
      await h.dispose?.();
    }
  };

  describe(`Workbook port contract: ${host}`, () => {
    it(
      "reads every input name, numbers as numbers and Units as text",
      withHarness(async (h) => {
        await fillRequired(h);
        const r = await h.port.readInputs();
        expect(Object.keys(r).sort()).toEqual([...INPUT_NAMES, CANDIDATES_NAME].sort());
        expect(r[CANDIDATES_NAME]).toEqual({ kind: "missing" });
        for (const name of REQUIRED_NAMES) {
          expect(r[name]).toMatchObject({ kind: "number", value: REQUIRED_VALUES[name] });
        }
        expect(r.Units).toMatchObject({ kind: "text", value: "US" });
      }),
    );

    it(
      "says which names the workbook does not define",
      withHarness(async (h) => {
        await fillRequired(h);
        await h.remove("Demand_Pressure");
        const r = await h.port.readInputs();
        expect(r.Demand_Pressure).toEqual({ kind: "missing" });
        expect(r.Pump_RatedFlow).toEqual({ kind: "missing" });
        expect(r.Supply_Static.kind).toBe("number");
      }),
    );

    it(
      "tells an empty cell, text and an error apart, with the cell's address",
      withHarness(async (h) => {
        await fillRequired(h);
        await h.put("Supply_Static", "seventy");
        await h.put("Supply_Residual", null);
        await h.putError("Supply_TestFlow");
        const r = await h.port.readInputs();
        expect(r.Supply_Static).toMatchObject({ kind: "text", value: "seventy" });
        expect(r.Supply_Residual.kind).toBe("empty");
        expect(r.Supply_TestFlow.kind).toBe("error");
        if (r.Supply_TestFlow.kind === "error") expect(r.Supply_TestFlow.code).toMatch(/^#[A-Z0-9/]+[!?]?$/);
        const target = await h.nameTarget("Supply_Static");
        expect(target).not.toBeNull();
        if (r.Supply_Static.kind === "text") expect(r.Supply_Static.address).toMatch(new RegExp(`${target!.address}$`));
      }),
    );

    it(
      "reads the candidates table row by row, each cell as a one-cell name is, with its own address",
      withHarness(async (h) => {
        await fillRequired(h);
        await h.putTable(CANDIDATES_NAME, [
          ["Warehouse", 1450, 61.5, null],
          ["Office", "abc", null, 400],
        ]);
        const t = (await h.port.readInputs())[CANDIDATES_NAME];
        expect(t?.kind).toBe("table");
        if (t?.kind !== "table") return;
        expect(t.rows).toHaveLength(2);
        expect(t.rows[0].map((c) => c.kind)).toEqual(["text", "number", "number", "empty"]);
        expect(t.rows[0][0]).toMatchObject({ value: "Warehouse" });
        expect(t.rows[0][2]).toMatchObject({ value: 61.5 });
        expect(t.rows[1][1]).toMatchObject({ kind: "text", value: "abc" });
        expect(t.rows[1][3]).toMatchObject({ kind: "number", value: 400 });
        // each cell's address: the block's top-left cell and the one below and right of it
        const first = t.rows[0][0].kind === "text" ? t.rows[0][0].address! : "";
        const last = t.rows[1][3].kind === "number" ? t.rows[1][3].address! : "";
        const [sheet, a] = first.split("!");
        expect(last.split("!")[0]).toBe(sheet);
        const cell = (x: string) => /^([A-Z]+)(\d+)$/.exec(x.replace(/\$/g, ""))!;
        const [, c0, r0] = cell(a);
        const [, c1, r1] = cell(last.split("!")[1]);
        expect(Number(r1) - Number(r0)).toBe(1);
        expect(c1.charCodeAt(0) - c0.charCodeAt(0)).toBe(3);
      }),
    );

    it(
      "says a candidates table that is not four columns wide is not one",
      withHarness(async (h) => {
        await fillRequired(h);
        await h.putTable(CANDIDATES_NAME, [["Warehouse", 1450, 61.5]]);
        const t = (await h.port.readInputs())[CANDIDATES_NAME];
        expect(t).toMatchObject({ kind: "invalid" });
        if (t?.kind === "invalid") expect(t.reason).toMatch(/3 columns wide; it must be 4 columns wide: name, demand flow, pressure at the supply, flow through a pump/);
      }),
    );

    it(
      "reads the value a formula gives, not the formula",
      withHarness(async (h) => {
        await fillRequired(h);
        await h.putFormula("Supply_Residual", "=50+8", 58);
        const r = await h.port.readInputs();
        expect(r.Supply_Residual).toMatchObject({ kind: "number", value: 58 });
      }),
    );

    it(
      "calls the subscriber after a change, and stops after unsubscribing",
      withHarness(async (h) => {
        await fillRequired(h);
        let calls = 0;
        const unsubscribe = await h.port.subscribe(() => calls++);
        await h.put("Demand_Flow", 600);
        await h.settle();
        expect(calls).toBeGreaterThanOrEqual(1);
        expect((await h.port.readInputs()).Demand_Flow).toMatchObject({ kind: "number", value: 600 });
        await unsubscribe();
        const before = calls;
        await h.put("Demand_Flow", 650);
        await h.settle();
        expect(calls).toBe(before);
      }),
    );

    it(
      "inserts an estimate sheet whose named cells the port then reads",
      withHarness(async (h) => {
        const sheetsBefore = await h.sheetNames();
        const result = await h.port.insertEstimateSheet("US");
        const sheetsAfter = await h.sheetNames();
        expect(sheetsAfter).toContain(result.sheetName);
        expect(sheetsBefore).not.toContain(result.sheetName);
        const template = estimateTemplate(demoScenario("US"));
        for (const n of template.names) {
          expect(await h.nameTarget(n.name)).toEqual({ sheet: result.sheetName, address: n.address });
        }
        const r = await h.port.readInputs();
        const demo = demoScenario("US");
        expect(r.Units).toMatchObject({ kind: "text", value: "US" });
        // inputs the sheet holds as typed (the supply names are calculated: a mock that cannot calculate shows #BUSY!)
        expect(r.Suction_Minimum).toMatchObject({ kind: "number", value: demo.suctionMinimum });
        expect(r.Required_Margin).toMatchObject({ kind: "number", value: demo.requiredMargin });
        for (const name of REQUIRED_NAMES) expect(r[name].kind).not.toBe("missing");
      }),
    );

    it(
      "a second estimate sheet gets its own name and takes the named cells over",
      withHarness(async (h) => {
        const first = await h.port.insertEstimateSheet("US");
        const second = await h.port.insertEstimateSheet("SI");
        expect(second.sheetName).not.toBe(first.sheetName);
        expect(second.namesMoved).toContain("Supply_Static");
        expect((await h.nameTarget("Supply_Static"))?.sheet).toBe(second.sheetName);
        const r = await h.port.readInputs();
        expect(r.Units).toMatchObject({ kind: "text", value: "SI" });
        expect(r.Required_Margin).toMatchObject({ kind: "number", value: demoScenario("SI").requiredMargin });
      }),
    );

    it(
      "finds the input cells a named formula is calculated from, nearest first, through other formulas, and only inputs",
      withHarness(async (h) => {
        await fillRequired(h);
        const text = await h.putInput("J1", "1250 gpm");
        const number = await h.putInput("J2", 14);
        await h.putCell("J3", "=J1*2", 0); // a formula between the name and an input
        await h.putCell("J4", 3); // a constant, not an input
        await h.putFormula("Supply_TestFlow", "=J3+J2+J4", 0);
        const at = (await h.port.readInputs()).Supply_TestFlow;
        const address = "address" in at ? at.address! : "";
        expect(address).not.toBe("");
        const behind = await h.port.inputsBehind([address]);
        expect(Object.keys(behind)).toEqual([address]);
        // J2 is read by the name's formula itself, J1 through J3's
        expect(behind[address].map((s) => s.address)).toEqual([number, text]);
        expect(behind[address][1].reading).toMatchObject({ kind: "text", value: "1250 gpm" });
        expect(behind[address][0].reading).toMatchObject({ kind: "number", value: 14 });
      }),
    );

    it(
      "finds no input behind a cell without a formula",
      withHarness(async (h) => {
        await fillRequired(h);
        const at = (await h.port.readInputs()).Supply_Static;
        const address = "address" in at ? at.address! : "";
        expect(await h.port.inputsBehind([address])).toEqual({ [address]: [] });
        expect(await h.port.inputsBehind([])).toEqual({});
      }),
    );

    it(
      "makes a share copy holding values only, stamped, and leaves the source untouched",
      withHarness(async (h) => {
        await fillRequired(h);
        await h.putFormula("Supply_Residual", "=50+8", 58);
        const source = (await h.nameTarget("Supply_Static"))!.sheet;
        const before = await h.cells(source);
        const result = await h.port.makeShareCopy();
        expect(result).toMatchObject({ ok: true, sourceSheet: source });
        if (!result.ok) return;
        expect(await h.sheetNames()).toContain(result.sheetName);
        expect(await h.cells(source)).toEqual(before);
        const copy = await h.cells(result.sheetName);
        const formulas = Object.entries(copy).filter(([, c]) => c.formula);
        expect(formulas).toEqual([]);
        const shown = Object.values(copy).map((c) => c.value);
        expect(shown).toContain(58);
        expect(shown).toContain(72);
        const stamp = shown.find((v) => typeof v === "string" && v.includes(SHARE_STAMP));
        expect(stamp).toContain(isoDate(new Date()));
      }),
    );

    it(
      "refuses a share copy while a cell shows an error, naming the cell, and adds no sheet",
      withHarness(async (h) => {
        await fillRequired(h);
        await h.putError("Demand_Flow");
        const sheetsBefore = await h.sheetNames();
        const target = (await h.nameTarget("Demand_Flow"))!;
        const before = await h.cells(target.sheet);
        const result = await h.port.makeShareCopy();
        expect(result.ok).toBe(false);
        if (!result.ok) {
          expect(result.reason).toContain(target.address);
          expect(result.reason).toMatch(/#[A-Z0-9/]+[!?]?/);
        }
        expect(await h.sheetNames()).toEqual(sheetsBefore);
        expect(await h.cells(target.sheet)).toEqual(before);
      }),
    );
  });
}
