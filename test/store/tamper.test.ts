import { expect, it } from "vitest";
import { onEachBackend, PEOPLE, registerPeople, sampleInput, type Backend } from "./helpers.ts";

/**
 * Attack: someone with the database edits an approved revision outside Hoopwise (the triggers
 * that refuse edits are dropped first, as anyone holding the file or the database owner's
 * login can do).
 */
onEachBackend("a database edited outside the tool", (b) => {
  async function approved(b: Backend) {
    const store = await b.store();
    const people = await registerPeople(store);
    const { id } = await store.createCheck({ input: sampleInput() });
    for (const [role, who] of [
      ["prepared", "ana"],
      ["checked", "bo"],
      ["approved", "cy"],
    ] as const) {
      await store.signOff(id, { revision: 1, role, passphrase: PEOPLE[who].passphrase }, people[who], "test");
    }
    expect((await store.getCheck(id)).revisions[0].state).toBe("approved");
    return { store, id };
  }

  it("attack — stored input edited: the fingerprint recomputed on read no longer matches, the revision is not intact and counts no sign-off", async () => {
    const { store, id } = await approved(b);
    await b.dropTrigger(store, "revisions_immutable_update", "revisions");
    const row = await store.sql.get<{ j: string }>("SELECT input_json AS j FROM revisions WHERE check_id = ?", id);
    const edited = JSON.parse(row?.j ?? "") as { shell: { thickness_mm: number } };
    edited.shell.thickness_mm = 3.2;
    await store.sql.run("UPDATE revisions SET input_json = ? WHERE check_id = ?", JSON.stringify(edited), id);
    const [rev] = (await store.getCheck(id)).revisions;
    expect(rev).toMatchObject({ intact: false, state: "draft" });
    expect((await store.listChecks())[0]).toMatchObject({ intact: false, state: "draft" });
  });

  it("attack — input and fingerprint edited together: the sign-off signatures no longer hold, so none counts", async () => {
    const { store, id } = await approved(b);
    await b.dropTrigger(store, "revisions_immutable_update", "revisions");
    const { fingerprint } = await import("../../src/engine/fingerprint.ts");
    const row = await store.sql.get<{ j: string; v: string }>(
      "SELECT input_json AS j, engine_version AS v FROM revisions WHERE check_id = ?",
      id,
    );
    const edited = JSON.parse(row?.j ?? "") as { shell: { thickness_mm: number } };
    edited.shell.thickness_mm = 3.2;
    await store.sql.run(
      "UPDATE revisions SET input_json = ?, fingerprint = ? WHERE check_id = ?",
      JSON.stringify(edited),
      fingerprint(edited, row?.v ?? ""),
      id,
    );
    const [rev] = (await store.getCheck(id)).revisions;
    expect(rev.intact).toBe(true);
    expect(rev.signoffs.map((s) => s.valid)).toEqual([false, false, false]);
    expect(rev.state).toBe("draft");
  });

  it("attack — a sign-off's name edited in the database: its signature fails and the state drops back", async () => {
    const { store, id } = await approved(b);
    await b.dropTrigger(store, "signoffs_immutable_update", "signoffs");
    await store.sql.run("UPDATE signoffs SET name = 'Someone Senior' WHERE role = 'approved'");
    const [rev] = (await store.getCheck(id)).revisions;
    expect(rev.signoffs.map((s) => [s.role, s.valid])).toEqual([
      ["prepared", true],
      ["checked", true],
      ["approved", false],
    ]);
    expect(rev.state).toBe("checked");
  });
});
