import { describe, expect, it } from "vitest";
import {
  MIN_TEST_DROP_SHARE,
  assess,
  caveatSentence,
  flowTestCaveat,
  margin,
  pumpBoost,
  stateSentence,
  verdictSentence,
} from "../../src/engine/decision";
import { supplyAt } from "../../src/engine/supply";

// Supply curve [NFPA 291]: static 72, residual 58 at 1100 gpm. At 562 gpm: 72 − 14 × (562/1100)^1.85 = 72 − 14 × 0.28870 = 67.958
// Its drop, 72 − 58 = 14 psi, is 14 / 72 = 19.4 % of static: under 25 % [NFPA 291] (from memory)
const t = { static: 72, residual: 58, testFlow: 1100 };

describe("margin", () => {
  it("margin is supply pressure at the demand flow minus the demand pressure [NFPA 291]", () => {
    expect(margin(562, 48, t)).toBeCloseTo(67.958 - 48, 3);
    expect(margin(562, 78, t)).toBeCloseTo(67.958 - 78, 3);
  });
  it("pump boost is demand + required margin − supply, and 0 when none is needed", () => {
    expect(pumpBoost(562, 80, t, 10)).toBeCloseTo(80 + 10 - 67.958, 3);
    expect(pumpBoost(562, 48, t, 10)).toBe(0);
  });
});

describe("VERDICT's three states", () => {
  it("no pump needed: the margin meets the required margin, which the sentence names, or says none was required", () => {
    // 67.958 − 48 = 19.958 psi to spare
    const a = assess(562, 48, t, 10);
    expect(a.state).toBe("enough");
    expect(a.pumpNeeded).toBe(false);
    expect(stateSentence(a, "US")).toBe("No pump needed: 20.0 psi to spare at 562 gpm (10.0 psi margin required).");
    expect(stateSentence(assess(562, 48, t, 0), "US")).toBe("No pump needed: 20.0 psi to spare at 562 gpm (no margin required).");
  });

  it("marginal: 0 ≤ margin < required margin", () => {
    // 67.958 − 62 = 5.958 psi, less than 10 psi
    const a = assess(562, 62, t, 10);
    expect(a.state).toBe("marginal");
    expect(a.pumpNeeded).toBe(true);
    expect(stateSentence(a, "US")).toBe("Marginal: 6.0 psi to spare at 562 gpm, less than the 10.0 psi margin required.");
  });

  it("pump needed: the supply falls short", () => {
    // 67.958 − 78 = −10.042 psi
    const a = assess(562, 78, t, 10);
    expect(a.state).toBe("short");
    expect(a.pumpNeeded).toBe(true);
    expect(stateSentence(a, "US")).toBe("Pump needed: the supply is 10.0 psi short at 562 gpm.");
  });

  it("puts a margin of exactly 0 on the right side of each boundary", () => {
    const level = supplyAt(562, t); // the demand pressure equal to the supply: a margin of 0
    expect(assess(562, level, t, 0).state).toBe("enough"); // 0 ≥ 0
    expect(assess(562, level, t, 10).state).toBe("marginal"); // 0 ≤ 0 < 10
    expect(assess(562, level + 0.01, t, 0).state).toBe("short"); // −0.01 < 0
    expect(stateSentence(assess(562, level + 0.01, t, 0), "US")).toBe("Pump needed: the supply is less than 0.1 psi short at 562 gpm.");
  });

  it("a supply that reaches 0 psi before the demand flow: a pump alone cannot serve", () => {
    // exhaustion flow 1100 × (72/14)^(1/1.85) = 1100 × 2.4235 = 2666 gpm
    const a = assess(3000, 40, t, 0);
    expect(a.state).toBe("exhausted");
    expect(a.pumpNeeded).toBe(true);
    const sentence = stateSentence(a, "US");
    expect(sentence).toBe(
      "A pump alone cannot serve: the supply reaches 0 psi at 2666 gpm, below the demand flow of 3000 gpm; a suction tank or a stronger main is needed.",
    );
    expect(sentence).not.toMatch(/Pump needed: the supply reaches 0/);
    expect(() => margin(3000, 40, t)).toThrow(/demand_flow: got 3000 gpm; this supply reaches 0 psi at 2665\.8 gpm; no margin exists/);
    expect(() => pumpBoost(3000, 40, t, 0)).toThrow(/cannot draw more/);
  });

  it("writes SI sentences in bar and L/min", () => {
    // 20.0 psi × 0.0689476 = 1.379 bar; 562 gpm × 3.785 = 2127 L/min; 2665.8 gpm × 3.785 = 10091 L/min
    expect(stateSentence(assess(562, 48, t, 0), "SI")).toBe("No pump needed: 1.38 bar to spare at 2127 L/min (no margin required).");
    expect(stateSentence(assess(3000, 40, t, 0), "SI")).toBe(
      "A pump alone cannot serve: the supply reaches 0 bar at 10091 L/min, below the demand flow of 11356 L/min; a suction tank or a stronger main is needed.",
    );
  });
});

describe("the flow-test caveat [NFPA 291] (from memory)", () => {
  it("holds the share of static the drop should reach, 25 % [NFPA 291] (from memory)", () => {
    expect(MIN_TEST_DROP_SHARE).toBe(0.25);
  });

  it("follows when the drop is under 25 % of static and the demand flow is above the test flow", () => {
    // drop 72 − 58 = 14 psi, 14 / 72 = 0.19444; demand 1200 gpm above the 1100 gpm test flow
    const a = assess(1200, 30, t, 0);
    expect(a.caveat).toEqual({ drop: 14, dropShare: expect.closeTo(0.194444, 6) });
    expect(caveatSentence(a, "US")).toBe("The flow test dropped only 14.0 psi (19 % of static), so the supply beyond its flow is uncertain.");
    // 14 psi × 0.0689476 = 0.965 bar
    expect(caveatSentence(a, "SI")).toBe("The flow test dropped only 0.97 bar (19 % of static), so the supply beyond its flow is uncertain.");
    // supply at 1200 gpm: 72 − 14 × (1200/1100)^1.85 = 72 − 14 × 1.17465 = 55.555; 55.555 − 30 = 25.555 psi to spare
    expect(verdictSentence(a, "US")).toBe(
      "No pump needed: 25.6 psi to spare at 1200 gpm (no margin required). The flow test dropped only 14.0 psi (19 % of static), so the supply beyond its flow is uncertain.",
    );
  });

  it("does not follow at or below the test flow, whatever the drop", () => {
    expect(flowTestCaveat(1100, t)).toBeNull(); // demand equal to the test flow
    expect(flowTestCaveat(1100.5, t)).toEqual({ drop: 14, dropShare: expect.closeTo(0.194444, 6) }); // just above
    const a = assess(562, 48, t, 0);
    expect(a.caveat).toBeNull();
    expect(caveatSentence(a, "US")).toBeNull();
    expect(verdictSentence(a, "US")).toBe(stateSentence(a, "US"));
  });

  it("does not follow when the drop is 25 % of static or more, whatever the demand flow", () => {
    // 80 − 60 = 20 psi = 25 % of 80: not under 25 %; 80 − 61 = 19 psi = 23.75 %: under
    expect(flowTestCaveat(2000, { static: 80, residual: 60, testFlow: 1000 })).toBeNull();
    expect(flowTestCaveat(2000, { static: 80, residual: 40, testFlow: 1000 })).toBeNull();
    expect(flowTestCaveat(2000, { static: 80, residual: 61, testFlow: 1000 })).toEqual({ drop: 19, dropShare: 0.2375 });
    expect(flowTestCaveat(900, { static: 80, residual: 61, testFlow: 1000 })).toBeNull();
  });

  it("follows in any state, the exhausted one too", () => {
    // 3000 gpm is above the 1100 gpm test flow; the drop is 19.4 % of static
    expect(verdictSentence(assess(3000, 40, t, 0), "US")).toBe(
      "A pump alone cannot serve: the supply reaches 0 psi at 2666 gpm, below the demand flow of 3000 gpm; a suction tank or a stronger main is needed. The flow test dropped only 14.0 psi (19 % of static), so the supply beyond its flow is uncertain.",
    );
    // short: 1200 gpm at 60 psi against 55.555 psi: 4.4 psi short
    expect(verdictSentence(assess(1200, 60, t, 0), "US")).toMatch(/^Pump needed: the supply is 4\.4 psi short at 1200 gpm\. The flow test dropped only/);
  });

  it("says the share in whole percent, never 25 % for a drop under it, and 'less than 1 %' for a trace", () => {
    // 100 − 75.1 = 24.9 psi, 24.9 % of static: rounds to 25, said as less than 25 %
    const near = assess(2000, 10, { static: 100, residual: 75.1, testFlow: 1000 }, 0);
    expect(caveatSentence(near, "US")).toBe("The flow test dropped only 24.9 psi (less than 25 % of static), so the supply beyond its flow is uncertain.");
    // 100 − 99.6 = 0.4 psi, 0.4 % of static
    const trace = assess(1001, 10, { static: 100, residual: 99.6, testFlow: 1000 }, 0);
    expect(caveatSentence(trace, "US")).toBe("The flow test dropped only 0.4 psi (less than 1 % of static), so the supply beyond its flow is uncertain.");
  });
});
