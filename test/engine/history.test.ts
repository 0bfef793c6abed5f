import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { base, example, run } from "./exampleRun.ts";
import { resolveLoad, rotateToPeak } from "../../src/engine/load.ts";

describe("repeated histories", () => {
  // ASTM E1049-85 §5.4.4 example history, shifted by +5 so the shell stays pressurized
  const e1049 = [-2, 1, -3, 5, -1, 3, -4, 4, -2].map((x) => x + 5);

  it("a single pass is counted as it stands (ASTM E1049 Table 4)", () => {
    // E1049-85 rainflow result (from memory): range 3: 0.5, 4: 1.5, 6: 0.5, 8: 1.0, 9: 0.5 cycles
    const load = resolveLoad({ history_MPa: e1049 } as never, false);
    const byRange = new Map<number, number>();
    for (const c of load.cycles) byRange.set(c.range, (byRange.get(c.range) ?? 0) + c.count);
    expect(Object.fromEntries(byRange)).toEqual({ 3: 0.5, 4: 1.5, 6: 0.5, 8: 1, 9: 0.5 });
  });

  it("a repeated history is rotated to its highest point: the largest cycle counts whole (hand count)", () => {
    // rotated: 10, 4, 8, 1, 9, 3, 3, 6, 2, 10. Hand count (E1049 §5.4.4 rules): full cycles of range 4 (4↔8),
    // 3 (3↔6), 7 (9↔2), and the two halves of range 9 (10↔1) that now meet: one full cycle each.
    expect([...rotateToPeak(e1049)]).toEqual([10, 4, 8, 1, 9, 3, 3, 6, 2, 10]);
    const load = resolveLoad({ history_MPa: e1049 } as never, true);
    const byRange = new Map<number, number>();
    for (const c of load.cycles) byRange.set(c.range, (byRange.get(c.range) ?? 0) + c.count);
    expect(Object.fromEntries(byRange)).toEqual({ 3: 1, 4: 1, 7: 1, 9: 1 });
    expect(load.steps[0].substituted).toMatch(/rotated to start and end at its highest point/);
    expect(load.steps[0].source).toMatch(/E1049/);
  });

  it("a design life of one pass keeps the single-pass count; more passes rotate", () => {
    const history = e1049.map((x) => x * 0.01);
    const one = run(base({ pressure: { history_MPa: history }, fatigue: { ...example.fatigue, designLife_cycles: 1 } }));
    const many = run(base({ pressure: { history_MPa: history }, fatigue: { ...example.fatigue, designLife_cycles: 100 } }));
    expect(one.spectrum!.totalCycles).toBeCloseTo(4, 12); // 0.5 + 1.5 + 0.5 + 1 + 0.5
    expect(many.spectrum!.totalCycles).toBeCloseTo(4, 12); // four full cycles
    expect(many.spectrum!.cycles[0].range_MPa).toBeCloseTo((2.5 * 0.09 * 1500) / 1.6, 9); // Kt 2.5 × 9 × 0.01 MPa × r/t
  });

  it("property: rotating a repeated history never lengthens the life", () => {
    const point = fc.integer({ min: 1, max: 100 }).map((x) => x / 1000);
    fc.assert(
      fc.property(
        fc.array(point, { minLength: 3, maxLength: 40 }),
        fc.constantFrom("goodman", "swt", "morrow", "gerber", "walker"),
        (h, criterion) => {
          if (Math.max(...h) === Math.min(...h)) return;
          const fatigue = (life: number) => ({ ...example.fatigue, meanStress: criterion, designLife_cycles: life });
          const single = run(base({ pressure: { history_MPa: h }, fatigue: fatigue(1) }));
          const repeated = run(base({ pressure: { history_MPa: h }, fatigue: fatigue(1000) }));
          const l0 = single.spectrum!.passesToFailure ?? Infinity;
          const l1 = repeated.spectrum!.passesToFailure ?? Infinity;
          expect(l1).toBeLessThanOrEqual(l0 * (1 + 1e-9));
        },
      ),
      { numRuns: 200 },
    );
  });
});
