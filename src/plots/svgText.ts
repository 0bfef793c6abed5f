/**
 * Text and attribute output. Everything placed in the SVG passes through here:
 * titles and labels may come from users, and the same markup is inlined in the web
 * page and the printed sheet, so one missed escape is a script injection.
 */
import { isFiniteNumber } from "./format.ts";

export const FONT_FAMILY = "'DejaVu Sans', 'Liberation Sans', Arial, Helvetica, sans-serif";

/** Sizes in viewBox units; at the default width of 800 printed 16 cm wide, 15 units ≈ 3 mm (8.5 pt). */
export const FONT_SIZE = { heading: 20, axisTitle: 17, tick: 15, legend: 15, note: 14 } as const;

// Control characters are not allowed in XML at all, even escaped; a pasted title may carry them.
// biome-ignore lint/suspicious/noControlCharactersInRegex: control characters are what this removes (XML 1.0 forbids them)
const XML_FORBIDDEN = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g;

export function escapeXml(s: string): string {
  return String(s)
    .replace(XML_FORBIDDEN, "")
    .replace(/[&<>"']/g, (c) => ESCAPES[c]);
}
const ESCAPES: Record<string, string> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&apos;" };

/** A coordinate or length for an attribute: two decimals are finer than any printer. */
export function num(v: number): string {
  // Callers drop non-finite points first; this is the last guard so no artefact reaches the sheet.
  if (!isFiniteNumber(v)) return "0";
  const r = Math.round(v * 100) / 100;
  return String(Object.is(r, -0) ? 0 : r);
}

/**
 * Internal labels write a subscript as `σ_{a}`; it becomes a tspan. User text never goes
 * through this markup (use `escapeXml`) so a user cannot inject tspans either.
 */
export function richText(s: string): string {
  return s
    .split(/(_\{[^}]*\})/)
    .map((part) =>
      part.startsWith("_{") && part.endsWith("}")
        ? `<tspan baseline-shift="sub" font-size="75%">${escapeXml(part.slice(2, -1))}</tspan>`
        : escapeXml(part),
    )
    .join("");
}

/** The same label as plain text, for `<title>` and aria-label. */
export function plainText(s: string): string {
  return s.replace(/_\{([^}]*)\}/g, "$1");
}

/** Rough advance width for layout: DejaVu Sans runs about 0.53 em per character in mixed text, 0.6 in bold. */
export function textWidth(s: string, size: number, bold = false): number {
  return plainText(s).length * size * (bold ? 0.6 : 0.53);
}

export interface TextStyle {
  size?: number;
  anchor?: "start" | "middle" | "end";
  weight?: "normal" | "bold";
  /** Rotate about the anchor point, degrees. */
  rotate?: number;
  /** White outline behind the glyphs so a label stays legible where it crosses a line. */
  halo?: boolean;
  /** Content uses the internal `_{sub}` markup (never set for user text). */
  rich?: boolean;
  italic?: boolean;
  className?: string;
  fill?: string;
}

export function textAt(x: number, y: number, content: string, style: TextStyle = {}): string {
  const attrs = [
    style.className ? `class="${escapeXml(style.className)}"` : "",
    `x="${num(x)}"`,
    `y="${num(y)}"`,
    `font-size="${style.size ?? FONT_SIZE.note}"`,
    style.anchor && style.anchor !== "start" ? `text-anchor="${style.anchor}"` : "",
    style.weight === "bold" ? `font-weight="bold"` : "",
    style.italic ? `font-style="italic"` : "",
    style.fill ? `fill="${escapeXml(style.fill)}"` : "",
    style.rotate ? `transform="rotate(${num(style.rotate)} ${num(x)} ${num(y)})"` : "",
    style.halo ? `stroke="#fff" stroke-width="4" stroke-linejoin="round" paint-order="stroke"` : "",
  ].filter(Boolean);
  const body = style.rich ? richText(content) : escapeXml(content);
  return `<text ${attrs.join(" ")}>${body}</text>`;
}
