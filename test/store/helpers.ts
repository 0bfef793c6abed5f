import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { onTestFinished } from "vitest";
import { openStore, type Actor, type SqliteStore, type StoreOptions } from "../../src/store/index.ts";
import { fakeValidate } from "./fixtures/validator.ts";

export { fakeValidate, sampleInput } from "./fixtures/validator.ts";

/** A fresh database file in its own temporary folder, removed when the test ends. */
export function tempDbPath(): string {
  const dir = mkdtempSync(join(tmpdir(), "hoopwise-store-"));
  onTestFinished(() => rmSync(dir, { recursive: true, force: true }));
  return join(dir, "records.db");
}

/** A cheap scrypt cost that keeps sign-off tests fast; signers.test.ts also covers the default cost. */
export const FAST_SCRYPT = { n: 2 ** 10, r: 8, p: 1 };

/** A store on a fresh database, closed when the test ends. A fixed clock keeps times predictable. */
export function testStore(options: Partial<StoreOptions> = {}): SqliteStore {
  const store = openStore({
    path: tempDbPath(),
    validate: fakeValidate,
    now: () => new Date("2030-03-01T08:00:00.000Z"),
    passphraseCost: FAST_SCRYPT,
    ...options,
  });
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
export async function registerPeople(store: SqliteStore): Promise<Record<Who, Actor>> {
  const ana = await store.addUser({ ...PEOPLE.ana, role: "admin" }, null);
  const bo = await store.addUser({ ...PEOPLE.bo, role: "engineer" }, ana);
  const cy = await store.addUser({ ...PEOPLE.cy, role: "engineer" }, ana);
  const actor = (u: Actor): Actor => ({ id: u.id, name: u.name, role: u.role });
  return { ana: actor(ana), bo: actor(bo), cy: actor(cy) };
}
