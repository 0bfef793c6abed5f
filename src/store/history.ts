/**
 * @module store/history
 * Reading the records back: the list of saved checks, one check with all its revisions and its event
 * log, and one revision for its sheet. Each revision is checked as it is read: its fingerprint is
 * recomputed from the stored input and engine version (a mismatch means the database was changed
 * outside Hoopwise, and then no sign-off of it counts), and its sign-offs' signatures are verified
 * (signoffs.ts); the revision's state follows from the valid sign-offs alone (state.ts). Each read is
 * one transaction, so it sees one snapshot while another process writes. Handed the SQL and the
 * signing keys; gives plain records (CheckSummary, CheckRecord, SheetRevision) for the routes and the
 * sheet.
 */
import { fingerprint as fingerprintOf } from "../engine/fingerprint.ts";
import type { StoreContext } from "./context.ts";
import { latestRevision, requireCheck } from "./checks.ts";
import { RecordNotFoundError } from "./errors.ts";
import { listEvents, type EventRecord } from "./events.ts";
import { signoffRows, type SignOffRecord } from "./signoffs.ts";
import type { Q } from "./sql.ts";
import { revisionState, type RevisionState } from "./state.ts";

type ReadCtx = Pick<StoreContext, "sql" | "keys">;

/** A saved check as the list shows it. */
export interface CheckSummary {
  id: string;
  title: string;
  calcNumber: string;
  latestRevision: number;
  /** The latest revision's state (never "superseded"). */
  state: RevisionState;
  /** When the latest revision was saved. */
  updatedAt: string;
  /** False when the latest revision's stored input no longer gives its stored fingerprint. */
  intact: boolean;
}

export interface RevisionRecord {
  number: number;
  /** The normalized check input exactly as saved. */
  input: unknown;
  fingerprint: string;
  engineVersion: string;
  savedAt: string;
  savedBy: string | null;
  /** From the valid sign-offs only; "draft" whatever they say when the revision is not intact. */
  state: RevisionState;
  /** In role order: prepared, checked, approved. Each says whether its signature holds. */
  signoffs: SignOffRecord[];
  /**
   * The fingerprint recomputed from the stored input and engine version equals the stored one.
   * False means the database was changed outside Hoopwise: nothing of this revision is to be trusted.
   */
  intact: boolean;
  /** Brought in by an import whose sign-offs could not be trusted: it came in unsigned. */
  importedUnsigned: boolean;
}

export interface CheckRecord {
  id: string;
  title: string;
  calcNumber: string;
  createdAt: string;
  latestRevision: number;
  revisions: RevisionRecord[];
  events: EventRecord[];
}

/** What a revision's sheet prints: the check it belongs to and the revision with its sign-offs. */
export interface SheetRevision {
  check: { id: string; title: string; calcNumber: string };
  latestRevision: number;
  revision: RevisionRecord;
}

/** Every saved check, the most recently saved first. */
export function listChecks(ctx: ReadCtx): Promise<CheckSummary[]> {
  return ctx.sql.read(async (q) => {
    const rows = await q.all<{ id: string; title: string; calcNumber: string; createdAt: string; updatedAt: string; latest: number }>(
      `SELECT c.id, c.title, c.calc_number AS "calcNumber", c.created_at AS "createdAt", r.saved_at AS "updatedAt", r.number AS latest
         FROM checks c
         JOIN revisions r ON r.check_id = c.id
          AND r.number = (SELECT max(number) FROM revisions WHERE check_id = c.id)
        ORDER BY r.saved_at DESC, c.calc_number`,
    );
    const out: CheckSummary[] = [];
    for (const row of rows) {
      const rev = await readRevision(ctx, q, row.id, row.latest, row.latest);
      out.push({
        id: row.id,
        title: row.title,
        calcNumber: row.calcNumber,
        latestRevision: row.latest,
        state: rev.state,
        updatedAt: row.updatedAt,
        intact: rev.intact,
      });
    }
    return out;
  });
}

export function getCheck(ctx: ReadCtx, checkId: string): Promise<CheckRecord> {
  // One read transaction: every query sees the same snapshot even while another process saves.
  return ctx.sql.read(async (q) => {
    const check = await requireCheck(q, checkId);
    const latest = (await latestRevision(q, checkId)).number;
    const numbers = await q.all<{ number: number }>("SELECT number FROM revisions WHERE check_id = ? ORDER BY number", checkId);
    const revisions: RevisionRecord[] = [];
    for (const { number } of numbers) revisions.push(await readRevision(ctx, q, checkId, number, latest));
    return { ...check, latestRevision: latest, revisions, events: await listEvents(q, checkId) };
  });
}

/** One revision with its sign-offs, for the sheet route. */
export function getSheetRevision(ctx: ReadCtx, checkId: string, number: number): Promise<SheetRevision> {
  return ctx.sql.read(async (q) => {
    const check = await requireCheck(q, checkId);
    const latest = (await latestRevision(q, checkId)).number;
    return {
      check: { id: check.id, title: check.title, calcNumber: check.calcNumber },
      latestRevision: latest,
      revision: await readRevision(ctx, q, checkId, number, latest),
    };
  });
}

interface StoredRevision {
  number: number;
  inputJson: string;
  fingerprint: string;
  engineVersion: string;
  savedAt: string;
  savedBy: string | null;
  importedUnsigned: number;
}

async function readRevision(ctx: ReadCtx, q: Q, checkId: string, number: number, latest: number): Promise<RevisionRecord> {
  const row = await q.get<StoredRevision>(
    `SELECT number, input_json AS "inputJson", fingerprint, engine_version AS "engineVersion", saved_at AS "savedAt",
            saved_by AS "savedBy", imported_unsigned AS "importedUnsigned"
       FROM revisions WHERE check_id = ? AND number = ?`,
    checkId,
    number,
  );
  if (!row) throw new RecordNotFoundError([{ path: "revision", message: `check ${checkId} has no revision ${number}` }]);
  let input: unknown;
  let intact: boolean;
  try {
    input = JSON.parse(row.inputJson) as unknown;
    intact = fingerprintOf(input, row.engineVersion) === row.fingerprint;
  } catch {
    input = null;
    intact = false;
  }
  const signoffs = (await signoffRows(ctx, q, checkId, row.number, row.fingerprint)).map(({ identity: _i, ...s }) => s);
  const counted = intact ? signoffs.filter((s) => s.valid).map((s) => s.role) : [];
  return {
    number: row.number,
    input,
    fingerprint: row.fingerprint,
    engineVersion: row.engineVersion,
    savedAt: row.savedAt,
    savedBy: row.savedBy,
    state: revisionState(row.number, latest, counted),
    signoffs,
    intact,
    importedUnsigned: row.importedUnsigned === 1,
  };
}
