import { Hono } from "hono";
import type { Store } from "../../store/index.ts";
import { accessPages } from "./access.tsx";
import { recordsApi } from "./api.ts";
import { recordsPages } from "./pages.tsx";
import { revisionSheetApi } from "./sheet.ts";

/** Every records route, page and API, over one store: sign-in and first run, the JSON API, sheets and pages. */
export function recordsRoutes({ store }: { store: Store }): Hono {
  const app = new Hono();
  app.route("/", accessPages({ store }));
  app.route("/", revisionSheetApi({ store }) as unknown as Hono);
  app.route("/", recordsApi({ store }) as unknown as Hono);
  app.route("/", recordsPages({ store }) as unknown as Hono);
  return app;
}
