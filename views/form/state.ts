import type { LibraryMaterial } from "../../src/materials/library.ts";
import type { FormValues } from "./fields.ts";
import type { Units } from "../../src/schema/units.ts";

/** Everything a form section needs to draw itself: the text in each field, the errors beside them, the units. */
export interface FormState {
  values: FormValues;
  /** Messages by field name. */
  errors: ReadonlyMap<string, readonly string[]>;
  units: Units;
  /** The library material whose values stand behind blank material fields, if one is chosen. */
  library?: LibraryMaterial;
  /** Rows the block table shows. */
  blockRows: readonly number[];
}
