/**
 * What the one-page summary says beside the verdict, read from the workbook's named cells (SUMMARY_NAMES of
 * ../workbook/port.ts) and from the pane's estimate: the project, the flow test's date and place, the design, and
 * the key inputs in plain words. Free of the DOM; ./page.ts lays it out.
 *
 * Every one of these names is optional: a workbook without them gets a summary that says what it does not know.
 */
import { formatFlow, formatPressure } from "../engine/decision";
import { HAZARD_CODES, type Hazard, hazardInfo } from "../engine/design";
import { type UnitSystem, unitName } from "../engine/units";
import type { Estimate } from "../taskpane/model";
import type { Reading, Readings } from "../workbook/port";

export interface SummaryFacts {
  site: string | null;
  address: string | null;
  preparedBy: string | null;
  /** when and where the governing flow test was made */
  testWhen: string | null;
  /** the occupancy hazard code, or what is stored in a design by number of sprinklers, as the sheet says it */
  hazard: string | null;
  /** wet, dry, preaction... as the sheet says it */
  system: string | null;
  /** the design area in the sheet's units, or null (not given, or a design by number of sprinklers) */
  designArea: number | null;
}

/** A text name's value: the text (a number typed there as its digits), or null when blank, missing or in error. */
function text(r: Reading): string | null {
  if (r.kind === "text") return r.value.trim() === "" ? null : r.value.trim();
  if (r.kind === "number") return String(r.value);
  return null;
}

/** The summary's facts from the readings the pane's estimate was built from. */
export function summaryFacts(readings: Readings): SummaryFacts {
  const area = readings.Design_Area;
  return {
    site: text(readings.Project_Site),
    address: text(readings.Project_Address),
    preparedBy: text(readings.Project_PreparedBy),
    testWhen: text(readings.Supply_When),
    hazard: text(readings.Design_Hazard),
    system: text(readings.Design_System),
    designArea: area.kind === "number" && area.value > 0 ? area.value : null,
  };
}

/**
 * A hazard in words: NFPA 13's occupancy class by name with its code ("Ordinary hazard group 2 (OH2)"); anything
 * else (a storage description) as the sheet has it.
 */
export function hazardWords(hazard: string): string {
  const code = hazard.trim().toUpperCase();
  if (!(HAZARD_CODES as readonly string[]).includes(code)) return hazard;
  const name = hazardInfo(code as Hazard).name;
  return `${name.charAt(0).toUpperCase()}${name.slice(1)} (${code})`;
}

/** The sheet's system words as a reader knows them: "wet" → "Wet pipe"; anything else as typed, capitalised. */
export function systemWords(system: string): string {
  const s = system.trim();
  const known: Record<string, string> = { wet: "Wet pipe", dry: "Dry pipe" };
  return known[s.toLowerCase()] ?? `${s.charAt(0).toUpperCase()}${s.slice(1)}`;
}

/** An area in the sheet's units, as the sheet formats it (whole ft², m² to one decimal). */
export function areaWords(area: number, units: UnitSystem): string {
  return `${Number(area.toFixed(units === "SI" ? 1 : 0))} ${unitName("area", units)}`;
}

/**
 * The run segment losing the most, where the estimate carries the pressure breakdown (the pane reads it from
 * Run_WorstSegment and its loss); null where it does not.
 */
export function worstSegment(e: Estimate): { segment: string; loss: number } | null {
  return e.breakdown?.worst ?? null;
}

/** One row of the key inputs: what it is, and its value in words. */
export type KeyInput = [label: string, value: string];

/**
 * The key inputs a project manager checks: the flow test used (its pressures and flow, when and where), the design
 * area judged where several are compared, the hazard or what is stored, the system, the design area, the demand at
 * the supply (and the other areas compared, each with its margin) and the margin required, and the pipe that loses
 * the most where the sheet names it. Rows the workbook does not give are left out, save the test's date.
 */
export function keyInputs(e: Estimate, f: SummaryFacts): KeyInput[] {
  const u = e.units;
  const t = e.test;
  const rows: KeyInput[] = [
    ["Flow test used", `${formatPressure(t.static, u)} static, ${formatPressure(t.residual, u)} residual at ${formatFlow(t.testFlow, u)}`],
    ["Tested", f.testWhen ?? "date and place not given on the sheet"],
  ];
  // several design areas: the verdict is the controlling one's; the hazard, system and design area on the sheet are
  // the sheet's own area's, and say so where another controls
  const several = e.candidates.length >= 2;
  const controlling = e.candidates.find((c) => c.controls);
  if (several && controlling) rows.push(["Design area judged", `${controlling.name}: the least margin of the ${e.candidates.length} compared`]);
  const own = several && !e.judgesOwn ? `, ${e.candidates[0].name}` : "";
  if (f.hazard) {
    const words = hazardWords(f.hazard);
    // in SI work the classes are NFPA 13's with converted values, as the sheet and the pane say
    rows.push([`Hazard${own}`, u === "SI" && words !== f.hazard ? `${words}: NFPA 13's class, values in SI` : words]);
  }
  if (f.system) rows.push([`System${own}`, systemWords(f.system)]);
  if (f.designArea !== null) rows.push([`Design area${own}`, areaWords(f.designArea, u)]);
  const hose = e.hoseFlow !== null && e.hoseFlow > 0 ? ` (hose ${formatFlow(e.hoseFlow, u)} included)` : "";
  rows.push(["Demand at the supply", `${formatFlow(e.demandFlow, u)} at ${formatPressure(e.demandPressure, u)}${hose}`]);
  if (several) {
    const others = e.candidates.filter((c) => !c.controls);
    const margin = (m: number) => `${m < 0 ? "−" : ""}${formatPressure(m, u)}`;
    rows.push(["Also compared", others.map((c) => `${c.name}, ${formatFlow(c.flow, u)} at ${formatPressure(c.pressure, u)}, margin ${margin(c.margin)}`).join("; ")]);
  }
  rows.push(["Margin required", e.requiredMarginGiven ? formatPressure(e.requiredMargin, u) : "none set"]);
  const worst = worstSegment(e);
  if (worst) rows.push(["Pipe losing the most", `${worst.segment}, ${formatPressure(worst.loss, u)}`]);
  return rows;
}
