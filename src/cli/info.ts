import { z } from "zod";
import { MATERIALS, TYPICAL_FLAG } from "../materials/library.ts";
import { checkSchema } from "../schema/check.ts";
import { resultSchema } from "../schema/result.ts";
import type { Io } from "./io.ts";

/** `materials [--json]`: the library, each with its source and the typical-values flag. */
export function materialsCommand(args: string[], io: Io): number {
  if (args.includes("--json")) {
    io.stdout.write(`${JSON.stringify(MATERIALS, null, 2)}\n`);
    return 0;
  }
  io.stdout.write(`Material library (${TYPICAL_FLAG}):\n\n`);
  for (const m of MATERIALS) {
    io.stdout.write(
      `${m.id.padEnd(16)} ${m.name}\n${"".padEnd(16)} Su ${m.ultimate_MPa} MPa, Sy ${m.yield_MPa} MPa, E ${m.modulus_MPa} MPa, σ'f ${m.fatigueStrengthCoefficient_MPa} MPa, b ${m.fatigueStrengthExponent}` +
        `${m.enduranceLimit_MPa ? `, Se ${m.enduranceLimit_MPa} MPa` : ""}\n${"".padEnd(16)} source: ${m.source}\n\n`,
    );
  }
  return 0;
}

/** `schema [--result]`: the check format, or the result format, as JSON Schema generated from its zod schema (the one definition). */
export function schemaCommand(args: string[], io: Io): number {
  const result = args.includes("--result");
  const schema = result
    ? z.toJSONSchema(resultSchema, { io: "output", unrepresentable: "any" })
    : z.toJSONSchema(checkSchema, { io: "input", unrepresentable: "any" });
  const head = result
    ? { $id: "https://hoopwise.invalid/schema/result-1.json", title: "Hoopwise result, format hoopwise.result/1" }
    : { $id: "https://hoopwise.invalid/schema/check-1.json", title: "Hoopwise check, format hoopwise.check/1" };
  io.stdout.write(`${JSON.stringify({ ...head, ...schema }, null, 2)}\n`);
  return 0;
}
