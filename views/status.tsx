import type { FieldError } from "../src/engine/index.ts";
import { fieldId } from "./form/fields.ts";

/**
 * What stands between the input and a result. Empty when the result shown is up to date.
 * With scripting, an input with errors leaves the last good result in place, greyed by the
 * stylesheet whenever this note is present, so it is never taken for the answer to the new input.
 */
export function StatusNote({
  errors,
  general,
  hadResult,
  beside = new Map(),
}: {
  errors: number;
  general: readonly FieldError[];
  hadResult: boolean;
  /** Messages shown beside fields, by field name: the summary links to each field. */
  beside?: ReadonlyMap<string, readonly string[]>;
}) {
  if (errors === 0) return null;
  return (
    <div class="stale-note">
      <p>
        <strong>{hadResult ? "Out of date." : "No result."}</strong>{" "}
        {errors === 1 ? "One input needs correcting" : `${errors} inputs need correcting`}
        {general.length < errors ? " — see the messages beside the marked fields" : ""}.
        {hadResult ? " Any result still shown is greyed out: it belongs to the last complete input, not to what is in the form now." : ""}
      </p>
      {general.length || beside.size ? (
        <ul>
          {[...beside].map(([name, messages]) => (
            <li>
              <a href={`#${fieldId(name)}`}>{name}</a>: {messages.join("; ")}
            </li>
          ))}
          {general.map((e) => (
            <li>
              {e.path === "(document)" ? "" : <code>{e.path}</code>} {e.message}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
