/**
 * @module web/records/access
 * Signing in and out, and the first-run page. The first-run page exists only while no one is
 * registered, and only for a browser on the server's own machine (loopback), so no one on the
 * network can make themselves the first admin of a fresh install.
 * The forms post and redirect; after signing in the browser goes back to the page it asked for,
 * only ever a path on this site. A refusal (a wrong passphrase, a guessing delay, a name already
 * taken) comes back as the page with the message beside its field. Relies on the store for people
 * and sessions, the views of views/records/access.tsx, the session cookie and loopback test of
 * auth.ts, and the page frame of pages.tsx.
 */
import { Hono, type Context } from "hono";
import { bodyLimit } from "hono/body-limit";
import { RecordError, SlowDownError, type Store } from "../../store/index.ts";
import { SETUP_FIELDS, SetupView, SIGNIN_FIELDS } from "../../../views/records/access.tsx";
import { SETUP_PATH, SIGNIN_PATH, SIGNOUT_PATH } from "../../../views/records/paths.ts";
import { clearSessionCookie, isLocalRequest, noStore, setSessionCookie, sourceOf, tokenOf } from "./auth.ts";
import { formErrors, NO_ERRORS } from "../../present/formErrors.ts";
import { postedFields } from "./forms.ts";
import { statusOf } from "./http.ts";
import { page, signInPage } from "./pages.tsx";

const smallForm = bodyLimit({ maxSize: 64 * 1024, onError: (c) => c.text("The form is too large.", 413) });

/** Only a page of ours is a place to go back to after signing in: a path, never another site. */
function localNext(next: string | undefined): string {
  return next && /^\/(?![/\\])[\x21-\x7e]*$/.test(next) ? next : "/records";
}

export function accessPages({ store }: { store: Store }): Hono {
  const app = new Hono();
  for (const path of [SIGNIN_PATH, SIGNOUT_PATH, SETUP_PATH]) app.use(path, noStore);

  app.get(SIGNIN_PATH, async (c) => {
    if ((await store.countUsers()) === 0 && isLocalRequest(c)) return c.redirect(SETUP_PATH, 303);
    return signInPage(c, { next: c.req.query("next") }, NO_ERRORS, 200);
  });

  app.post(SIGNIN_PATH, smallForm, async (c) => {
    const f = await postedFields(c);
    try {
      const session = await store.signIn({ name: f.name ?? "", passphrase: f.passphrase ?? "" }, sourceOf(c));
      setSessionCookie(c, session);
      return c.redirect(localNext(f.next), 303);
    } catch (err) {
      if (!(err instanceof RecordError)) throw err;
      if (err instanceof SlowDownError) c.header("Retry-After", String(err.retryAfter_s));
      return signInPage(c, { name: f.name, next: f.next }, formErrors(err.errors, SIGNIN_FIELDS), statusOf(err));
    }
  });

  app.post(SIGNOUT_PATH, async (c) => {
    const token = tokenOf(c);
    if (token) await store.signOut(token);
    clearSessionCookie(c);
    return c.redirect(SIGNIN_PATH, 303);
  });

  const setupOpen = async (c: Context) => isLocalRequest(c) && (await store.countUsers()) === 0;

  app.get(SETUP_PATH, async (c) => {
    if (!(await setupOpen(c))) return c.redirect(SIGNIN_PATH, 303);
    return page(c, "First run", <SetupView errors={NO_ERRORS} />);
  });

  app.post(SETUP_PATH, smallForm, async (c) => {
    if (!(await setupOpen(c))) return c.redirect(SIGNIN_PATH, 303);
    const f = await postedFields(c);
    if ((f.passphrase ?? "") !== (f.again ?? "")) {
      const errors = formErrors(
        [{ path: "again", message: "does not match the passphrase above: type the same passphrase twice" }],
        SETUP_FIELDS,
      );
      return page(c, "First run", <SetupView name={f.name} errors={errors} />, 422);
    }
    try {
      const passphrase = f.passphrase ?? "";
      const user = await store.addUser({ name: f.name ?? "", role: "admin", passphrase }, null, sourceOf(c));
      const session = await store.signIn({ name: user.name, passphrase }, sourceOf(c));
      setSessionCookie(c, session);
      return c.redirect("/records/people", 303);
    } catch (err) {
      if (!(err instanceof RecordError)) throw err;
      return page(c, "First run", <SetupView name={f.name} errors={formErrors(err.errors, SETUP_FIELDS)} />, statusOf(err));
    }
  });

  return app;
}
