/**
 * Reading the plots back as a reader would: tags must balance, and a value is recovered
 * from a pixel through the tick marks printed on the axis, not through the plot's own scale.
 */
import { expect } from "vitest";

/** Fails unless the SVG is one well-formed element tree with no raw '<' or '&' in text or attributes. */
export function assertWellFormed(svg: string): void {
  expect(wellFormedProblems(svg)).toEqual([]);
}

function wellFormedProblems(svg: string): string[] {
  const problems: string[] = [];
  if (!svg.startsWith("<svg ")) problems.push("does not start with <svg");
  if (!svg.trimEnd().endsWith("</svg>")) problems.push("does not end with </svg>");
  const stack: string[] = [];
  const tag = /<(\/?)([a-zA-Z][\w:-]*)((?:\s+[\w:-]+="[^"]*")*)\s*(\/?)>/g;
  const badText = (text: string, where: string) => {
    if (/</.test(text)) problems.push(`raw < ${where}: ${text.slice(0, 40)}`);
    if (/&(?!(amp|lt|gt|quot|apos);)/.test(text)) problems.push(`raw & ${where}: ${text.slice(0, 40)}`);
  };
  let last = 0;
  for (let m = tag.exec(svg); m; m = tag.exec(svg)) {
    badText(svg.slice(last, m.index), "in text");
    last = tag.lastIndex;
    const [, closing, name, attrs, selfClosing] = m;
    for (const a of attrs.matchAll(/="([^"]*)"/g)) badText(a[1], `in an attribute of <${name}>`);
    if (closing) {
      const open = stack.pop();
      if (open !== name) problems.push(`</${name}> closes <${open}>`);
    } else if (!selfClosing) stack.push(name);
  }
  badText(svg.slice(last), "after the last tag");
  if (stack.length) problems.push(`unclosed: ${stack.join(", ")}`);
  return problems;
}

export interface TickMark {
  value: number;
  px: number;
}

export function ticks(svg: string, axis: "x" | "y"): TickMark[] {
  const re = new RegExp(`class="tick-${axis}" data-value="([^"]+)" transform="translate\\(([^,]+),([^)]+)\\)"`, "g");
  return [...svg.matchAll(re)].map((m) => ({ value: Number(m[1]), px: Number(axis === "x" ? m[2] : m[3]) }));
}

export function tickLabels(svg: string, axis: "x" | "y"): string[] {
  const re = new RegExp(`class="tick-${axis}"[^>]*>.*?<text[^>]*>([^<]*)</text>`, "g");
  return [...svg.matchAll(re)].map((m) => decode(m[1]));
}

/** Value → pixel through the first and last printed ticks, linear or logarithmic. */
export function axisMap(svg: string, axis: "x" | "y", kind: "linear" | "log"): (v: number) => number {
  const t = ticks(svg, axis);
  expect(t.length).toBeGreaterThanOrEqual(2);
  const f = kind === "log" ? Math.log10 : (v: number) => v;
  const a = t[0];
  const b = t[t.length - 1];
  const map = (v: number) => a.px + ((f(v) - f(a.value)) / (f(b.value) - f(a.value))) * (b.px - a.px);
  // Every printed tick must agree with the same map, or the axis itself is wrong.
  for (const m of t) expect(map(m.value)).toBeCloseTo(m.px, 0);
  return map;
}

/** Pixel → value, the inverse of axisMap. */
export function axisRead(svg: string, axis: "x" | "y", kind: "linear" | "log"): (px: number) => number {
  const t = ticks(svg, axis);
  const a = t[0];
  const b = t[t.length - 1];
  const f = kind === "log" ? Math.log10 : (v: number) => v;
  return (px: number) => {
    const u = f(a.value) + ((px - a.px) / (b.px - a.px)) * (f(b.value) - f(a.value));
    return kind === "log" ? 10 ** u : u;
  };
}

/** The opening tags that carry the given attribute text, e.g. `class="operating-point"`. */
export function elements(svg: string, marker: string): string[] {
  return [...svg.matchAll(/<[a-z]+\b[^>]*>/g)].map((m) => m[0]).filter((t) => t.includes(marker));
}

export function attr(tag: string, name: string): number {
  const m = tag.match(new RegExp(`\\s${name}="([^"]*)"`));
  expect(m, `${name} in ${tag}`).not.toBeNull();
  return Number(m![1]);
}

/** Vertices of a path written as M x,y L x,y … (as d3-shape writes them). */
export function pathPoints(tag: string): [number, number][] {
  const d = tag.match(/\sd="([^"]*)"/)![1];
  return [...d.matchAll(/[ML](-?[\d.]+(?:e-?\d+)?),(-?[\d.]+(?:e-?\d+)?)/g)].map((m) => [Number(m[1]), Number(m[2])]);
}

/** All text a reader sees, tags removed and entities decoded, lines joined by newlines. */
export function visibleText(svg: string): string {
  return [...svg.matchAll(/<text[^>]*>(.*?)<\/text>/g)].map((m) => decode(m[1].replace(/<[^>]+>/g, ""))).join("\n");
}

export function decode(s: string): string {
  return s
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&quot;/g, '"')
    .replace(/&apos;/g, "'")
    .replace(/&amp;/g, "&");
}

/** No artefact of a failed computation anywhere in the markup. */
export function assertNoArtefacts(svg: string): void {
  expect(svg).not.toMatch(/NaN|Infinity|undefined|null/);
}
