/**
 * @module views/form/shell
 * Section 1 of the form: the shell's form (cylinder or sphere), its radius and where the radius is
 * measured, the wall thickness, and the wall theory. Handed the form's state (state.ts); the number
 * inputs take their labels and units from the form's table (fields.ts), the controls are controls.tsx's.
 */
import { NumberInput, Select } from "./controls.tsx";
import type { FormState } from "./state.ts";

export function ShellSection({ s }: { s: FormState }) {
  return (
    <fieldset class="section" id="sec-shell">
      <legend>1 · Shell</legend>
      <div class="grid">
        <Select
          s={s}
          name="shell.form"
          label="Form"
          options={[
            { value: "cylinder", label: "Cylinder (barrel, shell course)" },
            { value: "sphere", label: "Sphere (dome, spherical tank)" },
          ]}
        />
        <NumberInput s={s} name="shell.radius" />
        <Select
          s={s}
          name="shell.radiusAt"
          label="Radius measured at"
          options={[
            { value: "inner", label: "the inside surface" },
            { value: "mean", label: "mid-wall" },
            { value: "outer", label: "the outside surface" },
          ]}
        />
        <NumberInput s={s} name="shell.thickness" />
        <Select
          s={s}
          name="shell.theory"
          label="Wall theory"
          hint="Automatic uses the thick-wall (Lamé) solution when mean radius ÷ thickness is below 10."
          options={[
            { value: "auto", label: "Automatic" },
            { value: "thin", label: "Thin wall (membrane)" },
            { value: "thick", label: "Thick wall (Lamé)" },
          ]}
        />
      </div>
    </fieldset>
  );
}
