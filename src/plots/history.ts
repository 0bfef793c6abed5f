/**
 * A pressure history as it was logged: pressure against point number. A log of 10⁶ to 10⁷ points
 * has far more points than the plot has pixel columns, so it is decimated by min/max per column:
 * each column of the plot area draws one vertical stroke from the lowest to the highest pressure
 * of the points that fall in it, joined to the next column. Every extreme of the log is then on
 * the picture (no peak a plain subsampling would skip is lost), and the SVG holds about two
 * points per column whatever the log's length. One pass over the points, no copy of them.
 */
import { formatValue, isFiniteNumber } from "./format.ts";
import { makeFrame } from "./frame.ts";
import { num } from "./svgText.ts";
import { linearTicks } from "./ticks.ts";

export interface HistoryPlotData {
  /** The history in the unit shown (`unit`), in logged order. */
  values: ArrayLike<number>;
  /** The pressure unit's label, e.g. "kPa". */
  unit: string;
}

export interface HistoryPlotOptions {
  width?: number;
  height?: number;
  title?: string;
}

/** The lowest and highest value of each of `columns` equal runs of points, in one pass; NaN where a run holds none. */
export function minMaxColumns(values: ArrayLike<number>, columns: number): { min: Float64Array; max: Float64Array } {
  const n = values.length;
  const cols = Math.max(1, Math.floor(columns));
  const min = new Float64Array(cols).fill(Number.NaN);
  const max = new Float64Array(cols).fill(Number.NaN);
  // Point i falls in column floor(i·cols/n): each column's run is worked out once, not per point.
  for (let c = 0, from = 0; c < cols; c++) {
    const to = c === cols - 1 ? n : Math.ceil(((c + 1) * n) / cols);
    let lo = Number.NaN;
    let hi = Number.NaN;
    for (let i = from; i < to; i++) {
      const v = values[i];
      if (v - v !== 0) continue; // NaN or ±Infinity
      if (!(lo <= v)) lo = v;
      if (!(hi >= v)) hi = v;
    }
    min[c] = lo;
    max[c] = hi;
    from = to;
  }
  return { min, max };
}

/** Columns worked out before the plot area's width is known; merged into pixel columns after. */
const FINE_COLUMNS = 4096;

export function historyPlot(data: HistoryPlotData, opts: HistoryPlotOptions = {}): string {
  const n = data.values.length;
  const heading = opts.title ?? "Pressure history as logged";
  // One pass over the points: fine columns, from which the range and then the pixel columns follow.
  const fine = minMaxColumns(data.values, Math.min(FINE_COLUMNS, Math.max(1, n)));
  let lo = Infinity;
  let hi = -Infinity;
  for (let j = 0; j < fine.min.length; j++) {
    if (fine.min[j] < lo) lo = fine.min[j];
    if (fine.max[j] > hi) hi = fine.max[j];
  }
  const found = n > 0 && isFiniteNumber(lo) && isFiniteNumber(hi);
  const yDomain: [number, number] = found ? niceSpan(lo, hi) : [0, 1];
  const frame = makeFrame({
    name: "history",
    width: opts.width,
    height: opts.height,
    heading: heading || null,
    label: `${heading}: ${formatValue(n, 9)} points, pressure from ${found ? formatValue(lo) : "–"} to ${found ? formatValue(hi) : "–"} ${data.unit}, drawn as the lowest and highest pressure of each pixel column`,
    x: { kind: "linear", domain: [1, Math.max(2, n)], title: "Point number in the log" },
    y: { kind: "linear", domain: yDomain, title: `Pressure (${data.unit})` },
    footnotes: n > 0 ? [`${formatValue(n, 9)} points; each pixel column spans the lowest to the highest pressure of its points`] : [],
  });
  if (!found) return frame.render([]);
  const cols = Math.max(1, Math.min(Math.round(frame.area.right - frame.area.left), fine.min.length));
  const min = new Float64Array(cols).fill(Number.NaN);
  const max = new Float64Array(cols).fill(Number.NaN);
  for (let j = 0; j < fine.min.length; j++) {
    const c = Math.min(cols - 1, Math.floor((j * cols) / fine.min.length));
    if (!(min[c] <= fine.min[j])) min[c] = fine.min[j];
    if (!(max[c] >= fine.max[j])) max[c] = fine.max[j];
  }
  const step = (frame.area.right - frame.area.left) / cols;
  const parts: string[] = [];
  let pen = "M";
  for (let c = 0; c < cols; c++) {
    if (Number.isNaN(min[c])) {
      pen = "M";
      continue;
    }
    const x = num(frame.area.left + (c + 0.5) * step);
    parts.push(`${pen}${x} ${num(frame.y(min[c]))}V${num(frame.y(max[c]))}`);
    pen = "L";
  }
  const path = `<path class="history-envelope" d="${parts.join("")}" fill="none" stroke="#1f4e79" stroke-width="1" stroke-linejoin="round"/>`;
  return frame.render([path]);
}

/** A y range with round ends that holds [lo, hi] (a flat log gets some height). */
function niceSpan(lo: number, hi: number): [number, number] {
  if (hi - lo <= Math.abs(hi) * 1e-12) {
    const pad = Math.abs(hi) > 0 ? Math.abs(hi) * 0.1 : 1;
    return [lo - pad, hi + pad];
  }
  const ticks = linearTicks([lo, hi], 6).major.map((t) => t.value);
  const stepSize = ticks.length > 1 ? ticks[1] - ticks[0] : hi - lo;
  return [Math.min(lo, Math.floor(lo / stepSize) * stepSize), Math.max(hi, Math.ceil(hi / stepSize) * stepSize)];
}
