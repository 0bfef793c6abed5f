import { accessSync, constants, statSync } from "node:fs";
import { mkdtemp, readdir, rm, stat } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { launch, type Browser } from "puppeteer-core";
import { BrowserUnavailableError } from "./errors.ts";
import { killProcessGroup, waitForGroupExit } from "./processGroup.ts";

/** Debian's chromium package puts its launcher here. */
export const DEFAULT_CHROMIUM_PATH = "/usr/bin/chromium";

/**
 * The Chromium executable: `CHROME_PATH` when set, otherwise Debian's. Throws
 * BrowserUnavailableError with a message a user can act on when it is missing or not executable.
 */
export function resolveChromiumPath(env: NodeJS.ProcessEnv = process.env): string {
  const fromEnv = env.CHROME_PATH?.trim();
  const path = fromEnv || DEFAULT_CHROMIUM_PATH;
  if (!isExecutableFile(path)) {
    const where = fromEnv ? `${path} (from CHROME_PATH)` : path;
    throw new BrowserUnavailableError(
      `No Chromium found at ${where}. Install Debian's chromium package ` +
        `(apt-get install chromium) or set CHROME_PATH to a Chromium or Chrome executable.`,
    );
  }
  return path;
}

function isExecutableFile(path: string): boolean {
  try {
    accessSync(path, constants.X_OK);
    return statSync(path).isFile();
  } catch {
    return false;
  }
}

/**
 * Command-line switches, each for a reason:
 * - `--no-sandbox`: Chromium's sandbox cannot start as root in a container; the page runs no
 *   script and fetches nothing (see pdf.ts), which is the protection relied on instead.
 * - `--disable-gpu`, `--disable-quic`, `--disable-component-update`, `--no-first-run`,
 *   `--disable-background-networking`, `--disable-sync`: no GPU process, and none of the
 *   browser's own background traffic (updates, sync, field trials).
 * - `--host-resolver-rules=MAP * ~NOTFOUND`: no host name or address resolves, IP literals
 *   included. A second wall behind request interception that also stops the connections
 *   interception never sees (`<link rel=preconnect>`, speculative connects before a navigation).
 * - `--enable-features=NetworkServiceInProcess2`: on some virtual machines the out-of-process
 *   network service crashes at start ("FD ownership violation"); every request then fails before
 *   request interception sees it, and the refusal log would be empty for the wrong reason. Running
 *   it inside the browser process behaves the same everywhere and spares a process.
 * - `--disable-crashpad-for-testing`: otherwise crash handlers start outside the browser's process
 *   group (they would outlive a killed browser) and write under the user's home directory.
 */
const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--disable-component-update",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-sync",
  "--host-resolver-rules=MAP * ~NOTFOUND",
  "--enable-features=NetworkServiceInProcess2",
  "--disable-crashpad-for-testing",
];

const PROFILE_PREFIX = "hoopwise-chromium-";

/**
 * Remove the temporary profiles a killed server left behind (kill -9 gives it no time to clean
 * up): those whose owning process is gone, and older unnamed ones after a day. Profiles of live
 * servers (other processes, tests running beside) are left alone. Returns how many were removed.
 */
export async function removeLeftoverProfiles(dir: string = tmpdir()): Promise<number> {
  let removed = 0;
  let names: string[];
  try {
    names = await readdir(dir);
  } catch {
    return 0;
  }
  for (const name of names) {
    if (!name.startsWith(PROFILE_PREFIX)) continue;
    const path = join(dir, name);
    const pid = Number(name.slice(PROFILE_PREFIX.length).match(/^(\d+)-/)?.[1]);
    let dead: boolean;
    if (Number.isInteger(pid) && pid > 0) {
      dead = pid !== process.pid && !processAlive(pid);
    } else {
      const age = await stat(path).then(
        (st) => Date.now() - st.mtimeMs,
        () => 0,
      );
      dead = age > 24 * 3600_000;
    }
    if (!dead) continue;
    await rm(path, { recursive: true, force: true }).then(
      () => removed++,
      () => undefined,
    );
  }
  return removed;
}

function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === "EPERM";
  }
}

export interface RunningChromium {
  browser: Browser;
  /** Process id of the browser, which is also the id of its process group. */
  pid: number;
  /** The fresh profile directory, removed by disposeChromium. */
  userDataDir: string;
  /** Set by disposeChromium so that a second call waits for the first. */
  disposing?: Promise<void>;
}

export async function launchChromium(
  executablePath: string,
  options: { launchTimeout_ms: number; protocolTimeout_ms: number },
): Promise<RunningChromium> {
  // The server's pid in the name lets the next start tell a dead server's leftovers from a live one's.
  const userDataDir = await mkdtemp(join(tmpdir(), `${PROFILE_PREFIX}${process.pid}-`));
  let browser: Browser;
  try {
    browser = await launch({
      executablePath,
      headless: true,
      // The DevTools connection runs over a pipe: no debugging port that any local user could open.
      pipe: true,
      args: [...CHROMIUM_ARGS, `--user-data-dir=${userDataDir}`],
      timeout: options.launchTimeout_ms,
      protocolTimeout: options.protocolTimeout_ms,
      // Shutdown is ours to order: a server finishes its renders on SIGTERM before closing the
      // browser. puppeteer still kills the browser when Node exits.
      handleSIGINT: false,
      handleSIGTERM: false,
      handleSIGHUP: false,
    });
  } catch (cause) {
    await rm(userDataDir, { recursive: true, force: true });
    throw new BrowserUnavailableError(`Chromium at ${executablePath} would not start: ${(cause as Error).message}`, { cause });
  }
  const pid = browser.process()?.pid;
  if (pid === undefined) {
    await browser.close().catch(() => {});
    await rm(userDataDir, { recursive: true, force: true });
    throw new BrowserUnavailableError(`Chromium at ${executablePath} started without a process id.`);
  }
  return { browser, pid, userDataDir };
}

/**
 * Close the browser, kill whatever of its process group is left, wait for the group to empty,
 * and remove the profile. Safe to call more than once and after the browser died on its own.
 */
export function disposeChromium(chromium: RunningChromium): Promise<void> {
  chromium.disposing ??= (async () => {
    const closed = chromium.browser.close().catch(() => {});
    // A hung browser does not answer Browser.close; the group kill below ends it either way.
    await Promise.race([closed, new Promise((r) => setTimeout(r, 5_000).unref())]);
    killProcessGroup(chromium.pid);
    await waitForGroupExit(chromium.pid, 5_000);
    await rm(chromium.userDataDir, { recursive: true, force: true, maxRetries: 3 }).catch(() => {});
  })();
  return chromium.disposing;
}
