import type { CheckResult, Verdict, VerdictRow } from "./result.ts";
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
    rows.push({
      id: "minimum-gauge",
      title: "Minimum gauge",
      status: t >= floor ? "pass" : "fail",
      detail: `wall ${fmt(t)} mm against the minimum gauge ${fmt(s.minimumGauge_mm)} mm plus ${fmt(s.corrosionAllowance_mm)} mm corrosion allowance`,
      margin: t / floor - 1,
    });
  }
  const f = r.fatigue;
  const unit = f.lifeCountedIn;
  // An unlimited life has no life reserve: its reserve is the corrected endurance limit over the equivalent amplitude.
  const se = f.curveUsed.enduranceLimit_MPa;
  const unlimitedReserve =
    se !== null && f.equivalentAmplitude_MPa !== null && f.equivalentAmplitude_MPa > 0
      ? (f.modifyingFactor * se) / f.equivalentAmplitude_MPa - 1
      : null;
  rows.push({
    id: "fatigue",
    title: `Fatigue life (${curveWords(f)}, scatter factor ${fmt(f.scatterFactor)})`,
    status: f.pass ? "pass" : "fail",
    detail:
      f.life_cycles === null
        ? `unlimited life against a design life of ${fmt(f.designLife_cycles)} ${unit}${unlimitedReserve === null ? "" : `: the equivalent amplitude ${fmt(f.equivalentAmplitude_MPa ?? 0)} MPa is below the corrected endurance limit ${fmt(f.modifyingFactor * (f.curveUsed.enduranceLimit_MPa ?? 0))} MPa, and the reserve is on stress`}`
        : f.life_cycles === 0
          ? "no life: the mean stress is beyond the criterion's range"
          : `allowable ${fmt(f.allowableLife_cycles ?? 0)} ${unit} against a design life of ${fmt(f.designLife_cycles)} ${unit} (damage ${fmt(f.damage ?? Infinity, 3)})`,
    margin: f.life_cycles === null ? unlimitedReserve : f.damage !== null && f.damage > 0 ? 1 / f.damage - 1 : -1,
  });
  if (r.crack) rows.push(...crackRows(r));
  if (r.evidence) {
    const ev = r.evidence;
    rows.push({
      id: "evidence",
      title: "Test evidence (one-sided lower tolerance bound)",
      status: ev.supportsDesignLife === null ? "info" : ev.supportsDesignLife ? "pass" : "fail",
      detail:
        ev.lowerBound_cycles === null
          ? `no bound: ${ev.n} test life without an assumed scatter cannot bound a fleet's life`
          : `lower bound ${fmt(ev.lowerBound_cycles)} cycles against a design life of ${fmt(ev.designLife_cycles)} cycles${f.lifeCountedIn === "passes" ? ` (${fmt(f.designLife_cycles)} passes)` : ""}`,
      margin: ev.lowerBound_cycles === null ? null : ev.lowerBound_cycles / ev.designLife_cycles - 1,
    });
  }
  if (r.fleet) {
    const fl = r.fleet;
    rows.push({
      id: "fleet",
      title: `Fleet of ${fmt(fl.size)} (${fl.basis === "test evidence" ? "from the test evidence" : "from the computed life, assumed scatter"})`,
      status: "info",
      detail: `the weakest of ${fmt(fl.size)} is expected to fail at about ${fmt(fl.firstFailure_cycles)} cycles; the chance that one fails before the design life of ${fmt(f.designLife_cycles)} cycles is ${fmt(fl.probabilityAnyFailsBeforeDesignLife, 2)}; 95 % of items exceed ${fmt(fl.percentile5_cycles)} cycles`,
      margin: null,
    });
  }
  const n = r.notch;
  if (n.refer?.length || n.opening?.curvature) {
    const c = n.opening?.curvature;
    rows.push({
      id: "opening",
      title: "Opening within the membrane screening's range (curvature, reinforcement)",
      status: n.refer?.length ? "refer" : "pass",
      detail: n.refer?.length
        ? n.refer.join("; ")
        : `curvature parameter β = ${fmt(c?.beta ?? 0, 3)} within the small-curvature range (β ≤ ${fmt(c?.limit ?? 0)})`,
      // The reserve on the curvature range, limit ÷ β − 1 (negative when β is beyond it).
      margin: c && c.beta > 0 ? c.limit / c.beta - 1 : null,
    });
  }
  if (r.load.pressureMin_MPa < 0) {
    rows.push({
      id: "external-pressure",
      title: "External pressure (buckling)",
      status: "refer",
      detail: `the differential pressure falls to ${fmt(r.load.pressureMin_MPa)} MPa (outside above inside): the shell ${EXTERNAL_PRESSURE_WORDS}, which this tool does not make`,
      margin: null,
    });
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
  return { rows, verdict, governs: text, governing: { rowId: gov.id, text } };
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
  const critical = `critical ${fmt(c.critical_mm)} mm, set by ${c.criticalBy}`;
  let status: VerdictRow["status"];
  let detail: string;
  let margin: number | null = null;
  if (c.cycles === null || threshold === null) {
    status = "pass";
    detail = `the pressure does not cycle, so the crack does not grow (${critical})`;
  } else if (threshold >= life) {
    status = "pass";
    detail = `the threshold of ${fmt(threshold)} ${unit} covers the design life of ${fmt(life)} ${unit}: no inspection needed within it (${critical})`;
    margin = threshold / life - 1;
  } else if (leakDecides && lbb.leakBeforeBreak) {
    status = "pass";
    detail = `the threshold of ${fmt(threshold)} ${unit} is short of the design life, but the shell leaks before it breaks, which decides as asked (${critical})`;
  } else if (repeat === null) {
    status = "fail";
    detail = `the threshold of ${fmt(threshold)} ${unit} is short of the design life of ${fmt(life)} ${unit}, and without a detectable crack size no repeat inspection interval can be set (${critical})`;
    margin = threshold / life - 1;
  } else if (repeat <= 0) {
    status = "fail";
    detail = `the threshold of ${fmt(threshold)} ${unit} is short of the design life, and the detectable size ${fmt(c.detectable_mm ?? 0)} mm is already critical: no inspection can find the crack in time (${critical})`;
    margin = threshold / life - 1;
  } else if (minimum !== null && repeatCycles !== null && repeatCycles < minimum) {
    status = "fail";
    detail = `the threshold of ${fmt(threshold)} ${unit} is short of the design life, and the repeat interval of ${fmt(repeatCycles)} cycles is shorter than the practical minimum of ${fmt(minimum)} cycles (${critical})`;
    margin = repeatCycles / minimum - 1;
  } else {
    status = "pass";
    detail = `inspect from ${fmt(threshold)} ${unit} and then every ${fmt(repeat)} ${unit} (detectable ${fmt(c.detectable_mm ?? 0)} mm, ${critical})`;
    margin = minimum !== null && repeatCycles !== null ? repeatCycles / minimum - 1 : null;
  }
  rows.push({ id: "crack", title: `Damage tolerance: crack growth and inspections${which}`, status, detail, margin });
  if (lbb) {
    const words = lbb.leakBeforeBreak
      ? `yes: a through-wall crack of half-length ${fmt(lbb.throughWallHalfLength_mm)} mm is below the critical half-length ${fmt(lbb.criticalHalfLength_mm)} mm, so the shell should leak before it breaks`
      : `no: a through-wall crack of half-length ${fmt(lbb.throughWallHalfLength_mm)} mm exceeds the critical half-length ${fmt(lbb.criticalHalfLength_mm)} mm, so the shell may break without warning`;
    rows.push({
      id: "leak-before-break",
      title: `Leak before break (through-wall crack of length 2t)${c.leakBeforeBreakDecides ? ", asked to decide" : ""}`,
      status: c.leakBeforeBreakDecides ? (lbb.leakBeforeBreak ? "pass" : "fail") : "info",
      detail: words,
      margin: lbb.criticalHalfLength_mm / lbb.throughWallHalfLength_mm - 1,
    });
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
  let detail: string;
  if (s.basis === "en13445-3" || s.basis === "asme-viii-1") {
    const sym = s.basis === "en13445-3" ? "f" : "S";
    detail = `analysis wall ${fmt(s.analysisThickness_mm)} mm against ${fmt(s.formulaThickness_mm ?? Infinity)} mm from the formula (${s.governs}, ${sym} = ${fmt(s.allowable_MPa)} MPa, ${s.basis === "en13445-3" ? "z" : "E"} = ${fmt(s.jointEfficiency)}); ordered wall needed ${fmt(s.requiredThickness_mm ?? Infinity)} mm`;
  } else if (s.basis === "aircraft") {
    detail = `${s.governs}: factors ${fmt(s.limitFactor ?? 0)} (limit) and ${fmt(s.ultimateFactor ?? 0)} (ultimate) on the differential`;
  } else {
    detail = `σvm = ${fmt(s.vonMisesMax_MPa)} MPa against Sy/${fmt(s.yieldFactor)} = ${fmt(s.allowable_MPa)} MPa`;
  }
  if (s.refer) detail = `${s.refer}; ${detail}`;
  return { id: "static", title, status, detail, margin: s.margin };
}

function curveWords(f: CheckResult["fatigue"]): string {
  if (f.curve === "welded") return "welded detail category, EN 1993-1-9";
  if (f.curve === "en13445-welded") return `EN 13445-3 welded class ${fmt(f.detailCategory_MPa ?? 0)}`;
  if (f.curve === "en13445-unwelded") return "EN 13445-3 unwelded curve";
  return f.criteria.find((c) => c.chosen)?.label ?? f.criterion;
}
