import { describe, expect, it } from "vitest";
import { spectrumPlot, type SpectrumData } from "../../src/plots/spectrum.ts";
import { assertNoArtefacts, assertWellFormed, attr, axisMap, elements, tickLabels, visibleText } from "./svgTools.ts";

// An invented pressure spectrum: many small cycles, a few large ones, one half cycle.
const base: SpectrumData = {
  cycles: [
    { range_MPa: 12, mean_MPa: 40, count: 5000 },
    { range_MPa: 25, mean_MPa: 45, count: 1800 },
    { range_MPa: 38, mean_MPa: 50, count: 420 },
    { range_MPa: 61, mean_MPa: 60, count: 90 },
    { range_MPa: 90, mean_MPa: 70, count: 12.5 },
    { range_MPa: 140, mean_MPa: 75, count: 3 },
    { range_MPa: 190, mean_MPa: 95, count: 1 },
    { range_MPa: 195, mean_MPa: 97.5, count: 0.5 },
  ],
};

const bars = (svg: string) =>
  elements(svg, 'class="bar"').map((t) => ({ tag: t, from: attr(t, "data-from"), to: attr(t, "data-to"), count: attr(t, "data-count") }));

describe("load spectrum", () => {
  const svg = spectrumPlot(base);

  it("is well formed with stress range and count axes titled with units", () => {
    assertWellFormed(svg);
    assertNoArtefacts(svg);
    const text = visibleText(svg);
    expect(text).toContain("Stress range Δσ (MPa)");
    expect(text).toContain("Cycles counted");
    expect(text).toContain("7327 cycles in all (half cycles count ½)");
  });

  it("bins on round edges and keeps every cycle, half cycles as a half", () => {
    const b = bars(svg);
    expect(b.reduce((s, x) => s + x.count, 0)).toBe(7327);
    expect(b.every((x) => x.to - x.from === 20 && x.from % 20 === 0)).toBe(true);
    expect(b.find((x) => x.from === 180)!.count).toBe(1.5);
    expect(b.find((x) => x.from === 20)!.count).toBe(2220);
  });

  it("uses a log count axis when counts span decades and puts bar tops at their counts", () => {
    expect(tickLabels(svg, "y")).toEqual(expect.arrayContaining(["1", "10", "100", "1000"]));
    const y = axisMap(svg, "y", "log");
    const x = axisMap(svg, "x", "linear");
    for (const b of bars(svg)) {
      expect(attr(b.tag, "y")).toBeCloseTo(y(b.count), 1);
      expect(attr(b.tag, "x")).toBeCloseTo(x(b.from), 1);
      expect(attr(b.tag, "x") + attr(b.tag, "width")).toBeCloseTo(x(b.to), 1);
    }
  });

  it("shows a few large cycles beside many small ones: a log count axis from one decade of spread", () => {
    // The receiver demo's pass: 20 000 load/unload cycles and 300 start-ups (invented demo, src/demo)
    const s = spectrumPlot({
      cycles: [
        { range_MPa: 50, mean_MPa: 140, count: 20000 },
        { range_MPa: 170, mean_MPa: 85, count: 300 },
      ],
    });
    const y = axisMap(s, "y", "log");
    const big = bars(s).find((b) => b.count === 300);
    if (!big) throw new Error("no bar for the 300 start-ups");
    // On a log axis the bar of 300 reaches log10(300)/log10(20000) ≈ 0.58 of the way up to the tallest.
    expect(attr(big.tag, "y")).toBeCloseTo(y(300), 1);
    expect(attr(big.tag, "height")).toBeGreaterThan(50);
  });

  it("uses a linear count axis from zero when counts are of one order", () => {
    const s = spectrumPlot({
      cycles: [
        { range_MPa: 100, mean_MPa: 50, count: 3 },
        { range_MPa: 80, mean_MPa: 60, count: 1.5 },
        { range_MPa: 190, mean_MPa: 95, count: 0.5 },
      ],
    });
    const y = axisMap(s, "y", "linear");
    expect(tickLabels(s, "y")[0]).toMatch(/^0(\.0)?$/);
    for (const b of bars(s)) {
      expect(attr(b.tag, "y")).toBeCloseTo(y(b.count), 1);
      expect(attr(b.tag, "y") + attr(b.tag, "height")).toBeCloseTo(y(0), 1);
    }
  });

  it("honours an explicit number of equal bins from zero to the largest range", () => {
    const s = spectrumPlot({ ...base, bins: 5 });
    const b = bars(s);
    const widths = new Set(b.map((x) => Math.round((x.to - x.from) * 1e6)));
    expect(widths).toEqual(new Set([39e6]));
    expect(Math.max(...b.map((x) => x.to))).toBeCloseTo(195, 9);
    expect(b.reduce((sum, x) => sum + x.count, 0)).toBe(7327);
  });

  it("relabels the range axis in psi", () => {
    const s = spectrumPlot(base, { units: { stress: "psi", length: "in" } });
    expect(visibleText(s)).toContain("Stress range Δσ (psi)");
    expect(tickLabels(s, "x")).not.toEqual(tickLabels(svg, "x"));
    const largest = Math.max(...bars(s).map((x) => x.to));
    expect(largest).toBeGreaterThanOrEqual(195 * 145.0377);
    expect(visibleText(s)).toContain("psi");
    expect(visibleText(s)).not.toContain("MPa");
  });

  it("survives empty and nonsense input and escapes the title", () => {
    const bad: SpectrumData[] = [
      { cycles: [] },
      {
        cycles: [
          { range_MPa: NaN, mean_MPa: NaN, count: 3 },
          { range_MPa: Infinity, mean_MPa: 0, count: 1 },
          { range_MPa: 10, mean_MPa: 0, count: -1 },
        ],
        bins: NaN,
      },
      { cycles: [{ range_MPa: 0, mean_MPa: 0, count: 2 }], bins: 0 },
      { cycles: [{ range_MPa: 50, mean_MPa: 0, count: 2 }], bins: 1e9 },
      { cycles: null } as unknown as SpectrumData,
    ];
    for (const d of bad) {
      const s = spectrumPlot(d, { title: "a < b & c" });
      assertWellFormed(s);
      assertNoArtefacts(s);
      expect(s).toContain("a &lt; b &amp; c");
    }
    expect(visibleText(spectrumPlot(bad[0]))).toContain("no cycles counted");
  });
});
