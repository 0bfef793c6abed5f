import type { KeyObject } from "node:crypto";
import { z } from "zod";
import { fingerprint } from "../engine/fingerprint.ts";
import { canonicalJson } from "../schema/canonical.ts";
import { signoffMessage } from "../schema/signoff.ts";
import type { FieldError } from "../engine/errors.ts";
import { isoNow, validInput, type StoreContext } from "./context.ts";
import { assertCalcNumberFree, insertRevision } from "./checks.ts";
import { InvalidRecordError, RecordConflictError } from "./errors.ts";
import { appendEvent, EVENT_KINDS } from "./events.ts";
import { calcNumberField, joinPath, parseFields, personNameField, revisionNumberField, roleField, titleField } from "./fields.ts";
import { getCheck } from "./history.ts";
import { keyFingerprint, readPublicKey, signatureValid } from "./keys.ts";
import { identityOf, signOffProblem, type SignoffRow } from "./signoffs.ts";
import { ROLES } from "./state.ts";
import { listTrustedKeys } from "./trust.ts";
import type { Actor } from "./users.ts";

/**
 * One check with all its revisions, sign-offs and events as a single JSON document, to carry it
 * to another database. Passphrase hashes are never written: a sign-off travels as its facts and
 * their Ed25519 signature. The whole document is signed with the records' key, and carries the
 * public key so the receiving records can name it.
 *
 * An import keeps sign-offs only when the document's signature and every sign-off's signature
 * verify with a key these records trust (their own, or one an admin marked trusted). Otherwise
 * every revision comes in unsigned, as a draft, marked "imported, not signed in these records".
 */
export const EXCHANGE_FORMAT = "hoopwise.records/2";

/** Caps on what one import may bring, each refused with its own message. */
export const MAX_IMPORT_REVISIONS = 500;
export const MAX_IMPORT_EVENTS = 20_000;
/** Bytes of the document's canonical JSON; the HTTP route refuses a larger body before reading it. */
export const MAX_IMPORT_BYTES = 64 * 1024 * 1024;

const isoTime = z.iso.datetime({ error: "must be an ISO 8601 time such as 2030-01-31T09:00:00.000Z" });
const hex64 = z.string().regex(/^[0-9a-f]{64}$/, "must be 64 lowercase hexadecimal digits");
const base64 = z
  .string()
  .max(200, "must be at most 200 characters")
  .regex(/^[A-Za-z0-9+/]+={0,2}$/, "must be base64");

const signoffDoc = z.strictObject({
  role: roleField,
  name: personNameField,
  userId: z.int({ error: "must be a whole number" }).min(1).nullable(),
  signedAt: isoTime,
  keyFingerprint: hex64.nullable(),
  signature: base64.nullable(),
});

const revisionDoc = z.strictObject({
  number: revisionNumberField,
  input: z.unknown(),
  fingerprint: hex64,
  engineVersion: z.string().min(1, "must not be empty").max(100, "must be at most 100 characters"),
  savedAt: isoTime,
  savedBy: personNameField.nullable(),
  signoffs: z.array(signoffDoc).max(ROLES.length, `must hold at most ${ROLES.length} sign-offs`),
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
  signature: z.strictObject({
    algorithm: z.literal("Ed25519", { error: 'must be "Ed25519"' }),
    publicKeyPem: z.string().max(4096),
    keyFingerprint: hex64,
    value: base64,
  }),
});

export type ExchangeDocument = z.output<typeof exchangeDoc>;

export interface ImportedCheck {
  id: string;
  title: string;
  calcNumber: string;
  revisions: number;
  /** Whether the sign-offs were kept: the document and each sign-off signed by a trusted key. */
  signed: boolean;
  /** Why not, in words, when they were not. */
  unsignedBecause?: string;
}

/** The check as a signed exchange document. Reading for an export writes nothing. */
export async function exportCheck(ctx: StoreContext, checkId: string): Promise<ExchangeDocument> {
  const check = await getCheck(ctx, checkId);
  const body: Omit<ExchangeDocument, "signature"> = {
    format: EXCHANGE_FORMAT,
    exportedAt: isoNow(ctx),
    check: { id: check.id, title: check.title, calcNumber: check.calcNumber, createdAt: check.createdAt },
    revisions: check.revisions.map((r) => ({
      number: r.number,
      input: r.input,
      fingerprint: r.fingerprint,
      engineVersion: r.engineVersion,
      savedAt: r.savedAt,
      savedBy: r.savedBy,
      // Only sign-offs that hold travel: one whose signature fails here would fail there too.
      signoffs: r.signoffs
        .filter((s) => s.valid && r.intact)
        .map(({ role, name, userId, signedAt, keyFingerprint, signature }) => ({
          role,
          name,
          userId,
          signedAt,
          keyFingerprint,
          signature,
        })),
    })),
    events: check.events,
  };
  return {
    ...body,
    signature: {
      algorithm: "Ed25519",
      publicKeyPem: ctx.keys.publicKeyPem,
      keyFingerprint: ctx.keys.fingerprint,
      value: ctx.keys.sign(canonicalJson(body)),
    },
  };
}

/** The public keys an import's signatures may be by: these records' own and the ones an admin trusts. */
export interface ImportKeys {
  /** PEM text by fingerprint. */
  [fingerprint: string]: string;
}

/**
 * An exchange document checked for everything but what is already in the records: the caps, the
 * fields, the numbering, every fingerprint, the input of each revision (validated), the file's
 * and every sign-off's signature against `keys`, and the sign-off rules. Pure and CPU-bound, so a
 * large import is worked in a worker thread; the answer is plain data (the inputs left out, their
 * canonical text kept), cheap to hand back.
 */
export interface PreparedImport {
  /** The document with each revision's input set to null: `canonical` holds it. */
  doc: ExchangeDocument;
  /** The canonical JSON of each revision's input, in order, as it will be stored. */
  canonical: string[];
  trust: Trust;
}

export function prepareImport(ctx: Pick<StoreContext, "validate">, document: unknown, keys: ImportKeys): PreparedImport {
  refuseOverCaps(document);
  const doc = parseFields(exchangeDoc, document);
  const errors = checkContent(ctx, doc);
  if (errors.length) throw new InvalidRecordError(errors);
  const { signature: _s, ...body } = document as Record<string, unknown>;
  const trust = judgeTrust(doc, canonicalJson(body), (fp) => (keys[fp] ? readPublicKey(keys[fp]) : undefined));
  if (trust.ok) {
    const ruleErrors = doc.revisions.flatMap((r, i) => signoffErrors(r.signoffs, `revisions.${i}`));
    if (ruleErrors.length) throw new InvalidRecordError(ruleErrors);
  }
  const canonical = doc.revisions.map((r) => canonicalJson(r.input));
  return { doc: { ...doc, revisions: doc.revisions.map((r) => ({ ...r, input: null })) }, canonical, trust };
}

/** The keys an import may be signed with, as prepareImport takes them. */
export async function importKeys(ctx: Pick<StoreContext, "sql" | "keys">): Promise<ImportKeys> {
  const keys: ImportKeys = { [ctx.keys.fingerprint]: ctx.keys.publicKeyPem };
  for (const k of await listTrustedKeys(ctx.sql)) keys[k.fingerprint] = k.publicKeyPem;
  return keys;
}

/**
 * Bring an exported check into this database after checking the caps, every fingerprint, the
 * input of each revision, the signatures and the sign-off rules. Nothing is written unless all
 * of it holds: the rows go in one write transaction. `prepared` is prepareImport's answer for
 * this document when it was worked elsewhere (a worker thread, with the same schema and keys);
 * otherwise it is worked here.
 */
export async function importCheck(ctx: StoreContext, document: unknown, by: Actor, prepared?: PreparedImport): Promise<ImportedCheck> {
  const { doc, canonical, trust } = prepared ?? prepareImport(ctx, document, await importKeys(ctx));

  const at = isoNow(ctx);
  const { check } = doc;
  await ctx.sql.write(async (q) => {
    if (await q.get("SELECT 1 AS found FROM checks WHERE id = ?", check.id)) {
      throw new RecordConflictError([{ path: "check.id", message: `check ${check.id} is already in these records` }]);
    }
    await assertCalcNumberFree(q, check.calcNumber, "check.calcNumber");
    await q.run(
      "INSERT INTO checks (id, title, calc_number, created_at) VALUES (?, ?, ?, ?)",
      check.id,
      check.title,
      check.calcNumber,
      check.createdAt,
    );
    for (const [i, r] of doc.revisions.entries()) {
      await insertRevision(q, check.id, {
        number: r.number,
        canonical: canonical[i],
        fingerprint: r.fingerprint,
        engineVersion: r.engineVersion,
        savedAt: r.savedAt,
        savedBy: r.savedBy,
        importedUnsigned: !trust.ok,
      });
      if (!trust.ok) continue;
      for (const s of r.signoffs) {
        await q.run(
          `INSERT INTO signoffs (check_id, revision, role, name, name_key, signer_id, signed_at, user_id, key_fingerprint, signature)
           VALUES (?, ?, ?, ?, ?, NULL, ?, ?, ?, ?)`,
          check.id,
          r.number,
          s.role,
          s.name,
          identityOf(s.keyFingerprint, s.userId),
          s.signedAt,
          s.userId,
          s.keyFingerprint,
          s.signature,
        );
      }
    }
    for (const e of doc.events) await appendEvent(q, check.id, e);
    await appendEvent(q, check.id, {
      at,
      kind: "imported",
      revision: doc.revisions.length,
      actor: by.name,
      detail: {
        exportedAt: doc.exportedAt,
        keyFingerprint: trust.fingerprint,
        signed: trust.ok,
        ...(trust.ok ? {} : { unsignedBecause: trust.why }),
      },
    });
  });
  return {
    id: check.id,
    title: check.title,
    calcNumber: check.calcNumber,
    revisions: doc.revisions.length,
    signed: trust.ok,
    ...(trust.ok ? {} : { unsignedBecause: trust.why }),
  };
}

/** The caps, judged on the raw document before anything heavier, so an oversized one costs little. */
function refuseOverCaps(document: unknown): void {
  const d = document as { revisions?: unknown; events?: unknown } | null;
  const errors: FieldError[] = [];
  if (Array.isArray(d?.revisions) && d.revisions.length > MAX_IMPORT_REVISIONS) {
    errors.push({ path: "revisions", message: `holds ${d.revisions.length} revisions; an import takes at most ${MAX_IMPORT_REVISIONS}` });
  }
  if (Array.isArray(d?.events) && d.events.length > MAX_IMPORT_EVENTS) {
    errors.push({ path: "events", message: `holds ${d.events.length} events; an import takes at most ${MAX_IMPORT_EVENTS}` });
  }
  if (errors.length) throw new InvalidRecordError(errors);
  const bytes = Buffer.byteLength(canonicalJson(document));
  if (bytes > MAX_IMPORT_BYTES) {
    throw new InvalidRecordError([
      { path: "(document)", message: `is ${(bytes / 1048576).toFixed(1)} MiB; an import takes at most ${MAX_IMPORT_BYTES / 1048576} MiB` },
    ]);
  }
}

/** What must hold whether or not the file is trusted: numbering, fingerprints, valid inputs, events. */
function checkContent(ctx: Pick<StoreContext, "validate">, doc: ExchangeDocument): FieldError[] {
  const errors: FieldError[] = [];
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
  });
  doc.events.forEach((e, i) => {
    if (e.revision !== null && e.revision > doc.revisions.length) {
      errors.push({ path: `events.${i}.revision`, message: `names revision ${e.revision}, which the file does not hold` });
    }
  });
  return errors;
}

export type Trust = { ok: true; fingerprint: string } | { ok: false; fingerprint: string | null; why: string };

/** Whether the document and all its sign-offs are signed by a key these records trust. */
function judgeTrust(doc: ExchangeDocument, signedBody: string, keyFor: (fingerprint: string) => KeyObject | undefined): Trust {
  const key = readPublicKey(doc.signature.publicKeyPem);
  if (!key) return { ok: false, fingerprint: null, why: "the file's public key cannot be read" };
  // The fingerprint is worked out from the key itself, never taken from the file's word.
  const fp = keyFingerprint(key);
  const trusted = keyFor(fp);
  if (!trusted)
    return { ok: false, fingerprint: fp, why: `the file is signed with key ${fp}, which no admin of these records has marked trusted` };
  if (!signatureValid(trusted, signedBody, doc.signature.value)) {
    return { ok: false, fingerprint: fp, why: "the file's signature does not match its contents: it was changed after it was exported" };
  }
  for (const [i, r] of doc.revisions.entries()) {
    for (const s of r.signoffs) {
      const facts = {
        checkId: doc.check.id,
        revision: r.number,
        fingerprint: r.fingerprint,
        role: s.role,
        userId: s.userId ?? 0,
        name: s.name,
        signedAt: s.signedAt,
      };
      const signer = s.keyFingerprint ? keyFor(s.keyFingerprint) : undefined;
      if (!signer || !s.signature || s.userId === null || !signatureValid(signer, signoffMessage(facts), s.signature)) {
        return { ok: false, fingerprint: fp, why: `the ${s.role} sign-off of revision ${i + 1} has no valid signature from a trusted key` };
      }
    }
  }
  return { ok: true, fingerprint: fp };
}

/** Imported sign-offs must obey the same order and three-people rules as ones given here. */
function signoffErrors(signoffs: ExchangeDocument["revisions"][number]["signoffs"], at: string): FieldError[] {
  const errors: FieldError[] = [];
  const accepted: Pick<SignoffRow, "role" | "name" | "identity">[] = [];
  const inRoleOrder = signoffs.map((s, j) => ({ ...s, j })).sort((a, b) => ROLES.indexOf(a.role) - ROLES.indexOf(b.role));
  for (const s of inRoleOrder) {
    const identity = identityOf(s.keyFingerprint, s.userId);
    const problem = signOffProblem(accepted, s.role, identity);
    if (problem) errors.push({ path: joinPath(`${at}.signoffs.${s.j}`, problem.path), message: problem.message });
    else accepted.push({ role: s.role, name: s.name, identity });
  }
  return errors;
}
