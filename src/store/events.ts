import type { Q } from "./sql.ts";

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

export async function appendEvent(q: Q, checkId: string, e: EventRecord): Promise<void> {
  await q.run(
    "INSERT INTO events (check_id, at, kind, revision, actor, detail) VALUES (?, ?, ?, ?, ?, ?)",
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
export async function listEvents(q: Q, checkId: string): Promise<EventRecord[]> {
  const rows = await q.all<EventRow>("SELECT at, kind, revision, actor, detail FROM events WHERE check_id = ? ORDER BY id", checkId);
  return rows.map((r) => ({ ...r, detail: r.detail === null ? null : (JSON.parse(r.detail) as Record<string, unknown>) }));
}
