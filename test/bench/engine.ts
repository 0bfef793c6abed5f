import { readFileSync } from "node:fs";
import { performance } from "node:perf_hooks";
import { DEMOS } from "../../src/demo/index.ts";
import { checkDocument } from "../../src/engine/index.ts";
import { minerDamage } from "../../src/engine/miner.ts";
import { countHistory } from "../../src/engine/rainflowMatrix.ts";
import { basquinLife } from "../../src/engine/sn.ts";
import { solveOpening } from "../../src/engine/openings/index.ts";

/** Median of `runs` timings of `fn`, in milliseconds, after a warm-up. */
export function medianMs(fn: () => void, runs: number, warmup = 5): number {
  for (let i = 0; i < warmup; i++) fn();
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const s = performance.now();
    fn();
    t.push(performance.now() - s);
  }
  t.sort((a, b) => a - b);
  return t[Math.floor(t.length / 2)];
}

const example = JSON.parse(readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8"));

/** One full check (parse, engine, all seven criteria, life-vs-thickness sweep, crack, evidence). */
export function engineBench() {
  const full = medianMs(() => checkDocument(example), 200);
  const demos = Object.fromEntries(DEMOS.map((d) => [d.id, medianMs(() => checkDocument(d.document), 100)]));
  const solveDoc = { ...example, crack: undefined, evidence: undefined, solve: { for: "thickness" } };
  const solved = checkDocument(solveDoc);
  const evaluations = solved.ok ? (solved.result.solution?.evaluations ?? NaN) : NaN;
  return { fullCheck_ms: full, demos_ms: demos, thicknessSolveEvaluations: evaluations };
}

/** Worst case for counting: every point is a fresh random level, so two points in three reverse. */
function randomHistory(points: number): Float64Array {
  const h = new Float64Array(points);
  let seed = 12345;
  const rand = () => (seed = (seed * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff;
  for (let i = 0; i < points; i++) h[i] = Math.round((0.4 + 0.6 * rand()) * 1000) / 1000;
  return h;
}

/**
 * A recorded-looking cabin history: 500-point flights (climb, cruise with a small ripple, descent)
 * sampled finely, as a pressure logger would, so reversals are few beside the points.
 */
function flightHistory(points: number): Float64Array {
  const h = new Float64Array(points);
  for (let i = 0; i < points; i++) {
    const k = i % 500;
    const flight = Math.floor(i / 500);
    const top = 0.055 + 0.004 * Math.sin(flight * 1.7);
    const level = k < 100 ? (top * k) / 100 : k < 400 ? top + 0.0008 * Math.sin(k / 7) : (top * (500 - k)) / 100;
    h[i] = Math.round(level * 1e5) / 1e5;
  }
  return h;
}

/** Peak resident memory of this process so far (Linux /proc), in bytes. */
function highWater_bytes(): number {
  const m = /VmHWM:\s+(\d+) kB/.exec(readFileSync("/proc/self/status", "utf8"));
  return m ? Number(m[1]) * 1024 : NaN;
}

/**
 * Rainflow + Miner on a 10⁶-point history against one pass summing the same typed array.
 * The engine's path: counting into the range–mean matrix, then Miner over its cells. The history is a seeded random sequence with pressure-like levels; peak memory is the growth of
 * heap plus array buffers over the input's own bytes (run with --expose-gc for a clean baseline).
 */
export function rainflowBench(points = 1_000_000, shape: "random" | "flights" = "random") {
  const history = shape === "random" ? randomHistory(points) : flightHistory(points);
  const curve = { coefficient_MPa: 900, exponent: -0.102, factor: 1 };
  const perMPa = 150;
  let checksum = 0;
  const baseline = medianMs(
    () => {
      let s = 0;
      for (let i = 0; i < history.length; i++) s += history[i];
      checksum += s;
    },
    9,
    2,
  );
  // Peak memory: the process's high-water resident set (VmHWM) before and after, so garbage the
  // collector has not yet returned still counts, as it does for the machine.
  (globalThis as { gc?: () => void }).gc?.();
  const before = highWater_bytes();
  const work = medianMs(
    () => {
      const { cycles } = countHistory(history);
      const d = minerDamage(cycles, (range, mean) => {
        const a = (perMPa * range) / 2;
        const m = perMPa * mean;
        return basquinLife(a / (1 - m / 470), curve);
      });
      checksum += d.damagePerPass;
    },
    7,
    3,
  );
  const peak = highWater_bytes() - before;
  return {
    points,
    rainflowMiner_ms: work,
    onePassSum_ms: baseline,
    ratio: work / baseline,
    peakExtraMemory_overInput: peak / history.byteLength,
    checksum,
  };
}

/**
 * The plane-elasticity solution of the cabin demo's window with its fastener row, solved afresh
 * each run (a new corner radius by 1e-9 mm defeats the solution cache), against one full check of
 * the format example, which has no shaped opening.
 */
export function openingBench() {
  const full = medianMs(() => checkDocument(example), 100);
  const c = DEMOS[0].document.cutout as { fasteners?: { hoop_mm: number; axial_mm: number; radius_mm: number }[] };
  let k = 0;
  const solve_ms = medianMs(
    () =>
      solveOpening(
        { kind: "rounded-rectangle", halfWidthAlongHoop_mm: 115, halfLengthAlongAxial_mm: 160, cornerRadius_mm: 55 + 1e-9 * ++k },
        c.fasteners ?? [],
      ),
    15,
    2,
  );
  return { solve_ms, fullCheck_ms: full, ratio: solve_ms / full };
}
