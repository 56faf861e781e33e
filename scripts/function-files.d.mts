/** Absolute paths of the files of src/functions/ that hold cell functions (see function-files.mjs). */
export function functionFiles(): string[];
/** functions.json as the add-in ships it: the generator's output without allowCustomDataForDataTypeAny. */
export function shippedMetadata(json: string): string;
