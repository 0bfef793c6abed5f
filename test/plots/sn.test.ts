import { describe, expect, it } from "vitest";
import { snCurve, type SnData } from "../../src/plots/sn.ts";
import { assertNoArtefacts, assertWellFormed, attr, axisMap, axisRead, elements, pathPoints, tickLabels, visibleText } from "./svgTools.ts";

// Invented constants: σar = 900·(2N)^−0.102, endurance limit 120 MPa.
const sf = 900;
const b = -0.102;
const lifeAt = (s: number) => 0.5 * (s / sf) ** (1 / b);
const base: SnData = {
  fatigueStrengthCoefficient_MPa: sf,
  fatigueStrengthExponent: b,
  enduranceLimit_MPa: 120,
  operating: { equivalentAmplitude_MPa: 190, life_cycles: lifeAt(190) },
  designLife_cycles: 60000,
  scatterFactor: 3,
  allowableLife_cycles: lifeAt(190) / 3,
};

function curveVertices(svg: string, cls: string): [number, number][] {
  const rx = axisRead(svg, "x", "log");
  const ry = axisRead(svg, "y", "log");
  return elements(svg, `class="${cls}"`).flatMap((t) => pathPoints(t).map(([x, y]): [number, number] => [rx(x), ry(y)]));
}

describe("S-N curve", () => {
  const svg = snCurve(base);

  it("is well formed with log axes titled with units and decade labels", () => {
    assertWellFormed(svg);
    assertNoArtefacts(svg);
    const text = visibleText(svg);
    expect(text).toContain("Life N (cycles)");
    expect(text).toContain("Equivalent amplitude σar (MPa)");
    expect(tickLabels(svg, "x")).toEqual(expect.arrayContaining(["10³", "10⁴", "10⁵", "10⁶", "10⁷"]));
  });

  it("places the operating point at its life and amplitude on the log scales", () => {
    const [tag] = elements(svg, 'class="operating-point"');
    expect(attr(tag, "cx")).toBeCloseTo(axisMap(svg, "x", "log")(lifeAt(190)), 1);
    expect(attr(tag, "cy")).toBeCloseTo(axisMap(svg, "y", "log")(190), 1);
  });

  it("follows Basquin above the endurance limit and stays flat at it beyond the knee", () => {
    const pts = curveVertices(svg, "sn-curve");
    expect(pts.length).toBeGreaterThan(20);
    const knee = lifeAt(120);
    for (const [n, s] of pts) {
      const expected = n < knee ? sf * (2 * n) ** b : 120;
      expect(Math.abs(s / expected - 1), `at N ${n}`).toBeLessThan(0.01);
    }
    expect(pts.some(([n]) => n > knee * 1.5)).toBe(true);
  });

  it("draws the design life and design life × scatter factor as verticals at those lives", () => {
    const x = axisMap(svg, "x", "log");
    const [design] = elements(svg, "life-design");
    const [required] = elements(svg, "life-required");
    expect(pathPoints(design)[0][0]).toBeCloseTo(x(60000), 1);
    expect(pathPoints(required)[0][0]).toBeCloseTo(x(180000), 1);
    expect(visibleText(svg)).toContain("design life × scatter 3 = 180\u2009000");
  });

  it("marks the allowable life (life ÷ scatter) at the operating amplitude", () => {
    const [tag] = elements(svg, 'class="allowable"');
    const [[px, py]] = pathPoints(tag);
    expect(px).toBeCloseTo(axisMap(svg, "x", "log")(lifeAt(190) / 3), 1);
    expect(py).toBeLessThan(axisMap(svg, "y", "log")(190)); // the diamond's top vertex sits above its centre
  });

  it("shows an unlimited life at the right edge with a note, never as NaN", () => {
    const s = snCurve({ ...base, operating: { equivalentAmplitude_MPa: 100, life_cycles: null }, allowableLife_cycles: null });
    assertWellFormed(s);
    assertNoArtefacts(s);
    const [tag] = elements(s, 'class="operating-point"');
    expect(tag).toContain('data-unlimited="true"');
    expect(attr(tag, "cy")).toBeCloseTo(axisMap(s, "y", "log")(100), 1);
    expect(visibleText(s)).toContain("unlimited life");
  });

  it("draws coupons, runouts with an arrow, a scatter band and the extrapolated part of the curve", () => {
    const s = snCurve({
      ...base,
      validRange_cycles: [1e4, 2e6],
      coupons: [
        { amplitude_MPa: 250, life_cycles: 42000 },
        { amplitude_MPa: 210, life_cycles: 130000 },
        { amplitude_MPa: 160, life_cycles: 2e6, runout: true },
      ],
      band: [
        { amplitude_MPa: 280, lower_cycles: 15000, upper_cycles: 60000 },
        { amplitude_MPa: 170, lower_cycles: 400000, upper_cycles: 1800000 },
      ],
    });
    assertWellFormed(s);
    expect(elements(s, 'class="coupon"').length).toBe(2);
    const [runout] = elements(s, 'class="coupon runout"');
    expect(attr(runout, "x") + attr(runout, "width") / 2).toBeCloseTo(axisMap(s, "x", "log")(2e6), 1);
    expect(elements(s, 'class="band"').length).toBe(1);
    const inside = curveVertices(s, "sn-curve");
    const outside = curveVertices(s, "sn-curve-extrapolated");
    for (const [n] of inside) expect(n >= 1e4 * 0.99 && n <= 2e6 * 1.01).toBe(true);
    expect(outside.some(([n]) => n < 1e4)).toBe(true);
    expect(outside.some(([n]) => n > 2e6)).toBe(true);
    const text = visibleText(s);
    expect(text).toContain("coupon runout (no failure)");
    expect(text).toContain("scatter band");
  });

  it("relabels the stress axis in ksi and keeps points on the curve", () => {
    const s = snCurve(base, { units: { stress: "ksi", length: "in" } });
    const k = 0.1450377;
    expect(visibleText(s)).toContain("Equivalent amplitude σar (ksi)");
    expect(tickLabels(s, "y")).not.toEqual(tickLabels(svg, "y"));
    expect(tickLabels(s, "x")).toEqual(tickLabels(svg, "x"));
    const [tag] = elements(s, 'class="operating-point"');
    expect(attr(tag, "cy")).toBeCloseTo(axisMap(s, "y", "log")(190 * k), 1);
    for (const [n, v] of curveVertices(s, "sn-curve")) expect(v / k).toBeCloseTo(Math.max(120, sf * (2 * n) ** b), -1);
  });

  it("escapes a hostile title and survives nonsense input", () => {
    const hostile = snCurve(base, { title: "<script>alert(1)</script>" });
    expect(hostile).not.toContain("<script>");
    expect(hostile).toContain("&lt;script&gt;");
    const bad: SnData[] = [
      { ...base, fatigueStrengthExponent: 0.1 },
      { ...base, fatigueStrengthCoefficient_MPa: NaN, enduranceLimit_MPa: Infinity },
      { ...base, designLife_cycles: NaN, scatterFactor: Infinity, operating: { equivalentAmplitude_MPa: NaN, life_cycles: Infinity } },
      {
        ...base,
        validRange_cycles: [5e5, 1e3],
        coupons: [{ amplitude_MPa: NaN, life_cycles: -1 }],
        band: [{ amplitude_MPa: 1, lower_cycles: NaN, upper_cycles: 2 }],
      },
      { ...base, operating: null } as unknown as SnData,
    ];
    for (const d of bad) {
      const s = snCurve(d);
      assertWellFormed(s);
      assertNoArtefacts(s);
    }
    expect(visibleText(snCurve(bad[0]))).toContain("curve not drawn");
  });
});
