/**
 * @module store/db
 * The SQLite database file: where it is (HOOPWISE_DB, else data/hoopwise.db), opening it owner-only
 * with the write-ahead log, durable commits, foreign keys and a busy timeout, and bringing its schema
 * up to date with the migrations of migrations.ts, refusing a file newer than this build. Handed a
 * path; gives a better-sqlite3 handle, which sqlite.ts wraps in the SQL interface the rest of the
 * store uses. PostgreSQL has its own opener (postgres.ts).
 */
import Database from "better-sqlite3";
import { closeSync, mkdirSync, openSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { ownerOnly } from "./keys.ts";
import { MIGRATIONS, SCHEMA_VERSION } from "./migrations.ts";

export type Db = Database.Database;

const REPO_ROOT = fileURLToPath(new URL("../..", import.meta.url));

/** How long a writer waits for another process's write lock before giving up (ms). */
const BUSY_TIMEOUT_MS = 5000;

/**
 * The database file: `HOOPWISE_DB` when set (a relative path is taken from the
 * working directory, as a shell user expects), else `data/hoopwise.db` in the
 * repository, a folder git ignores.
 */
export function defaultDbPath(env: NodeJS.ProcessEnv = process.env): string {
  const fromEnv = env.HOOPWISE_DB?.trim();
  if (fromEnv) return fromEnv === ":memory:" ? fromEnv : resolve(fromEnv);
  return resolve(REPO_ROOT, "data", "hoopwise.db");
}

/** Open (creating when needed) the database and bring its schema up to date. */
export function openDatabase(path: string = defaultDbPath()): Db {
  if (path !== ":memory:") {
    mkdirSync(dirname(path), { recursive: true });
    // Created owner-only before SQLite opens it; SQLite gives its -wal and -shm files the
    // database file's permissions.
    closeSync(openSync(path, "a", 0o600));
    ownerOnly(path);
  }
  const db = new Database(path);
  try {
    // busy_timeout first: the pragmas after it may need a lock another process holds.
    db.pragma(`busy_timeout = ${BUSY_TIMEOUT_MS}`);
    db.pragma("journal_mode = WAL");
    // FULL makes each commit durable against a power cut, not only a crash;
    // saves come at human pace, so the extra sync costs nothing that matters.
    db.pragma("synchronous = FULL");
    db.pragma("foreign_keys = ON");
    migrate(db);
    return db;
  } catch (err) {
    db.close();
    throw err;
  }
}

/** Apply every migration newer than the file's `user_version`, each in its own write transaction. */
export function migrate(db: Db): void {
  const found = userVersion(db);
  if (found > SCHEMA_VERSION) {
    throw new Error(
      `database ${db.name} has schema version ${found}, newer than this build of Hoopwise understands (${SCHEMA_VERSION}); ` +
        "update Hoopwise rather than let an older build write to it",
    );
  }
  for (const m of MIGRATIONS) {
    // Re-read inside the IMMEDIATE transaction: two processes opening a new
    // file at once must not both apply the same migration.
    db.transaction(() => {
      if (userVersion(db) >= m.version) return;
      db.exec(m.sql);
      m.run?.(db);
      db.pragma(`user_version = ${m.version}`);
    }).immediate();
  }
}

export function userVersion(db: Db): number {
  return db.pragma("user_version", { simple: true }) as number;
}
