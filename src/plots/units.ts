/**
 * Display units of a plot. Data always arrives in SI (MPa, mm, cycles); a plot converts only
 * what it shows, so a US-customary reader sees ksi or inches on the axes while the engine's
 * numbers stay untouched. The units and their factors are the format's (src/schema/units.ts).
 */
import { fromSI, type LengthUnit, SI_UNITS, STRESS_UNITS, LENGTH_UNITS, type StressUnit, type Units } from "../schema/units.ts";

export type { LengthUnit, StressUnit } from "../schema/units.ts";

export interface PlotOptions {
  /** viewBox width; the SVG itself is 100 % wide and scales. Default 800 (≈ 16 cm printed at 0.2 mm per unit). */
  width?: number;
  /** viewBox height, legend included. Default 520. */
  height?: number;
  /** Heading drawn above the plot. Undefined: the plot's own heading; "": none (the sheet captions it). */
  title?: string;
  units?: { stress?: StressUnit; length?: LengthUnit };
}

export interface DisplayUnits {
  stressUnit: StressUnit;
  lengthUnit: LengthUnit;
  /** MPa → display stress unit. */
  stress(mpa: number): number;
  /** mm → display length unit. */
  length(mm: number): number;
}

export function displayUnits(opts: PlotOptions | undefined): DisplayUnits {
  const s = opts?.units?.stress;
  const l = opts?.units?.length;
  const stressUnit: StressUnit = s && (STRESS_UNITS as readonly string[]).includes(s) ? s : "MPa";
  const lengthUnit: LengthUnit = l && (LENGTH_UNITS as readonly string[]).includes(l) ? l : "mm";
  const u: Units = { ...SI_UNITS, stress: stressUnit, length: lengthUnit };
  return { stressUnit, lengthUnit, stress: (v) => fromSI(v, "stress", u), length: (v) => fromSI(v, "length", u) };
}
