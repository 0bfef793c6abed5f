import { parseCheck } from "./input.ts";
import { runCheck } from "./check.ts";
import { InputError, type FieldError } from "./errors.ts";
import type { CheckResult } from "./result.ts";

export { runCheck } from "./check.ts";
export { InputError, type FieldError } from "./errors.ts";
export type { CheckResult, CriterionRow, VerdictRow, SpectrumCycle } from "./result.ts";
export type { Step } from "./step.ts";
export { ENGINE_VERSION } from "./version.ts";
export { fingerprint } from "./fingerprint.ts";
export { parseCheck, type ParseResult, type ResolvedCheck, type ResolvedMaterial } from "./input.ts";
export { VERDICT_WORDS } from "./verdict.ts";
export type { Verdict } from "./result.ts";

export type Outcome = { ok: true; result: CheckResult } | { ok: false; errors: FieldError[] };

/** Parse, validate and run a check document; the one entry point for every face. Never throws for bad input. */
export function checkDocument(json: unknown): Outcome {
  const parsed = parseCheck(json);
  if (!parsed.ok) return parsed;
  try {
    return { ok: true, result: runCheck(parsed.value) };
  } catch (err) {
    if (err instanceof InputError) return { ok: false, errors: [{ path: err.path, message: err.message }] };
    throw err;
  }
}
