/**
 * Line styles, markers, arrows and clipping shared by every plot. A printed sheet is
 * often black and white, so each series differs by dash pattern and marker shape as
 * well as colour; colour only helps on screen.
 */
import { line } from "d3-shape";
import { isFiniteNumber } from "./format.ts";
import { escapeXml, num } from "./svgText.ts";

export type Point = [number, number];
export type MarkerShape = "circle" | "square" | "triangle" | "diamond";

/** Dash arrays in viewBox units; each is recognisable at a glance in print. */
export const DASH = {
  solid: "",
  long: "11 5",
  short: "5 4",
  dot: "2 4",
  dashDot: "12 4 3 4",
  dashDotDot: "12 3 3 3 3 3",
  longShort: "16 4 6 4",
} as const;

export interface SeriesStyle {
  color: string;
  dash: string;
  width: number;
  marker?: MarkerShape;
  /** Open markers have a white fill, so filled and open of one shape are two distinct series. */
  filled?: boolean;
}

function pathD(points: Point[]): string {
  return line().digits(2)(points) ?? "";
}

export function strokeAttrs(style: SeriesStyle): string {
  const dash = style.dash ? ` stroke-dasharray="${escapeXml(style.dash)}"` : "";
  return `fill="none" stroke="${escapeXml(style.color)}" stroke-width="${num(style.width)}"${dash}`;
}

export function polyline(points: Point[], style: SeriesStyle, className?: string, extra = ""): string {
  const cls = className ? ` class="${escapeXml(className)}"` : "";
  return `<path${cls} d="${pathD(points)}" ${strokeAttrs(style)} stroke-linejoin="round"${extra}/>`;
}

export function marker(shape: MarkerShape, x: number, y: number, size: number, style: SeriesStyle, className?: string): string {
  const cls = className ? `class="${escapeXml(className)}" ` : "";
  const paint = `fill="${style.filled ? escapeXml(style.color) : "#fff"}" stroke="${escapeXml(style.color)}" stroke-width="1.8"`;
  const r = size / 2;
  switch (shape) {
    case "circle":
      return `<circle ${cls}cx="${num(x)}" cy="${num(y)}" r="${num(r)}" ${paint}/>`;
    case "square":
      return `<rect ${cls}x="${num(x - r * 0.9)}" y="${num(y - r * 0.9)}" width="${num(r * 1.8)}" height="${num(r * 1.8)}" ${paint}/>`;
    case "triangle": {
      const h = r * 1.15;
      return `<path ${cls}d="${pathD([
        [x, y - h],
        [x + h, y + h * 0.8],
        [x - h, y + h * 0.8],
      ])}Z" ${paint}/>`;
    }
    case "diamond": {
      const h = r * 1.25;
      return `<path ${cls}d="${pathD([
        [x, y - h],
        [x + h, y],
        [x, y + h],
        [x - h, y],
      ])}Z" ${paint}/>`;
    }
  }
}

/** A shaft with an open head, drawn as paths rather than an SVG <marker> so no document-wide ids are needed. */
export function arrow(from: Point, to: Point, color: string, width = 1.8, head = 9): string {
  const [x0, y0] = from;
  const [x1, y1] = to;
  const angle = Math.atan2(y1 - y0, x1 - x0);
  const wing = (sign: number): Point => [x1 - head * Math.cos(angle + sign * 0.45), y1 - head * Math.sin(angle + sign * 0.45)];
  const stroke = `fill="none" stroke="${escapeXml(color)}" stroke-width="${num(width)}" stroke-linecap="round" stroke-linejoin="round"`;
  return `<path d="${pathD([from, to])}${pathD([wing(1), to, wing(-1)])}" ${stroke}/>`;
}

export interface Rect {
  left: number;
  top: number;
  right: number;
  bottom: number;
}

/**
 * Clip a polyline (pixel coordinates) to a rectangle, splitting it where it leaves and
 * re-enters and where a point is not finite. Geometric clipping instead of <clipPath>
 * keeps the markup free of ids, which would collide when several plots share a page.
 */
export function clipPolyline(points: Point[], r: Rect): Point[][] {
  const pieces: Point[][] = [];
  let current: Point[] = [];
  const flush = () => {
    if (current.length > 1) pieces.push(current);
    current = [];
  };
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    if (![...a, ...b].every(isFiniteNumber)) {
      flush();
      continue;
    }
    const seg = clipSegment(a, b, r);
    if (!seg) {
      flush();
      continue;
    }
    const [p, q] = seg;
    const last = current[current.length - 1];
    if (!last || last[0] !== p[0] || last[1] !== p[1]) {
      flush();
      current.push(p);
    }
    current.push(q);
    if (q[0] !== b[0] || q[1] !== b[1]) flush();
  }
  flush();
  return pieces;
}

// Liang–Barsky: the parametric segment a + t(b − a), t in [0, 1], kept where inside.
function clipSegment(a: Point, b: Point, r: Rect): [Point, Point] | null {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  let t0 = 0;
  let t1 = 1;
  const edges: [number, number][] = [
    [-dx, a[0] - r.left],
    [dx, r.right - a[0]],
    [-dy, a[1] - r.top],
    [dy, r.bottom - a[1]],
  ];
  const eps = 1e-9;
  for (const [p, q] of edges) {
    if (Math.abs(p) < eps) {
      if (q < -eps) return null;
      continue;
    }
    const t = q / p;
    if (p < 0) t0 = Math.max(t0, t);
    else t1 = Math.min(t1, t);
    if (t0 > t1 + eps) return null;
  }
  const at = (t: number): Point => (t === 0 ? a : t === 1 ? b : [a[0] + t * dx, a[1] + t * dy]);
  return [at(t0), at(t1)];
}

/** Points at even fractions of a polyline's length, offset per series so markers of neighbouring lines do not pile up. */
export function pointsAlong(points: Point[], count: number, offset: number): Point[] {
  const lengths = [0];
  for (let i = 1; i < points.length; i++)
    lengths.push(lengths[i - 1] + Math.hypot(points[i][0] - points[i - 1][0], points[i][1] - points[i - 1][1]));
  const total = lengths[lengths.length - 1];
  if (!(total > 0)) return [];
  const out: Point[] = [];
  for (let j = 0; j < count; j++) {
    const target = total * ((j + offset) / count);
    const i = lengths.findIndex((l) => l >= target);
    if (i <= 0) continue;
    const t = (target - lengths[i - 1]) / (lengths[i] - lengths[i - 1] || 1);
    out.push([points[i - 1][0] + t * (points[i][0] - points[i - 1][0]), points[i - 1][1] + t * (points[i][1] - points[i - 1][1])]);
  }
  return out;
}
