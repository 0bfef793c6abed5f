import { Hono } from "hono";
import type { NewCheck, NewRevision, NewSigner, SignOffRequest, Store } from "../store/index.ts";
import { readJson, tooLarge } from "./api.ts";
import { recordsErrorResponse } from "./recordsHttp.ts";

export interface RecordsDeps {
  /** The open records store; it validates check inputs with the validator it was opened with. */
  store: Store;
}

/**
 * The JSON API for saved checks, revisions, signers and sign-offs. The store
 * checks every body in full (its fields and the check input together), so a
 * client hears every problem in one 422 answer; these handlers only carry
 * requests in and answers out. Bodies are read as the check API reads them.
 */
export function recordsApi({ store }: RecordsDeps): Hono {
  const app = new Hono();
  app.onError(recordsErrorResponse);

  app.get("/api/v1/checks", (c) => c.json({ checks: store.listChecks() }));

  app.post("/api/v1/checks", tooLarge, async (c) => {
    const body = await readJson(c.req.raw);
    if (!body.ok) return c.json(body.body, body.status);
    const created = store.createCheck(body.value as NewCheck);
    c.header("Location", `/api/v1/checks/${encodeURIComponent(created.id)}`);
    return c.json(created, 201);
  });

  // "import" can never be taken for a check id here: it has no second path segment.
  app.post("/api/v1/checks/import", tooLarge, async (c) => {
    const body = await readJson(c.req.raw);
    if (!body.ok) return c.json(body.body, body.status);
    const imported = store.importCheck(body.value);
    c.header("Location", `/api/v1/checks/${encodeURIComponent(imported.id)}`);
    return c.json(imported, 201);
  });

  app.get("/api/v1/checks/:id", (c) => c.json(store.getCheck(c.req.param("id"))));

  app.post("/api/v1/checks/:id/revisions", tooLarge, async (c) => {
    const body = await readJson(c.req.raw);
    if (!body.ok) return c.json(body.body, body.status);
    const saved = store.addRevision(c.req.param("id"), body.value as NewRevision);
    // An unchanged input creates nothing: 200 with the existing revision, and says so.
    return c.json(saved, saved.unchanged ? 200 : 201);
  });

  app.post("/api/v1/checks/:id/signoffs", tooLarge, async (c) => {
    const body = await readJson(c.req.raw);
    if (!body.ok) return c.json(body.body, body.status);
    return c.json(await store.signOff(c.req.param("id"), body.value as SignOffRequest), 201);
  });

  app.get("/api/v1/checks/:id/export", (c) => {
    const doc = store.exportCheck(c.req.param("id"));
    const file = doc.check.calcNumber.replace(/[^A-Za-z0-9._-]+/g, "_");
    c.header("Content-Disposition", `attachment; filename="${file}.hoopwise.json"`);
    return c.json(doc);
  });

  app.get("/api/v1/signers", (c) => c.json({ signers: store.listSigners() }));

  app.post("/api/v1/signers", tooLarge, async (c) => {
    const body = await readJson(c.req.raw);
    if (!body.ok) return c.json(body.body, body.status);
    return c.json(await store.addSigner(body.value as NewSigner), 201);
  });

  return app;
}
