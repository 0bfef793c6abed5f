/**
 * Stress-range S-N curves for welded details in the style of EN 1993-1-9 (§7.1, Figure 7.1).
 *
 * A detail category Δσ_C is the stress range (MPa) at N_C = 2·10⁶ cycles. The curve is
 *   Δσ^3 · N = Δσ_C^3 · 2·10⁶              for N ≤ 5·10⁶ (slope m = 3),
 *   Δσ_D = (2/5)^(1/3) · Δσ_C ≈ 0.737·Δσ_C  the constant-amplitude fatigue limit at 5·10⁶,
 *   Δσ^5 · N = Δσ_D^5 · 5·10⁶              from 5·10⁶ to 10⁸ (slope m = 5, spectra only),
 *   Δσ_L = (5/100)^(1/5) · Δσ_D ≈ 0.549·Δσ_D ≈ 0.405·Δσ_C  the cut-off at 10⁸.
 * Under constant amplitude, ranges below Δσ_D do no damage; in a spectrum, ranges between
 * Δσ_L and Δσ_D follow the m = 5 branch and ranges below Δσ_L do none.
 * The partial factor γ_Mf divides the resistance (EN 1993-1-9 §8; Table 3.1 recommends
 * values from 1.0 to 1.35 by consequence of failure and assessment method); here it scales
 * the applied range up by γ_Mf, which is the same thing.
 *
 * No mean-stress correction: as-welded joints hold tensile residual stresses near yield, so
 * the local cycle swings from near yield whatever the applied mean, and the stress range alone
 * governs (EN 1993-1-9 §7.2.1 allows a reduced compressive part only for non-welded or
 * stress-relieved details; from memory).
 */
import { InputError } from "./errors.ts";
import { fmt, step, type Step } from "./step.ts";
import { MPa, n, say, type Warning } from "./phrase.ts";

/** Detail categories (Δσ_C in MPa) of EN 1993-1-9 Figure 7.1. */
export const DETAIL_CATEGORIES_MPa = [36, 40, 45, 50, 56, 63, 71, 80, 90, 100, 112, 125, 140, 160] as const;

export const N_C = 2e6;
export const N_D = 5e6;
export const N_L = 1e8;

export type WeldRegime = "slope-3" | "slope-5" | "below-fatigue-limit" | "below-cut-off";

export interface WeldedOptions {
  /** True for a spectrum (rainflow-counted or block loading): the m = 5 branch and the cut-off apply. */
  variableAmplitude: boolean;
  /** Partial factor for fatigue strength γ_Mf; default 1.0. */
  gammaMf?: number;
}

export interface WeldedResult {
  /** null where the life is unlimited. */
  life_cycles: number | null;
  regime: WeldRegime;
  /** Δσ_D and Δσ_L of the category, after γ_Mf. */
  fatigueLimit_MPa: number;
  cutOff_MPa: number;
  steps: Step[];
  warnings: Warning[];
}

const EN1993 = "EN 1993-1-9 §7.1, Figure 7.1 (fatigue strength curves for direct stress ranges)";

/** Δσ_D and Δσ_L of a category Δσ_C (MPa), from the definitions in EN 1993-1-9 §7.1. */
export function weldedLimits(category_MPa: number): { fatigueLimit_MPa: number; cutOff_MPa: number } {
  const fatigueLimit_MPa = Math.cbrt(N_C / N_D) * category_MPa;
  const cutOff_MPa = (N_D / N_L) ** (1 / 5) * fatigueLimit_MPa;
  return { fatigueLimit_MPa, cutOff_MPa };
}

/**
 * Life of a welded detail at a nominal stress range. Units: MPa, cycles.
 * Validity: nominal stress ranges on details classified to EN 1993-1-9 Tables 8.1–8.10;
 * steel in normal atmosphere below 150 °C.
 */
export function weldedLife(range_MPa: number, category_MPa: number, options: WeldedOptions): WeldedResult {
  const gammaMf = options.gammaMf ?? 1;
  if (!(Number.isFinite(range_MPa) && range_MPa >= 0)) {
    throw new InputError("pressure", "The stress range at the weld must be zero or positive.");
  }
  if (!(Number.isFinite(category_MPa) && category_MPa > 0)) {
    throw new InputError("fatigue.detailCategory_MPa", "The detail category must be a positive stress range in MPa, e.g. 71.");
  }
  if (!(Number.isFinite(gammaMf) && gammaMf >= 1)) {
    throw new InputError("fatigue.gammaMf", "The partial factor γ_Mf must be 1.0 or more (EN 1993-1-9 Table 3.1 gives 1.0 to 1.35).");
  }
  const warnings: Warning[] = [];
  if (!(DETAIL_CATEGORIES_MPa as readonly number[]).includes(category_MPa)) {
    warnings.push(
      say`${MPa(category_MPa)} is not one of the EN 1993-1-9 detail categories (${DETAIL_CATEGORIES_MPa.join(", ")}); check the classification.`,
    );
  }
  if (gammaMf > 1.35) {
    warnings.push(say`γ_Mf = ${n(gammaMf)} is above the 1.35 that EN 1993-1-9 Table 3.1 recommends at most; check the value.`);
  }
  const limits = weldedLimits(category_MPa);
  const fatigueLimit_MPa = limits.fatigueLimit_MPa / gammaMf;
  const cutOff_MPa = limits.cutOff_MPa / gammaMf;
  const design = category_MPa / gammaMf;
  const steps: Step[] = [
    step(
      "welded-fatigue-limit",
      "Constant-amplitude fatigue limit of the detail (design value, after γ_Mf)",
      "Δσ_D,d = (2/5)^(1/3)·Δσ_C / γ_Mf",
      `Δσ_D,d = 0.7368 × ${fmt(category_MPa)} / ${fmt(gammaMf)}`,
      fatigueLimit_MPa,
      "MPa",
      EN1993,
    ),
  ];
  if (options.variableAmplitude) {
    steps.push(
      step(
        "welded-cut-off",
        "Cut-off limit of the detail (design value, after γ_Mf)",
        "Δσ_L,d = (5/100)^(1/5)·Δσ_D,d",
        `Δσ_L,d = 0.5493 × ${fmt(fatigueLimit_MPa)}`,
        cutOff_MPa,
        "MPa",
        EN1993,
      ),
    );
  }

  let life_cycles: number | null;
  let regime: WeldRegime;
  if (range_MPa >= fatigueLimit_MPa && range_MPa > 0) {
    regime = "slope-3";
    life_cycles = N_C * (design / range_MPa) ** 3;
    steps.push(
      step(
        "welded-life",
        "Life of the welded detail (slope 3)",
        "N = 2·10⁶ · (Δσ_C/(γ_Mf·Δσ))³",
        `N = 2×10^6 × (${fmt(category_MPa)} / (${fmt(gammaMf)} × ${fmt(range_MPa)}))³`,
        life_cycles,
        "cycles",
        EN1993,
      ),
    );
  } else if (options.variableAmplitude && range_MPa >= cutOff_MPa && range_MPa > 0) {
    regime = "slope-5";
    life_cycles = N_D * (fatigueLimit_MPa / range_MPa) ** 5;
    steps.push(
      step(
        "welded-life",
        "Life of the welded detail (slope 5, spectrum loading)",
        "N = 5·10⁶ · (Δσ_D,d/Δσ)⁵",
        `N = 5×10^6 × (${fmt(fatigueLimit_MPa)} / ${fmt(range_MPa)})⁵`,
        life_cycles,
        "cycles",
        EN1993,
      ),
    );
  } else {
    regime = options.variableAmplitude ? "below-cut-off" : "below-fatigue-limit";
    life_cycles = null;
    steps.push(
      step(
        "welded-life",
        options.variableAmplitude
          ? "Range below the cut-off limit: no damage"
          : "Range below the constant-amplitude fatigue limit: unlimited life",
        options.variableAmplitude ? "Δσ < Δσ_L,d" : "Δσ < Δσ_D,d",
        `${fmt(range_MPa)} < ${fmt(options.variableAmplitude ? cutOff_MPa : fatigueLimit_MPa)}`,
        null,
        "cycles",
        EN1993,
      ),
    );
  }
  return { life_cycles, regime, fatigueLimit_MPa, cutOff_MPa, steps, warnings };
}
