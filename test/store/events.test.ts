import { describe, expect, it } from "vitest";
import { PEOPLE, registerPeople, sampleInput, testStore } from "./helpers.ts";

describe("records the database refuses to change", () => {
  it("keeps the event log append-only: an UPDATE or DELETE is refused and the rows stay", async () => {
    const store = testStore();
    const people = await registerPeople(store);
    const { id } = store.createCheck({ input: sampleInput() });
    await store.signOff(id, { revision: 1, role: "prepared", passphrase: PEOPLE.ana.passphrase }, people.ana, "test");
    store.addRevision(id, { input: sampleInput(2.4) });
    const before = store.getCheck(id).events;
    expect(before.map((e) => e.kind)).toEqual(["saved", "signed", "saved", "superseded"]);

    expect(() => store.db.prepare("UPDATE events SET actor = 'someone else'").run()).toThrow(/append-only/);
    expect(() => store.db.prepare("DELETE FROM events").run()).toThrow(/append-only/);
    expect(() => store.db.prepare("DELETE FROM people_events").run()).toThrow(/append-only/);
    expect(store.getCheck(id).events).toEqual(before);
  });

  it("keeps revisions immutable", () => {
    const store = testStore();
    const { id } = store.createCheck({ input: sampleInput() });
    expect(() => store.db.prepare("UPDATE revisions SET input_json = '{}' WHERE check_id = ?").run(id)).toThrow(/immutable/);
    expect(() => store.db.prepare("DELETE FROM revisions WHERE check_id = ?").run(id)).toThrow(/immutable/);
    expect(store.getCheck(id).revisions[0].input).toMatchObject({ shell: { thickness_mm: 1.6 } });
  });

  it("keeps sign-offs immutable", async () => {
    const store = testStore();
    const people = await registerPeople(store);
    const { id } = store.createCheck({ input: sampleInput() });
    await store.signOff(id, { revision: 1, role: "prepared", passphrase: PEOPLE.ana.passphrase }, people.ana, "test");
    expect(() => store.db.prepare("UPDATE signoffs SET name = 'Someone Else'").run()).toThrow(/immutable/);
    expect(() => store.db.prepare("DELETE FROM signoffs").run()).toThrow(/immutable/);
    expect(store.getCheck(id).revisions[0].signoffs.map((s) => s.name)).toEqual([PEOPLE.ana.name]);
  });

  it("a read writes nothing: listing, reading a check, a sheet revision and an export leave the event log as it was", async () => {
    const store = testStore();
    await registerPeople(store);
    const { id } = store.createCheck({ input: sampleInput() });
    const count = () => (store.db.prepare("SELECT count(*) AS n FROM events").get() as { n: number }).n;
    const before = count();
    store.listChecks();
    store.getCheck(id);
    store.getSheetRevision(id, 1);
    store.exportCheck(id);
    expect(count()).toBe(before);
  });
});
