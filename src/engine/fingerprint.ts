import { createHash } from "node:crypto";
import { canonicalJson } from "../schema/canonical.ts";
import { ENGINE_VERSION } from "./version.ts";

/**
 * The fingerprint of a check: it ties a sheet or a saved revision to both its canonical input and
 * the engine that worked it, so new numbers from a new engine never verify silently against old ones.
 */
/** SHA-256 (hex) of the canonical input JSON followed by a newline and the engine version. */
export function fingerprint(input: unknown, engineVersion: string = ENGINE_VERSION): string {
  return createHash("sha256")
    .update(canonicalJson(input) + "\n" + engineVersion)
    .digest("hex");
}
