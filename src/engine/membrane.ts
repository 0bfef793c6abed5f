import { fmt, step, type Step } from "./step.ts";

/**
 * Membrane stresses of a closed pressurized shell.
 * Thin wall (Roark's Formulas for Stress and Strain, Ch. 13, thin-walled shells of revolution under
 * internal pressure): cylinder σθ = p·r/t, σx = p·r/(2t); sphere σθ = σφ = p·r/(2t), r the mean radius.
 * Thick wall (Lamé; Roark Ch. 13, thick-walled cylinders and spheres; Timoshenko, Strength of Materials II):
 * stresses at the inner surface, where they are largest; closed-end cylinder.
 * Units: MPa and mm. Stresses are linear in p, so they are returned per unit pressure too.
 */
export type ShellForm = "cylinder" | "sphere";
export type Theory = "thin" | "thick";

export interface Radii {
  inner_mm: number;
  mean_mm: number;
  outer_mm: number;
}

export function radii(radius_mm: number, at: "inner" | "mean" | "outer", thickness_mm: number): Radii {
  const inner_mm = at === "inner" ? radius_mm : at === "mean" ? radius_mm - thickness_mm / 2 : radius_mm - thickness_mm;
  return { inner_mm, mean_mm: inner_mm + thickness_mm / 2, outer_mm: inner_mm + thickness_mm };
}

/** Ratio of mean radius to thickness below which thin-wall theory is not used (common practice: r/t = 10). */
export const THIN_WALL_LIMIT = 10;

export function chooseTheory(requested: "auto" | Theory, r: Radii, thickness_mm: number): Theory {
  if (requested !== "auto") return requested;
  return r.mean_mm / thickness_mm >= THIN_WALL_LIMIT ? "thin" : "thick";
}

/** Stresses at the critical (inner) surface for a pressure of 1 MPa; multiply by p. */
export interface UnitStresses {
  hoop: number;
  axial: number;
  radial: number;
}

export function unitStresses(form: ShellForm, theory: Theory, r: Radii, thickness_mm: number): UnitStresses {
  if (theory === "thin") {
    const hoop = form === "cylinder" ? r.mean_mm / thickness_mm : r.mean_mm / (2 * thickness_mm);
    return { hoop, axial: r.mean_mm / (2 * thickness_mm), radial: 0 };
  }
  const a = r.inner_mm;
  const b = r.outer_mm;
  if (form === "cylinder") {
    const d = b * b - a * a;
    return { hoop: (b * b + a * a) / d, axial: (a * a) / d, radial: -1 };
  }
  const d3 = b ** 3 - a ** 3;
  const hoop = (b ** 3 + 2 * a ** 3) / (2 * d3);
  return { hoop, axial: hoop, radial: -1 };
}

/** von Mises equivalent stress from three principal stresses (Dowling eq. 7.32). */
export function vonMises(s1: number, s2: number, s3: number): number {
  return Math.sqrt(0.5 * ((s1 - s2) ** 2 + (s2 - s3) ** 2 + (s3 - s1) ** 2));
}

const ROARK = "Roark's Formulas for Stress and Strain, Ch. 13 (thin-walled pressure vessels)";
const LAME =
  "Lamé thick-wall solution at the inner surface, closed ends (Roark's Formulas for Stress and Strain, Ch. 13, thick-walled vessels)";

export function membraneSteps(form: ShellForm, theory: Theory, r: Radii, t: number, p: number, u: UnitStresses): Step[] {
  if (theory === "thin") {
    const rm = fmt(r.mean_mm);
    return form === "cylinder"
      ? [
          step("hoop", "Hoop membrane stress", "σθ = p·r/t", `σθ = ${fmt(p)} × ${rm} / ${fmt(t)}`, p * u.hoop, "MPa", ROARK),
          step("axial", "Axial membrane stress", "σx = p·r/(2t)", `σx = ${fmt(p)} × ${rm} / (2 × ${fmt(t)})`, p * u.axial, "MPa", ROARK),
        ]
      : [
          step(
            "hoop",
            "Membrane stress (sphere, equal in all directions)",
            "σθ = σφ = p·r/(2t)",
            `σθ = ${fmt(p)} × ${rm} / (2 × ${fmt(t)})`,
            p * u.hoop,
            "MPa",
            ROARK,
          ),
        ];
  }
  const a = fmt(r.inner_mm);
  const b = fmt(r.outer_mm);
  if (form === "cylinder") {
    return [
      step(
        "hoop",
        "Hoop stress at the inner surface (Lamé)",
        "σθ = p·(b² + a²)/(b² − a²)",
        `σθ = ${fmt(p)} × (${b}² + ${a}²)/(${b}² − ${a}²)`,
        p * u.hoop,
        "MPa",
        LAME,
      ),
      step(
        "axial",
        "Axial stress, closed ends (Lamé)",
        "σx = p·a²/(b² − a²)",
        `σx = ${fmt(p)} × ${a}²/(${b}² − ${a}²)`,
        p * u.axial,
        "MPa",
        LAME,
      ),
      step("radial", "Radial stress at the inner surface", "σr = −p", `σr = −${fmt(p)}`, -p, "MPa", LAME),
    ];
  }
  return [
    step(
      "hoop",
      "Tangential stress at the inner surface (Lamé, sphere)",
      "σθ = p·(b³ + 2a³)/(2(b³ − a³))",
      `σθ = ${fmt(p)} × (${b}³ + 2 × ${a}³)/(2 × (${b}³ − ${a}³))`,
      p * u.hoop,
      "MPa",
      LAME,
    ),
    step("radial", "Radial stress at the inner surface", "σr = −p", `σr = −${fmt(p)}`, -p, "MPa", LAME),
  ];
}
