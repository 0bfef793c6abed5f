/**
 * @module test/web/postedForm
 * What a browser posts for a check, for the page's tests.
 */
import { unshownParts } from "../../src/web/form/carry.ts";
import { writeForm } from "../../src/web/form/index.ts";
import { unitsFrom, unitsKey, type Units } from "../../src/schema/units.ts";

/**
 * The fields a browser posts for a check as the checker draws it: its values plus the hidden units
 * and material markers, and the hidden field that carries what the form has no field for (the
 * cutout's fastener holes, for one).
 */
export function postedForm(
  doc: unknown,
  units: Units = unitsFrom((doc as { display?: Record<string, string> }).display),
): Record<string, string> {
  const carried = unshownParts(doc, units);
  return {
    ...writeForm(doc, units),
    ...(carried ? { carry: JSON.stringify(carried) } : {}),
    "units.shown": unitsKey(units),
    "units.length": units.length,
    "units.stress": units.stress,
    "units.pressure": units.pressure,
    "units.altitude": units.altitude,
    "material.shown": (doc as { material?: { id?: string } }).material?.id ?? "",
  };
}
