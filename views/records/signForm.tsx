import { ROLES, type Actor, type CheckRecord, type Role } from "../../src/store/index.ts";
import type { FormErrors } from "../../src/present/formErrors.ts";
import { FormProblems, PassphraseField, SelectField } from "./fields.tsx";
import { signPath } from "./paths.ts";
import { ROLE_WORDS } from "./state.tsx";

/** What the sign form shows again after a refusal: the choices made, never the passphrase. */
export interface SignFormState {
  role?: string;
  errors: FormErrors;
}

export const SIGN_FIELDS = ["revision", "role", "passphrase"] as const;

/** The role the latest revision needs next, or none once it is approved. */
export function nextRole(check: CheckRecord): Role | undefined {
  const latest = check.revisions[check.revisions.length - 1];
  const signed = new Set(latest?.signoffs.filter((s) => s.valid).map((s) => s.role));
  return ROLES.find((r) => !signed.has(r));
}

/**
 * Signing the latest revision as the signed-in user, in a role, with the passphrase given again.
 * The store judges the order and the three-people rule; its refusals come back beside the
 * field they are about.
 */
export function SignForm({ check, user, form }: { check: CheckRecord; user: Actor; form: SignFormState }) {
  const latest = check.latestRevision;
  const next = nextRole(check);
  const e = form.errors.fields;
  if (!next) {
    return (
      <section class="panel-box" aria-labelledby="h-sign" id="sign">
        <h2 id="h-sign">Sign-off</h2>
        <p>Revision {latest} is approved. A change to the check is saved as a new revision, which starts unsigned.</p>
      </section>
    );
  }
  return (
    <section class="panel-box" aria-labelledby="h-sign" id="sign">
      <h2 id="h-sign">Sign revision {latest}</h2>
      <form method="post" action={signPath(check.id)} class="sign-form">
        <FormProblems messages={form.errors.general} />
        <input type="hidden" name="revision" value={String(latest)} />
        <p class="field-note">
          Signing as <strong id="signing-as">{user.name}</strong>.
        </p>
        <p class="field-note">
          Revision <strong>{latest}</strong>, the latest — only the latest revision can be signed.
        </p>
        <p class="field-error" id="sign-revision-error">
          {(e.get("revision") ?? []).join("; ")}
        </p>
        <div class="grid">
          <SelectField
            id="sign-role"
            name="role"
            label="Sign as"
            value={form.role ?? next}
            options={ROLES.map((r) => ({ value: r, label: ROLE_WORDS[r] }))}
            hint={`In order: ${ROLES.join(" → ")}. Next: ${next}.`}
            errors={e.get("role")}
          />
          <PassphraseField
            id="sign-passphrase"
            name="passphrase"
            label={`${user.name}'s passphrase, again`}
            autocomplete="current-password"
            hint="Preparer, checker and approver are three different people, each signed in as themselves."
            errors={e.get("passphrase")}
          />
        </div>
        <div class="actions">
          <button type="submit" class="primary">
            Sign revision {latest}
          </button>
        </div>
      </form>
    </section>
  );
}
