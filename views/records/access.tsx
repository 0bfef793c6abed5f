/**
 * @module views/records/access
 * The sign-in form and the first-run form that makes the first admin, each with the names of its
 * fields so the routes (src/web/records/access.tsx) can put a refusal beside the right one. Handed
 * what was typed (never a passphrase) and the errors sorted by src/present/formErrors.ts; the
 * passphrase's least length is the store's. The field controls are fields.tsx's.
 */
import { MIN_PASSPHRASE_LENGTH } from "../../src/store/index.ts";
import type { FormErrors } from "../../src/present/formErrors.ts";
import { FormProblems, PassphraseField, TextField } from "./fields.tsx";
import { SETUP_PATH, SIGNIN_PATH } from "./paths.ts";

export const SIGNIN_FIELDS = ["name", "passphrase"] as const;
export const SETUP_FIELDS = ["name", "passphrase", "again"] as const;

/** Signing in; `next` is the local page to return to. */
export function SignInView({ name, next, errors, why }: { name?: string; next?: string; errors: FormErrors; why?: string }) {
  return (
    <section class="panel-box" aria-labelledby="h-signin">
      <h1 id="h-signin">Sign in to the records</h1>
      <p class="lead">{why ?? "The saved checks, their revisions and sign-offs are for the people registered here."}</p>
      <form method="post" action={SIGNIN_PATH} id="signin">
        <FormProblems messages={errors.general} />
        {next ? <input type="hidden" name="next" value={next} /> : null}
        <div class="grid">
          <TextField id="signin-name" name="name" label="Name" value={name} autocomplete="username" errors={errors.fields.get("name")} />
          <PassphraseField
            id="signin-passphrase"
            name="passphrase"
            label="Passphrase"
            autocomplete="current-password"
            errors={errors.fields.get("passphrase")}
          />
        </div>
        <div class="actions">
          <button type="submit" class="primary">
            Sign in
          </button>
        </div>
      </form>
      <p class="hint">
        No account? Ask an admin of these records to add you. The checker itself needs none: <a href="/">open the checker</a>.
      </p>
    </section>
  );
}

/** The first run: no one is registered yet, and this page is served only to the machine itself. */
export function SetupView({ name, errors }: { name?: string; errors: FormErrors }) {
  return (
    <section class="panel-box" aria-labelledby="h-setup">
      <h1 id="h-setup">First run: make the first admin</h1>
      <p class="lead">
        No one is registered in these records yet. The first person is an admin, who then adds the engineers who save and sign. This page is
        shown only to a browser on this machine, and only until someone is registered. The same can be done with{" "}
        <code>npm run -s cli -- user add NAME --role admin</code>.
      </p>
      <form method="post" action={SETUP_PATH} id="setup">
        <FormProblems messages={errors.general} />
        <div class="grid">
          <TextField
            id="setup-name"
            name="name"
            label="Your name as it is printed on sheets"
            value={name}
            autocomplete="name"
            errors={errors.fields.get("name")}
          />
          <PassphraseField
            id="setup-passphrase"
            name="passphrase"
            label="Passphrase"
            autocomplete="new-password"
            minLength={MIN_PASSPHRASE_LENGTH}
            hint={`At least ${MIN_PASSPHRASE_LENGTH} characters and hard to guess; a few unrelated words work well.`}
            errors={errors.fields.get("passphrase")}
          />
          <PassphraseField
            id="setup-again"
            name="again"
            label="The passphrase again"
            autocomplete="new-password"
            errors={errors.fields.get("again")}
          />
        </div>
        <div class="actions">
          <button type="submit" class="primary">
            Make me the admin
          </button>
        </div>
      </form>
    </section>
  );
}
