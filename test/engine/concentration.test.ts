import { describe, expect, it } from "vitest";
import { concentration } from "../../src/engine/concentration.ts";

describe("stress concentration in the biaxial membrane field", () => {
  it("circular hole: Kt = 3, 2.5 and 2 under uniaxial, 2:1 and equibiaxial fields", () => {
    // Kirsch (1898); Peterson's Stress Concentration Factors, Chart 4.1: Kt = 3 − σ2/σ1
    expect(concentration({ kind: "circular-hole" }, 0).kt).toBeCloseTo(3, 12);
    expect(concentration({ kind: "circular-hole" }, 0.5).kt).toBeCloseTo(2.5, 12);
    expect(concentration({ kind: "circular-hole" }, 1).kt).toBeCloseTo(2, 12);
  });

  it("ellipse with its long axis across the load: Kt = 1 + 2a/b", () => {
    // Inglis (1913); Peterson's Stress Concentration Factors, §4.5 (from memory): uniaxial, a/b = 2 ⇒ Kt = 5
    const c = concentration({ kind: "elliptical-hole", halfAxisAlongHoop_mm: 10, halfAxisAlongAxial_mm: 20 }, 0);
    expect(c.kt).toBeCloseTo(5, 12);
    expect(c.governs).toMatch(/axial half-axis/);
    // root radius at the end of the long axis ρ = b²/a = 10²/20 = 5 mm (ellipse geometry)
    expect(c.rootRadius_mm).toBeCloseTo(5, 12);
  });

  it("ellipse in an equibiaxial field: Kt = 2a/b", () => {
    // Peterson's Stress Concentration Factors, §4.5 (from memory): equal biaxial tension, σmax = 2(a/b)σ
    const c = concentration({ kind: "elliptical-hole", halfAxisAlongHoop_mm: 10, halfAxisAlongAxial_mm: 30 }, 1);
    expect(c.kt).toBeCloseTo(6, 12);
  });

  it("ellipse with its long axis along the load: the crown point governs only with enough transverse stress", () => {
    // Inglis: uniaxial load along the long axis gives 1 + 2b/a at the sides; b/a = 1/2 ⇒ 2 (Peterson §4.5, from memory)
    const uni = concentration({ kind: "elliptical-hole", halfAxisAlongHoop_mm: 20, halfAxisAlongAxial_mm: 10 }, 0);
    expect(uni.kt).toBeCloseTo(2, 12);
    // with λ = 1 the axial-direction point sees 1·(1 + 2·20/10) − 1 = 4 (Peterson §4.5, equal biaxial 2a/b, from memory)
    const bi = concentration({ kind: "elliptical-hole", halfAxisAlongHoop_mm: 20, halfAxisAlongAxial_mm: 10 }, 1);
    expect(bi.kt).toBeCloseTo(4, 12);
    expect(bi.governs).toMatch(/hoop half-axis/);
  });

  it("a window-shaped opening in a cylinder has a Kt near two (common practice)", () => {
    // common practice: a smooth elliptical cabin window cutout, taller than wide, sees Kt of about 2 in the 2:1 field
    const c = concentration({ kind: "elliptical-hole", halfAxisAlongHoop_mm: 190, halfAxisAlongAxial_mm: 140 }, 0.5);
    expect(c.kt).toBeGreaterThan(1.8);
    expect(c.kt).toBeLessThan(2.2);
  });

  it("a given Kt is used as it stands and records its basis", () => {
    const c = concentration({ kind: "given", kt: 3.1, basis: "Peterson Chart 4.76" }, 0.5);
    expect(c.kt).toBe(3.1);
    expect(c.steps[0].source).toContain("Peterson Chart 4.76");
  });
});
