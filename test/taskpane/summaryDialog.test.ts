// @vitest-environment happy-dom
/**
 * The pane's side of the one-page summary in Excel (src/taskpane/summaryDialog.ts), against a fake Office: Office's
 * context (ui.displayDialogAsync, requirements.isSetSupported) is an office-addin-mock object, the Dialog it hands
 * back a fake that records its handlers; Office's enums carry the string values office.js gives them
 * (@microsoft/office-js 1.1.110: EventType.DialogMessageReceived "dialogMessageReceived", AsyncResultStatus.Failed
 * "failed"). The dialog call and its options, the message exchange, and every refusal: each says to print the
 * estimate sheet instead.
 */
import { OfficeMockObject } from "office-addin-mock";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import type { SummaryRequest } from "../../src/taskpane/pane";
import { buildModel } from "../../src/taskpane/model";
import { DIALOG_API, DIALOG_READY_MS, DIALOG_SIZE, PRINT_SHEET, officeDialogHost, openSummaryDialog } from "../../src/taskpane/summaryDialog";
import { decodeDialogMessage, decodePaneMessage, encode } from "../../src/taskpane/summaryProtocol";
import { INPUT_NAMES, type Readings } from "../../src/workbook/port";
import { BASE, FakePort, candidatesTable } from "./fakePort";

const OFFICE_ENUMS = {
  EventType: { DialogMessageReceived: "dialogMessageReceived", DialogEventReceived: "dialogEventReceived", DialogParentMessageReceived: "dialogParentMessageReceived" },
  AsyncResultStatus: { Succeeded: "succeeded", Failed: "failed" },
};

type Handler = (arg: { message: string; origin: string | undefined } | { error: number }) => void;

/** The Dialog displayDialogAsync hands back: its handlers by event, and what the pane asked of it. */
class FakeDialog {
  handlers = new Map<string, Handler>();
  sent: string[] = [];
  closed = 0;
  addEventHandler = vi.fn((type: string, handler: Handler) => void this.handlers.set(type, handler));
  messageChild = vi.fn((message: string) => void this.sent.push(message));
  close = vi.fn(() => void this.closed++);
  /** the dialog's page calls messageParent */
  fromPage(message: string): void {
    this.handlers.get("dialogMessageReceived")!({ message, origin: "https://localhost:3000" });
  }
  event(error: number): void {
    this.handlers.get("dialogEventReceived")!({ error });
  }
}

let dialog: FakeDialog;
let displayDialogAsync: ReturnType<typeof vi.fn>;
let supported: boolean;

/** Office, with the dialog opening, or failing with `error`. */
function stubOffice(error?: { code: number; message: string }) {
  dialog = new FakeDialog();
  displayDialogAsync = vi.fn((_url: string, _options: Office.DialogOptions, callback: (r: unknown) => void) => {
    setTimeout(() => callback(error ? { status: "failed", error } : { status: "succeeded", value: dialog }), 0);
  });
  const context = new OfficeMockObject({
    ui: { displayDialogAsync },
    requirements: { isSetSupported: vi.fn((name: string, version: string) => supported && name === "DialogApi" && version === DIALOG_API) },
  });
  vi.stubGlobal("Office", { context, ...OFFICE_ENUMS });
}

async function request(): Promise<SummaryRequest> {
  const readings = await new FakePort({ ...BASE, Project_Site: "Unit 7", Supply_When: "2026-03-14, hydrant H-2" }).readInputs();
  const m = buildModel(readings);
  if (m.kind !== "ready") throw new Error("BASE is not ready");
  return { estimate: m.estimate, readings };
}

beforeEach(() => {
  supported = true;
  // the pane's page, as the dev server serves it (happy-dom's own hook)
  (window as unknown as { happyDOM: { setURL(url: string): void } }).happyDOM.setURL("https://localhost:3000/taskpane.html");
});

afterEach(() => {
  vi.unstubAllGlobals();
  vi.useRealTimers();
});

describe("opening the summary in an Office dialog", () => {
  it("opens summary.html beside the pane's page, at 60 % × 90 % of the screen", async () => {
    stubOffice();
    const shown = openSummaryDialog(officeDialogHost(), await request());
    await vi.waitFor(() => expect(displayDialogAsync).toHaveBeenCalledTimes(1));
    const [url, options] = displayDialogAsync.mock.calls[0];
    expect(url).toBe("https://localhost:3000/summary.html");
    expect(options).toEqual({ width: DIALOG_SIZE.width, height: DIALOG_SIZE.height });
    await vi.waitFor(() => expect(dialog.addEventHandler).toHaveBeenCalledTimes(2));
    expect([...dialog.handlers.keys()].sort()).toEqual(["dialogEventReceived", "dialogMessageReceived"]);
    dialog.fromPage(encode({ type: "ready" }));
    await expect(shown).resolves.toEqual({ shown: true });
  });

  it("answers the page's 'ready' with the readings (messageChild), and closes the dialog on its 'close'", async () => {
    stubOffice();
    const req = await request();
    const shown = openSummaryDialog(officeDialogHost(), req);
    await vi.waitFor(() => expect(dialog.handlers.size).toBe(2));
    // a message that is not ours is left alone
    dialog.fromPage("hello");
    expect(dialog.messageChild).not.toHaveBeenCalled();
    dialog.fromPage(encode({ type: "ready" }));
    expect(dialog.messageChild).toHaveBeenCalledTimes(1);
    const sent = decodePaneMessage(dialog.sent[0]);
    expect(sent?.readings).toEqual(req.readings);
    await expect(shown).resolves.toEqual({ shown: true });
    expect(dialog.closed).toBe(0);
    dialog.fromPage(encode({ type: "close" }));
    expect(dialog.closed).toBe(1);
    // the reader closing it with its X afterwards changes nothing
    dialog.event(12006);
  });

  it("where DialogApi 1.2 is missing, opens nothing and says to print the estimate sheet", async () => {
    supported = false;
    stubOffice();
    const outcome = await openSummaryDialog(officeDialogHost(), await request());
    expect(displayDialogAsync).not.toHaveBeenCalled();
    expect(outcome).toEqual({ shown: false, reason: expect.stringContaining(`DialogApi ${DIALOG_API}`) });
    if (!outcome.shown) expect(outcome.reason).toContain(PRINT_SHEET);
  });

  it.each([
    [12009, "The user chose to ignore the dialog box.", /was not allowed to open/],
    [12011, "Pop-ups are blocked.", /blocks pop-up windows/],
    [12004, "Domain is not trusted.", /could not open \(12004: Domain is not trusted\.\)/],
    [5001, "Internal error.", /could not open \(5001: Internal error\.\)/],
  ])("when the dialog cannot open (%i), says why and to print the estimate sheet instead", async (code, message, why) => {
    stubOffice({ code, message });
    const outcome = await openSummaryDialog(officeDialogHost(), await request());
    expect(outcome.shown).toBe(false);
    if (outcome.shown) return;
    expect(outcome.reason).toMatch(why);
    expect(outcome.reason.toLowerCase()).toContain("print the estimate sheet instead");
  });

  it("when a dialog is already open (12007), says where it is", async () => {
    stubOffice({ code: 12007, message: "A dialog is already open." });
    const outcome = await openSummaryDialog(officeDialogHost(), await request());
    expect(outcome).toEqual({ shown: false, reason: expect.stringMatching(/already open in its own window/) });
  });

  it("when the dialog's page cannot load (12002) before it is ready, says so", async () => {
    stubOffice();
    const shown = openSummaryDialog(officeDialogHost(), await request());
    await vi.waitFor(() => expect(dialog.handlers.size).toBe(2));
    dialog.event(12002);
    const outcome = await shown;
    expect(outcome).toEqual({ shown: false, reason: expect.stringContaining("could not load its page (12002)") });
  });

  it("when the page never says it is ready, closes the dialog after DIALOG_READY_MS and says so", async () => {
    vi.useFakeTimers();
    stubOffice();
    const shown = openSummaryDialog(officeDialogHost(), await request());
    await vi.advanceTimersByTimeAsync(0);
    expect(dialog.handlers.size).toBe(2);
    await vi.advanceTimersByTimeAsync(DIALOG_READY_MS);
    await expect(shown).resolves.toEqual({ shown: false, reason: expect.stringContaining("did not answer") });
    expect(dialog.closed).toBe(1);
  });
});

describe("the messages between the pane and the dialog", () => {
  it("carry the table of candidate design areas, so that the dialog judges the area the pane judges", async () => {
    const { readings } = await request();
    const withTable: Readings = { ...readings, Design_Candidates: candidatesTable([["Print hall", 562, 48, null], ["Paper store", 1000, 66, 700]]) };
    expect(decodePaneMessage(encode({ type: "summary", readings: withTable }))).toEqual({ type: "summary", readings: withTable });
    // a table that is not one is refused like any other reading that is not one
    const odd = { ...withTable, Design_Candidates: { kind: "table", address: "Estimate!A60:D60", rows: [[{ kind: "number", value: "5" }]] } };
    expect(decodePaneMessage(JSON.stringify({ type: "summary", readings: odd }))).toBeNull();
    const invalid = { ...withTable, Design_Candidates: { kind: "invalid", reason: "3 columns wide" } };
    expect(decodePaneMessage(encode({ type: "summary", readings: invalid as Readings }))).toEqual({ type: "summary", readings: invalid });
  });

  it("carry the readings exactly, and refuse anything else", async () => {
    const { readings } = await request();
    expect(decodePaneMessage(encode({ type: "summary", readings }))).toEqual({ type: "summary", readings });
    expect(decodeDialogMessage(encode({ type: "ready" }))).toEqual({ type: "ready" });
    expect(decodeDialogMessage('{"type":"other"}')).toBeNull();
    expect(decodeDialogMessage("not json")).toBeNull();
    expect(decodePaneMessage('{"type":"summary"}')).toBeNull();
    // every name must come with a reading of a known kind, numbers finite
    const without = { ...readings } as Partial<Readings>;
    delete without[INPUT_NAMES[1]];
    expect(decodePaneMessage(JSON.stringify({ type: "summary", readings: without }))).toBeNull();
    const odd = { ...readings, Supply_Static: { kind: "number", value: "72" } };
    expect(decodePaneMessage(JSON.stringify({ type: "summary", readings: odd }))).toBeNull();
    const unknown = { ...readings, Supply_Static: { kind: "formula", value: 72 } };
    expect(decodePaneMessage(JSON.stringify({ type: "summary", readings: unknown }))).toBeNull();
  });
});
