/** Sign-off roles, in the order they must be given on one revision. */
export const ROLES = ["prepared", "checked", "approved"] as const;
export type Role = (typeof ROLES)[number];

/**
 * A revision's state is never stored: it follows from its sign-offs and
 * whether a later revision exists, so it cannot drift from the records.
 */
export type RevisionState = "draft" | Role | "superseded";

export function revisionState(number: number, latest: number, signed: Iterable<Role>): RevisionState {
  if (number < latest) return "superseded";
  let state: RevisionState = "draft";
  const have = new Set(signed);
  for (const role of ROLES) if (have.has(role)) state = role;
  return state;
}

export function isRole(x: unknown): x is Role {
  return typeof x === "string" && (ROLES as readonly string[]).includes(x);
}
