import type { z } from "zod";
import { checkSchema } from "./check.ts";

/**
 * Defaults as the schema states them, read from the zod definitions so no face re-types one:
 * the form fills a choice the document leaves out with the value the engine will use, and
 * placeholders and sheet rows print the same number. A path inside a union is looked up in the
 * first option that has it.
 */

// zod 4 keeps each schema's definition on `_zod.def`; only the few wrapper kinds matter here.
type Def = { type: string; innerType?: Node; in?: Node; shape?: Record<string, Node>; options?: Node[]; defaultValue?: unknown };
type Node = { _zod: { def: Def } };

function unwrap(n: Node): { node: Node; fallback?: { value: unknown } } {
  let node = n;
  let fallback: { value: unknown } | undefined;
  for (;;) {
    const d = node._zod.def;
    if (d.type === "default" || d.type === "prefault") {
      fallback ??= { value: typeof d.defaultValue === "function" ? (d.defaultValue as () => unknown)() : d.defaultValue };
      node = d.innerType as Node;
    } else if ((d.type === "optional" || d.type === "nullable" || d.type === "readonly") && d.innerType) node = d.innerType;
    else if (d.type === "pipe" && d.in) node = d.in;
    else return { node, fallback };
  }
}

function child(n: Node, key: string): Node | undefined {
  const d = n._zod.def;
  if (d.shape && key in d.shape) return d.shape[key];
  for (const option of d.options ?? []) {
    const found = child(unwrap(option).node, key);
    if (found) return found;
  }
  return undefined;
}

/** The schema node at a dot path of the check document, or undefined where the format has no such key. */
export function schemaAt(path: string, root: z.ZodType = checkSchema): z.ZodType | undefined {
  let node: Node | undefined = root as unknown as Node;
  for (const key of path.split(".")) {
    if (!node) return undefined;
    node = child(unwrap(node).node, key);
  }
  return node as unknown as z.ZodType | undefined;
}

/** The value the schema fills in at `path` when a document leaves it out; undefined where it fills none. */
export function defaultAt(path: string): unknown {
  const node = schemaAt(path);
  return node ? unwrap(node as unknown as Node).fallback?.value : undefined;
}
