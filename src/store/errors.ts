import type { FieldError } from "../engine/errors.ts";

/**
 * Every refusal the store makes is one of these, carrying the same
 * { path, message } entries as the rest of Hoopwise, so a face (HTTP, CLI)
 * can answer with a clear errors document and never mistake a user's
 * mistake for a fault of its own.
 */
export abstract class RecordError extends Error {
  constructor(readonly errors: FieldError[]) {
    super(errors.map((e) => (e.path ? `${e.path}: ${e.message}` : e.message)).join("; "));
    this.name = new.target.name;
  }
}

/** The request itself is malformed or breaks a field rule (HTTP 422). */
export class InvalidRecordError extends RecordError {}

/** A check or revision that does not exist (HTTP 404). */
export class RecordNotFoundError extends RecordError {}

/** The request clashes with what is already stored: a taken name, number or id (HTTP 409). */
export class RecordConflictError extends RecordError {}

/** A sign-off the rules forbid: out of order, on a superseded revision, or the same person twice (HTTP 409). */
export class SignOffRefusedError extends RecordError {}

/** The passphrase does not match the signed-in user's, given again to sign (HTTP 403). */
export class WrongPassphraseError extends RecordError {}

/** No one is signed in, or the name and passphrase do not match a user (HTTP 401). */
export class NotSignedInError extends RecordError {}

/** Signed in, but this needs an admin, or the user's own account (HTTP 403). */
export class NotAllowedError extends RecordError {}

/** Too many wrong passphrases lately: wait `retryAfter_s` seconds (HTTP 429 with Retry-After). */
export class SlowDownError extends RecordError {
  constructor(readonly retryAfter_s: number) {
    super([
      {
        path: "passphrase",
        message: `too many wrong passphrases lately from this account or this address; wait ${retryAfter_s} second${retryAfter_s === 1 ? "" : "s"} before trying again (the wait grows with each wrong try and resets on a right one)`,
      },
    ]);
  }
}

/** The database cannot take a write now: full, read-only or failing (HTTP 503). */
export class RecordsUnavailableError extends RecordError {}
