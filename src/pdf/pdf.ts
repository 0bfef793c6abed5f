/**
 * HTML in, PDF out, through the Chromium pool (browser.ts).
 *
 *   const pdf = await renderPdf(html, { paper: "A4", headerHtml, footerHtml });
 *
 * The document is closed to the outside world:
 * - JavaScript is off: a <script> in the HTML stays text in the DOM and never runs.
 * - The HTML is written into the page (page.setContent), so there is no navigation and no request
 *   for the document itself. Every request the document then makes is refused: http:, https:,
 *   file:, and anything else that reaches the network stack; navigations get "204 No Content" so
 *   the frame keeps the sheet (see requests.ts). Chromium itself refuses file: loads from the
 *   about:blank document before they reach the interceptor, and no host name or address resolves
 *   in this Chromium (chromium.ts), so even a request that slipped past would go nowhere.
 * - data: URLs load, because they are content of the document, not references out of it: this
 *   is how a template inlines its images and fonts (shipped with the project, embedded as data:).
 *   Plots are inline SVG and need nothing.
 * So the HTML must carry every asset it needs; `requestLog` tells what it tried to reach.
 *
 * headerHtml and footerHtml are Chromium header/footer templates: HTML with no access to the
 * page's styles (they need their own inline styles, including font-size, or print tiny), where
 * elements with the classes pageNumber, totalPages, date, title and url are filled in by Chromium.
 * They are HTML: escape any user text put into them.
 */
import { sharedPool, type BrowserPool } from "./browser.ts";
import { guardRequests, type RequestRecord } from "./requests.ts";

export type { RequestRecord } from "./requests.ts";

export type Paper = "A4" | "Letter";

export interface Margins {
  top: string;
  right: string;
  bottom: string;
  left: string;
}

/** Margins when the caller gives none (the check sheet passes its own, src/sheet/margins.tsx). */
const DEFAULT_MARGINS: Margins = { top: "26mm", right: "15mm", bottom: "20mm", left: "22mm" };

/** "Page X of Y" in Chromium's template classes, to place in a header or footer. */
export const PAGE_X_OF_Y = 'Page <span class="pageNumber"></span> of <span class="totalPages"></span>';

/** Chromium prints the date and the document title when no header is given; this prints nothing. */
const EMPTY_HEADER = "<span></span>";

const DEFAULT_FOOTER =
  `<div style="width:100%;box-sizing:border-box;padding:0 ${DEFAULT_MARGINS.right} 0 ${DEFAULT_MARGINS.left};` +
  `font:8pt sans-serif;text-align:right">${PAGE_X_OF_Y}</div>`;

export interface PdfOptions {
  paper: Paper;
  /** Header template on every page. Default: none. */
  headerHtml?: string;
  /** Footer template on every page. Default: "Page X of Y" at the right. */
  footerHtml?: string;
  /** Page margins as CSS lengths. Default: 26 mm top, 20 mm bottom, 15 mm right, 22 mm left. */
  margin?: Margins;
  /** Time limit of this render. Default: the pool's (30 s unless configured). */
  timeout_ms?: number;
  /** Pool to render on. Default: sharedPool(). */
  pool?: BrowserPool;
  /** When given, receives one record per request the document tried to make. */
  requestLog?: RequestRecord[];
}

/** Render `html` to a PDF; see the module comment for what the document may and may not do. */
export async function renderPdf(html: string, options: PdfOptions): Promise<Buffer> {
  const pool = options.pool ?? sharedPool();
  return pool.withPage(
    async (page) => {
      await page.setJavaScriptEnabled(false);
      const guard = await guardRequests(page);
      try {
        // 0: the pool's time limit governs the whole render; puppeteer's own would cut it shorter.
        await page.setContent(html, { waitUntil: "load", timeout: 0 });
        const bytes = await page.pdf({
          format: options.paper,
          printBackground: true,
          preferCSSPageSize: false,
          displayHeaderFooter: true,
          headerTemplate: options.headerHtml ?? EMPTY_HEADER,
          footerTemplate: options.footerHtml ?? DEFAULT_FOOTER,
          margin: options.margin ?? DEFAULT_MARGINS,
          timeout: 0,
        });
        return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
      } finally {
        const records = await guard.stop();
        options.requestLog?.push(...records);
      }
    },
    { timeout_ms: options.timeout_ms },
  );
}

const BLANK_HTML = '<!doctype html><html><head><meta charset="utf-8"></head><body></body></html>';

/**
 * An empty page through the same pool, settings and default footer as renderPdf: the baseline
 * a sheet's render time is compared with.
 */
export function renderBlankPdf(options: Pick<PdfOptions, "pool" | "timeout_ms"> & { paper?: Paper } = {}): Promise<Buffer> {
  return renderPdf(BLANK_HTML, { ...options, paper: options.paper ?? "A4" });
}
