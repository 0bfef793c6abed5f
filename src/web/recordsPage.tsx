import { Hono, type Context } from "hono";
import type { JSX } from "hono/jsx/jsx-runtime";
import { bodyLimit } from "hono/body-limit";
import { z } from "zod";
import { ENGINE_VERSION } from "../engine/index.ts";
import { RecordError, RecordNotFoundError, type CheckRecord, type Role, type Store } from "../store/index.ts";
import { passphraseField, personNameField, safeParseFields, zodFieldErrors } from "../store/fields.ts";
import { CheckView } from "../../views/records/check.tsx";
import { CompareView, type Comparison } from "../../views/records/compare.tsx";
import { pageHtml, RecordsLayout, type Notice } from "../../views/records/layout.tsx";
import { ChecksList } from "../../views/records/list.tsx";
import { checkPath, inputPath, SIGNERS_PATH } from "../../views/records/paths.ts";
import { SIGN_FIELDS, type SignFormState } from "../../views/records/signForm.tsx";
import { SIGNER_FIELDS, SignersView } from "../../views/records/signers.tsx";
import { diffInputs } from "./history/diff.ts";
import { workRevision } from "./history/figures.ts";
import { encodeCheck, MAX_LINK_CHARS } from "./link.ts";
import { isDatabaseBusy, statusOf } from "./recordsHttp.ts";
import { formErrors, NO_ERRORS, postedFields, type FormErrors } from "./recordsForms.ts";
import { saveRoutes } from "./recordsSave.tsx";

type Status = 200 | 403 | 404 | 409 | 422 | 503;

/** Sign and register forms carry a few short fields; anything far larger is not one of ours. */
const smallForm = bodyLimit({ maxSize: 64 * 1024, onError: (c) => c.text("The form is too large.", 413) });

/**
 * The records as pages: the list of saved checks, one check with its revisions and log, signing,
 * comparing two revisions, and registering the people who sign. Every form posts and redirects
 * (or answers with the whole page and the message beside the field), so all of it works without
 * scripting; every refusal is a page, never a server error.
 */
export function recordsPages({ store }: { store: Store }): Hono {
  const app = new Hono();
  app.onError(errorPage);
  app.route("/", saveRoutes({ store }));

  app.get("/records", (c) => page(c, "Saved checks", <ChecksList checks={store.listChecks()} />));

  app.get(SIGNERS_PATH, (c) => {
    const added = c.req.query("added");
    const known = added !== undefined && store.listSigners().some((s) => s.name === added);
    return signersPage(c, {}, NO_ERRORS, 200, known ? { tone: "done", text: `${added} is registered and can now sign.` } : undefined);
  });

  app.post(SIGNERS_PATH, smallForm, async (c) => {
    const f = await postedFields(c);
    const problems = signerProblems(f);
    if (problems.length) return signersPage(c, f, formErrors(problems, SIGNER_FIELDS), 422);
    try {
      const { name } = await store.addSigner({ name: f.name ?? "", passphrase: f.passphrase ?? "" });
      return c.redirect(`${SIGNERS_PATH}?added=${encodeURIComponent(name)}`, 303);
    } catch (err) {
      if (!(err instanceof RecordError)) throw err;
      return signersPage(c, f, formErrors(err.errors, SIGNER_FIELDS), statusOf(err));
    }
  });

  app.get("/records/:id", (c) => {
    const check = store.getCheck(c.req.param("id"));
    return checkPage(c, check, { errors: NO_ERRORS }, 200, outcomeNotice(check, c.req.query()));
  });

  app.post("/records/:id/sign", smallForm, async (c) => {
    const check = store.getCheck(c.req.param("id"));
    const f = await postedFields(c);
    const form = { role: f.role, name: f.name };
    if (!f.passphrase) {
      const errors = formErrors([{ path: "passphrase", message: "type your passphrase to sign" }], SIGN_FIELDS);
      return checkPage(c, check, { ...form, errors }, 422, refused("Not signed: see the message beside the field."));
    }
    const revision = /^\d{1,9}$/.test(f.revision ?? "") ? Number(f.revision) : f.revision;
    try {
      // The store checks every field of the request; the casts only give the form's text the request's type.
      const request = { revision: revision as number, role: f.role as Role, name: f.name ?? "", passphrase: f.passphrase };
      const signed = await store.signOff(check.id, request);
      return c.redirect(`${checkPath(check.id)}?signed=${signed.revision}&role=${signed.signoff.role}`, 303);
    } catch (err) {
      if (!(err instanceof RecordError)) throw err;
      const errors = formErrors(err.errors, SIGN_FIELDS);
      // Reload: a refusal for a superseded revision means someone saved meanwhile, and the page should show it.
      return checkPage(
        c,
        store.getCheck(check.id),
        { ...form, errors },
        statusOf(err),
        refused("Not signed: see the message beside the field."),
      );
    }
  });

  app.get("/records/:id/compare", (c) => {
    const check = store.getCheck(c.req.param("id"));
    const comparison = compare(check, c.req.query("from"), c.req.query("to"));
    return page(c, `Compare · ${check.calcNumber}`, <CompareView {...comparison} />, comparison.errors.size ? 422 : 200);
  });

  app.get("/records/:id/revisions/:n/open", (c) => {
    const { check, revision } = savedRevision(c);
    const link = encodeCheck(revision.input);
    if (link.length > MAX_LINK_CHARS) {
      const text = (
        <>
          Revision {revision.number} is too large to open by a link. <a href={inputPath(check.id, revision.number)}>Download its input</a>,
          then open that file in the checker.
        </>
      );
      return checkPage(c, store.getCheck(check.id), { errors: NO_ERRORS }, 200, refused(text));
    }
    return c.redirect(`/?c=${link}&record=${encodeURIComponent(check.id)}`, 303);
  });

  // One revision's input as a check file, the same document the checker downloads and opens.
  app.get("/records/:id/revisions/:n/input", (c) => {
    const { check, revision } = savedRevision(c);
    const file = `${check.calcNumber.replace(/[^A-Za-z0-9._-]+/g, "_")}-rev${revision.number}.json`;
    c.header("Content-Disposition", `attachment; filename="${file}"`);
    return c.body(`${JSON.stringify(revision.input, null, 2)}\n`, 200, { "Content-Type": "application/json; charset=utf-8" });
  });

  function savedRevision(c: Context) {
    const n = Number(c.req.param("n"));
    if (!Number.isInteger(n) || n < 1)
      throw new RecordNotFoundError([{ path: "revision", message: `there is no revision “${c.req.param("n")}”` }]);
    return store.getSheetRevision(c.req.param("id") ?? "", n);
  }

  async function checkPage(c: Context, check: CheckRecord, sign: SignFormState, status: Status, notice?: Notice) {
    const view = <CheckView check={check} signers={store.listSigners()} sign={sign} />;
    return page(c, `${check.calcNumber} · ${check.title}`, view, status, notice);
  }

  async function signersPage(c: Context, f: Record<string, string>, errors: FormErrors, status: Status, notice?: Notice) {
    const failed = status !== 200 ? refused("Not registered: see the messages beside the fields.") : notice;
    return page(c, "People who sign", <SignersView signers={store.listSigners()} name={f.name} errors={errors} />, status, failed);
  }

  return app;
}

async function page(c: Context, title: string, body: JSX.Element, status: Status = 200, notice?: Notice) {
  return c.html(await pageHtml(<RecordsLayout title={title} notice={notice} children={body} />), status);
}

const refused = (text: Notice["text"]): Notice => ({ tone: "refused", text });

/** Every problem with a registration at once: the store's own field rules, and the two passphrases agreeing. */
function signerProblems(f: Record<string, string>) {
  const parsed = safeParseFields(z.object({ name: personNameField, passphrase: passphraseField }), {
    name: f.name,
    passphrase: f.passphrase,
  });
  const problems = parsed.success ? [] : zodFieldErrors(parsed.error);
  if ((f.passphrase ?? "") !== (f.again ?? "")) {
    problems.push({ path: "again", message: "does not match the passphrase above: type the same passphrase twice" });
  }
  return problems;
}

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
  if (isDatabaseBusy(err)) {
    c.header("Retry-After", "1");
    const body = (
      <section class="panel-box">
        <p>The records are busy with another save. Try again in a moment.</p>
        {back}
      </section>
    );
    return page(c, "Busy", body, 503);
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
