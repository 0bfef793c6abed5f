import { createHash, createPrivateKey, createPublicKey, generateKeyPairSync, sign, verify, type KeyObject } from "node:crypto";
import { chmodSync, existsSync, mkdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { dirname } from "node:path";

/**
 * The records' signing key: an Ed25519 key pair (RFC 8032) made through node:crypto on first
 * start and kept beside the database as a PKCS #8 PEM file that only its owner may read. Every
 * sign-off and every export is signed with it; anyone holding the public key (served at
 * GET /api/v1/keys) can check those signatures, and no one without the private key can make one.
 */
export interface SigningKeys {
  /** SHA-256 of the public key's DER (SubjectPublicKeyInfo) encoding, in hex: how a key is named. */
  readonly fingerprint: string;
  readonly publicKeyPem: string;
  readonly publicKey: KeyObject;
  sign(message: string): string;
  /** Where the private key lives; absent for an in-memory database's throw-away key. */
  readonly path?: string;
}

/** The private key file for a database file: beside it, with `.signing-key.pem` after its name. */
export function keyPathFor(dbPath: string): string {
  return `${dbPath}.signing-key.pem`;
}

/** Load the key pair beside the database, creating it (owner-only) when there is none yet. */
export function openSigningKeys(dbPath: string): SigningKeys {
  if (dbPath === ":memory:") return keysFrom(generateKeyPairSync("ed25519").privateKey);
  return openKeyFile(keyPathFor(dbPath));
}

/** The key pair in a PKCS #8 PEM file, made (owner-only, in a folder made when missing) when there is none yet. */
export function openKeyFile(path: string): SigningKeys {
  if (!existsSync(path)) {
    mkdirSync(dirname(path), { recursive: true });
    const { privateKey } = generateKeyPairSync("ed25519");
    const pem = privateKey.export({ type: "pkcs8", format: "pem" }) as string;
    try {
      // "wx": never overwrite a key another process has just written.
      writeFileSync(path, pem, { mode: 0o600, flag: "wx" });
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== "EEXIST") throw err;
    }
  }
  ownerOnly(path);
  const key = createPrivateKey(readFileSync(path));
  if (key.asymmetricKeyType !== "ed25519") throw new Error(`${path} does not hold an Ed25519 private key`);
  return keysFrom(key, path);
}

function keysFrom(privateKey: KeyObject, path?: string): SigningKeys {
  const publicKey = createPublicKey(privateKey);
  return {
    fingerprint: keyFingerprint(publicKey),
    publicKeyPem: publicKey.export({ type: "spki", format: "pem" }) as string,
    publicKey,
    sign: (message) => sign(null, Buffer.from(message, "utf8"), privateKey).toString("base64"),
    path,
  };
}

/** A public key from PEM text, or undefined when the text is not an Ed25519 public key. */
export function readPublicKey(pem: string): KeyObject | undefined {
  try {
    const key = createPublicKey(pem);
    return key.asymmetricKeyType === "ed25519" ? key : undefined;
  } catch {
    return undefined;
  }
}

export function keyFingerprint(publicKey: KeyObject): string {
  return createHash("sha256")
    .update(publicKey.export({ type: "spki", format: "der" }))
    .digest("hex");
}

/** Whether `signature` (base64) is `key`'s Ed25519 signature of `message`. */
export function signatureValid(key: KeyObject, message: string, signature: string): boolean {
  try {
    return verify(null, Buffer.from(message, "utf8"), key, Buffer.from(signature, "base64"));
  } catch {
    return false;
  }
}

/**
 * Make a file readable and writable by its owner only (mode 600). A file made by an older build
 * with wider permissions is tightened; on a file system that cannot (some network mounts)
 * this is left to the administrator.
 */
export function ownerOnly(path: string): void {
  try {
    if ((statSync(path).mode & 0o077) !== 0) chmodSync(path, 0o600);
  } catch {
    // The file's permissions are the administrator's then.
  }
}
