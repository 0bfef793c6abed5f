import { parseCheck } from "../engine/input.ts";
import type { Validator } from "./context.ts";

/**
 * The store's validator for real checks: parseCheck, keeping the parsed
 * document (defaults filled in, a library material still named by its id).
 * That document is what the engine fingerprints, so a saved revision's
 * fingerprint is the one its sheet prints; and a library value revised later
 * does not change what an old revision meant.
 */
export const validateCheckDocument: Validator = (json) => {
  const r = parseCheck(json);
  return r.ok ? { ok: true, value: r.value.document } : r;
};
