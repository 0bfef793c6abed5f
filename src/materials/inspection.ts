/**
 * @module materials/inspection
 * Typical detectable crack sizes, one for each inspection method the check format names
 * (INSPECTION_METHODS in src/schema/check.ts), with the words a step prints for the method and the
 * source line it cites. The crack-growth programme (src/engine/crackProgramme.ts) takes its
 * detectable size from here when a check names the method instead of giving a size, and warns that
 * the value is typical. They sit beside the material library because, like its values, they are
 * typical figures to verify, not data of a qualified procedure.
 */
import type { INSPECTION_METHODS } from "../schema/check.ts";

type Method = (typeof INSPECTION_METHODS)[number];

/**
 * Typical detectable through-crack sizes by inspection method, of the kind damage-tolerance
 * requirements assume for in-service inspection (e.g. MIL-A-83444 and its successors; from
 * memory). Typical values only: verify against a qualified inspection procedure.
 */
export const TYPICAL_DETECTABLE_MM: Record<Method, { size_mm: number; label: string }> = {
  "bolt-hole-eddy-current": { size_mm: 1.27, label: "bolt-hole eddy current (0.05 in from the hole's edge)" },
  "surface-eddy-current": { size_mm: 2.54, label: "surface eddy current (0.1 in)" },
  "detailed-visual": { size_mm: 12.7, label: "detailed visual (0.5 in beyond the fastener head)" },
  "general-visual": { size_mm: 50.8, label: "general visual / walk-around (2 in)" },
};
export const TYPICAL_DETECTABLE_SOURCE =
  "Typical detectable sizes assumed for in-service inspection (damage-tolerance requirements such as MIL-A-83444; from memory) — typical, verify against a qualified inspection procedure";
