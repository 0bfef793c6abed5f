import { describe, expect, it } from "vitest";
import { fleetPlot, type FleetPlotData } from "../../src/plots/fleet.ts";
import { assertNoArtefacts, assertWellFormed, attr, axisMap, elements, pathPoints, visibleText } from "./svgTools.ts";

// An invented fleet: median 4×10⁵ cycles, σ = 0.14 in log10 life, 150 items, one test article.
const mu = Math.log10(4e5);
const sigma = 0.14;
const density: FleetPlotData["density"] = Array.from({ length: 61 }, (_, i) => {
  const x = mu + sigma * (-5 + (8 * i) / 60);
  const z = (x - mu) / sigma;
  return { life_cycles: 10 ** x, one: Math.exp((-z * z) / 2) / (sigma * Math.sqrt(2 * Math.PI)), first: 0 };
});
const data: FleetPlotData = {
  density,
  testLives_cycles: [4e5],
  designLife_cycles: 6e4,
  percentile5_cycles: 2.4e5,
  firstFailure_cycles: 1.8e5,
  size: 150,
};

describe("fleet plot", () => {
  const svg = fleetPlot(data);

  it("is well formed, with its axes and marks named", () => {
    assertWellFormed(svg);
    assertNoArtefacts(svg);
    const text = visibleText(svg);
    expect(text).toContain("Life N (cycles)");
    expect(text).toContain("first failure among 150 items");
    expect(text).toContain("one test article");
  });

  it("puts the design life, 5th percentile and first failure where their values lie", () => {
    const x = axisMap(svg, "x", "log");
    for (const [cls, v] of [
      ["design-life", 6e4],
      ["percentile5", 2.4e5],
      ["first-failure", 1.8e5],
    ] as const) {
      const [line] = elements(svg, `class="${cls}"`);
      expect(attr(line, "data-value")).toBe(v);
      expect(pathPoints(line)[0][0]).toBeCloseTo(x(v), 1);
    }
    expect(elements(svg, 'class="test-life"')).toHaveLength(1);
  });

  it("draws the one-item density peaking at the median", () => {
    const x = axisMap(svg, "x", "log");
    const pts = elements(svg, 'class="one-density"').flatMap(pathPoints);
    const top = pts.reduce((a, b) => (b[1] < a[1] ? b : a));
    // The density is sampled every 0.019 decade, a few pixels apart: the peak lies within one step of the median.
    expect(Math.abs(top[0] - x(4e5))).toBeLessThan(Math.abs(x(10 ** (mu + (8 * sigma) / 60)) - x(4e5)) + 0.5);
  });
});
