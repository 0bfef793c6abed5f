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
  equation: string;
  substituted: string;
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

export function equivalentAmplitude(c: MeanStressCriterion, amplitude: number, mean: number, s: Strengths): Equivalent {
  const a = amplitude;
  const m = mean;
  const max = m + a;
  const A = fmt(a);
  const M = fmt(m);
  const divide = (limit: number, limitName: string, form: (x: number) => number, eq: string, sub: string): Equivalent => {
    if (m <= 0) return { sigmaAr: a, noDamage: false, equation: "σar = σa (compressive mean: no credit)", substituted: `σar = ${A}` };
    const d = form(m / limit);
    if (!(d > 0))
      return { sigmaAr: null, noDamage: false, equation: eq, substituted: sub, reason: `the mean stress ${M} MPa reaches ${limitName} (${fmt(limit)} MPa), beyond which ${CRITERION_LABEL[c]} has no answer` };
    return { sigmaAr: a / d, noDamage: false, equation: eq, substituted: sub };
  };
  switch (c) {
    case "goodman":
      return divide(s.ultimate_MPa, "the ultimate strength", (x) => 1 - x, "σar = σa/(1 − σm/Su)", `σar = ${A}/(1 − ${M}/${fmt(s.ultimate_MPa)})`);
    case "gerber":
      return divide(s.ultimate_MPa, "the ultimate strength", (x) => 1 - x * x, "σar = σa/(1 − (σm/Su)²)", `σar = ${A}/(1 − (${M}/${fmt(s.ultimate_MPa)})²)`);
    case "soderberg":
      return divide(s.yield_MPa, "the yield strength", (x) => 1 - x, "σar = σa/(1 − σm/Sy)", `σar = ${A}/(1 − ${M}/${fmt(s.yield_MPa)})`);
    case "asme-elliptic":
      return divide(s.yield_MPa, "the yield strength", (x) => Math.sqrt(Math.max(0, 1 - x * x)), "σar = σa/√(1 − (σm/Sy)²)", `σar = ${A}/√(1 − (${M}/${fmt(s.yield_MPa)})²)`);
    case "morrow": {
      const f = s.fatigueStrengthCoefficient_MPa;
      const eq = "σar = σa/(1 − σm/σ'f)";
      const sub = `σar = ${A}/(1 − ${M}/${fmt(f)})`;
      if (m >= f) return { sigmaAr: null, noDamage: false, equation: eq, substituted: sub, reason: `the mean stress ${M} MPa reaches σ'f (${fmt(f)} MPa), beyond which Morrow has no answer` };
      return { sigmaAr: a / (1 - m / f), noDamage: false, equation: eq, substituted: sub };
    }
    case "swt": {
      const eq = "σar = √(σmax·σa)";
      const sub = `σar = √(${fmt(max)} × ${A})`;
      if (max <= 0) return { sigmaAr: 0, noDamage: true, equation: eq, substituted: sub, reason: "the cycle never reaches tension, so SWT predicts no fatigue damage" };
      return { sigmaAr: Math.sqrt(max * a), noDamage: false, equation: eq, substituted: sub };
    }
    case "walker": {
      const g = s.walkerGamma;
      const eq = "σar = σmax^(1−γ)·σa^γ";
      const sub = `σar = ${fmt(max)}^(1 − ${fmt(g)}) × ${A}^${fmt(g)}`;
      if (max <= 0) return { sigmaAr: 0, noDamage: true, equation: eq, substituted: sub, reason: "the cycle never reaches tension, so Walker predicts no fatigue damage" };
      return { sigmaAr: max ** (1 - g) * a ** g, noDamage: false, equation: eq, substituted: sub };
    }
  }
}
