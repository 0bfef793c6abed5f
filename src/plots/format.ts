/**
 * Number formatting for tick labels and notes. Never yields "NaN" or "Infinity":
 * a value that is not finite prints as a dash, because a plot on a signed sheet
 * must not show a programming artefact.
 */

const SUPERSCRIPT_DIGITS = "⁰¹²³⁴⁵⁶⁷⁸⁹";
const MINUS = "−";
// Thin space groups thousands: reads as 60 000 in print and cannot be mistaken for a decimal mark.
const GROUP = "\u2009";

export function isFiniteNumber(v: unknown): v is number {
  return typeof v === "number" && Number.isFinite(v);
}

function superscript(n: number): string {
  return String(n)
    .replace("-", "⁻")
    .replace(/\d/g, (d) => SUPERSCRIPT_DIGITS[Number(d)]);
}

/** "10⁴" or "2×10⁴". */
export function powerOfTen(v: number, digits = 3): string {
  let k = Math.floor(Math.log10(Math.abs(v)) + 1e-9);
  let m = Number((v / 10 ** k).toPrecision(digits));
  // Rounding can carry the mantissa to 10 (999 999 → 10.0×10⁵): move it into the exponent.
  if (Math.abs(m) >= 10) {
    m /= 10;
    k += 1;
  }
  const sign = v < 0 ? MINUS : "";
  return m === 1 ? `${sign}10${superscript(k)}` : `${sign}${fixed(Math.abs(m), decimalsOf(Math.abs(m)))}×10${superscript(k)}`;
}

/** A value in a note: `sig` significant figures, powers of ten from a million up (lives read better as 2.1×10⁶). */
export function formatValue(v: number, sig = 3): string {
  if (!isFiniteNumber(v)) return "—";
  if (v === 0) return "0";
  const a = Math.abs(v);
  if (a >= 1e6 || a < 1e-3) return powerOfTen(v, sig);
  const rounded = Number(v.toPrecision(sig));
  return fixed(rounded, decimalsOf(rounded));
}

/** A tick label on a linear axis whose ticks are `step` apart. */
export function formatTick(v: number, step: number): string {
  if (!isFiniteNumber(v)) return "—";
  const a = Math.abs(v);
  if (a >= 1e7) return powerOfTen(v, 3);
  const decimals = isFiniteNumber(step) && step > 0 ? Math.max(0, Math.ceil(-Math.log10(step) - 1e-9)) : 0;
  // Ticks sit on multiples of the step, so snapping removes float noise such as 0.30000000000000004.
  return fixed(v, Math.min(decimals, 6));
}

function decimalsOf(v: number): number {
  const s = String(v);
  if (s.includes("e")) return 6;
  const dot = s.indexOf(".");
  return dot < 0 ? 0 : s.length - dot - 1;
}

function fixed(v: number, decimals: number): string {
  let s = Math.abs(v).toFixed(decimals);
  const negative = v < 0 && Number(s) !== 0;
  const [int, frac] = s.split(".");
  const grouped = int.length > 4 ? int.replace(/\B(?=(\d{3})+$)/g, GROUP) : int;
  s = frac ? `${grouped}.${frac}` : grouped;
  return negative ? MINUS + s : s;
}
