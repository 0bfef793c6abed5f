/**
 * Display units. Data always arrives in SI (MPa, mm, cycles); a plot converts only
 * what it shows, so a US-customary reader sees ksi or inches on the axes while the
 * engine's numbers stay untouched.
 */
export type StressUnit = "MPa" | "ksi" | "psi";
export type LengthUnit = "mm" | "in";

export interface PlotOptions {
  /** viewBox width; the SVG itself is 100 % wide and scales. Default 800 (≈ 16 cm printed at 0.2 mm per unit). */
  width?: number;
  /** viewBox height, legend included. Default 520. */
  height?: number;
  /** Heading drawn above the plot. Undefined: the plot's own heading; "": none (the sheet captions it). */
  title?: string;
  units?: { stress?: StressUnit; length?: LengthUnit };
}

const PER_MPA: Record<StressUnit, number> = { MPa: 1, ksi: 0.1450377, psi: 145.0377 };
const PER_MM: Record<LengthUnit, number> = { mm: 1, in: 1 / 25.4 };

export interface DisplayUnits {
  stressUnit: StressUnit;
  lengthUnit: LengthUnit;
  /** MPa → display stress unit. */
  stress(mpa: number): number;
  /** mm → display length unit. */
  length(mm: number): number;
}

export function displayUnits(opts: PlotOptions | undefined): DisplayUnits {
  const stressUnit = opts?.units?.stress && opts.units.stress in PER_MPA ? opts.units.stress : "MPa";
  const lengthUnit = opts?.units?.length && opts.units.length in PER_MM ? opts.units.length : "mm";
  const ks = PER_MPA[stressUnit];
  const kl = PER_MM[lengthUnit];
  return { stressUnit, lengthUnit, stress: (v) => v * ks, length: (v) => v * kl };
}
