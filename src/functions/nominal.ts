/**
 * The `nominal` argument: a nominal pipe size in any form users type, checked against the sizes of a schedule.
 *
 * US work: 2, 2.5, "2", "2.5", "2-1/2", "2 1/2", "2½", "3/4", "¾", 0.75, optionally with "NPS" before or
 * `"`/"in" after. SI work: the DN (20, 25, 32, 40, 50, 65, 80, 90, 100, 125, 150, 200, 250, 300). Text with
 * "DN" before it ("DN65", "DN 65") is a DN in either unit system. The result is always the NPS in inches, the
 * engine's key (src/engine/pipes.ts).
 */
import { fail } from "../engine/errors";
import { type Schedule, findPipeSize, listSizes, nominalOfDn, scheduleInfo } from "../engine/pipes";
import type { UnitSystem } from "../engine/units";
import { cellBasicValue, isBlank } from "./args";

/** What a typed size says: an NPS in inches, or a DN. */
export type NominalText = { kind: "nps"; nps: number } | { kind: "dn"; dn: number } | { kind: "number"; value: number };

const VULGAR: Readonly<Record<string, string>> = { "¼": " 1/4", "½": " 1/2", "¾": " 3/4", "⅛": " 1/8", "⅜": " 3/8" };

/**
 * Read a typed nominal size without deciding yet what a bare number means: "2-1/2" → nps 2.5, "DN65" → dn 65,
 * 2 or "2" → number 2 (an NPS in US work, a DN in SI work). Undefined when it is not a size at all.
 */
export function readNominal(value: unknown): NominalText | undefined {
  if (typeof value === "number") return Number.isFinite(value) ? { kind: "number", value } : undefined;
  if (typeof value !== "string") return undefined;
  let t = value.trim().toLowerCase();
  const dn = /^dn\s*(\d+)$/.exec(t);
  if (dn) return { kind: "dn", dn: Number(dn[1]) };
  t = t
    .replace(/^nps\s*/, "")
    .replace(/\s*(["”″]|inches|inch|in\.?)$/, "")
    .replace(/[¼½¾⅛⅜]/g, (c) => VULGAR[c] ?? c)
    .replace(/⁄/g, "/")
    .trim();
  if (/^(\d+(\.\d*)?|\.\d+)$/.test(t)) return { kind: "number", value: Number(t) };
  const frac = /^(\d+)\s*\/\s*(\d+)$/.exec(t);
  if (frac) {
    const d = Number(frac[2]);
    return d > 0 ? { kind: "nps", nps: Number(frac[1]) / d } : undefined;
  }
  const mixed = /^(\d+)(?:\s*-\s*|\s+)(\d+)\s*\/\s*(\d+)$/.exec(t);
  if (mixed) {
    const d = Number(mixed[3]);
    return d > 0 ? { kind: "nps", nps: Number(mixed[1]) + Number(mixed[2]) / d } : undefined;
  }
  return undefined;
}

/**
 * A nominal size of `schedule`, returned as NPS in inches. `units` decides what a bare number means: NPS in US work,
 * DN in SI work. A size the schedule lacks is #VALUE! listing the sizes it has (as NPS in US work, as DN in SI).
 */
export function nominalArg(value: unknown, name: string, schedule: Schedule, units: UnitSystem): number {
  value = cellBasicValue(value);
  const info = scheduleInfo(schedule);
  const sizesUS = `${info.name} comes in ${listSizes(schedule)} in`;
  const sizesSI = `${info.name} comes in DN ${listSizes(schedule, true)}`;
  const sizes = units === "SI" ? sizesSI : sizesUS;
  if (isBlank(value)) fail(name, undefined, `is empty: type a nominal size; ${sizes}`);
  if (typeof value === "boolean") fail(name, { cell: value }, `must be a nominal size; ${sizes}`);
  if (Array.isArray(value)) fail(name, { cell: value }, "must be a single nominal size");
  const read = readNominal(value);
  if (!read) {
    const forms = units === "SI" ? "a DN such as 50 or 65" : `a nominal size such as 2, 2.5, "2-1/2" or "2½"`;
    fail(name, { cell: value }, `must be ${forms}; ${sizes}`);
  }
  let nps: number | undefined;
  if (read.kind === "dn") {
    nps = nominalOfDn(read.dn);
    if (nps === undefined || !findPipeSize(nps, schedule)) fail(name, { cell: value }, sizesSI);
  } else if (read.kind === "nps") {
    if (units === "SI") fail(name, { cell: value }, `in SI a nominal size is a DN (or type it as "DN65"): ${sizesSI}`);
    nps = read.nps;
  } else if (units === "SI") {
    nps = nominalOfDn(read.value);
    if (nps === undefined || !findPipeSize(nps, schedule)) fail(name, { cell: value }, `in SI a nominal size is a DN: ${sizesSI}`);
  } else {
    nps = read.value;
  }
  const row = findPipeSize(nps, schedule);
  if (!row) {
    // a DN typed in US work (50 for 2 in): say how to mean it
    const dnNps = read.kind === "number" ? nominalOfDn(read.value) : undefined;
    const dnHint =
      read.kind === "number" && dnNps !== undefined && findPipeSize(dnNps, schedule)
        ? `; for DN ${read.value} type "DN${read.value}" or set units to "SI"`
        : "";
    fail(name, { cell: value }, `${sizesUS}${dnHint}`);
  }
  return row.nominal;
}
