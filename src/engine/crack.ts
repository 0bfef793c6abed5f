/**
 * Fatigue crack growth in the skin of a pressurized shell by the Paris law.
 *
 *   da/dN = C·(ΔK_eff)^m,  ΔK = M·Y(a)·Δσ·√(πa)
 * with da/dN in m/cycle and ΔK in MPa·√m (the trade convention: a is turned from mm to m
 * here), Δσ the nominal hoop stress range (the crack lies along the axis and is opened by
 * the hoop stress), Y the geometry factor (crackGeometry.ts), M Folias's bulging factor when
 * asked for (cylinders only), and optionally Walker's R-ratio form
 * ΔK_eff = ΔK/(1 − R)^(1 − γ) (Walker, ASTM STP 462 (1970); Dowling, Mechanical Behavior of
 * Materials, ch. 11). Paris & Erdogan, J. Basic Eng. 85 (1963) 528.
 *
 * The critical size is the smaller of: M·Y·σmax·√(πa) reaching the toughness K_c, and —
 * when a width is given — the net-section stress σmax·W/(W − cracked width) reaching yield.
 * The cycles from the initial to the critical size are N = ∫ da/(C·ΔK_eff^m), integrated in
 * ln a by adaptive Gauss–Kronrod to a relative accuracy of about 1e-10.
 * Leak before break (Irwin's criterion): a crack grown through the wall is about 2t long;
 * the vessel leaks first if a centre crack of half-length t is below its critical size.
 *
 * Validity: linear-elastic fracture mechanics (small-scale yielding), Paris regime (well above
 * threshold, well below K_c), constant-amplitude hoop cycles, through-thickness cracks.
 */
import {
  accurateLimit_mm,
  bulgingHalfLength_mm,
  describeFactor,
  foliasFactor,
  geometryFactor,
  growthLimit_mm,
  type CrackGeometry,
  type CrackShape,
} from "./crackGeometry.ts";
import { InputError } from "./errors.ts";
import { bracketRoot, integrate } from "./special.ts";
import { fmt, step, type Step } from "./step.ts";

export interface CrackInput {
  geometry: CrackGeometry;
  /** Half-length (centre crack) or depth from the edge or the hole's edge. */
  initial_mm: number;
  width_mm?: number;
  holeRadius_mm?: number;
  cracksAtHole?: 1 | 2;
  /** Folias bulging of a crack along the axis of a cylinder; off by default. */
  bulging?: boolean;
  form: "cylinder" | "sphere";
  shellRadius_mm: number;
  thickness_mm: number;
  hoopMax_MPa: number;
  hoopMin_MPa: number;
  yield_MPa: number;
  /** Paris coefficient, da/dN in m/cycle with ΔK in MPa·√m. */
  parisC: number;
  parisM: number;
  toughness_MPaSqrtM: number;
  /** Walker exponent γ for the R-ratio effect; off when absent. */
  walkerGamma?: number;
  inspectionFactor: number;
}

export interface CrackCurvePoint {
  a_mm: number;
  n_cycles: number;
}

export interface LeakBeforeBreak {
  leakBeforeBreak: boolean;
  throughWallHalfLength_mm: number;
  criticalHalfLength_mm: number;
}

export interface CrackResult {
  critical_mm: number;
  criticalBy: "toughness" | "net-section yield";
  /** null when the stress range is zero (no growth). */
  cycles: number | null;
  inspectionInterval_cycles: number | null;
  curve: CrackCurvePoint[];
  leakBeforeBreak: LeakBeforeBreak;
  steps: Step[];
  warnings: string[];
}

const PARIS = "Paris & Erdogan, J. Basic Eng. 85 (1963) 528: da/dN = C·ΔK^m (da/dN in m/cycle, ΔK in MPa·√m)";
const WALKER = "Walker, ASTM STP 462 (1970); Dowling, Mechanical Behavior of Materials, ch. 11 (from memory)";
const FOLIAS = "Folias, Int. J. Fracture Mech. 1 (1965) 104: axial crack in a pressurized cylinder (short form, from memory)";
const NET_SECTION = "Net-section yield of the cracked strip: σmax·W/(W − cracked width) = σy (common practice)";
const LBB =
  "Irwin's leak-before-break criterion: a through-wall crack about 2t long must be below critical (e.g. Broek, Elementary Engineering Fracture Mechanics; from memory)";
const CURVE_POINTS = 60;

/** Stress intensity at crack size a (mm) for a nominal stress σ (MPa), with the bulging factor when used. */
function stressIntensity(a_mm: number, sigma_MPa: number, shape: CrackShape, bulge: ((a: number) => number) | null): number {
  const M = bulge ? bulge(a_mm) : 1;
  return M * geometryFactor(a_mm, shape) * sigma_MPa * Math.sqrt((Math.PI * a_mm) / 1000);
}

/**
 * Crack size where K reaches K_c. K rises with a from 0 for all the geometries here (and
 * without bound towards the strip's limit), so a geometric walk from `start` brackets the
 * single crossing, which bracketRoot then narrows.
 */
function toughnessSize(start_mm: number, limit_mm: number, K: (a: number) => number, Kc: number): number {
  const g = (a: number) => K(a) - Kc;
  const top = Number.isFinite(limit_mm) ? limit_mm * (1 - 1e-12) : Infinity;
  let lo = Math.min(start_mm, top / 2);
  let hi = lo;
  for (let i = 0; i < 10000; i++) {
    if (g(lo) >= 0) {
      hi = lo;
      lo /= 1.25;
    } else if (g(hi) < 0) {
      // A stress so low that K stays below the toughness up to the strip's limit: critical only where it cuts through.
      if (hi >= top) return top;
      lo = hi;
      hi = Math.min(hi * 1.25, top);
    } else {
      return bracketRoot(g, lo, hi, 1e-13);
    }
  }
  throw new RangeError("toughnessSize: no crossing of the toughness found");
}

/**
 * Net-section yield size: the width lost (2a for a centre crack, a for an edge crack, 2(R + a)
 * or 2R + a at a hole) equals W·(1 − σmax/σy), solved for a; null without a width.
 */
function netSectionSize(shape: CrackShape, sigmaMax: number, yieldStress: number): number | null {
  const W = shape.width_mm;
  if (W === undefined) return null;
  const lost = W * (1 - sigmaMax / yieldStress);
  const R = shape.holeRadius_mm ?? 0;
  switch (shape.geometry) {
    case "center-through":
      return lost / 2;
    case "edge-through":
      return lost;
    case "hole-through":
      return shape.cracksAtHole === 2 ? lost / 2 - R : lost - 2 * R;
  }
}

function positive(value: number | undefined, path: string, message: string): void {
  if (!(value !== undefined && Number.isFinite(value) && value > 0)) throw new InputError(path, message);
}

function validate(o: CrackInput): void {
  positive(o.initial_mm, "crack.initial_mm", "The initial crack size must be a positive length in mm.");
  if (o.width_mm !== undefined) positive(o.width_mm, "crack.width_mm", "The width must be a positive length in mm.");
  if (o.geometry === "hole-through") {
    positive(o.holeRadius_mm, "crack.holeRadius_mm", "A crack at a hole needs the hole radius in mm.");
  }
  if (o.cracksAtHole !== undefined && o.cracksAtHole !== 1 && o.cracksAtHole !== 2) {
    throw new InputError("crack.cracksAtHole", "The number of cracks at the hole must be 1 or 2.");
  }
  positive(o.shellRadius_mm, "shell.radius_mm", "The shell radius must be a positive length in mm.");
  positive(o.thickness_mm, "shell.thickness_mm", "The wall thickness must be a positive length in mm.");
  positive(o.yield_MPa, "material.yield_MPa", "The yield strength must be positive.");
  positive(o.parisC, "material.parisC", "The Paris coefficient C must be positive (da/dN in m/cycle, ΔK in MPa·√m).");
  positive(o.parisM, "material.parisM", "The Paris exponent m must be positive.");
  positive(o.toughness_MPaSqrtM, "material.toughness_MPaSqrtM", "The fracture toughness must be positive, in MPa·√m.");
  if (!(Number.isFinite(o.inspectionFactor) && o.inspectionFactor >= 1)) {
    throw new InputError("crack.inspectionFactor", "The inspection factor must be 1 or more, e.g. 2.");
  }
  if (o.walkerGamma !== undefined && !(o.walkerGamma >= 0 && o.walkerGamma <= 1)) {
    throw new InputError("crack.walkerGamma", "Walker's exponent γ must lie between 0 and 1.");
  }
  if (!(Number.isFinite(o.hoopMax_MPa) && o.hoopMax_MPa > 0)) {
    throw new InputError(
      "pressure.max_MPa",
      "The hoop stress never becomes tensile, so a crack along the axis is never opened; a crack-growth check does not apply.",
    );
  }
  if (!(Number.isFinite(o.hoopMin_MPa) && o.hoopMin_MPa <= o.hoopMax_MPa)) {
    throw new InputError("pressure.min_MPa", "The minimum pressure must not exceed the maximum.");
  }
}

/** Critical size of a crack in a shape, by toughness and (with a width) net-section yield, whichever is smaller. */
function criticalSize(
  shape: CrackShape,
  sigmaMax: number,
  yieldStress: number,
  Kc: number,
  bulge: ((a: number) => number) | null,
  start_mm: number,
): { size: number; by: CrackResult["criticalBy"]; byToughness: number; byNet: number | null } {
  const K = (a: number) => stressIntensity(a, sigmaMax, shape, bulge);
  const byToughness = toughnessSize(start_mm, growthLimit_mm(shape), K, Kc);
  const byNet = netSectionSize(shape, sigmaMax, yieldStress);
  if (byNet !== null && byNet < byToughness) return { size: byNet, by: "net-section yield", byToughness, byNet };
  return { size: byToughness, by: "toughness", byToughness, byNet };
}

/**
 * Paris-law growth of a through-crack from its initial to its critical size.
 * Units: lengths in mm, stresses in MPa, toughness in MPa·√m, C with da/dN in m/cycle.
 */
export function crackGrowth(opts: CrackInput): CrackResult {
  validate(opts);
  const shape: CrackShape = {
    geometry: opts.geometry,
    width_mm: opts.width_mm,
    holeRadius_mm: opts.holeRadius_mm,
    cracksAtHole: opts.cracksAtHole ?? 1,
  };
  const a0 = opts.initial_mm;
  const sMax = opts.hoopMax_MPa;
  const Kc = opts.toughness_MPaSqrtM;
  const { parisC: C, parisM: m } = opts;
  const steps: Step[] = [];
  const warnings: string[] = [];

  const limit = growthLimit_mm(shape);
  if (a0 >= limit) {
    throw new InputError(
      "crack.initial_mm",
      `The initial crack (${fmt(a0)} mm) already cuts through the ${fmt(opts.width_mm ?? 0)} mm width.`,
    );
  }

  // Bulging: Folias's factor is for cylinders; a sphere's factor differs and is not applied.
  let bulge: ((a: number) => number) | null = null;
  if (opts.bulging && opts.form === "sphere") {
    warnings.push(
      "Bulging was asked for, but the Folias factor used here is for an axial crack in a cylinder; it is not applied to a sphere. " +
        "A sphere's skin bulges at a crack too, so crack growth and critical size read unconservatively for long cracks.",
    );
  } else if (opts.bulging) {
    bulge = (a: number) => foliasFactor(bulgingHalfLength_mm(a, shape), opts.shellRadius_mm, opts.thickness_mm);
  }

  // Stress range: the compressive part of a cycle closes the crack and does not drive it.
  const sMinEff = Math.max(opts.hoopMin_MPa, 0);
  const range = sMax - sMinEff;
  if (opts.hoopMin_MPa < 0) {
    warnings.push(
      `The hoop stress goes into compression (${fmt(opts.hoopMin_MPa)} MPa); the compressive part is taken to close the crack and is left out of the range.`,
    );
  }
  steps.push(
    step(
      "crack-range",
      "Nominal hoop stress range driving the crack",
      opts.hoopMin_MPa < 0 ? "Δσ = σmax − 0 (compressive part ignored)" : "Δσ = σmax − σmin",
      `Δσ = ${fmt(sMax)} − ${fmt(sMinEff)}`,
      range,
      "MPa",
      opts.hoopMin_MPa < 0
        ? "Crack along the axis opened by the hoop stress; compressive part ignored (common practice, e.g. Dowling ch. 11)"
        : "Crack along the axis opened by the hoop stress",
    ),
  );
  const R = sMinEff / sMax;
  let walker = 1;
  if (opts.walkerGamma !== undefined) {
    walker = 1 / (1 - R) ** (1 - opts.walkerGamma);
    steps.push(
      step(
        "crack-walker",
        "Walker factor for the stress ratio",
        "ΔK_eff/ΔK = 1/(1 − R)^(1 − γ), R = σmin/σmax",
        `1/(1 − ${fmt(R)})^(1 − ${fmt(opts.walkerGamma)})`,
        walker,
        "—",
        WALKER,
      ),
    );
  } else if (R >= 0.5) {
    warnings.push(
      `The stress ratio R = ${fmt(R)} is high; Paris constants are usually measured near R = 0.1 and cracks grow faster at high R. Consider giving Walker's exponent.`,
    );
  }

  const factor = describeFactor(shape);
  const Y0 = geometryFactor(a0, shape);
  steps.push(
    step(
      "crack-y-initial",
      "Geometry factor at the initial crack",
      factor.equation,
      `Y(${fmt(a0)} mm) = ${fmt(Y0)}`,
      Y0,
      "—",
      factor.source,
    ),
  );
  if (bulge) {
    const c0 = bulgingHalfLength_mm(a0, shape);
    steps.push(
      step(
        "crack-bulging-initial",
        "Bulging factor at the initial crack",
        "M = √(1 + 1.61·c²/(R·t))",
        `M = √(1 + 1.61 × ${fmt(c0)}² / (${fmt(opts.shellRadius_mm)} × ${fmt(opts.thickness_mm)}))`,
        bulge(a0),
        "—",
        FOLIAS,
      ),
    );
  }
  const dK0 = walker * stressIntensity(a0, range, shape, bulge);
  steps.push(
    step(
      "crack-dk-initial",
      walker !== 1 ? "Effective stress intensity range at the initial crack" : "Stress intensity range at the initial crack",
      `${walker !== 1 ? "ΔK_eff" : "ΔK"} = ${bulge ? "M·" : ""}Y·Δσ·√(πa)${walker !== 1 ? "/(1 − R)^(1 − γ)" : ""}`,
      `${walker !== 1 ? "ΔK_eff" : "ΔK"} = ${bulge ? `${fmt(bulge(a0))} × ` : ""}${fmt(Y0)} × ${fmt(range)} × √(π × ${fmt(a0 / 1000)} m)${walker !== 1 ? ` × ${fmt(walker)}` : ""}`,
      dK0,
      "MPa·√m",
      PARIS,
    ),
  );

  // Critical size.
  const crit = criticalSize(shape, sMax, opts.yield_MPa, Kc, bulge, a0);
  if (crit.byNet !== null && crit.byNet <= 0) {
    throw new InputError(
      "pressure.max_MPa",
      `The peak hoop stress (${fmt(sMax)} MPa) already yields the net section of the ${fmt(opts.width_mm ?? 0)} mm width without any crack (yield ${fmt(opts.yield_MPa)} MPa).`,
    );
  }
  const Yc = geometryFactor(crit.byToughness, shape);
  const Mc = bulge ? bulge(crit.byToughness) : 1;
  steps.push(
    step(
      "crack-critical-toughness",
      "Crack size at which the stress intensity reaches the toughness",
      "a_c = (K_c/(M·Y·σmax))²/π, Y and M at a_c",
      `a_c = (${fmt(Kc)} / (${fmt(Mc)} × ${fmt(Yc)} × ${fmt(sMax)}))² / π × 1000`,
      crit.byToughness,
      "mm",
      "Irwin: K = Y·σ·√(πa) reaching K_c (Tada, Paris & Irwin)",
    ),
  );
  if (crit.byNet !== null) {
    steps.push(
      step(
        "crack-critical-net",
        "Crack size at which the net section yields",
        "σmax·W/(W − cracked width) = σy",
        `cracked width = ${fmt(opts.width_mm ?? 0)} × (1 − ${fmt(sMax)}/${fmt(opts.yield_MPa)})`,
        crit.byNet,
        "mm",
        NET_SECTION,
      ),
    );
  }
  const ac = crit.size;
  steps.push(
    step(
      "crack-critical",
      `Critical crack size (governed by ${crit.by})`,
      "a_crit = min(a_c, a_net)",
      crit.byNet === null ? `a_crit = a_c = ${fmt(ac)}` : `a_crit = min(${fmt(crit.byToughness)}, ${fmt(crit.byNet)})`,
      ac,
      "mm",
      crit.by === "toughness" ? "Irwin: K = Y·σ·√(πa) reaching K_c" : NET_SECTION,
    ),
  );
  if (a0 >= ac) {
    throw new InputError(
      "crack.initial_mm",
      `The initial crack (${fmt(a0)} mm) is already at or beyond the critical size (${fmt(ac)} mm, by ${crit.by}); the part would fail at the first peak pressure.`,
    );
  }
  if (ac > accurateLimit_mm(shape)) {
    warnings.push(
      `The critical crack (${fmt(ac)} mm) lies beyond the range where the width correction keeps its stated accuracy (${fmt(accurateLimit_mm(shape))} mm); treat the last part of the growth as approximate.`,
    );
  }
  if (shape.geometry === "hole-through" && shape.cracksAtHole === 1) {
    warnings.push(
      "The factor for one crack at a hole is interpolated between its exact short- and long-crack limits; for cracks of about 0.3 to 3 hole radii " +
        "it may read several per cent below tabulated one-crack values, so consider two cracks for a conservative answer.",
    );
  }

  // Growth: N = ∫ da/(C·ΔK_eff^m), in u = ln a so that dN/du = a/(C·ΔK_eff^m), a in metres.
  const growthRate = (a_mm: number) => C * (walker * stressIntensity(a_mm, range, shape, bulge)) ** m; // m/cycle
  const dNdu = (u: number) => {
    const a = Math.exp(u);
    return a / 1000 / growthRate(a);
  };
  let cycles: number | null = null;
  const curve: CrackCurvePoint[] = [];
  if (range > 0) {
    const u0 = Math.log(a0);
    const u1 = Math.log(ac);
    let n = 0;
    curve.push({ a_mm: a0, n_cycles: 0 });
    for (let i = 1; i < CURVE_POINTS; i++) {
      const ua = u0 + ((u1 - u0) * (i - 1)) / (CURVE_POINTS - 1);
      const ub = i === CURVE_POINTS - 1 ? u1 : u0 + ((u1 - u0) * i) / (CURVE_POINTS - 1);
      n += integrate(dNdu, ua, ub, { relTol: 1e-12 });
      curve.push({ a_mm: Math.exp(ub), n_cycles: n });
    }
    curve[curve.length - 1].a_mm = ac;
    cycles = n;
    steps.push(
      step(
        "crack-cycles",
        "Cycles to grow the crack to its critical size",
        "N = ∫ da / (C·ΔK_eff^m), from a₀ to a_crit",
        `N = ∫ da / (${fmt(C)} × (${walker !== 1 ? `${fmt(walker)}·` : ""}${bulge ? "M·" : ""}Y·${fmt(range)}·√(πa))^${fmt(m)}), a from ${fmt(a0)} to ${fmt(ac)} mm`,
        cycles,
        "cycles",
        `${PARIS}; integrated numerically (adaptive Gauss–Kronrod in ln a)`,
      ),
    );
    // Hand check: Y (and M) held at their initial values gives the closed form of the Paris integral.
    const k0 = dK0 / Math.sqrt((Math.PI * a0) / 1000); // ΔK/√(πa) at a₀
    const hand = parisClosedForm(a0 / 1000, ac / 1000, C, m, k0 * Math.sqrt(Math.PI));
    steps.push(
      step(
        "crack-cycles-hand",
        "Hand check: cycles with the geometry factor held at its initial value",
        m === 2 ? "N = ln(a_c/a₀) / (C·k²·π), k = ΔK₀/√(πa₀)" : "N = (a₀^(1−m/2) − a_c^(1−m/2)) / (C·(k·√π)^m·(m/2 − 1)), k = ΔK₀/√(πa₀)",
        `k = ${fmt(k0)} MPa, a₀ = ${fmt(a0 / 1000)} m, a_c = ${fmt(ac / 1000)} m, C = ${fmt(C)}, m = ${fmt(m)}`,
        hand,
        "cycles",
        `${PARIS}; closed form for constant Y (differs from N where Y changes with a)`,
      ),
    );
    const interval = cycles / opts.inspectionFactor;
    steps.push(
      step(
        "crack-inspection",
        "Inspection interval",
        "N_insp = N / inspection factor",
        `N_insp = ${fmt(cycles)} / ${fmt(opts.inspectionFactor)}`,
        interval,
        "cycles",
        "Damage-tolerance practice: at least two inspections while the crack grows from detectable to critical (common practice)",
      ),
    );
  } else {
    warnings.push("The hoop stress does not vary, so the crack does not grow by fatigue; only its critical size applies.");
  }

  const leakBeforeBreak = leakCheck(opts, sMax, Kc, bulge, steps, warnings);
  return {
    critical_mm: ac,
    criticalBy: crit.by,
    cycles,
    inspectionInterval_cycles: cycles === null ? null : cycles / opts.inspectionFactor,
    curve,
    leakBeforeBreak,
    steps,
    warnings,
  };
}

/**
 * Closed-form Paris integral for a constant geometry factor, a in metres and k = Y·Δσ·√π:
 * N = (a₀^(1−m/2) − a_c^(1−m/2)) / (C·k^m·(m/2 − 1)), or ln(a_c/a₀)/(C·k²) when m = 2.
 */
export function parisClosedForm(a0_m: number, ac_m: number, C: number, m: number, k: number): number {
  if (m === 2) return Math.log(ac_m / a0_m) / (C * k * k);
  return (a0_m ** (1 - m / 2) - ac_m ** (1 - m / 2)) / (C * k ** m * (m / 2 - 1));
}

/** Leak before break: compare a through-wall centre crack of half-length t with its critical half-length. */
function leakCheck(
  opts: CrackInput,
  sMax: number,
  Kc: number,
  bulge: ((a: number) => number) | null,
  steps: Step[],
  warnings: string[],
): LeakBeforeBreak {
  const t = opts.thickness_mm;
  const centre: CrackShape = { geometry: "center-through", width_mm: opts.width_mm, cracksAtHole: 1 };
  const centreBulge = bulge ? (a: number) => foliasFactor(a, opts.shellRadius_mm, opts.thickness_mm) : null;
  const crit = criticalSize(centre, sMax, opts.yield_MPa, Kc, centreBulge, t);
  const leak = t < crit.size;
  steps.push(
    step(
      "crack-lbb",
      "Leak before break: through-wall crack half-length against its critical half-length",
      "t < c_crit (centre crack, same stress field)",
      `${fmt(t)} mm ${leak ? "<" : "≥"} ${fmt(crit.size)} mm`,
      crit.size,
      "mm",
      LBB,
    ),
  );
  if (!leak) {
    warnings.push(
      `A crack grown through the wall (about ${fmt(2 * t)} mm long) would already be critical (critical length ${fmt(2 * crit.size)} mm): the shell could burst without leaking first.`,
    );
  }
  return { leakBeforeBreak: leak, throughWallHalfLength_mm: t, criticalHalfLength_mm: crit.size };
}
