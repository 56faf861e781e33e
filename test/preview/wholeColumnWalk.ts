/**
 * Run as its own process by port.test.ts: the preview port's walk back from a formula reading a whole column and a
 * whole row, its answer printed as JSON. Its own process, so that a walk that never ends is ended from outside (a
 * loop that never yields blocks the test runner's own timeout).
 */
import { PreviewWorkbook } from "../../src/preview/workbook";
import { PreviewPort } from "../../src/preview/port";

const wb = new PreviewWorkbook({
  sheets: [
    {
      name: "S",
      cells: {
        A1: { content: "abc", style: { role: "input" } },
        B1: { content: 5 },
        B2: { content: 6, style: { role: "input" } },
        D3: { content: 7, style: { role: "input" } },
        C1: { content: "=A1+SUM(B:B)" },
        C2: { content: "=SUM(3:3)" },
      },
    },
  ],
  names: [],
  activeSheet: "S",
});
void new PreviewPort(wb).inputsBehind(["S!C1", "S!C2"]).then((r) => process.stdout.write(JSON.stringify(r)));
