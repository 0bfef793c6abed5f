import { createHash } from "node:crypto";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { fingerprint } from "../../src/engine/fingerprint.ts";
import { canonicalJson, canonicalJsonInPieces } from "../../src/schema/canonical.ts";

/** The definition of the fingerprint, worked the plain way: SHA-256 of the whole canonical text, a newline, the engine version. */
const plainFingerprint = (v: unknown, version: string) =>
  createHash("sha256")
    .update(`${canonicalJson(v)}\n${version}`)
    .digest("hex");

describe("canonical JSON written in pieces", () => {
  it("is the canonical text to the byte, for any JSON value (property)", { timeout: 60_000 }, () => {
    fc.assert(
      fc.property(fc.jsonValue(), (v) => {
        expect(canonicalJsonInPieces(v)).toBe(canonicalJson(v));
      }),
      { numRuns: 500 },
    );
  });

  it("writes a long flat history across its pieces exactly as in one text, with undefined members and keys as JSON.stringify treats them", {
    timeout: 60_000,
  }, () => {
    fc.assert(
      fc.property(fc.array(fc.double({ noDefaultInfinity: false }), { minLength: 8000, maxLength: 20000 }), (xs) => {
        const doc = { pressure: { history_MPa: xs }, b: undefined, a: [1, undefined, "x"] };
        expect(canonicalJsonInPieces(doc)).toBe(canonicalJson(doc));
      }),
      { numRuns: 10 },
    );
  });

  it("gives the fingerprint its definition gives", { timeout: 60_000 }, () => {
    fc.assert(
      fc.property(fc.jsonValue(), fc.string(), (v, version) => {
        expect(fingerprint(v, version)).toBe(plainFingerprint(v, version));
      }),
      { numRuns: 200 },
    );
  });
});
