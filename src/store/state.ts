/**
 * @module store/state
 * The sign-off roles and the revision-state rule, as the store's files import them. Their one home is
 * src/schema/signoff.ts, beside the message a sign-off signs, so the sheet's templates read the same
 * rules without importing the store; this file only re-exports them.
 */
export { isRole, revisionState, ROLES, signOffState, type RevisionState, type Role } from "../schema/signoff.ts";
