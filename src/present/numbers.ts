/**
 * @module present/numbers
 * How every face writes a number: the page, the sheet, the records and the command line. Written
 * as a person would on paper: a true minus sign (U+2212), powers of ten as 1.909 × 10¹² rather
 * than computer notation, thin spaces between thousands in long whole numbers. Superscript
 * digits are single characters, so a value stays on one text line for anyone copying it out.
 * One way to show a reserve: a signed percentage.
 */
import type { Phrase } from "../schema/result.ts";
import { fromSI, type Quantity, type Units, unitLabel } from "../schema/units.ts";

const SUPERSCRIPT: Record<string, string> = {
  "-": "⁻",
  "−": "⁻",
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
    return `${m.replace(/^-/, MINUS)} × 10${superscript(String(Number(exponent)))}`;
  }
  const rounded = Number(x.toPrecision(digits));
  const [whole, fraction] = String(Math.abs(rounded)).split(".");
  // Four-digit numbers (years, 1150 mm) read better ungrouped, as is usual in engineering print.
  const grouped = whole.length > 4 ? whole.replace(/\B(?=(\d{3})+(?!\d))/g, THIN_SPACE) : whole;
  return `${rounded < 0 ? MINUS : ""}${grouped}${fraction ? `.${fraction}` : ""}`;
}

function superscript(digits: string): string {
  return [...digits].map((ch) => SUPERSCRIPT[ch] ?? ch).join("");
}

/** A value with its unit; a dimensionless unit ("—" or "") prints the number alone. */
export function withUnit(x: number | null | undefined, unit: string, digits = 4): string {
  const n = sig(x, digits);
  return unit && unit !== "—" && n !== "—" ? `${n} ${unit}` : n;
}

/** A life: null is unlimited (below the endurance limit or cut-off); undefined is no number. */
export function life(x: number | null | undefined, unit = "cycles", digits = 4): string {
  if (x === null) return "unlimited";
  return withUnit(x, unit, digits);
}

/** Reserves beyond this many per cent read as "over": the exact figure stops meaning anything. */
const HUGE_RESERVE_PCT = 10_000;

/**
 * A reserve (capacity ÷ demand − 1) as a signed percentage, the one way every face shows it:
 * 0.2345 → "+23 %", −0.1 → "−10 %", a huge one "over +10 000 %"; "—" where none is defined.
 */
export function reserve(x: number | null | undefined): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return "—";
  const pct = x * 100;
  if (pct >= HUGE_RESERVE_PCT) return `over +${sig(HUGE_RESERVE_PCT)} %`;
  const text = sig(Math.abs(pct), Math.abs(pct) >= 100 ? 3 : 2);
  return `${pct < 0 ? MINUS : "+"}${text} %`;
}

/** A ratio given as a percentage, e.g. a reliability of 0.9 → "90 %". */
export function percent(x: number): string {
  return `${sig(x * 100, 4)} %`;
}

/** An SI quantity as a number in the chosen display unit, without the unit (for table columns headed with it). */
export function inUnits(x: number | null | undefined, q: Quantity, units: Units, digits = 4): string {
  return x === null || x === undefined ? "—" : sig(fromSI(x, q, units), digits);
}

/** An SI quantity in the chosen display unit, with the unit. */
export function quantity(x: number | null | undefined, q: Quantity, units: Units, digits = 4): string {
  if (x === null || x === undefined) return "—";
  const unit = unitLabel(q, units);
  return `${inUnits(x, q, units, digits)}${unit ? ` ${unit}` : ""}`;
}

/** A list of numbers, cut short after `max` with a count of the rest. */
export function numberList(xs: readonly number[], max = 12, digits = 4): string {
  const shown = xs
    .slice(0, max)
    .map((x) => sig(x, digits))
    .join("; ");
  return xs.length > max ? `${shown}; … and ${xs.length - max} more` : shown;
}

/**
 * Engine text for a plain-text face: the engine writes powers of ten in its JSON-friendly
 * notation (1.909×10^12, 9.43×10^−8); the page shows them as 1.909 × 10¹², like the sheet.
 */
export function engineText(text: string): string {
  return text.replace(/×10\^([-−]?\d+)/g, (_m, e: string) => ` × 10${superscript(e)}`);
}

/**
 * An engine phrase in the reader's units: its words as they are, each amount converted from SI and
 * written with the one number formatter, so no face reads a number back out of a sentence.
 */
export function phraseText(parts: Phrase["parts"], units: Units): string {
  return parts
    .map((p) =>
      typeof p === "string"
        ? engineText(p)
        : p.quantity === "plain"
          ? sig(p.value ?? Number.POSITIVE_INFINITY, p.digits)
          : p.bare
            ? inUnits(p.value ?? Number.POSITIVE_INFINITY, p.quantity, units, p.digits)
            : quantity(p.value ?? Number.POSITIVE_INFINITY, p.quantity, units, p.digits),
    )
    .join("");
}

/** Engine sentences start in lower case so they can be embedded; a list item starts a sentence. */
export function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
