import type { Q } from "./sql.ts";

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

export async function logPeopleEvent(q: Q, e: PeopleEvent): Promise<void> {
  await q.run(
    "INSERT INTO people_events (at, kind, user_id, actor_id, source, detail) VALUES (?, ?, ?, ?, ?, ?)",
    e.at,
    e.kind,
    e.userId,
    e.actorId,
    e.source,
    e.detail === null ? null : JSON.stringify(e.detail),
  );
}

export async function listPeopleEvents(q: Q, limit = 200): Promise<PeopleEvent[]> {
  const rows = await q.all<Omit<PeopleEvent, "detail"> & { detail: string | null }>(
    `SELECT at, kind, user_id AS "userId", actor_id AS "actorId", source, detail FROM people_events ORDER BY id DESC LIMIT ?`,
    limit,
  );
  return rows.map((r) => ({ ...r, detail: r.detail === null ? null : (JSON.parse(r.detail) as Record<string, unknown>) }));
}
