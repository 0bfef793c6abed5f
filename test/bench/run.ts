import os from "node:os";
import { apiBench } from "./api.ts";
import { engineBench, openingBench, rainflowBench } from "./engine.ts";
import { historyBench } from "./history.ts";
import { previewBench } from "./preview.ts";
import { apiVsEngineBench, batchBench } from "./scale.ts";

/**
 * `npm run bench`: every figure as a ratio against a baseline measured in the same run on the
 * same machine, since absolute times drift. Prints a Markdown table for the README.
 */
const rows: [string, string, string][] = [];
const add = (what: string, value: string, goal: string) => rows.push([what, value, goal]);
const f = (x: number, d = 2) => x.toFixed(d);

const e = engineBench();
add("One full check (format example: 7 criteria, sweep, crack, evidence)", `${f(e.fullCheck_ms, 3)} ms median`, "—");
for (const [id, ms] of Object.entries(e.demos_ms)) add(`One full check, ${id} demo`, `${f(ms, 3)} ms median`, "—");
add("Thickness solve: engine evaluations per solve (rel. tol. 1e-4)", String(e.thicknessSolveEvaluations), "≤ 60");
const o = openingBench();
add(
  "Opening solution, cabin demo window with its fastener row / one full check without it",
  `${f(o.ratio, 1)} (${f(o.solve_ms, 1)} ms / ${f(o.fullCheck_ms, 3)} ms)`,
  "solve well under 50 ms",
);

// Flights first: the resident high-water mark only rises, so the smaller case must be measured before the larger.
for (const shape of ["flights", "random"] as const) {
  const r = rainflowBench(1_000_000, shape);
  add(
    `Rainflow + Miner on ${r.points.toLocaleString("en")} ${shape === "random" ? "random points (worst case)" : "points of logged flights"} / one summing pass`,
    `${f(r.ratio, 1)} (${f(r.rainflowMiner_ms, 0)} ms / ${f(r.onePassSum_ms, 1)} ms)`,
    "≤ 8",
  );
  add(`Rainflow + Miner peak extra resident memory / input bytes (${shape})`, f(r.peakExtraMemory_overInput, 2), "≤ 3");
}

const h = historyBench();
add(
  `Whole check of a ${h.points.toLocaleString("en")}-point history from JSON text / compiled C rainflow + Miner from text (each less a 50-point run)`,
  h.ratio === null
    ? `not compared (${h.peerNote}); ${f(h.hoopwise_ms, 0)} ms`
    : `${f(h.ratio, 2)} (${f(h.hoopwise_ms, 0)} ms / ${f(h.peer_ms ?? NaN, 0)} ms)`,
  "≤ 3",
);
add(
  "Whole check of that history: peak extra resident memory / input text bytes (worker's young generation)",
  f(h.memoryOverInput, 2),
  "≤ 3",
);

const pv = previewBench();
add(
  `Preview plot of a ${pv.points.toLocaleString("en")}-point history (min/max per pixel column) / one summing pass over the points`,
  `${f(pv.ratio, 2)} (${f(pv.draw_ms, 0)} ms / ${f(pv.sum_ms, 0)} ms)`,
  "a moment: well under 1 s",
);

const b = await batchBench();
add(
  `Batch (${b.lines} full checks, NDJSON): 2 worker threads / 1 worker thread`,
  `${f(b.ratio, 2)} (${f(b.twoWorkers_per_s, 0)} / ${f(b.oneWorker_per_s, 0)} checks/s)`,
  "≥ 1.7 on 2 cores",
);
const ae = await apiVsEngineBench();
add(
  "JSON API full checks/s (server in its own process, autocannon, 4 connections) / engine in-process on one core",
  `${f(ae.ratio, 2)} (${f(ae.api_per_s, 0)} / ${f(ae.engine_per_s, 0)} checks/s)`,
  "≥ 0.8",
);

const a = await apiBench();
add(
  "JSON API full check / bare /healthz throughput (autocannon, 10 connections)",
  `${f(a.ratio, 3)} (${f(a.check_rps, 0)} / ${f(a.healthz_rps, 0)} req/s)`,
  "≥ 0.6",
);

for (const extra of ["./page.ts", "./sheet.ts"]) {
  try {
    const mod = (await import(extra)) as Record<string, () => Promise<Record<string, unknown>>>;
    for (const [name, fn] of Object.entries(mod)) {
      if (typeof fn !== "function" || !name.endsWith("Bench")) continue;
      const out = await fn();
      for (const [k, v] of Object.entries(out)) add(`${name}: ${k}`, typeof v === "number" ? f(v, 2) : String(v), "—");
    }
  } catch (err) {
    add(`${extra}`, `not run: ${(err as Error).message.split("\n")[0]}`, "—");
  }
}

console.log(
  `Benchmarks, ${new Date().toISOString().slice(0, 10)}, ${os.cpus().length} × ${os.cpus()[0]?.model ?? "cpu"}, Node ${process.version}\n`,
);
console.log("| Measure | Result | Goal |\n|---|---|---|");
for (const [w, v, g] of rows) console.log(`| ${w} | ${v} | ${g} |`);
process.exit(0);
