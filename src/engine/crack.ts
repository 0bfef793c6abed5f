/**
 * Fatigue crack growth and residual strength of a through-crack in the skin of a pressurized
 * shell, for one orientation of the crack.
 *
 *   da/dN = C·(ΔK_eff)^m,  ΔK = M·Y(a)·β(a)·Δσ·√(πa)
 * with da/dN in m/cycle and ΔK in MPa·√m (the trade convention: a is turned from mm to m
 * here), Δσ the nominal stress range opening the crack (the hoop stress for a crack along the
 * axis, the axial stress for a crack around it), Y the geometry factor (crackGeometry.ts), M the
 * bulging factor of the shell (Folias; on by default), β the correction for a stress gradient
 * along the crack's path (weightFunction.ts; 1 in a uniform field), and optionally Walker's
 * R-ratio form ΔK_eff = ΔK/(1 − R)^(1 − γ) (Walker, ASTM STP 462 (1970); Dowling, Mechanical
 * Behavior of Materials, ch. 11). Paris & Erdogan, J. Basic Eng. 85 (1963) 528.
 *
 * The critical size comes from the failure assessment diagram (fad.ts): Kr = K/K_mat against
 * Lr = σ_ref/σy, with σ_ref the larger of the bulged stress M·σmax (local collapse of the shell,
 * as BS 7910 takes it for a through-wall flaw in a cylinder) and, with a width, the net-section
 * stress σmax·W/(W − cracked width). A crack growing toward an opening links up with it when
 * its ligament is gone, which is critical too.
 *
 * The cycles between two sizes are N = ∫ da/(C·ΔK_eff^m), integrated in ln a by adaptive
 * Gauss–Kronrod. The inspection programme: threshold = N(initial → critical)/factor, repeat
 * interval = N(detectable → critical)/factor.
 *
 * Validity: fracture mechanics of through-thickness cracks, Paris regime (well above threshold,
 * well below K_c), no load-interaction (retardation) effects.
 */
import {
  accurateLimit_mm,
  bulgingFactor,
  bulgingFactorFor,
  bulgingHalfLength_mm,
  describeFactor,
  geometryFactor,
  growthLimit_mm,
  type CrackGeometry,
  type CrackOrientation,
  type CrackShape,
} from "./crackGeometry.ts";
import { InputError } from "./errors.ts";
import { fadCriticalSize, lrCutOff, type CriticalBy, type FadResult } from "./fad.ts";
import { integrate } from "./special.ts";
import { fmt, step, type Step } from "./step.ts";
import { MPa, mm, n, say, type Warning } from "./phrase.ts";
import { effectiveStress } from "./weightFunction.ts";

/** The stress normal to a crack's path at a point of it, as coefficients of the nominal hoop and axial stresses. */
export interface PathField {
  hoopCoeff: number;
  axialCoeff: number;
}

/** A crack from a fastener hole growing into the field of a nearby opening. */
export interface CrackGradient {
  /** The stress the part carries at distance x (mm) from the hole's edge along the path, without the hole, over the nominal stress. */
  field: (x_mm: number) => number;
  /** Distance from the hole's edge to the opening's edge along the path: the crack links up there. */
  ligament_mm: number;
  /** Where the field comes from, for the steps. */
  source: string;
}

export interface CrackInput {
  geometry: CrackGeometry;
  /** Half-length (centre crack) or depth from the edge or the hole's edge: the flaw assumed at the start of service. */
  initial_mm: number;
  /** The size an inspection finds reliably; sets the repeat interval. */
  detectable_mm?: number;
  width_mm?: number;
  holeRadius_mm?: number;
  cracksAtHole?: 1 | 2;
  /** "axial": along the axis, opened by the hoop stress; "circumferential": around it, opened by the axial stress. */
  orientation?: CrackOrientation;
  /** The shell's bulging at the crack; on by default (off is unconservative and warns). */
  bulging?: boolean;
  form: "cylinder" | "sphere";
  shellRadius_mm: number;
  thickness_mm: number;
  /** Nominal stress opening the crack at the peak and at the valley of the cycle. */
  stressMax_MPa: number;
  stressMin_MPa: number;
  yield_MPa: number;
  /** For the cut-off of the failure assessment diagram; yield when absent (Lr,max = 1, conservative). */
  ultimate_MPa?: number;
  /** Paris coefficient, da/dN in m/cycle with ΔK in MPa·√m. */
  parisC: number;
  parisM: number;
  toughness_MPaSqrtM: number;
  /** Walker exponent γ for the R-ratio effect; off when absent. */
  walkerGamma?: number;
  inspectionFactor: number;
  /** A stress gradient along the path (hole-through only). */
  gradient?: CrackGradient;
  /** Skip the leak-before-break check (it is made for the axial crack only). */
  leakCheck?: boolean;
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
  orientation: CrackOrientation;
  stressMax_MPa: number;
  range_MPa: number;
  critical_mm: number;
  criticalBy: CriticalBy;
  fad: Omit<FadResult, "by" | "critical_mm">;
  /** null when the stress range is zero (no growth). */
  cycles: number | null;
  threshold_cycles: number | null;
  /** null without a detectable size; 0 when the detectable size is already critical. */
  repeatInterval_cycles: number | null;
  /** The repeat interval with a detectable size, else the threshold. */
  inspectionInterval_cycles: number | null;
  curve: CrackCurvePoint[];
  /** With a gradient: the same crack grown as if the field were uniform (the hole alone). */
  uniform?: { cycles: number | null; critical_mm: number; curve: CrackCurvePoint[] };
  leakBeforeBreak: LeakBeforeBreak | null;
  steps: Step[];
  warnings: Warning[];
}

const PARIS = "Paris & Erdogan, J. Basic Eng. 85 (1963) 528: da/dN = C·ΔK^m (da/dN in m/cycle, ΔK in MPa·√m)";
const WALKER = "Walker, ASTM STP 462 (1970); Dowling, Mechanical Behavior of Materials, ch. 11 (from memory)";
const FAD = "BS 7910 / R6 Option 1 failure assessment diagram (from memory)";
const LBB =
  "Irwin's leak-before-break criterion: a through-wall crack about 2t long must be below critical (e.g. Broek, Elementary Engineering Fracture Mechanics; from memory)";
const CLOSURE =
  "Compressive part of the cycle left out: a through-crack closes in compression and does not grow (ASTM E647 takes ΔK = Kmax for R ≤ 0); common practice";
const CURVE_POINTS = 60;

function positive(value: number | undefined, path: string, message: string): void {
  if (!(value !== undefined && Number.isFinite(value) && value > 0)) throw new InputError(path, message);
}

function validate(o: CrackInput): void {
  positive(o.initial_mm, "crack.initial_mm", "The initial crack size must be a positive length in mm.");
  if (o.detectable_mm !== undefined)
    positive(o.detectable_mm, "crack.detectable_mm", "The detectable crack size must be a positive length in mm.");
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
  if (!(Number.isFinite(o.stressMax_MPa) && o.stressMax_MPa > 0)) {
    throw new InputError(
      o.orientation === "circumferential" ? "crack.orientation" : "pressure.max_MPa",
      o.orientation === "circumferential"
        ? "The axial stress never becomes tensile, so a crack around the shell is never opened; choose the axial orientation."
        : "The hoop stress never becomes tensile, so a crack along the axis is never opened; a crack-growth check does not apply.",
    );
  }
  if (!(Number.isFinite(o.stressMin_MPa) && o.stressMin_MPa <= o.stressMax_MPa)) {
    throw new InputError("pressure.min_MPa", "The minimum pressure must not exceed the maximum.");
  }
  if (o.gradient && o.geometry !== "hole-through")
    throw new InputError(
      "crack.openingDistance_mm",
      "A crack growing toward an opening must start at a hole: choose the hole-through geometry.",
    );
  if (o.gradient)
    positive(
      o.gradient.ligament_mm,
      "crack.openingDistance_mm",
      "The fastener hole must lie clear of the opening: its edge must not reach the opening's edge.",
    );
}

/** Width lost to the crack (and its hole) across a strip, for the net-section stress. */
function lostWidth(a_mm: number, shape: CrackShape): number {
  const R = shape.holeRadius_mm ?? 0;
  switch (shape.geometry) {
    case "center-through":
      return 2 * a_mm;
    case "edge-through":
      return a_mm;
    case "hole-through":
      return shape.cracksAtHole === 2 ? 2 * (R + a_mm) : 2 * R + a_mm;
  }
}

interface Model {
  shape: CrackShape;
  /** Bulging factor at crack size a; 1 when off. */
  M: (a_mm: number) => number;
  /** Gradient correction at crack size a; 1 in a uniform field. */
  beta: (a_mm: number) => number;
  limit_mm: number;
}

/** K (MPa·√m) at crack size a (mm) for a nominal stress σ (MPa). */
function stressIntensity(model: Model, a_mm: number, sigma_MPa: number): number {
  return model.M(a_mm) * model.beta(a_mm) * geometryFactor(a_mm, model.shape) * sigma_MPa * Math.sqrt((Math.PI * a_mm) / 1000);
}

/** Reference stress of the cracked skin: the bulged stress M·σ and, with a width, the net-section stress; the larger. */
function referenceStress(model: Model, a_mm: number, sigma_MPa: number): number {
  const bulged = model.M(a_mm) * sigma_MPa;
  const W = model.shape.width_mm;
  if (W === undefined) return bulged;
  const ligament = W - lostWidth(a_mm, model.shape);
  const net = ligament > 0 ? (sigma_MPa * W) / ligament : Infinity;
  return Math.max(bulged, net);
}

/** Cycles to grow from a to b (mm) in the model; the growth rate in m/cycle. */
function cyclesBetween(rate: (a_mm: number) => number, a_mm: number, b_mm: number): number {
  if (b_mm <= a_mm) return 0;
  return integrate((u) => Math.exp(u) / 1000 / rate(Math.exp(u)), Math.log(a_mm), Math.log(b_mm), { relTol: 1e-10 });
}

function growthCurve(rate: (a_mm: number) => number, a0: number, ac: number): { cycles: number; curve: CrackCurvePoint[] } {
  const u0 = Math.log(a0);
  const u1 = Math.log(ac);
  const curve: CrackCurvePoint[] = [{ a_mm: a0, n_cycles: 0 }];
  let n = 0;
  for (let i = 1; i < CURVE_POINTS; i++) {
    const ua = u0 + ((u1 - u0) * (i - 1)) / (CURVE_POINTS - 1);
    const ub = i === CURVE_POINTS - 1 ? u1 : u0 + ((u1 - u0) * i) / (CURVE_POINTS - 1);
    n += integrate((u) => Math.exp(u) / 1000 / rate(Math.exp(u)), ua, ub, { relTol: 1e-11 });
    curve.push({ a_mm: Math.exp(ub), n_cycles: n });
  }
  curve[curve.length - 1].a_mm = ac;
  return { cycles: n, curve };
}

/**
 * What every stage of one crack's assessment shares: the input, the names it is reported under,
 * the model, and the steps and warnings written so far (in the order the sheet shows them).
 */
interface Stage {
  opts: CrackInput;
  orientation: CrackOrientation;
  /** Step id in this orientation's namespace. */
  id: (name: string) => string;
  /** "axial crack" or "circumferential crack", for titles and warnings. */
  which: string;
  /** "hoop" or "axial": the nominal stress that opens the crack. */
  stressName: string;
  steps: Step[];
  warnings: Warning[];
}

/** The bulging and gradient terms of the model, and whether bulging is on. */
interface ModelStage {
  model: Model;
  bulgingOn: boolean;
  factorM: ReturnType<typeof bulgingFactorFor>;
}

/**
 * Stage 1, the model: geometry factor, bulging factor and stress-gradient correction as functions
 * of the crack size, and the size the crack cannot grow past. Everything later reads K through
 * this one model, so the diagram, the growth integral and the hand check agree on the same K.
 */
function crackModel(st: Stage, shape: CrackShape): ModelStage {
  const { opts, which } = st;
  const a0 = opts.initial_mm;
  let limit = growthLimit_mm(shape);
  if (opts.gradient) limit = Math.min(limit, opts.gradient.ligament_mm);
  if (a0 >= limit) {
    throw new InputError(
      "crack.initial_mm",
      opts.gradient && opts.gradient.ligament_mm <= growthLimit_mm(shape)
        ? `The initial crack (${fmt(a0)} mm) already reaches the opening (${fmt(opts.gradient.ligament_mm)} mm from the hole's edge).`
        : `The initial crack (${fmt(a0)} mm) already cuts through the ${fmt(opts.width_mm ?? 0)} mm width.`,
    );
  }
  // Bulging: on by default; the sphere has its own factor, the circumferential crack its own.
  const bulgingOn = opts.bulging ?? true;
  const factorM = bulgingFactorFor(opts.form, st.orientation);
  const M = bulgingOn
    ? (a: number) => bulgingFactor(bulgingHalfLength_mm(a, shape), opts.shellRadius_mm, opts.thickness_mm, factorM.k)
    : () => 1;
  if (!bulgingOn)
    st.warnings.push(
      `Bulging is switched off for the ${which}: the shell's skin bulges out at a crack under pressure, which raises the stress intensity. ` +
        "Without it the critical size and the crack-growth life read unconservatively (long), more so for long cracks.",
    );
  const gradient = opts.gradient;
  const R = shape.holeRadius_mm ?? 0;
  const beta = gradient ? (a: number) => effectiveStress(gradient.field, a, R) : () => 1;
  return { model: { shape, M, beta, limit_mm: limit }, bulgingOn, factorM };
}

/**
 * Stage 2, the driving range: the compressive part of a cycle closes a through-crack and does not
 * drive it, so the range runs from the larger of the valley and zero; Walker's factor (when given)
 * turns it into the equivalent range at R = 0, since Paris constants are measured near R = 0.1.
 */
function drivingRange(st: Stage): { range: number; sMinEff: number; walker: number } {
  const { opts, which, stressName, orientation } = st;
  const sMax = opts.stressMax_MPa;
  const sMinEff = Math.max(opts.stressMin_MPa, 0);
  const range = sMax - sMinEff;
  // A valley below zero by rounding only (−7×10⁻¹⁵ MPa from a history that empties to zero) is not compression.
  if (opts.stressMin_MPa < -1e-9 * Math.abs(sMax)) {
    st.warnings.push(
      say`The ${stressName} stress goes into compression (${MPa(opts.stressMin_MPa)}); the compressive part is taken to close the ${which} and is left out of its range.`,
    );
  }
  st.steps.push(
    step(
      st.id("range"),
      `Nominal ${stressName} stress range driving the ${which}`,
      opts.stressMin_MPa < 0 ? "Δσ = σmax − 0 (compressive part left out)" : "Δσ = σmax − σmin",
      `Δσ = ${fmt(sMax)} − ${fmt(sMinEff)}`,
      range,
      "MPa",
      opts.stressMin_MPa < 0
        ? `${orientation === "circumferential" ? "Crack around the shell opened by the axial stress" : "Crack along the axis opened by the hoop stress"}; ${CLOSURE}`
        : orientation === "circumferential"
          ? "Crack around the shell opened by the axial stress"
          : "Crack along the axis opened by the hoop stress",
    ),
  );
  const Rratio = sMinEff / sMax;
  let walker = 1;
  if (opts.walkerGamma !== undefined) {
    walker = 1 / (1 - Rratio) ** (1 - opts.walkerGamma);
    st.steps.push(
      step(
        st.id("walker"),
        `Walker factor for the stress ratio (${which})`,
        "ΔK_eff/ΔK = 1/(1 − R)^(1 − γ), R = σmin/σmax",
        `1/(1 − ${fmt(Rratio)})^(1 − ${fmt(opts.walkerGamma)})`,
        walker,
        "—",
        WALKER,
      ),
    );
  } else if (Rratio >= 0.5) {
    st.warnings.push(
      say`The stress ratio R = ${n(Rratio)} is high; Paris constants are usually measured near R = 0.1 and cracks grow faster at high R. Consider giving Walker's exponent.`,
    );
  }
  return { range, sMinEff, walker };
}

/**
 * Stage 3, the factors at the initial flaw: each term of ΔK written out once where the reader can
 * check it by hand (Y, M, β and the range they multiply), before the integrals hide them.
 */
function initialFactors(st: Stage, ms: ModelStage, range: number, walker: number): number {
  const { opts, which } = st;
  const { model, bulgingOn, factorM } = ms;
  const { shape, M, beta } = model;
  const a0 = opts.initial_mm;
  const gradient = opts.gradient;
  const factor = describeFactor(shape);
  const Y0 = geometryFactor(a0, shape);
  st.steps.push(
    step(
      st.id("y-initial"),
      `Geometry factor at the initial ${which}`,
      factor.equation,
      `Y(${fmt(a0)} mm) = ${fmt(Y0)}`,
      Y0,
      "—",
      factor.source,
    ),
  );
  if (bulgingOn) {
    const c0 = bulgingHalfLength_mm(a0, shape);
    st.steps.push(
      step(
        st.id("bulging-initial"),
        `Bulging factor at the initial ${which}${opts.form === "sphere" ? " (sphere)" : ""}`,
        `M = √(1 + ${factorM.k}·c²/(R·t)), c the half-length seen from afar`,
        `M = √(1 + ${factorM.k} × ${fmt(c0)}² / (${fmt(opts.shellRadius_mm)} × ${fmt(opts.thickness_mm)}))`,
        M(a0),
        "—",
        factorM.source,
      ),
    );
  }
  if (gradient) {
    st.steps.push(
      step(
        st.id("gradient-initial"),
        "Stress-gradient correction at the initial crack (the opening's field along the path)",
        "β = ∫σ(x)·k(x)·m(x,a) dx / ∫k(x)·m(x,a) dx, k the hole's Kirsch field, m the edge-crack Green's function",
        `β(${fmt(a0)} mm) = ${fmt(beta(a0))}; ligament to the opening ${fmt(gradient.ligament_mm)} mm`,
        beta(a0),
        "—",
        `Tada, Paris & Irwin, edge crack with point loads (Hartranft–Sih form, from memory), compounded with Bowie's factor; field: ${gradient.source}`,
      ),
    );
  }
  const dK0 = walker * stressIntensity(model, a0, range);
  const parts = termsOf(st, bulgingOn);
  st.steps.push(
    step(
      st.id("dk-initial"),
      `${walker !== 1 ? "Effective stress intensity range" : "Stress intensity range"} at the initial ${which}`,
      `${walker !== 1 ? "ΔK_eff" : "ΔK"} = ${parts}Y·Δσ·√(πa)${walker !== 1 ? "/(1 − R)^(1 − γ)" : ""}`,
      `${walker !== 1 ? "ΔK_eff" : "ΔK"} = ${bulgingOn ? `${fmt(M(a0))} × ` : ""}${gradient ? `${fmt(beta(a0))} × ` : ""}${fmt(Y0)} × ${fmt(range)} × √(π × ${fmt(a0 / 1000)} m)${walker !== 1 ? ` × ${fmt(walker)}` : ""}`,
      dK0,
      "MPa·√m",
      PARIS,
    ),
  );
  return dK0;
}

/** The optional factors in front of Y, as the equations write them ("M·β·"). */
function termsOf(st: Stage, bulgingOn: boolean): string {
  return `${bulgingOn ? "M·" : ""}${st.opts.gradient ? "β·" : ""}`;
}

/** The failure assessment of a model from a start size: the critical size by the diagram. */
function assess(st: Stage, mdl: Model, start: number): FadResult {
  const { opts } = st;
  return fadCriticalSize({
    K: (a) => stressIntensity(mdl, a, opts.stressMax_MPa),
    sigmaRef: (a) => referenceStress(mdl, a, opts.stressMax_MPa),
    toughness_MPaSqrtM: opts.toughness_MPaSqrtM,
    yield_MPa: opts.yield_MPa,
    ultimate_MPa: opts.ultimate_MPa ?? opts.yield_MPa,
    start_mm: start,
    limit_mm: mdl.limit_mm,
  });
}

/**
 * Stage 4, the critical size by the failure assessment diagram: residual strength, not LEFM alone.
 * Both limits of the diagram are written out (toughness at Kr = 1, collapse at Lr,max) so the
 * reader sees which one the interaction lies near; a crack that reaches the opening first is
 * critical by link-up. A section already at collapse without a crack, or a flaw already critical,
 * is an input problem, not a result.
 */
function criticalSize(st: Stage, ms: ModelStage): { fad: FadResult; ac: number; by: CriticalBy } {
  const { opts, which, stressName } = st;
  const { model, bulgingOn, factorM } = ms;
  const { shape, M, beta } = model;
  const a0 = opts.initial_mm;
  const sMax = opts.stressMax_MPa;
  const Kc = opts.toughness_MPaSqrtM;
  const gradient = opts.gradient;
  const limit = model.limit_mm;
  const parts = termsOf(st, bulgingOn);
  const W = opts.width_mm;
  if (referenceStress(model, 1e-9, sMax) / opts.yield_MPa >= lrCutOff(opts.yield_MPa, opts.ultimate_MPa ?? opts.yield_MPa)) {
    throw new InputError(
      "pressure.max_MPa",
      `The peak ${stressName} stress (${fmt(sMax)} MPa) already reaches the collapse limit of the section without any crack (flow stress ${fmt(((opts.ultimate_MPa ?? opts.yield_MPa) + opts.yield_MPa) / 2)} MPa).`,
    );
  }
  const fad = assess(st, model, a0);
  let ac = fad.critical_mm;
  let by: CriticalBy = fad.by;
  const linkUp = gradient !== undefined && ac >= gradient.ligament_mm * (1 - 1e-9);
  if (linkUp) {
    ac = gradient.ligament_mm;
    by = "link-up";
  }
  const Yc = geometryFactor(fad.lefm_mm, shape);
  const Mc = M(fad.lefm_mm);
  st.steps.push(
    step(
      st.id("critical-toughness"),
      `LEFM limit: ${which} size at which the stress intensity reaches the toughness (Kr = 1)`,
      `a_K: ${parts}Y·σmax·√(πa) = K_mat`,
      `${bulgingOn ? `${fmt(Mc)} × ` : ""}${gradient ? `${fmt(beta(fad.lefm_mm))} × ` : ""}${fmt(Yc)} × ${fmt(sMax)} × √(π × ${fmt(fad.lefm_mm / 1000)} m) = ${fmt(Kc)}`,
      fad.lefm_mm,
      "mm",
      "Irwin: K = Y·σ·√(πa) reaching K_c (Tada, Paris & Irwin); the Kr = 1 limit of the diagram",
    ),
  );
  st.steps.push(
    step(
      st.id("critical-collapse"),
      `Collapse limit: ${which} size at which the reference stress reaches the flow stress (Lr = Lr,max)`,
      W === undefined
        ? "σ_ref = M·σmax = Lr,max·σy, Lr,max = (σy + σu)/(2σy)"
        : "σ_ref = max(M·σmax, σmax·W/(W − cracked width)) = Lr,max·σy",
      `Lr,max = (${fmt(opts.yield_MPa)} + ${fmt(opts.ultimate_MPa ?? opts.yield_MPa)})/(2 × ${fmt(opts.yield_MPa)}) = ${fmt(fad.LrMax)}`,
      fad.collapse_mm >= limit * (1 - 1e-9) && !Number.isFinite(limit) ? null : fad.collapse_mm,
      "mm",
      `${FAD}; reference stress of a through-wall flaw in a shell with the bulging factor (BS 7910, from memory)${W === undefined ? "" : "; net section of the strip (common practice)"}`,
    ),
  );
  st.steps.push(
    step(
      st.id("critical-fad"),
      linkUp
        ? `Failure assessment of the ${which} along the ligament: no critical size before the opening's edge (the point shown is at that edge)`
        : `Critical ${which} size by the failure assessment diagram (set by ${fad.by === "toughness" ? "the toughness" : fad.by === "collapse" ? "collapse" : "the interaction of fracture and collapse"})`,
      "Kr = f(Lr), f = (1 + 0.5Lr²)^(−1/2)·[0.3 + 0.7·exp(−0.6Lr⁶)], Lr ≤ Lr,max",
      `at a = ${fmt(fad.critical_mm)} mm: Lr = ${fmt(fad.Lr)}, Kr = ${fmt(fad.Kr)}, f(Lr) = ${fmt(fad.Lr >= fad.LrMax ? 0 : fad.Kr)}`,
      fad.critical_mm,
      "mm",
      `${FAD}; toughness when within 5 % of the LEFM size, collapse on the cut-off or within 5 % of the collapse size, else the interaction`,
    ),
  );
  if (linkUp) {
    st.steps.push(
      step(
        st.id("critical-link-up"),
        "The crack reaches the opening before it is critical by the diagram: link-up",
        "a_crit = ligament from the hole's edge to the opening",
        fad.critical_mm >= gradient.ligament_mm * (1 - 1e-9)
          ? `a_crit = ${fmt(gradient.ligament_mm)} mm (the diagram reaches no critical size within the ligament)`
          : `a_crit = ${fmt(gradient.ligament_mm)} mm (< ${fmt(fad.critical_mm)} mm by the diagram)`,
        ac,
        "mm",
        "A crack that joins an opening becomes part of a much longer crack: taken as critical (conservative, common practice)",
      ),
    );
  }
  st.steps.push(
    step(
      st.id("critical"),
      `Critical ${which} size (set by ${by})`,
      linkUp ? "a_crit = min(a_FAD, ligament)" : "a_crit = a_FAD",
      linkUp ? `a_crit = min(${fmt(fad.critical_mm)}, ${fmt(ac)})` : `a_crit = ${fmt(ac)}`,
      ac,
      "mm",
      linkUp ? "Link-up with the opening (common practice)" : FAD,
    ),
  );
  if (a0 >= ac) {
    throw new InputError(
      "crack.initial_mm",
      `The initial crack (${fmt(a0)} mm) is already at or beyond the critical size (${fmt(ac)} mm, set by ${by}); the part would fail at the first peak pressure.`,
    );
  }
  if (ac > accurateLimit_mm(shape)) {
    st.warnings.push(
      say`The critical ${which} (${mm(ac)}) lies beyond the range where the width correction keeps its stated accuracy (${mm(accurateLimit_mm(shape))}); treat the last part of the growth as approximate.`,
    );
  }
  const cc = bulgingHalfLength_mm(ac, shape);
  const Rt = opts.shellRadius_mm * opts.thickness_mm;
  if (bulgingOn && (cc * cc) / Rt > factorM.range) {
    st.warnings.push(
      say`At the critical size the ${which} reaches c²/(R·t) = ${n((cc * cc) / Rt)}, beyond the range of the bulging fit (${n(factorM.range)}); the factor there is extrapolated.`,
    );
  }
  return { fad, ac, by };
}

/** The growth rate da/dN (m/cycle) at crack size a (mm) of a model under the range. */
function rateOf(st: Stage, mdl: Model, range: number, walker: number): (a_mm: number) => number {
  const { parisC: C, parisM: m } = st.opts;
  return (a_mm) => C * (walker * stressIntensity(mdl, a_mm, range)) ** m;
}

/**
 * Stage 5, growth: the Paris integral from the initial flaw to the critical size, with the a–N
 * curve for the plot, and a hand check with the factors frozen at the initial flaw so a reader
 * can see how much the changing factors (bulging, the gradient) shorten the life.
 */
function growth(
  st: Stage,
  ms: ModelStage,
  ac: number,
  range: number,
  walker: number,
  dK0: number,
): { cycles: number; curve: CrackCurvePoint[] } {
  const { opts, which } = st;
  const { parisC: C, parisM: m } = opts;
  const a0 = opts.initial_mm;
  const parts = termsOf(st, ms.bulgingOn);
  const g = growthCurve(rateOf(st, ms.model, range, walker), a0, ac);
  st.steps.push(
    step(
      st.id("cycles"),
      `Cycles to grow the ${which} from the initial flaw to its critical size`,
      "N = ∫ da / (C·ΔK_eff^m), from a₀ to a_crit",
      `N = ∫ da / (${fmt(C)} × (${walker !== 1 ? `${fmt(walker)}·` : ""}${parts}Y·${fmt(range)}·√(πa))^${fmt(m)}), a from ${fmt(a0)} to ${fmt(ac)} mm`,
      g.cycles,
      "cycles",
      `${PARIS}; integrated numerically (adaptive Gauss–Kronrod in ln a)`,
    ),
  );
  const k0 = dK0 / Math.sqrt((Math.PI * a0) / 1000);
  const hand = parisClosedForm(a0 / 1000, ac / 1000, C, m, k0 * Math.sqrt(Math.PI));
  st.steps.push(
    step(
      st.id("cycles-hand"),
      "Hand check: cycles with the factors held at their initial values",
      m === 2 ? "N = ln(a_c/a₀) / (C·k²·π), k = ΔK₀/√(πa₀)" : "N = (a₀^(1−m/2) − a_c^(1−m/2)) / (C·(k·√π)^m·(m/2 − 1)), k = ΔK₀/√(πa₀)",
      `k = ${fmt(k0)} MPa, a₀ = ${fmt(a0 / 1000)} m, a_c = ${fmt(ac / 1000)} m, C = ${fmt(C)}, m = ${fmt(m)}`,
      hand,
      "cycles",
      `${PARIS}; closed form for constant factors (differs from N where they change with a)`,
    ),
  );
  return g;
}

/**
 * Stage 6, the inspection programme: the threshold from the initial flaw (an assumed
 * manufacturing or service flaw) and the repeat interval from the size an inspection finds
 * reliably, each over the inspection factor, so at least two chances to find the crack remain.
 */
function inspectionProgramme(
  st: Stage,
  ms: ModelStage,
  ac: number,
  cycles: number,
  range: number,
  walker: number,
): { threshold: number; repeat: number | null } {
  const { opts, which } = st;
  const threshold = cycles / opts.inspectionFactor;
  st.steps.push(
    step(
      st.id("threshold"),
      `Inspection threshold (${which}): growth from the initial flaw to critical over the factor`,
      "N_th = N(a₀ → a_crit) / inspection factor",
      `N_th = ${fmt(cycles)} / ${fmt(opts.inspectionFactor)}`,
      threshold,
      "cycles",
      "Damage-tolerance practice: the first inspection before the assumed initial flaw could grow to critical, with a factor on life (common practice)",
    ),
  );
  const ad = opts.detectable_mm;
  if (ad === undefined) return { threshold, repeat: null };
  const Nd = ad >= ac ? 0 : cyclesBetween(rateOf(st, ms.model, range, walker), Math.max(ad, 1e-9), ac);
  const repeat = Nd / opts.inspectionFactor;
  st.steps.push(
    step(
      st.id("repeat"),
      `Repeat inspection interval (${which}): growth from the detectable size to critical over the factor`,
      "N_rep = N(a_det → a_crit) / inspection factor",
      ad >= ac
        ? `a_det = ${fmt(ad)} mm ≥ a_crit = ${fmt(ac)} mm: no interval`
        : `N_rep = ${fmt(Nd)} / ${fmt(opts.inspectionFactor)}, a from ${fmt(ad)} to ${fmt(ac)} mm`,
      repeat,
      "cycles",
      "Damage-tolerance practice: at least two chances to find the crack between detectable and critical (common practice)",
    ),
  );
  if (ad >= ac)
    st.warnings.push(
      say`The detectable ${which} size (${mm(ad)}) is already at or beyond the critical size (${mm(ac)}): inspections by this method cannot find the crack in time.`,
    );
  return { threshold, repeat };
}

/**
 * Stage 7, the comparison a gradient asks for: the same crack grown as if the stress along its
 * path were uniform (the fastener hole alone), so the sheet and the a–N plot show how much the
 * opening's rising field shortens the life.
 */
function uniformComparison(st: Stage, ms: ModelStage, range: number, walker: number): NonNullable<CrackResult["uniform"]> {
  const a0 = st.opts.initial_mm;
  const flat: Model = { ...ms.model, beta: () => 1, limit_mm: growthLimit_mm(ms.model.shape) };
  const fu = assess(st, flat, a0);
  const gu = growthCurve(rateOf(st, flat, range, walker), a0, fu.critical_mm);
  st.steps.push(
    step(
      st.id("cycles-uniform"),
      "For comparison: cycles to critical if the stress along the path were uniform (the fastener hole alone)",
      "N = ∫ da / (C·ΔK^m), β = 1",
      `a from ${fmt(a0)} to ${fmt(fu.critical_mm)} mm`,
      gu.cycles,
      "cycles",
      PARIS,
    ),
  );
  return { cycles: gu.cycles, critical_mm: fu.critical_mm, curve: gu.curve };
}

/**
 * Paris-law growth of a through-crack from its initial to its critical size, with the critical
 * size from the failure assessment diagram and the inspection programme. The stages run in the
 * order the sheet reads them: model, driving range, factors at the initial flaw, critical size,
 * growth, inspection programme, the uniform-field comparison, and leak before break.
 * Units: lengths in mm, stresses in MPa, toughness in MPa·√m, C with da/dN in m/cycle.
 */
export function crackGrowth(opts: CrackInput): CrackResult {
  validate(opts);
  const orientation: CrackOrientation = opts.orientation ?? "axial";
  const st: Stage = {
    opts,
    orientation,
    id: (name) => (orientation === "circumferential" ? `crack-circ-${name}` : `crack-${name}`),
    which: orientation === "circumferential" ? "circumferential crack" : "axial crack",
    stressName: orientation === "circumferential" ? "axial" : "hoop",
    steps: [],
    warnings: [],
  };
  const shape: CrackShape = {
    geometry: opts.geometry,
    width_mm: opts.width_mm,
    holeRadius_mm: opts.holeRadius_mm,
    cracksAtHole: opts.cracksAtHole ?? 1,
  };
  const ms = crackModel(st, shape);
  const { range, walker } = drivingRange(st);
  const dK0 = initialFactors(st, ms, range, walker);
  const { fad, ac, by } = criticalSize(st, ms);

  let cycles: number | null = null;
  let threshold: number | null = null;
  let repeat: number | null = null;
  let curve: CrackCurvePoint[] = [];
  let uniform: CrackResult["uniform"];
  if (range > 0) {
    const g = growth(st, ms, ac, range, walker, dK0);
    cycles = g.cycles;
    curve = g.curve;
    ({ threshold, repeat } = inspectionProgramme(st, ms, ac, g.cycles, range, walker));
    if (opts.gradient) uniform = uniformComparison(st, ms, range, walker);
  } else {
    st.warnings.push(
      `The ${st.stressName} stress does not vary, so the ${st.which} does not grow by fatigue; only its critical size applies.`,
    );
  }

  const leakBeforeBreak =
    opts.leakCheck === false
      ? null
      : leakCheck(opts, opts.stressMax_MPa, opts.toughness_MPaSqrtM, ms.factorM.k, ms.bulgingOn, st.steps, st.warnings);
  return {
    orientation,
    stressMax_MPa: opts.stressMax_MPa,
    range_MPa: range,
    critical_mm: ac,
    criticalBy: by,
    fad: { Lr: fad.Lr, Kr: fad.Kr, LrMax: fad.LrMax, lefm_mm: fad.lefm_mm, collapse_mm: fad.collapse_mm },
    cycles,
    threshold_cycles: threshold,
    repeatInterval_cycles: repeat,
    inspectionInterval_cycles: repeat ?? threshold,
    curve,
    ...(uniform ? { uniform } : {}),
    leakBeforeBreak,
    steps: st.steps,
    warnings: st.warnings,
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

/** Leak before break: a through-wall centre crack of half-length t against its critical half-length by the diagram. */
function leakCheck(
  opts: CrackInput,
  sMax: number,
  Kc: number,
  k: number,
  bulgingOn: boolean,
  steps: Step[],
  warnings: Warning[],
): LeakBeforeBreak {
  const t = opts.thickness_mm;
  const centre: CrackShape = { geometry: "center-through", width_mm: opts.width_mm, cracksAtHole: 1 };
  const M = bulgingOn ? (a: number) => bulgingFactor(a, opts.shellRadius_mm, t, k) : () => 1;
  const model: Model = { shape: centre, M, beta: () => 1, limit_mm: growthLimit_mm(centre) };
  const crit = fadCriticalSize({
    K: (a) => stressIntensity(model, a, sMax),
    sigmaRef: (a) => referenceStress(model, a, sMax),
    toughness_MPaSqrtM: Kc,
    yield_MPa: opts.yield_MPa,
    ultimate_MPa: opts.ultimate_MPa ?? opts.yield_MPa,
    start_mm: t,
    limit_mm: model.limit_mm,
  });
  const leak = t < crit.critical_mm;
  steps.push(
    step(
      "crack-lbb",
      "Leak before break: through-wall crack half-length against its critical half-length",
      "t < c_crit (centre crack, same stress field, failure assessment diagram)",
      `${fmt(t)} mm ${leak ? "<" : "≥"} ${fmt(crit.critical_mm)} mm`,
      crit.critical_mm,
      "mm",
      `${LBB}; critical half-length by the ${FAD}`,
    ),
  );
  if (!leak) {
    warnings.push(
      say`A crack grown through the wall (about ${mm(2 * t)} long) would already be critical (critical length ${mm(2 * crit.critical_mm)}): the shell could burst without leaking first.`,
    );
  }
  return { leakBeforeBreak: leak, throughWallHalfLength_mm: t, criticalHalfLength_mm: crit.critical_mm };
}
