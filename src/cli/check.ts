/**
 * @module cli/check
 * `check FILE|- [--log LOG.csv [--column N|NAME] [--unit kPa] [--decimal ,] [--skip N] [--gate X]]`:
 * the result JSON on standard output, exit 0 whatever the verdict; exit 2 with the errors document.
 * With --log the check's pressure becomes the log's column as a history (in --unit, MPa unless
 * told), and --gate (in the same unit) sets the hysteresis gate ahead of counting.
 * The check is read by readJsonArg (io.ts), the log by the same reader the page uses
 * (src/schema/pressureLog.ts), and the result comes from the engine's checkDocument; the option
 * at fault is the errors' path, as a field is for the check. How many points the log gave goes to
 * standard error, so standard output stays one JSON document.
 */
import { readFileSync } from "node:fs";
import { checkDocument } from "../engine/index.ts";
import { readPressureLog, type LogOptions } from "../schema/pressureLog.ts";
import { readJsonArg, type Io } from "./io.ts";

const LOG_OPTIONS = ["--log", "--column", "--unit", "--decimal", "--skip", "--gate"] as const;
type ArgErrors = { path: string; message: string }[];

const fail = (io: Io, errors: ArgErrors) => {
  io.stdout.write(`${JSON.stringify({ errors }, null, 2)}\n`);
  return 2;
};

export async function checkCommand(args: string[], io: Io): Promise<number> {
  const values: Partial<Record<(typeof LOG_OPTIONS)[number], string>> = {};
  const positional: string[] = [];
  const errors: ArgErrors = [];
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if ((LOG_OPTIONS as readonly string[]).includes(a)) {
      if (i + 1 >= args.length) errors.push({ path: a, message: `${a} needs a value` });
      else values[a as (typeof LOG_OPTIONS)[number]] = args[++i];
    } else positional.push(a);
  }
  if (!values["--log"])
    for (const k of LOG_OPTIONS)
      if (k !== "--log" && values[k] !== undefined) errors.push({ path: k, message: `${k} goes with --log LOG.csv` });
  if (errors.length) return fail(io, errors);

  const doc = await readJsonArg(positional[0], io);
  if (!doc.ok) return fail(io, doc.errors);
  let document = doc.value;
  if (values["--log"]) {
    const withLog = applyLog(document, values, io);
    if (!withLog.ok) return fail(io, withLog.errors);
    document = withLog.document;
  }
  const out = checkDocument(document);
  if (!out.ok) return fail(io, out.errors);
  io.stdout.write(`${JSON.stringify(out.result, null, 2)}\n`);
  return 0;
}

function applyLog(
  document: unknown,
  values: Partial<Record<(typeof LOG_OPTIONS)[number], string>>,
  io: Io,
): { ok: true; document: unknown } | { ok: false; errors: ArgErrors } {
  const file = values["--log"]!;
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (err) {
    return {
      ok: false,
      errors: [{ path: "--log", message: `cannot read ${file}: ${(err as NodeJS.ErrnoException).code ?? (err as Error).message}` }],
    };
  }
  const skip = values["--skip"] === undefined ? 0 : Number(values["--skip"]);
  const opts: LogOptions = {
    column: values["--column"],
    unit: values["--unit"] as LogOptions["unit"],
    decimal: values["--decimal"] as LogOptions["decimal"],
    skip,
  };
  const log = readPressureLog(text, opts);
  if (!log.ok) return log;
  if (document === null || typeof document !== "object" || Array.isArray(document))
    return { ok: false, errors: [{ path: "(document)", message: "the check must be a JSON object" }] };
  let gate: number | undefined;
  if (values["--gate"] !== undefined) {
    gate = Number(values["--gate"]);
    if (!Number.isFinite(gate) || gate < 0)
      return { ok: false, errors: [{ path: "--gate", message: `the gate must be a number, 0 or more (got "${values["--gate"]}")` }] };
    gate *= unitFactor(opts);
  }
  io.stderr.write(`log ${file}: ${log.rows} points read (cells separated by ${log.delimiter === "\t" ? "tabs" : `"${log.delimiter}"`})\n`);
  const pressure: Record<string, unknown> = { history_MPa: log.history_MPa };
  if (gate !== undefined) pressure.gate_MPa = gate;
  return { ok: true, document: { ...(document as object), pressure } };
}

/** MPa per unit of the log, the same factor the log reader used. */
function unitFactor(opts: LogOptions): number {
  const one = readPressureLog("1", { unit: opts.unit });
  return one.ok ? one.history_MPa[0] : 1;
}
