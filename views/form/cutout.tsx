import { Choice, NumberInput, Panel, TextInput } from "./controls.tsx";
import type { FormState } from "./state.ts";

/** The opening or detail that raises the stress: Kt is referred to the nominal hoop stress. */
export function CutoutSection({ s }: { s: FormState }) {
  return (
    <fieldset class="section" id="sec-cutout">
      <legend>3 · Cutout</legend>
      <Choice
        s={s}
        name="cutout.kind"
        legend="At the point checked there is"
        fallback="none"
        options={[
          { value: "none", label: "plain skin" },
          { value: "circular-hole", label: "a round hole" },
          { value: "elliptical-hole", label: "an elliptical opening" },
          { value: "rounded-rectangle", label: "a rectangular opening with rounded corners" },
          { value: "outline", label: "an opening of a given outline (from a file)" },
          { value: "given", label: "a detail of known Kt" },
        ]}
      />
      <Panel name="cutout.kind" value="circular-hole">
        <div class="grid">
          <NumberInput
            s={s}
            name="circle.radius"
            label="Hole radius"
            hint="Optional: needed only for notch sensitivity from a material constant."
          />
        </div>
      </Panel>
      <Panel name="cutout.kind" value="elliptical-hole">
        <div class="grid">
          <NumberInput s={s} name="ellipse.hoop" label="Half-width around the shell (hoop direction)" />
          <NumberInput s={s} name="ellipse.axial" label="Half-length along the axis" />
        </div>
      </Panel>
      <Panel name="cutout.kind" value="rounded-rectangle">
        <div class="grid">
          <NumberInput s={s} name="rect.hoop" label="Half-width around the shell (hoop direction)" />
          <NumberInput s={s} name="rect.axial" label="Half-length along the axis" />
          <NumberInput s={s} name="rect.corner" hint="At most the smaller half-size." />
        </div>
        <p class="hint">Fastener holes and a reinforcement given in a check file ride along with it.</p>
      </Panel>
      <Panel name="cutout.kind" value="outline">
        <p class="hint">The outline's points and any fastener holes come from the check file you opened; they ride along with the form.</p>
      </Panel>
      <Panel name="cutout.kind" value="given">
        <div class="grid">
          <NumberInput s={s} name="given.kt" label="Kt, referred to the nominal hoop stress" />
          <NumberInput
            s={s}
            name="given.rootRadius"
            label="Notch root radius"
            hint="Optional: for notch sensitivity from a material constant."
          />
          <TextInput
            s={s}
            name="given.basis"
            label="Where this Kt comes from"
            wide
            placeholder="chart, finite-element model, strain-gauge test…"
          />
        </div>
      </Panel>
    </fieldset>
  );
}
