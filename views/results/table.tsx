import type { CheckResult } from "../../src/engine/index.ts";
import { phraseText } from "../../src/present/numbers.ts";
import type { Units } from "../../src/schema/units.ts";
import { STATUS_WORDS, VERDICT_COLUMNS } from "../../src/present/words.ts";
import { margin } from "../format.ts";

/** Every check the verdict weighs, with its demand against capacity in words. */
export function VerdictTable({ result, units }: { result: CheckResult; units: Units }) {
  return (
    <section class="block" aria-labelledby="h-verdict-table">
      <h3 id="h-verdict-table">Checks weighed</h3>
      <div class="scroll">
        <table class="verdict-table">
          <thead>
            <tr>
              <th scope="col">{VERDICT_COLUMNS.check}</th>
              <th scope="col">{VERDICT_COLUMNS.outcome}</th>
              <th scope="col">{VERDICT_COLUMNS.demand}</th>
              <th scope="col">{VERDICT_COLUMNS.reserve}</th>
            </tr>
          </thead>
          <tbody>
            {result.verdictTable.map((r) => (
              <tr class={`row-${r.status}`}>
                <th scope="row">{r.title}</th>
                <td>
                  <span class={`status status-${r.status}`}>{STATUS_WORDS[r.status]}</span>
                </td>
                <td>{phraseText(r.detailParts, units)}</td>
                <td class="num">{margin(r.margin)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
