/**
 * Root of an increasing function on a logarithmic variable: bracket by doubling or halving from a
 * start value, then Illinois false position (Dowell & Jarratt 1971) with a bisection whenever a step
 * fails to halve the bracket, so steps and plateaus (an endurance limit) cannot stall it.
 * Stops when the bracket's relative width is below `relTol`.
 */
export interface RootResult {
  x: number;
  iterations: number;
  evaluations: number;
  /** false when no root lies between `min` and `max`. */
  found: boolean;
  /** Which side failed when not found: "below-min" (f > 0 everywhere) or "above-max" (f < 0 everywhere). */
  side?: "below-min" | "above-max";
}

export function increasingRoot(f: (x: number) => number, start: number, min: number, max: number, relTol = 1e-5, maxIter = 200): RootResult {
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
  if (flo < 0) {
    while (fhi < 0) {
      lo = hi;
      flo = fhi;
      if (hi >= uMax) return { x: max, iterations: 0, evaluations, found: false, side: "above-max" };
      hi = Math.min(hi + Math.LN2, uMax);
      fhi = g(hi);
    }
  } else {
    while (flo >= 0) {
      hi = lo;
      fhi = flo;
      if (lo <= uMin) return { x: min, iterations: 0, evaluations, found: false, side: "below-min" };
      lo = Math.max(lo - Math.LN2, uMin);
      flo = g(lo);
    }
  }
  let iterations = 0;
  let side = 0;
  const tol = Math.log1p(relTol);
  while (hi - lo > tol && iterations < maxIter) {
    iterations++;
    const width = hi - lo;
    let u = (lo * fhi - hi * flo) / (fhi - flo);
    if (!(u > lo && u < hi)) u = 0.5 * (lo + hi);
    const fu = g(u);
    if (fu < 0) {
      lo = u;
      flo = fu;
      if (side === -1) fhi /= 2;
      side = -1;
    } else {
      hi = u;
      fhi = fu;
      if (side === 1) flo /= 2;
      side = 1;
    }
    if (hi - lo > 0.5 * width) {
      const mid = 0.5 * (lo + hi);
      const fm = g(mid);
      if (fm < 0) {
        lo = mid;
        flo = fm;
      } else {
        hi = mid;
        fhi = fm;
      }
      side = 0;
    }
  }
  return { x: Math.exp(hi), iterations, evaluations, found: true };
}
