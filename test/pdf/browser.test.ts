import { existsSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { createBrowserPool } from "../../src/pdf/browser.ts";
import { resolveChromiumPath } from "../../src/pdf/chromium.ts";
import { BrowserCrashedError, BrowserUnavailableError, PoolBusyError, RenderTimeoutError } from "../../src/pdf/errors.ts";
import { renderBlankPdf, renderPdf } from "../../src/pdf/pdf.ts";
import { chromiumBelow, commandLine, eventually, liveInGroup } from "./processes.ts";

/** A promise with its resolve exposed, to hold a page for as long as a test needs. */
function gate(): { open(): void; opened: Promise<void> } {
  let open = () => {};
  const opened = new Promise<void>((resolve) => (open = resolve));
  return { open, opened };
}

describe("finding Chromium", () => {
  it("names the missing path and the way out, without launching anything", async () => {
    expect(() => resolveChromiumPath({ CHROME_PATH: "/nonexistent/chromium" })).toThrow(BrowserUnavailableError);
    expect(() => resolveChromiumPath({ CHROME_PATH: "/nonexistent/chromium" })).toThrow(
      /No Chromium found at \/nonexistent\/chromium \(from CHROME_PATH\).*set CHROME_PATH/,
    );
    // A file that exists but is not executable is refused the same way.
    const dir = mkdtempSync(join(tmpdir(), "hoopwise-test-"));
    const plain = join(dir, "chromium");
    writeFileSync(plain, "not a program", { mode: 0o644 });
    expect(() => resolveChromiumPath({ CHROME_PATH: plain })).toThrow(BrowserUnavailableError);
    rmSync(dir, { recursive: true });

    const before = chromiumBelow().length;
    const pool = createBrowserPool({ executablePath: "/nonexistent/chromium" });
    await expect(renderBlankPdf({ pool })).rejects.toBeInstanceOf(BrowserUnavailableError);
    expect(pool.stats()).toMatchObject({ running: 0, launches: 0, browserPid: null });
    expect(chromiumBelow()).toHaveLength(before);
    await pool.close();
  });

  it("reports a program that is not Chromium as unavailable, not as a crash", { timeout: 60_000 }, async () => {
    const pool = createBrowserPool({ executablePath: "/bin/true" }); // exits at once, says nothing
    await expect(renderBlankPdf({ pool })).rejects.toThrow(/Chromium at \/bin\/true would not start/);
    await expect(renderBlankPdf({ pool })).rejects.toBeInstanceOf(BrowserUnavailableError);
    expect(pool.stats()).toMatchObject({ running: 0, launches: 0 });
    await pool.close();
  });

  it("uses CHROME_PATH when set and Debian's path otherwise", () => {
    expect(resolveChromiumPath({ CHROME_PATH: "/usr/bin/chromium" })).toBe("/usr/bin/chromium");
    expect(resolveChromiumPath({})).toBe("/usr/bin/chromium");
  });
});

describe("the pool", () => {
  it("refuses at once with PoolBusyError when every page is busy and the line is full", { timeout: 60_000 }, async () => {
    const pool = createBrowserPool({ concurrency: 1, queueLimit: 1 });
    try {
      const hold = gate();
      const first = pool.withPage(() => hold.opened.then(() => "first"));
      const second = pool.withPage(async () => "second");
      const third = pool.withPage(async () => "third");
      const busy = await third.then(
        () => null,
        (e: unknown) => e,
      );
      expect(busy).toBeInstanceOf(PoolBusyError);
      // Retry-After takes whole seconds (RFC 9110, 10.2.3); 0 would invite an instant retry.
      const retryAfter = (busy as PoolBusyError).retryAfter_s;
      expect(Number.isInteger(retryAfter) && retryAfter >= 1).toBe(true);
      expect(pool.stats()).toMatchObject({ running: 1, queued: 1 });
      hold.open();
      expect(await Promise.all([first, second])).toEqual(["first", "second"]);
      expect(pool.stats().peakRunning).toBe(1);
    } finally {
      await pool.close();
    }
  });

  it("gives up on a wait longer than queueWait_ms with PoolBusyError", { timeout: 60_000 }, async () => {
    const pool = createBrowserPool({ concurrency: 1, queueWait_ms: 200 });
    try {
      const hold = gate();
      const first = pool.withPage(() => hold.opened);
      await expect(pool.withPage(async () => "late")).rejects.toBeInstanceOf(PoolBusyError);
      expect(pool.stats().queued).toBe(0);
      hold.open();
      await first;
    } finally {
      await pool.close();
    }
  });

  it("stops a render at its time limit and keeps serving", { timeout: 60_000 }, async () => {
    const pool = createBrowserPool({ concurrency: 1 });
    try {
      await renderBlankPdf({ pool }); // start Chromium first, so the limit falls inside the render
      const html = "<p>Invented sheet that cannot be printed in a millisecond</p>";
      await expect(renderPdf(html, { paper: "A4", pool, timeout_ms: 1 })).rejects.toBeInstanceOf(RenderTimeoutError);
      const pdf = await renderBlankPdf({ pool });
      expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
      expect(pool.stats()).toMatchObject({ running: 0, launches: 1 });
    } finally {
      await pool.close();
    }
  });

  it("survives Chromium being killed mid-render: that render fails, the next starts a new Chromium", { timeout: 60_000 }, async () => {
    const pool = createBrowserPool({ concurrency: 1 });
    try {
      await renderBlankPdf({ pool });
      const firstPid = pool.stats().browserPid!;
      expect(liveInGroup(firstPid).length).toBeGreaterThan(1); // browser, zygotes, renderers, ...

      const killed = pool.withPage(async (page) => {
        await page.setContent("<p>Invented sheet</p>");
        process.kill(firstPid, "SIGKILL");
        return page.pdf();
      });
      await expect(killed).rejects.toBeInstanceOf(BrowserCrashedError);

      const pdf = await renderBlankPdf({ pool });
      expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
      expect(pool.stats().launches).toBe(2);
      expect(pool.stats().browserPid).not.toBe(firstPid);
      // Nothing of the killed browser is left, though its children lost their parent.
      expect(await eventually(() => liveInGroup(firstPid).length === 0)).toBe(true);
    } finally {
      await pool.close();
    }
  });

  it("close() leaves no Chromium process and no profile behind, and refuses later work", { timeout: 60_000 }, async () => {
    const pool = createBrowserPool();
    await Promise.all([renderBlankPdf({ pool }), renderBlankPdf({ pool })]);
    const pid = pool.stats().browserPid!;
    expect(chromiumBelow().length).toBeGreaterThan(1);
    const profile = /--user-data-dir=(\S+)/.exec(commandLine(pid))?.[1];
    expect(profile).toBeDefined();
    expect(existsSync(profile!)).toBe(true);

    await pool.close();
    expect(chromiumBelow()).toEqual([]);
    expect(liveInGroup(pid)).toEqual([]);
    expect(existsSync(profile!)).toBe(false);
    await expect(renderBlankPdf({ pool })).rejects.toBeInstanceOf(BrowserUnavailableError);
  });

  it("close() lets a running render finish and turns away those still waiting", { timeout: 60_000 }, async () => {
    const pool = createBrowserPool({ concurrency: 1 });
    const hold = gate();
    const running = pool.withPage(async (page) => {
      await hold.opened;
      return page.evaluate(() => 6 * 7);
    });
    const waiting = pool.withPage(async () => "never");
    // Wait until Chromium is up, so close() meets a render that holds a page.
    await eventually(() => pool.stats().browserPid !== null);
    const closed = pool.close();
    await expect(waiting).rejects.toBeInstanceOf(BrowserUnavailableError);
    hold.open();
    expect(await running).toBe(42);
    await closed;
    expect(chromiumBelow()).toEqual([]);
  });
});
