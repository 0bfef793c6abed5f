import { countCycles, rainflow, type Cycle } from "./rainflow.ts";

/**
 * Rainflow cycles of a long history gathered into a range–mean matrix (ASTM E1049 §5.4.4 counting;
 * binning into a matrix is the usual way to store counts, e.g. Dowling, Mechanical Behavior of
 * Materials §9.8). Ranges and means are rounded UP to the next bin edge, so binning can only add
 * damage (conservative); the bin width is reported. Short histories are counted exactly.
 *
 * Memory: one Float64Array of (bins + 1)² counts (2 MiB at 512 bins) beside the counting stack,
 * whatever the history's length; cycles are never held one by one.
 */
export const EXACT_LIMIT = 20_000;
export const DEFAULT_BINS = 512;

export interface CountedHistory {
  cycles: Cycle[];
  /** 0 when counted exactly. */
  binWidth: number;
  min: number;
  max: number;
}

export function countHistory(series: ArrayLike<number>, bins = DEFAULT_BINS): CountedHistory {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < series.length; i++) {
    const v = series[i];
    if (v < min) min = v;
    if (v > max) max = v;
  }
  if (series.length <= EXACT_LIMIT || !(max > min)) return { cycles: countCycles(series), binWidth: 0, min, max };
  const width = (max - min) / bins;
  const side = bins + 1;
  const counts = new Float64Array(side * side);
  rainflow(series, (range, mean, count) => {
    const r = Math.min(bins, Math.ceil(range / width - 1e-9));
    const m = Math.min(bins, Math.ceil((mean - min) / width - 1e-9));
    counts[r * side + m] += count;
  });
  const cycles: Cycle[] = [];
  for (let r = bins; r >= 1; r--) {
    for (let m = 0; m < side; m++) {
      const n = counts[r * side + m];
      if (n > 0) cycles.push({ range: r * width, mean: min + m * width, count: n });
    }
  }
  return { cycles, binWidth: width, min, max };
}

/**
 * Hysteresis gate (range filter) ahead of counting: a turn of the history counts as a reversal only
 * once the history has moved back from it by at least `gate`, so every ripple smaller than the gate
 * is dropped and every range left between successive reversals is at least the gate. This is the
 * usual gate of data reduction before rainflow counting (common practice for logged histories,
 * e.g. SAE Fatigue Design Handbook AE-22, ch. 4, from memory). It removes damage: the step says how
 * many reversals went, and a gate is the user's choice, never a default.
 */
export interface GatedHistory {
  /** The reversals that pass the gate, first point to last. */
  series: Float64Array;
  reversalsBefore: number;
  reversalsAfter: number;
}

/** Peaks and valleys of a history, both ends included (the reversals E1049 counts on). */
export function reversalCount(series: ArrayLike<number>): number {
  if (series.length === 0) return 0;
  let n = 1;
  let candidate = series[0];
  let direction = 0;
  for (let i = 1; i < series.length; i++) {
    const v = series[i];
    if (v === candidate) continue;
    const d = v > candidate ? 1 : -1;
    if (direction !== 0 && d !== direction) n++;
    direction = d;
    candidate = v;
  }
  return direction !== 0 ? n + 1 : n;
}

export function gateHistory(series: ArrayLike<number>, gate: number): GatedHistory {
  const out: number[] = [];
  let lo = series[0];
  let hi = series[0];
  let direction = 0;
  let extreme = series[0];
  for (let i = 1; i < series.length; i++) {
    const x = series[i];
    if (direction === 0) {
      // Until the history first moves by the gate, only its lowest and highest points matter.
      if (x < lo) lo = x;
      if (x > hi) hi = x;
      if (x - lo >= gate && x > lo) {
        out.push(lo);
        direction = 1;
        extreme = x;
      } else if (hi - x >= gate && x < hi) {
        out.push(hi);
        direction = -1;
        extreme = x;
      }
      continue;
    }
    if (direction === 1) {
      if (x > extreme) extreme = x;
      else if (extreme - x >= gate) {
        out.push(extreme);
        direction = -1;
        extreme = x;
      }
    } else if (x < extreme) extreme = x;
    else if (x - extreme >= gate) {
      out.push(extreme);
      direction = 1;
      extreme = x;
    }
  }
  if (direction !== 0) out.push(extreme);
  const gated = Float64Array.from(out);
  return { series: gated, reversalsBefore: reversalCount(series), reversalsAfter: reversalCount(gated) };
}
