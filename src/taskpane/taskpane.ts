/**
 * Entry of the task pane page, which is also the add-in's shared runtime: the functions bundle is loaded on the same
 * page (see webpack.config.js), so the cell functions and the pane share one JavaScript context.
 *
 * Office.onReady → the Excel side of the Workbook port → the pane. The pane itself (./pane.ts) knows nothing of
 * Office.js; the preview host mounts it over its own port. The pane's One-page summary opens in an Office dialog
 * (./summaryDialog.ts), or says why it cannot and to print the estimate sheet instead.
 */
import { officeDialogHost, openSummaryDialog } from "./summaryDialog";
import { createExcelPort } from "../workbook/excel";
import { mountPane } from "./pane";

/** Requirement set the port needs: worksheets.onChanged and Range.copyFrom are ExcelApi 1.9. */
const EXCEL_API = "1.9";

Office.onReady((info) => {
  const root = document.getElementById("headroom-pane");
  const status = document.getElementById("headroom-status");
  if (!root) return;
  if (info.host !== Office.HostType.Excel) {
    if (status) status.textContent = "Headroom's pane runs inside Excel.";
    return;
  }
  if (!Office.context.requirements.isSetSupported("ExcelApi", EXCEL_API)) {
    if (status) status.textContent = `This version of Excel lacks ExcelApi ${EXCEL_API}, which the pane needs; the HEADROOM cell functions still work.`;
    return;
  }
  mountPane(root, createExcelPort(), { onPrintSummary: (request) => openSummaryDialog(officeDialogHost(), request) });
});
