import { errorSlotNames } from "./form/fields.ts";
import { ErrorSlot } from "./form/controls.tsx";
import type { FormState } from "./form/state.ts";
import { PlotsLoader, ResultDetails, ResultTop } from "./results/index.tsx";
import { Plots } from "./results/plots.tsx";
import { VerdictSummary } from "./results/verdict.tsx";
import { StatusNote } from "./status.tsx";
import type { Outcome } from "./workspace.tsx";

/**
 * The answer to an edit made with scripting on: the top of the result (swapped into #results),
 * and, out of band, the verdict, the working, the plots (or a loader that fetches them at once,
 * when the check fits in a URL), the status note and every field's error slot — each slot is
 * sent, empty or not, so an error that has been put right disappears. With errors, the result
 * and verdict are left as they were and the status note marks them out of date.
 */
export function Fragment({ s, o, inlinePlots }: { s: FormState; o: Outcome; inlinePlots: boolean }) {
  const v = o.view;
  return (
    <>
      {v ? <ResultTop v={v} canUsePressure={o.canUsePressure} /> : null}
      {v ? (
        <div id="verdict" hx-swap-oob="innerHTML">
          <VerdictSummary result={v.result} units={v.units} />
        </div>
      ) : null}
      {v ? (
        <div id="details" hx-swap-oob="innerHTML">
          <ResultDetails v={v} />
        </div>
      ) : null}
      {v && inlinePlots ? (
        <div id="plots" hx-swap-oob="innerHTML">
          <Plots v={v} />
        </div>
      ) : null}
      {v && !inlinePlots ? <PlotsLoader v={v} /> : null}
      <div id="stale" hx-swap-oob="innerHTML">
        <StatusNote errors={o.errorCount} general={o.general} hadResult={true} beside={s.errors} />
      </div>
      {errorSlotNames(s.blockRows).map((name) => (
        <ErrorSlot name={name} messages={s.errors.get(name)} oob />
      ))}
    </>
  );
}
