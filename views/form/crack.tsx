/**
 * @module views/form/crack
 * Section 7 of the form: the optional crack, its geometry and hole (a hole of its own radius, or one
 * of the opening's fastener holes by number), its orientation, the inspection programme's sizes
 * and factor, leak before break and bulging. Field names and paths live in fields.ts.
 */
import { INSPECTION_METHODS } from "../../src/schema/check.ts";
import { TYPICAL_DETECTABLE_MM } from "../../src/materials/inspection.ts";
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
          <NumberInput s={s} name="crack.width" hint="Optional: finite-width correction." />
          <div class="when-hole">
            <NumberInput s={s} name="crack.holeRadius" />
          </div>
          <div class="when-hole">
            <Select
              s={s}
              name="crack.cracksAtHole"
              label="Cracks at the hole"
              options={[
                { value: "1", label: "One side" },
                { value: "2", label: "Both sides" },
              ]}
            />
          </div>
          <div class="when-hole">
            <NumberInput
              s={s}
              name="crack.fastener"
              label="From fastener hole number"
              hint="Optional: a hole of the opening's fastener list (1 = the first); the crack grows straight to the nearest point of the opening's edge. Leave the hole radius blank: the hole's own radius is used."
            />
          </div>
          <div class="when-hole">
            <NumberInput
              s={s}
              name="crack.openingDistance"
              label="Fastener hole to the opening's edge"
              hint="Optional, instead of a hole number: a hole of the radius above whose centre lies this far from the opening's edge on its axial centre line; the crack grows toward the opening."
            />
          </div>
          <Select
            s={s}
            name="crack.orientation"
            label="Orientation"
            fallback=""
            options={[
              { value: "", label: "Default (both with an axial extra stress)" },
              { value: "axial", label: "Along the axis (hoop stress opens it)" },
              { value: "circumferential", label: "Around the shell (axial stress opens it)" },
              { value: "both", label: "Both; the shorter life governs" },
            ]}
          />
          <NumberInput
            s={s}
            name="crack.detectable"
            label="Detectable size"
            hint="The size an inspection finds reliably: sets the repeat interval."
          />
          <Select
            s={s}
            name="crack.detectableBy"
            label="…or a typical size by method"
            fallback=""
            options={[
              { value: "", label: "None chosen" },
              ...INSPECTION_METHODS.map((m) => ({
                value: m,
                label: `${TYPICAL_DETECTABLE_MM[m].label}: ${TYPICAL_DETECTABLE_MM[m].size_mm} mm (typical, verify against a qualified procedure)`,
              })),
            ]}
          />
          <NumberInput
            s={s}
            name="crack.minimumInterval"
            label="Shortest practical interval (cycles)"
            hint="Optional: a shorter repeat interval fails the check."
          />
          <Select
            s={s}
            name="crack.leakBeforeBreak"
            label="Leak before break"
            options={[
              { value: "inform", label: "Inform only" },
              { value: "decide", label: "Decides (vessels): a leak first passes without inspections" },
            ]}
          />
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
          Allow for bulging of a pressurized crack (clearing it is unconservative)
        </label>
      </div>
    </fieldset>
  );
}
