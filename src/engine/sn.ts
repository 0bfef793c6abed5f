/**
 * @module engine/sn
 * Basquin's stress-life curve σar = σ'f·(2N)^b (Basquin 1910; Dowling, Mechanical Behavior of Materials, eq. 9.7),
 * solved for N = ½·(σar/σ'f)^(1/b). At or below the endurance limit the life is unlimited.
 * Modifying (Marin) factors, Shigley's Mechanical Engineering Design §6-9: surface ka = a·Su^b (Table 6-2),
 * size kb (eq. 6-20), reliability ke (Table 6-5). They are applied here as a factor on the strength at every
 * life (the whole curve shifts down), which is conservative at short lives where Shigley applies them only
 * at the endurance end.
 */
import type { MaterialFamily, SurfaceFinish } from "../schema/check.ts";
import { fmt, step, type Step } from "./step.ts";
import { MPa, say, type Warning } from "./phrase.ts";

export interface Curve {
  coefficient_MPa: number;
  exponent: number;
  enduranceLimit_MPa?: number;
  /** Product of the modifying factors, 1 when none are chosen. */
  factor: number;
  /**
   * Below the endurance limit in a spectrum: "haibach" continues the curve with slope 2m − 1
   * (m = −1/b), "elementary" continues it with slope m (elementary Miner). Constant amplitude
   * below the limit stays unlimited whichever is chosen.
   */
  belowLimit?: BelowLimit;
}

export type BelowLimit = "haibach" | "elementary";

export const BELOW_LIMIT_SOURCE: Record<BelowLimit, string> = {
  haibach:
    "Haibach's extension of the S-N curve below the endurance limit with slope 2m − 1 (Haibach 1970; as in EN 1993-1-9's slope 5 after slope 3, and the FKM guideline; from memory)",
  elementary: "elementary Miner: the S-N curve continued below the endurance limit with its own slope (Dowling §9.6, from memory)",
};

/** The knee: where the curve meets the endurance limit. Steels: 10⁶ cycles (Shigley §6-7). */
export const KNEE_CYCLES = 1e6;

/** Lives outside this range are outside typical stress-life data (common practice: 10³ to 10⁷ cycles). */
export const VALID_LIFE: readonly [number, number] = [1e3, 1e7];

/**
 * Cycles to failure at an equivalent fully reversed amplitude. At or below the endurance limit the life
 * is unlimited, unless `spectrum` is set and the curve says how to continue below it (Haibach or
 * elementary Miner), so that small cycles of a spectrum are not taken as harmless.
 */
export function basquinLife(sigmaAr: number, c: Curve, spectrum = false): number | null {
  if (sigmaAr <= 0) return null;
  const k = c.coefficient_MPa * c.factor;
  if (c.enduranceLimit_MPa !== undefined && sigmaAr <= c.enduranceLimit_MPa * c.factor) {
    if (!spectrum || c.belowLimit === undefined) return null;
    const se = c.enduranceLimit_MPa * c.factor;
    const kneeLife = 0.5 * (se / k) ** (1 / c.exponent);
    const m = -1 / c.exponent;
    const slope = c.belowLimit === "haibach" ? 2 * m - 1 : m;
    const life = kneeLife * (se / sigmaAr) ** slope;
    return Number.isFinite(life) ? life : null;
  }
  const life = 0.5 * (sigmaAr / k) ** (1 / c.exponent);
  // Past the largest double the life is unlimited for any purpose; Infinity would reach JSON as null unexplained.
  return Number.isFinite(life) ? life : null;
}

/**
 * The endurance limit in use: the given one (library or user), never above the curve at the knee.
 * A limit above the curve at 10⁶ cycles would declare unlimited every amplitude between the two,
 * where the curve itself gives a finite life, so it is brought down to the curve there and a warning
 * says so. Aluminium alloys have no endurance limit and titanium alloys no dependable one: a limit
 * given for them warns.
 */
export function enduranceLimitInUse(
  given: number | undefined,
  coefficient_MPa: number,
  exponent: number,
  family: MaterialFamily,
  fromLibrary: boolean,
): { value: number | undefined; steps: Step[]; warnings: Warning[] } {
  const steps: Step[] = [];
  const warnings: Warning[] = [];
  if (given === undefined || !Number.isFinite(coefficient_MPa) || !Number.isFinite(exponent)) return { value: given, steps, warnings };
  const atKnee = coefficient_MPa * (2 * KNEE_CYCLES) ** exponent;
  const value = Math.min(given, atKnee);
  steps.push(
    step(
      "endurance-knee",
      "Endurance limit, no higher than the curve at its knee (10⁶ cycles)",
      "Se = min(Se,given, σ'f·(2·10⁶)^b)",
      `Se = min(${fmt(given)}, ${fmt(coefficient_MPa)} × (2×10⁶)^(${fmt(exponent)}) = ${fmt(atKnee)})`,
      value,
      "MPa",
      "knee of the S-N curve of steels at 10⁶ cycles (Shigley's Mechanical Engineering Design §6-7); consistency of the limit with the curve",
    ),
  );
  if (given > atKnee * (1 + 1e-9))
    warnings.push(
      say`the ${fromLibrary ? "library's" : "given"} endurance limit (${MPa(given)}) lies above the material's own S-N curve at 10⁶ cycles (${MPa(atKnee)}): every amplitude between them would be called unlimited although the curve gives a finite life. The limit is taken as ${MPa(atKnee)}.`,
    );
  if (family === "aluminium")
    warnings.push(
      "an endurance limit was given for an aluminium alloy, but aluminium alloys have none: their S-N curves keep falling beyond 10⁷ cycles. Lives called unlimited here rest on that assumption; remove the limit for a conservative check.",
    );
  if (family === "titanium")
    warnings.push(
      "an endurance limit was given for a titanium alloy; titanium alloys show no dependable endurance limit (their curves flatten but keep falling, and surface and environment lower them). Lives called unlimited here rest on that assumption.",
    );
  return { value, steps, warnings };
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
  family: MaterialFamily = "steel",
  surfaceFrom?: string,
): { factor: number; steps: Step[]; warnings: Warning[] } {
  const steps: Step[] = [];
  const warnings: Warning[] = [];
  let factor = 1;
  if (!mods) return { factor, steps, warnings };
  const steelLike = family === "steel" || family === "stainless";
  if (!steelLike && (mods.surface !== undefined || mods.sizeDiameter_mm !== undefined))
    warnings.push(
      `the surface and size factors (Marin) are published for steels; for ${family === "other" ? "a material of unstated family" : `a ${family} alloy`} they are an assumption outside their data. They are applied (they lower the curve), but factors measured for this family should replace them.`,
    );
  if (mods.surface) {
    const [a, b] = SURFACE[mods.surface];
    const ka = Math.min(1, a * ultimate_MPa ** b);
    factor *= ka;
    steps.push(
      step(
        "marin-ka",
        `Surface factor (${mods.surface}${surfaceFrom ? `, ${surfaceFrom}` : ""})`,
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
