/**
 * The metadata of the functions module, generated the way the build does (custom-functions-metadata on the files
 * scripts/function-files.mjs lists), for tests in Node. Generated once per test file.
 */
import { generateCustomFunctionsMetadata } from "custom-functions-metadata";
import type { FunctionsMetadata } from "../../src/preview/metadata";
import { functionFiles } from "../../scripts/function-files.mjs";

let cached: Promise<FunctionsMetadata> | undefined;

export function generatedMetadata(): Promise<FunctionsMetadata> {
  cached ??= generateCustomFunctionsMetadata(functionFiles()).then((r) => {
    if (r.errors.length) throw new Error(`metadata generator: ${r.errors.join("; ")}`);
    return JSON.parse(r.metadataJson) as FunctionsMetadata;
  });
  return cached;
}
