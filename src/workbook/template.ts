/**
 * The estimate worksheet of a scenario: its sections (./sections.ts) one after the other, a blank row between two,
 * with the chart beside the first ones. The Excel host (./excel.ts) writes it into a workbook, the preview host loads
 * it into its formula engine, and the sample workbooks are built from it. What it is made of: ./sheet.ts.
 *
 * Sections, top to bottom:
 *   caution, project and units · water supply (up to three flow tests, a pitot reading through PITOTFLOW, each test
 *   carried to the site by SITETEST) · hazard and design area (DESIGNAREA, DESIGNDENSITY, HOSEALLOWANCE, DURATION), or
 *   for a design by number of sprinklers the storage criteria typed in · sprinklers and the design area's pipes
 *   (HEADFLOW, PIPEID, CFACTOR, ADJUSTAREA, AREADEMAND or, for a grid, GRIDDEMAND; or HEADSDEMAND), the fittings inside the area (FITTINGS,
 *   FRICTION) · the pipe run back to the supply (PIPEID, CFACTOR, FITTINGS helper columns into PIPERUN; the inside hose
 *   where a segment carries it; VELOCITY and FRICTIONRATE beside it) · where the pressure goes · demand at the supply
 *   and the flow through a pump · the design areas compared (this sheet's and the others typed; the least margin
 *   controls) · verdict, for the controlling design area (the
 *   governing flow test, MARGIN, VERDICT, PUMPBOOST, PUMPSIZE, PUMPSUCTION, the chosen pump through PUMPCURVE, a
 *   suction tank's volume) · supply curve for the chart (SUPPLYCURVE).
 */
import type { Scenario } from "./scenario";
import {
  type AreaDemandSection,
  breakdownSection,
  candidatesSection,
  gridDemandSection,
  hazardSection,
  headsDemandSection,
  pipeRunSection,
  projectSection,
  storageCriteriaSection,
  supplyCurveSection,
  supplyDemandSection,
  treeDemandSection,
  verdictSection,
  waterSupplySection,
} from "./sections";
import { columnLetters, parseCell } from "./a1";
import { type Section, type SheetTemplate, type TemplateCell, type TemplatePrint, templateExtent } from "./sheet";

/** Blank rows between two sections. */
const GAP = 1;

/** Where the chart stands: right of the upper sections, which use columns A to D only. */
export const CHART_FROM = "F5";
export const CHART_TO = "N24";

/** Column widths in points: A labels, B values, C units, D notes; the run table's columns E to T. */
const COLUMN_WIDTHS: Readonly<Record<string, number>> = {
  A: 230, B: 95, C: 80, D: 95, E: 70, F: 60, G: 60, H: 70, I: 40, J: 55, K: 70, L: 50, M: 60, N: 60, O: 60, P: 50, Q: 70, R: 55, S: 70, T: 90,
};

export interface TemplateOptions {
  /**
   * the section that finds the design area's demand; by default the scenario's: the tree of branch lines and a cross
   * main by the density/area method, or a number of sprinklers
   */
  areaDemand?: AreaDemandSection;
}

/**
 * The estimate worksheet for a scenario. Every formula passes the sheet's Units cell as its `units` argument, so the
 * same layout serves US and SI work.
 */
/** The demand section of a scenario's design. */
const DEMAND_SECTIONS: Record<Scenario["design"]["kind"], AreaDemandSection> = {
  area: treeDemandSection,
  grid: gridDemandSection,
  heads: headsDemandSection,
};

export function estimateTemplate(s: Scenario, { areaDemand = DEMAND_SECTIONS[s.design.kind] }: TemplateOptions = {}): SheetTemplate {
  const built: Array<Section<unknown>> = [];
  let row = 1;
  /** Lay a section down at the current row; its refs, for the sections after it. */
  const lay = <R>(section: Section<R>): R => {
    built.push(section);
    row += section.rows + GAP;
    return section.refs;
  };
  const { units } = lay(projectSection(s, row));
  const supply = lay(waterSupplySection(s, row, { units }));
  const hazard = lay(s.design.kind === "heads" ? storageCriteriaSection(s, row) : hazardSection(s, row, { units }));
  const area = lay(areaDemand(s, row, { units, hazard }));
  const run = lay(pipeRunSection(s, row, { units, area, hazard }));
  lay(breakdownSection(s, row, { area, run }));
  const demand = lay(supplyDemandSection(s, row, { area, hazard, run }));
  const judged = lay(candidatesSection(s, row, { units, supply, demand }));
  const { used } = lay(verdictSection(s, row, { units, supply, hazard, demand: judged }));
  const { chart } = lay(supplyCurveSection(s, row, { units, supply: used, demand, judged }));

  const sheet: Omit<SheetTemplate, "print"> = {
    sheetName: "Estimate",
    units: s.units,
    cells: built.flatMap((b) => b.cells),
    names: built.flatMap((b) => b.names),
    chart: { ...chart, from: CHART_FROM, to: CHART_TO },
    columnWidths: { ...COLUMN_WIDTHS },
  };
  return { ...sheet, print: printSetup(sheet) };
}

/**
 * The print setup of the estimate: the whole template (its extent, which takes in the chart beside the upper
 * sections), scaled to one page wide and one page tall, so that the first page holds the caution at the top and the
 * verdict further down whatever the paper; the title and the caution repeat on every page should a user print it
 * larger, over several pages. Portrait: the sheet is taller than it is wide (1490 pt of columns, some 2430 pt of rows
 * at Excel's default 15 pt a row with the wrapped notes' taller rows), so an upright page gives the larger scale, and
 * there the height sets it: about 28 % on Letter (684 pt of 2430) and 30 % on A4 (734 pt), with Excel's normal margins
 * of 0.7 in and 0.75 in (from memory). Small print: the one-page summary is the page to read; this one keeps the whole
 * working on one sheet of paper.
 */
function printSetup(t: Omit<SheetTemplate, "print">): TemplatePrint {
  const { rows, cols } = templateExtent(t);
  const row = (c: TemplateCell | undefined) => (c ? parseCell(c.address).row + 1 : 1);
  const title = row(t.cells.find((c) => c.role === "title"));
  const caution = row(t.cells.find((c) => c.role === "caution"));
  return {
    area: `A1:${columnLetters(cols - 1)}${rows}`,
    titleRows: `${Math.min(title, caution)}:${Math.max(title, caution)}`,
    fitWide: 1,
    fitTall: 1,
    orientation: "portrait",
  };
}
