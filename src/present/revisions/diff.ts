/**
 * The difference between two saved inputs, key by key. Both documents are flattened to dot paths
 * (`shell.thickness_mm`, `pressure.blocks.1.cycles`), so a reviewer sees exactly which entry
 * moved, whatever its depth. A list of plain values (a pressure history, test lives) is one entry:
 * a history of thousands of points is compared whole and summarised, not listed point by point.
 */

import { NUMBER_INPUTS } from "../../schema/inputs.ts";

export type ChangeKind = "changed" | "added" | "removed";

export interface InputChange {
  path: string;
  kind: ChangeKind;
  /** Absent when the key was added. */
  before?: unknown;
  /** Absent when the key was removed. */
  after?: unknown;
  unit?: string;
  /** The input's label as the form and the sheet show it, where the key is a number input of the format. */
  label?: string;
}

export interface InputDiff {
  changes: InputChange[];
  /** Differences beyond those listed, when there are very many (a rewritten block table). */
  more: number;
}

/** More rows than this would bury the few a reviewer is looking for. */
const MAX_LISTED = 300;

export function flatten(value: unknown, prefix = "", out = new Map<string, unknown>()): Map<string, unknown> {
  if (Array.isArray(value)) {
    if (value.length === 0 || value.every(isPlain)) out.set(prefix, value);
    else for (const [i, item] of value.entries()) flatten(item, join(prefix, String(i)), out);
  } else if (value !== null && typeof value === "object") {
    const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined);
    if (entries.length === 0) out.set(prefix, value);
    for (const [k, v] of entries) flatten(v, join(prefix, k), out);
  } else {
    out.set(prefix, value);
  }
  return out;
}

export function diffInputs(before: unknown, after: unknown): InputDiff {
  const a = flatten(before);
  const b = flatten(after);
  const paths = [...a.keys(), ...[...b.keys()].filter((k) => !a.has(k))];
  const changes: InputChange[] = [];
  for (const path of paths) {
    const unit = unitOf(path);
    const label = NUMBER_INPUTS.get(path.replace(/\.\d+(?=\.|$)/g, "[]"))?.label;
    const named = { path, unit, ...(label ? { label } : {}) };
    if (!b.has(path)) changes.push({ ...named, kind: "removed", before: a.get(path) });
    else if (!a.has(path)) changes.push({ ...named, kind: "added", after: b.get(path) });
    else if (!same(a.get(path), b.get(path))) changes.push({ ...named, kind: "changed", before: a.get(path), after: b.get(path) });
  }
  return { changes: changes.slice(0, MAX_LISTED), more: Math.max(0, changes.length - MAX_LISTED) };
}

/** Units as the check format spells them at the end of a key (`radius_mm`, `toughness_MPaSqrtM`). */
const UNIT_SUFFIXES: Record<string, string> = { mm: "mm", m: "m", MPa: "MPa", MPaSqrtM: "MPa·√m", cycles: "cycles" };

export function unitOf(path: string): string | undefined {
  const key = path.slice(path.lastIndexOf(".") + 1);
  if (key === "cycles") return "cycles";
  const m = /_([A-Za-z]+)$/.exec(key);
  return m ? (UNIT_SUFFIXES[m[1]] ?? m[1]) : undefined;
}

function isPlain(x: unknown): boolean {
  return x === null || typeof x !== "object";
}

function same(x: unknown, y: unknown): boolean {
  return Object.is(x, y) || JSON.stringify(x) === JSON.stringify(y);
}

function join(prefix: string, key: string): string {
  return prefix ? `${prefix}.${key}` : key;
}
