/**
 * Fit of coupon fatigue results to the Basquin line, after ASTM E739.
 *
 * E739 treats the life as the dependent variable: log10 N = A + B·log10 S, fitted by least
 * squares, with S the stress amplitude in MPa and N the cycles to failure. The Basquin form
 * σa = σ′f·(2N)^b follows by inverting the line: b = 1/B and σ′f = 10^(−A/B)/2^b.
 * The residual standard deviation s uses n − 2 degrees of freedom, and the confidence band
 * on the median line at confidence P is
 *   log10 N = A + B·X ± √(2·F_P(2, n − 2))·s·√(1/n + (X − X̄)²/Σ(Xᵢ − X̄)²),  X = log10 S
 * (ASTM E739, sections on the linear model and the confidence band for the whole line).
 *
 * Validity: the finite-life region where log N is linear in log S; run-outs (tests stopped
 * without failure) are censored results that least squares cannot use, so they are left out
 * and counted. σ′f and b describe the coupons' own load ratio; fully reversed tests give the
 * values the mean-stress criteria expect.
 */
import { InputError } from "./errors.ts";
import { fQuantileDf1Two } from "./special.ts";
import { fmt, step, type Step } from "./step.ts";
import { say, type Warning } from "./phrase.ts";

export interface Coupon {
  amplitude_MPa: number;
  life_cycles: number;
  /** True when the test stopped without failure. */
  runout?: boolean;
}

export interface CouponBand {
  lower_cycles: number;
  median_cycles: number;
  upper_cycles: number;
  /** True when the amplitude lies outside the range of the fitted (failed) coupons. */
  extrapolated: boolean;
  step: Step;
}

export interface CouponFit {
  fatigueStrengthCoefficient_MPa: number;
  fatigueStrengthExponent: number;
  /** Intercept of log10 N = A + B·log10 S. */
  A: number;
  /** Slope of log10 N = A + B·log10 S. */
  B: number;
  /** Failed coupons used in the fit. */
  n: number;
  /** Run-outs left out of the fit. */
  runouts: number;
  /** Residual standard deviation of log10 N, n − 2 degrees of freedom. */
  logStdDev: number;
  rSquared: number;
  band(amplitude_MPa: number, P?: number): CouponBand;
  steps: Step[];
  warnings: Warning[];
}

const E739 = "ASTM E739, linear model log N = A + B·log S fitted by least squares (life as the dependent variable)";
const E739_BAND = "ASTM E739, confidence band for the whole median line with √(2·F_P(2, n − 2))";
const BASQUIN = "Basquin relation σa = σ′f·(2N)^b (Dowling, Mechanical Behavior of Materials, ch. 9)";

/** Fit failed coupons to the Basquin line; see the module comment for the method. */
export function fitCoupons(coupons: Coupon[]): CouponFit {
  coupons.forEach((c, i) => {
    if (!(Number.isFinite(c.amplitude_MPa) && c.amplitude_MPa > 0)) {
      throw new InputError(`material.coupons.${i}.amplitude_MPa`, "Each coupon needs a positive stress amplitude in MPa.");
    }
    if (!(Number.isFinite(c.life_cycles) && c.life_cycles > 0)) {
      throw new InputError(`material.coupons.${i}.life_cycles`, "Each coupon needs a positive life in cycles.");
    }
  });
  const failed = coupons.filter((c) => !c.runout);
  const runouts = coupons.length - failed.length;
  const n = failed.length;
  if (n < 3) {
    throw new InputError(
      "material.coupons",
      `At least three coupons that failed are needed to fit an S-N line; ${n} given (run-outs do not count).`,
    );
  }
  const xs = failed.map((c) => Math.log10(c.amplitude_MPa));
  const ys = failed.map((c) => Math.log10(c.life_cycles));
  const xBar = xs.reduce((a, b) => a + b, 0) / n;
  const yBar = ys.reduce((a, b) => a + b, 0) / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (xs[i] - xBar) ** 2;
    sxy += (xs[i] - xBar) * (ys[i] - yBar);
    syy += (ys[i] - yBar) ** 2;
  }
  if (sxx === 0) {
    throw new InputError("material.coupons", "The failed coupons were all tested at one amplitude; an S-N line needs at least two.");
  }
  const B = sxy / sxx;
  const A = yBar - B * xBar;
  if (!(B < 0)) {
    throw new InputError(
      "material.coupons",
      "The coupon lives do not fall as the amplitude rises (fitted slope not negative); check the data for mixed-up columns.",
    );
  }
  let sse = 0;
  for (let i = 0; i < n; i++) sse += (ys[i] - (A + B * xs[i])) ** 2;
  const dof = n - 2;
  const logStdDev = Math.sqrt(sse / dof);
  const rSquared = syy > 0 ? 1 - sse / syy : 1;
  const b = 1 / B;
  const sigmaF = 10 ** (-A / B) / 2 ** b;

  const steps: Step[] = [
    step(
      "coupons-slope",
      "Slope of the fitted S-N line",
      "B = Σ(Xᵢ − X̄)(Yᵢ − Ȳ) / Σ(Xᵢ − X̄)²",
      `B = ${fmt(sxy)} / ${fmt(sxx)}`,
      B,
      "—",
      E739,
    ),
    step(
      "coupons-intercept",
      "Intercept of the fitted S-N line",
      "A = Ȳ − B·X̄",
      `A = ${fmt(yBar)} − (${fmt(B)}) × ${fmt(xBar)}`,
      A,
      "—",
      E739,
    ),
    step(
      "coupons-scatter",
      "Residual standard deviation of log life",
      "s = √(Σ(Yᵢ − A − B·Xᵢ)² / (n − 2))",
      `s = √(${fmt(sse)} / ${dof})`,
      logStdDev,
      "log10 cycles",
      E739,
    ),
    step(
      "coupons-r2",
      "Coefficient of determination",
      "R² = 1 − SSE/Σ(Yᵢ − Ȳ)²",
      `R² = 1 − ${fmt(sse)} / ${fmt(syy)}`,
      rSquared,
      "—",
      E739,
    ),
    step("coupons-b", "Fatigue strength exponent", "b = 1/B", `b = 1 / (${fmt(B)})`, b, "—", BASQUIN),
    step(
      "coupons-sigmaf",
      "Fatigue strength coefficient",
      "σ′f = 10^(−A/B) / 2^b",
      `σ′f = 10^(−(${fmt(A)})/(${fmt(B)})) / 2^(${fmt(b)})`,
      sigmaF,
      "MPa",
      BASQUIN,
    ),
  ];

  const warnings: Warning[] = [];
  if (runouts > 0) {
    warnings.push(
      `${runouts} run-out${runouts === 1 ? " was" : "s were"} left out of the fit: a test stopped without failure only says the life is longer, which least squares cannot use.`,
    );
  }
  if (n < 6) {
    warnings.push(
      say`Only ${String(n)} failed coupons: ASTM E739 suggests at least 6 for exploratory work and 12 or more for design data (from memory); the band is wide and the line uncertain.`,
    );
  }

  const xMin = Math.min(...xs);
  const xMax = Math.max(...xs);
  const band = (amplitude_MPa: number, P = 0.95): CouponBand => {
    // Both arguments come from the engine, not the user, so a bad one is a programming error.
    if (!(amplitude_MPa > 0)) throw new RangeError("band: the amplitude must be positive");
    if (!(P > 0 && P < 1)) throw new RangeError("band: the confidence P must lie between 0 and 1");
    const x = Math.log10(amplitude_MPa);
    const y = A + B * x;
    const f = fQuantileDf1Two(P, dof);
    const half = Math.sqrt(2 * f) * logStdDev * Math.sqrt(1 / n + (x - xBar) ** 2 / sxx);
    return {
      lower_cycles: 10 ** (y - half),
      median_cycles: 10 ** y,
      upper_cycles: 10 ** (y + half),
      extrapolated: x < xMin - 1e-12 || x > xMax + 1e-12,
      step: step(
        "coupons-band",
        `Half-width of the ${fmt(P * 100)} % confidence band on log life`,
        "w = √(2·F_P(2, n − 2))·s·√(1/n + (X − X̄)²/Σ(Xᵢ − X̄)²)",
        `w = √(2 × ${fmt(f)}) × ${fmt(logStdDev)} × √(1/${n} + (${fmt(x)} − ${fmt(xBar)})²/${fmt(sxx)})`,
        half,
        "log10 cycles",
        E739_BAND,
      ),
    };
  };

  return {
    fatigueStrengthCoefficient_MPa: sigmaF,
    fatigueStrengthExponent: b,
    A,
    B,
    n,
    runouts,
    logStdDev,
    rSquared,
    band,
    steps,
    warnings,
  };
}
