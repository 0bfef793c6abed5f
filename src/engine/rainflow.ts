/**
 * Rainflow cycle counting after ASTM E1049-85 (reapproved), §5.4.4, with half and full cycles.
 *
 * The history is first reduced to its peaks and valleys (repeated values and points that
 * do not reverse the direction are dropped, §5.4.4 counts on reversals only). Each new
 * reversal is compared with the previous ones:
 *   X = range formed by the newest point and the one before it, Y = the range before X.
 *   While X ≥ Y: if Y contains the starting point S, count Y as one half cycle and drop
 *   its first point (S moves on); otherwise count Y as one full cycle and drop both of
 *   its points. At the end, every range left counts as one half cycle.
 * A counted cycle reports its range |P − V| and mean (P + V)/2, in the history's units.
 *
 * Memory: the reversals still open sit on a Float64Array stack that starts at 64 entries
 * and doubles, never beyond the history's length. The peak extra memory is therefore at
 * most 1.5 × 8 bytes per history point (old and new stack during the last growth), i.e.
 * below 1.5 × a Float64Array input, and only a few kilobytes for real load histories,
 * whose open reversals stay few. The history itself is read twice (validation, counting)
 * and never copied.
 */
import { InputError } from "./errors.ts";

export interface Cycle {
  range: number;
  mean: number;
  /** 0.5 for a half cycle, 1 for a full cycle; more once merged by countCycles. */
  count: number;
}

export type CycleSink = (range: number, mean: number, count: number) => void;

const PATH = "pressure.history_MPa";

/** Growable stack of open reversals with a movable bottom (the starting point S). */
class ReversalStack {
  private data: Float64Array;
  /** Index of S, the oldest point still open. */
  bottom = 0;
  top = 0;

  constructor(private readonly limit: number) {
    this.data = new Float64Array(Math.min(64, limit));
  }

  get size(): number {
    return this.top - this.bottom;
  }

  /** The i-th point counted back from the newest (0 = newest). */
  back(i: number): number {
    return this.data[this.top - 1 - i];
  }

  push(x: number): void {
    if (this.top === this.data.length) this.grow();
    this.data[this.top++] = x;
  }

  private grow(): void {
    const open = this.size;
    if (open * 2 <= this.data.length) {
      // At least half the buffer holds points already dropped below S: slide the open ones down.
      this.data.copyWithin(0, this.bottom, this.top);
    } else {
      const next = new Float64Array(Math.min(this.limit, this.data.length * 2));
      next.set(this.data.subarray(this.bottom, this.top));
      this.data = next;
    }
    this.bottom = 0;
    this.top = open;
  }

  get(i: number): number {
    return this.data[i];
  }
}

function validate(series: ArrayLike<number>): void {
  if (series.length < 2) {
    throw new InputError(PATH, "A pressure history needs at least two points to make a cycle.");
  }
  for (let i = 0; i < series.length; i++) {
    if (!Number.isFinite(series[i])) {
      throw new InputError(`${PATH}.${i}`, `Point ${i} of the pressure history is not a finite number.`);
    }
  }
}

/**
 * Count the cycles of a history, reporting each to `onCycle(range, mean, count)` with
 * count 0.5 or 1 as it is found. Returns the number of reversals (peaks and valleys,
 * including both ends) the history reduced to. Linear time.
 */
export function rainflow(series: ArrayLike<number>, onCycle: CycleSink): { reversals: number } {
  validate(series);
  const stack = new ReversalStack(series.length);
  let reversals = 0;

  const close = (): void => {
    // E1049 §5.4.4 steps 2–5, repeated while the newest range is at least the one before it.
    while (stack.size >= 3) {
      const x = Math.abs(stack.back(0) - stack.back(1));
      const y = Math.abs(stack.back(1) - stack.back(2));
      if (x < y) return;
      const a = stack.back(2);
      const b = stack.back(1);
      if (stack.size === 3) {
        // Y contains S: half cycle, S moves to Y's second point.
        onCycle(y, 0.5 * (a + b), 0.5);
        stack.bottom++;
      } else {
        onCycle(y, 0.5 * (a + b), 1);
        const newest = stack.back(0);
        stack.top -= 3;
        stack.push(newest);
      }
    }
  };
  const accept = (x: number): void => {
    reversals++;
    stack.push(x);
    close();
  };

  // One pass: `candidate` is the latest extreme of the current run; it becomes a reversal
  // when the history turns back. Repeats and points continuing the run are dropped.
  accept(series[0]);
  let candidate = series[0];
  let direction = 0;
  for (let i = 1; i < series.length; i++) {
    const v = series[i];
    if (v === candidate) continue;
    const d = v > candidate ? 1 : -1;
    if (direction !== 0 && d !== direction) accept(candidate);
    direction = d;
    candidate = v;
  }
  if (direction !== 0) accept(candidate);

  // E1049 §5.4.4 step 6: the ranges left open count as half cycles.
  for (let i = stack.bottom; i + 1 < stack.top; i++) {
    const a = stack.get(i);
    const b = stack.get(i + 1);
    onCycle(Math.abs(b - a), 0.5 * (a + b), 0.5);
  }
  return { reversals };
}

/**
 * Count the cycles of a history and merge equal (range, mean) pairs, largest range first
 * (then by mean). Memory grows with the number of distinct pairs, so for very long
 * histories with continuous values prefer `rainflow` with a binning sink.
 */
export function countCycles(series: ArrayLike<number>): Cycle[] {
  const merged = new Map<string, Cycle>();
  rainflow(series, (range, mean, count) => {
    const key = `${range}|${mean}`;
    const found = merged.get(key);
    if (found) found.count += count;
    else merged.set(key, { range, mean, count });
  });
  return [...merged.values()].sort((p, q) => q.range - p.range || p.mean - q.mean);
}
