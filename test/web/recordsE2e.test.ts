import { mkdirSync, mkdtempSync, rmSync } from "node:fs";
import type { AddressInfo } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { serve, type ServerType } from "@hono/node-server";
import type { Browser, Page } from "puppeteer-core";
import { launchTestBrowser } from "./browser.ts";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeSharedPool } from "../../src/pdf/browser.ts";
import { openStore, type Store } from "../../src/store/index.ts";
import { createApp } from "../../src/web/app.ts";
import { pageRoutes } from "../../src/web/page.tsx";
import { recordsApi } from "../../src/web/records.ts";
import { recordsPages } from "../../src/web/recordsPage.tsx";
import { revisionSheetApi } from "../../src/web/revisionSheet.ts";
import { FAST_SCRYPT } from "../store/helpers.ts";

/** The records in real Chromium: save, revise, register, sign by two people, print, and see the history. */
const TIMEOUT = 120_000;
const ARTIFACTS = join(process.cwd(), "test-artifacts");

/** Invented people. */
const MIRA = { name: "Mira Castellanos-Ode", passphrase: "lantern over the saltmarsh" };
const TEO = { name: "Teo Vantongeren", passphrase: "blue heron at low tide" };

let server: ServerType;
let browser: Browser;
let store: Store;
let base: string;
let dir: string;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), "hoopwise-records-e2e-"));
  store = openStore({ path: join(dir, "records.db"), passphraseCost: FAST_SCRYPT });
  const app = createApp({ mounts: [revisionSheetApi({ store }), recordsApi({ store }), recordsPages({ store }), pageRoutes()] });
  await new Promise<void>((resolve) => {
    server = serve({ fetch: app.fetch, hostname: "127.0.0.1", port: 0 }, () => resolve());
  });
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  browser = await launchTestBrowser(join(dir, "profile"));
}, TIMEOUT);

afterAll(async () => {
  await browser?.close();
  await closeSharedPool();
  await new Promise((resolve) => server?.close(resolve));
  store?.close();
  rmSync(dir, { recursive: true, force: true });
}, TIMEOUT);

const text = (page: Page, selector: string) => page.$eval(selector, (e) => (e.textContent ?? "").replace(/\s+/g, " ").trim());

/** Click something that loads a new page, and wait for it. */
async function go(page: Page, selector: string) {
  await Promise.all([page.waitForNavigation({ waitUntil: "load" }), page.click(selector)]);
}

async function signAs(page: Page, role: string, who: { name: string; passphrase: string }) {
  await page.select("#sign-role", role);
  await page.select("#sign-name", who.name);
  await page.type("#sign-passphrase", who.passphrase);
  await go(page, ".sign-form button[type=submit]");
  expect(await text(page, ".notice")).toBe(`Revision 2 signed as ${role} by ${who.name}.`);
}

describe("the records in Chromium", () => {
  it(
    "saves the demo, saves a thicker skin as revision 2, has it signed by two people, prints the approved sheet",
    async () => {
      const page = await browser.newPage();
      const problems: string[] = [];
      page.on("pageerror", (e) => problems.push(`page error: ${(e as Error).message}`));
      page.on("console", (m) => {
        if (m.type() === "error") problems.push(`console: ${m.text()}`);
      });
      await page.setViewport({ width: 1280, height: 900 });

      // Save the cabin example from the checker.
      await page.goto(`${base}/`, { waitUntil: "networkidle0" });
      await page.type("#f-savedBy", MIRA.name);
      await go(page, "#save-record");
      expect(new URL(page.url()).pathname).toMatch(/^\/records\/[0-9a-f-]{36}$/);
      expect(await text(page, ".notice")).toContain("Saved as revision 1");
      const checkUrl = `${base}${new URL(page.url()).pathname}`;

      // Open it in the checker, make the skin thicker, save again: revision 2.
      await go(page, ".record-actions a.primary");
      await page.click("#f-shell-thickness", { count: 3 });
      await page.keyboard.press("Backspace");
      await page.type("#f-shell-thickness", "1.2");
      await page.waitForFunction(() => document.querySelector("#plot-thickness")?.textContent?.includes("current thickness 1.2 mm"), {
        timeout: 15_000,
      });
      expect(await text(page, "#save-record")).toBe("Save as a new revision");
      // Leaving the field sends one more edit (its change event); let it land before the page is left.
      await page.$eval("#f-shell-thickness", (e) => (e as HTMLInputElement).blur());
      await page.waitForNetworkIdle({ idleTime: 300 });
      await go(page, "#save-record");
      expect(await text(page, ".notice")).toContain("Saved as revision 2");

      // Register two signers from the page.
      for (const who of [MIRA, TEO]) {
        await page.goto(`${base}/records/signers`, { waitUntil: "load" });
        await page.type("#signer-name", who.name);
        await page.type("#signer-passphrase", who.passphrase);
        await page.type("#signer-again", who.passphrase);
        await go(page, ".signer-form button[type=submit]");
        expect(await text(page, ".notice")).toBe(`${who.name} is registered and can now sign.`);
      }

      // Mira prepares; she may not also check it; Teo checks; Mira approves.
      await page.goto(checkUrl, { waitUntil: "load" });
      await signAs(page, "prepared", MIRA);
      await page.select("#sign-role", "checked");
      await page.select("#sign-name", MIRA.name);
      await page.type("#sign-passphrase", MIRA.passphrase);
      await go(page, ".sign-form button[type=submit]");
      expect(await text(page, "#sign-name-error")).toContain("four-eyes rule");
      expect(await page.$eval("#sign-passphrase", (e) => (e as HTMLInputElement).value)).toBe("");
      mkdirSync(ARTIFACTS, { recursive: true });
      await page.screenshot({ path: join(ARTIFACTS, "records-refused.png") });
      await page.evaluate(() => (document.querySelector("#sign-passphrase") as HTMLInputElement).focus());
      await signAs(page, "checked", TEO);
      await signAs(page, "approved", MIRA);

      // Revision 2 approved, revision 1 superseded, both plain on the page.
      expect(await page.$eval("#revision-2", (e) => e.getAttribute("data-state"))).toBe("approved");
      expect(await text(page, "#revision-1 .state")).toBe("Superseded");
      expect(await text(page, "#revision-2 .state")).toBe("Approved");
      expect(await text(page, ".standing")).toContain("Revision 2 is Approved");

      // Print the approved sheet: the link answers with a PDF.
      const href = await page.$eval("#revision-2 .row-actions a[href$='/sheet']", (a) => a.getAttribute("href"));
      expect(href).toMatch(/\/revisions\/2\/sheet$/);
      const pdf = await page.evaluate(async (url) => {
        const res = await fetch(url);
        const bytes = new Uint8Array(await res.arrayBuffer());
        return {
          status: res.status,
          type: res.headers.get("content-type"),
          head: String.fromCharCode(...bytes.slice(0, 5)),
          size: bytes.length,
        };
      }, href!);
      expect(pdf).toMatchObject({ status: 200, type: "application/pdf", head: "%PDF-" });
      expect(pdf.size).toBeGreaterThan(10_000);

      await page.screenshot({ path: join(ARTIFACTS, "records.png"), fullPage: true });

      // The difference between the two revisions, side by side.
      await go(page, ".record-actions a[href*='/compare']");
      expect(await page.$eval("tr[data-path='shell.thickness_mm']", (e) => e.className)).toBe("diff-changed");
      expect(await page.$eval("tr[data-figure='life']", (e) => e.className)).toBe("diff-changed");
      await page.screenshot({ path: join(ARTIFACTS, "records-compare.png"), fullPage: true });

      await page.goto(`${base}/records`, { waitUntil: "load" });
      await page.screenshot({ path: join(ARTIFACTS, "records-list.png") });
      expect(await text(page, "#checks tbody tr .state")).toBe("Approved");

      // The one refusal of the walk (the four-eyes rule) is answered 409, which the browser notes; nothing else went wrong.
      expect(problems).toEqual(["console: Failed to load resource: the server responded with a status of 409 (Conflict)"]);
      await page.close();
    },
    TIMEOUT,
  );
});
