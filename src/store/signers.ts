import { z } from "zod";
import type { Db } from "./db.ts";
import { isoNow, type StoreContext } from "./context.ts";
import { InvalidRecordError, RecordConflictError, WrongPassphraseError } from "./errors.ts";
import { parseFields, passphraseField, personNameField } from "./fields.ts";
import { hashPassphrase, passphraseMatches, type PassphraseHash } from "./passphrase.ts";

/**
 * People who may sign. A name is unique regardless of case, spacing or Unicode
 * form, because the four-eyes rule compares people by name: "Ana Reyes" and
 * "ana  reyes" must be one person, not a way round the rule.
 */
export function nameKey(name: string): string {
  return name.normalize("NFC").trim().replace(/\s+/gu, " ").toLowerCase();
}

export interface NewSigner {
  name: string;
  passphrase: string;
}

export interface SignerRecord {
  name: string;
  createdAt: string;
}

const newSignerFields = z.strictObject({ name: personNameField, passphrase: passphraseField });

export async function addSigner(ctx: Pick<StoreContext, "db" | "now" | "passphraseCost">, args: NewSigner): Promise<SignerRecord> {
  const { name, passphrase } = parseFields(newSignerFields, args);
  // Refuse early so a taken name costs no hashing; the check inside the write transaction decides any race.
  assertNameFree(ctx.db, name);
  const stored = await hashPassphrase(passphrase, ctx.passphraseCost);
  const createdAt = isoNow(ctx);
  ctx.db
    .transaction(() => {
      assertNameFree(ctx.db, name);
      ctx.db
        .prepare(
          "INSERT INTO signers (name, name_key, salt, hash, scrypt_n, scrypt_r, scrypt_p, created_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?)",
        )
        .run(name, nameKey(name), stored.salt, stored.hash, stored.n, stored.r, stored.p, createdAt);
    })
    .immediate();
  return { name, createdAt };
}

export interface VerifiedSigner {
  id: number;
  /** The name as registered, which is what sheets print. */
  name: string;
  key: string;
}

/** The registered signer, once the passphrase is proven; a typed refusal otherwise. */
export async function verifySigner(db: Db, name: string, passphrase: string): Promise<VerifiedSigner> {
  const key = nameKey(name);
  const row = db
    .prepare("SELECT id, name, name_key AS key, salt, hash, scrypt_n AS n, scrypt_r AS r, scrypt_p AS p FROM signers WHERE name_key = ?")
    .get(key) as (VerifiedSigner & PassphraseHash) | undefined;
  if (!row) {
    throw new InvalidRecordError([
      { path: "name", message: `no signer is registered as "${name.trim()}"; register with \`signer add\` first` },
    ]);
  }
  if (!(await passphraseMatches(passphrase, row))) {
    throw new WrongPassphraseError([{ path: "passphrase", message: `the passphrase is not the one registered for "${row.name}"` }]);
  }
  return { id: row.id, name: row.name, key: row.key };
}

export function listSigners(db: Db): SignerRecord[] {
  return db.prepare("SELECT name, created_at AS createdAt FROM signers ORDER BY name_key").all() as SignerRecord[];
}

/** A RecordConflictError when someone is already registered under this name (in any case or spacing). */
export function assertNameFree(db: Db, name: string): void {
  const taken = db.prepare("SELECT name FROM signers WHERE name_key = ?").get(nameKey(name)) as { name: string } | undefined;
  if (taken) {
    const same = taken.name === name ? "" : ` (as "${taken.name}")`;
    throw new RecordConflictError([{ path: "name", message: `a signer named "${name}" is already registered${same}` }]);
  }
}
