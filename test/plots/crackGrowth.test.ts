import { describe, expect, it } from "vitest";
import { crackGrowthPlot, type CrackGrowthData } from "../../src/plots/crackGrowth.ts";
import { formatValue } from "../../src/plots/format.ts";
import { assertNoArtefacts, assertWellFormed, attr, axisMap, axisRead, elements, pathPoints, tickLabels, visibleText } from "./svgTools.ts";

// An invented a–N curve from 1 mm to a critical 14 mm in 52 000 cycles.
const nc = 52000;
const sizeAt = (n: number) => 1 / (1 - (n / nc) * (1 - 1 / 14));
const base: CrackGrowthData = {
  curve: Array.from({ length: 41 }, (_, i) => ({ n_cycles: (nc * i) / 40, a_mm: sizeAt((nc * i) / 40) })),
  critical_mm: 14,
  inspectionInterval_cycles: 13000,
  initial_mm: 1,
};

describe("crack growth", () => {
  const svg = crackGrowthPlot(base);

  it("is well formed with cycles and crack size axes titled with units", () => {
    assertWellFormed(svg);
    assertNoArtefacts(svg);
    const text = visibleText(svg);
    expect(text).toContain("Pressure cycles N");
    expect(text).toContain("Crack size a (mm)");
    expect(text).toContain("critical size ac = 14 mm");
  });

  it("draws the curve through the given points", () => {
    const rx = axisRead(svg, "x", "linear");
    const ry = axisRead(svg, "y", "linear");
    const pts = elements(svg, 'class="growth-curve"').flatMap(pathPoints);
    expect(pts.length).toBe(41);
    for (const [px, py] of pts) expect(ry(py)).toBeCloseTo(sizeAt(rx(px)), 1);
  });

  it("draws the critical size as a horizontal line at 14 mm", () => {
    const [line] = elements(svg, 'class="critical-size"');
    const [p, q] = pathPoints(line);
    expect(p[1]).toBeCloseTo(axisMap(svg, "y", "linear")(14), 1);
    expect(q[1]).toBe(p[1]);
  });

  it("marks each inspection up to the critical size, on the curve", () => {
    const x = axisMap(svg, "x", "linear");
    const y = axisMap(svg, "y", "linear");
    const lines = elements(svg, 'class="inspection"');
    expect(lines.map((l) => attr(l, "data-value"))).toEqual([13000, 26000, 39000, 52000]);
    for (const l of lines) expect(pathPoints(l)[0][0]).toBeCloseTo(x(attr(l, "data-value")), 1);
    const marks = elements(svg, 'class="inspection-mark"');
    expect(marks.length).toBe(4);
    // The diamond's first vertex is its top: centre x, centre y minus its half height.
    const [mx] = pathPoints(marks[1])[0];
    expect(mx).toBeCloseTo(x(26000), 1);
    const ys = pathPoints(marks[1]).map(([, py]) => py);
    expect((Math.min(...ys) + Math.max(...ys)) / 2).toBeCloseTo(y(sizeAt(26000)), 0);
  });

  it("stops numbering when inspections are too many to read one by one", () => {
    const s = crackGrowthPlot({ ...base, inspectionInterval_cycles: 2000 });
    expect(elements(s, 'class="inspection"').length).toBe(26);
    expect(visibleText(s)).not.toMatch(/^26$/m);
    expect(visibleText(svg)).toMatch(/^4$/m);
  });

  it("shows inches when asked", () => {
    const s = crackGrowthPlot(base, { units: { stress: "psi", length: "in" } });
    expect(visibleText(s)).toContain("Crack size a (in)");
    expect(tickLabels(s, "y")).not.toEqual(tickLabels(svg, "y"));
    const [line] = elements(s, 'class="critical-size"');
    expect(pathPoints(line)[0][1]).toBeCloseTo(axisMap(s, "y", "linear")(14 / 25.4), 1);
  });

  it("survives missing or nonsense input and escapes the title", () => {
    const bad: CrackGrowthData[] = [
      { curve: [], critical_mm: NaN, inspectionInterval_cycles: 0, initial_mm: NaN },
      { ...base, inspectionInterval_cycles: Infinity, critical_mm: Infinity },
      { ...base, inspectionInterval_cycles: null },
      {
        ...base,
        curve: [
          { a_mm: NaN, n_cycles: 5 },
          { a_mm: 2, n_cycles: Infinity },
        ],
        inspectionInterval_cycles: -5,
      },
      { curve: null, critical_mm: null, inspectionInterval_cycles: null, initial_mm: null } as unknown as CrackGrowthData,
    ];
    for (const d of bad) {
      const s = crackGrowthPlot(d, { title: "<b>crack</b>" });
      assertWellFormed(s);
      assertNoArtefacts(s);
      expect(s).toContain("&lt;b&gt;crack&lt;/b&gt;");
    }
    expect(visibleText(crackGrowthPlot(bad[0]))).toContain("no growth curve to plot");
  });
});

describe("crack growth with an inspection programme and a gradient", () => {
  // The same invented curve; inspections from a threshold of 20 000 cycles, then every 12 000; a uniform-field
  // comparison that grows at a third of the rate.
  const svg = crackGrowthPlot({
    ...base,
    threshold_cycles: 20000,
    repeatInterval_cycles: 12000,
    detectable_mm: 2.5,
    comparison: { curve: base.curve.map((p) => ({ n_cycles: 3 * p.n_cycles, a_mm: p.a_mm })), label: "same crack, uniform stress" },
  });

  it("marks the threshold and then every repeat interval", () => {
    assertWellFormed(svg);
    expect(elements(svg, 'class="inspection"').map((l) => attr(l, "data-value"))).toEqual([20000, 32000, 44000]);
    expect(visibleText(svg)).toContain(`inspections from ${formatValue(20000)}, then every ${formatValue(12000)} cycles`);
  });

  it("draws the detectable size and the uniform-field comparison", () => {
    const [line] = elements(svg, 'class="detectable-size"');
    expect(pathPoints(line)[0][1]).toBeCloseTo(axisMap(svg, "y", "linear")(2.5), 1);
    const rx = axisRead(svg, "x", "linear");
    const ry = axisRead(svg, "y", "linear");
    const pts = elements(svg, 'class="comparison-curve"').flatMap(pathPoints);
    expect(pts.length).toBeGreaterThan(5);
    for (const [px, py] of pts) expect(ry(py)).toBeCloseTo(sizeAt(rx(px) / 3), 0);
  });
});
