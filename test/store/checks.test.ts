import fc from "fast-check";
import { expect, it } from "vitest";
import { fingerprint } from "../../src/engine/fingerprint.ts";
import { InvalidRecordError, RecordConflictError, RecordNotFoundError } from "../../src/store/index.ts";
import { fakeValidate, onEachBackend, sampleInput } from "./helpers.ts";

/** The value the store keeps: the validator's normalized output. */
function normalized(input: unknown): unknown {
  const r = fakeValidate(input);
  if (!r.ok) throw new Error("sample input should be valid");
  return r.value;
}

onEachBackend("saving checks and revisions", (b) => {
  it("creates a check as revision 1, fingerprinted from the normalized input and the engine version", async () => {
    const store = await b.store({ engineVersion: "test-engine/1" });
    const created = await store.createCheck({ input: sampleInput(), calcNumber: "HW-2030-001", savedBy: "Ana Brightwater" });
    expect(created.revision).toBe(1);
    expect(created.fingerprint).toBe(fingerprint(normalized(sampleInput()), "test-engine/1"));
    expect(created.title).toBe("Bay 7 skin panel (invented example)");

    const check = await store.getCheck(created.id);
    expect(check.calcNumber).toBe("HW-2030-001");
    expect(check.revisions).toHaveLength(1);
    expect(check.revisions[0]).toMatchObject({
      number: 1,
      fingerprint: created.fingerprint,
      engineVersion: "test-engine/1",
      savedBy: "Ana Brightwater",
      savedAt: "2030-03-01T08:00:00.000Z",
      state: "draft",
      signoffs: [],
    });
    // The stored input is the normalized one: the default the validator filled in is kept.
    expect(check.revisions[0].input).toEqual(normalized(sampleInput()));
    expect(check.events.map((e) => [e.kind, e.revision])).toEqual([["saved", 1]]);
  });

  it("numbers new revisions consecutively and marks the older ones superseded", async () => {
    const store = await b.store();
    const { id } = await store.createCheck({ input: sampleInput(1.6) });
    const second = await store.addRevision(id, { input: sampleInput(1.8) });
    const third = await store.addRevision(id, { input: sampleInput(2.0) });
    expect([second.revision, third.revision]).toEqual([2, 3]);
    expect([second.unchanged, third.unchanged]).toEqual([false, false]);
    expect(second.fingerprint).not.toBe(third.fingerprint);

    const check = await store.getCheck(id);
    expect(check.revisions.map((r) => [r.number, r.state])).toEqual([
      [1, "superseded"],
      [2, "superseded"],
      [3, "draft"],
    ]);
    expect(check.events.filter((e) => e.kind === "superseded").map((e) => [e.revision, e.detail])).toEqual([
      [1, { by: 2 }],
      [2, { by: 3 }],
    ]);
  });

  it("answers an unchanged input with the latest revision and saves nothing", async () => {
    const store = await b.store();
    const { id, fingerprint: fp } = await store.createCheck({ input: sampleInput() });
    const again = await store.addRevision(id, { input: sampleInput() });
    expect(again).toEqual({ revision: 1, fingerprint: fp, unchanged: true });
    expect((await store.getCheck(id)).revisions).toHaveLength(1);
    expect((await store.getCheck(id)).events).toHaveLength(1);
  });

  it("treats an input that only spells out a default as unchanged", async () => {
    const store = await b.store();
    const { id } = await store.createCheck({ input: sampleInput() });
    const explicit = sampleInput();
    explicit.shell = { ...(explicit.shell as object), radiusAt: "mean" };
    expect((await store.addRevision(id, { input: explicit })).unchanged).toBe(true);
  });

  it("sees no change in an input whose keys come in another order (property)", async () => {
    const store = await b.store();
    const { id } = await store.createCheck({ input: sampleInput() });
    const base = sampleInput();
    const shell = base.shell as Record<string, unknown>;
    const reordered = (o: Record<string, unknown>, keys: string[]) => Object.fromEntries(keys.map((k) => [k, o[k]]));
    const permutation = (o: Record<string, unknown>) => fc.shuffledSubarray(Object.keys(o), { minLength: Object.keys(o).length });
    await fc.assert(
      fc.asyncProperty(permutation(base), permutation(shell), async (outer, inner) => {
        const saved = await store.addRevision(id, { input: { ...reordered(base, outer), shell: reordered(shell, inner) } });
        return saved.unchanged && saved.revision === 1;
      }),
      { numRuns: 30 },
    );
  });

  it("saves the same input again as a new revision when the engine version changed, since its sheet would differ", async () => {
    const place = await b.place();
    const { id } = await (await b.store({ place, engineVersion: "test-engine/1" })).createCheck({ input: sampleInput() });
    const later = await (await b.store({ place, engineVersion: "test-engine/2" })).addRevision(id, { input: sampleInput() });
    expect(later).toMatchObject({ revision: 2, unchanged: false });
  });

  it("takes the title and calculation number from the input when the request gives none", async () => {
    const store = await b.store();
    const fromInput = await store.createCheck({ input: { ...sampleInput(1.6, "Receiver shell, invented"), calcNumber: "RX-12" } });
    expect(fromInput).toMatchObject({ title: "Receiver shell, invented", calcNumber: "RX-12" });
    const given = await store.createCheck({
      input: { ...sampleInput(), calcNumber: "GIVEN-1" },
      title: "Given title",
      calcNumber: "GIVEN-1",
    });
    expect(given).toMatchObject({ title: "Given title", calcNumber: "GIVEN-1" });
  });

  // The sheet prints the record's number, so a number the records cannot keep is never quietly replaced.
  it("refuses two different numbers in one request, a malformed input number, and a revision that changes the number", async () => {
    const store = await b.store();
    const two = await catchError(() => store.createCheck({ input: { ...sampleInput(), calcNumber: "RX-13" }, calcNumber: "GIVEN-1" }));
    expect((two as InvalidRecordError).errors).toEqual([
      { path: "calcNumber", message: expect.stringMatching(/differs from the input's calculation number "RX-13"/) },
    ]);
    const odd = await catchError(() => store.createCheck({ input: { ...sampleInput(), calcNumber: "-starts with a dash" } }));
    expect((odd as InvalidRecordError).errors[0]).toMatchObject({
      path: "input.calcNumber",
      message: expect.stringMatching(/must start with a letter or digit/),
    });
    const { id } = await store.createCheck({ input: { ...sampleInput(), calcNumber: "RX-14" } });
    const moved = await catchError(() => store.addRevision(id, { input: { ...sampleInput(2), calcNumber: "RX-15" } }));
    expect((moved as InvalidRecordError).errors[0]).toMatchObject({
      path: "input.calcNumber",
      message: expect.stringMatching(/this check's calculation number is "RX-14"/),
    });
    expect((await store.listChecks()).map((c) => c.calcNumber)).toEqual(["RX-14"]);
  });

  it("generates a calculation number, and a title, when neither request nor input has one", async () => {
    const store = await b.store();
    const created = await store.createCheck({ input: sampleInput() });
    expect(created.calcNumber).toBe(`HW-${created.id.slice(0, 8).toUpperCase()}`);
    expect((await store.createCheck({ input: { ...sampleInput(), title: undefined } })).title).toBe("Untitled check");
  });

  it("refuses a calculation number another check already uses", async () => {
    const store = await b.store();
    await store.createCheck({ input: sampleInput(), calcNumber: "HW-7" });
    const err = await catchError(() => store.createCheck({ input: sampleInput(2), calcNumber: "HW-7" }));
    expect(err).toBeInstanceOf(RecordConflictError);
    expect((err as RecordConflictError).errors[0].path).toBe("calcNumber");
    // A number taken from the document is named where it came from.
    const fromInput = await catchError(() => store.createCheck({ input: { ...sampleInput(2), calcNumber: "HW-7" } }));
    expect((fromInput as RecordConflictError).errors[0].path).toBe("input.calcNumber");
    expect(await store.listChecks()).toHaveLength(1);
  });

  it("reports every bad field at once, the input's under input.", async () => {
    const store = await b.store();
    const err = await catchError(() => store.createCheck({ input: { shell: { thickness_mm: -1 } }, title: "  ", calcNumber: "#1" }));
    expect(err).toBeInstanceOf(InvalidRecordError);
    expect((err as InvalidRecordError).errors.map((e) => e.path).sort()).toEqual(["calcNumber", "input.shell.thickness_mm", "title"]);
    expect(await store.listChecks()).toEqual([]);
  });

  it("says the input is required when it is missing", async () => {
    const store = await b.store();
    const err = await catchError(() => store.createCheck({ input: undefined }));
    expect((err as InvalidRecordError).errors).toEqual([{ path: "input", message: expect.stringMatching(/required/) }]);
  });

  it("refuses a revision of a check that does not exist", async () => {
    const store = await b.store();
    const err = await catchError(() => store.addRevision("no-such-check", { input: sampleInput() }));
    expect(err).toBeInstanceOf(RecordNotFoundError);
  });

  it("lists checks with their latest revision and its state, the most recently saved first", async () => {
    let clock = Date.parse("2030-03-01T08:00:00.000Z");
    const store = await b.store({ now: () => new Date((clock += 60_000)) });
    const a = await store.createCheck({ input: sampleInput(), calcNumber: "HW-A", title: "Older" });
    await store.createCheck({ input: sampleInput(), calcNumber: "HW-B", title: "Newer" });
    await store.addRevision(a.id, { input: sampleInput(2.2) });
    expect((await store.listChecks()).map((c) => [c.calcNumber, c.title, c.latestRevision, c.state])).toEqual([
      ["HW-A", "Older", 2, "draft"],
      ["HW-B", "Newer", 1, "draft"],
    ]);
  });

  it("gives the sheet a revision with its check and sign-offs", async () => {
    const store = await b.store();
    const { id } = await store.createCheck({ input: sampleInput(), calcNumber: "HW-S" });
    await store.addRevision(id, { input: sampleInput(1.9) });
    const sheet = await store.getSheetRevision(id, 1);
    expect(sheet.check).toMatchObject({ id, calcNumber: "HW-S" });
    expect(sheet.latestRevision).toBe(2);
    expect(sheet.revision).toMatchObject({ number: 1, state: "superseded", signoffs: [] });
    expect(await catchError(() => store.getSheetRevision(id, 3))).toBeInstanceOf(RecordNotFoundError);
  });
});

async function catchError(f: () => Promise<unknown>): Promise<unknown> {
  try {
    await f();
  } catch (err) {
    return err;
  }
  throw new Error("expected an error");
}
