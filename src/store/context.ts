import type { FieldError } from "../engine/errors.ts";
import { InvalidRecordError } from "./errors.ts";
import { joinPath } from "./fields.ts";
import type { SigningKeys } from "./keys.ts";
import type { ScryptCost } from "./passphrase.ts";
import type { Sql } from "./sql.ts";

/**
 * Checks a check input and gives back its normalized value (defaults filled in).
 * Injected so the store works with whatever schema the build carries, and so
 * its tests need no engine.
 */
export type Validator = (json: unknown) => { ok: true; value: unknown } | { ok: false; errors: FieldError[] };

/** What the store's functions work with: the database, a clock, the check validator and the engine version fingerprints are bound to. */
export interface StoreContext {
  sql: Sql;
  now: () => Date;
  validate: Validator;
  engineVersion: string;
  /** The scrypt cost for newly registered passphrases; the default when absent. */
  passphraseCost?: ScryptCost;
  /** The records' signing key pair. */
  keys: SigningKeys;
}

/** The check input, validated and normalized, or an InvalidRecordError with paths under `prefix`. */
export function validInput(ctx: Pick<StoreContext, "validate">, input: unknown, prefix: string): unknown {
  if (input === undefined) throw new InvalidRecordError([{ path: prefix, message: "is required: the check to save" }]);
  const r = ctx.validate(input);
  if (!r.ok) {
    const errors = r.errors.length ? r.errors : [{ path: "", message: "is not a valid check" }];
    throw new InvalidRecordError(errors.map((e) => ({ path: joinPath(prefix, e.path), message: e.message })));
  }
  return r.value;
}

export function isoNow(ctx: Pick<StoreContext, "now">): string {
  return ctx.now().toISOString();
}
