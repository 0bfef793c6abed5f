import { describe, expect, it } from "vitest";
import * as plots from "../../src/plots/index.ts";
import { assertWellFormed, visibleText } from "./svgTools.ts";

describe("plots index", () => {
  it("exposes each plot, each returning one well-formed SVG with a caller's title", () => {
    const opts = { title: "Sheet 3 & 4" };
    const svgs = [
      plots.haighDiagram(
        {
          operating: { mean_MPa: 50, amplitude_MPa: 50 },
          equivalentAmplitude_MPa: 60,
          ultimate_MPa: 400,
          yield_MPa: 300,
          fatigueStrengthCoefficient_MPa: 800,
        },
        opts,
      ),
      plots.snCurve(
        {
          fatigueStrengthCoefficient_MPa: 800,
          fatigueStrengthExponent: -0.1,
          operating: { equivalentAmplitude_MPa: 200, life_cycles: 1e5 },
          designLife_cycles: 2e4,
        },
        opts,
      ),
      plots.lifeThicknessPlot(
        {
          points: [
            { thickness_mm: 2, life_cycles: 1e5 },
            { thickness_mm: 3, life_cycles: 1e6 },
          ],
          current_mm: 2,
          requiredLife_cycles: 3e5,
        },
        opts,
      ),
      plots.crackGrowthPlot(
        {
          curve: [
            { a_mm: 1, n_cycles: 0 },
            { a_mm: 5, n_cycles: 1e4 },
          ],
          critical_mm: 5,
          inspectionInterval_cycles: 5000,
          initial_mm: 1,
        },
        opts,
      ),
      plots.spectrumPlot({ cycles: [{ range_MPa: 100, mean_MPa: 50, count: 10 }] }, opts),
    ];
    for (const svg of svgs) {
      assertWellFormed(svg);
      expect(visibleText(svg).split("\n")[0]).toBe("Sheet 3 & 4");
    }
    expect(new Set(svgs.map((s) => s.match(/class="hoopwise-plot (plot-[\w-]+)"/)![1])).size).toBe(5);
  });

  it("leaves the heading out when the title is empty, keeping an accessible name", () => {
    const svg = plots.spectrumPlot({ cycles: [{ range_MPa: 100, mean_MPa: 50, count: 10 }] }, { title: "" });
    expect(svg).not.toContain('class="heading"');
    expect(svg).toMatch(/<title>Load spectrum \(rainflow count\): [^<]+<\/title>/);
  });
});
