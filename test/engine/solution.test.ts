import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { GAUGES_MM, roundUp } from "../../src/engine/gauges.ts";
import { checkDocument } from "../../src/engine/index.ts";
import { base, example, run } from "./exampleRun.ts";

describe("a solved thickness a designer can use", () => {
  it("rounds up to the next gauge of the list (common practice lists)", () => {
    // 0.016 in = 0.4064 mm, 0.040 in = 1.016 mm (25.4 mm per inch)
    expect(roundUp(0.2635, { kind: "list", list: "aircraft-sheet" })).toBeCloseTo(0.4064, 12);
    expect(roundUp(0.95, { kind: "list", list: "aircraft-sheet" })).toBeCloseTo(1.016, 12);
    expect(roundUp(1.016, { kind: "list", list: "aircraft-sheet" })).toBeCloseTo(1.016, 12);
    expect(roundUp(2.237, { kind: "list", list: "vessel-plate" })).toBe(3);
    expect(roundUp(151, { kind: "list", list: "vessel-plate" })).toBe(160); // beyond the list: its last spacing, 10 mm
    expect(roundUp(1.21, { kind: "step", step_mm: 0.1 })).toBeCloseTo(1.3, 12);
    expect(roundUp(2.2, { kind: "user-list", gauges_mm: [1, 2, 2.5, 4] })).toBe(2.5);
    expect(roundUp(1, { kind: "list", list: "vessel-plate" }, 5)).toBe(5); // never below a minimum gauge
    expect(GAUGES_MM["aircraft-sheet"][0]).toBeCloseTo(0.4064, 12);
  });

  it("the solution names the rounded thickness, the required one, and the reserves at the rounded one", () => {
    const r = run(base({ solve: { for: "thickness", gauges_mm: [1.0, 1.2, 1.6, 2.0] } }));
    const s = r.solution!;
    expect(s.thickness_mm).toBeGreaterThanOrEqual(s.requiredThickness_mm!);
    expect([1.0, 1.2, 1.6, 2.0]).toContain(s.thickness_mm);
    const at = run(base({ shell: { ...example.shell, thickness_mm: s.thickness_mm } }));
    expect(s.damageAtThickness).toBeCloseTo(at.fatigue.damage!, 12);
    expect(s.staticMarginAtThickness).toBeCloseTo(at.static.margin, 12);
    expect(r.steps.find((x) => x.id === "solve-thickness-rounded")?.substituted).toMatch(/static margin/);
  });

  it("schema: one way of rounding at a time", () => {
    const out = checkDocument(base({ solve: { for: "thickness", gauges: "vessel-plate", step_mm: 0.5 } }));
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.errors[0].path).toBe("solve.gauges");
  });

  it("property: a solved and rounded thickness always passes the checks it solved", () => {
    const cutouts = fc.constantFrom(
      { kind: "circular-hole" },
      { kind: "elliptical-hole", halfAxisAlongHoop_mm: 40, halfAxisAlongAxial_mm: 20 },
      { kind: "none" },
    );
    const materials = fc.constantFrom(example.material, { id: "steel-4340" }, { id: "al-7075-t6" }, { id: "steel-p265gh" });
    fc.assert(
      fc.property(
        fc.double({ min: 0.02, max: 1.5, noNaN: true }),
        fc.double({ min: 1e3, max: 1e9, noNaN: true }),
        cutouts,
        materials,
        fc.constantFrom(undefined, "aircraft-sheet", "vessel-plate"),
        (p, life, cutout, material, gauges) => {
          const fatigue = { ...example.fatigue, designLife_cycles: life };
          const doc = base({ pressure: { max_MPa: p, min_MPa: 0 }, cutout, material, fatigue });
          const r = run({ ...doc, solve: { for: "thickness", ...(gauges ? { gauges } : {}) } });
          if (r.solution!.governs === "none") return;
          const t = r.solution!.thickness_mm!;
          const at = run({ ...doc, shell: { ...doc.shell, thickness_mm: t } });
          expect(at.verdictTable.find((x) => x.id === "fatigue")!.status).toBe("pass");
          expect(at.verdictTable.find((x) => x.id === "static")!.status).toBe("pass");
        },
      ),
      { numRuns: 60 },
    );
  });
});

describe("one unit for lives", () => {
  it("test lives in cycles are compared with the design life converted from passes", () => {
    // blocks: 10 + 100 = 110 cycles per pass; 20 passes ⇒ 2200 cycles (hand calculation)
    const r = run({
      ...base({
        pressure: {
          blocks: [
            { max_MPa: 0.06, min_MPa: 0, cycles: 10 },
            { max_MPa: 0.06, min_MPa: 0.03, cycles: 100 },
          ],
        },
        fatigue: { ...example.fatigue, designLife_cycles: 20 },
      }),
      evidence: { lives_cycles: [41000, 52000, 47000] },
    });
    expect(r.steps.find((s) => s.id === "evidence-design-cycles")?.value).toBe(2200);
    expect(r.evidence!.designLife_cycles).toBe(2200);
    const row = r.verdictTable.find((x) => x.id === "evidence")!;
    expect(row.detail).toMatch(/2200 cycles \(20 passes\)/);
    expect(row.margin).toBeCloseTo(r.evidence!.lowerBound_cycles! / 2200 - 1, 12);
  });
});

describe("user coupons win over the library's curve", () => {
  // invented coupons on the 2024-T351 line σa = 900(2N)^−0.102 (Dowling Table 14.1, from memory), lives halved
  const coupons = [150, 200, 260, 330].map((a) => ({ amplitude_MPa: a, life_cycles: 0.25 * (a / 900) ** (1 / -0.102) }));

  it("the fit is used although a library material is named; the library's σ'f and b are shown for comparison only", () => {
    const r = run(base({ material: { id: "al-2024-t3", coupons } }));
    // halving every life leaves b and moves σ'f by 2^b: σ'f = 900·2^(−0.102)... exact since the points lie on a line
    expect(r.fatigue.curveUsed.fatigueStrengthExponent).toBeCloseTo(-0.102, 9);
    expect(r.fatigue.curveUsed.fatigueStrengthCoefficient_MPa).toBeCloseTo(900 * 2 ** -0.102, 6);
    expect(r.warnings.join(" ")).toMatch(/library's σ'f = 900 MPa and b = −0.102 .* for comparison only/);
  });

  it("an operating amplitude outside the coupons' range warns", () => {
    // format example: σar = 82.7 MPa (Goodman, hand calculation in check.test.ts), below the lowest coupon (150 MPa)
    const r = run(base({ material: { id: "al-2024-t3", coupons } }));
    expect(r.warnings.join(" ")).toMatch(/outside the range of the coupons that failed \(150–330 MPa\)/);
  });
});

describe("spectra: life-range warnings", () => {
  it("a spectrum whose largest cycles live under 10³ cycles warns, as a single cycle does", () => {
    // p = 0.2 MPa: σθ = 187.5, local 468.75 MPa, Goodman σar = 234.4/(1 − 234.4/470) = 467.5, N = ½(467.5/900)^(1/−0.102) ≈ 310 (hand calculation)
    const r = run(base({ pressure: { blocks: [{ max_MPa: 0.2, min_MPa: 0, cycles: 1 }] } }));
    expect(r.warnings.join(" ")).toMatch(/below 10³ cycles/);
  });

  it("damage from cycles beyond 10⁷ with no endurance limit warns", () => {
    const r = run(
      base({
        pressure: {
          blocks: [
            { max_MPa: 0.06, min_MPa: 0, cycles: 1 },
            { max_MPa: 0.06, min_MPa: 0.05, cycles: 1000 },
          ],
        },
      }),
    );
    expect(r.warnings.join(" ")).toMatch(/% of the damage per pass comes from cycles whose lives extrapolate the curve beyond 10⁷ cycles/);
  });
});
