/**
 * LibreOffice Calc, headless, as a reader of our files: `soffice --convert-to xlsx` opens each file as a user's Calc
 * would (its own recalculation rules on load) and writes what it then shows as the cached values of a new file, which
 * ExcelJS reads back. Debian's libreoffice-calc-nogui provides `soffice` (CI installs it, .ci/run).
 *
 * soffice wants a writable home and profile: each run gets its own temporary ones (`-env:UserInstallation`), so that
 * runs in parallel, or a LibreOffice a developer has open, do not share an instance. One run converts every file.
 * There is no skipping: without soffice the run fails and says what to install.
 */
import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { pathToFileURL } from "node:url";
import ExcelJS from "exceljs";

/** A value as a sheet shows it: a number, text, a boolean, nothing, or an error code. */
export type Shown = number | string | boolean | null | { error: string };

/** Convert `files` (name → bytes) with LibreOffice; returns each file as LibreOffice wrote it back, by name. */
export function convertWithLibreOffice(files: Record<string, Uint8Array>): Record<string, Buffer> {
  const work = mkdtempSync(path.join(tmpdir(), "headroom-lo-"));
  try {
    const inDir = path.join(work, "in");
    const outDir = path.join(work, "out");
    const home = path.join(work, "home");
    for (const d of [inDir, outDir, home]) mkdirSync(d, { recursive: true });
    const inputs = Object.entries(files).map(([name, bytes]) => {
      const p = path.join(inDir, name);
      writeFileSync(p, bytes);
      return p;
    });
    const soffice = process.env.SOFFICE ?? "soffice";
    const r = spawnSync(
      soffice,
      [`-env:UserInstallation=${pathToFileURL(path.join(work, "profile")).href}`, "--headless", "--norestore", "--convert-to", "xlsx", "--outdir", outDir, ...inputs],
      { encoding: "utf8", timeout: 240_000, env: { ...process.env, HOME: home } },
    );
    if (r.error) {
      throw new Error(`LibreOffice could not run (${soffice}: ${r.error.message}); install it: apt-get install --no-install-recommends libreoffice-calc-nogui`);
    }
    const out: Record<string, Buffer> = {};
    for (const name of Object.keys(files)) {
      const p = path.join(outDir, name);
      if (!existsSync(p)) throw new Error(`LibreOffice did not convert ${name} (exit ${r.status}): ${(r.stderr || r.stdout).trim()}`);
      out[name] = readFileSync(p);
    }
    return out;
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

/**
 * What every cell of a file shows, "Sheet!A1" → value (a formula's cached result, else the constant), and the blocks
 * of its array formulas ("Sheet!B55:F55").
 */
export async function shownCells(bytes: Uint8Array): Promise<{ cells: Map<string, Shown>; arrays: string[] }> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as unknown as ArrayBuffer);
  const cells = new Map<string, Shown>();
  const arrays: string[] = [];
  wb.eachSheet((ws) => {
    ws.eachRow({ includeEmpty: false }, (row) =>
      row.eachCell({ includeEmpty: false }, (cell) => {
        const v = cell.value as { shareType?: string; ref?: string } | null;
        if (v && typeof v === "object" && v.shareType === "array" && v.ref) arrays.push(`${ws.name}!${v.ref}`);
        cells.set(`${ws.name}!${cell.address}`, shownOf(cell.formula ? cell.result : cell.value));
      }),
    );
  });
  return { cells, arrays };
}

function shownOf(v: unknown): Shown {
  if (v === undefined || v === null || v === "") return null;
  if (typeof v === "number" || typeof v === "boolean") return v;
  if (typeof v === "string") return v;
  if (typeof v === "object") {
    if ("error" in v) return { error: String((v as { error: unknown }).error) };
    if ("richText" in v && Array.isArray((v as { richText: unknown }).richText)) {
      return (v as { richText: Array<{ text: string }> }).richText.map((r) => r.text).join("");
    }
    if ("result" in v) return shownOf((v as { result: unknown }).result);
  }
  return String(v);
}
