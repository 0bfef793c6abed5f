import { Hono } from "hono";
import type { Store } from "../../store/index.ts";
import type { SheetSignoffs } from "../../sheet/signatures.ts";
import { SIGNOFFS_FORMAT } from "../../sheet/signatures.ts";
import { errorsDoc } from "../api.ts";
import { noStore, requireUser, type RecordsEnv } from "./auth.ts";
import { recordsErrorResponse } from "./http.ts";
import { sheetResponse } from "../sheet.ts";

/**
 * GET /api/v1/checks/:id/revisions/:n/sheet — the check sheet of one saved revision, with the
 * records' calculation number, its sign-offs printed and attached with their signatures, and
 * the draft, superseded or "imported, not signed" mark its state calls for. A revision whose
 * stored input no longer gives its stored fingerprint was changed outside Hoopwise: no sheet.
 */
export function revisionSheetApi({ store }: { store: Store }): Hono<RecordsEnv> {
  const app = new Hono<RecordsEnv>();
  app.onError(recordsErrorResponse);
  app.use("/api/v1/checks/:id/revisions/:n/sheet", noStore, requireUser(store));
  app.get("/api/v1/checks/:id/revisions/:n/sheet", async (c) => {
    const n = Number(c.req.param("n"));
    if (!Number.isInteger(n) || n < 1) return c.json(errorsDoc("revision", "the revision must be a whole number from 1"), 422);
    const paper = c.req.query("paper") ?? "A4";
    if (paper !== "A4" && paper !== "Letter") return c.json(errorsDoc("paper", `the paper must be A4 or Letter (got "${paper}")`), 422);
    const { check, revision } = await store.getSheetRevision(c.req.param("id"), n);
    if (!revision.intact) {
      return c.json(
        errorsDoc(
          "revision",
          `revision ${revision.number} of ${check.calcNumber} was changed outside Hoopwise: its stored input no longer gives the fingerprint it was saved with (${revision.fingerprint}). The sheet is not printed; restore the database from a backup and tell whoever keeps the records`,
        ),
        409,
      );
    }
    const valid = revision.signoffs.filter((s) => s.valid);
    const key = store.publicKey();
    const signatures: SheetSignoffs = {
      format: SIGNOFFS_FORMAT,
      checkId: check.id,
      revision: revision.number,
      calcNumber: check.calcNumber,
      fingerprint: revision.fingerprint,
      engineVersion: revision.engineVersion,
      keyFingerprint: key.fingerprint,
      signoffs: valid.map((s) => ({
        role: s.role,
        name: s.name,
        userId: s.userId ?? 0,
        signedAt: s.signedAt,
        signature: s.signature ?? "",
        keyFingerprint: s.keyFingerprint ?? "",
      })),
    };
    return sheetResponse(revision.input, {
      paper,
      revision: revision.number,
      signoffs: valid.map((s) => ({ role: s.role, name: s.name, signedAt: s.signedAt, signature: s.signature ?? undefined })),
      superseded: revision.state === "superseded",
      calcNumber: check.calcNumber,
      importedUnsigned: revision.importedUnsigned,
      signatures,
    });
  });
  return app;
}
