import type { Actor, CheckRecord, EventRecord, RevisionRecord } from "../../src/store/index.ts";
import { comparePath, exportPath, inputPath, openPath, sheetPath } from "./paths.ts";
import { SignForm, type SignFormState } from "./signForm.tsx";
import { ROLE_WORDS, shortPrint, StateBadge, stateMeaning, StateTrack, When } from "./state.tsx";

/** One saved check: where it stands, signing its latest revision, every revision, and its log. */
export function CheckView({ check, user, sign }: { check: CheckRecord; user: Actor; sign: SignFormState }) {
  const latest = check.revisions[check.revisions.length - 1];
  const altered = check.revisions.filter((r) => !r.intact);
  return (
    <>
      {altered.length > 0 ? (
        <p class="notice refused" role="alert" id="altered">
          Changed outside Hoopwise: revision{altered.length === 1 ? "" : "s"} {altered.map((r) => r.number).join(", ")} no longer give
          {altered.length === 1 ? "s" : ""} the fingerprint saved with {altered.length === 1 ? "it" : "them"}. Their sign-offs do not count
          and their sheets are not printed; restore the database from a backup.
        </p>
      ) : null}
      <section aria-labelledby="h-check" class="check-head">
        <p class="crumbs">
          <a href="/records">Saved checks</a> /
        </p>
        <h1 id="h-check">
          <span class="calc">{check.calcNumber}</span> {check.title}
        </h1>
        <p class="standing">
          Revision {latest.number} is <StateBadge state={latest.state} /> — {stateMeaning(latest.state)}.
        </p>
        <StateTrack state={latest.state} />
        <p class="record-actions">
          <a class="button-link primary" href={openPath(check.id, latest.number)}>
            Open revision {latest.number} in the checker
          </a>
          <a class="button-link" href={sheetPath(check.id, latest.number)}>
            Print revision {latest.number} (PDF)
          </a>
          <a class="button-link" href={exportPath(check.id)}>
            Export the whole check (JSON)
          </a>
          {check.revisions.length > 1 ? (
            <a class="button-link" href={comparePath(check.id, latest.number - 1, latest.number)}>
              Compare revisions {latest.number - 1} and {latest.number}
            </a>
          ) : null}
        </p>
        <p class="hint">A sheet takes a few seconds to print. Unsigned revisions print with the draft mark; superseded ones say so.</p>
      </section>
      <SignForm check={check} user={user} form={sign} />
      <Revisions check={check} />
      <EventLog events={check.events} />
    </>
  );
}

function Revisions({ check }: { check: CheckRecord }) {
  const newestFirst = [...check.revisions].reverse();
  return (
    <section aria-labelledby="h-revisions" class="panel-box" id="revisions">
      <h2 id="h-revisions">Revisions</h2>
      <div class="scroll">
        <table class="records-table">
          <thead>
            <tr>
              <th scope="col" class="num">
                Rev.
              </th>
              <th scope="col">State</th>
              <th scope="col">Saved</th>
              <th scope="col">Fingerprint</th>
              <th scope="col">Sign-offs</th>
              <th scope="col">Actions</th>
            </tr>
          </thead>
          <tbody>
            {newestFirst.map((r) => (
              <RevisionRow check={check} r={r} />
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

function RevisionRow({ check, r }: { check: CheckRecord; r: RevisionRecord }) {
  return (
    <tr id={`revision-${r.number}`} class={`rev rev-${r.state}`} data-revision={r.number} data-state={r.state}>
      <td class="num">{r.number}</td>
      <td>
        <StateBadge state={r.state} />
      </td>
      <td>
        <When at={r.savedAt} />
        {r.savedBy ? <span class="by"> by {r.savedBy}</span> : null}
      </td>
      <td>
        <code title={r.fingerprint}>{shortPrint(r.fingerprint)}</code>
        <span class="engine">{r.engineVersion}</span>
      </td>
      <td>
        {r.importedUnsigned ? <p class="hint">imported, not signed in these records</p> : null}
        {r.signoffs.length === 0 ? (
          <span class="hint">none</span>
        ) : (
          <ul class="signoffs">
            {r.signoffs.map((s) => (
              <li>
                {ROLE_WORDS[s.role]} <strong>{s.name}</strong>, <When at={s.signedAt} />
                {s.imported ? <span class="hint"> (imported, signed with a trusted key)</span> : null}
                {s.valid ? null : <strong class="field-error"> — signature does not hold; not counted</strong>}
              </li>
            ))}
          </ul>
        )}
      </td>
      <td class="row-actions">
        <a href={openPath(check.id, r.number)}>Open in the checker</a>
        <a href={sheetPath(check.id, r.number)}>Print (PDF)</a>
        <a href={inputPath(check.id, r.number)}>Input (JSON)</a>
        {r.number > 1 ? <a href={comparePath(check.id, r.number - 1, r.number)}>Compare with {r.number - 1}</a> : null}
      </td>
    </tr>
  );
}

const EVENT_WORDS: Record<EventRecord["kind"], string> = {
  saved: "Saved",
  signed: "Signed",
  superseded: "Superseded",
  exported: "Exported",
  imported: "Imported",
};

/** What an event's detail adds, in words. */
function eventDetail(e: EventRecord): string {
  const d = e.detail ?? {};
  if (e.kind === "signed" && typeof d.role === "string") return `as ${d.role}`;
  if (e.kind === "superseded" && typeof d.by === "number") return `by revision ${d.by}`;
  if (e.kind === "saved" && typeof d.fingerprint === "string") return `fingerprint ${shortPrint(d.fingerprint)}`;
  return "";
}

function EventLog({ events }: { events: readonly EventRecord[] }) {
  return (
    <section aria-labelledby="h-log" class="panel-box" id="log">
      <h2 id="h-log">Log</h2>
      <p class="hint">Every save, signature, export and import, oldest first. Entries are only ever added.</p>
      <ol class="log">
        {events.map((e) => (
          <li class={`log-${e.kind}`}>
            <When at={e.at} /> <strong>{EVENT_WORDS[e.kind]}</strong>
            {e.revision !== null ? ` revision ${e.revision}` : ""} {eventDetail(e)}
            {e.actor ? ` — ${e.actor}` : ""}
          </li>
        ))}
      </ol>
    </section>
  );
}
