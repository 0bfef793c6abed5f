// biome-ignore-all lint/correctness/noPrecisionLoss: published coefficients keep the digits they are printed with; the double nearest them is what counts
/**
 * Special functions and the small numerical tools the statistics and crack-growth
 * modules share: the standard normal distribution, the log-gamma function, the
 * non-central t distribution (for one-sided tolerance factors), the F quantile
 * with two numerator degrees of freedom (for ASTM E739 bands), adaptive
 * Gauss–Kronrod quadrature and a bracketing root finder.
 *
 * All functions are pure and work in double precision.
 */

const SQRT2 = Math.SQRT2;
const SQRT_PI = Math.sqrt(Math.PI);
const LN_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);

/**
 * Complementary error function erfc(x) = Γ(1/2, x²)/√π, for any real x.
 *
 * Below x² = 1.5 the positive-term series of the lower incomplete gamma function is
 * summed; above it the Legendre continued fraction of the upper incomplete gamma
 * function is evaluated by the modified Lentz method (Press et al., Numerical Recipes,
 * 3rd ed., §6.2 and §5.2). Relative accuracy about 1e-15 in both tails.
 */
export function erfc(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x < 0) return 2 - erfc(-x);
  const x2 = x * x;
  if (x2 < 1.5) {
    // erf(x) = (2/√π)·e^(−x²)·Σ 2ⁿ x^(2n+1) / (1·3·…·(2n+1)); all terms positive.
    let term = x;
    let sum = x;
    for (let n = 1; n < 200; n++) {
      term *= (2 * x2) / (2 * n + 1);
      sum += term;
      if (term < sum * 1e-17) break;
    }
    return 1 - (2 / SQRT_PI) * Math.exp(-x2) * sum;
  }
  // Γ(a, X) = e^(−X)·X^a · 1/(X+1−a− 1(1−a)/(X+3−a− 2(2−a)/(X+5−a− …))), a = 1/2, X = x².
  const a = 0.5;
  const tiny = 1e-300;
  let b = x2 + 1 - a;
  let c = 1 / tiny;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 500; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < tiny) d = tiny;
    c = b + an / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return (Math.exp(-x2) * x * h) / SQRT_PI;
}

/** Standard normal density φ(x) = e^(−x²/2)/√(2π). */
export function normalPdf(x: number): number {
  return Math.exp(-0.5 * x * x - LN_SQRT_2PI);
}

/**
 * Standard normal distribution function Φ(x) = ½·erfc(−x/√2).
 * Relative accuracy about 1e-15 in the lower tail, absolute 1e-16 in the upper.
 */
export function normalCdf(x: number): number {
  return 0.5 * erfc(-x / SQRT2);
}

// Acklam's rational approximation to the normal quantile (relative error < 1.15e-9
// before refinement). P. J. Acklam, "An algorithm for computing the inverse normal
// cumulative distribution function" (2003, published on the author's web page).
const ACKLAM_A = [
  -3.969683028665376e1, 2.209460984245205e2, -2.759285104469687e2, 1.38357751867269e2, -3.066479806614716e1, 2.506628277459239,
];
const ACKLAM_B = [-5.447609879822406e1, 1.615858368580409e2, -1.556989798598866e2, 6.680131188771972e1, -1.328068155288572e1];
const ACKLAM_C = [
  -7.784894002430293e-3, -3.223964580411365e-1, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783,
];
const ACKLAM_D = [7.784695709041462e-3, 3.224671290700398e-1, 2.445134137142996, 3.754408661907416];
const ACKLAM_P_LOW = 0.02425;

function acklam(p: number): number {
  const [a1, a2, a3, a4, a5, a6] = ACKLAM_A;
  const [b1, b2, b3, b4, b5] = ACKLAM_B;
  const [c1, c2, c3, c4, c5, c6] = ACKLAM_C;
  const [d1, d2, d3, d4] = ACKLAM_D;
  if (p < ACKLAM_P_LOW) {
    const q = Math.sqrt(-2 * Math.log(p));
    return (((((c1 * q + c2) * q + c3) * q + c4) * q + c5) * q + c6) / ((((d1 * q + d2) * q + d3) * q + d4) * q + 1);
  }
  if (p > 1 - ACKLAM_P_LOW) return -acklam(1 - p);
  const q = p - 0.5;
  const r = q * q;
  return ((((((a1 * r + a2) * r + a3) * r + a4) * r + a5) * r + a6) * q) / (((((b1 * r + b2) * r + b3) * r + b4) * r + b5) * r + 1);
}

/**
 * Standard normal quantile z with Φ(z) = p, 0 < p < 1.
 * Acklam's approximation refined by Halley steps on Φ(z) − p until the step is
 * below 1e-15·|z| (one step normally suffices); accurate to about 1e-13 relative.
 * For p above ½ the upper tail is refined as −z(1 − p) to keep relative accuracy.
 */
export function normalQuantile(p: number): number {
  if (!(p > 0 && p < 1)) {
    if (p === 0) return -Infinity;
    if (p === 1) return Infinity;
    return NaN;
  }
  if (p > 0.5) return -normalQuantile(1 - p);
  let z = acklam(p);
  for (let i = 0; i < 4; i++) {
    const e = normalCdf(z) - p;
    const u = e * Math.exp(0.5 * z * z + LN_SQRT_2PI);
    const dz = u / (1 + 0.5 * z * u);
    z -= dz;
    if (Math.abs(dz) <= 1e-15 * Math.max(1, Math.abs(z))) break;
  }
  return z;
}

// Lanczos coefficients for g = 7, n = 9 (C. Lanczos, SIAM J. Numer. Anal. B 1 (1964) 86–96;
// the widely used coefficient set of Godfrey), relative accuracy about 1e-15.
const LANCZOS_G = 7;
const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059, 12.507343278686905,
  -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];

/**
 * ln Γ(x) for x > 0 by the Lanczos approximation
 * Γ(x+1) = √(2π)·(x+g+½)^(x+½)·e^−(x+g+½)·A_g(x); for x < ½ the reflection
 * Γ(x)Γ(1−x) = π/sin(πx) keeps the accuracy.
 */
export function lnGamma(x: number): number {
  if (!(x > 0)) return NaN;
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - lnGamma(1 - x);
  const xm1 = x - 1;
  let sum = LANCZOS[0];
  for (let i = 1; i < LANCZOS.length; i++) sum += LANCZOS[i] / (xm1 + i);
  const t = xm1 + LANCZOS_G + 0.5;
  return LN_SQRT_2PI + (xm1 + 0.5) * Math.log(t) - t + Math.log(sum);
}

// Gauss–Kronrod 7/15 nodes and weights on [−1, 1] (Piessens et al., QUADPACK, 1983, routine QK15).
const GK_X = [
  0.991455371120812639206854697526329, 0.949107912342758524526189684047851, 0.864864423359769072789712788640926,
  0.741531185599394439863864773280788, 0.586087235467691130294144845693013, 0.405845151377397166906606412076961,
  0.207784955007898467600689403773245, 0,
];
const GK_WK = [
  0.02293532201052922496373200805897, 0.063092092629978553290700663189204, 0.104790010322250183839876322541518,
  0.140653259715525918745189590510238, 0.16900472663926790282658342659855, 0.190350578064785409913256402421014,
  0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
];
// Gauss 7-point weights for the nodes GK_X[1], GK_X[3], GK_X[5] and 0.
const GK_WG = [
  0.129484966168869693270611432679082, 0.27970539148927666790146777142378, 0.381830050505118944950369775488975,
  0.417959183673469387755102040816327,
];

interface Panel {
  a: number;
  b: number;
  value: number;
  error: number;
}

function gk15(f: (x: number) => number, a: number, b: number): Panel {
  const c = 0.5 * (a + b);
  const h = 0.5 * (b - a);
  const fc = f(c);
  let kron = GK_WK[7] * fc;
  let gauss = GK_WG[3] * fc;
  for (let i = 0; i < 7; i++) {
    const pair = f(c - h * GK_X[i]) + f(c + h * GK_X[i]);
    kron += GK_WK[i] * pair;
    if (i % 2 === 1) gauss += GK_WG[(i - 1) / 2] * pair;
  }
  return { a, b, value: kron * h, error: Math.abs((kron - gauss) * h) };
}

export interface IntegrateOptions {
  /** Target relative error of the whole integral; default 1e-10. */
  relTol?: number;
  /** Target absolute error; default 0. */
  absTol?: number;
  /** Most panels before giving up; default 2000. */
  maxPanels?: number;
}

/**
 * ∫ f(x) dx over [a, b] by globally adaptive Gauss–Kronrod 7/15 quadrature: the panel
 * with the largest |K15 − G7| is halved until the summed estimate meets the tolerance
 * (the QUADPACK QAG strategy, Piessens et al. 1983). `breaks` adds interior points
 * where f changes character (a kink or a steep front), which saves many subdivisions.
 * The error estimate |K15 − G7| is pessimistic for smooth f, so the result is
 * usually far more accurate than asked.
 */
export function integrate(f: (x: number) => number, a: number, b: number, options: IntegrateOptions = {}, breaks: number[] = []): number {
  const relTol = options.relTol ?? 1e-10;
  const absTol = options.absTol ?? 0;
  const maxPanels = options.maxPanels ?? 2000;
  const cuts = [a, ...breaks.filter((x) => x > a && x < b).sort((p, q) => p - q), b];
  const panels: Panel[] = [];
  for (let i = 0; i + 1 < cuts.length; i++) panels.push(gk15(f, cuts[i], cuts[i + 1]));
  for (;;) {
    let value = 0;
    let error = 0;
    let worst = 0;
    for (let i = 0; i < panels.length; i++) {
      value += panels[i].value;
      error += panels[i].error;
      if (panels[i].error > panels[worst].error) worst = i;
    }
    if (error <= Math.max(absTol, relTol * Math.abs(value)) || panels.length >= maxPanels) return value;
    const p = panels[worst];
    const mid = 0.5 * (p.a + p.b);
    panels[worst] = gk15(f, p.a, mid);
    panels.push(gk15(f, mid, p.b));
  }
}

/**
 * A root of f in [lo, hi], where f(lo) and f(hi) have opposite signs, by the Illinois
 * variant of regula falsi with a bisection safeguard (Dowell and Jarratt, BIT 11 (1971)
 * 168–174). Stops when the bracket is narrower than tol·max(1, |x|).
 */
export function bracketRoot(f: (x: number) => number, lo: number, hi: number, tol = 1e-13): number {
  let a = lo;
  let b = hi;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (Math.sign(fa) === Math.sign(fb)) throw new RangeError("bracketRoot: the interval does not bracket a root");
  let side = 0;
  for (let i = 0; i < 300; i++) {
    let x = (a * fb - b * fa) / (fb - fa);
    // Bisect when the secant point falls outside the bracket or too close to an end.
    const width = b - a;
    if (!(x > a + 0.01 * width && x < b - 0.01 * width)) x = 0.5 * (a + b);
    const fx = f(x);
    if (fx === 0) return x;
    if (Math.sign(fx) === Math.sign(fb)) {
      b = x;
      fb = fx;
      if (side === 1) fa /= 2;
      side = 1;
    } else {
      a = x;
      fa = fx;
      if (side === -1) fb /= 2;
      side = -1;
    }
    if (Math.abs(b - a) <= tol * Math.max(1, Math.abs(x))) return 0.5 * (a + b);
  }
  return 0.5 * (a + b);
}

/**
 * Distribution function of the non-central t distribution, P(T ≤ t) with
 * T = (Z + δ)/√(V/ν), Z standard normal, V chi-square with ν degrees of freedom.
 *
 * Conditioning on S = √(V/ν) gives P(T ≤ t) = ∫₀^∞ Φ(t·s − δ)·f_S(s) ds with
 * f_S(s) = 2(ν/2)^(ν/2)/Γ(ν/2) · s^(ν−1)·e^(−νs²/2) (the scaled chi density; Johnson,
 * Kotz and Balakrishnan, Continuous Univariate Distributions vol. 2, ch. 31). The
 * integral is taken by adaptive Gauss–Kronrod with breaks at the mode of f_S and around
 * the front s = δ/t of Φ, over the range where f_S exceeds e^−60 of its peak, so it
 * stays accurate (absolute error below 1e-13) for large δ, where series methods lose
 * their digits. Valid for ν ≥ 1, any real t and finite δ.
 */
export function noncentralTCdf(t: number, df: number, delta: number): number {
  if (!(df >= 1) || !Number.isFinite(delta) || Number.isNaN(t)) return NaN;
  if (t === Infinity) return 1;
  if (t === -Infinity) return 0;
  const halfNu = 0.5 * df;
  const logNorm = Math.LN2 + halfNu * Math.log(halfNu) - lnGamma(halfNu);
  // s^(ν−1) is 1 for ν = 1, s = 0 included (0·log 0 would be NaN where a break lands a panel on s = 0).
  const logDensity = (s: number) => logNorm + (df === 1 ? 0 : (df - 1) * Math.log(s)) - 0.5 * df * s * s;
  // f_S peaks at √((ν−1)/ν); for ν = 1 (the half-normal) it peaks at s = 0 with value e^logNorm.
  const mode = Math.sqrt((df - 1) / df);
  const cutoff = (df > 1 ? logDensity(mode) : logNorm) - 60;
  // Walk outwards from the mode in steps of about one standard deviation of S until f_S is negligible.
  const spread = 1 / Math.sqrt(df);
  let hi = mode + spread;
  while (logDensity(hi) > cutoff) hi += spread;
  let lo = mode;
  while (lo > 0 && logDensity(lo) > cutoff) lo = Math.max(0, lo - spread);
  const integrand = (s: number) => normalCdf(t * s - delta) * Math.exp(logDensity(s));
  const breaks = [mode];
  if (t !== 0) {
    // Φ(t·s − δ) climbs from Φ(−10) ≈ 1e-23 to 1 − 1e-23 within ±10/|t| of s = δ/t; a front
    // narrower than a wide panel's node spacing would be missed by both rules, so it gets panels of its own.
    const front = delta / t;
    const width = 10 / Math.abs(t);
    breaks.push(front - width, front, front + width);
  }
  const p = integrate(integrand, lo, hi, { relTol: 1e-13, absTol: 1e-15, maxPanels: 4000 }, breaks);
  return Math.min(1, Math.max(0, p));
}

/**
 * Quantile of the non-central t distribution: the t with P(T ≤ t) = p.
 * The bracket starts at δ and widens geometrically until it holds p, then
 * bracketRoot narrows it to 1e-12 relative. The CDF rises monotonically in t,
 * so the bracketed root is unique.
 */
export function noncentralTQuantile(p: number, df: number, delta: number): number {
  if (!(p > 0 && p < 1) || !(df >= 1) || !Number.isFinite(delta)) return NaN;
  const g = (t: number) => noncentralTCdf(t, df, delta) - p;
  let step = 1 + Math.abs(delta) * 0.1;
  let lo = delta - step;
  let hi = delta + step;
  while (g(lo) > 0) {
    step *= 2;
    lo = delta - step;
  }
  step = 1 + Math.abs(delta) * 0.1;
  while (g(hi) < 0) {
    step *= 2;
    hi = delta + step;
  }
  return bracketRoot(g, lo, hi, 1e-12);
}

/**
 * Quantile of the F distribution with 2 numerator and ν = df2 denominator degrees of
 * freedom. Its distribution function is closed: P(F ≤ x) = 1 − (1 + 2x/ν)^(−ν/2)
 * (from the F density with d₁ = 2), so x = (ν/2)·((1 − p)^(−2/ν) − 1).
 * ASTM E739 uses F_P(2, n − 2) for the confidence band on a fitted S-N line.
 */
export function fQuantileDf1Two(p: number, df2: number): number {
  if (!(p >= 0 && p < 1) || !(df2 > 0)) return NaN;
  return 0.5 * df2 * ((1 - p) ** (-2 / df2) - 1);
}
