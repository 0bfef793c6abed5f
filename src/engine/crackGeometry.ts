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
 *    solution for two symmetric cracks in uniaxial tension as fitted in the handbook,
 *    F₂(s) = 0.5(3 − s)[1 + 1.243(1 − s)³], s = a/(R + a) (from memory). Its limits: s → 0
 *    gives 3 × 1.1215, an edge crack at the hole's stress concentration of 3; s → 1 gives 1,
 *    a centre crack of half-length R + a. One crack: F₁ = F₂·√((2 − s)/2), the ratio of the
 *    long-crack limits (a single long crack acts as a centre crack of half-length R + a/2);
 *    exact at both ends, an interpolation between (stated here from the limits, not from a
 *    table). In a strip of width W the factor √sec(π(R + a)/W) is applied for either case.
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
      const single = shape.cracksAtHole === 1 ? Math.sqrt((2 - s) / 2) : 1;
      const width = W === undefined ? 1 : secantCorrection(R + a_mm, W);
      return bowieTwoCracks(s) * single * width;
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
      const single = shape.cracksAtHole === 1 ? "·√((2 − s)/2)" : "";
      const width = hasWidth ? "·√sec(π(R + a)/W)" : "";
      return {
        equation: `Y = 0.5(3 − s)[1 + 1.243(1 − s)³]${single}${width}, s = a/(R + a)`,
        source:
          `${TPI}: Bowie's cracks at a hole, handbook fit for two cracks (from memory)` +
          (shape.cracksAtHole === 1 ? "; one crack scaled by the ratio of the long-crack limits" : "") +
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

/**
 * Folias's bulging factor for an axial through-crack in a pressurized cylinder,
 * M = √(1 + 1.61·c²/(R·t)), c the crack half-length, R the shell radius, t the wall
 * (Folias, Int. J. Fracture Mech. 1 (1965) 104; the common short form, from memory).
 * It reads higher than later fits for long cracks, which errs on the safe side.
 */
export function foliasFactor(halfLength_mm: number, shellRadius_mm: number, thickness_mm: number): number {
  return Math.sqrt(1 + (1.61 * halfLength_mm * halfLength_mm) / (shellRadius_mm * thickness_mm));
}
