/**
 * The database schema, one entry per version. A migration is never edited once
 * it has shipped: a change to the schema is a new entry with the next version.
 * `PRAGMA user_version` records the version a database file has reached.
 */
export interface Migration {
  version: number;
  sql: string;
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

export const MIGRATIONS: readonly Migration[] = [{ version: 1, sql: V1 }];

/** The version a database reaches once every migration in this build is applied. */
export const SCHEMA_VERSION = MIGRATIONS[MIGRATIONS.length - 1].version;
