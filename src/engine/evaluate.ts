import type { MeanStressCriterion } from "../schema/check.ts";
import type { ResolvedCheck } from "./input.ts";
import { concentration, type Concentration, type Cutout } from "./concentration.ts";
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
import { notchFactor, type NotchFactor } from "./notch.ts";
import { basquinLife, lifeStep, type Curve } from "./sn.ts";
import { fmt, step, type Step } from "./step.ts";
import { minerDamage } from "./miner.ts";
import { weldedLife } from "./welded.ts";

/**
 * One evaluation of the shell at a thickness and a pressure scale: membrane stresses, static check,
 * notch, and the fatigue damage of one pass of the load under a chosen mean-stress criterion.
 * Solvers call it many times; runCheck calls it once more with everything for the sheet.
 */
export interface Context {
  input: ResolvedCheck;
  load: Load;
  curve: Curve;
  strengths: Strengths;
  /** Kt and Kf with their steps by biaxial ratio: λ changes with thickness only when an axial load is added. */
  notchCache?: Map<number, { conc: ExtendedConcentration; notch: NotchFactor }>;
}

function notchAt(ctx: Context, lambda: number): { conc: ExtendedConcentration; notch: NotchFactor } {
  ctx.notchCache ??= new Map();
  const known = ctx.notchCache.get(lambda);
  if (known) return known;
  const { input } = ctx;
  // The opening's curvature is judged at the given wall (a solve for thickness keeps it).
  const shell = input.shell;
  const mean = radii(shell.radius_mm, shell.radiusAt, shell.thickness_mm).mean_mm;
  const conc = openingConcentration(input.cutout, lambda, { form: shell.form, meanRadius_mm: mean, thickness_mm: shell.thickness_mm }, () =>
    concentration(input.cutout as Cutout, lambda),
  );
  const notch = notchFactor(conc.kt, {
    q: input.fatigue.notchSensitivity,
    constant: input.fatigue.notchConstant,
    rootRadius_mm: conc.rootRadius_mm,
    family: input.material.family,
    ultimate_MPa: input.material.ultimate_MPa,
  });
  if (ctx.notchCache.size > 64) ctx.notchCache.clear();
  ctx.notchCache.set(lambda, { conc, notch });
  return { conc, notch };
}

export interface CycleOutcome {
  amplitude: number;
  mean: number;
  sigmaAr: number | null;
  life: number | null;
  status: "ok" | "no-answer" | "no-damage" | "unlimited";
  reason?: string;
  /** The welded method's own worked steps and warnings (EN 1993-1-9), kept for the sheet. */
  welded?: { steps: Step[]; warnings: string[] };
}

export interface Evaluation {
  thickness_mm: number;
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
  conc: ExtendedConcentration;
  notch: NotchFactor;
  peakMax: number;
  peakMin: number;
  localYield: boolean;
  /** The largest-range cycle, reported as the operating point. */
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
  const shell = input.shell;
  const r = radii(shell.radius_mm, shell.radiusAt, thickness_mm);
  const theory = chooseTheory(shell.theory, r, thickness_mm);
  const u = unitStresses(shell.form, theory, r, thickness_mm);
  const extra = input.axialExtra ?? { max_MPa: 0, min_MPa: 0 };
  const pMax = load.max_MPa * scale;
  const pMin = load.min_MPa * scale;
  const hoopMax = u.hoop * pMax;
  const hoopMin = u.hoop * pMin;
  const axialMax = u.axial * pMax + extra.max_MPa;
  const axialMin = u.axial * pMin + extra.min_MPa;
  const radialMax = u.radial * pMax;
  const vm = vonMises(hoopMax, axialMax, radialMax);
  const yieldFactor = input.static?.yieldFactor ?? 1.5;
  const staticAllowable = input.material.yield_MPa / yieldFactor;
  const lambda = hoopMax > 0 ? axialMax / hoopMax : 0;
  const { conc, notch } = notchAt(ctx, lambda);
  const localPerMPa = notch.kf * u.hoop * scale;
  const peakMax = localPerMPa * load.max_MPa;
  const peakMin = localPerMPa * load.min_MPa;

  let damagePerPass = 0;
  let noAnswer = false;
  let governing: CycleOutcome | undefined;
  let largestRange = -1;
  for (const c of load.cycles) {
    const o = cycleOutcome(ctx, criterion, localPerMPa * (c.range / 2), localPerMPa * c.mean, load.isSpectrum);
    // A life that underflowed to 0 is no life, as life 0 reads everywhere else.
    if (o.status === "no-answer" || o.life === 0) noAnswer = true;
    else if (o.life !== null) damagePerPass += c.count / o.life;
    if (c.range > largestRange) {
      largestRange = c.range;
      governing = o;
    }
  }
  const finiteDamage = Number.isFinite(damagePerPass);
  const life = noAnswer || !finiteDamage ? 0 : damagePerPass > 0 ? 1 / damagePerPass : null;
  const sf = input.fatigue.scatterFactor;
  const allowable = life === null ? null : life / sf;
  const ratio = allowable === null ? 0 : input.fatigue.designLife_cycles / allowable;
  const damage = Number.isFinite(ratio) ? ratio : null;
  return {
    thickness_mm,
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
    staticMargin: vm > 0 ? staticAllowable / vm - 1 : Infinity,
    lambda,
    conc,
    notch,
    peakMax,
    peakMin,
    localYield: peakMax > input.material.yield_MPa,
    governing: governing as CycleOutcome,
    life,
    damagePerPass: finiteDamage ? damagePerPass : null,
    allowable,
    damage,
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
  const life = basquinLife(eq.sigmaAr, curve);
  return { amplitude, mean: m, sigmaAr: eq.sigmaAr, life, status: life === null ? "unlimited" : "ok" };
}

/** The worked steps of one evaluation, in the order a checker redoes them. */
export function evaluationSteps(ctx: Context, e: Evaluation, criterion: MeanStressCriterion): Step[] {
  const { input, load } = ctx;
  const t = e.thickness_mm;
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
  const yf = input.static?.yieldFactor ?? 1.5;
  steps.push(
    step(
      "static-allowable",
      "Allowable membrane stress",
      "σ_allow = Sy/n_y",
      `σ_allow = ${fmt(input.material.yield_MPa)}/${fmt(yf)}`,
      e.staticAllowable,
      "MPa",
      "yield factor 1.5 by default, i.e. 2/3 of yield (ASME II-D Mandatory Appendix 1 basis, from memory)",
    ),
  );
  steps.push(
    step(
      "static-margin",
      "Static margin",
      "MS = σ_allow/σvm − 1",
      `MS = ${fmt(e.staticAllowable)}/${fmt(e.vonMisesMax)} − 1`,
      e.staticMargin,
      "—",
      "margin of safety, common practice",
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
  steps.push(
    step(
      "peak-max",
      "Local stress at the notch, maximum pressure",
      "σ_max = Kf·σθ,max",
      `σ_max = ${fmt(e.notch.kf)} × ${fmt(e.hoopMax)}`,
      e.peakMax,
      "MPa",
      "check format convention: local = Kf × nominal hoop",
    ),
  );
  steps.push(
    step(
      "peak-min",
      "Local stress at the notch, minimum pressure",
      "σ_min = Kf·σθ,min",
      `σ_min = ${fmt(e.notch.kf)} × ${fmt(e.hoopMin)}`,
      e.peakMin,
      "MPa",
      "check format convention: local = Kf × nominal hoop",
    ),
  );
  const g = e.governing;
  const label = load.isSpectrum ? " (largest cycle)" : "";
  steps.push(
    step(
      "amplitude",
      `Local stress amplitude${label}`,
      "σa = (σ_max − σ_min)/2",
      `σa = (${fmt(g.mean + g.amplitude)} − ${fmt(g.mean - g.amplitude)})/2`,
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
  if (input.fatigue.curve === "welded") {
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
      const k = e.notch.kf * e.unit.hoop * e.scale;
      const lifeOf = (range: number, mean: number) => cycleOutcome(ctx, criterion, (k * range) / 2, k * mean, true).life;
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
