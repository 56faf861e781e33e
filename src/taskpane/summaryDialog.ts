/**
 * The one-page summary in Excel: the pane opens summary.html (../summary/dialog-page.ts, built beside taskpane.html, on the
 * add-in's own origin) in an Office dialog and hands it the readings by the documented route: the dialog says it is
 * ready with messageParent, the pane answers with Dialog.messageChild ("Pass information to the dialog box",
 * https://learn.microsoft.com/office/dev/add-ins/develop/dialog-api-in-office-add-ins#pass-information-to-the-dialog-box).
 *
 * messageChild and the dialog's DialogParentMessageReceived event are DialogApi 1.2, which "can't be specified in the
 * add-in manifest" (same page): the pane checks it at runtime before it opens the dialog. Where the dialog cannot open
 * (DialogApi 1.2 missing, a pop-up blocked or ignored on the web: 12009, 12011; any other error) the pane's status
 * line says so and points to the dependable route: printing the estimate sheet, whose print area puts the verdict and
 * the caution on one page (../workbook/excel.ts, setPrint). Error codes:
 * https://learn.microsoft.com/office/dev/add-ins/develop/dialog-handle-errors-events.
 *
 * Everything goes through a DialogHost so that tests run it against a fake Office.
 */
import type { SummaryOutcome, SummaryRequest } from "./pane";
import { decodeDialogMessage, encode } from "./summaryProtocol";

/** The Dialog API version the route needs: messageChild and DialogParentMessageReceived. */
export const DIALOG_API = "1.2";

/** The dialog's size, percent of the screen: room for the page (about 190 mm wide) and its toolbar. */
export const DIALOG_SIZE = { width: 60, height: 90 } as const;

/** How long the pane waits for the dialog's page to say it is ready, ms. */
export const DIALOG_READY_MS = 30_000;

/** The dialog's page, beside the pane's page. */
export const DIALOG_PAGE = "summary.html";

/** What the pane needs of Office for the dialog. */
export interface DialogHost {
  /** Office.context.ui.displayDialogAsync */
  displayDialogAsync(url: string, options: Office.DialogOptions, callback: (result: Office.AsyncResult<Office.Dialog>) => void): void;
  /** Office.context.requirements.isSetSupported */
  isSetSupported(name: string, version: string): boolean;
  /** the pane page's own address: the dialog's page is resolved against it, so it shares its origin */
  base: string;
  /** Office's values: the failed status of an AsyncResult, the two events of a Dialog */
  values: { failed: Office.AsyncResultStatus; message: Office.EventType; event: Office.EventType };
  setTimeout(run: () => void, ms: number): unknown;
  clearTimeout(timer: unknown): void;
}

/** The host of a running add-in. */
export function officeDialogHost(): DialogHost {
  return {
    displayDialogAsync: (url, options, callback) => Office.context.ui.displayDialogAsync(url, options, callback),
    isSetSupported: (name, version) => Office.context.requirements.isSetSupported(name, version),
    base: window.location.href,
    values: { failed: Office.AsyncResultStatus.Failed, message: Office.EventType.DialogMessageReceived, event: Office.EventType.DialogEventReceived },
    setTimeout: (run, ms) => window.setTimeout(run, ms),
    clearTimeout: (timer) => window.clearTimeout(timer as number),
  };
}

/** The dependable route, said after every refusal. */
export const PRINT_SHEET =
  "Print the estimate sheet instead (File > Print): a sheet made by New estimate sheet prints the verdict and the caution on one page.";

/** Why the dialog did not open, in words, with the way round it. */
export function refusal(code: number | null, message = ""): string {
  switch (code) {
    case null:
      return `This version of Excel cannot pass the estimate to a summary window (it lacks DialogApi ${DIALOG_API}). ${PRINT_SHEET}`;
    case 12007:
      return "The summary is already open in its own window: switch to it, or close it and try again.";
    case 12009:
      return `The summary window was not allowed to open. Choose Allow when Excel asks, or ${lower(PRINT_SHEET)}`;
    case 12011:
      return `The browser blocks pop-up windows, so the summary cannot open. Allow pop-ups for Excel, or ${lower(PRINT_SHEET)}`;
    case 12002:
      return `The summary window could not load its page (12002). ${PRINT_SHEET}`;
    default:
      return `The summary window could not open (${code}${message ? `: ${message}` : ""}). ${PRINT_SHEET}`;
  }
}

function lower(s: string): string {
  return s.charAt(0).toLowerCase() + s.slice(1);
}

/**
 * Open the summary of the pane's estimate in an Office dialog. Resolves once the dialog has its data ({ shown: true }),
 * or with the reason it could not open; later, the dialog's Close button closes it.
 */
export function openSummaryDialog(host: DialogHost, request: SummaryRequest): Promise<SummaryOutcome> {
  if (!host.isSetSupported("DialogApi", DIALOG_API)) return Promise.resolve({ shown: false, reason: refusal(null) });
  const url = new URL(DIALOG_PAGE, host.base).href;
  return new Promise<SummaryOutcome>((resolve) => {
    let settled = false;
    let timer: unknown;
    const settle = (outcome: SummaryOutcome) => {
      if (settled) return;
      settled = true;
      if (timer !== undefined) host.clearTimeout(timer);
      resolve(outcome);
    };
    host.displayDialogAsync(url, { width: DIALOG_SIZE.width, height: DIALOG_SIZE.height }, (result) => {
      if (result.status === host.values.failed) {
        settle({ shown: false, reason: refusal(result.error.code, result.error.message) });
        return;
      }
      const dialog = result.value;
      timer = host.setTimeout(() => {
        dialog.close();
        settle({ shown: false, reason: `The summary window did not answer. ${PRINT_SHEET}` });
      }, DIALOG_READY_MS);
      dialog.addEventHandler(host.values.message, (arg) => {
        const message = "message" in arg ? decodeDialogMessage(arg.message) : null;
        if (message?.type === "ready") {
          dialog.messageChild(encode({ type: "summary", readings: request.readings }));
          settle({ shown: true });
        } else if (message?.type === "close") {
          dialog.close();
        }
      });
      dialog.addEventHandler(host.values.event, (arg) => {
        // 12006: closed by the reader (before it loaded, nothing to report); 12002, 12003: its page could not load
        const code = "error" in arg ? arg.error : null;
        settle(code === 12006 ? { shown: true } : { shown: false, reason: refusal(code) });
      });
    });
  });
}
