/**
 * The parts of the code and the arrows between them, as the contributor guide's whiteboard draws
 * them (DEVELOPERS.md, "The parts and the rules"). Each folder may import only the folders listed
 * for it here; an import that is not drawn fails, and so does a cycle between folders. The list is
 * the whiteboard written as data: change both together.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import { dirname, join, relative, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";

const ROOT = fileURLToPath(new URL("..", import.meta.url));

/** What each part may import (besides itself and packages), from the bottom of the drawing up. */
const ALLOWED: Record<string, readonly string[]> = {
  "src/schema": [],
  "src/materials": ["src/schema"],
  "src/engine": ["src/materials", "src/schema"],
  "src/demo": ["src/schema"],
  "src/plots": ["src/engine", "src/schema"],
  "src/store": ["src/engine", "src/schema"],
  "src/present": ["src/engine", "src/plots", "src/schema"],
  "src/pdf": [],
  views: ["src/demo", "src/engine", "src/materials", "src/plots", "src/present", "src/schema", "src/store"],
  templates: ["src/engine", "src/present", "src/schema"],
  "src/sheet": ["src/engine", "src/pdf", "src/schema", "templates"],
  "src/pool": ["src/engine", "src/plots", "src/schema", "src/store"],
  "src/web": [
    "src/demo",
    "src/engine",
    "src/materials",
    "src/pdf",
    "src/plots",
    "src/pool",
    "src/present",
    "src/schema",
    "src/sheet",
    "src/store",
    "views",
  ],
  "src/cli": ["src/engine", "src/materials", "src/pdf", "src/pool", "src/schema", "src/sheet", "src/store"],
  "src/server.ts": ["src/pdf", "src/pool", "src/store", "src/web"],
  "src/cli.ts": ["src/cli"],
};

/** The part a file belongs to: a folder under src/ (or src's entry files), views or templates. */
function partOf(file: string): string {
  const p = relative(ROOT, file).split("/");
  if (p[0] !== "src") return p[0];
  return `src/${p[1]}`;
}

function sources(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? sources(p) : /\.tsx?$/.test(f) ? [p] : [];
  });
}

/** Every relative import and re-export of the code, as [from part, to part, file, specifier]. */
function arrows(): [string, string, string, string][] {
  const out: [string, string, string, string][] = [];
  for (const f of ["src", "views", "templates"].flatMap((d) => sources(join(ROOT, d)))) {
    const text = readFileSync(f, "utf8");
    for (const m of text.matchAll(/^\s*(?:import|export)\b[^;]*?\bfrom\s+"(\.[^"]+)"/gms)) {
      const to = partOf(resolve(dirname(f), m[1]));
      const from = partOf(f);
      if (to !== from) out.push([from, to, relative(ROOT, f), m[1]]);
    }
    for (const m of text.matchAll(/\bimport\(\s*"(\.[^"]+)"\s*\)/g)) {
      const to = partOf(resolve(dirname(f), m[1]));
      const from = partOf(f);
      if (to !== from) out.push([from, to, relative(ROOT, f), m[1]]);
    }
  }
  return out;
}

describe("the parts of the code import only downward", () => {
  const all = arrows();

  it("finds the imports it judges (the reader is not blind)", () => {
    // The web routes import the engine and the sheet; the engine imports the schema (by construction of the drawing).
    expect(all.some(([a, b]) => a === "src/web" && b === "src/engine")).toBe(true);
    expect(all.some(([a, b]) => a === "src/engine" && b === "src/schema")).toBe(true);
  });

  it("every part of the code is on the whiteboard", () => {
    const parts = new Set([...all.map((x) => x[0]), ...all.map((x) => x[1])]);
    expect([...parts].filter((p) => !(p in ALLOWED))).toEqual([]);
  });

  it("no import runs against the drawing", () => {
    const wrong = all.filter(([from, to]) => !ALLOWED[from]?.includes(to)).map(([, to, file, spec]) => `${file} → ${spec} (${to})`);
    expect(wrong).toEqual([]);
  });

  it("the drawing itself has no cycle", () => {
    const seen = new Map<string, "open" | "done">();
    const cycle: string[] = [];
    const visit = (p: string, path: string[]): boolean => {
      if (seen.get(p) === "done") return false;
      if (seen.get(p) === "open") {
        cycle.push(...path, p);
        return true;
      }
      seen.set(p, "open");
      for (const q of ALLOWED[p] ?? []) if (visit(q, [...path, p])) return true;
      seen.set(p, "done");
      return false;
    };
    for (const p of Object.keys(ALLOWED)) visit(p, []);
    expect(cycle).toEqual([]);
  });
});
