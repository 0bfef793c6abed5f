import type { KeyObject } from "node:crypto";
import { z } from "zod";
import type { StoreContext } from "./context.ts";
import { InvalidRecordError, RecordConflictError } from "./errors.ts";
import { parseFields, titleField } from "./fields.ts";
import { keyFingerprint, readPublicKey } from "./keys.ts";
import { logPeopleEvent } from "./peopleLog.ts";
import { requireAdmin, type Actor } from "./users.ts";
import { isoNow } from "./context.ts";

/**
 * Keys whose signatures these records accept besides their own: another office's records key,
 * marked trusted by an admin. An import keeps its sign-offs only when they are signed by one.
 */
export interface TrustedKey {
  fingerprint: string;
  publicKeyPem: string;
  label: string;
  trustedBy: number;
  trustedAt: string;
}

const trustFields = z.strictObject({
  publicKeyPem: z.string({ error: "is required: the other records' public key, as PEM text" }).max(4096, "must be at most 4096 characters"),
  label: titleField,
});

export function trustKey(ctx: StoreContext, body: unknown, by: Actor): TrustedKey {
  requireAdmin(ctx.db, by, "trust a key");
  const f = parseFields(trustFields, body);
  const key = readPublicKey(f.publicKeyPem);
  if (!key)
    throw new InvalidRecordError([
      { path: "publicKeyPem", message: "is not an Ed25519 public key in PEM form (-----BEGIN PUBLIC KEY-----)" },
    ]);
  const fingerprint = keyFingerprint(key);
  if (fingerprint === ctx.keys.fingerprint) {
    throw new RecordConflictError([{ path: "publicKeyPem", message: "is these records' own key, which is always trusted" }]);
  }
  const pem = key.export({ type: "spki", format: "pem" }) as string;
  const at = isoNow(ctx);
  ctx.db
    .transaction(() => {
      if (ctx.db.prepare("SELECT 1 FROM trusted_keys WHERE fingerprint = ?").get(fingerprint)) {
        throw new RecordConflictError([{ path: "publicKeyPem", message: `the key ${fingerprint} is already trusted` }]);
      }
      ctx.db
        .prepare("INSERT INTO trusted_keys (fingerprint, public_key, label, trusted_by, trusted_at) VALUES (?, ?, ?, ?, ?)")
        .run(fingerprint, pem, f.label, by.id, at);
      logPeopleEvent(ctx.db, {
        at,
        kind: "key-trusted",
        userId: null,
        actorId: by.id,
        source: null,
        detail: { fingerprint, label: f.label },
      });
    })
    .immediate();
  return { fingerprint, publicKeyPem: pem, label: f.label, trustedBy: by.id, trustedAt: at };
}

export function listTrustedKeys(ctx: Pick<StoreContext, "db">): TrustedKey[] {
  return ctx.db
    .prepare(
      "SELECT fingerprint, public_key AS publicKeyPem, label, trusted_by AS trustedBy, trusted_at AS trustedAt FROM trusted_keys ORDER BY trusted_at",
    )
    .all() as TrustedKey[];
}

/** The public key named by a fingerprint: these records' own, or a trusted one. */
export function keyForFingerprint(ctx: Pick<StoreContext, "db" | "keys">, fingerprint: string): KeyObject | undefined {
  if (fingerprint === ctx.keys.fingerprint) return ctx.keys.publicKey;
  const row = ctx.db.prepare("SELECT public_key AS pem FROM trusted_keys WHERE fingerprint = ?").get(fingerprint) as
    | { pem: string }
    | undefined;
  return row ? readPublicKey(row.pem) : undefined;
}
