/**
 * @module engine/sections
 * The sections of the calculation, in the order the sheet prints them and a checker redoes
 * them: load, membrane stresses, static strength, the opening, the notch, the curve, fatigue,
 * crack growth, test evidence, the fleet view, the solution. The headings are the format's
 * (src/schema/result.ts); the engine decides which section each step belongs to, so no face keeps
 * its own list; a step that is worked early (the Marin factors of the fatigue curve, the coupon
 * fit) still prints under its own heading, after the membrane stresses.
 */
import { SECTION_HEADINGS as SECTIONS } from "../schema/result.ts";
import type { CheckResult } from "./result.ts";
import type { Step } from "./step.ts";

export type SectionHeading = (typeof SECTIONS)[number];

/** Headings by the first word of a step id; a step whose id is not listed stays under the heading before it. */
const HEADING_OF: Record<string, SectionHeading> = {
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
  local: "Local stresses at the notch",
  governing: "Local stresses at the notch",
  peak: "Local stresses at the notch",
  amplitude: "Local stresses at the notch",
  mean: "Local stresses at the notch",
  coupons: "S-N curve from the coupons",
  marin: "Fatigue life",
  endurance: "Fatigue life",
  below: "Fatigue life",
  sigma: "Fatigue life",
  weld: "Fatigue life",
  welded: "Fatigue life",
  vessel: "Fatigue life",
  life: "Fatigue life",
  miner: "Fatigue life",
  passes: "Fatigue life",
  allowable: "Fatigue life",
  damage: "Fatigue life",
  crack: "Crack growth",
  evidence: "Test evidence",
  fleet: "Fleet view",
  solve: "Solution",
};

/** One section of the calculation: its heading and how many of the (reordered) steps it holds. */
export type Section = CheckResult["sections"][number];

/** The steps in sheet order (stable within a section) and the sections they fall into. */
export function inSheetOrder(steps: readonly Step[]): { steps: Step[]; sections: Section[] } {
  let current: SectionHeading = SECTIONS[0];
  const tagged = steps.map((step, i) => {
    current = HEADING_OF[step.id.split("-")[0]] ?? current;
    return { step, i, order: SECTIONS.indexOf(current), heading: current };
  });
  tagged.sort((a, b) => a.order - b.order || a.i - b.i);
  const sections: Section[] = [];
  for (const t of tagged) {
    const last = sections[sections.length - 1];
    if (last && last.heading === t.heading) last.steps += 1;
    else sections.push({ heading: t.heading, steps: 1 });
  }
  return { steps: tagged.map((t) => t.step), sections };
}
