/**
 * The shell and its opening drawn to scale from the inputs: what a checker looks at first, to see
 * that the numbers describe the part meant. Left, the section of the shell with the wall and the
 * opening's hoop extent at true proportion; right, the skin round the opening developed flat
 * (hoop across, axis up) with the fastener holes and, when a crack is grown, its critical length
 * on the same scale bar. Nothing here is computed beyond proportion: the numbers are the engine's.
 */
import { formatValue, isFiniteNumber } from "./format.ts";
import { DASH, type Point, polyline } from "./marks.ts";
import { escapeXml, FONT_FAMILY, FONT_SIZE, num, textAt } from "./svgText.ts";
import { displayUnits, type PlotOptions } from "./units.ts";

export interface ShellPictureData {
  form: "cylinder" | "sphere";
  innerRadius_mm: number;
  outerRadius_mm: number;
  thickness_mm: number;
  /** The opening's outline round its centre, [hoop_mm, axial_mm]; null where its shape is not given. */
  outline: [number, number][] | null;
  fasteners: { hoop_mm: number; axial_mm: number; radius_mm: number }[];
  /** The crack size a as the crack model measures it, initial and critical, mm: drawn on the same scale as the skin. */
  crack?: { initial_mm: number; critical_mm: number; detectable_mm?: number | null };
}

const INK = "#000";
const OPENING = "#D55E00";
const CRACK = "#0072B2";

/** A round length for a scale bar: 1, 2 or 5 × 10^k display units, near a quarter of the span. */
export function scaleBarLength(span: number): number {
  const target = span / 4;
  const k = 10 ** Math.floor(Math.log10(target));
  const m = target / k;
  return (m >= 5 ? 5 : m >= 2 ? 2 : 1) * k;
}

export function shellPicture(data: ShellPictureData, opts?: PlotOptions): string {
  const u = displayUnits(opts);
  const W = opts?.width ?? 800;
  const H = Math.round(W * 0.56);
  const heading = opts?.title ?? "The shell and its opening, to scale";
  const ri = data.innerRadius_mm;
  const ro = data.outerRadius_mm;
  const rm = (ri + ro) / 2;
  const outline = (data.outline ?? []).filter((p) => p.every(isFiniteNumber));
  const holes = data.fasteners.filter((f) => [f.hoop_mm, f.axial_mm, f.radius_mm].every(isFiniteNumber));
  const len = (mm: number) => `${formatValue(u.length(mm))} ${u.lengthUnit}`;
  const hoopHalf = outline.length ? Math.max(...outline.map((p) => Math.abs(p[0]))) : 0;
  const label = `${heading}: ${data.form}, mean radius ${len(rm)}, wall ${len(data.thickness_mm)}${outline.length ? `, opening ${len(2 * hoopHalf)} across the hoop` : ", no opening outline"}${holes.length ? `, ${holes.length} fastener holes` : ""}${data.crack ? `, critical crack size ${len(data.crack.critical_mm)}` : ""}`;
  const out: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" class="hoopwise-plot plot-shell" viewBox="0 0 ${W} ${H}" width="100%" role="img" aria-label="${escapeXml(label)}" font-family="${escapeXml(FONT_FAMILY)}" fill="${INK}">`,
    `<title>${escapeXml(label)}</title>`,
  ];
  const top = heading ? 60 : 30;
  if (heading) out.push(textAt(20, 30, heading, { size: FONT_SIZE.heading, weight: "bold" }));
  if (!(ri > 0 && ro > ri)) {
    out.push(textAt(W / 2, H / 2, "no shell to draw", { anchor: "middle" }), "</svg>");
    return out.join("\n");
  }
  out.push(...section(data, hoopHalf, { x: 20, y: top, w: W * 0.36, h: H - top - 70 }, len));
  out.push(...developed(data, outline, holes, { x: W * 0.42, y: top, w: W * 0.56, h: H - top - 70 }, u.length, u.lengthUnit, len));
  out.push("</svg>");
  return out.join("\n");
}

interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** The section through the opening's centre: both wall faces at true radius, the opening's hoop half-width (mm) as an arc. */
function section(data: ShellPictureData, hoopHalf: number, b: Box, len: (mm: number) => string): string[] {
  const out: string[] = [];
  const R = Math.min(b.w, b.h - 40) / 2;
  const scale = R / data.outerRadius_mm;
  const cx = b.x + b.w / 2;
  const cy = b.y + 20 + R;
  const wallPx = (data.outerRadius_mm - data.innerRadius_mm) * scale;
  // The wall as a filled ring: inner and outer faces at their true radii.
  out.push(
    `<path class="wall" d="M ${num(cx - R)} ${num(cy)} a ${num(R)} ${num(R)} 0 1 0 ${num(2 * R)} 0 a ${num(R)} ${num(R)} 0 1 0 ${num(-2 * R)} 0 Z M ${num(cx - R + wallPx)} ${num(cy)} a ${num(R - wallPx)} ${num(R - wallPx)} 0 1 1 ${num(2 * (R - wallPx))} 0 a ${num(R - wallPx)} ${num(R - wallPx)} 0 1 1 ${num(-2 * (R - wallPx))} 0 Z" fill="#555" fill-rule="evenodd" stroke="${INK}" stroke-width="${wallPx < 1.5 ? 1.5 : 0.8}"/>`,
  );
  // The opening's hoop extent: an arc at the top of the section (its half-angle is half-width / mean radius).
  const rm = (data.innerRadius_mm + data.outerRadius_mm) / 2;
  if (hoopHalf > 0) {
    const phi = Math.min(Math.PI, hoopHalf / rm);
    const r = rm * scale;
    const p0: Point = [cx - r * Math.sin(phi), cy - r * Math.cos(phi)];
    const p1: Point = [cx + r * Math.sin(phi), cy - r * Math.cos(phi)];
    out.push(
      `<path class="opening-arc" d="M ${num(p0[0])} ${num(p0[1])} A ${num(r)} ${num(r)} 0 ${phi > Math.PI / 2 ? 1 : 0} 1 ${num(p1[0])} ${num(p1[1])}" fill="none" stroke="${OPENING}" stroke-width="7" stroke-linecap="butt"/>`,
    );
    out.push(textAt(cx, cy - R - 10, `opening ${len(2 * hoopHalf)}`, { anchor: "middle", size: FONT_SIZE.note, fill: OPENING }));
  }
  // The radius, drawn from the centre.
  out.push(
    polyline(
      [
        [cx, cy],
        [cx + R * Math.cos(Math.PI / 6), cy + R * Math.sin(Math.PI / 6)],
      ],
      { color: INK, dash: DASH.short, width: 1 },
    ),
  );
  out.push(textAt(cx + 8, cy + 28, `r_{m} ${len(rm)}`, { size: FONT_SIZE.note, rich: true, halo: true }));
  const lines = [
    `${data.form === "sphere" ? "Sphere, section through the opening" : "Cylinder, cross-section at the opening"}`,
    `wall t ${len(data.thickness_mm)}, r_{m}/t ${formatValue(rm / data.thickness_mm)}${wallPx < 1.5 ? " (thinner than a line here)" : ""}`,
  ];
  for (const [k, t] of lines.entries()) out.push(textAt(b.x, b.y + b.h + 30 + k * 20, t, { size: FONT_SIZE.note, rich: true }));
  return out;
}

/** The skin round the opening developed flat, to scale, with a scale bar and the critical crack on the same scale. */
function developed(
  data: ShellPictureData,
  outline: [number, number][],
  holes: ShellPictureData["fasteners"],
  b: Box,
  toDisplay: (mm: number) => number,
  unit: string,
  len: (mm: number) => string,
): string[] {
  const out: string[] = [];
  const xs = [...outline.map((p) => p[0]), ...holes.flatMap((f) => [f.hoop_mm - f.radius_mm, f.hoop_mm + f.radius_mm])];
  const ys = [...outline.map((p) => p[1]), ...holes.flatMap((f) => [f.axial_mm - f.radius_mm, f.axial_mm + f.radius_mm])];
  const crack = data.crack && isFiniteNumber(data.crack.critical_mm) && data.crack.critical_mm > 0 ? data.crack : undefined;
  // Half-span of the skin drawn: the opening and holes with a margin, at least the critical crack, at least 100 wall thicknesses.
  const reach = Math.max(...xs.map(Math.abs), ...ys.map(Math.abs), 0);
  const half = Math.max(reach * 1.35, (crack?.critical_mm ?? 0) * 0.6, 50 * data.thickness_mm);
  const plotH = b.h - 30;
  const scale = Math.min(b.w / (2 * half), plotH / (2 * half));
  const cx = b.x + b.w / 2;
  const cy = b.y + 10 + plotH / 2;
  const P = (x: number, y: number): Point => [cx + x * scale, cy - y * scale];
  const [l, t] = P(-half, half);
  out.push(
    `<rect class="skin" x="${num(l)}" y="${num(t)}" width="${num(2 * half * scale)}" height="${num(2 * half * scale)}" fill="#f2f2f2" stroke="#888"/>`,
  );
  out.push(polyline([P(-half, 0), P(half, 0)], { color: "#999", dash: DASH.dashDot, width: 1 }, "centre-line"));
  out.push(polyline([P(0, -half), P(0, half)], { color: "#999", dash: DASH.dashDot, width: 1 }, "centre-line"));
  out.push(textAt(P(half, 0)[0] - 4, P(half, 0)[1] - 6, "hoop →", { anchor: "end", size: FONT_SIZE.note }));
  out.push(textAt(P(0, half)[0] + 6, P(0, half)[1] + 16, "axial ↑", { size: FONT_SIZE.note }));
  if (outline.length) {
    const ring = [...outline, outline[0]].map(([x, y]) => P(x, y));
    out.push(
      `<path class="opening" d="M ${ring.map((p) => `${num(p[0])} ${num(p[1])}`).join(" L ")} Z" fill="#fff" stroke="${OPENING}" stroke-width="2.5"/>`,
    );
  } else out.push(textAt(cx, cy - 8, "opening shape not given (Kt only)", { anchor: "middle", size: FONT_SIZE.note, halo: true }));
  for (const f of holes) {
    const p = P(f.hoop_mm, f.axial_mm);
    out.push(
      `<circle class="fastener" cx="${num(p[0])}" cy="${num(p[1])}" r="${num(Math.max(f.radius_mm * scale, 1.5))}" fill="#fff" stroke="${INK}"/>`,
    );
  }
  // Scale bar and the critical crack on the same scale, below the skin.
  const yBar = b.y + b.h + 8;
  const barMm = scaleBarLength(toDisplay(2 * half)) / toDisplay(1);
  const x0 = b.x;
  out.push(
    polyline(
      [
        [x0, yBar],
        [x0 + barMm * scale, yBar],
      ],
      { color: INK, dash: "", width: 3 },
      "scale-bar",
    ),
  );
  out.push(textAt(x0, yBar + 20, `${formatValue(toDisplay(barMm))} ${unit}`, { size: FONT_SIZE.note }));
  if (crack) {
    const xc = x0 + barMm * scale + 40;
    const drawn = Math.min(crack.critical_mm * scale, b.x + b.w - xc);
    out.push(
      polyline(
        [
          [xc, yBar],
          [xc + drawn, yBar],
        ],
        { color: CRACK, dash: "", width: 3 },
        "critical-crack",
      ),
    );
    // Two lines, so the sizes stay inside the picture at any width the page gives it.
    const style = { size: FONT_SIZE.note, fill: CRACK };
    out.push(textAt(xc, yBar + 20, `crack size a: critical ${len(crack.critical_mm)}`, style));
    out.push(
      textAt(
        xc,
        yBar + 36,
        `initial ${len(crack.initial_mm)}${isFiniteNumber(crack.detectable_mm) ? `, detectable ${len(crack.detectable_mm)}` : ""}`,
        style,
      ),
    );
  }
  return out;
}
