/**
 * The fleet view: the life distribution of one item (lognormal, as density per decade of
 * life) and that of the first of the fleet to fail, with the tested lives, the design life,
 * the 5th-percentile life and the median life of the fleet's first failure marked. It shows
 * why one tested article says little about the weakest of many in service.
 */
import { formatValue, isFiniteNumber } from "./format.ts";
import { type LegendEntry, makeFrame, notes, verticalLineLabel } from "./frame.ts";
import { DASH, marker, type Point, polyline, type SeriesStyle } from "./marks.ts";
import { decadeDomain } from "./ticks.ts";
import type { PlotOptions } from "./units.ts";

export interface FleetPlotData {
  /** Densities per decade of life (per unit of log10 N): one item, and the first failure of the fleet. */
  density: { life_cycles: number; one: number; first: number }[];
  testLives_cycles: number[];
  designLife_cycles: number;
  percentile5_cycles: number;
  firstFailure_cycles: number;
  size: number;
}

const ONE: SeriesStyle = { color: "#000", dash: DASH.solid, width: 2.4 };
const FIRST: SeriesStyle = { color: "#D55E00", dash: DASH.long, width: 2.4 };
const TEST: SeriesStyle = { color: "#0072B2", dash: "", width: 1.5, marker: "diamond", filled: true };
const DESIGN: SeriesStyle = { color: "#000", dash: DASH.dashDot, width: 1.8 };
const P5: SeriesStyle = { color: "#007A5A", dash: DASH.dot, width: 2.2 };
const FIRST_MARK: SeriesStyle = { color: "#D55E00", dash: DASH.short, width: 1.6 };

export function fleetPlot(data: FleetPlotData, opts?: PlotOptions): string {
  const rows = (data.density ?? []).filter(
    (r) => r && isFiniteNumber(r.life_cycles) && r.life_cycles > 0 && isFiniteNumber(r.one) && isFiniteNumber(r.first),
  );
  const tests = (data.testLives_cycles ?? []).filter((x) => isFiniteNumber(x) && x > 0);
  const positive = (v: unknown) => (isFiniteNumber(v) && v > 0 ? v : NaN);
  const design = positive(data.designLife_cycles);
  const p5 = positive(data.percentile5_cycles);
  const first = positive(data.firstFailure_cycles);
  const lives = [...rows.map((r) => r.life_cycles), ...tests, design, p5, first].filter(isFiniteNumber);
  const xDomain = decadeDomain(lives, [1e3, 1e7]);
  const yMax = Math.max(0, ...rows.map((r) => Math.max(r.one, r.first)));
  const n = isFiniteNumber(data.size) ? data.size : NaN;

  const legend: LegendEntry[] = [
    { label: "life of one item", style: ONE },
    { label: `first failure among ${formatValue(n)} items`, style: FIRST },
  ];
  if (tests.length) legend.push({ label: `test life${tests.length > 1 ? "s" : ""}`, style: TEST, kind: "marker" });
  if (isFiniteNumber(design)) legend.push({ label: `design life ${formatValue(design)}`, style: DESIGN });
  if (isFiniteNumber(p5)) legend.push({ label: `5th percentile ${formatValue(p5)}`, style: P5 });
  if (isFiniteNumber(first)) legend.push({ label: `expected first failure ${formatValue(first)}`, style: FIRST_MARK });

  const heading = opts?.title ?? "Fleet view";
  const frame = makeFrame({
    name: "fleet",
    width: opts?.width,
    height: opts?.height,
    heading: heading || null,
    label: `${heading || "Fleet view"}: life distribution of one item and of the first of ${formatValue(n)} to fail; design life ${formatValue(design)}, 5th percentile ${formatValue(p5)}, expected first failure ${formatValue(first)} cycles`,
    x: { kind: "log", domain: xDomain, title: "Life N (cycles)" },
    y: { kind: "linear", domain: [0, yMax > 0 ? yMax * 1.12 : 1], title: "Density per decade of life" },
    legend,
  });
  const content: string[] = [];
  const vertical = (x: number, style: SeriesStyle, cls: string, label: string, side: "left" | "right") => {
    const px = frame.x(x);
    if (!isFiniteNumber(px) || px < frame.area.left || px > frame.area.right) return;
    content.push(
      polyline(
        [
          [px, frame.area.top],
          [px, frame.area.bottom],
        ],
        style,
        cls,
        ` data-value="${x}"`,
      ),
    );
    content.push(verticalLineLabel(frame, px, label, side));
  };
  vertical(design, DESIGN, "design-life", "design life", "left");
  vertical(p5, P5, "percentile5", "5th percentile", "right");
  vertical(first, FIRST_MARK, "first-failure", "first failure", "left");
  const one: Point[] = rows.map((r) => [r.life_cycles, r.one]);
  const fst: Point[] = rows.map((r) => [r.life_cycles, r.first]);
  for (const piece of frame.trace(fst)) content.push(polyline(piece, FIRST, "first-density"));
  for (const piece of frame.trace(one)) content.push(polyline(piece, ONE, "one-density"));
  for (const t of tests) {
    const p = frame.at(t, 0);
    if (p) content.push(marker("diamond", p[0], p[1] - 8, 13, TEST, "test-life"));
  }
  if (tests.length === 1)
    content.push(
      notes(frame, ["one test article: its life is one draw from the", "distribution, not the weakest of the fleet"], "top-right"),
    );
  if (rows.length < 2) content.push(notes(frame, ["no distribution to plot"], "top-left"));
  return frame.render(content);
}
