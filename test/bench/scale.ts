/**
 * Throughput at scale: the batch command on one worker thread against two, and the JSON API against
 * the engine in-process on one core, each on the same documents in the same run.
 */
import { spawn } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Readable } from "node:stream";
import { fileURLToPath } from "node:url";
import autocannon from "autocannon";
import { runBatch } from "../../src/cli/batch.ts";
import { DEMOS } from "../../src/demo/index.ts";
import { checkDocument } from "../../src/engine/index.ts";
import { createPool } from "../../src/pool/index.ts";
import { medianMs } from "./engine.ts";

const EXAMPLE_TEXT = readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8");
const ROOT = fileURLToPath(new URL("../..", import.meta.url));

/** NDJSON of full checks: the format example and the demos, thicknesses varied so no two lines are alike. */
function ndjson(lines: number): string {
  const docs = [JSON.parse(EXAMPLE_TEXT), ...DEMOS.map((d) => d.document)];
  const out: string[] = [];
  for (let i = 0; i < lines; i++) {
    const d = docs[i % docs.length];
    out.push(JSON.stringify({ ...d, shell: { ...d.shell, thickness_mm: d.shell.thickness_mm * (1 + 0.001 * (i % 50)) } }));
  }
  return `${out.join("\n")}\n`;
}

const sink = { write: () => true };

async function batchSeconds(text: string, threads: number): Promise<number> {
  const pool = createPool({ threads, maxQueue: Number.POSITIVE_INFINITY, yieldToRequests: false });
  try {
    // Warm: every worker compiles the code once before the clock starts.
    await runBatch(Readable.from([ndjson(threads * 64)]), { stdout: sink, stderr: sink }, pool);
    const t = performance.now();
    await runBatch(Readable.from([text]), { stdout: sink, stderr: sink }, pool);
    return (performance.now() - t) / 1000;
  } finally {
    await pool.close();
  }
}

/** Checks per second of the batch on two worker threads over one; goal ≥ 1.7 on two cores. */
export async function batchBench(lines = 3000) {
  const text = ndjson(lines);
  const one = await batchSeconds(text, 1);
  const two = await batchSeconds(text, 2);
  return { lines, oneWorker_per_s: lines / one, twoWorkers_per_s: lines / two, ratio: one / two };
}

/** CPU seconds (user + system) a process has used so far, from /proc (Linux); clock ticks of 1/100 s. */
export function cpuSecondsOf(pid: number): number {
  const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
  const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
  return (Number(fields[11]) + Number(fields[12])) / 100;
}

/**
 * Full checks per second through POST /api/v1/check — the server in a process of its own, as
 * deployed, the load generator in this one — against the engine in this process on one core
 * (checkDocument on the already parsed document, the result not serialized): goal ≥ 0.8.
 */
export async function apiVsEngineBench(requests = 1500) {
  const doc = JSON.parse(EXAMPLE_TEXT);
  const engine_ms = medianMs(() => checkDocument(doc), 300, 30);
  const dir = mkdtempSync(join(tmpdir(), "hoopwise-bench-"));
  const child = spawn(process.execPath, ["--import", "tsx", "src/server.ts"], {
    cwd: ROOT,
    env: { ...process.env, PORT: "0", HOOPWISE_DB: join(dir, "records.db") },
    stdio: ["ignore", "pipe", "pipe"],
  });
  try {
    const base = await new Promise<string>((resolve, reject) => {
      let out = "";
      child.stdout.setEncoding("utf8").on("data", (s: string) => {
        out += s;
        const m = /serving on (http:\/\/[^\s/]+)\//.exec(out);
        if (m) resolve(m[1]);
      });
      child.once("exit", (code) => reject(new Error(`the server exited (${code}) before serving: ${out}`)));
    });
    const opts = {
      url: `${base}/api/v1/check`,
      method: "POST" as const,
      headers: { "content-type": "application/json" },
      body: EXAMPLE_TEXT,
    };
    await autocannon({ ...opts, connections: 4, amount: 300 }); // warm the server's code
    const cpu0 = cpuSecondsOf(child.pid!);
    const r = await autocannon({ ...opts, connections: 4, amount: requests });
    const serverCpu_s = cpuSecondsOf(child.pid!) - cpu0;
    // The engine's CPU time per check, in this process, over a fixed number of checks.
    const n = 400;
    const c0 = process.cpuUsage();
    for (let i = 0; i < n; i++) checkDocument(doc);
    const c1 = process.cpuUsage(c0);
    const engineCpu_s = (c1.user + c1.system) / 1e6 / n;
    const engine_per_s = 1000 / engine_ms;
    return {
      api_per_s: r.requests.average,
      engine_per_s,
      ratio: r.requests.average / engine_per_s,
      /** Checks per CPU-second of the server process against the engine's: what one core gives, whatever else the machine runs. */
      cpuRatio: (r.requests.total / serverCpu_s) * engineCpu_s,
      api_p50_ms: r.latency.p50,
      errors: r.errors + r.non2xx,
    };
  } finally {
    child.kill("SIGTERM");
    await new Promise((r) => child.once("exit", r));
    rmSync(dir, { recursive: true, force: true });
  }
}
