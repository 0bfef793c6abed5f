/**
 * @module templates/plots
 * Section 5 of the sheet: the plots of the result, each a figure with its number and caption, and
 * the note when a plot does not apply. Which plots there are and what each draws is decided once
 * for every face in src/present/plots.ts; the SVG comes from src/plots and is inlined.
 */
import { raw } from "hono/html";
import { plotInputs } from "../src/present/plots.ts";
import type { SheetModel } from "./model.ts";

export function Plots({ m, num }: { m: SheetModel; num: number }) {
  const { figures: figs, note } = plotInputs(m.result, m.units, { title: "" });
  return (
    <section>
      <h2>
        <span class="num">{num}</span>Plots
      </h2>
      {note ? <p class="note">{note}</p> : null}
      {figs.map((fig, i) => (
        <figure>
          {/* SVG from src/plots, which escapes every text it draws; it is inlined so nothing is fetched. */}
          {raw(fig.svg)}
          <figcaption>
            <b>Figure {i + 1}.</b>
            {fig.caption}
          </figcaption>
        </figure>
      ))}
    </section>
  );
}
