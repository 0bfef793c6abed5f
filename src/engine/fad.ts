/**
 * Residual strength of a cracked part by a failure assessment diagram (FAD).
 *
 * A crack of size a under the peak load is assessed by two ratios:
 *   Kr = K_I(a)/K_mat   (fracture: the stress intensity against the toughness)
 *   Lr = σ_ref(a)/σy    (collapse: the reference stress of the cracked section against yield)
 * and it is acceptable while Kr ≤ f(Lr) and Lr ≤ Lr,max. The Option 1 curve of BS 7910 and R6:
 *   f(Lr) = (1 + 0.5·Lr²)^(−1/2)·[0.3 + 0.7·exp(−0.6·Lr⁶)] for Lr ≤ Lr,max, 0 beyond,
 *   Lr,max = (σy + σu)/(2σy)
 * (BS 7910, Guide to methods for assessing the acceptability of flaws in metallic structures,
 * Option 1 FAD; R6 Option 1 — from memory). Kr rises and f(Lr) falls as the crack grows, so the
 * critical size is the single crossing of the curve.
 *
 * Two limits of the diagram bound the answer: linear-elastic fracture mechanics (Kr = 1, the
 * toughness alone) and plastic collapse (Lr = Lr,max, the flow stress alone). The critical size
 * is said to be set by "toughness" when it lies within 5 % of the LEFM size, by "collapse" when it
 * lies on the cut-off or within 5 % of the collapse size, and by their "interaction" otherwise.
 *
 * Units: a in mm, stresses in MPa, K in MPa·√m.
 */
import { bracketRoot } from "./special.ts";

export type CriticalBy = "toughness" | "collapse" | "interaction" | "link-up";

/** BS 7910 / R6 Option 1 FAD curve f(Lr); 0 beyond the cut-off. */
export function fadOption1(Lr: number, LrMax: number): number {
  if (Lr > LrMax) return 0;
  return (0.3 + 0.7 * Math.exp(-0.6 * Lr ** 6)) / Math.sqrt(1 + 0.5 * Lr * Lr);
}

/** The cut-off of the Option 1 curve, Lr,max = (σy + σu)/(2σy): collapse at the flow stress. */
export function lrCutOff(yield_MPa: number, ultimate_MPa: number): number {
  return (yield_MPa + ultimate_MPa) / (2 * yield_MPa);
}

export interface FadCase {
  /** K_I at the peak load, MPa·√m, for a crack of size a (mm). */
  K: (a_mm: number) => number;
  /** Reference stress of the cracked section at the peak load, MPa. */
  sigmaRef: (a_mm: number) => number;
  toughness_MPaSqrtM: number;
  yield_MPa: number;
  ultimate_MPa: number;
  /** A size to start the search from (e.g. the initial crack). */
  start_mm: number;
  /** Largest size the factors allow (the section cut through); Infinity when unbounded. */
  limit_mm: number;
}

export interface FadResult {
  critical_mm: number;
  by: Exclude<CriticalBy, "link-up">;
  /** The assessment point at the critical size. */
  Lr: number;
  Kr: number;
  LrMax: number;
  /** LEFM limit: the size at which Kr = 1. */
  lefm_mm: number;
  /** Collapse limit: the size at which Lr = Lr,max (the limit when collapse never occurs). */
  collapse_mm: number;
}

/**
 * Smallest size at which h(a) reaches 1, h rising with a. A geometric walk from `start` brackets the
 * crossing; bracketRoot narrows it. Returns the limit when h stays below 1 up to it.
 */
export function firstCrossing(h: (a: number) => number, start_mm: number, limit_mm: number): number {
  const g = (a: number) => h(a) - 1;
  const top = Number.isFinite(limit_mm) ? limit_mm * (1 - 1e-12) : Infinity;
  let lo = Math.min(start_mm, top / 2);
  let hi = lo;
  for (let i = 0; i < 10000; i++) {
    if (g(lo) >= 0) {
      hi = lo;
      lo /= 1.25;
      if (lo < 1e-12) return lo;
    } else if (g(hi) < 0) {
      if (hi >= top) return top;
      lo = hi;
      hi = Math.min(hi * 1.25, top);
    } else {
      return bracketRoot(g, lo, hi, 1e-13);
    }
  }
  throw new RangeError("firstCrossing: no crossing found");
}

/** The critical size by the Option 1 diagram, with its two limits and what sets it. */
export function fadCriticalSize(c: FadCase): FadResult {
  const LrMax = lrCutOff(c.yield_MPa, c.ultimate_MPa);
  const Kr = (a: number) => c.K(a) / c.toughness_MPaSqrtM;
  const Lr = (a: number) => c.sigmaRef(a) / c.yield_MPa;
  const assess = (a: number) => {
    const l = Lr(a);
    if (l >= LrMax) return Infinity;
    return Kr(a) / fadOption1(l, LrMax);
  };
  const critical_mm = firstCrossing(assess, c.start_mm, c.limit_mm);
  const lefm_mm = firstCrossing(Kr, c.start_mm, c.limit_mm);
  const collapse_mm = firstCrossing((a) => Lr(a) / LrMax, c.start_mm, c.limit_mm);
  const onCutOff = Lr(critical_mm) >= LrMax * (1 - 1e-9);
  const by: FadResult["by"] =
    critical_mm >= 0.95 * lefm_mm ? "toughness" : onCutOff || critical_mm >= 0.95 * collapse_mm ? "collapse" : "interaction";
  return { critical_mm, by, Lr: Lr(critical_mm), Kr: Kr(critical_mm), LrMax, lefm_mm, collapse_mm };
}
