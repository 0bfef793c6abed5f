import { checkDocument, type CheckResult, type FieldError } from "../../engine/index.ts";

/**
 * The key results of a saved revision, worked out again by the running engine, so two revisions
 * can be set side by side. What each null means differs by figure (an unlimited life, a crack
 * that does not grow), so each figure says how it reads; undefined means the check has no such
 * part (no crack or test evidence given).
 */
export type FigureKind = "verdict" | "text" | "stress" | "factor" | "life" | "damage" | "interval" | "bound";

export interface Figure {
  id: string;
  label: string;
  kind: FigureKind;
  /** Cycles or passes, for lives; MPa for stresses. */
  unit?: string;
  value: number | string | null | undefined;
}

export type WorkedRevision = { ok: true; figures: Figure[] } | { ok: false; errors: FieldError[] };

const lifeUnit = (r: CheckResult) => (r.fatigue.lifeCountedIn === "passes" ? "passes" : "cycles");

interface FigureRule {
  id: string;
  label: string;
  kind: FigureKind;
  unit?: (r: CheckResult) => string;
  get: (r: CheckResult) => Figure["value"];
}

const FIGURES: readonly FigureRule[] = [
  { id: "verdict", label: "Verdict", kind: "verdict", get: (r) => r.verdict },
  { id: "governs", label: "Governed by", kind: "text", get: (r) => r.governs },
  { id: "hoop", label: "Hoop stress at the highest pressure", kind: "stress", unit: () => "MPa", get: (r) => r.membrane.hoopMax_MPa },
  { id: "kt", label: "Stress concentration Kt", kind: "factor", get: (r) => r.notch.kt },
  { id: "kf", label: "Fatigue notch factor Kf", kind: "factor", get: (r) => r.notch.kf },
  { id: "life", label: "Fatigue life", kind: "life", unit: lifeUnit, get: (r) => r.fatigue.life_cycles },
  { id: "allowable", label: "Allowable life (after scatter)", kind: "life", unit: lifeUnit, get: (r) => r.fatigue.allowableLife_cycles },
  { id: "damage", label: "Fatigue damage", kind: "damage", get: (r) => r.fatigue.damage },
  {
    id: "interval",
    label: "Crack inspection interval",
    kind: "interval",
    unit: () => "cycles",
    get: (r) => r.crack?.inspectionInterval_cycles,
  },
  { id: "bound", label: "Test evidence lower bound", kind: "bound", unit: () => "cycles", get: (r) => r.evidence?.lowerBound_cycles },
];

export function workRevision(input: unknown): WorkedRevision {
  const run = checkDocument(input);
  if (!run.ok) return run;
  const r = run.result;
  return { ok: true, figures: FIGURES.map((f) => ({ id: f.id, label: f.label, kind: f.kind, unit: f.unit?.(r), value: f.get(r) })) };
}

/** The relative change from `before` to `after`, where both are numbers and it means something. */
export function relativeChange(before: Figure["value"], after: Figure["value"]): number | undefined {
  if (typeof before !== "number" || typeof after !== "number" || before === 0) return undefined;
  if (!Number.isFinite(before) || !Number.isFinite(after)) return undefined;
  return (after - before) / Math.abs(before);
}
