import { describe, expect, it } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import { checkDocument } from "../../src/engine/index.ts";
import { shellPicture } from "../../src/plots/index.ts";
import { scaleBarLength } from "../../src/plots/shell.ts";
import { textWidth } from "../../src/plots/svgText.ts";
import { assertWellFormed } from "./svgTools.ts";

/** The x extent and y extent of a path's absolute coordinates (M/L pairs). */
function extent(d: string): { w: number; h: number } {
  const n = (d.match(/-?\d+(?:\.\d+)?/g) ?? []).map(Number);
  const xs = n.filter((_, i) => i % 2 === 0);
  const ys = n.filter((_, i) => i % 2 === 1);
  return { w: Math.max(...xs) - Math.min(...xs), h: Math.max(...ys) - Math.min(...ys) };
}

function pathOf(svg: string, cls: string): string {
  const m = svg.match(new RegExp(`class="${cls}" d="([^"]+)"`));
  if (!m) throw new Error(`no ${cls} path`);
  return m[1];
}

describe("the shell and its opening, to scale", () => {
  const out = checkDocument(DEMOS[0].document);
  if (!out.ok) throw new Error("the cabin demo must run");
  const r = out.result;
  const data = {
    form: r.workedAt.form,
    innerRadius_mm: r.membrane.innerRadius_mm,
    outerRadius_mm: r.membrane.outerRadius_mm,
    thickness_mm: r.workedAt.thickness_mm,
    outline: r.workedAt.outline,
    fasteners: r.workedAt.fasteners,
    crack: { initial_mm: 1.27, critical_mm: 200 },
  };

  it("draws the opening at its true proportion against the scale bar", () => {
    const svg = shellPicture(data);
    assertWellFormed(svg);
    // The demo window is 230 mm across the hoop and 320 mm along the axis (its inputs).
    const o = extent(pathOf(svg, "opening"));
    expect(o.h / o.w).toBeCloseTo(320 / 230, 2);
    const bar = svg.match(/class="scale-bar" d="M([\d.]+),([\d.]+)L([\d.]+),/);
    if (!bar) throw new Error("no scale bar");
    const barPx = Number(bar[3]) - Number(bar[1]);
    const barMm = Number(svg.match(/>(\d+) mm<\/text>/)?.[1]);
    // The drawn width per scale-bar length equals 230 mm per the bar's printed length.
    expect(o.w / barPx).toBeCloseTo(230 / barMm, 2);
    expect(svg.match(/class="fastener"/g)).toHaveLength(5);
  });

  it("shows the critical crack on the same scale as the skin", () => {
    const svg = shellPicture(data);
    const bar = svg.match(/class="scale-bar" d="M([\d.]+),[\d.]+L([\d.]+),/);
    const crack = svg.match(/class="critical-crack" d="M([\d.]+),[\d.]+L([\d.]+),/);
    if (!bar || !crack) throw new Error("no bars");
    const barMm = Number(svg.match(/>(\d+) mm<\/text>/)?.[1]);
    expect((Number(crack[2]) - Number(crack[1])) / (Number(bar[2]) - Number(bar[1]))).toBeCloseTo(200 / barMm, 2);
    expect(svg).toContain("crack size a: critical 200 mm");
    expect(svg).toContain("initial 1.27 mm");
  });

  it("keeps every label inside the picture, the crack sizes of the demo included", () => {
    const c = r.crack!;
    const svg = shellPicture({ ...data, crack: { initial_mm: c.initial_mm, critical_mm: c.critical_mm, detectable_mm: c.detectable_mm } });
    const width = Number(svg.match(/viewBox="0 0 ([\d.]+) /)?.[1]);
    // Each start-anchored label's right end, at the plots' own glyph-width estimate (svgText.ts), stays within the view box.
    for (const m of svg.matchAll(/<text x="([\d.]+)" y="[\d.]+" font-size="(\d+)"(?![^>]*text-anchor)[^>]*>([^<]*)</g))
      expect(Number(m[1]) + textWidth(m[3], Number(m[2])), m[3]).toBeLessThanOrEqual(width);
    expect(svg).toContain(`detectable ${c.detectable_mm} mm`);
  });

  it("gives the opening's hoop extent as an arc of half-angle half-width / mean radius", () => {
    const svg = shellPicture(data);
    const m = svg.match(/class="opening-arc" d="M ([\d.]+) ([\d.]+) A ([\d.]+) [\d.]+ 0 0 1 ([\d.]+) ([\d.]+)"/);
    if (!m) throw new Error("no arc");
    const chord = Number(m[4]) - Number(m[1]);
    const radius = Number(m[3]);
    // chord = 2 r sin φ with φ = 115 / 1150 rad (the demo's half-width over its mean radius)
    expect(chord / (2 * radius)).toBeCloseTo(Math.sin(115 / 1150), 3);
    expect(svg).toContain("(thinner than a line here)");
    expect(svg).toMatch(/r<tspan[^>]*>m<\/tspan>\/t 1150/);
  });

  it("speaks the reader's length unit", () => {
    const svg = shellPicture(data, { units: { length: "in" } });
    // 230 mm = 9.06 in (25.4 mm per inch, exact by definition)
    expect(svg).toContain("opening 9.06 in");
  });

  it("says so when only a Kt is given, and refuses a shell with no wall", () => {
    expect(shellPicture({ ...data, outline: null, fasteners: [] })).toContain("opening shape not given (Kt only)");
    expect(shellPicture({ ...data, innerRadius_mm: 100, outerRadius_mm: 100 })).toContain("no shell to draw");
  });

  it("rounds scale bars to 1, 2 or 5 times a power of ten (common practice)", () => {
    expect(scaleBarLength(1000)).toBe(200);
    expect(scaleBarLength(300)).toBe(50);
    expect(scaleBarLength(3.3)).toBe(0.5);
    expect(scaleBarLength(44)).toBe(10);
  });
});
