import { openStore } from "../store/index.ts";
import type { Io } from "./io.ts";

/**
 * `key show`: the records' public signing key as PEM on standard output, its fingerprint on
 * standard error. The records are DATABASE_URL's when it is set, else the SQLite file (`dbPath`,
 * HOOPWISE_DB or the default).
 */
export async function keyShowCommand(args: string[], io: Io, dbPath?: string): Promise<number> {
  if (args[0] !== "show" || args.length !== 1) {
    io.stderr.write("usage: key show   (prints the records' public key; save it as KEY.pem for verify --key)\n");
    return 2;
  }
  try {
    const store = await openStore({ path: dbPath });
    try {
      const k = store.publicKey();
      io.stdout.write(k.publicKeyPem);
      io.stderr.write(`Ed25519 public key, fingerprint ${k.fingerprint}\n`);
      return 0;
    } finally {
      await store.close();
    }
  } catch (err) {
    io.stderr.write(`key show: cannot open the records: ${(err as Error).message}\n`);
    return 1;
  }
}
