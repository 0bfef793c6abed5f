import { Hono, type Context } from "hono";
import { bodyLimit } from "hono/body-limit";
import { compress } from "hono/compress";
import { findDemo, DEMOS } from "../demo/index.ts";
import { checkDocument, type FieldError } from "../engine/index.ts";
import { findMaterial } from "../materials/library.ts";
import { parseCheck } from "../engine/input.ts";
import { Page } from "../../views/page.tsx";
import { Workspace, type Outcome } from "../../views/workspace.tsx";
import type { FormState } from "../../views/form/state.ts";
import { Fragment } from "../../views/fragment.tsx";
import { Plots } from "../../views/results/plots.tsx";
import { MAX_SHARE_LINK_CHARS } from "../../views/results/share.tsx";
import { MAX_JSON_BYTES } from "./api.ts";
import { sheetResponse } from "./sheet.ts";
import { assetRoutes } from "./assets.ts";
import { logPreviewRoutes } from "./logPreview.tsx";
import { readForm, readPosted, SPARE_BLOCK_ROWS, valueAt, writeForm, type FormValues, type Posted } from "./form/index.ts";
import { MAX_JSON_DEPTH, tooDeepAt } from "../schema/depth.ts";
import { unshownParts } from "./form/carry.ts";
import { decodeCheck, encodeCheck } from "./link.ts";
import { unitsFrom, type Units } from "../schema/units.ts";
import { messageInUnits } from "../present/limits.ts";

/**
 * The checker page. One handler shape for every way in: a link or example (GET), a plain form
 * post (the whole page back, so it works without scripting), an htmx post (only what changed,
 * as fragments), an uploaded JSON file. Every answer to a user's mistake is a page or fragment
 * with the message beside the field — never a server error.
 */

/** URLs longer than the page's link limit are not written into the address bar after each edit, and the plots come inline. */
const MAX_ADDRESS_CHARS = MAX_SHARE_LINK_CHARS;

/** What the page shows for one check: the form state, the outcome, and the link. */
interface Worked {
  state: FormState;
  outcome: Outcome;
  link?: string;
}

/** Run a check document and lay out what the page needs. Errors go beside the field they belong to, or in the general list. */
function work(
  document: Record<string, unknown>,
  solve: Posted["solve"],
  form: {
    values: FormValues;
    units: Units;
    rows: number[];
    fieldFor: (p: string) => string | undefined;
    formErrors?: Map<string, string[]>;
  },
): Worked {
  const run = checkDocument(solve ? { ...document, solve: { for: solve } } : document);
  // Messages the form itself found (a log that cannot be read) stand for what the check then lacks.
  const errors = new Map<string, string[]>(form.formErrors ?? []);
  const general: FieldError[] = [];
  let outcome: Outcome = { errorCount: 0, general, canUsePressure: form.values["pressure.mode"] === "direct" };
  let link: string | undefined;
  if (run.ok) {
    link = encodeCheck(document);
    outcome.view = { result: run.result, units: form.units, link, solve };
  } else {
    for (const e of run.errors) {
      if (form.formErrors?.size && (e.path === "pressure" || e.path.startsWith("pressure."))) continue;
      const name = form.fieldFor(e.path);
      if (name === undefined) general.push(e);
      // A limit the message states is written in the form's units, as the field reads.
      else errors.set(name, [...(errors.get(name) ?? []), messageInUnits(e, form.units)]);
    }
    outcome = { ...outcome, errorCount: [...errors.values()].reduce((n, m) => n + m.length, 0) + general.length };
  }
  const state: FormState = {
    values: form.values,
    errors,
    units: form.units,
    library: findMaterial(form.values["material.id"] ?? ""),
    blockRows: form.rows,
  };
  return { state, outcome, link };
}

/** A document from a link, an example or a file: shown in its own display units unless the query asks for others. */
function workDocument(doc: unknown, query: Record<string, string | undefined>, solve?: Posted["solve"]): Worked {
  const display = valueAt(doc, "display") as Record<string, unknown> | undefined;
  const units = unitsFrom({ ...display, ...pickDefined(query, ["length", "stress", "pressure", "altitude"]) });
  // `record` names the saved check a document was opened from, so saving it adds a revision there.
  const carried = unshownParts(doc, units);
  const values = { ...writeForm(doc, units), ...pickDefined(query, ["record"]), ...(carried ? { carry: JSON.stringify(carried) } : {}) };
  const blocks = valueAt(doc, "pressure.blocks");
  const rows = Array.from({ length: Math.max(3, (Array.isArray(blocks) ? blocks.length : 0) + SPARE_BLOCK_ROWS) }, (_, i) => i);
  // The document itself is checked, not the form read back from it, so a link reproduces its numbers exactly.
  const document =
    doc !== null && typeof doc === "object" && !Array.isArray(doc) ? { ...(doc as Record<string, unknown>), display: { ...units } } : {};
  return work(document, solve, { values, units, rows, fieldFor: readForm(values, units).fieldFor });
}

function pickDefined(q: Record<string, string | undefined>, keys: string[]): Record<string, string> {
  return Object.fromEntries(keys.filter((k) => q[k] !== undefined).map((k) => [k, q[k] as string]));
}

async function fullPage(c: Context, w: Worked, status: 200 | 401 | 403 | 404 | 409 | 422 | 429 | 503, notice?: string) {
  const title = w.state.values.title;
  const page = (
    <Page title={title} notice={notice}>
      <Workspace s={w.state} o={w.outcome} />
    </Page>
  );
  return c.html(`<!doctype html>${await page.toString()}`, status);
}

/**
 * The checker page for a posted form that another route (saving to the records) did not act on:
 * the reason as a notice, and that route's own messages beside the fields they are about.
 */
export async function showPosted(
  c: Context,
  posted: Posted,
  notice: string,
  status: 401 | 403 | 404 | 409 | 422 | 429 | 503 = 422,
  beside: Record<string, string[]> = {},
) {
  const w = work(posted.document, undefined, posted);
  const errors = new Map(w.state.errors);
  for (const [name, messages] of Object.entries(beside)) errors.set(name, [...(errors.get(name) ?? []), ...messages]);
  return fullPage(c, { ...w, state: { ...w.state, errors } }, status, notice);
}

/** GET / and GET /recalc: a link (`?c=`), an example (`?demo=`), or the cabin example on a first visit. */
async function showLinked(c: Context) {
  const q = c.req.query();
  if (q.c !== undefined) {
    const decoded = decodeCheck(q.c);
    if (decoded.ok) return fullPage(c, workDocument(decoded.value, q), 200);
    return fullPage(
      c,
      workDocument(DEMOS[0].document, q),
      422,
      `The link could not be opened: ${decoded.message}. The cabin example is shown instead.`,
    );
  }
  const demo = findDemo(q.demo ?? DEMOS[0].id);
  if (!demo)
    return fullPage(
      c,
      workDocument(DEMOS[0].document, q),
      422,
      `There is no example called “${q.demo}”. The cabin example is shown instead.`,
    );
  return fullPage(c, workDocument(demo.document, q), 200);
}

/** A posted form: the whole page for a plain post, fragments for htmx. */
async function recalc(c: Context, allowFragments: boolean) {
  const posted = await readPosted(c.req.raw);
  const w = work(posted.document, posted.solve, posted);
  const ok = w.outcome.view !== undefined;
  if (!(allowFragments && c.req.header("HX-Request") === "true")) return fullPage(c, w, ok ? 200 : 422);
  // htmx swaps 200 answers only; every fragment carries its own errors, so each is a 200.
  if (ok && w.link && w.link.length <= MAX_ADDRESS_CHARS) c.header("HX-Replace-Url", `/?c=${w.link}`);
  if (posted.redraw) {
    c.header("HX-Retarget", "#workspace");
    c.header("HX-Reswap", "outerHTML");
    return c.html(await (<Workspace s={w.state} o={w.outcome} />).toString());
  }
  if (!ok) c.header("HX-Reswap", "none");
  const inlinePlots = (w.link?.length ?? 0) > MAX_ADDRESS_CHARS;
  return c.html(await (<Fragment s={w.state} o={w.outcome} inlinePlots={inlinePlots} />).toString());
}

/** GET /plots: the plots of a linked check, fetched by the page just after an edit's numbers; a whole page when asked for directly. */
async function showPlots(c: Context) {
  if (c.req.header("HX-Request") !== "true") return showLinked(c);
  const q = c.req.query();
  const decoded = decodeCheck(q.c ?? "");
  const solve = q.solve === "thickness" || q.solve === "pressure" ? q.solve : undefined;
  const view = decoded.ok ? workDocument(decoded.value, {}, solve).outcome.view : undefined;
  const answer = view ? <Plots v={view} /> : <p class="hint">The plots could not be drawn: the linked check could not be worked out.</p>;
  return c.html(await answer.toString());
}

/** A file name from the title: letters, digits and hyphens only. */
function fileName(title: unknown): string {
  const slug =
    typeof title === "string"
      ? title
          .toLowerCase()
          .replace(/[^a-z0-9]+/g, "-")
          .replace(/^-|-$/g, "")
          .slice(0, 60)
      : "";
  return `hoopwise-${slug || "check"}.json`;
}

function download(c: Context, doc: unknown) {
  c.header("Content-Disposition", `attachment; filename="${fileName(valueAt(doc, "title"))}"`);
  return c.body(`${JSON.stringify(doc, null, 2)}\n`, 200, { "Content-Type": "application/json; charset=utf-8" });
}

const formLimit = bodyLimit({
  maxSize: MAX_JSON_BYTES,
  onError: (c) =>
    c.html(
      `<!doctype html><title>Too large</title><p>The form is larger than ${MAX_JSON_BYTES / 1024 / 1024} MiB. Shorten the pressure history and try again.</p>`,
      413,
    ),
});

export function pageRoutes(): Hono {
  const app = new Hono();
  app.route("/", assetRoutes());
  app.route("/", logPreviewRoutes());
  // Whole pages opened by a link are gzipped (about a fifth of the bytes); an edit's fragments on
  // loopback are not, as packing them would cost more time than it saves.
  app.get("/", compress(), showLinked);
  app.get("/recalc", compress(), showLinked);
  app.get("/plots", compress(), showPlots);
  app.post("/", formLimit, (c) => recalc(c, false));
  app.post("/recalc", formLimit, (c) => recalc(c, true));

  app.get("/export", (c) => {
    const decoded = decodeCheck(c.req.query("c") ?? "");
    if (!decoded.ok) return c.json({ errors: [{ path: "c", message: decoded.message }] }, 422);
    const parsed = parseCheck(decoded.value);
    return parsed.ok ? download(c, decoded.value) : c.json({ errors: parsed.errors }, 422);
  });
  app.post("/export", formLimit, async (c) => {
    const posted = await readPosted(c.req.raw);
    const parsed = parseCheck(posted.document);
    if (parsed.ok) return download(c, posted.document);
    return fullPage(c, work(posted.document, undefined, posted), 422, "The check was not downloaded: correct the marked fields first.");
  });

  // The page's print button: the same fields as the form, the sheet back as a PDF download.
  app.post("/sheet", formLimit, async (c) => {
    const posted = await readPosted(c.req.raw);
    if (!parseCheck(posted.document).ok)
      return fullPage(c, work(posted.document, undefined, posted), 422, "The sheet was not printed: correct the marked fields first.");
    return sheetResponse(posted.document);
  });

  app.post("/import", formLimit, async (c) => {
    const form = await c.req.raw.formData().catch(() => undefined);
    const file = form?.get("file");
    const retry = (message: string) =>
      fullPage(c, workDocument(DEMOS[0].document, {}), 422, `${message} The cabin example is shown instead.`);
    if (!(file instanceof File) || file.size === 0) return retry("Choose a check file (JSON) to open.");
    let doc: unknown;
    try {
      doc = JSON.parse(await file.text());
    } catch (err) {
      return retry(`“${file.name}” is not valid JSON (${(err as Error).message}).`);
    }
    if (tooDeepAt(doc) !== undefined) return retry(`“${file.name}” nests deeper than ${MAX_JSON_DEPTH} levels, which no check does.`);
    const w = workDocument(doc, {});
    return fullPage(
      c,
      w,
      w.outcome.view ? 200 : 422,
      w.outcome.view ? undefined : `“${file.name}” was opened, but it needs correcting before it can be worked out.`,
    );
  });
  return app;
}
