import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { isStorageFault, openStore, SCHEMA_VERSION, storageFaultWords } from "../../src/store/index.ts";
import { PG_MIGRATIONS } from "../../src/store/pgMigrations.ts";
import { fakeValidate, PG_URL, POSTGRES, sampleInput, tempDir, RECORD_TABLES } from "./helpers.ts";

/** What only the PostgreSQL records have: their migrations, the shared signing key, a server out of reach. */
describe.skipIf(!PG_URL)(`the PostgreSQL records${PG_URL ? "" : " (skipped: HOOPWISE_TEST_PG_URL is not set)"}`, () => {
  it("bring a fresh schema to the current version, the same number SQLite's migrations reach", async () => {
    expect(PG_MIGRATIONS.at(-1)?.version).toBe(SCHEMA_VERSION);
    const store = await POSTGRES.store();
    expect(await store.sql.all("SELECT version FROM schema_version ORDER BY version")).toEqual(
      PG_MIGRATIONS.map((m) => ({ version: m.version })),
    );
    const tables = await store.sql.all<{ name: string }>(
      "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = current_schema() ORDER BY table_name",
    );
    expect(tables.map((t) => t.name)).toEqual(expect.arrayContaining([...RECORD_TABLES]));
  });

  it("apply each migration once when several servers open a fresh schema together, and again change nothing", async () => {
    const place = await POSTGRES.place();
    const stores = await Promise.all([1, 2, 3, 4].map(() => POSTGRES.store({ place })));
    const { id } = await stores[0].createCheck({ input: sampleInput(), calcNumber: "HW-PG-KEPT" });
    const again = await POSTGRES.store({ place });
    expect(await again.sql.all("SELECT version FROM schema_version")).toHaveLength(PG_MIGRATIONS.length);
    expect((await again.getCheck(id)).calcNumber).toBe("HW-PG-KEPT");
  });

  it("refuse a schema from a newer build rather than write to it", async () => {
    const place = await POSTGRES.place();
    const store = await POSTGRES.store({ place });
    await store.sql.run("INSERT INTO schema_version (version, applied_at) VALUES (?, ?)", SCHEMA_VERSION + 1, "2030-01-01T00:00:00.000Z");
    await expect(POSTGRES.store({ place })).rejects.toThrow(/newer than this build/);
  });

  it("refuse to start a server whose signing key differs from the one the records are signed with", async () => {
    const place = await POSTGRES.place();
    await POSTGRES.store({ place });
    const other = join(tempDir(), "another.signing-key.pem");
    await expect(POSTGRES.store({ place: { ...place, keyPath: other } })).rejects.toThrow(/copy the signing key file of the first server/);
  });

  it("report a server out of reach as a storage fault in words, not as the user's mistake", async () => {
    const url = new URL(PG_URL ?? "");
    url.port = "1"; // nothing listens on port 1
    const err = await openStore({ databaseUrl: url.toString(), keyPath: join(tempDir(), "k.pem"), validate: fakeValidate }).catch(
      (e: unknown) => e,
    );
    expect(isStorageFault(err)).toBe(true);
    expect(storageFaultWords(err)).toMatch(/cannot be reached/);
  });
});
