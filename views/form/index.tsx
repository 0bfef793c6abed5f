import { AboutSection } from "./about.tsx";
import { CrackSection } from "./crack.tsx";
import { CutoutSection } from "./cutout.tsx";
import { EvidenceSection } from "./evidence.tsx";
import { FatigueSection } from "./fatigue.tsx";
import { MaterialSection } from "./material.tsx";
import { OptionsSection } from "./options.tsx";
import { PressureSection } from "./pressure.tsx";
import { ServiceSection } from "./service.tsx";
import { ShellSection } from "./shell.tsx";
import { UnitsSection } from "./units.tsx";
import type { FormState } from "./state.ts";

/**
 * The check form, in the order of the work. With scripting it posts itself a moment after
 * each edit and only the result is swapped; without, "Work it out" posts it and the whole page
 * comes back. The buttons that solve, download and print sit with the result (OutcomeActions)
 * and post this same form.
 */
export function CheckForm({ s }: { s: FormState }) {
  return (
    <form
      id="check-form"
      class="check-form"
      method="post"
      action="/"
      enctype="multipart/form-data"
      hx-encoding="multipart/form-data"
      hx-post="/recalc"
      hx-trigger="input changed delay:300ms, change"
      hx-target="#results"
      hx-swap="innerHTML"
      hx-sync="#check-form:queue last"
      hx-indicator="#busy"
    >
      {/* The first submit button is the one Enter presses: it must recalculate, not add rows or solve. */}
      {/* biome-ignore lint/a11y/noAriaHiddenOnFocusable: out of the tab order (tabindex −1) and off screen; the visible "Work it out" is the one people use */}
      <button type="submit" class="default-submit" tabindex={-1} aria-hidden="true" hx-post="/recalc">
        Work it out
      </button>
      <ServiceSection s={s} />
      <AboutSection s={s} />
      <UnitsSection s={s} />
      <ShellSection s={s} />
      <PressureSection s={s} />
      <CutoutSection s={s} />
      <MaterialSection s={s} />
      <FatigueSection s={s} />
      <OptionsSection s={s} />
      <CrackSection s={s} />
      <EvidenceSection s={s} />
      <div class="actions">
        <button type="submit" class="primary" hx-post="/recalc">
          Work it out
        </button>
        <a href="#outcome-actions">Solve, download or print ↗</a>
      </div>
    </form>
  );
}
