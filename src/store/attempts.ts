import type { StoreContext } from "./context.ts";
import { WrongPassphraseError } from "./errors.ts";

/**
 * Wrong passphrases per signer: after MAX_FAILURES within WINDOW_MS the signer's name is locked
 * until the window from the first failure has passed, so a passphrase cannot be guessed by
 * trying many (common practice for password checks). Kept in memory: a restart clears it, which
 * costs a guesser a restart per five tries.
 */
export const MAX_FAILURES = 5;
export const WINDOW_MS = 15 * 60 * 1000;

interface Tally {
  failures: number;
  since: number;
}

const tallies = new WeakMap<StoreContext, Map<string, Tally>>();

function tallyOf(ctx: StoreContext): Map<string, Tally> {
  let t = tallies.get(ctx);
  if (!t) tallies.set(ctx, (t = new Map()));
  return t;
}

/** Refuse before the (slow) passphrase check when this name has failed too often lately. */
export function refuseWhileLocked(ctx: StoreContext, key: string, shownName: string): void {
  const t = tallyOf(ctx).get(key);
  const now = ctx.now().getTime();
  if (!t || now - t.since >= WINDOW_MS) return;
  if (t.failures >= MAX_FAILURES) {
    const minutes = Math.ceil((t.since + WINDOW_MS - now) / 60000);
    throw new WrongPassphraseError([
      {
        path: "passphrase",
        message: `too many wrong passphrases for "${shownName}"; signing as this person is paused for ${minutes} more minute${minutes === 1 ? "" : "s"}`,
      },
    ]);
  }
}

export function noteFailure(ctx: StoreContext, key: string): void {
  const tally = tallyOf(ctx);
  const now = ctx.now().getTime();
  const t = tally.get(key);
  if (!t || now - t.since >= WINDOW_MS) tally.set(key, { failures: 1, since: now });
  else t.failures++;
}

export function clearFailures(ctx: StoreContext, key: string): void {
  tallyOf(ctx).delete(key);
}
