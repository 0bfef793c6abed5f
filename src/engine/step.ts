/**
 * A worked step: one line of the calculation a checker can redo by hand.
 * Every quantity that reaches the check sheet is returned as a Step beside its value.
 */
export interface Step {
  id: string;
  title: string;
  /** The equation in symbols, e.g. "σθ = p·r/t". */
  equation: string;
  /** The same equation with the numbers put in, e.g. "σθ = 0.06 × 1500 / 1.6". */
  substituted: string;
  /** null where the quantity is unbounded (an unlimited life). */
  value: number | null;
  unit: string;
  /** Published source: handbook, standard or textbook with table or equation number where known. */
  source: string;
}

/** Format a number for a substituted equation: 4 significant figures, exponent form for very large or small values. */
export function fmt(x: number, digits = 4): string {
  if (!Number.isFinite(x)) return x > 0 ? "∞" : x < 0 ? "−∞" : "NaN";
  if (x === 0) return "0";
  const ax = Math.abs(x);
  if (ax >= 1e6 || ax < 1e-3) {
    const [m, e] = x.toExponential(digits - 1).split("e");
    return `${trimZeros(m).replace(/^-/, "−")}×10^${String(Number(e)).replace("-", "−")}`;
  }
  // Number(...) drops the exponent form toPrecision uses for 60000 ("6.000e+4") and trailing zeros.
  return String(Number(x.toPrecision(digits))).replace(/^-/, "−");
}

function trimZeros(s: string): string {
  return s.includes(".") ? s.replace(/\.?0+$/, "") : s;
}

/** Build a step; keeps call sites short. */
export function step(
  id: string,
  title: string,
  equation: string,
  substituted: string,
  value: number | null,
  unit: string,
  source: string,
): Step {
  return { id, title, equation, substituted, value, unit, source };
}
