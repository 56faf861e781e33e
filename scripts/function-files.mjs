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
