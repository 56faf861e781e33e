/**
 * Outside check of the steel schedule table: python3-fluids (Debian package python3-fluids),
 * `fluids.piping.nearest_pipe(NPS=..., schedule='10'|'40')` → (NPS, Di, Do, t) in metres, for every steel size and
 * schedule of src/engine/pipes.ts, compared within 0.002 in. One python process answers for all sizes.
 *
 * When no python3 can import fluids, the checks fail if REQUIRE_REFERENCE=1 (CI installs the package and sets it)
 * and are reported as skipped otherwise.
 */
import { spawnSync } from "node:child_process";
import { beforeAll, describe, expect, it } from "vitest";
import { type Schedule, internalDiameter, scheduleSizes } from "../../src/engine/pipes";

const STEEL: readonly Schedule[] = ["10", "40"];
const TOLERANCE_IN = 0.002;
const M_PER_IN = 0.0254; // exact by definition of the inch

const SCRIPT = `
import json, sys
from fluids.piping import nearest_pipe
req = json.loads(sys.argv[1])
out = {}
for sch, sizes in req.items():
    out[sch] = {}
    for key in sizes:
        NPS, Di, Do, t = nearest_pipe(NPS=float(key), schedule=sch)
        out[sch][key] = {"NPS": NPS, "Di": Di, "Do": Do, "t": t}
print(json.dumps(out))
`;

type FluidsRow = { NPS: number; Di: number; Do: number; t: number };
type Reference = { ok: true; python: string; rows: Record<string, Record<string, FluidsRow>> } | { ok: false; reason: string };

/** Ask the first python3 that can import fluids, once, for every steel size. */
function askFluids(): Reference {
  const request = Object.fromEntries(STEEL.map((s) => [s, scheduleSizes(s).map((r) => String(r.nominal))]));
  const reasons: string[] = [];
  for (const python of ["/usr/bin/python3", "python3"]) {
    const r = spawnSync(python, ["-c", SCRIPT, JSON.stringify(request)], { encoding: "utf8", timeout: 60_000 });
    if (r.error) {
      reasons.push(`${python}: ${r.error.message}`);
      continue;
    }
    if (r.status !== 0) {
      const last = (r.stderr || "").trim().split("\n").pop() ?? "";
      reasons.push(`${python}: ${last}`);
      continue;
    }
    return { ok: true, python, rows: JSON.parse(r.stdout) };
  }
  return { ok: false, reason: `no python3 can import fluids (${reasons.join("; ")}); install python3-fluids` };
}

let reference: Reference = { ok: false, reason: "not asked yet" };
beforeAll(() => {
  reference = askFluids();
});

const cases = STEEL.flatMap((s) => scheduleSizes(s).map((r) => [s, r.nominal, r.label] as const));

describe("steel internal diameters against python3-fluids", () => {
  it("covers every steel size and schedule of the table (28)", () => {
    expect(cases.length).toBe(28);
  });

  it.for(cases)("Schedule %s, NPS %s (%s) within 0.002 in", ([schedule, nominal], ctx) => {
    if (!reference.ok) {
      if (process.env.REQUIRE_REFERENCE === "1") throw new Error(`REQUIRE_REFERENCE=1 but ${reference.reason}`);
      ctx.skip(reference.reason);
      return;
    }
    const row = reference.rows[schedule][String(nominal)];
    expect(row, `python3-fluids answered for Schedule ${schedule} NPS ${nominal}`).toBeDefined();
    expect(row.NPS).toBe(nominal);
    const fluidsIn = row.Di / M_PER_IN; // python3-fluids nearest_pipe Di, m → in
    const ours = internalDiameter(nominal, schedule); // [ASME B36.10M]
    expect(Math.abs(ours - fluidsIn), `ours ${ours} in, python3-fluids ${fluidsIn.toFixed(4)} in`).toBeLessThanOrEqual(TOLERANCE_IN);
  });
});
