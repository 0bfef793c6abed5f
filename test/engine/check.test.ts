import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { checkDocument, type CheckResult } from "../../src/engine/index.ts";
import { DEMOS } from "../../src/demo/index.ts";

const example = JSON.parse(readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8"));

/** The format's example without the crack and evidence sections, with a given pressure and thickness. */
function base(p = 0.06, t = 1.6, extra: Record<string, unknown> = {}) {
  const { crack: _c, evidence: _e, ...doc } = structuredClone(example);
  return { ...doc, shell: { ...doc.shell, thickness_mm: t }, pressure: { max_MPa: p, min_MPa: 0 }, ...extra };
}

function run(doc: unknown): CheckResult {
  const out = checkDocument(doc);
  if (!out.ok) throw new Error(JSON.stringify(out.errors));
  return out.result;
}

describe("a whole check", () => {
  it("the format's example: stresses, Kt, Goodman amplitude and the life worked by hand", () => {
    const r = run(example);
    // thin wall, Roark Ch. 13: σθ = 0.06 × 1500/1.6 = 56.25, σx = 28.125 MPa
    expect(r.membrane.theory).toBe("thin");
    expect(r.membrane.hoopMax_MPa).toBeCloseTo(56.25, 10);
    expect(r.membrane.axialMax_MPa).toBeCloseTo(28.125, 10);
    // von Mises 2:1: σθ·√3/2 (Dowling §7.5)
    expect(r.membrane.vonMisesMax_MPa).toBeCloseTo((56.25 * Math.sqrt(3)) / 2, 10);
    // Kirsch in the 2:1 field, Peterson Chart 4.1: Kt = 2.5; q = 1 ⇒ Kf = 2.5
    expect(r.notch.kt).toBeCloseTo(2.5, 12);
    expect(r.notch.peakMax_MPa).toBeCloseTo(140.625, 10);
    // σa = σm = 70.3125; Goodman σar = 70.3125/(1 − 70.3125/470) (Shigley Table 6-6)
    const sar = 70.3125 / (1 - 70.3125 / 470);
    expect(r.fatigue.equivalentAmplitude_MPa).toBeCloseTo(sar, 10);
    // Basquin N = ½(σar/σ'f)^(1/b) (Dowling eq. 9.7)
    const n = 0.5 * (sar / 900) ** (1 / -0.102);
    expect(r.fatigue.life_cycles).toBeCloseTo(n, -Math.floor(Math.log10(n)) + 8);
    expect(r.fatigue.allowableLife_cycles).toBeCloseTo(n / 3, -Math.floor(Math.log10(n)) + 8);
    expect(r.fatigue.damage).toBeCloseTo(60000 / (n / 3), 10);
    expect(r.fatigue.criteria).toHaveLength(7);
    expect(r.verdictTable.map((v) => v.id)).toEqual(expect.arrayContaining(["static", "fatigue", "crack", "evidence"]));
    expect(r.fingerprint).toMatch(/^[0-9a-f]{64}$/);
  });

  it("every step carries an equation, its numbers and a source", () => {
    const r = run(example);
    expect(r.steps.length).toBeGreaterThan(15);
    for (const s of r.steps) {
      expect(s.equation.length, s.id).toBeGreaterThan(0);
      expect(s.substituted.length, s.id).toBeGreaterThan(0);
      expect(s.source.length, s.id).toBeGreaterThan(3);
    }
  });

  it("a mean stress beyond the criterion's range gives no life, a failing verdict and a warning", () => {
    const r = run(
      base(0.06, 1.6, { fatigue: { meanStress: "soderberg", designLife_cycles: 1000 }, material: { ...example.material, yield_MPa: 60 } }),
    );
    expect(r.fatigue.life_cycles).toBe(0);
    expect(r.verdict).toBe("fail");
    expect(r.warnings.join(" ")).toMatch(/no life/);
  });

  it("thin-wall theory forced on a thick wall warns by how much it under-estimates", () => {
    const r = run({
      ...base(10, 30),
      shell: { form: "cylinder", radius_mm: 150, thickness_mm: 30, theory: "thin" },
      cutout: { kind: "none" },
    });
    expect(r.membrane.theory).toBe("thin");
    expect(r.warnings.join(" ")).toMatch(/under-estimates the inner-surface hoop stress/);
    const auto = run({ ...base(10, 30), shell: { form: "cylinder", radius_mm: 150, thickness_mm: 30 }, cutout: { kind: "none" } });
    expect(auto.membrane.theory).toBe("thick");
  });

  it("a notch above yield warns and, with shakedown, lowers the mean to Sy − σa", () => {
    const doc = base(0.2, 1.6, { fatigue: { ...example.fatigue, localYield: "shakedown" } });
    const r = run(doc);
    expect(r.notch.localYield).toBe(true);
    expect(r.fatigue.mean_MPa).toBeCloseTo(325 - r.fatigue.amplitude_MPa, 10);
    expect(r.warnings.join(" ")).toMatch(/yields on the first cycle/);
  });

  it("the solved thickness gives the design life back", () => {
    const r = run(
      base(0.06, 1.6, { solve: { for: "thickness" }, fatigue: { ...example.fatigue, designLife_cycles: 2e6, scatterFactor: 5 } }),
    );
    const t = r.solution!.requiredThickness_mm!; // the solved minimum, before rounding up to a gauge
    expect(r.solution!.governs).toBe("fatigue");
    const again = run(base(0.06, t, { fatigue: { ...example.fatigue, designLife_cycles: 2e6, scatterFactor: 5 } }));
    expect(again.fatigue.damage).toBeLessThanOrEqual(1);
    expect(again.fatigue.damage).toBeGreaterThan(0.995);
    expect(r.solution!.evaluations).toBeLessThanOrEqual(60);
  });

  it("the solved pressure brings the reserve to zero", () => {
    const r = run(base(0.06, 1.6, { solve: { for: "pressure" }, fatigue: { ...example.fatigue, designLife_cycles: 2e6 } }));
    const p = r.solution!.pressureMax_MPa!;
    const again = run(base(p, 1.6, { fatigue: { ...example.fatigue, designLife_cycles: 2e6 } }));
    expect(again.fatigue.damage).toBeLessThanOrEqual(1.0001);
    expect(again.fatigue.damage).toBeGreaterThan(0.99);
  });

  it("both demos run and pass their own checks", () => {
    for (const d of DEMOS) {
      const out = checkDocument(d.document);
      expect(out.ok, `${d.id}: ${JSON.stringify(!out.ok && out.errors)}`).toBe(true);
    }
  });
});

describe("invariants (property tests)", () => {
  const pressure = fc.double({ min: 0.01, max: 0.2, noNaN: true });
  const thickness = fc.double({ min: 0.8, max: 4, noNaN: true });
  const factor = fc.double({ min: 1.01, max: 3, noNaN: true });

  it("membrane stresses are linear in pressure and Kt does not depend on it", () => {
    fc.assert(
      fc.property(pressure, factor, (p, k) => {
        const a = run(base(p));
        const b = run(base(p * k));
        expect(b.membrane.hoopMax_MPa / a.membrane.hoopMax_MPa).toBeCloseTo(k, 9);
        expect(b.membrane.axialMax_MPa / a.membrane.axialMax_MPa).toBeCloseTo(k, 9);
        expect(b.notch.kt).toBeCloseTo(a.notch.kt, 12);
      }),
      { numRuns: 40 },
    );
  });

  it("life falls as pressure rises and rises with thickness", () => {
    fc.assert(
      fc.property(pressure, thickness, factor, (p, t, k) => {
        const here = run(base(p, t)).fatigue.life_cycles ?? Infinity;
        const harder = run(base(p * k, t)).fatigue.life_cycles ?? Infinity;
        const thicker = run(base(p, t * k)).fatigue.life_cycles ?? Infinity;
        expect(harder).toBeLessThanOrEqual(here);
        expect(thicker).toBeGreaterThanOrEqual(here);
      }),
      { numRuns: 40 },
    );
  });

  it("a solved thickness meets the design life (damage at most 1, within the solver tolerance)", () => {
    fc.assert(
      fc.property(pressure, fc.double({ min: 1e4, max: 1e7, noNaN: true }), (p, life) => {
        const fatigue = { ...example.fatigue, designLife_cycles: life };
        const r = run(base(p, 1.6, { fatigue, solve: { for: "thickness" } }));
        const t = r.solution!.requiredThickness_mm!; // before rounding up
        const at = run(base(p, t, { fatigue }));
        expect(at.fatigue.damage).toBeLessThanOrEqual(1);
        expect(at.static.margin).toBeGreaterThanOrEqual(-1e-9);
        const thinner = run(base(p, t * (1 - 2e-4), { fatigue }));
        expect(thinner.fatigue.damage === null || thinner.fatigue.damage > 1 || thinner.static.margin < 0).toBe(true);
      }),
      { numRuns: 25 },
    );
  });
});
