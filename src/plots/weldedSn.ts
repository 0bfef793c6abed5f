/**
 * S-N curve of a welded class on log–log axes: stress range Δσ against cycles, slope 3 up to
 * 5·10⁶ cycles, then either flat at the constant-amplitude limit or, for a spectrum, slope 5 to
 * the cut-off at 10⁸ cycles. The operating point is the range entering the curve (after any
 * correction factors) at its life; the design life is a vertical.
 */
import { formatValue, isFiniteNumber } from "./format.ts";
import { makeFrame, notes, OPERATING_LEGEND, operatingPoint, type LegendEntry } from "./frame.ts";
import { arrow, DASH, polyline, type Point, type SeriesStyle } from "./marks.ts";
import { FONT_SIZE, textAt } from "./svgText.ts";
import { decadeDomain, logNiceDomain } from "./ticks.ts";
import { displayUnits, type PlotOptions } from "./units.ts";

export interface WeldedSnData {
  /** Δσ at 2·10⁶ cycles, MPa. */
  class_MPa: number;
  /** Which curve family, for the legend: e.g. "EN 13445-3 class 63". */
  curveName: string;
  variableAmplitude: boolean;
  operating: { range_MPa: number; life_cycles: number | null };
  designLife_cycles: number;
  /** The unit the design life counts ("cycles" or "passes"); the point is in cycles of its own range. */
  designLifeUnit?: string;
}

const CURVE: SeriesStyle = { color: "#000", dash: DASH.solid, width: 2.6 };
const DESIGN: SeriesStyle = { color: "#0072B2", dash: DASH.long, width: 1.8 };

export function weldedSnCurve(data: WeldedSnData, opts?: PlotOptions): string {
  const u = displayUnits(opts);
  const su = u.stressUnit;
  const c = data.class_MPa;
  const nD = 5e6;
  const nL = 1e8;
  const dD = c * Math.cbrt(2e6 / nD);
  const dL = dD * (nD / nL) ** 0.2;
  const rangeAt = (n: number) => (n <= nD ? c * (2e6 / n) ** (1 / 3) : data.variableAmplitude ? (n <= nL ? dD * (nD / n) ** 0.2 : dL) : dD);
  const life = data.operating.life_cycles;
  const unlimited = !isFiniteNumber(life) || life <= 0;
  const range = data.operating.range_MPa;
  // A design life counted in passes of a spectrum has no place on an axis of the largest cycle's own cycles.
  const design = (data.designLifeUnit ?? "cycles") === "cycles" ? data.designLife_cycles : Number.NaN;
  const [nMin, nMax] = decadeDomain([1e4, 1e9, unlimited ? NaN : life, design], [1e4, 1e9]);
  const ys = [rangeAt(nMin), rangeAt(nMax), range].filter((v) => isFiniteNumber(v) && v > 0).map((v) => u.stress(v));
  const yDomain = logNiceDomain([Math.min(...ys) * 0.9, Math.max(...ys) * 1.1], [u.stress(10), u.stress(1000)]);
  const legend: LegendEntry[] = [{ label: `${data.curveName}: Δσ_{R} = ${formatValue(u.stress(c))} ${su} at 2×10⁶`, style: CURVE }];
  if (isFiniteNumber(design) && design > 0)
    legend.push({ label: `design life ${formatValue(design)} ${data.designLifeUnit ?? "cycles"}`, style: DESIGN });
  legend.push(OPERATING_LEGEND);
  const heading = opts?.title ?? "Welded S-N curve";
  const frame = makeFrame({
    name: "welded-sn",
    width: opts?.width,
    height: opts?.height,
    heading: heading || null,
    label: `${heading || "Welded S-N curve"}: ${data.curveName}, stress range against cycles, both logarithmic; operating range ${formatValue(u.stress(range))} ${su}, life ${unlimited ? "unlimited" : formatValue(life)} cycles`,
    x: { kind: "log", domain: [nMin, nMax], title: "Cycles N", logLabels: "power" },
    y: { kind: "log", domain: yDomain, title: `Stress range Δσ (${su})` },
    legend,
  });
  const content: string[] = [];
  const pts: Point[] = [];
  const corners = [nD, nL].filter((n) => n > nMin && n < nMax);
  const lives = Array.from({ length: 121 }, (_, i) => nMin * (nMax / nMin) ** (i / 120))
    .concat(corners)
    .sort((a, b) => a - b);
  for (const n of lives) pts.push([n, u.stress(rangeAt(n))]);
  for (const piece of frame.trace(pts)) content.push(polyline(piece, CURVE, "welded-curve"));
  if (isFiniteNumber(design) && design > 0) {
    const x = frame.x(design);
    if (isFiniteNumber(x) && x >= frame.area.left && x <= frame.area.right)
      content.push(
        polyline(
          [
            [x, frame.area.top],
            [x, frame.area.bottom],
          ],
          DESIGN,
          "design",
        ),
      );
  }
  const y = frame.y(u.stress(range));
  if (isFiniteNumber(range) && range > 0 && isFiniteNumber(y)) {
    if (unlimited) {
      const x = frame.area.right - 60;
      content.push(arrow([x + 10, y], [frame.area.right - 4, y], "#000", 2), operatingPoint([x, y]));
      content.push(
        textAt(x - 14, y + 5, `Δσ ${formatValue(u.stress(range))} ${su}: below the limit`, {
          size: FONT_SIZE.note,
          anchor: "end",
          halo: true,
          weight: "bold",
        }),
      );
    } else {
      const p = frame.at(life as number, u.stress(range));
      if (p) {
        content.push(operatingPoint(p));
        content.push(
          textAt(p[0] + 12, p[1] - 10, `Δσ ${formatValue(u.stress(range))} ${su}, N ${formatValue(life)}`, {
            size: FONT_SIZE.note,
            halo: true,
            weight: "bold",
          }),
        );
      }
    }
  }
  content.push(
    notes(
      frame,
      [data.variableAmplitude ? "slope 3 to 5×10⁶, slope 5 to the cut-off at 10⁸" : "slope 3 to 5×10⁶, then the constant-amplitude limit"],
      "bottom-left",
    ),
  );
  return frame.render(content);
}
