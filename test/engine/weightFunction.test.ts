/**
 * The crack growing into a stress gradient: the edge-crack Green's function, its compounding with
 * Bowie's factor, and the opening's field along the path (closed forms, the solver, the table).
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { crackGrowth, type CrackInput } from "../../src/engine/crack.ts";
import { ellipseAxisField, roundedRectangleAxisField, solvedPathField, tabulatePathField } from "../../src/engine/crackPath.ts";
import { discretize, ellipse } from "../../src/engine/openings/geometry.ts";
import { outlineOf } from "../../src/engine/openings/index.ts";
import { buildOperator, solve, stressAt } from "../../src/engine/openings/solver.ts";
import { edgeCrackFactor, effectiveStress, kirschUniaxial } from "../../src/engine/weightFunction.ts";

describe("edge-crack Green's function", () => {
  it("gives the half-plane's 1.1215 under a uniform stress", () => {
    // Tada, Paris & Irwin: edge crack in a half-plane, F = 1.1215 (from memory); the Hartranft–Sih form is quoted to about 1 %.
    expect(Math.abs(edgeCrackFactor(() => 1, 5) / 1.1215 - 1)).toBeLessThan(0.001);
  });

  it("gives 0.683 under a stress rising linearly from the edge, σ = σ₁·x/a", () => {
    // Edge crack in a half-plane under a linear stress: G₁ = 0.682–0.683 (Buchalet & Bamford's polynomial
    // influence coefficients, as quoted in fracture handbooks; from memory).
    expect(Math.abs(edgeCrackFactor((x) => x / 4, 4) - 0.683)).toBeLessThan(0.004);
  });

  it("is linear in the stress (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 20, noNaN: true }), fc.double({ min: -3, max: 3, noNaN: true }), (a, k) => {
        const f = (x: number) => 1 + 0.1 * x;
        const g = (x: number) => Math.exp(-x);
        const lhs = edgeCrackFactor((x) => f(x) + k * g(x), a);
        return Math.abs(lhs - (edgeCrackFactor(f, a) + k * edgeCrackFactor(g, a))) < 1e-9 * Math.max(1, Math.abs(lhs));
      }),
      { numRuns: 50 },
    );
  });
});

describe("crack at a hole in a stress gradient", () => {
  it("reduces exactly to Bowie's factor in a uniform field", () => {
    for (const a of [0.1, 1, 3, 10]) expect(effectiveStress(() => 1, a, 2.4)).toBeCloseTo(1, 12);
    const base: CrackInput = {
      geometry: "hole-through",
      initial_mm: 1,
      holeRadius_mm: 2.4,
      cracksAtHole: 1,
      form: "cylinder",
      shellRadius_mm: 1150,
      thickness_mm: 1,
      stressMax_MPa: 45,
      stressMin_MPa: 0,
      yield_MPa: 345,
      ultimate_MPa: 483,
      parisC: 1.6e-11,
      parisM: 3.6,
      toughness_MPaSqrtM: 90,
      inspectionFactor: 2,
    };
    const plain = crackGrowth(base);
    const flat = crackGrowth({ ...base, gradient: { field: () => 1, ligament_mm: 1000, source: "uniform" } });
    expect(Math.abs((flat.cycles ?? 0) / (plain.cycles ?? 1) - 1)).toBeLessThan(1e-9);
    expect(flat.critical_mm).toBeCloseTo(plain.critical_mm, 8);
  });

  it("grows faster, and faster still, as the crack runs into a rising stress", () => {
    const field = ellipseAxisField(140, 190);
    const ligament = 9.6;
    // Hoop loading only (the axial coefficient left out), so the field is the opening's hoop concentration along the path.
    const gradient = { field: (x: number) => field(ligament - x).hoopCoeff, ligament_mm: ligament, source: "Inglis" };
    const base: CrackInput = {
      geometry: "hole-through",
      initial_mm: 1.27,
      holeRadius_mm: 2.4,
      cracksAtHole: 1,
      form: "cylinder",
      shellRadius_mm: 1150,
      thickness_mm: 1,
      stressMax_MPa: 43,
      stressMin_MPa: 0,
      yield_MPa: 345,
      ultimate_MPa: 483,
      parisC: 1.6e-11,
      parisM: 3.6,
      toughness_MPaSqrtM: 90,
      inspectionFactor: 2,
    };
    const g = crackGrowth({ ...base, gradient });
    expect(g.criticalBy).toBe("link-up");
    expect(g.uniform).toBeDefined();
    expect(g.cycles ?? Infinity).toBeLessThan(g.uniform?.cycles ?? 0);
    // The correction β = σ_eff/σ_n rises along the path toward the opening (Inglis: 1 far off, 2.47 at the edge).
    const b1 = effectiveStress(gradient.field, 1, 2.4);
    const b5 = effectiveStress(gradient.field, 5, 2.4);
    const b9 = effectiveStress(gradient.field, 9, 2.4);
    expect(b1).toBeLessThan(b5);
    expect(b5).toBeLessThan(b9);
  });
});

describe("the opening's field along the path", () => {
  it("has Inglis's vertex stress and decays to the remote field", () => {
    // Inglis (1913): at the vertex, σ = (1 + 2A/B)·σ_hoop − σ_axial for A across the load (Peterson, from memory).
    const f = ellipseAxisField(140, 190);
    expect(f(0).hoopCoeff).toBeCloseTo(1 + 280 / 190, 10);
    expect(f(0).axialCoeff).toBeCloseTo(-1, 10);
    expect(f(1e5).hoopCoeff).toBeCloseTo(1, 4);
    expect(Math.abs(f(1e5).axialCoeff)).toBeLessThan(1e-4);
  });

  it("is Kirsch's field for a circle", () => {
    // Kirsch: σθ on the line across the load at r: 1 + R²/(2r²) + 3R⁴/(2r⁴); along it: R²/(2r²) − 3R⁴/(2r⁴) (Timoshenko & Goodier §35).
    const f = ellipseAxisField(10, 10);
    for (const s of [0, 1, 4, 10, 40]) {
      const r = 10 + s;
      expect(f(s).hoopCoeff).toBeCloseTo(kirschUniaxial(s, 10), 10);
      expect(f(s).axialCoeff).toBeCloseTo(0.5 * (10 / r) ** 2 - 1.5 * (10 / r) ** 4, 10);
    }
  });
});

describe("an opening's field from the plane-elasticity solver", () => {
  it("agrees with the closed form of Inglis's ellipse along the axis", () => {
    // Two independent methods: Muskhelishvili's potentials on the axis (closed form) and the integral-equation solver.
    // The solver's coordinates: x around the hoop (half-axis 190), y along the axis (half-axis 140); the path runs
    // up the axial line from the vertex, and the stress normal to it is the hoop-direction stress.
    const closed = ellipseAxisField(140, 190);
    const solved = solvedPathField(ellipse(190, 140), [0, 140], [0, 1]);
    for (const s of [0.5, 3, 12, 40, 150]) {
      const a = closed(s);
      const b = solved(s);
      expect(Math.abs(b.hoopCoeff / a.hoopCoeff - 1)).toBeLessThan(1e-6);
      expect(Math.abs(b.axialCoeff - a.axialCoeff)).toBeLessThan(1e-6);
    }
  });
});

describe("the field along the path, tabulated once", () => {
  it("reads Inglis's closed form between its nodes to 1e-9", () => {
    // Reference: the closed form itself (Muskhelishvili's potentials on the axis), read at points off the table's nodes.
    const closed = ellipseAxisField(140, 190);
    const table = tabulatePathField(closed, 9.6);
    for (const s of [0.013, 0.7, 2.5, 4.8, 7.77, 9.59]) {
      expect(Math.abs(table(s).hoopCoeff - closed(s).hoopCoeff)).toBeLessThan(1e-9);
      expect(Math.abs(table(s).axialCoeff - closed(s).axialCoeff)).toBeLessThan(1e-9);
    }
    // Beyond its length the table reads the field itself.
    expect(table(30).hoopCoeff).toBe(closed(30).hoopCoeff);
  });

  it("gives a rounded-rectangular opening's solved field as the solver reads it directly", () => {
    // Independent reading: the integral-equation solution evaluated point by point along the same line.
    const cut = { halfWidthAlongHoop_mm: 115, halfLengthAlongAxial_mm: 160, cornerRadius_mm: 55 };
    const op = buildOperator(discretize([outlineOf({ kind: "rounded-rectangle", ...cut })]));
    const hoop = solve(op, { sxx: 1, syy: 0 });
    const axial = solve(op, { sxx: 0, syy: 1 });
    const table = roundedRectangleAxisField(cut, 9.6);
    for (const s of [0.3, 3.1, 6.2, 9.4]) {
      expect(Math.abs(table(s).hoopCoeff - stressAt(hoop, 0, 160 + s).sxx)).toBeLessThan(1e-7);
      expect(Math.abs(table(s).axialCoeff - stressAt(axial, 0, 160 + s).sxx)).toBeLessThan(1e-7);
    }
    // The same geometry is solved once: a second request returns the same table.
    expect(roundedRectangleAxisField(cut, 9.6)).toBe(table);
  });
});
