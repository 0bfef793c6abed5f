import type { CheckResult, Verdict, VerdictRow } from "./result.ts";
import { joined, MPa, mm, n, type Phrase, pressure, say } from "./phrase.ts";
import { fmt } from "./step.ts";

/**
 * The verdict table: one row per check made, with what was demanded against what is allowed.
 * The verdict fails if any row fails, else it refers if any row refers (outside what this screening
 * can judge), else it passes; "info" rows (inspection intervals, leak-before-break) inform without
 * deciding. What governs is the first failing row, else the first referring row, else the row with
 * the least reserve.
 */
/** The verdict in plain words, for every face (page, sheet, CLI, API). */
export const VERDICT_WORDS: Record<Verdict, { short: string; badge: string; outcome: string; meaning: string }> = {
  pass: { short: "passes", badge: "Passes", outcome: "PASSES", meaning: "passes this screening check" },
  fail: { short: "fails", badge: "Fails", outcome: "DOES NOT PASS", meaning: "does not pass this screening check" },
  refer: {
    short: "refer",
    badge: "Refer",
    outcome: "REFER: NEEDS AN ANALYSIS BEYOND THIS SCREENING",
    meaning: "refer: outside what this screening can judge; an analysis beyond it is needed before the item is accepted",
  },
};

export const EXTERNAL_PRESSURE_WORDS = "needs a buckling check to the governing code";

/** A row from its phrase: the SI sentence and the same as words and amounts. */
function row(id: VerdictRow["id"], title: string, status: VerdictRow["status"], p: Phrase, margin: number | null): VerdictRow {
  return { id, title, status, detail: p.text, detailParts: p.parts, margin };
}

export function verdictTable(r: CheckResult): {
  rows: VerdictRow[];
  verdict: Verdict;
  governs: string;
  governing: CheckResult["governing"];
} {
  const rows: VerdictRow[] = [];
  const s = r.static;
  rows.push(staticRow(r));
  if (s.minimumGauge_mm > 0) {
    const floor = s.minimumGauge_mm + s.corrosionAllowance_mm;
    const t = s.analysisThickness_mm + s.corrosionAllowance_mm + s.thicknessTolerance_mm;
    rows.push(
      row(
        "minimum-gauge",
        "Minimum gauge",
        t >= floor ? "pass" : "fail",
        say`wall ${mm(t)} against the minimum gauge ${mm(s.minimumGauge_mm)} plus ${mm(s.corrosionAllowance_mm)} corrosion allowance`,
        t / floor - 1,
      ),
    );
  }
  const f = r.fatigue;
  const unit = f.lifeCountedIn;
  // An unlimited life has no life reserve: its reserve is the corrected endurance limit over the equivalent amplitude.
  const se = f.curveUsed.enduranceLimit_MPa;
  const unlimitedReserve =
    se !== null && f.equivalentAmplitude_MPa !== null && f.equivalentAmplitude_MPa > 0
      ? (f.modifyingFactor * se) / f.equivalentAmplitude_MPa - 1
      : null;
  const onStress =
    unlimitedReserve === null
      ? say``
      : say`: the equivalent amplitude ${MPa(f.equivalentAmplitude_MPa ?? 0)} is below the corrected endurance limit ${MPa(f.modifyingFactor * (se ?? 0))}, and the reserve is on stress`;
  rows.push(
    row(
      "fatigue",
      `Fatigue life (${curveWords(f)}, scatter factor ${fmt(f.scatterFactor)})`,
      f.pass ? "pass" : "fail",
      f.life_cycles === null
        ? joined([say`unlimited life against a design life of ${n(f.designLife_cycles)} ${unit}`, onStress], "")
        : f.life_cycles === 0
          ? say`no life: the mean stress is beyond the criterion's range`
          : say`allowable ${n(f.allowableLife_cycles ?? 0)} ${unit} against a design life of ${n(f.designLife_cycles)} ${unit} (damage ${n(f.damage ?? Number.POSITIVE_INFINITY, 3)})`,
      f.life_cycles === null ? unlimitedReserve : f.damage !== null && f.damage > 0 ? 1 / f.damage - 1 : -1,
    ),
  );
  if (r.crack) rows.push(...crackRows(r));
  if (r.evidence) {
    const ev = r.evidence;
    rows.push(
      row(
        "evidence",
        "Test evidence (one-sided lower tolerance bound)",
        ev.supportsDesignLife === null ? "info" : ev.supportsDesignLife ? "pass" : "fail",
        ev.lowerBound_cycles === null
          ? say`no bound: ${n(ev.n)} test life without an assumed scatter cannot bound a fleet's life`
          : joined(
              [
                say`lower bound ${n(ev.lowerBound_cycles)} cycles against a design life of ${n(ev.designLife_cycles)} cycles`,
                f.lifeCountedIn === "passes" ? say` (${n(f.designLife_cycles)} passes)` : say``,
              ],
              "",
            ),
        ev.lowerBound_cycles === null ? null : ev.lowerBound_cycles / ev.designLife_cycles - 1,
      ),
    );
  }
  if (r.fleet) {
    const fl = r.fleet;
    rows.push(
      row(
        "fleet",
        `Fleet of ${fmt(fl.size)} (${fl.basis === "test evidence" ? "from the test evidence" : "from the computed life, assumed scatter"})`,
        "info",
        say`the weakest of ${n(fl.size)} is expected to fail at about ${n(fl.firstFailure_cycles)} cycles; the chance that one fails before the design life of ${n(f.designLife_cycles)} cycles is ${n(fl.probabilityAnyFailsBeforeDesignLife, 2)}; 95 % of items exceed ${n(fl.percentile5_cycles)} cycles`,
        null,
      ),
    );
  }
  const notch = r.notch;
  if (notch.refer?.length || notch.opening?.curvature) {
    const c = notch.opening?.curvature;
    rows.push(
      row(
        "opening",
        "Opening within the membrane screening's range (curvature, reinforcement)",
        notch.refer?.length ? "refer" : "pass",
        notch.refer?.length
          ? say`${notch.refer.join("; ")}`
          : say`curvature parameter β = ${n(c?.beta ?? 0, 3)} within the small-curvature range (β ≤ ${n(c?.limit ?? 0)})`,
        // The reserve on the curvature range, limit ÷ β − 1 (negative when β is beyond it).
        c && c.beta > 0 ? c.limit / c.beta - 1 : null,
      ),
    );
  }
  if (r.load.pressureMin_MPa < 0) {
    rows.push(
      row(
        "external-pressure",
        "External pressure (buckling)",
        "refer",
        say`the differential pressure falls to ${pressure(r.load.pressureMin_MPa)} (outside above inside): the shell ${EXTERNAL_PRESSURE_WORDS}, which this tool does not make`,
        null,
      ),
    );
  }
  return decide(rows);
}

/** fail > refer > pass over the rows; what governs is the first failing, else referring, else least-reserve row. */
export function decide(rows: VerdictRow[]): { rows: VerdictRow[]; verdict: Verdict; governs: string; governing: CheckResult["governing"] } {
  const failing = rows.filter((x) => x.status === "fail");
  const referring = rows.filter((x) => x.status === "refer");
  const deciding = rows.filter((x) => (x.status === "pass" || x.status === "fail") && x.margin !== null);
  const least = deciding.reduce<VerdictRow | undefined>(
    (a, b) => (a === undefined || (b.margin as number) < (a.margin as number) ? b : a),
    undefined,
  );
  const gov = failing[0] ?? referring[0] ?? least ?? rows[0];
  const verdict: Verdict = failing.length ? "fail" : referring.length ? "refer" : "pass";
  const text = `${gov.title}: ${gov.detail}`;
  return { rows, verdict, governs: text, governing: { rowId: gov.id, text, parts: [`${gov.title}: `, ...gov.detailParts] } };
}

/**
 * The crack rows. The crack check passes when the threshold covers the design life, or when an
 * inspection programme is possible: a repeat interval from the detectable size, no shorter than the
 * user's minimum. It fails when the threshold falls short and no such interval exists. Leak before
 * break decides when asked: a shell that leaks first passes without inspections.
 */
function crackRows(r: CheckResult): VerdictRow[] {
  const c = r.crack!;
  const f = r.fatigue;
  const rows: VerdictRow[] = [];
  const inPasses = c.threshold_passes !== undefined;
  const unit = inPasses ? "passes" : "cycles";
  const threshold = inPasses ? (c.threshold_passes ?? null) : c.threshold_cycles;
  const repeat = inPasses ? (c.repeatInterval_passes ?? null) : c.repeatInterval_cycles;
  const minimum = c.minimumInterval_cycles;
  const repeatCycles = c.repeatInterval_cycles;
  const life = f.designLife_cycles;
  const lbb = c.leakBeforeBreak;
  const leakDecides = c.leakBeforeBreakDecides && lbb !== null;
  const which = c.orientation === "both" ? ` (${c.governingOrientation} crack governs)` : "";
  const critical = say`critical ${mm(c.critical_mm)}, set by ${c.criticalBy}`;
  const th = n(threshold ?? 0);
  let status: VerdictRow["status"];
  let detail: Phrase;
  let margin: number | null = null;
  if (c.cycles === null || threshold === null) {
    status = "pass";
    detail = joined([say`the pressure does not cycle, so the crack does not grow (`, critical, say`)`], "");
  } else if (threshold >= life) {
    status = "pass";
    detail = joined(
      [
        say`the threshold of ${th} ${unit} covers the design life of ${n(life)} ${unit}: no inspection needed within it (`,
        critical,
        say`)`,
      ],
      "",
    );
    margin = threshold / life - 1;
  } else if (leakDecides && lbb.leakBeforeBreak) {
    status = "pass";
    detail = joined(
      [
        say`the threshold of ${th} ${unit} is short of the design life, but the shell leaks before it breaks, which decides as asked (`,
        critical,
        say`)`,
      ],
      "",
    );
  } else if (repeat === null) {
    status = "fail";
    detail = joined(
      [
        say`the threshold of ${th} ${unit} is short of the design life of ${n(life)} ${unit}, and without a detectable crack size no repeat inspection interval can be set (`,
        critical,
        say`)`,
      ],
      "",
    );
    margin = threshold / life - 1;
  } else if (repeat <= 0) {
    status = "fail";
    detail = joined(
      [
        say`the threshold of ${th} ${unit} is short of the design life, and the detectable size ${mm(c.detectable_mm ?? 0)} is already critical: no inspection can find the crack in time (`,
        critical,
        say`)`,
      ],
      "",
    );
    margin = threshold / life - 1;
  } else if (minimum !== null && repeatCycles !== null && repeatCycles < minimum) {
    status = "fail";
    detail = joined(
      [
        say`the threshold of ${th} ${unit} is short of the design life, and the repeat interval of ${n(repeatCycles)} cycles is shorter than the practical minimum of ${n(minimum)} cycles (`,
        critical,
        say`)`,
      ],
      "",
    );
    margin = repeatCycles / minimum - 1;
  } else {
    status = "pass";
    // Without a practical minimum interval the programme's reserve is on crack size: how far the
    // detectable size stands below the critical one (nil when it reaches it, where the row fails above).
    const onSize = minimum === null || repeatCycles === null;
    detail = joined(
      [
        say`inspect from ${th} ${unit} and then every ${n(repeat)} ${unit} (detectable ${mm(c.detectable_mm ?? 0)}, `,
        critical,
        onSize ? say`; no practical minimum interval given, so the reserve is on crack size)` : say`)`,
      ],
      "",
    );
    margin = onSize ? c.critical_mm / (c.detectable_mm ?? c.critical_mm) - 1 : repeatCycles / minimum - 1;
  }
  rows.push(row("crack", `Damage tolerance: crack growth and inspections${which}`, status, detail, margin));
  if (lbb) {
    const words = lbb.leakBeforeBreak
      ? say`yes: a through-wall crack of half-length ${mm(lbb.throughWallHalfLength_mm)} is below the critical half-length ${mm(lbb.criticalHalfLength_mm)}, so the shell should leak before it breaks`
      : say`no: a through-wall crack of half-length ${mm(lbb.throughWallHalfLength_mm)} exceeds the critical half-length ${mm(lbb.criticalHalfLength_mm)}, so the shell may break without warning`;
    rows.push(
      row(
        "leak-before-break",
        `Leak before break (through-wall crack of length 2t)${c.leakBeforeBreakDecides ? ", asked to decide" : ""}`,
        c.leakBeforeBreakDecides ? (lbb.leakBeforeBreak ? "pass" : "fail") : "info",
        words,
        lbb.criticalHalfLength_mm / lbb.throughWallHalfLength_mm - 1,
      ),
    );
  }
  return rows;
}

const BASIS_TITLE: Record<CheckResult["static"]["basis"], string> = {
  "en13445-3": "Static strength (EN 13445-3 design by formula)",
  "asme-viii-1": "Static strength (ASME VIII-1 UG-27 shell formula)",
  aircraft: "Static strength (limit pressure against yield, ultimate against ultimate strength)",
  yield: "Static strength (von Mises against yield / factor)",
};

function staticRow(r: CheckResult): VerdictRow {
  const s = r.static;
  const title = BASIS_TITLE[s.basis];
  const status = s.refer ? "refer" : s.margin >= 0 ? "pass" : "fail";
  let detail: Phrase;
  if (s.basis === "en13445-3" || s.basis === "asme-viii-1") {
    const sym = s.basis === "en13445-3" ? "f" : "S";
    detail = say`analysis wall ${mm(s.analysisThickness_mm)} against ${mm(s.formulaThickness_mm ?? Number.POSITIVE_INFINITY)} from the formula (${s.governs}, ${sym} = ${MPa(s.allowable_MPa)}, ${s.basis === "en13445-3" ? "z" : "E"} = ${n(s.jointEfficiency)}); ordered wall needed ${mm(s.requiredThickness_mm ?? Number.POSITIVE_INFINITY)}`;
  } else if (s.basis === "aircraft") {
    detail = say`${s.governs}: factors ${n(s.limitFactor ?? 0)} (limit) and ${n(s.ultimateFactor ?? 0)} (ultimate) on the differential`;
  } else {
    detail = say`σvm = ${MPa(s.vonMisesMax_MPa)} against Sy/${n(s.yieldFactor)} = ${MPa(s.allowable_MPa)}`;
  }
  if (s.refer) detail = joined([{ text: s.refer, parts: s.referParts ?? [s.refer] }, detail], "; ");
  return row("static", title, status, detail, s.margin);
}

function curveWords(f: CheckResult["fatigue"]): string {
  if (f.curve === "welded") return "welded detail category, EN 1993-1-9";
  if (f.curve === "en13445-welded") return `EN 13445-3 welded class ${fmt(f.detailCategory_MPa ?? 0)}`;
  if (f.curve === "en13445-unwelded") return "EN 13445-3 unwelded curve";
  return f.criteria.find((c) => c.chosen)?.label ?? f.criterion;
}
