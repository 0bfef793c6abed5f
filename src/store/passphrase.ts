import { randomBytes, scrypt, timingSafeEqual, type ScryptOptions } from "node:crypto";

/**
 * Passphrases are kept only as scrypt hashes with a salt of their own.
 * The cost parameters are stored beside each hash, so they can be raised
 * later without locking out anyone registered before.
 */
export interface PassphraseHash extends ScryptCost {
  salt: Buffer;
  hash: Buffer;
}

/** scrypt's cost parameters: CPU/memory cost N, block size r, parallelism p. */
export interface ScryptCost {
  n: number;
  r: number;
  p: number;
}

// N = 2^15, r = 8: 32 MiB and about a tenth of a second per sign-off,
// costly to guess at scale yet unnoticed by someone signing a sheet.
export const DEFAULT_SCRYPT_COST: ScryptCost = { n: 2 ** 15, r: 8, p: 1 };
const KEY_LENGTH = 32;
const SALT_LENGTH = 16;

export async function hashPassphrase(passphrase: string, cost: ScryptCost = DEFAULT_SCRYPT_COST): Promise<PassphraseHash> {
  const salt = randomBytes(SALT_LENGTH);
  const hash = await derive(passphrase, salt, cost);
  return { salt, hash, ...cost };
}

export async function passphraseMatches(passphrase: string, stored: PassphraseHash): Promise<boolean> {
  const candidate = await derive(passphrase, stored.salt, stored);
  return candidate.length === stored.hash.length && timingSafeEqual(candidate, stored.hash);
}

function derive(passphrase: string, salt: Buffer, cost: ScryptCost): Promise<Buffer> {
  const options: ScryptOptions = { N: cost.n, r: cost.r, p: cost.p, maxmem: 256 * cost.n * cost.r };
  // NFC: the same phrase typed on two systems can arrive in two Unicode forms.
  const secret = passphrase.normalize("NFC");
  return new Promise((resolve, reject) => scrypt(secret, salt, KEY_LENGTH, options, (err, key) => (err ? reject(err) : resolve(key))));
}
