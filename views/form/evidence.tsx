import { errorId, fieldId } from "./fields.ts";
import { ErrorSlot, NumberInput, Toggle } from "./controls.tsx";
import type { FormState } from "./state.ts";

/** Optional fatigue test results: a lower bound on life with stated reliability and confidence. */
export function EvidenceSection({ s }: { s: FormState }) {
  const name = "evidence.lives";
  const errs = s.errors.get(name);
  return (
    <fieldset class="section switchable" id="sec-evidence">
      <legend>8 · Test evidence (optional)</legend>
      <Toggle s={s} name="evidence.on" label="Compare with fatigue test results" />
      <div class="switched">
        <div class="grid">
          <div class="field wide">
            <label for={fieldId(name)}>
              Test lives <span class="unit">(cycles, one per test article)</span>
            </label>
            <input
              type="text"
              id={fieldId(name)}
              name={name}
              value={s.values[name] ?? ""}
              autocomplete="off"
              aria-describedby={errorId(name)}
              aria-invalid={errs ? "true" : undefined}
            />
            <ErrorSlot name={name} messages={errs} />
          </div>
          <NumberInput s={s} name="evidence.reliability" label="Proportion surviving (reliability)" placeholder="0.9" />
          <NumberInput s={s} name="evidence.confidence" placeholder="0.95" />
          <NumberInput
            s={s}
            name="evidence.logStdDev"
            label="Assumed standard deviation of log₁₀ life"
            hint="Needed when only one article was tested: one result says nothing about scatter."
          />
        </div>
      </div>
      <div class="grid">
        <NumberInput
          s={s}
          name="fleet.size"
          label="Items in service (fleet)"
          hint="Optional: the fleet view of the weakest of that many."
        />
        <NumberInput
          s={s}
          name="fleet.logStdDev"
          label="Fleet: standard deviation of log₁₀ life"
          hint="Needed only without test evidence (the computed life is then the median)."
        />
      </div>
    </fieldset>
  );
}
