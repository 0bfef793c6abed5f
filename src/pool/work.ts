import { checkDocument } from "../engine/index.ts";
import { parseJsonText } from "../schema/jsonText.ts";
import { MAX_JSON_DEPTH, tooDeepAt } from "../schema/depth.ts";
import { jsonBody } from "../schema/jsonBody.ts";
import type { FieldError } from "../engine/errors.ts";
import { historyPlot } from "../plots/history.ts";
import { readPressureLog, type LogOptions } from "../schema/pressureLog.ts";
import { SI_UNITS, toSI } from "../schema/units.ts";
import { validateCheckDocument } from "../store/checkValidator.ts";
import { InvalidRecordError } from "../store/errors.ts";
import { prepareImport, type ImportKeys, type PreparedImport } from "../store/exchange.ts";

/**
 * One check from the text of its document to the text of its answer: parse, depth guard, validate,
 * run, serialize. The same function runs on the request thread (small bodies) and in the worker
 * pool (large ones), so both give byte-for-byte the same answer. Never throws for bad input.
 */
export interface CheckAnswer {
  /** 200 for a result, 400 for text that is not JSON, 422 for an errors document. */
  status: 200 | 400 | 422;
  body: string;
}

const errorsText = (path: string, message: string) => JSON.stringify({ errors: [{ path, message }] });

/** `what` names the text in the message when it is not JSON ("the body", "the line"). */
export function checkText(text: string, what = "the body"): CheckAnswer {
  let value: unknown;
  try {
    value = parseJsonText(text);
  } catch (err) {
    return { status: 400, body: errorsText("(document)", `${what} is not valid JSON: ${(err as Error).message}`) };
  }
  return checkValue(value);
}

export function checkValue(value: unknown): CheckAnswer {
  const deep = tooDeepAt(value);
  if (deep !== undefined)
    return { status: 422, body: errorsText(deep, `nests deeper than ${MAX_JSON_DEPTH} levels; no field of Hoopwise nests that deep`) };
  const out = checkDocument(value);
  return out.ok ? { status: 200, body: JSON.stringify(out.result) } : { status: 422, body: JSON.stringify({ errors: out.errors }) };
}

/** A records import worked off the request thread: ready for the store's transaction, or refused. */
export type ImportAnswer =
  | { ok: true; prepared: PreparedImport }
  | { ok: false; status: 400 | 422; body: { errors: { path: string; message: string }[] } };

/**
 * An exchange document from its text to what the store's import transaction needs: parsed, its
 * caps and fields checked, every revision's fingerprint and input validated with the check schema,
 * every signature checked against `keys`. Never throws for a bad document.
 */
export function prepareImportText(text: string, keys: ImportKeys): ImportAnswer {
  const body = jsonBody(text);
  if (!body.ok) return body;
  try {
    return { ok: true, prepared: prepareImport({ validate: validateCheckDocument }, body.value, keys) };
  } catch (err) {
    if (err instanceof InvalidRecordError) return { ok: false, status: 422, body: { errors: err.errors } };
    throw err;
  }
}

/** A logger's file read and drawn for the page's preview, or the reader's errors. */
export type LogPreview =
  | { ok: true; rows: number; delimiter: string; min: number; max: number; svg: string; drawn_ms: number }
  | { ok: false; errors: FieldError[] };

/**
 * Read a log with the command line's reader and draw it (min/max per pixel column) in the log's
 * own unit. CPU-bound for a long log, so the page's preview runs it in a worker thread.
 */
export function previewLogText(text: string, opts: LogOptions): LogPreview {
  const read = readPressureLog(text, opts);
  if (!read.ok) return read;
  const unit = opts.unit ?? "MPa";
  const perUnit = toSI(1, "pressure", { ...SI_UNITS, pressure: unit });
  const values = new Float64Array(read.history_MPa.length);
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = read.history_MPa[i] / perUnit;
    values[i] = v;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const t = performance.now();
  const svg = historyPlot({ values, unit });
  return { ok: true, rows: read.rows, delimiter: read.delimiter, min, max, svg, drawn_ms: performance.now() - t };
}
