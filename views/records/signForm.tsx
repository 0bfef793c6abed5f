import { ROLES, type CheckRecord, type Role, type SignerRecord } from "../../src/store/index.ts";
import type { FormErrors } from "../../src/web/recordsForms.ts";
import { FormProblems, PassphraseField, SelectField } from "./fields.tsx";
import { SIGNERS_PATH, signPath } from "./paths.ts";
import { ROLE_WORDS } from "./state.tsx";

/** What the sign form shows again after a refusal: the choices made, never the passphrase. */
export interface SignFormState {
  role?: string;
  name?: string;
  errors: FormErrors;
}

export const SIGN_FIELDS = ["revision", "role", "name", "passphrase"] as const;

/** The role the latest revision needs next, or none once it is approved. */
export function nextRole(check: CheckRecord): Role | undefined {
  const latest = check.revisions[check.revisions.length - 1];
  const signed = new Set(latest?.signoffs.map((s) => s.role));
  return ROLES.find((r) => !signed.has(r));
}

/**
 * Signing the latest revision: who signs, in which role, proved by the signer's passphrase.
 * The store judges the order and the four-eyes rule; its refusals come back beside the field
 * they are about.
 */
export function SignForm({ check, signers, form }: { check: CheckRecord; signers: readonly SignerRecord[]; form: SignFormState }) {
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
      {signers.length === 0 ? (
        <p>
          No one is registered to sign yet. <a href={SIGNERS_PATH}>Register the people who sign</a>, then come back.
        </p>
      ) : (
        <form method="post" action={signPath(check.id)} class="sign-form">
          <FormProblems messages={form.errors.general} />
          <input type="hidden" name="revision" value={String(latest)} />
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
            <SelectField
              id="sign-name"
              name="name"
              label="Name"
              value={form.name}
              options={signers.map((s) => ({ value: s.name, label: s.name }))}
              hint="The checker must be someone other than the preparer."
              errors={e.get("name")}
            />
            <PassphraseField
              id="sign-passphrase"
              name="passphrase"
              label="Passphrase"
              autocomplete="current-password"
              errors={e.get("passphrase")}
            />
          </div>
          <div class="actions">
            <button type="submit" class="primary">
              Sign revision {latest}
            </button>
            <a href={SIGNERS_PATH}>Register someone new</a>
          </div>
        </form>
      )}
    </section>
  );
}
