/** The sheet groups its steps as the page does (src/present/steps.ts). */
export { groupSteps, type StepGroup } from "../src/present/steps.ts";
