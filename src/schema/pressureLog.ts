import type { FieldError } from "./errors.ts";
import { PRESSURE_UNITS, SI_UNITS, toSI, type StressUnit } from "./units.ts";

/**
 * A pressure log as loggers and spreadsheets write it — CSV or TSV, a header or a few lines of
 * preamble, a decimal comma — read into a history in MPa for `pressure.history_MPa`.
 * The column is a 1-based number or the name it has in the last skipped (header) line. Cells are
 * separated by a tab, by a semicolon, or by a comma where the decimal separator is a point; the
 * first data line decides. Blank lines are passed over; any other cell that is not a number is an
 * error naming its line and column.
 */
export interface LogOptions {
  column?: number | string;
  unit?: StressUnit;
  decimal?: "." | ",";
  /** Lines before the data (a header, a logger's preamble). */
  skip?: number;
}

export type LogRead = { ok: true; history_MPa: number[]; rows: number; delimiter: string } | { ok: false; errors: FieldError[] };

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const MAX_ERRORS = 10;

const fail = (path: string, message: string): LogRead => ({ ok: false, errors: [{ path, message }] });

export function readPressureLog(text: string, opts: LogOptions = {}): LogRead {
  const unit = opts.unit ?? "MPa";
  if (!(PRESSURE_UNITS as readonly string[]).includes(unit))
    return fail("log.unit", `the unit must be one of ${PRESSURE_UNITS.join(", ")} (got "${unit}")`);
  const decimal = opts.decimal ?? ".";
  if (decimal !== "." && decimal !== ",") return fail("log.decimal", `the decimal separator must be "." or "," (got "${decimal}")`);
  const skip = opts.skip ?? 0;
  if (!Number.isInteger(skip) || skip < 0)
    return fail("log.skip", `the header lines to skip must be a whole number, 0 or more (got ${skip})`);

  const lines = text.split(/\r\n|\n|\r/);
  const firstData = lines.findIndex((l, i) => i >= skip && l.trim() !== "");
  if (firstData < 0) return fail("log", `the log has no data after the ${skip} header line${skip === 1 ? "" : "s"} skipped`);
  const sample = lines[firstData];
  const delimiter = sample.includes("\t") ? "\t" : sample.includes(";") || decimal === "," ? ";" : ",";
  const cells = (line: string) =>
    line.split(delimiter).map((c) =>
      c
        .trim()
        .replace(/^"(.*)"$/, "$1")
        .trim(),
    );

  let index: number;
  const column = opts.column ?? 1;
  if (typeof column === "number" || /^\d+$/.test(column)) {
    index = Number(column) - 1;
    if (!Number.isInteger(index) || index < 0) return fail("log.column", `the column is counted from 1 (got ${column})`);
  } else {
    const header = skip > 0 ? cells(lines[skip - 1]) : [];
    index = header.findIndex((h) => h.toLowerCase() === column.toLowerCase());
    if (index < 0)
      return fail(
        "log.column",
        skip > 0
          ? `no column named "${column}" in the header line (${header.map((h) => `"${h}"`).join(", ")})`
          : `a column chosen by name needs the header line: skip at least one line`,
      );
  }

  const width = cells(sample).length;
  const factor = toSI(1, "pressure", { ...SI_UNITS, pressure: unit });
  const history: number[] = [];
  const errors: FieldError[] = [];
  for (let i = skip; i < lines.length && errors.length < MAX_ERRORS; i++) {
    const line = lines[i];
    if (line.trim() === "") continue;
    const row = cells(line);
    const where = `log.line ${i + 1}`;
    if (index >= row.length) {
      errors.push({
        path: where,
        message: `line ${i + 1} has ${row.length} column${row.length === 1 ? "" : "s"}, so no column ${index + 1}`,
      });
      continue;
    }
    if (row.length !== width) {
      errors.push({
        path: where,
        message: `line ${i + 1} has ${row.length} cells where the first data line has ${width}${delimiter === "," ? ' (is the decimal separator ","?)' : ""}`,
      });
      continue;
    }
    let cell = row[index];
    if (decimal === ",") cell = cell.replace(",", ".");
    if (!NUMBER.test(cell)) {
      errors.push({
        path: where,
        message: `line ${i + 1}, column ${index + 1}: "${row[index]}" is not a number${decimal === "." && /^\d+,\d+$/.test(row[index]) ? ' (is the decimal separator ","?)' : ""}`,
      });
      continue;
    }
    history.push(Number(cell) * factor);
  }
  if (errors.length) return { ok: false, errors };
  return { ok: true, history_MPa: history, rows: history.length, delimiter };
}
