import type { Hono } from "hono";
import type { Store } from "../store/index.ts";
import { createApp, type AppOptions } from "./app.ts";
import { pageRoutes } from "./page.tsx";
import { recordsRoutes } from "./records/index.ts";
import { sheetApi } from "./sheet.ts";

/** Every route of the checker over one records store: what the server serves and what tests drive in-process. */
export function wholeApp(store: Store, options: Pick<AppOptions, "allowedHosts"> = {}): Hono {
  return createApp({ ...options, store, mounts: [sheetApi(), recordsRoutes({ store }), pageRoutes()] });
}
