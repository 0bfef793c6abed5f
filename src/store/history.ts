import type { Db } from "./db.ts";
import { latestRevision, requireCheck } from "./checks.ts";
import { RecordNotFoundError } from "./errors.ts";
import { listEvents, type EventRecord } from "./events.ts";
import { signoffRows, type SignOffRecord } from "./signoffs.ts";
import { revisionState, type RevisionState, type Role } from "./state.ts";

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
}

export interface RevisionRecord {
  number: number;
  /** The normalized check input exactly as saved. */
  input: unknown;
  fingerprint: string;
  engineVersion: string;
  savedAt: string;
  savedBy: string | null;
  state: RevisionState;
  /** In role order: prepared, checked, approved. */
  signoffs: SignOffRecord[];
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
export function listChecks(db: Db): CheckSummary[] {
  const rows = db
    .prepare(
      `SELECT c.id, c.title, c.calc_number AS calcNumber, r.number AS latestRevision, r.saved_at AS updatedAt,
              (SELECT group_concat(s.role) FROM signoffs s WHERE s.check_id = c.id AND s.revision = r.number) AS roles
         FROM checks c
         JOIN revisions r ON r.check_id = c.id
          AND r.number = (SELECT max(number) FROM revisions WHERE check_id = c.id)
        ORDER BY r.saved_at DESC, c.calc_number`,
    )
    .all() as (Omit<CheckSummary, "state"> & { roles: string | null })[];
  return rows.map(({ roles, ...row }) => ({
    ...row,
    state: revisionState(row.latestRevision, row.latestRevision, (roles?.split(",") ?? []) as Role[]),
  }));
}

export function getCheck(db: Db, checkId: string): CheckRecord {
  // One read transaction: every query sees the same snapshot even while another process saves.
  return db.transaction(() => readCheck(db, checkId))();
}

function readCheck(db: Db, checkId: string): CheckRecord {
  const check = requireCheck(db, checkId);
  const latest = latestRevision(db, checkId).number;
  const rows = db.prepare(`${REVISION_SELECT} ORDER BY number`).all(checkId) as StoredRevision[];
  return {
    ...check,
    latestRevision: latest,
    revisions: rows.map((row) => revisionRecord(db, checkId, row, latest)),
    events: listEvents(db, checkId),
  };
}

/** One revision with its sign-offs, for the sheet route. */
export function getSheetRevision(db: Db, checkId: string, number: number): SheetRevision {
  return db.transaction(() => readSheetRevision(db, checkId, number))();
}

function readSheetRevision(db: Db, checkId: string, number: number): SheetRevision {
  const check = requireCheck(db, checkId);
  const latest = latestRevision(db, checkId).number;
  const row = db.prepare(`${REVISION_SELECT} AND number = ?`).get(checkId, number) as StoredRevision | undefined;
  if (!row) throw new RecordNotFoundError([{ path: "revision", message: `check ${checkId} has no revision ${number}` }]);
  return {
    check: { id: check.id, title: check.title, calcNumber: check.calcNumber },
    latestRevision: latest,
    revision: revisionRecord(db, checkId, row, latest),
  };
}

const REVISION_SELECT = `SELECT number, input_json AS inputJson, fingerprint, engine_version AS engineVersion,
  saved_at AS savedAt, saved_by AS savedBy FROM revisions WHERE check_id = ?`;

interface StoredRevision {
  number: number;
  inputJson: string;
  fingerprint: string;
  engineVersion: string;
  savedAt: string;
  savedBy: string | null;
}

function revisionRecord(db: Db, checkId: string, { inputJson, ...row }: StoredRevision, latest: number): RevisionRecord {
  const signoffs = signoffRows(db, checkId, row.number).map(({ role, name, signedAt, imported }) => ({ role, name, signedAt, imported }));
  return {
    ...row,
    input: JSON.parse(inputJson) as unknown,
    state: revisionState(
      row.number,
      latest,
      signoffs.map((s) => s.role),
    ),
    signoffs,
  };
}
