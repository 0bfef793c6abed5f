/**
 * @module web/app
 * The Hono app: JSON API, health check and (mounted) the page, sheet and records routes.
 * Security headers on every answer: the Content-Security-Policy allows only the project's own
 * scripts, styles and images; frames are refused.
 * A request for a Host not served (hosts.ts) or a browser's state-changing request from another site
 * (crossSite.ts) is refused before any route sees it. GET /healthz says whether the records can be
 * written now (503 when not). An unknown address is a 404 errors document, a storage fault a 503,
 * and anything unexpected is logged and answered 500 in words that say nothing saved was lost.
 * Handed the sub-apps, the worker pool, the store and the served hosts (AppOptions); web/whole.ts
 * puts it together for the server and for tests.
 */
import { Hono } from "hono";
import { secureHeaders } from "hono/secure-headers";
import type { WorkPool } from "../pool/index.ts";
import { checkApi, errorsDoc } from "./api.ts";
import { isStorageFault, storageFaultWords, type Store } from "../store/index.ts";
import { refuseCrossSite } from "./crossSite.ts";
import { refuseForeignHost } from "./hosts.ts";

export interface AppOptions {
  /** Extra sub-apps mounted at the root (sheet, records, page). */
  // biome-ignore lint/suspicious/noExplicitAny: sub-apps carry their own variables (the signed-in user).
  mounts?: Hono<any, any, any>[];
  /** Worker threads for large check bodies; the process's shared pool unless given. */
  pool?: WorkPool;
  /** The records, whose writability /healthz reports. */
  store?: Pick<Store, "probeWrite">;
  /** Host header values served (hosts.ts); the loopback names on any port by default. */
  allowedHosts?: readonly string[];
}

export function createApp(opts: AppOptions = {}): Hono {
  const app = new Hono();
  app.use(
    "*",
    secureHeaders({
      contentSecurityPolicy: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: ["'self'"],
        imgSrc: ["'self'", "data:"],
        connectSrc: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
        baseUri: ["'none'"],
        objectSrc: ["'none'"],
      },
      referrerPolicy: "no-referrer",
      xContentTypeOptions: "nosniff",
      xFrameOptions: "DENY",
    }),
  );
  app.use("*", refuseForeignHost(opts.allowedHosts));
  app.use("*", refuseCrossSite());
  app.get("/healthz", async (c) => {
    c.header("Cache-Control", "no-store");
    if (!opts.store) return c.json({ status: "ok" });
    try {
      await opts.store.probeWrite();
      return c.json({ status: "ok", records: "writable" });
    } catch (err) {
      if (!isStorageFault(err)) console.error(err);
      return c.json({ status: "unavailable", errors: [{ path: "(records)", message: storageFaultWords(err) }] }, 503);
    }
  });
  app.route("/", checkApi({ pool: opts.pool }));
  for (const m of opts.mounts ?? []) app.route("/", m);
  app.notFound((c) => c.json(errorsDoc("(url)", `no such page: ${c.req.method} ${c.req.path}`), 404));
  app.onError((err, c) => {
    if (isStorageFault(err)) return c.json(errorsDoc("(server)", storageFaultWords(err)), 503);
    console.error(err);
    return c.json(errorsDoc("(server)", "the server met an unexpected problem; nothing saved was lost — please report it"), 500);
  });
  return app;
}
