import { ZxcvbnFactory } from "@zxcvbn-ts/core";
import * as common from "@zxcvbn-ts/language-common";
import * as en from "@zxcvbn-ts/language-en";

/**
 * How hard a new passphrase is to guess, judged by zxcvbn (Wheeler, "zxcvbn: Low-Budget Password
 * Strength Estimation", USENIX Security 2016), through its maintained TypeScript port
 * @zxcvbn-ts with its common and English dictionaries. It finds dictionary words, common
 * passwords, keyboard walks, repeats ("aaaa…", "abcabc…"), sequences and dates, and scores the
 * guesses needed from 0 to 4. A passphrase must score at least MIN_SCORE (3: "safely
 * unguessable: moderate protection from offline slow-hash scenario", in zxcvbn's words), and
 * the person's own name counts as a dictionary word for it.
 */
export const MIN_SCORE = 3;

let factory: ZxcvbnFactory | undefined;

function estimator(): ZxcvbnFactory {
  factory ??= new ZxcvbnFactory({
    dictionary: { ...common.dictionary, ...en.dictionary },
    graphs: common.adjacencyGraphs,
    translations: en.translations,
  });
  return factory;
}

/** Why the passphrase is too easy to guess, in words; undefined when it is strong enough. */
export function weakPassphrase(passphrase: string, personal: readonly string[]): string | undefined {
  // zxcvbn's time grows with length; past 256 characters, length alone is strength enough.
  if ([...passphrase].length > 256) return undefined;
  const words = personal.flatMap((p) => [p, ...p.split(/\s+/u)]).filter((w) => w.length >= 3);
  const r = estimator().check(passphrase, [...words, "hoopwise"]);
  if (r.score >= MIN_SCORE) return undefined;
  const why = [r.feedback.warning, ...r.feedback.suggestions].filter((x): x is string => Boolean(x)).join(" ");
  return `is too easy to guess (strength ${r.score} of 4, at least ${MIN_SCORE} needed)${why ? `: ${why.replace(/\.$/, "")}` : ""}; a few unrelated words work well`;
}
