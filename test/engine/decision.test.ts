import { describe, expect, it } from "vitest";
import { assess, margin, pumpBoost, verdictSentence } from "../../src/engine/decision";

// Supply curve [NFPA 291]: static 72, residual 58 at 1100 gpm. At 562 gpm: 72 − 14 × (562/1100)^1.85 = 72 − 14 × 0.28870 = 67.958
const t = { static: 72, residual: 58, testFlow: 1100 };

describe("margin and verdict", () => {
  it("margin is supply pressure at the demand flow minus the demand pressure [NFPA 291]", () => {
    expect(margin(562, 48, t)).toBeCloseTo(67.958 - 48, 3);
    expect(margin(562, 78, t)).toBeCloseTo(67.958 - 78, 3);
  });

  it("says no pump is needed when the margin meets the required margin", () => {
    expect(verdictSentence(assess(562, 48, t, 0), "US")).toBe("No pump needed: 20.0 psi to spare at 562 gpm.");
    expect(verdictSentence(assess(562, 48, t, 10), "US")).toBe(
      "No pump needed: 20.0 psi to spare at 562 gpm (10.0 psi margin required).",
    );
  });

  it("says a pump is needed when the supply falls short or the margin is too thin", () => {
    expect(verdictSentence(assess(562, 78, t, 0), "US")).toBe("Pump needed: the supply is 10.0 psi short at 562 gpm.");
    expect(verdictSentence(assess(562, 62, t, 10), "US")).toBe(
      "Pump needed: 6.0 psi to spare at 562 gpm, less than the 10.0 psi margin required.",
    );
  });

  it("says when the supply runs out before the demand flow", () => {
    // exhaustion flow 1100 × (72/14)^(1/1.85) = 1100 × 2.4235 = 2666 gpm
    expect(verdictSentence(assess(3000, 40, t, 0), "US")).toBe(
      "Pump needed: the supply reaches 0 at 2666 gpm, below the demand flow of 3000 gpm.",
    );
    expect(() => margin(3000, 40, t)).toThrow(/demand_flow: got 3000 gpm; this supply reaches 0 psi at 2665\.8 gpm; no margin exists/);
    expect(() => pumpBoost(3000, 40, t, 0)).toThrow(/cannot draw more/);
  });

  it("writes SI sentences in bar and L/min", () => {
    // 20.0 psi × 0.0689476 = 1.379 bar; 562 gpm × 3.785 = 2127 L/min
    expect(verdictSentence(assess(562, 48, t, 0), "SI")).toBe("No pump needed: 1.38 bar to spare at 2127 L/min.");
  });

  it("pump boost is demand + required margin − supply, and 0 when none is needed", () => {
    expect(pumpBoost(562, 80, t, 10)).toBeCloseTo(80 + 10 - 67.958, 3);
    expect(pumpBoost(562, 48, t, 10)).toBe(0);
  });
});
