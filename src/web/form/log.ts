/**
 * @module web/form/log
 * A logger's file on the page: the same reader as the command line's --log (schema/pressureLog.ts),
 * with its choices as form fields. The gate is given in the log's own unit.
 * Handed the form's values and the file's text, it gives the pressure history in MPa with the gate
 * converted to MPa, or the messages keyed by the form field each belongs beside (a line of the file
 * that cannot be read goes beside the file). The field names are the form's table's
 * (views/form/fields.ts, LOG_FIELDS re-exported). Used by the posted-form reader (posted.ts) and the
 * log preview (src/web/logPreview.tsx).
 */
import type { FieldError } from "../../engine/errors.ts";
import { readPressureLog, type LogOptions } from "../../schema/pressureLog.ts";
import { PRESSURE_UNITS, SI_UNITS, toSI, type StressUnit } from "../../schema/units.ts";
import type { FormValues } from "../../../views/form/fields.ts";
export { LOG_FIELDS } from "../../../views/form/fields.ts";
import { parseNumber } from "./lists.ts";

export interface LogChoice {
  opts: LogOptions;
  /** The hysteresis gate in MPa, when one is given and readable. */
  gate_MPa?: number;
  errors: Map<string, string[]>;
}

const add = (errors: Map<string, string[]>, field: string, message: string) => errors.set(field, [...(errors.get(field) ?? []), message]);

/** The reader's options from the form's fields; a field that cannot be read is an error beside it. */
export function logChoice(v: FormValues): LogChoice {
  const errors = new Map<string, string[]>();
  const unitText = (v["log.unit"] ?? "").trim() || "MPa";
  const unit = (PRESSURE_UNITS as readonly string[]).includes(unitText) ? (unitText as StressUnit) : undefined;
  if (!unit) add(errors, "log.unit", `must be one of ${PRESSURE_UNITS.join(", ")}`);
  const decimal = (v["log.decimal"] ?? ".").trim() === "," ? "," : ".";
  const skipText = (v["log.skip"] ?? "").trim();
  const skip = skipText === "" ? 0 : Number(skipText);
  if (!Number.isInteger(skip) || skip < 0) add(errors, "log.skip", "must be a whole number of lines, 0 or more");
  const column = (v["log.column"] ?? "").trim() || "1";
  const opts: LogOptions = { column, unit: unit ?? "MPa", decimal, skip: Number.isInteger(skip) && skip >= 0 ? skip : 0 };
  let gate_MPa: number | undefined;
  const gateText = (v["log.gate"] ?? "").trim();
  if (gateText !== "") {
    const g = parseNumber(gateText);
    if (g === undefined || !(g >= 0)) add(errors, "log.gate", "must be a pressure range, 0 or more, in the log's unit");
    else gate_MPa = toSI(g, "pressure", { ...SI_UNITS, pressure: opts.unit ?? "MPa" });
  }
  return { opts, gate_MPa, errors };
}

/** The form field each of the reader's error paths belongs beside: a line or the whole log beside the file. */
export function logField(path: string): string {
  if (path === "log.column" || path === "log.unit" || path === "log.decimal" || path === "log.skip") return path;
  return "log.file";
}

export type LogOutcome =
  | { ok: true; history_MPa: number[]; rows: number; delimiter: string; gate_MPa?: number; unit: StressUnit }
  | { ok: false; errors: Map<string, string[]> };

/** Read the posted log with the form's choices; every problem lands beside its field. */
export function readLog(text: string | undefined, v: FormValues): LogOutcome {
  const choice = logChoice(v);
  if (text === undefined) add(choice.errors, "log.file", "choose the logger's file (CSV or TSV) to read");
  if (choice.errors.size || text === undefined) return { ok: false, errors: choice.errors };
  const read = readPressureLog(text, choice.opts);
  if (!read.ok) {
    const errors = new Map<string, string[]>();
    for (const e of read.errors as FieldError[]) add(errors, logField(e.path), e.message);
    return { ok: false, errors };
  }
  return {
    ok: true,
    history_MPa: read.history_MPa,
    rows: read.rows,
    delimiter: read.delimiter,
    gate_MPa: choice.gate_MPa,
    unit: choice.opts.unit ?? "MPa",
  };
}
