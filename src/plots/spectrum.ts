/**
 * The rainflow-counted load spectrum as a histogram: cycles counted in bins of stress
 * range (half cycles count ½). Counts go on a log axis when they span a decade or
 * more, as pressure spectra usually do (many small cycles, a few large ones).
 */
import { scaleLinear } from "d3-scale";
import { formatValue, isFiniteNumber } from "./format.ts";
import { type Frame, makeFrame, notes } from "./frame.ts";
import type { SeriesStyle } from "./marks.ts";
import { escapeXml, FONT_SIZE, num, textAt } from "./svgText.ts";
import { decadeDomain } from "./ticks.ts";
import { displayUnits, type PlotOptions } from "./units.ts";

export interface SpectrumData {
  cycles: { range_MPa: number; mean_MPa: number; count: number }[];
  /** Number of equal bins from zero to the largest range; default: about 10 on round edges. */
  bins?: number;
}

const BAR: SeriesStyle = { color: "#000", dash: "", width: 1 };
const BAR_FILL = "#aebfd0";
/** Count labels above the bars stay legible up to this many bins. */
const MAX_LABELLED_BINS = 16;
const MAX_BINS = 200;

interface Bin {
  from: number;
  to: number;
  count: number;
}

export function spectrumPlot(data: SpectrumData, opts?: PlotOptions): string {
  const u = displayUnits(opts);
  const su = u.stressUnit;
  const cycles = (data.cycles ?? []).filter(
    (c) => c && isFiniteNumber(c.range_MPa) && c.range_MPa >= 0 && isFiniteNumber(c.count) && c.count > 0,
  );
  const bins = binCycles(
    cycles.map((c) => ({ range: u.stress(c.range_MPa), count: c.count })),
    data.bins,
  );
  const counted = bins.filter((b) => b.count > 0);
  const total = cycles.reduce((s, c) => s + c.count, 0);
  const maxCount = Math.max(0, ...counted.map((b) => b.count));
  const minCount = Math.min(...counted.map((b) => b.count));
  // From one decade of spread up, counts go on a log axis: a few large cycles, which do most of the damage,
  // would otherwise be a sliver beside thousands of small ones.
  const logCounts = counted.length > 0 && maxCount / minCount >= 10;
  const yDomain: [number, number] = logCounts
    ? decadeDomain([minCount, maxCount], [0.1, 10])
    : [
        0,
        scaleLinear()
          .domain([0, (maxCount || 1) * 1.1])
          .nice()
          .domain()[1],
      ];
  const xMax = bins.length ? bins[bins.length - 1].to : 1;

  const means = cycles.map((c) => u.stress(c.mean_MPa)).filter(isFiniteNumber);
  const footnotes = cycles.length
    ? [
        `${formatValue(total, 7)} cycles in all (half cycles count ½)`,
        means.length
          ? `mean stress of the counted cycles: ${formatValue(Math.min(...means))} to ${formatValue(Math.max(...means))} ${su}`
          : "",
      ]
    : [];
  const heading = opts?.title ?? "Load spectrum (rainflow count)";
  const frame = makeFrame({
    name: "spectrum",
    width: opts?.width,
    height: opts?.height,
    heading: heading || null,
    label: `${heading || "Load spectrum (rainflow count)"}: cycles counted by stress range in ${su}, ${bins.length} bins, ${formatValue(total, 7)} cycles in all${logCounts ? ", counts on a logarithmic axis" : ""}`,
    x: { kind: "linear", domain: [0, xMax], title: `Stress range Δσ (${su})` },
    y: { kind: logCounts ? "log" : "linear", domain: yDomain, title: "Cycles counted", logLabels: "auto" },
    footnotes,
  });

  const content = bins.map((b) => bar(frame, b, bins.length <= MAX_LABELLED_BINS));
  if (cycles.length === 0) content.push(notes(frame, ["no cycles counted"], "top-right"));
  return frame.render(content);
}

/** Equal bins from zero; the largest range falls in the last bin, not past it. */
function binCycles(cycles: { range: number; count: number }[], requested: number | undefined): Bin[] {
  const top = Math.max(0, ...cycles.map((c) => c.range));
  if (cycles.length === 0 || top === 0) return cycles.length ? [{ from: 0, to: 1, count: cycles.reduce((s, c) => s + c.count, 0) }] : [];
  let edges: number[];
  if (isFiniteNumber(requested) && requested >= 1) {
    const n = Math.min(MAX_BINS, Math.round(requested));
    edges = Array.from({ length: n + 1 }, (_, i) => (top * i) / n);
  } else {
    // Round edges (0, 20, 40 … MPa) read off the axis directly.
    const nice = scaleLinear().domain([0, top]).nice(10);
    edges = nice.ticks(10);
    if (edges[edges.length - 1] < top) edges.push(edges[edges.length - 1] + (edges[1] - edges[0]));
  }
  const width = edges[1] - edges[0];
  const out: Bin[] = edges.slice(0, -1).map((from, i) => ({ from, to: edges[i + 1], count: 0 }));
  for (const c of cycles) out[Math.min(out.length - 1, Math.floor(c.range / width + 1e-9))].count += c.count;
  return out;
}

function bar(frame: Frame, b: Bin, labelled: boolean): string {
  if (!(b.count > 0)) return "";
  const x0 = frame.x(b.from);
  const x1 = frame.x(b.to);
  const top = frame.y(b.count);
  const bottom = frame.area.bottom;
  if (![x0, x1, top].every(isFiniteNumber)) return "";
  const y = Math.max(frame.yTop, Math.min(top, bottom));
  const rect = `<rect class="bar" data-from="${b.from}" data-to="${b.to}" data-count="${b.count}" x="${num(x0)}" y="${num(y)}" width="${num(x1 - x0)}" height="${num(bottom - y)}" fill="${BAR_FILL}" stroke="${escapeXml(BAR.color)}" stroke-width="${BAR.width}"/>`;
  const label = labelled
    ? textAt((x0 + x1) / 2, y - 5, formatValue(b.count, 7), { size: FONT_SIZE.note - 1, anchor: "middle", halo: true })
    : "";
  return rect + label;
}
