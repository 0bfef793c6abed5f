/**
 * The server stays responsive while a very long history is worked: a 5 000 000-point check (the
 * largest the schema takes) goes to the worker pool, and meanwhile a bounded probe — one /healthz
 * and one small check in turn, one request at a time, every 20 ms — measures how long the small
 * requests wait. The goal is a service level: the 99th percentile within 50 ms. A loaded shared
 * machine (several test runs on two cores) cannot promise any latency, so by default the test asserts
 * what tells a blocked server from a free one — the 99th percentile stays under a tenth of the long check,
 * where a blocked event loop would hold it for the whole check — and prints the percentiles; with
 * HOOPWISE_STRICT_LATENCY=1 (a machine of its own, as .ci/run) it asserts the 50 ms goal itself.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { HANG_LIMIT_MS, bounded, expectResult } from "./answers.ts";
import { FORMAT_EXAMPLE } from "./hostile.ts";
import { jsonOf, send } from "./http.ts";
import { startServer, type ServerChild } from "./server.ts";

const POINTS = 5_000_000;
/**
 * The long check takes a few seconds on a quiet machine of two cores and up to a minute when other
 * test files run beside it at low priority; past this it counts as hung.
 */
const LONG_CHECK_LIMIT_MS = 150_000;
const P99_GOAL_MS = 50;
const STRICT = process.env.HOOPWISE_STRICT_LATENCY === "1";
const JSON_TYPE = { "content-type": "application/json" };

/** A cabin-like history: 500-point flights with a cruise ripple, levels to 10 Pa as a logger writes them. */
function longHistoryDoc(points: number): string {
  const parts: string[] = [];
  for (let i = 0; i < points; i++) {
    const k = i % 500;
    const top = 0.055 + 0.004 * Math.sin(Math.floor(i / 500) * 1.7);
    const level = k < 100 ? (top * k) / 100 : k < 400 ? top + 0.0008 * Math.sin(k / 7) : (top * (500 - k)) / 100;
    parts.push((Math.round(level * 1e5) / 1e5).toString());
  }
  const { pressure: _, crack: __, ...rest } = FORMAT_EXAMPLE as Record<string, unknown>;
  const head = JSON.stringify({ ...rest, title: "Long logged history" });
  return `${head.slice(0, -1)},"pressure":{"history_MPa":[${parts.join(",")}]}}`;
}

function percentile(xs: number[], p: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil((p / 100) * s.length) - 1)];
}

let server: ServerChild;
beforeAll(async () => {
  server = await startServer();
}, 90_000);
afterAll(async () => {
  await server?.dispose();
});

describe("nothing blocks the server", () => {
  it(`answers /healthz and a small check at once (goal: 99th percentile within ${P99_GOAL_MS} ms) while a ${POINTS.toLocaleString("en")}-point history is checked`, {
    timeout: LONG_CHECK_LIMIT_MS + 2 * HANG_LIMIT_MS,
  }, async () => {
    const big = longHistoryDoc(POINTS);
    const small = JSON.stringify(FORMAT_EXAMPLE);
    // Warm both paths first, so compiling the code is not what gets measured.
    for (let i = 0; i < 5; i++) await send(`${server.base}/api/v1/check`, { method: "POST", headers: JSON_TYPE, body: small });

    let done = false;
    const started = performance.now();
    const heavy = send(`${server.base}/api/v1/check`, { method: "POST", headers: JSON_TYPE, body: big }).finally(() => (done = true));
    const health: number[] = [];
    const checks: number[] = [];
    while (!done && performance.now() - started < LONG_CHECK_LIMIT_MS) {
      let t = performance.now();
      const h = await send(`${server.base}/healthz`);
      health.push(performance.now() - t);
      expect(h.status).toBe(200);
      t = performance.now();
      const c = await send(`${server.base}/api/v1/check`, { method: "POST", headers: JSON_TYPE, body: small });
      checks.push(performance.now() - t);
      expect(c.status).toBe(200);
      await new Promise((r) => setTimeout(r, 20));
    }
    const answer = await bounded("the long history", heavy);
    const heavy_ms = performance.now() - started;
    expect(answer.status, answer.body.toString("utf8").slice(0, 400)).toBe(200);
    const result = jsonOf(answer) as { spectrum?: { historyPoints?: number } };
    expectResult(result);
    expect(result.spectrum?.historyPoints).toBe(POINTS);

    const p99 = { health: percentile(health, 99), check: percentile(checks, 99) };
    console.log(
      `no-freeze: ${POINTS} points checked in ${heavy_ms.toFixed(0)} ms; meanwhile ${health.length} /healthz (p50 ${percentile(health, 50).toFixed(1)}, p99 ${p99.health.toFixed(1)}, max ${Math.max(...health).toFixed(1)} ms) and ${checks.length} small checks (p50 ${percentile(checks, 50).toFixed(1)}, p99 ${p99.check.toFixed(1)}, max ${Math.max(...checks).toFixed(1)} ms)`,
    );
    // Enough probes to speak of a 99th percentile at all.
    expect(health.length).toBeGreaterThanOrEqual(20);
    const bound = STRICT ? P99_GOAL_MS : heavy_ms / 10;
    expect(p99.health).toBeLessThan(bound);
    expect(p99.check).toBeLessThan(bound);
  });
});
