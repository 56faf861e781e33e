/**
 * Outside check of the steel schedule table: python3-fluids (Debian package python3-fluids),
 * `fluids.piping.nearest_pipe(NPS=..., schedule='10'|'40')` → (NPS, Di, Do, t) in metres, for every steel size and
 * schedule of src/engine/pipes.ts, compared within 0.002 in. One python process answers for all sizes.
 *
 * When no python3 can import fluids, the checks fail if REQUIRE_REFERENCE=1 (CI installs the package and sets it)
 * and are reported as skipped otherwise (test/reference/python.ts).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { type Schedule, internalDiameter, scheduleSizes } from "../../src/engine/pipes";
import { type PythonAnswer, askPython, requireOrSkip } from "../reference/python";

const STEEL: readonly Schedule[] = ["10", "40"];
const TOLERANCE_IN = 0.002;
const M_PER_IN = 0.0254; // exact by definition of the inch

/** Gets only plain inputs: the schedule names and the NPS numbers as text. */
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
type Rows = Record<string, Record<string, FluidsRow>>;

const cases = STEEL.flatMap((s) => scheduleSizes(s).map((r) => [s, r.nominal, r.label] as const));

let answer: PythonAnswer<Rows> = { ok: false, reason: "python3-fluids not asked yet" };
beforeAll(() => {
  const request = Object.fromEntries(STEEL.map((s) => [s, scheduleSizes(s).map((r) => String(r.nominal))]));
  answer = askPython<Rows>("fluids", SCRIPT, request);
});

describe("steel internal diameters against python3-fluids", () => {
  it("covers every steel size and schedule of the table (2 × 14)", () => {
    expect(cases.length).toBe(28);
  });

  it.for(cases)("Schedule %s, NPS %s (%s) within 0.002 in", ([schedule, nominal], ctx) => {
    if (!requireOrSkip(answer, ctx)) return;
    const row = answer.value[schedule][String(nominal)];
    expect(row, `python3-fluids answered for Schedule ${schedule} NPS ${nominal}`).toBeDefined();
    expect(row.NPS).toBe(nominal);
    const fluidsIn = row.Di / M_PER_IN; // python3-fluids nearest_pipe Di, m → in
    const ours = internalDiameter(nominal, schedule); // [ASME B36.10M]
    expect(Math.abs(ours - fluidsIn), `ours ${ours} in, python3-fluids ${fluidsIn.toFixed(4)} in`).toBeLessThanOrEqual(TOLERANCE_IN);
  });
});
