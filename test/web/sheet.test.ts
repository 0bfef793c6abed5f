import { afterAll, describe, expect, it } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import { checkDocument } from "../../src/engine/index.ts";
import { closeSharedPool, createBrowserPool } from "../../src/pdf/browser.ts";
import { verifySheet } from "../../src/sheet/verify.ts";
import { createApp } from "../../src/web/app.ts";
import { sheetApi, sheetFilename, sheetResponse } from "../../src/web/sheet.ts";

afterAll(() => closeSharedPool());

const cabin = DEMOS.find((d) => d.id === "cabin")!.document;
const app = createApp({ mounts: [sheetApi()] });
const post = (body: string, type = "application/json", query = "") =>
  app.request(`/api/v1/sheet${query}`, { method: "POST", headers: { "content-type": type }, body });
const RENDER = { timeout: 90_000 };

describe("POST /api/v1/sheet", () => {
  it("answers a check with its sheet as application/pdf, named from the calculation number", RENDER, async () => {
    const res = await post(JSON.stringify(cabin));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("content-disposition")).toBe(
      `attachment; filename="L30-FUS-017-sheet.pdf"; filename*=UTF-8''L30-FUS-017-sheet.pdf`,
    );
    const expected = checkDocument(cabin);
    if (!expected.ok) throw new Error("the cabin demo must be valid");
    expect(res.headers.get("x-hoopwise-fingerprint")).toBe(expected.result.fingerprint);
    const pdf = new Uint8Array(await res.arrayBuffer());
    expect(Buffer.from(pdf.subarray(0, 5)).toString("latin1")).toBe("%PDF-");
    expect((await verifySheet(pdf)).ok).toBe(true);
  });

  it("answers a bad check with 422 and the errors document naming the field", async () => {
    const res = await post(JSON.stringify({ ...cabin, fatigue: { ...cabin.fatigue, designLife_cycles: 0 } }));
    expect(res.status).toBe(422);
    expect(await res.json()).toEqual({
      errors: [{ path: "fatigue.designLife_cycles", message: "the design life must be greater than 0" }],
    });
  });

  it("answers a body that is not JSON, or an unknown paper, without a 500", async () => {
    expect((await post("{ not json")).status).toBe(400);
    const form = await post("title=x", "application/x-www-form-urlencoded");
    expect(form.status).toBe(415);
    expect((await form.json()).errors[0].path).toBe("(document)");
    const paper = await post(JSON.stringify(cabin), "application/json", "?paper=Legal");
    expect(paper.status).toBe(422);
    expect(await paper.json()).toEqual({ errors: [{ path: "paper", message: 'the paper must be A4 or Letter (got "Legal")' }] });
  });
});

describe("sheetResponse when the renderer cannot take the work", () => {
  it("answers 503 with Retry-After while every slot and the waiting line are full", RENDER, async () => {
    const pool = createBrowserPool({ concurrency: 1, queueLimit: 0 });
    try {
      const first = sheetResponse(cabin, { pool });
      // Give the first render its slot before the second asks.
      await new Promise((r) => setImmediate(r));
      const busy = await sheetResponse(cabin, { pool });
      expect(busy.status).toBe(503);
      expect(Number(busy.headers.get("retry-after"))).toBeGreaterThanOrEqual(1);
      expect((await busy.json()).errors[0]).toMatchObject({ path: "(server)", message: expect.stringMatching(/busy/) });
      expect((await first).status).toBe(200);
    } finally {
      await pool.close();
    }
  });

  it("answers 503 with a plain errors document when Chromium is missing", async () => {
    const pool = createBrowserPool({ executablePath: "/nonexistent/chromium" });
    try {
      const res = await sheetResponse(cabin, { pool });
      expect(res.status).toBe(503);
      const body = await res.json();
      expect(body.errors).toHaveLength(1);
      expect(body.errors[0].message).toMatch(/^the check sheet cannot be printed now: Chromium at \/nonexistent\/chromium would not start/);
    } finally {
      await pool.close();
    }
  });
});

describe("sheetFilename", () => {
  it("keeps a file name to safe characters whatever the calculation number holds", () => {
    expect(sheetFilename("AR500-SHELL-003")).toBe("AR500-SHELL-003-sheet.pdf");
    expect(sheetFilename("../../etc/passwd")).toBe("etc-passwd-sheet.pdf");
    expect(sheetFilename('calc "7"\r\nX-Injected: 1')).toBe("calc-7-X-Injected-1-sheet.pdf");
    expect(sheetFilename("压力容器")).toBe("check-sheet.pdf");
    expect(sheetFilename(undefined)).toBe("check-sheet.pdf");
  });
});
