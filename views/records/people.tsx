/**
 * @module views/records/people
 * The people of the records, the signed-in user's own passphrase, and (for an admin) adding,
 * disabling and resetting people and trusting another office's key. Passphrase fields always
 * come back empty.
 * Handed the signed-in user, the people, the forms' typed values and errors, the records' own public
 * key and the trusted ones, as the route (src/web/records/pages.tsx) reads them from the store. The
 * names of each form's fields are exported so the route can put a refusal beside the right one; the
 * roles and the passphrase's least length are the store's.
 */
import {
  MIN_PASSPHRASE_LENGTH,
  USER_ROLES,
  type Actor,
  type PublicKeyInfo,
  type TrustedKey,
  type UserRecord,
} from "../../src/store/index.ts";
import type { FormErrors } from "../../src/present/formErrors.ts";
import { FormProblems, PassphraseField, SelectField, TextField } from "./fields.tsx";
import { PEOPLE_PATH } from "./paths.ts";
import { When } from "./state.tsx";

export const ADD_USER_FIELDS = ["name", "role", "passphrase", "again"] as const;
export const OWN_PASSPHRASE_FIELDS = ["current", "passphrase", "again"] as const;
export const TRUST_FIELDS = ["publicKeyPem", "label"] as const;

export interface PeopleForms {
  add: { name?: string; role?: string; errors: FormErrors };
  own: { errors: FormErrors };
  trust: { label?: string; publicKeyPem?: string; errors: FormErrors };
}

const ROLE_MEANS: Record<(typeof USER_ROLES)[number], string> = {
  admin: "manages people and trusted keys; may also save and sign",
  engineer: "saves, revises and signs checks",
};

export function PeopleView({
  user,
  users,
  forms,
  ownKey,
  trusted,
}: {
  user: Actor;
  users: readonly UserRecord[];
  forms: PeopleForms;
  ownKey: PublicKeyInfo;
  trusted: readonly TrustedKey[];
}) {
  const admin = user.role === "admin";
  return (
    <>
      <h1>People</h1>
      <p class="lead">
        Each person signs in with their own name and passphrase, and gives the passphrase again to sign. Passphrases are kept only as salted
        scrypt hashes: no one, including Hoopwise, can read one back. A forgotten passphrase is reset by an admin.
      </p>
      <section class="panel-box" aria-labelledby="h-people">
        <h2 id="h-people">Registered</h2>
        <ul class="people" id="people">
          {users.map((u) => (
            <li data-user={u.id}>
              <strong>{u.name}</strong>{" "}
              <span class="hint">
                {u.role} — {ROLE_MEANS[u.role]}
              </span>
              {u.disabled ? <strong class="field-error"> disabled</strong> : null}{" "}
              <span class="hint">
                since <When at={u.createdAt} />
              </span>
              {admin && u.id !== user.id ? (
                <span class="row-actions">
                  <form method="post" action={`${PEOPLE_PATH}/${u.id}/${u.disabled ? "enable" : "disable"}`} class="inline">
                    <button type="submit">{u.disabled ? "Enable" : "Disable"}</button>
                  </form>
                  <form method="post" action={`${PEOPLE_PATH}/${u.id}/clear-delay`} class="inline">
                    <button type="submit">Clear guessing delay</button>
                  </form>
                  <form method="post" action={`${PEOPLE_PATH}/${u.id}/reset`} class="inline">
                    <label for={`reset-${u.id}`}>New passphrase</label>{" "}
                    <input type="password" id={`reset-${u.id}`} name="passphrase" autocomplete="new-password" required />{" "}
                    <button type="submit">Reset passphrase</button>
                  </form>
                </span>
              ) : null}
            </li>
          ))}
        </ul>
      </section>

      <section class="panel-box" aria-labelledby="h-own">
        <h2 id="h-own">Your passphrase</h2>
        <form method="post" action={`${PEOPLE_PATH}/me/passphrase`}>
          <FormProblems messages={forms.own.errors.general} />
          <div class="grid">
            <PassphraseField
              id="own-current"
              name="current"
              label="Current passphrase"
              autocomplete="current-password"
              errors={forms.own.errors.fields.get("current")}
            />
            <PassphraseField
              id="own-passphrase"
              name="passphrase"
              label="New passphrase"
              autocomplete="new-password"
              minLength={MIN_PASSPHRASE_LENGTH}
              hint={`At least ${MIN_PASSPHRASE_LENGTH} characters and hard to guess; a few unrelated words work well.`}
              errors={forms.own.errors.fields.get("passphrase")}
            />
            <PassphraseField
              id="own-again"
              name="again"
              label="New passphrase again"
              autocomplete="new-password"
              errors={forms.own.errors.fields.get("again")}
            />
          </div>
          <div class="actions">
            <button type="submit">Change my passphrase</button>
          </div>
        </form>
      </section>

      {admin ? (
        <section class="panel-box" aria-labelledby="h-add">
          <h2 id="h-add">Add someone</h2>
          <form method="post" action={PEOPLE_PATH} class="signer-form">
            <FormProblems messages={forms.add.errors.general} />
            <div class="grid">
              <TextField
                id="user-name"
                name="name"
                label="Name as it is printed on sheets"
                value={forms.add.name}
                autocomplete="off"
                errors={forms.add.errors.fields.get("name")}
              />
              <SelectField
                id="user-role"
                name="role"
                label="Role"
                value={forms.add.role ?? "engineer"}
                options={USER_ROLES.map((r) => ({ value: r, label: `${r} — ${ROLE_MEANS[r]}` }))}
                errors={forms.add.errors.fields.get("role")}
              />
              <PassphraseField
                id="user-passphrase"
                name="passphrase"
                label="Passphrase"
                autocomplete="new-password"
                minLength={MIN_PASSPHRASE_LENGTH}
                hint={`At least ${MIN_PASSPHRASE_LENGTH} characters and hard to guess; the person changes it after signing in.`}
                errors={forms.add.errors.fields.get("passphrase")}
              />
              <PassphraseField
                id="user-again"
                name="again"
                label="The passphrase again"
                autocomplete="new-password"
                errors={forms.add.errors.fields.get("again")}
              />
            </div>
            <div class="actions">
              <button type="submit" class="primary">
                Add
              </button>
            </div>
          </form>
        </section>
      ) : null}

      <section class="panel-box" aria-labelledby="h-keys">
        <h2 id="h-keys">Signing keys</h2>
        <p>
          These records sign every sign-off and export with an Ed25519 key, fingerprint <code id="own-key">{ownKey.fingerprint}</code>. Its
          public half is served at <a href="/api/v1/keys">/api/v1/keys</a>; give it to whoever verifies sheets or imports exports.
        </p>
        <pre class="mono">{ownKey.publicKeyPem}</pre>
        <h3>Trusted for imports</h3>
        {trusted.length === 0 ? (
          <p class="empty">No other key is trusted: imported checks arrive unsigned.</p>
        ) : (
          <ul id="trusted">
            {trusted.map((k) => (
              <li>
                <strong>{k.label}</strong> <code>{k.fingerprint}</code>, since <When at={k.trustedAt} />
              </li>
            ))}
          </ul>
        )}
        {admin ? (
          <form method="post" action={`${PEOPLE_PATH}/trusted-keys`}>
            <FormProblems messages={forms.trust.errors.general} />
            <TextField
              id="trust-label"
              name="label"
              label="Whose key (e.g. the other office's records)"
              value={forms.trust.label}
              errors={forms.trust.errors.fields.get("label")}
            />
            <div class="field">
              <label for="trust-pem">Public key (PEM)</label>
              <textarea id="trust-pem" name="publicKeyPem" rows={5} cols={70} aria-describedby="trust-pem-error">
                {forms.trust.publicKeyPem ?? ""}
              </textarea>
              <p class="field-error" id="trust-pem-error">
                {(forms.trust.errors.fields.get("publicKeyPem") ?? []).join("; ")}
              </p>
            </div>
            <p class="hint">Trust a key only after comparing its fingerprint with its owner by another channel (phone, paper).</p>
            <div class="actions">
              <button type="submit">Trust this key</button>
            </div>
          </form>
        ) : null}
      </section>
    </>
  );
}
