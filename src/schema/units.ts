/**
 * @module schema/units
 * Display units, the one home of units and their SI factors for the format, the form, the plots
 * and the sheet. The check document is always SI (mm, MPa, m); the form shows and reads values
 * in the units the user picked, and these functions convert at that edge.
 * Factors: 1 in = 25.4 mm and 1 ft = 0.3048 m (exact, international yard and pound, 1959);
 * 1 psi = 6894.757293168 Pa (NIST SP 811, B.8); 1 bar = 0.1 MPa (exact).
 */

export const LENGTH_UNITS = ["mm", "in"] as const;
export const STRESS_UNITS = ["MPa", "ksi", "psi", "kPa", "bar"] as const;
export const PRESSURE_UNITS = ["MPa", "kPa", "bar", "psi", "ksi"] as const;
export const ALTITUDE_UNITS = ["m", "ft"] as const;

export type LengthUnit = (typeof LENGTH_UNITS)[number];
export type StressUnit = (typeof STRESS_UNITS)[number];
export type AltitudeUnit = (typeof ALTITUDE_UNITS)[number];

/** The units the user reads and types in; the same shape as the check document's `display`. */
export interface Units {
  length: LengthUnit;
  stress: StressUnit;
  pressure: StressUnit;
  altitude: AltitudeUnit;
}

export const SI_UNITS: Units = { length: "mm", stress: "MPa", pressure: "MPa", altitude: "m" };

const MM_PER: Record<LengthUnit, number> = { mm: 1, in: 25.4 };
const MPA_PER: Record<StressUnit, number> = { MPa: 1, kPa: 1e-3, bar: 0.1, psi: 6.894757293168e-3, ksi: 6.894757293168 };
const M_PER: Record<AltitudeUnit, number> = { m: 1, ft: 0.3048 };
/**
 * 1 ksi·√in in MPa·√m: 1 ksi = 6.894757293168 MPa and 1 in = 0.0254 m, so
 * 1 ksi·√in = 6.894757293168 MPa × √(0.0254 m) = 6.894757 × 0.1593738 = 1.098843 MPa·√m.
 */
export const MPA_SQRT_M_PER_KSI_SQRT_IN = 6.894757293168 * Math.sqrt(0.0254);
/** Metres in an inch (exact). */
const M_PER_IN = 0.0254;

/**
 * What a form number measures. "toughness" follows the stress system: ksi·√in beside psi or ksi,
 * MPa·√m otherwise. "plain" numbers (counts, ratios, exponents) are never converted. The Paris
 * coefficient is a "plain" number whose factor depends on its exponent: parisCFromSI and parisCToSI.
 */
export const QUANTITIES = ["length", "stress", "pressure", "altitude", "toughness", "plain"] as const;
export type Quantity = (typeof QUANTITIES)[number];

function usToughness(u: Units): boolean {
  return u.stress === "psi" || u.stress === "ksi";
}

/** How many SI units (mm, MPa, m, MPa·√m) one display unit holds. */
function siPerUnit(q: Quantity, u: Units): number {
  switch (q) {
    case "length":
      return MM_PER[u.length];
    case "stress":
      return MPA_PER[u.stress];
    case "pressure":
      return MPA_PER[u.pressure];
    case "altitude":
      return M_PER[u.altitude];
    case "toughness":
      return usToughness(u) ? MPA_SQRT_M_PER_KSI_SQRT_IN : 1;
    case "plain":
      return 1;
  }
}

/** A value typed in display units → SI. */
export function toSI(value: number, q: Quantity, u: Units): number {
  return value * siPerUnit(q, u);
}

/** An SI value → display units. */
export function fromSI(value: number, q: Quantity, u: Units): number {
  return value / siPerUnit(q, u);
}

/** The label text of a quantity's unit in the chosen units ("" for plain numbers). */
export function unitLabel(q: Quantity, u: Units): string {
  switch (q) {
    case "length":
      return u.length;
    case "stress":
      return u.stress;
    case "pressure":
      return u.pressure;
    case "altitude":
      return u.altitude;
    case "toughness":
      return usToughness(u) ? "ksi·√in" : "MPa·√m";
    case "plain":
      return "";
  }
}

/**
 * The Paris coefficient C of da/dN = C·ΔK^m in the reader's units. The check format holds it with
 * da/dN in m/cycle and ΔK in MPa·√m. Beside psi or ksi (where toughness reads ksi·√in) it reads
 * with da/dN in in/cycle and ΔK in ksi·√in, the pair US handbooks tabulate. Its factor depends on
 * the exponent: with ΔK_SI = k·ΔK_US, k = 1.098843 MPa·√m per ksi·√in, and da/dN_US = da/dN_SI / 0.0254,
 *   C_US = C_SI · k^m / 0.0254.
 */
export function parisCFromSI(C: number, m: number, u: Units): number {
  return usToughness(u) ? (C * MPA_SQRT_M_PER_KSI_SQRT_IN ** m) / M_PER_IN : C;
}

/** A Paris coefficient typed in the reader's units → the format's (m/cycle, MPa·√m); see parisCFromSI. */
export function parisCToSI(C: number, m: number, u: Units): number {
  return usToughness(u) ? (C * M_PER_IN) / MPA_SQRT_M_PER_KSI_SQRT_IN ** m : C;
}

/** The units the Paris coefficient is read in: "m/cycle per (MPa·√m)^m" or "in/cycle per (ksi·√in)^m". */
export function parisCUnit(u: Units): string {
  return usToughness(u) ? "in/cycle per (ksi·√in)^m" : "m/cycle per (MPa·√m)^m";
}

function pick<T extends string>(allowed: readonly T[], v: unknown, fallback: T): T {
  return typeof v === "string" && (allowed as readonly string[]).includes(v) ? (v as T) : fallback;
}

/** Units from loose input (a form, a query string, a document's `display`); unknown values fall back to SI. */
export function unitsFrom(src: { length?: unknown; stress?: unknown; pressure?: unknown; altitude?: unknown } | undefined): Units {
  return {
    length: pick(LENGTH_UNITS, src?.length, SI_UNITS.length),
    stress: pick(STRESS_UNITS, src?.stress, SI_UNITS.stress),
    pressure: pick(STRESS_UNITS, src?.pressure, SI_UNITS.pressure),
    altitude: pick(ALTITUDE_UNITS, src?.altitude, SI_UNITS.altitude),
  };
}

/** Compact text form of a choice ("mm MPa kPa m"), carried in a hidden field so the server knows what units the posted numbers are in. */
export function unitsKey(u: Units): string {
  return `${u.length} ${u.stress} ${u.pressure} ${u.altitude}`;
}

export function parseUnitsKey(key: string | undefined): Units | undefined {
  if (!key) return undefined;
  const [length, stress, pressure, altitude] = key.split(" ");
  const u = unitsFrom({ length, stress, pressure, altitude });
  return unitsKey(u) === key ? u : undefined;
}

export function sameUnits(a: Units, b: Units): boolean {
  return unitsKey(a) === unitsKey(b);
}

/**
 * A number written for a form field: 6 significant figures, so a converted value reads cleanly
 * (0.0393701 in, not 0.03937007874015748) while a round trip keeps better than 1 part in 10⁵.
 */
export function formNumber(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return "0";
  const ax = Math.abs(x);
  if (ax >= 1e7 || ax < 1e-4)
    return x
      .toExponential(5)
      .replace(/\.?0+e/, "e")
      .replace("e+", "e");
  return String(Number(x.toPrecision(6)));
}
