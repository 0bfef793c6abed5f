import type { SurfaceFinish } from "../schema/check.ts";
import { fmt, step, type Step } from "./step.ts";

/**
 * Basquin's stress-life curve σar = σ'f·(2N)^b (Basquin 1910; Dowling, Mechanical Behavior of Materials, eq. 9.7),
 * solved for N = ½·(σar/σ'f)^(1/b). At or below the endurance limit the life is unlimited.
 * Modifying (Marin) factors, Shigley's Mechanical Engineering Design §6-9: surface ka = a·Su^b (Table 6-2),
 * size kb (eq. 6-20), reliability ke (Table 6-5). They are applied here as a factor on the strength at every
 * life (the whole curve shifts down), which is conservative at short lives where Shigley applies them only
 * at the endurance end.
 */
export interface Curve {
  coefficient_MPa: number;
  exponent: number;
  enduranceLimit_MPa?: number;
  /** Product of the modifying factors, 1 when none are chosen. */
  factor: number;
}

/** Lives outside this range are outside typical stress-life data (common practice: 10³ to 10⁷ cycles). */
export const VALID_LIFE: readonly [number, number] = [1e3, 1e7];

export function basquinLife(sigmaAr: number, c: Curve): number | null {
  if (sigmaAr <= 0) return null;
  if (c.enduranceLimit_MPa !== undefined && sigmaAr <= c.enduranceLimit_MPa * c.factor) return null;
  const life = 0.5 * (sigmaAr / (c.coefficient_MPa * c.factor)) ** (1 / c.exponent);
  // Past the largest double the life is unlimited for any purpose; Infinity would reach JSON as null unexplained.
  return Number.isFinite(life) ? life : null;
}

/** Amplitude the curve allows at N cycles (inverse of basquinLife, ignoring the endurance limit). */
export function basquinAmplitude(life_cycles: number, c: Curve): number {
  return c.coefficient_MPa * c.factor * (2 * life_cycles) ** c.exponent;
}

const SURFACE: Record<SurfaceFinish, [number, number]> = {
  ground: [1.58, -0.085],
  machined: [4.51, -0.265],
  "hot-rolled": [57.7, -0.718],
  "as-forged": [272, -0.995],
};

/** Shigley Table 6-5: reliability factor ke = 1 − 0.08·za. */
export function reliabilityFactor(reliability: number, za: number): number {
  return reliability <= 0.5 ? 1 : 1 - 0.08 * za;
}

export interface Modifiers {
  surface?: SurfaceFinish;
  reliability?: number;
  sizeDiameter_mm?: number;
}

export function modifyingFactors(
  mods: Modifiers | undefined,
  ultimate_MPa: number,
  normalQuantile: (p: number) => number,
): { factor: number; steps: Step[]; warnings: string[] } {
  const steps: Step[] = [];
  const warnings: string[] = [];
  let factor = 1;
  if (!mods) return { factor, steps, warnings };
  if (mods.surface) {
    const [a, b] = SURFACE[mods.surface];
    const ka = Math.min(1, a * ultimate_MPa ** b);
    factor *= ka;
    steps.push(
      step(
        "marin-ka",
        `Surface factor (${mods.surface})`,
        "ka = a·Su^b",
        `ka = ${fmt(a)} × ${fmt(ultimate_MPa)}^(${fmt(b)})`,
        ka,
        "—",
        "Shigley's Mechanical Engineering Design, eq. 6-19 and Table 6-2",
      ),
    );
  }
  if (mods.sizeDiameter_mm !== undefined) {
    const d = mods.sizeDiameter_mm;
    const kb = d <= 51 ? (d / 7.62) ** -0.107 : 1.51 * d ** -0.157;
    factor *= kb;
    steps.push(
      step(
        "marin-kb",
        "Size factor",
        d <= 51 ? "kb = (d/7.62)^−0.107" : "kb = 1.51·d^−0.157",
        d <= 51 ? `kb = (${fmt(d)}/7.62)^(−0.107)` : `kb = 1.51 × ${fmt(d)}^(−0.157)`,
        kb,
        "—",
        "Shigley's Mechanical Engineering Design, eq. 6-20",
      ),
    );
    warnings.push(
      "a size factor was applied although membrane loading is axial, for which Shigley takes kb = 1; it is kept because it was asked for",
    );
  }
  if (mods.reliability !== undefined) {
    const za = normalQuantile(mods.reliability);
    const ke = reliabilityFactor(mods.reliability, za);
    factor *= ke;
    steps.push(
      step(
        "marin-ke",
        `Reliability factor (${fmt(mods.reliability * 100)} %)`,
        "ke = 1 − 0.08·za",
        `ke = 1 − 0.08 × ${fmt(za)}`,
        ke,
        "—",
        "Shigley's Mechanical Engineering Design, Table 6-5 (8 % coefficient of variation)",
      ),
    );
  }
  steps.push(
    step(
      "marin",
      "Product of the modifying factors",
      "k = ka·kb·ke",
      `k = ${steps.map((s) => fmt(s.value ?? 1)).join(" × ")}`,
      factor,
      "—",
      "Shigley's Mechanical Engineering Design, eq. 6-18 (Marin)",
    ),
  );
  return { factor, steps, warnings };
}

export function lifeStep(sigmaAr: number, c: Curve, life: number | null): Step {
  const src = "Basquin; Dowling, Mechanical Behavior of Materials, eq. 9.7";
  const coeff = c.factor === 1 ? fmt(c.coefficient_MPa) : `(${fmt(c.factor)} × ${fmt(c.coefficient_MPa)})`;
  if (life === null) {
    return step(
      "life",
      "Fatigue life",
      "σar ≤ k·Se ⇒ unlimited",
      `${fmt(sigmaAr)} ≤ ${fmt((c.enduranceLimit_MPa ?? 0) * c.factor)} ⇒ unlimited`,
      null,
      "cycles",
      src,
    );
  }
  return step(
    "life",
    "Fatigue life from the Basquin curve",
    "N = ½·(σar/(k·σ'f))^(1/b)",
    `N = ½ × (${fmt(sigmaAr)}/${coeff})^(1/${fmt(c.exponent)})`,
    life,
    "cycles",
    src,
  );
}
