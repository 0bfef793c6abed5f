/**
 * The sign-offs of a revision printed from the records, attached to its sheet with their
 * Ed25519 signatures (SIGNOFFS_ATTACHMENT), so that `verify` can prove from the PDF alone and
 * the records' public key that each named person signed exactly this input.
 */
import type { KeyObject } from "node:crypto";
import { createHash, createPublicKey, verify } from "node:crypto";
import { AFRelationship, type PDFDocument } from "pdf-lib";
import { fingerprint as fingerprintOf } from "../engine/fingerprint.ts";
import { isRole, signoffMessage, type Role } from "../schema/signoff.ts";
import { SIGNOFFS_ATTACHMENT } from "../schema/attachments.ts";
import { extractAttachment } from "./attach.ts";

export const SIGNOFFS_FORMAT = "hoopwise.sheet-signoffs/1";

export interface SheetSignoff {
  role: Role;
  name: string;
  userId: number;
  signedAt: string;
  signature: string;
  keyFingerprint: string;
}

export interface SheetSignoffs {
  format: typeof SIGNOFFS_FORMAT;
  checkId: string;
  revision: number;
  calcNumber: string;
  /** The revision's fingerprint as the records hold it, with the engine version it was saved under. */
  fingerprint: string;
  engineVersion: string;
  /** The records' key at printing. */
  keyFingerprint: string;
  signoffs: SheetSignoff[];
}

export async function attachSignoffs(doc: PDFDocument, s: SheetSignoffs, createdAt: Date): Promise<void> {
  await doc.attach(new TextEncoder().encode(JSON.stringify(s)), SIGNOFFS_ATTACHMENT, {
    mimeType: "application/json",
    description: "The sign-offs of this revision with their Ed25519 signatures, for verification with the records' public key.",
    creationDate: createdAt,
    modificationDate: createdAt,
    afRelationship: AFRelationship.Supplement,
  });
}

export async function readSignoffs(pdf: Uint8Array): Promise<SheetSignoffs | null> {
  const bytes = await extractAttachment(pdf, SIGNOFFS_ATTACHMENT, { maxBytes: 1024 * 1024 });
  if (!bytes) return null;
  let parsed: unknown;
  try {
    parsed = JSON.parse(new TextDecoder("utf-8", { fatal: true }).decode(bytes));
  } catch {
    throw new Error(`The attached ${SIGNOFFS_ATTACHMENT} is not valid JSON.`);
  }
  if (!isSheetSignoffs(parsed)) throw new Error(`The attached ${SIGNOFFS_ATTACHMENT} is not a sign-off record this version understands.`);
  return parsed;
}

function isSheetSignoffs(x: unknown): x is SheetSignoffs {
  const s = x as Partial<SheetSignoffs> | null;
  const str = (v: unknown) => typeof v === "string";
  return (
    typeof s === "object" &&
    s !== null &&
    s.format === SIGNOFFS_FORMAT &&
    str(s.checkId) &&
    Number.isInteger(s.revision) &&
    str(s.calcNumber) &&
    str(s.fingerprint) &&
    str(s.engineVersion) &&
    str(s.keyFingerprint) &&
    Array.isArray(s.signoffs) &&
    s.signoffs.every(
      (o) => isRole(o?.role) && str(o.name) && Number.isInteger(o.userId) && str(o.signedAt) && str(o.signature) && str(o.keyFingerprint),
    )
  );
}

/** A public key from PEM text, with its fingerprint (SHA-256 of the DER SubjectPublicKeyInfo). */
export function publicKeyFrom(pem: string): { key: KeyObject; fingerprint: string } {
  const key = createPublicKey(pem);
  if (key.asymmetricKeyType !== "ed25519") throw new Error("the key is not an Ed25519 public key");
  return {
    key,
    fingerprint: createHash("sha256")
      .update(key.export({ type: "spki", format: "der" }))
      .digest("hex"),
  };
}

export interface SignoffCheck {
  role: Role;
  name: string;
  signedAt: string;
  /** The signature verifies with a key given to verify. */
  valid: boolean;
  why?: string;
}

/**
 * Each sign-off against the keys given: the signature must verify over the facts the sheet
 * carries, and those facts must name the attached input (its fingerprint recomputed).
 */
export function checkSignoffs(s: SheetSignoffs, input: unknown, keys: readonly { key: KeyObject; fingerprint: string }[]): SignoffCheck[] {
  const inputMatches = fingerprintOf(input, s.engineVersion) === s.fingerprint;
  return s.signoffs.map((o) => {
    const base = { role: o.role, name: o.name, signedAt: o.signedAt };
    if (!inputMatches) return { ...base, valid: false, why: "the sign-off names a fingerprint the attached input does not have" };
    const k = keys.find((x) => x.fingerprint === o.keyFingerprint);
    if (!k) return { ...base, valid: false, why: `signed with key ${o.keyFingerprint}, which was not given to verify` };
    const message = signoffMessage({
      checkId: s.checkId,
      revision: s.revision,
      fingerprint: s.fingerprint,
      role: o.role,
      userId: o.userId,
      name: o.name,
      signedAt: o.signedAt,
    });
    let ok = false;
    try {
      ok = verify(null, Buffer.from(message, "utf8"), k.key, Buffer.from(o.signature, "base64"));
    } catch {
      ok = false;
    }
    return ok
      ? { ...base, valid: true }
      : { ...base, valid: false, why: "the signature does not match: the sign-off or the sheet was changed" };
  });
}
