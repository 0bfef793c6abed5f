/**
 * @module engine/concentration
 * Stress at the edge of an opening in the biaxial membrane field, as a boundary field: each point
 * of the edge carries influence coefficients so that its tangential (edge) stress at any instant is
 *
 *   σ_edge = hoopCoeff·σθ + axialCoeff·σx
 *
 * from the nominal hoop stress σθ and axial stress σx of that instant (linear elasticity, superposition).
 * Fatigue evaluates every point at every instant (maximum, minimum, each counted extreme of a spectrum)
 * and takes the worst, so an axial stress that does not follow the pressure is not lost.
 *
 * Elliptical hole (Inglis 1913; Peterson's Stress Concentration Factors, 3rd ed., §4.5), half-axis h
 * along the hoop direction and z along the axis. Under a uniaxial stress S the edge stress is
 * S·(1 + 2a/b) at the ends of the axis a lying across the load and −S at the ends of the axis lying
 * along it. Superposing the hoop and the axial stress:
 *  - ends of the axial half-axis (edge runs along the hoop):  σ_A = (1 + 2z/h)·σθ − σx
 *  - ends of the hoop half-axis (edge runs along the axis):   σ_B = −σθ + (1 + 2h/z)·σx
 * A circle (h = z) gives Kirsch's 3σθ − σx and 3σx − σθ (Kirsch 1898; Peterson Chart 4.1: Kt = 3 − λ).
 * These are the points where the edge stress of an ellipse in a field whose principal axes lie along
 * the ellipse's axes takes its extremes (Peterson §4.5), so for circles and ellipses they are the
 * governing points at every instant.
 *
 * `notch.kt` stays referred to the nominal hoop stress at maximum pressure: Kt = σ_edge,max/σθ,max.
 */
import { fmt, step, type Step } from "./step.ts";
import { n, say, type Warning } from "./phrase.ts";

export type Cutout =
  | { kind: "none" }
  | { kind: "circular-hole"; radius_mm?: number }
  | { kind: "elliptical-hole"; halfAxisAlongHoop_mm: number; halfAxisAlongAxial_mm: number }
  | { kind: "given"; kt: number; rootRadius_mm?: number; basis?: string };

/** One point of an opening's edge with the influence coefficients of its edge stress. */
export interface BoundaryPoint {
  id: string;
  /** Where the point is, in words a checker reads on the sheet. */
  label: string;
  /** σ_edge per unit nominal hoop stress. */
  hoopCoeff: number;
  /** σ_edge per unit nominal axial stress. */
  axialCoeff: number;
  /**
   * Direction of the edge at this point, degrees from the hoop direction (0: the edge runs along the
   * hoop, 90: along the axis). The nominal stress along the edge, σθ·cos² + σx·sin², is what the notch
   * sensitivity q scales the concentration from. Default 0.
   */
  edgeAngle_deg?: number;
  /** Angle of the point around the opening, degrees from the hoop direction, where known. */
  angle_deg?: number;
  /** Position relative to the opening's centre (mm), hoop and axial, where known. */
  x_mm?: number;
  y_mm?: number;
  /** Notch root radius at this point (mm), where the geometry gives one. */
  rootRadius_mm?: number;
}

/** An opening as its boundary field. */
export interface OpeningField {
  points: BoundaryPoint[];
  /** What the field rests on, in words (method, or what is assumed for a given Kt). */
  basis: string;
  /** True when the coefficients are assumed rather than worked from the shape (a given Kt). */
  assumed: boolean;
  steps: Step[];
  warnings: Warning[];
}

/** Edge stress of a point from the nominal hoop and axial stresses of one instant. */
export function edgeStress(p: BoundaryPoint, hoop_MPa: number, axial_MPa: number): number {
  return p.hoopCoeff * hoop_MPa + p.axialCoeff * axial_MPa;
}

/**
 * The skin beside the opening carries the membrane stresses themselves. They are evaluated with the
 * edge points so that no opening ever lowers the local stress below the membrane stress (Kt ≥ 1), and so
 * that a large added axial stress is checked in the plain skin too.
 */
export const MEMBRANE_POINTS: readonly BoundaryPoint[] = [
  { id: "membrane-hoop", label: "the plain skin, stressed along the hoop", hoopCoeff: 1, axialCoeff: 0, edgeAngle_deg: 0 },
  { id: "membrane-axial", label: "the plain skin, stressed along the axis", hoopCoeff: 0, axialCoeff: 1, edgeAngle_deg: 90 },
];

const PETERSON = "Peterson's Stress Concentration Factors (Pilkey), §4.5, holes in biaxial fields; Inglis (1913) superposed";
const KIRSCH = "Kirsch (1898); Peterson's Stress Concentration Factors, Chart 4.1 (biaxial)";

/** Words for a given Kt: what the tool assumes about it. */
export const GIVEN_KT_ASSUMPTION =
  "the given Kt is taken as the edge stress per unit nominal hoop stress at every instant (σ_edge = Kt·σθ): it is assumed to scale with the hoop stress, and the axial stress's own influence at that point is not known";

/** The boundary field of an opening: its governing points with their influence coefficients. */
export function openingField(cutout: Cutout): OpeningField {
  const warnings: Warning[] = [];
  if (cutout.kind === "none") {
    return { points: [], basis: "plain skin (no opening): the membrane stresses themselves", assumed: false, steps: [], warnings };
  }
  if (cutout.kind === "given") {
    return {
      points: [
        {
          id: "given",
          label: "the point the given Kt refers to",
          hoopCoeff: cutout.kt,
          axialCoeff: 0,
          edgeAngle_deg: 0,
          rootRadius_mm: cutout.rootRadius_mm,
        },
      ],
      basis: GIVEN_KT_ASSUMPTION,
      assumed: true,
      steps: [
        step(
          "kt-given",
          "Stress concentration factor (given), referred to the nominal hoop stress",
          "σ_edge = Kt·σθ at every instant",
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
  const circle = cutout.kind === "circular-hole";
  const rA = circle ? cutout.radius_mm : (h * h) / z;
  const rB = circle ? cutout.radius_mm : (z * z) / h;
  const points: BoundaryPoint[] = [
    {
      id: "axial-ends",
      label: "the edge of the opening at the ends of its axial half-axis, stressed along the hoop",
      hoopCoeff: 1 + (2 * z) / h,
      axialCoeff: -1,
      edgeAngle_deg: 0,
      angle_deg: 90,
      x_mm: 0,
      y_mm: circle ? cutout.radius_mm : z,
      rootRadius_mm: rA,
    },
    {
      id: "hoop-ends",
      label: "the edge of the opening at the ends of its hoop half-axis, stressed along the axis",
      hoopCoeff: -1,
      axialCoeff: 1 + (2 * h) / z,
      edgeAngle_deg: 90,
      angle_deg: 0,
      x_mm: circle ? cutout.radius_mm : h,
      y_mm: 0,
      rootRadius_mm: rB,
    },
  ];
  const [A, B] = points;
  const steps: Step[] = circle
    ? [
        step(
          "kt-side",
          "Edge stress at the ends of the axial diameter (Kirsch)",
          "σ_A = 3σθ − σx",
          "σ_A = 3·σθ − 1·σx",
          A.hoopCoeff,
          "per unit σθ",
          KIRSCH,
        ),
        step(
          "kt-crown",
          "Edge stress at the ends of the hoop diameter (Kirsch)",
          "σ_B = −σθ + 3σx",
          "σ_B = −1·σθ + 3·σx",
          B.axialCoeff,
          "per unit σx",
          KIRSCH,
        ),
      ]
    : [
        step(
          "kt-side",
          "Edge stress at the ends of the axial half-axis (Inglis)",
          "σ_A = (1 + 2z/h)·σθ − σx",
          `σ_A = (1 + 2 × ${fmt(z)}/${fmt(h)})·σθ − σx`,
          A.hoopCoeff,
          "per unit σθ",
          PETERSON,
        ),
        step(
          "kt-crown",
          "Edge stress at the ends of the hoop half-axis (Inglis)",
          "σ_B = −σθ + (1 + 2h/z)·σx",
          `σ_B = −σθ + (1 + 2 × ${fmt(h)}/${fmt(z)})·σx`,
          B.axialCoeff,
          "per unit σx",
          PETERSON,
        ),
      ];
  return { points, basis: circle ? KIRSCH : PETERSON, assumed: false, steps, warnings };
}

export interface Concentration {
  kt: number;
  /** Which point of the opening governs, in words. */
  governs: string;
  /** The governing point's id. */
  pointId?: string;
  /** Notch root radius at the governing point, when the geometry gives one (mm). */
  rootRadius_mm?: number;
  steps: Step[];
  warnings: Warning[];
}

/**
 * Kt referred to the nominal hoop stress in a field of fixed biaxial ratio λ = σx/σθ: the largest edge
 * stress over the opening's points and the plain skin beside it. Used where one number is wanted (the
 * sheet's Kt line); fatigue itself superposes at every instant (see evaluate.ts).
 */
export function concentration(
  cutout: Cutout,
  lambda: number,
  field: OpeningField = openingField(cutout),
  /** Report this point (the one that governs fatigue) instead of the one with the largest edge stress. */
  pointId?: string,
): Concentration {
  const all = [...field.points, ...MEMBRANE_POINTS];
  let best = all[0];
  let kt = -Infinity;
  for (const p of all) {
    const v = edgeStress(p, 1, lambda);
    if (v > kt + 1e-12) {
      kt = v;
      best = p;
    }
  }
  const largest = kt;
  const chosen = pointId === undefined ? undefined : all.find((p) => p.id === pointId);
  if (chosen) {
    best = chosen;
    kt = edgeStress(chosen, 1, lambda);
  }
  const ratio = `λ = σx/σθ = ${fmt(lambda)}`;
  const terms = field.points.map((p) => `${fmt(p.hoopCoeff)} + ${fmt(p.axialCoeff)}·${fmt(lambda)}`);
  const steps: Step[] = [...field.steps];
  if (cutout.kind === "none") {
    steps.push(step("kt", "Stress concentration factor", "Kt = 1", "no opening: Kt = 1", 1, "—", "definition"));
  } else {
    steps.push(
      step(
        "kt",
        cutout.kind === "given"
          ? "Stress concentration factor (given)"
          : `Stress concentration factor at maximum pressure, at ${best.label}`,
        kt === largest
          ? "Kt = max over the points of (c_θ + c_x·λ), at least 1 (the plain skin)"
          : "Kt = c_θ + c_x·λ at the point that governs fatigue",
        kt === largest
          ? `Kt = max(${[...terms, "1"].join(", ")})   (${ratio})`
          : `Kt = ${fmt(best.hoopCoeff)} + ${fmt(best.axialCoeff)} × ${fmt(lambda)}`,
        kt,
        "—",
        cutout.kind === "given" ? field.steps[0].source : `${field.basis}; superposition`,
      ),
    );
  }
  const warnings = [...field.warnings];
  if (cutout.kind !== "none" && best.id.startsWith("membrane"))
    warnings.push(say`the opening relieves rather than raises the edge stress here; the plain skin beside it governs (Kt = ${n(kt)})`);
  return {
    kt,
    governs: cutout.kind === "none" ? "plain skin (no opening)" : best.label,
    pointId: best.id,
    rootRadius_mm: best.rootRadius_mm,
    steps,
    warnings,
  };
}
