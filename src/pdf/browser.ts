/**
 * A Chromium pool: one browser per process, started on first use and reused, with a bounded number
 * of pages rendering at once and a bounded line of renders waiting for a page.
 *
 *   const pool = createBrowserPool({ concurrency: 2 });
 *   const pdf = await pool.withPage((page) => page.pdf());   // usually through renderPdf (pdf.ts)
 *   await pool.close();                                      // on shutdown: no Chromium left behind
 *
 * - No Chromium at the configured path: BrowserUnavailableError (nothing is launched).
 * - All pages busy and the line full, or waited longer than `queueWait_ms`: PoolBusyError, with a
 *   Retry-After hint in seconds.
 * - A render longer than its time limit: RenderTimeoutError; its page is closed, not reused.
 * - Chromium killed or crashed mid-render: that render gets BrowserCrashedError; the next starts a
 *   new Chromium.
 * - close(): refuses new work, lets running renders finish (each within its time limit), closes
 *   Chromium and kills anything left of its process group, and removes its profile directory.
 */
import type { Page } from "puppeteer-core";
import { disposeChromium, launchChromium, resolveChromiumPath, type RunningChromium } from "./chromium.ts";
import { BrowserCrashedError, BrowserUnavailableError, RenderTimeoutError } from "./errors.ts";
import { RenderSlots } from "./slots.ts";

export interface PoolOptions {
  /** Chromium to run. Default: `CHROME_PATH`, else /usr/bin/chromium, looked up at first launch. */
  executablePath?: string;
  /** Renders at once, each on its own page. Default 2. */
  concurrency?: number;
  /** Renders that may wait for a page; one more is refused at once with PoolBusyError. Default 16. */
  queueLimit?: number;
  /** Longest wait for a page before PoolBusyError. Default 30 000 ms. */
  queueWait_ms?: number;
  /** Time limit of one render, from taking a page to returning it. Default 30 000 ms. */
  renderTimeout_ms?: number;
  /** Time limit for Chromium to start. Default 30 000 ms. */
  launchTimeout_ms?: number;
}

export interface PoolStats {
  /** Renders holding a page now. */
  running: number;
  /** Renders waiting for a page now. */
  queued: number;
  /** Most renders that held a page at the same time since the pool was made. */
  peakRunning: number;
  /** Chromium starts since the pool was made (more than one after a crash). */
  launches: number;
  /** Process id (and process group id) of the running Chromium, null when none runs. */
  browserPid: number | null;
  /** Moving average of recent render times, the basis of the Retry-After hint. */
  meanRender_ms: number;
}

export interface BrowserPool {
  /** Run `work` on a page of the shared browser; the page goes back to the pool afterwards. */
  withPage<T>(work: (page: Page) => Promise<T>, options?: { timeout_ms?: number }): Promise<T>;
  stats(): PoolStats;
  /** Clean shutdown; safe to call more than once. Later calls to withPage get BrowserUnavailableError. */
  close(): Promise<void>;
}

const DEFAULTS: Required<Omit<PoolOptions, "executablePath">> = {
  concurrency: 2,
  queueLimit: 16,
  queueWait_ms: 30_000,
  renderTimeout_ms: 30_000,
  launchTimeout_ms: 30_000,
};

const SHUT_DOWN = "The PDF renderer has been shut down.";

/** A page that does not close within this time means a browser that no longer answers. */
const PAGE_CLOSE_LIMIT_MS = 5_000;

/** The pool's options with the defaults filled in, each checked. */
function settle(options: PoolOptions): typeof DEFAULTS & Pick<PoolOptions, "executablePath"> {
  const o = { ...DEFAULTS, ...withoutUndefined(options) };
  for (const key of ["concurrency", "queueLimit", "queueWait_ms", "renderTimeout_ms", "launchTimeout_ms"] as const) {
    const min = key === "queueLimit" ? 0 : 1;
    if (!Number.isInteger(o[key]) || o[key] < min) {
      throw new RangeError(`${key} must be a whole number of at least ${min}; got ${o[key]}.`);
    }
  }
  return o;
}

/**
 * The pool in three parts: admission (slots.ts: how many render, how many wait), the browser's
 * life (one Chromium, started on demand and replaced after a crash, with its idle pages), and one
 * render on a page (its time limit, and what happens to a page whose state is unknown).
 */
export function createBrowserPool(options: PoolOptions = {}): BrowserPool {
  const o = settle(options);
  let current: RunningChromium | null = null;
  let starting: Promise<RunningChromium> | null = null;
  let idle: Page[] = [];
  let launches = 0;
  // A first guess that covers a cold start, replaced by measurements as renders finish.
  let meanRender_ms = 1_000;
  let closed = false;
  let closing: Promise<void> | null = null;
  const slots = new RenderSlots(o, () => meanRender_ms);

  function ensureBrowser(): Promise<RunningChromium> {
    if (current?.browser.connected) return Promise.resolve(current);
    starting ??= start().finally(() => {
      starting = null;
    });
    return starting;
  }

  async function start(): Promise<RunningChromium> {
    const executablePath = o.executablePath ?? resolveChromiumPath();
    const chromium = await launchChromium(executablePath, {
      launchTimeout_ms: o.launchTimeout_ms,
      // Stray protocol calls of an abandoned render end soon after its time limit.
      protocolTimeout_ms: o.renderTimeout_ms + 10_000,
    });
    launches += 1;
    chromium.browser.once("disconnected", () => {
      forget(chromium);
      void disposeChromium(chromium);
    });
    current = chromium;
    idle = [];
    return chromium;
  }

  function forget(chromium: RunningChromium): void {
    if (current === chromium) {
      current = null;
      idle = [];
    }
  }

  async function takePage(chromium: RunningChromium): Promise<Page> {
    for (let page = idle.pop(); page; page = idle.pop()) {
      if (!page.isClosed()) return page;
    }
    return chromium.browser.newPage();
  }

  function givePageBack(chromium: RunningChromium, page: Page): void {
    if (current === chromium && !closed && !page.isClosed() && idle.length < o.concurrency) {
      idle.push(page);
    } else {
      void page.close().catch(() => {});
    }
  }

  /** Close a page whose state is unknown; a browser that cannot even do that is replaced. */
  async function discardPage(chromium: RunningChromium, page: Page | undefined): Promise<void> {
    if (!page) return;
    const closedInTime = await Promise.race([
      page.close().then(
        () => true,
        () => page.isClosed(),
      ),
      delay(PAGE_CLOSE_LIMIT_MS).then(() => false),
    ]);
    if (!closedInTime) {
      forget(chromium);
      await disposeChromium(chromium);
    }
  }

  async function runOnPage<T>(chromium: RunningChromium, work: (page: Page) => Promise<T>, timeout_ms: number): Promise<T> {
    const started = performance.now();
    let page: Page | undefined;
    const attempt = (async () => {
      page = await takePage(chromium);
      return work(page);
    })();
    let timer: NodeJS.Timeout | undefined;
    const expired = new Promise<never>((_, reject) => {
      timer = setTimeout(() => reject(new RenderTimeoutError(timeout_ms)), timeout_ms);
    });
    try {
      const result = await Promise.race([attempt, expired]);
      meanRender_ms = 0.8 * meanRender_ms + 0.2 * (performance.now() - started);
      givePageBack(chromium, page!);
      return result;
    } catch (error) {
      // An abandoned attempt may still get its page later; close it whenever it settles.
      void attempt.then(
        () => page?.close().catch(() => {}),
        () => page?.close().catch(() => {}),
      );
      if (!chromium.browser.connected) throw new BrowserCrashedError({ cause: error });
      await discardPage(chromium, page);
      throw error;
    } finally {
      clearTimeout(timer);
    }
  }

  async function withPage<T>(work: (page: Page) => Promise<T>, options: { timeout_ms?: number } = {}): Promise<T> {
    const timeout_ms = options.timeout_ms ?? o.renderTimeout_ms;
    if (closed) throw new BrowserUnavailableError(SHUT_DOWN);
    await slots.acquire();
    try {
      const chromium = await ensureBrowser();
      return await runOnPage(chromium, work, timeout_ms);
    } finally {
      slots.release();
    }
  }

  function close(): Promise<void> {
    closing ??= (async () => {
      closed = true;
      slots.refuseWaiting(new BrowserUnavailableError(SHUT_DOWN));
      await slots.drained();
      const chromium = current;
      current = null;
      idle = [];
      if (chromium) await disposeChromium(chromium);
    })();
    return closing;
  }

  return {
    withPage,
    close,
    stats: () => ({
      running: slots.running,
      queued: slots.queued,
      peakRunning: slots.peakRunning,
      launches,
      browserPid: current?.pid ?? null,
      meanRender_ms,
    }),
  };
}

let shared: BrowserPool | null = null;

/** The process-wide pool with default options, made on first use (Chromium starts on first render). */
export function sharedPool(): BrowserPool {
  shared ??= createBrowserPool();
  return shared;
}

/**
 * Close the process-wide pool, if one was made. A CLI must call this before it ends: a running
 * Chromium keeps Node's event loop alive.
 */
export async function closeSharedPool(): Promise<void> {
  const pool = shared;
  shared = null;
  await pool?.close();
}

function delay(ms: number): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, ms).unref());
}

function withoutUndefined<T extends object>(value: T): Partial<T> {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined)) as Partial<T>;
}
