import type { CheckResult } from "../../src/engine/index.ts";
import { capitalise, engineText } from "../../src/present/numbers.ts";

/** The engine's warnings: where a method was used near or past the edge of its validity. */
export function Warnings({ result }: { result: CheckResult }) {
  if (result.warnings.length === 0) return null;
  return (
    <section class="block warnings" aria-labelledby="h-warnings">
      <h3 id="h-warnings">Read before relying on this ({result.warnings.length})</h3>
      <ul>
        {result.warnings.map((w) => (
          <li>{capitalise(engineText(w))}</li>
        ))}
      </ul>
    </section>
  );
}
