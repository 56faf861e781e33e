/**
 * The summary's Office dialog page (summary.html, entry ./summary.ts): it listens for the pane's message
 * (DialogParentMessageReceived, registered with UI.addHandlerAsync), says it is ready (messageParent), and shows the
 * summary of the readings it is sent in the print view, whose Close asks the pane to close the dialog. Only
 * messageParent and isSetSupported among Office's APIs may be called in a dialog
 * (https://learn.microsoft.com/office/dev/add-ins/develop/dialog-best-practices), plus the handler registration of
 * "Handle DialogParentMessageReceived in the dialog box"
 * (https://learn.microsoft.com/office/dev/add-ins/develop/dialog-api-in-office-add-ins).
 *
 * Everything goes through a DialogPageOffice so that tests run it against a fake Office.
 */
import { buildModel } from "../taskpane/model";
import { summaryFacts } from "./facts";
import { PRINT_SHEET } from "../taskpane/summaryDialog";
import { decodePaneMessage, encode } from "../taskpane/summaryProtocol";
import { type SummaryView, showSummaryView } from "./view";

/** What the dialog page needs of Office. */
export interface DialogPageOffice {
  /** register for the pane's messages; `done` says whether Office took the handler */
  listen(onMessage: (message: string) => void, done: (ok: boolean, error: string) => void): void;
  messageParent(message: string): void;
}

/** The Office of a running dialog. */
export function officeDialogPage(): DialogPageOffice {
  return {
    listen: (onMessage, done) =>
      Office.context.ui.addHandlerAsync(
        Office.EventType.DialogParentMessageReceived,
        (arg) => onMessage(arg.message),
        (result) => done(result.status === Office.AsyncResultStatus.Succeeded, result.error?.message ?? ""),
      ),
    messageParent: (message) => Office.context.ui.messageParent(message),
  };
}

/** Start the dialog page: `status` is the page's line for what goes wrong before there is a summary to show. */
export function startDialogPage(doc: Document, office: DialogPageOffice, status: HTMLElement, now: () => Date = () => new Date()): void {
  let view: SummaryView | null = null;
  office.listen(
    (text) => {
      const message = decodePaneMessage(text);
      if (!message) return; // not one of ours
      const model = buildModel(message.readings);
      if (model.kind !== "ready") {
        status.textContent = `The pane's inputs cannot be read right now. Close this window, look at the pane, and try again; or ${PRINT_SHEET.charAt(0).toLowerCase()}${PRINT_SHEET.slice(1)}`;
        return;
      }
      view?.remove();
      view = showSummaryView(doc, model.estimate, summaryFacts(message.readings), {
        printedOn: now(),
        closeLabel: "Close",
        onClose: () => office.messageParent(encode({ type: "close" })),
      });
    },
    (ok, error) => {
      if (ok) office.messageParent(encode({ type: "ready" }));
      else status.textContent = `The summary could not reach the pane (${error}). Close this window. ${PRINT_SHEET}`;
    },
  );
}
