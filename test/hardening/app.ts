/** The whole app in-process, wired as src/server.ts wires it (keep the two in step), on a database of its own. */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Hono } from "hono";
import { openStore, type Store } from "../../src/store/index.ts";
import { createApp } from "../../src/web/app.ts";
import { pageRoutes } from "../../src/web/page.tsx";
import { recordsApi } from "../../src/web/records.ts";
import { recordsPages } from "../../src/web/recordsPage.tsx";
import { revisionSheetApi } from "../../src/web/revisionSheet.ts";
import { sheetApi } from "../../src/web/sheet.ts";

export interface WholeApp {
  app: Hono;
  store: Store;
  /** Close the database and remove its folder. */
  close(): void;
}

export function wholeApp(): WholeApp {
  const dir = mkdtempSync(join(tmpdir(), "hoopwise-hardening-"));
  const store = openStore({ path: join(dir, "records.db") });
  const app = createApp({ mounts: [sheetApi(), revisionSheetApi({ store }), recordsApi({ store }), recordsPages({ store }), pageRoutes()] });
  return {
    app,
    store,
    close() {
      store.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
