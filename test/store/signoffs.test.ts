import { describe, expect, it } from "vitest";
import { InvalidRecordError, RecordNotFoundError, SignOffRefusedError, WrongPassphraseError, type Store } from "../../src/store/index.ts";
import { PEOPLE, registerPeople, sampleInput, testStore } from "./helpers.ts";

async function storeWithCheck(): Promise<{ store: Store; id: string }> {
  const store = testStore();
  await registerPeople(store);
  const { id } = store.createCheck({ input: sampleInput(), calcNumber: "HW-SIGN-1" });
  return { store, id };
}

function sign(
  store: Store,
  id: string,
  revision: number,
  role: "prepared" | "checked" | "approved",
  who: { name: string; passphrase: string },
) {
  return store.signOff(id, { revision, role, ...who });
}

describe("sign-off", () => {
  it("goes prepared → checked → approved, the state following each step", async () => {
    const { store, id } = await storeWithCheck();
    expect((await sign(store, id, 1, "prepared", PEOPLE.ana)).state).toBe("prepared");
    expect((await sign(store, id, 1, "checked", PEOPLE.bo)).state).toBe("checked");
    expect((await sign(store, id, 1, "approved", PEOPLE.cy)).state).toBe("approved");
    const [rev] = store.getCheck(id).revisions;
    expect(rev.state).toBe("approved");
    expect(rev.signoffs.map((s) => [s.role, s.name, s.imported])).toEqual([
      ["prepared", PEOPLE.ana.name, false],
      ["checked", PEOPLE.bo.name, false],
      ["approved", PEOPLE.cy.name, false],
    ]);
    expect(
      store
        .getCheck(id)
        .events.filter((e) => e.kind === "signed")
        .map((e) => [e.actor, e.detail]),
    ).toEqual([
      [PEOPLE.ana.name, { role: "prepared" }],
      [PEOPLE.bo.name, { role: "checked" }],
      [PEOPLE.cy.name, { role: "approved" }],
    ]);
  });

  it("refuses a role out of order", async () => {
    const { store, id } = await storeWithCheck();
    await expect(sign(store, id, 1, "checked", PEOPLE.bo)).rejects.toBeInstanceOf(SignOffRefusedError);
    await sign(store, id, 1, "prepared", PEOPLE.ana);
    await expect(sign(store, id, 1, "approved", PEOPLE.cy)).rejects.toThrow(/needs the "checked" sign-off first/);
    await expect(sign(store, id, 1, "prepared", PEOPLE.bo)).rejects.toThrow(/already signed as prepared/);
    expect(store.getCheck(id).revisions[0].state).toBe("prepared");
  });

  // The four-eyes rule (common practice): the person who checks a calculation is not the one who prepared it.
  it("refuses the preparer as checker, however the name is typed", async () => {
    const { store, id } = await storeWithCheck();
    await sign(store, id, 1, "prepared", PEOPLE.ana);
    const err = await sign(store, id, 1, "checked", { ...PEOPLE.ana, name: "ANA  BRIGHTWATER" }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(SignOffRefusedError);
    expect((err as SignOffRefusedError).errors).toEqual([{ path: "name", message: expect.stringMatching(/four-eyes/) }]);
    expect(store.getCheck(id).revisions[0].signoffs).toHaveLength(1);
  });

  it("refuses the checker as approver, and lets the preparer approve", async () => {
    const { store, id } = await storeWithCheck();
    await sign(store, id, 1, "prepared", PEOPLE.ana);
    await sign(store, id, 1, "checked", PEOPLE.bo);
    await expect(sign(store, id, 1, "approved", PEOPLE.bo)).rejects.toBeInstanceOf(SignOffRefusedError);
    expect((await sign(store, id, 1, "approved", PEOPLE.ana)).state).toBe("approved");
  });

  it("refuses a wrong passphrase with a typed error and records nothing", async () => {
    const { store, id } = await storeWithCheck();
    const err = await sign(store, id, 1, "prepared", { name: PEOPLE.ana.name, passphrase: PEOPLE.bo.passphrase }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(WrongPassphraseError);
    expect((err as WrongPassphraseError).errors[0].path).toBe("passphrase");
    expect(store.getCheck(id).revisions[0].signoffs).toEqual([]);
    expect(store.getCheck(id).events.some((e) => e.kind === "signed")).toBe(false);
  });

  it("refuses to sign a superseded revision, which keeps the sign-offs it had", async () => {
    const { store, id } = await storeWithCheck();
    await sign(store, id, 1, "prepared", PEOPLE.ana);
    store.addRevision(id, { input: sampleInput(2.0) });
    const err = await sign(store, id, 1, "checked", PEOPLE.bo).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(SignOffRefusedError);
    expect((err as SignOffRefusedError).errors[0].path).toBe("revision");
    const [first, second] = store.getCheck(id).revisions;
    expect(first.state).toBe("superseded");
    expect(first.signoffs.map((s) => s.name)).toEqual([PEOPLE.ana.name]);
    // A new revision starts unsigned.
    expect(second).toMatchObject({ state: "draft", signoffs: [] });
  });

  it("names an unknown signer, revision or check", async () => {
    const { store, id } = await storeWithCheck();
    await expect(sign(store, id, 1, "prepared", { name: "Not Registered", passphrase: "whatever long enough" })).rejects.toBeInstanceOf(
      InvalidRecordError,
    );
    await expect(sign(store, id, 9, "prepared", PEOPLE.ana)).rejects.toBeInstanceOf(RecordNotFoundError);
    await expect(sign(store, "no-such-check", 1, "prepared", PEOPLE.ana)).rejects.toBeInstanceOf(RecordNotFoundError);
  });

  it("checks the request's fields before anything else", async () => {
    const { store, id } = await storeWithCheck();
    const err = await store.signOff(id, { revision: 0, role: "reviewed" as "checked", name: "", passphrase: "" }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(InvalidRecordError);
    expect((err as InvalidRecordError).errors.map((e) => e.path)).toEqual(["revision", "role", "name"]);
  });
});
