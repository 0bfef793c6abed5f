/**
 * Long histories: the whole check of a 10⁶-point pressure history from its JSON text (parse, depth
 * guard, validation, rainflow, damage for the check, all seven criteria and the thickness sweep,
 * crack growth and evidence, fingerprint, the result's text) against a plain compiled C rainflow
 * count with Miner's sum over the same points read from text. The C peer is written to a temporary
 * folder and compiled with `cc -O2` when a compiler is present; it is a yardstick of the bench, not
 * part of Hoopwise. Start-up is taken out on both sides by subtracting the same run on a 50-point
 * history. Peak memory is measured in a child process of its own, with the young generation a pool
 * worker has, as the growth of the high-water resident set over the input text's bytes.
 */
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { YOUNG_GENERATION_MB } from "../../src/pool/index.ts";
import { checkText } from "../../src/pool/work.ts";
import { medianMs } from "./engine.ts";

const EXAMPLE = JSON.parse(readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8"));

/** Seeded pressure-like levels (MPa, to 10 Pa): every point a fresh level, so about two in three reverse. */
export function randomLevels(points: number, seed = 12345): number[] {
  const h = new Array<number>(points);
  let s = seed;
  const rand = () => (s = (s * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff;
  for (let i = 0; i < points; i++) h[i] = Math.round((0.01 + 0.05 * rand()) * 1e5) / 1e5;
  return h;
}

export function historyDocText(levels: number[]): string {
  return JSON.stringify({ ...EXAMPLE, title: "Long history", pressure: { history_MPa: levels } });
}

/**
 * The C peer: strtod over the text (one point per line), ASTM E1049 §5.4.4 counting on a stack of
 * reversals, and Miner's sum with Basquin's curve and Goodman's mean-stress correction per cycle.
 */
const PEER_C = String.raw`
#include <stdio.h>
#include <stdlib.h>
#include <math.h>
static double *st; static long top = 0, bottom = 0;
static double D = 0, cycles = 0;
static const double K = 2800.0, SU = 470.0, SF = 900.0, B = -0.102;
static void cycle(double range, double mean, double n) {
  double a = K * range / 2, m = K * mean;
  double ar = m > 0 ? a / (1 - m / SU) : a;
  if (ar > 0) D += n / (0.5 * pow(ar / SF, 1 / B));
  cycles += n;
}
static void accept(double x) {
  st[top++] = x;
  while (top - bottom >= 3) {
    double X = fabs(st[top-1] - st[top-2]), Y = fabs(st[top-2] - st[top-3]);
    if (X < Y) return;
    if (top - bottom == 3) { cycle(Y, 0.5 * (st[top-2] + st[top-3]), 0.5); bottom++; }
    else { cycle(Y, 0.5 * (st[top-2] + st[top-3]), 1); st[top-3] = st[top-1]; top -= 2; }
  }
}
int main(int argc, char **argv) {
  FILE *f = fopen(argv[1], "rb"); if (!f) return 1;
  fseek(f, 0, SEEK_END); long size = ftell(f); fseek(f, 0, SEEK_SET);
  char *text = malloc(size + 1); if (fread(text, 1, size, f) != (size_t)size) return 1; text[size] = 0; fclose(f);
  long cap = size / 2 + 2; double *h = malloc(cap * sizeof(double)); long n = 0;
  char *p = text, *end;
  for (;;) { double v = strtod(p, &end); if (end == p) break; h[n++] = v; p = end; }
  st = malloc((n + 1) * sizeof(double));
  double cand = h[0]; int dir = 0; accept(h[0]);
  for (long i = 1; i < n; i++) {
    double v = h[i]; if (v == cand) continue;
    int d = v > cand ? 1 : -1;
    if (dir != 0 && d != dir) accept(cand);
    dir = d; cand = v;
  }
  if (dir != 0) accept(cand);
  for (long i = bottom; i + 1 < top; i++) cycle(fabs(st[i+1] - st[i]), 0.5 * (st[i] + st[i+1]), 0.5);
  printf("%ld points, %.1f cycles, D = %.6e\n", n, cycles, D);
  return 0;
}
`;

/** Wall and CPU time (user + system, from the shell's `times`) of one run of a program, in ms. */
function runMs(cmd: string, args: string[]): { wall: number; cpu: number } {
  const t = performance.now();
  const script = `"$0" "$@" > /dev/null || exit 1; times`;
  const r = spawnSync("bash", ["-c", script, cmd, ...args], { encoding: "utf8" });
  const wall = performance.now() - t;
  if (r.status !== 0) throw new Error(`${cmd} failed: ${r.stderr}`);
  // `times` prints the shell's own line, then its children's: "0m0.123s 0m0.004s".
  const child = r.stdout.trim().split("\n").at(-1) ?? "";
  const secs = [...child.matchAll(/(\d+)m([\d.]+)s/g)].map((m) => Number(m[1]) * 60 + Number(m[2]));
  return { wall, cpu: 1000 * secs.reduce((a, b) => a + b, 0) };
}

/** CPU time of one call in this process (user + system), in ms: the median of `runs`. */
function cpuMs(fn: () => void, runs: number, warmup: number): number {
  for (let i = 0; i < warmup; i++) fn();
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const c = process.cpuUsage();
    fn();
    const d = process.cpuUsage(c);
    t.push((d.user + d.system) / 1000);
  }
  return median(t);
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** Peak extra resident memory of one whole check in a fresh process, over the input text's bytes. */
function memoryOverInput(file: string): number {
  const script = fileURLToPath(new URL("./historyMemory.ts", import.meta.url));
  // The same young generation as a pool worker has (src/pool): the check runs in one in the product.
  const semi = String(YOUNG_GENERATION_MB / 3);
  const out = execFileSync(process.execPath, [`--max-semi-space-size=${semi}`, "--import", "tsx", script, file], { encoding: "utf8" });
  return (JSON.parse(out) as { overInput: number }).overInput;
}

export function historyBench(points = 1_000_000, runs = 5) {
  const big = randomLevels(points);
  const small = randomLevels(50);
  const bigText = historyDocText(big);
  const smallText = historyDocText(small);
  const check = (t: string) => {
    const a = checkText(t);
    if (a.status !== 200) throw new Error(`the long-history check answered ${a.status}: ${a.body.slice(0, 300)}`);
  };
  const hoopwise_ms = medianMs(() => check(bigText), runs, 1) - medianMs(() => check(smallText), 20, 5);
  const hoopwiseCpu_ms = cpuMs(() => check(bigText), runs, 0) - cpuMs(() => check(smallText), 20, 5);

  const dir = mkdtempSync(join(tmpdir(), "hoopwise-bench-"));
  try {
    const docFile = join(dir, "history.json");
    writeFileSync(docFile, bigText);
    const memory = memoryOverInput(docFile);
    let peer_ms: number | null = null;
    let peerCpu_ms: number | null = null;
    let peerNote = "skipped: no C compiler (cc) on this machine";
    const cc = spawnSync("cc", ["--version"], { stdio: "ignore" });
    if (cc.status === 0) {
      writeFileSync(join(dir, "peer.c"), PEER_C);
      const exe = join(dir, "peer");
      execFileSync("cc", ["-O2", "-o", exe, join(dir, "peer.c"), "-lm"]);
      writeFileSync(join(dir, "big.txt"), big.join("\n"));
      writeFileSync(join(dir, "small.txt"), small.join("\n"));
      const bigRuns: { wall: number; cpu: number }[] = [];
      const smallRuns: { wall: number; cpu: number }[] = [];
      for (let i = 0; i < runs + 2; i++) {
        bigRuns.push(runMs(exe, [join(dir, "big.txt")]));
        smallRuns.push(runMs(exe, [join(dir, "small.txt")]));
      }
      peer_ms = median(bigRuns.map((r) => r.wall)) - median(smallRuns.map((r) => r.wall));
      peerCpu_ms = median(bigRuns.map((r) => r.cpu)) - median(smallRuns.map((r) => r.cpu));
      peerNote = execFileSync(exe, [join(dir, "big.txt")], { encoding: "utf8" }).trim();
    }
    return {
      points,
      hoopwise_ms,
      peer_ms,
      ratio: peer_ms === null ? null : hoopwise_ms / peer_ms,
      hoopwiseCpu_ms,
      peerCpu_ms,
      cpuRatio: peerCpu_ms === null || peerCpu_ms <= 0 ? null : hoopwiseCpu_ms / peerCpu_ms,
      peerNote,
      memoryOverInput: memory,
    };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
