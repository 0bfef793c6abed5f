import type { Q, Sql } from "./sql.ts";
import { SlowDownError } from "./errors.ts";

/**
 * Guessing a passphrase is slowed, never locked out. Every attempt is counted in the database
 * before the (slow) scrypt check, in one write transaction, so guesses sent together are
 * counted one after another and a restart forgets nothing. After f wrong passphrases in a row,
 * the next attempt waits 2^(f−1) seconds from the last one, up to a cap: per account (so a
 * guesser gets about one try in five minutes at worst, while the owner is never shut out for
 * longer) and per source address (so one machine trying many names is slowed too). A right
 * passphrase clears the account's count; an admin can clear it as well. Common practice for
 * online guessing (growing delays rather than lockout, as NIST SP 800-63B §5.2.2 recommends
 * rate limiting without letting an attacker deny the owner).
 */
export const ACCOUNT_CAP_S = 300;
export const SOURCE_CAP_S = 900;

export function delaySeconds(failures: number, cap: number): number {
  return failures <= 0 ? 0 : Math.min(cap, 2 ** Math.min(failures - 1, 30));
}

export interface Subjects {
  /** "account:" and the name's skeleton, whether or not anyone has that name. */
  account: string;
  /** "source:" and the client's address. */
  source: string;
}

export function subjectsFor(nameKey: string, source: string): Subjects {
  return { account: `account:${nameKey}`, source: `source:${source}` };
}

interface Row {
  failures: number;
  last_at: number;
}

/**
 * Count one attempt for both subjects, or refuse with the wait left when either must still wait.
 * Runs in its own write transaction, so two attempts can never both see the same count.
 */
export async function countAttempt(sql: Sql, s: Subjects, nowMs: number): Promise<void> {
  await sql.write(async (q) => {
    let wait = 0;
    for (const [subject, cap] of [
      [s.account, ACCOUNT_CAP_S],
      [s.source, SOURCE_CAP_S],
    ] as const) {
      const row = await q.get<Row>("SELECT failures, last_at FROM attempts WHERE subject = ?", subject);
      if (row) wait = Math.max(wait, row.last_at + delaySeconds(row.failures, cap) * 1000 - nowMs);
    }
    if (wait > 0) throw new SlowDownError(Math.ceil(wait / 1000));
    const bump = `INSERT INTO attempts (subject, failures, last_at) VALUES (?, 1, ?)
       ON CONFLICT (subject) DO UPDATE SET failures = attempts.failures + 1, last_at = excluded.last_at`;
    await q.run(bump, s.account, nowMs);
    await q.run(bump, s.source, nowMs);
  });
}

/** The attempt was right: the account starts afresh, and the source is not charged for it. */
export async function attemptSucceeded(sql: Sql, s: Subjects): Promise<void> {
  await sql.write(async (q) => {
    await q.run("DELETE FROM attempts WHERE subject = ?", s.account);
    await q.run("UPDATE attempts SET failures = CASE WHEN failures > 0 THEN failures - 1 ELSE 0 END WHERE subject = ?", s.source);
  });
}

/** An admin lifts the wait on an account. Returns whether there was one. */
export async function clearAccount(q: Q, nameKey: string): Promise<boolean> {
  return (await q.run("DELETE FROM attempts WHERE subject = ?", `account:${nameKey}`)).changes > 0;
}

export async function failuresOf(q: Q, subject: string): Promise<number> {
  return (await q.get<Row>("SELECT failures FROM attempts WHERE subject = ?", subject))?.failures ?? 0;
}
