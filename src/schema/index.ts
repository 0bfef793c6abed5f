import type { FieldError } from "../engine/errors.ts";
import { checkSchema } from "./check.ts";
import { toFieldErrors } from "./errors.ts";
import { resolveCheck, type ResolvedCheck } from "./resolve.ts";

export * from "./check.ts";
export type { ResolvedCheck, ResolvedMaterial } from "./resolve.ts";
export { canonicalJson, fingerprint } from "./canonical.ts";

export type CheckInput = ResolvedCheck;
export type ParseResult = { ok: true; value: ResolvedCheck } | { ok: false; errors: FieldError[] };

/** Validate a check document: schema first, then the cross-field rules. Never throws. */
export function parseCheck(json: unknown, pathPrefix = ""): ParseResult {
  const parsed = checkSchema.safeParse(json);
  if (!parsed.success) return { ok: false, errors: toFieldErrors(parsed.error.issues, json, pathPrefix) };
  const resolved = resolveCheck(parsed.data);
  if (!resolved.ok && pathPrefix) return { ok: false, errors: resolved.errors.map((e) => ({ ...e, path: `${pathPrefix}.${e.path}` })) };
  return resolved;
}
