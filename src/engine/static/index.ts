/**
 * The static check by the basis the shell's engineers work to.
 *
 * - "en13445-3": design by formula. Nominal design stress f = min(Rp0.2/1.5, Rm/2.4) for steels
 *   (EN 13445-3 §6, Table 6-1, normal operating cases); the required wall of a cylinder
 *   e = P·Di/(2fz − P) (§7.4.2) and of a sphere e = P·Di/(4fz − P) (§7.4.3), valid for e/De ≤ 0.16,
 *   with the weld joint coefficient z.
 * - "asme-viii-1": UG-27. Circumferential stress t = PR/(SE − 0.6P) (valid for t ≤ R/2 and
 *   P ≤ 0.385SE), longitudinal stress t = PR/(2SE + 0.4P) (t ≤ R/2, P ≤ 1.25SE), sphere
 *   t = PR/(2SE − 0.2P) (t ≤ 0.356R, P ≤ 0.665SE). S = min(Su/3.5, 2Sy/3) at room temperature
 *   (ASME II-D Mandatory Appendix 1) unless the user gives S; joint efficiency E.
 * - "aircraft": von Mises at the limit pressure (limit factor × differential) against yield, and at
 *   the ultimate pressure (limit factor × ultimate factor × differential) against the ultimate strength.
 * - "yield": von Mises at the maximum pressure against yield / factor.
 *
 * Lengths in mm, stresses and pressures in MPa. The code formulas take the inner radius in the
 * corroded condition (the new inner radius plus the corrosion allowance) and are compared with the
 * analysis wall e_a = e_n − c − δ; the required (ordered) wall is e + c + δ, and never below the
 * minimum gauge plus the corrosion allowance. Recalled clauses are marked "from memory".
 */
import type { MaterialFamily } from "../../schema/check.ts";
import type { ResolvedStatic } from "../input.ts";
import type { StaticBasis } from "../../schema/service.ts";
import { fmt, step, type Step } from "../step.ts";
import { mm, n, pressure, say, type Phrase, type Warning } from "../phrase.ts";

export const EN13445_VALIDITY = 0.16;

export interface StaticPlan {
  basis: StaticBasis;
  form: "cylinder" | "sphere";
  /** f (EN), S (ASME), Sy/n (yield), Sy (aircraft limit). */
  allowable_MPa: number;
  /** The aircraft basis's ultimate allowable (Su); NaN otherwise. */
  ultimate_MPa: number;
  joint: number;
  corrosion_mm: number;
  tolerance_mm: number;
  gauge_mm: number;
  limitFactor: number;
  ultimateFactor: number;
  yieldFactor: number;
  /** Why the basis cannot judge this shell (a family the code does not cover), or null. */
  refer: string | null;
  steps: Step[];
  warnings: Warning[];
}

const EN_F = "EN 13445-3 §6, Table 6-1: f = min(Rp0.2/1.5, Rm/2.4) for steels other than austenitic (from memory)";
const ASME_S = "ASME II-D Mandatory Appendix 1, Table 1-100: S = min(Su/3.5, 2Sy/3) at room temperature (from memory)";

export function staticPlan(
  s: ResolvedStatic,
  form: "cylinder" | "sphere",
  material: { family: MaterialFamily; yield_MPa: number; ultimate_MPa: number },
): StaticPlan {
  const steps: Step[] = [];
  const warnings: Warning[] = [];
  let refer: string | null = null;
  const Sy = material.yield_MPa;
  const Su = material.ultimate_MPa;
  let allowable_MPa: number;
  let ultimate_MPa = NaN;
  if (s.basis === "en13445-3") {
    if (s.allowableStress_MPa !== undefined) {
      allowable_MPa = s.allowableStress_MPa;
      steps.push(
        step(
          "static-design-stress",
          "Nominal design stress (given)",
          "f",
          `f = ${fmt(allowable_MPa)}`,
          allowable_MPa,
          "MPa",
          "given by the user from the code's material rules",
        ),
      );
    } else {
      allowable_MPa = Math.min(Sy / 1.5, Su / 2.4);
      const family = material.family;
      let source = EN_F;
      if (family === "stainless")
        source +=
          "; for austenitic steels the code allows max(Rp1.0/1.5, min(Rp1.0/1.2, Rm/3)) (§6, A ≥ 35 %), and Rp1.0 ≥ Rp0.2, so this is the conservative side";
      steps.push(
        step(
          "static-design-stress",
          "Nominal design stress",
          "f = min(Rp0.2/1.5, Rm/2.4)",
          `f = min(${fmt(Sy)}/1.5, ${fmt(Su)}/2.4)`,
          allowable_MPa,
          "MPa",
          source,
        ),
      );
      if (family === "aluminium")
        warnings.push(
          "EN 13445-3 sets design stresses for steels; aluminium vessels follow EN 13445-8. The steel rule is applied; give static.allowableStress_MPa from the aluminium rules.",
        );
      if (family === "titanium" || family === "other")
        refer = `EN 13445-3 gives no design stress rule here for the "${family}" family: give material.family or static.allowableStress_MPa`;
    }
  } else if (s.basis === "asme-viii-1") {
    if (s.allowableStress_MPa !== undefined) {
      allowable_MPa = s.allowableStress_MPa;
      steps.push(
        step(
          "static-design-stress",
          "Allowable stress (given)",
          "S",
          `S = ${fmt(allowable_MPa)}`,
          allowable_MPa,
          "MPa",
          "given by the user from ASME II-D tables",
        ),
      );
    } else {
      allowable_MPa = Math.min(Su / 3.5, (2 * Sy) / 3);
      steps.push(
        step(
          "static-design-stress",
          "Allowable stress at room temperature",
          "S = min(Su/3.5, 2Sy/3)",
          `S = min(${fmt(Su)}/3.5, 2 × ${fmt(Sy)}/3)`,
          allowable_MPa,
          "MPa",
          ASME_S,
        ),
      );
    }
  } else if (s.basis === "aircraft") {
    allowable_MPa = Sy;
    ultimate_MPa = Su;
  } else {
    allowable_MPa = Sy / s.yieldFactor;
  }
  return {
    basis: s.basis,
    form,
    allowable_MPa,
    ultimate_MPa,
    joint: s.jointEfficiency,
    corrosion_mm: s.corrosionAllowance_mm,
    tolerance_mm: s.thicknessTolerance_mm,
    gauge_mm: s.minimumGauge_mm,
    limitFactor: s.limitFactor,
    ultimateFactor: s.ultimateFactor,
    yieldFactor: s.yieldFactor,
    refer,
    steps,
    warnings,
  };
}

/** The wall taken off the ordered thickness before any stress is worked: corrosion and minus tolerance. */
export function allowances_mm(plan: StaticPlan): number {
  return plan.corrosion_mm + plan.tolerance_mm;
}

/** Least ordered wall: the minimum gauge, exclusive of the corrosion allowance. */
export function gaugeFloor_mm(plan: StaticPlan): number {
  return plan.gauge_mm > 0 ? plan.gauge_mm + plan.corrosion_mm : 0;
}

export interface CodeFormula {
  /** Wall the formula asks for, without allowances; Infinity when the pressure is beyond the formula. */
  formula_mm: number;
  /** Which formula governs (ASME cylinder: circumferential or longitudinal). */
  governs: string;
  /** Why the formula is outside its published range, or null. */
  outside: Phrase | null;
}

/** The code formula at pressure P with the corroded inner radius R (mm). */
export function codeFormula(plan: StaticPlan, P: number, R: number): CodeFormula {
  const f = plan.allowable_MPa;
  const z = plan.joint;
  const D = 2 * R;
  if (plan.basis === "en13445-3") {
    const denom = plan.form === "cylinder" ? 2 * f * z - P : 4 * f * z - P;
    const e = denom > 0 ? (P * D) / denom : Infinity;
    const ratio = e / (D + 2 * e);
    const outside =
      ratio > EN13445_VALIDITY ? say`e/De = ${n(ratio, 3)} is above ${String(EN13445_VALIDITY)}, the limit of the §7.4 formulas` : null;
    return { formula_mm: e, governs: plan.form === "cylinder" ? "cylinder §7.4.2" : "sphere §7.4.3", outside };
  }
  // ASME VIII-1 UG-27
  const SE = f * z;
  if (plan.form === "sphere") {
    const denom = 2 * SE - 0.2 * P;
    const t = denom > 0 ? (P * R) / denom : Infinity;
    const outside =
      P > 0.665 * SE
        ? say`P = ${pressure(P)} is above 0.665SE = ${pressure(0.665 * SE)} (UG-27(d)); Appendix 1-3 applies`
        : t > 0.356 * R
          ? say`t = ${mm(t)} is above 0.356R (UG-27(d)); Appendix 1-3 applies`
          : null;
    return { formula_mm: t, governs: "sphere UG-27(d)", outside };
  }
  const dc = SE - 0.6 * P;
  const tc = dc > 0 ? (P * R) / dc : Infinity;
  const tl = (P * R) / (2 * SE + 0.4 * P);
  const circ = tc >= tl;
  const t = Math.max(tc, tl);
  const outside =
    P > 0.385 * SE
      ? say`P = ${pressure(P)} is above 0.385SE = ${pressure(0.385 * SE)} (UG-27(c)(1)); the thick-wall formulas of Appendix 1-2 apply`
      : t > R / 2
        ? say`t = ${mm(t)} is above R/2 (UG-27(c)); the thick-wall formulas of Appendix 1-2 apply`
        : null;
  return { formula_mm: t, governs: circ ? "circumferential stress UG-27(c)(1)" : "longitudinal stress UG-27(c)(2)", outside };
}

export interface StaticAt {
  /** Capacity over demand; 1 or more passes. */
  ratio: number;
  /** The stress the basis compares (σvm, factored for the aircraft basis); NaN for the code formulas. */
  demand_MPa: number;
  /** The code formula's wall, without allowances (code bases only). */
  formula: CodeFormula | null;
  /** Which check of the basis governs, in words. */
  governs: string;
}

export interface StaticInputs {
  analysis_mm: number;
  /** Inner radius of the new wall. */
  innerRadius_mm: number;
  pMax: number;
  /** von Mises at the maximum pressure times a factor (the added axial stress unfactored). */
  vonMisesAt: (factor: number) => number;
}

export function staticAt(plan: StaticPlan, g: StaticInputs): StaticAt {
  if (plan.basis === "en13445-3" || plan.basis === "asme-viii-1") {
    const formula = codeFormula(plan, g.pMax, g.innerRadius_mm + plan.corrosion_mm);
    const ratio = g.analysis_mm > 0 ? g.analysis_mm / formula.formula_mm : 0;
    return { ratio, demand_MPa: NaN, formula, governs: formula.governs };
  }
  if (plan.basis === "aircraft") {
    const limit = g.vonMisesAt(plan.limitFactor);
    const ultimate = g.vonMisesAt(plan.limitFactor * plan.ultimateFactor);
    const rl = limit > 0 ? plan.allowable_MPa / limit : Infinity;
    const ru = ultimate > 0 ? plan.ultimate_MPa / ultimate : Infinity;
    return rl <= ru
      ? { ratio: rl, demand_MPa: limit, formula: null, governs: "limit pressure against yield" }
      : { ratio: ru, demand_MPa: ultimate, formula: null, governs: "ultimate pressure against the ultimate strength" };
  }
  const vm = g.vonMisesAt(1);
  return { ratio: vm > 0 ? plan.allowable_MPa / vm : Infinity, demand_MPa: vm, formula: null, governs: "von Mises against yield / factor" };
}

const ANALYSIS_WALL_SOURCE =
  "EN 13445-3 §5.2 (analysis thickness); ASME VIII-1 UG-16, UG-25 (from memory). Every stress of this check is worked on e_a";

/** The worked steps of the static check at the given wall. */
export function staticSteps(plan: StaticPlan, g: StaticInputs, at: StaticAt, thickness_mm: number): Step[] {
  const steps: Step[] = [...plan.steps];
  const c = plan.corrosion_mm;
  const d = plan.tolerance_mm;
  if (c > 0 || d > 0)
    steps.push(
      step(
        "static-analysis-thickness",
        "Analysis wall: the ordered wall less corrosion and minus tolerance",
        "e_a = e_n − c − δ",
        `e_a = ${fmt(thickness_mm)} − ${fmt(c)} − ${fmt(d)}`,
        g.analysis_mm,
        "mm",
        `${ANALYSIS_WALL_SOURCE}${
          d > 0
            ? `. Sides: the corrosion is taken off the bore (R_i + c) and the minus tolerance off the outer face, as UG-27 and §7.4 take the inner radius at its nominal value plus corrosion; δ taken off the bore instead would raise the membrane stresses by about δ/R = ${fmt((100 * d) / (g.innerRadius_mm + c), 2)} %`
            : ", the corrosion taken off the bore (R_i + c)"
        }`,
      ),
    );
  if (at.formula) {
    const R = g.innerRadius_mm + c;
    const P = g.pMax;
    const f = plan.allowable_MPa;
    const z = plan.joint;
    steps.push(
      step(
        "static-corroded-radius",
        "Inner radius in the corroded condition",
        "R = R_i + c",
        `R = ${fmt(g.innerRadius_mm)} + ${fmt(c)}`,
        R,
        "mm",
        "ASME VIII-1 UG-27 (R in the corroded condition); EN 13445-3 §7.4 with Di of the corroded shell (from memory)",
      ),
    );
    steps.push(
      step(
        "static-pressure",
        "Pressure the formula takes",
        "P = p_max",
        `P = ${fmt(P)}  (the highest pressure of the load; a code's design pressure may be higher, e.g. the relief-valve setting)`,
        P,
        "MPa",
        "common practice: the formula is worked at the highest pressure given",
      ),
    );
    if (plan.basis === "en13445-3") {
      const cyl = plan.form === "cylinder";
      steps.push(
        step(
          "static-formula-thickness",
          cyl ? "Required wall of the cylinder (without allowances)" : "Required wall of the sphere (without allowances)",
          cyl ? "e = P·Di/(2f·z − P)" : "e = P·Di/(4f·z − P)",
          `e = ${fmt(P)} × ${fmt(2 * R)}/(${cyl ? 2 : 4} × ${fmt(f)} × ${fmt(z)} − ${fmt(P)})`,
          Number.isFinite(at.formula.formula_mm) ? at.formula.formula_mm : null,
          "mm",
          cyl
            ? "EN 13445-3 §7.4.2, cylindrical shells under internal pressure, eq. (7.4-1) (from memory); z: weld joint coefficient, §5.7"
            : "EN 13445-3 §7.4.3, spherical shells under internal pressure (from memory); z: weld joint coefficient, §5.7",
        ),
      );
    } else if (plan.form === "cylinder") {
      const SE = f * z;
      const tc = (P * R) / (SE - 0.6 * P);
      const tl = (P * R) / (2 * SE + 0.4 * P);
      steps.push(
        step(
          "static-asme-circumferential",
          "Required wall for the circumferential stress (longitudinal joints)",
          "t = P·R/(S·E − 0.6P)",
          `t = ${fmt(P)} × ${fmt(R)}/(${fmt(f)} × ${fmt(z)} − 0.6 × ${fmt(P)})`,
          SE - 0.6 * P > 0 ? tc : null,
          "mm",
          "ASME VIII-1 UG-27(c)(1), valid for t ≤ R/2 and P ≤ 0.385SE",
        ),
        step(
          "static-asme-longitudinal",
          "Required wall for the longitudinal stress (circumferential joints)",
          "t = P·R/(2S·E + 0.4P)",
          `t = ${fmt(P)} × ${fmt(R)}/(2 × ${fmt(f)} × ${fmt(z)} + 0.4 × ${fmt(P)})`,
          tl,
          "mm",
          "ASME VIII-1 UG-27(c)(2), valid for t ≤ R/2 and P ≤ 1.25SE; one E is taken for both joints",
        ),
        step(
          "static-formula-thickness",
          "Required wall (without allowances): the larger",
          "t = max(t_circ, t_long)",
          `t = max(${fmt(SE - 0.6 * P > 0 ? tc : Infinity)}, ${fmt(tl)})  (${at.formula.governs})`,
          Number.isFinite(at.formula.formula_mm) ? at.formula.formula_mm : null,
          "mm",
          "ASME VIII-1 UG-27(c)",
        ),
      );
    } else {
      steps.push(
        step(
          "static-formula-thickness",
          "Required wall of the sphere (without allowances)",
          "t = P·R/(2S·E − 0.2P)",
          `t = ${fmt(P)} × ${fmt(R)}/(2 × ${fmt(f)} × ${fmt(z)} − 0.2 × ${fmt(P)})`,
          Number.isFinite(at.formula.formula_mm) ? at.formula.formula_mm : null,
          "mm",
          "ASME VIII-1 UG-27(d), valid for t ≤ 0.356R and P ≤ 0.665SE",
        ),
      );
    }
    const req = requiredOrdered(plan, at.formula.formula_mm);
    steps.push(
      step(
        "static-required-thickness",
        "Required ordered wall: formula plus allowances, not below the minimum gauge",
        "e_req = max(e + c + δ, e_gauge + c)",
        `e_req = max(${fmt(at.formula.formula_mm)} + ${fmt(c)} + ${fmt(d)}, ${fmt(plan.gauge_mm)} + ${fmt(c)})`,
        Number.isFinite(req) ? req : null,
        "mm",
        plan.basis === "en13445-3"
          ? "EN 13445-3 §5.2: required thickness e + c + δ (from memory); minimum gauge exclusive of corrosion, ASME VIII-1 UG-16(b) convention"
          : "ASME VIII-1 UG-16, UG-25: t + c, plus the mill undertolerance; minimum gauge UG-16(b) (from memory)",
      ),
    );
    steps.push(
      step(
        "static-margin",
        "Static margin on the wall",
        "MS = e_a/e − 1",
        `MS = ${fmt(g.analysis_mm)}/${fmt(at.formula.formula_mm)} − 1`,
        at.ratio - 1,
        "—",
        "margin of safety, common practice: the analysis wall over the wall the formula asks for",
      ),
    );
    return steps;
  }
  if (plan.basis === "aircraft") {
    const fl = plan.limitFactor;
    const fu = plan.limitFactor * plan.ultimateFactor;
    const limit = g.vonMisesAt(fl);
    const ult = g.vonMisesAt(fu);
    steps.push(
      step(
        "static-limit-pressure",
        "Limit pressure",
        "p_L = k_L·p_max",
        `p_L = ${fmt(fl)} × ${fmt(g.pMax)}`,
        fl * g.pMax,
        "MPa",
        "limit factor on the maximum cabin differential, common practice (CS/14 CFR 25.365(d): 1.33, from memory); user-settable",
      ),
      step(
        "static-limit-stress",
        "von Mises at the limit pressure",
        "σvm,L = σvm(p_L)",
        `σvm,L at ${fmt(fl * g.pMax)} MPa`,
        limit,
        "MPa",
        "von Mises criterion; membrane stresses in proportion to pressure",
      ),
      step(
        "static-limit-margin",
        "Margin at limit pressure against yield",
        "MS_L = Sy/σvm,L − 1",
        `MS_L = ${fmt(plan.allowable_MPa)}/${fmt(limit)} − 1`,
        plan.allowable_MPa / limit - 1,
        "—",
        "no yield at limit load (CS/14 CFR 25.305(a), from memory)",
      ),
      step(
        "static-ultimate-pressure",
        "Ultimate pressure",
        "p_U = k_L·k_U·p_max",
        `p_U = ${fmt(fl)} × ${fmt(plan.ultimateFactor)} × ${fmt(g.pMax)}`,
        fu * g.pMax,
        "MPa",
        "ultimate factor of safety 1.5 on the limit load (CS/14 CFR 25.303, from memory); user-settable",
      ),
      step(
        "static-ultimate-stress",
        "von Mises at the ultimate pressure",
        "σvm,U = σvm(p_U)",
        `σvm,U at ${fmt(fu * g.pMax)} MPa`,
        ult,
        "MPa",
        "von Mises criterion; membrane stresses in proportion to pressure",
      ),
      step(
        "static-ultimate-margin",
        "Margin at ultimate pressure against the ultimate strength",
        "MS_U = Su/σvm,U − 1",
        `MS_U = ${fmt(plan.ultimate_MPa)}/${fmt(ult)} − 1`,
        plan.ultimate_MPa / ult - 1,
        "—",
        "no failure at ultimate load (CS/14 CFR 25.305(b), from memory)",
      ),
      step(
        "static-margin",
        "Static margin (the smaller)",
        "MS = min(MS_L, MS_U)",
        `MS = ${at.governs}`,
        at.ratio - 1,
        "—",
        "margin of safety, common practice",
      ),
    );
    return steps;
  }
  const vm = g.vonMisesAt(1);
  steps.push(
    step(
      "static-allowable",
      "Allowable membrane stress",
      "σ_allow = Sy/n_y",
      `σ_allow = ${fmt(plan.allowable_MPa * plan.yieldFactor)}/${fmt(plan.yieldFactor)}`,
      plan.allowable_MPa,
      "MPa",
      "yield factor 1.5 by default, i.e. 2/3 of yield, common practice (not a code's design-by-formula check)",
    ),
    step(
      "static-margin",
      "Static margin",
      "MS = σ_allow/σvm − 1",
      `MS = ${fmt(plan.allowable_MPa)}/${fmt(vm)} − 1`,
      at.ratio - 1,
      "—",
      "margin of safety, common practice",
    ),
  );
  return steps;
}

/** Ordered wall a formula wall asks for: plus allowances, and not below the gauge floor. */
export function requiredOrdered(plan: StaticPlan, formula_mm: number): number {
  return Math.max(formula_mm + plan.corrosion_mm + plan.tolerance_mm, gaugeFloor_mm(plan));
}

/** The plain statement every sheet of a code basis carries. */
export function basisStatement(basis: StaticBasis): string | null {
  if (basis === "en13445-3" || basis === "asme-viii-1")
    return `This is the shell formula check of ${basis === "en13445-3" ? "EN 13445-3" : "ASME VIII-1"}, not a statement of compliance with the code. The code's other rules — openings and nozzle reinforcement, heads, materials and their certificates, design temperature, fabrication, examination and pressure testing — are not checked.`;
  if (basis === "aircraft")
    return "This is the pressure-factor check of a cabin skin on membrane stresses, not a showing of compliance with the airworthiness requirements: other loads, joints, frames, fail-safety and damage tolerance need their own substantiation.";
  return null;
}
