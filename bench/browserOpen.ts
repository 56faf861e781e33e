/**
 * The browser benchmark's file-opening part: how long the preview takes to open (or refuse) a large .xlsx file, and
 * the longest time it holds the page still meanwhile (Chromium's long tasks, and the longest gap between two
 * animation frames). Each file is opened the user's way (the Open button's file input; the file is read off the page
 * by ./src/preview/reader.ts) and, side by side in the same run, read by the same reader on the page itself.
 * Printed, never asserted: the goal is that no file holds the page still for more than 1 s at a time.
 */
import { mkdtemp, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Page } from "playwright-core";
import { MAX_CELLS } from "../src/preview/xlsx";
import { bigXlsx } from "./bigFile";

interface Watch {
  ms: number;
  longestTaskMs: number;
  longestFrameGapMs: number;
  status: string;
}

/** Start watching the page's main thread: long tasks and gaps between animation frames. */
async function watch(page: Page): Promise<void> {
  // as a string: the page runs it as written (tsx would wrap named functions in a helper the page lacks)
  await page.evaluate(`(() => {
    const state = { tasks: [], gap: 0, last: performance.now(), on: true };
    window.benchWatch = state;
    new PerformanceObserver((list) => { for (const e of list.getEntries()) state.tasks.push(e.duration); }).observe({ type: "longtask" });
    function frame(t) {
      state.gap = Math.max(state.gap, t - state.last);
      state.last = t;
      if (state.on) requestAnimationFrame(frame);
    }
    requestAnimationFrame(frame);
  })()`);
}

async function stopWatch(page: Page): Promise<{ longestTaskMs: number; longestFrameGapMs: number }> {
  return page.evaluate(async () => {
    const state = (window as unknown as { benchWatch: { tasks: number[]; gap: number; on: boolean } }).benchWatch;
    await new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)));
    state.on = false;
    return { longestTaskMs: Math.max(0, ...state.tasks), longestFrameGapMs: state.gap };
  });
}

/** Open `bytes` with the Open button's file input; resolves when the status line says opened or could not. */
async function openTheUsersWay(page: Page, name: string, bytes: Uint8Array): Promise<Watch> {
  // from a file on disk, as a user picks one: a buffer would be decoded by script on the page, which is not the page's work
  const file = path.join(await mkdtemp(path.join(tmpdir(), "headroom-bench-")), name);
  await writeFile(file, bytes);
  await watch(page);
  const t = Date.now();
  await page.setInputFiles('[data-role="file-input"]', file);
  await page.waitForFunction((n) => /^(Opened|Could not open) /.test(document.querySelector('[data-role="preview-status"]')?.textContent ?? "") && (document.querySelector('[data-role="preview-status"]')?.textContent ?? "").includes(n), name, {
    timeout: 600_000,
    polling: 50,
  });
  const ms = Date.now() - t;
  const status = (await page.textContent('[data-role="preview-status"]')) ?? "";
  return { ms, status, ...(await stopWatch(page)) };
}

/** Read `bytes` with the same reader on the page itself, in no worker: what the worker spares the page. */
async function readOnThePage(page: Page, bytes: Uint8Array): Promise<Watch> {
  await page.evaluate((b64) => {
    (window as unknown as { benchBytes: ArrayBuffer }).benchBytes = Uint8Array.from(atob(b64), (c) => c.charCodeAt(0)).buffer;
  }, Buffer.from(bytes).toString("base64"));
  await watch(page);
  const t = Date.now();
  const status = await page.evaluate(async () => {
    const w = window as unknown as { benchBytes: ArrayBuffer; headroomPreview: { readOnPage(b: ArrayBuffer): Promise<unknown> } };
    try {
      await w.headroomPreview.readOnPage(w.benchBytes);
      return "read";
    } catch (e) {
      return `refused: ${(e as Error).message}`;
    }
  });
  const ms = Date.now() - t;
  return { ms, status, ...(await stopWatch(page)) };
}

/**
 * The files: one the preview opens (at its cell limit, MAX_CELLS) and one it refuses (two million cells). Opened the
 * user's way, the time runs until the status line answers, the workbook built and drawn; beside it, the file read by
 * the same reader on the page itself, which is what the worker spares the page.
 */
export async function openBench(page: Page, reload: () => Promise<void>): Promise<string[]> {
  const lines: string[] = ["Opening large files (goal: the page never held still for more than 1 s at a time)"];
  for (const [rows, cols] of [
    [MAX_CELLS / 20, 20],
    [100_000, 20],
  ] as const) {
    const cells = rows * cols;
    const bytes = await bigXlsx(rows, cols);
    const label = `${cells.toLocaleString("en-US")} cells (${rows.toLocaleString("en-US")} rows × ${cols}, ${(bytes.length / 1e6).toFixed(1)} MB)`;
    await reload();
    const offPage = await openTheUsersWay(page, `bench-${cells}.xlsx`, bytes);
    await reload();
    const onPage = await readOnThePage(page, bytes);
    const say = (w: Watch) => `${(w.ms / 1000).toFixed(1)} s to answer; longest task ${(w.longestTaskMs / 1000).toFixed(2)} s, longest frame gap ${(w.longestFrameGapMs / 1000).toFixed(2)} s`;
    lines.push(`  ${label}`);
    lines.push(`    opened the user's way:       ${say(offPage)}; ${offPage.status.slice(0, 110)}`);
    lines.push(`    the same reader on the page: ${say(onPage)} (reading only, nothing built); ${onPage.status.slice(0, 80)}`);
  }
  return lines;
}
