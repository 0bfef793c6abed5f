import { describe, expect, it } from "vitest";
import { equivalentAmplitude, type Strengths } from "../../src/engine/meanStress.ts";
import { MEAN_STRESS_CRITERIA } from "../../src/schema/check.ts";

const s: Strengths = { ultimate_MPa: 600, yield_MPa: 400, fatigueStrengthCoefficient_MPa: 900, walkerGamma: 0.5 };

describe("mean-stress criteria", () => {
  it("every criterion gives σar = σa at zero mean (fully reversed), SWT and Walker included", () => {
    // definition of the equivalent fully reversed amplitude (Dowling, Mechanical Behavior of Materials, §10.6)
    for (const c of MEAN_STRESS_CRITERIA) expect(equivalentAmplitude(c, 120, 0, s).sigmaAr).toBeCloseTo(120, 10);
  });

  it("Goodman: σa/σar + σm/Su = 1", () => {
    // modified Goodman line (Shigley's Mechanical Engineering Design, Table 6-6): 100/σar + 200/600 = 1 ⇒ σar = 150
    expect(equivalentAmplitude("goodman", 100, 200, s).sigmaAr).toBeCloseTo(150, 10);
  });

  it("Gerber: σa/σar + (σm/Su)² = 1", () => {
    // Gerber parabola (Shigley, Table 6-7): 100/σar + (300/600)² = 1 ⇒ σar = 133.33
    expect(equivalentAmplitude("gerber", 100, 300, s).sigmaAr).toBeCloseTo(400 / 3, 10);
  });

  it("Soderberg and ASME elliptic use the yield strength", () => {
    // Soderberg (Shigley §6-12): 100/(1 − 200/400) = 200; ASME elliptic (Shigley Table 6-8): 100/√(1 − 0.25) = 115.47
    expect(equivalentAmplitude("soderberg", 100, 200, s).sigmaAr).toBeCloseTo(200, 10);
    expect(equivalentAmplitude("asme-elliptic", 100, 200, s).sigmaAr).toBeCloseTo(100 / Math.sqrt(0.75), 10);
  });

  it("SWT: σar = √(σmax·σa); Walker with γ = 0.5 equals SWT", () => {
    // Smith, Watson & Topper (1970); Walker (1970) with γ = 0.5 reduces to SWT (Dowling §10.6)
    const swt = equivalentAmplitude("swt", 100, 200, s).sigmaAr as number;
    expect(swt).toBeCloseTo(Math.sqrt(300 * 100), 10);
    expect(equivalentAmplitude("walker", 100, 200, s).sigmaAr).toBeCloseTo(swt, 10);
  });

  it("Morrow: σa/σar + σm/σ'f = 1", () => {
    // Morrow (Dowling §10.6): 100/(1 − 300/900) = 150
    expect(equivalentAmplitude("morrow", 100, 300, s).sigmaAr).toBeCloseTo(150, 10);
  });

  it("tensile mean: Soderberg is the most and Gerber the least severe of the Shigley four", () => {
    // Shigley §6-12, Fig. 6-27 ordering of the failure lines (common practice)
    const v = (c: "goodman" | "gerber" | "soderberg" | "asme-elliptic") => equivalentAmplitude(c, 80, 150, s).sigmaAr as number;
    expect(v("soderberg")).toBeGreaterThan(v("goodman"));
    expect(v("goodman")).toBeGreaterThan(v("gerber"));
  });

  it("a mean at or beyond the strength a criterion uses has no answer and says why", () => {
    const g = equivalentAmplitude("goodman", 50, 600, s);
    expect(g.sigmaAr).toBeNull();
    expect(g.reason).toMatch(/ultimate strength/);
    expect(equivalentAmplitude("soderberg", 10, 450, s).sigmaAr).toBeNull();
    expect(equivalentAmplitude("morrow", 10, 950, s).sigmaAr).toBeNull();
  });

  it("a cycle that never reaches tension does no SWT or Walker damage", () => {
    const e = equivalentAmplitude("swt", 50, -80, s);
    expect(e.noDamage).toBe(true);
    // Goodman-type criteria give no credit for a compressive mean (Shigley §6-12)
    expect(equivalentAmplitude("goodman", 50, -80, s).sigmaAr).toBe(50);
  });
});
