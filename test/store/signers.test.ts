import { describe, expect, it } from "vitest";
import { InvalidRecordError, MIN_PASSPHRASE_LENGTH, RecordConflictError, WrongPassphraseError } from "../../src/store/index.ts";
import { verifySigner } from "../../src/store/signers.ts";
import { PEOPLE, testStore } from "./helpers.ts";

describe("signers", () => {
  it("keeps only a salted scrypt hash of the passphrase, never the passphrase", async () => {
    const store = testStore();
    await store.addSigner(PEOPLE.ana);
    await store.addSigner({ name: "Dee Marchetti", passphrase: PEOPLE.ana.passphrase });
    const rows = store.db.prepare("SELECT name, salt, hash FROM signers ORDER BY name").all() as {
      name: string;
      salt: Buffer;
      hash: Buffer;
    }[];
    const everything = JSON.stringify(store.db.prepare("SELECT * FROM signers").all());
    expect(everything).not.toContain(PEOPLE.ana.passphrase);
    for (const r of rows) expect(r.hash.toString("utf8")).not.toContain(PEOPLE.ana.passphrase);
    // The same passphrase under two names gives two different hashes: each signer has a salt of their own.
    expect(rows[0].salt.equals(rows[1].salt)).toBe(false);
    expect(rows[0].hash.equals(rows[1].hash)).toBe(false);
  });

  it("hashes at the default cost unless told otherwise, storing the cost beside the hash", async () => {
    const store = testStore({ passphraseCost: undefined });
    await store.addSigner(PEOPLE.ana);
    expect(store.db.prepare("SELECT scrypt_n AS n, scrypt_r AS r, scrypt_p AS p FROM signers").get()).toEqual({ n: 2 ** 15, r: 8, p: 1 });
    await expect(verifySigner(store.db, PEOPLE.ana.name, PEOPLE.ana.passphrase)).resolves.toMatchObject({ name: PEOPLE.ana.name });
  });

  it("verifies the right passphrase and refuses a wrong one with a typed error", async () => {
    const store = testStore();
    await store.addSigner(PEOPLE.ana);
    await expect(verifySigner(store.db, "  ana   brightwater ", PEOPLE.ana.passphrase)).resolves.toMatchObject({ name: PEOPLE.ana.name });
    await expect(verifySigner(store.db, PEOPLE.ana.name, `${PEOPLE.ana.passphrase}!`)).rejects.toBeInstanceOf(WrongPassphraseError);
    await expect(verifySigner(store.db, "Nobody Registered", PEOPLE.ana.passphrase)).rejects.toBeInstanceOf(InvalidRecordError);
  });

  it("accepts the same passphrase typed in another Unicode form", async () => {
    const store = testStore();
    await store.addSigner({ name: "Zoë Fairbanks", passphrase: "crème brûlée at noon" });
    const decomposed = "crème brûlée at noon".normalize("NFD");
    await expect(verifySigner(store.db, "Zoë Fairbanks", decomposed)).resolves.toMatchObject({ name: "Zoë Fairbanks" });
  });

  it("keeps names unique regardless of case and spacing, and trims them", async () => {
    const store = testStore();
    expect(await store.addSigner({ name: "  Ana Brightwater ", passphrase: PEOPLE.ana.passphrase })).toMatchObject({
      name: "Ana Brightwater",
    });
    await expect(store.addSigner({ name: "ANA  brightwater", passphrase: "another long phrase" })).rejects.toBeInstanceOf(
      RecordConflictError,
    );
    expect(store.listSigners().map((s) => s.name)).toEqual(["Ana Brightwater"]);
  });

  it("refuses an empty name and a short passphrase, naming each field", async () => {
    const store = testStore();
    const err = await store.addSigner({ name: "   ", passphrase: "x".repeat(MIN_PASSPHRASE_LENGTH - 1) }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(InvalidRecordError);
    expect((err as InvalidRecordError).errors).toEqual([
      { path: "name", message: "must not be empty" },
      { path: "passphrase", message: `must be at least ${MIN_PASSPHRASE_LENGTH} characters` },
    ]);
    expect(store.listSigners()).toEqual([]);
  });
});
