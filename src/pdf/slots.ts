/**
 * @module pdf/slots
 * Admission to the renderer: at most `concurrency` renders hold a page at once, at most
 * `queueLimit` wait in line for one, and none waits longer than `queueWait_ms`. A render refused
 * gets PoolBusyError with a Retry-After hint worked out from the recent render time and the
 * renders ahead of it. Kept apart from the browser's life (browser.ts) so each can be read alone:
 * this part knows nothing of Chromium.
 */
import { PoolBusyError } from "./errors.ts";

interface Waiter {
  admit(): void;
  refuse(error: Error): void;
  timer: NodeJS.Timeout;
}

export class RenderSlots {
  running = 0;
  peakRunning = 0;
  private readonly waiters: Waiter[] = [];
  private idle: (() => void) | null = null;

  constructor(
    private readonly limits: { concurrency: number; queueLimit: number; queueWait_ms: number },
    /** The recent mean time of one render, for the Retry-After hint. */
    private readonly meanRender_ms: () => number,
  ) {}

  get queued(): number {
    return this.waiters.length;
  }

  /** Seconds until a refused render could expect a page: the renders ahead of it over the pages. */
  retryAfter_s(): number {
    const ahead = this.running + this.waiters.length;
    return Math.max(1, Math.ceil((this.meanRender_ms() * ahead) / this.limits.concurrency / 1000));
  }

  /** A slot now, a place in line, or PoolBusyError when the line is full or the wait too long. */
  acquire(): Promise<void> {
    if (this.running < this.limits.concurrency) {
      this.running += 1;
      this.peakRunning = Math.max(this.peakRunning, this.running);
      return Promise.resolve();
    }
    if (this.waiters.length >= this.limits.queueLimit) return Promise.reject(new PoolBusyError(this.retryAfter_s()));
    return new Promise((admit, refuse) => {
      const waiter: Waiter = {
        admit,
        refuse,
        timer: setTimeout(() => {
          this.waiters.splice(this.waiters.indexOf(waiter), 1);
          refuse(new PoolBusyError(this.retryAfter_s()));
        }, this.limits.queueWait_ms),
      };
      this.waiters.push(waiter);
    });
  }

  /** Hand the slot straight to the next waiter, so `running` never passes the bound. */
  release(): void {
    const next = this.waiters.shift();
    if (next) {
      clearTimeout(next.timer);
      next.admit();
      return;
    }
    this.running -= 1;
    if (this.running === 0) this.idle?.();
  }

  /** Refuse everyone in line (on shutdown). */
  refuseWaiting(error: Error): void {
    for (const waiter of this.waiters.splice(0)) {
      clearTimeout(waiter.timer);
      waiter.refuse(error);
    }
  }

  /** Resolves when no render holds a slot. */
  drained(): Promise<void> {
    if (this.running === 0) return Promise.resolve();
    return new Promise<void>((resolve) => {
      this.idle = resolve;
    });
  }
}
