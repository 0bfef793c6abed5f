/**
 * The ways a PDF render can fail that a face (CLI, HTTP) should tell apart.
 * Each carries a message in plain words that can be shown to a user as it is.
 *
 * HTTP mapping the faces are expected to use:
 *   BrowserUnavailableError → 503 (no Chromium, or the server is shutting down)
 *   PoolBusyError           → 503 with `Retry-After: retryAfter_s`
 *   RenderTimeoutError      → 503 (the pool has already recovered the page)
 *   BrowserCrashedError     → 503 with `Retry-After` (the next render starts a new Chromium)
 */

/** No usable Chromium: none at the configured path, it would not start, or the pool was closed. */
export class BrowserUnavailableError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = "BrowserUnavailableError";
  }
}

/** Every render slot is taken and the waiting line is full (or waited too long). */
export class PoolBusyError extends Error {
  constructor(
    /** Whole seconds after which a retry is likely to find a free slot. */
    readonly retryAfter_s: number,
  ) {
    super(`The PDF renderer is busy; try again in ${retryAfter_s} s.`);
    this.name = "PoolBusyError";
  }
}

/** One render took longer than its time limit. */
export class RenderTimeoutError extends Error {
  constructor(readonly timeout_ms: number) {
    super(`The PDF render did not finish within ${timeout_ms} ms.`);
    this.name = "RenderTimeoutError";
  }
}

/** Chromium went away during the render (killed, crashed, out of memory). */
export class BrowserCrashedError extends Error {
  constructor(options?: { cause?: unknown }) {
    super("Chromium stopped during the render; the next render starts a new one.", options);
    this.name = "BrowserCrashedError";
  }
}
