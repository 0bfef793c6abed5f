import { SAVE_PATH } from "./records/paths.ts";
import { ErrorSlot } from "./form/controls.tsx";
import type { FormState } from "./form/state.ts";

/** What htmx does with a button that posts the check form from outside it: the same as for an edit of the form. */
export const RECALC_BUTTON = {
  "hx-post": "/recalc",
  "hx-target": "#results",
  "hx-swap": "innerHTML",
  "hx-sync": "#check-form:queue last",
  "hx-indicator": "#busy",
} as const;

/**
 * Buttons that act on the whole check, kept with the result they act on. Each belongs to the
 * check form (form="check-form"), so without scripting it posts the form like any submit button.
 * Downloading and printing post the same fields to their own routes.
 */
export function OutcomeActions({ s }: { s: FormState }) {
  return (
    // biome-ignore lint/a11y/useSemanticElements: a row of buttons, not form fields: a fieldset would add a legend and a frame
    <div class="outcome-actions" id="outcome-actions" role="group" aria-label="Solve, download, print or save this check">
      <button type="submit" form="check-form" name="solve" value="thickness" {...RECALC_BUTTON}>
        Find the least thickness
      </button>
      <button type="submit" form="check-form" name="solve" value="pressure" {...RECALC_BUTTON}>
        Find the highest pressure
      </button>
      <button type="submit" form="check-form" formaction="/export" formmethod="post" class="secondary">
        Download as JSON
      </button>
      <button type="submit" form="check-form" formaction="/sheet" formmethod="post" class="secondary" id="print-sheet">
        Print the check sheet (PDF)
      </button>
      <p id="sheet-note" class="sheet-note" role="status" hidden>
        Preparing the check sheet — this takes a few seconds…
      </p>
      <SaveActions s={s} />
    </div>
  );
}

/**
 * Saving to the records, for sign-off. The saver's name and the saved check the form was opened
 * from (if any) belong to the check form, so every post of it carries them and they survive a
 * whole-page answer.
 */
function SaveActions({ s }: { s: FormState }) {
  const record = s.values.record;
  return (
    // biome-ignore lint/a11y/useSemanticElements: a row of buttons, not form fields: a fieldset would add a legend and a frame
    <div class="save-actions" role="group" aria-labelledby="h-save">
      <p id="h-save" class="save-title">
        Keep this check
      </p>
      {record ? <input type="hidden" form="check-form" name="record" value={record} /> : null}
      <div class="field">
        <label for="f-savedBy">
          Saved by <span class="unit">(optional)</span>
        </label>
        <input
          type="text"
          id="f-savedBy"
          form="check-form"
          name="savedBy"
          value={s.values.savedBy ?? ""}
          autocomplete="name"
          aria-describedby="e-savedBy"
          aria-invalid={s.errors.has("savedBy") ? "true" : undefined}
        />
        <ErrorSlot name="savedBy" messages={s.errors.get("savedBy")} />
      </div>
      <button type="submit" form="check-form" formaction={SAVE_PATH} formmethod="post" class="primary" id="save-record">
        {record ? "Save as a new revision" : "Save to the records"}
      </button>
      {record ? (
        <button type="submit" form="check-form" formaction={SAVE_PATH} formmethod="post" name="as" value="new" class="secondary">
          Save as a new check
        </button>
      ) : null}
      <p class="hint save-hint">
        {record
          ? "Opened from the records: saving adds a revision to that check, which then needs signing again."
          : "Saved checks keep every revision and can be signed, compared and printed from the records."}{" "}
        <a href="/records">Saved checks</a>
      </p>
    </div>
  );
}
