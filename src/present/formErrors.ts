/**
 * @module present/formErrors
 * A records form's problems sorted the way the page shows them: beside the field they belong to,
 * or above the form. The routes make them; the views draw them.
 */
import type { FieldError } from "../engine/index.ts";

/** A records form's problems: those that belong beside one of its fields, and the rest. */
export interface FormErrors {
  fields: Map<string, string[]>;
  general: string[];
}

export const NO_ERRORS: FormErrors = { fields: new Map(), general: [] };

/** Sort the store's refusals beside the form's own fields; a refusal about anything else is listed above the form. */
export function formErrors(errors: readonly FieldError[], fieldNames: readonly string[]): FormErrors {
  const fields = new Map<string, string[]>();
  const general: string[] = [];
  for (const e of errors) {
    if (fieldNames.includes(e.path)) fields.set(e.path, [...(fields.get(e.path) ?? []), e.message]);
    else general.push(e.path && e.path !== "(document)" ? `${e.path}: ${e.message}` : e.message);
  }
  return { fields, general };
}
