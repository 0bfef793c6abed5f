import type { SignOff, SignOffRole } from "./model.ts";

export type SheetState = "draft" | SignOffRole | "superseded";

/** The mark printed on every page: what a reader may take the sheet for, in a few words. */
export interface StatusMark {
  state: SheetState;
  words: string;
}

const ORDER: readonly SignOffRole[] = ["prepared", "checked", "approved"];

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
  if (superseded) return { state: "superseded", words: WORDS.superseded };
  const signed = new Set(signoffs.map((s) => s.role));
  let state: SheetState = "draft";
  for (const role of ORDER) if (signed.has(role)) state = role;
  return { state, words: WORDS[state] };
}
