/**
 * @module test/engine/crack.test
 * Crack growth and residual strength of one through-crack, against handbook and hand-worked values.
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { crackGrowth, parisClosedForm, type CrackInput } from "../../src/engine/crack.ts";
import { foliasFactor, secantCorrection } from "../../src/engine/crackGeometry.ts";
import { InputError } from "../../src/engine/errors.ts";
import { warningText } from "../../src/engine/phrase.ts";

// An invented aluminium cabin-barrel skin: hoop stress 100 MPa at peak differential pressure.
const base: CrackInput = {
  geometry: "center-through",
  initial_mm: 1,
  form: "cylinder",
  shellRadius_mm: 1500,
  thickness_mm: 1.6,
  stressMax_MPa: 100,
  stressMin_MPa: 0,
  yield_MPa: 325,
  parisC: 1.2e-11,
  parisM: 3.4,
  toughness_MPaSqrtM: 70,
  inspectionFactor: 2,
  // The flat-sheet methods first: bulging is on by default in a check and tested on its own below.
  bulging: false,
};

/** Closed-form Paris life written out afresh (not via the module): constant Y, a in metres. */
function parisLife(a0_m: number, ac_m: number, C: number, m: number, Y: number, dS: number): number {
  const k = Y * dS * Math.sqrt(Math.PI);
  return m === 2 ? Math.log(ac_m / a0_m) / (C * k * k) : (a0_m ** (1 - m / 2) - ac_m ** (1 - m / 2)) / (C * k ** m * (m / 2 - 1));
}

function inputError(f: () => unknown): InputError {
  try {
    f();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error("expected an InputError");
}

describe("critical crack size", () => {
  it("is (K_c/(Y·σmax))²/π for a constant geometry factor", () => {
    // Irwin: K = Y·σ·√(πa) = K_c → a_c = (K_c/(Yσ))²/π (Tada, Paris & Irwin; closed form).
    // This is the LEFM limit of the failure assessment diagram (Kr = 1).
    const r = crackGrowth(base);
    expect(r.fad.lefm_mm).toBeCloseTo(((70 / 100) ** 2 / Math.PI) * 1000, 9);
    const edge = crackGrowth({ ...base, geometry: "edge-through" });
    expect(edge.fad.lefm_mm).toBeCloseTo(((70 / (1.1215 * 100)) ** 2 / Math.PI) * 1000, 9);
  });

  it("solves the secant-corrected strip by its fixed point", () => {
    const r = crackGrowth({ ...base, width_mm: 400, yield_MPa: 1000 });
    // At the root, √sec(πa/W)·σ·√(πa) = K_c (Feddersen, Tada, Paris & Irwin).
    const a = r.fad.lefm_mm;
    expect(secantCorrection(a, 400) * 100 * Math.sqrt((Math.PI * a) / 1000)).toBeCloseTo(70, 9);
    expect(r.criticalBy).toBe("toughness");
  });

  it("is set by collapse of the net section when the ligament yields first", () => {
    // Centre crack, W = 100 mm, σmax = 200 MPa, σy = 325 MPa, no ultimate (Lr,max = 1): the collapse limit
    // 2a = W(1 − σ/σy) → a = 19.23 mm (hand algebra); there K ≈ 54 MPa√m, Kr ≈ 0.77, so collapse governs.
    const r = crackGrowth({ ...base, width_mm: 100, stressMax_MPa: 200 });
    expect(r.fad.collapse_mm).toBeCloseTo((100 * (1 - 200 / 325)) / 2, 9);
    expect(r.criticalBy).not.toBe("toughness");
    expect(r.critical_mm).toBeLessThanOrEqual(r.fad.collapse_mm);
    // With an ultimate strength the cut-off moves to the flow stress: σ_ref = (σy + σu)/2 (BS 7910 Option 1 cut-off, from memory).
    const flow = crackGrowth({ ...base, width_mm: 100, stressMax_MPa: 200, ultimate_MPa: 425 });
    expect(flow.fad.collapse_mm).toBeCloseTo((100 * (1 - 200 / 375)) / 2, 9);
  });

  it("refuses a crack already at or beyond critical, naming both sizes", () => {
    const e = inputError(() => crackGrowth({ ...base, initial_mm: 200 }));
    expect(e.path).toBe("crack.initial_mm");
    expect(e.message).toContain("200 mm");
    expect(e.message).toMatch(/\d+(\.\d+)? mm, set by/);
  });
});

describe("cycles to failure", () => {
  it("matches the closed-form Paris integral for constant Y to 1e-8", () => {
    // Paris & Erdogan (1963) integrated for constant Y: N = (a₀^(1−m/2) − a_c^(1−m/2))/(C(YΔσ√π)^m(m/2 − 1)).
    const r = crackGrowth(base);
    const exact = parisLife(0.001, r.critical_mm / 1000, 1.2e-11, 3.4, 1, 100);
    expect(Math.abs((r.cycles ?? 0) / exact - 1)).toBeLessThan(1e-8);
    expect(parisClosedForm(0.001, r.critical_mm / 1000, 1.2e-11, 3.4, 100 * Math.sqrt(Math.PI))).toBeCloseTo(exact, 6);
    // Edge crack in a half-plane, Y = 1.1215, m = 2 (the logarithmic case).
    const e = crackGrowth({ ...base, geometry: "edge-through", parisM: 2, parisC: 1e-10 });
    const exactLog = parisLife(0.001, e.critical_mm / 1000, 1e-10, 2, 1.1215, 100);
    expect(Math.abs((e.cycles ?? 0) / exactLog - 1)).toBeLessThan(1e-8);
  });

  it("sets the inspection interval to cycles over the inspection factor", () => {
    const r = crackGrowth({ ...base, inspectionFactor: 3 });
    expect(r.inspectionInterval_cycles).toBeCloseTo((r.cycles ?? 0) / 3, 6);
  });

  it("gives a 60-point a–N curve from the initial to the critical size", () => {
    const r = crackGrowth({ ...base, geometry: "hole-through", holeRadius_mm: 2.4, width_mm: 300 });
    expect(r.curve).toHaveLength(60);
    expect(r.curve[0]).toEqual({ a_mm: 1, n_cycles: 0 });
    expect(r.curve[59].a_mm).toBe(r.critical_mm);
    expect(r.curve[59].n_cycles).toBe(r.cycles);
    for (let i = 1; i < 60; i++) {
      expect(r.curve[i].a_mm).toBeGreaterThan(r.curve[i - 1].a_mm);
      expect(r.curve[i].n_cycles).toBeGreaterThan(r.curve[i - 1].n_cycles);
    }
  });

  it("applies Walker's R-ratio form as a constant factor on ΔK", () => {
    // ΔK_eff = ΔK/(1 − R)^(1 − γ) (Walker 1970; Dowling ch. 11, from memory). With R = 0.5 and γ = 0.5 the factor
    // is √2, so the closed-form life divides by (√2)^m; the critical size (set by σmax) is unchanged.
    const r = crackGrowth({ ...base, stressMax_MPa: 100, stressMin_MPa: 50, walkerGamma: 0.5 });
    const exact = parisLife(0.001, r.critical_mm / 1000, 1.2e-11, 3.4, Math.SQRT2, 50);
    expect(Math.abs((r.cycles ?? 0) / exact - 1)).toBeLessThan(1e-8);
    expect(r.fad.lefm_mm).toBeCloseTo((0.7 ** 2 / Math.PI) * 1000, 9);
    // Without γ the high stress ratio draws a warning.
    expect(
      crackGrowth({ ...base, stressMin_MPa: 60 })
        .warnings.map(warningText)
        .some((w) => w.includes("stress ratio")),
    ).toBe(true);
  });

  it("leaves the compressive part of the cycle out of the range", () => {
    const r = crackGrowth({ ...base, stressMin_MPa: -30 });
    const same = crackGrowth(base);
    expect(r.cycles).toBe(same.cycles);
    expect(r.warnings.map(warningText).some((w) => w.includes("compression"))).toBe(true);
  });

  it("does not call a valley below zero by rounding alone compression", () => {
    // A history that empties to zero pressure can leave the hoop stress at −7×10⁻¹⁵ MPa by floating-point rounding.
    const r = crackGrowth({ ...base, stressMin_MPa: -7.105e-15 });
    expect(r.cycles).toBe(crackGrowth({ ...base, stressMin_MPa: 0 }).cycles);
    expect(r.warnings.map(warningText).some((w) => w.includes("compression"))).toBe(false);
  });

  it("reports no growth for a steady stress", () => {
    const r = crackGrowth({ ...base, stressMin_MPa: 100 });
    expect(r.cycles).toBeNull();
    expect(r.inspectionInterval_cycles).toBeNull();
    expect(r.curve).toEqual([]);
  });

  it("loses cycles as the stress range grows (property)", () => {
    fc.assert(
      fc.property(
        fc.constantFrom<CrackInput["geometry"]>("center-through", "edge-through", "hole-through"),
        fc.double({ min: 20, max: 120, noNaN: true }),
        fc.double({ min: 1.01, max: 1.5, noNaN: true }),
        (geometry, sMax, k) => {
          const opts = { ...base, geometry, holeRadius_mm: 3, width_mm: 500 };
          const low = crackGrowth({ ...opts, stressMax_MPa: sMax }).cycles ?? 0;
          const high = crackGrowth({ ...opts, stressMax_MPa: sMax * k }).cycles ?? 0;
          return high < low;
        },
      ),
      { numRuns: 40 },
    );
  });
});

describe("bulging", () => {
  it("shortens the critical size by Folias's factor; the sphere has its own", () => {
    const flat = crackGrowth(base);
    const bulged = crackGrowth({ ...base, bulging: true });
    expect(bulged.fad.lefm_mm).toBeLessThan(flat.fad.lefm_mm);
    // At the LEFM root, M·σ·√(πa) = K_c with M = √(1 + 1.61a²/(Rt)) (Folias 1965, from memory).
    const a = bulged.fad.lefm_mm;
    expect(foliasFactor(a, 1500, 1.6) * 100 * Math.sqrt((Math.PI * a) / 1000)).toBeCloseTo(70, 9);
    expect((bulged.cycles ?? 0) < (flat.cycles ?? 0)).toBe(true);
    // Sphere: M = √(1 + 1.93c²/(Rt)) (Folias, spherical shell, from memory) — shorter than the cylinder's.
    const sphere = crackGrowth({ ...base, form: "sphere", bulging: true });
    const s = sphere.fad.lefm_mm;
    expect(Math.sqrt(1 + (1.93 * s * s) / (1500 * 1.6)) * 100 * Math.sqrt((Math.PI * s) / 1000)).toBeCloseTo(70, 9);
    expect(s).toBeLessThan(a);
    // Circumferential crack: M = √(1 + 0.32c²/(Rt)) (from memory): bulges less than the axial crack.
    const circ = crackGrowth({ ...base, orientation: "circumferential", bulging: true });
    expect(circ.fad.lefm_mm).toBeGreaterThan(a);
    expect(circ.fad.lefm_mm).toBeLessThan(flat.fad.lefm_mm);
  });

  it("warns that switching it off is unconservative", () => {
    expect(
      crackGrowth(base)
        .warnings.map(warningText)
        .some((w) => w.includes("unconservative")),
    ).toBe(true);
    expect(
      crackGrowth({ ...base, bulging: true })
        .warnings.map(warningText)
        .some((w) => w.includes("switched off")),
    ).toBe(false);
  });
});

describe("leak before break", () => {
  it("holds for a thin, tough skin", () => {
    const r = crackGrowth(base);
    expect(r.leakBeforeBreak?.leakBeforeBreak).toBe(true);
    expect(r.leakBeforeBreak?.throughWallHalfLength_mm).toBe(1.6);
    expect(r.leakBeforeBreak?.criticalHalfLength_mm).toBeCloseTo(r.critical_mm, 6); // same centre-crack field
  });

  it("fails for a thick wall of low toughness", () => {
    // t = 30 mm, σ = 200 MPa, K_c = 40 MPa√m: critical half-length (40/200)²/π m = 12.7 mm < t (Irwin, closed form).
    // With σy = 5000 MPa the collapse ratio stays small (Lr = 0.04, f(Lr) = 0.9992), so the diagram's size lies within 0.2 % of it.
    const r = crackGrowth({ ...base, thickness_mm: 30, stressMax_MPa: 200, toughness_MPaSqrtM: 40, initial_mm: 2, yield_MPa: 5000 });
    expect(r.leakBeforeBreak?.leakBeforeBreak).toBe(false);
    expect(Math.abs((r.leakBeforeBreak?.criticalHalfLength_mm ?? 0) / ((0.2 ** 2 / Math.PI) * 1000) - 1)).toBeLessThan(0.002);
    expect(r.warnings.map(warningText).some((w) => w.includes("without leaking"))).toBe(true);
  });
});

describe("input problems", () => {
  it("names the field", () => {
    expect(inputError(() => crackGrowth({ ...base, geometry: "hole-through" })).path).toBe("crack.holeRadius_mm");
    expect(inputError(() => crackGrowth({ ...base, initial_mm: 0 })).path).toBe("crack.initial_mm");
    expect(inputError(() => crackGrowth({ ...base, parisC: -1 })).path).toBe("material.parisC");
    expect(inputError(() => crackGrowth({ ...base, stressMax_MPa: -5, stressMin_MPa: -10 })).path).toBe("pressure.max_MPa");
    expect(inputError(() => crackGrowth({ ...base, inspectionFactor: 0.5 })).path).toBe("crack.inspectionFactor");
    expect(inputError(() => crackGrowth({ ...base, width_mm: 1.5 })).path).toBe("crack.initial_mm");
    expect(inputError(() => crackGrowth({ ...base, width_mm: 100, stressMax_MPa: 400, yield_MPa: 325 })).path).toBe("pressure.max_MPa");
  });
});
