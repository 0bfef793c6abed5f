/**
 * @module web/assets
 * GET /assets/:name: the page's static files (views/assetFiles.ts), cached for a year when the
 * request carries the current content hash, revalidated after five minutes otherwise.
 * A matching ETag is answered 304, and a client that takes gzip gets the compressed copy. The files,
 * their types and hashes are read in views/assetFiles.ts; its assetUrl, which writes an address with
 * the hash, is re-exported for the routes. Mounted by the page's routes (page.tsx).
 */
import { Hono } from "hono";
import { findAsset } from "../../views/assetFiles.ts";

export { assetUrl } from "../../views/assetFiles.ts";

export function assetRoutes(): Hono {
  const app = new Hono();
  app.get("/assets/:name", (c) => {
    const a = findAsset(c.req.param("name"));
    if (!a) return c.text("no such asset", 404);
    const etag = `"${a.hash}"`;
    const headers: Record<string, string> = {
      "Content-Type": a.type,
      ETag: etag,
      Vary: "Accept-Encoding",
      "Cache-Control": c.req.query("v") === a.hash ? "public, max-age=31536000, immutable" : "public, max-age=300, must-revalidate",
    };
    if (c.req.header("If-None-Match") === etag) return c.body(null, 304, headers);
    const gz = /\bgzip\b/.test(c.req.header("Accept-Encoding") ?? "");
    if (gz) headers["Content-Encoding"] = "gzip";
    return c.body(new Uint8Array(gz ? a.gzip : a.body), 200, headers);
  });
  return app;
}
