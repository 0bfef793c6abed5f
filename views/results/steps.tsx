import type { Step } from "../../src/engine/index.ts";
import type { Section } from "../../src/engine/sections.ts";
import { groupSteps } from "../../src/present/steps.ts";
import { sig } from "../format.ts";

/**
 * The calculation as a checker reads it: each line's equation in symbols, the same with the
 * numbers put in, the value with its unit, and where the method is published.
 * Worked in SI whatever the display units, exactly as the engine computed it.
 */
export function Steps({ steps, sections }: { steps: readonly Step[]; sections?: readonly Section[] }) {
  const groups = groupSteps(steps, sections);
  return (
    <section class="block" aria-labelledby="h-steps">
      <h3 id="h-steps">The calculation, line by line</h3>
      <p class="hint">Worked in SI (N, mm, MPa, cycles). Each line can be redone by hand.</p>
      {groups.map((g) => (
        <>
          <h4 class="step-group">{g.title}</h4>
          <ol class="steps" start={g.steps[0]?.no ?? 1}>
            {g.steps.map(({ step: st }) => (
              <li id={`step-${st.id}`}>
                <p class="step-title">{st.title}</p>
                <p class="eq sym">{st.equation}</p>
                <p class="eq sub">
                  {st.substituted}
                  <span class="val">
                    {st.value === null ? " → unlimited" : ` → ${sig(st.value, 4)}${st.unit && st.unit !== "—" ? ` ${st.unit}` : ""}`}
                  </span>
                </p>
                <p class="source">{st.source}</p>
              </li>
            ))}
          </ol>
        </>
      ))}
    </section>
  );
}
