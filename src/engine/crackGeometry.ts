/**
 * Geometry factors Y for through-thickness cracks opened by the nominal hoop stress, in
 * K = Y·σ·√(πa) (Tada, Paris & Irwin, The Stress Analysis of Cracks Handbook):
 *
 *  - centre through-crack, a = half-length: Y = 1 in a wide sheet; in a strip of width W,
 *    Feddersen's secant correction Y = √sec(πa/W) (within about 0.3 % for 2a/W ≤ 0.7).
 *  - edge through-crack, a = depth: Y = 1.1215 in a half-plane; in a strip of width W the
 *    Gross–Srawley polynomial Y = 1.12 − 0.231α + 10.55α² − 21.72α³ + 30.39α⁴, α = a/W ≤ 0.6
 *    (0.5 %). Beyond 0.6 the polynomial reads low, so Tada's formula for any α is used there:
 *    Y = √(tan(πα/2)/(πα/2))·[0.752 + 2.02α + 0.37(1 − sin(πα/2))³]/cos(πα/2).
 *  - through-crack at a circular hole of radius R, a = depth from the hole's edge: Bowie's
 *    solution in uniaxial tension. Two symmetric cracks: the handbook fit
 *    F₂(s) = 0.5(3 − s)[1 + 1.243(1 − s)³], s = a/(R + a) (from memory). One crack: the
 *    quartic fit of Bowie's one-crack table in λ = R/(R + a),
 *    F₁ = 0.707 − 0.18λ + 6.55λ² − 10.54λ³ + 6.85λ⁴ (within about 1 % of the table over the
 *    whole range, 0.707 for a long crack, 3.39 at the hole's edge; the fit as quoted by Broek,
 *    Elementary Engineering Fracture Mechanics, and in Grandt's fastener-hole work, from memory).
 *    From a = 3R on, where the fit dips below the table, the long-crack limit √((2 − s)/(2s))
 *    (a centre crack of half-length R + a/2) is taken when it is larger: a conservative envelope.
 *    In a strip of width W the factor √sec(π(R + a)/W) is applied for either case.
 *    The hoop-only field is conservative for a cylinder: its axial stress lowers the
 *    hole's concentration from 3 to 2.5 (Kirsch solution for a 2:1 biaxial field).
 */
export type CrackGeometry = "center-through" | "edge-through" | "hole-through";

export interface CrackShape {
  geometry: CrackGeometry;
  width_mm?: number;
  holeRadius_mm?: number;
  cracksAtHole: 1 | 2;
}

/** Free edge factor of a shallow edge crack in a half-plane (Tada, Paris & Irwin). */
export const EDGE_HALF_PLANE = 1.1215;

/** Feddersen's secant width correction √sec(π·c/W), c the half-length of a central crack. */
export function secantCorrection(halfLength_mm: number, width_mm: number): number {
  return Math.sqrt(1 / Math.cos((Math.PI * halfLength_mm) / width_mm));
}

/** Gross–Srawley polynomial for a single edge crack in a strip, α = a/W ≤ 0.6. */
export function grossSrawley(alpha: number): number {
  return 1.12 + alpha * (-0.231 + alpha * (10.55 + alpha * (-21.72 + alpha * 30.39)));
}

/** Tada's formula for a single edge crack in a strip, any α = a/W below 1. */
export function tadaEdge(alpha: number): number {
  const x = (Math.PI * alpha) / 2;
  const bracket = 0.752 + 2.02 * alpha + 0.37 * (1 - Math.sin(x)) ** 3;
  return (Math.sqrt(Math.tan(x) / x) * bracket) / Math.cos(x);
}

/** Bowie's two symmetric cracks at a hole, as fitted: F₂(s) = 0.5(3 − s)[1 + 1.243(1 − s)³]. */
export function bowieTwoCracks(s: number): number {
  return 0.5 * (3 - s) * (1 + 1.243 * (1 - s) ** 3);
}

/**
 * Bowie's one crack at a hole, quartic fit in λ = R/(R + a):
 * F₁ = 0.707 − 0.18λ + 6.55λ² − 10.54λ³ + 6.85λ⁴ (from memory; see the module comment).
 */
export function bowieOneCrack(s: number): number {
  const l = 1 - s;
  // biome-ignore lint/suspicious/noApproximativeNumericConstant: 0.707 is the fit's published leading coefficient, not 1/√2
  const fit = 0.707 + l * (-0.18 + l * (6.55 + l * (-10.54 + l * 6.85)));
  // Beyond a = 3R the fit dips up to 2 % below the table; the long-crack limit (a centre crack of
  // half-length R + a/2, √((2 − s)/(2s))) lies above the table there, so the larger is taken.
  return s >= 0.75 ? Math.max(fit, Math.sqrt((2 - s) / (2 * s))) : fit;
}

/** The geometry factor Y at crack size a (mm). */
export function geometryFactor(a_mm: number, shape: CrackShape): number {
  const W = shape.width_mm;
  switch (shape.geometry) {
    case "center-through":
      return W === undefined ? 1 : secantCorrection(a_mm, W);
    case "edge-through": {
      if (W === undefined) return EDGE_HALF_PLANE;
      const alpha = a_mm / W;
      return alpha <= 0.6 ? grossSrawley(alpha) : tadaEdge(alpha);
    }
    case "hole-through": {
      const R = shape.holeRadius_mm ?? 0;
      const s = a_mm / (R + a_mm);
      const width = W === undefined ? 1 : secantCorrection(R + a_mm, W);
      return (shape.cracksAtHole === 1 ? bowieOneCrack(s) : bowieTwoCracks(s)) * width;
    }
  }
}

/** The factor's equation and source, for the worked steps. */
export function describeFactor(shape: CrackShape): { equation: string; source: string } {
  const TPI = "Tada, Paris & Irwin, The Stress Analysis of Cracks Handbook";
  const hasWidth = shape.width_mm !== undefined;
  switch (shape.geometry) {
    case "center-through":
      return hasWidth
        ? { equation: "Y = √sec(πa/W)", source: `${TPI}: centre crack in a strip, Feddersen's secant correction` }
        : { equation: "Y = 1", source: `${TPI}: centre crack in an infinite sheet` };
    case "edge-through":
      return hasWidth
        ? {
            equation: "Y = 1.12 − 0.231α + 10.55α² − 21.72α³ + 30.39α⁴, α = a/W",
            source: `${TPI}: single edge crack in a strip, Gross–Srawley polynomial (α ≤ 0.6; Tada's formula beyond)`,
          }
        : { equation: "Y = 1.1215", source: `${TPI}: edge crack in a half-plane` };
    case "hole-through": {
      const width = hasWidth ? "·√sec(π(R + a)/W)" : "";
      return {
        equation:
          shape.cracksAtHole === 1
            ? `Y = 0.707 − 0.18λ + 6.55λ² − 10.54λ³ + 6.85λ⁴${width}, λ = R/(R + a)`
            : `Y = 0.5(3 − s)[1 + 1.243(1 − s)³]${width}, s = a/(R + a)`,
        source:
          (shape.cracksAtHole === 1
            ? "Bowie's one crack at a hole: quartic fit of the table (Broek, Elementary Engineering Fracture Mechanics; from memory)"
            : `${TPI}: Bowie's two cracks at a hole, handbook fit (from memory)`) +
          (hasWidth ? "; secant width correction on R + a" : "") +
          "; uniaxial hoop field (conservative under the cylinder's axial stress)",
      };
    }
  }
}

/**
 * Half-length of the through-crack seen from afar, for the shell bulging factor:
 * the crack itself for centre and edge cracks, hole and cracks together at a hole
 * (R + a for two cracks, R + a/2 for one).
 */
export function bulgingHalfLength_mm(a_mm: number, shape: CrackShape): number {
  const R = shape.holeRadius_mm ?? 0;
  if (shape.geometry !== "hole-through") return a_mm;
  return shape.cracksAtHole === 2 ? R + a_mm : R + a_mm / 2;
}

/** Largest crack size for which the factor is defined: the strip is cut through (Infinity without a width). */
export function growthLimit_mm(shape: CrackShape): number {
  const W = shape.width_mm;
  if (W === undefined) return Infinity;
  const R = shape.holeRadius_mm ?? 0;
  switch (shape.geometry) {
    case "center-through":
      return W / 2;
    case "edge-through":
      return W;
    case "hole-through":
      return W / 2 - R;
  }
}

/** Largest crack size for which the factor keeps its stated accuracy (Infinity when unlimited). */
export function accurateLimit_mm(shape: CrackShape): number {
  const W = shape.width_mm;
  if (W === undefined) return Infinity;
  const R = shape.holeRadius_mm ?? 0;
  switch (shape.geometry) {
    case "center-through":
      return 0.35 * W; // 2a/W ≤ 0.7 for the secant correction
    case "edge-through":
      return 0.6 * W; // Gross–Srawley range
    case "hole-through":
      return 0.35 * W - R; // secant correction on R + a
  }
}

/** The orientation of a through-crack in the shell: along the axis (opened by the hoop stress) or around it (by the axial stress). */
export type CrackOrientation = "axial" | "circumferential";

export interface BulgingFactor {
  /** The coefficient k in M = √(1 + k·c²/(R·t)). */
  k: number;
  /** Largest c²/(R·t) for which the fit is quoted. */
  range: number;
  source: string;
}

/**
 * Bulging factors for a through-crack of half-length c in a pressurized shell of radius R and
 * wall t, M = √(1 + k·c²/(R·t)) (short forms of Folias's shallow-shell solutions, from memory):
 *  - axial crack in a cylinder, k = 1.61 (Folias, Int. J. Fracture Mech. 1 (1965) 104; the
 *    form BS 7910 and R6 use for M_T; quoted to c²/(R·t) = 50, where it errs high, i.e. safe);
 *  - circumferential crack in a cylinder, k = 0.32 (Folias / Erdogan & Ratwani, quoted to
 *    c²/(R·t) ≈ 10);
 *  - any crack in a sphere, k = 1.93 (Folias, the spherical shell; quoted to c/√(R·t) ≈ 3,
 *    c²/(R·t) ≈ 10).
 */
export function bulgingFactorFor(form: "cylinder" | "sphere", orientation: CrackOrientation): BulgingFactor {
  if (form === "sphere")
    return {
      k: 1.93,
      range: 10,
      source: "Folias, through-crack in a pressurized spherical shell: M = √(1 + 1.93·c²/(R·t)) (short form, from memory)",
    };
  if (orientation === "circumferential")
    return {
      k: 0.32,
      range: 10,
      source: "Folias; Erdogan & Ratwani: circumferential through-crack in a cylinder, M = √(1 + 0.32·c²/(R·t)) (short form, from memory)",
    };
  return {
    k: 1.61,
    range: 50,
    source:
      "Folias, Int. J. Fracture Mech. 1 (1965) 104: axial through-crack in a pressurized cylinder, M = √(1 + 1.61·c²/(R·t)) (short form as in BS 7910 and R6, from memory)",
  };
}

/** M = √(1 + k·c²/(R·t)). */
export function bulgingFactor(halfLength_mm: number, shellRadius_mm: number, thickness_mm: number, k: number): number {
  return Math.sqrt(1 + (k * halfLength_mm * halfLength_mm) / (shellRadius_mm * thickness_mm));
}

/**
 * Folias's bulging factor for an axial through-crack in a pressurized cylinder,
 * M = √(1 + 1.61·c²/(R·t)), c the crack half-length, R the shell radius, t the wall
 * (Folias, Int. J. Fracture Mech. 1 (1965) 104; the common short form, from memory).
 * It reads higher than later fits for long cracks, which errs on the safe side.
 */
export function foliasFactor(halfLength_mm: number, shellRadius_mm: number, thickness_mm: number): number {
  return bulgingFactor(halfLength_mm, shellRadius_mm, thickness_mm, 1.61);
}
