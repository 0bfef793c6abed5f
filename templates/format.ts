/**
 * How dates and sign-off times read on the printed sheet. Numbers are written by the one
 * formatter of every face (src/present/numbers.ts), re-exported here for the templates.
 */

export { capitalise, life, MINUS, numberList, percent, sig, withUnit } from "../src/present/numbers.ts";
import { reserve } from "../src/present/numbers.ts";

/** A reserve as every face shows it: a signed percentage (src/present/numbers.ts). */
export const margin = reserve;

/** ISO 8601 calendar date (YYYY-MM-DD) in UTC: unambiguous on both sides of the Atlantic. */
export function isoDate(d: Date): string {
  return d.toISOString().slice(0, 10);
}

/**
 * A sign-off time as recorded: an ISO timestamp prints as date and UTC time; anything else is
 * printed as given (it is escaped by the template like all text).
 */
export function signedAtText(signedAt: string): string {
  const t = Date.parse(signedAt);
  if (!/^\d{4}-\d{2}-\d{2}/.test(signedAt) || Number.isNaN(t)) return signedAt;
  const iso = new Date(t).toISOString();
  return `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;
}
