/**
 * @module templates/model
 * The shape of what the sheet prints: the sheet model and its sign-offs and paper. The sheet builder
 * (src/sheet/sheet.ts) fills it from the parsed check, the engine's result and the records'
 * revision; every part of the template reads from it and works nothing out of its own. Types only,
 * from the schema and the engine.
 */
import type { CheckResult } from "../src/engine/index.ts";
import type { ResolvedMaterial } from "../src/engine/input.ts";
import type { ParsedCheck } from "../src/schema/index.ts";
import type { Role } from "../src/schema/signoff.ts";
import type { Units } from "../src/schema/units.ts";

export type Paper = "A4" | "Letter";
export type SignOffRole = Role;

/** One sign-off as the records hold it. */
export interface SignOff {
  role: SignOffRole;
  name: string;
  /** ISO 8601 timestamp as recorded. */
  signedAt: string;
  /** The Ed25519 signature (base64) the records keep for it. */
  signature?: string;
}

/** Everything the sheet prints, gathered once so each part of the template reads from one place. */
export interface SheetModel {
  /** The parsed check with its defaults filled in: what the fingerprint covers. */
  document: ParsedCheck;
  /** The material values the engine used (library values merged with the user's). */
  material: ResolvedMaterial;
  result: CheckResult;
  /** The units the user chose; SI is printed beside them. */
  units: Units;
  /** Revision in the records; absent for a check printed without being saved. */
  revision?: number;
  signoffs: SignOff[];
  superseded: boolean;
  /** The records' calculation number, which the sheet prints; else the input's own. */
  calcNumber?: string;
  /** An imported revision whose sign-offs were not kept: printed as such. */
  importedUnsigned?: boolean;
  /** Fingerprint of the records' public key the sign-offs are signed with. */
  keyFingerprint?: string;
  /** The date printed on the sheet. */
  printedOn: Date;
  paper: Paper;
}
