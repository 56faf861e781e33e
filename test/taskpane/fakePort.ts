/**
 * A Workbook port over a plain map of readings, for the pane's tests: `set` changes a reading and notifies the
 * subscribers as a workbook change would.
 */
import { INPUT_NAMES, type InputName, type InsertResult, type Reading, type Readings, type ShareCopyResult, type WorkbookPort } from "../../src/workbook/port";
import type { UnitSystem } from "../../src/engine/units";

export type Values = Partial<Record<InputName, number | string | Reading | null>>;

function toReading(name: InputName, v: number | string | Reading | null | undefined): Reading {
  const address = `Estimate!B${INPUT_NAMES.indexOf(name) + 2}`;
  if (v === undefined) return { kind: "missing" };
  if (v === null) return { kind: "empty", address };
  if (typeof v === "number") return { kind: "number", value: v, address };
  if (typeof v === "string") return { kind: "text", value: v, address };
  return v;
}

export class FakePort implements WorkbookPort {
  readings: Readings;
  listeners = new Set<() => void>();
  reads = 0;
  inserted: UnitSystem[] = [];
  shareResult: ShareCopyResult = { ok: true, sheetName: "Estimate values 2026-05-04", sourceSheet: "Estimate" };

  constructor(values: Values) {
    this.readings = {} as Readings;
    this.setAll(values);
  }

  setAll(values: Values): void {
    for (const n of INPUT_NAMES) this.readings[n] = toReading(n, values[n]);
  }

  /** Change readings and notify, as a recalculation would. */
  set(values: Values): void {
    for (const [n, v] of Object.entries(values)) this.readings[n as InputName] = toReading(n as InputName, v);
    for (const l of this.listeners) l();
  }

  async readInputs(): Promise<Readings> {
    this.reads++;
    await Promise.resolve();
    return structuredClone(this.readings);
  }

  async subscribe(onChange: () => void): Promise<() => Promise<void>> {
    this.listeners.add(onChange);
    return async () => {
      this.listeners.delete(onChange);
    };
  }

  async insertEstimateSheet(units: UnitSystem): Promise<InsertResult> {
    this.inserted.push(units);
    return { sheetName: `Estimate ${this.inserted.length + 1}`, namesMoved: ["Supply_Static"] };
  }

  async makeShareCopy(): Promise<ShareCopyResult> {
    return this.shareResult;
  }
}

/**
 * The inputs of the engine's decision tests: static 72 psi, residual 58 psi at 1100 gpm; demand 562 gpm at 48 psi.
 * Supply at 562 gpm [NFPA 291]: 72 − 14 × (562/1100)^1.85 = 72 − 14 × 0.28870 = 67.958 psi.
 */
export const BASE: Values = {
  Units: "US",
  Supply_Static: 72,
  Supply_Residual: 58,
  Supply_TestFlow: 1100,
  Demand_Flow: 562,
  Demand_Pressure: 48,
};
