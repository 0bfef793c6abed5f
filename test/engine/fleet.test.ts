import { describe, expect, it } from "vitest";
import { anyOf, firstFailureMedian, fleetView } from "../../src/engine/fleet.ts";
import { normals, seeded } from "./random.ts";

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

describe("fleet figures against a seeded Monte Carlo of the lognormal", () => {
  const mu = 5.2;
  const sigma = 0.18;
  const n = 40;
  const design = 10 ** 4.85;
  const z = normals(seeded(20261201));
  const fleets = 6000;
  const mins: number[] = [];
  let anyEarly = 0;
  const all: number[] = [];
  for (let f = 0; f < fleets; f++) {
    let min = Infinity;
    for (let i = 0; i < n; i++) {
      const x = mu + sigma * z();
      if (x < min) min = x;
      if (f < 1500) all.push(x);
    }
    mins.push(min);
    if (min < Math.log10(design)) anyEarly++;
  }
  const v = fleetView({
    size: n,
    logMean: mu,
    logStdDev: sigma,
    designLife_cycles: design,
    basis: "test evidence",
    testLives_cycles: [],
  }).fleet;

  it("median of the weakest of n", () => {
    // Standard error of the median of 6000 minima is about 0.0015 in log10 here; allow 0.006.
    expect(Math.abs(Math.log10(v.firstFailure_cycles) - median(mins))).toBeLessThan(0.006);
  });

  it("probability that one of n fails before the design life", () => {
    // p ≈ 0.32 here; the binomial standard error over 6000 fleets is 0.006; allow 0.02.
    expect(v.probabilityAnyFailsBeforeDesignLife).toBeGreaterThan(0.1);
    expect(Math.abs(v.probabilityAnyFailsBeforeDesignLife - anyEarly / fleets)).toBeLessThan(0.02);
  });

  it("5th-percentile life", () => {
    const s = [...all].sort((a, b) => a - b);
    const p5 = s[Math.floor(0.05 * s.length)];
    expect(Math.abs(Math.log10(v.percentile5_cycles) - p5)).toBeLessThan(0.008);
  });
});

describe("closed forms", () => {
  it("a fleet of one is the median life, and a larger fleet fails earlier", () => {
    // n = 1: Φ⁻¹(1 − 0.5) = 0, the median of the lognormal (definition).
    expect(firstFailureMedian(1, 5, 0.2)).toBeCloseTo(1e5, 6);
    expect(firstFailureMedian(100, 5, 0.2)).toBeLessThan(firstFailureMedian(10, 5, 0.2));
  });

  it("keeps small probabilities accurate", () => {
    // 1 − (1 − p)ⁿ ≈ n·p for n·p ≪ 1 (binomial expansion).
    expect(anyOf(150, 1e-12) / 1.5e-10).toBeCloseTo(1, 8);
  });
});
