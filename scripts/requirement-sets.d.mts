/** Types for requirement-sets.mjs (requirement sets needed against declared), used by the tests. */
export interface Row {
  /** the API family, as the reference names it */
  api: string;
  /** requirement set name, e.g. "ExcelApi" */
  set: string;
  /** the version the family needs, e.g. "1.9" */
  version: string;
  /** where that version is written */
  source: string;
}
export interface Project {
  /** file path → text of the add-in's code */
  sources: Record<string, string>;
  /** the shipped functions.json */
  metadata?: Record<string, unknown>;
  /** manifest.xml */
  manifest: string;
}
export declare const CODE_ROWS: Array<Row & { code: RegExp; excelOnly?: boolean }>;
export declare const METADATA_ROWS: Array<Row & { metadataKey: string }>;
export declare const MANIFEST_ROWS: Array<Row & { manifest: RegExp }>;
export declare function compareVersions(a: string, b: string): number;
export declare function neededSets(project: Omit<Project, "manifest"> & { manifest?: string }): Map<string, { version: string; uses: string[] }>;
export declare function manifestSets(manifest: string): Map<string, string>;
export declare function runtimeChecks(sources: Record<string, string>): Map<string, { version: string; where: string }>;
export declare function guards(text: string): Map<string, string>;
export declare function requirementProblems(project: Project): string[];
