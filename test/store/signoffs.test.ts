import { expect, it } from "vitest";
import { signoffMessage } from "../../src/schema/signoff.ts";
import {
  InvalidRecordError,
  RecordNotFoundError,
  SignOffRefusedError,
  WrongPassphraseError,
  type Actor,
  type Store,
} from "../../src/store/index.ts";
import { onEachBackend, PEOPLE, registerPeople, sampleInput, type Backend, type Who } from "./helpers.ts";
import { createPublicKey, verify } from "node:crypto";

async function storeWithCheck(b: Backend) {
  const store = await b.store();
  const people = await registerPeople(store);
  const { id } = await store.createCheck({ input: sampleInput(), calcNumber: "HW-SIGN-1" });
  const sign = (revision: number, role: "prepared" | "checked" | "approved", who: Who, passphrase: string = PEOPLE[who].passphrase) =>
    store.signOff(id, { revision, role, passphrase }, people[who], "test");
  return { store, id, people, sign };
}

onEachBackend("sign-off", (b) => {
  it("goes prepared → checked → approved by three people, the state following each step", async () => {
    const { store, id, sign, people } = await storeWithCheck(b);
    expect((await sign(1, "prepared", "ana")).state).toBe("prepared");
    expect((await sign(1, "checked", "bo")).state).toBe("checked");
    expect((await sign(1, "approved", "cy")).state).toBe("approved");
    const [rev] = (await store.getCheck(id)).revisions;
    expect(rev.state).toBe("approved");
    expect(rev.signoffs.map((s) => [s.role, s.name, s.userId, s.imported, s.valid])).toEqual([
      ["prepared", PEOPLE.ana.name, people.ana.id, false, true],
      ["checked", PEOPLE.bo.name, people.bo.id, false, true],
      ["approved", PEOPLE.cy.name, people.cy.id, false, true],
    ]);
    expect((await store.getCheck(id)).events.filter((e) => e.kind === "signed").map((e) => [e.actor, e.detail])).toEqual([
      [PEOPLE.ana.name, { role: "prepared", userId: people.ana.id }],
      [PEOPLE.bo.name, { role: "checked", userId: people.bo.id }],
      [PEOPLE.cy.name, { role: "approved", userId: people.cy.id }],
    ]);
  });

  it("signs the check id, revision, fingerprint, role, user id and time with the records' Ed25519 key", async () => {
    const { store, id, sign } = await storeWithCheck(b);
    const { signoff } = await sign(1, "prepared", "ana");
    const rev = (await store.getCheck(id)).revisions[0];
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
    const { store, id, sign } = await storeWithCheck(b);
    await expect(sign(1, "checked", "bo")).rejects.toBeInstanceOf(SignOffRefusedError);
    await sign(1, "prepared", "ana");
    await expect(sign(1, "approved", "cy")).rejects.toThrow(/needs the "checked" sign-off first/);
    await expect(sign(1, "prepared", "bo")).rejects.toThrow(/already signed as prepared/);
    expect((await store.getCheck(id)).revisions[0].state).toBe("prepared");
  });

  // Attack: one person signing more than one role. Preparer, checker and approver are three
  // different user ids (the four-eyes rule and a separate approval, common practice).
  it("attack — one person signs two roles: the preparer may neither check nor approve, the checker may not approve", async () => {
    const { sign } = await storeWithCheck(b);
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
    const { store, id, sign } = await storeWithCheck(b);
    const err = await sign(1, "prepared", "ana", PEOPLE.bo.passphrase).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(WrongPassphraseError);
    expect((err as WrongPassphraseError).errors[0].path).toBe("passphrase");
    expect((await store.getCheck(id)).revisions[0].signoffs).toEqual([]);
    expect((await store.getCheck(id)).events.some((e) => e.kind === "signed")).toBe(false);
  });

  it("refuses to sign a superseded revision, which keeps the sign-offs it had", async () => {
    const { store, id, sign } = await storeWithCheck(b);
    await sign(1, "prepared", "ana");
    await store.addRevision(id, { input: sampleInput(2.0) });
    const err = await sign(1, "checked", "bo").catch((e: unknown) => e);
    expect(err).toBeInstanceOf(SignOffRefusedError);
    expect((err as SignOffRefusedError).errors[0].path).toBe("revision");
    const [first, second] = (await store.getCheck(id)).revisions;
    expect(first.state).toBe("superseded");
    expect(first.signoffs.map((s) => s.name)).toEqual([PEOPLE.ana.name]);
    // A new revision starts unsigned.
    expect(second).toMatchObject({ state: "draft", signoffs: [] });
  });

  it("names an unknown revision or check, and refuses a user who does not exist", async () => {
    const { store, id, sign } = await storeWithCheck(b);
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
    const { store, id, people } = await storeWithCheck(b);
    const bad = { revision: 0, role: "reviewed", name: PEOPLE.cy.name, passphrase: "" } as unknown as Parameters<Store["signOff"]>[1];
    const err = await store.signOff(id, bad, people.ana, "test").catch((e: unknown) => e);
    expect(err).toBeInstanceOf(InvalidRecordError);
    expect((err as InvalidRecordError).errors.map((e) => e.path).sort()).toEqual(["name", "revision", "role"]);
  });
});
