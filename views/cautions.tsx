import { CAUTION_SHORT, CAUTIONS, CAUTIONS_ALWAYS } from "../src/present/words.ts";

/**
 * The cautions, in plain words (src/present/words.ts, the same text as the sheet's). The
 * ones no result may be shown without head every page; the rest fold out. The short form sits
 * under the verdict, so no result is ever shown without it.
 */
export function Cautions() {
  return (
    <aside class="cautions" aria-labelledby="h-cautions">
      <h2 id="h-cautions">Before you rely on any result</h2>
      <ul>
        {CAUTIONS.slice(0, CAUTIONS_ALWAYS).map((c) => (
          <li>{c}</li>
        ))}
      </ul>
      <details>
        <summary>What else lies outside this check</summary>
        <ul>
          {CAUTIONS.slice(CAUTIONS_ALWAYS).map((c) => (
            <li>{c}</li>
          ))}
        </ul>
      </details>
    </aside>
  );
}

export function CautionStrip() {
  return <p class="caution-strip">{CAUTION_SHORT}</p>;
}
