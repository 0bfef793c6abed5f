/**
 * @module engine/phrase
 * Sentences that carry numbers with their quantities. The engine writes each verdict row as a
 * phrase: its text in SI (the result's `detail`, unchanged for readers of the JSON) and its parts,
 * plain words and amounts, so every face shows the numbers in the reader's units with the one
 * number formatter (src/present/numbers.ts) instead of reading numbers back out of a sentence.
 */
import type { Phrase, PhraseAmount } from "../schema/result.ts";

export type { Phrase, PhraseAmount };
import { SI_UNITS, type Quantity, unitLabel } from "../schema/units.ts";
import { fmt } from "./step.ts";

/** An amount: a value in SI with what it measures; `digits` significant figures where not 4. */
export function amount(value: number, quantity: Quantity, digits?: number): PhraseAmount {
  return { value: Number.isFinite(value) ? value : null, quantity, ...(digits !== undefined ? { digits } : {}) };
}
export const mm = (v: number, digits?: number) => amount(v, "length", digits);
export const MPa = (v: number, digits?: number) => amount(v, "stress", digits);
export const pressure = (v: number, digits?: number) => amount(v, "pressure", digits);
/** A count, ratio or life: shown as it is in every unit system. */
export const n = (v: number, digits?: number) => amount(v, "plain", digits);

/** The first end of a range, written without its unit: `${bare(MPa(lo))}–${MPa(hi)}` reads "150–330 MPa". */
export function bare(a: PhraseAmount): PhraseAmount {
  return { ...a, bare: true };
}

function siText(a: PhraseAmount): string {
  const unit = a.bare ? "" : unitLabel(a.quantity, SI_UNITS);
  const value = fmt(a.value ?? Number.POSITIVE_INFINITY, a.digits);
  return unit ? `${value} ${unit}` : value;
}

/** A phrase from a template: `say\`σvm = ${MPa(x)} against …\``; a plain string interpolated stays words. */
export function say(strings: TemplateStringsArray, ...values: (PhraseAmount | string)[]): Phrase {
  const parts: Phrase["parts"] = [];
  let text = "";
  strings.forEach((s, i) => {
    if (s) {
      parts.push(s);
      text += s;
    }
    if (i < values.length) {
      const v = values[i];
      if (typeof v === "string") {
        parts.push(v);
        text += v;
      } else {
        parts.push(v);
        text += siText(v);
      }
    }
  });
  return { text, parts };
}

/** Phrases joined by a separator, as one phrase. */
export function joined(phrases: readonly Phrase[], separator: string): Phrase {
  return phrases.reduce<Phrase>(
    (acc, p, i) => ({ text: acc.text + (i ? separator : "") + p.text, parts: [...acc.parts, ...(i ? [separator] : []), ...p.parts] }),
    { text: "", parts: [] },
  );
}

/**
 * A warning as the engine collects it: a phrase when it carries amounts, or plain words (a phrase
 * with no amounts). The result keeps both forms side by side: `warnings` in SI text and
 * `warningParts` for the faces.
 */
export type Warning = Phrase | string;

/** A warning's text in SI, as the result's `warnings` holds it. */
export function warningText(w: Warning): string {
  return typeof w === "string" ? w : w.text;
}

/** A warning's parts, words and amounts, as the result's `warningParts` holds them. */
export function warningParts(w: Warning): Phrase["parts"] {
  return typeof w === "string" ? [w] : w.parts;
}
