import { createHash } from "node:crypto";
import { writeCanonical } from "../schema/canonical.ts";
import { ENGINE_VERSION } from "./version.ts";

/**
 * The fingerprint of a check: it ties a sheet or a saved revision to both its canonical input and
 * the engine that worked it, so new numbers from a new engine never verify silently against old ones.
 */
/**
 * SHA-256 (hex) of the canonical input JSON followed by a newline and the engine version. The
 * canonical text is fed to the hash in pieces, which digests the same bytes as the joined text
 * without building a second copy of a long history.
 */
export function fingerprint(input: unknown, engineVersion: string = ENGINE_VERSION): string {
  const hash = createHash("sha256");
  writeCanonical(input, (piece) => hash.update(piece));
  return hash.update(`\n${engineVersion}`).digest("hex");
}
