import type { Units } from "../../schema/units.ts";
import { readForm } from "./read.ts";
import { valueAt, writeForm } from "./write.ts";

/**
 * Parts of a check the form has no field for (coupon data, a crack-growth Walker exponent, …)
 * ride along in one hidden field, so editing a check opened from a file or a link never drops
 * them silently. Only what the form cannot show is carried; whatever the form shows, it owns.
 */
const NOT_CARRIED = new Set(["format", "display", "solve"]);

/** The leaves of `doc` that the form, written and read back, does not reproduce; undefined when none. */
export function unshownParts(doc: unknown, units: Units): Record<string, unknown> | undefined {
  const back = readForm(writeForm(doc, units), units).document;
  const out: Record<string, unknown> = {};
  const walk = (x: unknown, path: string) => {
    if (x !== null && typeof x === "object" && !Array.isArray(x)) {
      for (const [k, v] of Object.entries(x)) if (!(path === "" && NOT_CARRIED.has(k))) walk(v, path ? `${path}.${k}` : k);
    } else if (x !== undefined && valueAt(back, path) === undefined) {
      out[path] = x;
    }
  };
  walk(doc, "");
  return Object.keys(out).length ? out : undefined;
}

/**
 * Put carried parts back into a document read from the form: only where the form left the place
 * empty and the section holding it is still there (a crack section switched off stays off).
 */
export function applyCarried(doc: Record<string, unknown>, carried: string | undefined): void {
  if (!carried) return;
  let parts: unknown;
  try {
    parts = JSON.parse(carried);
  } catch {
    return;
  }
  if (parts === null || typeof parts !== "object" || Array.isArray(parts)) return;
  for (const [path, value] of Object.entries(parts)) {
    const keys = path.split(".");
    const last = keys.pop() as string;
    const parent = keys.length ? valueAt(doc, keys.join(".")) : doc;
    if (parent === null || typeof parent !== "object" || Array.isArray(parent)) continue;
    if (keys.some((k) => k === "__proto__" || k === "constructor" || k === "prototype") || last === "__proto__") continue;
    const holder = parent as Record<string, unknown>;
    if (holder[last] === undefined) holder[last] = value;
  }
}
