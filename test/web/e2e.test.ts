import { mkdirSync, mkdtempSync, rmSync } from "node:fs";
import type { AddressInfo } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { serve, type ServerType } from "@hono/node-server";
import type { Browser, Page } from "puppeteer-core";
import { launchTestBrowser } from "./browser.ts";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createApp } from "../../src/web/app.ts";
import { pageRoutes } from "../../src/web/page.tsx";

/** The whole page in real Chromium: htmx edits, inline errors, units, and the page with scripting off. */
const TIMEOUT = 60_000;
const ARTIFACTS = join(process.cwd(), "test-artifacts");

let server: ServerType;
let browser: Browser;
let base: string;
let profile: string;

beforeAll(async () => {
  const app = createApp({ mounts: [pageRoutes()] });
  await new Promise<void>((resolve) => {
    server = serve({ fetch: app.fetch, hostname: "127.0.0.1", port: 0 }, () => resolve());
  });
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  profile = mkdtempSync(join(tmpdir(), "hoopwise-e2e-"));
  browser = await launchTestBrowser(profile);
}, TIMEOUT);

afterAll(async () => {
  await browser?.close();
  await new Promise((resolve) => server?.close(resolve));
  rmSync(profile, { recursive: true, force: true });
}, TIMEOUT);

/** A fresh page at the first-visit address, with htmx loaded and every page error collected. */
async function open(width = 1280, scripting = true): Promise<{ page: Page; problems: string[] }> {
  const page = await browser.newPage();
  const problems: string[] = [];
  page.on("pageerror", (e) => problems.push(`page error: ${(e as Error).message}`));
  page.on("console", (m) => {
    if (m.type() === "error") problems.push(`console: ${m.text()}`);
  });
  await page.setJavaScriptEnabled(scripting);
  await page.setViewport({ width, height: 900 });
  await page.goto(`${base}/`, { waitUntil: "networkidle0" });
  return { page, problems };
}

const text = (page: Page, selector: string) => page.$eval(selector, (e) => (e.textContent ?? "").trim());

/** Replace a text field's value by typing, as a user would. */
async function retype(page: Page, selector: string, value: string) {
  await page.click(selector, { count: 3 });
  await page.keyboard.press("Backspace");
  await page.type(selector, value);
}

async function waitForText(page: Page, selector: string, accept: (t: string) => boolean, timeout = 15_000) {
  const deadline = Date.now() + timeout;
  for (;;) {
    const t = await text(page, selector).catch(() => "");
    if (accept(t)) return t;
    if (Date.now() > deadline) throw new Error(`${selector} still reads "${t}"`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe("the checker page in Chromium", () => {
  it(
    "recalculates the life as the thickness is typed",
    async () => {
      const { page, problems } = await open();
      const lifeValue = () => page.$eval("[data-testid=life]", (e) => Number(e.getAttribute("data-value")));
      const before = await text(page, "[data-testid=life]");
      const beforeValue = await lifeValue();
      expect(before).toMatch(/cycles$/);
      await retype(page, "#f-shell-thickness", "0.6");
      const after = await waitForText(page, "[data-testid=life]", (t) => t !== before && t !== "");
      expect(after).toMatch(/cycles$/);
      // A thinner skin carries more stress per cycle, so it lives fewer cycles.
      expect(await lifeValue()).toBeLessThan(beforeValue);
      // The plots follow the numbers a moment later: the life-against-thickness plot marks the new thickness.
      await page.waitForFunction(() => document.querySelector("#plot-thickness")?.textContent?.includes("current thickness 0.6 mm"), {
        timeout: 15_000,
      });
      expect(new URL(page.url()).searchParams.get("c")).toBeTruthy();
      expect(problems).toEqual([]);
      await page.close();
    },
    TIMEOUT,
  );

  it(
    "shows the message beside a bad field and greys the old result as out of date",
    async () => {
      const { page, problems } = await open();
      await retype(page, "#f-shell-thickness", "abc");
      const message = await waitForText(page, "#e-shell-thickness", (t) => t !== "");
      expect(message).toBe("the wall thickness must be a number");
      const beside = await page.$eval("#f-shell-thickness", (input) => {
        const field = input.closest(".field");
        return {
          slot: field?.querySelector(".field-error")?.id,
          describedBy: input.getAttribute("aria-describedby"),
          invalid: input.getAttribute("aria-invalid"),
        };
      });
      expect(beside).toEqual({ slot: "e-shell-thickness", describedBy: "e-shell-thickness", invalid: "true" });
      expect(await text(page, "#stale")).toContain("Out of date.");
      const opacity = await page.$eval("#results", (e) => Number(getComputedStyle(e).opacity));
      expect(opacity).toBeLessThan(0.6);

      await retype(page, "#f-shell-thickness", "1.1");
      await waitForText(page, "#e-shell-thickness", (t) => t === "");
      expect(await text(page, "#stale")).toBe("");
      expect(await page.$eval("#f-shell-thickness", (e) => e.getAttribute("aria-invalid"))).toBeNull();
      expect(problems).toEqual([]);
      await page.close();
    },
    TIMEOUT,
  );

  it(
    "switches to US units and shows the same result",
    async () => {
      const { page, problems } = await open();
      const life = await text(page, "[data-testid=life]");
      const allowable = await text(page, "[data-testid=allowable-life]");
      await page.select("#f-units-length", "in");
      await page.waitForFunction(() => (document.querySelector("#f-shell-thickness") as HTMLInputElement | null)?.value === "0.0393701", {
        timeout: 15_000,
      });
      await page.select("#f-units-stress", "ksi");
      await page.waitForFunction(() => document.querySelector("label[for=f-material-sigmaF]")?.textContent?.includes("ksi"), {
        timeout: 15_000,
      });
      await page.select("#f-units-pressure", "psi");
      await page.waitForFunction(() => document.querySelector("label[for=f-altitude-min]")?.textContent?.includes("psi"), {
        timeout: 15_000,
      });
      await page.select("#f-units-altitude", "ft");
      await page.waitForFunction(() => (document.querySelector("#f-altitude-flight") as HTMLInputElement | null)?.value === "25000", {
        timeout: 15_000,
      });
      expect(await text(page, "[data-testid=life]")).toBe(life);
      expect(await text(page, "[data-testid=allowable-life]")).toBe(allowable);
      expect(await text(page, "#verdict")).toMatch(/Refer/);
      // The choice travels in the address, so reloading keeps it.
      await page.reload({ waitUntil: "networkidle0" });
      expect(await page.$eval("#f-units-length", (e) => (e as HTMLSelectElement).value)).toBe("in");
      expect(await text(page, "[data-testid=life]")).toBe(life);
      expect(problems).toEqual([]);
      await page.close();
    },
    TIMEOUT,
  );

  it(
    "finds the least thickness and puts it into the form",
    async () => {
      const { page, problems } = await open();
      await page.click("button[name=solve][value=thickness]");
      const solved = await waitForText(page, "[data-testid=solution]", (t) => /mm$/.test(t));
      await page.click("button[name=use]");
      // The answer is shown to four figures; the form takes it to six.
      const shown = Number(solved.replace(" mm", ""));
      await page.waitForFunction(
        (want) => Math.abs(Number((document.querySelector("#f-shell-thickness") as HTMLInputElement | null)?.value) / want - 1) < 5e-4,
        { timeout: 15_000 },
        shown,
      );
      expect(await text(page, "#verdict")).toMatch(/Refer/);
      expect(problems).toEqual([]);
      await page.close();
    },
    TIMEOUT,
  );

  it(
    "works with scripting off: the form posts and the whole page comes back with the new result",
    async () => {
      const { page } = await open(1280, false);
      const before = await text(page, "[data-testid=life]");
      await retype(page, "#f-shell-thickness", "0.7");
      await Promise.all([page.waitForNavigation({ waitUntil: "load" }), page.click("button.primary")]);
      expect(await page.$eval("#f-shell-thickness", (e) => (e as HTMLInputElement).value)).toBe("0.7");
      const after = await text(page, "[data-testid=life]");
      expect(after).toMatch(/cycles$/);
      expect(after).not.toBe(before);

      await retype(page, "#f-shell-thickness", "thin");
      await Promise.all([page.waitForNavigation({ waitUntil: "load" }), page.click("button.primary")]);
      expect(await text(page, "#e-shell-thickness")).toBe("the wall thickness must be a number");
      expect(await page.$("[data-testid=life]")).toBeNull();
      await page.close();
    },
    TIMEOUT,
  );

  it(
    "looks right at desktop and narrow widths (screenshots saved as test artefacts)",
    async () => {
      mkdirSync(ARTIFACTS, { recursive: true });
      for (const [width, name] of [
        [1280, "page.png"],
        [420, "page-narrow.png"],
      ] as const) {
        const { page, problems } = await open(width);
        const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
        expect(overflow).toBeLessThanOrEqual(0);
        await page.screenshot({ path: join(ARTIFACTS, name) });
        expect(problems).toEqual([]);
        await page.close();
      }
    },
    TIMEOUT,
  );
});
