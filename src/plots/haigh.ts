/**
 * Haigh (constant-life) diagram: mean stress across, stress amplitude up. Every
 * mean-stress criterion's line for the life being drawn passes through σar at zero
 * mean; the operating point sits on the line of the criterion the check used, and its
 * distance from the others shows how much the verdict leans on that choice.
 */
import { scaleLinear } from "d3-scale";
import { CRITERION_LABEL } from "../engine/meanStress.ts";
import { ALL_CRITERIA, amplitudeOnLine, type LineMaterial, type MeanStressCriterion, zeroAmplitudeMean } from "../engine/constantLife.ts";
import { formatValue, isFiniteNumber } from "./format.ts";
import { type Frame, type LegendEntry, makeFrame, notes, OPERATING_LEGEND, operatingPoint } from "./frame.ts";
import { DASH, marker, type Point, pointsAlong, polyline, type SeriesStyle } from "./marks.ts";
import { FONT_SIZE, num, textAt } from "./svgText.ts";
import { displayUnits, type PlotOptions } from "./units.ts";

export interface HaighData {
  operating: { mean_MPa: number; amplitude_MPa: number };
  /** σar: the fully reversed amplitude for the life being drawn. */
  equivalentAmplitude_MPa: number;
  ultimate_MPa: number;
  yield_MPa: number;
  fatigueStrengthCoefficient_MPa: number;
  walkerGamma?: number;
  /** Lines to draw; default every criterion whose constants are given. */
  criteria?: MeanStressCriterion[];
  /** The criterion the check used: drawn heavier and marked "used" in the legend. */
  selected?: MeanStressCriterion;
}

/** Fixed per criterion, so a criterion looks the same on every sheet. */
const STYLE: Record<MeanStressCriterion, SeriesStyle> = {
  goodman: { color: "#000000", dash: DASH.solid, width: 2.2, marker: "square", filled: true },
  gerber: { color: "#0072B2", dash: DASH.long, width: 2.2, marker: "circle", filled: false },
  soderberg: { color: "#D55E00", dash: DASH.short, width: 2.2, marker: "triangle", filled: true },
  "asme-elliptic": { color: "#007A5A", dash: DASH.dashDot, width: 2.2, marker: "diamond", filled: false },
  morrow: { color: "#A8457F", dash: DASH.dot, width: 2.4, marker: "square", filled: false },
  swt: { color: "#8B5A00", dash: DASH.dashDotDot, width: 2.2, marker: "triangle", filled: false },
  walker: { color: "#555555", dash: DASH.longShort, width: 2.2, marker: "diamond", filled: true },
};
// A broad pale band, unlike every dashed criterion, because it bounds the diagram rather than competing with the lines.
const YIELD_STYLE: SeriesStyle = { color: "#a3a3a3", dash: DASH.solid, width: 4.5 };

/** Criterion names as the engine words them, so the legend reads like the page and the sheet. */
const NAME = CRITERION_LABEL;

export function haighDiagram(data: HaighData, opts?: PlotOptions): string {
  const u = displayUnits(opts);
  const s = (v: unknown) => (isFiniteNumber(v) ? u.stress(v) : NaN);
  const m: LineMaterial = {
    equivalentAmplitude: s(data.equivalentAmplitude_MPa),
    ultimate: s(data.ultimate_MPa),
    yield: s(data.yield_MPa),
    fatigueStrengthCoefficient: s(data.fatigueStrengthCoefficient_MPa),
    walkerGamma: data.walkerGamma,
  };
  const mean = s(data.operating?.mean_MPa);
  const amp = s(data.operating?.amplitude_MPa);
  const sar = m.equivalentAmplitude;
  const positive = (v: number) => isFiniteNumber(v) && v > 0;

  const skipped: string[] = [];
  const requested = data.criteria ?? ALL_CRITERIA.filter((c) => c !== "walker" || isFiniteNumber(data.walkerGamma));
  const drawable = positive(sar)
    ? requested.filter((c) => {
        const missing = missingConstant(c, m);
        if (missing) skipped.push(`${NAME[c]} not drawn: ${missing}`);
        return !missing;
      })
    : [];

  const xMax = Math.max(...[m.ultimate, mean * 1.05].filter(positive), positive(m.yield) ? m.yield : 0) || 1;
  // A compressive mean pulls the axis below zero, with room for the point's marker.
  const xMin =
    isFiniteNumber(mean) && mean < 0
      ? scaleLinear()
          .domain([mean - 0.03 * (xMax - mean), xMax])
          .nice()
          .domain()[0]
      : 0;
  const peak = Math.max(...[sar, amp].filter(positive), 0);
  // Show the whole yield line only when that does not squash the constant-life lines; otherwise it enters from the top.
  const yBasis = positive(m.yield) && m.yield <= 1.6 * peak ? Math.max(peak, m.yield) : peak;
  const yMax = scaleLinear()
    .domain([0, (yBasis || 1) * 1.12])
    .nice()
    .domain()[1];

  const su = u.stressUnit;
  const legend: LegendEntry[] = drawable.map((c) => ({ label: legendLabel(c, data, m, su), style: styleOf(c, data.selected) }));
  const showYield = positive(m.yield);
  if (showYield) legend.push({ label: "yield: σ_{a} + |σ_{m}| = S_{y}", style: YIELD_STYLE });
  // The point's values go in the legend: beside the point a label would sit on the lines it is read against.
  if (isFiniteNumber(mean) && isFiniteNumber(amp))
    legend.push({ ...OPERATING_LEGEND, label: `operating point: σ_{m} ${formatValue(mean)}, σ_{a} ${formatValue(amp)} ${su}` });

  const heading = opts?.title ?? "Constant-life diagram (Haigh)";
  const frame = makeFrame({
    name: "haigh",
    width: opts?.width,
    height: opts?.height,
    heading: heading || null,
    label: `${heading || "Constant-life diagram (Haigh)"}: mean stress against stress amplitude in ${su}; operating point at mean ${formatValue(mean)} ${su}, amplitude ${formatValue(amp)} ${su}; σar ${formatValue(sar)} ${su}; lines: ${drawable.map((c) => NAME[c]).join(", ") || "none"}`,
    x: { kind: "linear", domain: [xMin, xMax], title: `Mean stress σ_{m} (${su})` },
    y: { kind: "linear", domain: [0, yMax], title: `Stress amplitude σ_{a} (${su})` },
    legend,
  });

  const content: string[] = [];
  if (showYield) content.push(yieldLine(frame, m.yield, xMin));
  drawable.forEach((c, i) => {
    content.push(criterionLine(frame, c, m, xMax, styleOf(c, data.selected), 0.25 + (0.5 * i) / Math.max(1, drawable.length)));
  });
  content.push(materialMarks(frame, m, sar, su));
  const op = frame.at(mean, amp);
  if (op) content.push(operatingPoint(op));
  else skipped.push("operating point not shown: mean or amplitude not given");
  if (!positive(sar)) skipped.push("no constant-life lines: σar not given");
  content.push(notes(frame, skipped, "top-right"));
  return frame.render(content);
}

function styleOf(c: MeanStressCriterion, selected: MeanStressCriterion | undefined): SeriesStyle {
  return c === selected ? { ...STYLE[c], width: 3.6 } : STYLE[c];
}

function missingConstant(c: MeanStressCriterion, m: LineMaterial): string | null {
  const ok = (v: number) => isFiniteNumber(v) && v > 0;
  if ((c === "goodman" || c === "gerber") && !ok(m.ultimate)) return "no ultimate strength";
  if ((c === "soderberg" || c === "asme-elliptic") && !ok(m.yield)) return "no yield strength";
  if (c === "morrow" && !ok(m.fatigueStrengthCoefficient)) return "no σ'f";
  if (c === "walker" && !(isFiniteNumber(m.walkerGamma) && m.walkerGamma > 0 && m.walkerGamma <= 1)) return "γ not given or outside (0, 1]";
  return null;
}

function legendLabel(c: MeanStressCriterion, data: HaighData, m: LineMaterial, su: string): string {
  const extra =
    c === "walker"
      ? ` (γ = ${formatValue(m.walkerGamma ?? NaN)}${m.walkerGamma === 0.5 ? ", the same line as SWT" : ""})`
      : c === "morrow"
        ? ` (σ'_{f} = ${formatValue(m.fatigueStrengthCoefficient)} ${su})`
        : "";
  return `${NAME[c]}${extra}${c === data.selected ? " — used" : ""}`;
}

function criterionLine(
  frame: Frame,
  c: MeanStressCriterion,
  m: LineMaterial,
  xMax: number,
  style: SeriesStyle,
  markerOffset: number,
): string {
  const end = Math.min(zeroAmplitudeMean(c, m), xMax);
  const straight = c === "goodman" || c === "soderberg" || c === "morrow";
  // Sample densely near the end, where the ellipse and the parabola turn down steeply.
  const n = straight ? 1 : 120;
  const pts: Point[] = [];
  for (let i = 0; i <= n; i++) {
    const sm = straight ? (i / n) * end : end * Math.sin((Math.PI / 2) * (i / n));
    pts.push([sm, Math.max(0, amplitudeOnLine(c, sm, m))]);
  }
  const pieces = frame.trace(pts);
  const lines = pieces.map((p) => polyline(p, style, `criterion criterion-${c}`, ` data-series="${c}"`));
  const marks =
    pieces.length && style.marker ? pointsAlong(pieces[0], 3, markerOffset).map(([x, y]) => marker(style.marker!, x, y, 10, style)) : [];
  return [...lines, ...marks].join("");
}

/** Tensile yield σa + σm = Sy and, for compressive means, σa − σm = Sy: either way the peak reaches yield. */
function yieldLine(frame: Frame, sy: number, xMin: number): string {
  const pts: Point[] =
    xMin < 0
      ? [
          [-sy, 0],
          [0, sy],
          [sy, 0],
        ]
      : [
          [0, sy],
          [sy, 0],
        ];
  return frame
    .trace(pts)
    .map((p) => polyline(p, YIELD_STYLE, "yield-line", ` data-series="yield"`))
    .join("");
}

function materialMarks(frame: Frame, m: LineMaterial, sar: number, su: string): string {
  const out: string[] = [];
  const { bottom } = frame.area;
  const axisMark = (v: number, name: string, anchor: "middle" | "end") => {
    const x = frame.x(v);
    if (!isFiniteNumber(x) || x < frame.area.left || x > frame.area.right + 0.5) return;
    out.push(`<line x1="${num(x)}" y1="${num(bottom)}" x2="${num(x)}" y2="${num(bottom - 10)}" stroke="#000" stroke-width="1.5"/>`);
    out.push(
      textAt(anchor === "end" ? x - 4 : x, bottom - 14, `${name} ${formatValue(v)}`, {
        size: FONT_SIZE.note,
        anchor,
        halo: true,
        rich: true,
      }),
    );
  };
  if (isFiniteNumber(m.ultimate) && m.ultimate > 0) axisMark(m.ultimate, "S_{u}", "end");
  if (isFiniteNumber(m.yield) && m.yield > 0 && m.yield < m.ultimate * 0.93) axisMark(m.yield, "S_{y}", "middle");
  const p = frame.at(0, sar);
  if (p && isFiniteNumber(sar) && sar > 0)
    out.push(textAt(p[0] + 8, p[1] - 10, `σ_{ar} = ${formatValue(sar)} ${su}`, { size: FONT_SIZE.note, halo: true, rich: true }));
  return out.join("");
}
