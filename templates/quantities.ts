import { fromSI, unitLabel, type Quantity, type Units } from "../src/schema/units.ts";
import { sig } from "./format.ts";

/** The SI unit the engine works in, per quantity. */
const SI_LABEL: Record<Quantity, string> = {
  length: "mm",
  stress: "MPa",
  pressure: "MPa",
  altitude: "m",
  toughness: "MPa·√m",
  plain: "",
};

/** A quantity in the user's unit, with the SI value beside it when the two differ. */
export interface Dual {
  shown: string;
  /** "" when the user's unit is the SI unit. */
  si: string;
}

export function dual(x_SI: number | null | undefined, q: Quantity, units: Units, digits = 4): Dual {
  if (x_SI === null || x_SI === undefined) return { shown: "—", si: "" };
  const unit = unitLabel(q, units);
  const shown = `${sig(fromSI(x_SI, q, units), digits)}${unit ? ` ${unit}` : ""}`;
  const siText = `${sig(x_SI, digits)}${SI_LABEL[q] ? ` ${SI_LABEL[q]}` : ""}`;
  return { shown, si: unit === SI_LABEL[q] ? "" : siText };
}

/** One line of text: "6.279 ksi (43.29 MPa)", or the SI value alone. */
export function dualText(x_SI: number | null | undefined, q: Quantity, units: Units, digits = 4): string {
  const d = dual(x_SI, q, units, digits);
  return d.si ? `${d.shown} (${d.si})` : d.shown;
}
