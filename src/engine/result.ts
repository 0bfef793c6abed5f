import type { FatigueCurve, MeanStressCriterion, Service, StaticBasis, WeldDetail } from "../schema/check.ts";
import type { EvidenceResult } from "./evidence.ts";
import type { FleetResult } from "./fleet.ts";
import type { Section } from "./sections.ts";
import type { OpeningPictureResult } from "./openings/concentration.ts";
import type { Step } from "./step.ts";

/** The result document, format "hoopwise.result/1". Keys listed in the check format never change meaning. */
export interface CriterionRow {
  criterion: MeanStressCriterion;
  label: string;
  equivalentAmplitude_MPa: number | null;
  life_cycles: number | null;
  allowableLife_cycles: number | null;
  /** null where there is no life. */
  damage: number | null;
  /** "ok" | "no-answer" (mean beyond the criterion's strength) | "no-damage" (never in tension) | "unlimited" */
  status: "ok" | "no-answer" | "no-damage" | "unlimited";
  chosen: boolean;
}

/**
 * The verdict: "refer" when the item is outside what this screening can judge (external pressure, a
 * method used outside its range in a way that could be unconservative) and needs an analysis beyond it.
 */
export type Verdict = "pass" | "fail" | "refer";

export interface VerdictRow {
  id:
    | "static"
    | "minimum-gauge"
    | "fatigue"
    | "crack"
    | "evidence"
    | "leak-before-break"
    | "external-pressure"
    | "opening"
    | "fleet"
    | (string & {});
  title: string;
  /** "refer": this row cannot be judged here and needs an analysis beyond this screening. */
  status: "pass" | "fail" | "info" | "refer";
  /** Plain-words statement of the demand against the capacity. */
  detail: string;
  /** Reserve: capacity / demand − 1 where it means something. */
  margin: number | null;
}

export interface SpectrumCycle {
  range_MPa: number;
  mean_MPa: number;
  count: number;
}

export interface CheckResult {
  format: "hoopwise.result/1";
  engine: string;
  fingerprint: string;
  title?: string;
  verdict: Verdict;
  /** The verdict in plain words. */
  verdictMeaning: string;
  /** What governs, in words: the governing row's title and detail. */
  governs: string;
  /** The same as a structure, so no face has to find the row by matching the sentence. */
  governing: { rowId: VerdictRow["id"]; text: string };
  /** What the check was worked at, for the faces' plots and the picture of the shell: nothing a face must look up again. */
  workedAt: {
    form: "cylinder" | "sphere";
    thickness_mm: number;
    ultimate_MPa: number;
    yield_MPa: number;
    walkerGamma: number;
    /** The opening's outline round its centre, [hoop_mm, axial_mm], to scale; null with no opening or only a given Kt. */
    outline: [number, number][] | null;
    /** Fastener holes, in the order given. */
    fasteners: { hoop_mm: number; axial_mm: number; radius_mm: number }[];
  };
  load: { pressureMax_MPa: number; pressureMin_MPa: number; source: "direct" | "altitude" | "history" | "blocks" };
  membrane: {
    theory: "thin" | "thick";
    theoryReason: string;
    innerRadius_mm: number;
    meanRadius_mm: number;
    outerRadius_mm: number;
    hoopMax_MPa: number;
    hoopMin_MPa: number;
    axialMax_MPa: number;
    axialMin_MPa: number;
    radialMax_MPa: number;
    vonMisesMax_MPa: number;
  };
  static: {
    basis: StaticBasis;
    service: Service;
    yieldFactor: number;
    /** f (EN 13445-3), S (ASME VIII-1), Sy (aircraft, at limit) or Sy/n (yield). */
    allowable_MPa: number;
    vonMisesMax_MPa: number;
    /** Capacity over demand less 1: the wall over the formula's wall for the code bases, stresses otherwise. */
    margin: number;
    pass: boolean;
    /** Why the static basis cannot judge the shell (refer), or null. */
    refer: string | null;
    /** Which check of the basis governs, in words. */
    governs: string;
    jointEfficiency: number;
    corrosionAllowance_mm: number;
    thicknessTolerance_mm: number;
    minimumGauge_mm: number;
    /** Ordered wall less corrosion allowance and minus tolerance: the wall every stress is worked on. */
    analysisThickness_mm: number;
    /** The code formula's wall without allowances (code bases only). */
    formulaThickness_mm: number | null;
    /** The ordered wall the static basis alone asks for, allowances and gauge included. */
    requiredThickness_mm: number | null;
    limitFactor: number | null;
    ultimateFactor: number | null;
    /** The plain statement of what the basis's check is and is not. */
    statement: string | null;
    /** Keys filled by a default of the service or basis, with the reason. */
    defaults: Partial<Record<string, string>>;
  };
  notch: {
    kt: number;
    ktGoverns: string;
    biaxialRatio: number;
    q: number;
    kf: number;
    peakMax_MPa: number;
    peakMin_MPa: number;
    localYield: boolean;
    /** Fastener holes in the order given, each Kt referred to the nominal hoop stress at maximum pressure. */
    fasteners?: {
      kt: number;
      hoop_mm: number;
      axial_mm: number;
      radius_mm: number;
      ligament_mm: number | null;
      solvedWithOpening: boolean;
      ktKirsch: number;
    }[];
    /** The opening's edge stress and what governs, for its picture (per unit nominal hoop stress). */
    opening?: OpeningPictureResult;
    /** Plain-words reasons the opening is outside this screening's range. */
    refer?: string[];
  };
  fatigue: {
    criterion: MeanStressCriterion;
    curve: FatigueCurve;
    amplitude_MPa: number;
    mean_MPa: number;
    equivalentAmplitude_MPa: number | null;
    life_cycles: number | null;
    allowableLife_cycles: number | null;
    designLife_cycles: number;
    scatterFactor: number;
    /** designLife / allowableLife; 0 where the life is unlimited, null where there is no life. */
    damage: number | null;
    /** "cycles" for a single cycle; "passes" when a history or block spectrum is repeated. */
    lifeCountedIn: "cycles" | "passes";
    modifyingFactor: number;
    curveUsed: { fatigueStrengthCoefficient_MPa: number; fatigueStrengthExponent: number; enduranceLimit_MPa: number | null };
    criteria: CriterionRow[];
    pass: boolean;
    /** The welded class or detail category in use (MPa at 2·10⁶ cycles), or null. */
    detailCategory_MPa: number | null;
    weldDetail: WeldDetail | null;
    temperature_C: number;
    defaults: Partial<Record<string, string>>;
    /** The largest cycle on a welded class curve (range after the route's corrections, in MPa) for the S-N plot; null otherwise. */
    weldedPoint: {
      curveName: string;
      class_MPa: number;
      range_MPa: number;
      life_cycles: number | null;
      variableAmplitude: boolean;
    } | null;
  };
  crack?: {
    geometry: string;
    /** The orientations asked for: "axial", "circumferential" or "both". */
    orientation: "axial" | "circumferential" | "both";
    /** The orientation with the shorter life; critical_mm, cycles and curve are its. */
    governingOrientation: "axial" | "circumferential";
    initial_mm: number;
    detectable_mm: number | null;
    critical_mm: number;
    /** "toughness" | "collapse" | "interaction" (failure assessment diagram) | "link-up" (the crack reaches an opening). */
    criticalBy: string;
    /** null when the pressure does not cycle (no growth). */
    cycles: number | null;
    /** The repeat interval when a detectable size is given, else the threshold. */
    inspectionInterval_cycles: number | null;
    /** Growth from the initial flaw to critical over the inspection factor (shorter orientation). */
    threshold_cycles: number | null;
    /** Growth from the detectable size to critical over the factor; null without a detectable size, 0 when it is already critical. */
    repeatInterval_cycles: number | null;
    minimumInterval_cycles: number | null;
    leakBeforeBreakDecides: boolean;
    /** With a history or blocks: the same in passes of the spectrum. */
    passes?: number | null;
    inspectionInterval_passes?: number | null;
    threshold_passes?: number | null;
    repeatInterval_passes?: number | null;
    curve: { a_mm: number; n_cycles: number }[];
    /** A crack growing toward an opening: the same crack grown as if the stress along its path were uniform. */
    uniformCurve?: { a_mm: number; n_cycles: number }[];
    uniformCycles?: number | null;
    uniformCritical_mm?: number;
    orientations: {
      orientation: "axial" | "circumferential";
      stressMax_MPa: number;
      range_MPa: number;
      critical_mm: number;
      criticalBy: string;
      fad: { Lr: number; Kr: number; LrMax: number; lefm_mm: number; collapse_mm: number };
      cycles: number | null;
      threshold_cycles: number | null;
      repeatInterval_cycles: number | null;
      curve: { a_mm: number; n_cycles: number }[];
    }[];
    leakBeforeBreak: { leakBeforeBreak: boolean; throughWallHalfLength_mm: number; criticalHalfLength_mm: number } | null;
  };
  fleet?: FleetResult;
  /** `designLife_cycles`: the design life the lives are compared with, in cycles (passes × cycles per pass for a spectrum). */
  evidence?: Omit<EvidenceResult, "steps" | "warnings"> & { designLife_cycles: number };
  materialFit?: {
    fatigueStrengthCoefficient_MPa: number;
    fatigueStrengthExponent: number;
    n: number;
    runouts: number;
    logStdDev: number;
    rSquared: number;
    band: { amplitude_MPa: number; lower_cycles: number; median_cycles: number; upper_cycles: number }[];
  };
  spectrum?: {
    cycles: SpectrumCycle[];
    totalCycles: number;
    /** null when beyond what a double holds (no life). */
    damagePerPass: number | null;
    passesToFailure: number | null;
    historyPoints?: number;
  };
  solution?: {
    /** The thickness to use: the solved minimum rounded up to the next available gauge. */
    thickness_mm?: number;
    /** The solved minimum before rounding. */
    requiredThickness_mm?: number;
    /** Which thicknesses it was rounded to, in words. */
    roundedTo?: string;
    /** Fatigue damage and static margin at the rounded thickness. */
    damageAtThickness?: number | null;
    staticMarginAtThickness?: number;
    pressureMax_MPa?: number;
    /** The check that binds at the solution. */
    governs: string;
    iterations: number;
    evaluations: number;
  };
  lifeVsThickness: { thickness_mm: number; life_cycles: number | null }[];
  verdictTable: VerdictRow[];
  material: { id?: string; name: string; source: string; typical: boolean };
  /** The worked steps, in the order of the sheet's sections. */
  steps: Step[];
  /** The sections the steps fall into, in order: each heading and how many consecutive steps it holds. */
  sections: Section[];
  warnings: string[];
}
