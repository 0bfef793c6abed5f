import type { KeyObject } from "node:crypto";
import { z } from "zod";
import type { StoreContext } from "./context.ts";
import { InvalidRecordError, RecordConflictError } from "./errors.ts";
import { parseFields, titleField } from "./fields.ts";
import { keyFingerprint, readPublicKey } from "./keys.ts";
import { logPeopleEvent } from "./peopleLog.ts";
import { requireAdmin, type Actor } from "./users.ts";
import { isoNow } from "./context.ts";
import type { Q } from "./sql.ts";

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

export async function trustKey(ctx: StoreContext, body: unknown, by: Actor): Promise<TrustedKey> {
  await requireAdmin(ctx.sql, by, "trust a key");
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
  await ctx.sql.write(async (q) => {
    if (await q.get("SELECT 1 AS found FROM trusted_keys WHERE fingerprint = ?", fingerprint)) {
      throw new RecordConflictError([{ path: "publicKeyPem", message: `the key ${fingerprint} is already trusted` }]);
    }
    await q.run(
      "INSERT INTO trusted_keys (fingerprint, public_key, label, trusted_by, trusted_at) VALUES (?, ?, ?, ?, ?)",
      fingerprint,
      pem,
      f.label,
      by.id,
      at,
    );
    await logPeopleEvent(q, {
      at,
      kind: "key-trusted",
      userId: null,
      actorId: by.id,
      source: null,
      detail: { fingerprint, label: f.label },
    });
  });
  return { fingerprint, publicKeyPem: pem, label: f.label, trustedBy: by.id, trustedAt: at };
}

export function listTrustedKeys(q: Q): Promise<TrustedKey[]> {
  return q.all<TrustedKey>(
    `SELECT fingerprint, public_key AS "publicKeyPem", label, trusted_by AS "trustedBy", trusted_at AS "trustedAt" FROM trusted_keys ORDER BY trusted_at`,
  );
}

/** The public key named by a fingerprint: these records' own, or a trusted one. */
export async function keyForFingerprint(ctx: Pick<StoreContext, "keys">, q: Q, fingerprint: string): Promise<KeyObject | undefined> {
  if (fingerprint === ctx.keys.fingerprint) return ctx.keys.publicKey;
  const row = await q.get<{ pem: string }>("SELECT public_key AS pem FROM trusted_keys WHERE fingerprint = ?", fingerprint);
  return row ? readPublicKey(row.pem) : undefined;
}
