/**
 * S-N curve on log–log axes: the Basquin line σar = σ'f·(2N)^b with the endurance limit as
 * a horizontal cut-off, the design life (and design life × scatter factor) as verticals,
 * and the operating point. The check passes when the point lies right of the line the
 * verdict uses; coupons and a scatter band show how far the data support the curve.
 */
import { formatValue, isFiniteNumber } from "./format.ts";
import { type Frame, type LegendEntry, makeFrame, notes, OPERATING_LEGEND, operatingPoint } from "./frame.ts";
import { arrow, DASH, marker, type Point, polyline, type SeriesStyle } from "./marks.ts";
import { escapeXml, FONT_SIZE, num, textAt } from "./svgText.ts";
import { decadeDomain, logNiceDomain } from "./ticks.ts";
import { displayUnits, type PlotOptions } from "./units.ts";

export interface SnData {
  /** σ'f in σar = σ'f·(2N)^b. */
  fatigueStrengthCoefficient_MPa: number;
  /** b, negative. */
  fatigueStrengthExponent: number;
  /** At or below it the life is unlimited; null or absent for none. */
  enduranceLimit_MPa?: number | null;
  operating: { equivalentAmplitude_MPa: number; life_cycles: number | null };
  designLife_cycles: number;
  /** Draws a second vertical at design life × scatter factor: the life the curve must reach. */
  scatterFactor?: number;
  /** Life ÷ scatter factor (the result's allowableLife_cycles), marked at the operating amplitude. */
  allowableLife_cycles?: number | null;
  /** Lives the curve's data cover; outside it the curve is drawn as extrapolated. */
  validRange_cycles?: [number, number];
  coupons?: { amplitude_MPa: number; life_cycles: number; runout?: boolean }[];
  /** A scatter or confidence band: at each amplitude, its lower and upper lives. */
  band?: { amplitude_MPa: number; lower_cycles: number; upper_cycles: number }[];
}

const CURVE: SeriesStyle = { color: "#000", dash: DASH.solid, width: 2.6 };
const EXTRAPOLATED: SeriesStyle = { color: "#000", dash: DASH.short, width: 1.6 };
const DESIGN: SeriesStyle = { color: "#0072B2", dash: DASH.long, width: 1.8 };
const REQUIRED: SeriesStyle = { color: "#D55E00", dash: DASH.dashDot, width: 2 };
const COUPON: SeriesStyle = { color: "#0072B2", dash: "", width: 1, marker: "square", filled: true };
const RUNOUT: SeriesStyle = { color: "#0072B2", dash: "", width: 1, marker: "square", filled: false };
const ALLOWABLE: SeriesStyle = { color: "#000", dash: "", width: 1, marker: "diamond", filled: false };
const BAND_EDGE: SeriesStyle = { color: "#777", dash: DASH.dot, width: 1.2 };
const BAND_FILL = "#e2e2e2";

export function snCurve(data: SnData, opts?: PlotOptions): string {
  const u = displayUnits(opts);
  const su = u.stressUnit;
  const s = (v: unknown) => (isFiniteNumber(v) ? u.stress(v) : NaN);
  const sf = s(data.fatigueStrengthCoefficient_MPa);
  const b = data.fatigueStrengthExponent;
  const se = s(data.enduranceLimit_MPa);
  const curveOk = isFiniteNumber(sf) && sf > 0 && isFiniteNumber(b) && b < 0;
  const hasLimit = curveOk && isFiniteNumber(se) && se > 0 && se < sf;
  const basquin = (n: number) => sf * (2 * n) ** b;
  const amplitudeAt = (n: number) => (hasLimit ? Math.max(se, basquin(n)) : basquin(n));
  const knee = hasLimit ? 0.5 * (se / sf) ** (1 / b) : NaN;

  const sar = s(data.operating?.equivalentAmplitude_MPa);
  const life = data.operating?.life_cycles;
  const unlimited = !isFiniteNumber(life) || life <= 0;
  const design = data.designLife_cycles;
  const factor = isFiniteNumber(data.scatterFactor) && data.scatterFactor > 0 ? data.scatterFactor : NaN;
  const required = isFiniteNumber(design) && design > 0 && isFiniteNumber(factor) && factor !== 1 ? design * factor : NaN;
  const allowable = data.allowableLife_cycles;
  const coupons = (data.coupons ?? []).filter(
    (c) => c && isFiniteNumber(c.amplitude_MPa) && isFiniteNumber(c.life_cycles) && c.life_cycles > 0 && c.amplitude_MPa > 0,
  );
  const band = (data.band ?? []).filter(
    (r) => r && [r.amplitude_MPa, r.lower_cycles, r.upper_cycles].every((v) => isFiniteNumber(v) && v > 0),
  );
  const valid = data.validRange_cycles;
  const validRange = valid && isFiniteNumber(valid[0]) && isFiniteNumber(valid[1]) && valid[0] > 0 && valid[1] > valid[0] ? valid : null;

  const lives = [
    design,
    isFiniteNumber(design) ? design / 30 : NaN,
    isFiniteNumber(design) ? design * 30 : NaN,
    required,
    unlimited ? NaN : life,
    allowable ?? NaN,
    ...(validRange ?? []),
    ...coupons.map((c) => c.life_cycles),
    ...band.flatMap((r) => [r.lower_cycles, r.upper_cycles]),
    knee < 1e10 ? knee * 3 : NaN,
  ];
  const [nMin, nMax] = decadeDomain(lives, [1e3, 1e7]);
  const stresses = [
    curveOk ? amplitudeAt(nMin) : NaN,
    curveOk ? amplitudeAt(nMax) : NaN,
    sar,
    hasLimit ? se : NaN,
    ...coupons.map((c) => s(c.amplitude_MPa)),
    ...band.map((r) => s(r.amplitude_MPa)),
  ].filter((v) => isFiniteNumber(v) && v > 0);
  const yDomain = logNiceDomain(
    stresses.length ? [Math.min(...stresses) * 0.92, Math.max(...stresses) * 1.08] : [],
    su === "MPa" ? [10, 1000] : [u.stress(10), u.stress(1000)],
  );

  const legend: LegendEntry[] = [];
  if (curveOk) legend.push({ label: "Basquin σ_{ar} = σ'_{f}·(2N)ᵇ", style: CURVE });
  if (curveOk && validRange) legend.push({ label: "extrapolated beyond the data", style: EXTRAPOLATED });
  if (band.length) legend.push({ label: "scatter band", style: BAND_EDGE, kind: "area", areaFill: BAND_FILL });
  if (isFiniteNumber(design) && design > 0) legend.push({ label: `design life ${formatValue(design)}`, style: DESIGN });
  if (isFiniteNumber(required))
    legend.push({ label: `design life × scatter ${formatValue(factor)} = ${formatValue(required)}`, style: REQUIRED });
  if (coupons.some((c) => !c.runout)) legend.push({ label: "coupon failure", style: COUPON, kind: "marker" });
  if (coupons.some((c) => c.runout)) legend.push({ label: "coupon runout (no failure)", style: RUNOUT, kind: "marker" });
  if (isFiniteNumber(allowable) && allowable > 0)
    legend.push({ label: "allowable life = life ÷ scatter factor", style: ALLOWABLE, kind: "marker" });
  legend.push(OPERATING_LEGEND);

  const heading = opts?.title ?? "S-N curve";
  const frame = makeFrame({
    name: "sn",
    width: opts?.width,
    height: opts?.height,
    heading: heading || null,
    label: `${heading || "S-N curve"}: life in cycles against fully reversed stress amplitude in ${su}, both logarithmic; operating point at ${formatValue(sar)} ${su}, life ${unlimited ? "unlimited" : formatValue(life)} cycles; design life ${formatValue(design)} cycles`,
    x: { kind: "log", domain: [nMin, nMax], title: "Life N (cycles)", logLabels: "power" },
    y: { kind: "log", domain: yDomain, title: `Equivalent amplitude σ_{ar} (${su})` },
    legend,
  });

  const content: string[] = [];
  const remarks: string[] = [];
  if (band.length)
    content.push(
      bandShape(
        frame,
        band.map((r) => ({ amplitude: s(r.amplitude_MPa), lower: r.lower_cycles, upper: r.upper_cycles })),
      ),
    );
  if (curveOk) {
    content.push(curve(frame, amplitudeAt, nMin, nMax, knee, validRange));
    remarks.push(
      `σ'f = ${formatValue(sf)} ${su}, b = ${formatValue(b)}${validRange ? `; data ${formatValue(validRange[0])} to ${formatValue(validRange[1])} cycles` : ""}`,
    );
  } else remarks.push("curve not drawn: σ'f or b missing");
  if (hasLimit) {
    const p = frame.at(nMax, se);
    if (p)
      content.push(
        textAt(p[0] - 8, p[1] - 9, `S_{e} = ${formatValue(se)} ${su}`, { size: FONT_SIZE.note, anchor: "end", halo: true, rich: true }),
      );
  }
  if (isFiniteNumber(design) && design > 0) content.push(vertical(frame, design, DESIGN, "design"));
  if (isFiniteNumber(required)) content.push(vertical(frame, required, REQUIRED, "required"));
  for (const c of coupons) content.push(coupon(frame, c.life_cycles, s(c.amplitude_MPa), c.runout === true));
  content.push(operating(frame, sar, unlimited ? null : life, isFiniteNumber(allowable) && allowable > 0 ? allowable : null, su));
  if (!isFiniteNumber(sar)) remarks.push("operating point not shown: σar not given");
  content.push(notes(frame, remarks, "bottom-left"));
  return frame.render(content);
}

function curve(
  frame: Frame,
  amplitudeAt: (n: number) => number,
  nMin: number,
  nMax: number,
  knee: number,
  valid: [number, number] | null,
): string {
  const lives: number[] = [];
  const steps = 160;
  for (let i = 0; i <= steps; i++) lives.push(nMin * (nMax / nMin) ** (i / steps));
  // The knee and the ends of the data range are exact corners, not sampled approximations.
  for (const n of [knee, ...(valid ?? [])]) if (isFiniteNumber(n) && n > nMin && n < nMax) lives.push(n);
  lives.sort((a, c) => a - c);
  const inRange = (n: number) => !valid || (n >= valid[0] * (1 - 1e-9) && n <= valid[1] * (1 + 1e-9));
  const out: string[] = [];
  let run: Point[] = [];
  let runValid = inRange(lives[0]);
  const flush = () => {
    for (const piece of frame.trace(run))
      out.push(polyline(piece, runValid ? CURVE : EXTRAPOLATED, runValid ? "sn-curve" : "sn-curve-extrapolated"));
  };
  for (const n of lives) {
    const point: Point = [n, amplitudeAt(n)];
    const v = inRange(n);
    if (v !== runValid && run.length) {
      // The solid and dashed parts share the range's end point (an exact sample), so they meet there.
      const boundary = v ? point : run[run.length - 1];
      if (v) run.push(point);
      flush();
      run = [boundary];
      runValid = v;
      if (v) continue;
    }
    run.push(point);
  }
  flush();
  return out.join("");
}

function vertical(frame: Frame, n: number, style: SeriesStyle, name: string): string {
  const x = frame.x(n);
  if (!isFiniteNumber(x) || x < frame.area.left || x > frame.area.right) return "";
  return polyline(
    [
      [x, frame.area.top],
      [x, frame.area.bottom],
    ],
    style,
    `life-line life-${name}`,
    ` data-value="${escapeXml(String(n))}"`,
  );
}

function coupon(frame: Frame, n: number, amplitude: number, runout: boolean): string {
  const p = frame.at(n, amplitude);
  if (!p) return "";
  const style = runout ? RUNOUT : COUPON;
  const mark = marker("square", p[0], p[1], 10, style, runout ? "coupon runout" : "coupon");
  return runout ? arrow([p[0] + 6, p[1]], [p[0] + 26, p[1]], style.color, 1.6, 7) + mark : mark;
}

function operating(frame: Frame, sar: number, life: number | null, allowable: number | null, su: string): string {
  if (!isFiniteNumber(sar) || sar <= 0) return "";
  if (life === null) {
    // An unlimited life has no abscissa: the point sits at the right edge with an arrow past it.
    const y = frame.y(sar);
    if (!isFiniteNumber(y) || y < frame.area.top || y > frame.area.bottom) return "";
    const x = frame.area.right - 60;
    return [
      arrow([x + 10, y], [frame.area.right - 4, y], "#000", 2),
      operatingPoint([x, y]).replace('class="operating-point"', 'class="operating-point" data-unlimited="true"'),
      textAt(x - 14, y + 5, `σ_{ar} ${formatValue(sar)} ${su}: unlimited life`, {
        size: FONT_SIZE.note,
        anchor: "end",
        halo: true,
        rich: true,
        weight: "bold",
      }),
    ].join("");
  }
  const p = frame.at(life, sar);
  if (!p) return "";
  const out: string[] = [];
  const a = allowable !== null ? frame.at(allowable, sar) : null;
  if (a) {
    out.push(arrow([p[0] - 10, p[1]], [a[0] + 8, a[1]], "#000", 1.2, 7));
    out.push(marker("diamond", a[0], a[1], 11, ALLOWABLE, "allowable"));
  }
  out.push(operatingPoint(p));
  // The curve falls to the right through the point: above-right of it, or below-left near the right edge, is clear.
  const nearRight = p[0] > frame.area.right - 260;
  out.push(
    textAt(p[0] + (nearRight ? -12 : 12), p[1] + (nearRight ? 28 : -16), `σ_{ar} ${formatValue(sar)} ${su}, N ${formatValue(life)}`, {
      size: FONT_SIZE.note,
      anchor: nearRight ? "end" : "start",
      halo: true,
      rich: true,
      weight: "bold",
    }),
  );
  return out.join("");
}

function bandShape(frame: Frame, rows: { amplitude: number; lower: number; upper: number }[]): string {
  const sorted = [...rows].sort((a, c) => a.amplitude - c.amplitude);
  const lower: Point[] = sorted.map((r) => [r.lower, r.amplitude]);
  const upper: Point[] = sorted.map((r) => [r.upper, r.amplitude]);
  const ring = [...lower, ...[...upper].reverse()].map(([n, a]) => frame.at(n, a)).filter((p): p is Point => p !== null);
  if (ring.length < 3) return "";
  const fill = `<path class="band" d="M${ring.map(([x, y]) => `${num(x)},${num(y)}`).join("L")}Z" fill="${BAND_FILL}" stroke="none"/>`;
  const edges = [lower, upper].flatMap((edge) => frame.trace(edge).map((p) => polyline(p, BAND_EDGE, "band-edge")));
  return fill + edges.join("");
}
