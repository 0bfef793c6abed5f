import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { edgeStress, openingField } from "../../src/engine/concentration.ts";
import { equivalentCycle, equivalentOf, equivalentRange } from "../../src/engine/equivalent.ts";
import { checkDocument, type CheckResult } from "../../src/engine/index.ts";

const example = JSON.parse(readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8"));

function base(extra: Record<string, unknown> = {}) {
  const { crack: _c, evidence: _e, ...doc } = structuredClone(example);
  return { ...doc, ...extra };
}

function run(doc: unknown): CheckResult {
  const out = checkDocument(doc);
  if (!out.ok) throw new Error(JSON.stringify(out.errors));
  return out.result;
}

describe("the opening as a boundary field", () => {
  it("circle: Kirsch's 3σθ − σx and 3σx − σθ at the ends of the two diameters", () => {
    // Kirsch (1898); Peterson's Stress Concentration Factors, Chart 4.1: uniaxial Kt = 3 with −1 at 90° from the peak
    const f = openingField({ kind: "circular-hole" });
    const a = f.points.find((p) => p.id === "axial-ends")!;
    const b = f.points.find((p) => p.id === "hoop-ends")!;
    expect([a.hoopCoeff, a.axialCoeff]).toEqual([3, -1]);
    expect([b.hoopCoeff, b.axialCoeff]).toEqual([-1, 3]);
    // 2:1 field (cylinder): 3 − 0.5 = 2.5 and 1.5 − 1 = 0.5 (Peterson Chart 4.1 at λ = 0.5)
    expect(edgeStress(a, 1, 0.5)).toBeCloseTo(2.5, 12);
    expect(edgeStress(b, 1, 0.5)).toBeCloseTo(0.5, 12);
  });

  it("ellipse: Inglis 1 + 2a/b across the load and −1 along it, at both axes", () => {
    // Inglis (1913); Peterson §4.5 (from memory): h = 10 along the hoop, z = 20 along the axis
    const f = openingField({ kind: "elliptical-hole", halfAxisAlongHoop_mm: 10, halfAxisAlongAxial_mm: 20 });
    const a = f.points.find((p) => p.id === "axial-ends")!;
    const b = f.points.find((p) => p.id === "hoop-ends")!;
    expect(a.hoopCoeff).toBeCloseTo(1 + (2 * 20) / 10, 12); // 5
    expect(a.axialCoeff).toBe(-1);
    expect(b.hoopCoeff).toBe(-1);
    expect(b.axialCoeff).toBeCloseTo(1 + (2 * 10) / 20, 12); // 2
    // root radii of the ellipse: ρ = h²/z at the ends of z, z²/h at the ends of h (ellipse geometry)
    expect(a.rootRadius_mm).toBeCloseTo(5, 12);
    expect(b.rootRadius_mm).toBeCloseTo(40, 12);
  });

  it("a given Kt says plainly what it is taken to mean", () => {
    const f = openingField({ kind: "given", kt: 3.1 });
    expect(f.assumed).toBe(true);
    expect(f.points).toHaveLength(1);
    expect(f.points[0].hoopCoeff).toBe(3.1);
    expect(f.basis).toMatch(/scale with the hoop stress/);
    const r = run(base({ cutout: { kind: "given", kt: 3.1 } }));
    expect(r.steps.find((s) => s.id === "kt-assumed")?.substituted).toMatch(/axial stress's own influence/);
  });
});

describe("superposition at every instant", () => {
  it("an axial stress present only at the minimum is not lost (hand calculation)", () => {
    // Format example: σθ = 56.25, σx = 28.125 MPa at p_max (Roark Ch. 13); at p_min = 0 only the added 20 MPa axial.
    // Kirsch point A (3, −1): σ_max = 3·56.25 − 28.125 = 140.625; σ_min = 3·0 − 20 = −20 (hand calculation).
    // σa = 80.3125, σm = 60.3125; Goodman σar = 80.3125/(1 − 60.3125/470) (Shigley Table 6-6).
    // Without the 20 MPa at the minimum: σa = σm = 70.3125, σar = 82.68 — smaller, so the added stress is counted.
    const r = run(base({ axialExtra: { max_MPa: 0, min_MPa: 20 } }));
    expect(r.notch.ktGoverns).toMatch(/axial half-axis/);
    expect(r.fatigue.amplitude_MPa).toBeCloseTo(80.3125, 10);
    expect(r.fatigue.mean_MPa).toBeCloseTo(60.3125, 10);
    const sar = 80.3125 / (1 - 60.3125 / 470);
    expect(r.fatigue.equivalentAmplitude_MPa).toBeCloseTo(sar, 10);
    const n = 0.5 * (sar / 900) ** (1 / -0.102); // Basquin, Dowling eq. 9.7
    expect(r.fatigue.life_cycles! / n).toBeCloseTo(1, 10);
    // the old fixed-λ scaling would have given σa = σm = 70.3125 (hand calculation above): a longer life
    const old = 0.5 * (70.3125 / (1 - 70.3125 / 470) / 900) ** (1 / -0.102);
    expect(r.fatigue.life_cycles!).toBeLessThan(old);
  });

  it("a relieving axial stress at the minimum is not relied on: the cycle without it is checked too", () => {
    // −20 MPa axial at p = 0 raises point A's minimum to +20 MPa (Kirsch: −1 × −20), which would lengthen the
    // life; the load is not relied on (EN 1990 favourable variable action taken as zero), so the cycle
    // 140.625 ↔ 0 of the plain case governs (hand calculation, as above).
    const plain = run(base());
    const relieved = run(base({ axialExtra: { max_MPa: 0, min_MPa: -20 } }));
    expect(relieved.fatigue.life_cycles!).toBeLessThanOrEqual(plain.fatigue.life_cycles! * (1 + 1e-12));
    expect(relieved.steps.find((s) => s.id === "amplitude-axial-extra")?.substituted).toMatch(/valley: left out/);
  });

  it("a large axial end load moves the governing point to the ends of the hoop diameter", () => {
    // σx,max = 28.125 + 100 = 128.125: point B (−1, 3) = −56.25 + 384.375 = 328.125 against
    // point A (3, −1) = 168.75 − 128.125 = 40.625 (hand calculation, Kirsch superposed)
    const r = run(base({ axialExtra: { max_MPa: 100, min_MPa: 100 } }));
    expect(r.notch.ktGoverns).toMatch(/hoop diameter|hoop half-axis/);
    expect(r.notch.kt).toBeCloseTo(328.125 / 56.25, 10);
  });

  it("property: adding an axial stress that is zero at maximum pressure never lengthens the life", () => {
    const cutouts = fc.constantFrom(
      { kind: "circular-hole" },
      { kind: "elliptical-hole", halfAxisAlongHoop_mm: 40, halfAxisAlongAxial_mm: 20 },
      { kind: "elliptical-hole", halfAxisAlongHoop_mm: 10, halfAxisAlongAxial_mm: 30 },
      { kind: "none" },
    );
    fc.assert(
      fc.property(
        cutouts,
        fc.double({ min: 0.02, max: 0.12, noNaN: true }),
        fc.double({ min: -80, max: 80, noNaN: true }),
        fc.constantFrom("goodman", "swt", "morrow", "gerber"),
        (cutout, p, x, criterion) => {
          const fatigue = { ...example.fatigue, meanStress: criterion };
          const plain = run(base({ cutout, fatigue, pressure: { max_MPa: p, min_MPa: 0 } }));
          const added = run(base({ cutout, fatigue, pressure: { max_MPa: p, min_MPa: 0 }, axialExtra: { max_MPa: 0, min_MPa: x } }));
          const l0 = plain.fatigue.life_cycles === 0 ? 0 : (plain.fatigue.life_cycles ?? Infinity);
          const l1 = added.fatigue.life_cycles === 0 ? 0 : (added.fatigue.life_cycles ?? Infinity);
          expect(l1).toBeLessThanOrEqual(l0 * (1 + 1e-9));
        },
      ),
      { numRuns: 60 },
    );
  });

  it("in a spectrum every counted cycle is superposed at the governing point", () => {
    // blocks 0 → 0.06 MPa (×10) and 0.03 → 0.06 (×100); with 20 MPa axial at every valley, point A (3, −1):
    // block 1: 140.625 ↔ −20; block 2: 140.625 ↔ (3·28.125 − (14.0625 + 20)) = 50.3125 (hand calculation)
    const r = run(
      base({
        pressure: {
          blocks: [
            { max_MPa: 0.06, min_MPa: 0, cycles: 10 },
            { max_MPa: 0.06, min_MPa: 0.03, cycles: 100 },
          ],
        },
        axialExtra: { max_MPa: 0, min_MPa: 20 },
      }),
    );
    const [big, small] = r.spectrum!.cycles;
    expect(big.range_MPa).toBeCloseTo(160.625, 10);
    expect(small.range_MPa).toBeCloseTo(140.625 - 50.3125, 10);
    expect(small.mean_MPa).toBeCloseTo((140.625 + 50.3125) / 2, 10);
  });
});

describe("thick walls: Tresca equivalent range at the bore", () => {
  it("equivalent of principal ranges: Tresca ≥ von Mises; uniaxial equal, pure shear 2 against √3", () => {
    // Dowling §7.4–7.5 (from memory): for (1, −1, 0) Tresca = 2, von Mises = √3; uniaxial both = 1
    expect(equivalentOf([1, -1, 0], "tresca")).toBe(2);
    expect(equivalentOf([1, -1, 0], "von-mises")).toBeCloseTo(Math.sqrt(3), 12);
    expect(equivalentRange([5, 0, 0], [4, 0, 0], "tresca")).toBe(1);
    expect(equivalentRange([5, 0, 0], [4, 0, 0], "von-mises")).toBeCloseTo(1, 12);
    // stresses to 1 kPa between ±1000 MPa: squares of subnormal doubles would lose the comparison to underflow
    const stress = fc.integer({ min: -1e6, max: 1e6 }).map((x) => x / 1000);
    fc.assert(
      fc.property(fc.tuple(stress, stress, stress), (s) => {
        const t = equivalentOf(s, "tresca");
        const v = equivalentOf(s, "von-mises");
        // Tresca/von Mises lies between 1 and 2/√3 (Dowling §7.5, from memory)
        expect(t).toBeGreaterThanOrEqual(v * (1 - 1e-12));
        expect(t).toBeLessThanOrEqual((2 / Math.sqrt(3)) * v * (1 + 1e-12) + 1e-12);
      }),
    );
  });

  it("plain bore of a thick cylinder: σa = ½(σθ − σr), not ½σθ (Lamé, hand calculation)", () => {
    // a = 100, b = 150, p = 10 MPa: σθ = 10·(150² + 100²)/(150² − 100²) = 26, σx = 10·100²/12500 = 8, σr = −10
    // (Roark Ch. 13, Lamé, closed ends). Tresca range from 0 to p: max(|26 − 8|, |8 + 10|, |−10 − 26|) = 36 ⇒ σa = 18;
    // mean: Tresca of (13, 4, −5) = 18 (hand calculation). Hoop alone would give σa = σm = 13.
    const doc = base({
      shell: { form: "cylinder", radius_mm: 100, radiusAt: "inner", thickness_mm: 50, theory: "auto" },
      pressure: { max_MPa: 10, min_MPa: 0 },
      cutout: { kind: "none" },
      material: { ...example.material, ultimate_MPa: 1000, yield_MPa: 800, fatigueStrengthCoefficient_MPa: 1500 },
    });
    const r = run(doc);
    expect(r.membrane.theory).toBe("thick");
    expect(r.membrane.hoopMax_MPa).toBeCloseTo(26, 10);
    expect(r.fatigue.amplitude_MPa).toBeCloseTo(18, 10);
    expect(r.fatigue.mean_MPa).toBeCloseTo(18, 10);
    expect(equivalentCycle([26, 8, -10], [0, 0, 0]).amplitude_MPa).toBeCloseTo(18, 12);
  });

  it("an opening in a thick wall warns that the flat-plate Kt is outside its range", () => {
    const r = run(
      base({
        shell: { form: "cylinder", radius_mm: 100, radiusAt: "inner", thickness_mm: 50, theory: "auto" },
        pressure: { max_MPa: 10, min_MPa: 0 },
        material: { ...example.material, ultimate_MPa: 1000, yield_MPa: 800, fatigueStrengthCoefficient_MPa: 1500 },
      }),
    );
    expect(r.warnings.join(" ")).toMatch(/flat-plate .*outside its range/);
  });
});

describe("the third verdict", () => {
  it("a cycle below zero differential refers: it needs a buckling check to the governing code", () => {
    const r = run(base({ pressure: { max_MPa: 0.06, min_MPa: -0.01 } }));
    expect(r.verdict).toBe("refer");
    const row = r.verdictTable.find((x) => x.id === "external-pressure")!;
    expect(row.status).toBe("refer");
    expect(row.detail).toMatch(/needs a buckling check to the governing code/);
    expect(r.verdictMeaning).toMatch(/outside what this screening can judge/);
    expect(r.governs).toMatch(/buckling/);
  });

  it("fail outranks refer", () => {
    const r = run(base({ pressure: { max_MPa: 0.06, min_MPa: -0.01 }, fatigue: { ...example.fatigue, designLife_cycles: 1e12 } }));
    expect(r.verdictTable.find((x) => x.id === "fatigue")!.status).toBe("fail");
    expect(r.verdict).toBe("fail");
  });

  it("a history dipping below zero refers too", () => {
    const r = run(base({ pressure: { history_MPa: [0, 0.06, -0.005, 0.05, 0] } }));
    expect(r.verdict).toBe("refer");
  });
});
