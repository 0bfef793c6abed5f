import type { Step } from "../src/engine/index.ts";

/** A run of consecutive steps under one heading of the calculation. */
export interface StepGroup {
  title: string;
  steps: { step: Step; no: number }[];
}

/**
 * Headings by the first word of a step id. The engine returns steps in the order it works
 * them out; a step whose id is not listed stays under the heading before it, so a new step
 * type still prints in its place.
 */
const HEADING_OF: Record<string, string> = {
  isa: "Load",
  differential: "Load",
  blocks: "Load",
  rainflow: "Load",
  slenderness: "Membrane stresses",
  hoop: "Membrane stresses",
  axial: "Membrane stresses",
  radial: "Membrane stresses",
  von: "Membrane stresses",
  static: "Static strength",
  biaxial: "Stress concentration at the opening",
  kt: "Stress concentration at the opening",
  notch: "Stress concentration at the opening",
  kf: "Stress concentration at the opening",
  peak: "Local stresses at the notch",
  amplitude: "Local stresses at the notch",
  mean: "Local stresses at the notch",
  coupons: "S-N curve from the coupons",
  marin: "Fatigue life",
  sigma: "Fatigue life",
  weld: "Fatigue life",
  welded: "Fatigue life",
  life: "Fatigue life",
  miner: "Fatigue life",
  passes: "Fatigue life",
  allowable: "Fatigue life",
  damage: "Fatigue life",
  crack: "Crack growth",
  evidence: "Test evidence",
  solve: "Solution",
};

export function groupSteps(steps: readonly Step[]): StepGroup[] {
  const groups: StepGroup[] = [];
  steps.forEach((step, i) => {
    const heading = HEADING_OF[step.id.split("-")[0]];
    const last = groups[groups.length - 1];
    if (last && (heading === undefined || heading === last.title)) last.steps.push({ step, no: i + 1 });
    else groups.push({ title: heading ?? "Calculation", steps: [{ step, no: i + 1 }] });
  });
  return groups;
}
