import { describe, expect, it } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import { checkDocument, type CheckResult } from "../../src/engine/index.ts";

function run(doc: unknown): CheckResult {
  const out = checkDocument(doc);
  if (!out.ok) throw new Error(JSON.stringify(out.errors));
  return out.result;
}

/** A steel shell with no opening at a stress well below its endurance limit: an unlimited life. */
const unlimited = {
  format: "hoopwise.check/1",
  shell: { form: "cylinder", radius_mm: 500, radiusAt: "mean", thickness_mm: 10, theory: "thin" },
  pressure: { max_MPa: 1, min_MPa: 0 },
  material: {
    name: "steel plate, test values",
    family: "steel",
    ultimate_MPa: 400,
    yield_MPa: 250,
    modulus_MPa: 200000,
    fatigueStrengthCoefficient_MPa: 700,
    fatigueStrengthExponent: -0.09,
    enduranceLimit_MPa: 150,
  },
  fatigue: { meanStress: "goodman", designLife_cycles: 1e5, scatterFactor: 3 },
};

describe("a reserve for every check", () => {
  it("an unlimited fatigue life shows its reserve on stress against the endurance limit", () => {
    const r = run(unlimited);
    expect(r.fatigue.life_cycles).toBeNull();
    const row = r.verdictTable.find((x) => x.id === "fatigue");
    // Hand calculation: σθ = p·r/t = 1 × 500/10 = 50 MPa (Roark Ch. 13, thin wall), plain skin Kt = 1,
    // σa = σm = 25 MPa, Goodman σar = 25/(1 − 25/400) = 26.667 MPa (Shigley Table 6-6); no Marin factors
    // were asked for, so the reserve is Se/σar − 1 = 150/26.667 − 1 = 4.625.
    expect(row?.margin).toBeCloseTo(150 / (25 / (1 - 25 / 400)) - 1, 6);
    expect(row?.detail).toContain("the reserve is on stress");
  });

  it("a crack row that passes by inspection with no practical minimum interval shows its reserve on crack size", () => {
    const r = run(DEMOS[0].document);
    const row = r.verdictTable.find((x) => x.id === "crack");
    const c = r.crack;
    if (!row || !c) throw new Error("the cabin demo has a crack row");
    expect(row.status).toBe("pass");
    // The demo's detectable size is the typical surface eddy-current size, 0.1 in = 2.54 mm (common practice); the
    // row's reserve is how far it stands below the critical size: a_crit/a_det − 1, positive while inspection can find it.
    expect(c.detectable_mm).toBe(2.54);
    expect(row.margin).toBeCloseTo(c.critical_mm / 2.54 - 1, 12);
    expect(row.margin).toBeGreaterThan(0);
    expect(row.detail).toContain("the reserve is on crack size");
    // Given a practical minimum, the reserve is the repeat interval over it instead.
    const doc = DEMOS[0].document as { crack: Record<string, unknown> };
    const timed = run({ ...doc, crack: { ...doc.crack, minimumInterval_cycles: 3000 } });
    const timedRow = timed.verdictTable.find((x) => x.id === "crack");
    expect(timedRow?.margin).toBeCloseTo((timed.crack?.repeatInterval_cycles ?? 0) / 3000 - 1, 12);
    expect(timedRow?.detail).not.toContain("crack size");
  });

  it("the opening row's reserve is its curvature range over β: negative where the cabin demo refers", () => {
    const r = run(DEMOS[0].document);
    const row = r.verdictTable.find((x) => x.id === "opening");
    const c = r.notch.opening?.curvature;
    if (!row || !c) throw new Error("the cabin demo has an opening row");
    // The window's half-width over √(R t) is 115/√(1150 × 1) = 3.39 (hand calculation): far beyond a small-curvature
    // limit of order 0.5 (from memory), so the reserve must be negative.
    expect(c.beta).toBeGreaterThan(3);
    expect(row.margin).toBeCloseTo(0.5 / c.beta - 1, 12);
    expect(row.margin).toBeLessThan(0);
  });
});
