import { HeadroomError } from "../../src/engine/errors";

/** Call an engine function expecting a HeadroomError; returns it for checks of its kind and message. */
export function errorOf(f: () => unknown): HeadroomError {
  try {
    f();
  } catch (e) {
    if (e instanceof HeadroomError) return e;
    throw e;
  }
  throw new Error("expected a HeadroomError");
}
