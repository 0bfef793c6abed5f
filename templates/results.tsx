/**
 * @module templates/results
 * The sheet's results section: the verdict table, the principal numbers, the mean-stress criteria
 * compared and every warning. Phrases from the engine (verdict rows, warnings) are written from
 * their parts in the sheet's units with the one number formatter.
 */
import { phraseText } from "../src/present/numbers.ts";
import type { Units } from "../src/schema/units.ts";
import { VERDICT_WORDS, type CheckResult, type VerdictRow } from "../src/engine/index.ts";
import { capitalise, life, margin, sig } from "./format.ts";
import { typeset } from "./math.tsx";
import type { SheetModel } from "./model.ts";
import { CRITERION_STATUS_WORDS, STATUS_WORDS, VERDICT_COLUMNS } from "../src/present/words.ts";
import { CRITERION_NAMES } from "./names.ts";
import { dual, dualText } from "./quantities.ts";

/** Results: the verdict table, the principal numbers, the mean-stress comparison and every warning. */
export function Results({ m, num }: { m: SheetModel; num: number }) {
  const r = m.result;
  return (
    <section>
      <h2>
        <span class="num">{num}</span>Results
      </h2>
      <div class="keep">
        <h3>
          {num}.1 Verdict: {VERDICT_WORDS[r.verdict].meaning}
        </h3>
        <VerdictTable r={r} units={m.units} />
      </div>
      <PrincipalResults m={m} num={`${num}.2`} />
      {r.fatigue.criteria.length > 0 ? <CriteriaTable m={m} num={`${num}.3`} /> : <NoCriteria m={m} num={`${num}.3`} />}
      <Warnings warnings={r.warningParts} units={m.units} num={`${num}.4`} />
    </section>
  );
}

/** The row the verdict names as governing, as the engine names it. */
function governs(r: CheckResult, row: VerdictRow): boolean {
  return r.governing.rowId === row.id;
}

export function VerdictTable({ r, units }: { r: CheckResult; units: Units }) {
  return (
    <table class="verdict">
      <colgroup>
        <col style="width:27%" />
        <col style="width:47%" />
        <col style="width:12%" />
        <col style="width:14%" />
      </colgroup>
      <thead>
        <tr>
          <th>{VERDICT_COLUMNS.check}</th>
          <th>{VERDICT_COLUMNS.demand}</th>
          <th class="n">{VERDICT_COLUMNS.reserve}</th>
          <th>{VERDICT_COLUMNS.outcome}</th>
        </tr>
      </thead>
      <tbody>
        {r.verdictTable.map((row) => {
          const gov = governs(r, row);
          return (
            <tr class={gov ? "governs" : ""}>
              <td>
                {typeset(row.title)}
                {gov ? <span class="flag">GOVERNS</span> : null}
              </td>
              <td>{typeset(phraseText(row.detailParts, units))}</td>
              <td class="n">{margin(row.margin)}</td>
              <td class={`status-${row.status}`}>{STATUS_WORDS[row.status]}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

function PrincipalResults({ m, num }: { m: SheetModel; num: string }) {
  const r = m.result;
  const u = m.units;
  const f = r.fatigue;
  const unit = f.lifeCountedIn;
  const rows: [string, string, string][] = [];
  const q = (label: string, x: number | null | undefined, kind: "stress" | "pressure" | "length") => {
    const d = dual(x, kind, u);
    rows.push([label, d.shown, d.si]);
  };
  const t = (label: string, text: string) => rows.push([label, text, ""]);
  q("Highest pressure differential p_max", r.load.pressureMax_MPa, "pressure");
  q("Lowest pressure differential p_min", r.load.pressureMin_MPa, "pressure");
  q("Hoop membrane stress at p_max", r.membrane.hoopMax_MPa, "stress");
  q("Axial membrane stress at p_max", r.membrane.axialMax_MPa, "stress");
  q("Von Mises stress at p_max", r.membrane.vonMisesMax_MPa, "stress");
  t("Kt, Kf", `${sig(r.notch.kt, 4)}, ${sig(r.notch.kf, 4)}`);
  q("Local stress at the notch, highest", r.notch.peakMax_MPa, "stress");
  q("Local stress amplitude σ_a", f.amplitude_MPa, "stress");
  q("Local mean stress σ_m", f.mean_MPa, "stress");
  if (f.curve === "basquin" && unit === "cycles") q("Equivalent fully reversed amplitude σ_ar", f.equivalentAmplitude_MPa, "stress");
  t(`Fatigue life (${unit})`, life(f.life_cycles, unit));
  t(`Allowable life, ÷ ${sig(f.scatterFactor, 3)}`, life(f.allowableLife_cycles, unit));
  t(`Design life (${unit})`, life(f.designLife_cycles, unit));
  t("Damage, design ÷ allowable", sig(f.damage, 3));
  if (r.spectrum) {
    t("Cycles per pass", sig(r.spectrum.totalCycles, 6));
    t("Damage per pass", sig(r.spectrum.damagePerPass, 4));
  }
  if (r.crack) {
    q("Initial crack", r.crack.initial_mm, "length");
    if (r.crack.detectable_mm !== null) q("Detectable crack", r.crack.detectable_mm, "length");
    q(`Critical crack (${r.crack.governingOrientation}, set by ${r.crack.criticalBy})`, r.crack.critical_mm, "length");
    t("Cycles to grow to critical", life(r.crack.cycles));
    t("Inspection threshold", life(r.crack.threshold_cycles));
    t(
      "Repeat inspection interval",
      r.crack.repeatInterval_cycles === null ? "— (no detectable size)" : life(r.crack.repeatInterval_cycles),
    );
  }
  if (r.fleet) {
    t(`Fleet of ${r.fleet.size}: expected first failure`, life(r.fleet.firstFailure_cycles));
    t("Fleet: 5th-percentile life", life(r.fleet.percentile5_cycles));
    t("Fleet: probability one fails before the design life", sig(r.fleet.probabilityAnyFailsBeforeDesignLife, 2));
  }
  if (r.evidence) t("Lower tolerance bound of the test lives", life(r.evidence.lowerBound_cycles));
  if (r.solution?.thickness_mm !== undefined) q("Least wall thickness that passes", r.solution.thickness_mm, "length");
  if (r.solution?.pressureMax_MPa !== undefined) q("Highest pressure that passes", r.solution.pressureMax_MPa, "pressure");
  // Not kept whole: the table is long and may run over a page; its header repeats there.
  return (
    <div>
      <h3>{num} Principal results</h3>
      <table class="principal">
        <colgroup>
          <col style="width:50%" />
          <col style="width:27%" />
          <col style="width:23%" />
        </colgroup>
        <thead>
          <tr>
            <th>Quantity</th>
            <th class="n">Value</th>
            <th class="n">In SI</th>
          </tr>
        </thead>
        <tbody>
          {rows.map(([label, shown, si]) => (
            <tr>
              <td>{typeset(label)}</td>
              <td class="n">{shown}</td>
              <td class="n si">{si}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {r.solution ? <p class="note">Solution: {typeset(r.solution.governs)}.</p> : null}
    </div>
  );
}

/** All seven mean-stress criteria on the same cycle, so a reader sees how far the verdict leans on the choice. */
function CriteriaTable({ m, num }: { m: SheetModel; num: string }) {
  const f = m.result.fatigue;
  const unit = f.lifeCountedIn;
  return (
    <div class="keep">
      <h3>{num} The mean-stress criteria compared</h3>
      <p class="note">
        The same local cycle (σ<sub>a</sub> = {dualText(f.amplitude_MPa, "stress", m.units)}, σ<sub>m</sub> ={" "}
        {dualText(f.mean_MPa, "stress", m.units)}) under each criterion; the one this check uses is marked.
      </p>
      <table class="criteria">
        <thead>
          <tr>
            <th>Criterion</th>
            <th class="n">
              σ<sub>ar</sub>
            </th>
            <th class="n">Life ({unit})</th>
            <th class="n">Allowable (÷ {sig(f.scatterFactor, 3)})</th>
            <th class="n">Damage</th>
            <th>Remark</th>
          </tr>
        </thead>
        <tbody>
          {f.criteria.map((c) => (
            <tr class={c.chosen ? "chosen" : ""}>
              <td>
                {CRITERION_NAMES[c.criterion]}
                {c.chosen ? <span class="flag">USED</span> : null}
              </td>
              <td class="n">{dual(c.equivalentAmplitude_MPa, "stress", m.units).shown}</td>
              <td class="n">{life(c.life_cycles, "")}</td>
              <td class="n">{life(c.allowableLife_cycles, "")}</td>
              <td class="n">{sig(c.damage, 3)}</td>
              <td class="note">{CRITERION_STATUS_WORDS[c.status]}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function NoCriteria({ m, num }: { m: SheetModel; num: string }) {
  return (
    <div class="keep">
      <h3>{num} The mean-stress criteria compared</h3>
      <p>
        {m.result.fatigue.curve === "welded"
          ? "Not compared: a welded detail category takes the stress range without a mean-stress correction (EN 1993-1-9), so the criteria do not apply."
          : "Not compared for this load: the damage of a spectrum is summed under the chosen criterion (see the calculation)."}
      </p>
    </div>
  );
}

/** Every warning, written from its parts in the sheet's units. */
function Warnings({ warnings, units, num }: { warnings: CheckResult["warningParts"]; units: Units; num: string }) {
  return (
    <div class="keep">
      <h3>{num} Warnings</h3>
      {warnings.length === 0 ? (
        <p>None: every method was used inside its range.</p>
      ) : (
        <ul class="warnings">
          {warnings.map((parts) => (
            <li>{typeset(capitalise(phraseText(parts, units)))}</li>
          ))}
        </ul>
      )}
    </div>
  );
}
