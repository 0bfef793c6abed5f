import {
  blockField,
  FORM_FIELDS,
  type FieldSpec,
  type FormValues,
  NUMBER_FIELDS,
  type NumberFieldName,
} from "../../../views/form/fields.ts";
import { formatNumberList, parseNumber, parseNumberList } from "./lists.ts";
import { defaultAt } from "../../schema/defaults.ts";
import { formNumber, fromSI, toSI, type Quantity, type Units } from "../../schema/units.ts";
import { parisCConverted, parisCShown, parisExponent } from "./paris.ts";

/**
 * @module web/form/write
 * Check document → form values in the chosen units. The document may come from a link or an
 * uploaded file and so may be incomplete or wrong: whatever is present is shown (wrong values
 * as their text), so the user sees it beside the error the schema gives.
 *
 * The modes are set first from what the document holds (how the pressure is given, how the
 * notch is treated, the sections present); then the walk over the form's table
 * (views/form/fields.ts) writes each field that applies, as the reader reads it.
 */
export function writeForm(doc: unknown, units: Units): FormValues {
  const v: FormValues = {};
  const at = (path: string) => valueAt(doc, path);

  // Modes.
  const p = at("pressure");
  const has = (k: string) => p !== null && typeof p === "object" && k in p;
  v["pressure.mode"] = has("fromAltitude") ? "altitude" : has("history_MPa") ? "history" : has("blocks") ? "blocks" : "direct";
  if (v["pressure.mode"] === "history") v["history.text"] = listText(at("pressure.history_MPa"), "pressure", units);
  if (v["pressure.mode"] === "blocks") {
    const blocks = at("pressure.blocks");
    (Array.isArray(blocks) ? blocks : []).forEach((b, row) => {
      const cell = (key: string, q: Quantity) => {
        const x = valueAt(b, key);
        return x === undefined || x === null ? "" : shownNumber(x, q, units);
      };
      v[blockField(row, "max")] = cell("max_MPa", "pressure");
      v[blockField(row, "min")] = cell("min_MPa", "pressure");
      v[blockField(row, "cycles")] = cell("cycles", "plain");
    });
  }
  const constant = at("fatigue.notchConstant");
  v["fatigue.notch"] = typeof constant === "string" ? constant : at("fatigue.notchSensitivity") !== undefined ? "q" : "kt";
  if (at("crack") !== undefined) {
    v["crack.on"] = "on";
    if (at("crack.bulging") !== false) v["crack.bulging"] = "on";
  }
  if (at("evidence") !== undefined) {
    v["evidence.on"] = "on";
    v["evidence.lives"] = listText(at("evidence.lives_cycles"), "plain", units);
  }

  for (const [name, f] of Object.entries(FORM_FIELDS as Record<string, FieldSpec>)) {
    if (f.when && !f.when(v)) continue;
    const x = at(f.path);
    if (f.kind === "number") {
      if (x !== undefined && x !== null) v[name] = shownNumber(x, NUMBER_FIELDS[name as NumberFieldName].quantity, units);
      continue;
    }
    if (typeof x === "string" || typeof x === "number" || typeof x === "boolean") v[name] = String(x);
    // A choice the document leaves out shows the value the schema fills in, not the list's first
    // option: the form re-posted unchanged must be the same check as the document.
    else if (f.showsDefault && defaultAt(f.path) !== undefined) v[name] = String(defaultAt(f.path));
  }
  // The Paris coefficient's factor depends on the exponent it goes with: the document's, else its library entry's.
  const parisC = at("material.parisC");
  if (typeof parisC === "number")
    v["material.parisC"] = parisCShown(parisC, parisExponent(at("material.parisM"), at("material.id")), units);
  return v;
}

/** A document value shown in a field: numbers converted to the display unit, anything else as its text. */
function shownNumber(x: unknown, q: Quantity, units: Units): string {
  return typeof x === "number" ? formNumber(fromSI(x, q, units)) : typeof x === "string" ? x : JSON.stringify(x);
}

function listText(x: unknown, q: Quantity, units: Units): string {
  if (!Array.isArray(x)) return x === undefined ? "" : String(x);
  if (x.every((e) => typeof e === "number")) return formatNumberList(x, (n) => formNumber(fromSI(n, q, units)));
  return x.map((e) => (typeof e === "number" ? formNumber(fromSI(e, q, units)) : String(e))).join(", ");
}

export function valueAt(doc: unknown, path: string): unknown {
  let x: unknown = doc;
  for (const key of path.split(".")) {
    if (x === null || typeof x !== "object") return undefined;
    x = (x as Record<string, unknown>)[key];
  }
  return x;
}

/**
 * The same values re-expressed in other units, for when the user switches units: each number
 * that parses is converted exactly and rewritten; anything else is kept as typed.
 */
export function convertValues(v: FormValues, from: Units, to: Units): FormValues {
  const out: FormValues = { ...v };
  const convert = (text: string, q: Quantity) => {
    const x = parseNumber(text);
    return x === undefined ? text : formNumber(fromSI(toSI(x, q, from), q, to));
  };
  for (const [name, f] of Object.entries(NUMBER_FIELDS)) if (out[name] !== undefined) out[name] = convert(out[name], f.quantity);
  if (v["material.parisC"] !== undefined)
    out["material.parisC"] = parisCConverted(v["material.parisC"], parisExponent(v["material.parisM"], v["material.id"]), from, to);
  for (const name of Object.keys(out)) {
    const m = /^blocks\.\d+\.(max|min)$/.exec(name);
    if (m) out[name] = convert(out[name], "pressure");
  }
  // A logger's table keeps only its pressure column: the other columns were never read.
  if (out["history.text"]) {
    const list = parseNumberList(out["history.text"]).map((x) => (typeof x === "number" ? toSI(x, "pressure", from) : x));
    out["history.text"] = listText(list, "pressure", to);
  }
  return out;
}
