import { MIN_PASSPHRASE_LENGTH, type SignerRecord } from "../../src/store/index.ts";
import type { FormErrors } from "../../src/web/recordsForms.ts";
import { FormProblems, PassphraseField, TextField } from "./fields.tsx";
import { SIGNERS_PATH } from "./paths.ts";
import { When } from "./state.tsx";

export const SIGNER_FIELDS = ["name", "passphrase", "again"] as const;

/** The people who may sign, and the form to register one more. The passphrase fields always come back empty. */
export function SignersView({ signers, name, errors }: { signers: readonly SignerRecord[]; name?: string; errors: FormErrors }) {
  const e = errors.fields;
  return (
    <>
      <h1>People who sign</h1>
      <p class="lead">
        A sign-off needs the signer’s own passphrase. It is kept only as a salted hash: no one, including Hoopwise, can read it back. A
        forgotten passphrase cannot be recovered.
      </p>
      <section class="panel-box" aria-labelledby="h-registered">
        <h2 id="h-registered">Registered</h2>
        {signers.length === 0 ? (
          <p class="empty">No one yet.</p>
        ) : (
          <ul class="people" id="signers">
            {signers.map((s) => (
              <li>
                <strong>{s.name}</strong>{" "}
                <span class="hint">
                  since <When at={s.createdAt} />
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>
      <section class="panel-box" aria-labelledby="h-register">
        <h2 id="h-register">Register someone</h2>
        <form method="post" action={SIGNERS_PATH} class="signer-form">
          <FormProblems messages={errors.general} />
          <div class="grid">
            <TextField
              id="signer-name"
              name="name"
              label="Name as it is printed on sheets"
              value={name}
              autocomplete="name"
              errors={e.get("name")}
            />
            <PassphraseField
              id="signer-passphrase"
              name="passphrase"
              label="Passphrase"
              autocomplete="new-password"
              minLength={MIN_PASSPHRASE_LENGTH}
              hint={`At least ${MIN_PASSPHRASE_LENGTH} characters; a few unrelated words work well.`}
              errors={e.get("passphrase")}
            />
            <PassphraseField
              id="signer-again"
              name="again"
              label="The passphrase again"
              autocomplete="new-password"
              errors={e.get("again")}
            />
          </div>
          <div class="actions">
            <button type="submit" class="primary">
              Register
            </button>
          </div>
        </form>
      </section>
    </>
  );
}
