import { Hono } from "hono";
import { secureHeaders } from "hono/secure-headers";
import type { WorkPool } from "../pool/index.ts";
import { checkApi, errorsDoc } from "./api.ts";
import { refuseCrossSite } from "./crossSite.ts";

export interface AppOptions {
  /** Extra sub-apps mounted at the root (sheet, records, page). */
  mounts?: Hono[];
  /** Worker threads for large check bodies; the process's shared pool unless given. */
  pool?: WorkPool;
}

/**
 * The Hono app: JSON API, health check and (mounted) the page, sheet and records routes.
 * Security headers on every answer: the Content-Security-Policy allows only the project's own
 * scripts, styles and images; frames are refused.
 */
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
  app.use("*", refuseCrossSite());
  app.get("/healthz", (c) => c.json({ status: "ok" }));
  app.route("/", checkApi({ pool: opts.pool }));
  for (const m of opts.mounts ?? []) app.route("/", m);
  app.notFound((c) => c.json(errorsDoc("(url)", `no such page: ${c.req.method} ${c.req.path}`), 404));
  app.onError((err, c) => {
    console.error(err);
    return c.json(errorsDoc("(server)", "the server met an unexpected problem; nothing saved was lost — please report it"), 500);
  });
  return app;
}
