import type { CheckSummary } from "../../src/store/index.ts";
import { StateBadge, When } from "./state.tsx";
import { checkPath, sheetPath } from "./paths.ts";

/** Every saved check, the most recently saved first, with what can be done with each. */
export function ChecksList({ checks }: { checks: readonly CheckSummary[] }) {
  return (
    <section aria-labelledby="h-checks">
      <h1 id="h-checks">Saved checks</h1>
      <p class="lead">
        Each check keeps every revision it was saved with. To save a check, work it out in the <a href="/">checker</a> and press{" "}
        <strong>Save to the records</strong> under the result.
      </p>
      {checks.length === 0 ? (
        <p class="empty">Nothing is saved yet.</p>
      ) : (
        <div class="scroll">
          <table class="records-table" id="checks">
            <thead>
              <tr>
                <th scope="col">Calculation number</th>
                <th scope="col">Title</th>
                <th scope="col" class="num">
                  Latest revision
                </th>
                <th scope="col">State</th>
                <th scope="col">Last saved</th>
                <th scope="col">Sheet</th>
              </tr>
            </thead>
            <tbody>
              {checks.map((c) => (
                <tr data-check={c.id}>
                  <td>
                    <a href={checkPath(c.id)}>{c.calcNumber}</a>
                  </td>
                  <td>{c.title}</td>
                  <td class="num">{c.latestRevision}</td>
                  <td>
                    <StateBadge state={c.state} />
                  </td>
                  <td>
                    <When at={c.updatedAt} />
                  </td>
                  <td>
                    <a href={sheetPath(c.id, c.latestRevision)}>Print revision {c.latestRevision} (PDF)</a>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
