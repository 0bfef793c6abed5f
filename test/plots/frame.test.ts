import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { formatTick, formatValue, powerOfTen } from "../../src/plots/format.ts";
import { makeFrame } from "../../src/plots/frame.ts";
import { clipPolyline, type Point } from "../../src/plots/marks.ts";
import { escapeXml, richText } from "../../src/plots/svgText.ts";
import { decadeDomain, logNiceDomain, logTicks } from "../../src/plots/ticks.ts";
import { displayUnits } from "../../src/plots/units.ts";
import { assertWellFormed, axisMap, decode, tickLabels, visibleText } from "./svgTools.ts";

describe("escaping", () => {
  it("escapes the five XML special characters", () => {
    expect(escapeXml(`<a href="x">Tom & Jerry's</a>`)).toBe("&lt;a href=&quot;x&quot;&gt;Tom &amp; Jerry&apos;s&lt;/a&gt;");
  });

  it("keeps subscript markup for internal labels but escapes what is inside it", () => {
    expect(richText("σ_{a} & <b>")).toBe('σ<tspan baseline-shift="sub" font-size="75%">a</tspan> &amp; &lt;b&gt;');
    expect(richText("x_{<i>}")).toContain("&lt;i&gt;");
  });

  it("any heading and label text yields well-formed markup that reads back as the text, less control characters", () => {
    fc.assert(
      fc.property(fc.string({ unit: "binary", maxLength: 60 }), (s) => {
        const svg = makeFrame({
          name: "t",
          heading: null,
          label: s,
          x: { kind: "linear", domain: [0, 1], title: "x (mm)" },
          y: { kind: "linear", domain: [0, 1], title: "y (MPa)" },
        }).render([]);
        assertWellFormed(svg);
        // eslint-disable-next-line no-control-regex
        // biome-ignore lint/suspicious/noControlCharactersInRegex: the control characters XML forbids are what this looks for
        const printable = s.replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g, "");
        expect(decode(svg.match(/<title>([^<]*)<\/title>/)![1])).toBe(printable);
        expect(decode(svg.match(/aria-label="([^"]*)"/)![1])).toBe(printable);
      }),
      { numRuns: 150 },
    );
  });
});

describe("number formatting", () => {
  it("never prints NaN or Infinity", () => {
    for (const v of [NaN, Infinity, -Infinity]) {
      expect(formatValue(v)).toBe("—");
      expect(formatTick(v, 1)).toBe("—");
    }
  });

  it("writes powers of ten with superscripts and a true minus sign", () => {
    expect(powerOfTen(1e4)).toBe("10⁴");
    expect(powerOfTen(2e5)).toBe("2×10⁵");
    expect(powerOfTen(1e-3)).toBe("10⁻³");
    expect(formatValue(2_100_000)).toBe("2.1×10⁶");
    expect(formatValue(-5.8)).toBe("−5.8");
    expect(formatValue(9_999_999)).toBe("10⁷");
    expect(formatValue(-2.5e-5)).toBe("−2.5×10⁻⁵");
  });

  it("groups thousands with a thin space from five digits on", () => {
    expect(formatValue(60000)).toBe("60\u2009000");
    expect(formatValue(1500)).toBe("1500");
    expect(formatTick(180000, 20000)).toBe("180\u2009000");
  });

  it("gives a tick as many decimals as its step needs, without float noise", () => {
    expect(formatTick(0.30000000000000004, 0.1)).toBe("0.3");
    expect(formatTick(0.25, 0.05)).toBe("0.25");
    expect(formatTick(-0, 1)).toBe("0");
  });
});

describe("log ticks", () => {
  it("labels decades as 10ⁿ on a cycles axis", () => {
    const t = logTicks([1e3, 1e8], 8, "power");
    expect(t.major.map((m) => m.label)).toEqual(["10³", "10⁴", "10⁵", "10⁶", "10⁷", "10⁸"]);
    expect(t.minor).toContain(2e3);
  });

  it("adds 1-2-3-5 multiples when the axis spans less than a decade", () => {
    const t = logTicks([100, 500], 4, "auto");
    expect(t.major.map((m) => m.value)).toEqual([100, 200, 300, 500]);
    expect(t.major.map((m) => m.label)).toEqual(["100", "200", "300", "500"]);
  });

  it("skips decades rather than crowd a short axis", () => {
    const t = logTicks([1, 1e12], 5, "power");
    expect(t.major.length).toBeLessThanOrEqual(5);
    expect(t.major[0].value).toBe(1);
  });

  it("rounds log domains out to decades or to 1-1.5-2-3-5-7 steps", () => {
    expect(decadeDomain([6e4, 2.1e5], [1, 10])).toEqual([1e4, 1e6]);
    expect(logNiceDomain([16, 65], [1, 10])).toEqual([15, 70]);
    expect(decadeDomain([NaN, -3], [1, 10])).toEqual([1, 10]);
  });
});

describe("clipping", () => {
  const rect = { left: 0, top: 0, right: 100, bottom: 100 };

  it("cuts a line where it leaves the plot area", () => {
    const pieces = clipPolyline(
      [
        [50, 50],
        [150, 50],
      ],
      rect,
    );
    expect(pieces).toEqual([
      [
        [50, 50],
        [100, 50],
      ],
    ]);
  });

  it("splits at a point that is not finite and where the line leaves and re-enters", () => {
    const pts: Point[] = [
      [10, 10],
      [20, 20],
      [NaN, 5],
      [30, 30],
      [40, 40],
      [40, 200],
      [60, 60],
      [70, 70],
    ];
    const pieces = clipPolyline(pts, rect);
    expect(pieces.length).toBe(3);
    expect(pieces[0]).toEqual([
      [10, 10],
      [20, 20],
    ]);
    expect(pieces[1]).toEqual([
      [30, 30],
      [40, 40],
      [40, 100],
    ]);
    expect(pieces[2][0][1]).toBeCloseTo(100, 9);
    expect(pieces[2].slice(1)).toEqual([
      [60, 60],
      [70, 70],
    ]);
    for (const piece of pieces) for (const [x, y] of piece) expect(x >= 0 && x <= 100 && y >= 0 && y <= 100).toBe(true);
  });
});

describe("units", () => {
  it("converts MPa to ksi and psi and mm to inches, defaulting to SI", () => {
    const us = displayUnits({ units: { stress: "ksi", length: "in" } });
    expect(us.stress(100)).toBeCloseTo(14.50377, 5);
    expect(us.length(25.4)).toBeCloseTo(1, 12);
    expect(displayUnits({ units: { stress: "psi" } }).stress(1)).toBeCloseTo(145.0377, 4);
    const si = displayUnits(undefined);
    expect([si.stressUnit, si.lengthUnit, si.stress(7), si.length(7)]).toEqual(["MPa", "mm", 7, 7]);
  });
});

describe("frame", () => {
  const frame = makeFrame({
    name: "demo",
    heading: "Demo",
    label: "Demo plot",
    x: { kind: "linear", domain: [0, 50], title: "Thickness t (mm)" },
    y: { kind: "log", domain: [1e3, 1e6], title: "Life N (cycles)", logLabels: "power" },
    legend: [{ label: "series σ_{a}", style: { color: "#000", dash: "4 4", width: 2, marker: "triangle" } }],
  });
  const svg = frame.render([]);

  it("is an accessible, scalable SVG with a generic font stack", () => {
    assertWellFormed(svg);
    expect(svg).toMatch(/^<svg [^>]*role="img"/);
    expect(svg).toMatch(/^<svg [^>]*aria-label="Demo plot"/);
    expect(svg).toMatch(/^<svg [^>]*viewBox="0 0 800 \d+"/);
    expect(svg).toMatch(/^<svg [^>]*width="100%"/);
    expect(svg).toMatch(/font-family="[^"]*sans-serif"/);
    expect(svg).toContain("<title>Demo plot</title>");
    expect(svg).not.toMatch(/url\(|@import|<image|href=/);
  });

  it("prints axis titles with units and a legend with its dash pattern and marker", () => {
    const text = visibleText(svg);
    expect(text).toContain("Thickness t (mm)");
    expect(text).toContain("Life N (cycles)");
    expect(text).toContain("series σa");
    expect(svg).toMatch(/class="legend-entry"><line [^>]*stroke-dasharray="4 4"/);
    expect(svg).toMatch(/class="legend-entry">.*<path d="M[^"]*Z"/);
  });

  it("places data where the printed ticks say it belongs", () => {
    const xMap = axisMap(svg, "x", "linear");
    const yMap = axisMap(svg, "y", "log");
    const p = frame.at(12.5, 3e4)!;
    expect(p[0]).toBeCloseTo(xMap(12.5), 1);
    expect(p[1]).toBeCloseTo(yMap(3e4), 1);
    expect(tickLabels(svg, "y")).toEqual(["10³", "10⁴", "10⁵", "10⁶"]);
  });

  it("refuses to place points that cannot be drawn", () => {
    expect(frame.at(NaN, 1e4)).toBeNull();
    expect(frame.at(10, 0)).toBeNull();
    expect(frame.at(10, -5)).toBeNull();
  });

  it("falls back to a drawable domain when given nonsense", () => {
    const bad = makeFrame({
      name: "bad",
      heading: null,
      label: "bad",
      x: { kind: "log", domain: [NaN, -1], title: "x" },
      y: { kind: "linear", domain: [3, 3], title: "y" },
    }).render([]);
    assertWellFormed(bad);
    expect(bad).not.toMatch(/NaN|Infinity/);
  });

  it("shortens a heading too long for the width but keeps it whole in the accessible name", () => {
    const long = "Cabin barrel frame station 1234 to 1456, left-hand side, below the passenger window belt, skin panel 7";
    const s = makeFrame({
      name: "l",
      heading: long,
      label: long,
      x: { kind: "linear", domain: [0, 1], title: "x" },
      y: { kind: "linear", domain: [0, 1], title: "y" },
    }).render([]);
    expect(s).toContain(`<title>${long}</title>`);
    const heading = s.match(/class="heading"[^>]*>([^<]*)</)![1];
    expect(heading.endsWith("…")).toBe(true);
    expect(heading.length).toBeLessThan(long.length);
  });
});
