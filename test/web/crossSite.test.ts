import { describe, expect, it } from "vitest";
import { createApp } from "../../src/web/app.ts";
import { pageRoutes } from "../../src/web/page.tsx";

const app = createApp({ mounts: [pageRoutes()] });
const form = (headers: Record<string, string>) =>
  app.request("http://127.0.0.1:8080/", {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded", ...headers },
    body: "shell.thickness=2",
  });

describe("requests from other sites", () => {
  it("a post another site's page makes through the browser is refused with a reason", async () => {
    const viaMetadata = await form({ "sec-fetch-site": "cross-site", origin: "http://elsewhere.invalid" });
    expect(viaMetadata.status).toBe(403);
    expect((await viaMetadata.json()).errors[0].message).toMatch(/another site/);
    expect((await form({ origin: "http://elsewhere.invalid" })).status).toBe(403);
  });

  it("the page's own posts, and clients that are not browsers, go through", async () => {
    expect((await form({ "sec-fetch-site": "same-origin", origin: "http://127.0.0.1:8080" })).status).not.toBe(403);
    expect((await form({ origin: "http://127.0.0.1:8080" })).status).not.toBe(403);
    expect((await form({})).status).not.toBe(403);
    expect((await app.request("http://127.0.0.1:8080/healthz", { headers: { "sec-fetch-site": "cross-site" } })).status).toBe(200);
  });
});
