import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import type { AddressInfo } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { serve, type ServerType } from "@hono/node-server";
import type { Browser, ElementHandle } from "puppeteer-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createApp } from "../../src/web/app.ts";
import { pageRoutes } from "../../src/web/page.tsx";
import { launchTestBrowser } from "./browser.ts";

/**
 * A pressure logger's file on the page, in real Chromium: an invented workshop receiver's log with
 * a two-line preamble, semicolon cells and decimal commas, read by column name in kPa, previewed,
 * then counted with a hysteresis gate, with the progress shown while it is sent.
 */
const TIMEOUT = 120_000;
const ARTIFACTS = join(process.cwd(), "test-artifacts");
const ROWS = 120_000;

let server: ServerType;
let browser: Browser;
let base: string;
let dir: string;
let logPath: string;

beforeAll(async () => {
  const app = createApp({ mounts: [pageRoutes()] });
  await new Promise<void>((resolve) => {
    server = serve({ fetch: app.fetch, hostname: "127.0.0.1", port: 0 }, () => resolve());
  });
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  dir = mkdtempSync(join(tmpdir(), "hoopwise-log-e2e-"));
  // Fills to 55 kPa, holds it with a compressor ripple of about 0.6 kPa, and empties, every 200 readings.
  const lines = ["Logger LX-7 (invented workshop receiver)", "Time s;Pressure kPa;Temperature C"];
  for (let i = 0; i < ROWS; i++) {
    const k = i % 200;
    const p = k < 50 ? 1.1 * k : k < 150 ? 55 + 0.3 * Math.sin(i / 2) : 1.1 * (200 - k);
    lines.push(`${i};${p.toFixed(2).replace(".", ",")};${(21 + Math.sin(i / 900)).toFixed(1).replace(".", ",")}`);
  }
  logPath = join(dir, "receiver-log.csv");
  writeFileSync(logPath, `${lines.join("\n")}\n`);
  browser = await launchTestBrowser(join(dir, "profile"));
}, TIMEOUT);

afterAll(async () => {
  await browser?.close();
  await new Promise((resolve) => server?.close(resolve));
  rmSync(dir, { recursive: true, force: true });
}, TIMEOUT);

describe("a logger's file on the page", () => {
  it(
    "reads the chosen column, previews it, counts it with a gate, and shows progress while it is sent",
    async () => {
      const page = await browser.newPage();
      const problems: string[] = [];
      page.on("pageerror", (e) => problems.push(`page error: ${(e as Error).message}`));
      await page.setViewport({ width: 1366, height: 1000 });
      await page.goto(`${base}/`, { waitUntil: "networkidle0" });
      // Record what the progress line said while the file was being sent.
      await page.evaluate(() => {
        const seen: string[] = [];
        (window as unknown as { seen: string[] }).seen = seen;
        new MutationObserver(() => {
          const t = document.querySelector(".log-progress-text")?.textContent ?? "";
          if (t && seen[seen.length - 1] !== t) seen.push(t);
        }).observe(document.body, { subtree: true, childList: true, characterData: true });
      });

      await page.click('input[name="pressure.mode"][value="log"]');
      const input = (await page.$("#f-log-file")) as ElementHandle<HTMLInputElement>;
      await input.uploadFile(logPath);
      await page.$eval("#f-log-column", (e) => {
        (e as HTMLInputElement).value = "Pressure kPa";
      });
      await page.$eval("#f-log-skip", (e) => {
        (e as HTMLInputElement).value = "2";
      });
      await page.$eval("#f-log-gate", (e) => {
        (e as HTMLInputElement).value = "1";
      });
      await page.select("#f-log-unit", "kPa");
      await page.select("#f-log-decimal", ",");

      await page.click("#log-preview-button");
      await page.waitForSelector("#log-preview svg.plot-history", { timeout: 60_000 }).catch(async (err: unknown) => {
        throw new Error(
          `no preview: ${await page.$eval("#log-preview", (e) => e.innerHTML)} ${problems.join("; ")} (${(err as Error).message})`,
        );
      });
      const summary = await page.$eval(".log-summary", (e) => e.textContent ?? "");
      expect(summary).toMatch(/120\s?000 readings from column Pressure kPa, cells separated by semicolons/);
      expect(summary).toMatch(/ kPa\.$/);

      // The check itself: worked out from the log, the gate's removals stated.
      // A new gate set without an input event: only the "Work it out" post can carry it.
      await page.$eval("#f-log-gate", (e) => {
        (e as HTMLInputElement).value = "2";
      });
      await page.click('#check-form button.primary[hx-post="/recalc"]');
      await page
        // The page writes the gate (2 kPa = 0.002 MPa) in the form's pressure unit, kPa.
        .waitForFunction(() => /hysteresis gate of 2 kPa removed \d+ reversals/.test(document.body.textContent ?? ""), {
          timeout: 90_000,
        })
        .catch(async (err: unknown) => {
          const shown = await page.$eval("#results", (e) => (e.textContent ?? "").replace(/\s+/g, " ").slice(0, 1500));
          throw new Error(`no gate in the result: ${shown} (${(err as Error).message})`);
        });
      // The last answer, to "Work it out", carried the file: nothing is left beside the file input.
      expect(await page.$eval("#e-log-file", (e) => (e.textContent ?? "").trim())).toBe("");
      const seen = await page.evaluate(() => (window as unknown as { seen: string[] }).seen);
      expect(seen.some((t) => /Sending the log|reading and counting/.test(t))).toBe(true);
      mkdirSync(ARTIFACTS, { recursive: true });
      await page.screenshot({ path: join(ARTIFACTS, "log-upload.png"), fullPage: true });
      await (await page.$("#sec-pressure"))?.screenshot({ path: join(ARTIFACTS, "log-upload-section.png") });
      expect(problems).toEqual([]);
      await page.close();
    },
    TIMEOUT,
  );
});
