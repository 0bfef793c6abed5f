import type { ResolvedCheck } from "./input.ts";
import { cabinDifferential } from "./atmosphere.ts";
import { InputError } from "./errors.ts";
import { countHistory, gateHistory } from "./rainflowMatrix.ts";
import { fmt, step, type Step } from "./step.ts";

/** One pressure cycle (MPa) with how many times it occurs in one pass of the loading. */
export interface PressureCycle {
  range: number;
  mean: number;
  count: number;
}

export interface Load {
  source: "direct" | "altitude" | "history" | "blocks";
  max_MPa: number;
  min_MPa: number;
  /** A single cycle has one entry with count 1; a spectrum has its rainflow or block cycles. */
  cycles: PressureCycle[];
  isSpectrum: boolean;
  historyPoints?: number;
  /** The hysteresis gate applied to a history, and the reversals it removed. */
  gate?: { gate_MPa: number; removed: number };
  steps: Step[];
}

/**
 * A history that repeats, rotated to start (and end) at its highest point, so that counting it once
 * counts the repeating sequence: the largest cycle is then a full cycle in every pass instead of two
 * halves that never meet, and the join from the last point back to the first is counted too
 * (ASTM E1049-85 §5.4.4 practice for repeated histories: begin at the highest peak or lowest valley).
 */
export function rotateToPeak(h: ArrayLike<number>): Float64Array {
  let k = 0;
  for (let i = 1; i < h.length; i++) if (h[i] > h[k]) k = i;
  const out = new Float64Array(h.length + 1);
  let j = 0;
  for (let i = k; i < h.length; i++) out[j++] = h[i];
  for (let i = 0; i <= k; i++) out[j++] = h[i];
  return out;
}

/**
 * The pressure loading in MPa, counted into cycles once so solvers can rescale it without recounting.
 * `repeated`: the history is one pass of many (a design life of more than one pass), so it is counted
 * as a repeating sequence; a single pass is counted as it stands.
 */
export function resolveLoad(p: ResolvedCheck["pressure"], repeated = false): Load {
  if (p.history_MPa) {
    const gate = p.gate_MPa ?? 0;
    const gated = gate > 0 ? gateHistory(p.history_MPa, gate) : undefined;
    if (gated && gated.series.length < 2)
      throw new InputError(
        "pressure.gate_MPa",
        `the hysteresis gate (${fmt(gate)} MPa) is larger than every range of the history, so no cycle is left to count; lower it`,
      );
    const source = gated ? gated.series : p.history_MPa;
    const counted = countHistory(repeated ? rotateToPeak(source) : source);
    const cycles = counted.cycles;
    const total = cycles.reduce((s, c) => s + c.count, 0);
    const binned =
      counted.binWidth > 0
        ? `, reduced to sorted range–mean classes ${fmt(counted.binWidth)} MPa wide: each range and mean is rounded up to its class edge, by less than ${fmt(counted.binWidth)} MPa (conservative)`
        : "";
    return {
      source: "history",
      max_MPa: counted.max,
      min_MPa: counted.min,
      cycles,
      isSpectrum: true,
      historyPoints: p.history_MPa.length,
      gate: gated ? { gate_MPa: gate, removed: gated.reversalsBefore - gated.reversalsAfter } : undefined,
      steps: [
        ...(gated
          ? [
              step(
                "hysteresis-gate",
                "Hysteresis gate ahead of counting (ripples below the gate dropped)",
                "reversal kept only once p(t) has moved back from it by ≥ Δp_gate",
                `Δp_gate = ${fmt(gate)} MPa: ${gated.reversalsBefore} reversals → ${gated.reversalsAfter}, ${gated.reversalsBefore - gated.reversalsAfter} removed`,
                gated.reversalsBefore - gated.reversalsAfter,
                "reversals removed",
                "range (hysteresis) gate before rainflow counting, common practice for logged histories (SAE AE-22 Fatigue Design Handbook, ch. 4, from memory); it lowers the damage, so the gate must stay below the smallest cycle that matters",
              ),
            ]
          : []),
        step(
          "rainflow",
          "Rainflow count of the pressure history",
          "cycles = rainflow(p(t))",
          `${gated ? `${gated.series.length} gated reversals of ${p.history_MPa.length} points` : `${p.history_MPa.length} points`} → ${cycles.length} distinct cycles, ${fmt(total)} cycles per pass${binned}${
            repeated
              ? "; repeated history: rotated to start and end at its highest point, so the largest cycle counts whole in every pass"
              : "; a single pass, counted as it stands (half cycles left open)"
          }`,
          total,
          "cycles",
          repeated
            ? "ASTM E1049-85, §5.4.4 (rainflow counting; repeated histories begin at the highest peak)"
            : "ASTM E1049-85, §5.4.4 (rainflow counting)",
        ),
      ],
    };
  }
  if (p.blocks) {
    const cycles = p.blocks.map((b) => ({ range: b.max_MPa - b.min_MPa, mean: (b.max_MPa + b.min_MPa) / 2, count: b.cycles }));
    const total = cycles.reduce((s, c) => s + c.count, 0);
    return {
      source: "blocks",
      max_MPa: Math.max(...p.blocks.map((b) => b.max_MPa)),
      min_MPa: Math.min(...p.blocks.map((b) => b.min_MPa)),
      cycles,
      isSpectrum: true,
      steps: [
        step(
          "blocks",
          "Block spectrum",
          "one pass = Σ blocks",
          `${p.blocks.length} blocks, ${fmt(total)} cycles per pass`,
          total,
          "cycles",
          "block loading, Palmgren–Miner (Dowling, Mechanical Behavior of Materials, §9.6)",
        ),
      ],
    };
  }
  const min = p.min_MPa ?? 0;
  if (p.fromAltitude) {
    const { differential_MPa, steps } = cabinDifferential(p.fromAltitude.flight_m, p.fromAltitude.cabin_m);
    return {
      source: "altitude",
      max_MPa: differential_MPa,
      min_MPa: min,
      cycles: [single(differential_MPa, min)],
      isSpectrum: false,
      steps,
    };
  }
  const max = p.max_MPa as number;
  return { source: "direct", max_MPa: max, min_MPa: min, cycles: [single(max, min)], isSpectrum: false, steps: [] };
}

function single(max: number, min: number): PressureCycle {
  return { range: max - min, mean: (max + min) / 2, count: 1 };
}
