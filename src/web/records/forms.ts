import type { Context } from "hono";
import type { FieldError } from "../../engine/index.ts";

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

/**
 * The text fields of a posted form. A body that is not a form reads as an empty one, so each
 * field then says what it is missing rather than the server failing.
 */
export async function postedFields(c: Context): Promise<Record<string, string>> {
  try {
    const body = await c.req.parseBody();
    return Object.fromEntries(Object.entries(body).filter((e): e is [string, string] => typeof e[1] === "string"));
  } catch {
    return {};
  }
}
