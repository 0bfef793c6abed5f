/** The check format: the zod schema, its units, its errors document and canonical JSON. Imports zod only. */
export * from "./check.ts";
export { canonicalJson } from "./canonical.ts";
export { toFieldErrors, type FieldError } from "./errors.ts";
