import type { FieldError } from "../src/engine/index.ts";
import { OutcomeActions } from "./actions.tsx";
import { CautionStrip } from "./cautions.tsx";
import { CheckForm } from "./form/index.tsx";
import type { FormState } from "./form/state.ts";
import { ResultDetails, ResultTop } from "./results/index.tsx";
import { Plots } from "./results/plots.tsx";
import type { ResultView } from "./results/context.ts";
import { VerdictSummary } from "./results/verdict.tsx";
import { StatusNote } from "./status.tsx";

/** Where the outcome stands: a result, or the errors that keep one from being worked out. */
export interface Outcome {
  view?: ResultView;
  errorCount: number;
  /** Errors that belong to no single field. */
  general: readonly FieldError[];
  /** The direct-pressure way is in use, so a solved pressure can be put into the form. */
  canUsePressure: boolean;
}

/** The form beside its outcome: the part of the page a change of units or material redraws as a whole. */
export function Workspace({ s, o }: { s: FormState; o: Outcome }) {
  return (
    <main id="workspace" class="workspace">
      <CheckForm s={s} />
      <section class="outcome" id="outcome" aria-labelledby="h-outcome">
        <div class="outcome-head">
          <h2 id="h-outcome">
            Result{" "}
            <span id="busy" class="busy">
              working…
            </span>
          </h2>
          <div id="stale" role="status">
            <StatusNote errors={o.errorCount} general={o.general} hadResult={false} beside={s.errors} />
          </div>
          <div id="verdict" aria-live="polite" aria-atomic="true">
            {o.view ? <VerdictSummary result={o.view.result} units={o.view.units} /> : null}
          </div>
          <CautionStrip />
          <OutcomeActions s={s} />
        </div>
        <div id="results">{o.view ? <ResultTop v={o.view} canUsePressure={o.canUsePressure} /> : null}</div>
        <div id="plots">{o.view ? <Plots v={o.view} /> : null}</div>
        <div id="details">{o.view ? <ResultDetails v={o.view} /> : null}</div>
        <div id="plots-loader"></div>
      </section>
    </main>
  );
}
