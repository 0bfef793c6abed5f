import { describe, expect, it } from "vitest";
import { AXIAL_ENDURANCE_RATIO, MATERIALS } from "../../src/materials/library.ts";

/** The library re-checked entry by entry for consistency between its static values, its curve and its limit. */
describe("the material library is self-consistent", () => {
  const at = (sf: number, b: number, n: number) => sf * (2 * n) ** b; // Basquin, Dowling eq. 9.7

  for (const m of MATERIALS) {
    it(`${m.id}: static values, curve and endurance limit agree`, () => {
      expect(m.yield_MPa).toBeLessThan(m.ultimate_MPa);
      // σ'f is near or above Su for metals (Dowling §9.2 / Table 14.1, from memory): at least 0.9 Su here
      expect(m.fatigueStrengthCoefficient_MPa).toBeGreaterThan(0.9 * m.ultimate_MPa);
      // b lies between −0.05 and −0.15 for metals (Dowling §9.2, from memory)
      expect(m.fatigueStrengthExponent).toBeLessThan(-0.05);
      expect(m.fatigueStrengthExponent).toBeGreaterThan(-0.15);
      expect(m.source.length).toBeGreaterThan(20);
      if (m.family === "aluminium" || m.family === "titanium") {
        // aluminium alloys have no endurance limit; titanium none to rely on
        expect(m.enduranceLimit_MPa).toBeUndefined();
      }
      if (m.enduranceLimit_MPa !== undefined) {
        // never above the curve at its knee, 10⁶ cycles (Shigley §6-7)
        expect(m.enduranceLimit_MPa).toBeLessThanOrEqual(at(m.fatigueStrengthCoefficient_MPa, m.fatigueStrengthExponent, 1e6));
        // never above Shigley's axial estimate kc·0.5·Su, kc = 0.85 (Shigley eqs. 6-8 and 6-26)
        expect(m.enduranceLimit_MPa).toBeLessThanOrEqual(AXIAL_ENDURANCE_RATIO * m.ultimate_MPa);
        expect(m.source).toMatch(/0\.85 × 0\.5 Su/);
      }
    });
  }

  it("the endurance limits are the hand-worked minima of the axial estimate and the curve at the knee", () => {
    // hand calculation: min(0.425·Su, σ'f·(2×10⁶)^b), rounded down to a whole MPa
    const expected: Record<string, number> = {
      "steel-1015-n": Math.floor(Math.min(0.425 * 415, 1020 * 2e6 ** -0.138)), // min(176.4, 137.7) = 137
      "steel-1020-hr": Math.floor(Math.min(0.425 * 441, 896 * 2e6 ** -0.12)), // min(187.4, 157.1) = 157
      "steel-p265gh": Math.floor(Math.min(0.425 * 410, 755 * 2e6 ** -0.1)), // min(174.3, 176.9) = 174
      "steel-4340": Math.floor(Math.min(0.425 * 1172, 1758 * 2e6 ** -0.0977)), // min(498.1, 425.999) = 425
    };
    for (const [id, se] of Object.entries(expected)) expect(MATERIALS.find((m) => m.id === id)?.enduranceLimit_MPa, id).toBe(se);
  });
});
