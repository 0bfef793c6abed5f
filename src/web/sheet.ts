import { Hono } from "hono";
import { BrowserCrashedError, BrowserUnavailableError, PoolBusyError, RenderTimeoutError } from "../pdf/errors.ts";
import { renderSheet, type SheetOptions } from "../sheet/sheet.ts";
import { errorsDoc, readJson, tooLarge } from "./api.ts";

/**
 * A file name from the calculation number: letters, digits, dot, dash and underscore only, so
 * it is safe in a Content-Disposition header and on any file system; the raw number (which may
 * hold any script) also goes in the RFC 6266 / RFC 8187 `filename*` form.
 */
export function sheetFilename(calcNumber: string | undefined): string {
  const safe = (calcNumber ?? "")
    .normalize("NFKD")
    .replace(/[^A-Za-z0-9._-]+/g, "-")
    .replace(/^[-.]+|[-.]+$/g, "")
    .slice(0, 80);
  return `${safe || "check"}-sheet.pdf`;
}

function contentDisposition(calcNumber: string | undefined): string {
  const ascii = sheetFilename(calcNumber);
  const full = calcNumber ? `${calcNumber}-sheet.pdf` : ascii;
  // RFC 8187 attr-char leaves out ' ( ) * which encodeURIComponent lets through.
  const encoded = encodeURIComponent(full).replace(/['()*]/g, (ch) => `%${ch.charCodeAt(0).toString(16).toUpperCase()}`);
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}

/**
 * The sheet as an HTTP answer: the PDF, 422 with the errors document for a bad check, 503 when
 * the renderer cannot take it now (with Retry-After when waiting helps). The page's print
 * button and POST /api/v1/sheet both answer through this.
 */
export async function sheetResponse(json: unknown, opts: Omit<SheetOptions, "requestLog"> = {}): Promise<Response> {
  try {
    const out = await renderSheet(json, opts);
    if (!out.ok) return Response.json({ errors: out.errors }, { status: 422 });
    // A check that rendered passed the schema: calcNumber is text or absent.
    const calcNumber = (json as { calcNumber?: string }).calcNumber;
    return new Response(new Uint8Array(out.pdf), {
      status: 200,
      headers: {
        "content-type": "application/pdf",
        "content-disposition": contentDisposition(calcNumber),
        "x-hoopwise-fingerprint": out.fingerprint,
        "cache-control": "no-store",
      },
    });
  } catch (err) {
    if (err instanceof PoolBusyError || err instanceof BrowserCrashedError) {
      const retry = err instanceof PoolBusyError ? err.retryAfter_s : 1;
      return Response.json(errorsDoc("(server)", err.message), { status: 503, headers: { "retry-after": String(retry) } });
    }
    if (err instanceof BrowserUnavailableError || err instanceof RenderTimeoutError) {
      // A renderer that would not start or hung is relaunched for the next sheet: worth a retry soon.
      return Response.json(errorsDoc("(server)", `the check sheet cannot be printed now: ${err.message}`), {
        status: 503,
        headers: { "retry-after": err instanceof RenderTimeoutError ? "5" : "30" },
      });
    }
    throw err;
  }
}

/** POST /api/v1/sheet: a check document in (JSON), its check sheet out (application/pdf). `?paper=Letter` for US Letter. */
export function sheetApi(): Hono {
  const app = new Hono();
  app.post("/api/v1/sheet", tooLarge, async (c) => {
    const body = await readJson(c.req.raw);
    if (!body.ok) return c.json(body.body, body.status);
    const paper = c.req.query("paper") ?? "A4";
    if (paper !== "A4" && paper !== "Letter") return c.json(errorsDoc("paper", `the paper must be A4 or Letter (got "${paper}")`), 422);
    return sheetResponse(body.value, { paper });
  });
  return app;
}
