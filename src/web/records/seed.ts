import { DEMOS } from "../../demo/index.ts";
import { RecordConflictError, type Store } from "../../store/index.ts";

/**
 * On first run (no saved check yet) the demos are saved as revision 1, unsigned, so the records
 * list is never empty for a new user. They are saved by no one: there may be no user yet. Two
 * servers starting together on one empty PostgreSQL database both try: a demo the other has
 * just saved (its calculation number taken) is left to it.
 */
export async function seedDemos(store: Store): Promise<number> {
  if ((await store.listChecks()).length > 0) return 0;
  let saved = 0;
  for (const d of DEMOS) {
    try {
      await store.createCheck(
        { input: d.document, title: d.document.title, calcNumber: d.document.calcNumber, savedBy: "Hoopwise demo" },
        null,
      );
      saved++;
    } catch (err) {
      if (!(err instanceof RecordConflictError)) throw err;
    }
  }
  return saved;
}
