/**
 * The estimate sheet changes only on purpose: what the template (and the preview's sheet built from it) produces for
 * the demo, sample and variant scenarios equals the committed snapshot, cell for cell, name for name, series for
 * series. After changing the sheet on purpose, rewrite the snapshot (see ./templateSnapshot.ts) and review the diff.
 */
import { readFile } from "node:fs/promises";
import { describe, expect, it } from "vitest";
import { SNAPSHOT_FILE, snapshotScenarios, snapshotText, takeSnapshot } from "./templateSnapshot";

describe("estimate template snapshot", async () => {
  const committed = JSON.parse(await readFile(SNAPSHOT_FILE, "utf8")) as Record<string, unknown>;
  const fresh = takeSnapshot();

  it("covers every scenario, and only those", () => {
    expect(Object.keys(committed).sort()).toEqual(Object.keys(snapshotScenarios()).sort());
  });

  it.each(Object.keys(snapshotScenarios()))("%s: the same cells, names, chart, merges and row heights", (key) => {
    const was = committed[key] as { template: { cells: unknown[] } };
    // a snapshot of nothing proves nothing
    expect(was.template.cells.length).toBeGreaterThan(150);
    expect(fresh[key]).toEqual(was);
  });

  it("is written in the form the writer gives it", async () => {
    expect(await readFile(SNAPSHOT_FILE, "utf8")).toBe(snapshotText(committed));
  });
});
