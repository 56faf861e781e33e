/**
 * The files of src/functions/ that hold cell functions (a `@customfunction` JSDoc tag), sorted: the one list the
 * custom-functions metadata generator reads, in the build (webpack.config.js) and in the tests alike, so that a
 * function in a new topic file can never be left out of one of them.
 */
import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const FUNCTIONS_DIR = path.join(root, "src", "functions");

/** Absolute paths of the cell-function files. */
export function functionFiles() {
  return readdirSync(FUNCTIONS_DIR)
    .filter((f) => f.endsWith(".ts"))
    .sort()
    .map((f) => path.join(FUNCTIONS_DIR, f))
    .filter((file) => /^\s*\*\s*@customfunction\b/m.test(readFileSync(file, "utf8")));
}

/**
 * The metadata as the add-in ships it (dist/functions.json): the generator's output without
 * `allowCustomDataForDataTypeAny`. custom-functions-metadata (2.2.3, lib/generate.js) writes that key as true for
 * every project, with no option to leave it out; it makes Excel hand data-typed cells (formatted numbers, entities,
 * images) to `any` parameters as objects, and needs CustomFunctionsRuntime 1.4
 * (https://learn.microsoft.com/javascript/api/requirement-sets/excel/custom-functions-requirement-sets,
 * https://learn.microsoft.com/office/dev/add-ins/excel/custom-functions-json#allowcustomdatafordatatypeany).
 * Headroom uses no data types: the build takes the key out (webpack.config.js), and args.ts still reads the basic
 * value of a data-typed cell, or refuses it, should one arrive.
 *
 * @param {string} json functions.json as the generator wrote it
 * @returns {string} the same metadata without the key
 */
export function shippedMetadata(json) {
  const metadata = JSON.parse(json);
  delete metadata.allowCustomDataForDataTypeAny;
  return JSON.stringify(metadata, null, 4);
}
