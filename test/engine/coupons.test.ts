/**
 * @module test/engine/coupons.test
 * The coupon fit after ASTM E739: the Basquin line, its band and what it leaves out.
 */
import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import * as ss from "simple-statistics";
import { fitCoupons, type Coupon } from "../../src/engine/coupons.ts";
import { InputError } from "../../src/engine/errors.ts";
import { warningText } from "../../src/engine/phrase.ts";

interface JStat {
  centralF: { inv(p: number, df1: number, df2: number): number };
}
const { jStat } = createRequire(import.meta.url)("jstat") as { jStat: JStat };

/** Life on the Basquin line σa = σ′f·(2N)^b, solved for N. */
const basquinLife = (amplitude: number, sigmaF: number, b: number) => 0.5 * (amplitude / sigmaF) ** (1 / b);

// Invented coupon results with scatter (amplitude MPa, cycles).
const scattered: Coupon[] = [
  { amplitude_MPa: 320, life_cycles: 21000 },
  { amplitude_MPa: 320, life_cycles: 34000 },
  { amplitude_MPa: 280, life_cycles: 61000 },
  { amplitude_MPa: 280, life_cycles: 45000 },
  { amplitude_MPa: 240, life_cycles: 150000 },
  { amplitude_MPa: 240, life_cycles: 98000 },
  { amplitude_MPa: 200, life_cycles: 420000 },
  { amplitude_MPa: 200, life_cycles: 610000 },
  { amplitude_MPa: 170, life_cycles: 5000000, runout: true },
];

describe("fitCoupons", () => {
  it("recovers σ′f and b exactly from noise-free data", () => {
    // Closed-form check: points on σa = 900·(2N)^−0.102 (invented constants) give the line back.
    const coupons = [150, 200, 250, 300, 400].map((s) => ({ amplitude_MPa: s, life_cycles: basquinLife(s, 900, -0.102) }));
    const fit = fitCoupons(coupons);
    expect(fit.fatigueStrengthCoefficient_MPa).toBeCloseTo(900, 8);
    expect(fit.fatigueStrengthExponent).toBeCloseTo(-0.102, 12);
    expect(fit.logStdDev).toBeCloseTo(0, 10);
    expect(fit.rSquared).toBeCloseTo(1, 12);
    expect(fit.runouts).toBe(0);
  });

  it("matches simple-statistics' least-squares line of log N on log S", () => {
    const fit = fitCoupons(scattered);
    const failed = scattered.filter((c) => !c.runout);
    const pts = failed.map((c) => [Math.log10(c.amplitude_MPa), Math.log10(c.life_cycles)]);
    const line = ss.linearRegression(pts);
    expect(fit.B).toBeCloseTo(line.m, 12);
    expect(fit.A).toBeCloseTo(line.b, 11);
    expect(fit.rSquared).toBeCloseTo(ss.rSquared(pts, ss.linearRegressionLine(line)), 12);
    // Residual standard deviation with n − 2 (ASTM E739), recomputed by hand from the residuals.
    const resid = pts.map(([x, y]) => y - (line.b + line.m * x));
    expect(fit.logStdDev).toBeCloseTo(Math.sqrt(ss.sum(resid.map((r) => r * r)) / (pts.length - 2)), 12);
    // b = 1/B and σ′f = 10^(−A/B)/2^b (inversion of the line; Basquin form).
    expect(fit.fatigueStrengthExponent).toBeCloseTo(1 / line.m, 12);
    expect(fit.fatigueStrengthCoefficient_MPa).toBeCloseTo(10 ** (-line.b / line.m) / 2 ** (1 / line.m), 6);
  });

  it("leaves run-outs out and says how many", () => {
    const fit = fitCoupons(scattered);
    expect(fit.n).toBe(8);
    expect(fit.runouts).toBe(1);
    expect(fit.warnings.map(warningText).some((w) => w.startsWith("1 run-out was left out"))).toBe(true);
  });

  it("gives the E739 band on the median line", () => {
    const fit = fitCoupons(scattered);
    const n = 8;
    // F_0.95(2, 6) = 5.14 (standard F table, from memory) and jstat's inverse.
    const f = jStat.centralF.inv(0.95, 2, n - 2);
    expect(f).toBeCloseTo(5.14, 2);
    // At X = X̄ the half-width is √(2F)·s/√n (ASTM E739 band with the (X − X̄)² term zero).
    const xBar = ss.mean(scattered.filter((c) => !c.runout).map((c) => Math.log10(c.amplitude_MPa)));
    const atMean = fit.band(10 ** xBar, 0.95);
    const half = (Math.sqrt(2 * f) * fit.logStdDev) / Math.sqrt(n);
    expect(Math.log10(atMean.upper_cycles / atMean.median_cycles)).toBeCloseTo(half, 8);
    expect(Math.log10(atMean.median_cycles / atMean.lower_cycles)).toBeCloseTo(half, 8);
    expect(atMean.step.value).toBeCloseTo(half, 8);
    expect(atMean.extrapolated).toBe(false);
    // Median life is on the fitted line.
    expect(Math.log10(fit.band(250).median_cycles)).toBeCloseTo(fit.A + fit.B * Math.log10(250), 12);
    expect(fit.band(120).extrapolated).toBe(true);
  });

  it("widens the band away from the centre of the data (property)", () => {
    const fit = fitCoupons(scattered);
    const xBar = ss.mean(scattered.filter((c) => !c.runout).map((c) => Math.log10(c.amplitude_MPa)));
    const width = (s: number) => {
      const b = fit.band(s);
      return Math.log10(b.upper_cycles / b.lower_cycles);
    };
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 0.5, noNaN: true }), fc.double({ min: 0.01, max: 0.5, noNaN: true }), (d1, d2) => {
        const near = Math.min(d1, d2);
        const far = Math.max(d1, d2);
        return width(10 ** (xBar + far)) >= width(10 ** (xBar + near)) - 1e-12;
      }),
    );
  });

  it("refuses data that cannot make a line", () => {
    const path = (f: () => unknown) => {
      try {
        f();
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        return (e as InputError).path;
      }
      return "no error";
    };
    expect(
      path(() =>
        fitCoupons([
          { amplitude_MPa: 300, life_cycles: 1e4 },
          { amplitude_MPa: 200, life_cycles: 1e5 },
          { amplitude_MPa: 150, life_cycles: 1e7, runout: true },
        ]),
      ),
    ).toBe("material.coupons");
    // Lives rising with amplitude: slope not negative.
    expect(
      path(() =>
        fitCoupons([
          { amplitude_MPa: 100, life_cycles: 1e4 },
          { amplitude_MPa: 200, life_cycles: 1e5 },
          { amplitude_MPa: 300, life_cycles: 1e6 },
        ]),
      ),
    ).toBe("material.coupons");
    expect(
      path(() =>
        fitCoupons([
          { amplitude_MPa: 200, life_cycles: 1e4 },
          { amplitude_MPa: 200, life_cycles: 2e4 },
          { amplitude_MPa: 200, life_cycles: 3e4 },
        ]),
      ),
    ).toBe("material.coupons");
    expect(path(() => fitCoupons([{ amplitude_MPa: 200, life_cycles: 0 }]))).toBe("material.coupons.0.life_cycles");
  });
});
