import { mkdirSync, mkdtempSync, rmSync } from "node:fs";
import type { AddressInfo } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { serve, type ServerType } from "@hono/node-server";
import type { Browser, Page } from "puppeteer-core";
import { launchTestBrowser } from "./browser.ts";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeSharedPool } from "../../src/pdf/browser.ts";
import { verifySheet } from "../../src/sheet/verify.ts";
import { openStore, type Store } from "../../src/store/index.ts";
import { wholeApp } from "../../src/web/whole.ts";
import { FAST_SCRYPT } from "../store/helpers.ts";

/**
 * The sign-off walk in real Chromium: the first admin on the first-run page, two engineers added,
 * save and revise from the checker, sign the three roles as three people each signed in as
 * themselves, print, and verify the printed sheet's signatures with the records' public key.
 */
const TIMEOUT = 120_000;
const ARTIFACTS = join(process.cwd(), "test-artifacts");

/** Invented people. */
const MIRA = { name: "Mira Castellanos-Ode", passphrase: "lantern over the saltmarsh" };
const TEO = { name: "Teo Vantongeren", passphrase: "blue heron at low tide" };
const RUI = { name: "Rui Adebayo-Lund", passphrase: "paper kites above the quarry" };
type Person = typeof MIRA;

let server: ServerType;
let browser: Browser;
let store: Store;
let base: string;
let dir: string;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), "hoopwise-records-e2e-"));
  store = await openStore({ path: join(dir, "records.db"), passphraseCost: FAST_SCRYPT });
  const app = wholeApp(store);
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

async function signAs(page: Page, role: string, who: Person) {
  expect(await text(page, "#signing-as")).toBe(who.name);
  await page.select("#sign-role", role);
  await page.type("#sign-passphrase", who.passphrase);
  await go(page, ".sign-form button[type=submit]");
  expect(await text(page, ".notice")).toBe(`Revision 2 signed as ${role} by ${who.name}.`);
}

/** Sign out whoever is signed in, and sign in as `who`, coming back to `next`. */
async function signInAs(page: Page, who: Person, next: string) {
  if (await page.$(".signout button")) await go(page, ".signout button");
  await page.goto(`${base}/signin?next=${encodeURIComponent(next)}`, { waitUntil: "load" });
  await page.type("#signin-name", who.name);
  await page.type("#signin-passphrase", who.passphrase);
  await go(page, "#signin button[type=submit]");
  expect(await text(page, "#signed-in-as")).toContain(who.name);
}

describe("the records in Chromium", () => {
  it(
    "first run, people, save and revise, sign as three people, print, and verify the signatures with the key",
    async () => {
      const page = await browser.newPage();
      const problems: string[] = [];
      page.on("pageerror", (e) => problems.push(`page error: ${(e as Error).message}`));
      page.on("console", (m) => {
        if (m.type() === "error") problems.push(`console: ${m.text()}`);
      });
      await page.setViewport({ width: 1280, height: 900 });

      // No one is registered: the records send a browser on this machine to the first-run page.
      await page.goto(`${base}/records`, { waitUntil: "load" });
      expect(await page.$("#signin")).not.toBeNull();
      await page.goto(`${base}/signin`, { waitUntil: "load" });
      expect(new URL(page.url()).pathname).toBe("/setup");
      await page.type("#setup-name", MIRA.name);
      await page.type("#setup-passphrase", MIRA.passphrase);
      await page.type("#setup-again", MIRA.passphrase);
      await go(page, "#setup button[type=submit]");
      expect(new URL(page.url()).pathname).toBe("/records/people");
      expect(await text(page, "#signed-in-as")).toBe(`${MIRA.name} (admin)`);

      // The admin adds two engineers.
      for (const who of [TEO, RUI]) {
        await page.type("#user-name", who.name);
        await page.select("#user-role", "engineer");
        await page.type("#user-passphrase", who.passphrase);
        await page.type("#user-again", who.passphrase);
        await go(page, ".signer-form button[type=submit]");
        expect(await text(page, ".notice")).toBe(`${who.name} is added as engineer and can now sign in.`);
      }

      // Save the cabin example from the checker.
      await page.goto(`${base}/`, { waitUntil: "networkidle0" });
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

      // Mira prepares; she may not also check it.
      await page.goto(checkUrl, { waitUntil: "load" });
      await signAs(page, "prepared", MIRA);
      await page.select("#sign-role", "checked");
      await page.type("#sign-passphrase", MIRA.passphrase);
      await go(page, ".sign-form button[type=submit]");
      expect(await text(page, "#sign-role-error")).toContain("three different people");
      expect(await page.$eval("#sign-passphrase", (e) => (e as HTMLInputElement).value)).toBe("");
      mkdirSync(ARTIFACTS, { recursive: true });
      await page.screenshot({ path: join(ARTIFACTS, "records-refused.png") });

      // Teo signs in and checks; Rui signs in and approves.
      await signInAs(page, TEO, new URL(checkUrl).pathname);
      await signAs(page, "checked", TEO);
      await signInAs(page, RUI, new URL(checkUrl).pathname);
      await signAs(page, "approved", RUI);

      // Revision 2 approved, revision 1 superseded, both plain on the page.
      expect(await page.$eval("#revision-2", (e) => e.getAttribute("data-state"))).toBe("approved");
      expect(await text(page, "#revision-1 .state")).toBe("Superseded");
      expect(await text(page, "#revision-2 .state")).toBe("Approved");
      expect(await text(page, ".standing")).toContain("Revision 2 is Approved");

      // Print the approved sheet: the link answers with a PDF, which verifies with the records' public key.
      const href = await page.$eval("#revision-2 .row-actions a[href$='/sheet']", (a) => a.getAttribute("href"));
      expect(href).toMatch(/\/revisions\/2\/sheet$/);
      const pdf = await page.evaluate(async (url) => {
        const res = await fetch(url);
        const bytes = new Uint8Array(await res.arrayBuffer());
        let binary = "";
        for (const b of bytes) binary += String.fromCharCode(b);
        return { status: res.status, type: res.headers.get("content-type"), cache: res.headers.get("cache-control"), base64: btoa(binary) };
      }, href!);
      expect(pdf).toMatchObject({ status: 200, type: "application/pdf", cache: "no-store" });
      const bytes = new Uint8Array(Buffer.from(pdf.base64, "base64"));
      expect(Buffer.from(bytes.subarray(0, 5)).toString("latin1")).toBe("%PDF-");
      const keys = (await (await fetch(`${base}/api/v1/keys`)).json()) as { keys: { publicKeyPem: string }[] };
      const report = await verifySheet(bytes, { publicKeys: keys.keys.map((k) => k.publicKeyPem) });
      expect(report.problems).toEqual([]);
      expect(report.ok).toBe(true);
      expect(report.signoffs.each.map((x) => [x.role, x.name, x.valid])).toEqual([
        ["prepared", MIRA.name, true],
        ["checked", TEO.name, true],
        ["approved", RUI.name, true],
      ]);
      // Without the key the signatures are reported unchecked, never taken as proven.
      const unchecked = await verifySheet(bytes);
      expect(unchecked.signoffs).toMatchObject({ attached: true, checked: false });

      await page.screenshot({ path: join(ARTIFACTS, "records.png"), fullPage: true });

      // The difference between the two revisions, side by side.
      await go(page, ".record-actions a[href*='/compare']");
      expect(await page.$eval("tr[data-path='shell.thickness_mm']", (e) => e.className)).toBe("diff-changed");
      expect(await page.$eval("tr[data-figure='life']", (e) => e.className)).toBe("diff-changed");
      await page.screenshot({ path: join(ARTIFACTS, "records-compare.png"), fullPage: true });

      await page.goto(`${base}/records`, { waitUntil: "load" });
      await page.screenshot({ path: join(ARTIFACTS, "records-list.png") });
      expect(await text(page, "#checks tbody tr .state")).toBe("Approved");

      // The refusals of the walk (the records asked for before signing in: 401; one person signing
      // twice: 409) are noted by the browser; nothing else went wrong.
      expect(problems).toEqual([
        "console: Failed to load resource: the server responded with a status of 401 (Unauthorized)",
        "console: Failed to load resource: the server responded with a status of 409 (Conflict)",
      ]);
      await page.close();
    },
    TIMEOUT,
  );
});
