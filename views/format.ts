/**
 * The page's names for the shared number formats of src/present/numbers.ts: one algorithm for
 * the page, the sheet, the records and the command line. Lives read with three significant figures
 * on the page (a headline), four on the sheet (a record to redo by hand).
 */
import { life, reserve } from "../src/present/numbers.ts";

export { inUnits, quantity, sig } from "../src/present/numbers.ts";

/** A life in cycles on the page: null is unlimited (below the endurance limit). */
export function cycles(x: number | null | undefined, unit = "cycles"): string {
  return x === undefined ? "—" : life(x, unit, 3);
}

/** A reserve as every face shows it: a signed percentage. */
export const margin = reserve;
