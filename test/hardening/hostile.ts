/**
 * Hostile documents for the fuzz tests: the demos and the format example, mutated. A plan (base,
 * then a few edits) is generated rather than the document itself, so fast-check shrinks a failure
 * to the fewest edits that still break something.
 */
import { readFileSync } from "node:fs";
import fc from "fast-check";
import { DEMOS } from "../../src/demo/index.ts";
import { MEAN_STRESS_CRITERIA } from "../../src/schema/index.ts";

export const FORMAT_EXAMPLE: Record<string, unknown> = JSON.parse(
  readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8"),
);
export const BASES: readonly unknown[] = [...DEMOS.map((d) => d.document), FORMAT_EXAMPLE];

/**
 * Body text JSON.stringify cannot write: number tokens (1e999 parses to Infinity, 1e-400 to 0,
 * -0 stays -0) and nesting deeper than its recursion allows. They travel through the document as
 * marker strings and are spliced into the body text by bodyOf.
 */
const RAW_MARK = "\u0000raw:";
const RAW_TOKENS = ["1e999", "-1e999", "1e-400", "-0", "-0.0e0", "123456789012345678901234567890", "0.0000000000000000000000001"];

function rawText(spec: string): string {
  const deep = /^deep-(array|object)-(\d+)$/.exec(spec);
  if (!deep) return spec;
  const depth = Number(deep[2]);
  return deep[1] === "array" ? `${"[".repeat(depth)}1${"]".repeat(depth)}` : `${'{"a":'.repeat(depth)}1${"}".repeat(depth)}`;
}

/** Values that have broken parsers before: extremes of double precision, NaN-like text, odd shapes. */
export const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(1e308, -1e308, 5e-324, -5e-324, -0, 0, -1, 1, 2 ** 53 + 2, 0.1, 1e-12, 1e12, 1e15),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.integer(),
  fc.constantFrom(...RAW_TOKENS).map((t) => `${RAW_MARK}${t}`),
  fc.constantFrom(
    "NaN",
    "Infinity",
    "-Infinity",
    "1e999",
    "",
    " ",
    "0x10",
    "1,5",
    "12 mm",
    "true",
    "null",
    "\u0000",
    "\ud800",
    "١٢٣",
    "−1",
  ),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: "grapheme", maxLength: 20 }),
  fc.integer({ min: 1_000, max: 200_000 }).map((n) => "x".repeat(n)),
  fc.constantFrom(null, true, false, [], {}, [1, 2, 3], [null], { max_MPa: 1 }),
  fc
    .tuple(fc.constantFrom("array", "object"), fc.integer({ min: 10, max: 50_000 }))
    .map(([kind, depth]) => `${RAW_MARK}deep-${kind}-${depth}`),
  fc.array(fc.double({ noNaN: true, noDefaultInfinity: true }), { maxLength: 50 }),
  fc.jsonValue({ maxDepth: 3 }),
);

/** Magnitudes at and past the ends of what a double holds, and the edges of the schema's ranges (accepted ones included, so the engine runs there). */
const extremeNumber = fc.constantFrom(
  5e-324,
  -5e-324,
  1e-300,
  1e-30,
  1e-20,
  1e-12,
  1e-6,
  1e-3,
  0.1,
  0.5,
  0.9999,
  0.999999,
  1,
  1.000001,
  1e4,
  1e5,
  1e7,
  1e12,
  1e15,
  1e300,
  1e308,
  -1e308,
  -1e4,
  -1,
  -0.01,
  -0.99,
);

/** Names from the schema, so a mutation often lands on a valid choice and the engine runs on it. */
const ENUM_WORDS = [
  ...MEAN_STRESS_CRITERIA,
  "cylinder",
  "sphere",
  "inner",
  "mean",
  "outer",
  "auto",
  "thin",
  "thick",
  "none",
  "circular-hole",
  "elliptical-hole",
  "given",
  "center-through",
  "edge-through",
  "hole-through",
  "basquin",
  "welded",
  "thickness",
  "pressure",
  "al-2024-t3",
  "steel-p265gh",
  "no-such-material",
];

type Path = (string | number)[];

export type Edit =
  | { op: "set"; at: number; value: unknown }
  | { op: "scale"; at: number; factor: number }
  | { op: "extreme"; at: number; value: number }
  | { op: "word"; at: number; word: string }
  | { op: "delete"; at: number }
  | { op: "unknownKey"; at: number; key: string; value: unknown }
  | { op: "wrapInArray"; at: number };

export interface Plan {
  base: number;
  /** Replace the whole document (top-level null, a number, an array...). */
  whole?: unknown;
  edits: Edit[];
}

const at = fc.nat();
export const edit: fc.Arbitrary<Edit> = fc.oneof(
  { weight: 4, arbitrary: fc.record({ op: fc.constant("set" as const), at, value: hostileValue }) },
  { weight: 3, arbitrary: fc.record({ op: fc.constant("scale" as const), at, factor: fc.double({ min: 0.01, max: 100, noNaN: true }) }) },
  { weight: 3, arbitrary: fc.record({ op: fc.constant("extreme" as const), at, value: extremeNumber }) },
  { weight: 2, arbitrary: fc.record({ op: fc.constant("word" as const), at, word: fc.constantFrom(...ENUM_WORDS) }) },
  { weight: 2, arbitrary: fc.record({ op: fc.constant("delete" as const), at }) },
  {
    weight: 1,
    arbitrary: fc.record({
      op: fc.constant("unknownKey" as const),
      at,
      key: fc.oneof(fc.string({ maxLength: 12 }), fc.constantFrom("__proto__", "constructor", "toString")),
      value: hostileValue,
    }),
  },
  { weight: 1, arbitrary: fc.record({ op: fc.constant("wrapInArray" as const), at }) },
);

export const plan: fc.Arbitrary<Plan> = fc.oneof(
  { weight: 1, arbitrary: fc.record({ base: fc.nat({ max: BASES.length - 1 }), edits: fc.constant<Edit[]>([]) }) },
  { weight: 12, arbitrary: fc.record({ base: fc.nat({ max: BASES.length - 1 }), edits: fc.array(edit, { minLength: 1, maxLength: 4 }) }) },
  { weight: 1, arbitrary: fc.record({ base: fc.constant(0), whole: hostileValue, edits: fc.constant<Edit[]>([]) }) },
);

/** Every path in `doc`, parents before children; the root is the empty path. */
function pathsOf(doc: unknown): Path[] {
  const out: Path[] = [];
  const stack: { path: Path; value: unknown }[] = [{ path: [], value: doc }];
  for (let item = stack.pop(); item && out.length < 10_000; item = stack.pop()) {
    out.push(item.path);
    const v = item.value;
    if (v !== null && typeof v === "object") {
      for (const [k, child] of Object.entries(v)) stack.push({ path: [...item.path, Array.isArray(v) ? Number(k) : k], value: child });
    }
  }
  return out;
}

function valueAt(doc: unknown, path: Path): unknown {
  return path.length === 0 ? doc : parentOf(doc, path)?.[path[path.length - 1]];
}

function parentOf(doc: unknown, path: Path): Record<string | number, unknown> | undefined {
  let x = doc;
  for (const k of path.slice(0, -1)) {
    if (x === null || typeof x !== "object") return undefined;
    x = (x as Record<string | number, unknown>)[k];
  }
  return x !== null && typeof x === "object" ? (x as Record<string | number, unknown>) : undefined;
}

function applyEdit(doc: unknown, e: Edit): unknown {
  const all = pathsOf(doc);
  // Numeric edits pick among the numbers, so they always land on one while the document has any.
  const numeric = e.op === "scale" || e.op === "extreme" ? all.filter((p) => typeof valueAt(doc, p) === "number") : all;
  const paths = numeric.length > 0 ? numeric : all;
  const path = paths[e.at % paths.length];
  const parent = parentOf(doc, path);
  const key = path[path.length - 1];
  const current = valueAt(doc, path);
  const put = (v: unknown) => {
    if (path.length === 0) return v;
    // defineProperty, so a "__proto__" key becomes an own property as JSON.parse would make it.
    if (parent) Object.defineProperty(parent, key, { value: v, enumerable: true, writable: true, configurable: true });
    return doc;
  };
  switch (e.op) {
    case "set":
      // A copy: fast-check hands the same constant object to many runs, and later edits change what they land in.
      return put(structuredClone(e.value));
    case "scale":
      return typeof current === "number" ? put(current * e.factor) : doc;
    case "extreme":
      return typeof current === "number" ? put(e.value) : doc;
    case "word":
      return typeof current === "string" ? put(e.word) : doc;
    case "delete":
      if (path.length === 0 || !parent) return undefined;
      if (Array.isArray(parent)) parent.splice(Number(key), 1);
      else delete parent[key];
      return doc;
    case "unknownKey":
      if (current !== null && typeof current === "object" && !Array.isArray(current)) {
        Object.defineProperty(current, e.key, { value: structuredClone(e.value), enumerable: true, writable: true, configurable: true });
      }
      return doc;
    case "wrapInArray":
      return put([current]);
  }
}

/** `base` (copied) with the edits applied; raw tokens stay as their marker strings: send bodyOf's text. */
export function applyEdits(base: unknown, list: readonly Edit[]): unknown {
  let doc: unknown = structuredClone(base);
  for (const e of list) doc = applyEdit(doc, e);
  return doc;
}

/** The document a plan describes. */
export function documentOf(p: Plan): unknown {
  return "whole" in p ? structuredClone(p.whole) : applyEdits(BASES[p.base], p.edits);
}

/** The body text: JSON, with the raw tokens and deep nesting spliced in where their markers stand. */
export function bodyOf(doc: unknown): string {
  const text = JSON.stringify(doc) ?? "null";
  return text.replace(/"\\u0000raw:([^"\\]+)"/g, (_, spec: string) => rawText(spec));
}
