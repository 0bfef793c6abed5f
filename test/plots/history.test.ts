import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { historyPlot, minMaxColumns } from "../../src/plots/history.ts";

/** The y coordinates of a path's points (every number after M, L or V, and the second of each M/L pair). */
function pathYs(svg: string): number[] {
  const d = /class="history-envelope" d="([^"]*)"/.exec(svg)?.[1] ?? "";
  const ys: number[] = [];
  for (const m of d.matchAll(/([MLV])(-?[\d.]+)(?: (-?[\d.]+))?/g)) ys.push(Number(m[1] === "V" ? m[2] : m[3]));
  return ys;
}

describe("the pressure history preview", () => {
  it("keeps each column's lowest and highest point, as a brute-force scan finds them (property)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -50, max: 50, noNaN: true }), { minLength: 1, maxLength: 400 }),
        fc.integer({ min: 1, max: 60 }),
        (xs, cols) => {
          const { min, max } = minMaxColumns(xs, cols);
          for (let c = 0; c < cols; c++) {
            // Point i belongs to column ⌊i·cols/n⌋.
            const run = xs.filter((_, i) => Math.floor((i * cols) / xs.length) === c);
            if (run.length === 0) expect(Number.isNaN(min[c])).toBe(true);
            else {
              expect(min[c]).toBe(Math.min(...run));
              expect(max[c]).toBe(Math.max(...run));
            }
          }
        },
      ),
      { numRuns: 200 },
    );
  });

  it("shows a one-point spike in a million flat points, which subsampling every hundredth point would miss", () => {
    const flat = new Float64Array(1_000_000).fill(0.5);
    const spiked = Float64Array.from(flat);
    spiked[654_321] = 0.9;
    spiked[123_457] = 0.1;
    const plain = pathYs(historyPlot({ values: flat, unit: "MPa" }));
    const withSpike = pathYs(historyPlot({ values: spiked, unit: "MPa" }));
    // The spike's column reaches higher on the page (smaller y) and the dip's lower than anything in the flat log.
    expect(Math.min(...withSpike)).toBeLessThan(Math.min(...plain) - 10);
    expect(Math.max(...withSpike)).toBeGreaterThan(Math.max(...plain) + 10);
  });

  it("draws a long log with about two points per pixel column, whatever its length, and names the count", () => {
    const n = 2_000_000;
    const values = new Float64Array(n);
    for (let i = 0; i < n; i++) values[i] = 0.05 * Math.sin(i / 500) + 0.003 * Math.sin(i / 3);
    const svg = historyPlot({ values, unit: "MPa" }, { width: 800 });
    expect(pathYs(svg).length).toBeLessThanOrEqual(2 * 800);
    expect(svg.length).toBeLessThan(60_000);
    expect(svg).toMatch(/2×10⁶ points/);
  });

  it("draws an empty or non-finite log as an empty frame, not an error", () => {
    expect(historyPlot({ values: [], unit: "kPa" })).toMatch(/<svg/);
    expect(historyPlot({ values: [Number.NaN, Number.NaN], unit: "kPa" })).not.toMatch(/history-envelope/);
  });
});
