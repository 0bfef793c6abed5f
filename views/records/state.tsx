import { ROLES, type RevisionState, type Role } from "../../src/store/index.ts";

/**
 * How a revision's state reads on the page. Each badge carries its word as well as its colour,
 * and a superseded one is drawn struck through, so no state depends on colour alone.
 */
const STATE_WORDS: Record<RevisionState, { word: string; means: string }> = {
  draft: { word: "Draft", means: "saved, not yet signed" },
  prepared: { word: "Prepared", means: "signed by its preparer; waiting for the check" },
  checked: { word: "Checked", means: "checked by a second person; waiting for approval" },
  approved: { word: "Approved", means: "prepared, checked and approved" },
  superseded: { word: "Superseded", means: "a later revision replaces it; its sign-offs stay on it" },
};

export const ROLE_WORDS: Record<Role, string> = { prepared: "Prepared by", checked: "Checked by", approved: "Approved by" };

export function StateBadge({ state }: { state: RevisionState }) {
  const { word, means } = STATE_WORDS[state];
  return (
    <span class={`state state-${state}`} title={means} data-state={state}>
      {word}
    </span>
  );
}

export function stateMeaning(state: RevisionState): string {
  return STATE_WORDS[state].means;
}

/** The steps a revision passes through, the ones it has reached marked, so what comes next is plain. */
export function StateTrack({ state }: { state: RevisionState }) {
  const reached = state === "superseded" ? -1 : ROLES.indexOf(state as Role);
  const steps = [{ key: "draft", word: "Saved" }, ...ROLES.map((r) => ({ key: r, word: STATE_WORDS[r].word }))];
  return (
    <ol class="track" aria-label="Sign-off progress of the latest revision">
      {steps.map((s, i) => {
        const done = i <= reached + 1;
        return (
          <li class={done ? "track-step done" : "track-step"}>
            <span class="track-mark" aria-hidden="true">
              {done ? "✓" : String(i + 1)}
            </span>{" "}
            {s.word}
            <span class="visually-hidden">{done ? " (done)" : " (to do)"}</span>
          </li>
        );
      })}
    </ol>
  );
}

/** A stored time as the records show it: date and minute, in UTC, said so. */
export function When({ at }: { at: string }) {
  const d = new Date(at);
  const text = Number.isNaN(d.getTime()) ? at : `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;
  return <time datetime={at}>{text}</time>;
}

/** The first twelve hex digits: enough to tell revisions apart by eye; the full one is on the sheet. */
export function shortPrint(fingerprint: string): string {
  return fingerprint.slice(0, 12);
}
