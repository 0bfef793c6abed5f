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
  rows.push({
    id: "static",
    title: "Static strength (von Mises against yield / factor)",
    status: s.pass ? "pass" : "fail",
    detail: `σvm = ${fmt(s.vonMisesMax_MPa)} MPa against Sy/${fmt(s.yieldFactor)} = ${fmt(s.allowable_MPa)} MPa`,
    margin: s.margin,
  });
  const f = r.fatigue;
  const unit = f.lifeCountedIn;
  rows.push({
    id: "fatigue",
    title: `Fatigue life (${f.curve === "welded" ? "welded detail category" : (f.criteria.find((c) => c.chosen)?.label ?? f.criterion)}, scatter factor ${fmt(f.scatterFactor)})`,
    status: f.pass ? "pass" : "fail",
    detail:
      f.life_cycles === null
        ? `unlimited life against a design life of ${fmt(f.designLife_cycles)} ${unit}`
        : f.life_cycles === 0
          ? "no life: the mean stress is beyond the criterion's range"
          : `allowable ${fmt(f.allowableLife_cycles ?? 0)} ${unit} against a design life of ${fmt(f.designLife_cycles)} ${unit} (damage ${fmt(f.damage ?? Infinity, 3)})`,
    margin: f.life_cycles === null ? null : f.damage !== null && f.damage > 0 ? 1 / f.damage - 1 : -1,
  });
  if (r.crack) {
    const c = r.crack;
    // With a spectrum the design life counts passes, so the interval is compared in passes.
    const interval = c.inspectionInterval_passes !== undefined ? c.inspectionInterval_passes : c.inspectionInterval_cycles;
    const within =
      c.inspectionInterval_passes !== undefined
        ? `${fmt(c.inspectionInterval_passes ?? 0)} passes`
        : `${fmt(c.inspectionInterval_cycles ?? 0)} cycles`;
    const covers = interval === null || interval >= f.designLife_cycles;
    rows.push({
      id: "crack",
      title: "Crack growth (Paris law)",
      status: covers ? "pass" : "info",
      detail:
        c.cycles === null
          ? "the pressure does not cycle, so the crack does not grow"
          : covers
            ? `the crack needs ${fmt(c.cycles)} cycles to reach ${fmt(c.critical_mm)} mm: the interval of ${within} covers the design life`
            : `the crack reaches its critical size of ${fmt(c.critical_mm)} mm (${c.criticalBy}) in ${fmt(c.cycles)} cycles: inspect at least every ${within}`,
      margin: null,
    });
    if (c.leakBeforeBreak) {
      const l = c.leakBeforeBreak;
      rows.push({
        id: "leak-before-break",
        title: "Leak before break (through-wall crack of length 2t)",
        status: "info",
        detail: l.leakBeforeBreak
          ? `yes: a through-wall crack of half-length ${fmt(l.throughWallHalfLength_mm)} mm is below the critical half-length ${fmt(l.criticalHalfLength_mm)} mm, so the shell should leak before it breaks`
          : `no: a through-wall crack of half-length ${fmt(l.throughWallHalfLength_mm)} mm exceeds the critical half-length ${fmt(l.criticalHalfLength_mm)} mm, so the shell may break without warning`,
        margin: l.criticalHalfLength_mm / l.throughWallHalfLength_mm - 1,
      });
    }
  }
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
      margin: null,
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
