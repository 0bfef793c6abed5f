/**
 * Crack size against pressure cycles (the a–N curve from Paris-law growth), with the
 * critical size where the peak stress intensity reaches the toughness and a mark at
 * every inspection: the inspections that fall before the critical size are the chances
 * to find the crack.
 */
import { scaleLinear } from "d3-scale";
import { formatValue, isFiniteNumber } from "./format.ts";
import { type Frame, horizontalLineLabel, type LegendEntry, makeFrame, notes } from "./frame.ts";
import { DASH, marker, type Point, polyline, type SeriesStyle } from "./marks.ts";
import { FONT_SIZE, textAt } from "./svgText.ts";
import { displayUnits, type PlotOptions } from "./units.ts";

export interface CrackGrowthData {
  /** The grown crack size after n cycles, from the initial size up to (about) the critical size. */
  curve: { a_mm: number; n_cycles: number }[];
  critical_mm: number;
  /** null where no interval applies: no inspection marks are drawn. */
  inspectionInterval_cycles: number | null;
  initial_mm: number;
  /** The first inspection, from the initial flaw; with it the marks fall at the threshold and then every repeat interval. */
  threshold_cycles?: number | null;
  repeatInterval_cycles?: number | null;
  /** The size an inspection finds: a dotted line. */
  detectable_mm?: number | null;
  /** The same crack grown as if the stress along its path were uniform (a crack running into a gradient). */
  comparison?: { curve: { a_mm: number; n_cycles: number }[]; label: string } | null;
}

const GROWTH: SeriesStyle = { color: "#000", dash: DASH.solid, width: 2.6 };
const CRITICAL: SeriesStyle = { color: "#D55E00", dash: DASH.dashDot, width: 2.2 };
const INSPECTION: SeriesStyle = { color: "#0072B2", dash: DASH.short, width: 1.3, marker: "diamond", filled: true };
const INITIAL: SeriesStyle = { color: "#000", dash: "", width: 1, marker: "square", filled: false };
const COMPARISON: SeriesStyle = { color: "#777", dash: DASH.long, width: 2 };
const DETECTABLE: SeriesStyle = { color: "#007A5A", dash: DASH.dot, width: 2 };
/** Beyond this many inspections the marks stop being read one by one; numbering them would only clutter. */
const MAX_NUMBERED = 12;
const MAX_MARKS = 200;

export function crackGrowthPlot(data: CrackGrowthData, opts?: PlotOptions): string {
  const u = displayUnits(opts);
  const lu = u.lengthUnit;
  const len = (v: unknown) => (isFiniteNumber(v) && v >= 0 ? u.length(v) : NaN);
  const curve: Point[] = (data.curve ?? [])
    .filter((r) => r && isFiniteNumber(r.n_cycles) && r.n_cycles >= 0 && isFiniteNumber(r.a_mm) && r.a_mm >= 0)
    .map((r): Point => [r.n_cycles, len(r.a_mm)])
    .sort((a, b) => a[0] - b[0]);
  const critical = len(data.critical_mm);
  const initial = len(data.initial_mm);
  const interval =
    isFiniteNumber(data.inspectionInterval_cycles) && data.inspectionInterval_cycles > 0 ? data.inspectionInterval_cycles : NaN;

  const comparison: Point[] = (data.comparison?.curve ?? [])
    .filter((r) => r && isFiniteNumber(r.n_cycles) && r.n_cycles >= 0 && isFiniteNumber(r.a_mm) && r.a_mm >= 0)
    .map((r): Point => [r.n_cycles, len(r.a_mm)])
    .sort((a, b) => a[0] - b[0]);
  const detectable = len(data.detectable_mm);
  const threshold = isFiniteNumber(data.threshold_cycles) && data.threshold_cycles > 0 ? data.threshold_cycles : NaN;
  const repeat = isFiniteNumber(data.repeatInterval_cycles) && data.repeatInterval_cycles > 0 ? data.repeatInterval_cycles : NaN;
  const nEnd = curve.length ? curve[curve.length - 1][0] : NaN;
  const xMax = niceTop(Math.max(...[nEnd, interval].filter(isFiniteNumber), 0) * 1.04);
  const yMax = niceTop(Math.max(...[critical, initial, ...curve.map((p) => p[1])].filter(isFiniteNumber), 0) * 1.1);
  const inspections: number[] = [];
  // Inspections after the crack is critical find nothing to stop: marks run up to the end of the curve.
  const lastUseful = isFiniteNumber(nEnd) ? nEnd : xMax;
  if (isFiniteNumber(threshold)) {
    inspections.push(threshold);
    if (isFiniteNumber(repeat))
      for (let k = 1; threshold + k * repeat <= lastUseful * (1 + 1e-9) && k <= MAX_MARKS; k++) inspections.push(threshold + k * repeat);
  } else if (isFiniteNumber(interval))
    for (let k = 1; k * interval <= lastUseful * (1 + 1e-9) && k <= MAX_MARKS; k++) inspections.push(k * interval);

  const legend: LegendEntry[] = [];
  if (curve.length > 1) legend.push({ label: `crack size a (${lu})`, style: GROWTH });
  if (isFiniteNumber(critical)) legend.push({ label: `critical size a_{c} = ${formatValue(critical)} ${lu}`, style: CRITICAL });
  if (comparison.length > 1 && data.comparison) legend.push({ label: data.comparison.label, style: COMPARISON });
  if (inspections.length)
    legend.push({
      label: isFiniteNumber(threshold)
        ? isFiniteNumber(repeat)
          ? `inspections from ${formatValue(threshold)}, then every ${formatValue(repeat)} cycles`
          : `first inspection at ${formatValue(threshold)} cycles`
        : `inspection every ${formatValue(interval)} cycles`,
      style: INSPECTION,
    });
  if (isFiniteNumber(detectable)) legend.push({ label: `detectable size ${formatValue(detectable)} ${lu}`, style: DETECTABLE });
  if (isFiniteNumber(initial)) legend.push({ label: `initial size a_{0} = ${formatValue(initial)} ${lu}`, style: INITIAL, kind: "marker" });

  const heading = opts?.title ?? "Crack growth";
  const frame = makeFrame({
    name: "crack-growth",
    width: opts?.width,
    height: opts?.height,
    heading: heading || null,
    label: `${heading || "Crack growth"}: pressure cycles against crack size in ${lu}; from ${formatValue(initial)} to critical ${formatValue(critical)} ${lu} in ${formatValue(nEnd)} cycles; inspection every ${formatValue(interval)} cycles`,
    x: { kind: "linear", domain: [0, xMax], title: "Pressure cycles N" },
    y: { kind: "linear", domain: [0, yMax], title: `Crack size a (${lu})` },
    legend,
  });

  const content: string[] = [];
  const numbered = inspections.length <= MAX_NUMBERED;
  for (const [k, n] of inspections.entries()) content.push(inspectionMark(frame, curve, n, numbered ? String(k + 1) : null));
  if (isFiniteNumber(critical)) {
    const y = frame.y(critical);
    content.push(
      polyline(
        [
          [frame.area.left, y],
          [frame.area.right, y],
        ],
        CRITICAL,
        "critical-size",
        ` data-value="${critical}"`,
      ),
    );
    content.push(horizontalLineLabel(frame, y, `a_{c} ${formatValue(critical)} ${lu}`, "left"));
  }
  if (isFiniteNumber(detectable)) {
    const y = frame.y(detectable);
    content.push(
      polyline(
        [
          [frame.area.left, y],
          [frame.area.right, y],
        ],
        DETECTABLE,
        "detectable-size",
        ` data-value="${detectable}"`,
      ),
    );
  }
  for (const piece of frame.trace(comparison)) content.push(polyline(piece, COMPARISON, "comparison-curve"));
  for (const piece of frame.trace(curve)) content.push(polyline(piece, GROWTH, "growth-curve"));
  const start = frame.at(0, initial);
  if (start) content.push(marker("square", start[0], start[1], 11, INITIAL, "initial-size"));
  const end = curve.length ? frame.at(...curve[curve.length - 1]) : null;
  if (end && isFiniteNumber(critical) && curve[curve.length - 1][1] >= critical * 0.98)
    content.push(
      textAt(end[0] - 10, end[1] + 22, `a_{c} reached at ${formatValue(nEnd)} cycles`, {
        size: FONT_SIZE.note,
        anchor: "end",
        halo: true,
        rich: true,
        weight: "bold",
      }),
    );
  if (curve.length < 2) content.push(notes(frame, ["no growth curve to plot"], "top-left"));
  return frame.render(content);
}

function niceTop(v: number): number {
  return v > 0 ? scaleLinear().domain([0, v]).nice().domain()[1] : 1;
}

/**
 * A mark where the curve stands at the inspection (interpolated between its points) and,
 * while there are few, a numbered dashed vertical; many inspections get a short tick instead.
 */
function inspectionMark(frame: Frame, curve: Point[], n: number, number: string | null): string {
  const x = frame.x(n);
  if (!isFiniteNumber(x)) return "";
  const { top, bottom } = frame.area;
  const out = [
    polyline(
      [
        [x, number ? top : bottom - 12],
        [x, bottom],
      ],
      { ...INSPECTION, dash: number ? INSPECTION.dash : "" },
      "inspection",
      ` data-value="${n}"`,
    ),
  ];
  const a = sizeAt(curve, n);
  const p = isFiniteNumber(a) ? frame.at(n, a) : null;
  if (p) out.push(marker("diamond", p[0], p[1], 11, INSPECTION, "inspection-mark"));
  if (number)
    out.push(textAt(x + 4, top + FONT_SIZE.note + 4, number, { size: FONT_SIZE.note, halo: true, fill: INSPECTION.color, weight: "bold" }));
  return out.join("");
}

function sizeAt(curve: Point[], n: number): number {
  for (let i = 1; i < curve.length; i++) {
    const [n0, a0] = curve[i - 1];
    const [n1, a1] = curve[i];
    if (n >= n0 && n <= n1) return n1 === n0 ? a1 : a0 + ((n - n0) / (n1 - n0)) * (a1 - a0);
  }
  return NaN;
}
