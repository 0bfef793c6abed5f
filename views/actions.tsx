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
export function OutcomeActions() {
  return (
    <div class="outcome-actions" id="outcome-actions" role="group" aria-label="Solve, download or print this check">
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
    </div>
  );
}
