import { randomBytes } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import pg from "pg";
import { afterAll, describe, onTestFinished } from "vitest";
import { openStore, openSqliteStore, type Actor, type OpenedStore, type SqliteStore, type StoreOptions } from "../../src/store/index.ts";
import { fakeValidate } from "./fixtures/validator.ts";

export { fakeValidate, sampleInput } from "./fixtures/validator.ts";

/**
 * The PostgreSQL server the records tests also run against: HOOPWISE_TEST_PG_URL, which
 * .ci/with-postgres.sh sets for a throw-away cluster (.ci/run uses it). Never DATABASE_URL, so a
 * developer's own records are never touched by a test. Unset, the PostgreSQL runs are skipped
 * and say so; with HOOPWISE_REQUIRE_PG=1 (as CI sets) an unset URL fails instead.
 */
export const PG_URL = process.env.HOOPWISE_TEST_PG_URL?.trim() || undefined;
if (!PG_URL && process.env.HOOPWISE_REQUIRE_PG === "1") {
  throw new Error("HOOPWISE_REQUIRE_PG=1 but HOOPWISE_TEST_PG_URL is not set: run the tests through .ci/with-postgres.sh");
}
const PG_SKIPPED = "skipped: no PostgreSQL server (HOOPWISE_TEST_PG_URL is not set; run through .ci/with-postgres.sh)";

/** A fresh folder in the temporary directory, removed when the test ends. */
export function tempDir(prefix = "hoopwise-store-"): string {
  const dir = mkdtempSync(join(tmpdir(), prefix));
  onTestFinished(() => rmSync(dir, { recursive: true, force: true }));
  return dir;
}

/** A fresh database file in its own temporary folder, removed when the test ends. */
export function tempDbPath(): string {
  return join(tempDir(), "records.db");
}

/** A cheap scrypt cost that keeps sign-off tests fast; signers.test.ts also covers the default cost. */
export const FAST_SCRYPT = { n: 2 ** 10, r: 8, p: 1 };

const FIXED_CLOCK = () => new Date("2030-03-01T08:00:00.000Z");

/** Where one test's records live: an SQLite file, or a PostgreSQL schema of its own with its key file. */
export type Place = Pick<StoreOptions, "path" | "databaseUrl" | "pgSchema" | "keyPath">;

export interface Backend {
  readonly name: "SQLite" | "PostgreSQL";
  /** Fresh, empty records (a temporary file, or a new schema), removed when the test ends. */
  place(): Promise<Place>;
  /** A store on `place` (fresh records when none is given), closed when the test ends. A fixed clock keeps times predictable. */
  store(options?: Partial<StoreOptions> & { place?: Place }): Promise<OpenedStore>;
  /** Drop one of the triggers that keep records immutable, as someone holding the database can. */
  dropTrigger(store: OpenedStore, trigger: string, table: string): Promise<void>;
}

function storeOptions(options: Partial<StoreOptions>): StoreOptions {
  return { validate: fakeValidate, now: FIXED_CLOCK, passphraseCost: FAST_SCRYPT, ...options };
}

export const SQLITE: Backend = {
  name: "SQLite",
  place: async () => ({ path: tempDbPath() }),
  store: async ({ place, ...options } = {}) => {
    const store = openSqliteStore(storeOptions({ ...(place ?? { path: tempDbPath() }), ...options }));
    onTestFinished(() => store.close());
    return store;
  },
  dropTrigger: async (store, trigger) => {
    await store.sql.run(`DROP TRIGGER ${trigger}`);
  },
};

let admin: pg.Pool | undefined;
/** One connection pool per test file for making and dropping schemas. */
function adminPool(): pg.Pool {
  if (!PG_URL) throw new Error(PG_SKIPPED);
  admin ??= new pg.Pool({ connectionString: PG_URL, max: 2 });
  return admin;
}

/** A new schema on the test server, dropped with everything in it when the test ends; the stores on it are closed first. */
export async function pgSchema(): Promise<{ schema: string; closeFirst: OpenedStore[] }> {
  const schema = `t_${randomBytes(6).toString("hex")}`;
  await adminPool().query(`CREATE SCHEMA ${schema}`);
  const closeFirst: OpenedStore[] = [];
  onTestFinished(async () => {
    for (const s of closeFirst) await s.close().catch(() => undefined);
    await adminPool().query(`DROP SCHEMA ${schema} CASCADE`);
  });
  return { schema, closeFirst };
}

afterAll(async () => {
  await admin?.end();
});

const pgPlaces = new Map<string, OpenedStore[]>();

export const POSTGRES: Backend = {
  name: "PostgreSQL",
  place: async () => {
    const { schema, closeFirst } = await pgSchema();
    pgPlaces.set(schema, closeFirst);
    return { databaseUrl: PG_URL, pgSchema: schema, keyPath: join(tempDir(), "records.signing-key.pem") };
  },
  store: async ({ place, ...options } = {}) => {
    const at = place ?? (await POSTGRES.place());
    const store = await openStore(storeOptions({ ...at, ...options }));
    pgPlaces.get(at.pgSchema ?? "")?.push(store);
    return store;
  },
  dropTrigger: async (store, trigger, table) => {
    await store.sql.run(`DROP TRIGGER ${trigger} ON ${table}`);
  },
};

/**
 * The suite `body` once per backend: on SQLite always, on PostgreSQL when a test server is
 * configured, else listed as skipped with the reason in its name.
 */
export function onEachBackend(title: string, body: (b: Backend) => void): void {
  describe(`${title} (SQLite)`, () => body(SQLITE));
  describe.skipIf(!PG_URL)(`${title} (PostgreSQL${PG_URL ? "" : `, ${PG_SKIPPED}`})`, () => body(POSTGRES));
}

/** A store on fresh SQLite records, for tests of what only the SQLite file has. */
export function testStore(options: Partial<StoreOptions> = {}): SqliteStore {
  const store = openSqliteStore(storeOptions({ path: tempDbPath(), ...options }));
  onTestFinished(() => store.close());
  return store;
}

/** Invented people for sign-off tests; passphrases meet the minimum length and zxcvbn's score 3. */
export const PEOPLE = {
  ana: { name: "Ana Brightwater", passphrase: "copper kettle morning" },
  bo: { name: "Bo Lindqvist-Arroyo", passphrase: "seven quiet lanterns" },
  cy: { name: "Cy Okonkwo-Hale", passphrase: "granite harbour tide" },
} as const;

export type Who = keyof typeof PEOPLE;

/** Ana as the first user (an admin), who adds Bo and Cy as engineers. Returns each as the actor the store takes. */
export async function registerPeople(store: Pick<OpenedStore, "addUser">): Promise<Record<Who, Actor>> {
  const ana = await store.addUser({ ...PEOPLE.ana, role: "admin" }, null);
  const bo = await store.addUser({ ...PEOPLE.bo, role: "engineer" }, ana);
  const cy = await store.addUser({ ...PEOPLE.cy, role: "engineer" }, ana);
  const actor = (u: Actor): Actor => ({ id: u.id, name: u.name, role: u.role });
  return { ana: actor(ana), bo: actor(bo), cy: actor(cy) };
}

/** The tables every records database holds, on either backend (its migrations make them). */
export const RECORD_TABLES = [
  "attempts",
  "checks",
  "events",
  "people_events",
  "revisions",
  "sessions",
  "signoffs",
  "trusted_keys",
  "users",
] as const;
