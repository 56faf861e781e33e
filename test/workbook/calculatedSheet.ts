/**
 * An estimate sheet of a scenario calculated by the preview's formula engine with the real cell functions (register
 * them first: registerHeadroomFunctions), read as a user reads it: the value beside a label, and the named cells.
 */
import { templateNames, templateSheet } from "../../src/preview/fromTemplate";
import { PreviewPort } from "../../src/preview/port";
import { PreviewWorkbook } from "../../src/preview/workbook";
import { parseCell } from "../../src/workbook/a1";
import type { InputName, Readings } from "../../src/workbook/port";
import { type Scenario, demoScenario } from "../../src/workbook/scenario";
import { estimateTemplate } from "../../src/workbook/template";

/**
 * The sheet of a scenario, calculated. `row(label)` is the row of a label (or of a run segment's name) in column A,
 * `at(label, col)` the value in that row's column (B by default), `num(name)` a named cell that must hold a number.
 */
export async function calculatedSheet(s: Scenario) {
  const t = estimateTemplate(s);
  const wb = new PreviewWorkbook({ sheets: [templateSheet(t)], names: templateNames(t) });
  const row = (label: string) => {
    const c = t.cells.find((x) => (x.role === "label" || x.role === "input") && x.value === label && x.address.startsWith("A"));
    if (!c) throw new Error(`no label "${label}"`);
    return parseCell(c.address).row + 1;
  };
  const at = (label: string, col = "B") => wb.value("Estimate", `${col}${row(label)}`);
  const readings: Readings = await new PreviewPort(wb).readInputs();
  const num = (name: InputName) => {
    const r = readings[name];
    if (r.kind !== "number") throw new Error(`${name} is ${JSON.stringify(r)}`);
    return r.value;
  };
  return { t, wb, at, row, readings, num };
}

/** The US demo scenario, changed. */
export function usDemo(change: (s: Scenario) => void = () => {}): Scenario {
  const s = demoScenario("US");
  change(s);
  return s;
}
