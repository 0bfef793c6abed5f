/**
 * The fleet view: what the lives of many items in service look like when one or a few tested
 * articles are all the evidence.
 *
 * Lives are lognormal: x = log10 N is normal with mean μ and standard deviation σ (from the test
 * evidence, or the computed life taken as the median with an assumed σ). For n items in service
 * (Johnson, Kotz & Balakrishnan, order statistics; any text on extreme values):
 *  - the first failure is the first order statistic, P(min ≤ x) = 1 − (1 − Φ((x − μ)/σ))ⁿ; its
 *    median solves Φ(z) = 1 − 0.5^(1/n): N₁ = 10^(μ + z·σ);
 *  - the probability that at least one fails before the design life D is
 *    1 − (1 − Φ((log10 D − μ)/σ))ⁿ;
 *  - the 5th-percentile life (the design basis the trade uses) is 10^(μ − 1.6449·σ).
 * μ and σ are taken as known: their own uncertainty from few tests is what the tolerance bound of
 * the evidence covers, not this view.
 */
import type { CheckResult } from "./result.ts";
import { normalCdf, normalQuantile } from "./special.ts";
import { fmt, step, type Step } from "./step.ts";
import { n as count, say, type Warning } from "./phrase.ts";

export interface FleetInput {
  size: number;
  logMean: number;
  logStdDev: number;
  designLife_cycles: number;
  basis: "test evidence" | "computed life";
  /** The tested lives, for the plot. */
  testLives_cycles: number[];
}

/** The fleet view as the result carries it (its definition: src/schema/result.ts). */
export type FleetResult = NonNullable<CheckResult["fleet"]>;

const ORDER =
  "First order statistic of n independent lognormal lives (order statistics, e.g. David & Nagaraja, Order Statistics; from memory)";
const Z5 = 1.6448536269514722; // Φ⁻¹(0.95)

/** Median of the smallest of n lives: 10^(μ + σ·Φ⁻¹(1 − 0.5^(1/n))). */
export function firstFailureMedian(n: number, mu: number, sigma: number): number {
  const p = -Math.expm1(Math.log(0.5) / n); // 1 − 0.5^(1/n), accurate for large n
  return 10 ** (mu + sigma * normalQuantile(p));
}

/** 1 − (1 − p)ⁿ without cancellation for small p. */
export function anyOf(n: number, p: number): number {
  return -Math.expm1(n * Math.log1p(-p));
}

export function fleetView(f: FleetInput): { fleet: FleetResult; steps: Step[]; warnings: Warning[] } {
  const { size: n, logMean: mu, logStdDev: sigma } = f;
  const steps: Step[] = [];
  const warnings: Warning[] = [];
  const p1 = -Math.expm1(Math.log(0.5) / n);
  const z1 = normalQuantile(p1);
  const first = firstFailureMedian(n, mu, sigma);
  steps.push(
    step(
      "fleet-first-failure",
      `Median life of the first of ${fmt(n)} items to fail`,
      "N₁ = 10^(μ + σ·Φ⁻¹(1 − 0.5^(1/n)))",
      `N₁ = 10^(${fmt(mu)} + ${fmt(sigma)} × Φ⁻¹(${fmt(p1)}) = ${fmt(mu)} + ${fmt(sigma)} × ${fmt(z1)})`,
      first,
      "cycles",
      ORDER,
    ),
  );
  const logD = Math.log10(f.designLife_cycles);
  const zD = (logD - mu) / sigma;
  const pOne = normalCdf(zD);
  const pAny = anyOf(n, pOne);
  steps.push(
    step(
      "fleet-any-before-design",
      `Probability that at least one of ${fmt(n)} items fails before the design life`,
      "P = 1 − (1 − Φ((log10 D − μ)/σ))ⁿ",
      `P = 1 − (1 − Φ((${fmt(logD)} − ${fmt(mu)})/${fmt(sigma)} = ${fmt(zD)}))^${fmt(n)}, Φ = ${fmt(pOne)}`,
      pAny,
      "—",
      ORDER,
    ),
  );
  const p5 = 10 ** (mu - Z5 * sigma);
  steps.push(
    step(
      "fleet-percentile5",
      "Life that 95 % of the items exceed (5th percentile)",
      "N₅ = 10^(μ − 1.6449·σ)",
      `N₅ = 10^(${fmt(mu)} − 1.6449 × ${fmt(sigma)})`,
      p5,
      "cycles",
      "Lognormal quantile (common practice as a design basis)",
    ),
  );
  if (first < f.designLife_cycles)
    warnings.push(
      say`The weakest of ${count(n)} items would be expected to fail at about ${count(first)} cycles, before the design life of ${count(f.designLife_cycles)} cycles.`,
    );
  if (f.basis === "computed life")
    warnings.push("The fleet view takes the computed life as the median with an assumed scatter: no test evidence supports it.");
  const density: FleetResult["density"] = [];
  for (let i = 0; i <= 120; i++) {
    const x = mu + sigma * (-6 + (9 * i) / 120);
    const zx = (x - mu) / sigma;
    const one = Math.exp(-0.5 * zx * zx) / (sigma * Math.sqrt(2 * Math.PI));
    const survive = 1 - normalCdf(zx);
    const first = n * one * (survive > 0 ? Math.exp((n - 1) * Math.log(survive)) : 0);
    density.push({ life_cycles: 10 ** x, one, first });
  }
  const tests = f.testLives_cycles.length;
  const statement =
    (tests === 1
      ? `One test article lasted ${fmt(f.testLives_cycles[0])} cycles. It shows that one item of this build lasted that long; it cannot show how much lives spread between items, so it cannot show how long the weakest of ${fmt(n)} in service will last. `
      : tests > 1
        ? `${tests} test articles give a median life of ${fmt(10 ** mu)} cycles and a spread of σ = ${fmt(sigma)} in log10 life; few tests estimate the spread poorly. `
        : `No test evidence: the computed life of ${fmt(10 ** mu)} cycles is taken as the median. `) +
    `With ${f.basis === "test evidence" && tests > 1 ? "that" : "an assumed"} spread of σ = ${fmt(sigma)} in log10 life, the weakest of ${fmt(n)} items is expected to fail at about ${fmt(first)} cycles, ${fmt(10 ** mu / first, 3)} times sooner than the median item, and 95 % of items exceed ${fmt(p5)} cycles. ` +
    "Only more tests, or service experience of the same detail, can show the spread itself.";
  return {
    fleet: {
      size: n,
      basis: f.basis,
      logMean: mu,
      logStdDev: sigma,
      median_cycles: 10 ** mu,
      firstFailure_cycles: first,
      probabilityAnyFailsBeforeDesignLife: pAny,
      percentile5_cycles: p5,
      probabilityOneFailsBeforeDesignLife: pOne,
      designLife_cycles: f.designLife_cycles,
      testLives_cycles: f.testLives_cycles,
      density,
      statement,
    },
    steps,
    warnings,
  };
}
