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
import { INPUT_NAMES, type Reading, type Readings } from "../workbook/port";

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

/** A message from the pane, or null: every name the pane reads must come with a reading. */
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
  return { type: "summary", readings };
}
