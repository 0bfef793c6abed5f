/**
 * @module present/steps
 * The worked steps under the section headings the engine gave them, numbered in order: one
 * grouping for the page and the sheet.
 */
import type { Step } from "../engine/index.ts";
import { inSheetOrder, type Section } from "../engine/sections.ts";

/** A run of consecutive steps under one heading of the calculation. */
export interface StepGroup {
  title: string;
  steps: { step: Step; no: number }[];
}

/**
 * The steps under the headings the engine gave them (result.sections); for steps without
 * sections (a test, an old record) the engine's own rule assigns them.
 */
export function groupSteps(steps: readonly Step[], sections: readonly Section[] = inSheetOrder(steps).sections): StepGroup[] {
  const groups: StepGroup[] = [];
  let i = 0;
  for (const s of sections) {
    const group: StepGroup = { title: s.heading, steps: [] };
    for (let k = 0; k < s.steps && i < steps.length; k += 1, i += 1) group.steps.push({ step: steps[i], no: i + 1 });
    groups.push(group);
  }
  return groups;
}
