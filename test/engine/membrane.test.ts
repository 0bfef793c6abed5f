import { describe, expect, it } from "vitest";
import { chooseTheory, radii, unitStresses, vonMises } from "../../src/engine/membrane.ts";

describe("membrane stresses", () => {
  it("thin cylinder: hoop p·r/t and axial half of it", () => {
    // Roark's Formulas for Stress and Strain, Ch. 13, thin cylinder under internal pressure: σθ = pR/t, σx = pR/(2t)
    const r = radii(500, "mean", 10);
    const u = unitStresses("cylinder", "thin", r, 10);
    expect(u.hoop).toBeCloseTo(50, 12);
    expect(u.axial).toBeCloseTo(25, 12);
  });

  it("thin sphere: p·r/(2t) in every direction", () => {
    // Roark's Formulas for Stress and Strain, Ch. 13, thin sphere under internal pressure: σ = pR/(2t)
    const r = radii(1000, "mean", 8);
    const u = unitStresses("sphere", "thin", r, 8);
    expect(u.hoop).toBeCloseTo(62.5, 12);
    expect(u.axial).toBeCloseTo(62.5, 12);
  });

  it("radiusAt converts inner and outer radii to the mean radius", () => {
    // geometry: r_mean = r_inner + t/2 = r_outer − t/2
    expect(radii(100, "inner", 10).mean_mm).toBe(105);
    expect(radii(100, "outer", 10).mean_mm).toBe(95);
    expect(radii(100, "mean", 10).inner_mm).toBe(95);
  });

  it("Lamé cylinder with b = 2a: hoop 5p/3 and axial p/3 at the bore", () => {
    // Lamé (Roark Ch. 13, thick-walled cylinder, closed ends): σθ = p(b²+a²)/(b²−a²) = 5/3 p, σx = p a²/(b²−a²) = p/3
    const r = radii(100, "inner", 100);
    const u = unitStresses("cylinder", "thick", r, 100);
    expect(u.hoop).toBeCloseTo(5 / 3, 12);
    expect(u.axial).toBeCloseTo(1 / 3, 12);
    expect(u.radial).toBe(-1);
  });

  it("Lamé sphere with b = 2a: tangential 5p/7 at the bore", () => {
    // Lamé sphere (Roark Ch. 13, thick-walled sphere): σt = p(b³ + 2a³)/(2(b³ − a³)) = p·10/14
    const r = radii(50, "inner", 50);
    const u = unitStresses("sphere", "thick", r, 50);
    expect(u.hoop).toBeCloseTo(10 / 14, 12);
  });

  it("thick and thin theories agree as the wall gets thin", () => {
    // Lamé tends to p·r_inner/t + p/2 … which meets p·r_mean/t as t/r → 0 (Timoshenko, Strength of Materials II)
    const r = radii(1000, "mean", 1);
    const thick = unitStresses("cylinder", "thick", r, 1).hoop;
    const thin = unitStresses("cylinder", "thin", r, 1).hoop;
    expect(Math.abs(thick / thin - 1)).toBeLessThan(1e-3);
  });

  it("auto theory switches to Lamé below r/t = 10 (common practice)", () => {
    expect(chooseTheory("auto", radii(100, "mean", 10), 10)).toBe("thin");
    expect(chooseTheory("auto", radii(99, "mean", 10), 10)).toBe("thick");
    expect(chooseTheory("thin", radii(20, "mean", 10), 10)).toBe("thin");
  });

  it("von Mises of a 2:1 biaxial membrane state is √3/2 of the hoop stress", () => {
    // σvm = √(σ1² − σ1σ2 + σ2²) with σ2 = σ1/2 gives σ1·√(3)/2 (Dowling, Mechanical Behavior of Materials, §7.5)
    expect(vonMises(100, 50, 0)).toBeCloseTo(50 * Math.sqrt(3), 10);
    // equibiaxial: σvm = σ
    expect(vonMises(80, 80, 0)).toBeCloseTo(80, 10);
  });
});
