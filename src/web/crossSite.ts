import type { MiddlewareHandler } from "hono";
import { errorsDoc } from "./api.ts";

/**
 * Refuse state-changing requests that a browser marks as coming from another site: a page
 * elsewhere must not save revisions, add people or sign through the user's browser. Browsers
 * send Sec-Fetch-Site and Origin on such posts (Fetch Metadata; the Origin header, RFC 6454);
 * scripts, the CLI and tests that send neither are not browsers acting for someone else and pass.
 */
export function refuseCrossSite(): MiddlewareHandler {
  return async (c, next) => {
    if (c.req.method === "GET" || c.req.method === "HEAD" || c.req.method === "OPTIONS") return next();
    const site = c.req.header("sec-fetch-site");
    const origin = c.req.header("origin");
    const foreignOrigin = origin !== undefined && origin !== new URL(c.req.url).origin;
    if (site === "cross-site" || (site !== "same-origin" && foreignOrigin)) {
      return c.json(errorsDoc("(request)", "this request came from another site; open Hoopwise itself and send it from there"), 403);
    }
    return next();
  };
}
