/**
 * Entry of the summary's Office dialog page (summary.html): see ./dialog-page.ts. The pane (../taskpane/taskpane.ts)
 * opens it through ../taskpane/summaryDialog.ts.
 */
import { officeDialogPage, startDialogPage } from "./dialog-page";

Office.onReady(() => {
  const status = document.getElementById("summary-status");
  if (status) startDialogPage(document, officeDialogPage(), status);
});
