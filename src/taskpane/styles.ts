/**
 * The pane's look, as a style sheet string injected with the pane (no stylesheet to fetch, nothing remote). Scoped
 * under .hr-pane so that a host page (the preview) keeps its own styles. Sized for a 320 px task pane.
 */
import { PALETTE } from "../workbook/look";
import type { BreakdownPart } from "./model";

/**
 * The colour of each part's bar in "Where the pressure goes": the end sprinkler in the plot's sprinkler colour, the
 * run's friction in the demand's; every bar sits beside its label and its number, so colour is never the only cue.
 */
export const PART_COLOURS: Readonly<Record<BreakdownPart["id"], string>> = {
  "end-sprinkler": PALETTE.sprinklers,
  "area-friction": PALETTE.band,
  "run-friction": PALETTE.demand,
  elevation: PALETTE.supply,
  devices: PALETTE.ink,
};

export const PANE_CSS = `
.hr-pane { font: 13px/1.4 system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif;
  color: #1B2A3A; background: #F6F7F9; padding: 10px 12px 14px; box-sizing: border-box; min-width: 280px; }
.hr-pane * { box-sizing: border-box; }
.hr-head { display: flex; align-items: baseline; gap: 8px; margin: 0 0 8px; }
.hr-brand { font-weight: 700; font-size: 15px; letter-spacing: 0.02em; }
.hr-sub { color: #5A6675; font-size: 12px; }
.hr-verdict-box { background: #FFFFFF; border-left: 6px solid #9AA5B1; border-radius: 4px; padding: 10px 12px;
  box-shadow: 0 1px 2px rgba(27, 42, 58, 0.12); }
.hr-verdict-box[data-state="pass"] { border-left-color: ${PALETTE.pump}; }
.hr-verdict-box[data-state="fail"] { border-left-color: ${PALETTE.demand}; }
.hr-verdict-box[data-state="marginal"] { border-left-color: ${PALETTE.sprinklers}; border-left-style: dashed; }
.hr-verdict-box[data-state="cannot-serve"] { border-left-color: ${PALETTE.demand}; border-left-width: 10px; }
.hr-verdict-box[data-state="problems"] { border-left-color: #8A5A00; }
.hr-state { margin: 0 0 4px; font-size: 12px; font-weight: 700; letter-spacing: 0.04em; text-transform: uppercase; color: #3A4A5A; }
.hr-state[hidden] { display: none; }
.hr-verdict { font-size: 20px; font-weight: 700; line-height: 1.25; margin: 0; }
.hr-margin, .hr-pump, .hr-caveat { margin: 6px 0 0; font-size: 13px; }
.hr-caveat { color: #6B2C00; }
.hr-pump[hidden], .hr-caveat[hidden], .hr-steps[hidden] { display: none; }
.hr-breakdown { margin: 10px 0 0; background: #FFFFFF; border-radius: 4px; padding: 8px 12px;
  box-shadow: 0 1px 2px rgba(27, 42, 58, 0.12); }
.hr-breakdown[hidden], .hr-worst[hidden] { display: none; }
.hr-breakdown-title { margin: 0 0 2px; font-size: 12px; font-weight: 700; color: #3A4A5A; }
.hr-parts { list-style: none; margin: 0; padding: 0; }
.hr-parts li { display: grid; grid-template-columns: minmax(0, 1fr) auto; gap: 1px 8px; margin: 4px 0 0; font-size: 12px; }
.hr-part-label { overflow-wrap: anywhere; }
.hr-part-value { text-align: right; white-space: nowrap; font-variant-numeric: tabular-nums; }
.hr-part-track { grid-column: 1 / -1; display: block; height: 7px; background: #EEF1F4; border-radius: 2px; overflow: hidden; }
.hr-part-bar { display: block; height: 100%; min-width: 2px; border-radius: 2px; background: currentColor; }
.hr-part-bar[data-sign="negative"] { background: transparent; border: 1.5px dashed currentColor; }
${Object.entries(PART_COLOURS)
  .map(([id, colour]) => `.hr-part-bar[data-part="${id}"] { color: ${colour}; }`)
  .join("\n")}
.hr-worst { margin: 6px 0 0; font-size: 13px; }
.hr-steps { margin: 6px 0 0; padding-left: 18px; font-size: 13px; }
.hr-steps li { margin: 3px 0; }
.hr-problems { margin: 6px 0 0; padding-left: 18px; }
.hr-problems li { margin: 4px 0; }
.hr-problems code { font-weight: 600; }
.hr-caution { margin: 8px 0 0; padding: 7px 9px; border-radius: 4px; background: #FDEBD3; color: #6B2C00;
  font-size: 12px; font-weight: 600; }
.hr-calc-note { margin: 6px 0 0; color: #5A6675; font-style: italic; font-size: 12px; }
.hr-plot-box { margin-top: 10px; background: #FFFFFF; border-radius: 4px; padding: 6px 0 6px;
  box-shadow: 0 1px 2px rgba(27, 42, 58, 0.12); }
.hr-plot-box[hidden] { display: none; }
.hr-axis-toggle { display: flex; justify-content: flex-end; gap: 0; padding: 0 8px 4px; }
.hr-axis-toggle button { font: inherit; font-size: 12px; padding: 3px 8px; border: 1px solid #8593A3; background: #FFFFFF;
  color: #1B2A3A; cursor: pointer; }
.hr-axis-toggle button:first-child { border-radius: 3px 0 0 3px; }
.hr-axis-toggle button:last-child { border-radius: 0 3px 3px 0; border-left: none; }
.hr-axis-toggle button[aria-pressed="true"] { background: #1B2A3A; color: #FFFFFF; border-color: #1B2A3A; }
.hr-plot { display: block; width: 100%; height: auto; }
.hr-legend { list-style: none; display: flex; flex-wrap: wrap; gap: 4px 12px; margin: 2px 10px 0; padding: 0; font-size: 12px; }
.hr-legend li { display: flex; align-items: center; gap: 5px; }
.hr-legend svg { flex: none; }
.hr-readings { margin-top: 10px; font-size: 12px; }
.hr-readings summary { cursor: pointer; color: #3A4A5A; }
.hr-readings dl { display: grid; grid-template-columns: auto auto; gap: 2px 10px; margin: 6px 0 0; }
.hr-readings dt { color: #5A6675; }
.hr-readings dd { margin: 0; text-align: right; font-variant-numeric: tabular-nums; }
.hr-actions { margin-top: 12px; display: flex; flex-wrap: wrap; gap: 8px; align-items: center; }
.hr-actions button, .hr-actions select { font: inherit; font-size: 13px; border-radius: 4px; padding: 6px 10px; cursor: pointer; }
.hr-actions button { border: 1px solid #1B4F8A; background: #1B4F8A; color: #FFFFFF; }
.hr-actions button.secondary { background: #FFFFFF; color: #1B4F8A; }
.hr-actions button:disabled { opacity: 0.55; cursor: default; }
.hr-actions select { border: 1px solid #8593A3; background: #FFFFFF; padding: 5px 6px; }
.hr-status { flex-basis: 100%; margin: 2px 0 0; font-size: 12px; min-height: 1em; }
.hr-status[data-tone="refused"] { color: #8A3200; }
`;
