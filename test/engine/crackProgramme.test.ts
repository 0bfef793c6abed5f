import { describe, expect, it } from "vitest";
import { checkDocument, type CheckResult } from "../../src/engine/index.ts";
import { TYPICAL_DETECTABLE_MM } from "../../src/materials/inspection.ts";

// An invented aluminium barrel skin, hoop stress 0.06 × 1500 / 1.6 = 56.25 MPa (thin wall).
const doc = (crack: Record<string, unknown>, extra: Record<string, unknown> = {}) => ({
  format: "hoopwise.check/1",
  shell: { form: "cylinder", radius_mm: 1500, thickness_mm: 1.6 },
  pressure: { max_MPa: 0.06 },
  material: { id: "al-2024-t3" },
  fatigue: { designLife_cycles: 60000, scatterFactor: 3 },
  crack: { geometry: "center-through", initial_mm: 1, ...crack },
  ...extra,
});

function run(d: unknown): CheckResult {
  const o = checkDocument(d);
  if (!o.ok) throw new Error(JSON.stringify(o.errors));
  return o.result;
}
const row = (r: CheckResult, id: string) => r.verdictTable.find((x) => x.id === id);

describe("orientations", () => {
  it("grows the axial crack alone by default, both when an axial extra stress is given", () => {
    const plain = run(doc({}));
    expect(plain.crack?.orientation).toBe("axial");
    expect(plain.crack?.orientations).toHaveLength(1);
    const both = run(doc({}, { axialExtra: { max_MPa: 10, min_MPa: 0 } }));
    expect(both.crack?.orientation).toBe("both");
    expect(both.crack?.orientations.map((o) => o.orientation)).toEqual(["axial", "circumferential"]);
  });

  it("lets the circumferential crack govern when the axial stress outgrows the hoop stress", () => {
    // Axial: 28.1 membrane + 60 extra = 88 MPa against 56 MPa hoop: the circumferential crack has the shorter life.
    const r = run(doc({}, { axialExtra: { max_MPa: 60, min_MPa: 0 } }));
    expect(r.crack?.governingOrientation).toBe("circumferential");
    const [ax, circ] = r.crack!.orientations;
    expect(circ.cycles ?? Infinity).toBeLessThan(ax.cycles ?? 0);
    expect(r.crack?.cycles).toBe(circ.cycles);
    expect(r.steps.find((s) => s.id === "crack-governs")?.title).toContain("circumferential");
  });
});

describe("inspection programme and the crack verdict", () => {
  it("separates the threshold (initial flaw) from the repeat interval (detectable size)", () => {
    const r = run(doc({ detectable_mm: 5 }));
    const c = r.crack!;
    expect(c.threshold_cycles).toBeCloseTo((c.cycles ?? 0) / 2, 6);
    expect(c.repeatInterval_cycles ?? Infinity).toBeLessThan(c.threshold_cycles ?? 0);
    expect(c.inspectionInterval_cycles).toBe(c.repeatInterval_cycles);
  });

  it("fails when the threshold is short and no repeat interval is possible", () => {
    // A low toughness and a fast Paris law make the threshold short of 60 000 cycles.
    const fast = { material: { id: "al-2024-t3", parisC: 5e-10, toughness_MPaSqrtM: 40 } };
    const none = run(doc({}, fast));
    expect(none.crack!.threshold_cycles ?? Infinity).toBeLessThan(60000);
    expect(row(none, "crack")?.status).toBe("fail");
    expect(none.verdict).toBe("fail");
    const tooBig = run(doc({ detectable_mm: 200 }, fast));
    expect(tooBig.crack?.repeatInterval_cycles).toBe(0);
    expect(row(tooBig, "crack")?.status).toBe("fail");
    const ok = run(doc({ detectable_mm: 3 }, fast));
    expect(row(ok, "crack")?.status).toBe("pass");
    const minimum = run(doc({ detectable_mm: 3, minimumInterval_cycles: 1e7 }, fast));
    expect(row(minimum, "crack")?.status).toBe("fail");
  });

  it("lets leak before break decide when asked", () => {
    const fast = { material: { id: "al-2024-t3", parisC: 5e-10, toughness_MPaSqrtM: 40 } };
    const r = run(doc({ leakBeforeBreak: "decide" }, fast));
    expect(r.crack?.leakBeforeBreak?.leakBeforeBreak).toBe(true);
    expect(row(r, "crack")?.status).toBe("pass");
    expect(row(r, "leak-before-break")?.status).toBe("pass");
  });

  it("offers typical detectable sizes by method, marked typical", () => {
    const r = run(doc({ detectableBy: "detailed-visual" }));
    expect(r.crack?.detectable_mm).toBe(TYPICAL_DETECTABLE_MM["detailed-visual"].size_mm);
    expect(r.warnings.some((w) => w.includes("verify it against a qualified inspection procedure"))).toBe(true);
    expect(r.steps.find((s) => s.id === "crack-detectable")?.source).toContain("typical");
  });
});

describe("bulging and the hole", () => {
  it("bulges by default, and switching it off shows a longer critical size with a warning", () => {
    const on = run(doc({}));
    const off = run(doc({ bulging: false }));
    expect(on.crack!.critical_mm).toBeLessThan(off.crack!.critical_mm);
    expect(off.warnings.some((w) => w.includes("unconservative"))).toBe(true);
  });

  it("refuses a crack at the opening with another hole radius than the fatigue check's", () => {
    const o = checkDocument(doc({ geometry: "hole-through", holeRadius_mm: 3 }, { cutout: { kind: "circular-hole", radius_mm: 5 } }));
    expect(o.ok).toBe(false);
    if (!o.ok) expect(o.errors[0].path).toBe("crack.holeRadius_mm");
    // The same radius (or none given) is accepted.
    expect(checkDocument(doc({ geometry: "hole-through" }, { cutout: { kind: "circular-hole", radius_mm: 5 } })).ok).toBe(true);
  });
});

describe("fleet", () => {
  it("needs a scatter, from the evidence or given", () => {
    const o = checkDocument(doc({}, { fleet: { size: 50 } }));
    expect(o.ok).toBe(false);
    if (!o.ok) expect(o.errors[0].path).toBe("fleet.logStdDev");
    const r = run(doc({}, { fleet: { size: 50 }, evidence: { lives_cycles: [400000], assumedLogStdDev: 0.15 } }));
    expect(r.fleet?.firstFailure_cycles).toBeLessThan(400000);
    expect(r.fleet?.basis).toBe("test evidence");
    expect(r.fleet?.statement).toContain("cannot show how long the weakest of 50");
  });

  it("gives no fleet figures for a scatter too small to mean anything", () => {
    const r = run(doc({}, { fleet: { size: 50 }, evidence: { lives_cycles: [400000], assumedLogStdDev: 5e-324 } }));
    expect(r.fleet).toBeUndefined();
    expect(r.warnings.some((w) => w.includes("below 0.001"))).toBe(true);
  });
});
