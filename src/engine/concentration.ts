import { fmt, step, type Step } from "./step.ts";

/**
 * Stress concentration at an opening in the biaxial membrane field: hoop stress S along the
 * circumference, axial stress λ·S along the axis. Kt is referred to the nominal hoop stress S.
 *
 * Elliptical hole (Inglis 1913; Peterson's Stress Concentration Factors, 3rd ed., §4.5, elliptical
 * holes in biaxial fields), half-axis h along the hoop direction and z along the axis:
 *  - at the ends of the axial half-axis the boundary stress runs along the hoop:  σ_A = S·(1 + 2z/h) − λS
 *  - at the ends of the hoop half-axis it runs along the axis:                     σ_B = λS·(1 + 2h/z) − S
 * using Inglis' uniaxial results (1 + 2a/b at the end of the axis across the load, −1 at the end of
 * the axis along it) superposed. A circle (h = z) gives Kirsch's Kt = 3 − λ (Peterson Chart 4.1 for
 * λ = 0, 0.5, 1: 3, 2.5, 2).
 */
export type Cutout =
  | { kind: "none" }
  | { kind: "circular-hole"; radius_mm?: number }
  | { kind: "elliptical-hole"; halfAxisAlongHoop_mm: number; halfAxisAlongAxial_mm: number }
  | { kind: "given"; kt: number; rootRadius_mm?: number; basis?: string };

export interface Concentration {
  kt: number;
  /** Which point of the opening governs, in words. */
  governs: string;
  /** Notch root radius at the governing point, when the geometry gives one (mm). */
  rootRadius_mm?: number;
  steps: Step[];
  warnings: string[];
}

const PETERSON = "Peterson's Stress Concentration Factors (Pilkey), §4.5, holes in biaxial fields; Inglis (1913) superposed";

export function concentration(cutout: Cutout, lambda: number): Concentration {
  const warnings: string[] = [];
  if (cutout.kind === "none") {
    return {
      kt: 1,
      governs: "plain skin (no opening)",
      steps: [step("kt", "Stress concentration factor", "Kt = 1", "no opening: Kt = 1", 1, "—", "definition")],
      warnings,
    };
  }
  if (cutout.kind === "given") {
    return {
      kt: cutout.kt,
      governs: "given by the user",
      rootRadius_mm: cutout.rootRadius_mm,
      steps: [
        step(
          "kt",
          "Stress concentration factor (given)",
          "Kt given",
          `Kt = ${fmt(cutout.kt)}`,
          cutout.kt,
          "—",
          cutout.basis ? `given: ${cutout.basis}` : "given by the user; its basis must be recorded",
        ),
      ],
      warnings,
    };
  }
  const h = cutout.kind === "circular-hole" ? 1 : cutout.halfAxisAlongHoop_mm;
  const z = cutout.kind === "circular-hole" ? 1 : cutout.halfAxisAlongAxial_mm;
  const sA = 1 + (2 * z) / h - lambda;
  const sB = lambda * (1 + (2 * h) / z) - 1;
  const aGoverns = sA >= sB;
  const kt = Math.max(sA, sB);
  const ratio = `λ = σx/σθ = ${fmt(lambda)}`;
  const steps: Step[] =
    cutout.kind === "circular-hole"
      ? [
          step(
            "kt",
            "Kt of a circular hole in the biaxial field (Kirsch)",
            "Kt = 3 − λ",
            `Kt = 3 − ${fmt(lambda)}   (${ratio})`,
            kt,
            "—",
            "Kirsch (1898); Peterson's Stress Concentration Factors, Chart 4.1 (biaxial)",
          ),
        ]
      : [
          step(
            "kt-side",
            "Boundary stress at the ends of the axial half-axis, per unit hoop stress",
            "σ_A/S = 1 + 2z/h − λ",
            `σ_A/S = 1 + 2 × ${fmt(z)}/${fmt(h)} − ${fmt(lambda)}`,
            sA,
            "—",
            PETERSON,
          ),
          step(
            "kt-crown",
            "Boundary stress at the ends of the hoop half-axis, per unit hoop stress",
            "σ_B/S = λ·(1 + 2h/z) − 1",
            `σ_B/S = ${fmt(lambda)} × (1 + 2 × ${fmt(h)}/${fmt(z)}) − 1`,
            sB,
            "—",
            PETERSON,
          ),
          step(
            "kt",
            "Stress concentration factor (larger of the two)",
            "Kt = max(σ_A, σ_B)/S",
            `Kt = max(${fmt(sA)}, ${fmt(sB)})`,
            kt,
            "—",
            PETERSON,
          ),
        ];
  let rootRadius_mm: number | undefined;
  if (cutout.kind === "circular-hole") rootRadius_mm = cutout.radius_mm;
  else rootRadius_mm = aGoverns ? (h * h) / z : (z * z) / h;
  if (kt < 1) warnings.push(`the opening relieves rather than raises stress here (Kt = ${fmt(kt)}); Kt is taken as 1`);
  return {
    kt: Math.max(kt, 1),
    governs: aGoverns
      ? "the edge of the opening at the ends of its axial half-axis, stressed along the hoop"
      : "the edge of the opening at the ends of its hoop half-axis, stressed along the axis",
    rootRadius_mm,
    steps,
    warnings,
  };
}
