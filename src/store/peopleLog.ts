import type { Db } from "./db.ts";

/** The append-only log of what was done to people and keys, and refused sign-ins. */
export const PEOPLE_EVENT_KINDS = [
  "user-added",
  "user-disabled",
  "user-enabled",
  "passphrase-changed",
  "passphrase-reset",
  "delay-cleared",
  "sign-in",
  "sign-in-refused",
  "key-trusted",
] as const;
export type PeopleEventKind = (typeof PEOPLE_EVENT_KINDS)[number];

export interface PeopleEvent {
  at: string;
  kind: PeopleEventKind;
  userId: number | null;
  actorId: number | null;
  source: string | null;
  detail: Record<string, unknown> | null;
}

export function logPeopleEvent(db: Db, e: PeopleEvent): void {
  db.prepare("INSERT INTO people_events (at, kind, user_id, actor_id, source, detail) VALUES (?, ?, ?, ?, ?, ?)").run(
    e.at,
    e.kind,
    e.userId,
    e.actorId,
    e.source,
    e.detail === null ? null : JSON.stringify(e.detail),
  );
}

export function listPeopleEvents(db: Db, limit = 200): PeopleEvent[] {
  const rows = db
    .prepare("SELECT at, kind, user_id AS userId, actor_id AS actorId, source, detail FROM people_events ORDER BY id DESC LIMIT ?")
    .all(limit) as (Omit<PeopleEvent, "detail"> & { detail: string | null })[];
  return rows.map((r) => ({ ...r, detail: r.detail === null ? null : (JSON.parse(r.detail) as Record<string, unknown>) }));
}
