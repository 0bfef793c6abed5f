import { Hono } from "hono";
import type { Store } from "../store/index.ts";
import { errorsDoc } from "./api.ts";
import { recordsErrorResponse } from "./recordsHttp.ts";
import { sheetResponse } from "./sheet.ts";

/**
 * GET /api/v1/checks/:id/revisions/:n/sheet — the check sheet of one saved revision, with its
 * sign-offs printed and the draft or superseded mark its state calls for.
 */
export function revisionSheetApi({ store }: { store: Store }): Hono {
  const app = new Hono();
  app.onError(recordsErrorResponse);
  app.get("/api/v1/checks/:id/revisions/:n/sheet", async (c) => {
    const n = Number(c.req.param("n"));
    if (!Number.isInteger(n) || n < 1) return c.json(errorsDoc("revision", "the revision must be a whole number from 1"), 422);
    const paper = c.req.query("paper") ?? "A4";
    if (paper !== "A4" && paper !== "Letter") return c.json(errorsDoc("paper", `the paper must be A4 or Letter (got "${paper}")`), 422);
    const { revision } = store.getSheetRevision(c.req.param("id"), n);
    return sheetResponse(revision.input, {
      paper,
      revision: revision.number,
      signoffs: revision.signoffs.map((s) => ({ role: s.role, name: s.name, signedAt: s.signedAt })),
      superseded: revision.state === "superseded",
    });
  });
  return app;
}
