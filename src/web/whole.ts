import type { Hono } from "hono";
import type { Store } from "../store/index.ts";
import { createApp } from "./app.ts";
import { pageRoutes } from "./page.tsx";
import { recordsApi } from "./records.ts";
import { recordsPages } from "./recordsPage.tsx";
import { revisionSheetApi } from "./revisionSheet.ts";
import { sheetApi } from "./sheet.ts";

/** Every route of the checker over one records store: what the server serves and what tests drive in-process. */
export function wholeApp(store: Store): Hono {
  return createApp({ mounts: [sheetApi(), revisionSheetApi({ store }), recordsApi({ store }), recordsPages({ store }), pageRoutes()] });
}
