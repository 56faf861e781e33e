/**
 * Where the pressure goes: the breakdown of the demand pressure the estimate sheet names (end sprinkler, friction in
 * the design area, friction in the pipe run, elevation, devices) and the run segment that loses the most. Every name
 * of it is optional; a sheet whose parts do not add up to Demand_Pressure is a problem, never a picture.
 *
 * The parts below are invented, and chosen to add up to the demand pressure of each case (the sums are written out).
 */
import { describe, expect, it } from "vitest";
import { type Estimate, type PaneModel, buildModel } from "../../src/taskpane/model";
import { BASE, FakePort, SHORT_105, type Values, siBreakdown } from "./fakePort";

function model(v: Values): PaneModel {
  return buildModel(new FakePort(v).readings);
}

function ready(v: Values): Estimate {
  const m = model(v);
  if (m.kind !== "ready") throw new Error(`expected an estimate, got ${JSON.stringify(m)}`);
  return m.estimate;
}

function problems(v: Values): string[] {
  const m = model(v);
  if (m.kind !== "problems") throw new Error(`expected problems, got ${m.kind}`);
  return m.problems.map((p) => p.message);
}

/** psi per bar and ft/s per m/s, from the exact definitions: 1 psi = 0.0689475729316836 bar, 1 ft = 0.3048 m. */
const BAR = 0.0689475729316836;
const M_PER_FT = 0.3048;

/**
 * An SI sheet's breakdown, invented: 1.03 + 0.59 + 1.19 + 0.30 + 0.19 = 3.30 bar against static 4.96, residual 4.0 bar
 * at 4164 L/min, the feed main losing 0.84 bar at `velocity` m/s.
 */
function smallSI(velocity: number): Values {
  return {
    Units: "SI",
    Supply_Static: 4.96,
    Supply_Residual: 4.0,
    Supply_TestFlow: 4164,
    Demand_Flow: 2127,
    Demand_Pressure: 3.3,
    Pressure_EndSprinkler: 1.03,
    Pressure_AreaFriction: 0.59,
    Pressure_RunFriction: 1.19,
    Pressure_Elevation: 0.3,
    Pressure_Devices: 0.19,
    Run_WorstSegment: "Feed main",
    Run_WorstLoss: 0.84,
    Run_WorstVelocity: velocity,
  };
}

/** Parts of BASE's 48 psi: 15 + 8.5 + 17.3 + 4.33 + 2.87 = 48.00 psi (elevation: 10 ft × 0.433 psi/ft [NFPA 13]). */
const PARTS_48: Values = {
  Pressure_EndSprinkler: 15,
  Pressure_AreaFriction: 8.5,
  Pressure_RunFriction: 17.3,
  Pressure_Elevation: 4.33,
  Pressure_Devices: 2.87,
};

/** The worst segment of a run: 9.1 psi lost at 14.2 ft/s, under the 20 ft/s limit (common practice). */
const WORST_SLOW: Values = { Run_WorstSegment: "Cross main to the riser", Run_WorstLoss: 9.1, Run_WorstVelocity: 14.2 };


describe("pane model: the breakdown of the demand pressure", () => {
  it("gives the five parts in order, with plain labels, where all five are named", () => {
    const b = ready({ ...BASE, ...PARTS_48 }).breakdown!;
    expect(b.parts.map((p) => [p.id, p.label, p.pressure])).toEqual([
      ["end-sprinkler", "End sprinkler", 15],
      ["area-friction", "Friction in the design area", 8.5],
      ["run-friction", "Friction in the pipe run", 17.3],
      ["elevation", "Elevation", 4.33],
      ["devices", "Devices (backflow preventer, meter)", 2.87],
    ]);
    expect(b.parts.map((p) => p.name)).toEqual(["Pressure_EndSprinkler", "Pressure_AreaFriction", "Pressure_RunFriction", "Pressure_Elevation", "Pressure_Devices"]);
    expect(b.worst).toBeNull();
  });

  it("has no breakdown, and nothing wrong, where the sheet names none or only some of the parts", () => {
    const none = ready(BASE);
    expect(none.breakdown).toBeNull();
    expect(none.breakdownMissing).toEqual(["Pressure_EndSprinkler", "Pressure_AreaFriction", "Pressure_RunFriction", "Pressure_Elevation", "Pressure_Devices"]);
    const some = ready({ ...BASE, ...PARTS_48, Pressure_Devices: undefined, Pressure_Elevation: null, ...WORST_SLOW });
    expect(some.breakdown).toBeNull();
    expect(some.breakdownMissing).toEqual(["Pressure_Elevation", "Pressure_Devices"]);
    expect(ready({ ...BASE, ...PARTS_48 }).breakdownMissing).toEqual([]);
    // the verdict is the same with or without the breakdown
    expect(ready({ ...BASE, ...PARTS_48 }).verdict).toBe(none.verdict);
  });

  it("takes a negative elevation pressure: the supply above the sprinklers", () => {
    // 15 + 8.5 + 25.8 + (−4.33) + 3.03 = 48.00 psi; −10 ft × 0.433 psi/ft [NFPA 13]
    const b = ready({ ...BASE, ...PARTS_48, Pressure_RunFriction: 25.8, Pressure_Elevation: -4.33, Pressure_Devices: 3.03 }).breakdown!;
    expect(b.parts[3]).toMatchObject({ id: "elevation", pressure: -4.33 });
  });

  it("reads a part holding text, or showing an error, as the cell says, and draws no verdict", () => {
    expect(problems({ ...BASE, ...PARTS_48, Pressure_RunFriction: "n/a" })).toEqual([
      'Pressure_RunFriction (Estimate!B16): Pressure_RunFriction: got "n/a"; must be a number',
    ]);
    expect(problems({ ...BASE, ...PARTS_48, Pressure_Devices: { kind: "error", code: "#VALUE!", address: "Estimate!B40" } })).toEqual([
      "Pressure_Devices (Estimate!B40) shows #VALUE!: fix the cells it is calculated from (Excel shows the message when you point at the cell).",
    ]);
    expect(problems({ ...BASE, ...PARTS_48, Run_WorstSegment: { kind: "error", code: "#N/A", address: "Estimate!C41" } })).toEqual([
      "Run_WorstSegment (Estimate!C41) shows #N/A: fix the cells it is calculated from (Excel shows the message when you point at the cell).",
    ]);
  });

  it("refuses a negative friction, and a friction beyond the plausibility bound, with the cell's message", () => {
    expect(problems({ ...BASE, ...PARTS_48, Pressure_AreaFriction: -8.5 })).toEqual([
      "Pressure_AreaFriction (Estimate!B15): Pressure_AreaFriction: got -8.5 psi; must be from 0 to 1000 psi",
    ]);
    // 1,000 psi is the bound of every pressure (common practice)
    expect(problems({ ...BASE, ...PARTS_48, Pressure_Elevation: -1500 })[0]).toMatch(/^Pressure_Elevation \(Estimate!B17\): Pressure_Elevation: got -1500 psi; must be from -1000 psi to 1000 psi$/);
  });

  it("waits on a part still being calculated", () => {
    expect(model({ ...BASE, ...PARTS_48, Pressure_RunFriction: { kind: "error", code: "#BUSY!" } })).toEqual({ kind: "busy", names: ["Pressure_RunFriction"] });
  });

  it("refuses parts that do not add up to Demand_Pressure: the sheet is inconsistent", () => {
    // 15 + 8.5 + 14.3 + 4.33 + 2.87 = 45.00 psi, not 48
    const msgs = problems({ ...BASE, ...PARTS_48, Pressure_RunFriction: 14.3 });
    expect(msgs).toEqual([
      "Pressure_EndSprinkler, Pressure_AreaFriction, Pressure_RunFriction, Pressure_Elevation and Pressure_Devices add up to 45 psi, " +
        "not the 48 psi of Demand_Pressure (Estimate!B7): the estimate sheet is inconsistent. Recalculate it, or point these names at the parts of that demand pressure.",
    ]);
  });

  it("allows 0.5 % of the demand pressure, and at least 0.05 psi, for rounding in the sheet", () => {
    // 48 × 0.005 = 0.24 psi: 48.2 passes, 48.3 does not
    expect(ready({ ...BASE, ...PARTS_48, Pressure_Devices: 2.87 + 0.2 }).breakdown).not.toBeNull();
    expect(problems({ ...BASE, ...PARTS_48, Pressure_Devices: 2.87 + 0.3 })).toHaveLength(1);
    // 8 psi × 0.005 = 0.04 psi, under the 0.05 psi floor: 8.045 passes, 8.06 does not
    const eight: Values = { ...BASE, Demand_Pressure: 8, Pressure_EndSprinkler: 7, Pressure_AreaFriction: 0.5, Pressure_RunFriction: 0.3, Pressure_Elevation: 0, Pressure_Devices: 0.2 };
    expect(ready(eight).breakdown).not.toBeNull();
    expect(ready({ ...eight, Pressure_Devices: 0.245 }).breakdown).not.toBeNull();
    expect(problems({ ...eight, Pressure_Devices: 0.26 })).toHaveLength(1);
  });

  it("refuses a worst segment that loses more than the whole run", () => {
    expect(problems({ ...BASE, ...PARTS_48, ...WORST_SLOW, Run_WorstLoss: 20 })).toEqual([
      "Run_WorstLoss (Estimate!B20) is 20 psi, more than the 17.3 psi of Pressure_RunFriction, the friction of the whole run: the estimate sheet is inconsistent.",
    ]);
  });

  it("converts an SI sheet's parts to psi and its velocity to ft/s", () => {
    // 1.03 + 0.59 + 1.19 + 0.30 + 0.19 = 3.30 bar
    const e = ready(smallSI(5.8));
    const b = e.breakdown!;
    // 1.03 bar / 0.0689476 = 14.939 psi ... 0.19 bar = 2.756 psi
    expect(b.parts.map((p) => p.pressure)).toEqual([1.03, 0.59, 1.19, 0.3, 0.19].map((bar) => expect.closeTo(bar / BAR, 9)));
    expect(b.parts[0].pressure).toBeCloseTo(14.939, 3);
    // 0.84 bar = 12.183 psi; 5.8 m/s / 0.3048 = 19.029 ft/s, under the 6 m/s = 19.685 ft/s of SI work (common practice)
    expect(b.worst).toMatchObject({ segment: "Feed main", overLimit: false, limitGiven: false });
    expect(b.worst!.loss).toBeCloseTo(0.84 / BAR, 9);
    expect(b.worst!.velocity).toBeCloseTo(5.8 / M_PER_FT, 9);
    expect(b.worst!.limit).toBeCloseTo(6 / M_PER_FT, 9);
  });
});

describe("pane model: the segment losing the most", () => {
  it("names the segment, its loss and velocity, under the 20 ft/s limit of common practice", () => {
    const w = ready({ ...BASE, ...PARTS_48, ...WORST_SLOW }).breakdown!.worst!;
    expect(w).toEqual({ segment: "Cross main to the riser", loss: 9.1, velocity: 14.2, overLimit: false, limit: 20, limitGiven: false });
  });

  it("flags a velocity above the limit: the sheet's Velocity_Limit, else 20 ft/s (common practice)", () => {
    expect(ready(SHORT_105).breakdown!.worst).toMatchObject({ velocity: 22.6, overLimit: true, limit: 20, limitGiven: false });
    expect(ready({ ...SHORT_105, Velocity_Limit: 25 }).breakdown!.worst).toMatchObject({ overLimit: false, limit: 25, limitGiven: true });
    // at the limit is not above it
    expect(ready({ ...SHORT_105, Velocity_Limit: 22.6 }).breakdown!.worst!.overLimit).toBe(false);
    // 6.9 m/s / 0.3048 = 22.64 ft/s, above 6 m/s, the SI default (common practice)
    const si = smallSI(6.9);
    expect(ready(si).breakdown!.worst).toMatchObject({ overLimit: true, limitGiven: false });
    // a limit given in m/s: 7 m/s
    expect(ready({ ...si, Velocity_Limit: 7 }).breakdown!.worst).toMatchObject({ overLimit: false, limitGiven: true });
    expect(ready({ ...si, Velocity_Limit: 7 }).breakdown!.worst!.limit).toBeCloseTo(7 / M_PER_FT, 9);
  });

  it("has no worst segment where its label, loss or velocity is not given", () => {
    expect(ready({ ...BASE, ...PARTS_48, ...WORST_SLOW, Run_WorstSegment: null }).breakdown!.worst).toBeNull();
    expect(ready({ ...BASE, ...PARTS_48, ...WORST_SLOW, Run_WorstSegment: "  " }).breakdown!.worst).toBeNull();
    expect(ready({ ...BASE, ...PARTS_48, ...WORST_SLOW, Run_WorstLoss: undefined }).breakdown!.worst).toBeNull();
    expect(ready({ ...BASE, ...PARTS_48, ...WORST_SLOW, Run_WorstVelocity: null }).breakdown!.worst).toBeNull();
  });

  it("reads a label that is a number as its text, and trims it", () => {
    expect(ready({ ...BASE, ...PARTS_48, ...WORST_SLOW, Run_WorstSegment: 3 }).breakdown!.worst!.segment).toBe("3");
    expect(ready({ ...BASE, ...PARTS_48, ...WORST_SLOW, Run_WorstSegment: " Riser " }).breakdown!.worst!.segment).toBe("Riser");
  });

  it("refuses text in the velocity and a zero or negative limit, with the cell's message", () => {
    expect(problems({ ...BASE, ...PARTS_48, ...WORST_SLOW, Run_WorstVelocity: "fast" })).toEqual([
      'Run_WorstVelocity (Estimate!B21): Run_WorstVelocity: got "fast"; must be a number',
    ]);
    expect(problems({ ...BASE, ...PARTS_48, ...WORST_SLOW, Velocity_Limit: 0 })).toEqual([
      "Velocity_Limit (Estimate!B22): Velocity_Limit: got 0 ft/s; must be greater than 0 and at most 1000 ft/s",
    ]);
  });
});

describe("pane model: what to do next names the segment", () => {
  it("pump needed: upsize the segment that loses the most, or budget the pump", () => {
    // 42.6 psi lost there, more than the 105 − 67.958 = 37.0 psi boost
    const e = ready(SHORT_105);
    expect(e.state).toBe("short");
    expect(e.nextSteps).toEqual(["Upsize Cross main to the riser (loses 42.6 psi), or budget the pump."]);
  });

  it("pump needed, where the segment loses less than the pressure to make up: says so", () => {
    // 61.4 − 42.6 + 9.1 = 27.9 psi in the run; 9.1 psi in that segment, under the 37.0 psi boost
    const e = ready({ ...SHORT_105, Pressure_RunFriction: 27.9, Pressure_Elevation: 46.5, Run_WorstLoss: 9.1, Run_WorstVelocity: 14.2 });
    // 15 + 12.4 + 27.9 + 46.5 + 3.2 = 105.0 psi
    expect(e.nextSteps).toEqual(["Upsize Cross main to the riser (loses 9.1 psi, less than the 37.0 psi to make up), or budget the pump."]);
  });

  it("marginal: names the segment instead of the pipe that loses the most", () => {
    // 67.958 − 60 = 7.96 psi to spare, 10 required: 2.04 psi to make up; 15 + 8.5 + 25.3 + 8.33 + 2.87 = 60.00 psi
    const e = ready({
      ...BASE,
      Demand_Pressure: 60,
      Required_Margin: 10,
      Pressure_EndSprinkler: 15,
      Pressure_AreaFriction: 8.5,
      Pressure_RunFriction: 25.3,
      Pressure_Elevation: 8.33,
      Pressure_Devices: 2.87,
      ...WORST_SLOW,
    });
    expect(e.state).toBe("marginal");
    expect(e.nextSteps).toEqual(["Upsize Cross main to the riser (loses 9.1 psi), or budget the pump."]);
  });

  it("keeps the general advice where no segment is named, and says nothing of a segment where no pump is needed", () => {
    expect(ready({ ...BASE, Demand_Pressure: 60, Required_Margin: 10 }).nextSteps).toEqual([
      "Upsize the pipe that loses the most pressure in the run on the estimate sheet, or budget the pump.",
    ]);
    expect(ready({ ...BASE, ...PARTS_48, ...WORST_SLOW }).nextSteps).toEqual([]);
    // pump needed without a breakdown: the pane's steps as before
    expect(ready({ ...BASE, Demand_Pressure: 105 }).nextSteps).toEqual([]);
  });

  it("speaks the sheet's units", () => {
    // 105 psi × 0.0689476 = 7.24 bar demanded; 42.6 psi = 2.94 bar; the SI sheet's parts are the US ones converted
    const e = ready(siBreakdown());
    expect(e.nextSteps).toEqual(["Upsize Cross main to the riser (loses 2.94 bar), or budget the pump."]);
  });
});
