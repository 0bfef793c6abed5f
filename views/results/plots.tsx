import { raw } from "hono/html";
import { plotInputs } from "../../src/present/plots.ts";
import type { ResultView } from "./context.ts";

/** Haigh, S-N, life against thickness, crack growth and spectrum: each where the check gives it something to draw (src/present/plots.ts). */
export function Plots({ v }: { v: ResultView }) {
  const { figures, note } = plotInputs(v.result, v.units);
  return (
    <section class="block" aria-labelledby="h-plots">
      <h3 id="h-plots">Plots</h3>
      <div class="plots">
        {figures.map((fig) => (
          <figure class="plot" id={`plot-${fig.id}`}>
            {/* The SVG comes from src/plots, which escapes every text it draws. */}
            {raw(fig.svg)}
            <figcaption>{fig.caption}</figcaption>
          </figure>
        ))}
      </div>
      {note ? <p class="hint">{note}</p> : null}
    </section>
  );
}
