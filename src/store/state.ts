export { isRole, revisionState, ROLES, signOffState, type RevisionState, type Role } from "../schema/signoff.ts";
