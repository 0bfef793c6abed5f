/**
 * @module engine/evaluate
 * One evaluation of the shell at a thickness and a pressure scale: membrane stresses, static check,
 * the local stress at every governing point of the opening, and the fatigue damage of one pass of the
 * load under a chosen mean-stress criterion, at the worst point.
 * Solvers call it many times; runCheck calls it once more with everything for the sheet.
 */
import type { MeanStressCriterion } from "../schema/check.ts";
import type { ResolvedCheck } from "./input.ts";
import {
  concentration,
  edgeStress,
  MEMBRANE_POINTS,
  openingField,
  type BoundaryPoint,
  type Concentration,
  type OpeningField,
  type Cutout,
  GIVEN_KT_ASSUMPTION,
} from "./concentration.ts";
import { EQUIVALENT_SOURCE, equivalentCycle, equivalentOf } from "./equivalent.ts";
import { openingConcentration, type ExtendedConcentration } from "./openings/concentration.ts";
import type { Load } from "./load.ts";
import { CRITERION_LABEL, CRITERION_SOURCE, criterionWorking, equivalentAmplitude, type Strengths } from "./meanStress.ts";
import {
  chooseTheory,
  membraneSteps,
  radii,
  unitStresses,
  vonMises,
  THIN_WALL_LIMIT,
  type Radii,
  type Theory,
  type UnitStresses,
} from "./membrane.ts";
import { kfStep, notchSensitivity, type NotchFactor } from "./notch.ts";
import { basquinLife, lifeStep, type Curve } from "./sn.ts";
import { fmt, step, type Step } from "./step.ts";
import type { Warning } from "./phrase.ts";
import { minerDamage } from "./miner.ts";
import { weldedLife } from "./welded.ts";
import { allowances_mm, staticAt, staticSteps, type StaticAt, type StaticPlan } from "./static/index.ts";
import { vesselLife, vesselSteps, type VesselCurve } from "./vessel/fatigue.ts";

export interface Context {
  input: ResolvedCheck;
  load: Load;
  curve: Curve;
  strengths: Strengths;
  /** The static basis with its allowables, resolved once. */
  staticPlan: StaticPlan;
  /** The vessel code's curve when fatigue.curve is en13445-welded or en13445-unwelded. */
  vessel?: VesselCurve;
  /** The opening's field and each point's notch sensitivity: they do not change with thickness or pressure. */
  fieldCache?: PointField;
}

/**
 * A point where fatigue is checked, with the coefficients of its fatigue-effective local stress
 * σf = σn + q·(σ_edge − σn) = fθ·σθ + fx·σx, σn being the nominal stress along the edge: with q = 1
 * it is the elastic edge stress; with q < 1 only that share of the concentration counts (Peterson's
 * Kf = 1 + q(Kt − 1), applied to the concentration at each instant).
 */
export interface Candidate {
  point: BoundaryPoint;
  q: number;
  fh: number;
  fa: number;
  /** The plain skin beside the opening (no concentration). */
  membrane: boolean;
}

interface PointField {
  opening: OpeningField;
  /** The openings module's result for shapes, fasteners and reinforcement. */
  extended?: ExtendedConcentration;
  geometry: { form: "cylinder" | "sphere"; meanRadius_mm: number; thickness_mm: number };
  candidates: Candidate[];
  sensitivity: Map<string, { q: number; steps: Step[]; warnings: Warning[] }>;
}

function pointField(ctx: Context): PointField {
  if (ctx.fieldCache) return ctx.fieldCache;
  const { input } = ctx;
  const shell = input.shell;
  const geometry = {
    form: shell.form,
    meanRadius_mm: radii(shell.radius_mm, shell.radiusAt, shell.thickness_mm).mean_mm,
    thickness_mm: shell.thickness_mm,
  };
  const cut = input.cutout as { kind: string; fasteners?: unknown[]; reinforcement?: unknown };
  const classicKind = ["none", "circular-hole", "elliptical-hole", "given"].includes(cut.kind);
  let opening: OpeningField;
  let extended: ExtendedConcentration | undefined;
  if (classicKind && !cut.fasteners?.length && !cut.reinforcement) {
    opening = openingField(input.cutout as Cutout);
  } else {
    // Shapes, fasteners and reinforcement solved by the openings module: its Kt at the biaxial ratio of the
    // pressure alone is taken to scale with the hoop stress at every instant, as a given Kt is (stated).
    const u = unitStresses(
      shell.form,
      chooseTheory(shell.theory, radii(shell.radius_mm, shell.radiusAt, shell.thickness_mm), shell.thickness_mm),
      radii(shell.radius_mm, shell.radiusAt, shell.thickness_mm),
      shell.thickness_mm,
    );
    const lambda0 = u.axial / u.hoop;
    extended = openingConcentration(input.cutout, lambda0, geometry, () => concentration({ kind: "none" }, lambda0));
    opening = {
      points: [
        {
          id: "opening",
          label: extended.governs,
          hoopCoeff: extended.kt,
          axialCoeff: 0,
          edgeAngle_deg: 0,
          rootRadius_mm: extended.rootRadius_mm,
        },
      ],
      basis: `${GIVEN_KT_ASSUMPTION.replace("the given Kt", "the opening's Kt (plane-elasticity solution at the pressure's biaxial ratio)")}`,
      assumed: true,
      steps: [],
      warnings: [],
    };
  }
  const cutoutRadius = input.cutout.kind === "circular-hole" ? input.cutout.radius_mm : undefined;
  const sensitivity = new Map<string, { q: number; steps: Step[]; warnings: Warning[] }>();
  const candidates: Candidate[] = [];
  for (const point of opening.points) {
    const s = notchSensitivity({
      q: input.fatigue.notchSensitivity,
      constant: input.fatigue.notchConstant,
      rootRadius_mm: point.rootRadius_mm ?? cutoutRadius,
      family: input.material.family,
      ultimate_MPa: input.material.ultimate_MPa,
    });
    sensitivity.set(point.id, s);
    candidates.push(candidateOf(point, s.q, false));
  }
  for (const point of MEMBRANE_POINTS) candidates.push(candidateOf(point, 1, true));
  ctx.fieldCache = { opening, candidates, sensitivity, extended, geometry };
  return ctx.fieldCache;
}

function candidateOf(point: BoundaryPoint, q: number, membrane: boolean): Candidate {
  const phi = ((point.edgeAngle_deg ?? 0) * Math.PI) / 180;
  const c2 = Math.cos(phi) ** 2;
  const s2 = Math.sin(phi) ** 2;
  return { point, q, fh: (1 - q) * c2 + q * point.hoopCoeff, fa: (1 - q) * s2 + q * point.axialCoeff, membrane };
}

export interface CycleOutcome {
  amplitude: number;
  mean: number;
  sigmaAr: number | null;
  life: number | null;
  status: "ok" | "no-answer" | "no-damage" | "unlimited";
  reason?: string;
  /** The welded method's own worked steps and warnings (EN 1993-1-9), kept for the sheet. */
  welded?: { steps: Step[]; warnings: Warning[] };
  /** Whether the added axial stress was counted at the peak and at the valley of this cycle. */
  extraAtPeak?: boolean;
  extraAtValley?: boolean;
}

/** The stresses of one instant: nominal hoop, axial (with any added axial stress) and radial at the bore. */
interface Instant {
  hoop: number;
  axial: number;
  radial: number;
}

export interface Evaluation {
  /** The ordered (nominal) wall. */
  thickness_mm: number;
  /** The wall every stress is worked on: ordered less corrosion allowance and minus tolerance. */
  analysis_mm: number;
  /** Inner radius of the new (uncorroded) wall. */
  newInnerRadius_mm: number;
  static: StaticAt;
  /** The stresses per MPa of pressure that fatigue works on (the membrane ones; σr = −p at the bore on the vessel route). */
  fatigueUnit: UnitStresses;
  /** Whether fatigue takes the equivalent (Tresca) range of the principal stresses: a thick wall, or the vessel route. */
  equivalentRange: boolean;
  scale: number;
  radii: Radii;
  theory: Theory;
  unit: UnitStresses;
  pMax: number;
  pMin: number;
  hoopMax: number;
  hoopMin: number;
  axialMax: number;
  axialMin: number;
  radialMax: number;
  vonMisesMax: number;
  staticAllowable: number;
  staticMargin: number;
  lambda: number;
  /** Kt, Kf and their steps at the governing point, with what the opening solver adds. */
  conc: ExtendedConcentration;
  notch: NotchFactor;
  /** The opening's points and the plain skin, and the one that governs fatigue. */
  candidates: Candidate[];
  point: Candidate;
  /** Fatigue-effective local stress at the governing point, at maximum and minimum pressure. */
  peakMax: number;
  peakMin: number;
  localYield: boolean;
  /** The largest-range cycle at the governing point, reported as the operating point. */
  governing: CycleOutcome;
  /** Life in cycles (single cycle) or passes (spectrum); null = unlimited; 0 = no answer. */
  life: number | null;
  /** null when it is beyond what a double holds (then life is 0). */
  damagePerPass: number | null;
  allowable: number | null;
  /** null where there is no life (life 0): JSON has no infinity, and a checker reads "none" better than a stand-in number. */
  damage: number | null;
}

export function evaluate(
  ctx: Context,
  thickness_mm: number,
  scale: number,
  criterion: MeanStressCriterion = ctx.input.fatigue.meanStress,
): Evaluation {
  const { input, load } = ctx;
  const plan = ctx.staticPlan;
  const m = membraneAt(ctx, thickness_mm, scale);
  const { analysis_mm, r, theory, u, extra, pMax, pMin, hoopMax, hoopMin, axialMax, axialMin, radialMax, vm, newInnerRadius_mm, st } = m;
  const staticAllowable = plan.allowable_MPa;
  const lambda = hoopMax > 0 ? axialMax / hoopMax : 0;
  const field = pointField(ctx);
  // The equivalent (Tresca) range of the principal stresses at the bore: for a thick wall, and always on the
  // vessel code's route, which takes σr = −p at the inner surface whatever the wall (EN 13445-3 §18, from memory).
  const thick = theory === "thick" || ctx.vessel !== undefined;
  const fu = fatigueUnit(ctx, u, theory);
  const candidates = candidatesFor(field.candidates, fu, extra, thick);

  // Damage of one pass at each candidate point; the worst point governs.
  let best: { c: Candidate; damage: number; noAnswer: boolean; governing: CycleOutcome; sigmaAr: number } | undefined;
  for (const cand of candidates) {
    let damage = 0;
    let noAnswer = false;
    let governing: CycleOutcome | undefined;
    let largestRange = -1;
    for (const c of load.cycles) {
      const o = cycleAtPoint(ctx, criterion, cand, fu, extra, scale, c.range, c.mean, thick, load.isSpectrum);
      // A life that underflowed to 0 is no life, as life 0 reads everywhere else.
      if (o.status === "no-answer" || o.life === 0) noAnswer = true;
      else if (o.life !== null) damage += c.count / o.life;
      if (c.range > largestRange) {
        largestRange = c.range;
        governing = o;
      }
    }
    const g = governing as CycleOutcome;
    const sigmaAr = g.sigmaAr ?? Infinity;
    const worse =
      best === undefined ||
      (noAnswer && !best.noAnswer) ||
      (noAnswer === best.noAnswer && (damage > best.damage || (damage === best.damage && sigmaAr > best.sigmaAr)));
    if (worse) best = { c: cand, damage, noAnswer, governing: g, sigmaAr };
  }
  const chosen = best as NonNullable<typeof best>;
  const damagePerPass = chosen.damage;
  const finiteDamage = Number.isFinite(damagePerPass);
  const life = chosen.noAnswer || !finiteDamage ? 0 : damagePerPass > 0 ? 1 / damagePerPass : null;
  const sf = input.fatigue.scatterFactor;
  const allowable = life === null ? null : life / sf;
  const ratio = allowable === null ? 0 : input.fatigue.designLife_cycles / allowable;
  const damage = Number.isFinite(ratio) ? ratio : null;

  const point = chosen.c;
  const peakMax = point.fh * hoopMax + point.fa * axialMax;
  const peakMin = point.fh * hoopMin + point.fa * axialMin;
  const { conc, notch } = governingNotch(ctx, field, point, lambda);
  return {
    thickness_mm,
    analysis_mm,
    newInnerRadius_mm,
    static: st,
    fatigueUnit: fu,
    equivalentRange: thick,
    scale,
    radii: r,
    theory,
    unit: u,
    pMax,
    pMin,
    hoopMax,
    hoopMin,
    axialMax,
    axialMin,
    radialMax,
    vonMisesMax: vm,
    staticAllowable,
    staticMargin: st.ratio - 1,
    lambda,
    conc,
    notch,
    candidates,
    point,
    peakMax,
    peakMin,
    localYield: Math.max(Math.abs(peakMax), Math.abs(peakMin)) > input.material.yield_MPa,
    governing: chosen.governing,
    life,
    damagePerPass: finiteDamage ? damagePerPass : null,
    allowable,
    damage,
  };
}

/** The membrane stresses and the static check alone at a wall and a pressure scale (no fatigue): what the static solve needs. */
export function membraneAt(ctx: Context, thickness_mm: number, scale: number) {
  const { input, load } = ctx;
  const shell = input.shell;
  const plan = ctx.staticPlan;
  // A wall used up by its allowances keeps a sliver so the arithmetic stays finite; its static ratio is 0.
  const analysis_mm = Math.max(thickness_mm - allowances_mm(plan), thickness_mm * 1e-6);
  const newInnerRadius_mm = radii(shell.radius_mm, shell.radiusAt, thickness_mm).inner_mm;
  // The wall corrodes from the inside: the stresses are worked on the corroded inner radius R_i + c with the analysis
  // wall outside it, as the code formulas take R (or Di) in the corroded condition (ASME VIII-1 UG-27, EN 13445-3 §7.4).
  const r =
    plan.corrosion_mm > 0
      ? radii(newInnerRadius_mm + plan.corrosion_mm, "inner", analysis_mm)
      : radii(shell.radius_mm, shell.radiusAt, analysis_mm);
  const theory = chooseTheory(shell.theory, r, analysis_mm);
  const u = unitStresses(shell.form, theory, r, analysis_mm);
  const extra = input.axialExtra ?? { max_MPa: 0, min_MPa: 0 };
  const pMax = load.max_MPa * scale;
  const pMin = load.min_MPa * scale;
  const hoopMax = u.hoop * pMax;
  const hoopMin = u.hoop * pMin;
  const axialMax = u.axial * pMax + extra.max_MPa;
  const axialMin = u.axial * pMin + extra.min_MPa;
  const radialMax = u.radial * pMax;
  const vm = vonMises(hoopMax, axialMax, radialMax);
  const st = staticAt(plan, {
    analysis_mm: thickness_mm - allowances_mm(plan),
    innerRadius_mm: newInnerRadius_mm,
    pMax,
    vonMisesAt: (k) => vonMises(k * hoopMax, k * u.axial * pMax + extra.max_MPa, k * radialMax),
  });
  return { analysis_mm, r, theory, u, extra, pMax, pMin, hoopMax, hoopMin, axialMax, axialMin, radialMax, vm, newInnerRadius_mm, st };
}

/** The stresses per MPa that fatigue works on: the membrane ones, with σr = −p at the bore on the vessel route. */
function fatigueUnit(ctx: Context, u: UnitStresses, theory: Theory): UnitStresses {
  return ctx.vessel && theory !== "thick" ? { ...u, radial: -1 } : u;
}

/**
 * The points worth evaluating. When every stress follows the pressure (no added axial stress), each
 * point's local stress is its own multiple of the pressure, so the point with the largest positive
 * multiple and the one with the most negative are the only ones that can govern (thick wall: the
 * largest equivalent multiple); otherwise every point is evaluated.
 */
function candidatesFor(all: Candidate[], u: UnitStresses, extra: { max_MPa: number; min_MPa: number }, thick: boolean): Candidate[] {
  const pool = thick ? all.filter((c) => c.point.id !== "membrane-axial") : all;
  if (extra.max_MPa !== 0 || extra.min_MPa !== 0) return pool;
  let hi: Candidate | undefined;
  let lo: Candidate | undefined;
  let hiK = -Infinity;
  let loK = Infinity;
  for (const c of pool) {
    const s = c.fh * u.hoop + c.fa * u.axial;
    const k = thick ? equivalentOf(stateOf(c, { hoop: u.hoop, axial: u.axial, radial: u.radial }, true)) : s;
    if (k > hiK + 1e-12) {
      hiK = k;
      hi = c;
    }
    if (k < loK - 1e-12) {
      loK = k;
      lo = c;
    }
  }
  return lo !== undefined && lo !== hi && loK < 0 ? [hi as Candidate, lo] : [hi as Candidate];
}

/**
 * Principal stresses at a point (thick wall): at the edge of an opening the edge stress σf, zero across
 * the free edge, and the radial stress at the bore; in the plain bore the hoop, axial and radial stresses.
 */
function stateOf(c: Candidate, s: Instant, thick: boolean): [number, number, number] {
  if (c.membrane) return thick ? [s.hoop, s.axial, s.radial] : [c.fh * s.hoop + c.fa * s.axial, 0, 0];
  return [c.fh * s.hoop + c.fa * s.axial, 0, thick ? s.radial : 0];
}

/**
 * The worst cycle at one point for a pressure cycle (range, mean): the stresses of its peak and valley
 * instants superposed, with the added axial stress counted or left out at each instant, whichever is worse
 * (a load that does not follow the pressure is not relied on to relieve; EN 1990 §6.4.3.2 takes favourable
 * variable actions as zero — from memory).
 */
export function cycleAtPoint(
  ctx: Context,
  criterion: MeanStressCriterion,
  cand: Candidate,
  u: UnitStresses,
  extra: { max_MPa: number; min_MPa: number },
  scale: number,
  range: number,
  mean: number,
  thick: boolean,
  spectrum: boolean,
): CycleOutcome {
  const pPeak = (mean + range / 2) * scale;
  const pValley = (mean - range / 2) * scale;
  const atPeak = extra.max_MPa !== 0 ? [true, false] : [false];
  const atValley = extra.min_MPa !== 0 ? [true, false] : [false];
  let worst: CycleOutcome | undefined;
  for (const xp of atPeak) {
    for (const xv of atValley) {
      const peak = instant(u, pPeak, xp ? extra.max_MPa : 0);
      const valley = instant(u, pValley, xv ? extra.min_MPa : 0);
      let amplitude: number;
      let m: number;
      if (thick) {
        const eq = equivalentCycle(stateOf(cand, peak, true), stateOf(cand, valley, true), "tresca");
        amplitude = eq.amplitude_MPa;
        m = eq.mean_MPa;
      } else {
        const s1 = cand.fh * peak.hoop + cand.fa * peak.axial;
        const s2 = cand.fh * valley.hoop + cand.fa * valley.axial;
        amplitude = Math.abs(s1 - s2) / 2;
        m = (s1 + s2) / 2;
      }
      const o = cycleOutcome(ctx, criterion, amplitude, m, spectrum);
      o.extraAtPeak = xp;
      o.extraAtValley = xv;
      if (worst === undefined || worseOutcome(o, worst)) worst = o;
    }
  }
  return worst as CycleOutcome;
}

function instant(u: UnitStresses, p: number, extraAxial: number): Instant {
  return { hoop: u.hoop * p, axial: u.axial * p + extraAxial, radial: u.radial * p };
}

/** True when outcome a is worse (shorter life) than b: no answer, then the shorter finite life, then the larger σar. */
function worseOutcome(a: CycleOutcome, b: CycleOutcome): boolean {
  const la = a.status === "no-answer" ? 0 : (a.life ?? Infinity);
  const lb = b.status === "no-answer" ? 0 : (b.life ?? Infinity);
  if (la !== lb) return la < lb;
  return (a.sigmaAr ?? Infinity) > (b.sigmaAr ?? Infinity);
}

/** Kt, q and Kf at the governing point, referred to the nominal hoop stress at maximum pressure. */
function governingNotch(ctx: Context, field: PointField, point: Candidate, lambda: number): { conc: Concentration; notch: NotchFactor } {
  const conc: ExtendedConcentration = field.extended
    ? { ...field.extended, kt: edgeStress(point.point, 1, lambda) }
    : openingConcentration(ctx.input.cutout, lambda, field.geometry, () =>
        concentration(ctx.input.cutout as Cutout, lambda, field.opening, point.point.id),
      );
  // Kt from the biaxial ratio, as the sheet's Kt line works it (the same number, without the rounding of σx/σθ twice).
  const kt = conc.kt;
  const s = field.sensitivity.get(point.point.id) ?? { q: 1, steps: [], warnings: [] };
  const q = point.membrane ? 1 : s.q;
  return {
    conc: { ...conc, kt },
    notch: { q, kf: 1 + q * (kt - 1), steps: [...s.steps, kfStep(kt, q)], warnings: s.warnings },
  };
}

/**
 * Local stresses of one cycle at the notch. With localYield = "shakedown", a peak above yield is
 * treated as elastic–perfectly plastic on first loading, after which the cycle runs elastically below
 * yield: the amplitude is kept and the mean falls to Sy − σa (Dowling, §10.7 / Shigley §6-14 nominal-mean
 * treatment, from memory). "elastic" keeps the elastic mean, which is conservative for tensile means.
 */
function cycleOutcome(ctx: Context, criterion: MeanStressCriterion, amplitude: number, mean: number, spectrum: boolean): CycleOutcome {
  const { input, curve, strengths } = ctx;
  let m = mean;
  if (input.fatigue.localYield === "shakedown" && m + amplitude > input.material.yield_MPa && amplitude < input.material.yield_MPa) {
    m = input.material.yield_MPa - amplitude;
  }
  if (ctx.vessel) {
    const life = vesselLife(ctx.vessel, 2 * amplitude, mean, spectrum);
    return { amplitude, mean, sigmaAr: amplitude, life, status: life === null ? "unlimited" : "ok" };
  }
  if (input.fatigue.curve === "welded") {
    const w = weldedLife(2 * amplitude, input.fatigue.detailCategory_MPa as number, {
      variableAmplitude: spectrum,
      gammaMf: input.fatigue.gammaMf,
    });
    return {
      amplitude,
      mean: m,
      sigmaAr: amplitude,
      life: w.life_cycles,
      status: w.life_cycles === null ? "unlimited" : "ok",
      welded: { steps: w.steps, warnings: w.warnings },
    };
  }
  const eq = equivalentAmplitude(criterion, amplitude, m, strengths);
  if (eq.sigmaAr === null) return { amplitude, mean: m, sigmaAr: null, life: 0, status: "no-answer", reason: eq.reason };
  if (eq.noDamage) return { amplitude, mean: m, sigmaAr: 0, life: null, status: "no-damage", reason: eq.reason };
  const life = basquinLife(eq.sigmaAr, curve, spectrum);
  return { amplitude, mean: m, sigmaAr: eq.sigmaAr, life, status: life === null ? "unlimited" : "ok" };
}

/** The worked steps of one evaluation, in the order a checker redoes them. */
export function evaluationSteps(ctx: Context, e: Evaluation, criterion: MeanStressCriterion): Step[] {
  const { input, load } = ctx;
  const t = e.analysis_mm;
  const steps: Step[] = [];
  steps.push(
    step(
      "slenderness",
      "Slenderness of the wall",
      "r_m/t",
      `r_m/t = ${fmt(e.radii.mean_mm)}/${fmt(t)}  (thin-wall theory at ${THIN_WALL_LIMIT} and above)`,
      e.radii.mean_mm / t,
      "—",
      "common practice: thin-wall theory for r/t ≥ 10 (Roark's Formulas for Stress and Strain, Ch. 13)",
    ),
  );
  steps.push(...membraneSteps(input.shell.form, e.theory, e.radii, t, e.pMax, e.unit));
  const extra = input.axialExtra;
  if (extra && (extra.max_MPa !== 0 || extra.min_MPa !== 0)) {
    steps.push(
      step(
        "axial-total",
        "Axial stress with the added axial load",
        "σx = σx,p + σx,extra",
        `σx = ${fmt(e.axialMax - extra.max_MPa)} + ${fmt(extra.max_MPa)}`,
        e.axialMax,
        "MPa",
        "superposition",
      ),
    );
  }
  if (e.pMin !== 0)
    steps.push(
      step(
        "hoop-min",
        "Hoop stress at the minimum pressure",
        "σθ,min = σθ·p_min/p_max",
        `σθ,min = ${fmt(e.hoopMax)} × ${fmt(e.pMin)}/${fmt(e.pMax)}`,
        e.hoopMin,
        "MPa",
        "linear elasticity: stresses proportional to pressure",
      ),
    );
  const vmEq = e.theory === "thick" ? "σvm = √(½[(σθ − σx)² + (σx − σr)² + (σr − σθ)²])" : "σvm = √(σθ² − σθ·σx + σx²)";
  const vmSub =
    e.theory === "thick"
      ? `σvm = √(½[(${fmt(e.hoopMax)} − ${fmt(e.axialMax)})² + (${fmt(e.axialMax)} + ${fmt(e.pMax)})² + (−${fmt(e.pMax)} − ${fmt(e.hoopMax)})²])`
      : `σvm = √(${fmt(e.hoopMax)}² − ${fmt(e.hoopMax)} × ${fmt(e.axialMax)} + ${fmt(e.axialMax)}²)`;
  steps.push(
    step(
      "von-mises",
      "von Mises stress at the maximum pressure",
      vmEq,
      vmSub,
      e.vonMisesMax,
      "MPa",
      "von Mises criterion; Dowling, Mechanical Behavior of Materials, §7.5",
    ),
  );
  steps.push(
    ...staticSteps(
      ctx.staticPlan,
      {
        analysis_mm: e.thickness_mm - allowances_mm(ctx.staticPlan),
        innerRadius_mm: e.newInnerRadius_mm,
        pMax: e.pMax,
        vonMisesAt: (k) => vonMises(k * e.hoopMax, k * e.unit.axial * e.pMax + (e.axialMax - e.unit.axial * e.pMax), k * e.radialMax),
      },
      e.static,
      e.thickness_mm,
    ),
  );
  if (input.cutout.kind !== "none")
    steps.push(
      step(
        "biaxial",
        "Biaxial ratio at the opening",
        "λ = σx/σθ",
        `λ = ${fmt(e.axialMax)}/${fmt(e.hoopMax)}`,
        e.lambda,
        "—",
        "Peterson's Stress Concentration Factors, §4.5",
      ),
    );
  steps.push(...e.conc.steps, ...e.notch.steps);
  steps.push(...pointSteps(ctx, e));
  const g = e.governing;
  const label = load.isSpectrum ? " (largest cycle)" : "";
  const extraGiven = input.axialExtra && (input.axialExtra.max_MPa !== 0 || input.axialExtra.min_MPa !== 0);
  if (extraGiven) {
    const words = (on: boolean | undefined) => (on ? "counted" : "left out");
    steps.push(
      step(
        "amplitude-axial-extra",
        `Added axial stress in the governing cycle${label}`,
        "each instant with and without the added axial stress; the worse cycle is used",
        `at the peak: ${words(g.extraAtPeak)}; at the valley: ${words(g.extraAtValley)}`,
        null,
        "—",
        "a load that does not follow the pressure is not relied on to relieve (EN 1990 §6.4.3.2: favourable variable actions taken as zero, from memory)",
      ),
    );
  }
  if (e.equivalentRange) {
    steps.push(
      step(
        "amplitude",
        `Equivalent local stress amplitude at the bore${label}`,
        "σa = ½·max(|Δσ₁ − Δσ₂|, |Δσ₂ − Δσ₃|, |Δσ₃ − Δσ₁|)  (Tresca of the principal stress ranges)",
        `principal stresses at the bore: edge or hoop stress, axial or 0 at a free edge, radial −p; σa = ${fmt(g.amplitude)}`,
        g.amplitude,
        "MPa",
        EQUIVALENT_SOURCE.tresca,
      ),
    );
    steps.push(
      step(
        "mean",
        `Equivalent local mean stress at the bore${label}`,
        "σm = max(|σm,1 − σm,2|, |σm,2 − σm,3|, |σm,3 − σm,1|)  (Tresca of the mean stresses, no sign: compression counts as tension)",
        `σm = ${fmt(g.mean)}`,
        g.mean,
        "MPa",
        "equivalent of the means as for combined loading, Shigley's Mechanical Engineering Design §6-14, with Tresca in place of von Mises",
      ),
    );
  } else {
    steps.push(
      step(
        "amplitude",
        `Local stress amplitude${label}`,
        "σa = |σ_max − σ_min|/2",
        `σa = |${fmt(g.mean + g.amplitude)} − ${fmt(g.mean - g.amplitude)}|/2`,
        g.amplitude,
        "MPa",
        "definition (Dowling, §9.2)",
      ),
    );
    steps.push(
      step(
        "mean",
        `Local mean stress${label}`,
        "σm = (σ_max + σ_min)/2",
        `σm = (${fmt(g.mean + g.amplitude)} + ${fmt(g.mean - g.amplitude)})/2`,
        g.mean,
        "MPa",
        input.fatigue.localYield === "shakedown" && e.localYield
          ? "shakedown: σm = Sy − σa (Dowling §10.7, from memory)"
          : "definition (Dowling, §9.2)",
      ),
    );
  }
  if (ctx.vessel) {
    const v = vesselSteps(ctx.vessel, 2 * g.amplitude, g.mean, load.isSpectrum);
    steps.push(...v.steps);
  } else if (input.fatigue.curve === "welded") {
    steps.push(
      step(
        "weld-range",
        `Stress range at the weld detail${label}`,
        "Δσ = 2σa (no mean-stress correction at welds)",
        `Δσ = 2 × ${fmt(g.amplitude)}`,
        2 * g.amplitude,
        "MPa",
        "EN 1993-1-9 §7.1: stress range, no mean-stress correction",
      ),
    );
  } else {
    const w = criterionWorking(criterion, g.amplitude, g.mean, ctx.strengths);
    steps.push(
      step(
        "sigma-ar",
        `Equivalent fully reversed amplitude (${CRITERION_LABEL[criterion]})${label}`,
        w.equation,
        w.substituted,
        g.sigmaAr,
        "MPa",
        CRITERION_SOURCE[criterion],
      ),
    );
    if (!load.isSpectrum && g.sigmaAr !== null && g.status !== "no-damage") steps.push(lifeStep(g.sigmaAr, ctx.curve, g.life));
  }
  if (load.isSpectrum) {
    if (e.life === 0) {
      steps.push(
        step(
          "miner-damage",
          "Fatigue damage per pass through the load history",
          "D = Σ nᵢ/Nᵢ",
          "a cycle has no answer under the criterion ⇒ no life",
          null,
          "—",
          "Palmgren–Miner rule",
        ),
      );
    } else {
      const extra = input.axialExtra ?? { max_MPa: 0, min_MPa: 0 };
      const thick = e.equivalentRange;
      const lifeOf = (range: number, mean: number) =>
        cycleAtPoint(ctx, criterion, e.point, e.fatigueUnit, extra, e.scale, range, mean, thick, true).life;
      // With a welded detail, its design limits (fatigue limit, cut-off) come first: the Miner sum reads each cycle against them.
      if (g.welded) steps.push(...g.welded.steps.filter((st) => st.id !== "welded-life"));
      steps.push(...minerDamage(load.cycles, lifeOf).steps);
    }
  } else if (g.welded) {
    // The welded method's own steps: the detail's fatigue limit and the life in its regime.
    steps.push(...g.welded.steps);
  }
  const sf = input.fatigue.scatterFactor;
  const unit = load.isSpectrum ? "passes" : "cycles";
  if (e.life !== null) {
    steps.push(
      step(
        "allowable",
        "Allowable life (scatter factor applied)",
        "N_allow = N/SF",
        `N_allow = ${fmt(e.life)}/${fmt(sf)}`,
        e.allowable,
        unit,
        "scatter factor on life, common practice in fatigue substantiation",
      ),
    );
    steps.push(
      step(
        "damage",
        "Damage against the design life",
        "D = N_design/N_allow",
        `D = ${fmt(input.fatigue.designLife_cycles)}/${fmt(e.allowable ?? 0)}`,
        e.damage,
        "—",
        "Palmgren–Miner; D ≤ 1 passes",
      ),
    );
  } else {
    steps.push(
      step(
        "damage",
        "Damage against the design life",
        "N unlimited ⇒ D = 0",
        "unlimited life ⇒ D = 0",
        0,
        "—",
        "endurance limit (Dowling, §9.4)",
      ),
    );
  }
  return steps;
}

/**
 * The local stress at each point of the opening at maximum and minimum pressure, superposed from the
 * hoop and axial stresses of that instant, and which point governs fatigue.
 */
function pointSteps(ctx: Context, e: Evaluation): Step[] {
  const { input } = ctx;
  const steps: Step[] = [];
  const thick = e.equivalentRange;
  const field = pointField(ctx);
  const shown = input.cutout.kind === "none" ? e.candidates : field.candidates.filter((c) => !c.membrane || c === e.point);
  for (const c of shown) {
    const at = (h: number, x: number) => c.fh * h + c.fa * x;
    const coeff = `${fmt(c.fh)}·σθ ${c.fa < 0 ? "−" : "+"} ${fmt(Math.abs(c.fa))}·σx`;
    steps.push(
      step(
        `local-${c.point.id}`,
        `Local stress at ${c.point.label}, at maximum and minimum pressure`,
        c.q === 1 || c.membrane ? "σ = c_θ·σθ + c_x·σx" : "σf = σn + q·(c_θ·σθ + c_x·σx − σn)",
        `σ_max = ${coeff} = ${fmt(c.fh)} × ${fmt(e.hoopMax)} + ${fmt(c.fa)} × ${fmt(e.axialMax)} = ${fmt(at(e.hoopMax, e.axialMax))} MPa; ` +
          `σ_min = ${fmt(c.fh)} × ${fmt(e.hoopMin)} + ${fmt(c.fa)} × ${fmt(e.axialMin)} = ${fmt(at(e.hoopMin, e.axialMin))} MPa`,
        at(e.hoopMax, e.axialMax) - at(e.hoopMin, e.axialMin),
        "MPa (range)",
        c.membrane ? "membrane stress (no concentration)" : `${field.opening.basis}; superposition at each instant`,
      ),
    );
  }
  if (field.opening.assumed)
    steps.push(
      step("kt-assumed", "What the given Kt is taken to mean", "σ_edge = Kt·σθ", field.opening.basis, null, "—", "assumption, stated"),
    );
  steps.push(
    step(
      "governing-point",
      "Point that governs fatigue",
      "the point with the most damage per pass (every point at every counted peak and valley)",
      `${e.point.point.label}${thick ? `; ${e.theory === "thick" ? "thick wall" : "vessel route"}: Tresca equivalent of the principal stress ranges at the bore` : ""}`,
      e.life,
      ctx.load.isSpectrum ? "passes" : "cycles",
      "superposition of the hoop and axial stresses at each instant; the worst point governs",
    ),
  );
  steps.push(
    step(
      "peak-max",
      "Local stress at the governing point, maximum pressure",
      "σ_max = fθ·σθ,max + fx·σx,max",
      `σ_max = ${fmt(e.point.fh)} × ${fmt(e.hoopMax)} + ${fmt(e.point.fa)} × ${fmt(e.axialMax)}`,
      e.peakMax,
      "MPa",
      "superposition; equals Kf·σθ,max where the edge runs along the hoop",
    ),
  );
  steps.push(
    step(
      "peak-min",
      "Local stress at the governing point, minimum pressure",
      "σ_min = fθ·σθ,min + fx·σx,min",
      `σ_min = ${fmt(e.point.fh)} × ${fmt(e.hoopMin)} + ${fmt(e.point.fa)} × ${fmt(e.axialMin)}`,
      e.peakMin,
      "MPa",
      "superposition of the stresses at the minimum of the cycle",
    ),
  );
  return steps;
}
