import { bracketRoot } from "./special.ts";

/**
 * Root of an increasing function on a logarithmic variable: bracket by doubling or halving from a
 * start value, then narrow with bracketRoot (Illinois false position with a bisection safeguard,
 * Dowell & Jarratt 1971), so steps and plateaus (an endurance limit) cannot stall it.
 * The answer is the end of the final bracket where f ≥ 0: the passing side, within `relTol`.
 */
export interface RootResult {
  x: number;
  /** Evaluations spent narrowing the bracket (the rest went to finding it). */
  iterations: number;
  evaluations: number;
  /** false when no root lies between `min` and `max`. */
  found: boolean;
  /** Which side failed when not found: "below-min" (f ≥ 0 everywhere) or "above-max" (f < 0 everywhere). */
  side?: "below-min" | "above-max";
}

export function increasingRoot(f: (x: number) => number, start: number, min: number, max: number, relTol = 1e-5): RootResult {
  let evaluations = 0;
  const g = (u: number) => {
    evaluations++;
    return f(Math.exp(u));
  };
  let lo = Math.log(start);
  let flo = g(lo);
  let hi = lo;
  let fhi = flo;
  const uMin = Math.log(min);
  const uMax = Math.log(max);
  while (fhi < 0) {
    if (hi >= uMax) return { x: max, iterations: 0, evaluations, found: false, side: "above-max" };
    lo = hi;
    hi = Math.min(hi + Math.LN2, uMax);
    fhi = g(hi);
  }
  while (flo >= 0) {
    if (lo <= uMin) return { x: min, iterations: 0, evaluations, found: false, side: "below-min" };
    hi = lo;
    lo = Math.max(lo - Math.LN2, uMin);
    flo = g(lo);
  }
  const bracketing = evaluations;
  // Track the passing end of the bracket as bracketRoot narrows it.
  let passing = hi;
  const tracked = (u: number) => {
    const v = g(u);
    if (v >= 0 && u < passing) passing = u;
    return v;
  };
  // bracketRoot scales its tolerance by |u|; divide that back out so the answer holds relTol in x.
  const tol = Math.log1p(relTol) / 2 / Math.max(1, Math.abs(lo), Math.abs(hi));
  const root = bracketRoot(tracked, lo, hi, tol);
  if (root < passing && g(root) >= 0) passing = root;
  return { x: Math.exp(passing), iterations: evaluations - bracketing, evaluations, found: true };
}
