import { expect, it } from "vitest";
import { onEachBackend, PEOPLE, registerPeople, sampleInput } from "./helpers.ts";

onEachBackend("records the database refuses to change", (b) => {
  it("keeps the event log append-only: an UPDATE or DELETE is refused and the rows stay", async () => {
    const store = await b.store();
    const people = await registerPeople(store);
    const { id } = await store.createCheck({ input: sampleInput() });
    await store.signOff(id, { revision: 1, role: "prepared", passphrase: PEOPLE.ana.passphrase }, people.ana, "test");
    await store.addRevision(id, { input: sampleInput(2.4) });
    const before = (await store.getCheck(id)).events;
    expect(before.map((e) => e.kind)).toEqual(["saved", "signed", "saved", "superseded"]);

    await expect(store.sql.run("UPDATE events SET actor = 'someone else'")).rejects.toThrow(/append-only/);
    await expect(store.sql.run("DELETE FROM events")).rejects.toThrow(/append-only/);
    await expect(store.sql.run("DELETE FROM people_events")).rejects.toThrow(/append-only/);
    if (store.sql.dialect === "postgres") {
      // PostgreSQL also has TRUNCATE, which row triggers do not see.
      await expect(store.sql.run("TRUNCATE events")).rejects.toThrow(/append-only/);
      await expect(store.sql.run("TRUNCATE people_events")).rejects.toThrow(/append-only/);
    }
    expect((await store.getCheck(id)).events).toEqual(before);
  });

  it("keeps revisions immutable", async () => {
    const store = await b.store();
    const { id } = await store.createCheck({ input: sampleInput() });
    await expect(store.sql.run("UPDATE revisions SET input_json = '{}' WHERE check_id = ?", id)).rejects.toThrow(/immutable/);
    await expect(store.sql.run("DELETE FROM revisions WHERE check_id = ?", id)).rejects.toThrow(/immutable/);
    if (store.sql.dialect === "postgres") await expect(store.sql.run("TRUNCATE revisions CASCADE")).rejects.toThrow(/immutable/);
    expect((await store.getCheck(id)).revisions[0].input).toMatchObject({ shell: { thickness_mm: 1.6 } });
  });

  it("keeps sign-offs immutable", async () => {
    const store = await b.store();
    const people = await registerPeople(store);
    const { id } = await store.createCheck({ input: sampleInput() });
    await store.signOff(id, { revision: 1, role: "prepared", passphrase: PEOPLE.ana.passphrase }, people.ana, "test");
    await expect(store.sql.run("UPDATE signoffs SET name = 'Someone Else'")).rejects.toThrow(/immutable/);
    await expect(store.sql.run("DELETE FROM signoffs")).rejects.toThrow(/immutable/);
    if (store.sql.dialect === "postgres") await expect(store.sql.run("TRUNCATE signoffs")).rejects.toThrow(/immutable/);
    expect((await store.getCheck(id)).revisions[0].signoffs.map((s) => s.name)).toEqual([PEOPLE.ana.name]);
  });

  it("a read writes nothing: listing, reading a check, a sheet revision and an export leave the event log as it was", async () => {
    const store = await b.store();
    await registerPeople(store);
    const { id } = await store.createCheck({ input: sampleInput() });
    const count = async () => (await store.sql.get<{ n: number }>("SELECT count(*) AS n FROM events"))?.n;
    const before = await count();
    await store.listChecks();
    await store.getCheck(id);
    await store.getSheetRevision(id, 1);
    await store.exportCheck(id);
    expect(await count()).toBe(before);
  });
});
