/**
 * Equivalent stress range of a cycle between two states of principal stresses whose directions do
 * not turn (pressure loading of a shell: hoop, axial and radial stay principal).
 *
 * The range of each principal stress is Δσᵢ = σᵢ(t₁) − σᵢ(t₂). The equivalent range is
 *  - Tresca of the ranges: Δσ_eq = max(|Δσ₁ − Δσ₂|, |Δσ₂ − Δσ₃|, |Δσ₃ − Δσ₁|)
 *    (EN 13445-3 §18, equivalent stress range for fixed principal directions, from memory);
 *  - von Mises of the ranges: Δσ_eq = √(½[(Δσ₁ − Δσ₂)² + (Δσ₂ − Δσ₃)² + (Δσ₃ − Δσ₁)²])
 *    (ASME VIII-2 §5.5.3 elastic fatigue analysis, from memory).
 * Tresca is never below von Mises (the ratio lies between 1 and 2/√3 ≈ 1.155), so it is the
 * conservative choice and the default here.
 *
 * The mean of the cycle is combined the same way from the mean of each principal stress, as Shigley
 * does for combined loading (equivalent of the amplitudes, equivalent of the means; Shigley's
 * Mechanical Engineering Design §6-14). An equivalent mean has no sign, so a compressive mean counts
 * as tensile: conservative, since compression would lower the equivalent amplitude.
 * Units: MPa in, MPa out.
 */
export type Principal = readonly [number, number, number];
export type EquivalentMethod = "tresca" | "von-mises";

export const EQUIVALENT_SOURCE: Record<EquivalentMethod, string> = {
  tresca: "Tresca of the principal stress ranges, EN 13445-3 §18 (from memory): conservative, never below von Mises",
  "von-mises": "von Mises of the principal stress ranges, ASME VIII-2 §5.5.3 (from memory)",
};

/** Tresca or von Mises equivalent of a set of principal stresses (or of their ranges). */
export function equivalentOf(s: Principal, method: EquivalentMethod = "tresca"): number {
  const d12 = s[0] - s[1];
  const d23 = s[1] - s[2];
  const d31 = s[2] - s[0];
  if (method === "tresca") return Math.max(Math.abs(d12), Math.abs(d23), Math.abs(d31));
  return Math.sqrt(0.5 * (d12 * d12 + d23 * d23 + d31 * d31));
}

/** Equivalent range between two states: the equivalent of the component ranges. */
export function equivalentRange(a: Principal, b: Principal, method: EquivalentMethod = "tresca"): number {
  return equivalentOf([a[0] - b[0], a[1] - b[1], a[2] - b[2]], method);
}

/** Equivalent amplitude and mean of the cycle between two states (see the module comment). */
export function equivalentCycle(
  a: Principal,
  b: Principal,
  method: EquivalentMethod = "tresca",
): { amplitude_MPa: number; mean_MPa: number; range_MPa: number } {
  const range_MPa = equivalentRange(a, b, method);
  const mean_MPa = equivalentOf([(a[0] + b[0]) / 2, (a[1] + b[1]) / 2, (a[2] + b[2]) / 2], method);
  return { amplitude_MPa: range_MPa / 2, mean_MPa, range_MPa };
}
