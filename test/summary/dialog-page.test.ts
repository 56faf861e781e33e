// @vitest-environment happy-dom
/**
 * The summary's dialog page (src/summary/dialog-page.ts) against a fake Office: it registers for the pane's messages,
 * says 'ready' only once Office took the handler, shows the summary of the readings it is sent, asks the pane to close
 * it; and, end to end, the pane's button → the dialog → the page showing the pane's verdict, through the very
 * messages Office would carry (both sides in one document here).
 */
import { afterEach, describe, expect, it, vi } from "vitest";
import { startDialogPage, type DialogPageOffice } from "../../src/summary/dialog-page";
import { buildModel } from "../../src/taskpane/model";
import { type PaneHandle, mountPane } from "../../src/taskpane/pane";
import { type DialogHost, openSummaryDialog } from "../../src/taskpane/summaryDialog";
import { encode } from "../../src/taskpane/summaryProtocol";
import { CAUTION } from "../../src/workbook/look";
import { BASE, FakePort } from "../taskpane/fakePort";

/** The dialog page's Office: the handler it registers, what it sent its parent. */
class FakePageOffice implements DialogPageOffice {
  onMessage: ((m: string) => void) | null = null;
  toParent: string[] = [];
  constructor(private readonly accept = true) {}
  listen(onMessage: (m: string) => void, done: (ok: boolean, error: string) => void): void {
    this.onMessage = this.accept ? onMessage : null;
    queueMicrotask(() => done(this.accept, this.accept ? "" : "Internal error"));
  }
  messageParent(m: string): void {
    this.toParent.push(m);
  }
}

let panes: PaneHandle[] = [];
afterEach(async () => {
  for (const p of panes) await p.destroy();
  panes = [];
  document.body.replaceChildren();
});

function statusLine(): HTMLElement {
  const p = document.createElement("p");
  document.body.append(p);
  return p;
}

const PRINTED = new Date(2026, 4, 4);

describe("the dialog page", () => {
  it("says ready once it listens, then shows the summary of what the pane sends, and asks the pane to close it", async () => {
    const office = new FakePageOffice();
    startDialogPage(document, office, statusLine(), () => PRINTED);
    await vi.waitFor(() => expect(office.toParent).toEqual([encode({ type: "ready" })]));
    const readings = await new FakePort({ ...BASE, Project_Site: "Unit 7" }).readInputs();
    office.onMessage!("something else"); // not ours: nothing happens
    expect(document.querySelector('[data-role="summary"]')).toBeNull();
    office.onMessage!(encode({ type: "summary", readings }));
    const page = document.querySelector('[data-role="summary-view"] [data-role="summary"]')!;
    const m = buildModel(readings);
    if (m.kind !== "ready") throw new Error("BASE is not ready");
    expect(page.querySelector('[data-role="summary-verdict"]')?.textContent).toBe(m.estimate.headline);
    expect(page.querySelector('[data-role="summary-site"]')?.textContent).toBe("Unit 7");
    expect(page.querySelector('[data-role="summary-printed"]')?.textContent).toBe("Printed 2026-05-04");
    expect(page.querySelector('[data-role="summary-caution"]')?.textContent).toBe(CAUTION);
    const close = document.querySelector<HTMLButtonElement>('[data-role="summary-close"]')!;
    expect(close.textContent).toBe("Close");
    close.click();
    expect(office.toParent.at(-1)).toBe(encode({ type: "close" }));
  });

  it("shows one summary at a time: a second message replaces the first", async () => {
    const office = new FakePageOffice();
    startDialogPage(document, office, statusLine(), () => PRINTED);
    await vi.waitFor(() => expect(office.toParent.length).toBe(1));
    office.onMessage!(encode({ type: "summary", readings: await new FakePort(BASE).readInputs() }));
    office.onMessage!(encode({ type: "summary", readings: await new FakePort({ ...BASE, Demand_Pressure: 90 }).readInputs() }));
    expect(document.querySelectorAll('[data-role="summary-view"]').length).toBe(1);
    expect(document.querySelector('[data-role="summary"]')?.getAttribute("data-state")).toBe("fail");
  });

  it("where Office does not take its handler, says so and to print the estimate sheet, and never says ready", async () => {
    const office = new FakePageOffice(false);
    const status = statusLine();
    startDialogPage(document, office, status, () => PRINTED);
    await vi.waitFor(() => expect(status.textContent).toMatch(/could not reach the pane \(Internal error\)/));
    expect(status.textContent).toContain("Print the estimate sheet instead");
    expect(office.toParent).toEqual([]);
  });

  it("where the readings sent cannot make an estimate, says so instead of a page", async () => {
    const office = new FakePageOffice();
    const status = statusLine();
    startDialogPage(document, office, status, () => PRINTED);
    await vi.waitFor(() => expect(office.toParent.length).toBe(1));
    office.onMessage!(encode({ type: "summary", readings: await new FakePort({ ...BASE, Supply_Static: "abc" }).readInputs() }));
    expect(document.querySelector('[data-role="summary"]')).toBeNull();
    expect(status.textContent).toMatch(/cannot be read right now/);
  });
});

describe("from the pane's button to the dialog's page", () => {
  it("the page in the dialog shows the verdict the pane shows", async () => {
    const pageOffice = new FakePageOffice();
    // Office between the two: the dialog's messages reach the pane's handler, messageChild reaches the page's
    const handlers = new Map<string, (arg: { message: string; origin: string | undefined } | { error: number }) => void>();
    const dialog = {
      addEventHandler: (type: string, h: (arg: { message: string; origin: string | undefined } | { error: number }) => void) => void handlers.set(type, h),
      messageChild: (m: string) => pageOffice.onMessage!(m),
      close: vi.fn(),
    };
    const opened: string[] = [];
    const host: DialogHost = {
      displayDialogAsync: (url, _options, callback) => {
        opened.push(url);
        callback({ status: "succeeded", value: dialog } as unknown as Office.AsyncResult<Office.Dialog>);
        // the page loads in the dialog; its messageParent reaches the pane
        const originalParent = pageOffice.messageParent.bind(pageOffice);
        pageOffice.messageParent = (m) => {
          originalParent(m);
          handlers.get("dialogMessageReceived")!({ message: m, origin: "https://localhost:3000" });
        };
        startDialogPage(document, pageOffice, statusLine(), () => PRINTED);
      },
      isSetSupported: () => true,
      base: "https://localhost:3000/taskpane.html",
      values: { failed: "failed", message: "dialogMessageReceived", event: "dialogEventReceived" } as unknown as DialogHost["values"],
      setTimeout: (run, ms) => setTimeout(run, ms),
      clearTimeout: (t) => clearTimeout(t as ReturnType<typeof setTimeout>),
    };
    const root = document.createElement("div");
    document.body.append(root);
    const pane = mountPane(root, new FakePort({ ...BASE, Demand_HoseFlow: 250 }), { width: 320, onPrintSummary: (r) => openSummaryDialog(host, r) });
    panes.push(pane);
    await pane.ready;
    await pane.idle();
    root.querySelector<HTMLButtonElement>('[data-role="print-summary"]')!.click();
    await vi.waitFor(() => expect(document.querySelector('[data-role="summary-view"] [data-role="summary"]')).not.toBeNull());
    expect(opened).toEqual(["https://localhost:3000/summary.html"]);
    const paneVerdict = root.querySelector('[data-role="verdict"]')!.textContent;
    expect(document.querySelector('[data-role="summary-verdict"]')!.textContent).toBe(paneVerdict);
    expect(root.querySelector('[data-role="status"]')!.textContent).toBe("");
    document.querySelector<HTMLButtonElement>('[data-role="summary-close"]')!.click();
    expect(dialog.close).toHaveBeenCalledTimes(1);
  });
});
