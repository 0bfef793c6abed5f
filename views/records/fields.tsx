import type { Child } from "hono/jsx";

/**
 * Controls of the records forms. Each has its label, an optional hint and an error slot named
 * by aria-describedby, so a refusal is read out with the field it is about. A passphrase field
 * never takes a value: whatever was typed is not sent back.
 */
interface Common {
  id: string;
  name: string;
  label: Child;
  hint?: Child;
  errors?: readonly string[];
}

function describedBy({ id, hint }: Common): string {
  return hint ? `${id}-error ${id}-hint` : `${id}-error`;
}

function After(props: Common) {
  return (
    <>
      {props.hint ? (
        <p class="hint" id={`${props.id}-hint`}>
          {props.hint}
        </p>
      ) : null}
      <p class="field-error" id={`${props.id}-error`}>
        {(props.errors ?? []).join("; ")}
      </p>
    </>
  );
}

export function TextField(props: Common & { value?: string; autocomplete?: string }) {
  return (
    <div class="field">
      <label for={props.id}>{props.label}</label>
      <input
        type="text"
        id={props.id}
        name={props.name}
        value={props.value ?? ""}
        autocomplete={props.autocomplete ?? "off"}
        aria-describedby={describedBy(props)}
        aria-invalid={props.errors?.length ? "true" : undefined}
      />
      <After {...props} />
    </div>
  );
}

export function PassphraseField(props: Common & { autocomplete: "current-password" | "new-password"; minLength?: number }) {
  return (
    <div class="field">
      <label for={props.id}>{props.label}</label>
      <input
        type="password"
        id={props.id}
        name={props.name}
        autocomplete={props.autocomplete}
        minlength={props.minLength}
        required
        aria-describedby={describedBy(props)}
        aria-invalid={props.errors?.length ? "true" : undefined}
      />
      <After {...props} />
    </div>
  );
}

export function SelectField(props: Common & { value?: string; options: readonly { value: string; label: string }[] }) {
  return (
    <div class="field">
      <label for={props.id}>{props.label}</label>
      <select
        id={props.id}
        name={props.name}
        aria-describedby={describedBy(props)}
        aria-invalid={props.errors?.length ? "true" : undefined}
      >
        {props.options.map((o) => (
          <option value={o.value} selected={o.value === props.value}>
            {o.label}
          </option>
        ))}
      </select>
      <After {...props} />
    </div>
  );
}

/** Problems that belong to no one field of the form. */
export function FormProblems({ messages }: { messages: readonly string[] }) {
  if (messages.length === 0) return null;
  return (
    <ul class="form-problems" role="alert">
      {messages.map((m) => (
        <li>{m}</li>
      ))}
    </ul>
  );
}
