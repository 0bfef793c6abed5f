import type { GaugeList, MaterialFamily } from "../schema/check.ts";

/**
 * Thicknesses a solved wall is rounded up to, so that "put this thickness into the form" never lands
 * on the line. Lists are common practice, not a standard's complete range; a user list or step replaces them.
 *  - aircraft-sheet: the usual aluminium and titanium sheet gauges in inches (0.016 … 0.250 in),
 *    common practice in airframe skins.
 *  - vessel-plate: the usual plate thicknesses of steel plate mills (3 … 150 mm), common practice
 *    (EN 10029 gives tolerances for plate of any thickness; these are the ones commonly stocked).
 * Beyond the last entry the rounding continues in steps of the last interval.
 */
const SHEET_IN = [0.016, 0.02, 0.025, 0.032, 0.036, 0.04, 0.045, 0.05, 0.063, 0.071, 0.08, 0.09, 0.1, 0.125, 0.16, 0.19, 0.25];
export const GAUGES_MM: Record<GaugeList, readonly number[]> = {
  "aircraft-sheet": SHEET_IN.map((x) => x * 25.4),
  "vessel-plate": [3, 4, 5, 6, 8, 10, 12, 15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 120, 130, 140, 150],
};

export const GAUGE_WORDS: Record<GaugeList, string> = {
  "aircraft-sheet": "aircraft sheet gauges (0.016–0.250 in)",
  "vessel-plate": "vessel plate thicknesses (3–150 mm)",
};

export type Rounding = { kind: "list"; list: GaugeList } | { kind: "user-list"; gauges_mm: number[] } | { kind: "step"; step_mm: number };

/** The rounding asked for, or the default: by service where it is given, else by material family. */
export function roundingFor(
  solve: { gauges?: GaugeList; gauges_mm?: number[]; step_mm?: number },
  family: MaterialFamily,
  service?: string,
): Rounding {
  if (solve.gauges_mm) return { kind: "user-list", gauges_mm: [...solve.gauges_mm].sort((a, b) => a - b) };
  if (solve.step_mm !== undefined) return { kind: "step", step_mm: solve.step_mm };
  if (solve.gauges) return { kind: "list", list: solve.gauges };
  if (service === "aircraft-cabin") return { kind: "list", list: "aircraft-sheet" };
  if (service === "pressure-vessel") return { kind: "list", list: "vessel-plate" };
  return { kind: "list", list: family === "aluminium" || family === "titanium" ? "aircraft-sheet" : "vessel-plate" };
}

export function roundingWords(r: Rounding): string {
  if (r.kind === "list") return GAUGE_WORDS[r.list];
  if (r.kind === "user-list") return `the given gauges (${r.gauges_mm.length})`;
  return `multiples of ${r.step_mm} mm`;
}

/** The least listed thickness at or above t (mm), and at or above `floor_mm`. */
export function roundUp(t_mm: number, r: Rounding, floor_mm = 0): number {
  const t = Math.max(t_mm, floor_mm);
  // A hair of tolerance so a value already on a gauge, but a rounding error above it, stays on it.
  const tol = 1e-9 * Math.max(1, t);
  if (r.kind === "step") return Math.ceil(t / r.step_mm - 1e-9) * r.step_mm;
  const list = r.kind === "list" ? GAUGES_MM[r.list] : r.gauges_mm;
  for (const g of list) if (g >= t - tol) return g;
  const last = list[list.length - 1];
  const spacing = list.length > 1 ? last - list[list.length - 2] : last;
  return last + Math.ceil((t - last) / spacing - 1e-9) * spacing;
}
