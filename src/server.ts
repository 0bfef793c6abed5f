import { serve } from "@hono/node-server";
import { createApp } from "./web/app.ts";

/** Serve the checker on HOST:PORT (127.0.0.1:8080 unless told otherwise), with a clean shutdown on SIGTERM/SIGINT. */
const host = process.env.HOST ?? "127.0.0.1";
const port = Number(process.env.PORT ?? 8080);
const app = createApp();

const server = serve({ fetch: app.fetch, hostname: host, port }, (info) => {
  console.log(`Hoopwise is serving on http://${host === "0.0.0.0" ? "127.0.0.1" : host}:${info.port}/`);
});

let closing = false;
function shutdown(signal: string) {
  if (closing) return;
  closing = true;
  console.log(`${signal}: finishing requests in flight, then stopping`);
  server.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 10_000).unref();
}
process.on("SIGTERM", () => shutdown("SIGTERM"));
process.on("SIGINT", () => shutdown("SIGINT"));
