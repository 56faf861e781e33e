/**
 * A stand-in for the `CustomFunctions` global of Excel's runtime, for hosts that are not Excel: the unit tests and
 * the local preview. Same shape as the real one for what Headroom uses: `Error`, `ErrorCode` and `associate`.
 * Installs itself only where no real runtime is present.
 */
export class ShimCellError extends Error {
  readonly code: string;
  constructor(code: string, message?: string) {
    super(message ?? code);
    this.name = "CustomFunctions.Error";
    this.code = code;
  }
}

export const SHIM_ERROR_CODES = {
  invalidValue: "#VALUE!",
  notAvailable: "#N/A",
  divisionByZero: "#DIV/0!",
  invalidNumber: "#NUM!",
  nullReference: "#NULL!",
  invalidName: "#NAME?",
  invalidReference: "#REF!",
} as const;

export function installCustomFunctionsShim(): void {
  const g = globalThis as unknown as { CustomFunctions?: unknown };
  if (g.CustomFunctions) return;
  g.CustomFunctions = {
    Error: ShimCellError,
    ErrorCode: SHIM_ERROR_CODES,
    associate: () => undefined,
  };
}
