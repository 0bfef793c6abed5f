/**
 * Tick positions and labels. Linear axes use d3's nice steps; log axes get decades,
 * or 1-2-5 / 1-2-3-5 mantissas when the axis spans too few decades for decades alone
 * to be read (a stress axis from 100 to 400 MPa has no decade inside it).
 */
import { scaleLinear } from "d3-scale";
import { formatTick, formatValue, isFiniteNumber, powerOfTen } from "./format.ts";

export interface Tick {
  value: number;
  label: string;
}

export interface TickSet {
  major: Tick[];
  /** Unlabelled grid positions (log axes: the 2…9 multiples). */
  minor: number[];
}

export type LogLabelStyle = "power" | "plain" | "auto";

export function linearTicks(domain: [number, number], count: number): TickSet {
  const scale = scaleLinear().domain(domain);
  const values = scale.ticks(Math.max(2, count));
  const step = values.length > 1 ? values[1] - values[0] : Math.abs(domain[1] - domain[0]);
  return { major: values.map((value) => ({ value, label: formatTick(value, step) })), minor: [] };
}

const MANTISSA_SETS = [[1, 1.5, 2, 3, 4, 5, 6, 7, 8, 9], [1, 2, 3, 4, 5, 6, 8], [1, 2, 3, 5], [1, 2, 5], [1, 3], [1]];

export function logTicks(domain: [number, number], maxCount: number, style: LogLabelStyle = "auto"): TickSet {
  const [lo, hi] = domain;
  const k0 = Math.floor(Math.log10(lo) + 1e-9);
  const k1 = Math.ceil(Math.log10(hi) - 1e-9);
  const inDomain = (v: number) => v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9);
  const candidates = (mantissas: number[], decadeStep: number) => {
    const out: number[] = [];
    for (let k = k0; k <= k1; k++) {
      if (mantissas.length === 1 && (k - k0) % decadeStep !== 0) continue;
      for (const m of mantissas) {
        const v = Number((m * 10 ** k).toPrecision(12));
        if (inDomain(v)) out.push(v);
      }
    }
    return out;
  };
  let values: number[] = [];
  for (const set of MANTISSA_SETS) {
    values = candidates(set, 1);
    if (values.length <= maxCount) break;
  }
  for (let step = 2; values.length > maxCount; step++) values = candidates([1], step);
  // An axis that holds no chosen tick (very narrow) still needs two labels to be read.
  if (values.length < 2) values = [lo, hi];

  const usePower = style === "power" || (style === "auto" && (k1 > 5 || k0 < -2));
  const major = values.map((value) => ({ value, label: usePower ? powerOfTen(value) : formatValue(value, 3) }));
  const minor: number[] = [];
  if (k1 - k0 <= 8) {
    for (let k = k0; k <= k1; k++)
      for (let m = 1; m <= 9; m++) {
        const v = Number((m * 10 ** k).toPrecision(12));
        if (inDomain(v) && !values.includes(v)) minor.push(v);
      }
  }
  return { major, minor };
}

/** Whole decades around the values: a log axis for cycles reads best from 10ⁿ to 10ᵐ. */
export function decadeDomain(values: number[], fallback: [number, number]): [number, number] {
  const v = values.filter((x) => isFiniteNumber(x) && x > 0);
  if (v.length === 0) return fallback;
  const lo = 10 ** Math.floor(Math.log10(Math.min(...v)) + 1e-9);
  let hi = 10 ** Math.ceil(Math.log10(Math.max(...v)) - 1e-9);
  if (hi <= lo) hi = lo * 10;
  return [lo, hi];
}

/** 1-1.5-2-3-5-7 bounds around the values: tighter than decades, for stress axes. */
export function logNiceDomain(values: number[], fallback: [number, number]): [number, number] {
  const v = values.filter((x) => isFiniteNumber(x) && x > 0);
  if (v.length === 0) return fallback;
  const steps = [1, 1.5, 2, 3, 5, 7, 10];
  const down = (x: number) => {
    const k = Math.floor(Math.log10(x) + 1e-9);
    const m = x / 10 ** k;
    return Number(([...steps].reverse().find((s) => s <= m * (1 + 1e-9))! * 10 ** k).toPrecision(12));
  };
  const up = (x: number) => {
    const k = Math.floor(Math.log10(x) + 1e-9);
    const m = x / 10 ** k;
    return Number((steps.find((s) => s >= m * (1 - 1e-9))! * 10 ** k).toPrecision(12));
  };
  const lo = down(Math.min(...v));
  let hi = up(Math.max(...v));
  if (hi <= lo) hi = up(lo * 1.5);
  return [lo, hi];
}
