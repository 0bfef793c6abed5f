import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { onTestFinished } from "vitest";
import { openStore, type Store, type StoreOptions } from "../../src/store/index.ts";
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
export function testStore(options: Partial<StoreOptions> = {}): Store {
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

/** Invented people for sign-off tests; passphrases meet the minimum length. */
export const PEOPLE = {
  ana: { name: "Ana Brightwater", passphrase: "copper kettle morning" },
  bo: { name: "Bo Lindqvist-Arroyo", passphrase: "seven quiet lanterns" },
  cy: { name: "Cy Okonkwo-Hale", passphrase: "granite harbour tide" },
} as const;

export async function registerPeople(store: Store): Promise<void> {
  for (const p of Object.values(PEOPLE)) await store.addSigner(p);
}
