/**
 * The messages between the task pane and the summary's Office dialog, as strings (the dialog API carries strings:
 * "any string, including stringified data", https://learn.microsoft.com/office/dev/add-ins/develop/dialog-api-in-office-add-ins).
 *
 *   dialog → pane   {"type":"ready"}      the dialog has loaded and listens: send the summary
 *                   {"type":"close"}      the reader chose Close: close the dialog
 *   pane → dialog   {"type":"summary","readings":{...}}
 *
 * The pane sends the readings its estimate was built from (plain numbers and strings, which JSON carries exactly); the
 * dialog builds the same estimate from them with the same code. Anything else is not a message of ours: decoding
 * gives null.
 */
import { CANDIDATES_NAME, INPUT_NAMES, type Reading, type Readings, type TableReading } from "../workbook/port";

export type DialogMessage = { type: "ready" } | { type: "close" };
export type PaneMessage = { type: "summary"; readings: Readings };

export function encode(message: DialogMessage | PaneMessage): string {
  return JSON.stringify(message);
}

function parse(text: unknown): Record<string, unknown> | null {
  if (typeof text !== "string") return null;
  try {
    const v: unknown = JSON.parse(text);
    return v !== null && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : null;
  } catch {
    return null;
  }
}

/** A message from the dialog, or null. */
export function decodeDialogMessage(text: unknown): DialogMessage | null {
  const v = parse(text);
  return v && (v.type === "ready" || v.type === "close") ? { type: v.type } : null;
}

const KINDS = new Set(["number", "text", "empty", "error", "missing", "invalid"]);

/** A reading as JSON brought it, or null where it is not one. */
function reading(v: unknown): Reading | null {
  if (v === null || typeof v !== "object") return null;
  const r = v as Record<string, unknown>;
  if (typeof r.kind !== "string" || !KINDS.has(r.kind)) return null;
  if (r.kind === "number" && !(typeof r.value === "number" && Number.isFinite(r.value))) return null;
  if (r.kind === "text" && typeof r.value !== "string") return null;
  if (r.kind === "error" && typeof r.code !== "string") return null;
  if (r.kind === "invalid" && typeof r.reason !== "string") return null;
  return r as unknown as Reading;
}

/** A table reading as JSON brought it, or null where it is not one. */
function tableReading(v: unknown): TableReading | null {
  if (v === null || typeof v !== "object") return null;
  const t = v as Record<string, unknown>;
  if (t.kind === "missing") return { kind: "missing" };
  if (t.kind === "invalid") return typeof t.reason === "string" ? (t as unknown as TableReading) : null;
  if (t.kind !== "table" || typeof t.address !== "string" || !Array.isArray(t.rows)) return null;
  const rows = t.rows.map((row) => (Array.isArray(row) ? row.map(reading) : null));
  if (rows.some((row) => row === null || row.some((r) => r === null))) return null;
  return { kind: "table", address: t.address, rows: rows as Reading[][] };
}

/**
 * A message from the pane, or null: every name the pane reads must come with a reading; the table of candidates may
 * be left out (a workbook without one), and where it comes it must be one.
 */
export function decodePaneMessage(text: unknown): PaneMessage | null {
  const v = parse(text);
  if (!v || v.type !== "summary" || v.readings === null || typeof v.readings !== "object") return null;
  const given = v.readings as Record<string, unknown>;
  const readings = {} as Readings;
  for (const n of INPUT_NAMES) {
    const r = reading(given[n]);
    if (!r) return null;
    readings[n] = r;
  }
  if (given[CANDIDATES_NAME] !== undefined) {
    const table = tableReading(given[CANDIDATES_NAME]);
    if (!table) return null;
    readings[CANDIDATES_NAME] = table;
  }
  return { type: "summary", readings };
}
