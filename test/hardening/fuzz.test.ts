/**
 * The JSON check API under hostile input: 10 000 generated documents (the demos and the format
 * example, mutated) sent in-process through the whole app. Whatever comes in, the answer is a
 * result or an errors document naming the field — never a 5xx, never a hang.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { checkDocument } from "../../src/engine/index.ts";
import { MAX_JSON_BYTES } from "../../src/web/api.ts";
import { createApp } from "../../src/web/app.ts";
import { bodyOf, BASES, documentOf, plan } from "./hostile.ts";
import { bounded, expectErrorsDoc, expectResult, nonFiniteNumbers } from "./answers.ts";
import { wholeApp } from "./app.ts";

const app = createApp();
const post = (body: BodyInit, type = "application/json") =>
  bounded(`POST /api/v1/check (${type})`, app.request("/api/v1/check", { method: "POST", headers: { "content-type": type }, body }));

describe("POST /api/v1/check under 10 000 generated documents", () => {
  it("answers each with a result (200) or an errors document naming the field (400/422), never a 5xx", { timeout: 300_000 }, async () => {
    const seen = { 200: 0, 400: 0, 422: 0 };
    await fc.assert(
      fc.asyncProperty(plan, async (p) => {
        const body = bodyOf(documentOf(p));
        const res = await post(body);
        expect([200, 400, 422]).toContain(res.status);
        seen[res.status as keyof typeof seen] += 1;
        const json: unknown = await res.json();
        if (res.status !== 200) return expectErrorsDoc(json);
        expectResult(json);
        // JSON would carry a NaN as null without a word: the engine's own numbers must be finite.
        const direct = checkDocument(JSON.parse(body));
        expect(direct.ok).toBe(true);
        if (direct.ok) expect(nonFiniteNumbers(direct.result)).toEqual([]);
      }),
      { numRuns: 10_000 },
    );
    // The generator is worth its name only if it reaches both the engine and the rejections.
    expect(seen[200]).toBeGreaterThan(100);
    expect(seen[422]).toBeGreaterThan(1_000);
  });

  it("runs every base document unchanged to a result", async () => {
    for (const doc of BASES) {
      const res = await post(JSON.stringify(doc));
      expect(res.status).toBe(200);
      expectResult(await res.json());
    }
  });
});

describe("POST /api/v1/check: what is not a JSON document", () => {
  it("refuses other content types with 415 and an errors document", async () => {
    const form = new FormData();
    form.set("document", JSON.stringify(BASES[0]));
    for (const [body, type] of [
      [JSON.stringify(BASES[0]), "text/plain"],
      [JSON.stringify(BASES[0]), "application/x-www-form-urlencoded"],
      [JSON.stringify(BASES[0]), ""],
      [JSON.stringify(BASES[0]), "application/jsonx"],
    ] as const) {
      const res = await post(body, type);
      expect(res.status, type).toBe(415);
      expectErrorsDoc(await res.json());
    }
    const multipart = await bounded("multipart", app.request("/api/v1/check", { method: "POST", body: form }));
    expect(multipart.status).toBe(415);
    expectErrorsDoc(await multipart.json());
  });

  it("answers malformed JSON with 400 and says it is not valid JSON", async () => {
    for (const body of ["{", "", "{'a': 1}", '{"a": NaN}', '{"a": Infinity}', "[1,]", "\u0000", '{"a":1}{"b":2}']) {
      const res = await post(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      const json = await res.json();
      expectErrorsDoc(json);
      expect(json.errors[0].message).toMatch(/not valid JSON/);
    }
  });

  it("answers a body over the limit with 413 naming the limit, whether or not its length is declared", { timeout: 60_000 }, async () => {
    const big = `{"title":"${"x".repeat(MAX_JSON_BYTES)}"}`;
    const streamed = new Blob([big]).stream();
    for (const [label, body, headers] of [
      ["declared", big, { "content-type": "application/json", "content-length": String(Buffer.byteLength(big)) }],
      ["streamed", streamed, { "content-type": "application/json" }],
    ] as const) {
      const res = await bounded(label, app.request("/api/v1/check", { method: "POST", headers, body, duplex: "half" } as RequestInit));
      expect(res.status, label).toBe(413);
      const json = await res.json();
      expectErrorsDoc(json);
      expect(json.errors[0].message).toContain(`${MAX_JSON_BYTES / 1024 / 1024} MiB`);
    }
  });
});

describe("every route that reads a body", () => {
  const JSON_ROUTES = [
    "/api/v1/check",
    "/api/v1/sheet",
    "/api/v1/checks",
    "/api/v1/checks/import",
    "/api/v1/checks/x/revisions",
    "/api/v1/checks/x/signoffs",
    "/api/v1/users",
    "/api/v1/session",
  ];
  const FORM_ROUTES = [
    "/",
    "/recalc",
    "/export",
    "/sheet",
    "/import",
    "/records/save",
    "/records/x/revisions",
    "/records/x/sign",
    "/records/people",
  ];

  it("refuses a body over its limit with 413 before reading it, and JSON routes say the limit", { timeout: 60_000 }, async () => {
    const whole = wholeApp();
    try {
      const big = "x".repeat(MAX_JSON_BYTES + 1);
      for (const path of [...JSON_ROUTES, ...FORM_ROUTES]) {
        const json = JSON_ROUTES.includes(path);
        const headers = {
          "content-type": json ? "application/json" : "application/x-www-form-urlencoded",
          "content-length": String(big.length),
        };
        const res = await bounded(path, whole.app.request(path, { method: "POST", headers, body: big }));
        expect(res.status, path).toBe(413);
        const text = await res.text();
        expect(text.trim(), path).not.toBe("");
        if (json) expect(JSON.parse(text).errors[0].message, path).toContain(`${MAX_JSON_BYTES / 1024 / 1024} MiB`);
      }
    } finally {
      whole.close();
    }
  });
});
