/**
 * Several candidate design areas in the pane's model: the least margin controls (the first on a tie), the verdict,
 * the pump and the suction check are its own, the sheet's own breakdown stays with the sheet's own area, and a
 * workbook with one demand reads as before.
 */
import { describe, expect, it } from "vitest";
import * as functions from "../../src/functions/functions";
import { type Estimate, type PaneModel, buildModel, plotData } from "../../src/taskpane/model";
import { BASE, FakePort, SHORT_105, type Values } from "./fakePort";

function model(v: Values, rows: Parameters<FakePort["setTable"]>[0]): PaneModel {
  const port = new FakePort(v);
  port.setTable(rows);
  return buildModel(port.readings);
}

function ready(v: Values, rows: Parameters<FakePort["setTable"]>[0]): Estimate {
  const m = model(v, rows);
  if (m.kind !== "ready") throw new Error(JSON.stringify(m));
  return m.estimate;
}

/** BASE's own area as the table's first row: 562 gpm at 48 psi. */
const OWN = ["Print hall", 562, 48, null];

describe("one demand", () => {
  it("reads as before without a table, and with a table holding only the sheet's own area", () => {
    const without = buildModel(new FakePort(SHORT_105).readings);
    const withOne = model(SHORT_105, [["Print hall", 562, 105, null], [null, null, null, null]]);
    expect(withOne.kind).toBe("ready");
    if (without.kind !== "ready" || withOne.kind !== "ready") return;
    const { candidates, ...rest } = withOne.estimate;
    const { candidates: none, ...before } = without.estimate;
    expect(none).toEqual([]);
    expect(candidates.map((c) => c.name)).toEqual(["Print hall"]);
    expect(rest).toEqual({ ...before, pumpFlowGiven: true });
    expect(rest.judgesOwn).toBe(true);
    expect(rest.breakdown).not.toBeNull();
  });
});

describe("several design areas", () => {
  // BASE's supply: static 72, residual 58 psi at 1100 gpm [NFPA 291]; P(Q) = 72 − 14 (Q/1100)^1.85
  const supply = (q: number) => 72 - 14 * (q / 1100) ** 1.85;

  it("judges the one with the least margin, and names it", () => {
    // own: 67.958 − 48 = 19.96 psi; an invented store at 1000 gpm needing 66 psi: 72 − 14 × 0.8385 = 60.26 → −5.74 psi
    const e = ready(BASE, [OWN, ["Paper store", 1000, 66, null], ["Office", 300, 30, null]]);
    expect(e.candidates.map((c) => [c.name, c.controls])).toEqual([
      ["Print hall", false],
      ["Paper store", true],
      ["Office", false],
    ]);
    expect(e.candidates[1].margin).toBeCloseTo(supply(1000) - 66, 9);
    expect(e.candidates[0].margin).toBeCloseTo(supply(562) - 48, 9);
    expect(e.demandFlow).toBe(1000);
    expect(e.demandPressure).toBe(66);
    // VERDICT's very sentence for it
    expect(e.verdict).toBe(functions.verdict(1000, 66, 72, 58, 1100, 0, "US"));
    expect(e.state).toBe("short");
    expect(e.judgesOwn).toBe(false);
  });

  it("sizes the pump on the controlling area's flow through a pump, its demand flow where the row leaves it blank", () => {
    const blank = ready({ ...BASE, Required_Margin: 10 }, [OWN, ["Paper store", 1000, 66, null]]);
    // boost 66 + 10 − 60.26 = 15.74 psi → 20 psi; 1000 gpm → the 1000 gpm rating [NFPA 20]
    expect(blank.pumpFlow).toBe(1000);
    expect(blank.pumpSize).toEqual({ ratedFlow: 1000, ratedPressure: 20 });
    const typed = ready({ ...BASE, Required_Margin: 10 }, [OWN, ["Paper store", 1000, 66, 700]]);
    // 700 gpm → the 750 gpm rating [NFPA 20]; the 300 gpm of hose beside the pump drawn from the main with it
    expect(typed.pumpFlow).toBe(700);
    expect(typed.pumpSize?.ratedFlow).toBe(750);
    expect(typed.suction?.drawn).toBeCloseTo(1.5 * 750 + 300, 9);
  });

  it("keeps the sheet's own breakdown and hose for the sheet's own area, and drops them where another controls", () => {
    const v = { ...SHORT_105, Demand_HoseFlow: 100 };
    const own = ready(v, [["Print hall", 562, 105, null], ["Office", 300, 30, null]]);
    expect(own.judgesOwn).toBe(true);
    expect(own.breakdown).not.toBeNull();
    expect(own.hoseFlow).toBe(100);
    const other = ready(v, [["Print hall", 562, 105, null], ["Paper store", 1000, 120, null]]);
    expect(other.judgesOwn).toBe(false);
    expect(other.breakdown).toBeNull();
    expect(other.hoseFlow).toBeNull();
  });

  it("takes the first of two equal margins, as the sheet's MATCH of the MIN does", () => {
    const e = ready(BASE, [OWN, ["Same again", 562, 48, null]]);
    expect(e.candidates.map((c) => c.controls)).toEqual([true, false]);
  });

  it("counts an area beyond the flow where the supply runs dry as 0 psi of supply there, so that it controls", () => {
    // BASE runs dry at 1100 × (72/14)^(1/1.85) = 1100 × 2.4218 = 2664 gpm [NFPA 291]
    const e = ready(BASE, [OWN, ["Yard", 3000, 20, null]]);
    expect(e.candidates[1]).toMatchObject({ controls: true, margin: -20 });
    expect(e.state).toBe("cannot-serve");
  });

  it("plots every candidate, the controlling one as the demand point named for it", () => {
    const e = ready(BASE, [OWN, ["Paper store", 1000, 66, null], ["Office", 300, 30, null]]);
    const d = plotData(e);
    expect(d.demand).toEqual([{ id: "total", label: "Paper store", q: 1000, p: 66 }]);
    expect(d.candidates.map((c) => [c.name, c.q, c.p, c.controls])).toEqual([
      ["Print hall", 562, 48, false],
      ["Paper store", 1000, 66, true],
      ["Office", 300, 30, false],
    ]);
    // the plot reaches past the largest flow compared
    expect(d.qMax).toBeGreaterThanOrEqual(1.2 * 1000);
  });

  it("plots no candidates for one demand", () => {
    expect(plotData(ready(BASE, [OWN])).candidates).toEqual([]);
  });
});

describe("a wrong table or row", () => {
  it.each([
    ["text in a flow", ["Dock", "lots", 50, null], /Design_Candidates, Dock \(Estimate!B61\): demand_flow: got "lots"; must be a number/],
    ["a name and no flow", ["Dock", null, 50, null], /Design_Candidates, Dock \(Estimate!B61\): demand_flow is empty: type a number/],
    ["a negative pressure", ["Dock", 500, -5, null], /Design_Candidates, Dock \(Estimate!C61\): demand_pressure: got -5 psi/],
    ["more through the pump than its demand", ["Dock", 500, 50, 600], /Design_Candidates, Dock \(Estimate!D61\): its flow through a pump cannot exceed its demand flow \(500 gpm\)/],
    ["an error in a cell", ["Dock", { kind: "error", code: "#VALUE!", message: "flow: got -1 gpm", address: "Estimate!B61" }, 50, null], /Dock \(Estimate!B61\): shows #VALUE! flow: got -1 gpm/],
  ] as const)("%s: says so for that row and gives no verdict", (_, row, message) => {
    const m = model(BASE, [OWN, [...row]]);
    expect(m.kind).toBe("problems");
    if (m.kind !== "problems") return;
    expect(m.problems).toHaveLength(1);
    expect(m.problems[0].name).toBe("Design_Candidates");
    expect(m.problems[0].message).toMatch(message);
  });

  it("points at the wrong row, not at the sheet's names whose errors follow from it", () => {
    // on the sheet the governing test is picked at the controlling flow: a wrong row makes Supply_* show its error
    const error = (address: string) => ({ kind: "error", code: "#VALUE!", message: 'demand_flow: got "lots"; must be a number', address }) as const;
    const v = { ...BASE, Supply_Static: error("Estimate!B70"), Supply_Residual: error("Estimate!B71"), Required_Margin: "ten" };
    const m = model(v, [OWN, ["Dock", "lots", 50, null]]);
    expect(m.kind === "problems" && m.problems.map((p) => p.name)).toEqual(["Required_Margin", "Design_Candidates"]);
  });

  it("names a row without a name by its place in the table", () => {
    const m = model(BASE, [OWN, [null, "lots", 50, null]]);
    expect(m.kind === "problems" && m.problems[0].message).toMatch(/^Design_Candidates, Row 2 \(Estimate!B61\)/);
  });

  it("waits while a row is still being calculated", () => {
    const m = model(BASE, [OWN, ["Dock", { kind: "error", code: "#BUSY!", address: "Estimate!B61" }, 50, null]]);
    expect(m).toEqual({ kind: "busy", names: ["Design_Candidates"] });
  });

  it("says a table of the wrong shape is not one", () => {
    const port = new FakePort(BASE);
    port.readings.Design_Candidates = { kind: "invalid", reason: "Design_Candidates refers to Estimate!A60:C62, 3 columns wide", address: "Estimate!A60:C62" };
    const m = buildModel(port.readings);
    expect(m.kind === "problems" && m.problems[0].message).toMatch(/^Design_Candidates: Design_Candidates refers to Estimate!A60:C62, 3 columns wide\. Point the name/);
  });
});
