/**
 * @module pool
 * A pool of worker threads (node:worker_threads through piscina) for work too big for the request
 * thread: a long pressure history is parsed, validated, counted and checked there, so the event loop
 * keeps answering small requests meanwhile. The workers load TypeScript the way the main thread does
 * (tsx), whatever flags the parent process was started with.
 * Here: the pool's face (WorkPool: check one document or several, prepare a records import,
 * preview a logger's file), createPool with its thread count, queue length and priority, the
 * process's one shared pool, and WorkPoolBusy for a full queue, which the routes answer with 503.
 * The work itself is in work.ts, re-exported so a small document is worked in place with the same
 * code; worker.ts is a thread's entry. Used by the JSON API, the records import, the log preview
 * (src/web) and the batch command (src/cli/batch.ts).
 */
import { availableParallelism } from "node:os";
import { Piscina } from "piscina";
import type { ImportKeys } from "../store/exchange.ts";
import type { LogOptions } from "../schema/pressureLog.ts";
import type { CheckAnswer, ImportAnswer, LogPreview } from "./work.ts";
import type { Task } from "./worker.ts";

export { checkText, checkValue, prepareImportText, previewLogText, type CheckAnswer, type ImportAnswer, type LogPreview } from "./work.ts";

export interface WorkPool {
  /** Check a document given as text or as UTF-8 bytes (the bytes' buffer is moved to the worker, not copied). */
  check(doc: string | Uint8Array): Promise<CheckAnswer>;
  /** Several documents in one hand-over to a thread; the answers in the same order. */
  checkMany(texts: string[]): Promise<CheckAnswer[]>;
  /** A records import's document (UTF-8 bytes, moved to the worker) parsed, validated and its signatures checked against `keys`. */
  prepareImport(bytes: Uint8Array, keys: ImportKeys): Promise<ImportAnswer>;
  /** A logger's file (UTF-8 bytes, moved to the worker) read and drawn for the page's preview. */
  previewLog(bytes: Uint8Array, opts: LogOptions): Promise<LogPreview>;
  readonly threads: number;
  close(): Promise<void>;
}

export interface PoolOptions {
  /** Worker threads; one per core by default. */
  threads?: number;
  /** Tasks that may wait for a thread; beyond it `check` rejects with WorkPoolBusy. */
  maxQueue?: number;
  /** Lower the workers' priority below the request thread's (default); a batch run, with no requests to serve, says false. */
  yieldToRequests?: boolean;
}

/** Every thread is busy and the queue is full: the caller answers 503 and asks to come back. */
export class WorkPoolBusy extends Error {}

/** The young generation of each worker, in MiB (V8 splits it in three: two semi-spaces of 2 MiB and room to promote). */
export const YOUNG_GENERATION_MB = 6;

const WORKER = new URL("./worker.ts", import.meta.url).href;

export function createPool(opts: PoolOptions = {}): WorkPool {
  const threads = Math.max(1, opts.threads ?? availableParallelism());
  const piscina = new Piscina<Task, CheckAnswer | CheckAnswer[] | ImportAnswer | LogPreview>({
    filename: WORKER,
    minThreads: threads,
    maxThreads: threads,
    idleTimeout: 30_000,
    maxQueue: opts.maxQueue ?? 64,
    concurrentTasksPerWorker: 1,
    execArgv: ["--import", "tsx"],
    workerData: { yieldToRequests: opts.yieldToRequests !== false },
    // A long check makes much short-lived garbage (a number's text, a slice of the history); a small
    // young generation collects it often instead of growing to 48 MiB, which keeps a worker's peak
    // memory near the size of the document it works.
    resourceLimits: { maxYoungGenerationSizeMb: YOUNG_GENERATION_MB },
  });
  return {
    threads,
    async check(doc) {
      try {
        if (typeof doc === "string") return (await piscina.run({ kind: "check", text: doc })) as CheckAnswer;
        const own = doc.byteOffset === 0 && doc.byteLength === doc.buffer.byteLength ? doc : doc.slice();
        return (await piscina.run({ kind: "check-bytes", bytes: own }, { transferList: [own.buffer as ArrayBuffer] })) as CheckAnswer;
      } catch (err) {
        if (/queue is at limit/i.test((err as Error).message)) throw new WorkPoolBusy((err as Error).message);
        throw err;
      }
    },
    async prepareImport(bytes, keys) {
      const own = bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength ? bytes : bytes.slice();
      try {
        return (await piscina.run(
          { kind: "prepare-import", bytes: own, keys },
          { transferList: [own.buffer as ArrayBuffer] },
        )) as ImportAnswer;
      } catch (err) {
        if (/queue is at limit/i.test((err as Error).message)) throw new WorkPoolBusy((err as Error).message);
        throw err;
      }
    },
    async previewLog(bytes, opts) {
      const own = bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength ? bytes : bytes.slice();
      try {
        return (await piscina.run({ kind: "log-preview", bytes: own, opts }, { transferList: [own.buffer as ArrayBuffer] })) as LogPreview;
      } catch (err) {
        if (/queue is at limit/i.test((err as Error).message)) throw new WorkPoolBusy((err as Error).message);
        throw err;
      }
    },
    async checkMany(texts) {
      try {
        return (await piscina.run({ kind: "check-many", texts })) as CheckAnswer[];
      } catch (err) {
        if (/queue is at limit/i.test((err as Error).message)) throw new WorkPoolBusy((err as Error).message);
        throw err;
      }
    },
    close: () => piscina.destroy(),
  };
}

let shared: WorkPool | undefined;

/** The process's one pool, started on first use. */
export function sharedPool(): WorkPool {
  shared ??= createPool();
  return shared;
}

export async function closeSharedWorkPool(): Promise<void> {
  const p = shared;
  shared = undefined;
  await p?.close();
}
