/**
 * @module views/results/warnings
 * The page's list of the engine's warnings, each written from its parts (words and amounts) in the
 * page's units with the one number formatter, so a reader in inches and ksi reads inches and ksi.
 */
import type { CheckResult } from "../../src/engine/index.ts";
import { capitalise, phraseText } from "../../src/present/numbers.ts";
import type { Units } from "../../src/schema/units.ts";

/** The engine's warnings: where a method was used near or past the edge of its validity. */
export function Warnings({ result, units }: { result: CheckResult; units: Units }) {
  if (result.warningParts.length === 0) return null;
  return (
    <section class="block warnings" aria-labelledby="h-warnings">
      <h3 id="h-warnings">Read before relying on this ({result.warningParts.length})</h3>
      <ul>
        {result.warningParts.map((parts) => (
          <li>{capitalise(phraseText(parts, units))}</li>
        ))}
      </ul>
    </section>
  );
}
