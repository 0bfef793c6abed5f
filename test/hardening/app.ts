/** The whole app in-process, as src/server.ts serves it, on a database of its own, with a signed-in admin. */
import { createHash, randomBytes } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Hono } from "hono";
import { openSqliteStore as openStore, type SqliteStore } from "../../src/store/index.ts";
import { wholeApp as serve } from "../../src/web/whole.ts";

export interface WholeApp {
  /** Every request carries the admin's session unless it sends its own Authorization or Cookie. */
  app: Hono;
  /** The app itself, for requests made as no one. */
  bare: Hono;
  store: SqliteStore;
  /** The admin's bearer token. */
  token: string;
  /** Close the database and remove its folder. */
  close(): void;
}

export const HARDENING_ADMIN = "Quill Ashgrove-Tamsin";

/**
 * An admin and a session written straight into the database (the hardening tests probe the
 * routes, not the sign-in, which test/web/records.test.ts covers): a random hash no passphrase
 * matches, and a session whose token only this helper knows.
 */
function adminSession(store: SqliteStore): string {
  const token = randomBytes(32).toString("base64url");
  const now = new Date();
  const user = store.db
    .prepare(
      "INSERT INTO users (name, name_key, role, salt, hash, scrypt_n, scrypt_r, scrypt_p, created_at) VALUES (?, ?, 'admin', ?, ?, 1024, 8, 1, ?)",
    )
    .run(HARDENING_ADMIN, HARDENING_ADMIN.toLowerCase(), randomBytes(16), randomBytes(32), now.toISOString());
  store.db
    .prepare("INSERT INTO sessions (token_hash, user_id, created_at, expires_at) VALUES (?, ?, ?, ?)")
    .run(
      createHash("sha256").update(token).digest("hex"),
      Number(user.lastInsertRowid),
      now.toISOString(),
      new Date(now.getTime() + 3600_000).toISOString(),
    );
  return token;
}

export function wholeApp(): WholeApp {
  const dir = mkdtempSync(join(tmpdir(), "hoopwise-hardening-"));
  const store = openStore({ path: join(dir, "records.db") });
  const bare = serve(store);
  const token = adminSession(store);
  const app = new Hono().all("*", (c) => {
    const req = c.req.raw;
    if (req.headers.has("authorization") || req.headers.has("cookie")) return bare.fetch(req, c.env);
    const headers = new Headers(req.headers);
    headers.set("authorization", `Bearer ${token}`);
    return bare.fetch(new Request(req, { headers }), c.env);
  });
  return {
    app,
    bare,
    store,
    token,
    close() {
      void store.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
