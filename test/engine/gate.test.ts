import fc from "fast-check";
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { checkDocument } from "../../src/engine/index.ts";
import { countCycles } from "../../src/engine/rainflow.ts";
import { gateHistory, reversalCount } from "../../src/engine/rainflowMatrix.ts";

const EXAMPLE = JSON.parse(readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8"));
const level = fc.double({ min: -1, max: 1, noNaN: true });

describe("hysteresis gate", () => {
  it("leaves only ranges of at least the gate between successive reversals, and rainflow then counts no smaller cycle (property)", () => {
    fc.assert(
      fc.property(fc.array(level, { minLength: 2, maxLength: 300 }), fc.double({ min: 0.01, max: 0.8, noNaN: true }), (h, gate) => {
        const g = gateHistory(h, gate);
        for (let i = 1; i < g.series.length; i++) expect(Math.abs(g.series[i] - g.series[i - 1])).toBeGreaterThanOrEqual(gate);
        if (g.series.length >= 2) for (const c of countCycles(g.series)) expect(c.range).toBeGreaterThanOrEqual(gate);
        // Every kept point is a point of the history; the gate never adds reversals.
        for (const x of g.series) expect(h).toContain(x);
        expect(g.reversalsAfter).toBeLessThanOrEqual(g.reversalsBefore);
      }),
      { numRuns: 300 },
    );
  });

  it("keeps the largest swing of the history whole (its highest and lowest points) when that swing passes the gate (property)", () => {
    fc.assert(
      fc.property(fc.array(level, { minLength: 2, maxLength: 300 }), fc.double({ min: 0.01, max: 0.5, noNaN: true }), (h, gate) => {
        const top = Math.max(...h);
        const bottom = Math.min(...h);
        fc.pre(top - bottom >= gate);
        const g = gateHistory(h, gate);
        expect(Math.max(...g.series)).toBe(top);
        expect(Math.min(...g.series)).toBe(bottom);
      }),
      { numRuns: 300 },
    );
  });

  it("removes a ripple smaller than the gate and keeps one larger (worked by hand)", () => {
    // 0 → 1 with a 0.05 ripple at 0.5 → 0: reversals 0, 0.55, 0.5, 1, 0 (five); a 0.1 gate leaves 0, 1, 0.
    const h = [0, 0.55, 0.5, 1, 0];
    expect(reversalCount(h)).toBe(5);
    const g = gateHistory(h, 0.1);
    expect([...g.series]).toEqual([0, 1, 0]);
    expect(g.reversalsBefore - g.reversalsAfter).toBe(2);
    expect([...gateHistory(h, 0.04).series]).toEqual([0, 0.55, 0.5, 1, 0]);
  });

  it("says on a step how many reversals it removed, warns, and refuses a gate above every range", () => {
    const history = Array.from({ length: 400 }, (_, i) => 0.03 + 0.02 * Math.sin(i / 10) + (i % 2 ? 0.004 : 0));
    const gated = checkDocument({ ...EXAMPLE, crack: undefined, pressure: { history_MPa: history, gate_MPa: 0.01 } });
    const plain = checkDocument({ ...EXAMPLE, crack: undefined, pressure: { history_MPa: history } });
    expect(gated.ok && plain.ok).toBe(true);
    if (!gated.ok || !plain.ok) return;
    const step = gated.result.steps.find((s) => s.id === "hysteresis-gate");
    const removed = reversalCount(history) - reversalCount(gateHistory(history, 0.01).series);
    expect(removed).toBeGreaterThan(100); // the 0.004 MPa flutter on every point
    expect(step?.value).toBe(removed);
    expect(step?.substituted).toMatch(new RegExp(`${removed} removed`));
    expect(gated.result.warnings.join(" ")).toMatch(/hysteresis gate .* removed/);
    // Fewer, never larger cycles: the damage can only go down.
    expect(gated.result.spectrum!.damagePerPass!).toBeLessThanOrEqual(plain.result.spectrum!.damagePerPass!);
    const tooBig = checkDocument({ ...EXAMPLE, crack: undefined, pressure: { history_MPa: history, gate_MPa: 1 } });
    expect(tooBig.ok).toBe(false);
    if (!tooBig.ok) expect(tooBig.errors[0].path).toBe("pressure.gate_MPa");
    const noHistory = checkDocument({ ...EXAMPLE, pressure: { max_MPa: 0.06, gate_MPa: 0.01 } });
    expect(!noHistory.ok && noHistory.errors[0].path).toBe("pressure.gate_MPa");
  });
});
