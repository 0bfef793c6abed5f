import type { CDPSession, HTTPRequest, Page } from "puppeteer-core";

/**
 * What became of one request the page tried to make while it was rendered.
 * - refused:   the request interceptor answered it without fetching anything.
 * - blocked:   Chromium stopped it before interception (a file: URL from the sheet's
 *              about:blank document, a name that does not resolve).
 * - inline:    a data: URL, read from the document itself; nothing is fetched.
 * - loaded:    fetched from outside the document. Never expected: a test that finds one has
 *              found a hole.
 * - unsettled: still open when the render ended.
 */
export interface RequestRecord {
  url: string;
  /** Chromium's resource type: Document, Stylesheet, Image, Font, Media, Other... */
  type: string;
  outcome: "refused" | "blocked" | "inline" | "loaded" | "unsettled";
  /** Chromium's error text for refused and blocked requests, else "". */
  detail: string;
}

interface Seen {
  url: string;
  type: string;
  state: "open" | "finished" | "failed";
  detail: string;
}

/**
 * Refuses every request of the page and records what Chromium reports about each one.
 *
 * The record comes from the DevTools Network domain on a session of its own, not from puppeteer's
 * request events: those only report requests that pass through interception, and a file: load
 * that Chromium handles (or that succeeded) would never show there.
 *
 * Navigations (a meta refresh, an iframe, an object) are answered "204 No Content", which
 * leaves the frame as it is; an aborted navigation would instead replace it with Chromium's
 * error page, and a meta refresh would print that page instead of the sheet.
 */
export async function guardRequests(page: Page): Promise<{ stop(): Promise<RequestRecord[]> }> {
  const seen = new Map<string, Seen>();
  // By URL: puppeteer does not expose the DevTools request id. Every request that reaches the
  // interceptor is refused, so a URL refused once is refused every time.
  const refused = new Set<string>();

  const session: CDPSession = await page.createCDPSession();
  session.on("Network.requestWillBeSent", (e) => {
    seen.set(e.requestId, { url: e.request.url, type: e.type ?? "Other", state: "open", detail: "" });
  });
  session.on("Network.loadingFinished", (e) => settle(e.requestId, "finished", ""));
  session.on("Network.loadingFailed", (e) => settle(e.requestId, "failed", e.errorText));
  await session.send("Network.enable");

  function settle(id: string, state: Seen["state"], detail: string): void {
    const entry = seen.get(id);
    if (entry) Object.assign(entry, { state, detail });
  }

  const refuse = (request: HTTPRequest): void => {
    // data: URLs cannot be intercepted (puppeteer leaves them alone); they are inline content.
    if (request.url().startsWith("data:")) return;
    refused.add(request.url());
    const answer = request.isNavigationRequest() ? request.respond({ status: 204, body: "" }) : request.abort("blockedbyclient");
    // The page may close under a timed-out render; nothing is left to answer then.
    answer.catch(() => {});
  };

  await page.setRequestInterception(true);
  page.on("request", refuse);

  return {
    async stop() {
      page.off("request", refuse);
      await session.detach().catch(() => {});
      return [...seen.values()].map((s) => ({
        url: s.url,
        type: s.type,
        outcome: outcomeOf(s, refused.has(s.url)),
        detail: s.detail,
      }));
    },
  };
}

function outcomeOf(s: Seen, refusedHere: boolean): RequestRecord["outcome"] {
  if (refusedHere) return "refused";
  if (s.state === "failed") return "blocked";
  if (s.state === "finished") return s.url.startsWith("data:") ? "inline" : "loaded";
  return "unsettled";
}
