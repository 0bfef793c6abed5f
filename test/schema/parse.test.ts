import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parseCheck } from "../../src/engine/input.ts";
import { fingerprint } from "../../src/engine/fingerprint.ts";

const example = JSON.parse(readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8"));
const clone = () => structuredClone(example);
const errorsOf = (doc: unknown) => {
  const r = parseCheck(doc);
  if (r.ok) throw new Error("expected errors");
  return r.errors;
};

describe("check format parsing", () => {
  it("accepts the format's own example and fills the defaults", () => {
    const r = parseCheck(example);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.fatigue.scatterFactor).toBe(3);
    expect(r.value.document.static).toBeUndefined();
    expect(r.value.static.basis).toBe("yield");
    expect(r.value.crack?.cracksAtHole).toBe(2);
  });

  it("names the field and says what is wrong: wrong type, missing, out of range", () => {
    const doc = clone();
    doc.shell.thickness_mm = "thick";
    delete doc.shell.radius_mm;
    doc.fatigue.designLife_cycles = -5;
    const errs = errorsOf(doc);
    expect(errs).toContainEqual({ path: "shell.thickness_mm", message: "the wall thickness must be a number" });
    expect(errs).toContainEqual({ path: "shell.radius_mm", message: "is required" });
    expect(errs).toContainEqual({ path: "fatigue.designLife_cycles", message: "the design life must be greater than 0" });
  });

  it("refuses a radius too small for its wall", () => {
    const doc = clone();
    doc.shell = { form: "cylinder", radius_mm: 5, radiusAt: "outer", thickness_mm: 6 };
    expect(errorsOf(doc)[0]).toMatchObject({ path: "shell.radius_mm", message: expect.stringMatching(/too small for its wall/) });
  });

  it("refuses a positive Basquin exponent with the reason", () => {
    const doc = clone();
    doc.material.fatigueStrengthExponent = 0.1;
    expect(errorsOf(doc)[0]).toMatchObject({
      path: "material.fatigueStrengthExponent",
      message: expect.stringMatching(/must be negative/),
    });
  });

  it("refuses unknown names: fields, enums, library ids, cutout kinds", () => {
    const doc = clone();
    doc.shell.thicknes_mm = 2;
    doc.fatigue.meanStress = "goodmann";
    doc.cutout = { kind: "square" };
    const errs = errorsOf(doc);
    expect(errs.map((e) => e.path)).toEqual(expect.arrayContaining(["shell.thicknes_mm", "fatigue.meanStress", "cutout.kind"]));
    const lib = clone();
    lib.material = { id: "unobtainium" };
    expect(errorsOf(lib)[0]).toMatchObject({ path: "material.id", message: expect.stringMatching(/unknown material "unobtainium"/) });
  });

  it("asks for the crack's material data when a crack is given", () => {
    const doc = clone();
    delete doc.material.parisC;
    expect(errorsOf(doc)).toContainEqual({
      path: "material.parisC",
      message: "the Paris coefficient C is required because a crack is given",
    });
  });

  it("takes exactly one way of giving the pressure", () => {
    const doc = clone();
    doc.pressure = { max_MPa: 0.06, blocks: [{ max_MPa: 0.06, cycles: 10 }] };
    expect(errorsOf(doc)[0].path).toBe("pressure");
    const none = clone();
    none.pressure = {};
    expect(errorsOf(none)[0].message).toMatch(/give the pressure one way/);
  });

  it("reliability outside (0, 1) and an empty history are field errors", () => {
    const doc = clone();
    doc.evidence.reliability = 1;
    expect(errorsOf(doc)).toContainEqual({ path: "evidence.reliability", message: "the reliability must be between 0 and 1 (exclusive)" });
    const h = clone();
    h.pressure = { history_MPa: [] };
    expect(errorsOf(h)[0]).toMatchObject({ path: "pressure.history_MPa" });
  });

  it("library materials take overrides beside their id", () => {
    const doc = clone();
    doc.material = { id: "al-2024-t3", yield_MPa: 300 };
    const r = parseCheck(doc);
    expect(r.ok && r.value.material.yield_MPa).toBe(300);
    expect(r.ok && r.value.material.ultimate_MPa).toBe(483);
  });

  it("the fingerprint ignores key order and explicit defaults", () => {
    const a = parseCheck(example);
    const reordered = JSON.parse(JSON.stringify({ fatigue: example.fatigue, ...example }));
    const withDefaults = clone();
    withDefaults.cutout = { kind: "circular-hole" };
    withDefaults.crack.cracksAtHole = 2;
    const b = parseCheck(reordered);
    const c = parseCheck(withDefaults);
    if (!a.ok || !b.ok || !c.ok) throw new Error("parse failed");
    expect(fingerprint(b.value.document)).toBe(fingerprint(a.value.document));
    expect(fingerprint(c.value.document)).toBe(fingerprint(a.value.document));
    expect(fingerprint(a.value.document)).toMatch(/^[0-9a-f]{64}$/);
  });
});
