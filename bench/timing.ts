/**
 * The benchmark's clock, shared by its sections: rounds of calls timed with the process's high-resolution clock,
 * medians, and two ways of doing the same work timed side by side.
 */

/** The middle value (the upper of the two middle ones for an even count). */
export const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

let sink: unknown;

/** Nanoseconds per call of `fn`, one round of `n` calls (each result kept alive, so no call is optimised away). */
export function round(fn: (i: number) => unknown, n: number): number {
  const t = process.hrtime.bigint();
  for (let i = 0; i < n; i++) sink = fn(i);
  const ns = Number(process.hrtime.bigint() - t) / n;
  if (sink === round) console.log(sink);
  return ns;
}

/**
 * Two ways of doing the same work, timed in alternating rounds (so that a slow stretch of this shared machine
 * hits both alike), after a warm-up round of each: the median nanoseconds per call of each and the median of the
 * per-round ratios a/b.
 */
export function compare(a: (i: number) => unknown, b: (i: number) => unknown, n: number, rounds: number) {
  round(a, n);
  round(b, n);
  const as: number[] = [], bs: number[] = [], ratios: number[] = [];
  for (let r = 0; r < rounds; r++) {
    const x = round(a, n), y = round(b, n);
    as.push(x);
    bs.push(y);
    ratios.push(x / y);
  }
  return { a: median(as), b: median(bs), ratio: median(ratios) };
}
