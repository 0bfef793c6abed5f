import type { Q } from "./sql.ts";

/**
 * Whether the database takes a write now: one committed write to a one-row table. A full disk,
 * a read-only file or folder, a failing device or a database server out of reach makes it throw,
 * and the health check says so.
 */
export async function probeWrite(q: Q, at: string): Promise<void> {
  await q.run("INSERT INTO probe (id, at) VALUES (1, ?) ON CONFLICT (id) DO UPDATE SET at = excluded.at", at);
}

/** The PostgreSQL server cannot be reached or dropped the connection: what node-postgres reports without an SQLSTATE. */
export class DatabaseUnreachableError extends Error {
  readonly code = "HOOPWISE_DB_UNREACHABLE";
  constructor(cause: Error) {
    super(`the records database server cannot be reached: ${cause.message}`, { cause });
    this.name = "DatabaseUnreachableError";
  }
}

/** SQLite result codes that mean the records cannot be written now, through no fault of the request. */
const SQLITE_UNAVAILABLE = /^SQLITE_(FULL|READONLY|IOERR|CANTOPEN|CORRUPT|NOTADB|PERM|BUSY|LOCKED|PROTOCOL)/;
/**
 * PostgreSQL SQLSTATEs of the same kind (PostgreSQL manual, Appendix A): connection exceptions
 * (08), insufficient resources such as a full disk (53), operator intervention such as a
 * shutdown (57P), system and internal errors (58, XX), a read-only server (25006), and a
 * serialization failure, deadlock or lock not available (40001, 40P01, 55P03).
 */
const PG_UNAVAILABLE = /^(08...|53...|57P..|58...|XX...|25006|40001|40P01|55P03)$/;

export function isStorageFault(err: unknown): boolean {
  const e = err as { code?: unknown; severity?: unknown } | null;
  const code = e?.code;
  if (typeof code !== "string") return false;
  if (SQLITE_UNAVAILABLE.test(code) || code === "HOOPWISE_DB_UNREACHABLE") return true;
  // Only a server's error carries a severity, so a Node error code is never read as an SQLSTATE.
  return typeof e?.severity === "string" && PG_UNAVAILABLE.test(code);
}

/** The fault in words for whoever sees the 503. */
export function storageFaultWords(err: unknown): string {
  const code = String((err as { code?: unknown }).code ?? "");
  if (code.startsWith("SQLITE_FULL") || code === "53100")
    return "the records database cannot be written: the disk is full. Nothing committed was lost; free some space and try again";
  if (code.startsWith("SQLITE_READONLY") || code.startsWith("SQLITE_PERM") || code.startsWith("SQLITE_CANTOPEN"))
    return "the records database cannot be written: its file or folder is read-only to the server. Nothing committed was lost; ask whoever runs the server to fix its permissions";
  if (code === "25006")
    return "the records database server takes no writes now (a read-only replica or a server in recovery). Nothing committed was lost; ask whoever runs the database";
  if (code.startsWith("SQLITE_BUSY") || code.startsWith("SQLITE_LOCKED") || ["40001", "40P01", "55P03", "53300"].includes(code))
    return "the records database is busy with another save; try again in a moment";
  if (code === "HOOPWISE_DB_UNREACHABLE" || code.startsWith("08") || code.startsWith("57P"))
    return "the records database server cannot be reached or is shutting down. Nothing committed was lost; try again in a moment, or ask whoever runs the database";
  return "the records database is failing (a storage or file error). Nothing committed was lost; ask whoever runs the server to check the disk";
}
