import { z } from "zod";
import type { FieldError } from "../engine/errors.ts";
import type { Db } from "./db.ts";
import { isoNow, type StoreContext } from "./context.ts";
import { clearFailures, noteFailure, refuseWhileLocked } from "./attempts.ts";
import { RecordNotFoundError, SignOffRefusedError, WrongPassphraseError } from "./errors.ts";
import { appendEvent } from "./events.ts";
import { latestRevision, requireCheck } from "./checks.ts";
import { offeredPassphraseField, parseFields, personNameField, revisionNumberField, roleField } from "./fields.ts";
import { nameKey, verifySigner } from "./signers.ts";
import { ROLES, revisionState, type RevisionState, type Role } from "./state.ts";

export interface SignOffRequest {
  revision: number;
  role: Role;
  name: string;
  passphrase: string;
}

export interface SignOffRecord {
  role: Role;
  name: string;
  signedAt: string;
  /** True for a sign-off brought in by an import: its passphrase was checked where it was given, not here. */
  imported: boolean;
}

export interface SignedRevision {
  revision: number;
  signoff: SignOffRecord;
  state: RevisionState;
}

const signOffFields = z.strictObject({
  revision: revisionNumberField,
  role: roleField,
  name: personNameField,
  passphrase: offeredPassphraseField,
});

/**
 * Sign one revision in one role. The rules, in the order a reader meets them:
 * roles go prepared → checked → approved; only the latest revision can be
 * signed; the checker must not be the preparer (the four-eyes rule, common
 * practice); the approver must not be the checker, so the approval is a second
 * look at the check rather than the checker's own stamp. The approver may be
 * the preparer, which lets a two-person office complete a sheet.
 */
export async function signOff(ctx: StoreContext, checkId: string, request: SignOffRequest): Promise<SignedRevision> {
  const req = parseFields(signOffFields, request);
  requireCheck(ctx.db, checkId);
  requireRevision(ctx.db, checkId, req.revision);
  const key = nameKey(req.name);
  refuseWhileLocked(ctx, key, req.name.trim());
  const signer = await verifySigner(ctx.db, req.name, req.passphrase).catch((err: unknown) => {
    if (err instanceof WrongPassphraseError) noteFailure(ctx, key);
    throw err;
  });
  clearFailures(ctx, key);
  const signedAt = isoNow(ctx);

  // The rules are judged inside the write transaction, after the (slow)
  // passphrase check, so a revision saved meanwhile is seen.
  return ctx.db
    .transaction((): SignedRevision => {
      const latest = latestRevision(ctx.db, checkId).number;
      if (req.revision < latest) {
        throw new SignOffRefusedError([
          {
            path: "revision",
            message: `revision ${req.revision} is superseded by revision ${latest}; only the latest revision can be signed`,
          },
        ]);
      }
      const existing = signoffRows(ctx.db, checkId, req.revision);
      refuseUnlessAllowed(existing, req.role, signer.key);
      ctx.db
        .prepare("INSERT INTO signoffs (check_id, revision, role, name, name_key, signer_id, signed_at) VALUES (?, ?, ?, ?, ?, ?, ?)")
        .run(checkId, req.revision, req.role, signer.name, signer.key, signer.id, signedAt);
      appendEvent(ctx.db, checkId, {
        at: signedAt,
        kind: "signed",
        revision: req.revision,
        actor: signer.name,
        detail: { role: req.role },
      });
      const roles = [...existing.map((s) => s.role), req.role];
      return {
        revision: req.revision,
        signoff: { role: req.role, name: signer.name, signedAt, imported: false },
        state: revisionState(req.revision, latest, roles),
      };
    })
    .immediate();
}

export interface SignoffRow {
  role: Role;
  name: string;
  key: string;
  signedAt: string;
  imported: boolean;
}

/**
 * Why `role` may not be signed next by the person with `signerKey`, given the
 * sign-offs already on the revision, naming the field at fault; nothing when
 * it may. Shared with the import, which holds outside records to the same rules.
 */
export function signOffProblem(
  existing: readonly Pick<SignoffRow, "role" | "name" | "key">[],
  role: Role,
  signerKey: string,
): FieldError | undefined {
  const by = (r: Role) => existing.find((s) => s.role === r);
  const already = by(role);
  if (already) return { path: "role", message: `the revision is already signed as ${role} by ${already.name}` };
  const index = ROLES.indexOf(role);
  const before = index > 0 ? ROLES[index - 1] : undefined;
  if (before && !by(before)) {
    return { path: "role", message: `"${role}" needs the "${before}" sign-off first (order: ${ROLES.join(" → ")})` };
  }
  const preparer = by("prepared");
  if (role === "checked" && preparer?.key === signerKey) {
    return { path: "name", message: `${preparer.name} prepared this revision and may not also check it (four-eyes rule)` };
  }
  const checker = by("checked");
  if (role === "approved" && checker?.key === signerKey) {
    return {
      path: "name",
      message: `${checker.name} checked this revision and may not also approve it; the approval must be a second look`,
    };
  }
  return undefined;
}

function refuseUnlessAllowed(existing: SignoffRow[], role: Role, signerKey: string): void {
  const problem = signOffProblem(existing, role, signerKey);
  if (problem) throw new SignOffRefusedError([problem]);
}

export function signoffRows(db: Db, checkId: string, revision: number): SignoffRow[] {
  return (
    db
      .prepare(
        "SELECT role, name, name_key AS key, signed_at AS signedAt, signer_id IS NULL AS imported FROM signoffs WHERE check_id = ? AND revision = ?",
      )
      .all(checkId, revision) as (Omit<SignoffRow, "imported"> & { imported: number })[]
  )
    .map((r) => ({ ...r, imported: r.imported === 1 }))
    .sort((a, b) => ROLES.indexOf(a.role) - ROLES.indexOf(b.role));
}

function requireRevision(db: Db, checkId: string, revision: number): void {
  const found = db.prepare("SELECT 1 FROM revisions WHERE check_id = ? AND number = ?").get(checkId, revision);
  if (!found) throw new RecordNotFoundError([{ path: "revision", message: `check ${checkId} has no revision ${revision}` }]);
}
