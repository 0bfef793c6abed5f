import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import * as ss from "simple-statistics";
import {
  bracketRoot,
  erfc,
  fQuantileDf1Two,
  integrate,
  lnGamma,
  noncentralTCdf,
  noncentralTQuantile,
  normalCdf,
  normalPdf,
  normalQuantile,
} from "../../src/engine/special.ts";

// jstat ships no type declarations; only the few functions used here are typed.
interface JStat {
  normal: { cdf(x: number, mean: number, sd: number): number; inv(p: number, mean: number, sd: number): number };
  studentt: { cdf(x: number, df: number): number; inv(p: number, df: number): number };
  noncentralt: { cdf(x: number, df: number, ncp: number): number };
  chisquare: { cdf(x: number, df: number): number };
  centralF: { inv(p: number, df1: number, df2: number): number };
  gammaln(x: number): number;
  erfc(x: number): number;
}
const { jStat } = createRequire(import.meta.url)("jstat") as { jStat: JStat };

describe("erfc and the normal distribution", () => {
  it("matches the high-precision values of the error function", () => {
    // Abramowitz & Stegun, Handbook of Mathematical Functions, Table 7.1 (erf to 15 places), from memory.
    expect(1 - erfc(0.5)).toBeCloseTo(0.520499877813047, 14);
    expect(1 - erfc(1)).toBeCloseTo(0.842700792949715, 14);
    expect(1 - erfc(2)).toBeCloseTo(0.995322265018953, 14);
    // erfc(3) = 2.209049699858544e-5 (A&S ch. 7, from memory) — relative check in the tail.
    expect(erfc(3) / 2.209049699858544e-5).toBeCloseTo(1, 12);
  });

  it("agrees with jstat's erfc and simple-statistics' erf at moderate arguments", () => {
    for (const x of [0.05, 0.3, 0.9, 1.2, 1.25, 1.5, 2.5, 3.5]) {
      expect(erfc(x)).toBeCloseTo(jStat.erfc(x), 13); // cross-check against jstat
      expect(1 - erfc(x)).toBeCloseTo(ss.errorFunction(x), 6); // simple-statistics' erf is good to ~1e-7
    }
  });

  it("gives standard normal table values", () => {
    // Standard normal table (e.g. Abramowitz & Stegun Table 26.1), values from memory.
    expect(normalCdf(1)).toBeCloseTo(0.841344746068543, 14);
    expect(normalCdf(1.96)).toBeCloseTo(0.97500210485178, 13);
    expect(normalCdf(-1)).toBeCloseTo(0.158655253931457, 14);
    // Φ(−3) = 1.3498980316301e-3 (A&S Table 26.1, from memory); checked relative in the lower tail.
    expect(normalCdf(-3) / 1.3498980316301e-3).toBeCloseTo(1, 11);
    // Φ(−10) = 7.6198530241605e-24 (A&S ch. 26 tables, from memory).
    expect(normalCdf(-10) / 7.6198530241605e-24).toBeCloseTo(1, 10);
  });

  it("agrees with jstat's normal cdf and is the integral of its density", () => {
    for (const x of [-6, -2.2, -0.4, 0, 0.7, 1.9, 4]) {
      expect(normalCdf(x)).toBeCloseTo(jStat.normal.cdf(x, 0, 1), 14); // cross-check against jstat
    }
    // Closed-form cross-check: Φ(2) − Φ(−1) equals the numerical integral of φ.
    expect(integrate(normalPdf, -1, 2, { relTol: 1e-14 })).toBeCloseTo(normalCdf(2) - normalCdf(-1), 14);
  });

  it("gives the familiar normal quantiles", () => {
    // Normal quantiles to 15 digits (A&S ch. 26 tables; from memory).
    expect(normalQuantile(0.975)).toBeCloseTo(1.959963984540054, 13);
    expect(normalQuantile(0.95)).toBeCloseTo(1.644853626951472, 13);
    expect(normalQuantile(0.99)).toBeCloseTo(2.326347874040841, 13);
    expect(normalQuantile(0.9)).toBeCloseTo(1.281551565544601, 13);
    expect(normalQuantile(0.999)).toBeCloseTo(3.090232306167813, 12);
    expect(normalQuantile(0.5)).toBe(0);
  });

  it("inverts normalCdf to 1e-12 over the whole range (property)", () => {
    // Round trip Φ(Φ⁻¹(p)) = p, relative; a closed-form identity.
    fc.assert(
      fc.property(fc.double({ min: 1e-300, max: 1 - 1e-12, noNaN: true }), (p) => {
        const z = normalQuantile(p);
        const back = p < 0.5 ? normalCdf(z) : 1 - normalCdf(-z);
        return Math.abs(back - p) <= 1e-12 * p + 1e-300;
      }),
    );
    // Cross-check against jstat and (loosely, its approximation is coarse) simple-statistics' probit.
    for (const p of [0.001, 0.02, 0.3, 0.77, 0.999]) expect(normalQuantile(p)).toBeCloseTo(jStat.normal.inv(p, 0, 1), 8);
    for (const p of [0.05, 0.3, 0.77, 0.95]) expect(normalQuantile(p)).toBeCloseTo(ss.probit(p), 2);
  });
});

describe("lnGamma", () => {
  it("matches exact values", () => {
    // Γ(1/2) = √π and Γ(n) = (n − 1)! — closed forms.
    expect(lnGamma(0.5)).toBeCloseTo(Math.log(Math.sqrt(Math.PI)), 14);
    expect(lnGamma(1)).toBeCloseTo(0, 14);
    expect(lnGamma(5)).toBeCloseTo(Math.log(24), 14);
    let lnFactorial99 = 0;
    for (let k = 2; k <= 99; k++) lnFactorial99 += Math.log(k);
    expect(lnGamma(100) / lnFactorial99).toBeCloseTo(1, 14);
    // Γ(1/3) = 2.678938534707747 (A&S ch. 6, from memory).
    expect(Math.exp(lnGamma(1 / 3))).toBeCloseTo(2.678938534707747, 13);
  });

  it("agrees with jstat and satisfies Γ(x + 1) = x·Γ(x) (property)", () => {
    for (const x of [0.1, 0.75, 3.3, 12.5, 170]) expect(lnGamma(x) / jStat.gammaln(x)).toBeCloseTo(1, 12);
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 1e4, noNaN: true }), (x) => {
        return Math.abs(lnGamma(x + 1) - lnGamma(x) - Math.log(x)) <= 1e-12 * Math.max(1, Math.abs(lnGamma(x + 1)));
      }),
    );
  });
});

describe("integrate and bracketRoot", () => {
  it("integrates smooth functions to their closed forms", () => {
    expect(integrate(Math.sin, 0, Math.PI, { relTol: 1e-14 })).toBeCloseTo(2, 14); // ∫₀^π sin = 2
    expect(integrate((x) => 1 / x, 1, 1000, { relTol: 1e-12 })).toBeCloseTo(Math.log(1000), 11); // ∫ dx/x = ln
    expect(integrate((x) => Math.sqrt(x), 0, 1, { relTol: 1e-12 })).toBeCloseTo(2 / 3, 10); // endpoint singularity
  });

  it("finds bracketed roots", () => {
    expect(bracketRoot((x) => x * x - 2, 0, 2)).toBeCloseTo(Math.SQRT2, 13); // √2
    expect(bracketRoot((x) => Math.cos(x) - x, 0, 1)).toBeCloseTo(0.739085133215161, 12); // Dottie number, from memory
    expect(() => bracketRoot((x) => x * x + 1, -1, 1)).toThrow(RangeError);
  });
});

describe("non-central t distribution", () => {
  it("reduces to Student's t when δ = 0", () => {
    // Closed forms: ν = 1 is the Cauchy law, F = ½ + atan(t)/π; ν = 2 gives F = ½ + t/(2√(2 + t²)).
    for (const t of [-3, -0.4, 0.8, 5]) {
      expect(noncentralTCdf(t, 1, 0)).toBeCloseTo(0.5 + Math.atan(t) / Math.PI, 12);
      expect(noncentralTCdf(t, 2, 0)).toBeCloseTo(0.5 + t / (2 * Math.sqrt(2 + t * t)), 12);
    }
    // Even ν: F = ½ + ½·sinθ·(1 + ½cos²θ + (1·3)/(2·4)cos⁴θ + …), θ = atan(t/√ν) (A&S §26.7, from memory).
    const evenNu = (t: number, nu: number) => {
      const sin = t / Math.sqrt(nu + t * t);
      let term = 1;
      let sum = 1;
      for (let j = 1; j < nu / 2; j++) {
        term *= ((2 * j - 1) / (2 * j)) * (1 - sin * sin);
        sum += term;
      }
      return 0.5 + 0.5 * sin * sum;
    };
    for (const t of [-2, 0.3, 2.5]) {
      expect(noncentralTCdf(t, 10, 0)).toBeCloseTo(evenNu(t, 10), 13);
      expect(noncentralTCdf(t, 10, 0)).toBeCloseTo(jStat.studentt.cdf(t, 10), 9); // jstat, to its precision
    }
    expect(evenNu(noncentralTQuantile(0.9, 8, 0), 8)).toBeCloseTo(0.9, 12);
  });

  it("gives Student t table quantiles", () => {
    // Student t table, upper-tail critical values (the standard table in any statistics text), from memory.
    expect(noncentralTQuantile(0.95, 5, 0)).toBeCloseTo(2.015, 3);
    expect(noncentralTQuantile(0.975, 10, 0)).toBeCloseTo(2.228, 3);
    expect(noncentralTQuantile(0.99, 20, 0)).toBeCloseTo(2.528, 3);
    expect(noncentralTQuantile(0.995, 30, 0)).toBeCloseTo(2.75, 3);
    expect(noncentralTQuantile(0.975, 1, 0)).toBeCloseTo(12.706, 3);
    // And jstat's Student t inverse, to its precision (about 1e-8).
    expect(noncentralTQuantile(0.9, 7, 0)).toBeCloseTo(jStat.studentt.inv(0.9, 7), 7);
  });

  it("agrees with jstat's non-central t at moderate δ", () => {
    // jstat sums a series that is sound for small δ; agreement to about 1e-8.
    for (const [t, df, d] of [
      [2, 5, 1],
      [5, 10, 3],
      [8, 9, 4.05],
      [-1, 3, 1],
      [12, 19, 8],
    ]) {
      expect(noncentralTCdf(t, df, d)).toBeCloseTo(jStat.noncentralt.cdf(t, df, d), 7);
    }
  });

  it("stays accurate for large δ (independent integration over the normal variable)", () => {
    // Cross-check by the other conditioning: for t > 0, P(T ≤ t) = ∫ φ(z)·P(χ²_ν ≥ ν((z + δ)/t)²) dz,
    // by composite Simpson in z with the closed-form chi-square tail: a Poisson sum for even ν,
    // erfc forms for ν = 1 and 3 (A&S §26.4, from memory).
    const chiSquareUpper = (x: number, nu: number) => {
      if (nu === 1) return erfc(Math.sqrt(x / 2));
      if (nu === 3) return erfc(Math.sqrt(x / 2)) + Math.sqrt((2 * x) / Math.PI) * Math.exp(-x / 2);
      let sum = 0;
      for (let k = 0; k < nu / 2; k++) sum += Math.exp(-x / 2 + k * Math.log(x / 2) - lnGamma(k + 1));
      return sum;
    };
    const byOtherRoute = (t: number, df: number, d: number) => {
      const lo = -12;
      const hi = 12;
      const m = 4000;
      const h = (hi - lo) / m;
      let sum = 0;
      for (let i = 0; i <= m; i++) {
        const z = lo + i * h;
        const w = i === 0 || i === m ? 1 : i % 2 ? 4 : 2;
        const q = (z + d) / t;
        const tail = q <= 0 ? 1 : chiSquareUpper(df * q * q, df);
        sum += w * normalPdf(z) * tail;
      }
      return (sum * h) / 3;
    };
    for (const [t, df, d] of [
      [70, 40, 60],
      [66, 664, 60],
      [45, 30, 40],
      [1000, 1, 60],
      [200, 3, 60],
      [500, 2, 60],
    ]) {
      expect(noncentralTCdf(t, df, d)).toBeCloseTo(byOtherRoute(t, df, d), 12);
    }
    // jstat's chi-square cdf agrees at a moderate point (a check on the check).
    expect(1 - jStat.chisquare.cdf(30, 40)).toBeCloseTo(chiSquareUpper(30, 40), 8);
  });

  it("is monotone in t and its quantile inverts the cdf (property)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 200 }),
        fc.double({ min: -5, max: 60, noNaN: true }),
        fc.double({ min: 0.01, max: 0.99, noNaN: true }),
        (df, d, p) => {
          const t = noncentralTQuantile(p, df, d);
          const back = noncentralTCdf(t, df, d);
          return Math.abs(back - p) < 1e-9 && noncentralTCdf(t + 0.01 * (1 + Math.abs(t)), df, d) > back;
        },
      ),
      { numRuns: 40 },
    );
  });
});

describe("F quantile with 2 numerator degrees of freedom", () => {
  it("matches F tables", () => {
    // F distribution table, upper 5 % and 1 % points, ν₁ = 2 (the standard table in any statistics text), from memory.
    expect(fQuantileDf1Two(0.95, 10)).toBeCloseTo(4.1, 2);
    expect(fQuantileDf1Two(0.95, 5)).toBeCloseTo(5.79, 2);
    expect(fQuantileDf1Two(0.95, 20)).toBeCloseTo(3.49, 2);
    expect(fQuantileDf1Two(0.99, 10)).toBeCloseTo(7.56, 2);
    expect(fQuantileDf1Two(0.95, 1)).toBeCloseTo(199.5, 1);
  });

  it("agrees with jstat's F inverse", () => {
    for (const [p, df2] of [
      [0.95, 3],
      [0.9, 7],
      [0.99, 25],
      [0.5, 12],
    ]) {
      expect(fQuantileDf1Two(p, df2)).toBeCloseTo(jStat.centralF.inv(p, 2, df2), 8);
    }
  });
});
