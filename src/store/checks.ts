/**
 * @module store/checks
 * Saving checks: a new check as revision 1, and a changed input as the check's next revision,
 * which supersedes the one before (an input identical to the latest saves nothing). It holds the
 * rules of calculation numbers (one number names one check; the request's, else the input's, else
 * one made from the id) and the row-level helpers other files of the store share (requireCheck,
 * latestRevision, insertRevision, assertCalcNumberFree; the import in exchange.ts uses the last
 * two). Handed the store context (SQL, validator, clock, engine version), a request body as it
 * arrived from JSON and the signed-in user; gives the saved revision's number and fingerprint, or
 * an InvalidRecordError or RecordConflictError naming the fields at fault. Relies on the engine's
 * fingerprint, the canonical JSON of src/schema, the field schemas of fields.ts and the event log of
 * events.ts.
 */
import { randomUUID } from "node:crypto";
import { z } from "zod";
import { fingerprint } from "../engine/fingerprint.ts";
import { canonicalJson } from "../schema/canonical.ts";
import type { FieldError } from "../engine/errors.ts";
import type { Q } from "./sql.ts";
import { isoNow, validInput, type StoreContext } from "./context.ts";
import { InvalidRecordError, RecordConflictError, RecordNotFoundError } from "./errors.ts";
import { appendEvent } from "./events.ts";
import type { Actor } from "./users.ts";
import { calcNumberField, personNameField, safeParseFields, titleField, zodFieldErrors } from "./fields.ts";

export interface NewCheck {
  input: unknown;
  /** Defaults to the input's own title, else "Untitled check". */
  title?: string;
  /** Defaults to the input's own calcNumber, else "HW-" and the first eight characters of the check's id. */
  calcNumber?: string;
  savedBy?: string;
}

export interface CreatedCheck {
  id: string;
  title: string;
  calcNumber: string;
  revision: 1;
  fingerprint: string;
}

export interface NewRevision {
  input: unknown;
  savedBy?: string;
}

export interface SavedRevision {
  revision: number;
  fingerprint: string;
  /** True when the input matched the latest revision: nothing was saved and `revision` is that latest one. */
  unchanged: boolean;
}

// Strict, so a misspelt field ("calcNumbr") is reported rather than silently dropped.
// The input is checked by the injected validator; here it only has to be present.
const newCheckFields = z.strictObject({
  input: z.unknown(),
  title: titleField.optional(),
  calcNumber: calcNumberField.optional(),
  savedBy: personNameField.optional(),
});
const newRevisionFields = z.strictObject({ input: z.unknown(), savedBy: personNameField.optional() });

/**
 * Save a new check as revision 1, saved by `by` (the signed-in user; none for the demo seed).
 * The calculation number is the request's, else the input's, else one made from the id; it is
 * what the sheet prints. A number the records cannot keep (taken, malformed, or two different
 * ones in one request) is refused, never replaced by another.
 */
export async function createCheck(ctx: StoreContext, args: NewCheck, by?: Actor | null): Promise<CreatedCheck> {
  const { fields, input } = validate(ctx, newCheckFields, args);
  const id = randomUUID();
  const title = fields.title ?? fieldOf(input, "title", titleField) ?? "Untitled check";
  const inputNumber = inputCalcNumber(input);
  if (fields.calcNumber !== undefined && inputNumber !== undefined && inputNumber !== fields.calcNumber) {
    throw new InvalidRecordError([
      { path: "calcNumber", message: `differs from the input's calculation number "${inputNumber}"; give one number, in one place` },
    ]);
  }
  const fromInput = fields.calcNumber === undefined ? inputNumber : undefined;
  const calcNumber = fields.calcNumber ?? fromInput ?? `HW-${id.slice(0, 8).toUpperCase()}`;
  const savedBy = by ? by.name : (fields.savedBy ?? null);
  const canonical = canonicalJson(input);
  const fp = fingerprint(input, ctx.engineVersion);
  const at = isoNow(ctx);

  await ctx.sql.write(async (q) => {
    await assertCalcNumberFree(q, calcNumber, fromInput ? "input.calcNumber" : "calcNumber");
    await q.run("INSERT INTO checks (id, title, calc_number, created_at) VALUES (?, ?, ?, ?)", id, title, calcNumber, at);
    await insertRevision(q, id, {
      number: 1,
      canonical,
      fingerprint: fp,
      engineVersion: ctx.engineVersion,
      savedAt: at,
      savedBy,
    });
    await appendEvent(q, id, { at, kind: "saved", revision: 1, actor: savedBy, detail: { fingerprint: fp } });
  });
  return { id, title, calcNumber, revision: 1, fingerprint: fp };
}

/**
 * Save a changed input as the check's next revision, which supersedes the one
 * before. An input identical to the latest revision's saves nothing.
 */
export async function addRevision(ctx: StoreContext, checkId: string, args: NewRevision, by?: Actor | null): Promise<SavedRevision> {
  const check = await requireCheck(ctx.sql, checkId);
  const { fields, input } = validate(ctx, newRevisionFields, args);
  const inputNumber = inputCalcNumber(input);
  if (inputNumber !== undefined && inputNumber !== check.calcNumber) {
    throw new InvalidRecordError([
      {
        path: "input.calcNumber",
        message: `is "${inputNumber}", but this check's calculation number is "${check.calcNumber}"; a revision keeps its check's number (save it as a new check to use another)`,
      },
    ]);
  }
  const canonical = canonicalJson(input);
  const fp = fingerprint(input, ctx.engineVersion);
  const at = isoNow(ctx);
  const savedBy = by ? by.name : (fields.savedBy ?? null);

  // The write transaction holds the writers' lock before reading the latest number, so two
  // writers (threads or processes) can never both claim the same next number.
  return ctx.sql.write(async (q): Promise<SavedRevision> => {
    const latest = await latestRevision(q, checkId);
    if (latest.fingerprint === fp) return { revision: latest.number, fingerprint: fp, unchanged: true };
    const number = latest.number + 1;
    await insertRevision(q, checkId, { number, canonical, fingerprint: fp, engineVersion: ctx.engineVersion, savedAt: at, savedBy });
    await appendEvent(q, checkId, { at, kind: "saved", revision: number, actor: savedBy, detail: { fingerprint: fp } });
    await appendEvent(q, checkId, { at, kind: "superseded", revision: latest.number, actor: savedBy, detail: { by: number } });
    return { revision: number, fingerprint: fp, unchanged: false };
  });
}

export interface CheckRow {
  id: string;
  title: string;
  calcNumber: string;
  createdAt: string;
}

export async function requireCheck(q: Q, checkId: string): Promise<CheckRow> {
  const row = await q.get<CheckRow>(
    `SELECT id, title, calc_number AS "calcNumber", created_at AS "createdAt" FROM checks WHERE id = ?`,
    checkId,
  );
  if (!row) throw new RecordNotFoundError([{ path: "id", message: `no saved check has the id "${checkId}"` }]);
  return row;
}

export async function latestRevision(q: Q, checkId: string): Promise<{ number: number; fingerprint: string }> {
  const row = await q.get<{ number: number; fingerprint: string }>(
    "SELECT number, fingerprint FROM revisions WHERE check_id = ? ORDER BY number DESC LIMIT 1",
    checkId,
  );
  // A check is created together with its revision 1 and revisions cannot be deleted.
  if (!row) throw new Error(`check ${checkId} has no revisions: the database is inconsistent`);
  return row;
}

export interface RevisionRow {
  number: number;
  canonical: string;
  fingerprint: string;
  engineVersion: string;
  savedAt: string;
  savedBy: string | null;
  /** Brought in by an import whose sign-offs were not kept. */
  importedUnsigned?: boolean;
}

export async function insertRevision(q: Q, checkId: string, r: RevisionRow): Promise<void> {
  await q.run(
    "INSERT INTO revisions (check_id, number, input_json, fingerprint, engine_version, saved_at, saved_by, imported_unsigned) VALUES (?, ?, ?, ?, ?, ?, ?, ?)",
    checkId,
    r.number,
    r.canonical,
    r.fingerprint,
    r.engineVersion,
    r.savedAt,
    r.savedBy,
    r.importedUnsigned ? 1 : 0,
  );
}

/** Calculation numbers are unique: a sheet's number must name one check. `path` is where the number came from. */
export async function assertCalcNumberFree(q: Q, calcNumber: string, path: string): Promise<void> {
  const other = await q.get<{ id: string }>("SELECT id FROM checks WHERE calc_number = ?", calcNumber);
  if (other) {
    throw new RecordConflictError([
      {
        path,
        message: `calculation number "${calcNumber}" is already used by check ${other.id}; save a new revision of that check, or give another number`,
      },
    ]);
  }
}

/**
 * Check the request's fields and its input together, so every problem is
 * reported at once. Requests arrive from JSON bodies, so nothing about their
 * shape is taken on trust from the TypeScript type.
 */
function validate<S extends z.ZodType>(ctx: StoreContext, schema: S, args: unknown): { fields: z.output<S>; input: unknown } {
  const errors: FieldError[] = [];
  const parsed = safeParseFields(schema, args);
  if (!parsed.success) errors.push(...zodFieldErrors(parsed.error));
  if (args === null || typeof args !== "object" || Array.isArray(args)) throw new InvalidRecordError(errors);
  let value: unknown;
  try {
    value = validInput(ctx, (args as { input?: unknown }).input, "input");
  } catch (err) {
    if (!(err instanceof InvalidRecordError)) throw err;
    errors.push(...err.errors);
  }
  if (errors.length || !parsed.success) throw new InvalidRecordError(errors);
  return { fields: parsed.data, input: value };
}

/**
 * The input's own calculation number, trimmed; a number present but unusable as a record's is
 * refused with the field's message rather than quietly replaced by a made-up one.
 */
function inputCalcNumber(input: unknown): string | undefined {
  const raw = (input as Record<string, unknown> | null)?.calcNumber;
  if (raw === undefined || raw === null || (typeof raw === "string" && raw.trim() === "")) return undefined;
  const r = calcNumberField.safeParse(raw);
  if (!r.success) throw new InvalidRecordError(zodFieldErrors(r.error, "input.calcNumber"));
  return r.data;
}

/** A record field taken from the check document when it holds a usable one. */
function fieldOf(input: unknown, key: string, schema: z.ZodType<string>): string | undefined {
  const r = schema.safeParse((input as Record<string, unknown> | null)?.[key]);
  return r.success ? r.data : undefined;
}
