import type { CheckResult } from "../../src/engine/index.ts";
import type { ResolvedMaterial } from "../../src/engine/input.ts";
import type { Units } from "../../src/schema/units.ts";

/** What the result views draw from: the engine's result, the material values it used, the display units. */
export interface ResultView {
  result: CheckResult;
  material: ResolvedMaterial;
  /** The Walker exponent used (for the Haigh diagram's Walker line). */
  walkerGamma: number;
  units: Units;
  /** The wall thickness checked, mm. */
  thickness_mm: number;
  /** The check encoded for a link (`?c=`). */
  link: string;
  /** What a solve button asked for, if one did. */
  solve?: "thickness" | "pressure";
}
