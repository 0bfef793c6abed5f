/**
 * src/server.ts as a child process on loopback, on a database of its own, as a user starts it.
 * PORT=0 lets the system pick a free port; the server's "serving on" line tells which.
 */
import { spawn, type ChildProcessWithoutNullStreams } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";

const ROOT = fileURLToPath(new URL("../..", import.meta.url));
/** Start-up includes compiling the TypeScript; generous so a slow CI machine is not taken for a broken server. */
const START_LIMIT_MS = 60_000;

export interface ServerChild {
  child: ChildProcessWithoutNullStreams;
  pid: number;
  /** http://127.0.0.1:<port> */
  base: string;
  dbPath: string;
  /** Everything the server has printed so far, standard output and error together. */
  output(): string;
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
  /** Kill the server if it still runs (SIGKILL, by its id) and remove its database folder. */
  dispose(): Promise<void>;
}

export async function startServer(extraEnv: Record<string, string> = {}): Promise<ServerChild> {
  const dir = mkdtempSync(join(tmpdir(), "hoopwise-server-"));
  const dbPath = join(dir, "records.db");
  const env: NodeJS.ProcessEnv = { ...process.env, PORT: "0", HOOPWISE_DB: dbPath, ...extraEnv };
  if (!("HOST" in extraEnv)) delete env.HOST;
  const child = spawn(process.execPath, ["--import", "tsx", "src/server.ts"], { cwd: ROOT, env });
  let output = "";
  child.stdout.setEncoding("utf8").on("data", (s: string) => (output += s));
  child.stderr.setEncoding("utf8").on("data", (s: string) => (output += s));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
    child.on("exit", (code, signal) => resolve({ code, signal })),
  );
  const dispose = async () => {
    if (child.exitCode === null && child.signalCode === null) {
      child.kill("SIGKILL");
      await exited;
    }
    rmSync(dir, { recursive: true, force: true });
  };
  const base = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(
      () => reject(new Error(`the server did not say where it serves within ${START_LIMIT_MS / 1000} s:\n${output}`)),
      START_LIMIT_MS,
    );
    const look = () => {
      const m = /serving on (http:\/\/[^\s/]+)\//.exec(output);
      if (m) {
        clearTimeout(timer);
        resolve(m[1]);
      }
    };
    child.stdout.on("data", look);
    void exited.then(({ code, signal }) => {
      clearTimeout(timer);
      reject(new Error(`the server exited (${code ?? signal}) before serving:\n${output}`));
    });
  }).catch(async (err: unknown) => {
    await dispose();
    throw err;
  });
  return { child, pid: child.pid as number, base, dbPath, output: () => output, exited, dispose };
}
