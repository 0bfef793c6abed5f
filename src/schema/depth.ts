/**
 * How deeply a received JSON value nests. A check nests five levels and a records export about
 * eight; nothing the server takes needs more. Far deeper input (a few kilobytes of "[[[[…") only
 * overflows the recursive code that later walks it — canonical JSON, JSON.stringify — so the
 * edges refuse it first, naming where it goes too deep.
 */
export const MAX_JSON_DEPTH = 64;

/** The dot path of the first value nested deeper than `limit`, or undefined. Iterative, so any depth is safe to check. */
export function tooDeepAt(value: unknown, limit = MAX_JSON_DEPTH): string | undefined {
  if (value === null || typeof value !== "object") return undefined;
  // Paths are built only for the objects and arrays that go on the stack: a history of millions
  // of numbers is passed over in one plain loop.
  const stack: { v: object; path: string; depth: number }[] = [{ v: value, path: "", depth: 0 }];
  for (let item = stack.pop(); item; item = stack.pop()) {
    if (item.depth >= limit) return item.path || "(document)";
    const { v, path, depth } = item;
    if (Array.isArray(v)) {
      for (let i = 0; i < v.length; i++) {
        const c = v[i];
        if (c !== null && typeof c === "object") stack.push({ v: c, path: path ? `${path}.${i}` : String(i), depth: depth + 1 });
      }
    } else {
      for (const k in v) {
        if (!Object.hasOwn(v, k)) continue;
        const c = (v as Record<string, unknown>)[k];
        if (c !== null && typeof c === "object") stack.push({ v: c, path: path ? `${path}.${k}` : k, depth: depth + 1 });
      }
    }
  }
  return undefined;
}

/**
 * The dot path of the first text (a value or a key) holding a lone UTF-16 surrogate, which JSON's
 * "\ud800" escapes can carry but no text encoding can store or print; undefined when all is well
 * formed. Iterative, like tooDeepAt.
 */
export function illFormedAt(value: unknown): string | undefined {
  const lone = /\p{Cs}/u;
  const stack: { v: unknown; path: string }[] = [{ v: value, path: "" }];
  for (let item = stack.pop(); item; item = stack.pop()) {
    const { v, path } = item;
    const at = (k: string) => (path ? `${path}.${k}` : k);
    if (typeof v === "string") {
      if (lone.test(v)) return path || "(document)";
    } else if (Array.isArray(v)) for (const [i, c] of v.entries()) stack.push({ v: c, path: at(String(i)) });
    else if (v !== null && typeof v === "object") {
      for (const [k, c] of Object.entries(v)) {
        if (lone.test(k)) return at(k.replace(/\p{Cs}/gu, "\uFFFD"));
        stack.push({ v: c, path: at(k) });
      }
    }
  }
  return undefined;
}
