/**
 * The opening as a picture: its outline coloured by the edge stress per unit nominal hoop stress
 * (at the biaxial ratio of maximum pressure), the governing point, the fastener holes with their
 * Kt, the curvature parameter and the path of a crack grown from one of the holes; and the edge
 * stress against arc length round the opening.
 */
import { formatValue, isFiniteNumber } from "./format.ts";
import { horizontalLineLabel, type LegendEntry, makeFrame } from "./frame.ts";
import { DASH, marker, type Point, polyline, type SeriesStyle } from "./marks.ts";
import { escapeXml, FONT_FAMILY, FONT_SIZE, num, textAt } from "./svgText.ts";
import { displayUnits, type PlotOptions } from "./units.ts";

export interface OpeningPictureData {
  /** Edge points [hoop_mm, axial_mm, arc length mm, edge stress per unit σθ]. */
  edge: [number, number, number, number][];
  governing: { hoop_mm: number; axial_mm: number; kt: number; at: "opening" | "fastener"; index?: number };
  fasteners: { hoop_mm: number; axial_mm: number; radius_mm: number; kt: number; solvedWithOpening: boolean }[];
  curvature: { beta: number; limit: number; within: boolean } | null;
  /** A crack grown from one of the fastener holes: its straight path from the hole's edge to the opening's edge. */
  crackPath?: { fastener: number; start_mm: [number, number]; end_mm: [number, number]; ligament_mm: number };
}

/** Colour of an edge stress ratio: blue (compression) through grey to red (the peak); colour-blind-safe ends. */
function colourOf(v: number, lo: number, hi: number): string {
  const t = hi > lo ? Math.min(1, Math.max(0, (v - lo) / (hi - lo))) : 0.5;
  // 0 → #0072B2 (blue), 0.5 → #BBBBBB, 1 → #D55E00 (vermilion)
  const a = t < 0.5 ? [0x00, 0x72, 0xb2] : [0xbb, 0xbb, 0xbb];
  const b = t < 0.5 ? [0xbb, 0xbb, 0xbb] : [0xd5, 0x5e, 0x00];
  const s = t < 0.5 ? t * 2 : (t - 0.5) * 2;
  const c = a.map((x, i) => Math.round(x + (b[i] - x) * s));
  return `#${c.map((x) => x.toString(16).padStart(2, "0")).join("")}`;
}

export function openingPicture(data: OpeningPictureData, opts?: PlotOptions): string {
  const u = displayUnits(opts);
  const W = opts?.width ?? 800;
  const H = Math.round(W * 0.82);
  const edge = (data.edge ?? []).filter((e) => e.every(isFiniteNumber));
  const fast = (data.fasteners ?? []).filter((f) => [f.hoop_mm, f.axial_mm, f.radius_mm, f.kt].every(isFiniteNumber));
  const xs = [...edge.map((e) => e[0]), ...fast.flatMap((f) => [f.hoop_mm - f.radius_mm, f.hoop_mm + f.radius_mm])];
  const ys = [...edge.map((e) => e[1]), ...fast.flatMap((f) => [f.axial_mm - f.radius_mm, f.axial_mm + f.radius_mm])];
  const heading = opts?.title ?? "Edge stress round the opening";
  const label = `${heading}: outline coloured by the edge stress per unit nominal hoop stress, peak Kt ${formatValue(data.governing?.kt ?? NaN)} at the ${data.governing?.at === "fastener" ? `edge of fastener hole ${(data.governing.index ?? 0) + 1}` : "opening's edge"}${fast.length ? `; ${fast.length} fastener holes` : ""}${data.curvature ? `; curvature parameter β ${formatValue(data.curvature.beta)}` : ""}${data.crackPath ? `; crack path from fastener hole ${data.crackPath.fastener} to the opening's edge` : ""}`;
  const out: string[] = [];
  out.push(
    `<svg xmlns="http://www.w3.org/2000/svg" class="hoopwise-plot plot-opening" viewBox="0 0 ${W} ${H}" width="100%" role="img" aria-label="${escapeXml(label)}" font-family="${escapeXml(FONT_FAMILY)}" fill="#000">`,
    `<title>${escapeXml(label)}</title>`,
  );
  if (heading) out.push(textAt(20, 30, heading, { size: FONT_SIZE.heading, weight: "bold" }));
  if (!edge.length) {
    out.push(textAt(W / 2, H / 2, "no outline to draw", { anchor: "middle" }), "</svg>");
    return out.join("\n");
  }
  const left = 60;
  const right = W - 170;
  const top = 60;
  const bottom = H - 70;
  const x0 = Math.min(...xs);
  const x1 = Math.max(...xs);
  const y0 = Math.min(...ys);
  const y1 = Math.max(...ys);
  const scale = Math.min((right - left) / (x1 - x0 || 1), (bottom - top) / (y1 - y0 || 1));
  const cx = (left + right) / 2 - ((x0 + x1) / 2) * scale;
  const cy = (top + bottom) / 2 + ((y0 + y1) / 2) * scale;
  const P = (x: number, y: number): Point => [cx + x * scale, cy - y * scale];
  const values = [...edge.map((e) => e[3]), ...fast.map((f) => f.kt)];
  const hi = Math.max(...values);
  const lo = Math.min(...values, 0);
  // centre lines
  const c0 = P(0, 0);
  out.push(
    polyline(
      [
        [left - 20, c0[1]],
        [right + 20, c0[1]],
      ],
      { color: "#999", dash: DASH.dashDot, width: 1 },
      "centre-line",
    ),
  );
  out.push(
    polyline(
      [
        [c0[0], top - 20],
        [c0[0], bottom + 20],
      ],
      { color: "#999", dash: DASH.dashDot, width: 1 },
      "centre-line",
    ),
  );
  out.push(textAt(right + 18, c0[1] - 6, "hoop →", { anchor: "end", size: FONT_SIZE.note }));
  out.push(textAt(c0[0] + 6, top - 8, "axial ↑", { size: FONT_SIZE.note }));
  // outline, one coloured segment per edge point
  for (let i = 0; i < edge.length; i++) {
    const a = edge[i];
    const b = edge[(i + 1) % edge.length];
    const pa = P(a[0], a[1]);
    const pb = P(b[0], b[1]);
    out.push(
      `<line x1="${num(pa[0])}" y1="${num(pa[1])}" x2="${num(pb[0])}" y2="${num(pb[1])}" stroke="${colourOf((a[3] + b[3]) / 2, lo, hi)}" stroke-width="6" stroke-linecap="round"/>`,
    );
  }
  // fasteners
  for (const [k, f] of fast.entries()) {
    const p = P(f.hoop_mm, f.axial_mm);
    const r = Math.max(f.radius_mm * scale, 3.5);
    out.push(
      `<circle class="fastener" cx="${num(p[0])}" cy="${num(p[1])}" r="${num(r)}" fill="${colourOf(f.kt, lo, hi)}" stroke="#000" stroke-width="${f.solvedWithOpening ? 2 : 1}"/>`,
    );
    out.push(textAt(p[0] + r + 4, p[1] - r - 2, `${k + 1}: ${formatValue(f.kt)}`, { size: FONT_SIZE.note - 2, halo: true }));
  }
  // the crack's path from its hole to the opening's edge
  const cp = data.crackPath;
  if (cp && [...cp.start_mm, ...cp.end_mm, cp.ligament_mm].every(isFiniteNumber)) {
    const a = P(cp.start_mm[0], cp.start_mm[1]);
    const b = P(cp.end_mm[0], cp.end_mm[1]);
    out.push(polyline([a, b], { color: "#000", dash: DASH.solid, width: 3 }, "crack-path"));
    // The path is short beside the opening: its label stands inside the opening, tied to it by a leader.
    const mid: Point = [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2];
    const at: Point = [Math.min(mid[0] - 30, right - 10), mid[1] + 56];
    out.push(polyline([mid, [at[0] + 4, at[1] - 14]], { color: "#000", dash: DASH.solid, width: 1 }, "crack-path-leader"));
    out.push(
      textAt(at[0], at[1], `crack path from hole ${cp.fastener}: ${formatValue(u.length(cp.ligament_mm))} ${u.lengthUnit} to the edge`, {
        size: FONT_SIZE.note - 2,
        halo: true,
        anchor: "end",
      }),
    );
  }
  // governing point
  const g = data.governing;
  if (g && isFiniteNumber(g.hoop_mm) && isFiniteNumber(g.axial_mm)) {
    const p = P(g.hoop_mm, g.axial_mm);
    out.push(marker("diamond", p[0], p[1], 16, { color: "#000", dash: "", width: 2, filled: false }, "governing-point"));
    out.push(
      textAt(p[0] - 12, p[1] + 28, `governs: Kt ${formatValue(g.kt)}`, { size: FONT_SIZE.note, weight: "bold", halo: true, anchor: "end" }),
    );
  }
  // colour bar
  const bx = W - 120;
  const by0 = top + 20;
  const by1 = bottom - 60;
  const steps = 24;
  for (let k = 0; k < steps; k++) {
    const v = hi - ((hi - lo) * k) / steps;
    const yA = by0 + ((by1 - by0) * k) / steps;
    out.push(`<rect x="${bx}" y="${num(yA)}" width="22" height="${num((by1 - by0) / steps + 0.5)}" fill="${colourOf(v, lo, hi)}"/>`);
  }
  out.push(`<rect x="${bx}" y="${by0}" width="22" height="${num(by1 - by0)}" fill="none" stroke="#000"/>`);
  out.push(textAt(bx + 28, by0 + 5, formatValue(hi), { size: FONT_SIZE.note }));
  out.push(textAt(bx + 28, by1 + 5, formatValue(lo), { size: FONT_SIZE.note }));
  out.push(textAt(bx - 20, by0 - 22, "σ_{edge}/σ_{θ}", { size: FONT_SIZE.note, rich: true }));
  // curvature and scale notes
  const lines: string[] = [];
  if (data.curvature)
    lines.push(
      `curvature parameter β = ${formatValue(data.curvature.beta)} (${data.curvature.within ? `within β ≤ ${formatValue(data.curvature.limit)}` : `beyond ${formatValue(data.curvature.limit)}: refer`})`,
    );
  lines.push(`width shown ${formatValue(u.length(x1 - x0))} ${u.lengthUnit}; holes drawn at least 7 px across`);
  for (const [k, t] of lines.entries()) out.push(textAt(20, H - 40 + k * 20, t, { size: FONT_SIZE.note }));
  out.push("</svg>");
  return out.join("\n");
}

const EDGE: SeriesStyle = { color: "#000", dash: DASH.solid, width: 2.4 };
const PEAK: SeriesStyle = { color: "#D55E00", dash: DASH.dashDot, width: 1.8 };

/** Edge stress per unit nominal hoop stress against arc length round the opening. */
export function edgeStressPlot(data: Pick<OpeningPictureData, "edge" | "governing">, opts?: PlotOptions): string {
  const u = displayUnits(opts);
  const pts: Point[] = (data.edge ?? []).filter((e) => e.every(isFiniteNumber)).map((e) => [u.length(e[2]), e[3]]);
  const sMax = pts.length ? Math.max(...pts.map((p) => p[0])) : 1;
  const vMax = Math.max(...pts.map((p) => p[1]), 1);
  const vMin = Math.min(...pts.map((p) => p[1]), 0);
  const heading = opts?.title ?? "Edge stress along the opening";
  const peak = Math.max(...pts.map((p) => p[1]));
  const legend: LegendEntry[] = [
    { label: "edge stress σ_{edge}/σ_{θ}", style: EDGE },
    { label: `largest at the opening's edge ${formatValue(peak)}`, style: PEAK },
  ];
  const frame = makeFrame({
    name: "edge-stress",
    width: opts?.width,
    height: opts?.height,
    heading: heading || null,
    label: `${heading || "Edge stress"}: arc length round the opening in ${u.lengthUnit} against the edge stress per unit nominal hoop stress; largest ${formatValue(peak)}`,
    x: { kind: "linear", domain: [0, sMax || 1], title: `Arc length round the opening s (${u.lengthUnit})` },
    y: { kind: "linear", domain: [Math.floor(vMin), Math.ceil(vMax * 1.05)], title: "Edge stress σ_{edge}/σ_{θ}" },
    legend,
    footnotes: ["at σx/σθ of maximum pressure; s runs clockwise from the top side"],
  });
  const content: string[] = [];
  if (isFiniteNumber(peak)) {
    const y = frame.y(peak);
    content.push(
      polyline(
        [
          [frame.area.left, y],
          [frame.area.right, y],
        ],
        PEAK,
        "peak",
      ),
    );
    content.push(horizontalLineLabel(frame, y, `${formatValue(peak)}`, "right"));
  }
  for (const piece of frame.trace(pts)) content.push(polyline(piece, EDGE, "edge-stress"));
  return frame.render(content);
}
