/**
 * The preview engine's share of the benchmark: a sheet of N friction rows recalculated in HyperFormula, once with
 * HEADROOM.FRICTION and once with the same Hazen-Williams written as a native formula.
 */
import { HyperFormula } from "hyperformula";
import { generateCustomFunctionsMetadata } from "custom-functions-metadata";
import * as functions from "../src/functions/functions";
import { registerHeadroomFunctions } from "../src/preview/plugin";
import type { FunctionsMetadata } from "../src/preview/metadata";
import { ENGINE_CONFIG } from "../src/preview/workbook";
import { functionFiles } from "../scripts/function-files.mjs";
import { median } from "./timing";

const ms = (f: () => void) => {
  const t = performance.now();
  f();
  return performance.now() - t;
};

function rows(n: number, formula: (r: number) => string): unknown[][] {
  // A flow, C, internal diameter, the formula, and in F1 the length every row uses
  return Array.from({ length: n }, (_, i) => [50 + (i % 400), 120, 1.049 + (i % 7) * 0.5, formula(i + 1), null, i === 0 ? 100 : null]);
}

export async function sheetBench(n: number) {
  // The metadata the build generates: every file of src/functions/ that holds a cell function.
  const generated = await generateCustomFunctionsMetadata(functionFiles());
  if (generated.errors.length || !generated.metadataJson) {
    throw new Error(`metadata generator: ${generated.errors.join("; ") || "no metadata"}`);
  }
  registerHeadroomFunctions(JSON.parse(generated.metadataJson) as FunctionsMetadata, functions);
  const variants = {
    headroom: (r: number) => `=HEADROOM.FRICTION(A${r},C${r},B${r},$F$1)`,
    native: (r: number) => `=4.52*A${r}^1.85/(B${r}^1.85*C${r}^4.87)*$F$1`,
  };
  type Tally = { build: number[]; full: number[]; edit: number[]; check: number };
  const tally: Record<string, Tally> = { headroom: { build: [], full: [], edit: [], check: 0 }, native: { build: [], full: [], edit: [], check: 0 } };
  const ratios: number[] = [];
  // The two sheets take turns, round by round, so that a slow stretch of this shared machine hits both alike.
  for (let round = 0; round < 7; round++) {
    const fullOf: Record<string, number> = {};
    for (const [name, formula] of Object.entries(variants)) {
      const t = tally[name];
      let hf!: HyperFormula;
      t.build.push(ms(() => (hf = HyperFormula.buildFromArray(rows(n, formula) as never, ENGINE_CONFIG))));
      const full: number[] = [];
      for (let k = 0; k < 3; k++) full.push(ms(() => hf.setCellContents({ sheet: 0, row: 0, col: 5 }, 100 + round + k)));
      fullOf[name] = median(full);
      t.full.push(fullOf[name]);
      for (let k = 0; k < 3; k++) t.edit.push(ms(() => hf.setCellContents({ sheet: 0, row: 10, col: 0 }, 200 + k)));
      t.check = hf.getCellValue({ sheet: 0, row: n - 1, col: 3 }) as number;
      hf.destroy();
    }
    if (round > 0) ratios.push(fullOf.headroom / fullOf.native); // round 0 warms both up
  }
  const out = Object.fromEntries(
    Object.entries(tally).map(([k, t]) => [k, { build: median(t.build), full: median(t.full), edit: median(t.edit), check: t.check }]),
  );
  if (Math.abs(out.headroom.check / out.native.check - 1) > 1e-9) {
    throw new Error(`the two sheets disagree: ${out.headroom.check} vs ${out.native.check}`);
  }
  const ratio = median(ratios);
  return [
    { name: `sheet ${n} rows: build, HEADROOM (ms)`, value: out.headroom.build, unit: "ms" },
    { name: `sheet ${n} rows: build, native (ms)`, value: out.native.build, unit: "ms" },
    { name: `sheet ${n} rows: full recalc, HEADROOM (ms)`, value: out.headroom.full, unit: "ms" },
    { name: `sheet ${n} rows: full recalc, native (ms)`, value: out.native.full, unit: "ms" },
    { name: `sheet ${n} rows: full recalc ratio HEADROOM/native`, value: ratio, unit: "×", goal: "≤ 1.2", ok: ratio <= 1.2 },
    { name: `sheet ${n} rows: one edit's recalc, HEADROOM (ms)`, value: out.headroom.edit, unit: "ms" },
  ];
}
