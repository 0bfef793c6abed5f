import { historyPlot } from "../../src/plots/history.ts";
import { medianMs } from "./engine.ts";

/**
 * The page's preview of a logged history: 10⁷ points drawn as min/max per pixel column, against
 * one plain summing pass over the same points (the least any drawing of every point must cost).
 */
export function previewBench(points = 10_000_000) {
  const values = new Float64Array(points);
  for (let i = 0; i < points; i++) values[i] = 0.055 * Math.abs(Math.sin(i / 500)) + 0.0008 * Math.sin(i / 7);
  let sink = 0;
  const sum_ms = medianMs(
    () => {
      let s = 0;
      for (let i = 0; i < values.length; i++) s += values[i];
      sink += s;
    },
    7,
    2,
  );
  const draw_ms = medianMs(
    () => {
      sink += historyPlot({ values, unit: "MPa" }).length;
    },
    7,
    2,
  );
  return { points, draw_ms, sum_ms, ratio: draw_ms / sum_ms, sink };
}
