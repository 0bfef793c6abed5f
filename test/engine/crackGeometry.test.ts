import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  EDGE_HALF_PLANE,
  bowieOneCrack,
  bowieTwoCracks,
  foliasFactor,
  geometryFactor,
  grossSrawley,
  secantCorrection,
  type CrackShape,
} from "../../src/engine/crackGeometry.ts";

const centre = (W?: number): CrackShape => ({ geometry: "center-through", width_mm: W, cracksAtHole: 1 });
const edge = (W?: number): CrackShape => ({ geometry: "edge-through", width_mm: W, cracksAtHole: 1 });
const hole = (R: number, n: 1 | 2, W?: number): CrackShape => ({
  geometry: "hole-through",
  holeRadius_mm: R,
  cracksAtHole: n,
  width_mm: W,
});

describe("centre through-crack", () => {
  it("is 1 in a wide sheet and follows Feddersen's secant in a strip", () => {
    expect(geometryFactor(5, centre())).toBe(1); // Griffith–Irwin centre crack, Y = 1
    // √sec(π/4) = 2^(1/4) at 2a/W = 0.5 (closed form).
    expect(geometryFactor(25, centre(100))).toBeCloseTo(2 ** 0.25, 14);
  });

  it("stays within 0.3 % of the handbook's accurate values up to 2a/W = 0.7", () => {
    // Tada, Paris & Irwin, centre-cracked strip, tabulated (Isida) values of F(2a/W), from memory.
    const table: [number, number][] = [
      [0.1, 1.006],
      [0.2, 1.0246],
      [0.3, 1.0577],
      [0.4, 1.1094],
      [0.5, 1.1867],
      [0.6, 1.3033],
      [0.7, 1.4882],
    ];
    // Tada's improved formula F = (1 − 0.025λ² + 0.06λ⁴)·√sec(πλ/2), quoted at 0.1 % for any λ (same handbook, from memory).
    const tada = (l: number) => (1 - 0.025 * l * l + 0.06 * l ** 4) * Math.sqrt(1 / Math.cos((Math.PI * l) / 2));
    for (const [lambda, F] of table) {
      const Y = geometryFactor(lambda * 50, centre(100));
      expect(Math.abs(Y / F - 1)).toBeLessThan(0.003);
      expect(Math.abs(Y / tada(lambda) - 1)).toBeLessThan(0.003);
      expect(Math.abs(tada(lambda) / F - 1)).toBeLessThan(0.001); // the two recalled sources agree
    }
  });
});

describe("edge through-crack", () => {
  it("is 1.1215 in a half-plane", () => {
    // Tada, Paris & Irwin, edge crack in a semi-infinite plate: 1.1215 (from memory).
    expect(geometryFactor(3, edge())).toBe(1.1215);
    expect(EDGE_HALF_PLANE).toBe(1.1215);
    // The Gross–Srawley polynomial starts at 1.12 (its leading coefficient).
    expect(grossSrawley(0)).toBe(1.12);
  });

  it("agrees with Tada's any-width formula within 0.5 % for a/W from 0.2 to 0.6", () => {
    // Tada, Paris & Irwin, single edge crack in a strip: Gross–Srawley polynomial (0.5 % for a/W ≤ 0.6) and
    // F = √(tan(πα/2)/(πα/2))·[0.752 + 2.02α + 0.37(1 − sin(πα/2))³]/cos(πα/2) (0.5 % for any α); both from memory.
    // Below a/W = 0.2 the two differ by up to 1.3 %, more than their quoted accuracies allow, so one recalled
    // detail is off there; the comparison is left out below 0.2 rather than loosened.
    const tada = (a: number) => {
      const x = (Math.PI * a) / 2;
      return (Math.sqrt(Math.tan(x) / x) * (0.752 + 2.02 * a + 0.37 * (1 - Math.sin(x)) ** 3)) / Math.cos(x);
    };
    for (const alpha of [0.2, 0.3, 0.4, 0.5, 0.6]) {
      expect(Math.abs(geometryFactor(alpha * 40, edge(40)) / tada(alpha) - 1)).toBeLessThan(0.005);
    }
    // Hand value of the polynomial at α = 0.5: 1.12 − 0.1155 + 2.6375 − 2.715 + 1.899375 = 2.826375.
    expect(grossSrawley(0.5)).toBeCloseTo(2.826375, 12);
    // Beyond 0.6 the any-width formula takes over (the polynomial reads low there).
    expect(geometryFactor(0.7 * 40, edge(40))).toBeCloseTo(tada(0.7), 12);
  });
});

describe("through-cracks at a hole", () => {
  it("has the exact limits of Bowie's solution", () => {
    // s → 0: an edge crack at the hole's concentration, 3 × 1.1215 = 3.3645; s → 1: a centre crack of half-length R + a.
    expect(bowieTwoCracks(0)).toBeCloseTo(3 * 1.1215, 4);
    expect(bowieTwoCracks(1)).toBe(1);
    // One crack (the quartic fit of the table): short-crack limit 3.39 in the table (3 × 1.1215 = 3.36 exactly), long-crack
    // limit √(1/2) = 0.7071, a centre crack of half-length R + a/2; the fit holds both within 1 %.
    expect(Math.abs(geometryFactor(1e-9, hole(5, 1)) / 3.39 - 1)).toBeLessThan(0.01);
    const long = 1e9;
    expect(Math.abs(geometryFactor(long, hole(5, 1)) / Math.SQRT1_2 - 1)).toBeLessThan(0.001);
    const twoLong = 1e9;
    expect(geometryFactor(twoLong, hole(5, 2)) * Math.sqrt(twoLong)).toBeCloseTo(Math.sqrt(twoLong + 5), 3);
  });

  it("matches Bowie's two-crack values in the middle range", () => {
    // Bowie (1956) two symmetric cracks, uniaxial tension, F at a/R = 0.5, 1, 2: 1.83, 1.45, 1.21
    // (as tabulated in Broek, Elementary Engineering Fracture Mechanics; from memory).
    for (const [ratio, F] of [
      [0.5, 1.83],
      [1, 1.45],
      [2, 1.21],
    ]) {
      expect(Math.abs(geometryFactor(ratio * 4, hole(4, 2)) / F - 1)).toBeLessThan(0.01);
    }
  });

  it("follows Bowie's one-crack table across the whole range", () => {
    // Bowie (1956) one crack at a hole, uniaxial tension, F against a/R (as tabulated in Broek, Elementary
    // Engineering Fracture Mechanics, and Rooke & Cartwright; from memory).
    const table: [number, number][] = [
      [0.1, 2.73],
      [0.2, 2.3],
      [0.3, 2.04],
      [0.4, 1.86],
      [0.5, 1.73],
      [0.6, 1.64],
      [0.8, 1.47],
      [1, 1.37],
      [1.5, 1.18],
      [2, 1.06],
      [3, 0.94],
      [5, 0.81],
      [10, 0.75],
    ];
    for (const [ratio, F] of table) {
      const Y = geometryFactor(ratio * 4, hole(4, 1));
      expect(Math.abs(Y / F - 1)).toBeLessThan(0.035); // within 3.5 % everywhere …
      expect(Y / F - 1).toBeGreaterThan(-0.01); // … and never more than 1 % below the table
      if (ratio <= 3) expect(Math.abs(Y / F - 1)).toBeLessThan(0.01); // the fit itself, up to a = 3R
    }
    // The mid-range, where the former interpolation between the limits read 9 % low: a/R = 1 gives 1.37, not 1.25.
    expect(bowieOneCrack(0.5)).toBeCloseTo(1.365, 3);
  });

  it("applies the secant correction on R + a in a strip", () => {
    const s = 3 / (2 + 3);
    expect(geometryFactor(3, hole(2, 2, 40))).toBeCloseTo(bowieTwoCracks(s) * secantCorrection(5, 40), 14);
  });
});

describe("Folias bulging factor", () => {
  it("is √(1 + 1.61·c²/(R·t))", () => {
    // Folias (1965), short form (from memory): c = 20 mm, R = 1000 mm, t = 2 mm → √(1 + 1.61 × 0.2) = √1.322.
    expect(foliasFactor(20, 1000, 2)).toBeCloseTo(Math.sqrt(1.322), 14);
    expect(foliasFactor(0, 1000, 2)).toBe(1);
  });
});

describe("stress intensity grows with the crack (property)", () => {
  it("Y·√a rises with a for every geometry", () => {
    const shapes = [centre(), centre(120), edge(), edge(60), hole(3, 1), hole(3, 2), hole(3, 2, 80), hole(3, 1, 80)];
    fc.assert(
      fc.property(
        fc.constantFrom(...shapes),
        fc.double({ min: 0.01, max: 20, noNaN: true }),
        fc.double({ min: 1.001, max: 1.5, noNaN: true }),
        (shape, a, k) => {
          return geometryFactor(a * k, shape) * Math.sqrt(a * k) > geometryFactor(a, shape) * Math.sqrt(a);
        },
      ),
    );
  });
});
