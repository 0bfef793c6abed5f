import { NumberInput, Select } from "./controls.tsx";
import type { FormState } from "./state.ts";

/** Settings most checks leave alone; folded away so the main path stays short. */
export function OptionsSection({ s }: { s: FormState }) {
  const used = ["axial.max", "axial.min", "static.yieldFactor", "fatigue.surface", "fatigue.reliability", "fatigue.size"].some(
    (n) => s.values[n],
  );
  const errs = [...s.errors.keys()].some((n) => /^(axial|static)\.|^fatigue\.(surface|reliability|size|localYield)$/.test(n));
  return (
    <details class="section" id="sec-options" open={used || errs || s.values["fatigue.localYield"] === "shakedown"}>
      <summary>6 · Further settings</summary>
      <fieldset>
        <legend>Axial stress from other loads (added to the membrane axial stress)</legend>
        <div class="grid">
          <NumberInput s={s} name="axial.max" label="At the highest pressure" placeholder="0" />
          <NumberInput s={s} name="axial.min" label="At the lowest pressure" placeholder="0" />
        </div>
      </fieldset>
      <fieldset>
        <legend>Static strength and local yield</legend>
        <div class="grid">
          <NumberInput
            s={s}
            name="static.yieldFactor"
            label="Factor on yield"
            placeholder="1.5"
            hint="Von Mises stress × this must not exceed yield."
          />
          <Select
            s={s}
            name="fatigue.localYield"
            label="Notch stress beyond yield"
            options={[
              { value: "elastic", label: "Keep elastic values (warn)" },
              { value: "shakedown", label: "Allow shakedown of the mean" },
            ]}
          />
        </div>
      </fieldset>
      <fieldset>
        <legend>Endurance modifying factors (Marin)</legend>
        <div class="grid">
          <Select
            s={s}
            name="fatigue.surface"
            label="Surface finish"
            fallback=""
            options={[
              { value: "", label: "Not applied" },
              { value: "ground", label: "Ground" },
              { value: "machined", label: "Machined or cold drawn" },
              { value: "hot-rolled", label: "Hot rolled" },
              { value: "as-forged", label: "As forged" },
            ]}
          />
          <NumberInput s={s} name="fatigue.reliability" label="Reliability (0.5 to 0.9999)" />
          <NumberInput s={s} name="fatigue.size" />
        </div>
      </fieldset>
    </details>
  );
}
