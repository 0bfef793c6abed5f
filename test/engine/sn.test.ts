/**
 * @module test/engine/sn.test
 * Basquin's curve and the Marin factors.
 */
import { describe, expect, it } from "vitest";
import { basquinAmplitude, basquinLife, modifyingFactors, reliabilityFactor } from "../../src/engine/sn.ts";
import { normalQuantile } from "../../src/engine/special.ts";
import { warningText } from "../../src/engine/phrase.ts";

const curve2024 = { coefficient_MPa: 900, exponent: -0.102, factor: 1 };

describe("Basquin S-N curve and modifying factors", () => {
  it("2024-T351 at 10⁶ cycles allows about 205 MPa fully reversed", () => {
    // Dowling, Mechanical Behavior of Materials, Table 14.1, 2024-T351: σ'f = 900 MPa, b = −0.102 (from memory);
    // σar = 900·(2×10⁶)^−0.102 = 204.9 MPa
    expect(basquinAmplitude(1e6, curve2024)).toBeCloseTo(204.9, 1);
    expect(basquinLife(204.9, curve2024)).toBeGreaterThan(0.99e6);
    expect(basquinLife(204.9, curve2024)).toBeLessThan(1.01e6);
  });

  it("life and amplitude are inverse functions", () => {
    for (const n of [1e3, 5e4, 2e6]) expect(basquinLife(basquinAmplitude(n, curve2024), curve2024)).toBeCloseTo(n, -Math.log10(n) + 6);
  });

  it("at or below the endurance limit the life is unlimited", () => {
    const c = { ...curve2024, enduranceLimit_MPa: 150 };
    expect(basquinLife(150, c)).toBeNull();
    expect(basquinLife(151, c)).not.toBeNull();
  });

  it("surface factor for a machined 520 MPa steel is 0.860", () => {
    // Shigley's Mechanical Engineering Design, Example 6-3: ka = 4.51(520)^−0.265 = 0.860
    const m = modifyingFactors({ surface: "machined" }, 520, normalQuantile);
    expect(m.factor).toBeCloseTo(0.86, 3);
  });

  it("size factor for a 32 mm diameter is 0.858", () => {
    // Shigley's Mechanical Engineering Design, Example 6-4: kb = (32/7.62)^−0.107 = 0.858
    const m = modifyingFactors({ sizeDiameter_mm: 32 }, 600, normalQuantile);
    expect(m.factor).toBeCloseTo(0.858, 3);
    expect(warningText(m.warnings[0])).toMatch(/axial/);
  });

  it("reliability factors follow Shigley Table 6-5", () => {
    // Shigley's Mechanical Engineering Design, Table 6-5: 90 % 0.897, 99 % 0.814, 99.9 % 0.753, 99.99 % 0.702
    const table: [number, number][] = [
      [0.9, 0.897],
      [0.99, 0.814],
      [0.999, 0.753],
      [0.9999, 0.702],
    ];
    for (const [r, ke] of table) expect(reliabilityFactor(r, normalQuantile(r))).toBeCloseTo(ke, 3);
    expect(reliabilityFactor(0.5, 0)).toBe(1);
  });

  it("modifying factors shorten the life", () => {
    const m = modifyingFactors({ surface: "machined", reliability: 0.99 }, 470, normalQuantile);
    const modified = { ...curve2024, factor: m.factor };
    expect(basquinLife(150, modified)!).toBeLessThan(basquinLife(150, curve2024)!);
  });
});
