import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ALL_CRITERIA, amplitudeOnLine, zeroAmplitudeMean } from "../../src/engine/constantLife.ts";
import { equivalentAmplitude } from "../../src/engine/meanStress.ts";

const m = { equivalentAmplitude: 150, ultimate: 600, yield: 400, fatigueStrengthCoefficient: 900, walkerGamma: 0.6 };
const strengths = { ultimate_MPa: 600, yield_MPa: 400, fatigueStrengthCoefficient_MPa: 900, walkerGamma: 0.6 };

describe("constant-life lines are the inverse of the mean-stress relations", () => {
  it("a point on each line gives back σar through the forward relation", () => {
    fc.assert(
      fc.property(fc.constantFrom(...ALL_CRITERIA), fc.double({ min: 0.01, max: 0.95, noNaN: true }), (c, frac) => {
        const reach = Math.min(zeroAmplitudeMean(c, m), 500);
        const sm = frac * reach;
        const sa = amplitudeOnLine(c, sm, m);
        if (!(sa > 1e-6)) return;
        expect(equivalentAmplitude(c, sa, sm, strengths).sigmaAr).toBeCloseTo(150, 6);
      }),
      { numRuns: 300 },
    );
  });

  it("Goodman runs from σar at zero mean to zero at Su (Shigley Table 6-6)", () => {
    expect(amplitudeOnLine("goodman", 0, m)).toBe(150);
    expect(amplitudeOnLine("goodman", 600, m)).toBe(0);
  });
});
