import puppeteer, { type Browser } from "puppeteer-core";
import { resolveChromiumPath } from "../../src/pdf/chromium.ts";

/**
 * Debian's Chromium for browser tests of the page. Unlike the sheet renderer's (src/pdf/chromium.ts),
 * this one must reach the test server on loopback, so only the flags that keep it quiet and offline
 * otherwise are set; the profile folder is the caller's, removed by the caller.
 */
export function launchTestBrowser(profileDir: string): Promise<Browser> {
  return puppeteer.launch({
    executablePath: resolveChromiumPath(),
    headless: true,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--disable-component-update",
      "--no-first-run",
      "--disable-background-networking",
      `--user-data-dir=${profileDir}`,
    ],
  });
}
