import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { canonicalJson } from "../../src/schema/canonical.ts";
import { EXCHANGE_FORMAT, InvalidRecordError, RecordConflictError, type ExchangeDocument, type Store } from "../../src/store/index.ts";
import { PEOPLE, registerPeople, sampleInput, testStore } from "./helpers.ts";

/** A check with two revisions: the first prepared and checked, then superseded; the second prepared. */
async function signedHistory(): Promise<{ store: Store; id: string }> {
  const store = testStore();
  await registerPeople(store);
  const { id } = store.createCheck({ input: sampleInput(1.6), calcNumber: "HW-EXCH-1", savedBy: PEOPLE.ana.name });
  await store.signOff(id, { revision: 1, role: "prepared", ...PEOPLE.ana });
  await store.signOff(id, { revision: 1, role: "checked", ...PEOPLE.bo });
  store.addRevision(id, { input: sampleInput(1.8), savedBy: PEOPLE.ana.name });
  await store.signOff(id, { revision: 2, role: "prepared", ...PEOPLE.ana });
  return { store, id };
}

/** A deep copy of the document, as it would be after a trip through a file. */
function copy(doc: ExchangeDocument): ExchangeDocument {
  return JSON.parse(JSON.stringify(doc)) as ExchangeDocument;
}

function importError(store: Store, doc: unknown): InvalidRecordError {
  try {
    store.importCheck(doc);
  } catch (err) {
    if (err instanceof InvalidRecordError) return err;
    throw err;
  }
  throw new Error("expected the import to be refused");
}

describe("export and import", () => {
  it("carries a check with every revision, sign-off and event into another database", async () => {
    const { store, id } = await signedHistory();
    const doc = copy(store.exportCheck(id));
    expect(doc.format).toBe(EXCHANGE_FORMAT);
    expect(store.getCheck(id).events.at(-1)?.kind).toBe("exported");

    const elsewhere = testStore();
    expect(elsewhere.importCheck(doc)).toEqual({ id, title: "Bay 7 skin panel (invented example)", calcNumber: "HW-EXCH-1", revisions: 2 });

    const original = store.getCheck(id);
    const imported = elsewhere.getCheck(id);
    expect(imported.revisions.map((r) => [r.number, r.fingerprint, r.state, r.input])).toEqual(
      original.revisions.map((r) => [r.number, r.fingerprint, r.state, r.input]),
    );
    expect(imported.revisions.map((r) => r.signoffs.map((s) => [s.role, s.name, s.signedAt, s.imported]))).toEqual(
      original.revisions.map((r) => r.signoffs.map((s) => [s.role, s.name, s.signedAt, true])),
    );
    expect(imported.events.slice(0, -1)).toEqual(original.events);
    expect(imported.events.at(-1)).toMatchObject({ kind: "imported", detail: { exportedAt: doc.exportedAt } });
  });

  it("never writes a signer's passphrase hash or salt into the file", async () => {
    const { store, id } = await signedHistory();
    const text = JSON.stringify(store.exportCheck(id));
    const secrets = store.db.prepare("SELECT hex(salt) AS salt, hex(hash) AS hash FROM signers").all() as { salt: string; hash: string }[];
    for (const s of secrets) {
      expect(text.toLowerCase()).not.toContain(s.salt.toLowerCase());
      expect(text.toLowerCase()).not.toContain(s.hash.toLowerCase());
      expect(text).not.toContain(Buffer.from(s.hash, "hex").toString("base64"));
    }
    expect(text).not.toContain(PEOPLE.ana.passphrase);
  });

  it("refuses a file whose input was edited, naming the revision, and stores nothing", async () => {
    const { store, id } = await signedHistory();
    const doc = copy(store.exportCheck(id));
    (doc.revisions[0].input as { shell: { thickness_mm: number } }).shell.thickness_mm = 2.5;
    const elsewhere = testStore();
    const err = importError(elsewhere, doc);
    expect(err.errors.map((e) => e.path)).toEqual(["digest", "revisions.0.fingerprint"]);
    expect(elsewhere.listChecks()).toEqual([]);
  });

  it("refuses a file whose sign-off was edited, through the digest", async () => {
    const { store, id } = await signedHistory();
    const doc = copy(store.exportCheck(id));
    doc.revisions[0].signoffs[1].name = "Someone Trusted";
    expect(importError(testStore(), doc).errors).toEqual([
      { path: "digest", message: expect.stringMatching(/changed after it was exported/) },
    ]);
  });

  it("holds imported sign-offs to the four-eyes rule even when the digest is consistent", async () => {
    const { store, id } = await signedHistory();
    const doc = copy(store.exportCheck(id));
    doc.revisions[0].signoffs[1].name = PEOPLE.ana.name;
    // Whoever edits a file can recompute its checksum; the rules still hold.
    const { digest: _old, ...body } = doc;
    const resealed = { ...body, digest: createHash("sha256").update(canonicalJson(body)).digest("hex") };
    expect(importError(testStore(), resealed).errors).toEqual([
      { path: "revisions.0.signoffs.1.name", message: expect.stringMatching(/four-eyes/) },
    ]);
  });

  it("refuses a file that is not an export, naming the fields", () => {
    const err = importError(testStore(), { format: "something/else", revisions: [] });
    const paths = err.errors.map((e) => e.path);
    expect(paths).toEqual(expect.arrayContaining(["format", "exportedAt", "check", "revisions", "events", "digest"]));
  });

  it("refuses to import a check the database already holds, leaving it as it was", async () => {
    const { store, id } = await signedHistory();
    const before = store.getCheck(id);
    const doc = copy(store.exportCheck(id));
    expect(() => store.importCheck(doc)).toThrow(RecordConflictError);
    expect(store.getCheck(id).revisions).toEqual(before.revisions);
  });
});
