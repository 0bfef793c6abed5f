/**
 * @module web/form/posted
 * A form post understood: the check document it describes in SI and the values to show back in
 * the units now chosen, with what the buttons asked for (a solve, a library material, more rows).
 */
import { findMaterial } from "../../materials/library.ts";
import { fromSI, formNumber, parseUnitsKey, sameUnits, unitsFrom, type Units } from "../../schema/units.ts";
import {
  BLOCK_COLUMNS,
  blockField,
  MATERIAL_VALUE_FIELDS,
  NUMBER_FIELDS,
  SPARE_BLOCK_ROWS,
  type BlockColumn,
  type FormValues,
} from "../../../views/form/fields.ts";
import { applyCarried } from "./carry.ts";
import { readLog } from "./log.ts";
import { blockRows, readForm, type ReadForm } from "./read.ts";
import { convertValues } from "./write.ts";
import { parisCShown } from "./paris.ts";

/**
 * A posted form, understood: the check document it describes (in SI) and the values to show
 * back (in the units now chosen). The page, the sheet and the JSON download all read a post
 * through here, so the same fields always mean the same check.
 */
export interface Posted {
  /** The check document; `display` holds the units now chosen. Without `solve`. */
  document: Record<string, unknown>;
  /** Solve asked for by a button, if any. */
  solve?: "thickness" | "pressure";
  /** Field values to show, in `units`. */
  values: FormValues;
  units: Units;
  /** Rows of the block table to show. */
  rows: number[];
  /** Messages beside fields that no document path names (a logger's file that cannot be read). */
  formErrors?: Map<string, string[]>;
  fieldFor: ReadForm["fieldFor"];
  /**
   * True when the form itself must be drawn again, not only the result: the units changed,
   * a file was read, rows were added, a solved value was put in, or another library material
   * was picked (its values stand behind the blank fields).
   */
  redraw: boolean;
}

type Body = Record<string, string | File | (string | File)[]>;

/** Read a form post (urlencoded or multipart). Never throws for what a user can send. */
export async function readPosted(req: Request): Promise<Posted> {
  const body = await parseForm(req);
  const values: FormValues = {};
  let file: File | undefined;
  let log: File | undefined;
  for (const [k, raw] of Object.entries(body)) {
    const last = Array.isArray(raw) ? raw[raw.length - 1] : raw;
    if (typeof last === "string") values[k] = last;
    else if (k === "history.file" && last.size > 0) file = last;
    else if (k === "log.file" && last.size > 0) log = last;
  }
  // A logger's file is read only when its way of giving the pressure is the one chosen.
  const logText = log && values["pressure.mode"] === "log" ? await log.text() : undefined;
  return understand(values, file ? await file.text() : undefined, logText);
}

async function parseForm(req: Request): Promise<Body> {
  const type = req.headers.get("content-type") ?? "";
  if (!/multipart\/form-data|application\/x-www-form-urlencoded/i.test(type)) return {};
  try {
    const form = await req.formData();
    const out: Body = {};
    form.forEach((value, key) => {
      const prev = out[key];
      out[key] = prev === undefined ? value : Array.isArray(prev) ? [...prev, value] : [prev, value];
    });
    return out;
  } catch {
    // A body that does not parse as the form it claims to be is read as an empty form: every required field then says so.
    return {};
  }
}

/** The posted values plus what the buttons asked for, turned into a document and the values to show. */
export function understand(posted: FormValues, historyFile?: string, logText?: string): Posted {
  const values = { ...posted };
  const chosen = unitsFrom({
    length: values["units.length"],
    stress: values["units.stress"],
    pressure: values["units.pressure"],
    altitude: values["units.altitude"],
  });
  // The numbers on the page are in the units they were drawn in; the choice may since have changed.
  const shown = parseUnitsKey(values["units.shown"]) ?? chosen;
  let redraw = false;

  if (historyFile !== undefined) {
    values["history.text"] = historyFile;
    values["pressure.mode"] = "history";
    redraw = true;
  }
  const use = /^(thickness|pressure):(.+)$/.exec(values.use ?? "");
  const usedValue = use ? Number(use[2]) : Number.NaN;
  if (use && Number.isFinite(usedValue) && usedValue > 0) {
    if (use[1] === "thickness") values["shell.thickness"] = formNumber(fromSI(usedValue, NUMBER_FIELDS["shell.thickness"].quantity, shown));
    else values["pressure.max"] = formNumber(fromSI(usedValue, "pressure", shown));
    redraw = true;
  }
  if ((values["material.shown"] ?? "") !== (values["material.id"] ?? "")) {
    fillFromLibrary(values, values["material.shown"] ?? "", shown);
    redraw = true;
  }

  const read = readForm(values, shown);
  let formErrors: Map<string, string[]> | undefined;
  let fieldFor = read.fieldFor;
  if (values["pressure.mode"] === "log") {
    // The history comes from the file, never into a text box: a log of millions of points stays
    // in the file input and is sent again with each post.
    const log = readLog(logText, values);
    if (log.ok)
      read.document.pressure = { history_MPa: log.history_MPa, ...(log.gate_MPa !== undefined ? { gate_MPa: log.gate_MPa } : {}) };
    else {
      delete read.document.pressure;
      formErrors = log.errors;
    }
    fieldFor = (path) =>
      path === "pressure.gate_MPa" ? "log.gate" : path === "pressure" || path.startsWith("pressure.") ? "log.file" : read.fieldFor(path);
  }
  applyCarried(read.document, values.carry);
  read.document.display = { ...chosen };
  const show = sameUnits(shown, chosen) ? values : convertValues(values, shown, chosen);
  const solve = values.solve === "thickness" || values.solve === "pressure" ? values.solve : undefined;
  const more = values["blocks.more"] !== undefined;
  return {
    document: read.document,
    solve,
    values: show,
    units: chosen,
    rows: rowsToShow(values, more),
    fieldFor,
    formErrors,
    redraw: redraw || more || !sameUnits(shown, chosen),
  };
}

/**
 * Leaving a library material for one's own values: the library's values are written into the
 * blank fields, so the user edits from them instead of starting from nothing.
 */
function fillFromLibrary(values: FormValues, previousId: string, units: Units) {
  const lib = findMaterial(previousId);
  if (!lib || values["material.id"] !== "") return;
  for (const name of MATERIAL_VALUE_FIELDS) {
    const f = NUMBER_FIELDS[name];
    const x = (lib as unknown as Record<string, unknown>)[f.path.slice("material.".length)];
    if ((values[name] ?? "").trim() === "" && typeof x === "number")
      values[name] = name === "material.parisC" ? parisCShown(x, lib.parisM, units) : formNumber(fromSI(x, f.quantity, units));
  }
  if ((values["material.name"] ?? "").trim() === "") values["material.name"] = lib.name;
}

/** Rows of the block table: at least those posted, and always a few blank ones after the last filled row. */
function rowsToShow(values: FormValues, more: boolean): number[] {
  const posted = blockRows(values);
  const filled = posted.filter((r) =>
    (Object.keys(BLOCK_COLUMNS) as BlockColumn[]).some((c) => (values[blockField(r, c)] ?? "").trim() !== ""),
  );
  const lastFilled = filled.length ? filled[filled.length - 1] : -1;
  // Rows follow what is filled in, not the highest row number posted: an empty field named
  // blocks.9999 must not make the page draw ten thousand rows.
  const n = Math.max(lastFilled + 1 + SPARE_BLOCK_ROWS, 3) + (more ? 3 : 0);
  return Array.from({ length: Math.min(n, 10_000) }, (_, i) => i);
}
