import { describe, expect, it } from "vitest";
import {
  MIN_TEST_DROP_SHARE,
  assess,
  chosenPumpCheck,
  caveatSentence,
  flowTestCaveat,
  margin,
  pumpBoost,
  stateSentence,
  verdictSentence,
} from "../../src/engine/decision";
import { supplyAt } from "../../src/engine/supply";
import { errorOf } from "./engineError";

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

describe("the pump the user chose (chosenPumpCheck)", () => {
  // supply at the total flow [NFPA 291] plus the pump's net pressure at the flow through it, P = s·Pr − k Q^n through
  // shutoff 1.2, rated and 0.7 at 150 % (common practice; the [NFPA 20] envelope); rated 500 gpm at 25 psi
  const rating = { ratedFlow: 500, ratedPressure: 25 };
  it("adds the pump's pressure at its own flow to the supply at the total flow, against demand + margin (by hand)", () => {
    // supply at 750 gpm: 72 − 14 × (750/1100)^1.85 = 72 − 14 × 0.492352 = 65.1069 psi
    // pump at 600 gpm: n = ln 2.5 / ln 1.5 = 2.259851; 1.2^n = 1.509864; 25 × (1.2 − 0.2 × 1.509864) = 22.4507 psi
    // delivered 65.1069 + 22.4507 = 87.5576 psi; required 80 + 10 = 90 psi; surplus −2.4424 psi
    const miss = chosenPumpCheck(750, 600, 80, 10, t, rating);
    expect(miss.supplyPressure).toBeCloseTo(65.1069, 4);
    expect(miss.pumpPressure).toBeCloseTo(22.4507, 4);
    expect(miss.delivered).toBeCloseTo(87.5576, 4);
    expect(miss.required).toBe(90);
    expect(miss.surplus).toBeCloseTo(-2.4424, 4);
    expect(miss.meets).toBe(false);
    // demand 70 + 10 = 80 psi: surplus 87.5576 − 80 = 7.5576 psi
    const meets = chosenPumpCheck(750, 600, 70, 10, t, rating);
    expect(meets.surplus).toBeCloseTo(7.5576, 4);
    expect(meets.meets).toBe(true);
  });

  it("meets with a surplus of exactly 0, and takes the curve's shape from the ratios given", () => {
    const level = chosenPumpCheck(750, 600, 0, 0, t, rating).delivered;
    expect(chosenPumpCheck(750, 600, level, 0, t, rating).meets).toBe(true);
    // s 1.4, o 0.65 [NFPA 20] envelope edges: n = ln(0.75 / 0.4) / ln 1.5 = 1.550340; 1.2^n = exp(1.550340 × 0.182322)
    // = 1.326654; 25 × (1.4 − 0.4 × 1.326654) = 25 × 0.869338 = 21.7335 psi
    expect(chosenPumpCheck(750, 600, 80, 10, t, rating, 1.4, 0.65).pumpPressure).toBeCloseTo(21.7335, 4);
  });

  it("throws where the flow through the pump is beyond 150 % of its rating, saying the rating it would need", () => {
    // 800 gpm through a 500 gpm pump is 160 %; a rating of 800 / 1.5 = 533.3 gpm would reach it
    const e = errorOf(() => chosenPumpCheck(900, 800, 60, 10, t, rating));
    expect(e.kind).toBe("number");
    expect(e.message).toBe("rated_flow: got 500 gpm; the flow through the pump, 800 gpm, is beyond 150 % of it: choose at least 533.333 gpm");
    expect(chosenPumpCheck(900, 750, 60, 10, t, rating).pumpPressure).toBeCloseTo(17.5, 10); // 150 % exactly: 0.7 × 25
  });

  it("throws where the supply reaches 0 psi at or before the total flow", () => {
    // 1100 × (72/14)^(1/1.85) = 2665.8 gpm
    const e = errorOf(() => chosenPumpCheck(3000, 1000, 60, 10, t, { ratedFlow: 1000, ratedPressure: 50 }));
    expect(e.kind).toBe("value");
    expect(e.message).toBe("demand_flow: got 3000 gpm; this supply reaches 0 psi at 2665.8 gpm; a pump cannot draw more than the main delivers");
  });

  it("refuses a pump flow above the total flow and bad inputs, naming them", () => {
    expect(errorOf(() => chosenPumpCheck(600, 750, 60, 10, t, rating)).message).toBe(
      "pump_flow: got 750 gpm; must be at most the demand flow 600 gpm",
    );
    expect(errorOf(() => chosenPumpCheck(0, 0, 60, 10, t, rating)).message).toBe("demand_flow: got 0 gpm; must be greater than 0");
    expect(errorOf(() => chosenPumpCheck(600, -1, 60, 10, t, rating)).message).toBe("pump_flow: got -1 gpm; must be 0 or more");
    expect(errorOf(() => chosenPumpCheck(600, 500, -1, 10, t, rating)).message).toBe("demand_pressure: got -1 psi; must be 0 or more");
    expect(errorOf(() => chosenPumpCheck(600, 500, 60, -1, t, rating)).message).toBe("required_margin: got -1 psi; must be 0 or more");
    expect(errorOf(() => chosenPumpCheck(600, 500, 60, 10, t, { ratedFlow: 0, ratedPressure: 25 })).message).toBe("rated_flow: got 0 gpm; must be greater than 0");
    expect(errorOf(() => chosenPumpCheck(600, 500, 60, 10, t, rating, 1.5)).message).toMatch(/^shutoff_ratio: got 1.5;/);
  });
});
