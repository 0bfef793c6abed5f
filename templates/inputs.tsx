/**
 * @module templates/inputs
 * Section 2 of the sheet: the inputs as one table, the user's unit first, SI beside it where it
 * differs, and where each value came from. Only the layout is here; the rows, their labels and
 * values are worked out in inputRows.ts from the sheet model (model.ts).
 */
import { inputGroups } from "./inputRows.ts";
import { typeset } from "./math.tsx";
import type { SheetModel } from "./model.ts";

const LONG_TEXT = 28;

export function Inputs({ m, num }: { m: SheetModel; num: number }) {
  return (
    <section>
      <h2>
        <span class="num">{num}</span>Inputs
      </h2>
      <table class="inputs">
        <colgroup>
          <col style="width:38%" />
          <col style="width:22%" />
          <col style="width:17%" />
          <col style="width:23%" />
        </colgroup>
        <thead>
          <tr>
            <th>Quantity</th>
            <th>Value</th>
            <th>In SI</th>
            <th>Note</th>
          </tr>
        </thead>
        {inputGroups(m).map((g) => (
          <tbody>
            <tr class="group">
              <th colspan={4}>{g.title}</th>
            </tr>
            {g.rows.map((row) =>
              // Long text (a source, a basis) gets the width of the three value columns.
              row.si === "" && row.shown.length > LONG_TEXT ? (
                <tr>
                  <td>{typeset(row.label)}</td>
                  <td colspan={3} class="user">
                    {row.shown}
                    {row.note ? <span class="note"> ({row.note})</span> : null}
                  </td>
                </tr>
              ) : (
                <tr>
                  <td>{typeset(row.label)}</td>
                  <td class="user">{row.shown}</td>
                  <td class="si">{row.si}</td>
                  <td class="note user">{row.note}</td>
                </tr>
              ),
            )}
          </tbody>
        ))}
      </table>
    </section>
  );
}
