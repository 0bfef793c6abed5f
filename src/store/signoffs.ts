/**
 * @module store/signoffs
 * Signing a revision and reading its sign-offs back. signOff applies the rules and signs the
 * sign-off's facts with the records' Ed25519 key; signOffProblem states the rules once, for the
 * import too (exchange.ts); signoffRows reads a revision's sign-offs and verifies each signature
 * against the facts as stored now, so a row edited in the database shows as a sign-off that does not
 * count. Handed the store context, the request and the signed-in user, who proves the passphrase
 * again (users.ts); gives the sign-off with the revision's new state, or a refusal naming the field.
 * Relies on the signed message of src/schema/signoff.ts and the keys of keys.ts and trust.ts.
 */
import type { KeyObject } from "node:crypto";
import { z } from "zod";
import type { FieldError } from "../engine/errors.ts";
import { signoffMessage, type SignedFacts } from "../schema/signoff.ts";
import type { Q } from "./sql.ts";
import { isoNow, type StoreContext } from "./context.ts";
import { latestRevision, requireCheck } from "./checks.ts";
import { RecordNotFoundError, SignOffRefusedError } from "./errors.ts";
import { appendEvent } from "./events.ts";
import { offeredPassphraseField, parseFields, revisionNumberField, roleField } from "./fields.ts";
import { keyForFingerprint } from "./trust.ts";
import { signatureValid } from "./keys.ts";
import { provePassphrase, type Actor } from "./users.ts";
import { ROLES, revisionState, type RevisionState, type Role } from "./state.ts";

export interface SignOffRequest {
  revision: number;
  role: Role;
  /** The signed-in user's passphrase, given again: a sign-off is a deliberate act, not a click. */
  passphrase: string;
}

export interface SignOffRecord {
  role: Role;
  name: string;
  /** The signer's user id in the records that signed it (these, or the ones an import came from). */
  userId: number | null;
  signedAt: string;
  /** True for a sign-off brought in by an import from a trusted key. */
  imported: boolean;
  /** Ed25519 signature (base64) over the sign-off's facts; null for one made before signatures were kept. */
  signature: string | null;
  keyFingerprint: string | null;
  /** The signature is there, verifies, and is by these records' key or a trusted one. Only valid sign-offs count. */
  valid: boolean;
}

export interface SignedRevision {
  revision: number;
  signoff: SignOffRecord;
  state: RevisionState;
}

const signOffFields = z.strictObject({
  revision: revisionNumberField,
  role: roleField,
  passphrase: offeredPassphraseField,
});

/**
 * Sign one revision in one role as the signed-in user, who gives their passphrase again. The
 * rules, in the order a reader meets them: roles go prepared → checked → approved; only the
 * latest revision can be signed; preparer, checker and approver are three different people
 * (the four-eyes rule and a separate approval, common practice for calculation sheets). The
 * sign-off signs the check id, revision, fingerprint, role, user id, name and time with the
 * records' Ed25519 key.
 */
export async function signOff(
  ctx: StoreContext,
  checkId: string,
  request: SignOffRequest,
  by: Actor,
  source: string,
): Promise<SignedRevision> {
  const req = parseFields(signOffFields, request);
  await requireCheck(ctx.sql, checkId);
  await requireRevision(ctx.sql, checkId, req.revision);
  await provePassphrase(ctx, by, req.passphrase, source);
  const signedAt = isoNow(ctx);

  // The rules are judged inside the write transaction, after the (slow) passphrase check, so a
  // revision saved meanwhile is seen.
  return ctx.sql.write(async (q): Promise<SignedRevision> => {
    const latest = await latestRevision(q, checkId);
    if (req.revision < latest.number) {
      throw new SignOffRefusedError([
        {
          path: "revision",
          message: `revision ${req.revision} is superseded by revision ${latest.number}; only the latest revision can be signed`,
        },
      ]);
    }
    const existing = await signoffRows(ctx, q, checkId, req.revision, latest.fingerprint);
    const identity = identityOf(ctx.keys.fingerprint, by.id);
    const problem = signOffProblem(existing, req.role, identity);
    if (problem) throw new SignOffRefusedError([problem]);
    const facts: SignedFacts = {
      checkId,
      revision: req.revision,
      fingerprint: latest.fingerprint,
      role: req.role,
      userId: by.id,
      name: by.name,
      signedAt,
    };
    const signature = ctx.keys.sign(signoffMessage(facts));
    await q.run(
      `INSERT INTO signoffs (check_id, revision, role, name, name_key, signer_id, signed_at, user_id, key_fingerprint, signature)
         VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
      checkId,
      req.revision,
      req.role,
      by.name,
      identity,
      by.id,
      signedAt,
      by.id,
      ctx.keys.fingerprint,
      signature,
    );
    await appendEvent(q, checkId, {
      at: signedAt,
      kind: "signed",
      revision: req.revision,
      actor: by.name,
      detail: { role: req.role, userId: by.id },
    });
    const roles = [...existing.filter((s) => s.valid).map((s) => s.role), req.role];
    return {
      revision: req.revision,
      signoff: {
        role: req.role,
        name: by.name,
        userId: by.id,
        signedAt,
        imported: false,
        signature,
        keyFingerprint: ctx.keys.fingerprint,
        valid: true,
      },
      state: revisionState(req.revision, latest.number, roles),
    };
  });
}

/** Who a sign-off is by: a user id is only unique within the records (the key) that gave it. */
export function identityOf(keyFingerprint: string | null, userId: number | null): string {
  return `${keyFingerprint ?? "unsigned"}/${userId ?? "?"}`;
}

export interface SignoffRow extends SignOffRecord {
  /** identityOf(keyFingerprint, userId). */
  identity: string;
}

/**
 * Why `role` may not be signed next by the person `identity`, given the sign-offs already on the
 * revision, naming the field at fault; nothing when it may. Shared with the import, which holds
 * outside records to the same rules.
 */
export function signOffProblem(
  existing: readonly Pick<SignoffRow, "role" | "name" | "identity">[],
  role: Role,
  identity: string,
): FieldError | undefined {
  const by = (r: Role) => existing.find((s) => s.role === r);
  const already = by(role);
  if (already) return { path: "role", message: `the revision is already signed as ${role} by ${already.name}` };
  const index = ROLES.indexOf(role);
  const before = index > 0 ? ROLES[index - 1] : undefined;
  if (before && !by(before)) {
    return { path: "role", message: `"${role}" needs the "${before}" sign-off first (order: ${ROLES.join(" → ")})` };
  }
  const same = existing.find((s) => s.identity === identity);
  if (same) {
    return {
      path: "role",
      message: `${same.name} already signed this revision as ${same.role}; preparer, checker and approver must be three different people`,
    };
  }
  return undefined;
}

interface StoredSignoff {
  role: Role;
  name: string;
  userId: number | null;
  signedAt: string;
  local: number;
  signature: string | null;
  keyFingerprint: string | null;
}

/**
 * The revision's sign-offs in role order, each with its signature checked against the facts as
 * stored now: a sign-off whose signature fails (a row or the revision's fingerprint edited in
 * the database file, or a key no longer trusted) is shown but does not count.
 */
export async function signoffRows(
  ctx: Pick<StoreContext, "keys">,
  q: Q,
  checkId: string,
  revision: number,
  fingerprint: string,
): Promise<SignoffRow[]> {
  const rows = await q.all<StoredSignoff>(
    `SELECT role, name, user_id AS "userId", signed_at AS "signedAt", CASE WHEN signer_id IS NULL THEN 0 ELSE 1 END AS local, signature,
            key_fingerprint AS "keyFingerprint"
       FROM signoffs WHERE check_id = ? AND revision = ?`,
    checkId,
    revision,
  );
  const keys = new Map<string, KeyObject | undefined>();
  for (const r of rows)
    if (r.keyFingerprint && !keys.has(r.keyFingerprint)) keys.set(r.keyFingerprint, await keyForFingerprint(ctx, q, r.keyFingerprint));
  return rows
    .map(({ local, ...r }) => {
      const key = r.keyFingerprint ? keys.get(r.keyFingerprint) : undefined;
      const valid =
        key !== undefined &&
        r.signature !== null &&
        r.userId !== null &&
        signatureValid(
          key,
          signoffMessage({ checkId, revision, fingerprint, role: r.role, userId: r.userId, name: r.name, signedAt: r.signedAt }),
          r.signature,
        );
      return { ...r, imported: local === 0, valid, identity: identityOf(r.keyFingerprint, r.userId) };
    })
    .sort((a, b) => ROLES.indexOf(a.role) - ROLES.indexOf(b.role));
}

async function requireRevision(q: Q, checkId: string, revision: number): Promise<void> {
  const found = await q.get("SELECT 1 AS found FROM revisions WHERE check_id = ? AND number = ?", checkId, revision);
  if (!found) throw new RecordNotFoundError([{ path: "revision", message: `check ${checkId} has no revision ${revision}` }]);
}
