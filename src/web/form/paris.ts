/**
 * @module web/form/paris
 * The Paris coefficient C on the form, in the reader's units. Its factor between unit systems
 * depends on the exponent m (src/schema/units.ts, parisCFromSI), so each edge of the form converts
 * it with the exponent it goes with: the one typed, else the library entry's. Without any exponent
 * the number is left as typed: the check then asks for the exponent, and C is not used before it.
 */
import { findMaterial } from "../../materials/library.ts";
import { formNumber, parisCFromSI, parisCToSI, type Units } from "../../schema/units.ts";
import { parseNumber } from "./lists.ts";

/** The exponent m a coefficient goes with: the one given (a number, or a field's text), else the library entry's. */
export function parisExponent(m: unknown, materialId: unknown): number | undefined {
  const given = typeof m === "number" ? m : typeof m === "string" ? parseNumber(m.trim()) : undefined;
  if (given !== undefined && Number.isFinite(given)) return given;
  return typeof materialId === "string" ? findMaterial(materialId)?.parisM : undefined;
}

/** A check document's material read off the form: its Paris coefficient, typed in `units`, put into the format's units. */
export function parisCIntoSI(material: Record<string, unknown> | undefined, units: Units): void {
  if (!material || typeof material.parisC !== "number") return;
  const m = parisExponent(material.parisM, material.id);
  if (m !== undefined) material.parisC = parisCToSI(material.parisC, m, units);
}

/** A document's Paris coefficient as the form shows it in `units`. */
export function parisCShown(C: number, m: number | undefined, units: Units): string {
  return formNumber(m === undefined ? C : parisCFromSI(C, m, units));
}

/** A typed coefficient re-expressed when the units change; text that is not a number is kept as typed. */
export function parisCConverted(text: string, m: number | undefined, from: Units, to: Units): string {
  const x = parseNumber(text.trim());
  if (x === undefined || m === undefined) return text;
  return formNumber(parisCFromSI(parisCToSI(x, m, from), m, to));
}
