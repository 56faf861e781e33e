/**
 * Which Office requirement sets the add-in needs, read from what it uses, against what it declares.
 *
 * Needed: every API family of the table below that the code in src/ (the preview host aside: it runs outside Office)
 * calls, every key of the shipped functions.json that belongs to a set, and every manifest feature that does.
 * Declared: the manifest's <Requirements><Sets> (Office installs the add-in only where these are supported), or a
 * runtime check `Office.context.requirements.isSetSupported("Set", "x.y")` in src/ for a part the add-in can do
 * without (the pane's ExcelApi calls: the cell functions work without them, so ExcelApi is checked when the pane
 * starts, not required for installation; see "Check for requirement set support" in
 * https://learn.microsoft.com/office/dev/add-ins/develop/specify-api-requirements-runtime).
 *
 * A set is "matched" when its declared version is exactly the highest version needed: lower lets the add-in run where
 * a call fails; higher keeps it from hosts it would run on. test/requirements.test.ts runs this on the project.
 *
 * The table names families, not every member: a row matches the call that needs the highest version of its family.
 * Each row says where its version is written: the reference page of the member (learn.microsoft.com/javascript/api/...,
 * whose "[API set: ...]" line the @types packages copy) or the requirement-set page.
 */

const CF_SETS = "https://learn.microsoft.com/javascript/api/requirement-sets/excel/custom-functions-requirement-sets";
const EXCEL_REF = "https://learn.microsoft.com/javascript/api/excel/";

/**
 * @typedef {{ api: string, set: string, version: string, source: string }} Row
 * @typedef {Row & { code: RegExp, excelOnly?: boolean }} CodeRow       a family called in src/
 * @typedef {Row & { metadataKey: string }} MetadataRow                a top-level key of functions.json
 * @typedef {Row & { manifest: RegExp }} ManifestRow                   a manifest element
 */

/** @type {CodeRow[]} */
export const CODE_ROWS = [
  // Custom functions runtime (https://learn.microsoft.com/javascript/api/custom-functions-runtime)
  {
    api: "CustomFunctions.Error",
    code: /\bCustomFunctions\.Error\b(?!Code)/,
    set: "CustomFunctionsRuntime",
    version: "1.2",
    source: "https://learn.microsoft.com/javascript/api/custom-functions-runtime/customfunctions.error",
  },
  {
    // every member of the enum is "[Api set: CustomFunctionsRuntime 1.3]" in the reference's
    // custom-functions-runtime.d.ts (OfficeDev/office-js-docs-reference, generate-docs/api-extractor-inputs-custom-functions-runtime)
    api: "CustomFunctions.ErrorCode",
    code: /\bCustomFunctions\.ErrorCode\b/,
    set: "CustomFunctionsRuntime",
    version: "1.3",
    source: "https://learn.microsoft.com/javascript/api/custom-functions-runtime/customfunctions.errorcode",
  },
  {
    api: "CustomFunctions.Invocation.parameterAddresses",
    code: /\.parameterAddresses\b/,
    set: "CustomFunctionsRuntime",
    version: "1.3",
    source: "https://learn.microsoft.com/javascript/api/custom-functions-runtime/customfunctions.invocation",
  },
  // Common API
  {
    api: "Office.context.ui.displayDialogAsync",
    code: /\bdisplayDialogAsync\s*\(/,
    set: "DialogApi",
    version: "1.1",
    source: "https://learn.microsoft.com/javascript/api/requirement-sets/common/dialog-api-requirement-sets",
  },
  {
    // "Delivers a message from the dialog box to its parent/opener page" (Office.UI, DialogApi 1.1)
    api: "Office.context.ui.messageParent",
    code: /\.messageParent\s*\(/,
    set: "DialogApi",
    version: "1.1",
    source: "https://learn.microsoft.com/javascript/api/office/office.ui",
  },
  {
    // "Requirement sets: DialogApi 1.2" on Dialog.messageChild; DialogApi 1.2 "can't be specified in the add-in
    // manifest" (dialog-api-in-office-add-ins, "Pass information to the dialog box"): checked at runtime
    api: "Dialog.messageChild",
    code: /\.messageChild\s*\(/,
    set: "DialogApi",
    version: "1.2",
    source: "https://learn.microsoft.com/javascript/api/office/office.dialog",
  },
  {
    // UI.addHandlerAsync for the DialogParentMessageReceived event: "Requirement set: DialogApi 1.2"
    api: "UI.addHandlerAsync(DialogParentMessageReceived)",
    code: /\bDialogParentMessageReceived\b/,
    set: "DialogApi",
    version: "1.2",
    source: "https://learn.microsoft.com/javascript/api/office/office.ui",
  },
  // Excel JavaScript API: the families above ExcelApi 1.1 (sought in files that use the Excel namespace)
  {
    api: "Range.getResizedRange, Range.merge, RangeFormat.rowHeight/columnWidth",
    code: /\.getResizedRange\s*\(|\.merge\s*\(|\.(?:rowHeight|columnWidth)\b/,
    excelOnly: true,
    set: "ExcelApi",
    version: "1.2",
    source: `${EXCEL_REF}excel.range, ${EXCEL_REF}excel.rangeformat`,
  },
  {
    api: "*OrNullObject getters, NamedItemCollection.add",
    code: /\.get(?:Item|Range|UsedRange)OrNullObject\s*\(|\bnames\.add\s*\(/,
    excelOnly: true,
    set: "ExcelApi",
    version: "1.4",
    source: `${EXCEL_REF}excel.nameditemcollection, ${EXCEL_REF}excel.worksheetcollection, ${EXCEL_REF}excel.worksheet`,
  },
  {
    api: "Application.suspendApiCalculationUntilNextSync",
    code: /\.suspendApiCalculationUntilNextSync\s*\(/,
    excelOnly: true,
    set: "ExcelApi",
    version: "1.6",
    source: `${EXCEL_REF}excel.application`,
  },
  {
    api: "chart series (series.add, setXAxisValues, marker*), Worksheet.copy",
    code: /\.series\.add\s*\(|\.setXAxisValues\s*\(|\.marker(?:Style|Size|BackgroundColor|ForegroundColor)\b|\.copy\s*\(\s*"(?:None|Before|After|Beginning|End)"/,
    excelOnly: true,
    set: "ExcelApi",
    version: "1.7",
    source: `${EXCEL_REF}excel.chartseries, ${EXCEL_REF}excel.chartseriescollection, ${EXCEL_REF}excel.worksheet`,
  },
  {
    api: "Application.calculate",
    code: /\bapplication\.calculate\s*\(/,
    excelOnly: true,
    set: "ExcelApi",
    version: "1.1",
    source: `${EXCEL_REF}excel.application`,
  },
  {
    api: "WorksheetCollection.onActivated",
    code: /\bworksheets\.onActivated\b/,
    excelOnly: true,
    set: "ExcelApi",
    version: "1.7",
    source: `${EXCEL_REF}excel.worksheetcollection`,
  },
  {
    api: "WorksheetCollection.onCalculated",
    code: /\bworksheets\.onCalculated\b/,
    excelOnly: true,
    set: "ExcelApi",
    version: "1.8",
    source: `${EXCEL_REF}excel.worksheetcollection`,
  },
  {
    api: "WorksheetCollection.onChanged, Range.copyFrom, Worksheet.pageLayout, Range.getCellProperties",
    code: /\bworksheets\.onChanged\b|\.copyFrom\s*\(|\.pageLayout\b|\.getCellProperties\s*\(/,
    excelOnly: true,
    set: "ExcelApi",
    version: "1.9",
    source: `${EXCEL_REF}excel.worksheetcollection, ${EXCEL_REF}excel.range, ${EXCEL_REF}excel.worksheet`,
  },
  {
    // the pane names the input behind a formula where Excel has these, else the formula cell: guarded, see GUARD
    api: "Range.getDirectPrecedents, WorkbookRangeAreas.addresses, Range.getSpillParentOrNullObject",
    code: /\.getDirectPrecedents\s*\(|\.getSpillParent(?:OrNullObject)?\s*\(/,
    excelOnly: true,
    set: "ExcelApi",
    version: "1.12",
    source: `${EXCEL_REF}excel.range, ${EXCEL_REF}excel.workbookrangeareas`,
  },
];

/**
 * A use the add-in does without where the host lacks its set: the file that makes it asks first, through a function
 * `supports("Set", "x.y")` (the version a literal or a `const` of the same file) that wraps isSetSupported. Uses of
 * exactly that version in that file need no declaration; the file's other uses of the set still do.
 */
const GUARD = /\bsupports\(\s*"([^"]+)"\s*,\s*(?:"([^"]+)"|([A-Za-z_$][\w$]*))\s*\)/g;

/**
 * The sets a file guards its own uses with, each at the highest version it asks for.
 *
 * @param {string} text
 * @returns {Map<string, string>}
 */
export function guards(text) {
  const out = new Map();
  for (const m of text.matchAll(GUARD)) {
    const version = m[2] ?? new RegExp(`\\bconst\\s+${m[3]}\\s*=\\s*"([^"]+)"`).exec(text)?.[1];
    if (version && (!out.has(m[1]) || compareVersions(version, out.get(m[1])) > 0)) out.set(m[1], version);
  }
  return out;
}

/** @type {MetadataRow[]} */
export const METADATA_ROWS = [
  {
    // "Requirement set 1.4 includes custom functions integration with data types and the allowCustomDataForDataTypeAny
    // JSON manifest property"
    api: "allowCustomDataForDataTypeAny (functions.json)",
    metadataKey: "allowCustomDataForDataTypeAny",
    set: "CustomFunctionsRuntime",
    version: "1.4",
    source: CF_SETS,
  },
];

/** @type {ManifestRow[]} */
export const MANIFEST_ROWS = [
  {
    // "Associated with these requirement sets: SharedRuntime 1.1 (Only when used in a task pane add-in.)"
    api: "<Runtime> (shared runtime)",
    manifest: /<Runtime\b/,
    set: "SharedRuntime",
    version: "1.1",
    source: "https://learn.microsoft.com/javascript/api/manifest/runtime",
  },
];

/** Compare "1.10" with "1.9" part by part: negative, 0 or positive. */
export function compareVersions(a, b) {
  const pa = a.split(".").map(Number);
  const pb = b.split(".").map(Number);
  for (let i = 0; i < Math.max(pa.length, pb.length); i++) {
    const d = (pa[i] ?? 0) - (pb[i] ?? 0);
    if (d !== 0) return d;
  }
  return 0;
}

/**
 * The sets needed, each at the highest version any use asks for, with the uses that ask for it.
 *
 * @param {{ sources: Record<string, string>, metadata?: Record<string, unknown>, manifest?: string }} project
 *   sources: file path → text of the add-in's code; metadata: the shipped functions.json; manifest: manifest.xml
 * @returns {Map<string, { version: string, uses: string[] }>}
 */
export function neededSets({ sources, metadata = {}, manifest = "" }) {
  /** @type {Map<string, { version: string, uses: string[] }>} */
  const needed = new Map();
  const need = (row, where) => {
    const use = `${row.api} (${row.set} ${row.version}) in ${where}`;
    const had = needed.get(row.set);
    if (!had || compareVersions(row.version, had.version) > 0) needed.set(row.set, { version: row.version, uses: [use, ...(had?.uses ?? [])] });
    else had.uses.push(use);
  };
  for (const [file, text] of Object.entries(sources)) {
    const usesExcel = /\bExcel\.\w/.test(text);
    const guarded = guards(text);
    for (const row of CODE_ROWS) {
      if ((row.excelOnly && !usesExcel) || !row.code.test(text)) continue;
      const guard = guarded.get(row.set);
      if (guard !== undefined && compareVersions(guard, row.version) === 0) continue; // done without where unsupported
      need(row, file);
    }
  }
  for (const row of METADATA_ROWS) if (metadata[row.metadataKey] !== undefined) need(row, "functions.json");
  for (const row of MANIFEST_ROWS) if (row.manifest.test(manifest)) need(row, "manifest.xml");
  return needed;
}

/**
 * The sets the manifest requires for installation: <Set Name MinVersion> in OfficeApp's own <Requirements> (not those
 * inside VersionOverrides), MinVersion defaulting to <Sets DefaultMinVersion>, itself "1.1" when absent
 * (https://learn.microsoft.com/javascript/api/manifest/sets).
 *
 * @param {string} manifest manifest.xml
 * @returns {Map<string, string>} set name → minimum version
 */
export function manifestSets(manifest) {
  const beforeOverrides = manifest.split(/<VersionOverrides\b/)[0];
  const requirements = /<Requirements>([\s\S]*?)<\/Requirements>/.exec(beforeOverrides)?.[1] ?? "";
  const fallback = /<Sets\b[^>]*\bDefaultMinVersion="([^"]+)"/.exec(requirements)?.[1] ?? "1.1";
  const sets = new Map();
  for (const m of requirements.matchAll(/<Set\b([^>]*)\/?>/g)) {
    const name = /\bName="([^"]+)"/.exec(m[1])?.[1];
    if (name) sets.set(name, /\bMinVersion="([^"]+)"/.exec(m[1])?.[1] ?? fallback);
  }
  return sets;
}

/**
 * The sets checked at runtime: `isSetSupported("Set", "x.y")`, the version written as a literal or as a constant
 * `const NAME = "x.y"` of the same file.
 *
 * @param {Record<string, string>} sources file path → text
 * @returns {Map<string, { version: string, where: string }>}
 */
export function runtimeChecks(sources) {
  const checks = new Map();
  for (const [file, text] of Object.entries(sources)) {
    for (const m of text.matchAll(/\bisSetSupported\(\s*"([^"]+)"\s*,\s*(?:"([^"]+)"|([A-Za-z_$][\w$]*))\s*\)/g)) {
      const version = m[2] ?? new RegExp(`\\bconst\\s+${m[3]}\\s*=\\s*"([^"]+)"`).exec(text)?.[1];
      if (version) checks.set(m[1], { version, where: file });
    }
  }
  return checks;
}

/**
 * Every mismatch between the sets needed and the sets declared, one line each; empty when they match.
 *
 * @param {{ sources: Record<string, string>, metadata?: Record<string, unknown>, manifest: string }} project
 * @returns {string[]}
 */
export function requirementProblems(project) {
  const needed = neededSets(project);
  const declared = manifestSets(project.manifest);
  const checked = runtimeChecks(project.sources);
  const problems = [];
  for (const [set, { version, uses }] of needed) {
    const inManifest = declared.get(set);
    const atRuntime = checked.get(set);
    const because = `for ${uses[0]}`;
    if (inManifest !== undefined) {
      if (compareVersions(inManifest, version) < 0) problems.push(`manifest.xml asks for ${set} ${inManifest}, but the add-in needs ${version} ${because}`);
      else if (compareVersions(inManifest, version) > 0) problems.push(`manifest.xml asks for ${set} ${inManifest}, but the add-in needs only ${version} (${uses[0]})`);
    } else if (atRuntime !== undefined) {
      if (compareVersions(atRuntime.version, version) < 0) problems.push(`${atRuntime.where} checks ${set} ${atRuntime.version}, but the add-in needs ${version} ${because}`);
      else if (compareVersions(atRuntime.version, version) > 0) problems.push(`${atRuntime.where} checks ${set} ${atRuntime.version}, but the add-in needs only ${version} (${uses[0]})`);
    } else {
      problems.push(`${set} ${version} is neither in manifest.xml's <Requirements> nor checked with isSetSupported, but is needed ${because}`);
    }
  }
  for (const [set, version] of declared) {
    if (!needed.has(set)) problems.push(`manifest.xml asks for ${set} ${version}, which nothing in the add-in uses`);
  }
  return problems;
}
