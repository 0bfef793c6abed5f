import type { CheckSummary } from "../../src/store/index.ts";
import { checkPath, revisionSavePath } from "./paths.ts";
import { StateBadge } from "./state.tsx";

/**
 * Asked before a check is saved onto one already in the records under its calculation number:
 * the new revision would supersede the latest one, signed or not, so the user says so first.
 * The check travels in the form as its JSON document, whatever its size.
 */
export function ConfirmSave({ existing, document, back }: { existing: CheckSummary; document: unknown; back?: string }) {
  return (
    <section class="panel-box" aria-labelledby="h-confirm">
      <h1 id="h-confirm">This calculation number is already in the records</h1>
      <p>
        <a href={checkPath(existing.id)}>
          <span class="calc">{existing.calcNumber}</span> {existing.title}
        </a>{" "}
        is saved with revision {existing.latestRevision}, <StateBadge state={existing.state} />.
      </p>
      <form method="post" action={revisionSavePath(existing.id)} class="actions">
        <input type="hidden" name="document" value={JSON.stringify(document)} />
        <button type="submit" class="primary">
          Save as revision {existing.latestRevision + 1} of {existing.calcNumber}
        </button>
      </form>
      <p class="hint">
        Revision {existing.latestRevision} then becomes superseded; it keeps its sign-offs. If this is a different item, go{" "}
        {back ? <a href={back}>back to the checker</a> : "back to the checker"} and give it a calculation number of its own.
      </p>
    </section>
  );
}
