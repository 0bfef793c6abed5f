/**
 * Kinds of service and the defaults each sets. The lists and the defaults live here once; the
 * engine, the page and the sheet import them. Every default is one a user may change, and each
 * carries its reason so a face can show it beside the value.
 */

export const SERVICES = ["pressure-vessel", "aircraft-cabin", "other"] as const;
export type Service = (typeof SERVICES)[number];

export const STATIC_BASES = ["en13445-3", "asme-viii-1", "aircraft", "yield"] as const;
export type StaticBasis = (typeof STATIC_BASES)[number];

export const FATIGUE_CURVES = ["basquin", "welded", "en13445-welded", "en13445-unwelded"] as const;
export type FatigueCurve = (typeof FATIGUE_CURVES)[number];

/** Weld details of the picker (described and drawn in src/engine/vessel/details.ts). */
export const WELD_DETAILS = ["longitudinal-butt", "circumferential-butt", "nozzle-fillet", "attachment-fillet"] as const;
export type WeldDetail = (typeof WELD_DETAILS)[number];

export const SERVICE_LABEL: Record<Service, string> = {
  "pressure-vessel": "Pressure vessel (air receiver, process vessel, tank)",
  "aircraft-cabin": "Aircraft cabin (pressurized fuselage skin)",
  other: "Other shell",
};

export const STATIC_BASIS_LABEL: Record<StaticBasis, string> = {
  "en13445-3": "EN 13445-3 design by formula",
  "asme-viii-1": "ASME VIII-1 UG-27 shell formulas",
  aircraft: "Aircraft: limit and ultimate pressure factors",
  yield: "von Mises against yield / factor",
};

export interface Defaulted<T> {
  value: T;
  why: string;
}

export interface ServiceDefaults {
  basis: Defaulted<StaticBasis>;
  corrosionAllowance_mm: Defaulted<number>;
  thicknessTolerance_mm: Defaulted<number>;
  minimumGauge_mm: Defaulted<number>;
  /** The fatigue curve for a steel shell; other families keep the material curve. */
  steelCurve: Defaulted<FatigueCurve>;
  /** The weld detail assumed when a welded vessel curve is chosen and neither a detail nor a class is given. */
  weldDetail: Defaulted<WeldDetail>;
}

const NONE = (what: string) => ({ value: 0, why: `none unless given (${what})` });

export const SERVICE_DEFAULTS: Record<Service, ServiceDefaults> = {
  "pressure-vessel": {
    basis: { value: "en13445-3", why: "pressure-vessel service: EN 13445-3 design by formula" },
    corrosionAllowance_mm: {
      value: 1,
      why: "pressure-vessel service: 1 mm, common practice for carbon steel in wet compressed-air service",
    },
    thicknessTolerance_mm: {
      value: 0.3,
      why: "pressure-vessel service: 0.3 mm, the minus tolerance of EN 10029 class B plate (from memory)",
    },
    minimumGauge_mm: {
      value: 1.5,
      why: "pressure-vessel service: 1.5 mm exclusive of the corrosion allowance, ASME VIII-1 UG-16(b) (from memory)",
    },
    steelCurve: { value: "en13445-welded", why: "pressure-vessel service: the welded classes of EN 13445-3 clause 18" },
    weldDetail: {
      value: "attachment-fillet",
      why: "pressure-vessel service: the fillet-welded attachment, the lowest class of the common details (conservative)",
    },
  },
  "aircraft-cabin": {
    basis: { value: "aircraft", why: "aircraft-cabin service: limit and ultimate pressure factors" },
    corrosionAllowance_mm: NONE("aircraft skins are sized without one"),
    thicknessTolerance_mm: NONE("give the sheet's minus tolerance"),
    minimumGauge_mm: NONE("give the shop's least skin gauge"),
    steelCurve: { value: "basquin", why: "aircraft-cabin service: the material curve" },
    weldDetail: { value: "nozzle-fillet", why: "not used without a welded curve" },
  },
  other: {
    basis: { value: "yield", why: "other service: von Mises against yield / factor" },
    corrosionAllowance_mm: NONE("give one where the shell corrodes"),
    thicknessTolerance_mm: NONE("give the plate's minus tolerance"),
    minimumGauge_mm: NONE("give a least gauge where one applies"),
    steelCurve: { value: "basquin", why: "other service: the material curve" },
    weldDetail: { value: "nozzle-fillet", why: "not used without a welded curve" },
  },
};

export interface WeldDetailInfo {
  id: WeldDetail;
  label: string;
  /** In our own words: what the detail is and where the crack starts. */
  description: string;
  /** The welded class: the stress range in MPa at 2·10⁶ cycles. */
  class_MPa: number;
  source: string;
}

/**
 * The weld details of the picker and the class each maps to. The stress range at the weld is the
 * equivalent (Tresca) structural range of the shell at that point: across the seam for a butt weld,
 * at the opening's edge for a nozzle. Values are recalled, not read from the tables.
 */
export const WELD_DETAIL_INFO: Record<WeldDetail, WeldDetailInfo> = {
  "longitudinal-butt": {
    id: "longitudinal-butt",
    label: "Longitudinal seam, butt weld",
    description:
      "The shell plate's own seam, running along the axis; full penetration, as welded, examined. The hoop stress pulls across it; a crack starts at the toe of the weld cap.",
    class_MPa: 71,
    source: "EN 13445-3 Table 18-4, seam welds, full penetration from one side, as welded (from memory)",
  },
  "circumferential-butt": {
    id: "circumferential-butt",
    label: "Circumferential seam, butt weld",
    description:
      "The ring seam joining two shell courses or a head, often welded from one side on a backing strip. The axial stress pulls across it; the crack starts at the root.",
    class_MPa: 63,
    source: "EN 13445-3 Table 18-4, circumferential butt weld from one side on a backing strip (from memory)",
  },
  "nozzle-fillet": {
    id: "nozzle-fillet",
    label: "Nozzle, fillet-welded to the shell",
    description:
      "A branch or socket set on or through the shell and held by fillet welds. The crack starts at the weld toe in the shell, where the opening raises the stress.",
    class_MPa: 63,
    source:
      "EN 13445-3 Table 18-4, nozzle welds, weld toe in the shell (from memory); a root crack in a partial-penetration weld is a separate check",
  },
  "attachment-fillet": {
    id: "attachment-fillet",
    label: "Attachment, fillet-welded",
    description:
      "A lug, saddle pad, bracket or nameplate fillet-welded on the shell, longer than 100 mm along the stress. The crack starts at the end of the weld.",
    class_MPa: 56,
    source: "EN 13445-3 Table 18-4 and EN 1993-1-9 Table 8.4, longitudinal attachment longer than 100 mm (from memory)",
  },
};

/** Defaults that follow the static basis rather than the service. */
export const BASIS_DEFAULTS = {
  jointEfficiency: {
    value: 0.7,
    why: "0.7, the lowest joint coefficient of the codes for butt welds without volumetric testing (EN 13445-3 testing group 4; ASME VIII-1 Table UW-12, no radiography), conservative (from memory)",
  },
  limitFactor: {
    value: 1.33,
    why: "1.33 on the maximum cabin differential, common practice for the pressure-alone case (CS/14 CFR 25.365(d), from memory)",
  },
  ultimateFactor: { value: 1.5, why: "1.5, the ultimate factor of safety (CS/14 CFR 25.303, from memory)" },
} as const;
