import { createServer, type Server } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createBrowserPool, type BrowserPool } from "../../src/pdf/browser.ts";
import { PAGE_X_OF_Y, renderBlankPdf, renderPdf, type RequestRecord } from "../../src/pdf/pdf.ts";
import { pdfInfo, pdfText } from "../sheet/poppler.ts";

const pool = createBrowserPool({ concurrency: 2 });
afterAll(() => pool.close());

const PDF_MAGIC = "%PDF-"; // ISO 32000-1, 7.5.2: a PDF file begins with this header

describe("renderPdf", () => {
  it("renders a blank page as a one-page A4 PDF, and Letter when asked", { timeout: 60_000 }, async () => {
    const a4 = await renderBlankPdf({ pool });
    expect(a4.subarray(0, 5).toString("latin1")).toBe(PDF_MAGIC);
    expect(pdfText(a4)).toContain("Page 1 of 1"); // the default footer
    const a4Info = pdfInfo(a4);
    expect(a4Info).toMatch(/^Pages:\s+1$/m);
    // ISO 216: A4 is 210 × 297 mm = 595.28 × 841.89 pt; Chromium rounds to 8.27 × 11.7 in,
    // which poppler still names A4.
    expect(a4Info).toMatch(/^Page size:.*\(A4\)$/m);

    const letter = await renderBlankPdf({ pool, paper: "Letter" });
    // US Letter is 8.5 × 11 in = 612 × 792 pt (1 pt = 1/72 in).
    expect(pdfInfo(letter)).toMatch(/^Page size:\s+612 x 792 pts \(letter\)$/m);
  });

  it("keeps the document's text, with its header and footer on every page", { timeout: 60_000 }, async () => {
    const html = `<!doctype html><html><head><meta charset="utf-8"><style>
      .next { break-before: page; }</style></head><body>
      <p>Hoop stress of the invented receiver shell</p>
      <p class="next">Second sheet: invented crack growth table</p></body></html>`;
    const headerHtml = `<div style="font:8pt sans-serif;width:100%;text-align:center">Calc HW-0042 rev B</div>`;
    const footerHtml = `<div style="font:8pt sans-serif;width:100%;text-align:right">Invented fingerprint 5e1f · ${PAGE_X_OF_Y}</div>`;
    const pdf = await renderPdf(html, { paper: "A4", pool, headerHtml, footerHtml });
    const text = pdfText(pdf);
    expect(pdfInfo(pdf)).toMatch(/^Pages:\s+2$/m);
    expect(text).toContain("Hoop stress of the invented receiver shell");
    expect(text).toContain("Second sheet: invented crack growth table");
    expect(text.match(/Calc HW-0042 rev B/g)).toHaveLength(2);
    expect(text).toContain("Invented fingerprint 5e1f · Page 1 of 2");
    expect(text).toContain("Invented fingerprint 5e1f · Page 2 of 2");
  });

  describe("hostile HTML", () => {
    // A loopback server that only counts connections: any connection at all means a fetch got out.
    let trap: Server;
    let trapUrl = "";
    let connections = 0;
    beforeAll(async () => {
      trap = createServer((socket) => {
        connections += 1;
        socket.destroy();
      });
      await new Promise<void>((resolve) => trap.listen(0, "127.0.0.1", resolve));
      const address = trap.address();
      if (address === null || typeof address === "string") throw new Error("trap server has no port");
      trapUrl = `http://127.0.0.1:${address.port}`;
    });
    afterAll(() => new Promise<void>((resolve) => trap.close(() => resolve())));

    it("runs no script, fetches nothing, and logs every outside request as refused", { timeout: 60_000 }, async () => {
      const outside = {
        stylesheet: "http://127.0.0.1:9/x.css",
        trapStylesheet: `${trapUrl}/trap.css`,
        cssImport: `${trapUrl}/import.css`,
        background: `${trapUrl}/background.png`,
        font: `${trapUrl}/font.woff2`,
        image: "https://example.invalid/logo.png",
        iframe: `${trapUrl}/frame.html`,
        object: `${trapUrl}/object.html`,
        refresh: `${trapUrl}/refresh.html`,
      };
      const html = `<!doctype html><html><head><meta charset="utf-8">
        <meta http-equiv="refresh" content="0;url=${outside.refresh}">
        <link rel="stylesheet" href="${outside.stylesheet}">
        <link rel="stylesheet" href="${outside.trapStylesheet}">
        <link rel="preconnect" href="${trapUrl}">
        <style>
          @import url("${outside.cssImport}");
          body { background: url("${outside.background}"); }
          @font-face { font-family: Trap; src: url("${outside.font}"); }
          .t { font-family: Trap, sans-serif; }
        </style></head><body>
        <p class="t">Invented sheet body stays in place</p>
        <script>document.body.innerHTML = 'pwned';</script>
        <img src="file:///etc/passwd">
        <img src="${outside.image}">
        <iframe src="${outside.iframe}"></iframe>
        <object data="${outside.object}"></object>
        </body></html>`;
      const headerHtml = `<div style="font-size:8pt"><img src="${trapUrl}/header.png">Header text</div>`;
      const log: RequestRecord[] = [];

      const pdf = await renderPdf(html, { paper: "A4", pool, headerHtml, requestLog: log });
      // Let a late connection, if any, arrive before counting.
      await new Promise((r) => setTimeout(r, 300));

      const text = pdfText(pdf);
      expect(text).toContain("Invented sheet body stays in place"); // not replaced by a navigation
      expect(text).not.toContain("pwned");
      expect(text).not.toMatch(/root:.*:0:0:/); // /etc/passwd's first line
      expect(connections).toBe(0);

      const outcomeOf = (url: string) => log.filter((r) => r.url === url).map((r) => r.outcome);
      for (const url of Object.values(outside)) {
        expect(outcomeOf(url), url).not.toHaveLength(0);
        expect(new Set(outcomeOf(url)), url).toEqual(new Set(["refused"]));
      }
      // From an about:blank document Chromium refuses file: itself, before interception.
      expect(outcomeOf("file:///etc/passwd")).toEqual(["blocked"]);
      const fetched = log.filter((r) => r.outcome === "loaded" || r.outcome === "unsettled");
      expect(fetched).toEqual([]);
    });
  });

  it("renders 10 documents at once, all correct, with never more than 2 pages busy", { timeout: 60_000 }, async () => {
    let inFlight = 0;
    let maxInFlight = 0;
    const counted: BrowserPool = {
      ...pool,
      withPage: (work, options) =>
        pool.withPage(async (page) => {
          inFlight += 1;
          maxInFlight = Math.max(maxInFlight, inFlight);
          try {
            return await work(page);
          } finally {
            inFlight -= 1;
          }
        }, options),
    };
    const numbers = Array.from({ length: 10 }, (_, i) => i + 1);
    const pdfs = await Promise.all(
      numbers.map((n) => renderPdf(`<p>Invented sheet number ${n} of ten</p>`, { paper: "A4", pool: counted })),
    );
    // Each PDF holds its own document: reused pages do not carry one render into another.
    for (const [i, pdf] of pdfs.entries()) expect(pdfText(pdf)).toContain(`Invented sheet number ${numbers[i]} of ten`);
    expect(maxInFlight).toBe(2); // the pool's concurrency, reached and not passed
    expect(pool.stats().running).toBe(0);
  });
});
