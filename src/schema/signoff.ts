import { canonicalJson } from "./canonical.ts";

/**
 * Sign-off roles and the state they give a revision, written once: the records, the sheet's
 * status mark and the sheet's options all read them from here.
 */

/** Sign-off roles, in the order they must be given on one revision. */
export const ROLES = ["prepared", "checked", "approved"] as const;
export type Role = (typeof ROLES)[number];

/**
 * A revision's state is never stored: it follows from its sign-offs and whether a later
 * revision exists, so it cannot drift from the records.
 */
export type RevisionState = "draft" | Role | "superseded";

/** The last role of prepared → checked → approved that is signed; superseded whatever it carries. */
export function signOffState(signed: Iterable<Role>, superseded: boolean): RevisionState {
  if (superseded) return "superseded";
  let state: RevisionState = "draft";
  const have = new Set(signed);
  for (const role of ROLES) if (have.has(role)) state = role;
  return state;
}

/** The state of revision `number` of a check whose latest revision is `latest`. */
export function revisionState(number: number, latest: number, signed: Iterable<Role>): RevisionState {
  return signOffState(signed, number < latest);
}

export function isRole(x: unknown): x is Role {
  return typeof x === "string" && (ROLES as readonly string[]).includes(x);
}

/** What one sign-off signs: the facts that make it this person's approval of this content. */
export interface SignedFacts {
  checkId: string;
  revision: number;
  /** The revision's fingerprint: SHA-256 of its canonical input and engine version. */
  fingerprint: string;
  role: Role;
  /** The signer's user id in the records that signed it. */
  userId: number;
  /** The signer's name as printed. */
  name: string;
  signedAt: string;
}

export const SIGNOFF_FORMAT = "hoopwise.signoff/1";

/** The exact text signed with Ed25519: the canonical JSON of the facts with a format tag. */
export function signoffMessage(f: SignedFacts): string {
  return canonicalJson({
    format: SIGNOFF_FORMAT,
    checkId: f.checkId,
    revision: f.revision,
    fingerprint: f.fingerprint,
    role: f.role,
    userId: f.userId,
    name: f.name,
    signedAt: f.signedAt,
  });
}
