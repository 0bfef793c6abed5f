import Database from "better-sqlite3";
import { describe, expect, it } from "vitest";
import { openSqliteStore as openStore } from "../../src/store/index.ts";
import { fakeValidate, sampleInput, tempDbPath } from "./helpers.ts";
import { startSaver } from "./processes.ts";

describe("a writer killed mid-burst", () => {
  it("loses no committed revision and leaves an intact database", async () => {
    const path = tempDbPath();
    const setup = openStore({ path, validate: fakeValidate });
    const { id } = await setup.createCheck({ input: sampleInput(), calcNumber: "HW-CRASH" });
    await setup.close();

    // Far more saves than it gets to make: the kill always lands mid-burst.
    const saver = startSaver({ path }, id, 1_000_000, "burst");
    await saver.linesSeen(150);
    saver.child.kill("SIGKILL");
    const exit = await saver.exited;
    expect(exit.signal).toBe("SIGKILL");

    const reported = [...saver.committed];
    expect(reported.length).toBeGreaterThanOrEqual(150);

    // Opened the way the program opens it, after a raw look at the file's integrity.
    const raw = new Database(path);
    expect(raw.pragma("integrity_check", { simple: true })).toBe("ok");
    expect(raw.pragma("foreign_key_check")).toEqual([]);
    raw.close();

    const store = openStore({ path, validate: fakeValidate });
    const numbers = (await store.getCheck(id)).revisions.map((r) => r.number);
    for (const n of reported) expect(numbers).toContain(n);
    // No gaps: whatever the child committed beyond what it printed is still consecutive.
    expect(numbers).toEqual(Array.from({ length: numbers.length }, (_, i) => i + 1));
    expect(numbers.length).toBeGreaterThanOrEqual(Math.max(...reported));
    await store.close();
  }, 60_000);
});
