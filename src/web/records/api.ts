/**
 * @module web/records/api
 * The JSON API for saved checks, revisions, sign-offs, people, sessions and keys. The store
 * checks every body in full, so a client hears every problem in one 422 answer; these handlers
 * only carry requests in and answers out, for the signed-in user. Only POST /api/v1/session and
 * GET /api/v1/keys are open.
 * Handed the store and, for large imports, the worker pool (src/pool), which parses an import and
 * checks its signatures off the request thread; a full pool is answered 503. The store's refusals
 * become errors documents with their status through http.ts; the session cookie and the signed-in
 * guard are auth.ts's; the JSON body reader and its size limit are the check API's (src/web/api.ts).
 */
import { Hono } from "hono";
import { bodyLimit } from "hono/body-limit";
import { MAX_IMPORT_BYTES, type NewCheck, type NewRevision, type NewUser, type SignOffRequest, type Store } from "../../store/index.ts";
import { sharedPool, WorkPoolBusy, type WorkPool } from "../../pool/index.ts";
import { jsonBody } from "../../schema/jsonBody.ts";
import { errorsDoc, notJson, POOL_FROM_BYTES, readJson, tooLarge } from "../api.ts";
import { clearSessionCookie, noStore, requireUser, setSessionCookie, sourceOf, tokenOf, type RecordsEnv } from "./auth.ts";
import { recordsErrorResponse } from "./http.ts";

export interface RecordsDeps {
  /** The open records store; it validates check inputs with the validator it was opened with. */
  store: Store;
  /** Worker threads for large imports; the process's shared pool unless given. */
  pool?: WorkPool;
}

const utf8 = new TextDecoder();

const importLimit = bodyLimit({
  maxSize: MAX_IMPORT_BYTES,
  onError: (c) => c.json(errorsDoc("(document)", `an import is at most ${MAX_IMPORT_BYTES / 1048576} MiB; this one is larger`), 413),
});

export function recordsApi({ store, pool }: RecordsDeps): Hono<RecordsEnv> {
  const app = new Hono<RecordsEnv>();
  app.onError(recordsErrorResponse);
  for (const path of ["/api/v1/checks", "/api/v1/users", "/api/v1/session", "/api/v1/keys"]) {
    app.use(path, noStore);
    app.use(`${path}/*`, noStore);
  }

  // Signing in: the one records route open to anyone, slowed against guessing by the store.
  app.post("/api/v1/session", tooLarge, async (c) => {
    const body = await readJson(c.req.raw);
    if (!body.ok) return c.json(body.body, body.status);
    const session = await store.signIn(body.value, sourceOf(c));
    setSessionCookie(c, session);
    return c.json({ token: session.token, user: session.user, expiresAt: session.expiresAt }, 201);
  });

  // The public key: anyone may check a signature, so anyone may have it.
  app.get("/api/v1/keys", (c) => c.json({ keys: [store.publicKey()] }));

  const signedIn = requireUser(store);
  app.use("/api/v1/checks", signedIn);
  app.use("/api/v1/checks/*", signedIn);
  app.use("/api/v1/users", signedIn);
  app.use("/api/v1/users/*", signedIn);
  app.use("/api/v1/keys/trusted", signedIn);
  app.get("/api/v1/session", signedIn, (c) => c.json({ user: c.get("user") }));
  app.delete("/api/v1/session", signedIn, async (c) => {
    const token = tokenOf(c);
    if (token) await store.signOut(token);
    clearSessionCookie(c);
    return c.body(null, 204);
  });

  app.get("/api/v1/checks", async (c) => c.json({ checks: await store.listChecks() }));

  app.post("/api/v1/checks", tooLarge, async (c) => {
    const body = await readJson(c.req.raw);
    if (!body.ok) return c.json(body.body, body.status);
    const created = await store.createCheck(body.value as NewCheck, c.get("user"));
    c.header("Location", `/api/v1/checks/${encodeURIComponent(created.id)}`);
    return c.json(created, 201);
  });

  // "import" can never be taken for a check id here: it has no second path segment. A large file
  // is parsed, validated and its signatures checked in a worker thread (the bytes moved there, not
  // copied), so the request thread keeps serving; only the write transaction runs here.
  app.post("/api/v1/checks/import", importLimit, async (c) => {
    const wrongType = notJson(c.req.raw);
    if (wrongType) return c.json(wrongType, 415);
    const bytes = new Uint8Array(await c.req.raw.arrayBuffer());
    let imported: Awaited<ReturnType<Store["importCheck"]>>;
    if (bytes.byteLength < POOL_FROM_BYTES) {
      const body = jsonBody(utf8.decode(bytes));
      if (!body.ok) return c.json(body.body, body.status);
      imported = await store.importCheck(body.value, c.get("user"));
    } else {
      let answer: Awaited<ReturnType<WorkPool["prepareImport"]>>;
      try {
        answer = await (pool ?? sharedPool()).prepareImport(bytes, await store.importKeys());
      } catch (err) {
        if (!(err instanceof WorkPoolBusy)) throw err;
        return c.json(errorsDoc("(server)", "every worker is busy with large documents; try again shortly"), 503, { "retry-after": "2" });
      }
      if (!answer.ok) return c.json(answer.body, answer.status);
      imported = await store.importCheck(undefined, c.get("user"), answer.prepared);
    }
    c.header("Location", `/api/v1/checks/${encodeURIComponent(imported.id)}`);
    return c.json(imported, 201);
  });

  app.get("/api/v1/checks/:id", async (c) => c.json(await store.getCheck(c.req.param("id"))));

  app.post("/api/v1/checks/:id/revisions", tooLarge, async (c) => {
    const body = await readJson(c.req.raw);
    if (!body.ok) return c.json(body.body, body.status);
    const saved = await store.addRevision(c.req.param("id"), body.value as NewRevision, c.get("user"));
    // An unchanged input creates nothing: 200 with the existing revision, and says so.
    return c.json(saved, saved.unchanged ? 200 : 201);
  });

  app.post("/api/v1/checks/:id/signoffs", tooLarge, async (c) => {
    const body = await readJson(c.req.raw);
    if (!body.ok) return c.json(body.body, body.status);
    return c.json(await store.signOff(c.req.param("id"), body.value as SignOffRequest, c.get("user"), sourceOf(c)), 201);
  });

  app.get("/api/v1/checks/:id/export", async (c) => {
    const doc = await store.exportCheck(c.req.param("id"));
    const file = doc.check.calcNumber.replace(/[^A-Za-z0-9._-]+/g, "_");
    c.header("Content-Disposition", `attachment; filename="${file}.hoopwise.json"`);
    return c.json(doc);
  });

  app.get("/api/v1/users", async (c) => c.json({ users: await store.listUsers() }));

  app.post("/api/v1/users", tooLarge, async (c) => {
    const body = await readJson(c.req.raw);
    if (!body.ok) return c.json(body.body, body.status);
    return c.json(await store.addUser(body.value as NewUser, c.get("user"), sourceOf(c)), 201);
  });

  app.post("/api/v1/users/:id/disable", async (c) => c.json(await store.setDisabled(userId(c.req.param("id")), true, c.get("user"))));
  app.post("/api/v1/users/:id/enable", async (c) => c.json(await store.setDisabled(userId(c.req.param("id")), false, c.get("user"))));
  app.post("/api/v1/users/:id/clear-delay", async (c) =>
    c.json({ cleared: await store.clearDelay(userId(c.req.param("id")), c.get("user")) }),
  );
  app.post("/api/v1/users/:id/passphrase", tooLarge, async (c) => {
    const body = await readJson(c.req.raw);
    if (!body.ok) return c.json(body.body, body.status);
    await store.setPassphrase(userId(c.req.param("id")), body.value, c.get("user"), sourceOf(c));
    return c.body(null, 204);
  });

  app.get("/api/v1/keys/trusted", async (c) => c.json({ trusted: await store.listTrustedKeys() }));
  app.post("/api/v1/keys/trusted", tooLarge, async (c) => {
    const body = await readJson(c.req.raw);
    if (!body.ok) return c.json(body.body, body.status);
    return c.json(await store.trustKey(body.value, c.get("user")), 201);
  });

  return app;
}

/** A user id from the path; anything that is not a number names no one, a 404 from the store. */
function userId(raw: string): number {
  return /^\d{1,12}$/.test(raw) ? Number(raw) : -1;
}
