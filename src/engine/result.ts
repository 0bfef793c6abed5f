import type { z } from "zod";
import type { criterionRowSchema, resultSchema, verdictRowSchema, verdictSchema } from "../schema/result.ts";

/**
 * The result document, format "hoopwise.result/1". Its one definition is the zod schema in
 * src/schema/result.ts; the engine builds values of these types and the faces read them.
 * Keys listed in the check format never change meaning.
 */
export type CheckResult = z.infer<typeof resultSchema>;
/** "refer": the item is outside what this screening can judge and needs an analysis beyond it. */
export type Verdict = z.infer<typeof verdictSchema>;
export type VerdictRow = z.infer<typeof verdictRowSchema>;
export type CriterionRow = z.infer<typeof criterionRowSchema>;
export type SpectrumCycle = NonNullable<CheckResult["spectrum"]>["cycles"][number];
