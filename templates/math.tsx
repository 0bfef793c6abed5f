import type { Child } from "hono/jsx";
import { MINUS } from "./format.ts";

/**
 * Typesets the engine's plain-text equations the way they are written by hand: `x^(a/b)` and
 * `x^2` become superscripts, `σ_allow` a subscript, `×10^-11` a power of ten with a true minus,
 * `log10` log₁₀, and the usual engineering symbols get their subscripts (σvm → σ with "vm" set
 * low, Kt, Su). The engine writes equations in this small plain-text convention (src/engine/step.ts)
 * so that its JSON stays readable; only the sheet turns it into print.
 *
 * Output is JSX children, so every character of the text is escaped by the renderer; nothing
 * here builds HTML by hand.
 */
export function typeset(text: string): Child[] {
  const out: Child[] = [];
  let plain = "";
  const flush = () => {
    if (plain) out.push(...symbols(tidy(plain)));
    plain = "";
  };
  let i = 0;
  while (i < text.length) {
    const ch = text[i];
    if (ch === "^") {
      const group = text[i + 1] === "(" ? balanced(text, i + 1) : null;
      if (group) {
        flush();
        out.push(<sup>{typeset(group.inner)}</sup>);
        i = group.end;
        continue;
      }
      // Combining marks (x̄) belong to the letter before them.
      const token = /^[-−]?[0-9A-Za-z.'′\p{M}]+/u.exec(text.slice(i + 1));
      if (token) {
        flush();
        out.push(<sup>{tidy(token[0])}</sup>);
        i += 1 + token[0].length;
        continue;
      }
    }
    if (ch === "_" && i > 0 && /\S/.test(text[i - 1])) {
      // A Latin word (σ_allow) or one Greek letter (z_γ in "z_γσ", which is z_γ times σ).
      const token = /^(?:[0-9A-Za-z]+|[α-ωΑ-Ω])/.exec(text.slice(i + 1));
      if (token) {
        flush();
        out.push(<sub>{token[0]}</sub>);
        i += 1 + token[0].length;
        continue;
      }
    }
    plain += ch;
    i += 1;
  }
  flush();
  return out;
}

/** The group in parentheses starting at `open`, without its outer pair; null when unbalanced. */
function balanced(text: string, open: number): { inner: string; end: number } | null {
  let depth = 0;
  for (let j = open; j < text.length; j += 1) {
    if (text[j] === "(") depth += 1;
    else if (text[j] === ")") {
      depth -= 1;
      if (depth === 0) return { inner: text.slice(open + 1, j), end: j + 1 };
    }
  }
  return null;
}

/** Print typography for a run of plain text: true minus signs, spaced multiplication, log₁₀. */
function tidy(s: string): string {
  return s
    .replace(/(^|[^0-9A-Za-z.])-(?=[0-9.])/g, `$1${MINUS}`)
    .replace(/(\d)×(\d)/g, "$1 × $2")
    .replace(/\blog10\b/g, "log₁₀");
}

/**
 * Symbols the engine writes without an underscore: a stress letter with a short lower-case
 * qualifier (σa, σvm, σθ,max) and the two-letter factors and strengths (Kt, Kf, Kc, Su, Sy, Se).
 */
const SYMBOL = /([σετ])([a-zθ]{1,3}(?:,(?:max|min))?)(?![A-Za-z])|\b([KS])([tfcuye])\b/g;

function symbols(s: string): Child[] {
  const out: Child[] = [];
  let last = 0;
  for (const m of s.matchAll(SYMBOL)) {
    out.push(s.slice(last, m.index));
    out.push(m[1] ?? m[3], <sub>{m[2] ?? m[4]}</sub>);
    last = m.index + m[0].length;
  }
  out.push(s.slice(last));
  return out.filter((x) => x !== "");
}

/**
 * An equation split at its first " = " into the quantity and its expression, so the working can
 * align the equals signs of the symbolic and the substituted line; null where there is none.
 */
export function splitAtEquals(eq: string): { lhs: string; rhs: string } | null {
  const at = eq.indexOf(" = ");
  if (at <= 0) return null;
  return { lhs: eq.slice(0, at), rhs: eq.slice(at + 3) };
}
