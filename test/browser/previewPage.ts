/**
 * What the browser tests do to the preview page: type into the cell a workbook name points at, as a user would type
 * into that cell, and wait until the pane has read the workbook again.
 */
import { existsSync } from "node:fs";
import { chromium, type Page } from "playwright-core";
import { afterAll, beforeAll, expect } from "vitest";
import { startServer } from "../../scripts/start-server.mjs";

const CHROMIUM = "/usr/bin/chromium";

/** Type `typed` into the cell the workbook name `name` points at; resolves once the pane has drawn again. */
export async function setNamed(page: Page, name: string, typed: string): Promise<void> {
  await page.evaluate(
    ({ name, typed }) => {
      type Wb = { nameTarget(n: string): { kind: string; sheet: string; address: string } | null; setTyped(s: string, a: string, t: string): void };
      const wb = (window as unknown as { headroomPreview: { workbook: Wb } }).headroomPreview.workbook;
      const t = wb.nameTarget(name);
      if (!t || t.kind !== "cell") throw new Error(`${name} is not one cell`);
      wb.setTyped(t.sheet, t.address, typed);
    },
    { name, typed },
  );
  await page.evaluate(async () => {
    await new Promise((r) => setTimeout(r, 0));
    await (window as unknown as { headroomPreview: { pane: { idle(): Promise<void> } } }).headroomPreview.pane.idle();
  });
}

/** A browser on the served preview: what the browser test files share. */
export interface PreviewSession {
  /** the served dist/, e.g. "http://127.0.0.1:41234/" */
  base: string;
  page: Page;
  /** page errors seen so far: a test file expects none at its end */
  problems: string[];
  close(): Promise<void>;
}

/**
 * Serve the built dist/ on loopback and open headless Chromium (Debian's /usr/bin/chromium) on a 1280 × 800 page;
 * "leave the page?" is answered yes, other dialogs Cancel.
 */
export async function startPreview(): Promise<PreviewSession> {
  if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: apt-get install -y --no-install-recommends chromium (see .ci/run)`);
  if (!existsSync("dist/preview/index.html")) throw new Error("dist/preview/index.html is missing: run npm run build");
  const { server, url } = await startServer({ dir: "dist", port: 0 });
  const browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: ["--disable-gpu", "--disable-quic"] });
  const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
  const page = await context.newPage();
  const problems: string[] = [];
  page.on("pageerror", (e) => problems.push(`page error: ${e.message}`));
  page.on("dialog", (d) => void (d.type() === "beforeunload" ? d.accept() : d.dismiss()));
  return {
    base: url,
    page,
    problems,
    close: async () => {
      await browser.close();
      await new Promise((r) => server.close(r));
    },
  };
}

/** Open the preview on a sample, declining work an earlier test left kept in the browser; resolves once it is ready. */
export async function openSample(s: PreviewSession, sample: string): Promise<void> {
  await s.page.goto(`${s.base}preview/?sample=${encodeURIComponent(sample)}`);
  await s.page.waitForSelector("body[data-ready]", { timeout: 60_000 });
  if ((await s.page.getAttribute("body", "data-ready")) !== "1") throw new Error(`the preview did not start on ${sample}`);
  if (await s.page.locator('[data-role="restore-offer"]').isVisible()) await s.page.click('[data-role="restore-decline"]');
}

/**
 * A test file's browser: started before its first test (`onStart` gets it) and closed after its last, which fails if
 * the page reported an error meanwhile. Returns the session's getter.
 */
export function usePreview(onStart: (s: PreviewSession) => void = () => {}): () => PreviewSession {
  let session: PreviewSession | undefined;
  beforeAll(async () => {
    session = await startPreview();
    onStart(session);
  });
  afterAll(async () => {
    await session?.close();
    expect(session?.problems ?? []).toEqual([]);
  });
  return () => {
    if (!session) throw new Error("the preview has not started");
    return session;
  };
}
