/**
 * Lists of numbers typed or pasted into one field: a pressure history or test lives.
 * Accepted: numbers separated by spaces, commas, semicolons or new lines; or a CSV or
 * tab-separated table with one row per line (a logger's "time, pressure" export), of which the
 * last column is read. Lines of space-separated numbers are one list wrapped, not a table.
 * A first line without any number is taken as a header and skipped.
 */

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** One typed number, or undefined when the text is not a plain decimal number. */
export function parseNumber(text: string): number | undefined {
  const t = text.trim().replace(/\u2212/g, "-");
  return NUMBER.test(t) ? Number(t) : undefined;
}

/**
 * The list's entries in order. Entries that are not numbers are kept as text, so the check's
 * schema reports them with the same message the API gives ("each pressure … must be a number")
 * and points at their position.
 */
export function parseNumberList(text: string): (number | string)[] {
  const lines = text
    .split(/\r?\n/)
    .map((l) => l.trim())
    .filter((l) => l !== "");
  const anyNumber = (l: string) => l.split(/[\s,;]+/).some((t) => parseNumber(t) !== undefined);
  if (lines.length > 0 && !anyNumber(lines[0])) lines.shift();
  const cells = lines.map((l) => l.split(/\s*[,;\t]\s*/));
  const table = lines.length > 1 && cells[0].length > 1 && cells.every((r) => r.length === cells[0].length);
  const tokens = table ? cells.map((r) => r[r.length - 1]) : lines.flatMap((l) => l.split(/[\s,;]+/)).filter((t) => t !== "");
  return tokens.map((t) => parseNumber(t) ?? t);
}

/** Write a list back into its field: one entry per line for long lists, so a history reads as a column. */
export function formatNumberList(values: readonly number[], write: (x: number) => string): string {
  const parts = values.map(write);
  return values.length > 12 ? parts.join("\n") : parts.join(", ");
}
