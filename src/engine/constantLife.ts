/**
 * Constant-life lines: the inverse of the mean-stress relations in meanStress.ts, σa(σm) for
 * σm ≥ 0 passing through σar at zero mean — what a Haigh diagram draws so the operating point
 * can be seen against every criterion at once. Kept beside the forward relations so the two
 * cannot drift apart (test/engine/constantLife.test.ts checks one against the other).
 * Relations as given in mechanical design and mechanical-behaviour texts (Shigley-style
 * design texts for Goodman, Gerber, Soderberg and ASME elliptic; Dowling for Morrow,
 * Smith–Watson–Topper and Walker).
 */
import { MEAN_STRESS_CRITERIA, type MeanStressCriterion } from "../schema/check.ts";

export type { MeanStressCriterion };

/** Drawing order: the format's list of criteria (the yield/ultimate lines first, then the σmax- and σ'f-based ones). */
export const ALL_CRITERIA: readonly MeanStressCriterion[] = MEAN_STRESS_CRITERIA;

export interface LineMaterial {
  /** σar: the fully reversed amplitude for the life being drawn, MPa. */
  equivalentAmplitude: number;
  ultimate: number;
  yield: number;
  fatigueStrengthCoefficient: number;
  walkerGamma?: number;
}

/** Where the line meets σa = 0, or Infinity when it never does (SWT, Walker, Morrow beyond σ'f). */
export function zeroAmplitudeMean(c: MeanStressCriterion, m: LineMaterial): number {
  switch (c) {
    case "goodman":
    case "gerber":
      return m.ultimate;
    case "soderberg":
    case "asme-elliptic":
      return m.yield;
    case "morrow":
      return m.fatigueStrengthCoefficient;
    case "swt":
    case "walker":
      return Infinity;
  }
}

/** σa on the constant-life line at mean stress σm ≥ 0; NaN outside the line's reach. */
export function amplitudeOnLine(c: MeanStressCriterion, sm: number, m: LineMaterial): number {
  const sar = m.equivalentAmplitude;
  switch (c) {
    case "goodman":
      return sar * (1 - sm / m.ultimate);
    case "gerber":
      return sar * (1 - (sm / m.ultimate) ** 2);
    case "soderberg":
      return sar * (1 - sm / m.yield);
    case "asme-elliptic":
      return sm <= m.yield ? sar * Math.sqrt(1 - (sm / m.yield) ** 2) : NaN;
    case "morrow":
      return sar * (1 - sm / m.fatigueStrengthCoefficient);
    case "swt":
      // σa(σa + σm) = σar², the positive root.
      return (-sm + Math.sqrt(sm * sm + 4 * sar * sar)) / 2;
    case "walker":
      return walkerAmplitude(sm, sar, m.walkerGamma);
  }
}

/**
 * Walker: σmax^(1−γ)·σa^γ = σar with σmax = σm + σa. The left side rises with σa for
 * σm ≥ 0 and equals σar somewhere in (0, σar], so bisection always converges.
 */
function walkerAmplitude(sm: number, sar: number, gamma: number | undefined): number {
  if (gamma === undefined || !Number.isFinite(gamma) || gamma <= 0 || gamma > 1 || sm < 0 || !(sar > 0)) return NaN;
  const f = (sa: number) => (sm + sa) ** (1 - gamma) * sa ** gamma - sar;
  let lo = 0;
  let hi = sar;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (f(mid) > 0) hi = mid;
    else lo = mid;
  }
  return (lo + hi) / 2;
}
