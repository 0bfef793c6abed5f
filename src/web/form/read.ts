import {
  BLOCK_COLUMNS,
  blockField,
  FORM_FIELDS,
  type FieldSpec,
  type FormValues,
  filled,
  NUMBER_FIELDS,
  type NumberFieldName,
  OPTIONAL_SECTIONS,
} from "../../../views/form/fields.ts";
import { parseNumber, parseNumberList } from "./lists.ts";
import { toSI, type Units } from "../../schema/units.ts";
import { parisCIntoSI } from "./paris.ts";

/**
 * @module web/form/read
 * Form → check document. Numbers are read in the user's units and written in SI. Nothing is
 * judged here: a blank field is left out and a field that is not a number is passed on as its
 * text, so the schema gives the very messages the API gives ("is required", "… must be a
 * number"). Each field read is bound to its document path, so an error can be put beside it.
 *
 * The fields are a walk over the form's table (views/form/fields.ts): each field that applies
 * puts its value at its path. Only the modes have code of their own: how the pressure is given
 * (a history, a block table), the sections switched on, the bulging box and the test lives.
 */
export interface ReadForm {
  document: Record<string, unknown>;
  /** The form field an error at this document path belongs to (the deepest bound path that contains it). */
  fieldFor(path: string): string | undefined;
}

type Obj = Record<string, unknown>;

export function readForm(v: FormValues, units: Units): ReadForm {
  const bound = new Map<string, string>();
  const bind = (name: string, path: string) => bound.set(path, name);
  // The sections in the format's order; the walk fills them, and what stays empty or unset goes.
  const doc: Obj = {
    format: "hoopwise.check/1",
    title: undefined,
    project: undefined,
    calcNumber: undefined,
    notes: undefined,
    display: { ...units },
    shell: {},
    pressure: {},
    cutout: {},
    material: {},
    fatigue: {},
    axialExtra: {},
    static: {},
    crack: v["crack.on"] ? {} : undefined,
    fleet: {},
    evidence: v["evidence.on"] ? {} : undefined,
  };

  for (const [name, f] of Object.entries(FORM_FIELDS as Record<string, FieldSpec>)) {
    if (f.when && !f.when(v)) continue;
    bind(name, f.path);
    const value =
      f.kind === "number" ? numberIn(v[name], (x) => toSI(x, NUMBER_FIELDS[name as NumberFieldName].quantity, units)) : filled(v, name);
    if (value !== undefined) putAt(doc, f.path, f.numeric && typeof value === "string" ? (parseNumber(value) ?? value) : value);
  }

  // Modes.
  bind("pressure.mode", "pressure");
  bind("cutout.kind", "cutout");
  (doc.cutout as Obj).kind ??= "none";
  // The Paris coefficient's factor depends on its exponent, so it is put into SI once the exponent is read.
  parisCIntoSI(doc.material as Obj, units);
  if (v["pressure.mode"] === "history") {
    bind("history.text", "pressure.history_MPa");
    const list = parseNumberList(v["history.text"] ?? "");
    doc.pressure = { history_MPa: list.map((x) => (typeof x === "number" ? toSI(x, "pressure", units) : x)) };
  } else if (v["pressure.mode"] === "blocks") {
    doc.pressure = { blocks: readBlocks(v, units, bind) };
  }
  // Bulging is on unless the box is cleared (off is unconservative).
  if (doc.crack && !v["crack.bulging"]) (doc.crack as Obj).bulging = false;
  if (doc.evidence) {
    bind("evidence.lives", "evidence.lives_cycles");
    (doc.evidence as Obj).lives_cycles = parseNumberList(v["evidence.lives"] ?? "");
  }
  for (const section of OPTIONAL_SECTIONS) dropIfEmpty(doc, section);
  for (const [k, x] of Object.entries(doc)) if (x === undefined) delete doc[k];

  return {
    document: doc,
    fieldFor(path) {
      for (let p = path; p !== ""; p = p.includes(".") ? p.slice(0, p.lastIndexOf(".")) : "") {
        const name = bound.get(p);
        if (name !== undefined) return name;
      }
      return undefined;
    },
  };
}

/** Put a value at a dotted path, making the objects on the way. */
function putAt(doc: Obj, path: string, value: unknown): void {
  const keys = path.split(".");
  const last = keys.pop() as string;
  let o = doc;
  for (const k of keys) {
    o[k] ??= {};
    o = o[k] as Obj;
  }
  o[last] = value;
}

/** Remove an optional section none of whose fields was filled. */
function dropIfEmpty(doc: Obj, path: string): void {
  const keys = path.split(".");
  const last = keys.pop() as string;
  let o: Obj | undefined = doc;
  for (const k of keys) o = o?.[k] as Obj | undefined;
  const section = o?.[last];
  if (o && section !== null && typeof section === "object" && Object.keys(section).length === 0) delete o[last];
}

/** A typed number in SI, or the text itself when it is not a number (the schema words the error). */
function numberIn(raw: string | undefined, convert: (x: number) => number): number | string | undefined {
  const t = (raw ?? "").trim();
  if (t === "") return undefined;
  const x = parseNumber(t);
  return x === undefined ? t : convert(x);
}

/** Filled rows of the block table, in order; blank rows are skipped and each kept row is bound to its document index. */
function readBlocks(v: FormValues, units: Units, bind: (n: string, p: string) => void): Obj[] {
  bind("blocks", "pressure.blocks");
  const out: Obj[] = [];
  for (const row of blockRows(v)) {
    const cols = Object.keys(BLOCK_COLUMNS) as (keyof typeof BLOCK_COLUMNS)[];
    if (cols.every((c) => (v[blockField(row, c)] ?? "").trim() === "")) continue;
    const i = out.length;
    const cell = (c: keyof typeof BLOCK_COLUMNS) => {
      bind(blockField(row, c), `pressure.blocks.${i}.${c === "cycles" ? "cycles" : `${c}_MPa`}`);
      return numberIn(v[blockField(row, c)], (x) => toSI(x, BLOCK_COLUMNS[c], units));
    };
    const block: Obj = { max_MPa: cell("max"), min_MPa: cell("min"), cycles: cell("cycles") };
    for (const [k, x] of Object.entries(block)) if (x === undefined) delete block[k];
    out.push(block);
  }
  return out;
}

/** Row numbers of the block table present in the posted values, ascending. */
export function blockRows(v: FormValues): number[] {
  const rows = new Set<number>();
  for (const k of Object.keys(v)) {
    const m = /^blocks\.(\d+)\.(max|min|cycles)$/.exec(k);
    if (m && Number(m[1]) < 10_000) rows.add(Number(m[1]));
  }
  return [...rows].sort((a, b) => a - b);
}
