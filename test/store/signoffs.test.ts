import { describe, expect, it } from "vitest";
import { signoffMessage } from "../../src/schema/signoff.ts";
import {
  InvalidRecordError,
  RecordNotFoundError,
  SignOffRefusedError,
  WrongPassphraseError,
  type Actor,
  type SqliteStore,
} from "../../src/store/index.ts";
import { PEOPLE, registerPeople, sampleInput, testStore, type Who } from "./helpers.ts";
import { createPublicKey, verify } from "node:crypto";

async function storeWithCheck() {
  const store = testStore();
  const people = await registerPeople(store);
  const { id } = store.createCheck({ input: sampleInput(), calcNumber: "HW-SIGN-1" });
  const sign = (revision: number, role: "prepared" | "checked" | "approved", who: Who, passphrase: string = PEOPLE[who].passphrase) =>
    store.signOff(id, { revision, role, passphrase }, people[who], "test");
  return { store, id, people, sign };
}

describe("sign-off", () => {
  it("goes prepared → checked → approved by three people, the state following each step", async () => {
    const { store, id, sign, people } = await storeWithCheck();
    expect((await sign(1, "prepared", "ana")).state).toBe("prepared");
    expect((await sign(1, "checked", "bo")).state).toBe("checked");
    expect((await sign(1, "approved", "cy")).state).toBe("approved");
    const [rev] = store.getCheck(id).revisions;
    expect(rev.state).toBe("approved");
    expect(rev.signoffs.map((s) => [s.role, s.name, s.userId, s.imported, s.valid])).toEqual([
      ["prepared", PEOPLE.ana.name, people.ana.id, false, true],
      ["checked", PEOPLE.bo.name, people.bo.id, false, true],
      ["approved", PEOPLE.cy.name, people.cy.id, false, true],
    ]);
    expect(
      store
        .getCheck(id)
        .events.filter((e) => e.kind === "signed")
        .map((e) => [e.actor, e.detail]),
    ).toEqual([
      [PEOPLE.ana.name, { role: "prepared", userId: people.ana.id }],
      [PEOPLE.bo.name, { role: "checked", userId: people.bo.id }],
      [PEOPLE.cy.name, { role: "approved", userId: people.cy.id }],
    ]);
  });

  it("signs the check id, revision, fingerprint, role, user id and time with the records' Ed25519 key", async () => {
    const { store, id, sign } = await storeWithCheck();
    const { signoff } = await sign(1, "prepared", "ana");
    const rev = store.getCheck(id).revisions[0];
    const key = createPublicKey(store.publicKey().publicKeyPem);
    const facts = {
      checkId: id,
      revision: 1,
      fingerprint: rev.fingerprint,
      role: "prepared" as const,
      userId: signoff.userId ?? 0,
      name: signoff.name,
      signedAt: signoff.signedAt,
    };
    // Checked with node:crypto directly, independent of the store's own check.
    expect(verify(null, Buffer.from(signoffMessage(facts)), key, Buffer.from(signoff.signature ?? "", "base64"))).toBe(true);
    expect(
      verify(null, Buffer.from(signoffMessage({ ...facts, role: "approved" })), key, Buffer.from(signoff.signature ?? "", "base64")),
    ).toBe(false);
    expect(signoff.keyFingerprint).toBe(store.publicKey().fingerprint);
  });

  it("refuses a role out of order", async () => {
    const { store, id, sign } = await storeWithCheck();
    await expect(sign(1, "checked", "bo")).rejects.toBeInstanceOf(SignOffRefusedError);
    await sign(1, "prepared", "ana");
    await expect(sign(1, "approved", "cy")).rejects.toThrow(/needs the "checked" sign-off first/);
    await expect(sign(1, "prepared", "bo")).rejects.toThrow(/already signed as prepared/);
    expect(store.getCheck(id).revisions[0].state).toBe("prepared");
  });

  // Attack: one person signing more than one role. Preparer, checker and approver are three
  // different user ids (the four-eyes rule and a separate approval, common practice).
  it("attack — one person signs two roles: the preparer may neither check nor approve, the checker may not approve", async () => {
    const { store, id, sign } = await storeWithCheck();
    await sign(1, "prepared", "ana");
    const err = await sign(1, "checked", "ana").catch((e: unknown) => e);
    expect(err).toBeInstanceOf(SignOffRefusedError);
    expect((err as SignOffRefusedError).errors).toEqual([{ path: "role", message: expect.stringMatching(/three different people/) }]);
    await sign(1, "checked", "bo");
    await expect(sign(1, "approved", "bo")).rejects.toThrow(/three different people/);
    await expect(sign(1, "approved", "ana")).rejects.toThrow(/three different people/);
    expect((await sign(1, "approved", "cy")).state).toBe("approved");
  });

  it("refuses a wrong passphrase given again with a typed error and records nothing", async () => {
    const { store, id, sign } = await storeWithCheck();
    const err = await sign(1, "prepared", "ana", PEOPLE.bo.passphrase).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(WrongPassphraseError);
    expect((err as WrongPassphraseError).errors[0].path).toBe("passphrase");
    expect(store.getCheck(id).revisions[0].signoffs).toEqual([]);
    expect(store.getCheck(id).events.some((e) => e.kind === "signed")).toBe(false);
  });

  it("refuses to sign a superseded revision, which keeps the sign-offs it had", async () => {
    const { store, id, sign } = await storeWithCheck();
    await sign(1, "prepared", "ana");
    store.addRevision(id, { input: sampleInput(2.0) });
    const err = await sign(1, "checked", "bo").catch((e: unknown) => e);
    expect(err).toBeInstanceOf(SignOffRefusedError);
    expect((err as SignOffRefusedError).errors[0].path).toBe("revision");
    const [first, second] = store.getCheck(id).revisions;
    expect(first.state).toBe("superseded");
    expect(first.signoffs.map((s) => s.name)).toEqual([PEOPLE.ana.name]);
    // A new revision starts unsigned.
    expect(second).toMatchObject({ state: "draft", signoffs: [] });
  });

  it("names an unknown revision or check, and refuses a user who does not exist", async () => {
    const { store, id, sign } = await storeWithCheck();
    await expect(sign(9, "prepared", "ana")).rejects.toBeInstanceOf(RecordNotFoundError);
    const ghost: Actor = { id: 999, name: "Not Registered", role: "engineer" };
    await expect(store.signOff(id, { revision: 1, role: "prepared", passphrase: "whatever long enough" }, ghost, "test")).rejects.toThrow(
      /disabled/,
    );
    await expect(store.signOff("no-such-check", { revision: 1, role: "prepared", passphrase: "x" }, ghost, "test")).rejects.toBeInstanceOf(
      RecordNotFoundError,
    );
  });

  it("checks the request's fields before anything else, and takes no typed name", async () => {
    const { store, id, people } = await storeWithCheck();
    const bad = { revision: 0, role: "reviewed", name: PEOPLE.cy.name, passphrase: "" } as unknown as Parameters<SqliteStore["signOff"]>[1];
    const err = await store.signOff(id, bad, people.ana, "test").catch((e: unknown) => e);
    expect(err).toBeInstanceOf(InvalidRecordError);
    expect((err as InvalidRecordError).errors.map((e) => e.path).sort()).toEqual(["name", "revision", "role"]);
  });
});
