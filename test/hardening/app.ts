/** The whole app in-process, as src/server.ts serves it, on a database of its own. */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Hono } from "hono";
import { openStore, type Store } from "../../src/store/index.ts";
import { wholeApp as serve } from "../../src/web/whole.ts";

export interface WholeApp {
  app: Hono;
  store: Store;
  /** Close the database and remove its folder. */
  close(): void;
}

export function wholeApp(): WholeApp {
  const dir = mkdtempSync(join(tmpdir(), "hoopwise-hardening-"));
  const store = openStore({ path: join(dir, "records.db") });
  const app = serve(store);
  return {
    app,
    store,
    close() {
      store.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
