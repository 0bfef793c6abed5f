/**
 * Security headers on every answer of every route family — pages, fragments, assets, the APIs,
 * the records, errors and 404s — and a server that listens on loopback unless told otherwise.
 */
import { readFileSync } from "node:fs";
import { Hono } from "hono";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import { MAX_JSON_BYTES } from "../../src/web/api.ts";
import { createApp } from "../../src/web/app.ts";
import { assetUrl } from "../../views/assetFiles.ts";
import { wholeApp, type WholeApp } from "./app.ts";
import { startServer, type ServerChild } from "./server.ts";

/** The headers every answer carries, whatever its status. */
function expectSecurityHeaders(res: Response, what: string): void {
  const csp = res.headers.get("content-security-policy") ?? "";
  const directives = new Map(
    csp
      .split(";")
      .map((d) => d.trim().split(/\s+/))
      .filter((d) => d[0])
      .map(([name, ...values]) => [name, values]),
  );
  expect(directives.get("frame-ancestors"), `${what}: frame-ancestors`).toEqual(["'none'"]);
  expect(directives.get("script-src"), `${what}: script-src`).toEqual(["'self'"]);
  expect(directives.get("default-src"), `${what}: default-src`).toEqual(["'self'"]);
  expect(csp, what).not.toMatch(/unsafe-inline|unsafe-eval|\*/);
  expect(res.headers.get("x-content-type-options"), what).toBe("nosniff");
  expect(res.headers.get("referrer-policy"), what).toBe("no-referrer");
  expect(res.headers.get("x-frame-options"), what).toBe("DENY");
}

const cabin = JSON.stringify(DEMOS[0].document);
const json = { "content-type": "application/json" };
const form = { "content-type": "application/x-www-form-urlencoded" };

/** One request of each route family and each kind of answer it gives, with the status expected. */
function routeFamilies(id: string): [string, string, RequestInit, number][] {
  const css = assetUrl("site.css");
  return [
    ["page", "/", {}, 200],
    ["page from a link, damaged", "/?c=%%", {}, 422],
    ["fragment", "/recalc", { method: "POST", headers: { ...form, "hx-request": "true" }, body: "title=x" }, 200],
    ["plots fragment", "/plots?c=x", { headers: { "hx-request": "true" } }, 200],
    ["page post with errors", "/", { method: "POST", headers: form, body: "title=x" }, 422],
    ["page head", "/", { method: "HEAD" }, 200],
    ["asset", css, {}, 200],
    ["asset not modified", css, { headers: { "if-none-match": `"${new URL(css, "http://x").searchParams.get("v")}"` } }, 304],
    ["asset missing", "/assets/nothing.js", {}, 404],
    ["health", "/healthz", {}, 200],
    ["check API", "/api/v1/check", { method: "POST", headers: json, body: cabin }, 200],
    ["check API, invalid", "/api/v1/check", { method: "POST", headers: json, body: "{}" }, 422],
    ["check API, not JSON", "/api/v1/check", { method: "POST", headers: json, body: "{" }, 400],
    ["check API, wrong type", "/api/v1/check", { method: "POST", headers: { "content-type": "text/plain" }, body: cabin }, 415],
    [
      "check API, too large",
      "/api/v1/check",
      { method: "POST", headers: { ...json, "content-length": String(MAX_JSON_BYTES + 1) }, body: "x".repeat(MAX_JSON_BYTES + 1) },
      413,
    ],
    ["records list", "/api/v1/checks", {}, 200],
    ["record", `/api/v1/checks/${id}`, {}, 200],
    ["record missing", "/api/v1/checks/none", {}, 404],
    ["record refused", "/api/v1/checks", { method: "POST", headers: json, body: "{}" }, 422],
    ["people", "/api/v1/users", {}, 200],
    ["keys", "/api/v1/keys", {}, 200],
    ["sheet API, invalid", "/api/v1/sheet", { method: "POST", headers: json, body: "{}" }, 422],
    ["sheet API, wrong type", "/api/v1/sheet", { method: "POST", headers: form, body: "a=b" }, 415],
    ["revision sheet missing", "/api/v1/checks/none/revisions/1/sheet", {}, 404],
    ["records page", "/records", {}, 200],
    ["record page", `/records/${id}`, {}, 200],
    ["record page missing", "/records/none", {}, 404],
    ["people page", "/records/people", {}, 200],
    ["no such page", "/nowhere", {}, 404],
    ["no such method", "/api/v1/check", { method: "PUT", headers: json, body: cabin }, 404],
  ];
}

describe("in-process, every route family", () => {
  let whole: WholeApp;
  let id: string;
  beforeAll(async () => {
    whole = wholeApp();
    id = (await whole.store.createCheck({ input: { ...DEMOS[0].document, calcNumber: "HDR-1" } })).id;
  });
  afterAll(() => whole.close());

  it("carries the security headers on every answer, success or error", async () => {
    for (const [what, path, init, status] of routeFamilies(id)) {
      const res = await whole.app.request(path, init);
      expect(res.status, what).toBe(status);
      expectSecurityHeaders(res, what);
    }
  });

  it("carries them on a sub-app's own error answer and on the app's last-resort 500, and logs the fault", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const broken = wholeApp();
    broken.close(); // the records now fail inside their handlers, as with a lost database
    const res = await broken.app.request("/api/v1/checks");
    expect(res.status).toBe(500);
    expectSecurityHeaders(res, "records 500");
    expect(JSON.stringify(await res.json())).toContain("nothing saved was lost");

    const throwing = new Hono().get("/boom", () => {
      throw new Error("an invented fault");
    });
    const last = await createApp({ mounts: [throwing] }).request("/boom");
    expect(last.status).toBe(500);
    expectSecurityHeaders(last, "app 500");
    expect(log.mock.calls.map((c) => String(c[0]))).toEqual([
      expect.stringContaining("database connection is not open"),
      expect.stringContaining("an invented fault"),
    ]);
    log.mockRestore();
  });
});

describe("the server as started", () => {
  let server: ServerChild;
  beforeAll(async () => {
    server = await startServer();
  }, 90_000);
  afterAll(() => server?.dispose());

  it("listens on 127.0.0.1 only when HOST is not set", async () => {
    expect(server.base).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
    const port = Number(new URL(server.base).port);
    const hexPort = port.toString(16).toUpperCase().padStart(4, "0");
    // /proc/net/tcp: "local_address rem_address st", addresses as little-endian hex; 0A is LISTEN.
    const listening = (file: string) =>
      readFileSync(file, "utf8")
        .split("\n")
        .slice(1)
        .map((l) => l.trim().split(/\s+/))
        .filter((f) => f[1]?.endsWith(`:${hexPort}`) && f[3] === "0A")
        .map((f) => f[1].split(":")[0]);
    expect(listening(`/proc/${server.pid}/net/tcp`)).toEqual(["0100007F"]);
    expect(listening(`/proc/${server.pid}/net/tcp6`)).toEqual([]);
  });

  it("sends the headers from the real wiring too", async () => {
    const authorization = `Bearer ${await server.adminToken()}`;
    const id = (await (await fetch(`${server.base}/api/v1/checks`, { headers: { authorization } })).json()).checks[0].id as string;
    for (const [what, path, init, status] of routeFamilies(id).filter(([what]) => !what.includes("too large"))) {
      const res = await fetch(`${server.base}${path}`, {
        ...init,
        headers: { ...(init.headers as Record<string, string>), authorization },
      });
      await res.arrayBuffer();
      expect(res.status, what).toBe(status);
      expectSecurityHeaders(res, what);
    }
  });
});
