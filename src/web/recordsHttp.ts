import type { Context } from "hono";
import {
  InvalidRecordError,
  RecordConflictError,
  RecordError,
  RecordNotFoundError,
  SignOffRefusedError,
  WrongPassphraseError,
} from "../store/index.ts";
import { errorsDoc } from "./api.ts";

/**
 * The answer for an error a records request ran into: each refusal of the
 * store has its status; a database still locked by another writer after the
 * wait is a 503 the client may retry. Anything else is a fault of ours.
 */
export function recordsErrorResponse(err: Error, c: Context): Response {
  if (err instanceof RecordError) return c.json({ errors: err.errors }, statusOf(err));
  if (isDatabaseBusy(err)) {
    c.header("Retry-After", "1");
    return c.json(errorsDoc("(server)", "the records database is busy with another save; try again in a moment"), 503);
  }
  console.error(err);
  return c.json(errorsDoc("(server)", "the server met an unexpected problem; nothing saved was lost — please report it"), 500);
}

export function statusOf(err: RecordError): 403 | 404 | 409 | 422 {
  if (err instanceof RecordNotFoundError) return 404;
  if (err instanceof WrongPassphraseError) return 403;
  if (err instanceof RecordConflictError || err instanceof SignOffRefusedError) return 409;
  if (err instanceof InvalidRecordError) return 422;
  throw new Error(`no HTTP status for ${err.name}`);
}

export function isDatabaseBusy(err: Error): boolean {
  const code = (err as { code?: unknown }).code;
  return code === "SQLITE_BUSY" || code === "SQLITE_LOCKED";
}
