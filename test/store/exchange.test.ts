import { createPrivateKey, generateKeyPairSync, sign } from "node:crypto";
import { readFileSync } from "node:fs";
import { expect, it } from "vitest";
import { canonicalJson } from "../../src/schema/canonical.ts";
import { signoffMessage } from "../../src/schema/signoff.ts";
import {
  EXCHANGE_FORMAT,
  InvalidRecordError,
  MAX_IMPORT_EVENTS,
  MAX_IMPORT_REVISIONS,
  RecordConflictError,
  type Actor,
  type ExchangeDocument,
  type OpenedStore,
} from "../../src/store/index.ts";
import { onEachBackend, PEOPLE, registerPeople, sampleInput, type Backend } from "./helpers.ts";

/** A check with two revisions: the first prepared and checked, then superseded; the second prepared. */
async function signedHistory(b: Backend) {
  const store = await b.store();
  const people = await registerPeople(store);
  const { id } = await store.createCheck({ input: sampleInput(1.6), calcNumber: "HW-EXCH-1" }, people.ana);
  const s = (revision: number, role: "prepared" | "checked", who: "ana" | "bo") =>
    store.signOff(id, { revision, role, passphrase: PEOPLE[who].passphrase }, people[who], "test");
  await s(1, "prepared", "ana");
  await s(1, "checked", "bo");
  await store.addRevision(id, { input: sampleInput(1.8) }, people.ana);
  await s(2, "prepared", "ana");
  return { store, id, people };
}

/** A deep copy of the document, as it would be after a trip through a file. */
function copy(doc: ExchangeDocument): ExchangeDocument {
  return JSON.parse(JSON.stringify(doc)) as ExchangeDocument;
}

/** Records elsewhere, with an admin to import. */
async function otherRecords(b: Backend): Promise<{ store: OpenedStore; admin: Actor }> {
  const store = await b.store();
  const admin = await store.addUser({ name: "Dee Marchetti", role: "admin", passphrase: "lilac thunder pebble road" }, null);
  return { store, admin };
}

async function importError(store: OpenedStore, admin: Actor, doc: unknown): Promise<InvalidRecordError> {
  try {
    await store.importCheck(doc, admin);
  } catch (err) {
    if (err instanceof InvalidRecordError) return err;
    throw err;
  }
  throw new Error("expected the import to be refused");
}

onEachBackend("export and import", (b) => {
  it("carries a check with its sign-offs into records that trust the exporting key", async () => {
    const { store, id } = await signedHistory(b);
    const doc = copy(await store.exportCheck(id));
    expect(doc.format).toBe(EXCHANGE_FORMAT);
    expect(doc.signature.keyFingerprint).toBe(store.publicKey().fingerprint);

    const { store: elsewhere, admin } = await otherRecords(b);
    await elsewhere.trustKey({ publicKeyPem: store.publicKey().publicKeyPem, label: "the first office" }, admin);
    expect(await elsewhere.importCheck(doc, admin)).toMatchObject({ id, calcNumber: "HW-EXCH-1", revisions: 2, signed: true });

    const original = await store.getCheck(id);
    const imported = await elsewhere.getCheck(id);
    expect(imported.revisions.map((r) => [r.number, r.fingerprint, r.state, r.input, r.importedUnsigned])).toEqual(
      original.revisions.map((r) => [r.number, r.fingerprint, r.state, r.input, false]),
    );
    expect(imported.revisions.map((r) => r.signoffs.map((s) => [s.role, s.name, s.signedAt, s.imported, s.valid]))).toEqual(
      original.revisions.map((r) => r.signoffs.map((s) => [s.role, s.name, s.signedAt, true, true])),
    );
    expect(imported.events.slice(0, -1)).toEqual(original.events);
    expect(imported.events.at(-1)).toMatchObject({ kind: "imported", actor: "Dee Marchetti", detail: { signed: true } });
  });

  it("brings a file from a key no admin trusts in unsigned, as drafts marked imported", async () => {
    const { store, id } = await signedHistory(b);
    const { store: elsewhere, admin } = await otherRecords(b);
    const out = await elsewhere.importCheck(copy(await store.exportCheck(id)), admin);
    expect(out).toMatchObject({ signed: false, unsignedBecause: expect.stringMatching(/no admin of these records has marked trusted/) });
    const imported = await elsewhere.getCheck(id);
    expect(imported.revisions.map((r) => [r.state, r.importedUnsigned, r.signoffs.length])).toEqual([
      ["superseded", true, 0],
      ["draft", true, 0],
    ]);
  });

  it("never writes a passphrase hash or salt into the file", async () => {
    const { store, id } = await signedHistory(b);
    const text = JSON.stringify(await store.exportCheck(id));
    const rows = await store.sql.all<{ salt: Buffer; hash: Buffer }>("SELECT salt, hash FROM users");
    const secrets = rows.map((r) => ({ salt: Buffer.from(r.salt).toString("hex"), hash: Buffer.from(r.hash).toString("hex") }));
    expect(secrets).toHaveLength(3);
    for (const s of secrets) {
      expect(text.toLowerCase()).not.toContain(s.salt.toLowerCase());
      expect(text.toLowerCase()).not.toContain(s.hash.toLowerCase());
      expect(text).not.toContain(Buffer.from(s.hash, "hex").toString("base64"));
    }
    expect(text).not.toContain(PEOPLE.ana.passphrase);
  });

  it("refuses a file whose input was edited without its fingerprint, naming the revision, and stores nothing", async () => {
    const { store, id } = await signedHistory(b);
    const doc = copy(await store.exportCheck(id));
    (doc.revisions[0].input as { shell: { thickness_mm: number } }).shell.thickness_mm = 2.5;
    const { store: elsewhere, admin } = await otherRecords(b);
    expect((await importError(elsewhere, admin, doc)).errors.map((e) => e.path)).toEqual(["revisions.0.fingerprint"]);
    expect(await elsewhere.listChecks()).toEqual([]);
  });

  // Attack: an altered export. The attacker renames a sign-off to a trusted person; the file's
  // and the sign-off's signatures no longer match, so the sign-offs are dropped.
  it("attack — altered import: a sign-off renamed in a trusted file arrives unsigned", async () => {
    const { store, id } = await signedHistory(b);
    const { store: elsewhere, admin } = await otherRecords(b);
    await elsewhere.trustKey({ publicKeyPem: store.publicKey().publicKeyPem, label: "the first office" }, admin);
    const doc = copy(await store.exportCheck(id));
    doc.revisions[0].signoffs[1].name = "Someone Trusted";
    const out = await elsewhere.importCheck(doc, admin);
    expect(out).toMatchObject({ signed: false, unsignedBecause: expect.stringMatching(/changed after it was exported/) });
    expect((await elsewhere.getCheck(id)).revisions.every((r) => r.signoffs.length === 0 && r.importedUnsigned)).toBe(true);
  });

  // Attack: a record made from nothing, signed with the attacker's own fresh key, with the
  // fingerprints recomputed so every checksum is consistent.
  it("attack — forged import: a record made from nothing with the forger's own key gets no sign-off", async () => {
    const { store, id } = await signedHistory(b);
    const forged = copy(await store.exportCheck(id));
    const { privateKey, publicKey } = generateKeyPairSync("ed25519");
    const pem = publicKey.export({ type: "spki", format: "pem" }) as string;
    const fp = (await import("node:crypto"))
      .createHash("sha256")
      .update(publicKey.export({ type: "spki", format: "der" }))
      .digest("hex");
    forged.check.id = "forged-check-1";
    forged.check.calcNumber = "HW-FORGED-1";
    forged.revisions = [forged.revisions[1]];
    forged.revisions[0].number = 1;
    forged.events = [];
    const r = forged.revisions[0];
    r.signoffs = (["prepared", "checked", "approved"] as const).map((role, i) => {
      const facts = {
        checkId: forged.check.id,
        revision: 1,
        fingerprint: r.fingerprint,
        role,
        userId: i + 1,
        name: `Person ${i + 1}`,
        signedAt: "2030-03-01T08:00:00.000Z",
      };
      return {
        role,
        name: facts.name,
        userId: facts.userId,
        signedAt: facts.signedAt,
        keyFingerprint: fp,
        signature: sign(null, Buffer.from(signoffMessage(facts)), privateKey).toString("base64"),
      };
    });
    const { signature: _s, ...body } = forged;
    const doc = {
      ...body,
      signature: {
        algorithm: "Ed25519",
        publicKeyPem: pem,
        keyFingerprint: fp,
        value: sign(null, Buffer.from(canonicalJson(body)), privateKey).toString("base64"),
      },
    };
    const { store: elsewhere, admin } = await otherRecords(b);
    expect(await elsewhere.importCheck(doc, admin)).toMatchObject({ signed: false });
    const [rev] = (await elsewhere.getCheck("forged-check-1")).revisions;
    expect(rev).toMatchObject({ state: "draft", importedUnsigned: true, signoffs: [] });
  });

  it("holds a trusted file's sign-offs to the three-people rule, even when every signature holds", async () => {
    // Re-signed with the exporting records' own private key, so only the rule can refuse it.
    const { store, id, people } = await signedHistory(b);
    const key = createPrivateKey(readFileSync(store.keyPath ?? ""));
    const doc = copy(await store.exportCheck(id));
    const r = doc.revisions[0];
    const checked = r.signoffs[1];
    checked.userId = people.ana.id;
    checked.name = people.ana.name;
    const facts = {
      checkId: id,
      revision: 1,
      fingerprint: r.fingerprint,
      role: checked.role,
      userId: checked.userId,
      name: checked.name,
      signedAt: checked.signedAt,
    };
    checked.signature = sign(null, Buffer.from(signoffMessage(facts)), key).toString("base64");
    const { signature: old, ...body } = doc;
    const resigned = { ...body, signature: { ...old, value: sign(null, Buffer.from(canonicalJson(body)), key).toString("base64") } };
    const { store: elsewhere, admin } = await otherRecords(b);
    await elsewhere.trustKey({ publicKeyPem: store.publicKey().publicKeyPem, label: "the first office" }, admin);
    expect((await importError(elsewhere, admin, resigned)).errors).toEqual([
      { path: "revisions.0.signoffs.1.role", message: expect.stringMatching(/three different people/) },
    ]);
  });

  it("refuses a file with more revisions or events than an import takes, each with its own message", async () => {
    const store = await b.store();
    const admin = { id: 1, name: "x", role: "admin" as const };
    const big = { revisions: new Array(MAX_IMPORT_REVISIONS + 1).fill({}), events: new Array(MAX_IMPORT_EVENTS + 1).fill({}) };
    const err = await importError(store, admin, big);
    expect(err.errors).toEqual([
      { path: "revisions", message: expect.stringMatching(new RegExp(`at most ${MAX_IMPORT_REVISIONS}`)) },
      { path: "events", message: expect.stringMatching(new RegExp(`at most ${MAX_IMPORT_EVENTS}`)) },
    ]);
  });

  it("refuses a file that is not an export, naming the fields", async () => {
    const err = await importError(await b.store(), { id: 1, name: "x", role: "admin" }, { format: "something/else", revisions: [] });
    const paths = err.errors.map((e) => e.path);
    expect(paths).toEqual(expect.arrayContaining(["format", "exportedAt", "check", "revisions", "events", "signature"]));
  });

  it("refuses to import a check the records already hold, and a calculation number they already use, leaving both as they were", async () => {
    const { store, id, people } = await signedHistory(b);
    const before = await store.getCheck(id);
    const doc = copy(await store.exportCheck(id));
    await expect(store.importCheck(doc, people.ana)).rejects.toThrow(RecordConflictError);
    doc.check.id = "another-id";
    await expect(store.importCheck(doc, people.ana)).rejects.toThrow(/calculation number "HW-EXCH-1" is already used/);
    expect((await store.getCheck(id)).revisions).toEqual(before.revisions);
  });
});
