import { Hono } from "hono";
import { bodyLimit } from "hono/body-limit";
import { checkDocument } from "../engine/index.ts";
import { MAX_JSON_DEPTH, tooDeepAt } from "./depth.ts";

/** Largest JSON body the API reads: room for a pressure history of about a million points. */
export const MAX_JSON_BYTES = 32 * 1024 * 1024;

export function errorsDoc(path: string, message: string) {
  return { errors: [{ path, message }] };
}

/** Read a JSON body without throwing: malformed or absurdly nested JSON becomes an errors document. */
export async function readJson(
  req: Request,
): Promise<{ ok: true; value: unknown } | { ok: false; status: 400 | 415 | 422; body: ReturnType<typeof errorsDoc> }> {
  const type = req.headers.get("content-type") ?? "";
  if (!/^application\/(.+\+)?json\b/i.test(type)) {
    return {
      ok: false,
      status: 415,
      body: errorsDoc("(document)", `send the check as JSON with Content-Type: application/json (got "${type || "none"}")`),
    };
  }
  const text = await req.text();
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (err) {
    return { ok: false, status: 400, body: errorsDoc("(document)", `the body is not valid JSON: ${(err as Error).message}`) };
  }
  const deep = tooDeepAt(value);
  if (deep !== undefined)
    return {
      ok: false,
      status: 422,
      body: errorsDoc(deep, `nests deeper than ${MAX_JSON_DEPTH} levels; no field of Hoopwise nests that deep`),
    };
  return { ok: true, value };
}

export const tooLarge = bodyLimit({
  maxSize: MAX_JSON_BYTES,
  onError: (c) => c.json(errorsDoc("(document)", `the body is larger than ${MAX_JSON_BYTES / 1024 / 1024} MiB`), 413),
});

/** The JSON check route: POST /api/v1/check. */
export function checkApi(): Hono {
  const app = new Hono();
  app.post("/api/v1/check", tooLarge, async (c) => {
    const body = await readJson(c.req.raw);
    if (!body.ok) return c.json(body.body, body.status);
    const out = checkDocument(body.value);
    return out.ok ? c.json(out.result) : c.json({ errors: out.errors }, 422);
  });
  return app;
}
