import { expect, it } from "vitest";
import { fakeValidate, onEachBackend, sampleInput } from "./helpers.ts";
import { startSaver } from "./processes.ts";

onEachBackend("concurrent saves to one check", (b) => {
  it("give consecutive revision numbers with no gaps or duplicates across processes", async () => {
    const place = await b.place();
    const setup = await b.store({ place, validate: fakeValidate });
    const { id } = await setup.createCheck({ input: sampleInput(), calcNumber: "HW-RACE" });

    const PROCESSES = 4;
    const EACH = 25;
    const savers = Array.from({ length: PROCESSES }, (_, i) => startSaver(place, id, EACH, `writer-${i}`, true));
    // Every child has opened the database before any starts writing, so the saves really overlap.
    await Promise.all(savers.map((s) => s.linesSeen(1)));
    for (const s of savers) s.child.stdin.end("go\n");
    const exits = await Promise.all(savers.map((s) => s.exited));
    for (const e of exits) expect(e).toMatchObject({ code: 0, stderr: "" });

    const reported = savers.flatMap((s) => s.committed).sort((a, b) => a - b);
    const expected = Array.from({ length: PROCESSES * EACH }, (_, i) => i + 2);
    expect(reported).toEqual(expected);
    // Each process saw its own numbers rise: a later commit never got an earlier number.
    for (const s of savers) expect(s.committed).toEqual([...s.committed].sort((a, b) => a - b));

    const check = await setup.getCheck(id);
    expect(check.revisions.map((r) => r.number)).toEqual([1, ...expected]);
    expect(check.revisions.filter((r) => r.state !== "superseded").map((r) => r.number)).toEqual([PROCESSES * EACH + 1]);
    expect(check.events.filter((e) => e.kind === "superseded")).toHaveLength(PROCESSES * EACH);
  }, 60_000);
});
