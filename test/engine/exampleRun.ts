/** The format's example document, and a runner that throws on input errors: shared by the engine tests. */
import { readFileSync } from "node:fs";
import { checkDocument, type CheckResult } from "../../src/engine/index.ts";

export const example = JSON.parse(readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8"));

export function run(doc: unknown): CheckResult {
  const out = checkDocument(doc);
  if (!out.ok) throw new Error(JSON.stringify(out.errors));
  return out.result;
}

/** The example without its crack and evidence parts, with `extra` laid over it. */
export function base(extra: Record<string, unknown> = {}) {
  const { crack: _c, evidence: _e, ...doc } = structuredClone(example);
  return { ...doc, ...extra };
}
