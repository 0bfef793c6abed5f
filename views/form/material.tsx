/**
 * @module views/form/material
 * The form's material section: a library entry (typical values behind the blank fields) or the
 * user's own values, each in the chosen units; the Paris coefficient in the units its exponent
 * goes with (src/schema/units.ts).
 */
import { MATERIALS, TYPICAL_FLAG } from "../../src/materials/library.ts";
import { MATERIAL_VALUE_FIELDS, NUMBER_FIELDS, type NumberFieldName } from "./fields.ts";
import { formNumber, fromSI, parisCFromSI, parisCUnit } from "../../src/schema/units.ts";
import { NumberInput, Select, TextInput } from "./controls.tsx";
import type { FormState } from "./state.ts";

const LABELS: Record<(typeof MATERIAL_VALUE_FIELDS)[number], string> = {
  "material.ultimate": "Ultimate strength",
  "material.yield": "Yield strength",
  "material.modulus": "Elastic modulus",
  "material.sigmaF": "Fatigue strength coefficient σ′f",
  "material.b": "Basquin exponent b",
  "material.endurance": "Endurance limit",
  "material.toughness": "Fracture toughness",
  "material.parisC": "Paris coefficient C",
  "material.parisM": "Paris exponent m",
};

/**
 * The material: a library entry (typical values, to be verified) or the user's own values.
 * With a library entry chosen, each blank field keeps the library's value, shown as the
 * field's placeholder; a value typed in replaces it for this check only.
 */
export function MaterialSection({ s }: { s: FormState }) {
  const lib = s.library;
  const placeholder = (name: NumberFieldName) => {
    const f = NUMBER_FIELDS[name];
    const x = lib ? (lib as unknown as Record<string, unknown>)[f.path.slice("material.".length)] : undefined;
    if (typeof x !== "number") return undefined;
    // The Paris coefficient's factor between unit systems depends on its exponent: the library's goes with the library's.
    return formNumber(
      name === "material.parisC" && lib?.parisM !== undefined ? parisCFromSI(x, lib.parisM, s.units) : fromSI(x, f.quantity, s.units),
    );
  };
  return (
    <fieldset class="section" id="sec-material">
      <legend>4 · Material</legend>
      <input type="hidden" name="material.shown" value={lib?.id ?? ""} />
      <div class="grid">
        <Select
          s={s}
          name="material.id"
          label="Material"
          fallback=""
          options={[{ value: "", label: "Own values (typed below)" }, ...MATERIALS.map((m) => ({ value: m.id, label: m.name }))]}
        />
        <TextInput
          s={s}
          name="material.name"
          label="Name on the sheet"
          placeholder={lib?.name ?? "e.g. plate to the purchase specification"}
        />
      </div>
      <p class={lib ? "flag" : "flag own"}>
        {lib ? (
          <>
            <strong>Typical values — verify against certified data.</strong> Blank fields keep the library value shown in grey; type a value
            to replace it for this check. Source: {lib.source}
          </>
        ) : (
          <>
            <strong>Your own values.</strong> Give at least the strengths, the modulus and the Basquin constants; toughness and Paris
            constants are needed only for crack growth. Material values must come from certified data ({TYPICAL_FLAG} when taken from a
            handbook).
          </>
        )}
      </p>
      <div class="grid">
        {MATERIAL_VALUE_FIELDS.map((name) => (
          <NumberInput
            s={s}
            name={name}
            label={LABELS[name]}
            placeholder={placeholder(name)}
            unit={name === "material.parisC" ? parisCUnit(s.units) : undefined}
          />
        ))}
      </div>
    </fieldset>
  );
}
