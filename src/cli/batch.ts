import { createReadStream } from "node:fs";
import { availableParallelism } from "node:os";
import { createInterface } from "node:readline";
import { createPool, type CheckAnswer, type WorkPool } from "../pool/index.ts";
import type { Io } from "./io.ts";

/** Documents handed to a worker at once: enough to make the hand-over cheap beside the checks, few enough to keep every worker busy. */
const PER_TASK = 16;
/** Tasks in flight per worker: the input is read ahead by this much and no further, so memory stays bounded on any length of input. */
const AHEAD_PER_WORKER = 4;
const MAX_WORKERS = 256;
const PROGRESS_EVERY_MS = 1000;

const errorsLine = (path: string, message: string) => JSON.stringify({ errors: [{ path, message }] });

/**
 * `batch FILE|- [--workers N]`: one check document per line (NDJSON) in, one answer per line out,
 * in input order — the result document, or the errors document of that line (a blank line, text
 * that is not JSON, a check that does not validate) — and the run goes on. The checks run in a
 * pool of worker threads, one per core unless --workers says otherwise. A progress line goes to
 * standard error. Exit 0 when every line gave a result, 2 when any line gave errors.
 */
export async function batchCommand(args: string[], io: Io): Promise<number> {
  let file: string | undefined;
  let workers = availableParallelism();
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a === "--workers") {
      const n = Number(args[++i]);
      if (!Number.isInteger(n) || n < 1 || n > MAX_WORKERS) {
        io.stdout.write(
          `${errorsLine("--workers", `give the number of worker threads, a whole number from 1 to ${MAX_WORKERS} (got "${args[i] ?? ""}")`)}\n`,
        );
        return 2;
      }
      workers = n;
    } else if (file === undefined) file = a;
    else {
      io.stdout.write(`${errorsLine("(arguments)", `one input only: a file, or - for standard input (got also "${a}")`)}\n`);
      return 2;
    }
  }
  if (!file) {
    io.stdout.write(`${errorsLine("(file)", "give an NDJSON file (one check per line), or - to read standard input")}\n`);
    return 2;
  }
  const stream: NodeJS.ReadableStream = file === "-" ? io.stdin : createReadStream(file);
  const opened = await new Promise<string | undefined>((resolve) => {
    if (file === "-") return resolve(undefined);
    stream.once("error", (err: Error) => resolve((err as NodeJS.ErrnoException).code ?? (err as Error).message));
    stream.once("readable", () => resolve(undefined));
  });
  if (opened) {
    io.stdout.write(`${errorsLine("(file)", `cannot read ${file}: ${opened}`)}\n`);
    return 2;
  }

  const pool = createPool({ threads: workers, maxQueue: Number.POSITIVE_INFINITY, yieldToRequests: false });
  try {
    const { invalid } = await runBatch(stream, io, pool);
    return invalid > 0 ? 2 : 0;
  } finally {
    await pool.close();
  }
}

/** The batch itself over a pool the caller owns (the bench runs it on warm pools of one and two threads). */
export async function runBatch(
  stream: NodeJS.ReadableStream,
  io: Pick<Io, "stdout" | "stderr">,
  pool: WorkPool,
): Promise<{ lines: number; invalid: number }> {
  const workers = pool.threads;
  const started = performance.now();
  let read = 0;
  let written = 0;
  let invalid = 0;
  let lastProgress = 0;
  const tty = Boolean((io.stderr as { isTTY?: boolean }).isTTY);
  const progress = (final = false) => {
    const now = performance.now();
    if (!final && now - lastProgress < PROGRESS_EVERY_MS) return;
    lastProgress = now;
    const rate = written / Math.max(1e-3, (now - started) / 1000);
    io.stderr.write(
      `batch: ${written} of ${read}${final ? "" : "+"} lines answered, ${invalid} with errors, ${rate.toFixed(0)} checks/s on ${workers} worker${workers === 1 ? "" : "s"}${final || !tty ? "\n" : "\r"}`,
    );
  };
  // Answers wait here until every line before them is written.
  const pending: Promise<CheckAnswer[]>[] = [];
  const writeReady = async () => {
    const answers = await pending.shift()!;
    let out = "";
    for (const a of answers) {
      if (a.status !== 200) invalid++;
      out += `${a.body}\n`;
    }
    written += answers.length;
    io.stdout.write(out);
    progress();
  };
  let group: string[] = [];
  const send = () => {
    const texts = group;
    group = [];
    pending.push(
      pool
        .checkMany(texts.map((t) => (t.trim() === "" ? "" : t)))
        .then((answers) =>
          answers.map((a, k) =>
            texts[k].trim() === ""
              ? { status: 400 as const, body: errorsLine("(line)", "the line is blank; give one check document per line") }
              : a,
          ),
        ),
    );
  };
  {
    const lines = createInterface({ input: stream, crlfDelay: Number.POSITIVE_INFINITY });
    for await (const line of lines) {
      read++;
      group.push(line);
      if (group.length === PER_TASK) send();
      while (pending.length >= workers * AHEAD_PER_WORKER) await writeReady();
    }
    if (group.length) send();
    while (pending.length) await writeReady();
  }
  progress(true);
  return { lines: read, invalid };
}
