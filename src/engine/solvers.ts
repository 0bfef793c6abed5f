/**
 * @module engine/solvers
 * Design solvers. The reserve of an evaluation is the smaller of the fatigue reserve
 * log10(N_allow / N_design) and the static reserve log10(σ_allow / σvm); both grow with thickness
 * and fall with pressure, so the minimum thickness (or the maximum pressure) is the root of the reserve.
 */
import { evaluate, type Context, type Evaluation } from "./evaluate.ts";
import type { CheckResult } from "./result.ts";
import { roundingFor, roundingWords, roundUp } from "./gauges.ts";
import { increasingRoot } from "./solve.ts";
import { fmt, step, type Step } from "./step.ts";
import { mm, say, type Warning } from "./phrase.ts";
import { gaugeFloor_mm } from "./static/index.ts";

const CAP = 50;

function reserve(e: Evaluation, designLife: number): { value: number; governs: "fatigue" | "static" } {
  const fatigue = e.allowable === null ? CAP : e.allowable <= 0 ? -CAP : Math.log10(e.allowable / designLife);
  const stat = e.static.ratio > 0 ? Math.min(Math.log10(e.static.ratio), CAP) : -CAP;
  return fatigue <= stat ? { value: Math.max(fatigue, -CAP), governs: "fatigue" } : { value: Math.max(stat, -CAP), governs: "static" };
}

/** The two reserves separately. */
function reserves(e: Evaluation, designLife: number): { fatigue: number; stat: number } {
  const fatigue = e.allowable === null ? CAP : e.allowable <= 0 ? -CAP : Math.log10(e.allowable / designLife);
  const stat = e.static.ratio > 0 ? Math.min(Math.log10(e.static.ratio), CAP) : -CAP;
  return { fatigue, stat };
}

/**
 * The check that binds at a root: the one that fails just past it on the failing side. At a knee the
 * passing side has an unlimited fatigue life, so the smaller reserve there would wrongly name the static
 * check; the failing side names the endurance limit.
 */
function binding(at: Evaluation, past: Evaluation, designLife: number): string {
  const p = reserves(past, designLife);
  const which = p.fatigue < 0 && (p.stat >= 0 || p.fatigue <= p.stat) ? "fatigue" : p.stat < 0 ? "static" : reserve(at, designLife).governs;
  if (which === "fatigue" && at.allowable === null)
    return "fatigue, at the endurance limit (the local equivalent amplitude falls to the limit here, below which the life is unlimited)";
  return which;
}

export function solveFor(
  ctx: Context,
  target: "thickness" | "pressure",
): { solution: NonNullable<CheckResult["solution"]>; steps: Step[]; warnings: Warning[] } {
  const design = ctx.input.fatigue.designLife_cycles;
  const shell = ctx.input.shell;
  const t0 = shell.thickness_mm;
  const warnings: Warning[] = [];
  const REL_TOL = 1e-4;
  const unit = ctx.load.isSpectrum ? "passes" : "cycles";
  if (target === "thickness") {
    // The wall must leave an inside: for a mean radius t < 2r, for an outer radius t < r.
    const tMax =
      shell.radiusAt === "inner" ? 100 * shell.radius_mm : shell.radiusAt === "mean" ? 1.999 * shell.radius_mm : 0.999 * shell.radius_mm;
    const root = increasingRoot((t) => reserve(evaluate(ctx, t, 1), design).value, t0, t0 * 1e-4, tMax, REL_TOL);
    const e = evaluate(ctx, root.x, 1);
    const governs = root.found ? binding(e, evaluate(ctx, root.x * (1 - 4 * REL_TOL), 1), design) : "none";
    if (!root.found)
      warnings.push(
        root.side === "above-max"
          ? "no wall thickness meets the design life and the static check for this radius"
          : "even a wall far thinner than the given one meets the checks; the solve stopped at 1/10 000 of it",
      );
    const steps: Step[] = [
      step(
        "solve-thickness",
        "Minimum wall thickness for the fatigue and static checks (crack growth and test evidence are not re-solved)",
        "t_min: min(log₁₀(N_allow/N_design), log₁₀(static capacity/demand)) = 0",
        `t_min = ${fmt(root.x)} mm (${governs} governs; ${root.evaluations} evaluations)`,
        root.x,
        "mm",
        "bracketing and Illinois false position (Dowell & Jarratt 1971) on ln t",
      ),
    ];
    if (!root.found)
      return {
        solution: { thickness_mm: root.x, governs, iterations: root.iterations, evaluations: root.evaluations },
        steps,
        warnings,
      };
    // Round up to a thickness that exists, never below the minimum gauge, and show the reserve there.
    const rounding = roundingFor(ctx.input.solve ?? {}, ctx.input.material.family, shell.service);
    // Never below the minimum gauge, exclusive of the corrosion allowance (ASME VIII-1 UG-16(b) convention, from memory).
    const floor = gaugeFloor_mm(ctx.staticPlan);
    const rounded = roundUp(root.x, rounding, floor);
    // A gauge past the geometric limit would leave no inside: keep the solved value and say so.
    const tr = rounded <= tMax ? rounded : root.x;
    if (rounded > tMax)
      warnings.push(
        say`the next gauge (${mm(rounded)}) leaves no inside for this radius; the solved minimum is given unrounded and lies on the line`,
      );
    const er = evaluate(ctx, tr, 1);
    const words = roundingWords(rounding);
    const fatigueWords =
      er.life === null
        ? "unlimited fatigue life"
        : `allowable ${fmt(er.allowable ?? 0)} ${unit} against ${fmt(design)} (damage ${fmt(er.damage ?? Infinity, 3)})`;
    steps.push(
      step(
        "solve-thickness-rounded",
        `Wall thickness to use: the solved minimum rounded up to the next of ${words}${floor > 0 ? `, at least the minimum gauge ${fmt(floor)} mm` : ""}`,
        "t = next gauge ≥ t_min; reserves at t",
        `t_min = ${fmt(root.x)} mm → t = ${fmt(tr)} mm: ${fatigueWords}; static margin ${fmt(er.staticMargin, 3)}`,
        tr,
        "mm",
        "rounding up to an available thickness, common practice",
      ),
    );
    return {
      solution: {
        thickness_mm: tr,
        requiredThickness_mm: root.x,
        roundedTo: words,
        damageAtThickness: er.damage,
        staticMarginAtThickness: er.staticMargin,
        governs: floor > root.x ? "minimum gauge" : governs,
        iterations: root.iterations,
        evaluations: root.evaluations,
      },
      steps,
      warnings,
    };
  }
  // Pressure: scale every pressure by s; the reserve falls with s, so solve on w = 1/s where it rises.
  const root = increasingRoot((w) => reserve(evaluate(ctx, t0, 1 / w), design).value, 1, 1e-6, 1e6, REL_TOL);
  const s = 1 / root.x;
  const e = evaluate(ctx, t0, s);
  const governs = root.found ? binding(e, evaluate(ctx, t0, s * (1 + 4 * REL_TOL)), design) : "none";
  if (!root.found) warnings.push("no pressure scale between 10⁻⁶ and 10⁶ times the given one brings the reserve to zero");
  const pMax = ctx.load.max_MPa * s;
  const stepOut = step(
    "solve-pressure",
    "Maximum pressure for the fatigue and static checks (all pressures scaled together; crack growth and test evidence are not re-solved)",
    "p_max: min(log₁₀(N_allow/N_design), log₁₀(static capacity/demand)) = 0",
    `p_max = ${fmt(ctx.load.max_MPa)} × ${fmt(s)} (${governs} governs; ${root.evaluations} evaluations)`,
    pMax,
    "MPa",
    "bracketing and Illinois false position (Dowell & Jarratt 1971) on ln(1/s)",
  );
  return {
    solution: { pressureMax_MPa: pMax, governs, iterations: root.iterations, evaluations: root.evaluations },
    steps: [stepOut],
    warnings,
  };
}
