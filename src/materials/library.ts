import type { MaterialFamily } from "../schema/check.ts";

/**
 * The material library: typical values only. Every entry names where its numbers come from;
 * "from memory" marks values recalled rather than read from the cited table. None of them is
 * a design allowable: verify against certified data (mill certificates, the governing code's
 * tables, or the material specification) before relying on a result.
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
  toughness_MPaSqrtM?: number;
  parisC?: number;
  parisM?: number;
  /** Where each group of values comes from. */
  source: string;
}

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
      "Static: typical 2024-T3 sheet values (from memory). Basquin: Dowling, Mechanical Behavior of Materials, Table 14.1, 2024-T351 (from memory). Kc: thin-sheet apparent toughness, conservative (from memory). Paris: typical 2024-T3 fit (from memory).",
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
      "Dowling, Mechanical Behavior of Materials, Table 14.1 (static, Basquin) (from memory). KIc and Paris: typical Ti-6Al-4V values (from memory).",
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
    enduranceLimit_MPa: 207,
    toughness_MPaSqrtM: 100,
    parisC: 6.9e-12,
    parisM: 3.0,
    source: `Dowling, Mechanical Behavior of Materials, Table 14.1 (static, Basquin) (from memory). Endurance limit: Shigley's estimate S'e = 0.5 Su (Shigley eq. 6-8). Toughness: typical upper-shelf value (from memory). ${BARSOM_FERRITIC}.`,
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
    enduranceLimit_MPa: 220,
    toughness_MPaSqrtM: 100,
    parisC: 6.9e-12,
    parisM: 3.0,
    source: `Shigley's Mechanical Engineering Design, Table A-23, cyclic properties of SAE 1020 hot rolled (from memory). Endurance limit: S'e = 0.5 Su (Shigley eq. 6-8). ${BARSOM_FERRITIC}.`,
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
    enduranceLimit_MPa: 205,
    toughness_MPaSqrtM: 90,
    parisC: 6.9e-12,
    parisM: 3.0,
    source: `Static: EN 10028-2 specified minimums for P265GH up to 16 mm (from memory). Basquin estimated from Su: σ'f ≈ Su + 345 MPa, b ≈ −0.1 (Dowling, steel estimates, from memory). Endurance limit S'e = 0.5 Su (Shigley eq. 6-8). ${BARSOM_FERRITIC}.`,
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
    enduranceLimit_MPa: 586,
    toughness_MPaSqrtM: 100,
    parisC: 1.35e-10,
    parisM: 2.25,
    source:
      "Dowling, Mechanical Behavior of Materials, Table 14.1 (static, Basquin) (from memory). Endurance limit S'e = 0.5 Su (Shigley eq. 6-8). Paris: Barsom & Rolfe, martensitic steels, 1.35×10⁻¹⁰ ΔK^2.25 (from memory).",
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
    toughness_MPaSqrtM: 150,
    parisC: 5.6e-12,
    parisM: 3.25,
    source:
      "Static: typical annealed 304 (from memory). Basquin: typical strain-life fit for annealed 304 (from memory). Paris: Barsom & Rolfe, austenitic stainless steels, 5.6×10⁻¹² ΔK^3.25 (from memory).",
  },
];

export function findMaterial(id: string): LibraryMaterial | undefined {
  return MATERIALS.find((m) => m.id === id);
}
