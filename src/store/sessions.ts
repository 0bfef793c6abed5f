import { createHash, randomBytes } from "node:crypto";
import { z } from "zod";
import { isoNow, type StoreContext } from "./context.ts";
import { offeredPassphraseField, parseFields } from "./fields.ts";
import { logPeopleEvent } from "./peopleLog.ts";
import { authenticate, type Actor } from "./users.ts";

/**
 * Sign-in sessions. A token is 32 random bytes (base64url); the database keeps only its SHA-256,
 * so a copy of the database gives no one a way in. A session lasts SESSION_HOURS and ends at
 * sign-out, when the account is disabled, or when an admin resets its passphrase.
 */
export const SESSION_HOURS = 12;

export interface Session {
  token: string;
  user: Actor;
  expiresAt: string;
}

const signInFields = z.strictObject({
  name: z.string({ error: "is required: the name you were registered with" }).max(200, "must be at most 200 characters"),
  passphrase: offeredPassphraseField,
});

export async function signIn(ctx: StoreContext, body: unknown, source: string): Promise<Session> {
  const { name, passphrase } = parseFields(signInFields, body);
  const user = await authenticate(ctx, name, passphrase, source);
  const token = randomBytes(32).toString("base64url");
  const now = ctx.now();
  const expiresAt = new Date(now.getTime() + SESSION_HOURS * 3600_000).toISOString();
  await ctx.sql.write(async (q) => {
    // Expired sessions are swept here, on a write, so reading a page never writes.
    await q.run("DELETE FROM sessions WHERE expires_at <= ?", now.toISOString());
    await q.run(
      "INSERT INTO sessions (token_hash, user_id, created_at, expires_at) VALUES (?, ?, ?, ?)",
      tokenHash(token),
      user.id,
      isoNow(ctx),
      expiresAt,
    );
    await logPeopleEvent(q, { at: isoNow(ctx), kind: "sign-in", userId: user.id, actorId: user.id, source, detail: null });
  });
  return { token, user, expiresAt };
}

/** The enabled user a token belongs to, or undefined. Reads only. */
export async function userForToken(ctx: StoreContext, token: string): Promise<Actor | undefined> {
  if (!/^[A-Za-z0-9_-]{20,100}$/.test(token)) return undefined;
  return ctx.sql.get<Actor>(
    `SELECT u.id, u.name, u.role FROM sessions s JOIN users u ON u.id = s.user_id
      WHERE s.token_hash = ? AND s.expires_at > ? AND u.disabled = 0`,
    tokenHash(token),
    isoNow(ctx),
  );
}

export async function signOut(ctx: StoreContext, token: string): Promise<void> {
  await ctx.sql.run("DELETE FROM sessions WHERE token_hash = ?", tokenHash(token));
}

function tokenHash(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}
