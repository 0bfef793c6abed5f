import type { CheckResult } from "../../src/engine/index.ts";
import type { Units } from "../../src/schema/units.ts";
import { CRITERION_STATUS_WORDS } from "../../src/present/words.ts";
import { cycles, inUnits, sig } from "../format.ts";

/** All seven mean-stress criteria worked on the same cycle, so the user sees how much the verdict leans on the choice. */
export function CriteriaTable({ result, units }: { result: CheckResult; units: Units }) {
  const f = result.fatigue;
  const unit = f.lifeCountedIn === "passes" ? "passes" : "cycles";
  return (
    <section class="block" aria-labelledby="h-criteria">
      <h3 id="h-criteria">Mean-stress criteria side by side</h3>
      {f.criteria.length === 0 ? (
        <p>
          Not compared here: the welded detail curve is a curve of stress range and carries the effect of mean and residual stress within
          it.
        </p>
      ) : (
        <div class="scroll">
          <table class="criteria">
            <thead>
              <tr>
                <th scope="col">Criterion</th>
                <th scope="col">σar ({units.stress})</th>
                <th scope="col">Life ({unit})</th>
                <th scope="col">Allowable ({unit})</th>
                <th scope="col">Damage</th>
              </tr>
            </thead>
            <tbody>
              {f.criteria.map((c) => (
                <tr class={c.chosen ? "chosen" : undefined}>
                  <th scope="row">
                    {c.label}
                    {c.chosen ? <span class="tag">used</span> : null}
                  </th>
                  <td class="num">{inUnits(c.equivalentAmplitude_MPa, "stress", units)}</td>
                  {c.status === "ok" || c.status === "unlimited" ? (
                    <>
                      <td class="num">{cycles(c.life_cycles, "")}</td>
                      <td class="num">{cycles(c.allowableLife_cycles, "")}</td>
                      <td class="num">{sig(c.damage, 3)}</td>
                    </>
                  ) : (
                    <td colspan={3}>{CRITERION_STATUS_WORDS[c.status]}</td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
