import type { CheckResult } from "../../src/engine/index.ts";
import type { Units } from "../../src/schema/units.ts";
import { RECALC_BUTTON } from "../actions.tsx";
import { quantity } from "../format.ts";

/**
 * The answer of a solve button: the least wall thickness, or the highest pressure, that still
 * passes every check, and which check sets it. A button puts a solved thickness (or a directly
 * given pressure) into the form.
 */
export function Solution({ result, units, canUsePressure }: { result: CheckResult; units: Units; canUsePressure: boolean }) {
  const s = result.solution;
  if (!s) return null;
  const thickness = s.thickness_mm !== undefined;
  const value = thickness ? s.thickness_mm : s.pressureMax_MPa;
  return (
    <section class="block solution" aria-labelledby="h-solution">
      <h3 id="h-solution">{thickness ? "Least wall thickness that passes" : "Highest pressure that passes"}</h3>
      <p class="solved">
        <strong data-testid="solution">{value === undefined ? "—" : quantity(value, thickness ? "length" : "pressure", units)}</strong>, set
        by {s.governs}
      </p>
      <p class="hint">
        Found in {s.iterations} iterations ({s.evaluations} evaluations of the whole check); every other input held as given.
      </p>
      {value !== undefined && (thickness || canUsePressure) ? (
        <button
          type="submit"
          form="check-form"
          name="use"
          value={`${thickness ? "thickness" : "pressure"}:${value}`}
          class="secondary"
          {...RECALC_BUTTON}
        >
          Put this {thickness ? "thickness" : "pressure"} into the form
        </button>
      ) : null}
    </section>
  );
}
