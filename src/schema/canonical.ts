/**
 * Canonical JSON: object keys sorted at every depth, no whitespace, numbers as JavaScript prints them.
 * Two inputs that mean the same check give the same text, so the same fingerprint.
 */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(sortKeys(value));
}

function sortKeys(v: unknown): unknown {
  if (Array.isArray(v)) return flat(v) ? v : v.map(sortKeys);
  if (v !== null && typeof v === "object") {
    const out: Record<string, unknown> = {};
    for (const k of Object.keys(v as object).sort()) {
      const x = (v as Record<string, unknown>)[k];
      if (x !== undefined) out[k] = sortKeys(x);
    }
    return out;
  }
  return v;
}

/** An array of numbers, strings, booleans and nulls only (a pressure history): it needs no copy to be canonical. */
function flat(xs: unknown[]): boolean {
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i];
    if (x !== null && typeof x === "object") return false;
    // JSON.stringify writes a hole or undefined as null; the copy through map() would do the same.
    if (x === undefined || !(i in xs)) return false;
  }
  return true;
}

/** Points of a flat array written per piece: long enough to be quick, short enough to hold no second copy of a long history. */
const PIECE = 1024;

/**
 * The canonical JSON text of `v`, handed over in pieces that joined give exactly canonicalJson(v):
 * keys sorted and undefined values left out as there, primitives written by JSON.stringify, and a
 * flat array (a pressure history) written a slice at a time, so the whole text is never built.
 */
export function writeCanonical(v: unknown, write: (piece: string) => void): void {
  if (Array.isArray(v)) {
    if (flat(v)) {
      write("[");
      for (let i = 0; i < v.length; i += PIECE) {
        if (i > 0) write(",");
        write(JSON.stringify(v.slice(i, i + PIECE)).slice(1, -1));
      }
      write("]");
      return;
    }
    write("[");
    for (let i = 0; i < v.length; i++) {
      if (i > 0) write(",");
      const x = v[i];
      // As JSON.stringify writes it inside an array: undefined (and what JSON cannot carry) as null.
      if (x === undefined || typeof x === "function" || typeof x === "symbol") write("null");
      else writeCanonical(x, write);
    }
    write("]");
    return;
  }
  if (v !== null && typeof v === "object") {
    write("{");
    let first = true;
    for (const k of canonicalKeyOrder(v as object)) {
      const x = (v as Record<string, unknown>)[k];
      if (x === undefined || typeof x === "function" || typeof x === "symbol") continue;
      write(first ? `${JSON.stringify(k)}:` : `,${JSON.stringify(k)}:`);
      first = false;
      writeCanonical(x, write);
    }
    write("}");
    return;
  }
  // String(): a bare undefined reads "undefined", as the joined text did before.
  write(String(JSON.stringify(v)));
}

/**
 * The key order canonicalJson's sorted copy ends up with: sorted, except that JavaScript lists
 * integer-like keys ("0", "12") first, in numeric order, whatever the insertion order was.
 */
function canonicalKeyOrder(v: object): string[] {
  const order: Record<string, true> = {};
  for (const k of Object.keys(v).sort()) order[k] = true;
  return Object.keys(order);
}

/** canonicalJson(v) by way of the piecewise writer (for tests: both must agree to the byte). */
export function canonicalJsonInPieces(v: unknown): string {
  const pieces: string[] = [];
  writeCanonical(v, (p) => pieces.push(p));
  return pieces.join("");
}
