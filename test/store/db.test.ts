import Database from "better-sqlite3";
import { existsSync, statSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { defaultDbPath, openDatabase, SCHEMA_VERSION } from "../../src/store/index.ts";
import { tempDbPath, RECORD_TABLES } from "./helpers.ts";

describe("openDatabase", () => {
  it("creates the folder and the file, and brings the schema to the current version", () => {
    const path = join(dirname(tempDbPath()), "nested", "deeper", "records.db");
    const db = openDatabase(path);
    expect(existsSync(path)).toBe(true);
    expect(db.pragma("user_version", { simple: true })).toBe(SCHEMA_VERSION);
    const tables = (db.prepare("SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name").all() as { name: string }[]).map(
      (t) => t.name,
    );
    expect(tables).toEqual(expect.arrayContaining([...RECORD_TABLES]));
    // Readable by its owner only.
    expect(statSync(path).mode & 0o777).toBe(0o600);
    db.close();
  });

  it("uses WAL, enforces foreign keys and waits for a busy lock", () => {
    const db = openDatabase(tempDbPath());
    expect(db.pragma("journal_mode", { simple: true })).toBe("wal");
    expect(db.pragma("foreign_keys", { simple: true })).toBe(1);
    expect(db.pragma("busy_timeout", { simple: true })).toBeGreaterThan(0);
    expect(() => db.prepare("INSERT INTO revisions VALUES ('no-such-check', 1, '{}', 'x', 'v', 't', NULL, 0)").run()).toThrow(
      /FOREIGN KEY/,
    );
    db.close();
  });

  it("opens an up-to-date database again without touching its records", () => {
    const path = tempDbPath();
    const first = openDatabase(path);
    first.prepare("INSERT INTO checks VALUES ('c1', 'Kept title', 'HW-KEPT', '2030-01-01T00:00:00.000Z')").run();
    first.close();
    const again = openDatabase(path);
    expect(again.pragma("user_version", { simple: true })).toBe(SCHEMA_VERSION);
    expect(again.prepare("SELECT title FROM checks WHERE id = 'c1'").get()).toEqual({ title: "Kept title" });
    again.close();
  });

  it("refuses a database from a newer build rather than write to it", () => {
    const path = tempDbPath();
    const raw = new Database(path);
    raw.pragma(`user_version = ${SCHEMA_VERSION + 1}`);
    raw.close();
    expect(() => openDatabase(path)).toThrow(/newer than this build/);
  });

  it("takes HOOPWISE_DB when set, else data/hoopwise.db in the repository", () => {
    expect(defaultDbPath({ HOOPWISE_DB: "/srv/records/shop.db" })).toBe("/srv/records/shop.db");
    expect(defaultDbPath({ HOOPWISE_DB: "relative/shop.db" })).toBe(resolve("relative/shop.db"));
    const repoRoot = resolve(import.meta.dirname, "..", "..");
    expect(defaultDbPath({})).toBe(join(repoRoot, "data", "hoopwise.db"));
  });
});
