/**
 * The requirement sets manifest.xml declares match the APIs the add-in uses (scripts/requirement-sets.mjs: a small
 * table of API families, each with the set and version its Microsoft reference page gives). The check is first tried
 * on made-up inputs, so that a broken check cannot pass silently; then on the project itself: the code of src/ (the
 * preview host aside, which runs outside Office), the functions.json the build ships and manifest.xml.
 */
import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { generateCustomFunctionsMetadata } from "custom-functions-metadata";
import { functionFiles, shippedMetadata } from "../scripts/function-files.mjs";
import {
  CODE_ROWS,
  MANIFEST_ROWS,
  METADATA_ROWS,
  compareVersions,
  guards,
  manifestSets,
  neededSets,
  requirementProblems,
  runtimeChecks,
} from "../scripts/requirement-sets.mjs";

const root = path.resolve(__dirname, "..");
const manifest = readFileSync(path.join(root, "manifest.xml"), "utf8");

/** A manifest whose <Requirements> holds exactly these sets (and a VersionOverrides set that must not count). */
function toyManifest(sets: string, defaultMin = "1.1"): string {
  return `<OfficeApp><Requirements><Sets DefaultMinVersion="${defaultMin}">${sets}</Sets></Requirements>
    <VersionOverrides><Requirements><Sets><Set Name="AddinCommands" MinVersion="1.3"/></Sets></Requirements></VersionOverrides></OfficeApp>`;
}

describe("the requirement-set check itself, on made-up inputs", () => {
  it("compares versions part by part (1.10 is above 1.9)", () => {
    expect(compareVersions("1.10", "1.9")).toBeGreaterThan(0);
    expect(compareVersions("1.2", "1.2")).toBe(0);
    expect(compareVersions("1.1", "1.3")).toBeLessThan(0);
  });

  it("reads the manifest's own sets, with DefaultMinVersion as the default, and not those of VersionOverrides", () => {
    const sets = manifestSets(toyManifest('<Set Name="SharedRuntime"/><Set Name="CustomFunctionsRuntime" MinVersion="1.3"/>', "1.2"));
    expect(Object.fromEntries(sets)).toEqual({ SharedRuntime: "1.2", CustomFunctionsRuntime: "1.3" });
  });

  it("passes code whose needs the manifest declares exactly", () => {
    const sources = { "f.ts": "throw new CustomFunctions.Error(CustomFunctions.ErrorCode.invalidValue, m);" };
    expect(requirementProblems({ sources, manifest: toyManifest('<Set Name="CustomFunctionsRuntime" MinVersion="1.3"/>') })).toEqual([]);
  });

  it("reports a set declared below what the code needs (CustomFunctions.ErrorCode is 1.3)", () => {
    const sources = { "f.ts": "new CustomFunctions.Error(CustomFunctions.ErrorCode.notAvailable)" };
    const problems = requirementProblems({ sources, manifest: toyManifest('<Set Name="CustomFunctionsRuntime" MinVersion="1.2"/>') });
    expect(problems).toHaveLength(1);
    expect(problems[0]).toContain("asks for CustomFunctionsRuntime 1.2, but the add-in needs 1.3");
    expect(problems[0]).toContain("CustomFunctions.ErrorCode");
  });

  it("reports a set declared above what the code needs, and a set nothing uses", () => {
    const sources = { "f.ts": "throw new CustomFunctions.Error(code)" };
    const problems = requirementProblems({
      sources,
      manifest: toyManifest('<Set Name="CustomFunctionsRuntime" MinVersion="1.4"/><Set Name="DialogApi" MinVersion="1.1"/>'),
    });
    expect(problems).toEqual([
      "manifest.xml asks for CustomFunctionsRuntime 1.4, but the add-in needs only 1.2 (CustomFunctions.Error (CustomFunctionsRuntime 1.2) in f.ts)",
      "manifest.xml asks for DialogApi 1.1, which nothing in the add-in uses",
    ]);
  });

  it("counts allowCustomDataForDataTypeAny in functions.json as CustomFunctionsRuntime 1.4", () => {
    const needed = neededSets({ sources: {}, metadata: { allowCustomDataForDataTypeAny: true, functions: [] } });
    expect(needed.get("CustomFunctionsRuntime")?.version).toBe("1.4");
    expect(neededSets({ sources: {}, metadata: { functions: [] } }).has("CustomFunctionsRuntime")).toBe(false);
  });

  it("counts a <Runtime> in the manifest as SharedRuntime 1.1", () => {
    const withRuntime = toyManifest("") + '<Runtimes><Runtime resid="Taskpane.Url" lifetime="long"/></Runtimes>';
    expect(requirementProblems({ sources: {}, manifest: withRuntime })).toEqual([
      "SharedRuntime 1.1 is neither in manifest.xml's <Requirements> nor checked with isSetSupported, but is needed for <Runtime> (shared runtime) (SharedRuntime 1.1) in manifest.xml",
    ]);
  });

  it("accepts an ExcelApi call guarded by a runtime check of the same version, and reports a lower one", () => {
    const excel = "await Excel.run(async (ctx) => { range.copyFrom(used, 'Values'); });";
    const guardOk = 'const EXCEL_API = "1.9";\nif (Office.context.requirements.isSetSupported("ExcelApi", EXCEL_API)) start();';
    const guardLow = 'if (Office.context.requirements.isSetSupported("ExcelApi", "1.8")) start();';
    expect(Object.fromEntries(runtimeChecks({ "pane.ts": guardOk }))).toEqual({ ExcelApi: { version: "1.9", where: "pane.ts" } });
    expect(requirementProblems({ sources: { "x.ts": excel, "pane.ts": guardOk }, manifest: toyManifest("") })).toEqual([]);
    expect(requirementProblems({ sources: { "x.ts": excel, "pane.ts": guardLow }, manifest: toyManifest("") })).toEqual([
      "pane.ts checks ExcelApi 1.8, but the add-in needs 1.9 for WorksheetCollection.onChanged, Range.copyFrom, Worksheet.pageLayout, Range.getCellProperties (ExcelApi 1.9) in x.ts",
    ]);
    expect(requirementProblems({ sources: { "x.ts": excel }, manifest: toyManifest("") })[0]).toMatch(/^ExcelApi 1.9 is neither in manifest.xml/);
  });

  it("needs no declaration for a use guarded by supports() at its own version, and still needs the file's other uses", () => {
    const guarded = [
      'const PRECEDENTS_API = "1.12";',
      'if (host.supports("ExcelApi", PRECEDENTS_API)) { const p: Excel.WorkbookRangeAreas = r.getDirectPrecedents(); }',
      "range.copyFrom(used, 'Values');",
    ].join("\n");
    expect(Object.fromEntries(guards(guarded))).toEqual({ ExcelApi: "1.12" });
    expect(Object.fromEntries([...neededSets({ sources: { "x.ts": guarded } })].map(([set, n]) => [set, n.version]))).toEqual({ ExcelApi: "1.9" });
    // unguarded, the same call asks for 1.12
    const bare = "const p: Excel.WorkbookRangeAreas = r.getDirectPrecedents();";
    expect(neededSets({ sources: { "x.ts": bare } }).get("ExcelApi")?.version).toBe("1.12");
    // a guard of another version guards nothing
    expect(neededSets({ sources: { "x.ts": bare.replace("const p", 'host.supports("ExcelApi", "1.13"); const p') } }).get("ExcelApi")?.version).toBe("1.12");
  });

  it("seeks Excel families only in files that use the Excel namespace (a .merge( elsewhere is not Range.merge)", () => {
    expect(neededSets({ sources: { "grid.ts": "cells.merge(other)" } }).has("ExcelApi")).toBe(false);
    expect(neededSets({ sources: { "x.ts": "const r: Excel.Range = s.getRange('A1:B2'); r.merge(false);" } }).get("ExcelApi")?.version).toBe("1.2");
  });

  it("names, for every row of the table, a set, a version and the Microsoft page it comes from", () => {
    for (const row of [...CODE_ROWS, ...METADATA_ROWS, ...MANIFEST_ROWS]) {
      expect(row.set, row.api).toMatch(/^[A-Za-z]+$/);
      expect(row.version, row.api).toMatch(/^\d+\.\d+$/);
      expect(row.source, row.api).toMatch(/^https:\/\/learn\.microsoft\.com\//);
    }
  });
});

/** The add-in's code: src/**\/*.ts, the preview host (src/preview/, run outside Office) aside. */
function addinSources(): Record<string, string> {
  const out: Record<string, string> = {};
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const p = path.join(dir, entry.name);
      if (entry.isDirectory()) {
        if (p !== path.join(root, "src", "preview")) walk(p);
      } else if (entry.name.endsWith(".ts")) out[path.relative(root, p)] = readFileSync(p, "utf8");
    }
  };
  walk(path.join(root, "src"));
  return out;
}

describe("the add-in's requirement sets", () => {
  it("manifest.xml and the pane's runtime check declare exactly what the code, functions.json and the manifest need", async () => {
    const generated = await generateCustomFunctionsMetadata(functionFiles());
    expect(generated.errors).toEqual([]);
    const metadata = JSON.parse(shippedMetadata(generated.metadataJson));
    expect(requirementProblems({ sources: addinSources(), metadata, manifest })).toEqual([]);
  });

  it("the sets found are the ones the add-in is known to need (so the scan did find its uses)", async () => {
    const metadata = JSON.parse(shippedMetadata((await generateCustomFunctionsMetadata(functionFiles())).metadataJson));
    const needed = neededSets({ sources: addinSources(), metadata, manifest });
    // CustomFunctions.ErrorCode (bridge.ts) → 1.3; the pane's copyFrom / worksheets.onChanged (excel.ts) → ExcelApi 1.9;
    // <Runtime lifetime="long"> → SharedRuntime 1.1; the summary's dialog: Dialog.messageChild (summaryDialog.ts) and
    // DialogParentMessageReceived (dialog-page.ts) → DialogApi 1.2 (sources in scripts/requirement-sets.mjs)
    expect(Object.fromEntries([...needed].map(([set, n]) => [set, n.version]))).toEqual({
      CustomFunctionsRuntime: "1.3",
      DialogApi: "1.2",
      ExcelApi: "1.9",
      SharedRuntime: "1.1",
    });
    expect(needed.get("DialogApi")!.uses.join("\n")).toMatch(/Dialog\.messageChild .* in src\/taskpane\/summaryDialog\.ts/);
    expect(needed.get("DialogApi")!.uses.join("\n")).toMatch(/DialogParentMessageReceived.* in src\/summary\/dialog-page\.ts/);
  });

  it("functions.json as shipped does not turn data-typed cells into objects (no allowCustomDataForDataTypeAny)", async () => {
    const generated = await generateCustomFunctionsMetadata(functionFiles());
    // the generator (custom-functions-metadata 2.2.3) always writes the key; the build takes it out
    expect(JSON.parse(generated.metadataJson)).toHaveProperty("allowCustomDataForDataTypeAny");
    const shipped = JSON.parse(shippedMetadata(generated.metadataJson));
    expect(shipped).not.toHaveProperty("allowCustomDataForDataTypeAny");
    expect(shipped.functions).toEqual(JSON.parse(generated.metadataJson).functions);
  });
});
