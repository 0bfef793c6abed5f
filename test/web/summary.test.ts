import { describe, expect, it } from "vitest";
import { findDemo } from "../../src/demo/index.ts";
import { createApp } from "../../src/web/app.ts";
import { encodeCheck } from "../../src/web/link.ts";
import { pageRoutes } from "../../src/web/page.tsx";
import { MAX_SHARE_LINK_CHARS } from "../../views/results/share.tsx";
import { browserFields } from "./formFields.ts";

const app = createApp({ mounts: [pageRoutes()] });

describe("the error summary", () => {
  it("links to every field that holds an error", async () => {
    const opened = await (await app.request("/?demo=cabin")).text();
    const fields = { ...browserFields(opened), "shell.thickness": "-1", "shell.radius": "abc" };
    const html = await (await app.request("/", { method: "POST", body: new URLSearchParams(fields) })).text();
    const note = html.slice(html.indexOf('class="stale-note"'), html.indexOf("</div>", html.indexOf('class="stale-note"')));
    expect(note).toContain('href="#f-shell-thickness"');
    expect(note).toContain('href="#f-shell-radius"');
    // Each link leads to a field that exists on the page.
    for (const m of note.matchAll(/href="#([^"]+)"/g)) expect(html).toContain(`id="${m[1]}"`);
  });
});

describe("the share link", () => {
  it("is offered for a short check and replaced by a clear message for a long history", async () => {
    const short = await (await app.request("/?demo=receiver")).text();
    expect(short).toContain('id="check-link"');
    expect(short).not.toContain('id="link-too-long"');
    // An invented logger record: 20 000 readings that deflate poorly (a pseudo-random walk).
    let x = 0.5;
    let seed = 7;
    const history = Array.from({ length: 20_000 }, () => {
      seed = (seed * 16807) % 2147483647;
      x = Math.min(1.1, Math.max(0, x + (seed / 2147483647 - 0.5) * 0.2));
      return Math.round(x * 1e4) / 1e4;
    });
    const doc = { ...findDemo("receiver")!.document, pressure: { history_MPa: history } };
    expect(encodeCheck(doc).length).toBeGreaterThan(MAX_SHARE_LINK_CHARS);
    const opened = await (await app.request("/", { method: "POST", body: new URLSearchParams(browserFields(short)) })).text();
    expect(opened).toContain('id="check-link"');
    const long = await (
      await app.request("/", {
        method: "POST",
        body: new URLSearchParams({
          ...browserFields(short),
          "pressure.mode": "history",
          "history.text": history.map((v) => String(v * 10)).join(" "),
        }),
      })
    ).text();
    expect(long).toContain('id="link-too-long"');
    expect(long).toContain("too long for a link");
    expect(long).not.toContain('id="check-link"');
  });
});
