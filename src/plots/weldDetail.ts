/**
 * Small sketches of the weld details of the picker: a section or a plan of the shell with the
 * weld hatched, an arrow for the stress that crosses it, and a dot where the crack starts.
 * Drawn here, not copied from any table: each sketch shows only what the description says.
 */
import type { WeldDetail } from "../schema/service.ts";
import { escapeXml } from "./svgText.ts";

const W = 160;
const H = 96;
const INK = "#000";
const WELD = "#888";
const STRESS = "#0072B2";
const CRACK = "#D55E00";

function wrap(id: string, title: string, body: string): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" class="weld-sketch" data-detail="${escapeXml(id)}" viewBox="0 0 ${W} ${H}" width="${W}" height="${H}" role="img" aria-label="${escapeXml(title)}"><title>${escapeXml(title)}</title>${body}</svg>`;
}

function arrowH(x1: number, x2: number, y: number): string {
  const d = x2 > x1 ? -6 : 6;
  return `<line x1="${x1}" y1="${y}" x2="${x2}" y2="${y}" stroke="${STRESS}" stroke-width="2"/><path d="M${x2} ${y} l${d} -4 v8 z" fill="${STRESS}"/>`;
}

const crack = (x: number, y: number) => `<circle cx="${x}" cy="${y}" r="3.5" fill="${CRACK}"/>`;

const SKETCH: Record<WeldDetail, { title: string; body: string }> = {
  "longitudinal-butt": {
    title: "Longitudinal seam: two plate edges butt-welded, the hoop stress pulling across the seam",
    body:
      `<rect x="20" y="40" width="52" height="16" fill="none" stroke="${INK}" stroke-width="1.5"/>` +
      `<rect x="88" y="40" width="52" height="16" fill="none" stroke="${INK}" stroke-width="1.5"/>` +
      `<path d="M72 36 L88 36 L84 60 L76 60 Z" fill="${WELD}" stroke="${INK}"/>` +
      arrowH(18, 2, 48) +
      arrowH(142, 158, 48) +
      crack(72, 37) +
      `<text x="80" y="84" font-size="11" text-anchor="middle" font-family="sans-serif">hoop stress across</text>`,
  },
  "circumferential-butt": {
    title: "Circumferential seam welded from one side on a backing strip, the axial stress pulling across it",
    body:
      `<rect x="20" y="36" width="56" height="14" fill="none" stroke="${INK}" stroke-width="1.5"/>` +
      `<rect x="84" y="36" width="56" height="14" fill="none" stroke="${INK}" stroke-width="1.5"/>` +
      `<path d="M74 32 L86 32 L82 50 L78 50 Z" fill="${WELD}" stroke="${INK}"/>` +
      `<rect x="66" y="50" width="28" height="6" fill="none" stroke="${INK}" stroke-dasharray="3 2"/>` +
      arrowH(18, 2, 43) +
      arrowH(142, 158, 43) +
      crack(80, 51) +
      `<text x="80" y="84" font-size="11" text-anchor="middle" font-family="sans-serif">axial stress across</text>`,
  },
  "nozzle-fillet": {
    title: "Nozzle set on the shell and held by fillet welds; the crack starts at the weld toe in the shell",
    body:
      `<rect x="10" y="58" width="140" height="12" fill="none" stroke="${INK}" stroke-width="1.5"/>` +
      `<rect x="62" y="14" width="8" height="44" fill="none" stroke="${INK}" stroke-width="1.5"/>` +
      `<rect x="90" y="14" width="8" height="44" fill="none" stroke="${INK}" stroke-width="1.5"/>` +
      `<path d="M62 58 L52 58 L62 48 Z" fill="${WELD}" stroke="${INK}"/>` +
      `<path d="M98 58 L108 58 L98 48 Z" fill="${WELD}" stroke="${INK}"/>` +
      arrowH(8, 0, 64) +
      arrowH(152, 160, 64) +
      crack(52, 58) +
      crack(108, 58) +
      `<text x="80" y="88" font-size="11" text-anchor="middle" font-family="sans-serif">opening raises the stress</text>`,
  },
  "attachment-fillet": {
    title: "Attachment longer than 100 mm fillet-welded on the shell; the crack starts at the end of the weld",
    body:
      `<rect x="10" y="58" width="140" height="12" fill="none" stroke="${INK}" stroke-width="1.5"/>` +
      `<rect x="44" y="30" width="72" height="28" fill="none" stroke="${INK}" stroke-width="1.5"/>` +
      `<path d="M44 58 L36 58 L44 50 Z" fill="${WELD}" stroke="${INK}"/>` +
      `<path d="M116 58 L124 58 L116 50 Z" fill="${WELD}" stroke="${INK}"/>` +
      arrowH(8, 0, 64) +
      arrowH(152, 160, 64) +
      crack(36, 58) +
      crack(124, 58) +
      `<text x="80" y="88" font-size="11" text-anchor="middle" font-family="sans-serif">lug, pad or bracket</text>`,
  },
};

export function weldDetailSketch(id: WeldDetail): string {
  const s = SKETCH[id];
  return wrap(id, s.title, s.body);
}
