import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { fingerprint } from "../../src/engine/fingerprint.ts";
import { InvalidRecordError, RecordConflictError, RecordNotFoundError } from "../../src/store/index.ts";
import { fakeValidate, sampleInput, tempDbPath, testStore } from "./helpers.ts";

/** The value the store keeps: the validator's normalized output. */
function normalized(input: unknown): unknown {
  const r = fakeValidate(input);
  if (!r.ok) throw new Error("sample input should be valid");
  return r.value;
}

describe("saving checks and revisions", () => {
  it("creates a check as revision 1, fingerprinted from the normalized input and the engine version", () => {
    const store = testStore({ engineVersion: "test-engine/1" });
    const created = store.createCheck({ input: sampleInput(), calcNumber: "HW-2030-001", savedBy: "Ana Brightwater" });
    expect(created.revision).toBe(1);
    expect(created.fingerprint).toBe(fingerprint(normalized(sampleInput()), "test-engine/1"));
    expect(created.title).toBe("Bay 7 skin panel (invented example)");

    const check = store.getCheck(created.id);
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

  it("numbers new revisions consecutively and marks the older ones superseded", () => {
    const store = testStore();
    const { id } = store.createCheck({ input: sampleInput(1.6) });
    const second = store.addRevision(id, { input: sampleInput(1.8) });
    const third = store.addRevision(id, { input: sampleInput(2.0) });
    expect([second.revision, third.revision]).toEqual([2, 3]);
    expect([second.unchanged, third.unchanged]).toEqual([false, false]);
    expect(second.fingerprint).not.toBe(third.fingerprint);

    const check = store.getCheck(id);
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

  it("answers an unchanged input with the latest revision and saves nothing", () => {
    const store = testStore();
    const { id, fingerprint: fp } = store.createCheck({ input: sampleInput() });
    const again = store.addRevision(id, { input: sampleInput() });
    expect(again).toEqual({ revision: 1, fingerprint: fp, unchanged: true });
    expect(store.getCheck(id).revisions).toHaveLength(1);
    expect(store.getCheck(id).events).toHaveLength(1);
  });

  it("treats an input that only spells out a default as unchanged", () => {
    const store = testStore();
    const { id } = store.createCheck({ input: sampleInput() });
    const explicit = sampleInput();
    explicit.shell = { ...(explicit.shell as object), radiusAt: "mean" };
    expect(store.addRevision(id, { input: explicit }).unchanged).toBe(true);
  });

  it("sees no change in an input whose keys come in another order (property)", () => {
    const store = testStore();
    const { id } = store.createCheck({ input: sampleInput() });
    const base = sampleInput();
    const shell = base.shell as Record<string, unknown>;
    const reordered = (o: Record<string, unknown>, keys: string[]) => Object.fromEntries(keys.map((k) => [k, o[k]]));
    const permutation = (o: Record<string, unknown>) => fc.shuffledSubarray(Object.keys(o), { minLength: Object.keys(o).length });
    fc.assert(
      fc.property(permutation(base), permutation(shell), (outer, inner) => {
        const saved = store.addRevision(id, { input: { ...reordered(base, outer), shell: reordered(shell, inner) } });
        return saved.unchanged && saved.revision === 1;
      }),
      { numRuns: 30 },
    );
  });

  it("saves the same input again as a new revision when the engine version changed, since its sheet would differ", () => {
    const path = tempDbPath();
    const { id } = testStore({ path, engineVersion: "test-engine/1" }).createCheck({ input: sampleInput() });
    const later = testStore({ path, engineVersion: "test-engine/2" }).addRevision(id, { input: sampleInput() });
    expect(later).toMatchObject({ revision: 2, unchanged: false });
  });

  it("takes the title and calculation number from the input when the request gives none", () => {
    const store = testStore();
    const fromInput = store.createCheck({ input: { ...sampleInput(1.6, "Receiver shell, invented"), calcNumber: "RX-12" } });
    expect(fromInput).toMatchObject({ title: "Receiver shell, invented", calcNumber: "RX-12" });
    const given = store.createCheck({ input: { ...sampleInput(), calcNumber: "GIVEN-1" }, title: "Given title", calcNumber: "GIVEN-1" });
    expect(given).toMatchObject({ title: "Given title", calcNumber: "GIVEN-1" });
  });

  // The sheet prints the record's number, so a number the records cannot keep is never quietly replaced.
  it("refuses two different numbers in one request, a malformed input number, and a revision that changes the number", () => {
    const store = testStore();
    const two = catchError(() => store.createCheck({ input: { ...sampleInput(), calcNumber: "RX-13" }, calcNumber: "GIVEN-1" }));
    expect((two as InvalidRecordError).errors).toEqual([
      { path: "calcNumber", message: expect.stringMatching(/differs from the input's calculation number "RX-13"/) },
    ]);
    const odd = catchError(() => store.createCheck({ input: { ...sampleInput(), calcNumber: "-starts with a dash" } }));
    expect((odd as InvalidRecordError).errors[0]).toMatchObject({
      path: "input.calcNumber",
      message: expect.stringMatching(/must start with a letter or digit/),
    });
    const { id } = store.createCheck({ input: { ...sampleInput(), calcNumber: "RX-14" } });
    const moved = catchError(() => store.addRevision(id, { input: { ...sampleInput(2), calcNumber: "RX-15" } }));
    expect((moved as InvalidRecordError).errors[0]).toMatchObject({
      path: "input.calcNumber",
      message: expect.stringMatching(/this check's calculation number is "RX-14"/),
    });
    expect(store.listChecks().map((c) => c.calcNumber)).toEqual(["RX-14"]);
  });

  it("generates a calculation number, and a title, when neither request nor input has one", () => {
    const store = testStore();
    const created = store.createCheck({ input: sampleInput() });
    expect(created.calcNumber).toBe(`HW-${created.id.slice(0, 8).toUpperCase()}`);
    expect(store.createCheck({ input: { ...sampleInput(), title: undefined } }).title).toBe("Untitled check");
  });

  it("refuses a calculation number another check already uses", () => {
    const store = testStore();
    store.createCheck({ input: sampleInput(), calcNumber: "HW-7" });
    const err = catchError(() => store.createCheck({ input: sampleInput(2), calcNumber: "HW-7" }));
    expect(err).toBeInstanceOf(RecordConflictError);
    expect((err as RecordConflictError).errors[0].path).toBe("calcNumber");
    // A number taken from the document is named where it came from.
    const fromInput = catchError(() => store.createCheck({ input: { ...sampleInput(2), calcNumber: "HW-7" } }));
    expect((fromInput as RecordConflictError).errors[0].path).toBe("input.calcNumber");
    expect(store.listChecks()).toHaveLength(1);
  });

  it("reports every bad field at once, the input's under input.", () => {
    const store = testStore();
    const err = catchError(() => store.createCheck({ input: { shell: { thickness_mm: -1 } }, title: "  ", calcNumber: "#1" }));
    expect(err).toBeInstanceOf(InvalidRecordError);
    expect((err as InvalidRecordError).errors.map((e) => e.path).sort()).toEqual(["calcNumber", "input.shell.thickness_mm", "title"]);
    expect(store.listChecks()).toEqual([]);
  });

  it("says the input is required when it is missing", () => {
    const store = testStore();
    const err = catchError(() => store.createCheck({ input: undefined }));
    expect((err as InvalidRecordError).errors).toEqual([{ path: "input", message: expect.stringMatching(/required/) }]);
  });

  it("refuses a revision of a check that does not exist", () => {
    const store = testStore();
    const err = catchError(() => store.addRevision("no-such-check", { input: sampleInput() }));
    expect(err).toBeInstanceOf(RecordNotFoundError);
  });

  it("lists checks with their latest revision and its state, the most recently saved first", () => {
    let clock = Date.parse("2030-03-01T08:00:00.000Z");
    const store = testStore({ now: () => new Date((clock += 60_000)) });
    const a = store.createCheck({ input: sampleInput(), calcNumber: "HW-A", title: "Older" });
    store.createCheck({ input: sampleInput(), calcNumber: "HW-B", title: "Newer" });
    store.addRevision(a.id, { input: sampleInput(2.2) });
    expect(store.listChecks().map((c) => [c.calcNumber, c.title, c.latestRevision, c.state])).toEqual([
      ["HW-A", "Older", 2, "draft"],
      ["HW-B", "Newer", 1, "draft"],
    ]);
  });

  it("gives the sheet a revision with its check and sign-offs", () => {
    const store = testStore();
    const { id } = store.createCheck({ input: sampleInput(), calcNumber: "HW-S" });
    store.addRevision(id, { input: sampleInput(1.9) });
    const sheet = store.getSheetRevision(id, 1);
    expect(sheet.check).toMatchObject({ id, calcNumber: "HW-S" });
    expect(sheet.latestRevision).toBe(2);
    expect(sheet.revision).toMatchObject({ number: 1, state: "superseded", signoffs: [] });
    expect(catchError(() => store.getSheetRevision(id, 3))).toBeInstanceOf(RecordNotFoundError);
  });
});

function catchError(f: () => unknown): unknown {
  try {
    f();
  } catch (err) {
    return err;
  }
  throw new Error("expected an error");
}
