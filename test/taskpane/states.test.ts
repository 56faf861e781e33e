/**
 * The pane's states: no pump needed, marginal, pump needed, a pump alone cannot serve (the main runs dry, or falls
 * below the least it must keep at the pump's 150 % point), a chosen pump that meets or misses, and the flow-test
 * caveat, each with what to do next.
 */
import { describe, expect, it } from "vitest";
import { type Estimate, buildModel } from "../../src/taskpane/model";
import { STATE_WORDS, pumpLine, suctionLine } from "../../src/taskpane/pane";
import { BASE, FakePort, type Values } from "./fakePort";

function ready(v: Values): Estimate {
  const m = buildModel(new FakePort(v).readings);
  if (m.kind !== "ready") throw new Error(JSON.stringify(m));
  return m.estimate;
}

/** Supply at 562 gpm on the base test (static 72, residual 58 psi at 1100 gpm) [NFPA 291]: 72 − 14 × (562/1100)^1.85. */
const SUPPLY_562 = 72 - 14 * (562 / 1100) ** 1.85; // 67.958 psi

/**
 * A pump's net pressure on the three-point curve through shutoff 120 %, rated and 150 % flow at 70 % (common
 * practice): P = 1.2 Pr − k Q^n, n = ln((1.2 − 0.7) / 0.2) / ln 1.5 = 2.25985, k = 0.2 Pr / Qr^n.
 */
function pumpAt(q: number, qr: number, pr: number): number {
  const n = Math.log(0.5 / 0.2) / Math.log(1.5);
  return 1.2 * pr - 0.2 * pr * (q / qr) ** n;
}

describe("pane states", () => {
  it("no pump needed: the margin meets the required margin", () => {
    const e = ready({ ...BASE, Required_Margin: 10 });
    expect(e.state).toBe("enough");
    expect(e.verdict).toBe("No pump needed: 20.0 psi to spare at 562 gpm (10.0 psi margin required).");
    expect(e.pumpSize).toBeNull();
    expect(e.suction).toBeNull();
    expect(e.nextSteps).toEqual([]);
    expect(pumpLine(e)).toBeNull();
  });

  it("marginal: some pressure to spare but less than the margin; says what to do next, not drawn as a failure", () => {
    // 67.958 − 60 = 7.96 psi, under the 10 psi required
    const e = ready({ ...BASE, Demand_Pressure: 60, Required_Margin: 10 });
    expect(e.state).toBe("marginal");
    expect(e.verdict).toBe("Marginal: 8.0 psi to spare at 562 gpm, less than the 10.0 psi margin required.");
    expect(e.nextSteps.join(" ")).toMatch(/Upsize the pipe that loses the most pressure.*or budget the pump/);
  });

  it("pump needed: the suggested pump is sized on the flow through it, and its suction is checked", () => {
    // 100 gpm of outside hose drawn beside the pump: 462 gpm through it → 500 gpm, the smallest standard rating
    // not below it [NFPA 20] (from memory); boost 80 + 10 − 67.958 = 22.04 psi → 25 psi
    const e = ready({ ...BASE, Demand_Pressure: 80, Required_Margin: 10, Pump_Flow: 462 });
    expect(e.state).toBe("short");
    expect(e.verdict).toBe(`Pump needed: the supply is ${(80 - SUPPLY_562).toFixed(1)} psi short at 562 gpm.`);
    expect(e.pumpSize).toEqual({ ratedFlow: 500, ratedPressure: 25 });
    // PUMPSUCTION: 1.5 × 500 + 100 = 850 gpm; 72 − 14 × (850/1100)^1.85 [NFPA 291]
    expect(e.suction!.pressure).toBeCloseTo(72 - 14 * (850 / 1100) ** 1.85, 9);
    expect(e.suction!.below).toBe(false);
    expect(pumpLine(e)).toBe("Suggested pump: 500 gpm rated at 25.0 psi, the smallest standard rating for 462 gpm through it and a boost of 22.0 psi.");
    expect(suctionLine(e)).toMatch(/^Main at 150 % of the suggested pump's rated flow: \d+\.\d psi, above the 20\.0 psi \(common practice: no Suction_Minimum name\) it must keep\.$/);
  });

  it("sizes on the demand flow where the workbook gives no Pump_Flow", () => {
    const e = ready({ ...BASE, Demand_Pressure: 80, Required_Margin: 10 });
    expect(e.pumpFlow).toBe(562);
    expect(e.pumpSize).toEqual({ ratedFlow: 750, ratedPressure: 25 });
  });

  it("a pump alone cannot serve where the main falls below the least it must keep", () => {
    // 750 gpm pump: 1125 gpm at its 150 % point leaves 72 − 14 × (1125/1100)^1.85 = 57.4 psi, under 60 psi
    const e = ready({ ...BASE, Demand_Pressure: 80, Required_Margin: 10, Suction_Minimum: 60 });
    expect(e.suction!.pressure).toBeCloseTo(72 - 14 * (1125 / 1100) ** 1.85, 9);
    expect(e.state).toBe("cannot-serve");
    expect(suctionLine(e)).toMatch(/below the 60\.0 psi it must keep\. A pump alone cannot serve: a suction tank or a stronger main is needed\.$/);
    expect(e.nextSteps.join(" ")).toMatch(/suction tank/);
    expect(pumpLine(e)).toBeNull();
    expect(STATE_WORDS[e.state]).toBe("A pump alone cannot serve");
  });

  it("says in plain flows where the main runs dry at the pump's 150 % point", () => {
    // a 1500 gpm pump draws 2250 gpm + 500 gpm of hose beside it = 2750 gpm, beyond the 2665.8 gpm where the base
    // test reaches 0 psi [NFPA 291]: the pump at 1500 gpm comes from a chosen rating
    const e = ready({ ...BASE, Demand_Flow: 1000, Pump_Flow: 500, Demand_Pressure: 80, Pump_RatedFlow: 1500, Pump_RatedPressure: 40 });
    expect(e.suction).toMatchObject({ pressure: null, below: true, drawn: 2750 });
    expect(suctionLine(e)).toBe(
      "Main at 150 % of the chosen pump's rated flow (2750 gpm with the hose beside it): it runs dry at 2666 gpm. A pump alone cannot serve: a suction tank or a stronger main is needed.",
    );
  });

  it("a pump alone cannot serve where the supply runs dry before the demand flow, and never says 'Pump needed: the supply reaches 0'", () => {
    // the base test reaches 0 psi at 1100 × (72/14)^(1/1.85) = 2665.8 gpm [NFPA 291]
    const e = ready({ ...BASE, Demand_Flow: 3000 });
    expect(e.state).toBe("cannot-serve");
    expect(e.verdict).toMatch(/^A pump alone cannot serve: the supply reaches 0 psi at 2666 gpm/);
    expect(e.verdict).not.toMatch(/Pump needed: the supply reaches 0/);
  });

  it("checks a chosen pump that meets the demand, and suggests none", () => {
    // 67.958 + P(562 gpm on a 750 gpm / 40 psi pump) − 80 − 10
    const surplus = SUPPLY_562 + pumpAt(562, 750, 40) - 80 - 10;
    const e = ready({ ...BASE, Demand_Pressure: 80, Required_Margin: 10, Pump_RatedFlow: 750, Pump_RatedPressure: 40 });
    expect(e.pumpSize).toBeNull();
    expect(e.chosen!.surplus).toBeCloseTo(surplus, 9);
    expect(e.chosen!.meets).toBe(true);
    expect(pumpLine(e)).toBe(`Chosen pump 750 gpm at 40.0 psi: meets the demand and the required margin, ${surplus.toFixed(1)} psi to spare.`);
    expect(suctionLine(e)).toMatch(/^Main at 150 % of the chosen pump's rated flow/);
  });

  it("checks a chosen pump that misses, and says so", () => {
    const surplus = SUPPLY_562 + pumpAt(562, 750, 5) - 80 - 10;
    expect(surplus).toBeLessThan(0);
    const e = ready({ ...BASE, Demand_Pressure: 80, Required_Margin: 10, Pump_RatedFlow: 750, Pump_RatedPressure: 5 });
    expect(e.chosen!.meets).toBe(false);
    expect(pumpLine(e)).toBe(`Chosen pump 750 gpm at 5.0 psi: falls ${(-surplus).toFixed(1)} psi short of the demand and the required margin.`);
    expect(e.nextSteps.join(" ")).toMatch(/higher rated pressure/);
  });

  it("cannot check a chosen pump whose curve ends before the flow through it", () => {
    const e = ready({ ...BASE, Demand_Pressure: 80, Pump_RatedFlow: 250, Pump_RatedPressure: 40 });
    expect(e.chosen).toMatchObject({ surplus: null, meets: false });
    expect(pumpLine(e)).toBe(
      "Chosen pump 250 gpm at 40.0 psi cannot be checked: rated_flow: got 250 gpm; the flow through the pump, 562 gpm, is beyond 150 % of it: choose at least 374.667 gpm.",
    );
  });

  it("adds the flow-test caveat where the test dropped under 25 % and the demand is above the test flow [NFPA 291] (from memory)", () => {
    // drop 14 of 72 psi = 19 %; demand 1200 gpm above the 1100 gpm test flow
    const e = ready({ ...BASE, Demand_Flow: 1200, Demand_Pressure: 40, Required_Margin: 10 });
    expect(e.state).toBe("enough");
    expect(e.caveat).toBe("The flow test dropped only 14.0 psi (19 % of static), so the supply beyond its flow is uncertain.");
    expect(e.verdict.endsWith(e.caveat!)).toBe(true);
    expect(e.nextSteps[0]).toMatch(/^Confirm the flow test/);
    // and not below the test flow
    expect(ready({ ...BASE, Required_Margin: 10 }).caveat).toBeNull();
  });

  it("refuses text in Suction_Minimum, and a Pump_Flow above the demand flow, with the cell's message", () => {
    const problems = (v: Values) => {
      const m = buildModel(new FakePort(v).readings);
      return m.kind === "problems" ? m.problems.map((p) => p.message) : [];
    };
    expect(problems({ ...BASE, Suction_Minimum: "twenty" })).toEqual(['Suction_Minimum (Estimate!B13): Suction_Minimum: got "twenty"; must be a number']);
    expect(problems({ ...BASE, Pump_Flow: 600 })).toEqual(["Pump_Flow (Estimate!B12) is 600 gpm; it cannot exceed Demand_Flow (562 gpm)."]);
  });
});
