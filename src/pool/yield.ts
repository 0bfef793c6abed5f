import { setPriority } from "node:os";
import { workerData } from "node:worker_threads";

/**
 * Imported first by the worker entry: on Linux the nice value belongs to a thread, and priority 0
 * of `setPriority` means the calling thread, so this lowers only the worker thread. A long check
 * then gives way to the request thread whenever both want a core, and small requests stay quick.
 * Where the system refuses (or applies it process-wide elsewhere), the worker runs at normal priority.
 * A pool with no request thread to give way to (a batch run) asks for none.
 */
export const WORKER_NICE = 10;
if (process.platform === "linux" && (workerData as { yieldToRequests?: boolean } | undefined)?.yieldToRequests !== false) {
  try {
    setPriority(WORKER_NICE);
  } catch {
    // not allowed here: run at the inherited priority
  }
}
