import { CRITERION_LABEL } from "../../src/engine/meanStress.ts";
import { raw } from "hono/html";
import { MEAN_STRESS_CRITERIA, SERVICE_DEFAULTS, SERVICES, WELD_DETAILS, WELD_DETAIL_INFO, type Service } from "../../src/schema/check.ts";
import { weldDetailSketch } from "../../src/plots/weldDetail.ts";
import { Choice, ErrorSlot, NumberInput, Panel, Select } from "./controls.tsx";
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
          hint="All seven are worked side by side in the result; this one decides the verdict."
          options={MEAN_STRESS_CRITERIA.map((c) => ({ value: c, label: CRITERION_LABEL[c] }))}
        />
        <div class="when-walker">
          <NumberInput s={s} name="fatigue.walkerGamma" placeholder="0.5" />
        </div>
        <NumberInput s={s} name="fatigue.designLife" unit="cycles, or passes of a history or block set" />
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
          fallback=""
          hint={`Default for the kind of shell: ${curveDefault(s)}.`}
          options={[
            { value: "", label: "Default for the kind of shell" },
            { value: "basquin", label: "Material curve (Basquin)" },
            { value: "welded", label: "Welded detail category (EN 1993-1-9)" },
            { value: "en13445-welded", label: "Vessel welded class (EN 13445-3 clause 18)" },
            { value: "en13445-unwelded", label: "Vessel unwelded curve from Rm (EN 13445-3 clause 18)" },
          ]}
        />
        <div class="when-welded">
          <NumberInput
            s={s}
            name="fatigue.detailCategory"
            label="Detail category or class (stress range at 2 million cycles)"
            hint="For a vessel class, blank takes the class of the weld detail picked below."
          />
        </div>
        <div class="when-welded">
          <NumberInput s={s} name="fatigue.gammaMf" label="Partial factor γMf (EN 1993-1-9 only)" placeholder="1" />
        </div>
        <NumberInput s={s} name="fatigue.temperature" label="Temperature T* for the vessel curves" unit="°C" placeholder="20" />
        <NumberInput s={s} name="fatigue.roughness" label="Surface roughness Rz (unwelded vessel curve)" unit="µm" placeholder="200" />
      </div>
      <WeldDetailPicker s={s} />
    </fieldset>
  );
}

function curveDefault(s: FormState): string {
  const v = s.values["shell.service"] ?? "";
  const service: Service = (SERVICES as readonly string[]).includes(v) ? (v as Service) : "other";
  const d = SERVICE_DEFAULTS[service];
  return d.steelCurve.value === "basquin" ? "the material curve" : "the vessel welded class for steels, the material curve otherwise";
}

/** The weld details in words and a sketch, each with the class it maps to; picking one sets the vessel class. */
export function WeldDetailPicker({ s }: { s: FormState }) {
  const chosen = s.values["fatigue.weldDetail"] ?? "";
  return (
    <fieldset class="choice weld-picker" id="weld-picker" aria-describedby="weld-picker-hint">
      <legend>Weld detail (vessel welded class)</legend>
      <p class="hint" id="weld-picker-hint">
        The stress range at the weld is the equivalent (Tresca) range of the shell there; the class is the range the detail stands for 2
        million cycles. Blank: {WELD_DETAIL_INFO[SERVICE_DEFAULTS["pressure-vessel"].weldDetail.value].label.toLowerCase()}, the lowest
        class (conservative).
      </p>
      <label class="weld-option">
        <input type="radio" name="fatigue.weldDetail" value="" checked={chosen === ""} /> Default (or the class given above)
      </label>
      {WELD_DETAILS.map((id) => {
        const d = WELD_DETAIL_INFO[id];
        return (
          <label class="weld-option" data-detail={id}>
            <input type="radio" name="fatigue.weldDetail" value={id} checked={chosen === id} />
            {raw(weldDetailSketch(id))}
            <span>
              <b>
                {d.label} — class {d.class_MPa}
              </b>
              <br />
              {d.description}
              <br />
              <small>{d.source}</small>
            </span>
          </label>
        );
      })}
      <ErrorSlot name="fatigue.weldDetail" messages={s.errors.get("fatigue.weldDetail")} />
    </fieldset>
  );
}
