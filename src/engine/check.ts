/**
 * @module engine/check
 * The whole check in order: the load, the material's curve, the membrane, static, notch and fatigue
 * evaluation, then the optional solve, crack growth, test evidence and fleet view, and the verdict.
 * It gathers the steps and the warnings of every stage; each warning is kept as a phrase, so the
 * result carries it both as SI text (`warnings`) and as words and amounts (`warningParts`).
 */
import { MEAN_STRESS_CRITERIA } from "../schema/check.ts";
import { fingerprint } from "./fingerprint.ts";
import type { ResolvedCheck } from "./input.ts";
import { fitCoupons } from "./coupons.ts";
import { damageTolerance } from "./crackProgramme.ts";
import { InputError } from "./errors.ts";
import { cycleAtPoint, evaluate, evaluationSteps, membraneAt, type Context, type Evaluation } from "./evaluate.ts";
import { evaluateEvidence } from "./evidence.ts";
import { fleetView } from "./fleet.ts";
import { resolveLoad, type Load } from "./load.ts";
import { CRITERION_LABEL } from "./meanStress.ts";
import type { CheckResult, CriterionRow } from "./result.ts";
import { BELOW_LIMIT_SOURCE, enduranceLimitInUse, modifyingFactors, VALID_LIFE } from "./sn.ts";
import { solveFor } from "./solvers.ts";
import { trace } from "./openings/geometry.ts";
import { outlineOf, type ShapeCutout } from "./openings/index.ts";
import { normalQuantile } from "./special.ts";
import { fmt, step, type Step } from "./step.ts";
import { bare, joined, MPa, mm, n, pressure, say, type Warning, warningParts, warningText } from "./phrase.ts";
import { inSheetOrder } from "./sections.ts";
import { EXTERNAL_PRESSURE_WORDS, VERDICT_WORDS, verdictTable } from "./verdict.ts";
import { ENGINE_VERSION } from "./version.ts";
import { allowances_mm, basisStatement, gaugeFloor_mm, requiredOrdered, type StaticPlan, staticPlan } from "./static/index.ts";
import { increasingRoot } from "./solve.ts";
import { plasticityFactor, temperatureFactor, vesselLife, vesselSteps, weldedThicknessFactor } from "./vessel/fatigue.ts";
import { weldedLife } from "./welded.ts";

/** The geometry and material values the check was worked at (the opening traced from the same outline the solver uses). */
function workedAt(input: ResolvedCheck, t: number): CheckResult["workedAt"] {
  const c = input.cutout;
  const shaped = c.kind !== "none" && c.kind !== "given" && !(c.kind === "circular-hole" && c.radius_mm === undefined);
  return {
    form: input.shell.form,
    thickness_mm: t,
    ultimate_MPa: input.material.ultimate_MPa,
    yield_MPa: input.material.yield_MPa,
    walkerGamma: input.fatigue.walkerGamma,
    outline: shaped ? trace(outlineOf(c as ShapeCutout)) : null,
    fasteners: (c.kind !== "given" ? (c.fasteners ?? []) : []).map((f) => ({
      hoop_mm: f.hoop_mm,
      axial_mm: f.axial_mm,
      radius_mm: f.radius_mm,
    })),
  };
}

/** What a stage adds to the sheet: its steps and its warnings, in the order they are worked. */
interface Said {
  steps: Step[];
  warnings: Warning[];
}

/** Stage 1, the load: the pressure cycle or spectrum, and what a hysteresis gate left out. */
function loadStage(input: ResolvedCheck, said: Said): Load {
  const load = resolveLoad(input.pressure, input.fatigue.designLife_cycles > 1);
  if (!load.isSpectrum && load.min_MPa >= load.max_MPa) {
    throw new InputError(
      "pressure.min_MPa",
      `the minimum pressure (${fmt(load.min_MPa)} MPa) must be below the maximum (${fmt(load.max_MPa)} MPa)`,
    );
  }
  said.steps.push(...load.steps);
  if (load.gate && load.gate.removed > 0)
    said.warnings.push(
      say`the hysteresis gate of ${pressure(load.gate.gate_MPa)} removed ${String(load.gate.removed)} reversals of the history: the damage of ripples below the gate is not counted`,
    );
  return load;
}

/** The material's fatigue curve as the check uses it. */
interface CurveInUse {
  fit?: ReturnType<typeof fitCoupons>;
  coefficient: number;
  exponent: number;
  mods: ReturnType<typeof modifyingFactors>;
  se: ReturnType<typeof enduranceLimitInUse> | { value: undefined; steps: Step[]; warnings: Warning[] };
}

/**
 * Stage 2, the material's curve: fitted to coupons where they are given and no σ'f and b are,
 * corrected by the modifying (Marin) factors, with the endurance limit in use and, under a
 * spectrum, what happens to cycles below it.
 */
function curveStage(input: ResolvedCheck, load: Load, said: Said): CurveInUse {
  const mat = input.material;
  let fit: ReturnType<typeof fitCoupons> | undefined;
  if (mat.coupons && input.fatigue.curve === "basquin") {
    fit = fitCoupons(mat.coupons);
    said.steps.push(...fit.steps);
    said.warnings.push(...fit.warnings);
  }
  const coefficient = mat.fatigueStrengthCoefficient_MPa ?? fit?.fatigueStrengthCoefficient_MPa ?? NaN;
  const exponent = mat.fatigueStrengthExponent ?? fit?.fatigueStrengthExponent ?? NaN;
  const fitUsed = fit !== undefined && mat.fatigueStrengthCoefficient_MPa === undefined;
  if (fit && !fitUsed)
    said.warnings.push("coupons were given but σ'f and b were given too; the given σ'f and b are used and the fit is shown for comparison");
  if (fitUsed && mat.libraryCurve)
    said.warnings.push(
      say`the curve is fitted to the coupons given (σ'f = ${MPa(coefficient)}, b = ${n(exponent)}); the library's σ'f = ${MPa(mat.libraryCurve.fatigueStrengthCoefficient_MPa)} and b = ${n(mat.libraryCurve.fatigueStrengthExponent)} for ${mat.name} are shown for comparison only`,
    );
  const curveKind = input.fatigue.curve;
  const steelLike = mat.family === "steel" || mat.family === "stainless";
  const defaultSurface = curveKind === "basquin" && !fitUsed && steelLike && mat.surface && input.fatigue.modifiers?.surface === undefined;
  const modifiers = defaultSurface ? { ...input.fatigue.modifiers, surface: mat.surface } : input.fatigue.modifiers;
  const mods = modifyingFactors(
    modifiers,
    mat.ultimate_MPa,
    normalQuantile,
    mat.family,
    defaultSurface ? "the library entry's as-delivered finish; fatigue.modifiers.surface changes it" : undefined,
  );
  said.steps.push(...mods.steps);
  said.warnings.push(...mods.warnings);
  const se =
    curveKind === "basquin"
      ? enduranceLimitInUse(
          mat.enduranceLimit_MPa,
          coefficient,
          exponent,
          mat.family,
          mat.id !== undefined && input.document.material.enduranceLimit_MPa === undefined,
        )
      : { value: undefined, steps: [], warnings: [] };
  said.steps.push(...se.steps);
  said.warnings.push(...se.warnings);
  const belowLimit = input.fatigue.belowEnduranceLimit;
  if (se.value !== undefined && load.isSpectrum)
    said.steps.push(
      step(
        "below-endurance-limit",
        "Spectrum cycles below the endurance limit",
        belowLimit === "haibach" ? "N = N_knee·(k·Se/σar)^(2m − 1), m = −1/b" : "N = ½·(σar/(k·σ'f))^(1/b) below k·Se too",
        belowLimit === "haibach"
          ? `slope 2m − 1 = ${fmt(2 * (-1 / exponent) - 1)} below k·Se = ${fmt(se.value * mods.factor)} MPa`
          : `slope m = ${fmt(-1 / exponent)} below k·Se = ${fmt(se.value * mods.factor)} MPa`,
        belowLimit === "haibach" ? 2 * (-1 / exponent) - 1 : -1 / exponent,
        "—",
        BELOW_LIMIT_SOURCE[belowLimit],
      ),
    );
  return { fit, coefficient, exponent, mods, se };
}

/** Stage 3, the static basis and the wall the allowances leave; a wall they use up is an input error. */
function staticStage(input: ResolvedCheck, said: Said): StaticPlan {
  const plan = staticPlan(input.static, input.shell.form, input.material);
  said.warnings.push(...plan.warnings);
  const t = input.shell.thickness_mm;
  if (t - allowances_mm(plan) <= 0)
    throw new InputError(
      "static.corrosionAllowance_mm",
      `the corrosion allowance and the minus tolerance (${fmt(allowances_mm(plan))} mm together) leave nothing of the ${fmt(t)} mm wall`,
    );
  return plan;
}

/** What every evaluation of the check needs, at whatever thickness or pressure a solver tries. */
function contextOf(input: ResolvedCheck, load: Load, plan: StaticPlan, curve: CurveInUse): Context {
  const mat = input.material;
  const curveKind = input.fatigue.curve;
  return {
    input,
    load,
    staticPlan: plan,
    vessel:
      curveKind === "en13445-welded" || curveKind === "en13445-unwelded"
        ? {
            kind: curveKind,
            family: mat.family,
            yield_MPa: mat.yield_MPa,
            ultimate_MPa: mat.ultimate_MPa,
            class_MPa: input.fatigue.detailCategory_MPa ?? NaN,
            thickness_mm: input.shell.thickness_mm,
            temperature_C: input.fatigue.temperature_C,
            rz_um: input.fatigue.roughnessRz_um,
          }
        : undefined,
    curve: {
      coefficient_MPa: curve.coefficient,
      exponent: curve.exponent,
      enduranceLimit_MPa: curve.se.value,
      factor: curve.mods.factor,
      belowLimit: input.fatigue.belowEnduranceLimit,
    },
    strengths: {
      ultimate_MPa: mat.ultimate_MPa,
      yield_MPa: mat.yield_MPa,
      fatigueStrengthCoefficient_MPa: curve.coefficient,
      walkerGamma: input.fatigue.walkerGamma,
    },
  };
}

/** Stage 4, the evaluation at the given wall: membrane, static, opening, notch and fatigue, with each method's range warnings. */
function evaluationStage(ctx: Context, said: Said): Evaluation {
  const criterion = ctx.input.fatigue.meanStress;
  const e = evaluate(ctx, ctx.input.shell.thickness_mm, 1, criterion);
  said.steps.push(...evaluationSteps(ctx, e, criterion));
  said.warnings.push(...e.conc.warnings, ...e.notch.warnings, ...(e.governing.welded?.warnings ?? []), ...validityWarnings(ctx, e));
  // The vessel route's own range warnings (ke extrapolated, the creep range, the thickness held at 150 mm), at the governing cycle.
  if (ctx.vessel) said.warnings.push(...vesselSteps(ctx.vessel, 2 * e.governing.amplitude, e.governing.mean, ctx.load.isSpectrum).warnings);
  return e;
}

/** Stage 5, the static check's findings: the wall it needs, the minimum gauge, and what sends it to a code. */
function staticSection(ctx: Context, e: Evaluation, said: Said): CheckResult["static"] {
  const { input, staticPlan: plan } = ctx;
  const t = input.shell.thickness_mm;
  const required = requiredThickness(ctx, e);
  if (required.step) said.steps.push(required.step);
  const gaugeOk = t >= gaugeFloor_mm(plan);
  if (!gaugeOk)
    said.warnings.push(
      say`the wall (${mm(t)}) is below the minimum gauge (${mm(plan.gauge_mm)} plus ${mm(plan.corrosion_mm)} corrosion allowance)`,
    );
  if (e.static.formula?.outside)
    said.warnings.push(
      joined([say`the static formula is used outside its range: `, e.static.formula.outside, say`; the static check is referred`], ""),
    );
  if (plan.refer) said.warnings.push(plan.refer);
  if (input.axialExtra && (plan.basis === "en13445-3" || plan.basis === "asme-viii-1"))
    said.warnings.push(
      "the shell formulas of the code take pressure alone: the added axial stress is not in the formula check (only in the stresses and the fatigue)",
    );
  return {
    basis: plan.basis,
    service: input.shell.service,
    yieldFactor: input.static.yieldFactor,
    allowable_MPa: e.staticAllowable,
    vonMisesMax_MPa: e.vonMisesMax,
    margin: e.staticMargin,
    pass: e.staticMargin >= 0 && gaugeOk && !plan.refer && !e.static.formula?.outside,
    refer: plan.refer ?? e.static.formula?.outside?.text ?? null,
    referParts: plan.refer ? [plan.refer] : (e.static.formula?.outside?.parts ?? null),
    governs: e.static.governs,
    jointEfficiency: plan.joint,
    corrosionAllowance_mm: plan.corrosion_mm,
    thicknessTolerance_mm: plan.tolerance_mm,
    minimumGauge_mm: plan.gauge_mm,
    analysisThickness_mm: e.thickness_mm - allowances_mm(plan),
    formulaThickness_mm: e.static.formula ? finiteOrNull(e.static.formula.formula_mm) : null,
    requiredThickness_mm: required.value,
    limitFactor: plan.basis === "aircraft" ? plan.limitFactor : null,
    ultimateFactor: plan.basis === "aircraft" ? plan.ultimateFactor : null,
    statement: basisStatement(plan.basis),
    defaults: input.static.defaults,
  };
}

function membraneSection(input: ResolvedCheck, e: Evaluation): CheckResult["membrane"] {
  return {
    theory: e.theory,
    theoryReason: theoryReason(input.shell.theory, e),
    innerRadius_mm: e.radii.inner_mm,
    meanRadius_mm: e.radii.mean_mm,
    outerRadius_mm: e.radii.outer_mm,
    hoopMax_MPa: e.hoopMax,
    hoopMin_MPa: e.hoopMin,
    axialMax_MPa: e.axialMax,
    axialMin_MPa: e.axialMin,
    radialMax_MPa: e.radialMax,
    vonMisesMax_MPa: e.vonMisesMax,
  };
}

function notchSection(e: Evaluation): CheckResult["notch"] {
  return {
    kt: e.conc.kt,
    ktGoverns: e.conc.governs,
    biaxialRatio: e.lambda,
    q: e.notch.q,
    kf: e.notch.kf,
    peakMax_MPa: e.peakMax,
    peakMin_MPa: e.peakMin,
    localYield: e.localYield,
    ...(e.conc.fasteners?.length
      ? {
          fasteners: e.conc.fasteners.map((f) => ({
            kt: f.kt,
            hoop_mm: f.hoop_mm,
            axial_mm: f.axial_mm,
            radius_mm: f.radius_mm,
            ligament_mm: Number.isFinite(f.ligament_mm) ? f.ligament_mm : null,
            solvedWithOpening: f.solvedWithOpening,
            ktKirsch: f.ktKirsch,
          })),
        }
      : {}),
    ...(e.conc.picture ? { opening: e.conc.picture } : {}),
    ...(e.conc.refer?.length ? { refer: e.conc.refer } : {}),
  };
}

function fatigueSection(ctx: Context, e: Evaluation, curve: CurveInUse): CheckResult["fatigue"] {
  const f = ctx.input.fatigue;
  return {
    criterion: f.meanStress,
    curve: f.curve,
    amplitude_MPa: e.governing.amplitude,
    mean_MPa: e.governing.mean,
    equivalentAmplitude_MPa: e.governing.sigmaAr,
    life_cycles: e.life,
    allowableLife_cycles: e.allowable,
    designLife_cycles: f.designLife_cycles,
    scatterFactor: f.scatterFactor,
    damage: e.damage,
    lifeCountedIn: ctx.load.isSpectrum ? "passes" : "cycles",
    modifyingFactor: curve.mods.factor,
    curveUsed: {
      fatigueStrengthCoefficient_MPa: curve.coefficient,
      fatigueStrengthExponent: curve.exponent,
      enduranceLimit_MPa: curve.se.value ?? null,
    },
    criteria: f.curve !== "basquin" ? [] : compareCriteria(ctx, e),
    pass: e.damage !== null && e.damage <= 1,
    detailCategory_MPa: f.curve === "basquin" ? null : (f.detailCategory_MPa ?? null),
    weldDetail: f.curve === "en13445-welded" ? (f.weldDetail ?? null) : null,
    temperature_C: f.temperature_C,
    defaults: f.defaults,
    weldedPoint: weldedPoint(ctx, e),
  };
}

/** The spectrum's cycles at the governing point, for the spectrum plot and the damage sum. */
function spectrumSection(ctx: Context, e: Evaluation): NonNullable<CheckResult["spectrum"]> {
  const { input, load } = ctx;
  const extra = input.axialExtra ?? { max_MPa: 0, min_MPa: 0 };
  return {
    cycles: load.cycles.map((c) => {
      const o = cycleAtPoint(ctx, input.fatigue.meanStress, e.point, e.fatigueUnit, extra, 1, c.range, c.mean, e.equivalentRange, true);
      return { range_MPa: 2 * o.amplitude, mean_MPa: o.mean, count: c.count };
    }),
    totalCycles: load.cycles.reduce((s, c) => s + c.count, 0),
    damagePerPass: e.damagePerPass,
    passesToFailure: e.life,
    historyPoints: load.historyPoints,
  };
}

/** The test evidence against the design life, in cycles: with a spectrum the design life counts passes and is converted first. */
function evidenceSection(input: ResolvedCheck, load: Load, said: Said): NonNullable<CheckResult["evidence"]> {
  const cyclesPerPass = load.isSpectrum ? load.cycles.reduce((s, c) => s + c.count, 0) : 1;
  const designCycles = input.fatigue.designLife_cycles * cyclesPerPass;
  if (load.isSpectrum)
    said.steps.push(
      step(
        "evidence-design-cycles",
        "Design life in cycles, for comparison with test lives in cycles",
        "N_design = B_design × n_pass",
        `N_design = ${fmt(input.fatigue.designLife_cycles)} passes × ${fmt(cyclesPerPass)} cycles per pass`,
        designCycles,
        "cycles",
        "unit conversion: test lives count cycles, the design life counts passes of the spectrum",
      ),
    );
  const { steps, warnings, ...evidence } = evaluateEvidence(input.evidence!, designCycles, input.fatigue.scatterFactor);
  if (load.isSpectrum)
    warnings.push(
      say`the test lives (cycles) are compared with the design life converted to cycles, ${n(designCycles)} = ${n(input.fatigue.designLife_cycles)} passes × ${n(cyclesPerPass)} cycles per pass; tests at one amplitude do not reproduce the spectrum's mix of cycles, so the comparison is approximate`,
    );
  said.steps.push(...steps);
  said.warnings.push(...warnings);
  return { ...evidence, designLife_cycles: designCycles };
}

/**
 * The whole check, stage by stage: load → material curve → static plan → evaluation (membrane,
 * static, notch, fatigue) → the sections of the result → optional solve, crack growth, test
 * evidence and fleet view → verdict, with the steps put in the sheet's order. Pure: no I/O.
 * Throws InputError only for input problems that show once the numbers are worked; faces turn it
 * into the errors document.
 */
export function runCheck(input: ResolvedCheck): CheckResult {
  const said: Said = { steps: [], warnings: [] };
  const { steps, warnings } = said;
  const load = loadStage(input, said);
  const curve = curveStage(input, load, said);
  const plan = staticStage(input, said);
  const ctx = contextOf(input, load, plan, curve);
  const e = evaluationStage(ctx, said);
  const t = input.shell.thickness_mm;
  const mat = input.material;

  const result: CheckResult = {
    format: "hoopwise.result/1",
    engine: ENGINE_VERSION,
    fingerprint: fingerprint(input.document),
    title: input.title,
    verdict: "pass",
    verdictMeaning: "",
    governs: "",
    governing: { rowId: "static", text: "", parts: [] },
    workedAt: workedAt(input, t),
    load: { pressureMax_MPa: load.max_MPa, pressureMin_MPa: load.min_MPa, source: load.source },
    membrane: membraneSection(input, e),
    static: staticSection(ctx, e, said),
    notch: notchSection(e),
    fatigue: fatigueSection(ctx, e, curve),
    lifeVsThickness: lifeVsThickness(ctx, t),
    verdictTable: [],
    sections: [],
    material: { id: mat.id, name: mat.name, source: mat.source, typical: mat.id !== undefined },
    steps,
    warnings: [],
    warningParts: [],
  };
  if (curve.fit) result.materialFit = fitSummary(curve.fit, mat.coupons ?? []);
  if (load.isSpectrum) result.spectrum = spectrumSection(ctx, e);

  if (input.solve) {
    const s = solveFor(ctx, input.solve.for);
    result.solution = s.solution;
    steps.push(...s.steps);
    warnings.push(...s.warnings);
  }
  if (input.crack) addCrack(result, input, e, load, steps, warnings);
  if (input.evidence) result.evidence = evidenceSection(input, load, said);
  if (input.fleet) addFleet(result, input, e, steps, warnings);

  const table = verdictTable(result);
  result.verdictTable = table.rows;
  result.verdict = table.verdict;
  result.verdictMeaning = VERDICT_WORDS[table.verdict].meaning;
  result.governs = table.governs;
  result.governing = table.governing;
  const ordered = inSheetOrder(result.steps);
  result.steps = ordered.steps;
  result.sections = ordered.sections;
  result.warnings = warnings.map(warningText);
  result.warningParts = warnings.map(warningParts);
  return result;
}

/** The largest cycle on a welded class curve: the range entering the curve after its corrections, and its life. */
function weldedPoint(ctx: Context, e: Evaluation): CheckResult["fatigue"]["weldedPoint"] {
  const f = ctx.input.fatigue;
  const cls = f.detailCategory_MPa;
  if (cls === undefined || (f.curve !== "welded" && f.curve !== "en13445-welded")) return null;
  const spectrum = ctx.load.isSpectrum;
  const range = 2 * e.governing.amplitude;
  if (ctx.vessel) {
    const v = ctx.vessel;
    const design =
      (plasticityFactor(range, v.yield_MPa, v.family, v.ultimate_MPa) * range) /
      (weldedThicknessFactor(v.thickness_mm) * temperatureFactor(v.temperature_C, v.family));
    return {
      curveName: `EN 13445-3 class ${fmt(cls)}`,
      class_MPa: cls,
      range_MPa: design,
      life_cycles: vesselLife(v, range, 0, spectrum),
      variableAmplitude: spectrum,
    };
  }
  const w = weldedLife(range, cls, { variableAmplitude: spectrum, gammaMf: f.gammaMf });
  return {
    curveName: `EN 1993-1-9 category ${fmt(cls)}`,
    class_MPa: cls,
    range_MPa: range * f.gammaMf,
    life_cycles: w.life_cycles,
    variableAmplitude: spectrum,
  };
}

function finiteOrNull(x: number): number | null {
  return Number.isFinite(x) ? x : null;
}

/**
 * The ordered wall the static basis alone asks for at the given pressure: the code formula plus
 * allowances (closed form) or, for the stress bases, the wall where the static ratio reaches 1.
 */
function requiredThickness(ctx: Context, e: Evaluation): { value: number | null; step?: Step } {
  const plan = ctx.staticPlan;
  if (e.static.formula) {
    const v = requiredOrdered(plan, e.static.formula.formula_mm);
    return { value: finiteOrNull(v) };
  }
  const shell = ctx.input.shell;
  const tMax =
    shell.radiusAt === "inner" ? 100 * shell.radius_mm : shell.radiusAt === "mean" ? 1.999 * shell.radius_mm : 0.999 * shell.radius_mm;
  const start = Math.max(e.thickness_mm, allowances_mm(plan) * 1.01 + 1e-6);
  const root = increasingRoot(
    (t) => Math.log(Math.max(membraneAt(ctx, t, 1).st.ratio, 1e-300)),
    start,
    Math.max(start * 1e-4, allowances_mm(plan) + 1e-9),
    tMax,
    1e-6,
  );
  if (!root.found) return { value: null };
  const v = Math.max(root.x, gaugeFloor_mm(plan));
  const c = plan.corrosion_mm;
  const d = plan.tolerance_mm;
  return {
    value: v,
    step: step(
      "static-required-thickness",
      "Required ordered wall for the static check alone",
      plan.basis === "aircraft"
        ? "e_req: min(MS_L, MS_U) = 0, plus c + δ, not below the gauge"
        : "e_req: σvm(e_req − c − δ) = Sy/n_y, not below the gauge",
      `e_req = ${fmt(root.x - c - d)} + ${fmt(c)} + ${fmt(d)} (gauge floor ${fmt(gaugeFloor_mm(plan))})`,
      v,
      "mm",
      "the membrane stresses solved for the wall (bracketing and Illinois false position, Dowell & Jarratt 1971)",
    ),
  };
}

function addCrack(result: CheckResult, input: ResolvedCheck, e: Evaluation, load: Load, steps: Step[], warnings: Warning[]): void {
  const d = withPressurePath(input, () => damageTolerance(input, e, load));
  result.crack = d.crack;
  steps.push(...d.steps);
  warnings.push(...d.warnings);
}

/** The fleet view from the test evidence, or from the computed life with an assumed scatter. */
function addFleet(result: CheckResult, input: ResolvedCheck, e: Evaluation, steps: Step[], warnings: Warning[]): void {
  const f = input.fleet!;
  const ev = result.evidence;
  const sigma = ev?.logStdDev ?? f.logStdDev;
  const mu = ev ? ev.logMean : e.life !== null && e.life > 0 ? Math.log10(e.life) : null;
  if (mu === null || sigma === null || sigma === undefined || !Number.isFinite(mu) || mu > 250) {
    warnings.push(
      "the fleet view needs a finite median life and a scatter; the computed life is unlimited or nil, so no fleet figures are given",
    );
    return;
  }
  if (!(sigma >= 0.001)) {
    warnings.push(
      say`the scatter of log10 life (${n(sigma)}) is below 0.001: no real fleet is that uniform, and the fleet figures would be noise, so none are given`,
    );
    return;
  }
  const v = fleetView({
    size: f.size,
    logMean: mu,
    logStdDev: sigma,
    designLife_cycles: input.fatigue.designLife_cycles,
    basis: ev ? "test evidence" : "computed life",
    testLives_cycles: input.evidence?.lives_cycles ?? [],
  });
  result.fleet = v.fleet;
  steps.push(...v.steps);
  warnings.push(...v.warnings);
}

/** Pressure given by altitude, history or blocks has no max_MPa/min_MPa field: point at the pressure as a whole. */
function withPressurePath<T>(input: ResolvedCheck, fn: () => T): T {
  try {
    return fn();
  } catch (err) {
    if (err instanceof InputError && err.path.startsWith("pressure.") && input.pressure.max_MPa === undefined)
      throw new InputError("pressure", err.message);
    throw err;
  }
}

/** Life under each criterion at the same thickness, so the user sees how much the choice matters. */
function compareCriteria(ctx: Context, chosenEvaluation: Evaluation): CriterionRow[] {
  const chosen = ctx.input.fatigue.meanStress;
  return MEAN_STRESS_CRITERIA.map((c) => {
    // The chosen criterion was evaluated already for the check itself.
    const e = c === chosen ? chosenEvaluation : evaluate(ctx, chosenEvaluation.thickness_mm, 1, c);
    return {
      criterion: c,
      label: CRITERION_LABEL[c],
      equivalentAmplitude_MPa: e.governing.sigmaAr,
      life_cycles: e.life,
      allowableLife_cycles: e.allowable,
      damage: e.damage,
      status: e.life === 0 ? "no-answer" : e.governing.status,
      chosen: c === chosen,
    };
  });
}

function lifeVsThickness(ctx: Context, t: number): CheckResult["lifeVsThickness"] {
  const shell = ctx.input.shell;
  const points: CheckResult["lifeVsThickness"] = [];
  for (let i = 0; i <= 20; i++) {
    const ti = t * (0.6 + i * 0.05);
    const inner =
      shell.radiusAt === "inner" ? shell.radius_mm : shell.radiusAt === "mean" ? shell.radius_mm - ti / 2 : shell.radius_mm - ti;
    if (inner <= 0) continue;
    points.push({ thickness_mm: ti, life_cycles: evaluate(ctx, ti, 1).life });
  }
  return points;
}

function theoryReason(requested: string, e: Evaluation): string {
  const ratio = fmt(e.radii.mean_mm / e.thickness_mm);
  if (requested === "auto")
    return e.theory === "thin" ? `thin-wall theory: r_m/t = ${ratio} ≥ 10` : `thick-wall (Lamé) theory: r_m/t = ${ratio} < 10`;
  return `${e.theory}-wall theory as requested (r_m/t = ${ratio})`;
}

function validityWarnings(ctx: Context, e: Evaluation): Warning[] {
  const w: Warning[] = [];
  const { input } = ctx;
  const ratio = e.radii.mean_mm / e.thickness_mm;
  if (e.theory === "thin" && ratio < 10) {
    const thick = evaluateThick(ctx, e);
    w.push(
      say`thin-wall theory was asked for at r_m/t = ${n(ratio)}, below 10: it under-estimates the inner-surface hoop stress by ${n(100 * (thick / e.hoopMax - 1), 2)} %; use "auto" or "thick"`,
    );
  }
  if (e.theory === "thick" && input.cutout.kind !== "none")
    w.push(
      say`the wall is thick (r_m/t = ${n(ratio)}): the concentration factor of the opening is a flat-plate (membrane) solution, outside its range where the stress varies through the wall and the bore carries a radial stress; the local stress is an estimate, and a nozzle or opening in a thick wall needs a method for it (the governing code's nozzle rules or a finite-element model)`,
    );
  if (ctx.load.min_MPa < 0)
    w.push(
      say`the pressure differential falls below zero (to ${pressure(ctx.load.min_MPa)}): an outside pressure can buckle the shell, which this tool does not check; the item ${EXTERNAL_PRESSURE_WORDS}`,
    );
  if (e.localYield) {
    w.push(
      say`the elastic local stress at the notch (${MPa(e.peakMax)}) exceeds the yield strength (${MPa(input.material.yield_MPa)}): the notch yields on the first cycle. ${
        input.fatigue.localYield === "shakedown"
          ? "The local mean stress is reduced to Sy − σa (shakedown); a strain-life analysis would be more exact."
          : 'The elastic stresses are kept, which over-states the mean stress (conservative); choose localYield "shakedown" or make a strain-life analysis for a closer answer.'
      }`,
    );
  }
  if (2 * e.governing.amplitude > 2 * input.material.yield_MPa)
    w.push(
      "the local stress range exceeds twice the yield strength: the notch yields in every cycle (reversed plasticity); stress-life results are not valid there",
    );
  if (e.life === 0) w.push(`no life: ${e.governing.reason ?? "the mean stress is beyond the chosen criterion's range"}. The check fails.`);
  if (e.governing.status === "no-damage") w.push(e.governing.reason ?? "the cycle never reaches tension");
  if (input.fatigue.curve === "basquin" && !ctx.load.isSpectrum && e.life !== null && e.life > 0) {
    if (e.life < VALID_LIFE[0])
      w.push(
        say`the life (${n(e.life)} cycles) is below 10³ cycles, where local plasticity makes stress-life curves unreliable; a strain-life analysis is needed`,
      );
    if (e.life > VALID_LIFE[1] && ctx.curve.enduranceLimit_MPa === undefined)
      w.push(
        say`the life (${n(e.life)} cycles) extrapolates the curve beyond 10⁷ cycles, past typical test data and with no endurance limit given`,
      );
  }
  if (input.fatigue.curve === "basquin" && ctx.load.isSpectrum && e.life !== null && e.life > 0) {
    // The same life-range limits, cycle by cycle at the governing point.
    const extra = input.axialExtra ?? { max_MPa: 0, min_MPa: 0 };
    let shortest = Infinity;
    let beyondDamage = 0;
    let damage = 0;
    for (const c of ctx.load.cycles) {
      const o = cycleAtPoint(ctx, input.fatigue.meanStress, e.point, e.fatigueUnit, extra, 1, c.range, c.mean, e.equivalentRange, true);
      if (o.life === null || !(o.life > 0)) continue;
      shortest = Math.min(shortest, o.life);
      damage += c.count / o.life;
      if (o.life > VALID_LIFE[1]) beyondDamage += c.count / o.life;
    }
    if (shortest < VALID_LIFE[0])
      w.push(
        say`the largest cycles of the spectrum have lives of ${n(shortest)} cycles, below 10³ cycles, where local plasticity makes stress-life curves unreliable; a strain-life analysis is needed`,
      );
    if (beyondDamage > 0 && ctx.curve.enduranceLimit_MPa === undefined)
      w.push(
        say`${n((100 * beyondDamage) / damage, 2)} % of the damage per pass comes from cycles whose lives extrapolate the curve beyond 10⁷ cycles, past typical test data and with no endurance limit given`,
      );
  }
  const coupons = input.material.coupons?.filter((c) => !c.runout) ?? [];
  if (coupons.length && input.fatigue.curve === "basquin" && input.material.fatigueStrengthCoefficient_MPa === undefined) {
    const lo = Math.min(...coupons.map((c) => c.amplitude_MPa));
    const hi = Math.max(...coupons.map((c) => c.amplitude_MPa));
    const sar = e.governing.sigmaAr;
    if (sar !== null && sar > 0 && (sar < lo * (1 - 1e-9) || sar > hi * (1 + 1e-9)))
      w.push(
        say`the operating equivalent amplitude (${MPa(sar)}) lies outside the range of the coupons that failed (${bare(MPa(lo))}–${MPa(hi)}): the fitted curve is extrapolated there`,
      );
  }
  if (input.fatigue.scatterFactor === 1)
    w.push("the scatter factor is 1: the life is a median estimate with no statistical allowance for the weaker items of a fleet");
  if (e.damage !== null && e.damage > 1)
    w.push(
      say`the allowable life (${n(e.allowable ?? 0)} ${ctx.load.isSpectrum ? "passes" : "cycles"}) is short of the design life (${n(input.fatigue.designLife_cycles)} ${ctx.load.isSpectrum ? "passes" : "cycles"})`,
    );
  return w;
}

function evaluateThick(ctx: Context, e: Evaluation): number {
  const thick = evaluate({ ...ctx, input: { ...ctx.input, shell: { ...ctx.input.shell, theory: "thick" } } }, e.thickness_mm, 1);
  return thick.hoopMax;
}

/** The fit with its E739 band drawn across the tested amplitudes (not beyond: the band is for the data's range). */
function fitSummary(
  fit: ReturnType<typeof fitCoupons>,
  coupons: { amplitude_MPa: number; runout: boolean }[],
): NonNullable<CheckResult["materialFit"]> {
  const tested = coupons.filter((c) => !c.runout).map((c) => c.amplitude_MPa);
  const lo = Math.min(...tested);
  const hi = Math.max(...tested);
  const amplitudes = Array.from({ length: 9 }, (_, i) => lo * (hi / lo) ** (i / 8));
  return {
    fatigueStrengthCoefficient_MPa: fit.fatigueStrengthCoefficient_MPa,
    fatigueStrengthExponent: fit.fatigueStrengthExponent,
    n: fit.n,
    runouts: fit.runouts,
    logStdDev: fit.logStdDev,
    rSquared: fit.rSquared,
    // The band's numbers only: its worked step is for the sheet's calculation, not for every plotted point.
    band: amplitudes.map((a) => {
      const b = fit.band(a, 0.95);
      return { amplitude_MPa: a, lower_cycles: b.lower_cycles, median_cycles: b.median_cycles, upper_cycles: b.upper_cycles };
    }),
  };
}
