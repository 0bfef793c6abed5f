import { Hono } from "hono";
import { bodyLimit } from "hono/body-limit";
import { checkText, sharedPool, WorkPoolBusy, type WorkPool } from "../pool/index.ts";
import { jsonBody } from "../schema/jsonBody.ts";

/** Largest JSON body the API reads: room for the longest history the schema takes (5 000 000 points of about 8 characters). */
export const MAX_JSON_BYTES = 64 * 1024 * 1024;

/**
 * Bodies above this size are checked in the worker pool, so the request thread stays free. Below it a
 * check takes a few milliseconds in place, less than the hand-over to a thread would add; about
 * 15 000 history points fit under it.
 */
export const POOL_FROM_BYTES = 128 * 1024;

export function errorsDoc(path: string, message: string) {
  return { errors: [{ path, message }] };
}

/** Read a JSON body without throwing: malformed or absurdly nested JSON becomes an errors document. */
export async function readJson(
  req: Request,
): Promise<{ ok: true; value: unknown } | { ok: false; status: 400 | 415 | 422; body: ReturnType<typeof errorsDoc> }> {
  const wrongType = notJson(req);
  if (wrongType) return { ok: false, status: 415, body: wrongType };
  return jsonBody(await req.text());
}

export function notJson(req: Request): ReturnType<typeof errorsDoc> | undefined {
  const type = req.headers.get("content-type") ?? "";
  if (/^application\/(.+\+)?json\b/i.test(type)) return undefined;
  return errorsDoc("(document)", `send the check as JSON with Content-Type: application/json (got "${type || "none"}")`);
}

export const tooLarge = bodyLimit({
  maxSize: MAX_JSON_BYTES,
  onError: (c) => c.json(errorsDoc("(document)", `the body is larger than ${MAX_JSON_BYTES / 1024 / 1024} MiB`), 413),
});

export interface CheckApiOptions {
  /** Worker threads for large bodies; the process's shared pool unless given. */
  pool?: WorkPool;
}

const utf8 = new TextDecoder();

/**
 * The JSON check route: POST /api/v1/check. The body is read as bytes and parsed once; the answer is
 * serialized once. A large body goes whole (bytes moved, not copied) to a worker thread, which
 * decodes, parses, validates, checks and serializes it there.
 */
export function checkApi(opts: CheckApiOptions = {}): Hono {
  const app = new Hono();
  app.post("/api/v1/check", tooLarge, async (c) => {
    const wrongType = notJson(c.req.raw);
    if (wrongType) return c.json(wrongType, 415);
    const bytes = new Uint8Array(await c.req.raw.arrayBuffer());
    let answer: Awaited<ReturnType<WorkPool["check"]>>;
    if (bytes.byteLength < POOL_FROM_BYTES) answer = checkText(utf8.decode(bytes));
    else {
      try {
        answer = await (opts.pool ?? sharedPool()).check(bytes);
      } catch (err) {
        if (!(err instanceof WorkPoolBusy)) throw err;
        return c.json(errorsDoc("(server)", "every worker is busy with large checks; try again shortly"), 503, { "retry-after": "2" });
      }
    }
    return c.body(answer.body, answer.status, { "content-type": "application/json" });
  });
  return app;
}
