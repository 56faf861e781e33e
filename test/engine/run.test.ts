import { describe, expect, it } from "vitest";
import { HW_CONSTANT_SI_AS_US, headLoss } from "../../src/engine/friction";
import { type RunInput, type Segment, segmentLosses, walkRun } from "../../src/engine/run";

const seg = (s: Partial<Segment>): Segment => ({
  flow: 500,
  diameter: 4.026, // 4 in Schedule 40 [ASME B36.10M]
  cFactor: 120,
  length: 80,
  fittingLength: 20,
  rise: 10,
  fixedLoss: 5,
  ...s,
});

describe("segment losses [NFPA 13]", () => {
  it("friction over pipe plus fitting length, 0.433 psi per ft of rise, fixed loss", () => {
    const l = segmentLosses(seg({}));
    // 4.52 × 500^1.85 / (120^1.85 × 4.026^4.87) = 0.07178 psi/ft [NFPA 13]; × (80 + 20) ft = 7.178 psi
    expect(l.friction).toBeCloseTo(7.178, 3);
    // 0.433 × 10 = 4.33 psi [NFPA 13]
    expect(l.elevation).toBeCloseTo(4.33, 12);
    expect(l.fixed).toBe(5);
  });
  it("a drop gives a gain", () => {
    expect(segmentLosses(seg({ rise: -10 })).elevation).toBeCloseTo(-4.33, 12); // 0.433 × −10 [NFPA 13]
  });
  it("uses the head loss it is given (the EN 12845 form in SI work)", () => {
    // 6.05e5 in SI carried to US quantities is 4.5209 against the NFPA 13 4.52 [EN 12845] [NFPA 13]
    expect(segmentLosses(seg({}), headLoss("SI")).friction / segmentLosses(seg({})).friction).toBeCloseTo(HW_CONSTANT_SI_AS_US / 4.52, 12);
  });
  it("rejects impossible segments, naming the column", () => {
    expect(() => segmentLosses(seg({ diameter: 0 }))).toThrow(/diameter: got 0 in; must be greater than 0/);
    expect(() => segmentLosses(seg({ fixedLoss: -1 }))).toThrow(/fixed_loss/);
    expect(() => segmentLosses(seg({ length: -1 }))).toThrow(/length/);
  });
});

describe("walking a run", () => {
  const a: RunInput = { kind: "segment", losses: { friction: 7.18, elevation: 4.33, fixed: 5 } };
  const b: RunInput = { kind: "segment", losses: { friction: 2, elevation: -4.33, fixed: 0 } };

  it("accumulates pressure from the start pressure", () => {
    const steps = walkRun(40, [a, b]);
    // 40 + 7.18 + 4.33 + 5 = 56.51; 56.51 + 2 − 4.33 = 54.18
    expect(steps[0]).toMatchObject({ kind: "segment", brokenBy: null });
    if (steps[0].kind !== "segment" || steps[1].kind !== "segment") throw new Error("segments expected");
    expect(steps[0].pressureAfter).toBeCloseTo(56.51, 10);
    expect(steps[1].pressureAfter).toBeCloseTo(54.18, 10);
  });
  it("lets blank rows pass through", () => {
    const steps = walkRun(40, [a, { kind: "blank" }, b, { kind: "blank" }]);
    expect(steps.map((s) => s.kind)).toEqual(["segment", "blank", "segment", "blank"]);
    if (steps[2].kind !== "segment") throw new Error("segment expected");
    expect(steps[2].pressureAfter).toBeCloseTo(54.18, 10);
    expect(steps[2].brokenBy).toBeNull();
  });
  it("an unreadable row breaks the chain for later pressures only", () => {
    const steps = walkRun(40, [a, { kind: "unreadable" }, b]);
    expect(steps[0]).toMatchObject({ brokenBy: null });
    expect(steps[2]).toMatchObject({ kind: "segment", brokenBy: 2 });
  });
  it("a pressure below 0 breaks the chain after that row", () => {
    const drop: RunInput = { kind: "segment", losses: { friction: 0.5, elevation: -20, fixed: 0 } };
    const steps = walkRun(10, [drop, a]);
    if (steps[0].kind !== "segment") throw new Error("segment expected");
    expect(steps[0].pressureAfter).toBeCloseTo(-9.5, 10); // 10 + 0.5 − 20
    expect(steps[0].brokenBy).toBeNull();
    expect(steps[1]).toMatchObject({ brokenBy: 1 });
  });
  it("rejects a negative start pressure", () => {
    expect(() => walkRun(-1, [a])).toThrow(/start_pressure: got -1/);
  });
});
