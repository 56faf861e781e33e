/**
 * A Workbook port over a plain map of readings, for the pane's tests: `set` changes a reading and notifies the
 * subscribers as a workbook change would.
 */
import {
  CANDIDATES_NAME,
  INPUT_NAMES,
  type InputName,
  type InsertResult,
  type Reading,
  type Readings,
  type ShareCopyResult,
  type SharePlot,
  type SourceInput,
  type TableReading,
  type WorkbookPort,
} from "../../src/workbook/port";
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
  host: "excel" | "preview" = "excel";
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

  /**
   * Give the workbook a table of candidates at Estimate!A60 (one row each: name, demand flow, pressure at the supply,
   * flow through a pump; null an empty cell; a Reading as it is), or take it away (null), and notify.
   */
  setTable(rows: Array<Array<number | string | null | Reading>> | null): void {
    this.readings[CANDIDATES_NAME] = rows === null ? { kind: "missing" } : candidatesTable(rows);
    for (const l of this.listeners) l();
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

  /** the input cells behind each cell, as a test sets them */
  behind: Record<string, SourceInput[]> = {};
  /** the addresses the pane asked about, each time */
  askedBehind: string[][] = [];

  async inputsBehind(addresses: readonly string[]): Promise<Record<string, SourceInput[]>> {
    this.askedBehind.push([...addresses]);
    return Object.fromEntries(addresses.map((a) => [a, structuredClone(this.behind[a] ?? [])]));
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

  /** the plot the pane handed over with each share copy asked for */
  sharedPlots: Array<SharePlot | undefined> = [];

  async makeShareCopy(plot?: SharePlot): Promise<ShareCopyResult> {
    this.sharedPlots.push(plot);
    return this.shareResult;
  }
}

/** A table of candidates at Estimate!A60:D(59 + rows), as a host reads it. */
export function candidatesTable(rows: Array<Array<number | string | null | Reading>>): TableReading {
  return {
    kind: "table",
    address: `Estimate!A60:D${59 + rows.length}`,
    rows: rows.map((row, i) =>
      row.map((v, j): Reading => {
        const address = `Estimate!${"ABCD"[j]}${60 + i}`;
        if (v === null) return { kind: "empty", address };
        if (typeof v === "number") return { kind: "number", value: v, address };
        if (typeof v === "string") return { kind: "text", value: v, address };
        return v;
      }),
    ),
  };
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

/**
 * A pump-needed estimate with its pressure breakdown, in SI: the US case (end sprinkler 15, design area 12.4, run
 * friction 61.4, elevation 13.0, devices 3.2 psi, the cross main to the riser losing 42.6 psi at 22.6 ft/s) with
 * each pressure × 0.0689476 bar/psi (mathjs: psi to bar), flows × 3.785411784 L/min per gpm, the velocity × 0.3048
 * m/ft. Invented demo numbers.
 */
export function siBreakdown(): Values {
  const bar = (psi: number) => Number((psi * 0.0689475729316836).toFixed(4));
  const parts = [15, 12.4, 61.4, 13.0, 3.2].map(bar);
  return {
    Units: "SI",
    Supply_Static: bar(72),
    Supply_Residual: bar(58),
    Supply_TestFlow: 1100 * 3.785411784,
    Demand_Flow: 562 * 3.785411784,
    Demand_Pressure: parts.reduce((a, b) => a + b, 0),
    Pressure_EndSprinkler: parts[0],
    Pressure_AreaFriction: parts[1],
    Pressure_RunFriction: parts[2],
    Pressure_Elevation: parts[3],
    Pressure_Devices: parts[4],
    Run_WorstSegment: "Cross main to the riser",
    Run_WorstLoss: bar(42.6),
    Run_WorstVelocity: 22.6 * 0.3048,
  };
}

/**
 * A pump-needed case: 105 psi wanted where BASE's supply gives 67.958 psi at 562 gpm [NFPA 291]. Parts:
 * 15 + 12.4 + 61.4 + 13.0 + 3.2 = 105.0 psi; of the run's 61.4 psi, 42.6 psi lost in one 2½ in segment at 22.6 ft/s.
 */
export const SHORT_105: Values = {
  ...BASE,
  Demand_Pressure: 105,
  Pressure_EndSprinkler: 15,
  Pressure_AreaFriction: 12.4,
  Pressure_RunFriction: 61.4,
  Pressure_Elevation: 13.0,
  Pressure_Devices: 3.2,
  Run_WorstSegment: "Cross main to the riser",
  Run_WorstLoss: 42.6,
  Run_WorstVelocity: 22.6,
};
