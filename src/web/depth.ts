/**
 * How deeply a received JSON value nests. A check nests five levels and a records export about
 * eight; nothing the server takes needs more. Far deeper input (a few kilobytes of "[[[[…") only
 * overflows the recursive code that later walks it — canonical JSON, JSON.stringify — so the
 * edges refuse it first, naming where it goes too deep.
 */
export const MAX_JSON_DEPTH = 64;

/** The dot path of the first value nested deeper than `limit`, or undefined. Iterative, so any depth is safe to check. */
export function tooDeepAt(value: unknown, limit = MAX_JSON_DEPTH): string | undefined {
  const stack: { v: object; path: string; depth: number }[] = [];
  const visit = (v: unknown, path: string, depth: number) => {
    if (v !== null && typeof v === "object") stack.push({ v, path, depth });
  };
  visit(value, "", 0);
  for (let item = stack.pop(); item; item = stack.pop()) {
    if (item.depth >= limit) return item.path || "(document)";
    const at = (k: string) => (item.path ? `${item.path}.${k}` : k);
    if (Array.isArray(item.v)) item.v.forEach((c, i) => visit(c, at(String(i)), item.depth + 1));
    else for (const [k, c] of Object.entries(item.v)) visit(c, at(k), item.depth + 1);
  }
  return undefined;
}
