import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { fileURLToPath } from "node:url";
import { gzipSync } from "node:zlib";

/**
 * The page's static files, served by the project itself (routes in src/web/assets.ts) (no CDN): htmx from node_modules, and
 * our stylesheet and small script from views/assets/. Each is read once at start-up, hashed and
 * gzipped. Pages link `/assets/<name>?v=<hash>`: a request carrying the current hash may be
 * cached for a year, because a changed file gets a new hash and so a new URL.
 */
export interface Asset {
  body: Buffer;
  gzip: Buffer;
  type: string;
  hash: string;
}

const require = createRequire(import.meta.url);
const OWN = (name: string) => fileURLToPath(new URL(`./assets/${name}`, import.meta.url));

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

/** One asset as served: its bytes, gzipped bytes, type and content hash; undefined for a name not shipped. */
export function findAsset(name: string): Asset | undefined {
  return assets().get(name);
}

/** The URL a page uses for an asset, versioned by its content. */
export function assetUrl(name: AssetName): string {
  const a = assets().get(name);
  return a ? `/assets/${name}?v=${a.hash}` : `/assets/${name}`;
}
