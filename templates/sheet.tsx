/**
 * @module templates/sheet
 * The whole check sheet as one HTML document, with its stylesheet (sheet.css) inlined: the front,
 * then the numbered sections (scope, inputs, calculation, results, plots, cautions, sign-off), each
 * from its own template, and the SUPERSEDED watermark where it applies. Handed the sheet model
 * (model.ts); gives the HTML the printer turns into the PDF (src/sheet), whose page header and
 * footer are drawn by src/sheet/margins.tsx. The model's types, the cautions and the step result text
 * are re-exported, so the sheet builder and the sheet's tests import the templates from this file.
 */
import { readFileSync } from "node:fs";
import { raw } from "hono/html";
import { Cautions } from "./cautions.tsx";
import { Front } from "./front.tsx";
import { htmlOf } from "./html.ts";
import { Inputs } from "./inputs.tsx";
import type { SheetModel } from "./model.ts";
import { Plots } from "./plots.tsx";
import { Results } from "./results.tsx";
import { Scope } from "./scope.tsx";
import { SignOffBlock } from "./signoff.tsx";
import { Calculation } from "./steps.tsx";

export type { Paper, SheetModel, SignOff, SignOffRole } from "./model.ts";
export { CAUTIONS } from "./cautions.tsx";
export { stepResultText } from "./steps.tsx";

/** Read once: the stylesheet is ours and does not change while the process runs. */
const STYLE = readFileSync(new URL("./sheet.css", import.meta.url), "utf8");

/** The sheet's page body as HTML; the printer's header and footer come from src/sheet/margins.tsx. */
export function sheetBody(m: SheetModel): string {
  return `<!doctype html>${htmlOf(<Sheet m={m} />)}`;
}

function Sheet({ m }: { m: SheetModel }) {
  return (
    <html lang="en">
      <head>
        <meta charset="utf-8" />
        <title>{m.document.title ?? "Check sheet"}</title>
        {/* Our own stylesheet, inlined: the renderer fetches nothing. */}
        <style>{raw(STYLE)}</style>
      </head>
      <body>
        {m.superseded ? <div class="watermark">SUPERSEDED</div> : null}
        <Front m={m} />
        <Scope m={m} num={1} />
        <Inputs m={m} num={2} />
        <Calculation m={m} num={3} />
        <Results m={m} num={4} />
        <Plots m={m} num={5} />
        <Cautions num={6} />
        <SignOffBlock m={m} num={7} />
      </body>
    </html>
  );
}
