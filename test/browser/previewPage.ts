/**
 * What the browser tests do to the preview page: type into the cell a workbook name points at, as a user would type
 * into that cell, and wait until the pane has read the workbook again.
 */
import type { Page } from "playwright-core";

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
