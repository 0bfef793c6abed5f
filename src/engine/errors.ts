/**
 * A problem with the user's input that only shows once the numbers are worked
 * (a crack already past its critical size, a radius too small for its wall).
 * Faces turn it into the same errors document as a schema failure: { path, message }.
 */
export class InputError extends Error {
  constructor(
    readonly path: string,
    message: string,
  ) {
    super(message);
    this.name = "InputError";
  }
}

/** The errors document's entry lives with the format; re-exported for the engine's callers. */
export type { FieldError } from "../schema/errors.ts";
