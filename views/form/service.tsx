import {
  BASIS_DEFAULTS,
  SERVICE_DEFAULTS,
  SERVICE_LABEL,
  SERVICES,
  STATIC_BASES,
  STATIC_BASIS_LABEL,
  type Service,
  type StaticBasis,
} from "../../src/schema/service.ts";
import { NumberInput, Select } from "./controls.tsx";
import type { FormState } from "./state.ts";

/** The kind of shell, chosen first: it sets the static basis and the fatigue route, each shown as a default to change. */
/** The allowances whose default follows the service: field, its default's key, and a note before the default. */
const DEFAULTED = [
  ["static.corrosionAllowance", "corrosionAllowance_mm", ""],
  ["static.thicknessTolerance", "thicknessTolerance_mm", "Of the plate. "],
  ["static.minimumGauge", "minimumGauge_mm", "Without the corrosion allowance. "],
] as const;

export function ServiceSection({ s }: { s: FormState }) {
  const service = (SERVICES as readonly string[]).includes(s.values["shell.service"] ?? "")
    ? (s.values["shell.service"] as Service)
    : "other";
  const d = SERVICE_DEFAULTS[service];
  const chosen = s.values["static.basis"];
  const basis: StaticBasis = (STATIC_BASES as readonly string[]).includes(chosen ?? "") ? (chosen as StaticBasis) : d.basis.value;
  const code = basis === "en13445-3" || basis === "asme-viii-1";
  const num = (x: number) => String(x);
  return (
    <fieldset class="section" id="sec-service">
      <legend>Kind of shell and static basis</legend>
      <div class="grid">
        <Select
          s={s}
          name="shell.service"
          label="Kind of shell"
          hint="Sets the defaults below; every default can be changed."
          options={SERVICES.map((x) => ({ value: x, label: SERVICE_LABEL[x] }))}
        />
        <Select
          s={s}
          name="static.basis"
          label="Static basis"
          fallback=""
          hint={`Default: ${STATIC_BASIS_LABEL[d.basis.value]} (${d.basis.why}).`}
          options={[
            { value: "", label: `Default for the kind of shell (${STATIC_BASIS_LABEL[d.basis.value]})` },
            ...STATIC_BASES.map((x) => ({ value: x, label: STATIC_BASIS_LABEL[x] })),
          ]}
        />
      </div>
      <div class="grid">
        <NumberInput
          s={s}
          name="static.jointEfficiency"
          label={
            basis === "en13445-3"
              ? "Weld joint coefficient z"
              : basis === "asme-viii-1"
                ? "Joint efficiency E"
                : "Joint coefficient z or E (vessel bases only)"
          }
          placeholder={code ? num(BASIS_DEFAULTS.jointEfficiency.value) : "1"}
          hint={`Default ${BASIS_DEFAULTS.jointEfficiency.value}: no volumetric testing (conservative).`}
        />
        <NumberInput
          s={s}
          name="static.allowableStress"
          label={basis === "asme-viii-1" ? "Allowable stress S from the code (optional)" : "Design stress f from the code (optional)"}
          hint={
            basis === "en13445-3"
              ? "Blank: f = min(Rp0.2/1.5, Rm/2.4)."
              : basis === "asme-viii-1"
                ? "Blank: S = min(Su/3.5, 2Sy/3) at room temperature."
                : "Vessel bases only."
          }
        />

        <NumberInput
          s={s}
          name="static.limitFactor"
          hint="Aircraft basis only: on the pressure differential."
          placeholder={num(BASIS_DEFAULTS.limitFactor.value)}
        />
        <NumberInput
          s={s}
          name="static.ultimateFactor"
          hint="Aircraft basis only."
          placeholder={num(BASIS_DEFAULTS.ultimateFactor.value)}
        />
        {DEFAULTED.map(([name, key, note]) => (
          <NumberInput s={s} name={name} placeholder={num(d[key].value)} hint={`${note}Default: ${d[key].why}.`} />
        ))}
      </div>
      {code ? (
        <p class="hint">
          The formula check of the shell only: openings, nozzles, heads, materials, temperature and testing follow the code's own rules,
          which are not checked here.
        </p>
      ) : null}
    </fieldset>
  );
}
