/**
 * Runs a Python script with the first python3 that can import the given module (Debian's /usr/bin/python3 first:
 * python3-fluids is a Debian package), once, and parses the JSON it prints. Outside references must be independent of
 * this project's code, so the script receives only plain inputs.
 *
 * When no interpreter can import the module, `requireOrSkip` fails the test if REQUIRE_REFERENCE=1 (CI installs the
 * package and sets it) and reports it as skipped otherwise.
 */
import { spawnSync } from "node:child_process";

export type PythonAnswer<T> = { ok: true; python: string; value: T } | { ok: false; reason: string };

export function askPython<T>(module: string, script: string, input: unknown): PythonAnswer<T> {
  const reasons: string[] = [];
  for (const python of ["/usr/bin/python3", "python3"]) {
    const r = spawnSync(python, ["-c", script, JSON.stringify(input)], { encoding: "utf8", timeout: 60_000 });
    if (r.error) {
      reasons.push(`${python}: ${r.error.message}`);
      continue;
    }
    if (r.status !== 0) {
      reasons.push(`${python}: ${(r.stderr || "").trim().split("\n").pop() ?? ""}`);
      continue;
    }
    return { ok: true, python, value: JSON.parse(r.stdout) as T };
  }
  return { ok: false, reason: `no python3 can import ${module} (${reasons.join("; ")}); install python3-${module}` };
}

/** In a test: go on when the answer is there; otherwise fail under REQUIRE_REFERENCE=1, else skip with the reason. */
export function requireOrSkip<T>(answer: PythonAnswer<T>, ctx: { skip: (note?: string) => void }): answer is { ok: true; python: string; value: T } {
  if (answer.ok) return true;
  if (process.env.REQUIRE_REFERENCE === "1") throw new Error(`REQUIRE_REFERENCE=1 but ${answer.reason}`);
  ctx.skip(answer.reason);
  return false;
}
