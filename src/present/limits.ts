/**
 * @module present/limits
 * An error that states a limit, in the form's units. The schema writes its messages in SI
 * ("the wall thickness must be at most 10000"); the form shows and reads inches, ksi or feet. The
 * limits live once, as the schema's metadata (src/schema/inputs.ts), with the one sentence that
 * states them (src/schema/check.ts, limitMessage): a message that is that sentence for one of its
 * field's limits is written again with the limit converted, and any other message is left as it is.
 */
import type { FieldError } from "../schema/errors.ts";
import { limitMessage } from "../schema/check.ts";
import { NUMBER_INPUTS, registryPath } from "../schema/inputs.ts";
import type { Units } from "../schema/units.ts";
import { quantity } from "./numbers.ts";

/** The message of a field error with any limit it states in `units`. */
export function messageInUnits(e: FieldError, units: Units): string {
  const info = NUMBER_INPUTS.get(registryPath(e.path));
  if (!info?.limits || info.quantity === "plain") return e.message;
  for (const l of info.limits)
    if (e.message === limitMessage(info.words, l.relation, l.text, l.why))
      return limitMessage(info.words, l.relation, quantity(l.value, info.quantity, units), l.why);
  return e.message;
}
