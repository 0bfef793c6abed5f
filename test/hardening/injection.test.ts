/**
 * Markup and script typed into a check's text fields come out inert everywhere: escaped on the
 * page, plain strings in the JSON, literal text in the PDF — which fetches nothing while printed.
 */
import { deflateRawSync } from "node:zlib";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeSharedPool } from "../../src/pdf/browser.ts";
import type { RequestRecord } from "../../src/pdf/pdf.ts";
import { renderSheet } from "../../src/sheet/sheet.ts";
import { writeForm } from "../../src/web/form/index.ts";
import { sheetFilename } from "../../src/web/sheet.ts";
import { unitsFrom } from "../../src/schema/units.ts";
import { pdfText } from "../sheet/poppler.ts";
import { wholeApp, type WholeApp } from "./app.ts";
import { FORMAT_EXAMPLE } from "./hostile.ts";

const SCRIPT = "<script>alert(1)</script>";
const BREAKOUT = '"><img src=x onerror=alert(1)>';
const FILE_IMAGE = '<img src="file:///etc/passwd">';
const JS_URL = "javascript:alert(document.cookie)";
const SVG_ESCAPE = "</svg><script>alert(2)</script>";
const PAYLOADS = [SCRIPT, BREAKOUT, FILE_IMAGE, JS_URL, SVG_ESCAPE];

/** Every text field the check format has, each holding markup (within the schema's lengths). */
function checkWith(text: (field: string) => string) {
  return {
    ...FORMAT_EXAMPLE,
    title: text("title"),
    project: text("project"),
    calcNumber: text("calcNumber"),
    notes: text("notes"),
    material: { ...(FORMAT_EXAMPLE.material as object), name: text("material.name") },
    cutout: { kind: "given", kt: 2.5, basis: text("cutout.basis") },
  };
}
const HOSTILE_TEXT: Record<string, string> = {
  title: `${SCRIPT} ${SVG_ESCAPE}`,
  project: `${BREAKOUT} ${JS_URL}`,
  calcNumber: FILE_IMAGE,
  notes: PAYLOADS.join(" "),
  "material.name": `${JS_URL} ${BREAKOUT}`,
  "cutout.basis": `${SVG_ESCAPE} ${FILE_IMAGE}`,
};
const hostile = checkWith((f) => HOSTILE_TEXT[f]);
const benign = checkWith((f) => `plain words for the ${f}`);

/** How the page's templates escape text, in body and attribute alike. */
const escaped = (s: string) =>
  s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#39;");
const linkOf = (doc: unknown) => deflateRawSync(Buffer.from(JSON.stringify(doc), "utf8")).toString("base64url");

/** Each tag's name and attributes, read as a browser reads them (escaped text cannot open a tag or end a value). */
function tags(html: string): { name: string; attrs: [string, string][] }[] {
  const out: { name: string; attrs: [string, string][] }[] = [];
  for (const m of html.matchAll(/<([a-zA-Z][\w:-]*)((?:\s+[^\s=>/]+(?:\s*=\s*(?:"[^"]*"|'[^']*'|[^\s>]+))?)*)\s*\/?>/g)) {
    const attrs: [string, string][] = [...m[2].matchAll(/\s+([^\s=>/]+)(?:\s*=\s*("[^"]*"|'[^']*'|[^\s>]+))?/g)].map((a) => [
      a[1].toLowerCase(),
      (a[2] ?? "").replace(/^["']|["']$/g, ""),
    ]);
    out.push({ name: m[1].toLowerCase(), attrs });
  }
  return out;
}

/** What could run or fetch in a page: script elements, images, frames, inline handlers, script URLs. */
function activeParts(html: string) {
  const all = tags(html);
  const attrs = all.flatMap((t) => t.attrs);
  return {
    scripts: all.filter((t) => t.name === "script").length,
    images: all.filter((t) => t.name === "img" || t.name === "image").length,
    frames: all.filter((t) => ["iframe", "object", "embed", "frame"].includes(t.name)).length,
    handlers: attrs.filter(([k]) => k.startsWith("on")).length,
    scriptUrls: attrs.filter(([k, v]) => /^(href|src|action|formaction|xlink:href)$/.test(k) && /^\s*javascript:/i.test(v)).length,
  };
}

let whole: WholeApp;
beforeAll(() => {
  whole = wholeApp();
});
afterAll(async () => {
  whole.close();
  await closeSharedPool();
});

/** The page's answers for a document: opened from a link, posted as a form, its htmx fragment and its plots. */
async function pagesFor(doc: object): Promise<Record<string, string>> {
  const units = unitsFrom(undefined);
  const form = new URLSearchParams({
    ...writeForm(doc, units),
    "units.length": units.length,
    "units.stress": units.stress,
    "units.pressure": units.pressure,
    "units.altitude": units.altitude,
  });
  const posted = { "content-type": "application/x-www-form-urlencoded" };
  const answers = {
    link: await whole.app.request(`/?c=${linkOf(doc)}`),
    form: await whole.app.request("/", { method: "POST", headers: posted, body: form.toString() }),
    fragment: await whole.app.request("/recalc", { method: "POST", headers: { ...posted, "hx-request": "true" }, body: form.toString() }),
    plots: await whole.app.request(`/plots?c=${linkOf(doc)}`, { headers: { "hx-request": "true" } }),
  };
  const out: Record<string, string> = {};
  for (const [k, res] of Object.entries(answers)) {
    expect(res.status, k).toBe(200);
    out[k] = await res.text();
  }
  return out;
}

describe("on the page", () => {
  it("shows markup only escaped, and adds nothing that could run or fetch", async () => {
    const pages = await pagesFor(hostile);
    const baseline = await pagesFor(benign);
    for (const [k, html] of Object.entries(pages)) {
      for (const p of PAYLOADS.filter((p) => /[<>"]/.test(p))) expect(html, `${k} holds ${p} raw`).not.toContain(p);
      expect(activeParts(html), k).toEqual(activeParts(baseline[k]));
      expect(activeParts(html).scriptUrls, k).toBe(0);
    }
    // The text is there for the reader, escaped: in the form's fields and in the result.
    for (const p of PAYLOADS) expect(pages.form, p).toContain(escaped(p));
    expect(pages.link).toContain(escaped(SCRIPT));
  });
});

describe("in the JSON", () => {
  it("returns the text as plain strings, as JSON that no browser would sniff as a page", async () => {
    const res = await whole.app.request("/api/v1/check", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(hostile),
    });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/^application\/json/);
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect((await res.json()).title).toBe(HOSTILE_TEXT.title);

    // A calculation number the records cannot keep is refused, never replaced by another.
    const refused = await whole.app.request("/api/v1/checks", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ input: hostile, title: HOSTILE_TEXT.project }),
    });
    expect(refused.status).toBe(422);
    expect((await refused.json()).errors[0].path).toBe("input.calcNumber");
    const saved = await whole.app.request("/api/v1/checks", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ input: { ...hostile, calcNumber: undefined }, title: HOSTILE_TEXT.project }),
    });
    expect(saved.status).toBe(201);
    const { id } = await saved.json();
    const record = await (await whole.app.request(`/api/v1/checks/${id}`)).json();
    expect(record.title).toBe(HOSTILE_TEXT.project);
    const exported = await whole.app.request(`/api/v1/checks/${id}/export`);
    expect(exported.headers.get("content-disposition")).toMatch(/^attachment; filename="[A-Za-z0-9._-]+\.hoopwise\.json"$/);
    const input = (await exported.json()).revisions[0].input;
    for (const [field, text] of Object.entries(HOSTILE_TEXT)) {
      if (field === "calcNumber") continue; // refused above
      const [a, b] = field.split(".");
      expect(b ? input[a === "cutout" ? "cutout" : "material"][b] : input[a], field).toBe(text);
    }
  });

  it("names the PDF file with safe characters only, whatever the calculation number", () => {
    for (const p of PAYLOADS) expect(sheetFilename(p)).toMatch(/^[A-Za-z0-9._-]+-sheet\.pdf$/);
  });
});

describe("in the PDF", () => {
  it("prints the text literally and makes no request to the network or the file system", { timeout: 90_000 }, async () => {
    const log: RequestRecord[] = [];
    const out = await renderSheet(hostile, { requestLog: log });
    if (!out.ok) throw new Error(JSON.stringify(out.errors));
    // Only the template's own inline (data:) content may be read; nothing else is even attempted.
    expect(log.filter((r) => !r.url.startsWith("data:"))).toEqual([]);
    expect(log.filter((r) => r.outcome === "loaded")).toEqual([]);
    const squash = (s: string) => s.replace(/\s+/g, "");
    const text = squash(pdfText(out.pdf));
    for (const p of PAYLOADS) expect(text, p).toContain(squash(p));
    expect(text).not.toMatch(/root:.*:0:0:/); // the first line of /etc/passwd
  });
});
