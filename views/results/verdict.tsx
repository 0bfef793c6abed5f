import type { CheckResult, VerdictRow } from "../../src/engine/index.ts";
import { phraseText, quantity } from "../../src/present/numbers.ts";
import type { Units } from "../../src/schema/units.ts";
import { VERDICT_WORDS } from "../../src/present/words.ts";
import { cycles, margin, sig } from "../format.ts";
import { STATIC_BASIS_LABEL, WELD_DETAIL_INFO } from "../../src/schema/service.ts";

/** The row the verdict rests on, as the engine names it. */
export function governingRow(result: CheckResult): VerdictRow | undefined {
  return result.verdictTable.find((r) => r.id === result.governing.rowId);
}

/**
 * The verdict in a few lines: pass or fail, what governs and by how much, and the fatigue
 * life against the design life. Read out by screen readers whenever it changes.
 */
export function VerdictSummary({ result, units }: { result: CheckResult; units: Units }) {
  const row = governingRow(result);
  const f = result.fatigue;
  const unit = f.lifeCountedIn === "passes" ? "passes" : "cycles";
  return (
    <div class={`verdict verdict-${result.verdict}`}>
      <p class="verdict-word">
        <span class="badge">{VERDICT_WORDS[result.verdict].badge}</span>
        <span class="verdict-title">{result.title ?? "this check"}</span>
      </p>
      <p class="governs">
        <strong>Governed by</strong> {phraseText(result.governing.parts, units)}
        {row && row.margin !== null ? (
          <>
            {" "}
            —{" "}
            <strong>
              {row.margin >= 0 ? "reserve" : "shortfall"} {margin(row.margin)}
            </strong>
          </>
        ) : null}
      </p>
      <p class="static-basis" data-testid="static-basis">
        <strong>Static basis:</strong> {STATIC_BASIS_LABEL[result.static.basis]}
        {result.static.requiredThickness_mm !== null ? (
          <> — ordered wall needed {quantity(result.static.requiredThickness_mm, "length", units)}</>
        ) : null}
        {f.weldDetail ? (
          <>
            {" "}
            · <strong>Weld detail:</strong> {WELD_DETAIL_INFO[f.weldDetail].label}, class {sig(f.detailCategory_MPa, 3)}
          </>
        ) : null}
      </p>
      {result.static.statement ? <p class="static-statement">{result.static.statement}</p> : null}
      <dl class="headline">
        <div>
          <dt>Fatigue damage</dt>
          <dd>{sig(f.damage, 3)}</dd>
        </div>
        <div>
          <dt>Allowable life</dt>
          <dd data-testid="allowable-life">{cycles(f.allowableLife_cycles, unit)}</dd>
        </div>
        <div>
          <dt>Design life</dt>
          <dd>{cycles(f.designLife_cycles, unit)}</dd>
        </div>
        <div>
          <dt>Static reserve</dt>
          <dd>{margin(result.static.margin)}</dd>
        </div>
      </dl>
    </div>
  );
}
