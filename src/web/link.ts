import { deflateRawSync, inflateRawSync } from "node:zlib";
import { MAX_JSON_DEPTH, tooDeepAt } from "../schema/depth.ts";

/**
 * A link that reproduces a check: the check JSON, deflated (raw DEFLATE, RFC 1951) and written
 * in base64url (RFC 4648 §5) so it fits a query string without escaping. A typical check
 * shrinks to a few hundred characters.
 */

/** Longest encoded text accepted from a URL; browsers and proxies start refusing URLs past ~64 KiB. */
export const MAX_LINK_CHARS = 60_000;
/** Largest JSON a link may inflate to, so a small hostile link cannot expand into a huge one. */
const MAX_INFLATED_BYTES = 4 * 1024 * 1024;

export function encodeCheck(doc: unknown): string {
  return deflateRawSync(Buffer.from(JSON.stringify(doc), "utf8"), { level: 6 }).toString("base64url");
}

export type Decoded = { ok: true; value: unknown } | { ok: false; message: string };

/** Never throws: a damaged or truncated link gives a message a user can act on. */
export function decodeCheck(encoded: string): Decoded {
  if (encoded.length > MAX_LINK_CHARS) return { ok: false, message: `the link's check is longer than ${MAX_LINK_CHARS} characters` };
  if (!/^[A-Za-z0-9_-]*$/.test(encoded))
    return { ok: false, message: "the link's check holds characters a check link never has; was it copied in full?" };
  let text: string;
  try {
    text = inflateRawSync(Buffer.from(encoded, "base64url"), { maxOutputLength: MAX_INFLATED_BYTES }).toString("utf8");
  } catch {
    return { ok: false, message: "the link's check could not be unpacked; was it copied in full?" };
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return { ok: false, message: "the link's check is not valid JSON; was it copied in full?" };
  }
  if (tooDeepAt(value) !== undefined)
    return { ok: false, message: `the link's check nests deeper than ${MAX_JSON_DEPTH} levels, which no check does` };
  return { ok: true, value };
}
