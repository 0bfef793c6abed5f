import type { MeanStressCriterion } from "../schema/check.ts";
import { fmt } from "./step.ts";

/**
 * Mean-stress criteria as an equivalent fully reversed amplitude σar: the amplitude that, applied
 * with zero mean, gives the same life as (σa, σm). Sources:
 *  Goodman, Gerber, Soderberg, ASME elliptic — Shigley's Mechanical Engineering Design, Table 6-6/6-7 and §6-12;
 *  Morrow, Smith–Watson–Topper, Walker — Dowling, Mechanical Behavior of Materials, §10.6.
 * For a compressive mean, the first four take σar = σa (Shigley §6-12: the compressive side is bounded by
 * σa = Se), which ignores the benefit; Morrow keeps its straight line; SWT and Walker need σmax > 0.
 */
export interface Strengths {
  ultimate_MPa: number;
  yield_MPa: number;
  fatigueStrengthCoefficient_MPa: number;
  walkerGamma: number;
}

export interface Equivalent {
  /** null when the criterion has no answer (the mean stress reaches the strength it uses). */
  sigmaAr: number | null;
  /** Zero damage: no tension in the cycle (SWT, Walker). */
  noDamage: boolean;
  reason?: string;
}

export const CRITERION_LABEL: Record<MeanStressCriterion, string> = {
  goodman: "Goodman",
  gerber: "Gerber",
  soderberg: "Soderberg",
  "asme-elliptic": "ASME elliptic",
  swt: "Smith–Watson–Topper",
  morrow: "Morrow",
  walker: "Walker",
};

export const CRITERION_SOURCE: Record<MeanStressCriterion, string> = {
  goodman: "Shigley's Mechanical Engineering Design, Table 6-6 (modified Goodman)",
  gerber: "Shigley's Mechanical Engineering Design, Table 6-7 (Gerber)",
  soderberg: "Shigley's Mechanical Engineering Design, §6-12 (Soderberg line)",
  "asme-elliptic": "Shigley's Mechanical Engineering Design, Table 6-8 (ASME elliptic)",
  swt: "Dowling, Mechanical Behavior of Materials, §10.6 (Smith, Watson and Topper 1970)",
  morrow: "Dowling, Mechanical Behavior of Materials, §10.6 (Morrow)",
  walker: "Dowling, Mechanical Behavior of Materials, §10.6 (Walker 1970)",
};

/** The equivalent amplitude alone: numbers only, as solvers call it for every counted cycle. */
export function equivalentAmplitude(c: MeanStressCriterion, amplitude: number, mean: number, s: Strengths): Equivalent {
  const a = amplitude;
  const m = mean;
  const max = m + a;
  switch (c) {
    case "goodman":
      return m <= 0 ? reversed(a) : ratio(c, a, m, s.ultimate_MPa, "the ultimate strength", 1 - m / s.ultimate_MPa);
    case "gerber":
      return m <= 0 ? reversed(a) : ratio(c, a, m, s.ultimate_MPa, "the ultimate strength", 1 - (m / s.ultimate_MPa) ** 2);
    case "soderberg":
      return m <= 0 ? reversed(a) : ratio(c, a, m, s.yield_MPa, "the yield strength", 1 - m / s.yield_MPa);
    case "asme-elliptic":
      return m <= 0
        ? reversed(a)
        : ratio(c, a, m, s.yield_MPa, "the yield strength", m < s.yield_MPa ? Math.sqrt(1 - (m / s.yield_MPa) ** 2) : 0);
    case "morrow":
      return ratio(c, a, m, s.fatigueStrengthCoefficient_MPa, "σ'f", 1 - m / s.fatigueStrengthCoefficient_MPa);
    case "swt":
      return max <= 0 ? noTension(c) : { sigmaAr: Math.sqrt(max * a), noDamage: false };
    case "walker":
      return max <= 0 ? noTension(c) : { sigmaAr: max ** (1 - s.walkerGamma) * a ** s.walkerGamma, noDamage: false };
  }
}

/** Compressive mean under the Shigley four: no credit, σar = σa. */
function reversed(a: number): Equivalent {
  return { sigmaAr: a, noDamage: false };
}

/** σar = σa / denominator, or no answer once the mean reaches the strength the criterion uses. */
function ratio(c: MeanStressCriterion, a: number, m: number, limit: number, limitName: string, denominator: number): Equivalent {
  if (denominator > 0) return { sigmaAr: a / denominator, noDamage: false };
  return {
    sigmaAr: null,
    noDamage: false,
    reason: `the mean stress ${fmt(m)} MPa reaches ${limitName} (${fmt(limit)} MPa), beyond which ${CRITERION_LABEL[c]} has no answer`,
  };
}

function noTension(c: MeanStressCriterion): Equivalent {
  return { sigmaAr: 0, noDamage: true, reason: `the cycle never reaches tension, so ${CRITERION_LABEL[c]} predicts no fatigue damage` };
}

/** The criterion's equation in symbols and with the numbers put in, for the worked step. */
export function criterionWorking(
  c: MeanStressCriterion,
  amplitude: number,
  mean: number,
  s: Strengths,
): { equation: string; substituted: string } {
  const A = fmt(amplitude);
  const M = fmt(mean);
  const max = fmt(mean + amplitude);
  if (mean <= 0 && (c === "goodman" || c === "gerber" || c === "soderberg" || c === "asme-elliptic")) {
    return { equation: "σar = σa (compressive mean: no credit)", substituted: `σar = ${A}` };
  }
  const su = fmt(s.ultimate_MPa);
  const sy = fmt(s.yield_MPa);
  switch (c) {
    case "goodman":
      return { equation: "σar = σa/(1 − σm/Su)", substituted: `σar = ${A}/(1 − ${M}/${su})` };
    case "gerber":
      return { equation: "σar = σa/(1 − (σm/Su)²)", substituted: `σar = ${A}/(1 − (${M}/${su})²)` };
    case "soderberg":
      return { equation: "σar = σa/(1 − σm/Sy)", substituted: `σar = ${A}/(1 − ${M}/${sy})` };
    case "asme-elliptic":
      return { equation: "σar = σa/√(1 − (σm/Sy)²)", substituted: `σar = ${A}/√(1 − (${M}/${sy})²)` };
    case "morrow":
      return { equation: "σar = σa/(1 − σm/σ'f)", substituted: `σar = ${A}/(1 − ${M}/${fmt(s.fatigueStrengthCoefficient_MPa)})` };
    case "swt":
      return { equation: "σar = √(σmax·σa)", substituted: `σar = √(${max} × ${A})` };
    case "walker":
      return { equation: "σar = σmax^(1−γ)·σa^γ", substituted: `σar = ${max}^(1 − ${fmt(s.walkerGamma)}) × ${A}^${fmt(s.walkerGamma)}` };
  }
}
