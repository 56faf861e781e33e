/**
 * Entry of the task pane page, which is also the add-in's shared runtime: the functions bundle is loaded on the same
 * page (see webpack.config.js), so the cell functions and the pane share one JavaScript context.
 */
Office.onReady((info) => {
  const status = document.getElementById("status");
  if (status) {
    status.textContent = info.host === Office.HostType.Excel ? "Connected to Excel." : "Not running inside Excel.";
  }
});
