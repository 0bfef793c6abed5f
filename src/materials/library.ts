import type { MaterialFamily, SurfaceFinish } from "../schema/check.ts";

/**
 * The material library: typical values only. Every entry names where its numbers come from;
 * "from memory" marks values recalled rather than read from the cited table. None of them is
 * a design allowable: verify against certified data (mill certificates, the governing code's
 * tables, or the material specification) before relying on a result.
 *
 * Consistency rules every entry keeps (test/materials/library.test.ts checks them):
 *  - yield < ultimate; σ'f near or above the ultimate strength; b between −0.05 and −0.15.
 *  - The Basquin constants are strain-life values from smooth, polished axial specimens, so the axial
 *    load factor is in them and the surface factor is not.
 *  - Steels: the endurance limit is the smaller of Shigley's estimate for the same specimens,
 *    kc·0.5·Su with kc = 0.85 for axial load (Shigley eqs. 6-8 and 6-26), and the curve itself at its knee,
 *    σ'f·(2·10⁶)^b: never above the curve. The part's surface finish is applied as a Marin factor to the
 *    whole curve and limit by the engine: `surface` is the finish assumed when the user names none.
 *  - Aluminium and titanium alloys carry no endurance limit (aluminium has none; titanium none that
 *    can be relied on), so spectra and long lives use the curve itself.
 */
export interface LibraryMaterial {
  id: string;
  name: string;
  family: MaterialFamily;
  ultimate_MPa: number;
  yield_MPa: number;
  modulus_MPa: number;
  fatigueStrengthCoefficient_MPa: number;
  fatigueStrengthExponent: number;
  enduranceLimit_MPa?: number;
  /** As-delivered surface finish of the product, used for the surface factor when the user names none (steels). */
  surface?: SurfaceFinish;
  toughness_MPaSqrtM?: number;
  parisC?: number;
  parisM?: number;
  /** Where each group of values comes from. */
  source: string;
}

/** Shigley's axial load factor kc (eq. 6-26) times the rotating-beam estimate 0.5·Su (eq. 6-8). */
export const AXIAL_ENDURANCE_RATIO = 0.85 * 0.5;

export const TYPICAL_FLAG = "typical values — verify against certified data";

const BARSOM_FERRITIC = "Paris constants: Barsom & Rolfe, ferritic-pearlitic steels, da/dN = 6.9×10⁻¹² ΔK³ (from memory)";

export const MATERIALS: readonly LibraryMaterial[] = [
  {
    id: "al-2024-t3",
    name: "Aluminium 2024-T3 sheet",
    family: "aluminium",
    ultimate_MPa: 483,
    yield_MPa: 345,
    modulus_MPa: 72400,
    fatigueStrengthCoefficient_MPa: 900,
    fatigueStrengthExponent: -0.102,
    toughness_MPaSqrtM: 70,
    parisC: 1.6e-11,
    parisM: 3.59,
    source:
      "Static: typical 2024-T3 sheet values (from memory). Basquin: Dowling, Mechanical Behavior of Materials, Table 14.1, 2024-T351 (from memory). Kc: thin-sheet apparent toughness, conservative (from memory). Paris: typical 2024-T3 fit (from memory). No endurance limit: aluminium alloys have none.",
  },
  {
    id: "al-2024-t351",
    name: "Aluminium 2024-T351 plate",
    family: "aluminium",
    ultimate_MPa: 469,
    yield_MPa: 324,
    modulus_MPa: 73100,
    fatigueStrengthCoefficient_MPa: 900,
    fatigueStrengthExponent: -0.102,
    toughness_MPaSqrtM: 34,
    parisC: 1.6e-11,
    parisM: 3.59,
    source:
      "Dowling, Mechanical Behavior of Materials, Table 14.1 (static and Basquin) and Table 8.1 (KIc) (from memory). Paris: typical 2024 fit (from memory).",
  },
  {
    id: "al-7075-t6",
    name: "Aluminium 7075-T6",
    family: "aluminium",
    ultimate_MPa: 578,
    yield_MPa: 469,
    modulus_MPa: 71000,
    fatigueStrengthCoefficient_MPa: 1466,
    fatigueStrengthExponent: -0.143,
    toughness_MPaSqrtM: 29,
    parisC: 2.7e-11,
    parisM: 3.7,
    source:
      "Dowling, Mechanical Behavior of Materials, Table 14.1 (static, Basquin) and Table 8.1 (KIc, 7075-T651) (from memory). Paris: typical 7075-T6 fit (from memory).",
  },
  {
    id: "ti-6al-4v-sta",
    name: "Titanium Ti-6Al-4V, solution treated and aged",
    family: "titanium",
    ultimate_MPa: 1185,
    yield_MPa: 1103,
    modulus_MPa: 117000,
    fatigueStrengthCoefficient_MPa: 2030,
    fatigueStrengthExponent: -0.104,
    toughness_MPaSqrtM: 55,
    parisC: 1.0e-11,
    parisM: 3.2,
    source:
      "Dowling, Mechanical Behavior of Materials, Table 14.1 (static, Basquin) (from memory). KIc and Paris: typical Ti-6Al-4V values (from memory). No endurance limit: none that can be relied on for titanium alloys.",
  },
  {
    id: "steel-1015-n",
    name: "Low-carbon steel SAE 1015, normalized",
    family: "steel",
    ultimate_MPa: 415,
    yield_MPa: 228,
    modulus_MPa: 207000,
    fatigueStrengthCoefficient_MPa: 1020,
    fatigueStrengthExponent: -0.138,
    // min(0.425 × 415 = 176.4, 1020 × (2×10⁶)^−0.138 = 137.7) = 137.7 → 137 MPa
    enduranceLimit_MPa: 137,
    surface: "hot-rolled",
    toughness_MPaSqrtM: 100,
    parisC: 6.9e-12,
    parisM: 3.0,
    source: `Dowling, Mechanical Behavior of Materials, Table 14.1 (static, Basquin) (from memory). Endurance limit 137 MPa: the curve at its knee, σ'f(2×10⁶)^b = 137.7 MPa, below Shigley's axial estimate 0.85 × 0.5 Su = 176 MPa (Shigley eqs. 6-8, 6-26); polished, the surface factor is applied by the engine (as-delivered: hot rolled). Toughness: typical upper-shelf value (from memory). ${BARSOM_FERRITIC}.`,
  },
  {
    id: "steel-1020-hr",
    name: "Carbon steel SAE 1020, hot rolled",
    family: "steel",
    ultimate_MPa: 441,
    yield_MPa: 262,
    modulus_MPa: 203000,
    fatigueStrengthCoefficient_MPa: 896,
    fatigueStrengthExponent: -0.12,
    // min(0.425 × 441 = 187.4, 896 × (2×10⁶)^−0.12 = 157.1) = 157.1 → 157 MPa
    enduranceLimit_MPa: 157,
    surface: "hot-rolled",
    toughness_MPaSqrtM: 100,
    parisC: 6.9e-12,
    parisM: 3.0,
    source: `Shigley's Mechanical Engineering Design, Table A-23, cyclic properties of SAE 1020 hot rolled (from memory). Endurance limit 157 MPa: the curve at its knee, 896 × (2×10⁶)^−0.12 = 157.1 MPa, below 0.85 × 0.5 Su = 187 MPa (Shigley eqs. 6-8, 6-26); polished, surface factor applied by the engine (hot rolled). ${BARSOM_FERRITIC}.`,
  },
  {
    id: "steel-p265gh",
    name: "Vessel plate steel P265GH (specified minimum strengths)",
    family: "steel",
    ultimate_MPa: 410,
    yield_MPa: 265,
    modulus_MPa: 205000,
    fatigueStrengthCoefficient_MPa: 755,
    fatigueStrengthExponent: -0.1,
    // min(0.425 × 410 = 174.3, 755 × (2×10⁶)^−0.1 = 176.9) = 174.3 → 174 MPa
    enduranceLimit_MPa: 174,
    surface: "hot-rolled",
    toughness_MPaSqrtM: 90,
    parisC: 6.9e-12,
    parisM: 3.0,
    source: `Static: EN 10028-2 specified minimums for P265GH up to 16 mm (from memory). Basquin estimated from Su: σ'f ≈ Su + 345 MPa, b ≈ −0.1 (Dowling, steel estimates, from memory). Endurance limit 174 MPa: Shigley's axial estimate 0.85 × 0.5 Su = 174.3 MPa (eqs. 6-8, 6-26), just below the curve at its knee (176.9 MPa); polished, surface factor applied by the engine (plate: hot rolled). ${BARSOM_FERRITIC}.`,
  },
  {
    id: "steel-4340",
    name: "Alloy steel AISI 4340, quenched and tempered",
    family: "steel",
    ultimate_MPa: 1172,
    yield_MPa: 1103,
    modulus_MPa: 207000,
    fatigueStrengthCoefficient_MPa: 1758,
    fatigueStrengthExponent: -0.0977,
    // min(0.425 × 1172 = 498.1, 1758 × (2×10⁶)^−0.0977 = 425.999) → 425 MPa
    enduranceLimit_MPa: 425,
    surface: "machined",
    toughness_MPaSqrtM: 100,
    parisC: 1.35e-10,
    parisM: 2.25,
    source:
      "Dowling, Mechanical Behavior of Materials, Table 14.1 (static, Basquin) (from memory). Endurance limit 425 MPa: the curve at its knee, 1758 × (2×10⁶)^−0.0977 = 426.0 MPa (rounded down), below 0.85 × 0.5 Su = 498 MPa (Shigley eqs. 6-8, 6-26); polished, surface factor applied by the engine (machined). Paris: Barsom & Rolfe, martensitic steels, 1.35×10⁻¹⁰ ΔK^2.25 (from memory).",
  },
  {
    id: "stainless-304",
    name: "Austenitic stainless steel 304, annealed",
    family: "stainless",
    ultimate_MPa: 585,
    yield_MPa: 240,
    modulus_MPa: 193000,
    fatigueStrengthCoefficient_MPa: 1000,
    fatigueStrengthExponent: -0.114,
    surface: "machined",
    toughness_MPaSqrtM: 150,
    parisC: 5.6e-12,
    parisM: 3.25,
    source:
      "Static: typical annealed 304 (from memory). Basquin: typical strain-life fit for annealed 304 (from memory). No endurance limit given: austenitic steels harden cyclically and their limit depends on the product, so the curve itself is used at long lives (conservative). Surface: cold-rolled sheet taken as machined (Shigley Table 6-2 groups cold-drawn with machined). Paris: Barsom & Rolfe, austenitic stainless steels, 5.6×10⁻¹² ΔK^3.25 (from memory).",
  },
];

export function findMaterial(id: string): LibraryMaterial | undefined {
  return MATERIALS.find((m) => m.id === id);
}
