/**
 * @module test/engine/evidence.test
 * The lower tolerance bound on life from tested articles, and the warnings about the evidence.
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import * as ss from "simple-statistics";
import { evaluateEvidence, toleranceFactorKnownSigma, toleranceFactorSample } from "../../src/engine/evidence.ts";
import { InputError } from "../../src/engine/errors.ts";
import { normalQuantile } from "../../src/engine/special.ts";
import { normals, seeded } from "./random.ts";
import { warningText } from "../../src/engine/phrase.ts";

describe("one-sided tolerance factors", () => {
  // One-sided normal tolerance factors, B-basis (90 % of the population, 95 % confidence) and
  // A-basis (99 %, 95 %), as tabulated in MIL-HDBK-5 / MMPDS and Natrella, NBS Handbook 91, Table A-7.
  // All values from memory; each reproduced here within 0.003.
  const bBasis: [number, number][] = [
    [2, 20.581],
    [3, 6.156],
    [4, 4.162],
    [5, 3.407],
    [10, 2.355],
    [20, 1.926],
  ];
  const aBasis: [number, number][] = [
    [2, 37.094],
    [3, 10.553],
    [5, 5.741],
    [10, 3.981],
    [20, 3.295],
  ];
  it.each(bBasis)("B-basis, n = %i: k = %f (MMPDS / Natrella A-7, from memory)", (n, k) => {
    expect(Math.abs(toleranceFactorSample(n, 0.9, 0.95) - k)).toBeLessThan(0.003);
  });
  it.each(aBasis)("A-basis, n = %i: k = %f (MMPDS / Natrella A-7, from memory)", (n, k) => {
    expect(Math.abs(toleranceFactorSample(n, 0.99, 0.95) - k)).toBeLessThan(0.003);
  });

  it("known-σ factor is z_p + z_γ/√n", () => {
    // z_0.90 = 1.28155, z_0.95 = 1.64485 (standard normal table, from memory): n = 3 gives 1.28155 + 1.64485/√3.
    expect(toleranceFactorKnownSigma(3, 0.9, 0.95)).toBeCloseTo(1.28155 + 1.64485 / Math.sqrt(3), 4);
    // With 50 % confidence the bound is the p-quantile itself: k = z_p (closed form).
    expect(toleranceFactorKnownSigma(7, 0.99, 0.5)).toBeCloseTo(normalQuantile(0.99), 12);
  });

  it("covers the population quantile with the stated confidence (Monte Carlo, seeded)", () => {
    // Definition of a tolerance bound: P(x̄ − k·s ≤ μ − z_p·σ) = γ. 20 000 samples of n = 5 give a
    // binomial standard error of √(0.95·0.05/20000) ≈ 0.0015; the check allows four of them.
    const z = normals(seeded(12345));
    const n = 5;
    const k = toleranceFactorSample(n, 0.9, 0.95);
    const kKnown = toleranceFactorKnownSigma(n, 0.9, 0.95);
    const target = -normalQuantile(0.9);
    let covered = 0;
    let coveredKnown = 0;
    const trials = 20000;
    for (let i = 0; i < trials; i++) {
      const xs = Array.from({ length: n }, z);
      const mean = ss.mean(xs);
      if (mean - k * ss.sampleStandardDeviation(xs) <= target) covered++;
      if (mean - kKnown <= target) coveredKnown++;
    }
    expect(Math.abs(covered / trials - 0.95)).toBeLessThan(0.006);
    expect(Math.abs(coveredKnown / trials - 0.95)).toBeLessThan(0.006);
  });

  it("falls as the sample grows and rises with confidence (property)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 60 }), fc.double({ min: 0.6, max: 0.999, noNaN: true }), (n, p) => {
        const k = toleranceFactorSample(n, p, 0.95);
        return toleranceFactorSample(n + 1, p, 0.95) < k && toleranceFactorSample(n, p, 0.99) > k;
      }),
      { numRuns: 30 },
    );
  });
});

describe("evaluateEvidence", () => {
  const lives = [41000, 52000, 47000]; // invented test results

  it("computes the log mean and sample standard deviation (cross-check with simple-statistics)", () => {
    const r = evaluateEvidence({ lives_cycles: lives, reliability: 0.9, confidence: 0.95 }, 5000, 3);
    const logs = lives.map(Math.log10);
    expect(r.n).toBe(3);
    expect(r.logMean).toBeCloseTo(ss.mean(logs), 14);
    expect(r.logStdDev).toBeCloseTo(ss.sampleStandardDeviation(logs), 14);
    expect(r.logStdDevFrom).toBe("sample");
    // B-basis k for n = 3 is 6.156 (MMPDS / Natrella A-7, from memory).
    expect(Math.abs(r.toleranceFactor - 6.156)).toBeLessThan(0.003);
    // Lower bound and implied scatter follow from their definitions (closed form).
    const s = ss.sampleStandardDeviation(logs);
    expect(r.lowerBound_cycles).toBeCloseTo(10 ** (ss.mean(logs) - r.toleranceFactor * s), 6);
    expect(r.impliedScatterFactor).toBeCloseTo(10 ** (r.toleranceFactor * s), 10);
    expect(r.supportsDesignLife).toBe(true);
    expect(r.steps.map((x) => x.id)).toContain("evidence-lower-bound");
  });

  it("warns when the evidence implies a larger scatter factor than the one in use", () => {
    const r = evaluateEvidence({ lives_cycles: lives, reliability: 0.9, confidence: 0.95 }, 5000, 1.5);
    // Implied scatter factor 10^(k·s) ≈ 10^(6.156 × 0.0518) ≈ 2.08 by hand (k from MMPDS, from memory).
    expect(r.impliedScatterFactor).toBeGreaterThan(2);
    expect(r.impliedScatterFactor).toBeLessThan(2.15);
    expect(r.warnings.map(warningText).some((w) => w.includes("scatter factor") && w.includes("not conservative"))).toBe(true);
    const compare = r.steps.find((x) => x.id === "evidence-scatter-compare");
    expect(compare?.value).toBeCloseTo((r.impliedScatterFactor ?? 0) / 1.5, 12);
  });

  it("refuses a bound from a single article without an assumed spread", () => {
    const r = evaluateEvidence({ lives_cycles: [60000], reliability: 0.9, confidence: 0.95 }, 20000, 3);
    expect(r.lowerBound_cycles).toBeNull();
    expect(r.impliedScatterFactor).toBeNull();
    expect(r.supportsDesignLife).toBeNull();
    expect(r.logStdDev).toBeNull();
    expect(r.warnings.map(warningText).some((w) => w.includes("single tested article"))).toBe(true);
    // Required spread with the known-σ form: (log10 60000 − log10 20000)/(z_0.90 + z_0.95/√1) (closed form).
    const k = normalQuantile(0.9) + normalQuantile(0.95);
    expect(r.toleranceFactor).toBeCloseTo(k, 12);
    expect(r.requiredLogStdDev).toBeCloseTo(Math.log10(3) / k, 12);
  });

  it("uses an assumed spread with the known-σ factor, and flags a sample that scatters more", () => {
    const one = evaluateEvidence({ lives_cycles: [60000], reliability: 0.9, confidence: 0.95, assumedLogStdDev: 0.15 }, 20000, 3);
    // k = z_0.90 + z_0.95 = 1.28155 + 1.64485 = 2.92640 (normal table, from memory); N_L = 60000 × 10^(−2.9264 × 0.15).
    expect(one.toleranceFactor).toBeCloseTo(2.9264, 4);
    expect(one.lowerBound_cycles).toBeCloseTo(60000 * 10 ** (-2.9264 * 0.15), -1);
    expect(one.supportsDesignLife).toBe(true);

    const wide = evaluateEvidence(
      { lives_cycles: [20000, 90000, 40000], reliability: 0.9, confidence: 0.95, assumedLogStdDev: 0.1 },
      5000,
      3,
    );
    expect(wide.logStdDevFrom).toBe("assumed");
    expect(wide.logStdDev).toBe(0.1);
    expect(wide.warnings.map(warningText).some((w) => w.includes("scatter more"))).toBe(true);
  });

  it("reports a design life the evidence cannot support", () => {
    const r = evaluateEvidence({ lives_cycles: lives, reliability: 0.99, confidence: 0.95 }, 40000, 3);
    expect(r.supportsDesignLife).toBe(false);
    // The largest spread that would still do is (x̄ − log10 N_design)/k, by definition.
    expect(r.requiredLogStdDev).toBeCloseTo((r.logMean - Math.log10(40000)) / r.toleranceFactor, 12);
    const below = evaluateEvidence({ lives_cycles: lives, reliability: 0.9, confidence: 0.95 }, 60000, 3);
    expect(below.requiredLogStdDev).toBeNull();
    expect(below.warnings.map(warningText).some((w) => w.includes("below the design life"))).toBe(true);
  });

  it("rejects impossible input with the field's path", () => {
    const bad = (f: () => unknown, path: string) => {
      try {
        f();
        expect.unreachable();
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        expect((e as InputError).path).toBe(path);
      }
    };
    bad(() => evaluateEvidence({ lives_cycles: [], reliability: 0.9, confidence: 0.95 }, 1000, 1), "evidence.lives_cycles");
    bad(() => evaluateEvidence({ lives_cycles: [1000, -5], reliability: 0.9, confidence: 0.95 }, 1000, 1), "evidence.lives_cycles.1");
    bad(() => evaluateEvidence({ lives_cycles: [1000], reliability: 1, confidence: 0.95 }, 1000, 1), "evidence.reliability");
    bad(() => evaluateEvidence({ lives_cycles: [1000], reliability: 0.9, confidence: 0 }, 1000, 1), "evidence.confidence");
    bad(
      () => evaluateEvidence({ lives_cycles: [1000], reliability: 0.9, confidence: 0.9, assumedLogStdDev: 0 }, 1000, 1),
      "evidence.assumedLogStdDev",
    );
  });

  it("gives a lower bound that never exceeds the geometric mean (property)", () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 1000, max: 10_000_000 }), { minLength: 2, maxLength: 12 }), (xs) => {
        const r = evaluateEvidence({ lives_cycles: xs, reliability: 0.9, confidence: 0.95 }, 100, 1);
        return r.lowerBound_cycles !== null && r.lowerBound_cycles <= 10 ** r.logMean * (1 + 1e-12);
      }),
      { numRuns: 30 },
    );
  });
});
