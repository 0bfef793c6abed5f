/**
 * @module templates/front
 * Page 1: what the sheet is, which revision, its fingerprint, and the outcome in one line.
 * The title block (check, project, calculation number, revision, material, print date and paper,
 * engine, fingerprint), the status mark with what it means (status.ts), the screening outcome with
 * the governing check in the reader's units, how many warnings qualify it, and the short caution.
 * Handed the sheet model (model.ts); the verdict words are the engine's, the phrase is written by
 * the one number formatter (src/present/numbers.ts).
 */
import { phraseText } from "../src/present/numbers.ts";
import { VERDICT_WORDS } from "../src/engine/index.ts";
import { CAUTION_SHORT } from "./cautions.tsx";
import { isoDate } from "./format.ts";
import { typeset } from "./math.tsx";
import type { SheetModel } from "./model.ts";
import { statusMark } from "./status.ts";

const STATE_MEANS = {
  draft: "No one has signed this sheet. It is a working draft and must be checked before anyone relies on it.",
  prepared: "Signed as prepared; not yet checked by a second engineer.",
  checked: "Prepared and checked; not yet approved.",
  approved: "Prepared, checked and approved in the records (see the sign-off section).",
  superseded: "A later revision replaces this one. Keep it for the record only.",
} as const;

export function Front({ m }: { m: SheetModel }) {
  const d = m.document;
  const r = m.result;
  const mark = statusMark(m.signoffs, m.superseded);
  return (
    <header>
      <div class="title-block">
        <div class="k">Check</div>
        <div class="v wide title-v user">{d.title ?? "Untitled check"}</div>
        <div class="k">Project</div>
        <div class="v wide user">{d.project ?? "not named"}</div>
        <div class="k">Calculation no.</div>
        <div class="v user">{m.calcNumber ?? d.calcNumber ?? "not numbered"}</div>
        <div class="k">Revision</div>
        <div class="v last">{m.revision !== undefined ? String(m.revision) : "— (not saved)"}</div>
        <div class="k">Material</div>
        <div class="v user">{m.material.name}</div>
        <div class="k">Printed</div>
        <div class="v last">
          {isoDate(m.printedOn)} · {m.paper === "A4" ? "A4" : "US Letter"}
        </div>
        <div class="k">Engine</div>
        <div class="v wide">{r.engine}</div>
        <div class="k bottom">Fingerprint</div>
        <div class="v wide bottom">
          <span class="fingerprint">{r.fingerprint}</span>
          <br />
          <span class="note">SHA-256 of the canonical input and the engine version; the input is attached to this PDF.</span>
        </div>
      </div>
      <div class="status-line">
        <span class={`mark mark-${mark.state}`}>{mark.words}</span>
        <span class="why">{STATE_MEANS[mark.state]}</span>
      </div>
      <div class="outcome">
        <div class={`verdict ${r.verdict}`}>Screening outcome: {VERDICT_WORDS[r.verdict].outcome}</div>
        <div class="governs">
          <b>Governing check:</b> {typeset(phraseText(r.governing.parts, m.units))}.
        </div>
        {r.warnings.length > 0 ? (
          <div class="governs">
            {r.warnings.length === 1 ? "One warning qualifies" : `${r.warnings.length} warnings qualify`} this outcome (section 4).
          </div>
        ) : null}
      </div>
      <p class="caution-short">{CAUTION_SHORT} See section 6.</p>
    </header>
  );
}
