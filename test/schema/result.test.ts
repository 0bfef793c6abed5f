import { readFileSync } from "node:fs";
import { z } from "zod";
import { describe, expect, it } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import { checkDocument } from "../../src/engine/index.ts";
import { resultSchema } from "../../src/schema/result.ts";
import { PARTS, SPARSE } from "../fixtures/documents.ts";

const example = JSON.parse(readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8"));

const CASES: [string, unknown][] = [
  ["the format's example", example],
  ...DEMOS.map((d) => [`demo ${d.id}`, d.document] as [string, unknown]),
  ...SPARSE,
  ...PARTS,
];

describe("the result document has one definition", () => {
  it.each(CASES)("%s: its result, as sent in JSON, parses strictly against the result schema", (_name, doc) => {
    const out = checkDocument(doc);
    if (!out.ok) throw new Error(JSON.stringify(out.errors));
    const sent = JSON.parse(JSON.stringify(out.result));
    const parsed = resultSchema.safeParse(sent);
    expect(parsed.success, parsed.success ? "" : z.prettifyError(parsed.error)).toBe(true);
  });

  it("the cases reach every optional part of the result", () => {
    const seen = new Set<string>();
    for (const [, doc] of CASES) {
      const out = checkDocument(doc);
      if (out.ok) for (const k of Object.keys(out.result)) seen.add(k);
    }
    const optional = Object.entries(resultSchema.shape)
      .filter(([, s]) => s.safeParse(undefined).success)
      .map(([k]) => k);
    expect(optional.filter((k) => !seen.has(k))).toEqual([]);
  });

  it("refuses a key the schema does not know, so a new one cannot slip past it", () => {
    const out = checkDocument(DEMOS[1].document);
    if (!out.ok) throw new Error("the receiver demo must run");
    const sent = { ...JSON.parse(JSON.stringify(out.result)), extra: 1 };
    expect(resultSchema.safeParse(sent).success).toBe(false);
  });
});
