import { NumberInput, Select, Toggle } from "./controls.tsx";
import type { FormState } from "./state.ts";

/** Optional damage tolerance: a crack grown by the Paris law to its critical size. */
export function CrackSection({ s }: { s: FormState }) {
  return (
    <fieldset class="section switchable" id="sec-crack">
      <legend>7 · Crack growth (optional)</legend>
      <Toggle s={s} name="crack.on" label="Grow a crack from an assumed initial size" />
      <div class="switched">
        <div class="grid">
          <Select
            s={s}
            name="crack.geometry"
            label="Crack"
            fallback="center-through"
            options={[
              { value: "center-through", label: "Through crack in open skin" },
              { value: "edge-through", label: "Through crack from a free edge" },
              { value: "hole-through", label: "Through crack from a hole" },
            ]}
          />
          <NumberInput
            s={s}
            name="crack.initial"
            label="Initial size"
            hint="Half-length for a crack in open skin; length from the edge or hole otherwise."
          />
          <NumberInput s={s} name="crack.width" label="Panel width" hint="Optional: finite-width correction." />
          <div class="when-hole">
            <NumberInput s={s} name="crack.holeRadius" label="Hole radius" />
          </div>
          <div class="when-hole">
            <Select
              s={s}
              name="crack.cracksAtHole"
              label="Cracks at the hole"
              fallback="1"
              options={[
                { value: "1", label: "One side" },
                { value: "2", label: "Both sides" },
              ]}
            />
          </div>
          <NumberInput
            s={s}
            name="crack.inspectionFactor"
            label="Inspection factor"
            placeholder="2"
            hint="Growth life ÷ this = the interval between inspections."
          />
        </div>
        <label class="check">
          <input type="checkbox" name="crack.bulging" value="on" checked={Boolean(s.values["crack.bulging"])} />
          Allow for bulging of a pressurized crack
        </label>
      </div>
    </fieldset>
  );
}
