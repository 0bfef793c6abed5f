import { fromSI, type Quantity, type Units, unitLabel } from "../src/schema/units.ts";

/**
 * Numbers as the page shows them: four significant figures, a true minus sign, powers of ten
 * written out (1.23 × 10⁶) rather than computer notation, thin spaces between thousands.
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

export function sig(x: number | null | undefined, digits = 4): string {
  if (x === null || x === undefined || Number.isNaN(x)) return "—";
  if (!Number.isFinite(x)) return x > 0 ? "∞" : "−∞";
  if (x === 0) return "0";
  const ax = Math.abs(x);
  if (ax >= 1e6 || ax < 1e-3) {
    const [m, e] = x.toExponential(digits - 1).split("e");
    const mant = m.includes(".") ? m.replace(/\.?0+$/, "") : m;
    return `${minus(mant)} × 10${[...String(Number(e))].map((ch) => SUPERSCRIPT[ch]).join("")}`;
  }
  const fixed = Number(x.toPrecision(digits));
  const [int, frac] = String(Math.abs(fixed)).split(".");
  const grouped = int.length > 4 ? int.replace(/\B(?=(\d{3})+(?!\d))/g, "\u2009") : int;
  return `${fixed < 0 ? "−" : ""}${grouped}${frac ? `.${frac}` : ""}`;
}

function minus(s: string): string {
  return s.replace(/^-/, "−");
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

/** A life in cycles: null is unlimited (below the endurance limit). */
export function cycles(x: number | null | undefined, unit = "cycles"): string {
  if (x === null) return "unlimited";
  if (x === undefined) return "—";
  return unit ? `${sig(x, 3)} ${unit}` : sig(x, 3);
}

/** Reserves beyond this many per cent read as "over": the exact figure stops meaning anything. */
const HUGE_RESERVE_PCT = 10_000;

/** A reserve as a signed percentage: 0.23 → "+23 %"; a huge one as "over +10 000 %". */
export function margin(x: number | null | undefined): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return "—";
  const pct = x * 100;
  if (pct >= HUGE_RESERVE_PCT) return `over +${sig(HUGE_RESERVE_PCT)} %`;
  const text = sig(Math.abs(pct), Math.abs(pct) >= 100 ? 3 : 2);
  return `${pct < 0 ? "−" : "+"}${text} %`;
}
