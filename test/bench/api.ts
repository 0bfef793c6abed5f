import { readFileSync } from "node:fs";
import type { AddressInfo } from "node:net";
import { serve } from "@hono/node-server";
import autocannon from "autocannon";
import { createApp } from "../../src/web/app.ts";

const example = readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8");

function load(url: string, opts: Partial<autocannon.Options>): Promise<autocannon.Result> {
  return autocannon({ url, connections: 10, duration: 4, ...opts });
}

/**
 * JSON API full-check throughput against the same server's bare /healthz route, same load
 * generator, loopback only. Goal (issue 7): at least 0.6.
 */
export async function apiBench() {
  const app = createApp();
  const server = serve({ fetch: app.fetch, hostname: "127.0.0.1", port: 0 });
  await new Promise((r) => server.once("listening", r));
  const { port } = server.address() as AddressInfo;
  const base = `http://127.0.0.1:${port}`;
  try {
    const health = await load(`${base}/healthz`, {});
    const check = await load(`${base}/api/v1/check`, { method: "POST", headers: { "content-type": "application/json" }, body: example });
    return {
      healthz_rps: health.requests.average,
      check_rps: check.requests.average,
      ratio: check.requests.average / health.requests.average,
      check_p50_ms: check.latency.p50,
      errors: health.errors + check.errors + health.non2xx + check.non2xx,
    };
  } finally {
    await new Promise((r) => server.close(r));
  }
}
