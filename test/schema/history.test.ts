import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseCheck, resolveCheck } from "../../src/engine/input.ts";
import { checkSchema } from "../../src/schema/index.ts";
import { toFieldErrors } from "../../src/schema/errors.ts";

const EXAMPLE = JSON.parse(readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8"));

/** What parseCheck did before the one-loop history path: the schema over every point, then the cross-field rules. */
function plainParse(json: unknown) {
  const parsed = checkSchema.safeParse(json);
  if (!parsed.success) return { ok: false as const, errors: toFieldErrors(parsed.error.issues, json, "") };
  return resolveCheck(parsed.data);
}

const point = fc.oneof(
  { weight: 20, arbitrary: fc.double({ min: -0.2, max: 0.2, noNaN: true }) },
  {
    weight: 1,
    arbitrary: fc.constantFrom<unknown>(Number.NaN, Infinity, -1e5, 2e4, "0.05", null, true, [0.1], { p: 1 }),
  },
);

describe("a pressure history validated in one loop", () => {
  it("gives what the schema over every point gives: the same parsed check, or the same errors (property)", { timeout: 60_000 }, () => {
    fc.assert(
      fc.property(fc.array(point, { minLength: 0, maxLength: 60 }), fc.boolean(), (history, withMin) => {
        const doc = { ...EXAMPLE, crack: undefined, pressure: { history_MPa: history, ...(withMin ? { min_MPa: 0 } : {}) } };
        expect(parseCheck(doc)).toEqual(plainParse(doc));
      }),
      { numRuns: 400 },
    );
  });

  it("keeps the very array it was given (no copy of a long history)", () => {
    const history = Array.from({ length: 30_000 }, (_, i) => 0.03 + 0.02 * Math.sin(i / 5));
    const out = parseCheck({ ...EXAMPLE, pressure: { history_MPa: history } });
    expect(out.ok).toBe(true);
    if (out.ok) {
      expect(out.value.pressure.history_MPa).toBe(history);
      expect(out.value.document.pressure.history_MPa).toBe(history);
    }
  });
});
