import { describe, expect, it } from "vitest";
import { PEOPLE, registerPeople, sampleInput, testStore } from "./helpers.ts";

/**
 * Attack: someone with the database file edits an approved revision outside Hoopwise (the
 * triggers that refuse edits are dropped first, as anyone holding the file can do).
 */
describe("a database edited outside the tool", () => {
  async function approved() {
    const store = testStore();
    const people = await registerPeople(store);
    const { id } = store.createCheck({ input: sampleInput() });
    for (const [role, who] of [
      ["prepared", "ana"],
      ["checked", "bo"],
      ["approved", "cy"],
    ] as const) {
      await store.signOff(id, { revision: 1, role, passphrase: PEOPLE[who].passphrase }, people[who], "test");
    }
    expect(store.getCheck(id).revisions[0].state).toBe("approved");
    return { store, id };
  }

  it("attack — stored input edited: the fingerprint recomputed on read no longer matches, the revision is not intact and counts no sign-off", async () => {
    const { store, id } = await approved();
    store.db.exec("DROP TRIGGER revisions_immutable_update");
    const row = store.db.prepare("SELECT input_json AS j FROM revisions WHERE check_id = ?").get(id) as { j: string };
    const edited = JSON.parse(row.j) as { shell: { thickness_mm: number } };
    edited.shell.thickness_mm = 3.2;
    store.db.prepare("UPDATE revisions SET input_json = ? WHERE check_id = ?").run(JSON.stringify(edited), id);
    const [rev] = store.getCheck(id).revisions;
    expect(rev).toMatchObject({ intact: false, state: "draft" });
    expect(store.listChecks()[0]).toMatchObject({ intact: false, state: "draft" });
  });

  it("attack — input and fingerprint edited together: the sign-off signatures no longer hold, so none counts", async () => {
    const { store, id } = await approved();
    store.db.exec("DROP TRIGGER revisions_immutable_update");
    const { fingerprint } = await import("../../src/engine/fingerprint.ts");
    const row = store.db.prepare("SELECT input_json AS j, engine_version AS v FROM revisions WHERE check_id = ?").get(id) as {
      j: string;
      v: string;
    };
    const edited = JSON.parse(row.j) as { shell: { thickness_mm: number } };
    edited.shell.thickness_mm = 3.2;
    store.db
      .prepare("UPDATE revisions SET input_json = ?, fingerprint = ? WHERE check_id = ?")
      .run(JSON.stringify(edited), fingerprint(edited, row.v), id);
    const [rev] = store.getCheck(id).revisions;
    expect(rev.intact).toBe(true);
    expect(rev.signoffs.map((s) => s.valid)).toEqual([false, false, false]);
    expect(rev.state).toBe("draft");
  });

  it("attack — a sign-off's name edited in the file: its signature fails and the state drops back", async () => {
    const { store, id } = await approved();
    store.db.exec("DROP TRIGGER signoffs_immutable_update");
    store.db.prepare("UPDATE signoffs SET name = 'Someone Senior' WHERE role = 'approved'").run();
    const [rev] = store.getCheck(id).revisions;
    expect(rev.signoffs.map((s) => [s.role, s.valid])).toEqual([
      ["prepared", true],
      ["checked", true],
      ["approved", false],
    ]);
    expect(rev.state).toBe("checked");
  });
});
