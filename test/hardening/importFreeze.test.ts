/**
 * The server stays responsive while a large records import is worked: a signed export of one
 * check with many revisions, each holding a long logged history, is posted to
 * /api/v1/checks/import, and meanwhile a bounded probe (one /healthz at a time, every 20 ms)
 * measures how long /healthz waits. Parsing, validating every revision and checking every
 * signature run in a worker thread; only the write transaction runs on the request thread. As in
 * nofreeze.test.ts, a loaded shared machine cannot promise a latency, so by default the test
 * asserts what tells a blocked server from a free one (the 99th percentile under a tenth of the
 * import) and prints the percentiles; HOOPWISE_STRICT_LATENCY=1 asserts the 50 ms goal.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openSqliteStore } from "../../src/store/index.ts";
import { bounded, HANG_LIMIT_MS } from "./answers.ts";
import { FORMAT_EXAMPLE } from "./hostile.ts";
import { jsonOf, send } from "./http.ts";
import { startServer, type ServerChild } from "./server.ts";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

const REVISIONS = 40;
const POINTS = 60_000;
const P99_GOAL_MS = 50;
const STRICT = process.env.HOOPWISE_STRICT_LATENCY === "1";
const IMPORT_LIMIT_MS = 150_000;

function percentile(xs: number[], p: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil((p / 100) * s.length) - 1)];
}

/** An invented receiver's logged history: daily fills with a compressor ripple, different per revision. */
function history(points: number, seed: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < points; i++) {
    const k = i % 300;
    out.push(Math.round((0.6 + 0.2 * Math.sin(k / 40 + seed) + 0.01 * Math.sin(i / 3)) * 1e4) / 1e4);
  }
  return out;
}

let server: ServerChild;
let exportText: string;
let dir: string;
beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), "hoopwise-import-freeze-"));
  // The export is made by other records (a SQLite file of the test's own), unsigned in the server's eyes.
  const source = openSqliteStore({ path: join(dir, "source.db") });
  const { pressure: _p, crack: _c, ...rest } = FORMAT_EXAMPLE as Record<string, unknown>;
  const input = (r: number) => ({
    ...rest,
    title: "Imported long history",
    calcNumber: "IMP-BIG-1",
    pressure: { history_MPa: history(POINTS, r) },
  });
  const { id } = await source.createCheck({ input: input(0) });
  for (let r = 1; r < REVISIONS; r++) await source.addRevision(id, { input: input(r) });
  exportText = JSON.stringify(await source.exportCheck(id));
  await source.close();
  server = await startServer();
}, 180_000);
afterAll(async () => {
  await server?.dispose();
  rmSync(dir, { recursive: true, force: true });
});

describe("nothing blocks the server during an import", () => {
  it(`answers /healthz at once (goal: 99th percentile within ${P99_GOAL_MS} ms) while a ${REVISIONS}-revision import is worked`, {
    timeout: IMPORT_LIMIT_MS + 2 * HANG_LIMIT_MS,
  }, async () => {
    const token = await server.adminToken();
    const auth = { "content-type": "application/json", authorization: `Bearer ${token}` };
    for (let i = 0; i < 5; i++) await send(`${server.base}/healthz`);
    let done = false;
    const started = performance.now();
    const heavy = send(`${server.base}/api/v1/checks/import`, { method: "POST", headers: auth, body: exportText }).finally(
      () => (done = true),
    );
    const health: number[] = [];
    while (!done && performance.now() - started < IMPORT_LIMIT_MS) {
      const t = performance.now();
      const h = await send(`${server.base}/healthz`);
      health.push(performance.now() - t);
      expect(h.status).toBe(200);
      await new Promise((r) => setTimeout(r, 20));
    }
    const answer = await bounded("the import", heavy);
    const import_ms = performance.now() - started;
    expect(answer.status, answer.body.toString("utf8").slice(0, 400)).toBe(201);
    expect(jsonOf(answer)).toMatchObject({ calcNumber: "IMP-BIG-1", revisions: REVISIONS, signed: false });
    const p99 = percentile(health, 99);
    console.log(
      `import-freeze: ${REVISIONS} revisions of ${POINTS} points (${(exportText.length / 1048576).toFixed(1)} MiB) imported in ${import_ms.toFixed(0)} ms; meanwhile ${health.length} /healthz (p50 ${percentile(health, 50).toFixed(1)}, p99 ${p99.toFixed(1)}, max ${Math.max(...health).toFixed(1)} ms)`,
    );
    expect(health.length).toBeGreaterThanOrEqual(20);
    expect(p99).toBeLessThan(STRICT ? P99_GOAL_MS : import_ms / 10);
  });

  it("refuses a large file whose input was edited, naming the revision, as the small-file path does", {
    timeout: IMPORT_LIMIT_MS,
  }, async () => {
    const token = await server.adminToken();
    const doc = JSON.parse(exportText) as { check: { id: string; calcNumber: string }; revisions: { input: { title: string } }[] };
    doc.check.id = "edited-copy";
    doc.check.calcNumber = "IMP-BIG-2";
    doc.revisions[3].input.title = "Edited after export";
    const answer = await send(`${server.base}/api/v1/checks/import`, {
      method: "POST",
      headers: { "content-type": "application/json", authorization: `Bearer ${token}` },
      body: JSON.stringify(doc),
    });
    expect(answer.status).toBe(422);
    expect((jsonOf(answer) as { errors: { path: string }[] }).errors.map((e) => e.path)).toEqual(["revisions.3.fingerprint"]);
  });
});
