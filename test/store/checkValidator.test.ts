import { expect, it } from "vitest";
import { checkDocument } from "../../src/engine/index.ts";
import { DEMOS } from "../../src/demo/index.ts";
import { InvalidRecordError } from "../../src/store/index.ts";
import { onEachBackend, type Backend } from "./helpers.ts";

// These tests use the real schema (the store's default validator) rather than the stand-in.
function realStore(b: Backend) {
  return b.store({ validate: undefined });
}

onEachBackend("the store with the real check schema", (b) => {
  it("gives each saved demo the fingerprint its sheet prints, and takes its title and number", async () => {
    const store = await realStore(b);
    for (const demo of DEMOS) {
      const outcome = checkDocument(demo.document);
      if (!outcome.ok) throw new Error(`demo ${demo.id} should be valid`);
      const created = await store.createCheck({ input: demo.document });
      expect(created.fingerprint).toBe(outcome.result.fingerprint);
      expect(created).toMatchObject({ title: demo.document.title, calcNumber: demo.document.calcNumber });
    }
  });

  it("keeps a library material by its id, with the defaults the schema filled in", async () => {
    const store = await realStore(b);
    const cabin = DEMOS[0].document;
    const { id } = await store.createCheck({ input: cabin });
    const saved = (await store.getCheck(id)).revisions[0].input as Record<string, unknown>;
    expect(saved.material).toEqual(cabin.material);
    expect((await store.addRevision(id, { input: saved })).unchanged).toBe(true);
  });

  it("names a bad field of the check under input.", async () => {
    const store = await realStore(b);
    const broken = { ...DEMOS[0].document, shell: { ...DEMOS[0].document.shell, thickness_mm: -1 } };
    const err = await store.createCheck({ input: broken }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(InvalidRecordError);
    expect((err as InvalidRecordError).errors.map((e) => e.path)).toContain("input.shell.thickness_mm");
  });

  it("imports an exported demo with every revision re-validated by the schema", async () => {
    const store = await realStore(b);
    const { id } = await store.createCheck({ input: DEMOS[1].document });
    await store.addRevision(id, { input: { ...DEMOS[1].document, shell: { ...DEMOS[1].document.shell, thickness_mm: 6 } } });
    const doc = JSON.parse(JSON.stringify(await store.exportCheck(id))) as unknown;
    const admin = { id: 1, name: "Importing Admin", role: "admin" as const };
    expect(await (await realStore(b)).importCheck(doc, admin)).toMatchObject({ id, revisions: 2, signed: false });
  });
});
