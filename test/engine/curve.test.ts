import { describe, expect, it } from "vitest";
import { supplyCurvePoints } from "../../src/engine/curve";

// Flow test [NFPA 291] (invented numbers): static 70 psi, residual 50 psi at 1000 gpm
const t = { static: 70, residual: 50, testFlow: 1000 };

describe("supply curve points [NFPA 291]", () => {
  it("starts at the static pressure and passes the residual at the test flow [NFPA 291]", () => {
    const rows = supplyCurvePoints(t, 1500, 4);
    expect(rows).toHaveLength(4);
    expect(rows[0]).toEqual([0, 70]);
    expect(rows[2][0]).toBe(1000);
    expect(rows[2][1]).toBeCloseTo(50, 12);
  });
  it("follows P = Ps − (Ps − Pr)(Q/Qt)^1.85 between [NFPA 291]", () => {
    const rows = supplyCurvePoints(t, 1500, 4);
    // 500 gpm: 70 − 20 × 0.5^1.85 = 70 − 20 × 0.27739 = 64.452 psi; 1500 gpm: 70 − 20 × 2.11723 = 27.655 psi
    expect(rows[1][1]).toBeCloseTo(64.452, 3);
    expect(rows[3][1]).toBeCloseTo(27.655, 3);
  });
  it("spaces the flows evenly from 0 to max_flow over `points` rows", () => {
    const rows = supplyCurvePoints(t, 1500, 16);
    expect(rows).toHaveLength(16);
    rows.forEach((r, i) => expect(r[0]).toBeCloseTo((1500 * i) / 15, 10));
  });
  it("stops at the flow where the supply reaches 0 psi, and repeats that point to the last row [NFPA 291]", () => {
    // exhaustion: 1000 × (70 / 20)^(1/1.85) = 1000 × 3.5^0.54054 = 1968.3 gpm
    const rows = supplyCurvePoints(t, 3000, 7); // 0, 500, …, 3000
    expect(rows).toHaveLength(7);
    expect(rows[3][0]).toBe(1500);
    for (const r of rows.slice(4)) {
      expect(r[0]).toBeCloseTo(1968.3, 1);
      expect(r[1]).toBe(0);
    }
  });
  it("gives the exhaustion point from the second row when the supply runs out before the first step", () => {
    // 0 psi at 1968.3 gpm (above); one step of 2000 gpm already lies beyond it
    const rows = supplyCurvePoints(t, 20000, 11); // 0, 2000, …, 20000
    expect(rows[0]).toEqual([0, 70]);
    for (const r of rows.slice(1)) expect(r).toEqual([expect.closeTo(1968.3, 1), 0]);
    expect(rows.flat().every(Number.isFinite)).toBe(true);
  });
  it("rejects a bad points count or max_flow, and a bad flow test", () => {
    expect(() => supplyCurvePoints(t, 1500, 1)).toThrow(/points: got 1; must be a whole number from 2 to 1000/);
    expect(() => supplyCurvePoints(t, 1500, 2.5)).toThrow(/points/);
    expect(() => supplyCurvePoints(t, 0, 16)).toThrow(/max_flow: got 0/);
    expect(() => supplyCurvePoints({ ...t, residual: 80 }, 1500, 16)).toThrow(/residual/);
  });
});
