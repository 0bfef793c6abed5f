import { serve } from "@hono/node-server";
import { closeSharedPool } from "./pdf/browser.ts";
import { closeSharedWorkPool, sharedPool } from "./pool/index.ts";
import { openStore } from "./store/index.ts";
import { seedDemos } from "./web/seed.ts";
import { wholeApp } from "./web/whole.ts";

/**
 * Serve the checker on HOST:PORT (127.0.0.1:8080 unless told otherwise). SIGTERM/SIGINT stop taking
 * connections, let requests in flight finish, then close Chromium and the database.
 */
const host = process.env.HOST ?? "127.0.0.1";
const port = Number(process.env.PORT ?? 8080);
const store = openStore();
const seeded = seedDemos(store);
const app = wholeApp(store);
sharedPool();

const server = serve({ fetch: app.fetch, hostname: host, port }, (info) => {
  if (seeded) console.log(`Saved ${seeded} demo checks in ${process.env.HOOPWISE_DB ?? "data/hoopwise.db"}`);
  console.log(`Hoopwise is serving on http://${host === "0.0.0.0" ? "127.0.0.1" : host}:${info.port}/`);
});

let closing = false;
function shutdown(signal: string) {
  if (closing) return;
  closing = true;
  console.log(`${signal}: finishing requests in flight, then stopping`);
  const force = setTimeout(() => process.exit(1), 15_000);
  force.unref();
  server.close(async () => {
    await closeSharedPool().catch(() => undefined);
    await closeSharedWorkPool().catch(() => undefined);
    store.close();
    process.exit(0);
  });
}
process.on("SIGTERM", () => shutdown("SIGTERM"));
process.on("SIGINT", () => shutdown("SIGINT"));
