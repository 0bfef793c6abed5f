import { raw } from "hono/html";
// PAGE_X_OF_Y is our own constant markup (Chromium fills its pageNumber and totalPages spans).
import { type Margins, PAGE_X_OF_Y } from "../pdf/pdf.ts";
import { CAUTION_SHORT } from "../../templates/cautions.tsx";
import { isoDate } from "../../templates/format.ts";
import { htmlOf } from "../../templates/html.ts";
import type { SheetModel } from "../../templates/model.ts";
import { statusMark } from "../../templates/status.ts";

/**
 * Chromium's header and footer templates: printed in the page margins of every page. They see
 * none of the sheet's stylesheet, so every style is inline (font size included, or Chromium
 * prints them tiny). Text runs through JSX like the body, so user text is escaped here too.
 * One line each, cut with an ellipsis: a long title must not push into the page body.
 */
/**
 * Calculation-sheet margins: room at the top for a header of up to three lines and at the bottom
 * for the page count and fingerprint; the wider left edge leaves space to punch and file the sheet
 * (common practice).
 */
export const SHEET_MARGINS: Margins = { top: "26mm", right: "15mm", bottom: "20mm", left: "22mm" };

const SIDE = `0 ${SHEET_MARGINS.right} 0 ${SHEET_MARGINS.left}`;
const FONT = "'DejaVu Sans', sans-serif";
const ONE_LINE = "white-space:nowrap;overflow:hidden;text-overflow:ellipsis";
const MARK_COLOUR = { draft: "#a01010", superseded: "#a01010", prepared: "#8a5a00", checked: "#8a5a00", approved: "#185c2c" } as const;

export function headerHtml(m: SheetModel): string {
  const d = m.document;
  const mark = statusMark(m.signoffs, m.superseded);
  const rev = m.revision !== undefined ? `Rev. ${m.revision}` : "Rev. — (not saved)";
  return htmlOf(
    <div
      style={`width:100%;box-sizing:border-box;padding:${SIDE};font-family:${FONT};font-size:7.4pt;color:#111;-webkit-print-color-adjust:exact`}
    >
      <div style="display:flex;align-items:flex-end;gap:4mm;border-bottom:0.8pt solid #111;padding-bottom:1.2mm">
        <div style="flex:1;min-width:0">
          <div style={`${ONE_LINE};color:#444`}>{d.project ?? "Project not named"}</div>
          <div style={`${ONE_LINE};font-weight:bold;font-size:9pt`}>{d.title ?? "Untitled check"}</div>
          {/* The page count stands apart, so a long calculation number cannot push it out of sight. */}
          <div style="display:flex;gap:3mm">
            <div style={`flex:1;min-width:0;${ONE_LINE}`}>
              Calc. {m.calcNumber ?? d.calcNumber ?? "not numbered"} · {rev} · {isoDate(m.printedOn)}
            </div>
            <div style="flex:none;white-space:nowrap;font-weight:bold">{raw(PAGE_X_OF_Y)}</div>
          </div>
        </div>
        <div
          style={`flex:none;border:1.3pt solid ${MARK_COLOUR[mark.state]};color:${MARK_COLOUR[mark.state]};padding:1mm 2.2mm;font-weight:bold;letter-spacing:0.05em;font-size:8pt`}
        >
          {mark.words}
        </div>
      </div>
    </div>,
  );
}

/** The full fingerprint on every page, so any single page can be matched to its input, and the caution. */
export function footerHtml(m: SheetModel): string {
  return htmlOf(
    <div style={`width:100%;box-sizing:border-box;padding:${SIDE};font-family:${FONT};font-size:6.6pt;color:#333`}>
      <div style={`border-top:0.5pt solid #777;padding-top:1mm;${ONE_LINE}`}>
        Fingerprint (SHA-256) <span style="font-family:'DejaVu Sans Mono',monospace">{m.result.fingerprint}</span>
      </div>
      {/* The caution may take two lines: it is never cut short. */}
      <div style="margin-top:0.6mm;line-height:1.25">{CAUTION_SHORT}</div>
    </div>,
  );
}
