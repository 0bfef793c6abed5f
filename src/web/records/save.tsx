/**
 * @module web/records/save
 * Saving from the checker. The save button posts the checker's own form here: a check opened
 * from the records (its id in the hidden `record` field) gets a new revision; any other becomes
 * a new check, unless its calculation number is already in the records, in which case the user
 * is asked first. A check with mistakes goes back to the checker with the messages beside the
 * fields; nothing is saved until it is whole.
 * The form is read by the checker's own reader (src/web/form) and judged by the engine's parseCheck
 * before the store sees it; the store's refusals go beside the checker's fields where one names them
 * (showPosted of src/web/page.tsx). Mounted by pages.tsx behind its sign-in guard.
 */
import { Hono, type Context } from "hono";
import { bodyLimit } from "hono/body-limit";
import type { FieldError } from "../../engine/index.ts";
import { parseCheck } from "../../engine/input.ts";
import { RecordError, type SavedRevision, type Store } from "../../store/index.ts";
import { ConfirmSave } from "../../../views/records/confirmSave.tsx";
import { pageHtml, RecordsLayout } from "../../../views/records/layout.tsx";
import { checkPath, SAVE_PATH } from "../../../views/records/paths.ts";
import { MAX_JSON_BYTES } from "../api.ts";
import { readPosted, type Posted } from "../form/index.ts";
import { encodeCheck, MAX_LINK_CHARS } from "../link.ts";
import { showPosted } from "../page.tsx";
import { statusOf } from "./http.ts";
import { postedFields } from "./forms.ts";
import type { RecordsEnv } from "./auth.ts";

const formLimit = bodyLimit({
  maxSize: MAX_JSON_BYTES,
  onError: (c) => c.text(`The form is larger than ${MAX_JSON_BYTES / 1024 / 1024} MiB.`, 413),
});

export function saveRoutes({ store }: { store: Store }): Hono<RecordsEnv> {
  const app = new Hono<RecordsEnv>();

  app.post(SAVE_PATH, formLimit, async (c) => {
    const posted = await readPosted(c.req.raw);
    if (!parseCheck(posted.document).ok) return showPosted(c, posted, "Not saved: correct the marked fields first.");
    // The revision is saved by the signed-in user, whatever name the form carries.
    const user = c.get("user");
    const record = blankToUndefined(posted.values.record);
    try {
      if (record && posted.values.as !== "new")
        return savedAnswer(c, record, await store.addRevision(record, { input: posted.document }, user));
      const calcNumber = typeof posted.document.calcNumber === "string" ? posted.document.calcNumber.trim() : "";
      const existing = calcNumber ? (await store.listChecks()).find((x) => x.calcNumber === calcNumber) : undefined;
      if (existing) {
        const link = encodeCheck(posted.document);
        const back = link.length <= MAX_LINK_CHARS ? `/?c=${link}` : undefined;
        const body = <ConfirmSave existing={existing} document={posted.document} back={back} />;
        return c.html(await pageHtml(<RecordsLayout title="Save as a new revision?" user={user} children={body} />), 409);
      }
      const created = await store.createCheck({ input: posted.document }, user);
      return c.redirect(`${checkPath(created.id)}?saved=1`, 303);
    } catch (err) {
      if (!(err instanceof RecordError)) throw err;
      const { beside, rest } = besideFields(err.errors, posted);
      const notice = `Not saved: ${rest.length ? rest.join("; ") : "see the messages beside the fields"}.`;
      return showPosted(c, posted, notice, statusOf(err), beside);
    }
  });

  // The confirmed save of a check whose calculation number is already in the records.
  app.post("/records/:id/revisions", formLimit, async (c) => {
    const f = await postedFields(c);
    let input: unknown;
    try {
      input = JSON.parse(f.document ?? "");
    } catch {
      input = undefined;
    }
    // An unreadable document is passed on as missing: the store then says the check to save is required.
    return savedAnswer(c, c.req.param("id"), await store.addRevision(c.req.param("id"), { input }, c.get("user")));
  });

  return app;
}

function savedAnswer(c: Context, checkId: string, saved: SavedRevision) {
  return c.redirect(`${checkPath(checkId)}?${saved.unchanged ? "unchanged" : "saved"}=${saved.revision}`, 303);
}

/** The store's refusals that belong beside one of the checker's fields, and the rest in words. */
function besideFields(errors: readonly FieldError[], posted: Posted): { beside: Record<string, string[]>; rest: string[] } {
  const beside: Record<string, string[]> = {};
  const rest: string[] = [];
  for (const e of errors) {
    const field = e.path === "savedBy" ? "savedBy" : posted.fieldFor(e.path.replace(/^input\./, ""));
    if (field) beside[field] = [...(beside[field] ?? []), e.message];
    else rest.push(e.message);
  }
  return { beside, rest };
}

function blankToUndefined(s: string | undefined): string | undefined {
  const t = s?.trim();
  return t ? t : undefined;
}
