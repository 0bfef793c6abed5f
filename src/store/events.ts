import type { Db } from "./db.ts";

/**
 * The per-check event log. Rows are only ever inserted: the database's
 * triggers refuse any UPDATE or DELETE on the table.
 */
export const EVENT_KINDS = ["saved", "signed", "superseded", "exported", "imported"] as const;
export type EventKind = (typeof EVENT_KINDS)[number];

export interface EventRecord {
  at: string;
  kind: EventKind;
  /** The revision the event concerns, where there is one. */
  revision: number | null;
  /** Who caused it, where known. */
  actor: string | null;
  detail: Record<string, unknown> | null;
}

export function appendEvent(db: Db, checkId: string, e: EventRecord): void {
  db.prepare("INSERT INTO events (check_id, at, kind, revision, actor, detail) VALUES (?, ?, ?, ?, ?, ?)").run(
    checkId,
    e.at,
    e.kind,
    e.revision,
    e.actor,
    e.detail === null ? null : JSON.stringify(e.detail),
  );
}

interface EventRow {
  at: string;
  kind: EventKind;
  revision: number | null;
  actor: string | null;
  detail: string | null;
}

/** The check's events, oldest first. */
export function listEvents(db: Db, checkId: string): EventRecord[] {
  const rows = db.prepare("SELECT at, kind, revision, actor, detail FROM events WHERE check_id = ? ORDER BY id").all(checkId) as EventRow[];
  return rows.map((r) => ({ ...r, detail: r.detail === null ? null : (JSON.parse(r.detail) as Record<string, unknown>) }));
}
