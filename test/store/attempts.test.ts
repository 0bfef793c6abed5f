import { describe, expect, it } from "vitest";
import { MAX_FAILURES, WINDOW_MS } from "../../src/store/attempts.ts";
import { WrongPassphraseError } from "../../src/store/index.ts";
import { PEOPLE, registerPeople, sampleInput, testStore } from "./helpers.ts";

describe("wrong passphrases", () => {
  // Common practice for password checks: a few tries, then a pause, so a passphrase cannot be guessed by trying many.
  it("pause signing as a person after five wrong tries, even with the right one, until the window passes", async () => {
    let clock = Date.parse("2026-03-02T08:00:00Z");
    const store = testStore({ now: () => new Date(clock) });
    await registerPeople(store);
    const { id } = store.createCheck({ input: sampleInput(), calcNumber: "HW-TRIES-1" });
    const attempt = (passphrase: string) => store.signOff(id, { revision: 1, role: "prepared", name: PEOPLE.ana.name, passphrase });
    for (let i = 0; i < MAX_FAILURES; i++) await expect(attempt("not the right one at all")).rejects.toBeInstanceOf(WrongPassphraseError);
    await expect(attempt(PEOPLE.ana.passphrase)).rejects.toThrow(/too many wrong passphrases .* paused for 15 more minutes/);
    expect(store.getCheck(id).revisions[0].state).toBe("draft");
    clock += WINDOW_MS;
    expect((await attempt(PEOPLE.ana.passphrase)).state).toBe("prepared");
  });

  it("a right passphrase clears earlier wrong tries", async () => {
    const store = testStore();
    await registerPeople(store);
    const { id } = store.createCheck({ input: sampleInput(), calcNumber: "HW-TRIES-2" });
    for (let i = 0; i < MAX_FAILURES - 1; i++) {
      await expect(
        store.signOff(id, { revision: 1, role: "prepared", name: PEOPLE.ana.name, passphrase: "a wrong passphrase here" }),
      ).rejects.toBeInstanceOf(WrongPassphraseError);
    }
    await store.signOff(id, { revision: 1, role: "prepared", name: PEOPLE.ana.name, passphrase: PEOPLE.ana.passphrase });
    await expect(
      store.signOff(id, { revision: 1, role: "checked", name: PEOPLE.bo.name, passphrase: "a wrong passphrase here" }),
    ).rejects.toThrow(/is not the one registered/);
  });
});
