import { createHash } from "node:crypto";
import { z } from "zod";
import { fingerprint } from "../engine/fingerprint.ts";
import { canonicalJson } from "../schema/canonical.ts";
import type { FieldError } from "../engine/errors.ts";
import { isoNow, validInput, type StoreContext } from "./context.ts";
import { assertCalcNumberFree, insertRevision } from "./checks.ts";
import { InvalidRecordError, RecordConflictError } from "./errors.ts";
import { appendEvent, EVENT_KINDS } from "./events.ts";
import { calcNumberField, joinPath, parseFields, personNameField, revisionNumberField, roleField, titleField } from "./fields.ts";
import { getCheck } from "./history.ts";
import { nameKey } from "./signers.ts";
import { signOffProblem, type SignoffRow } from "./signoffs.ts";
import { ROLES } from "./state.ts";

/**
 * One check with all its revisions, sign-offs and events as a single JSON
 * document, to carry it to another database. Signers' passphrase hashes are
 * never written: a sign-off travels as a record (role, name, time).
 *
 * The digest is a checksum, not a signature: it catches a file edited by hand
 * or damaged on the way, but whoever edits the file can also recompute it.
 */
export const EXCHANGE_FORMAT = "hoopwise.records/1";

const isoTime = z.iso.datetime({ error: "must be an ISO 8601 time such as 2030-01-31T09:00:00.000Z" });

const signoffDoc = z.strictObject({ role: roleField, name: personNameField, signedAt: isoTime });

const revisionDoc = z.strictObject({
  number: revisionNumberField,
  input: z.unknown(),
  fingerprint: z.string().regex(/^[0-9a-f]{64}$/, "must be 64 lowercase hexadecimal digits"),
  engineVersion: z.string().min(1, "must not be empty").max(100, "must be at most 100 characters"),
  savedAt: isoTime,
  savedBy: personNameField.nullable(),
  signoffs: z.array(signoffDoc),
});

const eventDoc = z.strictObject({
  at: isoTime,
  kind: z.enum(EVENT_KINDS),
  revision: z.int().min(1).nullable(),
  actor: z.string().max(100).nullable(),
  detail: z.record(z.string(), z.unknown()).nullable(),
});

const exchangeDoc = z.strictObject({
  format: z.literal(EXCHANGE_FORMAT, { error: `must be "${EXCHANGE_FORMAT}"` }),
  exportedAt: isoTime,
  check: z.strictObject({
    id: z.string().regex(/^[A-Za-z0-9-]{1,64}$/, "must be 1 to 64 letters, digits or hyphens"),
    title: titleField,
    calcNumber: calcNumberField,
    createdAt: isoTime,
  }),
  revisions: z.array(revisionDoc).min(1, "must hold at least one revision"),
  events: z.array(eventDoc),
  digest: z.string(),
});

export type ExchangeDocument = z.output<typeof exchangeDoc>;

export interface ImportedCheck {
  id: string;
  title: string;
  calcNumber: string;
  revisions: number;
}

/** The check as an exchange document; the export itself is logged first, so the file carries its own "exported" event. */
export function exportCheck(ctx: StoreContext, checkId: string): ExchangeDocument {
  return ctx.db
    .transaction((): ExchangeDocument => {
      const at = isoNow(ctx);
      const before = getCheck(ctx.db, checkId);
      appendEvent(ctx.db, checkId, { at, kind: "exported", revision: before.latestRevision, actor: null, detail: null });
      const check = getCheck(ctx.db, checkId);
      const body: Omit<ExchangeDocument, "digest"> = {
        format: EXCHANGE_FORMAT,
        exportedAt: at,
        check: { id: check.id, title: check.title, calcNumber: check.calcNumber, createdAt: check.createdAt },
        revisions: check.revisions.map((r) => ({
          number: r.number,
          input: r.input,
          fingerprint: r.fingerprint,
          engineVersion: r.engineVersion,
          savedAt: r.savedAt,
          savedBy: r.savedBy,
          signoffs: r.signoffs.map(({ role, name, signedAt }) => ({ role, name, signedAt })),
        })),
        events: check.events,
      };
      return { ...body, digest: digestOf(body) };
    })
    .immediate();
}

/**
 * Bring an exported check into this database after verifying every
 * fingerprint, the digest, the input of each revision and the sign-off rules.
 * Nothing is written unless all of it holds.
 */
export function importCheck(ctx: StoreContext, document: unknown): ImportedCheck {
  const doc = parseFields(exchangeDoc, document);
  const errors = verify(ctx, doc, document);
  if (errors.length) throw new InvalidRecordError(errors);

  const at = isoNow(ctx);
  const { check } = doc;
  ctx.db
    .transaction(() => {
      if (ctx.db.prepare("SELECT 1 FROM checks WHERE id = ?").get(check.id)) {
        throw new RecordConflictError([{ path: "check.id", message: `check ${check.id} is already in this database` }]);
      }
      assertCalcNumberFree(ctx.db, check.calcNumber, "check.calcNumber");
      ctx.db
        .prepare("INSERT INTO checks (id, title, calc_number, created_at) VALUES (?, ?, ?, ?)")
        .run(check.id, check.title, check.calcNumber, check.createdAt);
      const addSignoff = ctx.db.prepare(
        "INSERT INTO signoffs (check_id, revision, role, name, name_key, signer_id, signed_at) VALUES (?, ?, ?, ?, ?, NULL, ?)",
      );
      for (const r of doc.revisions) {
        insertRevision(ctx.db, check.id, {
          number: r.number,
          canonical: canonicalJson(r.input),
          fingerprint: r.fingerprint,
          engineVersion: r.engineVersion,
          savedAt: r.savedAt,
          savedBy: r.savedBy,
        });
        for (const s of r.signoffs) addSignoff.run(check.id, r.number, s.role, s.name, nameKey(s.name), s.signedAt);
      }
      for (const e of doc.events) appendEvent(ctx.db, check.id, e);
      appendEvent(ctx.db, check.id, {
        at,
        kind: "imported",
        revision: doc.revisions.length,
        actor: null,
        detail: { exportedAt: doc.exportedAt },
      });
    })
    .immediate();
  return { id: check.id, title: check.title, calcNumber: check.calcNumber, revisions: doc.revisions.length };
}

function verify(ctx: StoreContext, doc: ExchangeDocument, raw: unknown): FieldError[] {
  const errors: FieldError[] = [];
  const { digest: _claimed, ...body } = raw as Record<string, unknown>;
  if (digestOf(body) !== doc.digest) {
    errors.push({ path: "digest", message: "does not match the file's contents: the file was changed after it was exported" });
  }
  doc.revisions.forEach((r, i) => {
    const at = `revisions.${i}`;
    if (r.number !== i + 1) errors.push({ path: `${at}.number`, message: `must be ${i + 1}: revisions are numbered 1, 2, 3… in order` });
    if (fingerprint(r.input, r.engineVersion) !== r.fingerprint) {
      errors.push({
        path: `${at}.fingerprint`,
        message: "does not match the revision's input and engine version: the input was changed after it was saved",
      });
    }
    try {
      validInput(ctx, r.input, `${at}.input`);
    } catch (err) {
      if (!(err instanceof InvalidRecordError)) throw err;
      errors.push(...err.errors);
    }
    errors.push(...signoffErrors(r.signoffs, at));
  });
  doc.events.forEach((e, i) => {
    if (e.revision !== null && e.revision > doc.revisions.length) {
      errors.push({ path: `events.${i}.revision`, message: `names revision ${e.revision}, which the file does not hold` });
    }
  });
  return errors;
}

/** Imported sign-offs must obey the same order and four-eyes rules as ones given here. */
function signoffErrors(signoffs: ExchangeDocument["revisions"][number]["signoffs"], at: string): FieldError[] {
  const errors: FieldError[] = [];
  const accepted: Pick<SignoffRow, "role" | "name" | "key">[] = [];
  const inRoleOrder = signoffs.map((s, j) => ({ ...s, j })).sort((a, b) => ROLES.indexOf(a.role) - ROLES.indexOf(b.role));
  for (const s of inRoleOrder) {
    const key = nameKey(s.name);
    const problem = signOffProblem(accepted, s.role, key);
    if (problem) errors.push({ path: joinPath(`${at}.signoffs.${s.j}`, problem.path), message: problem.message });
    else accepted.push({ role: s.role, name: s.name, key });
  }
  return errors;
}

function digestOf(body: unknown): string {
  return createHash("sha256").update(canonicalJson(body)).digest("hex");
}
