import type { Child } from "hono/jsx";
import { DEMOS } from "../src/demo/index.ts";
import { assetUrl } from "./assetFiles.ts";
import { Cautions } from "./cautions.tsx";

/** htmx settings: no injected inline style (the CSP forbids it; site.css styles the indicator) and no evaluated script. */
const HTMX_CONFIG = JSON.stringify({ includeIndicatorStyles: false, allowEval: false, allowScriptTags: false, historyCacheSize: 0 });

/** The page around the workspace: head, tools to open a check, the cautions. */
export function Page({ title, notice, children }: { title?: string; notice?: string; children: Child }) {
  return (
    <html lang="en">
      <head>
        <meta charset="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <title>{title ? `${title} — Hoopwise` : "Hoopwise — pressure-cycle check of a shell skin"}</title>
        <meta name="htmx-config" content={HTMX_CONFIG} />
        {/* No icon file: an empty one keeps the browser from asking for /favicon.ico. */}
        <link rel="icon" href="data:," />
        <link rel="stylesheet" href={assetUrl("site.css")} />
        <script src={assetUrl("htmx.min.js")} defer></script>
        <script src={assetUrl("page.js")} defer></script>
      </head>
      <body>
        <a class="skip" href="#check-form">
          Skip to the check
        </a>
        <header class="top">
          <p class="brand">
            <span class="name">Hoopwise</span>
            <span class="tagline">Pressure-cycle fatigue check of a shell skin</span>
          </p>
          <nav class="nav" aria-label="Hoopwise">
            <a href="/records">Saved checks</a>
          </nav>
          <div class="tools">
            <form method="get" action="/" class="tool">
              <label for="demo-pick">Start from an example</label>
              <select id="demo-pick" name="demo">
                {DEMOS.map((d) => (
                  <option value={d.id}>{d.label}</option>
                ))}
              </select>
              <button type="submit" class="secondary">
                Open example
              </button>
            </form>
            <form method="post" action="/import" enctype="multipart/form-data" class="tool">
              <label for="import-file">Open a saved check (JSON)</label>
              <input type="file" id="import-file" name="file" accept=".json,application/json" required />
              <button type="submit" class="secondary">
                Open file
              </button>
            </form>
          </div>
        </header>
        <Cautions />
        <a class="jump" href="#h-outcome">
          Go to the result ↓
        </a>
        {notice ? (
          <p class="notice" role="alert">
            {notice}
          </p>
        ) : null}
        {children}
        <footer class="foot">
          <p>
            Hoopwise works every check in SI and shows each line with its published source. Nothing you type is stored on the server until
            you save it to the records; the link under the result carries the inputs.
          </p>
        </footer>
      </body>
    </html>
  );
}
