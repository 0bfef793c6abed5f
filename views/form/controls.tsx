import type { Child } from "hono/jsx";
import { errorId, fieldId, NUMBER_FIELDS, type NumberFieldName, shownDefault } from "./fields.ts";
import { unitLabel } from "../../src/schema/units.ts";
import type { FormState } from "./state.ts";

/**
 * Form controls. Every control has a label naming its unit, and an error slot that is always
 * present (empty when all is well) and linked with aria-describedby, so an error swapped in
 * later is read out with the field.
 */

export function ErrorSlot({ name, messages, oob }: { name: string; messages?: readonly string[]; oob?: boolean }) {
  return (
    <p class="field-error" id={errorId(name)} hx-swap-oob={oob ? "true" : undefined}>
      {(messages ?? []).join("; ")}
    </p>
  );
}

function describedBy(name: string, hint?: Child) {
  return hint ? `${errorId(name)} ${fieldId(name)}-hint` : errorId(name);
}

function Hint({ name, hint }: { name: string; hint?: Child }) {
  return hint ? (
    <p class="hint" id={`${fieldId(name)}-hint`}>
      {hint}
    </p>
  ) : null;
}

function LabelText({ label, unit }: { label: Child; unit?: string }) {
  return (
    <>
      {label}
      {unit ? <span class="unit"> ({unit})</span> : null}
    </>
  );
}

interface FieldProps {
  s: FormState;
  label: Child;
  hint?: Child;
  placeholder?: string;
  /** Wide fields span the whole row of the grid. */
  wide?: boolean;
}

/** A number in the chosen units. Plain text with a decimal keypad: a browser's number box would drop what it cannot read, and the user would see "is required" instead of what is wrong. */
/** A number field; its label is the format's own words for the input unless the form's context asks for other words. */
export function NumberInput({
  s,
  name,
  label = NUMBER_FIELDS[name].label,
  hint,
  placeholder,
  unit,
}: Omit<FieldProps, "label"> & { label?: Child; name: NumberFieldName; unit?: string }) {
  const errs = s.errors.get(name);
  const shownUnit = unit ?? unitLabel(NUMBER_FIELDS[name].quantity, s.units);
  return (
    <div class="field">
      <label for={fieldId(name)}>
        <LabelText label={label} unit={shownUnit || undefined} />
      </label>
      <input
        type="text"
        inputmode="decimal"
        autocomplete="off"
        spellcheck={false}
        id={fieldId(name)}
        name={name}
        value={s.values[name] ?? ""}
        placeholder={placeholder}
        aria-describedby={describedBy(name, hint)}
        aria-invalid={errs ? "true" : undefined}
      />
      <Hint name={name} hint={hint} />
      <ErrorSlot name={name} messages={errs} />
    </div>
  );
}

export function TextInput({ s, name, label, hint, placeholder, wide, multiline }: FieldProps & { name: string; multiline?: boolean }) {
  const errs = s.errors.get(name);
  const common = {
    id: fieldId(name),
    name,
    placeholder,
    "aria-describedby": describedBy(name, hint),
    "aria-invalid": errs ? "true" : undefined,
  };
  return (
    <div class={wide ? "field wide" : "field"}>
      <label for={fieldId(name)}>{label}</label>
      {multiline ? (
        <textarea {...common} rows={2}>
          {s.values[name] ?? ""}
        </textarea>
      ) : (
        <input type="text" {...common} value={s.values[name] ?? ""} />
      )}
      <Hint name={name} hint={hint} />
      <ErrorSlot name={name} messages={errs} />
    </div>
  );
}

export interface Option {
  value: string;
  label: string;
}

export function Select({
  s,
  name,
  label,
  hint,
  options,
  fallback,
}: FieldProps & {
  name: string;
  options: readonly Option[];
  /** What shows with no value and no schema default (a blank choice, a first pick); a schema default is never typed here. */
  fallback?: string;
}) {
  const errs = s.errors.get(name);
  const chosen = s.values[name] ?? fallback ?? shownDefault(name) ?? options[0]?.value;
  return (
    <div class="field">
      <label for={fieldId(name)}>{label}</label>
      <select id={fieldId(name)} name={name} aria-describedby={describedBy(name, hint)} aria-invalid={errs ? "true" : undefined}>
        {options.map((o) => (
          <option value={o.value} selected={o.value === chosen}>
            {o.label}
          </option>
        ))}
        {chosen !== undefined && !options.some((o) => o.value === chosen) ? (
          <option value={chosen} selected>
            {chosen}
          </option>
        ) : null}
      </select>
      <Hint name={name} hint={hint} />
      <ErrorSlot name={name} messages={errs} />
    </div>
  );
}

/**
 * A choice between ways of giving something (pressure as a cycle, from altitudes, ...). Each way's
 * fields sit in a panel after the choices; the stylesheet shows only the chosen panel, and a
 * browser without that support simply shows them all, every one still labelled.
 */
export function Choice({
  s,
  name,
  legend,
  options,
  fallback,
}: {
  s: FormState;
  name: string;
  legend: Child;
  options: readonly Option[];
  fallback: string;
}) {
  const chosen = s.values[name] ?? fallback;
  const errs = s.errors.get(name);
  return (
    <fieldset class="choice" aria-describedby={errorId(name)}>
      <legend>{legend}</legend>
      {options.map((o) => (
        <label class="choice-option">
          <input type="radio" name={name} value={o.value} checked={o.value === chosen} id={`${fieldId(name)}-${o.value}`} />
          {o.label}
        </label>
      ))}
      <ErrorSlot name={name} messages={errs} />
    </fieldset>
  );
}

/** The fields of one way of a Choice; `data-when` ties it to its option for the stylesheet. */
export function Panel({ name, value, children }: { name: string; value: string; children: Child }) {
  return (
    <div class="panel" data-choice={name} data-when={value}>
      {children}
    </div>
  );
}

/** A switch that brings an optional section into the check; its fields show only while it is on. */
export function Toggle({ s, name, label }: { s: FormState; name: string; label: Child }) {
  return (
    <div class="toggle">
      <label>
        <input type="checkbox" name={name} value="on" id={fieldId(name)} checked={Boolean(s.values[name])} />
        {label}
      </label>
    </div>
  );
}
