import { describe, expect, it } from "vitest";
import { neuberSqrtA_sqrtMm, notchFactor, petersonAlpha_mm } from "../../src/engine/notch.ts";

describe("notch sensitivity and Kf", () => {
  it("Kf = 1 + q(Kt − 1)", () => {
    // Peterson; Shigley's Mechanical Engineering Design, eq. 6-32: q = 0.8, Kt = 3 ⇒ Kf = 2.6
    expect(notchFactor(3, { q: 0.8, family: "steel", ultimate_MPa: 500 }).kf).toBeCloseTo(2.6, 12);
    // q = 1 without other information: Kf = Kt (check format convention)
    expect(notchFactor(2.5, { family: "aluminium", ultimate_MPa: 470 }).kf).toBe(2.5);
  });

  it("Peterson's constant for a 690 MPa steel is about 0.18 mm", () => {
    // Dowling, Mechanical Behavior of Materials, eq. 10.9: α = 0.0254(2070/Su)^1.8 mm (from memory) ⇒ 0.0254·3^1.8
    expect(petersonAlpha_mm("steel", 690)).toBeCloseTo(0.0254 * 3 ** 1.8, 12);
    expect(petersonAlpha_mm("steel", 690)).toBeCloseTo(0.1835, 3);
    // aluminium alloys: α = 0.51 mm (Dowling §10.3, from memory)
    expect(petersonAlpha_mm("aluminium", 470)).toBe(0.51);
  });

  it("Neuber's constant for a 100 kpsi steel is about 0.062 √in", () => {
    // Shigley's Mechanical Engineering Design, eq. 6-35a at Sut = 100 kpsi: √a = 0.246 − 0.308 + 0.151 − 0.0267 = 0.0623 √in
    const sqrtA_in = neuberSqrtA_sqrtMm(689.4757) / Math.sqrt(25.4);
    expect(sqrtA_in).toBeCloseTo(0.0623, 4);
  });

  it("q from Peterson for a 2.4 mm fastener hole in aluminium", () => {
    // q = 1/(1 + α/ρ) = 1/(1 + 0.51/2.4) (Peterson; Dowling eq. 10.8, from memory)
    const n = notchFactor(2.5, { constant: "peterson", rootRadius_mm: 2.4, family: "aluminium", ultimate_MPa: 470 });
    expect(n.q).toBeCloseTo(1 / (1 + 0.51 / 2.4), 12);
    expect(n.kf).toBeCloseTo(1 + n.q * 1.5, 12);
    expect(n.steps.map((s) => s.id)).toEqual(["notch-alpha", "notch-q", "kf"]);
  });

  it("sharper notches are less sensitive (q falls with the root radius)", () => {
    const sharp = notchFactor(3, { constant: "neuber", rootRadius_mm: 0.2, family: "steel", ultimate_MPa: 700 }).q;
    const blunt = notchFactor(3, { constant: "neuber", rootRadius_mm: 5, family: "steel", ultimate_MPa: 700 }).q;
    expect(sharp).toBeLessThan(blunt);
    expect(blunt).toBeLessThan(1);
  });
});
