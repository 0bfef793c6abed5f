import { DEMOS } from "../../src/demo/index.ts";
import { createBrowserPool } from "../../src/pdf/browser.ts";
import { renderBlankPdf } from "../../src/pdf/pdf.ts";
import { renderSheet, sheetHtml } from "../../src/sheet/sheet.ts";

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function timed(fn: () => Promise<unknown> | unknown): Promise<number> {
  const t0 = performance.now();
  await fn();
  return performance.now() - t0;
}

/**
 * The check sheet's render times on one fresh pool, in one run: the first sheet (Chromium
 * starts), warm sheets, and a blank page through the same pool as the baseline. The cabin demo
 * is the larger of the two demos (crack growth, test evidence, every plot).
 */
export async function sheetBench(rounds = 7) {
  const doc = DEMOS.find((d) => d.id === "cabin")!.document;
  const pool = createBrowserPool({ concurrency: 1 });
  const sheet = async () => {
    const out = await renderSheet(doc, { pool });
    if (!out.ok) throw new Error(`the cabin demo did not render: ${JSON.stringify(out.errors)}`);
  };
  try {
    const cold_ms = await timed(sheet);
    const warm: number[] = [];
    const blank: number[] = [];
    const html: number[] = [];
    // Interleaved, so a drift in the machine's load touches both series alike.
    for (let i = 0; i < rounds; i += 1) {
      warm.push(await timed(sheet));
      blank.push(await timed(() => renderBlankPdf({ pool })));
      html.push(await timed(() => sheetHtml(doc)));
    }
    return {
      coldFirstSheet_ms: cold_ms,
      warmSheetMedian_ms: median(warm),
      blankPageMedian_ms: median(blank),
      warmOverBlank: median(warm) / median(blank),
      checkAndHtmlMedian_ms: median(html),
    };
  } finally {
    await pool.close();
  }
}
