/**
 * How numbers, dates and the fingerprint read on the printed sheet. Written out as a person
 * would on paper: a true minus sign (U+2212), powers of ten as 1.909 × 10¹² rather than computer
 * notation, thin spaces between thousands in long whole numbers. Superscript digits are single
 * characters, so a value stays on one text line for anyone copying it out of the PDF.
 */

const SUPERSCRIPT: Record<string, string> = {
  "-": "⁻",
  "0": "⁰",
  "1": "¹",
  "2": "²",
  "3": "³",
  "4": "⁴",
  "5": "⁵",
  "6": "⁶",
  "7": "⁷",
  "8": "⁸",
  "9": "⁹",
};

export const MINUS = "\u2212";
const THIN_SPACE = "\u2009";

/** `digits` significant figures; exponent form at and above 10⁶ and below 10⁻³; "—" for no number. */
export function sig(x: number | null | undefined, digits = 4): string {
  if (x === null || x === undefined || Number.isNaN(x)) return "—";
  if (!Number.isFinite(x)) return x > 0 ? "∞" : `${MINUS}∞`;
  if (x === 0) return "0";
  const ax = Math.abs(x);
  if (ax >= 1e6 || ax < 1e-3) {
    const [mantissa, exponent] = x.toExponential(digits - 1).split("e");
    const m = mantissa.includes(".") ? mantissa.replace(/\.?0+$/, "") : mantissa;
    const e = [...String(Number(exponent))].map((ch) => SUPERSCRIPT[ch]).join("");
    return `${m.replace(/^-/, MINUS)} × 10${e}`;
  }
  const rounded = Number(x.toPrecision(digits));
  const [whole, fraction] = String(Math.abs(rounded)).split(".");
  // Four-digit numbers (years, 1150 mm) read better ungrouped, as is usual in engineering print.
  const grouped = whole.length > 4 ? whole.replace(/\B(?=(\d{3})+(?!\d))/g, THIN_SPACE) : whole;
  return `${rounded < 0 ? MINUS : ""}${grouped}${fraction ? `.${fraction}` : ""}`;
}

/** A value with its unit; a dimensionless unit ("—" or "") prints the number alone. */
export function withUnit(x: number | null | undefined, unit: string, digits = 4): string {
  const n = sig(x, digits);
  return unit && unit !== "—" && n !== "—" ? `${n} ${unit}` : n;
}

/** A life: null is unlimited (below the endurance limit or cut-off). */
export function life(x: number | null | undefined, unit = "cycles"): string {
  if (x === null) return "unlimited";
  return withUnit(x, unit, 4);
}

/** The reserve capacity ÷ demand − 1, as the usual margin of safety; "—" where none is defined. */
export function margin(x: number | null | undefined): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return "—";
  return `${x >= 0 ? "+" : ""}${sig(x, 3)}`;
}

/** A ratio given as a percentage, e.g. a reliability of 0.9 → "90 %". */
export function percent(x: number): string {
  return `${sig(x * 100, 4)} %`;
}

/** ISO 8601 calendar date (YYYY-MM-DD) in UTC: unambiguous on both sides of the Atlantic. */
export function isoDate(d: Date): string {
  return d.toISOString().slice(0, 10);
}

/**
 * A sign-off time as recorded: an ISO timestamp prints as date and UTC time; anything else is
 * printed as given (it is escaped by the template like all text).
 */
export function signedAtText(signedAt: string): string {
  const t = Date.parse(signedAt);
  if (!/^\d{4}-\d{2}-\d{2}/.test(signedAt) || Number.isNaN(t)) return signedAt;
  const iso = new Date(t).toISOString();
  return `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;
}

/** A list of numbers, cut short after `max` with a count of the rest (the whole list rides in the PDF). */
export function numberList(xs: readonly number[], max = 12, digits = 4): string {
  const shown = xs
    .slice(0, max)
    .map((x) => sig(x, digits))
    .join("; ");
  return xs.length > max ? `${shown}; … and ${xs.length - max} more` : shown;
}

/** Engine sentences start in lower case so they can be embedded; a list item starts a sentence. */
export function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
