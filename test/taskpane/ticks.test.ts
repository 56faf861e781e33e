/**
 * The flow axis's ticks on both scales, the Q^1.85 one especially: round numbers at a regular step, 0 always, and no
 * two labels closer than their widths.
 */
import { describe, expect, it } from "vitest";
import { flowTicks, niceMax, xScale } from "../../src/taskpane/plot";

const label = (v: number) => String(v);
/** Round steps: 1, 2 or 5 × a power of ten (common practice for axis scales). */
const ROUND_STEPS = [1, 2, 5].flatMap((m) => [0, 1, 2, 3, 4].map((k) => m * 10 ** k));

describe.each(["linear", "pow"] as const)("flow ticks, %s axis", (axis) => {
  it.each([300, 750, 1500, 2000, 2665, 4000, 10000, 40000])("are round, regular and apart up to %d", (q) => {
    for (const width of [296, 396]) {
      const x = xScale(axis, niceMax(q), width);
      const ticks = flowTicks(x, (v) => x(v), label);
      expect(ticks[0]).toBe(0);
      expect(ticks.length).toBeGreaterThanOrEqual(3);
      const rest = ticks.slice(1);
      const step = rest.length > 1 ? rest[1] - rest[0] : rest[0];
      expect(ROUND_STEPS).toContain(step);
      for (const t of rest) expect(t % step).toBe(0);
      // a regular run from the first kept tick up
      rest.forEach((t, i) => expect(t).toBe(rest[0] + i * step));
      // no two labels overlap: centres further apart than half their widths (6.5 px a digit) and a gap
      ticks.slice(1).forEach((t, i) => expect(x(t) - x(ticks[i])).toBeGreaterThan(((label(t).length + label(ticks[i]).length) * 6.5) / 2));
    }
  });
});
