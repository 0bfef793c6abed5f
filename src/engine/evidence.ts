/**
 * Fatigue test evidence: a lower tolerance bound on life from a few tested articles.
 *
 * Lives are taken as lognormal, i.e. x = log10 N is normal. The lower bound is the
 * one-sided tolerance limit N_L = 10^(x̄ − k·s): with the stated confidence γ, at least
 * the proportion p (the reliability) of the population lives longer than N_L.
 *
 *  - σ estimated from the sample (n ≥ 2): k = t′_γ(n − 1, z_p·√n)/√n, t′ the non-central t
 *    quantile (Natrella, Experimental Statistics, NBS Handbook 91, 1963, Table A-7;
 *    the B- and A-basis factors of MIL-HDBK-5 / MMPDS are the same quantity).
 *  - σ known (assumed from wider experience): x̄ is normal with standard deviation σ/√n, so
 *    x̄ − z_γ·σ/√n is a γ lower confidence bound on the mean μ, and μ − z_p·σ is the p-survival
 *    life; together k = z_p + z_γ/√n.
 *
 * A single article without an assumed σ carries no information on the spread, so the bound
 * is refused rather than invented.
 */
import { InputError } from "./errors.ts";
import { noncentralTQuantile, normalQuantile } from "./special.ts";
import { fmt, step, type Step } from "./step.ts";
import { n as plain, say, type Warning } from "./phrase.ts";

export interface EvidenceInput {
  lives_cycles: number[];
  /** Proportion of the population to lie above the bound, e.g. 0.9 (B-basis) or 0.99 (A-basis). */
  reliability: number;
  /** Confidence level of the statement, e.g. 0.95. */
  confidence: number;
  /** A log10 standard deviation taken as known, from wider experience of the material and detail. */
  assumedLogStdDev?: number;
}

export interface EvidenceResult {
  n: number;
  /** Mean of log10 lives. */
  logMean: number;
  /** Sample standard deviation of log10 lives (n − 1 divisor), or the assumed one; null when neither exists. */
  logStdDev: number | null;
  logStdDevFrom: "sample" | "assumed" | null;
  /** One-sided tolerance factor k of the form in use (the known-σ form when the bound is refused). */
  toleranceFactor: number;
  lowerBound_cycles: number | null;
  /** Mean (geometric-mean) life over the lower bound, 10^(k·s); null when refused. */
  impliedScatterFactor: number | null;
  /** Largest log10 standard deviation for which the bound still reaches the design life; null when even σ = 0 does not. */
  requiredLogStdDev: number | null;
  supportsDesignLife: boolean | null;
  steps: Step[];
  warnings: Warning[];
}

const NATRELLA = "Natrella, Experimental Statistics, NBS Handbook 91 (1963), Table A-7 (one-sided normal tolerance factors)";
const KNOWN_SIGMA = "One-sided normal tolerance limit with known σ: lower γ-confidence bound on the mean, x̄ − z_γσ/√n, less z_p·σ";

/** One-sided lower tolerance factor with σ estimated from n results: t′_γ(n − 1, z_p√n)/√n. */
export function toleranceFactorSample(n: number, reliability: number, confidence: number): number {
  const key = `${n}|${reliability}|${confidence}`;
  const known = factorCache.get(key);
  if (known !== undefined) return known;
  const delta = normalQuantile(reliability) * Math.sqrt(n);
  const k = noncentralTQuantile(confidence, n - 1, delta) / Math.sqrt(n);
  if (factorCache.size >= 256) factorCache.clear();
  factorCache.set(key, k);
  return k;
}

/** The non-central t quantile costs milliseconds and the same few (n, p, γ) recur as a user types: remember them. */
const factorCache = new Map<string, number>();

/** One-sided lower tolerance factor with σ known: z_p + z_γ/√n. */
export function toleranceFactorKnownSigma(n: number, reliability: number, confidence: number): number {
  return normalQuantile(reliability) + normalQuantile(confidence) / Math.sqrt(n);
}

function validate(input: EvidenceInput, designLife_cycles: number, scatterFactor: number): void {
  const lives = input.lives_cycles;
  if (lives.length === 0) throw new InputError("evidence.lives_cycles", "Give at least one tested life.");
  lives.forEach((life, i) => {
    if (!(Number.isFinite(life) && life > 0)) {
      throw new InputError(`evidence.lives_cycles.${i}`, "Each tested life must be a positive number of cycles.");
    }
  });
  if (!(input.reliability > 0 && input.reliability < 1)) {
    throw new InputError("evidence.reliability", "Reliability must lie strictly between 0 and 1, e.g. 0.9.");
  }
  if (!(input.confidence > 0 && input.confidence < 1)) {
    throw new InputError("evidence.confidence", "Confidence must lie strictly between 0 and 1, e.g. 0.95.");
  }
  if (input.assumedLogStdDev !== undefined && !(Number.isFinite(input.assumedLogStdDev) && input.assumedLogStdDev > 0)) {
    throw new InputError("evidence.assumedLogStdDev", "The assumed log10 standard deviation must be a positive number, e.g. 0.15.");
  }
  if (!(Number.isFinite(designLife_cycles) && designLife_cycles > 0)) {
    throw new InputError("fatigue.designLife_cycles", "The design life must be a positive number of cycles.");
  }
  if (!(Number.isFinite(scatterFactor) && scatterFactor >= 1)) {
    throw new InputError("fatigue.scatterFactor", "The scatter factor must be 1 or more.");
  }
}

/** A list of log terms for a substituted equation, shortened after four. */
function listLogs(lives: number[]): string {
  const shown = lives.slice(0, 4).map((life) => `log10 ${fmt(life)}`);
  return lives.length > 4 ? `${shown.join(" + ")} + … (${lives.length} lives)` : shown.join(" + ");
}

/** What each stage of the assessment adds to the sheet. */
interface Said {
  steps: Step[];
  warnings: Warning[];
}

/** Stage 1, the sample: the mean of the log lives and, with two or more, their standard deviation. */
function logStatistics(lives: number[], said: Said): { logMean: number; sampleStdDev: number | null } {
  const n = lives.length;
  const logs = lives.map(Math.log10);
  const logMean = logs.reduce((a, b) => a + b, 0) / n;
  said.steps.push(
    step(
      "evidence-log-mean",
      "Mean of the log lives",
      "x̄ = Σ log10 Nᵢ / n",
      `x̄ = (${listLogs(lives)}) / ${n}`,
      logMean,
      "log10 cycles",
      "Lognormal life model (base-10 logarithms)",
    ),
  );
  const sampleStdDev = n >= 2 ? Math.sqrt(logs.reduce((acc, x) => acc + (x - logMean) ** 2, 0) / (n - 1)) : null;
  if (sampleStdDev !== null)
    said.steps.push(
      step(
        "evidence-log-sd",
        "Sample standard deviation of the log lives",
        "s = √(Σ(xᵢ − x̄)² / (n − 1))",
        `s = √(Σ(xᵢ − ${fmt(logMean)})² / ${n - 1})`,
        sampleStdDev,
        "log10 cycles",
        "Sample standard deviation with n − 1 divisor",
      ),
    );
  return { logMean, sampleStdDev };
}

interface Spread {
  k: number;
  logStdDev: number | null;
  logStdDevFrom: EvidenceResult["logStdDevFrom"];
}

/**
 * Stage 2, the spread and its tolerance factor: an assumed σ (or a single article) takes the
 * known-σ factor; otherwise σ comes from the sample and the factor from the non-central t.
 */
function spreadAndFactor(input: EvidenceInput, n: number, sampleStdDev: number | null, said: Said): Spread {
  const { reliability: p, confidence: gamma, assumedLogStdDev: assumed } = input;
  if (assumed !== undefined || n === 1) {
    const k = toleranceFactorKnownSigma(n, p, gamma);
    said.steps.push(
      step(
        "evidence-k",
        "One-sided tolerance factor, σ known",
        "k = z_p + z_γ/√n",
        `k = ${fmt(normalQuantile(p))} + ${fmt(normalQuantile(gamma))}/√${n}`,
        k,
        "—",
        KNOWN_SIGMA,
      ),
    );
    if (assumed !== undefined && sampleStdDev !== null && sampleStdDev > assumed)
      said.warnings.push(
        say`The tested lives scatter more (log10 standard deviation ${plain(sampleStdDev)}) than the assumed ${plain(assumed)}; the lower bound may be too high. Check the assumed scatter against these results.`,
      );
    return { k, logStdDev: assumed ?? null, logStdDevFrom: assumed !== undefined ? "assumed" : null };
  }
  const k = toleranceFactorSample(n, p, gamma);
  said.steps.push(
    step(
      "evidence-k",
      "One-sided tolerance factor, σ from the sample",
      "k = t′_γ(n − 1, z_p·√n) / √n",
      `k = t′_${fmt(gamma)}(${n - 1}, ${fmt(normalQuantile(p))}·√${n}) / √${n}`,
      k,
      "—",
      NATRELLA,
    ),
  );
  if (sampleStdDev === 0)
    said.warnings.push(
      "All tested lives are equal, so the sample shows no scatter and the lower bound equals the mean. " +
        "Real fleets scatter; give an assumed log standard deviation.",
    );
  return { k, logStdDev: sampleStdDev, logStdDevFrom: "sample" };
}

/** Stage 3, what the tests could support at best: the largest spread for which the bound still reaches the design life. */
function largestSpread(logMean: number, designLife_cycles: number, spread: Spread, said: Said): number | null {
  const marginLog = logMean - Math.log10(designLife_cycles);
  const required = marginLog > 0 ? marginLog / spread.k : null;
  said.steps.push(
    step(
      "evidence-required-sd",
      "Largest log standard deviation that still reaches the design life",
      "s_max = (x̄ − log10 N_design) / k",
      `s_max = (${fmt(logMean)} − log10 ${fmt(designLife_cycles)}) / ${fmt(spread.k)}`,
      required,
      "log10 cycles",
      spread.logStdDevFrom === "sample" ? NATRELLA : KNOWN_SIGMA,
    ),
  );
  if (required === null)
    said.warnings.push("The mean of the tested lives is below the design life: no amount of consistency in the tests would support it.");
  return required;
}

/**
 * Stage 4, the bound and what it says: the tolerance bound on life, the scatter factor it
 * implies against the one in use, and the bound against the design life.
 */
function boundAndComparisons(
  input: EvidenceInput,
  logMean: number,
  spread: Spread & { logStdDev: number },
  designLife_cycles: number,
  scatterFactor: number,
  said: Said,
): { lowerBound_cycles: number; impliedScatterFactor: number | null } {
  const { k, logStdDev } = spread;
  const source = spread.logStdDevFrom === "sample" ? NATRELLA : KNOWN_SIGMA;
  const lowerBound_cycles = 10 ** (logMean - k * logStdDev);
  said.steps.push(
    step(
      "evidence-lower-bound",
      `Lower tolerance bound on life (${fmt(input.reliability * 100)} % survival, ${fmt(input.confidence * 100)} % confidence)`,
      "N_L = 10^(x̄ − k·s)",
      `N_L = 10^(${fmt(logMean)} − ${fmt(k)} × ${fmt(logStdDev)})`,
      lowerBound_cycles,
      "cycles",
      source,
    ),
  );
  // Past the largest double the factor is no number at all: null, and the warning below says so.
  const implied = 10 ** (k * logStdDev);
  const impliedScatterFactor = Number.isFinite(implied) ? implied : null;
  said.steps.push(
    step(
      "evidence-implied-scatter",
      "Scatter factor implied by the evidence",
      "SF_implied = 10^x̄ / N_L = 10^(k·s)",
      `SF_implied = 10^(${fmt(k)} × ${fmt(logStdDev)})`,
      impliedScatterFactor,
      "—",
      "Ratio of the geometric-mean life to the tolerance bound",
    ),
    step(
      "evidence-scatter-compare",
      "Implied scatter factor against the scatter factor in use",
      "SF_implied / SF ≤ 1",
      impliedScatterFactor === null ? "SF_implied beyond any number" : `${fmt(impliedScatterFactor)} / ${fmt(scatterFactor)}`,
      impliedScatterFactor === null ? null : impliedScatterFactor / scatterFactor,
      "—",
      "Comparison of the statistical allowance with the scatter factor applied to the mean life",
    ),
  );
  if (impliedScatterFactor === null || impliedScatterFactor > scatterFactor)
    said.warnings.push(
      say`The test evidence implies a scatter factor of ${impliedScatterFactor === null ? "more than any number can hold" : plain(impliedScatterFactor)}, more than the ${plain(scatterFactor)} in use: dividing the mean life by the scatter factor in use is not conservative for this evidence.`,
    );
  said.steps.push(
    step(
      "evidence-design-life",
      "Lower bound against the design life",
      "N_L / N_design ≥ 1",
      `${fmt(lowerBound_cycles)} / ${fmt(designLife_cycles)}`,
      lowerBound_cycles / designLife_cycles,
      "—",
      "Design life shown by test when the tolerance bound reaches it",
    ),
  );
  return { lowerBound_cycles, impliedScatterFactor };
}

/**
 * Evaluate test lives against a design life, in four stages: the sample, the spread and its
 * tolerance factor, the largest spread the tests could carry, and the bound with what it says.
 * Units: lives and design life in cycles; the standard deviation is of log10 life.
 * Validity: lognormal lives from the same detail, load and environment as the design case.
 */
export function evaluateEvidence(input: EvidenceInput, designLife_cycles: number, scatterFactor: number): EvidenceResult {
  validate(input, designLife_cycles, scatterFactor);
  const n = input.lives_cycles.length;
  const said: Said = { steps: [], warnings: [] };
  const { logMean, sampleStdDev } = logStatistics(input.lives_cycles, said);
  const spread = spreadAndFactor(input, n, sampleStdDev, said);
  const requiredLogStdDev = largestSpread(logMean, designLife_cycles, spread, said);
  const common = {
    n,
    logMean,
    logStdDev: spread.logStdDev,
    logStdDevFrom: spread.logStdDevFrom,
    toleranceFactor: spread.k,
    requiredLogStdDev,
  };

  if (spread.logStdDev === null) {
    // A single article without an assumed spread: the bound is refused, and the warning says what would carry it.
    const reach =
      requiredLogStdDev !== null
        ? ` The design life would be supported if the log10 standard deviation were no more than ${fmt(requiredLogStdDev)}.`
        : "";
    said.warnings.push(
      "A single tested article says nothing about the spread of lives across a fleet, so no lower bound is given. " +
        "Give an assumed log standard deviation from wider experience, or test more articles." +
        reach,
    );
    return { ...common, lowerBound_cycles: null, impliedScatterFactor: null, supportsDesignLife: null, ...said };
  }
  const bound = boundAndComparisons(input, logMean, { ...spread, logStdDev: spread.logStdDev }, designLife_cycles, scatterFactor, said);
  return { ...common, ...bound, supportsDesignLife: bound.lowerBound_cycles >= designLife_cycles, ...said };
}
