import type { Child } from "hono/jsx";
import type { JSX } from "hono/jsx/jsx-runtime";
import { assetUrl } from "../assetFiles.ts";
import { CautionStrip } from "../cautions.tsx";
import type { Actor } from "../../src/store/index.ts";
import { PEOPLE_PATH, SIGNIN_PATH, SIGNOUT_PATH } from "./paths.ts";

/** A message at the top of a page: the outcome of what was just done, or why it was not. */
export interface Notice {
  tone: "done" | "refused";
  text: Child;
}

/**
 * The frame of every records page: the same head and header as the checker, links between the
 * records and the checker, and the short caution under the header, so no saved or signed check
 * is ever shown without it.
 */
export function RecordsLayout({ title, notice, user, children }: { title: string; notice?: Notice; user?: Actor; children: Child }) {
  return (
    <html lang="en">
      <head>
        <meta charset="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <title>{`${title} — Hoopwise records`}</title>
        <link rel="icon" href="data:," />
        <link rel="stylesheet" href={assetUrl("site.css")} />
      </head>
      <body>
        <a class="skip" href="#records-main">
          Skip to the content
        </a>
        <header class="top">
          <p class="brand">
            <span class="name">Hoopwise</span>
            <span class="tagline">Saved checks, revisions and sign-off</span>
          </p>
          <nav class="nav" aria-label="Hoopwise">
            <a href="/">Checker</a>
            <a href="/records">Saved checks</a>
            <a href={PEOPLE_PATH}>People</a>
            {user ? (
              <form method="post" action={SIGNOUT_PATH} class="signout">
                <span class="who" id="signed-in-as">
                  {user.name} ({user.role})
                </span>{" "}
                <button type="submit">Sign out</button>
              </form>
            ) : (
              <a href={SIGNIN_PATH}>Sign in</a>
            )}
          </nav>
        </header>
        <div class="records-caution">
          <CautionStrip />
        </div>
        {notice ? (
          <p class={`notice ${notice.tone}`} role={notice.tone === "refused" ? "alert" : "status"}>
            {notice.text}
          </p>
        ) : null}
        <main id="records-main" class="records">
          {children}
        </main>
      </body>
    </html>
  );
}

/** The answer for a whole records page: the doctype, then the page. */
export async function pageHtml(page: JSX.Element): Promise<string> {
  return `<!doctype html>${await page.toString()}`;
}
