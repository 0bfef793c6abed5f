/**
 * src/server.ts as a child process on loopback, on a database of its own, as a user starts it.
 * PORT=0 lets the system pick a free port; the server's "serving on" line tells which.
 */
import { spawn, type ChildProcessWithoutNullStreams } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { openSqliteStore as openStore } from "../../src/store/index.ts";

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
  /** A bearer token of an admin added to the server's records (the first call adds and signs in). */
  adminToken(): Promise<string>;
}

/** An invented admin for the server's records. */
const ADMIN = { name: "Orla Penhaligon-Voss", passphrase: "cobalt meadow lantern quay" };

export async function startServer(extraEnv: Record<string, string> = {}): Promise<ServerChild> {
  const dir = mkdtempSync(join(tmpdir(), "hoopwise-server-"));
  const dbPath = join(dir, "records.db");
  const env: NodeJS.ProcessEnv = { ...process.env, PORT: "0", HOOPWISE_DB: dbPath, ...extraEnv };
  if (!("HOST" in extraEnv)) delete env.HOST;
  // A developer's own DATABASE_URL must not turn the test server onto their records.
  if (!("DATABASE_URL" in extraEnv)) delete env.DATABASE_URL;
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
  let token: Promise<string> | undefined;
  const adminToken = () =>
    (token ??= (async () => {
      // Added through the records' own code, as `user add` does, by whoever owns the database file.
      const store = openStore({ path: dbPath, passphraseCost: { n: 2 ** 10, r: 8, p: 1 } });
      try {
        await store.addUser({ ...ADMIN, role: "admin" }, "database-owner", "test");
      } finally {
        await store.close();
      }
      const res = await fetch(`${base}/api/v1/session`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ name: ADMIN.name, passphrase: ADMIN.passphrase }),
      });
      if (res.status !== 201) throw new Error(`sign-in to the test server answered ${res.status}: ${await res.text()}`);
      return ((await res.json()) as { token: string }).token;
    })());
  return { child, pid: child.pid as number, base, dbPath, output: () => output, exited, dispose, adminToken };
}
