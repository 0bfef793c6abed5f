import type { Context } from "hono";
import {
  InvalidRecordError,
  isStorageFault,
  NotAllowedError,
  NotSignedInError,
  RecordConflictError,
  RecordError,
  RecordNotFoundError,
  RecordsUnavailableError,
  SignOffRefusedError,
  SlowDownError,
  storageFaultWords,
  WrongPassphraseError,
} from "../../store/index.ts";
import { errorsDoc } from "../api.ts";

/**
 * The answer for an error a records request ran into: each refusal of the store has its status;
 * a database that is busy, full, read-only or failing is a 503 in words (the write was rolled
 * back, so nothing committed is lost). Anything else is a fault of ours.
 */
export function recordsErrorResponse(err: Error, c: Context): Response {
  c.header("Cache-Control", "no-store");
  if (err instanceof RecordError) {
    if (err instanceof SlowDownError) c.header("Retry-After", String(err.retryAfter_s));
    return c.json({ errors: err.errors }, statusOf(err));
  }
  if (isStorageFault(err)) {
    c.header("Retry-After", isDatabaseBusy(err) ? "1" : "30");
    return c.json(errorsDoc("(server)", storageFaultWords(err)), 503);
  }
  console.error(err);
  return c.json(errorsDoc("(server)", "the server met an unexpected problem; nothing saved was lost — please report it"), 500);
}

export type RefusalStatus = 401 | 403 | 404 | 409 | 422 | 429 | 503;

export function statusOf(err: RecordError): RefusalStatus {
  if (err instanceof RecordNotFoundError) return 404;
  if (err instanceof NotSignedInError) return 401;
  if (err instanceof WrongPassphraseError || err instanceof NotAllowedError) return 403;
  if (err instanceof SlowDownError) return 429;
  if (err instanceof RecordsUnavailableError) return 503;
  if (err instanceof RecordConflictError || err instanceof SignOffRefusedError) return 409;
  if (err instanceof InvalidRecordError) return 422;
  throw new Error(`no HTTP status for ${err.name}`);
}

export function isDatabaseBusy(err: Error): boolean {
  const code = (err as { code?: unknown }).code;
  return code === "SQLITE_BUSY" || code === "SQLITE_LOCKED";
}
