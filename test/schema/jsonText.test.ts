import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseJsonText } from "../../src/schema/jsonText.ts";

/** A JSON number token as people and loggers write them: signs, leading zeros after the point, exponents, long mantissas. */
const numberToken = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true }).map((x) => JSON.stringify(x)),
  fc
    .tuple(fc.boolean(), fc.nat(99999), fc.nat(999999), fc.integer({ min: -30, max: 30 }))
    .map(([neg, whole, frac, exp]) => `${neg ? "-" : ""}${whole}.${String(frac).padStart(6, "0")}e${exp}`),
  fc.tuple(fc.nat(9), fc.stringMatching(/^[0-9]{1,22}$/)).map(([w, f]) => `${w}.${f}`),
  fc.constantFrom("0", "-0", "1E5", "2e-7", "0.1", "123456789012345678", "5e-324", "1.7976931348623157e308"),
);
const space = fc.constantFrom("", " ", "\n", "\t ", "\r\n");
/** Long enough for the scanner to take it (64 KiB of text). */
const historyText = fc
  .array(fc.tuple(space, numberToken, space), { minLength: 9000, maxLength: 10000 })
  .map((xs) => xs.map(([a, n, b]) => `${a}${n}${b}`).join(","));

const docText = (history: string, tail = "") =>
  `{"title":"a \\"history_MPa\\":[1] in words","pressure":{"history_MPa":[${history}]}${tail},"shell":{"radius_mm":1500}}`;

describe("JSON text with a long history", () => {
  it("reads to exactly what JSON.parse reads, every number the same double (property)", { timeout: 120_000 }, () => {
    fc.assert(
      fc.property(historyText, (h) => {
        const text = docText(h);
        const mine = parseJsonText(text) as { pressure: { history_MPa: number[] } };
        const theirs = JSON.parse(text) as { pressure: { history_MPa: number[] } };
        expect(mine).toEqual(theirs);
        const a = mine.pressure.history_MPa;
        const b = theirs.pressure.history_MPa;
        for (let i = 0; i < b.length; i++) if (!Object.is(a[i], b[i])) expect(`${i}: ${a[i]}`).toBe(`${i}: ${b[i]}`);
      }),
      { numRuns: 8 },
    );
  });

  it("leaves anything it cannot read exactly to JSON.parse, errors included", () => {
    const long = Array.from({ length: 10_000 }, (_, i) => (i % 7) / 100).join(",");
    const cases = [
      docText(`${long},"0.5"`), // a string among the points
      docText(`${long},null`),
      docText(`${long},[1]`),
      docText(`${long},`), // trailing comma: not JSON
      docText(`${long},01`), // leading zero: not JSON
      docText(`${long},.5`),
      docText(long, ',"blocks":{"history_MPa":[]}'), // the key twice
      `{"shell":{"history_MPa":[${long}]},"pressure":{}}`, // the key somewhere else
      `${docText(long)} x`, // text after the document
    ];
    for (const text of cases) {
      let expected: unknown;
      let thrown: string | undefined;
      try {
        expected = JSON.parse(text);
      } catch (err) {
        thrown = (err as Error).message;
      }
      if (thrown) expect(() => parseJsonText(text)).toThrow(thrown);
      else expect(parseJsonText(text)).toEqual(expected);
    }
  });
});
