import { describe, expect, it } from "vitest";
import { countCycles } from "../../src/engine/rainflow.ts";
import { countHistory, DEFAULT_BINS, EXACT_LIMIT } from "../../src/engine/rainflowMatrix.ts";

/** Seeded pseudo-random levels, so the test is the same every run. */
function history(points: number): Float64Array {
  const h = new Float64Array(points);
  let seed = 987654;
  for (let i = 0; i < points; i++) {
    seed = (seed * 1103515245 + 12345) & 0x7fffffff;
    h[i] = 0.2 + 0.8 * (seed / 0x7fffffff);
  }
  return h;
}

/** Basquin-type damage, exponent 1/b = −1/0.1: heavily weighted to the large ranges, as fatigue is. */
const damage = (cycles: { range: number; mean: number; count: number }[]) =>
  cycles.reduce((d, c) => d + c.count * (c.range * (1 + c.mean)) ** 10, 0);

describe("rainflow counts gathered in a range–mean matrix", () => {
  it("short histories are counted exactly (ASTM E1049 counts, no binning)", () => {
    const h = history(1000);
    const counted = countHistory(h);
    expect(counted.binWidth).toBe(0);
    expect(counted.cycles).toEqual(countCycles(h));
  });

  it("long histories keep every cycle and round each range and mean up to its bin edge", () => {
    const h = history(EXACT_LIMIT + 5000);
    const exact = countCycles(h);
    const binned = countHistory(h);
    expect(binned.binWidth).toBeCloseTo((binned.max - binned.min) / DEFAULT_BINS, 12);
    const total = (cs: { count: number }[]) => cs.reduce((s, c) => s + c.count, 0);
    expect(total(binned.cycles)).toBe(total(exact));
    // Rounding up can only add damage (conservative), and by little at this bin width.
    const dExact = damage(exact);
    const dBinned = damage(binned.cycles);
    expect(dBinned).toBeGreaterThanOrEqual(dExact);
    expect(dBinned / dExact).toBeLessThan(1.1);
    expect(binned.cycles.length).toBeLessThan(exact.length);
  });
});
