/**
 * @module templates/status
 * The status mark printed on every page of the sheet (the front, the sign-off section and the
 * printer's margins, src/sheet/margins.tsx): the sheet's state from its sign-offs, and the few words
 * that say what a reader may take it for. The state is worked by the records' own rule
 * (signOffState of src/schema/signoff.ts); only the words are here.
 */
import { signOffState, type RevisionState } from "../src/schema/signoff.ts";
import type { SignOff } from "./model.ts";

export type SheetState = RevisionState;

/** The mark printed on every page: what a reader may take the sheet for, in a few words. */
export interface StatusMark {
  state: SheetState;
  words: string;
}

const WORDS: Record<SheetState, string> = {
  draft: "UNCHECKED DRAFT — NOT FOR USE",
  prepared: "PREPARED — AWAITING CHECK",
  checked: "CHECKED — AWAITING APPROVAL",
  approved: "CHECKED AND APPROVED",
  superseded: "SUPERSEDED — DO NOT USE",
};

/**
 * The sheet's state follows from its sign-offs, as the records work it out: the last role of
 * prepared → checked → approved that is signed; a superseded revision is superseded whatever
 * it carries.
 */
export function statusMark(signoffs: readonly SignOff[], superseded: boolean): StatusMark {
  const state = signOffState(
    signoffs.map((s) => s.role),
    superseded,
  );
  return { state, words: WORDS[state] };
}
