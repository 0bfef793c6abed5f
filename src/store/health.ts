import type { Db } from "./db.ts";

/**
 * Whether the database takes a write now: one committed write to a one-row table. A full disk,
 * a read-only file or folder, or a failing device makes it throw, and the health check says so.
 */
export function probeWrite(db: Db, at: string): void {
  db.prepare("INSERT INTO probe (id, at) VALUES (1, ?) ON CONFLICT (id) DO UPDATE SET at = excluded.at").run(at);
}

/** SQLite result codes that mean the records cannot be written now, through no fault of the request. */
const UNAVAILABLE = /^SQLITE_(FULL|READONLY|IOERR|CANTOPEN|CORRUPT|NOTADB|PERM|BUSY|LOCKED|PROTOCOL)/;

export function isStorageFault(err: unknown): boolean {
  const code = (err as { code?: unknown } | null)?.code;
  return typeof code === "string" && UNAVAILABLE.test(code);
}

/** The fault in words for whoever sees the 503. */
export function storageFaultWords(err: unknown): string {
  const code = String((err as { code?: unknown }).code ?? "");
  if (code.startsWith("SQLITE_FULL"))
    return "the records database cannot be written: the disk is full. Nothing committed was lost; free some space and try again";
  if (code.startsWith("SQLITE_READONLY") || code.startsWith("SQLITE_PERM") || code.startsWith("SQLITE_CANTOPEN"))
    return "the records database cannot be written: its file or folder is read-only to the server. Nothing committed was lost; ask whoever runs the server to fix its permissions";
  if (code.startsWith("SQLITE_BUSY") || code.startsWith("SQLITE_LOCKED"))
    return "the records database is busy with another save; try again in a moment";
  return "the records database is failing (a storage or file error). Nothing committed was lost; ask whoever runs the server to check the disk";
}
