/**
 * The frame every plot is drawn in: layout, axes with ticks and titles, grid, legend
 * and the <svg> wrapper with its accessible name. A plot supplies domains, series and
 * annotations; the frame owns everything that must look the same across plots.
 */
import { scaleLinear, scaleLog } from "d3-scale";
import { isFiniteNumber } from "./format.ts";
import { clipPolyline, marker, type Point, type Rect, type SeriesStyle, strokeAttrs } from "./marks.ts";
import { escapeXml, FONT_FAMILY, FONT_SIZE, num, textAt, textWidth } from "./svgText.ts";
import { linearTicks, type LogLabelStyle, logTicks, type TickSet } from "./ticks.ts";

export interface AxisSpec {
  kind: "linear" | "log";
  domain: [number, number];
  /** Title with unit, e.g. "Stress amplitude σ_{a} (MPa)"; uses the `_{sub}` markup. */
  title: string;
  logLabels?: LogLabelStyle;
}

export interface LegendEntry {
  /** Uses the `_{sub}` markup; built by the plot, never raw user text. */
  label: string;
  style: SeriesStyle;
  /** "line": a stroke sample (with the style's marker); "marker": the marker alone; "area": a filled swatch. */
  kind?: "line" | "marker" | "area";
  areaFill?: string;
}

export interface FrameSpec {
  /** Short name for the root element's class, e.g. "haigh". */
  name: string;
  width?: number;
  height?: number;
  /** Visible heading (plain text, escaped here); null for none. */
  heading: string | null;
  /** Accessible name: the <title> and aria-label; plain text (may hold the user's title), escaped here. */
  label: string;
  x: AxisSpec;
  y: AxisSpec;
  legend?: LegendEntry[];
  /** Viewbox units kept above the top of the y range inside the plot area, e.g. for "unlimited" lives. */
  topStrip?: number;
  /** Plain-text lines under the legend (escaped here): facts a reader needs that no axis shows. */
  footnotes?: string[];
}

export interface Frame {
  /** The plot area in viewBox units. */
  area: Rect;
  /** Where the y range starts (below any top strip). */
  yTop: number;
  x(v: number): number;
  y(v: number): number;
  /** Pixel position of a data point, or null when it cannot be placed (not finite, or ≤ 0 on a log axis). */
  at(x: number, y: number): Point | null;
  /** Data points → clipped pixel polylines. */
  trace(points: Point[]): Point[][];
  render(content: string[]): string;
}

const DEFAULT_WIDTH = 800;
/** Default height before the legend; the legend adds its rows so the plot area keeps its size. */
const DEFAULT_HEIGHT_WITHOUT_LEGEND = 440;
const MIN_PLOT_HEIGHT = 150;
const TICK = 6;
const LEGEND_ROW = 24;
const FOOTNOTE_ROW = 20;
const LEGEND_SAMPLE = 46;

export function makeFrame(spec: FrameSpec): Frame {
  const width = positiveOr(spec.width, DEFAULT_WIDTH);
  const xAxis = { ...spec.x, domain: safeDomain(spec.x) };
  const yAxis = { ...spec.y, domain: safeDomain(spec.y) };
  const legend = spec.legend ?? [];

  const headingSize = fitHeading(spec.heading, width);
  const top = spec.heading ? 18 + headingSize.size + 14 : 18;
  // The legend starts under the plot area, whose left margin is not known yet: allow a typical one.
  const legendLayout = layoutLegend(legend, width - 110);
  const footnotes = (spec.footnotes ?? []).filter(Boolean);
  const legendBlock =
    (legendLayout.rows ? legendLayout.rows * LEGEND_ROW + 10 : 0) + (footnotes.length ? footnotes.length * FOOTNOTE_ROW + 8 : 0);
  const bottomMargin = TICK + FONT_SIZE.tick + 10 + FONT_SIZE.axisTitle + 12 + legendBlock;
  // A height too small for the legend would leave no plot: keep at least a readable area.
  const height = Math.max(positiveOr(spec.height, DEFAULT_HEIGHT_WITHOUT_LEGEND + legendBlock), top + MIN_PLOT_HEIGHT + bottomMargin);
  const bottom = height - bottomMargin;

  const yTicks = ticksFor(yAxis, Math.max(2, Math.floor((bottom - top) / 48)));
  const yLabelWidth = Math.max(0, ...yTicks.major.map((t) => textWidth(t.label, FONT_SIZE.tick)));
  const left = 14 + FONT_SIZE.axisTitle + 12 + yLabelWidth + TICK + 4;
  const xTicks = ticksFor(xAxis, Math.max(2, Math.floor((width - left - 30) / 95)));
  const lastX = xTicks.major[xTicks.major.length - 1];
  const right = width - Math.max(24, (lastX ? textWidth(lastX.label, FONT_SIZE.tick) / 2 : 0) + 6);
  const area: Rect = { left, top, right, bottom };
  const yTop = top + Math.max(0, spec.topStrip ?? 0);

  const xs = (xAxis.kind === "log" ? scaleLog() : scaleLinear()).domain(xAxis.domain).range([left, right]);
  const ys = (yAxis.kind === "log" ? scaleLog() : scaleLinear()).domain(yAxis.domain).range([bottom, yTop]);
  const x = (v: number) => xs(v);
  const y = (v: number) => ys(v);
  const placeable = (v: number, axis: AxisSpec) => isFiniteNumber(v) && (axis.kind === "linear" || v > 0);
  const at = (vx: number, vy: number): Point | null => {
    if (!placeable(vx, xAxis) || !placeable(vy, yAxis)) return null;
    const p: Point = [x(vx), y(vy)];
    return p.every(isFiniteNumber) ? p : null;
  };
  // Half a unit of slack so a line ending exactly on an axis is not cut by rounding.
  const clipRect: Rect = { left: left - 0.5, top: top - 0.5, right: right + 0.5, bottom: bottom + 0.5 };
  const trace = (points: Point[]) =>
    clipPolyline(
      points.map(([a, b]) => at(a, b) ?? [NaN, NaN]),
      clipRect,
    );

  const render = (content: string[]) => {
    const parts = [
      `<svg xmlns="http://www.w3.org/2000/svg" class="hoopwise-plot plot-${escapeXml(spec.name)}" viewBox="0 0 ${num(width)} ${num(height)}" width="100%" role="img" aria-label="${escapeXml(spec.label)}" font-family="${FONT_FAMILY}" fill="#000">`,
      `<title>${escapeXml(spec.label)}</title>`,
      `<rect width="${num(width)}" height="${num(height)}" fill="#fff"/>`,
      spec.heading
        ? textAt(width / 2, 18 + headingSize.size * 0.8, headingSize.text, {
            size: headingSize.size,
            anchor: "middle",
            weight: "bold",
            className: "heading",
          })
        : "",
      grid(xTicks, yTicks, x, y, area, yTop),
      ...content,
      axes(xTicks, yTicks, x, y, area, xAxis, yAxis, height),
      legendLayout.rows ? renderLegend(legend, legendLayout, left, height - legendBlock + 4) : "",
      ...footnotes.map((line, i) =>
        textAt(left, height - (footnotes.length - i - 1) * FOOTNOTE_ROW - 12, line, { size: FONT_SIZE.note, className: "footnote" }),
      ),
      `</svg>`,
    ];
    return parts.filter(Boolean).join("\n");
  };
  return { area, yTop, x, y, at, trace, render };
}

function positiveOr(v: number | undefined, fallback: number): number {
  return isFiniteNumber(v) && v >= 200 ? v : fallback;
}

/** A domain that can be drawn: finite, increasing, positive on a log axis. */
function safeDomain(axis: AxisSpec): [number, number] {
  let [a, b] = axis.domain;
  const ok = (v: number) => isFiniteNumber(v) && (axis.kind === "linear" || v > 0);
  if (!ok(a) && !ok(b)) return axis.kind === "log" ? [1, 10] : [0, 1];
  if (!ok(a)) a = axis.kind === "log" ? b / 10 : b - 1;
  if (!ok(b)) b = axis.kind === "log" ? a * 10 : a + 1;
  if (a > b) [a, b] = [b, a];
  if (a === b) return axis.kind === "log" ? [a / 2, a * 2] : a === 0 ? [0, 1] : [a - Math.abs(a) / 2, a + Math.abs(a) / 2];
  return [a, b];
}

function ticksFor(axis: AxisSpec, count: number): TickSet {
  return axis.kind === "log" ? logTicks(axis.domain, count, axis.logLabels) : linearTicks(axis.domain, count);
}

function fitHeading(heading: string | null, width: number): { text: string; size: number } {
  if (!heading) return { text: "", size: FONT_SIZE.heading };
  const room = width - 40;
  for (const size of [FONT_SIZE.heading, 18, 16]) if (textWidth(heading, size, true) <= room) return { text: heading, size };
  const chars = Math.max(8, Math.floor(room / (16 * 0.6)) - 1);
  return { text: `${heading.slice(0, chars)}…`, size: 16 };
}

/** The y title runs along a short side: shrink it rather than let it leave the picture. */
function fitSize(title: string, room: number): number {
  for (let size = FONT_SIZE.axisTitle; size > 12; size--) if (textWidth(title, size) <= room) return size;
  return 12;
}

function grid(xt: TickSet, yt: TickSet, x: (v: number) => number, y: (v: number) => number, a: Rect, yTop: number): string {
  const v = (px: number, color: string) =>
    `<line x1="${num(px)}" y1="${num(yTop)}" x2="${num(px)}" y2="${num(a.bottom)}" stroke="${color}" stroke-width="0.8"/>`;
  const h = (py: number, color: string) =>
    `<line x1="${num(a.left)}" y1="${num(py)}" x2="${num(a.right)}" y2="${num(py)}" stroke="${color}" stroke-width="0.8"/>`;
  const minorColor = "#ececec";
  const majorColor = "#cfcfcf";
  return [
    `<g class="grid">`,
    ...xt.minor.map((t) => v(x(t), minorColor)),
    ...yt.minor.map((t) => h(y(t), minorColor)),
    ...xt.major.map((t) => v(x(t.value), majorColor)),
    ...yt.major.map((t) => h(y(t.value), majorColor)),
    `</g>`,
  ].join("");
}

function axes(
  xt: TickSet,
  yt: TickSet,
  x: (v: number) => number,
  y: (v: number) => number,
  a: Rect,
  xa: AxisSpec,
  ya: AxisSpec,
  height: number,
): string {
  const xTick = (t: { value: number; label: string }) =>
    `<g class="tick-x" data-value="${t.value}" transform="translate(${num(x(t.value))},${num(a.bottom)})"><line y2="${TICK}" stroke="#000"/>${textAt(0, TICK + FONT_SIZE.tick + 2, t.label, { size: FONT_SIZE.tick, anchor: "middle" })}</g>`;
  const yTick = (t: { value: number; label: string }) =>
    `<g class="tick-y" data-value="${t.value}" transform="translate(${num(a.left)},${num(y(t.value))})"><line x2="${-TICK}" stroke="#000"/>${textAt(-TICK - 4, FONT_SIZE.tick * 0.35, t.label, { size: FONT_SIZE.tick, anchor: "end" })}</g>`;
  const xTitleY = a.bottom + TICK + FONT_SIZE.tick + 10 + FONT_SIZE.axisTitle;
  const yTitleX = 14 + FONT_SIZE.axisTitle * 0.8;
  return [
    `<g class="axes">`,
    `<rect x="${num(a.left)}" y="${num(a.top)}" width="${num(a.right - a.left)}" height="${num(a.bottom - a.top)}" fill="none" stroke="#000" stroke-width="1.2"/>`,
    ...xt.major.map(xTick),
    ...yt.major.map(yTick),
    textAt((a.left + a.right) / 2, Math.min(xTitleY, height - 4), xa.title, {
      size: FONT_SIZE.axisTitle,
      anchor: "middle",
      rich: true,
      className: "axis-title-x",
    }),
    textAt(yTitleX, (a.top + a.bottom) / 2, ya.title, {
      size: fitSize(ya.title, a.bottom - a.top + 40),
      anchor: "middle",
      rotate: -90,
      rich: true,
      className: "axis-title-y",
    }),
    `</g>`,
  ].join("");
}

interface LegendLayout {
  rows: number;
  columns: number;
  columnWidth: number;
}

function layoutLegend(entries: LegendEntry[], room: number): LegendLayout {
  if (entries.length === 0) return { rows: 0, columns: 0, columnWidth: 0 };
  const widest = Math.max(...entries.map((e) => textWidth(e.label, FONT_SIZE.legend)));
  const columnWidth = LEGEND_SAMPLE + 8 + widest + 22;
  const columns = Math.max(1, Math.min(entries.length, Math.floor(room / columnWidth)));
  return { rows: Math.ceil(entries.length / columns), columns, columnWidth };
}

function renderLegend(entries: LegendEntry[], layout: LegendLayout, left: number, top: number): string {
  const items = entries.map((e, i) => {
    // Column-major order keeps related entries (given in order) reading down a column.
    const col = Math.floor(i / layout.rows);
    const row = i % layout.rows;
    const x0 = left + col * layout.columnWidth;
    const yMid = top + row * LEGEND_ROW + LEGEND_ROW / 2;
    const sample = legendSample(e, x0, yMid);
    return `<g class="legend-entry">${sample}${textAt(x0 + LEGEND_SAMPLE + 8, yMid + FONT_SIZE.legend * 0.35, e.label, { size: FONT_SIZE.legend, rich: true })}</g>`;
  });
  return `<g class="legend">${items.join("")}</g>`;
}

function legendSample(e: LegendEntry, x0: number, yMid: number): string {
  const kind = e.kind ?? "line";
  const xm = x0 + LEGEND_SAMPLE / 2;
  if (kind === "area")
    return `<rect x="${num(x0)}" y="${num(yMid - 7)}" width="${LEGEND_SAMPLE}" height="14" fill="${escapeXml(e.areaFill ?? "#ddd")}" ${strokeAttrs(e.style).replace('fill="none" ', "")}/>`;
  const stroke =
    kind === "line"
      ? `<line x1="${num(x0)}" y1="${num(yMid)}" x2="${num(x0 + LEGEND_SAMPLE)}" y2="${num(yMid)}" ${strokeAttrs(e.style)}/>`
      : "";
  const mark = e.style.marker ? marker(e.style.marker, xm, yMid, 10, e.style) : "";
  return stroke + mark;
}

export type Corner = "top-left" | "top-right" | "bottom-left" | "bottom-right";

/** Short notes (plain text, escaped) stacked in a corner of the plot area, each on a white halo. */
export function notes(frame: Frame, lines: string[], corner: Corner): string {
  if (lines.length === 0) return "";
  const { left, right, bottom } = frame.area;
  const rowHeight = FONT_SIZE.note + 5;
  const atRight = corner.endsWith("right");
  const x = atRight ? right - 8 : left + 8;
  const y0 = corner.startsWith("top") ? frame.area.top + 8 + FONT_SIZE.note : bottom - 8 - (lines.length - 1) * rowHeight;
  return `<g class="notes">${lines
    .map((l, i) => textAt(x, y0 + i * rowHeight, l, { size: FONT_SIZE.note, anchor: atRight ? "end" : "start", halo: true }))
    .join("")}</g>`;
}

/** The operating point: a large filled circle with a white ring, unlike any series marker. */
export function operatingPoint(p: Point, className = "operating-point"): string {
  return `<circle class="${escapeXml(className)}" cx="${num(p[0])}" cy="${num(p[1])}" r="7" fill="#000" stroke="#fff" stroke-width="2"/><circle cx="${num(p[0])}" cy="${num(p[1])}" r="9.5" fill="none" stroke="#000" stroke-width="1.2"/>`;
}

export const OPERATING_LEGEND: LegendEntry = {
  label: "operating point",
  style: { color: "#000", dash: "", width: 1, marker: "circle", filled: true },
  kind: "marker",
};

/**
 * A label running up beside a vertical line from the top of the plot area; rotated so it
 * never crowds the x axis. Two close lines take one side each.
 */
export function verticalLineLabel(frame: Frame, x: number, content: string, side: "left" | "right" = "left"): string {
  // Rotated text grows to the left of its anchor, so the right side sets the anchor a glyph height further out.
  const ax = side === "left" ? x - 6 : x + 6 + FONT_SIZE.note * 0.8;
  return textAt(ax, frame.yTop + 8, content, { size: FONT_SIZE.note, anchor: "end", rotate: -90, halo: true, rich: true });
}

/** A label sitting on a horizontal line near one end of the plot area. */
export function horizontalLineLabel(frame: Frame, y: number, content: string, side: "left" | "right" = "right"): string {
  const x = side === "right" ? frame.area.right - 8 : frame.area.left + 8;
  return textAt(x, y - 7, content, { size: FONT_SIZE.note, anchor: side === "right" ? "end" : "start", halo: true, rich: true });
}
