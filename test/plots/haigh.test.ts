import { describe, expect, it } from "vitest";
import { haighDiagram, type HaighData } from "../../src/plots/haigh.ts";
import { assertNoArtefacts, assertWellFormed, attr, axisMap, axisRead, elements, pathPoints, tickLabels, visibleText } from "./svgTools.ts";

// Invented aluminium-like values; σar chosen so the operating point lies on the Goodman line.
const base: HaighData = {
  operating: { mean_MPa: 95, amplitude_MPa: 95 },
  equivalentAmplitude_MPa: 95 / (1 - 95 / 470),
  ultimate_MPa: 470,
  yield_MPa: 325,
  fatigueStrengthCoefficient_MPa: 900,
  walkerGamma: 0.6,
  selected: "goodman",
};
const sar = base.equivalentAmplitude_MPa;

function lineVertices(svg: string, series: string): [number, number][] {
  const readX = axisRead(svg, "x", "linear");
  const readY = axisRead(svg, "y", "linear");
  return elements(svg, `data-series="${series}"`).flatMap((tag) =>
    pathPoints(tag).map(([px, py]): [number, number] => [readX(px), readY(py)]),
  );
}

describe("Haigh diagram", () => {
  const svg = haighDiagram(base);

  it("is well formed, accessible and titled with units on both axes", () => {
    assertWellFormed(svg);
    assertNoArtefacts(svg);
    expect(svg).toMatch(
      /^<svg [^>]*role="img" aria-label="Constant-life diagram \(Haigh\): [^"]*operating point at mean 95 MPa, amplitude 95 MPa/,
    );
    const text = visibleText(svg);
    expect(text).toContain("Mean stress σm (MPa)");
    expect(text).toContain("Stress amplitude σa (MPa)");
    expect(text).toContain("operating point: σm 95, σa 95 MPa");
  });

  it("puts the operating point where the axis ticks say (95, 95) MPa is", () => {
    const [tag] = elements(svg, 'class="operating-point"');
    expect(tag.startsWith("<circle")).toBe(true);
    expect(attr(tag, "cx")).toBeCloseTo(axisMap(svg, "x", "linear")(95), 1);
    expect(attr(tag, "cy")).toBeCloseTo(axisMap(svg, "y", "linear")(95), 1);
  });

  it("runs the Goodman line from σar at zero mean to zero at the ultimate strength", () => {
    const pts = lineVertices(svg, "goodman");
    expect(pts[0][0]).toBeCloseTo(0, 0);
    expect(pts[0][1]).toBeCloseTo(sar, 0);
    expect(pts[pts.length - 1][0]).toBeCloseTo(470, 0);
    expect(pts[pts.length - 1][1]).toBeCloseTo(0, 0);
  });

  it("draws every criterion through σar at zero mean and along its own relation", () => {
    const tol = 1.5; // MPa: half a pixel or so at this scale
    const on: Record<string, (sm: number, sa: number) => number> = {
      goodman: (sm, sa) => sa - sar * (1 - sm / 470),
      gerber: (sm, sa) => sa - sar * (1 - (sm / 470) ** 2),
      soderberg: (sm, sa) => sa - sar * (1 - sm / 325),
      "asme-elliptic": (sm, sa) => sa - sar * Math.sqrt(Math.max(0, 1 - (sm / 325) ** 2)),
      morrow: (sm, sa) => sa - sar * (1 - sm / 900),
      swt: (sm, sa) => Math.sqrt(sa * (sa + sm)) - sar,
      walker: (sm, sa) => (sm + sa) ** 0.4 * sa ** 0.6 - sar,
    };
    for (const [series, residual] of Object.entries(on)) {
      const pts = lineVertices(svg, series);
      expect(pts.length, series).toBeGreaterThanOrEqual(2);
      expect(pts[0][1], series).toBeCloseTo(sar, 0);
      for (const [sm, sa] of pts) expect(Math.abs(residual(sm, sa)), `${series} at σm ${sm}`).toBeLessThan(tol);
    }
  });

  it("ends the lines where they meet zero amplitude or the end of the axis", () => {
    expect(lineVertices(svg, "soderberg").at(-1)![0]).toBeCloseTo(325, 0);
    expect(lineVertices(svg, "asme-elliptic").at(-1)![0]).toBeCloseTo(325, 0);
    expect(lineVertices(svg, "morrow").at(-1)![0]).toBeCloseTo(470, 0);
    expect(lineVertices(svg, "swt").at(-1)![0]).toBeCloseTo(470, 0);
  });

  it("draws the yield line σa + σm = Sy and marks Su, Sy and σar", () => {
    for (const [sm, sa] of lineVertices(svg, "yield")) expect(sm + sa).toBeCloseTo(325, 0);
    const text = visibleText(svg);
    expect(text).toMatch(/Su 470/);
    expect(text).toMatch(/Sy 325/);
    expect(text).toMatch(/σar = 119 MPa/);
  });

  it("distinguishes every line by dash pattern and marker, not colour alone", () => {
    const dashes = new Set<string>();
    for (const series of ["goodman", "gerber", "soderberg", "asme-elliptic", "morrow", "swt", "walker", "yield"]) {
      const [tag] = elements(svg, `data-series="${series}"`);
      const dash = tag.match(/stroke-dasharray="([^"]*)"/)?.[1] ?? "solid";
      const width = tag.match(/stroke-width="([^"]*)"/)![1];
      dashes.add(`${dash}/${width}`);
    }
    expect(dashes.size).toBe(8);
    const legendMarks = [...svg.matchAll(/class="legend-entry">(?:<line [^>]*\/>)?(<(?:rect|circle|path) [^>]*\/>)/g)].map((m) =>
      m[1].replace(/(x|y|cx|cy|d)="[^"]*"/g, ""),
    );
    expect(new Set(legendMarks).size).toBe(legendMarks.length);
  });

  it("draws the criterion the check used heavier and says so in the legend", () => {
    const width = (s: string) => attr(elements(svg, `data-series="${s}"`)[0], "stroke-width");
    expect(width("goodman")).toBeGreaterThan(width("gerber"));
    expect(visibleText(svg)).toContain("Goodman — used");
  });

  it("escapes a hostile title", () => {
    const hostile = haighDiagram(base, { title: "<script>alert(1)</script> & co" });
    assertWellFormed(hostile);
    expect(hostile).not.toContain("<script>");
    expect(hostile).toContain("&lt;script&gt;alert(1)&lt;/script&gt; &amp; co");
  });

  it("draws only the criteria asked for, and says why Walker is missing without γ", () => {
    const s = haighDiagram({ ...base, walkerGamma: undefined, criteria: ["goodman", "walker"] });
    expect(elements(s, 'data-series="goodman"').length).toBeGreaterThan(0);
    expect(elements(s, 'data-series="gerber"').length).toBe(0);
    expect(elements(s, 'data-series="walker"').length).toBe(0);
    expect(visibleText(s)).toContain("Walker not drawn: γ not given");
    expect(elements(haighDiagram({ ...base, walkerGamma: undefined }), 'data-series="walker"').length).toBe(0);
  });

  it("extends the mean axis below zero for a compressive mean and still places the point", () => {
    const s = haighDiagram({ ...base, operating: { mean_MPa: -40, amplitude_MPa: 110 } });
    const xTicks = tickLabels(s, "x");
    expect(xTicks[0].startsWith("−")).toBe(true);
    const [tag] = elements(s, 'class="operating-point"');
    expect(attr(tag, "cx")).toBeCloseTo(axisMap(s, "x", "linear")(-40), 1);
    expect(lineVertices(s, "goodman")[0][0]).toBeCloseTo(0, 0);
  });

  it("relabels axes and ticks in ksi while the geometry stays the same", () => {
    const s = haighDiagram(base, { units: { stress: "ksi", length: "in" } });
    const k = 0.1450377;
    const text = visibleText(s);
    expect(text).toContain("Mean stress σm (ksi)");
    expect(text).toContain("Stress amplitude σa (ksi)");
    expect(text).not.toContain("MPa");
    expect(tickLabels(s, "x")).not.toEqual(tickLabels(svg, "x"));
    const [tag] = elements(s, 'class="operating-point"');
    expect(attr(tag, "cx")).toBeCloseTo(axisMap(s, "x", "linear")(95 * k), 1);
    expect(attr(tag, "cy")).toBeCloseTo(axisMap(s, "y", "linear")(95 * k), 1);
    const goodman = lineVertices(s, "goodman");
    expect(goodman.at(-1)![0]).toBeCloseTo(470 * k, 1);
  });

  it("never prints NaN or Infinity, whatever the input", () => {
    const bad = [
      { ...base, equivalentAmplitude_MPa: NaN },
      { ...base, ultimate_MPa: Infinity, yield_MPa: NaN },
      { ...base, operating: { mean_MPa: NaN, amplitude_MPa: Infinity } },
      { ...base, operating: null, fatigueStrengthCoefficient_MPa: null, walkerGamma: -3 } as unknown as HaighData,
      { ...base, ultimate_MPa: 0, yield_MPa: 0, equivalentAmplitude_MPa: 0, operating: { mean_MPa: 0, amplitude_MPa: 0 } },
    ];
    for (const d of bad) {
      const s = haighDiagram(d, { width: NaN, height: -1 });
      assertWellFormed(s);
      assertNoArtefacts(s);
    }
    expect(visibleText(haighDiagram(bad[0]))).toContain("no constant-life lines: σar not given");
    const noPoint = visibleText(haighDiagram(bad[2]));
    expect(noPoint).toContain("operating point not shown");
    expect(noPoint).not.toContain("operating point:");
  });
});
