import { describe, expect, it } from "vitest";
import { findDemo } from "../../src/demo/index.ts";
import { diffInputs, flatten, unitOf } from "../../src/present/revisions/diff.ts";
import { relativeChange, workRevision } from "../../src/present/revisions/figures.ts";

const receiver = findDemo("receiver")!.document;

describe("the input difference", () => {
  it("flattens nested objects and lists of objects to dot paths, and keeps a list of plain values whole", () => {
    const flat = flatten({
      shell: { thickness_mm: 5 },
      pressure: { blocks: [{ cycles: 300 }, { cycles: 20 }] },
      evidence: { lives_cycles: [1, 2] },
    });
    expect([...flat.entries()]).toEqual([
      ["shell.thickness_mm", 5],
      ["pressure.blocks.0.cycles", 300],
      ["pressure.blocks.1.cycles", 20],
      ["evidence.lives_cycles", [1, 2]],
    ]);
  });

  it("reports changed, added and removed keys with the unit their names carry", () => {
    const after = {
      ...receiver,
      shell: { ...receiver.shell, thickness_mm: 6 },
      pressure: { blocks: [receiver.pressure.blocks![0]] },
      evidence: { lives_cycles: [52000, 61000] },
    };
    const { changes, more } = diffInputs(receiver, after);
    expect(more).toBe(0);
    expect(changes).toEqual([
      // Each number input carries the label the form and the sheet show (the schema's words for it).
      { path: "shell.thickness_mm", kind: "changed", before: 5, after: 6, unit: "mm", label: "Wall thickness" },
      { path: "pressure.blocks.1.max_MPa", kind: "removed", before: 1.1, unit: "MPa", label: "Block's maximum pressure" },
      { path: "pressure.blocks.1.min_MPa", kind: "removed", before: 0.8, unit: "MPa", label: "Block's minimum pressure" },
      { path: "pressure.blocks.1.cycles", kind: "removed", before: 20000, unit: "cycles", label: "Block's cycle count" },
      { path: "evidence.lives_cycles", kind: "added", after: [52000, 61000], unit: "cycles" },
    ]);
  });

  it("compares a long pressure history as one entry, however many points it has", () => {
    const history: number[] = Array.from({ length: 50_000 }, (_, i) => (i % 2 ? 0.06 : 0));
    const changed = [...history];
    changed[49_999] = 0.07;
    const { changes } = diffInputs({ pressure: { history_MPa: history } }, { pressure: { history_MPa: changed } });
    expect(changes.map((c) => [c.path, c.kind, c.unit])).toEqual([["pressure.history_MPa", "changed", "MPa"]]);
  });

  it("reads units from key names, and none from a name without one", () => {
    expect(unitOf("crack.toughness_MPaSqrtM")).toBe("MPa·√m");
    expect(unitOf("pressure.fromAltitude.cabin_m")).toBe("m");
    expect(unitOf("fatigue.scatterFactor")).toBeUndefined();
  });
});

describe("the result figures of a revision", () => {
  it("works a saved input out again and reports a thicker shell's lower hoop stress", () => {
    const thin = workRevision(receiver);
    const thick = workRevision({ ...receiver, shell: { ...receiver.shell, thickness_mm: 10 } });
    if (!thin.ok || !thick.ok) throw new Error("the demo must work out");
    const hoop = (w: typeof thin) => (w.ok ? w.figures.find((f) => f.id === "hoop")!.value : undefined);
    // Thin-wall hoop stress p·r/t on the analysis wall t − c − δ (c = 1, δ = 0.3 mm in the demo): 3.7 → 8.7 mm,
    // so the hoop stress falls by about 1 − 3.7/8.7 = 57 % (the mean radius moves a little).
    expect(relativeChange(hoop(thin), hoop(thick))).toBeCloseTo(3.7 / 8.7 - 1, 1);
    expect(thin.figures.find((f) => f.id === "bound")!.value).toBeUndefined();
  });

  it("gives the engine's messages for an input it cannot work out", () => {
    const w = workRevision({ ...receiver, shell: { ...receiver.shell, thickness_mm: -1 } });
    expect(w.ok).toBe(false);
    expect(!w.ok && w.errors.map((e) => e.path)).toContain("shell.thickness_mm");
  });
});
