import { expect, it } from "vitest";
import { nameKey } from "../../src/store/names.ts";
import { InvalidRecordError, NotAllowedError, NotSignedInError, RecordConflictError, SlowDownError } from "../../src/store/index.ts";
import { failuresOf } from "../../src/store/attempts.ts";
import { onEachBackend, PEOPLE, registerPeople } from "./helpers.ts";

onEachBackend("people", (b) => {
  it("keeps passphrases only as salted scrypt hashes", async () => {
    const store = await b.store();
    await registerPeople(store);
    const everything = JSON.stringify(await store.sql.all("SELECT * FROM users"));
    for (const p of Object.values(PEOPLE)) expect(everything).not.toContain(p.passphrase);
  });

  it("makes the first person an admin, then lets only an admin add people", async () => {
    const store = await b.store();
    await expect(store.addUser({ ...PEOPLE.ana, role: "engineer" }, null)).rejects.toThrow(/first person must be an admin/);
    const people = await registerPeople(store);
    await expect(
      store.addUser({ name: "Eve Outsider", role: "admin", passphrase: "violet canyon ember drum" }, null),
    ).rejects.toBeInstanceOf(NotSignedInError);
    await expect(
      store.addUser({ name: "Eve Outsider", role: "admin", passphrase: "violet canyon ember drum" }, people.bo),
    ).rejects.toBeInstanceOf(NotAllowedError);
    expect((await store.listUsers()).map((u) => [u.name, u.role])).toEqual([
      [PEOPLE.ana.name, "admin"],
      [PEOPLE.bo.name, "engineer"],
      [PEOPLE.cy.name, "engineer"],
    ]);
  });

  it("refuses common and trivially repeated passphrases (zxcvbn score under 3)", async () => {
    const store = await b.store();
    for (const weak of ["password1234", "aaaaaaaaaaaaaaaa", "qwertyuiop123", "Ana Brightwater1"]) {
      const err = await store.addUser({ name: PEOPLE.ana.name, role: "admin", passphrase: weak }, null).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(InvalidRecordError);
      expect((err as InvalidRecordError).errors[0]).toMatchObject({
        path: "passphrase",
        message: expect.stringMatching(/too easy to guess/),
      });
    }
  });

  // Attack: the same person registered again under a name that only looks different.
  it.each([
    ["a zero-width space", "Ana\u200b Brightwater"],
    ["a soft hyphen and a word joiner", "Ana Bright\u00adwa\u2060ter"],
    ["Cyrillic а and е", "\u0410na Brightwat\u0435r"],
    ["Greek capital Alpha and omicron", "\u0391na Brightwater"],
    ["fullwidth letters (NFKC)", "Ａｎａ Brightwater"],
    ["other case and spacing", "  ana   BRIGHTWATER "],
    ["capital I for small l", "Ana BrIghtwater"],
  ])("attack — look-alike name (%s) is refused at registration", async (_what, lookalike) => {
    const store = await b.store();
    const people = await registerPeople(store);
    const err = await store
      .addUser({ name: lookalike, role: "engineer", passphrase: "violet canyon ember drum" }, people.ana)
      .catch((e: unknown) => e);
    expect(err).toBeInstanceOf(RecordConflictError);
    expect((err as RecordConflictError).errors[0].path).toBe("name");
    expect(await store.listUsers()).toHaveLength(3);
  });

  it("folds look-alikes to one skeleton but keeps different names apart (UTS #39 confusables subset)", async () => {
    // Pairs a reader takes for one name; each from the confusables data's Latin/Greek/Cyrillic entries.
    expect(nameKey("Оlga Ρetrova")).toBe(nameKey("Olga Petrova")); // Cyrillic О, Greek Ρ
    expect(nameKey("Ma\u0301rta")).toBe(nameKey("Márta")); // combining acute vs precomposed (NFKC)
    expect(nameKey("Dan rn")).toBe(nameKey("Dan m")); // "rn" read as "m"
    expect(nameKey("Ana Reyes")).not.toBe(nameKey("Ana Reyez"));
    expect(nameKey("Bo Lind")).not.toBe(nameKey("Bo Lund"));
  });

  it("disables a person, ending their sessions, and an admin may reset a passphrase", async () => {
    let t = Date.parse("2030-03-01T08:00:00.000Z");
    const store = await b.store({ now: () => new Date((t += 60_000)) });
    const people = await registerPeople(store);
    const session = await store.signIn({ name: PEOPLE.bo.name, passphrase: PEOPLE.bo.passphrase }, "test");
    expect((await store.userForToken(session.token))?.id).toBe(people.bo.id);
    await expect(store.setDisabled(people.bo.id, true, people.cy)).rejects.toThrow(NotAllowedError);
    await store.setDisabled(people.bo.id, true, people.ana);
    expect(await store.userForToken(session.token)).toBeUndefined();
    await expect(store.signIn({ name: PEOPLE.bo.name, passphrase: PEOPLE.bo.passphrase }, "test")).rejects.toBeInstanceOf(NotSignedInError);
    await store.setDisabled(people.bo.id, false, people.ana);
    await store.setPassphrase(people.bo.id, { passphrase: "marble orchard violin" }, people.ana, "test");
    await expect(store.signIn({ name: PEOPLE.bo.name, passphrase: "marble orchard violin" }, "test")).resolves.toMatchObject({
      user: { id: people.bo.id },
    });
    expect((await store.listPeopleEvents()).map((e) => e.kind)).toEqual(
      expect.arrayContaining(["user-disabled", "user-enabled", "passphrase-reset"]),
    );
  });

  it("lets a person change their own passphrase only with the current one", async () => {
    let t = Date.parse("2030-03-01T08:00:00.000Z");
    const store = await b.store({ now: () => new Date((t += 60_000)) });
    const people = await registerPeople(store);
    await expect(
      store.setPassphrase(people.cy.id, { current: "not it at all", passphrase: "marble orchard violin" }, people.cy, "test"),
    ).rejects.toThrow(/is not/);
    await expect(
      store.setPassphrase(people.bo.id, { current: PEOPLE.cy.passphrase, passphrase: "marble orchard violin" }, people.cy, "test"),
    ).rejects.toBeInstanceOf(NotAllowedError);
    await store.setPassphrase(people.cy.id, { current: PEOPLE.cy.passphrase, passphrase: "marble orchard violin" }, people.cy, "test2");
    await expect(store.signIn({ name: PEOPLE.cy.name, passphrase: "marble orchard violin" }, "test3")).resolves.toBeDefined();
  });
});

onEachBackend("guessing", (b) => {
  // Attack: many guesses sent at once, hoping they are all checked before any is counted.
  it("attack — concurrent guesses: of twenty sent together, one is checked and the others are told to wait", async () => {
    const store = await b.store();
    await registerPeople(store);
    const tries = Array.from({ length: 20 }, (_, i) =>
      store.signIn({ name: PEOPLE.bo.name, passphrase: `wrong guess ${i}` }, `10.0.0.${i}`).catch((e: unknown) => e),
    );
    const outcomes = await Promise.all(tries);
    expect(outcomes.filter((e) => e instanceof NotSignedInError)).toHaveLength(1);
    expect(outcomes.filter((e) => e instanceof SlowDownError)).toHaveLength(19);
    expect(await failuresOf(store.sql, `account:${nameKey(PEOPLE.bo.name)}`)).toBe(1);
  });

  // Attack: restart the server to clear the count.
  it("attack — guesses across a restart: the count and the delay survive closing and reopening the records", async () => {
    const place = await b.place();
    let t = Date.parse("2030-03-01T08:00:00.000Z");
    const open = () => b.store({ place, now: () => new Date(t) });
    const first = await open();
    await registerPeople(first);
    for (let i = 0; i < 4; i++) {
      await expect(first.signIn({ name: PEOPLE.bo.name, passphrase: `wrong ${i}` }, "10.1.1.1")).rejects.toBeInstanceOf(NotSignedInError);
      t += 60_000; // a minute between guesses outlasts the delays so far (1, 2, 4 s)
    }
    await first.close();
    const second = await open();
    t -= 60_000 - 1_000; // the fifth guess, one second after the fourth, when its wait of 2^3 = 8 s has 7 s to run
    const err = await second.signIn({ name: PEOPLE.bo.name, passphrase: "wrong 5" }, "10.1.1.2").catch((e: unknown) => e);
    expect(err).toBeInstanceOf(SlowDownError);
    expect((err as SlowDownError).retryAfter_s).toBe(7);
    expect(await failuresOf(second.sql, `account:${nameKey(PEOPLE.bo.name)}`)).toBe(4);
    await second.close();
  });

  it("answers an unknown name and a wrong passphrase the same way, and counts both", async () => {
    const store = await b.store();
    await registerPeople(store);
    const unknown = await store.signIn({ name: "Nobody Registered", passphrase: "some guess here" }, "10.2.0.1").catch((e: unknown) => e);
    const wrong = await store.signIn({ name: PEOPLE.bo.name, passphrase: "some guess here" }, "10.2.0.2").catch((e: unknown) => e);
    expect(unknown).toBeInstanceOf(NotSignedInError);
    expect(wrong).toBeInstanceOf(NotSignedInError);
    expect((unknown as NotSignedInError).errors).toEqual((wrong as NotSignedInError).errors);
    expect(await failuresOf(store.sql, `account:${nameKey("Nobody Registered")}`)).toBe(1);
  });

  it("grows the wait per account and per source, never locks out: after the wait a right passphrase signs in and clears the count", async () => {
    let t = Date.parse("2030-03-01T08:00:00.000Z");
    const store = await b.store({ now: () => new Date(t) });
    const people = await registerPeople(store);
    for (let i = 0; i < 3; i++) {
      await expect(store.signIn({ name: PEOPLE.cy.name, passphrase: `wrong ${i}` }, "10.3.0.1")).rejects.toBeInstanceOf(NotSignedInError);
      t += 10_000;
    }
    // Three failures: the next try waits 2^2 = 4 s from the last, from any address.
    t -= 10_000 - 3_000;
    await expect(store.signIn({ name: PEOPLE.cy.name, passphrase: PEOPLE.cy.passphrase }, "10.3.0.9")).rejects.toBeInstanceOf(
      SlowDownError,
    );
    t += 2_000;
    await expect(store.signIn({ name: PEOPLE.cy.name, passphrase: PEOPLE.cy.passphrase }, "10.3.0.9")).resolves.toMatchObject({
      user: { id: people.cy.id },
    });
    expect(await failuresOf(store.sql, `account:${nameKey(PEOPLE.cy.name)}`)).toBe(0);
    // The source that guessed is still slowed for another name.
    expect(await failuresOf(store.sql, "source:10.3.0.1")).toBe(3);
  });

  it("an admin lifts a delay, and that is logged", async () => {
    const store = await b.store();
    const people = await registerPeople(store);
    await store.signIn({ name: PEOPLE.bo.name, passphrase: "wrong one here" }, "10.4.0.1").catch(() => undefined);
    expect(await store.clearDelay(people.bo.id, people.ana)).toBe(true);
    expect(await failuresOf(store.sql, `account:${nameKey(PEOPLE.bo.name)}`)).toBe(0);
    expect((await store.listPeopleEvents())[0]).toMatchObject({ kind: "delay-cleared", userId: people.bo.id, actorId: people.ana.id });
  });
});
