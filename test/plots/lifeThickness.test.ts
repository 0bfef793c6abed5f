import { describe, expect, it } from "vitest";
import { lifeThicknessPlot, type LifeThicknessData } from "../../src/plots/lifeThickness.ts";
import { assertNoArtefacts, assertWellFormed, attr, axisMap, elements, pathPoints, tickLabels, visibleText } from "./svgTools.ts";

// Invented lives rising steeply with thickness; above 2.0 mm the amplitude falls below the endurance limit.
const lifeAt = (t: number) => 2.1e5 * (t / 1.6) ** 9.8;
const base: LifeThicknessData = {
  points: [1.2, 1.4, 1.6, 1.8, 2.0, 2.2, 2.4].map((t) => ({ thickness_mm: t, life_cycles: t > 2.05 ? null : lifeAt(t) })),
  current_mm: 1.6,
  requiredLife_cycles: 180000,
  minimumThickness_mm: 1.575,
};

describe("life against thickness", () => {
  const svg = lifeThicknessPlot(base);

  it("is well formed with thickness and life axes titled with units", () => {
    assertWellFormed(svg);
    assertNoArtefacts(svg);
    const text = visibleText(svg);
    expect(text).toContain("Skin thickness t (mm)");
    expect(text).toContain("Life N (cycles)");
    expect(tickLabels(svg, "y")).toEqual(expect.arrayContaining(["10⁴", "10⁵", "10⁶"]));
  });

  it("places finite lives on the log axis and the current thickness as the operating point", () => {
    const x = axisMap(svg, "x", "linear");
    const y = axisMap(svg, "y", "log");
    const squares = elements(svg, 'class="point"');
    expect(squares.length).toBe(4);
    const centres = squares.map((t) => [attr(t, "x") + attr(t, "width") / 2, attr(t, "y") + attr(t, "height") / 2]);
    for (const [i, t] of [1.2, 1.4, 1.8, 2.0].entries()) {
      expect(centres[i][0]).toBeCloseTo(x(t), 1);
      expect(centres[i][1]).toBeCloseTo(y(lifeAt(t)), 1);
    }
    const [op] = elements(svg, 'class="operating-point"');
    expect(attr(op, "cx")).toBeCloseTo(x(1.6), 1);
    expect(attr(op, "cy")).toBeCloseTo(y(lifeAt(1.6)), 1);
  });

  it("puts unlimited lives in a strip above the axis, marked unlimited", () => {
    const strip = elements(svg, 'class="unlimited-strip"')[0];
    const stripTop = attr(strip, "y");
    const stripBottom = stripTop + attr(strip, "height");
    const unlimited = elements(svg, 'class="point unlimited"');
    expect(unlimited.length).toBe(2);
    for (const t of unlimited) {
      const ys = pathPoints(t).map(([, py]) => py);
      expect(Math.min(...ys)).toBeGreaterThanOrEqual(stripTop);
      expect(Math.max(...ys)).toBeLessThanOrEqual(stripBottom);
    }
    const highestTick = Math.min(...elements(svg, 'class="tick-y"').map((t) => Number(t.match(/translate\([^,]+,([^)]+)\)/)![1])));
    expect(highestTick).toBeGreaterThanOrEqual(stripBottom);
    expect(visibleText(svg)).toContain("unlimited life");
    expect(elements(svg, 'class="life-to-unlimited"').length).toBe(1);
  });

  it("draws the required life as a horizontal and the current and minimum thicknesses as verticals", () => {
    const [req] = elements(svg, 'class="required-life"');
    const pts = pathPoints(req);
    expect(pts[0][1]).toBeCloseTo(axisMap(svg, "y", "log")(180000), 1);
    expect(pts[0][1]).toBeCloseTo(pts[1][1], 6);
    const x = axisMap(svg, "x", "linear");
    expect(pathPoints(elements(svg, "thickness-current")[0])[0][0]).toBeCloseTo(x(1.6), 1);
    expect(pathPoints(elements(svg, "thickness-minimum")[0])[0][0]).toBeCloseTo(x(1.575), 1);
  });

  it("shows inches when asked, converting only the display", () => {
    const s = lifeThicknessPlot(base, { units: { stress: "ksi", length: "in" } });
    const text = visibleText(s);
    expect(text).toContain("Skin thickness t (in)");
    expect(text).toContain("current t 0.06299 in");
    expect(text).not.toContain("mm");
    expect(tickLabels(s, "x").every((l) => l.startsWith("0."))).toBe(true);
    const [op] = elements(s, 'class="operating-point"');
    expect(attr(op, "cx")).toBeCloseTo(axisMap(s, "x", "linear")(1.6 / 25.4), 1);
  });

  it("counts lives in passes when the check repeats a spectrum", () => {
    const s = lifeThicknessPlot({ ...base, lifeUnit: "passes" });
    expect(visibleText(s)).toContain("Life N (passes)");
    expect(visibleText(s)).not.toContain("(cycles)");
  });

  it("survives nulls, NaN and Infinity without printing them", () => {
    const bad: LifeThicknessData[] = [
      { points: [], current_mm: NaN, requiredLife_cycles: Infinity },
      {
        points: [
          { thickness_mm: 1, life_cycles: null },
          { thickness_mm: 2, life_cycles: null },
        ],
        current_mm: 1.5,
        requiredLife_cycles: 1e5,
      },
      {
        points: [
          { thickness_mm: NaN, life_cycles: 5 },
          { thickness_mm: 1.5, life_cycles: Infinity },
          { thickness_mm: 1.6, life_cycles: 1e5 },
        ],
        current_mm: 1.6,
        requiredLife_cycles: NaN,
        minimumThickness_mm: -2,
      },
      { points: null, current_mm: null, requiredLife_cycles: null } as unknown as LifeThicknessData,
    ];
    for (const d of bad) {
      const s = lifeThicknessPlot(d);
      assertWellFormed(s);
      assertNoArtefacts(s);
    }
    expect(visibleText(lifeThicknessPlot(bad[0]))).toContain("no lives to plot");
  });

  it("escapes a hostile title", () => {
    const s = lifeThicknessPlot(base, { title: `"><script>alert(1)</script>` });
    expect(s).not.toContain("<script>");
    expect(s).toContain("&quot;&gt;&lt;script&gt;");
  });
});
