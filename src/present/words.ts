/**
 * @module present/words
 * The words every face uses for the same thing, written once: the status of a verdict row and of
 * a mean-stress criterion, the criterion names (the engine's), and the cautions in a long form
 * (the page's banner, the sheet's section) and a short one (under the verdict, the sheet's footer).
 */
import type { CriterionRow, VerdictRow } from "../engine/index.ts";

export { CRITERION_LABEL as CRITERION_NAMES } from "../engine/meanStress.ts";

/** A verdict row's outcome in words ("refer" is listed so a row that refers reads alike everywhere). */
export const STATUS_WORDS: Record<VerdictRow["status"] | "refer", string> = {
  pass: "passes",
  fail: "fails",
  refer: "refer for analysis",
  info: "for information",
};

/** The headings of the verdict table's columns; each face orders them as its layout needs. */
export const VERDICT_COLUMNS = {
  check: "Check",
  outcome: "Outcome",
  demand: "Demand against capacity",
  reserve: "Reserve",
} as const;

/** The overall verdict in words: the engine's, the one list (src/engine/verdict.ts). */
export { VERDICT_WORDS } from "../engine/index.ts";

/** Why a criterion gives no finite life, in words ("" where it gives one). */
export const CRITERION_STATUS_WORDS: Record<CriterionRow["status"], string> = {
  ok: "",
  "no-answer": "no answer: the mean stress reaches the strength this criterion uses",
  "no-damage": "no damage: the cycle never reaches tension",
  unlimited: "unlimited: below the endurance limit",
};

/**
 * The cautions, long form: what a result is and is not. The first three are the ones no face
 * may show a result without; the rest say what lies outside the check.
 */
export const CAUTIONS = [
  "This is a screening check made on membrane theory and published methods. It is not a code-compliance certificate: it certifies compliance with no code or rule.",
  "The governing pressure-vessel or airworthiness code decides, and a licensed or authorized engineer must review the work and sign for the item before it is built, repaired or returned to service.",
  "Material values in the library are typical values, not design allowables: verify them against certified data (mill certificates, the material specification or the code's own tables).",
  "Outside this check: bending at frames, stiffeners, heads, nozzles and joints; residual, thermal and assembly stresses; buckling; corrosion, wear and environmental effects on fatigue and crack growth; manufacturing defects beyond the crack assumed here.",
  "Qualified test evidence outranks the estimates shown here wherever the code asks for it.",
] as const;

/** How many of CAUTIONS a face must show in full beside any result. */
export const CAUTIONS_ALWAYS = 3;

/** The cautions, short form: one line under every verdict and at the foot of every sheet page. */
export const CAUTION_SHORT =
  "Screening check only — not a code-compliance certificate. The governing code and a licensed or authorized engineer decide. Material values are typical: verify them against certified data.";
