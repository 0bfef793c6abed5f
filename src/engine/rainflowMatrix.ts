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
