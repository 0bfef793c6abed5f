import { DEMOS } from "../../demo/index.ts";
import type { Store } from "../../store/index.ts";

/**
 * On first run (no saved check yet) the demos are saved as revision 1, unsigned, so the records
 * list is never empty for a new user. They are saved by no one: there may be no user yet.
 */
export function seedDemos(store: Store): number {
  if (store.listChecks().length > 0) return 0;
  for (const d of DEMOS)
    store.createCheck({ input: d.document, title: d.document.title, calcNumber: d.document.calcNumber, savedBy: "Hoopwise demo" }, null);
  return DEMOS.length;
}
