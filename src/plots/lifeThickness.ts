/**
 * Life against skin thickness around the current value: how much thickness the
 * required life asks for, and how steeply life rises with it. Lives the engine calls
 * unlimited (at or below the endurance limit) have no place on a log axis, so they sit
 * in a strip above it, marked "unlimited".
 */
import { formatValue, isFiniteNumber } from "./format.ts";
import {
  type Frame,
  horizontalLineLabel,
  type LegendEntry,
  makeFrame,
  notes,
  OPERATING_LEGEND,
  operatingPoint,
  verticalLineLabel,
} from "./frame.ts";
import { DASH, marker, type Point, polyline, type SeriesStyle } from "./marks.ts";
import { FONT_SIZE, num, textAt } from "./svgText.ts";
import { decadeDomain } from "./ticks.ts";
import { displayUnits, type PlotOptions } from "./units.ts";

export interface LifeThicknessData {
  /** Life at each thickness; null where unlimited. */
  points: { thickness_mm: number; life_cycles: number | null }[];
  current_mm: number;
  /** Design life × scatter factor. */
  requiredLife_cycles: number;
  /** The least thickness that reaches the required life, where solved. */
  minimumThickness_mm?: number | null;
  /** What a life counts: single cycles (default) or passes of a repeated history or block spectrum. */
  lifeUnit?: "cycles" | "passes";
}

const LIFE: SeriesStyle = { color: "#000", dash: DASH.solid, width: 2.4, marker: "square", filled: true };
const TO_UNLIMITED: SeriesStyle = { color: "#000", dash: DASH.short, width: 1.6, marker: "triangle", filled: false };
const REQUIRED: SeriesStyle = { color: "#D55E00", dash: DASH.dashDot, width: 2 };
const CURRENT: SeriesStyle = { color: "#0072B2", dash: DASH.long, width: 1.8 };
const MINIMUM: SeriesStyle = { color: "#007A5A", dash: DASH.dot, width: 2.2 };
const STRIP = 46;

interface Placed {
  thickness: number;
  life: number | null;
  p: Point;
}

export function lifeThicknessPlot(data: LifeThicknessData, opts?: PlotOptions): string {
  const u = displayUnits(opts);
  const lu = u.lengthUnit;
  const len = (v: unknown) => (isFiniteNumber(v) && v > 0 ? u.length(v) : NaN);
  const rows = (data.points ?? [])
    .filter((r) => r && isFiniteNumber(r.thickness_mm) && r.thickness_mm > 0)
    .map((r) => ({ thickness: len(r.thickness_mm), life: isFiniteNumber(r.life_cycles) && r.life_cycles > 0 ? r.life_cycles : null }))
    .sort((a, b) => a.thickness - b.thickness);
  const current = len(data.current_mm);
  const minimum = len(data.minimumThickness_mm);
  const required = isFiniteNumber(data.requiredLife_cycles) && data.requiredLife_cycles > 0 ? data.requiredLife_cycles : NaN;
  const anyUnlimited = rows.some((r) => r.life === null);
  const lifeUnit = data.lifeUnit === "passes" ? "passes" : "cycles";

  const ts = [...rows.map((r) => r.thickness), current, minimum].filter(isFiniteNumber);
  const tMin = ts.length ? Math.min(...ts) : NaN;
  const tMax = ts.length ? Math.max(...ts) : NaN;
  const pad = (tMax - tMin) * 0.06 || tMin * 0.1 || 1;
  const lives = [...rows.map((r) => r.life ?? NaN), required];
  const yDomain = decadeDomain(lives, [1e3, 1e7]);

  const legend: LegendEntry[] = [];
  if (rows.some((r) => r.life !== null)) legend.push({ label: "life at thickness", style: LIFE });
  if (anyUnlimited) legend.push({ label: "toward unlimited life", style: TO_UNLIMITED });
  if (isFiniteNumber(required)) legend.push({ label: `required life ${formatValue(required)} (design × scatter)`, style: REQUIRED });
  if (isFiniteNumber(current)) legend.push({ label: `current thickness ${formatValue(current, 4)} ${lu}`, style: CURRENT });
  if (isFiniteNumber(minimum)) legend.push({ label: `minimum thickness ${formatValue(minimum, 4)} ${lu}`, style: MINIMUM });
  if (rows.some((r) => sameThickness(r.thickness, current))) legend.push({ ...OPERATING_LEGEND, label: "life at the current thickness" });

  const heading = opts?.title ?? "Fatigue life against skin thickness";
  const frame = makeFrame({
    name: "life-thickness",
    width: opts?.width,
    height: opts?.height,
    heading: heading || null,
    label: `${heading || "Fatigue life against skin thickness"}: thickness in ${lu} against life in ${lifeUnit} (logarithmic); current thickness ${formatValue(current, 4)} ${lu}; required life ${formatValue(required)} ${lifeUnit}`,
    x: { kind: "linear", domain: [Math.max(0, tMin - pad), tMax + pad], title: `Skin thickness t (${lu})` },
    y: { kind: "log", domain: yDomain, title: `Life N (${lifeUnit})`, logLabels: "power" },
    legend,
    topStrip: anyUnlimited ? STRIP : 0,
  });

  const stripY = frame.area.top + STRIP / 2;
  const placed: Placed[] = rows.flatMap((r) => {
    const p = r.life === null ? placeUnlimited(frame, r.thickness, stripY) : frame.at(r.thickness, r.life);
    return p ? [{ ...r, p }] : [];
  });

  const content: string[] = [];
  if (anyUnlimited) content.push(unlimitedStrip(frame));
  // The minimum is usually the thinner, so its label goes left and the current one right.
  const minimumLeft = !(minimum > current);
  if (isFiniteNumber(minimum))
    content.push(
      vertical(frame, minimum, MINIMUM, `minimum t ${formatValue(minimum, 4)} ${lu}`, "minimum", minimumLeft ? "left" : "right"),
    );
  if (isFiniteNumber(current))
    content.push(
      vertical(frame, current, CURRENT, `current t ${formatValue(current, 4)} ${lu}`, "current", minimumLeft ? "right" : "left"),
    );
  if (isFiniteNumber(required)) {
    const y = frame.y(required);
    content.push(
      polyline(
        [
          [frame.area.left, y],
          [frame.area.right, y],
        ],
        REQUIRED,
        "required-life",
        ` data-value="${required}"`,
      ),
    );
    content.push(horizontalLineLabel(frame, y, `required ${formatValue(required)}`));
  }
  content.push(curve(placed));
  for (const r of placed) {
    if (sameThickness(r.thickness, current)) content.push(operatingPoint(r.p));
    else
      content.push(
        marker(
          r.life === null ? "triangle" : "square",
          r.p[0],
          r.p[1],
          10,
          r.life === null ? TO_UNLIMITED : LIFE,
          r.life === null ? "point unlimited" : "point",
        ),
      );
  }
  if (placed.length === 0) content.push(notes(frame, ["no lives to plot"], "bottom-right"));
  return frame.render(content);
}

function sameThickness(a: number, b: number): boolean {
  return isFiniteNumber(a) && isFiniteNumber(b) && Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}

function placeUnlimited(frame: Frame, thickness: number, y: number): Point | null {
  const x = frame.x(thickness);
  return isFiniteNumber(x) ? [x, y] : null;
}

/** Finite neighbours join with a solid line; a step into the unlimited strip is dashed, since no life is known between. */
function curve(placed: Placed[]): string {
  const out: string[] = [];
  let run: Point[] = [];
  const flush = () => {
    if (run.length > 1) out.push(polyline(run, LIFE, "life-curve"));
    run = [];
  };
  for (let i = 0; i < placed.length; i++) {
    const r = placed[i];
    const prev = placed[i - 1];
    if (r.life === null) {
      flush();
      if (prev && prev.life !== null) out.push(polyline([prev.p, r.p], TO_UNLIMITED, "life-to-unlimited"));
      continue;
    }
    if (prev && prev.life === null) out.push(polyline([prev.p, r.p], TO_UNLIMITED, "life-to-unlimited"));
    run.push(r.p);
  }
  flush();
  return out.join("");
}

function unlimitedStrip(frame: Frame): string {
  const { left, right, top } = frame.area;
  return [
    `<rect class="unlimited-strip" x="${num(left)}" y="${num(top)}" width="${num(right - left)}" height="${STRIP}" fill="#f3f3f3"/>`,
    `<line x1="${num(left)}" y1="${num(frame.yTop)}" x2="${num(right)}" y2="${num(frame.yTop)}" stroke="#000" stroke-width="1" stroke-dasharray="6 3"/>`,
    textAt(left + 8, top + STRIP / 2 + 5, "unlimited life", { size: FONT_SIZE.note, italic: true }),
  ].join("");
}

function vertical(frame: Frame, t: number, style: SeriesStyle, label: string, name: string, side: "left" | "right"): string {
  const x = frame.x(t);
  if (!isFiniteNumber(x)) return "";
  return (
    polyline(
      [
        [x, frame.yTop],
        [x, frame.area.bottom],
      ],
      style,
      `thickness-line thickness-${name}`,
      ` data-value="${t}"`,
    ) + verticalLineLabel(frame, x, label, side)
  );
}
