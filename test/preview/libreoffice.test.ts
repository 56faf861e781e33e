/**
 * Files others open: the committed samples, a fresh save of an estimate and a share copy, opened by LibreOffice Calc
 * (headless, ../reference/libreoffice.ts), which has no Headroom add-in.
 *
 * What LibreOffice shows is compared, cell by cell, with the values cached in the file:
 * - a share copy (values only) shows every value, and no cell shows an error;
 * - a workbook shows every cached value outside its spilled blocks, and no error there: LibreOffice keeps the cached
 *   result of an ordinary formula (its default for Excel files is never to recalculate on load);
 * - inside a spilled block a cell shows its cached value or #NAME?: LibreOffice does not take the cached results of
 *   an array formula, dynamic or not (its import sets "cell formatting, but do not set result as cell value",
 *   SheetDataContext::onEndElement in sc/source/filter/oox/sheetdatacontext.cxx), and recalculates it without the
 *   add-in's functions. A spill stored any other way would not spill in Excel.
 */
import { readFile } from "node:fs/promises";
import path from "node:path";
import { describe, expect, test } from "vitest";
import { registerFunctions } from "../../samples/build";
import { SAMPLES } from "../../samples/scenarios";
import { templateNames, templateSheet } from "../../src/preview/fromTemplate";
import { picturePlace } from "../../src/preview/picture";
import { PreviewPort } from "../../src/preview/port";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { readXlsx, writeXlsx } from "../../src/preview/xlsx";
import { cellAddress, parseRange } from "../../src/workbook/a1";
import { demoScenario } from "../../src/workbook/scenario";
import { estimateTemplate } from "../../src/workbook/template";
import { type Shown, convertWithLibreOffice, shownCells } from "../reference/libreoffice";

const FRESH = "fresh-save.xlsx";
const SHARE = "share-copy.xlsx";

type Seen = Record<string, { ours: Awaited<ReturnType<typeof shownCells>>; theirs: Awaited<ReturnType<typeof shownCells>> }>;

/** LibreOffice runs once for every file (the first test that asks); a test fails, never skips, when it cannot run. */
let seen: Promise<Seen> | undefined;
const LIBREOFFICE_MS = 300_000;

/** Each file as written and as LibreOffice showed it. */
async function convertAll(): Promise<Seen> {
  const known = await registerFunctions();
  const bytes: Record<string, Uint8Array> = {};
  for (const s of SAMPLES) bytes[s.file] = await readFile(path.join("samples", s.file));

  // a fresh save: the demo estimate with an edit, as the preview's Save writes it
  const t = estimateTemplate(demoScenario("US"));
  const wb = new PreviewWorkbook({ sheets: [templateSheet(t)], names: templateNames(t) });
  wb.setTyped("Estimate", "B12", "80");
  bytes[FRESH] = await writeXlsx(wb.toData(), known);

  // a share copy of a sample, as the preview's Save share copy writes it
  const sample = new PreviewWorkbook((await readXlsx(bytes[SAMPLES[0].file], known)).workbook);
  const made = new PreviewPort(sample, () => new Date(2026, 4, 4)).shareCopyData();
  if (!made.ok) throw new Error(made.reason);
  // with a picture where the plot goes (one pixel: the file's drawing part is what matters here)
  const png = "data:image/png;base64,iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==";
  const pictures = [{ sheet: made.sheet.name, png, at: picturePlace(made.sheet), width: 360, height: 280 }];
  bytes[SHARE] = await writeXlsx({ sheets: [made.sheet], names: [], activeSheet: made.sheet.name }, known, { pictures });

  const converted = convertWithLibreOffice(bytes);
  const files: Seen = {};
  for (const name of Object.keys(bytes)) files[name] = { ours: await shownCells(bytes[name]), theirs: await shownCells(converted[name]) };
  return files;
}

/** Every cell of the blocks, "Sheet!A1". */
function blockCells(blocks: string[]): Set<string> {
  const out = new Set<string>();
  for (const b of blocks) {
    const at = b.lastIndexOf("!");
    const r = parseRange(b.slice(at + 1));
    for (let i = 0; i < r.rows; i++) for (let j = 0; j < r.cols; j++) out.add(`${b.slice(0, at)}!${cellAddress({ row: r.start.row + i, col: r.start.col + j })}`);
  }
  return out;
}

function same(a: Shown | undefined, b: Shown | undefined): boolean {
  if (typeof a === "number" && typeof b === "number") return Math.abs(a - b) <= 1e-12 * Math.max(1, Math.abs(a));
  return JSON.stringify(a ?? null) === JSON.stringify(b ?? null);
}

const isError = (v: Shown | undefined) => v !== null && typeof v === "object";

describe("LibreOffice Calc opens", () => {
  test("a share copy with its plot's picture: every value shown, no error cell", { timeout: LIBREOFFICE_MS }, async () => {
    const { ours, theirs } = (await (seen ??= convertAll()))[SHARE];
    expect(ours.arrays).toEqual([]);
    let compared = 0;
    for (const [at, v] of ours.cells) {
      if (v === null) continue;
      expect(theirs.cells.get(at), at).toSatisfy((x: Shown | undefined) => same(v, x));
      compared++;
    }
    expect([...theirs.cells].filter(([, v]) => isError(v)).map(([at]) => at)).toEqual([]);
    expect(compared).toBeGreaterThan(200);
  });

  test.each([...SAMPLES.map((s) => s.file), FRESH])(
    "%s: every cached value outside the spilled blocks, no error there; inside them the cached value or #NAME?",
    { timeout: LIBREOFFICE_MS },
    async (name) => {
      const { ours, theirs } = (await (seen ??= convertAll()))[name];
      const spilled = blockCells(ours.arrays);
      expect(spilled.size).toBeGreaterThan(20); // the estimate's spills: AREADEMAND or its kin, PIPERUN, SUPPLYCURVE...
      let compared = 0;
      for (const [at, v] of ours.cells) {
        if (v === null) continue;
        const shown = theirs.cells.get(at);
        if (spilled.has(at)) expect(same(v, shown) || JSON.stringify(shown) === '{"error":"#NAME?"}', `${at}: ${JSON.stringify(shown)}`).toBe(true);
        else expect(shown, at).toSatisfy((x: Shown | undefined) => same(v, x));
        compared++;
      }
      const errorsOutside = [...theirs.cells].filter(([at, v]) => isError(v) && !spilled.has(at)).map(([at, v]) => `${at} ${JSON.stringify(v)}`);
      expect(errorsOutside).toEqual([]);
      expect(compared).toBeGreaterThan(150);
    },
  );
});
