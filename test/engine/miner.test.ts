import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { minerDamage } from "../../src/engine/miner.ts";
import type { Cycle } from "../../src/engine/rainflow.ts";

// A Basquin-type life line N = 10^12 · Δσ^−3 with no fatigue limit (invented constants).
const powerLife = (range: number) => 1e12 * range ** -3;

const cycleArb = fc.record({
  range: fc.double({ min: 1, max: 500, noNaN: true }),
  mean: fc.double({ min: -100, max: 100, noNaN: true }),
  count: fc.double({ min: 0, max: 1e4, noNaN: true }),
});

describe("minerDamage", () => {
  it("sums count over life (hand arithmetic of D = Σ nᵢ/Nᵢ, Miner 1945)", () => {
    const cycles: Cycle[] = [
      { range: 100, mean: 50, count: 1000 }, // N = 10^6 → 0.001
      { range: 200, mean: 100, count: 10 }, // N = 1.25·10^5 → 0.00008
    ];
    const r = minerDamage(cycles, powerLife);
    expect(r.damagePerPass).toBeCloseTo(0.001 + 0.00008, 15);
    expect(r.passesToFailure).toBeCloseTo(1 / 0.00108, 8);
    expect(r.contributions.map((c) => c.range)).toEqual([100, 200]);
    expect(r.contributions[0].share).toBeCloseTo(0.001 / 0.00108, 12);
    expect(r.steps.map((s) => s.id)).toEqual(["miner-damage", "miner-passes"]);
  });

  it("gives constant-amplitude life back: n cycles at life N do n/N (closed form)", () => {
    const r = minerDamage([{ range: 150, mean: 0, count: 1 }], powerLife);
    expect(r.passesToFailure).toBeCloseTo(powerLife(150), 4);
  });

  it("leaves cycles with unlimited life out of the damage", () => {
    const limited = (range: number) => (range < 80 ? null : powerLife(range));
    const r = minerDamage(
      [
        { range: 50, mean: 0, count: 1e6 },
        { range: 100, mean: 0, count: 5 },
      ],
      limited,
    );
    expect(r.damagePerPass).toBeCloseTo(5 / 1e6, 15);
    expect(r.cyclesWithoutDamage).toBe(1e6);
    const none = minerDamage([{ range: 50, mean: 0, count: 3 }], limited);
    expect(none.damagePerPass).toBe(0);
    expect(none.passesToFailure).toBeNull();
  });

  it("lists only the top contributions, largest first", () => {
    const cycles = Array.from({ length: 30 }, (_, i) => ({ range: 10 + i, mean: 0, count: 1 }));
    const r = minerDamage(cycles, powerLife, 5);
    expect(r.contributions.map((c) => c.range)).toEqual([39, 38, 37, 36, 35]);
  });

  it("is additive over cycle lists and linear in the counts (property)", () => {
    fc.assert(
      fc.property(
        fc.array(cycleArb, { maxLength: 20 }),
        fc.array(cycleArb, { maxLength: 20 }),
        fc.double({ min: 0.1, max: 10, noNaN: true }),
        (a, b, k) => {
          const da = minerDamage(a, powerLife).damagePerPass;
          const db = minerDamage(b, powerLife).damagePerPass;
          const dab = minerDamage([...a, ...b], powerLife).damagePerPass;
          const dk = minerDamage(
            a.map((c) => ({ ...c, count: k * c.count })),
            powerLife,
          ).damagePerPass;
          const close = (x: number, y: number) => Math.abs(x - y) <= 1e-12 * Math.max(1e-300, Math.abs(x), Math.abs(y));
          return close(dab, da + db) && close(dk, k * da);
        },
      ),
    );
  });

  it("rejects a non-positive life", () => {
    expect(() => minerDamage([{ range: 1, mean: 0, count: 1 }], () => 0)).toThrow(RangeError);
  });
});
