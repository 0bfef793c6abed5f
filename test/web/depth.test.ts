import { describe, expect, it } from "vitest";
import { MAX_JSON_DEPTH, tooDeepAt } from "../../src/schema/depth.ts";

/** `depth` arrays, one inside the next, around a number; built in a loop so no recursion is needed. */
function nested(depth: number): unknown {
  let x: unknown = 1;
  for (let i = 0; i < depth; i++) x = [x];
  return x;
}

describe("tooDeepAt", () => {
  it("passes a check document and anything nested up to the limit", () => {
    expect(tooDeepAt({ shell: { radius_mm: 1 }, material: { coupons: [{ amplitude_MPa: 1 }] } })).toBeUndefined();
    expect(tooDeepAt(nested(MAX_JSON_DEPTH))).toBeUndefined();
    expect(tooDeepAt("text")).toBeUndefined();
    expect(tooDeepAt(null)).toBeUndefined();
  });

  it("names the path where the nesting passes the limit", () => {
    expect(tooDeepAt(nested(MAX_JSON_DEPTH + 1))).toBe(Array(MAX_JSON_DEPTH).fill("0").join("."));
    expect(tooDeepAt({ title: { a: { b: 1 } } }, 2)).toBe("title.a");
    expect(tooDeepAt([[1]], 1)).toBe("0");
    expect(tooDeepAt({ a: 1 }, 0)).toBe("(document)");
  });

  it("checks a million levels without overflowing the stack", () => {
    expect(tooDeepAt(nested(1_000_000))).toMatch(/^0(\.0){63}$/);
  });
});
