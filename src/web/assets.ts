import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { fileURLToPath } from "node:url";
import { gzipSync } from "node:zlib";
import { Hono } from "hono";

/**
 * The page's static files, served by the project itself (no CDN): htmx from node_modules, and
 * our stylesheet and small script from views/assets/. Each is read once at start-up, hashed and
 * gzipped. Pages link `/assets/<name>?v=<hash>`: a request carrying the current hash may be
 * cached for a year, because a changed file gets a new hash and so a new URL.
 */
interface Asset {
  body: Buffer;
  gzip: Buffer;
  type: string;
  hash: string;
}

const require = createRequire(import.meta.url);
const OWN = (name: string) => fileURLToPath(new URL(`../../views/assets/${name}`, import.meta.url));

const SOURCES = {
  "htmx.min.js": { file: require.resolve("htmx.org/dist/htmx.min.js"), type: "text/javascript; charset=utf-8" },
  "site.css": { file: OWN("site.css"), type: "text/css; charset=utf-8" },
  "page.js": { file: OWN("page.js"), type: "text/javascript; charset=utf-8" },
} as const satisfies Record<string, { file: string; type: string }>;

export type AssetName = keyof typeof SOURCES;

let loaded: Map<string, Asset> | undefined;

function assets(): Map<string, Asset> {
  if (!loaded) {
    loaded = new Map();
    for (const [name, { file, type }] of Object.entries(SOURCES)) {
      const body = readFileSync(file);
      loaded.set(name, {
        body,
        gzip: gzipSync(body, { level: 9 }),
        type,
        hash: createHash("sha256").update(body).digest("hex").slice(0, 12),
      });
    }
  }
  return loaded;
}

/** The URL a page uses for an asset, versioned by its content. */
export function assetUrl(name: AssetName): string {
  const a = assets().get(name);
  return a ? `/assets/${name}?v=${a.hash}` : `/assets/${name}`;
}

export function assetRoutes(): Hono {
  const app = new Hono();
  app.get("/assets/:name", (c) => {
    const a = assets().get(c.req.param("name"));
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
