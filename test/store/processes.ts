import { spawn, type ChildProcessWithoutNullStreams } from "node:child_process";
import { fileURLToPath } from "node:url";

const SAVE_LOOP = fileURLToPath(new URL("./fixtures/saveLoop.ts", import.meta.url));

/** A save-loop child process and the revision numbers it has reported as committed. */
export interface Saver {
  child: ChildProcessWithoutNullStreams;
  committed: number[];
  /** Resolves once the child has printed `lines` lines in all (including "ready"). */
  linesSeen(lines: number): Promise<void>;
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null; stderr: string }>;
}

/** `place`: the records as the store options that open them (an SQLite path, or a PostgreSQL URL and schema). */
export function startSaver(place: object, checkId: string, count: number, tag: string, wait = false): Saver {
  const child = spawn(process.execPath, [
    "--import",
    "tsx",
    SAVE_LOOP,
    JSON.stringify(place),
    checkId,
    String(count),
    tag,
    ...(wait ? ["--wait"] : []),
  ]);
  const committed: number[] = [];
  let lines = 0;
  let partial = "";
  let stderr = "";
  const waiters: { lines: number; resolve: () => void }[] = [];
  child.stdout.setEncoding("utf8").on("data", (chunk: string) => {
    const parts = (partial + chunk).split("\n");
    partial = parts.pop() ?? "";
    for (const line of parts) {
      lines++;
      if (/^\d+$/.test(line)) committed.push(Number(line));
    }
    for (const w of waiters.filter((w) => lines >= w.lines)) w.resolve();
  });
  child.stderr.setEncoding("utf8").on("data", (chunk: string) => (stderr += chunk));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null; stderr: string }>((resolve) =>
    child.on("close", (code, signal) => resolve({ code, signal, stderr })),
  );
  return {
    child,
    committed,
    exited,
    linesSeen: (n) =>
      new Promise<void>((resolve, reject) => {
        if (lines >= n) return resolve();
        waiters.push({ lines: n, resolve });
        void exited.then((e) => reject(new Error(`save-loop exited (${e.code ?? e.signal}) after ${lines} lines: ${e.stderr}`)));
      }),
  };
}
