import { createHash } from "node:crypto";
import { ENGINE_VERSION } from "../engine/version.ts";

/**
 * Canonical JSON: object keys sorted at every depth, no whitespace, numbers as JavaScript prints them.
 * Two inputs that mean the same check give the same text, so the same fingerprint.
 */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(sortKeys(value));
}

function sortKeys(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(sortKeys);
  if (v !== null && typeof v === "object") {
    const out: Record<string, unknown> = {};
    for (const k of Object.keys(v as object).sort()) {
      const x = (v as Record<string, unknown>)[k];
      if (x !== undefined) out[k] = sortKeys(x);
    }
    return out;
  }
  return v;
}

/** SHA-256 (hex) of the canonical input JSON followed by a newline and the engine version. */
export function fingerprint(input: unknown, engineVersion: string = ENGINE_VERSION): string {
  return createHash("sha256")
    .update(canonicalJson(input) + "\n" + engineVersion)
    .digest("hex");
}
