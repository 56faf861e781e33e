import { expect } from "vitest";

/** Call a cell function expecting an error; returns its code and message for further checks. */
export function errorOf(call: () => unknown): { code: string; message: string } {
  let value: unknown;
  try {
    value = call();
  } catch (e) {
    const err = e as { code?: string; message?: string };
    expect(err.code, `not a cell error: ${String(e)}`).toMatch(/^#/);
    expect(err.message, "error without message").toBeTruthy();
    return { code: err.code as string, message: err.message as string };
  }
  throw new Error(`expected an error, got ${JSON.stringify(value)}`);
}
