/**
 * Fatigue screening the way the vessel code frames it (EN 13445-3 clause 18, the detailed
 * assessment, applied to the membrane and opening stresses this tool works out).
 *
 * - Equivalent stress range: Tresca, the largest difference of the principal stress ranges at the
 *   inner surface (σθ, σx, σr = −p); at the edge of an opening the stress along the edge alone.
 *   It is worked by src/engine/equivalent.ts at every point of the opening's field (§18.6, from memory).
 * - Plasticity correction when the range exceeds twice the yield strength:
 *   ke = 1 + A0·(Δσ/(2·Rp0.2) − 1), A0 = 0.5 for ferritic steels with Rm ≤ 500 MPa and for
 *   austenitic steels, 0.4 + Rm/1250 for 500 < Rm ≤ 800 MPa, 1.0 for 800 < Rm ≤ 1000 MPa
 *   (§18.8.1, from memory).
 * - Welded details: class Δσ_R at 2·10⁶ cycles; slope 3 to 5·10⁶ cycles (the constant-amplitude
 *   endurance limit), slope 5 to the cut-off at 10⁸ cycles for a spectrum (§18.10.5, from memory);
 *   thickness correction f_ew = (25/e)^0.25 for 25 < e ≤ 150 mm (§18.10.6.2); no mean-stress
 *   correction for as-welded joints (§18.10.4: the residual stress is taken at yield).
 * - Unwelded parts: Δσ_R = 46 000/√N + 0.63·Rm + 11.5 for N ≤ 2·10⁶ (§18.11.2, from memory),
 *   with the surface factor f_s = F_s^(0.1·ln N − 0.465), F_s = 1 − 0.056(ln Rz)^0.64·ln Rm
 *   + 0.289(ln Rz)^0.53, the thickness factor f_ee = (25/e)^0.182 for 25 < e ≤ 150 mm, and the
 *   mean-stress factor f_m with M = 0.00035·Rm − 0.1 (§18.11.3, from memory).
 * - Temperature correction for T* above 100 °C: f_T = 1.03 − 1.5·10⁻⁴T* − 1.5·10⁻⁶T*² (ferritic),
 *   1.043 − 4.3·10⁻⁴T* (austenitic) (§18.10.6.3, from memory).
 * Units: MPa, mm, °C, cycles.
 */
import type { MaterialFamily } from "../../schema/check.ts";
import { EQUIVALENT_SOURCE } from "../equivalent.ts";
import { fmt, step, type Step } from "../step.ts";
import { MPa, mm, n, say, type Warning } from "../phrase.ts";
import { weldedLife } from "../welded.ts";

export const EN13445_18 = "EN 13445-3 clause 18";

export function plasticityA0(family: MaterialFamily, ultimate_MPa: number): { A0: number; why: string; outside: boolean } {
  if (family === "stainless") return { A0: 0.5, why: "A0 = 0.5 for austenitic steels", outside: false };
  if (ultimate_MPa <= 500) return { A0: 0.5, why: "A0 = 0.5 for ferritic steels with Rm ≤ 500 MPa", outside: false };
  if (ultimate_MPa <= 800)
    return { A0: 0.4 + ultimate_MPa / 1250, why: "A0 = 0.4 + Rm/1250 for ferritic steels with 500 < Rm ≤ 800 MPa", outside: false };
  return { A0: 1, why: "A0 = 1.0 for ferritic steels with 800 < Rm ≤ 1000 MPa", outside: ultimate_MPa > 1000 };
}

/** The plasticity correction factor ke of a range (1 at or below 2·Rp0.2). */
export function plasticityFactor(range_MPa: number, yield_MPa: number, family: MaterialFamily, ultimate_MPa: number): number {
  if (range_MPa <= 2 * yield_MPa) return 1;
  const { A0 } = plasticityA0(family, ultimate_MPa);
  return 1 + A0 * (range_MPa / (2 * yield_MPa) - 1);
}

export function weldedThicknessFactor(e_mm: number): number {
  return e_mm <= 25 ? 1 : (25 / Math.min(e_mm, 150)) ** 0.25;
}

export function unweldedThicknessFactor(e_mm: number): number {
  return e_mm <= 25 ? 1 : (25 / Math.min(e_mm, 150)) ** 0.182;
}

export function temperatureFactor(T_C: number, family: MaterialFamily): number {
  if (T_C <= 100) return 1;
  return family === "stainless" ? 1.043 - 4.3e-4 * T_C : 1.03 - 1.5e-4 * T_C - 1.5e-6 * T_C * T_C;
}

/** Unwelded design range Δσ_R at N cycles (N ≤ 2·10⁶), before the correction factors. */
export function unweldedRange(N: number, ultimate_MPa: number): number {
  return 46000 / Math.sqrt(N) + 0.63 * ultimate_MPa + 11.5;
}

export function surfaceFactor(N: number, ultimate_MPa: number, rz_um: number): number {
  const lr = Math.log(rz_um);
  const Fs = 1 - 0.056 * lr ** 0.64 * Math.log(ultimate_MPa) + 0.289 * lr ** 0.53;
  return Math.min(1, Fs) ** (0.1 * Math.log(N) - 0.465);
}

/** Mean-stress factor of the unwelded curve at the equivalent mean stress σm and the range Δσ_R. */
export function meanStressFactor(mean_MPa: number, rangeR_MPa: number, ultimate_MPa: number): number {
  const M = 0.00035 * ultimate_MPa - 0.1;
  const x = (2 * mean_MPa) / rangeR_MPa;
  if (mean_MPa <= rangeR_MPa / (2 * (1 + M))) return Math.sqrt(Math.max(0, 1 - ((M * (2 + M)) / (1 + M)) * x));
  return (1 + M / 3) / (1 + M) - (M / 3) * x;
}

export const UNWELDED_ENDURANCE_N = 2e6;
export const UNWELDED_CUTOFF_N = 1e8;

export interface VesselCurve {
  kind: "en13445-welded" | "en13445-unwelded";
  family: MaterialFamily;
  yield_MPa: number;
  ultimate_MPa: number;
  class_MPa: number;
  /** Ordered (nominal) wall for the thickness correction. */
  thickness_mm: number;
  temperature_C: number;
  rz_um: number;
}

/**
 * Life of one cycle of equivalent range Δσ (and equivalent mean σm, unwelded only) on the vessel
 * curve, after ke. null = unlimited (below the endurance limit, or the cut-off for a spectrum).
 */
export function vesselLife(c: VesselCurve, range_MPa: number, mean_MPa: number, spectrum: boolean): number | null {
  if (!(range_MPa > 0)) return null;
  const ke = plasticityFactor(range_MPa, c.yield_MPa, c.family, c.ultimate_MPa);
  const r = ke * range_MPa;
  const fT = temperatureFactor(c.temperature_C, c.family);
  if (c.kind === "en13445-welded") {
    const fe = weldedThicknessFactor(c.thickness_mm);
    return weldedLife(r / (fe * fT), c.class_MPa, { variableAmplitude: spectrum }).life_cycles;
  }
  const fe = unweldedThicknessFactor(c.thickness_mm);
  const allowed = (N: number) => {
    const R = unweldedRange(Math.min(N, UNWELDED_ENDURANCE_N), c.ultimate_MPa);
    const fm = meanStressFactor(mean_MPa, R, c.ultimate_MPa);
    const fs = surfaceFactor(Math.min(N, UNWELDED_ENDURANCE_N), c.ultimate_MPa, c.rz_um);
    // Beyond 2·10⁶ cycles a spectrum's small cycles follow slope 10 to the cut-off (assumed, conservative against none).
    const beyond = N > UNWELDED_ENDURANCE_N ? (UNWELDED_ENDURANCE_N / N) ** 0.1 : 1;
    return R * fm * fs * fe * fT * beyond;
  };
  if (allowed(1) <= r) return 1;
  const top = spectrum ? UNWELDED_CUTOFF_N : UNWELDED_ENDURANCE_N;
  if (allowed(top) > r) return null;
  // allowed(N) falls with N: bisect on ln N.
  let lo = 0;
  let hi = Math.log(top);
  for (let i = 0; i < 80; i++) {
    const mid = (lo + hi) / 2;
    if (allowed(Math.exp(mid)) > r) lo = mid;
    else hi = mid;
  }
  return Math.exp((lo + hi) / 2);
}

/**
 * The worked steps of the vessel route at the governing cycle, from its equivalent (Tresca) range and
 * equivalent mean (src/engine/equivalent.ts, worked at the governing point of the bore).
 */
export function vesselSteps(c: VesselCurve, range: number, mean: number, spectrum: boolean): { steps: Step[]; warnings: Warning[] } {
  const steps: Step[] = [];
  const warnings: Warning[] = [];
  const label = spectrum ? " (largest cycle)" : "";
  steps.push(
    step(
      "vessel-equivalent-range",
      `Equivalent (Tresca) stress range at the inner surface${label}`,
      "Δσ_eq = 2σa = max(|Δσ1 − Δσ2|, |Δσ2 − Δσ3|, |Δσ3 − Δσ1|)",
      `Δσ_eq = 2 × ${fmt(range / 2)}  (principal stresses at the bore: edge or hoop stress, axial or 0 at a free edge, σr = −p)`,
      range,
      "MPa",
      `${EN13445_18}, §18.6 equivalent stress range by Tresca (from memory); ${EQUIVALENT_SOURCE.tresca}`,
    ),
  );
  const ke = plasticityFactor(range, c.yield_MPa, c.family, c.ultimate_MPa);
  const a0 = plasticityA0(c.family, c.ultimate_MPa);
  steps.push(
    step(
      "vessel-ke",
      "Plasticity correction of the range",
      range > 2 * c.yield_MPa ? "ke = 1 + A0·(Δσ_eq/(2·Rp0.2) − 1)" : "ke = 1 for Δσ_eq ≤ 2·Rp0.2",
      range > 2 * c.yield_MPa
        ? `ke = 1 + ${fmt(a0.A0)} × (${fmt(range)}/(2 × ${fmt(c.yield_MPa)}) − 1)  (${a0.why})`
        : `Δσ_eq = ${fmt(range)} ≤ 2 × ${fmt(c.yield_MPa)} = ${fmt(2 * c.yield_MPa)}`,
      ke,
      "—",
      `${EN13445_18}, §18.8.1 (from memory); Rp0.2 at room temperature`,
    ),
  );
  if (a0.outside)
    warnings.push(say`the ke factor is published for ultimate strengths up to ${MPa(1000)}; above it the correction is extrapolated`);
  if (range > 2 * c.yield_MPa)
    warnings.push(
      say`the equivalent range (${MPa(range)}) exceeds twice the yield strength: the range is corrected by ke = ${n(ke, 3)}; the shell shakes down only if the code's other checks hold`,
    );
  const fT = temperatureFactor(c.temperature_C, c.family);
  steps.push(
    step(
      "vessel-temperature-factor",
      "Temperature correction of the curve",
      c.temperature_C <= 100
        ? "f_T = 1 for T* ≤ 100 °C"
        : c.family === "stainless"
          ? "f_T = 1.043 − 4.3×10⁻⁴·T*"
          : "f_T = 1.03 − 1.5×10⁻⁴·T* − 1.5×10⁻⁶·T*²",
      `T* = ${fmt(c.temperature_C)} °C`,
      fT,
      "—",
      `${EN13445_18}, §18.10.6.3 (from memory); T* = 0.75·T_max + 0.25·T_min`,
    ),
  );
  if (c.temperature_C > 380 && c.family !== "stainless")
    warnings.push(say`at ${n(c.temperature_C)} °C a ferritic steel creeps: the fatigue curves of clause 18 do not cover the creep range`);
  if (c.kind === "en13445-welded") {
    const fe = weldedThicknessFactor(c.thickness_mm);
    steps.push(
      step(
        "vessel-thickness-factor",
        "Thickness correction of the welded class",
        c.thickness_mm <= 25 ? "f_ew = 1 for e ≤ 25 mm" : "f_ew = (25/e)^0.25, 25 < e ≤ 150 mm",
        `e = ${fmt(c.thickness_mm)} mm`,
        fe,
        "—",
        `${EN13445_18}, §18.10.6.2 (from memory)`,
      ),
      step(
        "vessel-weld-mean",
        "Mean stress at the weld",
        "no correction: Δσ alone",
        "as-welded: the residual stress is taken at yield",
        0,
        "—",
        `${EN13445_18}, §18.10.4 (from memory): no mean-stress correction for as-welded joints (conservative also for stress-relieved ones)`,
      ),
      step(
        "vessel-design-range",
        `Range entering the class curve${label}`,
        "Δσ_d = ke·Δσ_eq/(f_ew·f_T)",
        `Δσ_d = ${fmt(ke)} × ${fmt(range)}/(${fmt(fe)} × ${fmt(fT)})`,
        (ke * range) / (fe * fT),
        "MPa",
        `${EN13445_18}, §18.10.5: the correction factors on the class curve (from memory)`,
      ),
    );
    if (!spectrum) {
      const life = vesselLife(c, range, 0, false);
      steps.push(
        step(
          "life",
          `Life on class ${fmt(c.class_MPa)} (slope 3 to 5×10⁶ cycles)`,
          "N = 2×10⁶·(Δσ_R/Δσ_d)³; unlimited below Δσ_D = 0.737·Δσ_R",
          `N = 2×10^6 × (${fmt(c.class_MPa)}/${fmt((ke * range) / (fe * fT))})³`,
          life,
          "cycles",
          `${EN13445_18}, §18.10.5, welded curves (from memory)`,
        ),
      );
    }
    if (c.thickness_mm > 150)
      warnings.push(say`the thickness correction of the welded classes is published to ${mm(150)}; it is held at ${mm(150)}`);
    return { steps, warnings };
  }
  const fe = unweldedThicknessFactor(c.thickness_mm);
  steps.push(
    step(
      "vessel-equivalent-mean",
      `Equivalent mean stress${label}`,
      "σ_eq,m = Tresca of the mean stresses",
      `σ_eq,m = ${fmt(mean)}  (the equivalent local mean stress above)`,
      mean,
      "MPa",
      `${EN13445_18}, §18.11.3 (from memory)`,
    ),
    step(
      "vessel-thickness-factor",
      "Thickness correction of the unwelded curve",
      c.thickness_mm <= 25 ? "f_ee = 1 for e ≤ 25 mm" : "f_ee = (25/e)^0.182, 25 < e ≤ 150 mm",
      `e = ${fmt(c.thickness_mm)} mm`,
      fe,
      "—",
      `${EN13445_18}, §18.11.3 (from memory)`,
    ),
  );
  const life = vesselLife(c, range, mean, spectrum);
  const N = life === null ? UNWELDED_ENDURANCE_N : Math.min(life, UNWELDED_ENDURANCE_N);
  const R = unweldedRange(N, c.ultimate_MPa);
  steps.push(
    step(
      "vessel-unwelded-range",
      "Unwelded design range from Rm",
      "Δσ_R = 46 000/√N + 0.63·Rm + 11.5",
      `Δσ_R = 46000/√${fmt(N)} + 0.63 × ${fmt(c.ultimate_MPa)} + 11.5`,
      R,
      "MPa",
      `${EN13445_18}, §18.11.2, unwelded design curve (from memory)`,
    ),
    step(
      "vessel-surface-factor",
      "Surface factor",
      "f_s = F_s^(0.1·ln N − 0.465), F_s = 1 − 0.056(ln Rz)^0.64·ln Rm + 0.289(ln Rz)^0.53",
      `Rz = ${fmt(c.rz_um)} µm, Rm = ${fmt(c.ultimate_MPa)} MPa, N = ${fmt(N)}`,
      surfaceFactor(N, c.ultimate_MPa, c.rz_um),
      "—",
      `${EN13445_18}, §18.11.3 (from memory)`,
    ),
    step(
      "vessel-mean-factor",
      "Mean-stress factor",
      "f_m = √(1 − M(2+M)/(1+M)·2σm/Δσ_R) for σm ≤ Δσ_R/(2(1+M)); else (1 + M/3)/(1+M) − M/3·2σm/Δσ_R; M = 0.00035·Rm − 0.1",
      `σm = ${fmt(mean)}, Δσ_R = ${fmt(R)}, M = ${fmt(0.00035 * c.ultimate_MPa - 0.1)}`,
      meanStressFactor(mean, R, c.ultimate_MPa),
      "—",
      `${EN13445_18}, §18.11.3 (from memory)`,
    ),
  );
  if (!spectrum)
    steps.push(
      step(
        "life",
        "Life on the unwelded curve",
        "ke·Δσ_eq = f_s·f_ee·f_m·f_T·Δσ_R(N), solved for N; unlimited beyond 2×10⁶ cycles",
        `ke·Δσ_eq = ${fmt(ke * range)} MPa`,
        life,
        "cycles",
        `${EN13445_18}, §18.11 (from memory); N found by bisection on ln N`,
      ),
    );
  if (spectrum)
    warnings.push(
      "beyond 2×10⁶ cycles the small cycles of the spectrum follow an assumed slope of 10 down to 10⁸ cycles on the unwelded curve (conservative against leaving them out)",
    );
  return { steps, warnings };
}
