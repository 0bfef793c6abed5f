import { CRITERION_LABEL } from "../../src/engine/meanStress.ts";
import { MEAN_STRESS_CRITERIA } from "../../src/schema/check.ts";
import { Choice, NumberInput, Panel, Select } from "./controls.tsx";
import type { FormState } from "./state.ts";

/** Fatigue settings: how mean stress, the notch, the design life and the statistics are treated. */
export function FatigueSection({ s }: { s: FormState }) {
  return (
    <fieldset class="section" id="sec-fatigue">
      <legend>5 · Fatigue</legend>
      <div class="grid">
        <Select
          s={s}
          name="fatigue.meanStress"
          label="Mean-stress criterion"
          fallback="goodman"
          hint="All seven are worked side by side in the result; this one decides the verdict."
          options={MEAN_STRESS_CRITERIA.map((c) => ({ value: c, label: CRITERION_LABEL[c] }))}
        />
        <div class="when-walker">
          <NumberInput s={s} name="fatigue.walkerGamma" label="Walker exponent γ" placeholder="0.5" />
        </div>
        <NumberInput s={s} name="fatigue.designLife" label="Design life" unit="cycles, or passes of a history or block set" />
        <NumberInput
          s={s}
          name="fatigue.scatterFactor"
          label="Scatter factor on life"
          placeholder="1"
          hint="The computed life is divided by this before it is compared with the design life."
        />
      </div>
      <Choice
        s={s}
        name="fatigue.notch"
        legend="Notch sensitivity"
        fallback="kt"
        options={[
          { value: "kt", label: "full (Kf = Kt)" },
          { value: "q", label: "a given q" },
          { value: "peterson", label: "from Peterson’s constant" },
          { value: "neuber", label: "from Neuber’s constant" },
        ]}
      />
      <Panel name="fatigue.notch" value="q">
        <div class="grid">
          <NumberInput s={s} name="fatigue.q" label="Notch sensitivity q (0 to 1)" hint="Kf = 1 + q·(Kt − 1)" />
        </div>
      </Panel>
      <div class="grid">
        <Select
          s={s}
          name="fatigue.curve"
          label="S-N curve"
          fallback="basquin"
          options={[
            { value: "basquin", label: "Material curve (Basquin)" },
            { value: "welded", label: "Welded detail category" },
          ]}
        />
        <div class="when-welded">
          <NumberInput s={s} name="fatigue.detailCategory" label="Detail category (stress range at 2 million cycles)" />
        </div>
        <div class="when-welded">
          <NumberInput s={s} name="fatigue.gammaMf" label="Partial factor γMf" placeholder="1" />
        </div>
      </div>
    </fieldset>
  );
}
