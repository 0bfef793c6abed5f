/**
 * @module web/records/pages
 * The records as pages: the list of saved checks, one check with its revisions and log, signing,
 * comparing two revisions, and the people and keys. Every page needs a signed-in user (else a
 * 401 with the sign-in form). Every form posts and redirects (or answers with the whole page and
 * the message beside the field), so all of it works without scripting; every refusal is a page,
 * never a server error.
 * Handed the store; the views are views/records, the comparison of two revisions is worked by
 * src/present/revisions, and saving from the checker is mounted from save.tsx. The page frame
 * (page) and the sign-in page are shared with access.tsx.
 */
import { Hono, type Context } from "hono";
import type { JSX } from "hono/jsx/jsx-runtime";
import { bodyLimit } from "hono/body-limit";
import { ENGINE_VERSION } from "../../engine/index.ts";
import {
  isStorageFault,
  RecordError,
  RecordNotFoundError,
  SlowDownError,
  storageFaultWords,
  type Actor,
  type CheckRecord,
  type Role,
  type Store,
  type UserRole,
} from "../../store/index.ts";
import { CheckView } from "../../../views/records/check.tsx";
import { CompareView, type Comparison } from "../../../views/records/compare.tsx";
import { pageHtml, RecordsLayout, type Notice } from "../../../views/records/layout.tsx";
import { ChecksList } from "../../../views/records/list.tsx";
import { SignInView } from "../../../views/records/access.tsx";
import { ADD_USER_FIELDS, OWN_PASSPHRASE_FIELDS, PeopleView, TRUST_FIELDS, type PeopleForms } from "../../../views/records/people.tsx";
import { checkPath, inputPath, PEOPLE_PATH } from "../../../views/records/paths.ts";
import { SIGN_FIELDS, type SignFormState } from "../../../views/records/signForm.tsx";
import { diffInputs } from "../../present/revisions/diff.ts";
import { workRevision } from "../../present/revisions/figures.ts";
import { encodeCheck, MAX_LINK_CHARS } from "../link.ts";
import { noStore, requireUser, sourceOf, type RecordsEnv } from "./auth.ts";
import { isDatabaseBusy, statusOf, type RefusalStatus } from "./http.ts";
import { type FormErrors, formErrors, NO_ERRORS } from "../../present/formErrors.ts";
import { postedFields } from "./forms.ts";
import { saveRoutes } from "./save.tsx";

type Status = RefusalStatus | 200;

/** Sign and register forms carry a few short fields; anything far larger is not one of ours. */
const smallForm = bodyLimit({ maxSize: 64 * 1024, onError: (c) => c.text("The form is too large.", 413) });

export function recordsPages({ store }: { store: Store }): Hono<RecordsEnv> {
  const app = new Hono<RecordsEnv>();
  app.onError(errorPage);
  const guard = requireUser(store, (c) => signInPage(c, { next: c.req.method === "GET" ? c.req.path : undefined }, NO_ERRORS, 401));
  for (const path of ["/records", "/records/*"]) app.use(path, noStore, guard);
  app.route("/", saveRoutes({ store }));

  app.get("/records", async (c) => page(c, "Saved checks", <ChecksList checks={await store.listChecks()} />));

  app.get(PEOPLE_PATH, (c) => {
    const done = c.req.query("done");
    return peoplePage(c, {}, 200, done ? { tone: "done", text: done } : undefined);
  });

  app.post(PEOPLE_PATH, smallForm, async (c) => {
    const f = await postedFields(c);
    const add = { name: f.name, role: f.role };
    if ((f.passphrase ?? "") !== (f.again ?? "")) {
      const errors = formErrors(
        [{ path: "again", message: "does not match the passphrase above: type the same passphrase twice" }],
        ADD_USER_FIELDS,
      );
      return peoplePage(c, { add: { ...add, errors } }, 422, refused("Not added: see the messages beside the fields."));
    }
    try {
      const u = await store.addUser(
        { name: f.name ?? "", role: (f.role ?? "") as UserRole, passphrase: f.passphrase ?? "" },
        c.get("user"),
        sourceOf(c),
      );
      return c.redirect(`${PEOPLE_PATH}?done=${encodeURIComponent(`${u.name} is added as ${u.role} and can now sign in.`)}`, 303);
    } catch (err) {
      if (!(err instanceof RecordError)) throw err;
      return peoplePage(
        c,
        { add: { ...add, errors: formErrors(err.errors, ADD_USER_FIELDS) } },
        statusOf(err),
        refused("Not added: see the messages beside the fields."),
      );
    }
  });

  app.post(`${PEOPLE_PATH}/me/passphrase`, smallForm, async (c) => {
    const f = await postedFields(c);
    const user = c.get("user");
    if ((f.passphrase ?? "") !== (f.again ?? "")) {
      const errors = formErrors(
        [{ path: "again", message: "does not match the new passphrase: type the same passphrase twice" }],
        OWN_PASSPHRASE_FIELDS,
      );
      return peoplePage(c, { own: { errors } }, 422, refused("Not changed: see the messages beside the fields."));
    }
    try {
      const body =
        user.role === "admin" && !f.current
          ? { passphrase: f.passphrase ?? "" }
          : { current: f.current ?? "", passphrase: f.passphrase ?? "" };
      await store.setPassphrase(user.id, body, user, sourceOf(c));
      return c.redirect(`${PEOPLE_PATH}?done=${encodeURIComponent("Your passphrase is changed.")}`, 303);
    } catch (err) {
      if (!(err instanceof RecordError)) throw err;
      return peoplePage(
        c,
        { own: { errors: formErrors(err.errors, OWN_PASSPHRASE_FIELDS) } },
        statusOf(err),
        refused("Not changed: see the messages beside the fields."),
      );
    }
  });

  app.post(`${PEOPLE_PATH}/trusted-keys`, smallForm, async (c) => {
    const f = await postedFields(c);
    try {
      const k = await store.trustKey({ publicKeyPem: f.publicKeyPem ?? "", label: f.label ?? "" }, c.get("user"));
      return c.redirect(
        `${PEOPLE_PATH}?done=${encodeURIComponent(`The key ${k.fingerprint} (${k.label}) is now trusted for imports.`)}`,
        303,
      );
    } catch (err) {
      if (!(err instanceof RecordError)) throw err;
      const trust = { label: f.label, publicKeyPem: f.publicKeyPem, errors: formErrors(err.errors, TRUST_FIELDS) };
      return peoplePage(c, { trust }, statusOf(err), refused("Not trusted: see the messages beside the fields."));
    }
  });

  app.post(`${PEOPLE_PATH}/:uid/:action{disable|enable|clear-delay|reset}`, smallForm, async (c) => {
    const id = /^\d{1,12}$/.test(c.req.param("uid")) ? Number(c.req.param("uid")) : -1;
    const by = c.get("user");
    const action = c.req.param("action");
    let done: string;
    if (action === "reset") {
      const f = await postedFields(c);
      await store.setPassphrase(id, { passphrase: f.passphrase ?? "" }, by, sourceOf(c));
      done = "The passphrase is reset; that person's sessions have ended.";
    } else if (action === "clear-delay") {
      done = (await store.clearDelay(id, by)) ? "The guessing delay is cleared." : "There was no guessing delay to clear.";
    } else {
      const u = await store.setDisabled(id, action === "disable", by);
      done = `${u.name} is ${u.disabled ? "disabled: their sessions have ended" : "enabled again"}.`;
    }
    return c.redirect(`${PEOPLE_PATH}?done=${encodeURIComponent(done)}`, 303);
  });

  app.get("/records/:id", async (c) => {
    const check = await store.getCheck(c.req.param("id"));
    return checkPage(c, check, { errors: NO_ERRORS }, 200, outcomeNotice(check, c.req.query()));
  });

  app.post("/records/:id/sign", smallForm, async (c) => {
    const check = await store.getCheck(c.req.param("id"));
    const f = await postedFields(c);
    const form = { role: f.role };
    if (!f.passphrase) {
      const errors = formErrors([{ path: "passphrase", message: "type your passphrase again to sign" }], SIGN_FIELDS);
      return checkPage(c, check, { ...form, errors }, 422, refused("Not signed: see the message beside the field."));
    }
    const revision = /^\d{1,9}$/.test(f.revision ?? "") ? Number(f.revision) : f.revision;
    try {
      // The store checks every field of the request; the casts only give the form's text the request's type.
      const request = { revision: revision as number, role: f.role as Role, passphrase: f.passphrase };
      const signed = await store.signOff(check.id, request, c.get("user"), sourceOf(c));
      return c.redirect(`${checkPath(check.id)}?signed=${signed.revision}&role=${signed.signoff.role}`, 303);
    } catch (err) {
      if (!(err instanceof RecordError)) throw err;
      if (err instanceof SlowDownError) c.header("Retry-After", String(err.retryAfter_s));
      const errors = formErrors(err.errors, SIGN_FIELDS);
      // Reload: a refusal for a superseded revision means someone saved meanwhile, and the page should show it.
      return checkPage(
        c,
        await store.getCheck(check.id),
        { ...form, errors },
        statusOf(err),
        refused("Not signed: see the message beside the field."),
      );
    }
  });

  app.get("/records/:id/compare", async (c) => {
    const check = await store.getCheck(c.req.param("id"));
    const comparison = compare(check, c.req.query("from"), c.req.query("to"));
    return page(c, `Compare · ${check.calcNumber}`, <CompareView {...comparison} />, comparison.errors.size ? 422 : 200);
  });

  app.get("/records/:id/revisions/:n/open", async (c) => {
    const { check, revision } = await savedRevision(c);
    const link = encodeCheck(revision.input);
    if (link.length > MAX_LINK_CHARS) {
      const text = (
        <>
          Revision {revision.number} is too large to open by a link. <a href={inputPath(check.id, revision.number)}>Download its input</a>,
          then open that file in the checker.
        </>
      );
      return checkPage(c, await store.getCheck(check.id), { errors: NO_ERRORS }, 200, refused(text));
    }
    return c.redirect(`/?c=${link}&record=${encodeURIComponent(check.id)}`, 303);
  });

  // One revision's input as a check file, the same document the checker downloads and opens.
  app.get("/records/:id/revisions/:n/input", async (c) => {
    const { check, revision } = await savedRevision(c);
    const file = `${check.calcNumber.replace(/[^A-Za-z0-9._-]+/g, "_")}-rev${revision.number}.json`;
    c.header("Content-Disposition", `attachment; filename="${file}"`);
    return c.body(`${JSON.stringify(revision.input, null, 2)}\n`, 200, { "Content-Type": "application/json; charset=utf-8" });
  });

  async function savedRevision(c: Context) {
    const n = Number(c.req.param("n"));
    if (!Number.isInteger(n) || n < 1)
      throw new RecordNotFoundError([{ path: "revision", message: `there is no revision “${c.req.param("n")}”` }]);
    return store.getSheetRevision(c.req.param("id") ?? "", n);
  }

  async function checkPage(c: Context<RecordsEnv>, check: CheckRecord, sign: SignFormState, status: Status, notice?: Notice) {
    const view = <CheckView check={check} user={c.get("user")} sign={sign} />;
    return page(c, `${check.calcNumber} · ${check.title}`, view, status, notice);
  }

  async function peoplePage(c: Context<RecordsEnv>, forms: Partial<PeopleForms>, status: Status, notice?: Notice) {
    const all: PeopleForms = { add: { errors: NO_ERRORS }, own: { errors: NO_ERRORS }, trust: { errors: NO_ERRORS }, ...forms };
    const view = (
      <PeopleView
        user={c.get("user")}
        users={await store.listUsers()}
        forms={all}
        ownKey={store.publicKey()}
        trusted={await store.listTrustedKeys()}
      />
    );
    return page(c, "People", view, status, notice);
  }

  return app;
}

export async function page(c: Context, title: string, body: JSX.Element, status: Status = 200, notice?: Notice) {
  const user = (c as Context<RecordsEnv>).get("user") as Actor | undefined;
  return c.html(await pageHtml(<RecordsLayout title={title} notice={notice} user={user} children={body} />), status);
}

/** The sign-in page, answered with `status` (401 where a records page was asked for without a session). */
export function signInPage(c: Context, f: { name?: string; next?: string }, errors: FormErrors, status: Status, why?: string) {
  return page(c, "Sign in", <SignInView name={f.name} next={f.next} errors={errors} why={why} />, status);
}

const refused = (text: Notice["text"]): Notice => ({ tone: "refused", text });

/** What the redirect after a save or a signature asks the page to report, read from the records rather than the address. */
function outcomeNotice(check: CheckRecord, q: Record<string, string>): Notice | undefined {
  const rev = check.revisions.find((r) => String(r.number) === (q.saved ?? q.unchanged ?? q.signed));
  if (!rev) return undefined;
  if (q.saved !== undefined) {
    const before = rev.number > 1 ? ` Revision ${rev.number - 1} is now superseded and keeps its sign-offs.` : "";
    return { tone: "done", text: `Saved as revision ${rev.number}, a draft waiting for sign-off.${before}` };
  }
  if (q.unchanged !== undefined)
    return { tone: "done", text: `Nothing changed since revision ${rev.number}, so no new revision was saved.` };
  const s = rev.signoffs.find((x) => x.role === q.role);
  return s ? { tone: "done", text: `Revision ${rev.number} signed as ${s.role} by ${s.name}.` } : undefined;
}

/** The two revisions asked for (by default the latest and the one before), or what is wrong with the request. */
function compare(check: CheckRecord, fromQ: string | undefined, toQ: string | undefined): Comparison {
  const latest = check.latestRevision;
  const from = fromQ ?? String(Math.max(1, latest - 1));
  const to = toQ ?? String(latest);
  const errors = new Map<string, string[]>();
  const find = (name: string, v: string) => {
    const r = check.revisions.find((x) => String(x.number) === v);
    if (!r) errors.set(name, [`there is no revision “${v}”; this check has revisions 1 to ${latest}`]);
    return r;
  };
  const a = find("from", from);
  const b = find("to", to);
  const base = { check, from, to, errors, engineVersion: ENGINE_VERSION };
  if (!a || !b || a.number === b.number) return base;
  return { ...base, pair: { a, b, input: diffInputs(a.input, b.input), worked: [workRevision(a.input), workRevision(b.input)] } };
}

/** A refusal or fault met while answering a records page, as a page of its own. */
async function errorPage(err: Error, c: Context) {
  const back = (
    <p>
      <a href="/records">Back to the saved checks</a>
    </p>
  );
  if (err instanceof RecordError) {
    if (err instanceof SlowDownError) c.header("Retry-After", String(err.retryAfter_s));
    const body = (
      <section class="panel-box">
        <h1>{err instanceof RecordNotFoundError ? "Not found" : "Not done"}</h1>
        <ul>
          {err.errors.map((e) => (
            <li>{e.message}</li>
          ))}
        </ul>
        {back}
      </section>
    );
    return page(c, err instanceof RecordNotFoundError ? "Not found" : "Not done", body, statusOf(err));
  }
  if (isStorageFault(err)) {
    c.header("Retry-After", isDatabaseBusy(err) ? "1" : "30");
    const body = (
      <section class="panel-box">
        <p>{storageFaultWords(err)}.</p>
        {back}
      </section>
    );
    return page(c, "Records unavailable", body, 503);
  }
  console.error(err);
  const body = (
    <section class="panel-box">
      <p>The server met an unexpected problem. Nothing saved was lost — please report it.</p>
      {back}
    </section>
  );
  return c.html(await pageHtml(<RecordsLayout title="Problem" children={body} />), 500);
}
