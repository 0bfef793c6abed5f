import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { DETAIL_CATEGORIES_MPa, weldedLife, weldedLimits } from "../../src/engine/welded.ts";
import { InputError } from "../../src/engine/errors.ts";

describe("welded detail S-N curves (EN 1993-1-9 §7.1)", () => {
  it("passes through the definition points of Figure 7.1", () => {
    // EN 1993-1-9 Figure 7.1: Δσ_C at 2·10⁶; Δσ_D = 0.737·Δσ_C at 5·10⁶; Δσ_L = 0.549·Δσ_D = 0.405·Δσ_C at 10⁸ (from memory).
    for (const c of [36, 71, 160]) {
      const { fatigueLimit_MPa, cutOff_MPa } = weldedLimits(c);
      expect(fatigueLimit_MPa / c).toBeCloseTo(0.737, 3);
      expect(cutOff_MPa / fatigueLimit_MPa).toBeCloseTo(0.549, 3);
      expect(cutOff_MPa / c).toBeCloseTo(0.405, 3);
      expect(weldedLife(c, c, { variableAmplitude: false }).life_cycles).toBeCloseTo(2e6, 2);
      expect(weldedLife(fatigueLimit_MPa, c, { variableAmplitude: true }).life_cycles).toBeCloseTo(5e6, 2);
      expect(weldedLife(cutOff_MPa, c, { variableAmplitude: true }).life_cycles).toBeCloseTo(1e8, 0);
    }
    // Category 71: Δσ_D = 52 MPa and Δσ_L = 29 MPa, as the figure labels them (EN 1993-1-9 Figure 7.1, from memory).
    expect(weldedLimits(71).fatigueLimit_MPa).toBeCloseTo(52, 0);
    expect(weldedLimits(71).cutOff_MPa).toBeCloseTo(29, 0);
  });

  it("follows slope 3 above the fatigue limit and slope 5 below it in a spectrum", () => {
    // Δσ³N constant on the first branch, Δσ⁵N on the second (EN 1993-1-9 §7.1(3), from memory).
    const a = weldedLife(100, 80, { variableAmplitude: false });
    expect(a.regime).toBe("slope-3");
    expect(a.life_cycles).toBeCloseTo(2e6 * 0.8 ** 3, 2);
    const b = weldedLife(40, 80, { variableAmplitude: true });
    expect(b.regime).toBe("slope-5");
    expect(b.life_cycles).toBeCloseTo(5e6 * ((0.4 ** (1 / 3) * 80) / 40) ** 5, 0);
  });

  it("gives unlimited life below the limits", () => {
    const ca = weldedLife(40, 80, { variableAmplitude: false });
    expect(ca.life_cycles).toBeNull();
    expect(ca.regime).toBe("below-fatigue-limit");
    const va = weldedLife(30, 80, { variableAmplitude: true });
    expect(va.life_cycles).toBeNull();
    expect(va.regime).toBe("below-cut-off");
  });

  it("applies γ_Mf to the resistance", () => {
    // Δσ_C/γ_Mf is the design strength (EN 1993-1-9 §8, from memory): life at Δσ with γ equals life at γ·Δσ without.
    const withFactor = weldedLife(60, 71, { variableAmplitude: true, gammaMf: 1.35 });
    const scaled = weldedLife(60 * 1.35, 71, { variableAmplitude: true });
    expect(withFactor.life_cycles).toBeCloseTo(scaled.life_cycles ?? 0, 2);
    expect(withFactor.fatigueLimit_MPa).toBeCloseTo(weldedLimits(71).fatigueLimit_MPa / 1.35, 10);
  });

  it("lists the standard categories and warns on others", () => {
    // EN 1993-1-9 Figure 7.1 categories (from memory).
    expect([...DETAIL_CATEGORIES_MPa]).toEqual([36, 40, 45, 50, 56, 63, 71, 80, 90, 100, 112, 125, 140, 160]);
    expect(weldedLife(50, 75, { variableAmplitude: false }).warnings.length).toBe(1);
    expect(weldedLife(50, 71, { variableAmplitude: false }).warnings.length).toBe(0);
  });

  it("loses life as the range grows (property)", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...DETAIL_CATEGORIES_MPa),
        fc.double({ min: 1, max: 400, noNaN: true }),
        fc.double({ min: 1.001, max: 3, noNaN: true }),
        fc.boolean(),
        (c, s, k, va) => {
          const n1 = weldedLife(s, c, { variableAmplitude: va }).life_cycles ?? Infinity;
          const n2 = weldedLife(s * k, c, { variableAmplitude: va }).life_cycles ?? Infinity;
          return n2 <= n1;
        },
      ),
    );
  });

  it("rejects impossible input", () => {
    expect(() => weldedLife(50, 0, { variableAmplitude: false })).toThrow(InputError);
    expect(() => weldedLife(-1, 71, { variableAmplitude: false })).toThrow(InputError);
    expect(() => weldedLife(50, 71, { variableAmplitude: false, gammaMf: 0.9 })).toThrow(InputError);
  });
});
