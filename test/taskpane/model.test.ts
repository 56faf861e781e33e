import { describe, expect, it } from "vitest";
import { margin as marginCell, pumpboost as pumpBoostCell, pumpsize as pumpSizeCell, verdict as verdictCell } from "../../src/functions/functions";
import { type PaneModel, buildModel, plotData, pumpSizeFor } from "../../src/taskpane/model";
import { BASE, FakePort, type Values } from "./fakePort";

function model(values: Values): PaneModel {
  return buildModel(new FakePort(values).readings);
}

function ready(values: Values) {
  const m = model(values);
  if (m.kind !== "ready") throw new Error(`expected an estimate, got ${JSON.stringify(m)}`);
  return m.estimate;
}

function problems(values: Values): string[] {
  const m = model(values);
  if (m.kind !== "problems") throw new Error(`expected problems, got ${m.kind}`);
  return m.problems.map((p) => p.message);
}

describe("pane model: the verdict is VERDICT's, the margin MARGIN's", () => {
  const cases: Array<[string, Values]> = [
    ["passing, no required margin", BASE],
    ["passing with a 10 psi margin", { ...BASE, Required_Margin: 10 }],
    ["short", { ...BASE, Demand_Pressure: 78 }],
    ["too thin a margin", { ...BASE, Demand_Pressure: 62, Required_Margin: 10 }],
    ["supply exhausted", { ...BASE, Demand_Flow: 3000, Demand_Pressure: 40 }],
    // SI: 4.96 bar static, 4.0 bar residual at 4164 L/min; 2127 L/min at 3.3 bar
    ["SI", { Units: "SI", Supply_Static: 4.96, Supply_Residual: 4.0, Supply_TestFlow: 4164, Demand_Flow: 2127, Demand_Pressure: 3.3, Required_Margin: 0.7 }],
  ];
  for (const [label, v] of cases) {
    it(label, () => {
      const e = ready(v);
      const args = [v.Demand_Flow, v.Demand_Pressure, v.Supply_Static, v.Supply_Residual, v.Supply_TestFlow] as const;
      expect(e.verdict).toBe(verdictCell(...args, v.Required_Margin ?? null, v.Units));
      if (e.assessment.margin !== null) {
        expect(fromSheet(e.assessment.margin, v.Units as string)).toBeCloseTo(marginCell(...args, v.Units) as number, 9);
      }
    });
  }

  it("reads the verdict of the decision tests [NFPA 291]", () => {
    // 67.958 − 48 = 19.96 psi to spare; 10 psi required
    expect(ready({ ...BASE, Required_Margin: 10 }).verdict).toBe("No pump needed: 20.0 psi to spare at 562 gpm (10.0 psi margin required).");
    expect(ready({ ...BASE, Demand_Pressure: 78 }).verdict).toBe("Pump needed: the supply is 10.0 psi short at 562 gpm.");
  });

  it("gives the margin as a share of the demand pressure", () => {
    // 19.958 / 48 = 41.6 %
    expect(ready(BASE).marginPercent).toBeCloseTo((19.958 / 48) * 100, 1);
  });

  it("sizes the pump where one is needed: PUMPBOOST's boost, PUMPSIZE's rating", () => {
    const e = ready({ ...BASE, Demand_Pressure: 78, Required_Margin: 10 });
    // boost = 78 + 10 − 67.958 = 20.042 psi → 25 psi in 5 psi steps; 562 gpm → 750 gpm [NFPA 20] (from memory)
    expect(e.boost).toBeCloseTo(20.042, 2);
    expect(e.pumpSize).toEqual({ ratedFlow: 750, ratedPressure: 25 });
    expect(ready(BASE).pumpSize).toBeNull();
  });

  it("gives the rating PUMPSIZE gives for PUMPBOOST's boost, in US and SI", () => {
    const cases: Values[] = [
      { ...BASE, Demand_Pressure: 78, Required_Margin: 10 },
      // supply at 1300 gpm [NFPA 291]: 72 − 14 × (1300/1100)^1.85 = 72 − 14 × 1.3619 = 52.9 psi, short of 60
      { ...BASE, Demand_Flow: 1300, Demand_Pressure: 60 },
      { Units: "SI", Supply_Static: 4.96, Supply_Residual: 4.0, Supply_TestFlow: 4164, Demand_Flow: 2127, Demand_Pressure: 4.9, Required_Margin: 0.7 },
    ];
    for (const v of cases) {
      const e = ready(v);
      const args = [v.Demand_Flow, v.Demand_Pressure, v.Supply_Static, v.Supply_Residual, v.Supply_TestFlow, v.Required_Margin ?? null, v.Units] as const;
      const boost = pumpBoostCell(...args) as number;
      const [[flow, pressure]] = pumpSizeCell(v.Demand_Flow, boost, v.Units) as number[][];
      const si = v.Units === "SI";
      expect(e.pumpSize!.ratedFlow * (si ? 3.785411784 : 1)).toBeCloseTo(flow, 6);
      expect(e.pumpSize!.ratedPressure * (si ? 0.0689475729316836 : 1)).toBeCloseTo(pressure, 9);
    }
  });

  it("rounds an SI pump pressure in bar", () => {
    // 1.52 bar → 2.0 bar in 0.5 bar steps; 2127 L/min = 561.9 gpm → 750 gpm [NFPA 20] (from memory)
    const r = pumpSizeFor(2127 / 3.785411784, 1.52 / 0.0689475729316836, "SI");
    expect(r.ratedFlow).toBe(750);
    expect(r.ratedPressure * 0.0689475729316836).toBeCloseTo(2.0, 9);
  });

  it("suggests no pump where the supply runs out before the demand flow: a pump alone cannot serve", () => {
    const e = ready({ ...BASE, Demand_Flow: 3000, Demand_Pressure: 40 });
    expect(e.pumpSize).toBeNull();
    expect(e.boost).toBeNull();
    expect(e.state).toBe("cannot-serve");
  });
});

function fromSheet(psi: number, units: string): number {
  return units === "SI" ? psi * 0.0689475729316836 : psi;
}

describe("pane model: what is wrong with the names", () => {
  it("names every missing required name and says how to define it", () => {
    const msgs = problems({ Units: "US", Supply_Static: 72 });
    expect(msgs).toHaveLength(4);
    expect(msgs[0]).toBe(
      "Supply_Residual is not defined. Select the cell that holds the residual pressure of the flow test, type Supply_Residual in the Name Box and press Enter, or use New estimate sheet.",
    );
    expect(msgs.join(" ")).toMatch(/Supply_TestFlow.*Demand_Flow.*Demand_Pressure/);
  });

  it("says a name holds text, is empty or shows an error, with its cell", () => {
    const sheet = (e: () => unknown) => {
      try {
        e();
      } catch (err) {
        return (err as Error).message;
      }
      return "";
    };
    // the sheet's own messages for the same inputs
    expect(sheet(() => verdictCell(562, 48, "seventy", 58, 1100))).toBe('static_pressure: got "seventy"; must be a number');
    expect(sheet(() => verdictCell(null, 48, 72, 58, 1100))).toBe("demand_flow is empty: type a number");
    const msgs = problems({ ...BASE, Supply_Static: "seventy", Demand_Flow: null, Demand_Pressure: { kind: "error", code: "#VALUE!", address: "Estimate!B57" } });
    expect(msgs).toEqual([
      // text and empty cells: the very messages VERDICT gives for those arguments
      'Supply_Static (Estimate!B3): static_pressure: got "seventy"; must be a number',
      "Demand_Flow (Estimate!B6): demand_flow is empty: type a number",
      "Demand_Pressure (Estimate!B57) shows #VALUE!: fix the cells it is calculated from (Excel shows the message when you point at the cell).",
    ]);
  });

  // Each of these is a #VALUE! in the sheet's VERDICT cell; the pane must show that very message, never a verdict.
  // The bounds are the plausibility limits of the argument checks (common practice): flow ≤ 100,000 gpm,
  // pressure ≤ 1,000 psi.
  const sheetErrors: Array<[string, Values]> = [
    ["a test flow of 150,000 gpm", { ...BASE, Supply_TestFlow: 150000 }],
    ["a static pressure of 5,000 psi", { ...BASE, Supply_Static: 5000 }],
    ["a required margin of 2,000 psi", { ...BASE, Required_Margin: 2000 }],
    ["a static pressure of 1e300 psi", { ...BASE, Supply_Static: 1e300 }],
    ["an SI static pressure of 500 bar", { Units: "SI", Supply_Static: 500, Supply_Residual: 4.0, Supply_TestFlow: 4164, Demand_Flow: 2127, Demand_Pressure: 3.3 }],
  ];
  for (const [label, v] of sheetErrors) {
    it(`shows the sheet's own message for ${label}`, () => {
      const args = [v.Demand_Flow, v.Demand_Pressure, v.Supply_Static, v.Supply_Residual, v.Supply_TestFlow, v.Required_Margin ?? null, v.Units] as const;
      let sheet = "";
      try {
        verdictCell(...args);
      } catch (e) {
        sheet = (e as Error).message;
      }
      expect(sheet).toMatch(/^\w+: got /);
      const m = model(v);
      expect(m.kind).toBe("problems");
      expect(problems(v).some((p) => p.endsWith(`: ${sheet}`))).toBe(true);
    });
  }

  it("checks the flow test makes a supply curve", () => {
    expect(problems({ ...BASE, Supply_Residual: 80 })).toEqual([
      // the sheet's own message (VERDICT reads the same checks), attributed to the named cell
      "Supply_Residual (Estimate!B4): residual: got 80 psi; must be below the static pressure 72 psi",
    ]);
    expect(problems({ ...BASE, Supply_TestFlow: 0 })[0]).toMatch(/^Supply_TestFlow .* must be greater than 0/);
  });

  it("wants both pump names or neither", () => {
    expect(problems({ ...BASE, Pump_RatedFlow: 750 })).toEqual([
      "Pump_RatedPressure is empty while Pump_RatedFlow holds 750 gpm: give both or neither.",
    ]);
  });

  it("treats empty optional names as not given, and assumes US without a Units name", () => {
    const e = ready({ ...BASE, Units: undefined, Pump_RatedFlow: "", Pump_RatedPressure: null, Required_Margin: null });
    expect(e.units).toBe("US");
    expect(e.unitsAssumed).toBe(true);
    expect(e.pump).toBeNull();
    expect(e.requiredMarginGiven).toBe(false);
  });

  it("refuses a Units cell that is neither US nor SI", () => {
    // the cell functions' own message for their [units] argument (unitsArg)
    expect(problems({ ...BASE, Units: "metric-ish" })).toEqual(['Units (Estimate!B2): units: got "metric-ish"; must be one of "US", "SI"']);
  });

  it("reads Units as the cell functions read [units]: case, spaces and the plain words", () => {
    expect(ready({ ...BASE, Units: " us " }).units).toBe("US");
    expect(ready({ ...BASE, Units: "Imperial" }).units).toBe("US");
    const si = { Units: "metric", Supply_Static: 4.96, Supply_Residual: 4.0, Supply_TestFlow: 4164, Demand_Flow: 2127, Demand_Pressure: 3.3 };
    expect(ready(si).units).toBe("SI");
  });

  it("waits on #BUSY! instead of calling it a problem", () => {
    expect(model({ ...BASE, Demand_Flow: { kind: "error", code: "#BUSY!" } })).toEqual({ kind: "busy", names: ["Demand_Flow"] });
  });
});

describe("pane model: the picture's points", () => {
  it("runs the supply from the static pressure through the test point [NFPA 291]", () => {
    const d = plotData(ready(BASE));
    expect(d.supply[0]).toEqual([0, 72]);
    expect(d.supply).toContainEqual([1100, 58]);
    expect(d.staticPoint).toEqual([0, 72]);
    expect(d.testPoint).toEqual([1100, 58]);
    // 1.5 × 1100 = 1650 gpm, beyond 1.15 × 562
    expect(d.qMax).toBe(1650);
  });

  it("ends the supply where it reaches 0 psi when that comes first", () => {
    // static 40, residual 10 at 1000 gpm [NFPA 291]: exhaustion 1000 × (40/30)^(1/1.85) = 1000 × e^(0.28768 × 0.54054)
    // = 1000 × e^0.15550 = 1168.2 gpm < 1.5 × 1000
    const d = plotData(ready({ ...BASE, Supply_Static: 40, Supply_Residual: 10, Supply_TestFlow: 1000, Demand_Pressure: 20 }));
    const last = d.supply[d.supply.length - 1];
    expect(last[0]).toBeCloseTo(1000 * Math.pow(40 / 30, 1 / 1.85), 6);
    expect(last[1]).toBe(0);
    expect(d.exhaustedAt).toBeCloseTo(1168.2, 1);
  });

  it("puts the sprinklers alone and sprinklers + hose at the demand pressure", () => {
    const d = plotData(ready({ ...BASE, Demand_HoseFlow: 250 }));
    expect(d.demand).toEqual([
      { id: "sprinklers", label: "Sprinklers", q: 312, p: 48 },
      { id: "total", label: "+ hose", q: 562, p: 48 },
    ]);
  });

  it("draws the margin band the required margin below the supply", () => {
    const d = plotData(ready({ ...BASE, Required_Margin: 10 }));
    d.band!.forEach(([q, p], i) => {
      expect(q).toBe(d.supply[i][0]);
      expect(p).toBeCloseTo(Math.max(0, d.supply[i][1] - 10), 9);
    });
  });

  it("adds the pump's net pressure to the supply", () => {
    // pump 750 gpm at 25 psi, shutoff 1.2 × 25 = 30 psi (common practice) on top of 72 psi static at 0 flow
    const d = plotData(ready({ ...BASE, Pump_RatedFlow: 750, Pump_RatedPressure: 25 }));
    expect(d.pump![0]).toEqual([0, 102]);
    // at rated flow: supply 72 − 14 × (750/1100)^1.85 = 72 − 14 × 0.49204 = 65.111 psi, plus 25
    const rated = d.pump!.find(([q]) => q === 750)!;
    expect(rated[1]).toBeCloseTo(72 - 14 * Math.pow(750 / 1100, 1.85) + 25, 6);
    expect(d.pumpLabel).toBe("Supply + chosen pump 750 gpm at 25.0 psi");
  });

  it("converts every point to SI for an SI sheet", () => {
    const d = plotData(ready({ Units: "SI", Supply_Static: 5, Supply_Residual: 4, Supply_TestFlow: 4000, Demand_Flow: 2000, Demand_Pressure: 3 }));
    expect(d.flowUnit).toBe("L/min");
    expect(d.pressureUnit).toBe("bar");
    expect(d.staticPoint[1]).toBeCloseTo(5, 9);
    expect(d.testPoint[0]).toBeCloseTo(4000, 9);
    expect(d.demand[0].q).toBeCloseTo(2000, 9);
  });
});
