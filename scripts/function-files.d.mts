/** Absolute paths of the files of src/functions/ that hold cell functions (see function-files.mjs). */
export function functionFiles(): string[];
