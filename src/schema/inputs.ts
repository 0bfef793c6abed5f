/**
 * @module schema/inputs
 * The registry of the check's number inputs, read off the schema itself: for every number the
 * format takes, its path, the words its error messages use, the label the faces show and the
 * quantity it measures. The words are the schema's metadata (check.ts); the quantity follows
 * the unit in the key's name (…_mm, …_MPa, …_m, …_MPaSqrtM), a pressure where the key sits under
 * `pressure`. The form, the sheet's input rows and the revision comparison read labels and
 * quantities from here instead of typing them again.
 */
import type { z } from "zod";
import { checkSchema, type Limit } from "./check.ts";
import type { Quantity } from "./units.ts";

export interface InputInfo {
  /** Dotted path in the check document; list items are written `[]` (`pressure.blocks[].max_MPa`). */
  path: string;
  /** The input in words, as the error messages say it: "the wall thickness". */
  words: string;
  /** The label a face shows: the words without the article, capitalised ("Wall thickness"). */
  label: string;
  /** The symbol the calculation uses for it ("t", "p_max"), where it has one. */
  symbol?: string;
  quantity: Quantity;
  /** The limits its error messages state, in SI, where the schema keeps them (src/schema/check.ts, limitMessage). */
  limits?: readonly Limit[];
}

type Node = z.core.$ZodType & { meta?: () => Record<string, unknown> | undefined };

function metaOf(node: Node): Record<string, unknown> | undefined {
  return typeof node.meta === "function" ? node.meta() : undefined;
}

/** The quantity of a key by the unit in its name (the format's convention). */
export function quantityOfKey(path: string): Quantity {
  const key = path.slice(path.lastIndexOf(".") + 1).replace(/\[\]$/, "");
  if (key.endsWith("_MPaSqrtM")) return "toughness";
  if (key.endsWith("_mm")) return "length";
  if (key.endsWith("_m")) return "altitude";
  if (key.endsWith("_MPa")) return path.startsWith("pressure.") ? "pressure" : "stress";
  return "plain";
}

/** "the wall thickness" → "Wall thickness"; "Kt" stays "Kt". */
export function labelOfWords(words: string): string {
  const bare = words.replace(/^the /, "");
  return bare.charAt(0).toUpperCase() + bare.slice(1);
}

interface Found {
  words?: string;
  symbol?: string;
  limits?: readonly Limit[];
}

function walk(node: Node, path: string, found: Found, out: Map<string, InputInfo>): void {
  const meta = metaOf(node);
  const f: Found = {
    words: typeof meta?.words === "string" ? meta.words : found.words,
    symbol: typeof meta?.symbol === "string" ? meta.symbol : found.symbol,
    limits: Array.isArray(meta?.limits) ? (meta.limits as Limit[]) : found.limits,
  };
  const def = node._zod.def as unknown as Record<string, unknown> & { type: string };
  switch (def.type) {
    case "object":
      for (const [k, child] of Object.entries(def.shape as Record<string, Node>)) walk(child, path ? `${path}.${k}` : k, {}, out);
      return;
    case "optional":
    case "nullable":
    case "default":
    case "prefault":
    case "readonly":
    case "nonoptional":
      walk(def.innerType as Node, path, f, out);
      return;
    case "pipe":
      walk(def.out as Node, path, f, out);
      return;
    case "union":
      for (const option of def.options as Node[]) walk(option, path, f, out);
      return;
    case "array":
      walk(def.element as Node, `${path}[]`, {}, out);
      return;
    case "number":
      if (f.words !== undefined && !out.has(path))
        out.set(path, {
          path,
          words: f.words,
          label: labelOfWords(f.words),
          quantity: quantityOfKey(path),
          ...(f.symbol ? { symbol: f.symbol } : {}),
          ...(f.limits ? { limits: f.limits } : {}),
        });
      return;
    default:
      return;
  }
}

function collect(): Map<string, InputInfo> {
  const out = new Map<string, InputInfo>();
  walk(checkSchema as unknown as Node, "", {}, out);
  return out;
}

/** Every number input of the check format, by path. */
export const NUMBER_INPUTS: ReadonlyMap<string, InputInfo> = collect();

/** The registry path of a document path: list positions become `[]` (`pressure.blocks.3.max_MPa` → `pressure.blocks[].max_MPa`). */
export function registryPath(path: string): string {
  return path.replace(/\.\d+(?=\.|$)/g, "[]");
}

/** The registry entry of a path; throws for a path the format does not take (a programming error, caught by the tests). */
export function inputAt(path: string): InputInfo {
  const info = NUMBER_INPUTS.get(path);
  if (!info) throw new Error(`the check format has no number input at ${path}`);
  return info;
}
