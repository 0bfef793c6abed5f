/**
 * @module server
 * Serve the checker on HOST:PORT (127.0.0.1:8080 unless told otherwise). SIGTERM/SIGINT stop taking
 * connections, let requests in flight finish, then close Chromium and the database.
 * The process's entry (`npm start`): it opens the records (src/store: PostgreSQL when DATABASE_URL
 * is set, else the SQLite file), saves the demo checks into records that hold none
 * (web/records/seed.ts), starts the worker pool (src/pool), removes browser profiles a killed server
 * left behind (src/pdf/chromium.ts), and serves every route (web/whole.ts) for the Host names it
 * serves (web/hosts.ts), known once the port is. It says on the console where the records are,
 * where it listens, that a server reachable from the network needs TLS in front, and how to
 * register the first person while no one is.
 */
import { serve } from "@hono/node-server";
import { closeSharedPool } from "./pdf/browser.ts";
import { closeSharedWorkPool, sharedPool } from "./pool/index.ts";
import { openStore } from "./store/index.ts";
import { seedDemos } from "./web/records/seed.ts";
import { wholeApp } from "./web/whole.ts";
import { removeLeftoverProfiles } from "./pdf/chromium.ts";
import { servedHosts } from "./web/hosts.ts";

function isLoopbackHost(h: string): boolean {
  return h === "localhost" || h === "::1" || /^127\./.test(h);
}

const host = process.env.HOST ?? "127.0.0.1";
const port = Number(process.env.PORT ?? 8080);
const store = await openStore();
const recordsPlace =
  store.backend === "postgres" ? "the PostgreSQL database of DATABASE_URL" : (process.env.HOOPWISE_DB ?? "data/hoopwise.db");
const seeded = await seedDemos(store);
// Filled once the port is known (PORT=0 lets the system choose); read by every request.
const allowedHosts: string[] = [];
const app = wholeApp(store, { allowedHosts });
sharedPool();
const leftovers = await removeLeftoverProfiles();

const server = serve({ fetch: app.fetch, hostname: host, port }, (info) => {
  allowedHosts.push(...servedHosts(host, info.port));
  if (seeded) console.log(`Saved ${seeded} demo checks (unsigned) in ${recordsPlace}`);
  console.log(`Records: ${recordsPlace}`);
  if (leftovers) console.log(`Removed ${leftovers} browser profile${leftovers === 1 ? "" : "s"} left by a server that was killed`);
  if (isLoopbackHost(host)) {
    console.log(`Hoopwise is serving on http://${host.includes(":") ? `[${host}]` : host}:${info.port}/`);
  } else {
    const shown =
      host === "0.0.0.0" || host === "::"
        ? servedHosts(host, info.port).filter((h) => !/^(localhost|127\.|\[::1\])/.test(h))
        : [`${host}:${info.port}`];
    console.log(`Hoopwise is serving on ${shown.map((h) => `http://${h}/`).join(", ")} (HOST=${host}: reachable from the network)`);
    console.log(
      'The records carry passphrases and session cookies: put TLS in front (a reverse proxy such as Caddy or nginx, see the README, "Deployment behind TLS"), and add its public name to HOOPWISE_ALLOWED_HOSTS.',
    );
  }
  void noOneYet(info.port);
});

/** Says how to register the first person while no one is. */
async function noOneYet(port: number) {
  if ((await store.countUsers()) === 0) {
    console.log(
      `No one is registered yet: open http://127.0.0.1:${port}/setup on this machine, or run: npm run -s cli -- user add NAME --role admin`,
    );
  }
}

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
    await store.close().catch(() => undefined);
    process.exit(0);
  });
}
process.on("SIGTERM", () => shutdown("SIGTERM"));
process.on("SIGINT", () => shutdown("SIGINT"));
