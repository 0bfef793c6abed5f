import type { CheckResult } from "../../src/engine/index.ts";
import type { Units } from "../../src/schema/units.ts";

/** What the result views draw from: the engine's result (which carries the values it was worked at) and the display units. */
export interface ResultView {
  result: CheckResult;
  units: Units;
  /** The check encoded for a link (`?c=`). */
  link: string;
  /** What a solve button asked for, if one did. */
  solve?: "thickness" | "pressure";
}
