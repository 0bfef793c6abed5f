/**
 * The database schema, one entry per version. A migration is never edited once
 * it has shipped: a change to the schema is a new entry with the next version.
 * `PRAGMA user_version` records the version a database file has reached.
 */
import type { Db } from "./db.ts";
import { nameKey } from "./names.ts";

export interface Migration {
  version: number;
  sql: string;
  /** Work SQL alone cannot do (recomputing keys), run in the same transaction after `sql`. */
  run?: (db: Db) => void;
}

// Revisions, sign-offs and events are records a shop relies on after the fact,
// so the database itself refuses to change or remove them: the triggers hold
// even against a bug in this code or a hand-typed SQL statement.
const V1 = `
CREATE TABLE checks (
  id          TEXT PRIMARY KEY,
  title       TEXT NOT NULL CHECK (length(title) BETWEEN 1 AND 200),
  calc_number TEXT NOT NULL UNIQUE,
  created_at  TEXT NOT NULL
) STRICT;

CREATE TABLE revisions (
  check_id       TEXT NOT NULL REFERENCES checks(id),
  number         INTEGER NOT NULL CHECK (number >= 1),
  input_json     TEXT NOT NULL,
  fingerprint    TEXT NOT NULL,
  engine_version TEXT NOT NULL,
  saved_at       TEXT NOT NULL,
  saved_by       TEXT,
  PRIMARY KEY (check_id, number)
) STRICT;

CREATE TABLE signers (
  id         INTEGER PRIMARY KEY,
  name       TEXT NOT NULL,
  name_key   TEXT NOT NULL UNIQUE,
  salt       BLOB NOT NULL,
  hash       BLOB NOT NULL,
  scrypt_n   INTEGER NOT NULL,
  scrypt_r   INTEGER NOT NULL,
  scrypt_p   INTEGER NOT NULL,
  created_at TEXT NOT NULL
) STRICT;

-- signer_id is NULL for a sign-off brought in by an import: the record keeps
-- the name, while the passphrase hash stays in the database it was signed in.
CREATE TABLE signoffs (
  check_id  TEXT NOT NULL,
  revision  INTEGER NOT NULL,
  role      TEXT NOT NULL CHECK (role IN ('prepared', 'checked', 'approved')),
  name      TEXT NOT NULL,
  name_key  TEXT NOT NULL,
  signer_id INTEGER REFERENCES signers(id),
  signed_at TEXT NOT NULL,
  PRIMARY KEY (check_id, revision, role),
  FOREIGN KEY (check_id, revision) REFERENCES revisions(check_id, number)
) STRICT;

CREATE TABLE events (
  id       INTEGER PRIMARY KEY AUTOINCREMENT,
  check_id TEXT NOT NULL REFERENCES checks(id),
  at       TEXT NOT NULL,
  kind     TEXT NOT NULL CHECK (kind IN ('saved', 'signed', 'superseded', 'exported', 'imported')),
  revision INTEGER,
  actor    TEXT,
  detail   TEXT
) STRICT;
CREATE INDEX events_by_check ON events(check_id, id);

CREATE TRIGGER revisions_immutable_update BEFORE UPDATE ON revisions
BEGIN SELECT RAISE(ABORT, 'revisions are immutable: save a new revision instead'); END;
CREATE TRIGGER revisions_immutable_delete BEFORE DELETE ON revisions
BEGIN SELECT RAISE(ABORT, 'revisions are immutable: they cannot be deleted'); END;

CREATE TRIGGER signoffs_immutable_update BEFORE UPDATE ON signoffs
BEGIN SELECT RAISE(ABORT, 'sign-offs are immutable'); END;
CREATE TRIGGER signoffs_immutable_delete BEFORE DELETE ON signoffs
BEGIN SELECT RAISE(ABORT, 'sign-offs are immutable: they cannot be deleted'); END;

CREATE TRIGGER events_append_only_update BEFORE UPDATE ON events
BEGIN SELECT RAISE(ABORT, 'the event log is append-only'); END;
CREATE TRIGGER events_append_only_delete BEFORE DELETE ON events
BEGIN SELECT RAISE(ABORT, 'the event log is append-only'); END;
`;

// People with roles who sign in; sign-offs signed with the records' key; guesses counted in the
// database; sessions; keys an admin trusts for imports; an append-only log of who did what to
// the people and keys; a one-row table the health check writes to prove the file is writable.
const V2 = `
ALTER TABLE signers RENAME TO users;
ALTER TABLE users ADD COLUMN role TEXT NOT NULL DEFAULT 'engineer' CHECK (role IN ('admin', 'engineer'));
ALTER TABLE users ADD COLUMN disabled INTEGER NOT NULL DEFAULT 0 CHECK (disabled IN (0, 1));

-- user_id: the signer's id in the records where it was signed (here, or the exporting records);
-- key_fingerprint names the key whose signature covers the sign-off.
ALTER TABLE signoffs ADD COLUMN user_id INTEGER;
ALTER TABLE signoffs ADD COLUMN key_fingerprint TEXT;
ALTER TABLE signoffs ADD COLUMN signature TEXT;

-- 1 for a revision brought in by an import whose sign-offs could not be trusted.
ALTER TABLE revisions ADD COLUMN imported_unsigned INTEGER NOT NULL DEFAULT 0 CHECK (imported_unsigned IN (0, 1));

CREATE TABLE sessions (
  token_hash TEXT PRIMARY KEY,
  user_id    INTEGER NOT NULL REFERENCES users(id),
  created_at TEXT NOT NULL,
  expires_at TEXT NOT NULL
) STRICT;

-- One row per account or source that has guessed: failures since the last success, and when the
-- last attempt was counted (ms since 1970).
CREATE TABLE attempts (
  subject  TEXT PRIMARY KEY,
  failures INTEGER NOT NULL CHECK (failures >= 0),
  last_at  INTEGER NOT NULL
) STRICT;

CREATE TABLE trusted_keys (
  fingerprint TEXT PRIMARY KEY,
  public_key  TEXT NOT NULL,
  label       TEXT NOT NULL,
  trusted_by  INTEGER NOT NULL REFERENCES users(id),
  trusted_at  TEXT NOT NULL
) STRICT;

CREATE TABLE people_events (
  id       INTEGER PRIMARY KEY AUTOINCREMENT,
  at       TEXT NOT NULL,
  kind     TEXT NOT NULL,
  user_id  INTEGER,
  actor_id INTEGER,
  source   TEXT,
  detail   TEXT
) STRICT;
CREATE TRIGGER people_events_append_only_update BEFORE UPDATE ON people_events
BEGIN SELECT RAISE(ABORT, 'the log of people and keys is append-only'); END;
CREATE TRIGGER people_events_append_only_delete BEFORE DELETE ON people_events
BEGIN SELECT RAISE(ABORT, 'the log of people and keys is append-only'); END;

CREATE TABLE probe (id INTEGER PRIMARY KEY CHECK (id = 1), at TEXT NOT NULL) STRICT;
`;

/** Names registered before the look-alike rule get its key; a clash keeps both, told apart by id. */
function rekeyNames(db: Db): void {
  const rows = db.prepare("SELECT id, name FROM users ORDER BY id").all() as { id: number; name: string }[];
  const taken = new Set<string>();
  const update = db.prepare("UPDATE users SET name_key = ? WHERE id = ?");
  for (const r of rows) update.run(`#${r.id}`, r.id);
  for (const r of rows) {
    let key = nameKey(r.name);
    if (taken.has(key)) key = `${key}#${r.id}`;
    taken.add(key);
    update.run(key, r.id);
  }
}

export const MIGRATIONS: readonly Migration[] = [
  { version: 1, sql: V1 },
  { version: 2, sql: V2, run: rekeyNames },
];

/** The version a database reaches once every migration in this build is applied. */
export const SCHEMA_VERSION = MIGRATIONS[MIGRATIONS.length - 1].version;
