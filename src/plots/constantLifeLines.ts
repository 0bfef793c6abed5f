/**
 * The constant-life lines a Haigh diagram draws, as σa(σm) for σm ≥ 0, each passing
 * through σar at zero mean. Drawing geometry only: the engine's mean-stress module is
 * what turns a load into an equivalent amplitude; these reproduce the same relations so
 * the operating point can be seen against every criterion at once.
 * Relations as given in mechanical design and mechanical-behaviour texts (Shigley-style
 * design texts for Goodman, Gerber, Soderberg and ASME elliptic; Dowling for Morrow,
 * Smith–Watson–Topper and Walker).
 */
import { isFiniteNumber } from "./format.ts";

export type MeanStressCriterion = "goodman" | "gerber" | "soderberg" | "asme-elliptic" | "swt" | "morrow" | "walker";

export const ALL_CRITERIA: readonly MeanStressCriterion[] = ["goodman", "gerber", "soderberg", "asme-elliptic", "morrow", "swt", "walker"];

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
  if (!isFiniteNumber(gamma) || gamma <= 0 || gamma > 1 || sm < 0 || !(sar > 0)) return NaN;
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
