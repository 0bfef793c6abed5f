/**
 * @module engine/notch
 * Notch sensitivity and fatigue notch factor, Kf = 1 + q·(Kt − 1) (Peterson; Shigley eq. 6-32).
 * Peterson: q = 1/(1 + α/ρ); α = 0.0254·(2070/Su)^1.8 mm for steels (Su in MPa, Su ≥ 550 MPa in the source's
 * range) and α = 0.51 mm for aluminium alloys (Dowling, Mechanical Behavior of Materials, §10.3, eqs. 10.8–10.9).
 * Neuber: q = 1/(1 + √a/√ρ); √a = 0.246 − 3.08×10⁻³·Su + 1.51×10⁻⁵·Su² − 2.67×10⁻⁸·Su³ (Su in kpsi, √a in √in)
 * for steels in bending or axial load (Shigley's Mechanical Engineering Design, eq. 6-35a), 50 ≤ Su ≤ 250 kpsi.
 */
import type { MaterialFamily } from "../schema/check.ts";
import { fmt, step, type Step } from "./step.ts";
import { MPa, say, type Warning } from "./phrase.ts";

export function petersonAlpha_mm(family: MaterialFamily, ultimate_MPa: number): number {
  return family === "aluminium" ? 0.51 : 0.0254 * (2070 / ultimate_MPa) ** 1.8;
}

export function neuberSqrtA_sqrtMm(ultimate_MPa: number): number {
  const su = ultimate_MPa / 6.894757;
  const sqrtA_in = 0.246 - 3.08e-3 * su + 1.51e-5 * su ** 2 - 2.67e-8 * su ** 3;
  return sqrtA_in * Math.sqrt(25.4);
}

export interface NotchFactor {
  q: number;
  kf: number;
  steps: Step[];
  warnings: Warning[];
}

export interface NotchOptions {
  q?: number;
  constant?: "peterson" | "neuber";
  rootRadius_mm?: number;
  family: MaterialFamily;
  ultimate_MPa: number;
}

/** Kf = 1 + q·(Kt − 1), with q given, worked from a root radius, or 1. */
export function notchFactor(kt: number, opts: NotchOptions): NotchFactor {
  const s = notchSensitivity(opts);
  return { q: s.q, kf: 1 + s.q * (kt - 1), steps: [...s.steps, kfStep(kt, s.q)], warnings: s.warnings };
}

/** The worked Kf line. */
export function kfStep(kt: number, q: number): Step {
  return step(
    "kf",
    "Fatigue notch factor",
    "Kf = 1 + q·(Kt − 1)",
    `Kf = 1 + ${fmt(q)} × (${fmt(kt)} − 1)`,
    1 + q * (kt - 1),
    "—",
    "Peterson; Shigley's Mechanical Engineering Design, eq. 6-32",
  );
}

/** Notch sensitivity q: given, from Peterson's or Neuber's constant and the root radius, or 1 (Kf = Kt, conservative). */
export function notchSensitivity(opts: NotchOptions): { q: number; steps: Step[]; warnings: Warning[] } {
  const steps: Step[] = [];
  const warnings: Warning[] = [];
  let q = opts.q ?? 1;
  if (opts.q === undefined && opts.constant && opts.rootRadius_mm !== undefined) {
    const rho = opts.rootRadius_mm;
    if (opts.constant === "peterson") {
      const alpha = petersonAlpha_mm(opts.family, opts.ultimate_MPa);
      if (opts.family !== "aluminium") {
        steps.push(
          step(
            "notch-alpha",
            "Peterson's material constant (steels)",
            "α = 0.0254·(2070/Su)^1.8",
            `α = 0.0254 × (2070/${fmt(opts.ultimate_MPa)})^1.8`,
            alpha,
            "mm",
            "Dowling, Mechanical Behavior of Materials, eq. 10.9 (from memory)",
          ),
        );
        if (opts.ultimate_MPa < 550)
          warnings.push(
            say`Peterson's constant for steels is fitted for ultimate strengths above about ${MPa(550)}; below that q is an extrapolation`,
          );
      } else {
        steps.push(
          step(
            "notch-alpha",
            "Peterson's material constant (aluminium alloys)",
            "α = 0.51 mm",
            "α = 0.51",
            alpha,
            "mm",
            "Dowling, Mechanical Behavior of Materials, §10.3 (from memory)",
          ),
        );
      }
      q = 1 / (1 + alpha / rho);
      steps.push(
        step(
          "notch-q",
          "Notch sensitivity (Peterson)",
          "q = 1/(1 + α/ρ)",
          `q = 1/(1 + ${fmt(alpha)}/${fmt(rho)})`,
          q,
          "—",
          "Peterson; Dowling eq. 10.8",
        ),
      );
    } else {
      const sqrtA = neuberSqrtA_sqrtMm(opts.ultimate_MPa);
      const suK = opts.ultimate_MPa / 6.894757;
      if (suK < 50 || suK > 250)
        warnings.push("Neuber's constant is fitted for ultimate strengths of 50–250 kpsi (345–1720 MPa); this material lies outside");
      steps.push(
        step(
          "notch-sqrta",
          "Neuber's constant (steels)",
          "√a = 0.246 − 3.08×10⁻³Su + 1.51×10⁻⁵Su² − 2.67×10⁻⁸Su³  (Su in kpsi, √in)",
          `√a = (0.246 − 3.08×10⁻³ × ${fmt(suK)} + …) × √25.4`,
          sqrtA,
          "√mm",
          "Shigley's Mechanical Engineering Design, eq. 6-35a",
        ),
      );
      q = 1 / (1 + sqrtA / Math.sqrt(rho));
      steps.push(
        step(
          "notch-q",
          "Notch sensitivity (Neuber)",
          "q = 1/(1 + √a/√ρ)",
          `q = 1/(1 + ${fmt(sqrtA)}/√${fmt(rho)})`,
          q,
          "—",
          "Shigley's Mechanical Engineering Design, eq. 6-34",
        ),
      );
    }
  }
  return { q, steps, warnings };
}
