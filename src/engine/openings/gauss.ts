/**
 * Gauss–Legendre nodes and weights on [−1, 1], with the barycentric weights, the differentiation
 * matrix and the interpolation that a panel of nodes needs.
 *
 * Nodes are the roots of the Legendre polynomial P_p, found by Newton's iteration from the
 * Chebyshev-like start cos(π(i − ¼)/(p + ½)); weights w = 2/((1 − x²)·P_p′(x)²)
 * (Abramowitz & Stegun 25.4.29; Golub & Welsch 1969 give the same rule).
 * Barycentric interpolation and the differentiation matrix follow Berrut & Trefethen,
 * "Barycentric Lagrange interpolation", SIAM Review 46 (2004), eqs. (4.2) and (9.4).
 */
export interface GaussRule {
  p: number;
  x: Float64Array;
  w: Float64Array;
  /** Barycentric weights of the nodes. */
  bary: Float64Array;
  /** Differentiation matrix, row-major p×p: (D f)_i = Σ_j D[i·p + j] f_j approximates f′(x_i). */
  D: Float64Array;
}

const rules = new Map<number, GaussRule>();

export function gaussRule(p: number): GaussRule {
  const known = rules.get(p);
  if (known) return known;
  const x = new Float64Array(p);
  const w = new Float64Array(p);
  for (let i = 0; i < p; i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (p + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1;
      let p1 = z;
      for (let k = 2; k <= p; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (p * (z * p1 - p0)) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-15) break;
    }
    x[p - 1 - i] = z;
    w[p - 1 - i] = 2 / ((1 - z * z) * dp * dp);
  }
  const bary = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    let prod = 1;
    for (let k = 0; k < p; k++) if (k !== j) prod *= x[j] - x[k];
    bary[j] = 1 / prod;
  }
  const D = new Float64Array(p * p);
  for (let i = 0; i < p; i++) {
    let diag = 0;
    for (let j = 0; j < p; j++) {
      if (j === i) continue;
      const d = bary[j] / bary[i] / (x[i] - x[j]);
      D[i * p + j] = d;
      diag -= d;
    }
    D[i * p + i] = diag;
  }
  const rule = { p, x, w, bary, D };
  rules.set(p, rule);
  return rule;
}

/** Interpolation weights at a point s of [−1, 1] from the nodes' values (barycentric formula of the second kind). */
export function interpolationRow(rule: GaussRule, s: number, out: Float64Array): void {
  const { p, x, bary } = rule;
  for (let j = 0; j < p; j++) {
    if (s === x[j]) {
      out.fill(0);
      out[j] = 1;
      return;
    }
  }
  let sum = 0;
  for (let j = 0; j < p; j++) {
    const c = bary[j] / (s - x[j]);
    out[j] = c;
    sum += c;
  }
  for (let j = 0; j < p; j++) out[j] /= sum;
}
