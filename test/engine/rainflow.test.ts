import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { countCycles, rainflow, type Cycle } from "../../src/engine/rainflow.ts";
import { InputError } from "../../src/engine/errors.ts";

/** All cycles as reported, keyed "range|mean|count", with how often each was reported. */
function tally(series: ArrayLike<number>, onlyFull = false): Map<string, number> {
  const m = new Map<string, number>();
  rainflow(series, (range, mean, count) => {
    if (onlyFull && count !== 1) return;
    const key = `${range}|${mean}|${count}`;
    m.set(key, (m.get(key) ?? 0) + 1);
  });
  return m;
}

const repeat = (h: number[], k: number) => Array.from({ length: k }, () => h).flat();

// Small integer histories make ties (equal ranges, repeated values) common, which is where counting rules differ.
const history = fc.array(fc.integer({ min: -6, max: 6 }), { minLength: 2, maxLength: 30 });

describe("rainflow (ASTM E1049 §5.4.4)", () => {
  it("counts the standard's worked example", () => {
    // ASTM E1049-85 §5.4.4 example history −2, 1, −3, 5, −1, 3, −4, 4, −2; the standard's table of
    // counted ranges (from memory, and worked by hand with the §5.4.4 steps):
    // range 9: 0.5, 8: 1.0, 6: 0.5, 4: 1.5, 3: 0.5 cycles.
    const byRange = new Map<number, number>();
    for (const c of countCycles([-2, 1, -3, 5, -1, 3, -4, 4, -2])) byRange.set(c.range, (byRange.get(c.range) ?? 0) + c.count);
    expect([...byRange.entries()].sort((a, b) => b[0] - a[0])).toEqual([
      [9, 0.5],
      [8, 1.0],
      [6, 0.5],
      [4, 1.5],
      [3, 0.5],
    ]);
    // The full cycle is the inner loop −1 → 3 (mean 1), closed by the drop to −4 (worked by hand).
    expect(countCycles([-2, 1, -3, 5, -1, 3, -4, 4, -2])).toContainEqual({ range: 4, mean: 1, count: 1 });
  });

  it("uses each range between reversals exactly once: Σ 2·count = reversals − 1 (property)", () => {
    // A full cycle removes two reversals and accounts for two ranges; a half cycle removes one and
    // accounts for one; the R reversals left at the end give R − 1 half cycles. Hence the identity.
    fc.assert(
      fc.property(history, (h) => {
        let sum = 0;
        const { reversals } = rainflow(h, (_r, _m, c) => (sum += 2 * c));
        return sum === reversals - 1;
      }),
    );
  });

  it("drops repeats and points that do not reverse", () => {
    expect(countCycles([0, 0, 1, 2, 2, 3, 1, 1, 0])).toEqual(countCycles([0, 3, 0]));
    expect(rainflow([0, 0, 1, 2, 2, 3, 1, 1, 0], () => {}).reversals).toBe(3);
    // Filling every step with intermediate points changes nothing (property).
    fc.assert(
      fc.property(history, (h) => {
        const filled: number[] = [h[0]];
        for (let i = 1; i < h.length; i++) filled.push((h[i - 1] + h[i]) / 2, h[i]);
        return JSON.stringify(countCycles(filled)) === JSON.stringify(countCycles(h));
      }),
    );
    // A flat history has no cycles.
    expect(countCycles([2, 2, 2])).toEqual([]);
  });

  it("counts a constant-amplitude history as (reversals − 1)/2 cycles of the full range", () => {
    // With E1049's X ≥ Y rule each equal range meets the starting point and counts as a half cycle.
    const h = Array.from({ length: 101 }, (_, i) => (i % 2 ? 10 : -10));
    expect(countCycles(h)).toEqual([{ range: 20, mean: 0, count: 50 }]);
  });

  it("is unchanged by shifting and negating the history, and scales with it (property)", () => {
    fc.assert(
      fc.property(history, fc.integer({ min: -50, max: 50 }), (h, shift) => {
        const base = countCycles(h);
        const shifted = countCycles(h.map((x) => x + shift)).map((c) => ({ ...c, mean: c.mean - shift }));
        const negated = countCycles(h.map((x) => -x)).map((c) => ({ ...c, mean: -c.mean + 0 }));
        const scaled = countCycles(h.map((x) => 4 * x)).map((c) => ({ ...c, range: c.range / 4, mean: c.mean / 4 }));
        const norm = (cs: Cycle[]) =>
          JSON.stringify([...cs].map((c) => ({ ...c, mean: c.mean + 0 })).sort((p, q) => p.range - q.range || p.mean - q.mean));
        return norm(shifted) === norm(base) && norm(negated) === norm(base) && norm(scaled) === norm(base);
      }),
    );
  });

  it("closes every loop of a block again in each repeat (property)", () => {
    // A full cycle is a closed hysteresis loop: it closes when the history returns past the loop's
    // first point, which depends only on what follows it, so each copy of h in h·h closes h's loops again.
    fc.assert(
      fc.property(history, (h) => {
        const once = tally(h, true);
        const twice = tally(repeat(h, 2), true);
        return [...once].every(([key, n]) => (twice.get(key) ?? 0) >= 2 * n);
      }),
    );
  });

  it("adds the same cycles for every block after the first (property)", () => {
    // The reversals left open after any stretch are its strict backward records (points no later point
    // reaches or passes). After one whole block those come from the latest block only, so every later
    // block meets the same open stack and adds the same cycles: count(h⁴) − count(h³) = count(h³) − count(h²).
    const diff = (a: Map<string, number>, b: Map<string, number>) => {
      const d = new Map(a);
      for (const [k, v] of b) d.set(k, (d.get(k) ?? 0) - v);
      return JSON.stringify([...d].filter(([, v]) => v !== 0).sort());
    };
    fc.assert(
      fc.property(history, (h) => diff(tally(repeat(h, 4)), tally(repeat(h, 3))) === diff(tally(repeat(h, 3)), tally(repeat(h, 2)))),
    );
  });

  it("counts a million-point Float64Array history (its speed is measured by npm run bench)", () => {
    const n = 1_000_000;
    const h = new Float64Array(n);
    let seed = 1;
    for (let i = 0; i < n; i++) {
      seed = (seed * 16807) % 2147483647; // Park–Miller generator: repeatable noise
      h[i] = 100 * Math.sin(i * 0.37) + 80 * (seed / 2147483647 - 0.5);
    }
    let units = 0;
    const { reversals } = rainflow(h, (_r, _m, c) => (units += 2 * c));
    expect(units).toBe(reversals - 1); // the identity above, on a long history
  });

  it("rejects histories that cannot make a cycle", () => {
    const path = (h: ArrayLike<number>) => {
      try {
        rainflow(h, () => {});
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        return (e as InputError).path;
      }
      return "no error";
    };
    expect(path([])).toBe("pressure.history_MPa");
    expect(path([0.5])).toBe("pressure.history_MPa");
    expect(path([0, Number.NaN, 1])).toBe("pressure.history_MPa.1");
  });
});
