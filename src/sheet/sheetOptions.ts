import { z } from "zod";
import { type FieldError, toFieldErrors } from "../schema/errors.ts";
import { ROLES } from "../schema/signoff.ts";
import type { SignOff } from "../../templates/sheet.tsx";

/**
 * The sheet's own options, checked like the check itself: a face may pass them on from a
 * request or a record, and a bad one must come back as an error naming the field, not as a
 * strange sheet.
 */

const optionsSchema = z.strictObject({
  paper: z.enum(["A4", "Letter"], { error: 'paper must be "A4" or "Letter"' }).default("A4"),
  revision: z.int({ error: "the revision must be a whole number" }).min(1, { error: "the revision must be 1 or more" }).optional(),
  signoffs: z
    .array(
      // Not strict: the records hand over their sign-off rows, which carry more than the sheet prints.
      z.object({
        role: z.enum(ROLES, { error: `role must be ${ROLES.map((r) => `"${r}"`).join(", ")}` }),
        name: z
          .string({ error: "the name must be text" })
          .trim()
          .min(1, { error: "the name must not be empty" })
          .max(200, { error: "the name must be at most 200 characters" }),
        signedAt: z
          .string({ error: "signedAt must be text" })
          .min(1, { error: "signedAt must not be empty" })
          .max(100, { error: "signedAt must be at most 100 characters" }),
        signature: z.string({ error: "signature must be text" }).max(200, { error: "signature must be at most 200 characters" }).optional(),
      }),
      { error: "signoffs must be a list" },
    )
    .max(3, { error: "at most three sign-offs: prepared, checked and approved" })
    .default([])
    .superRefine((list, ctx) => {
      const seen = new Set<string>();
      list.forEach((s, i) => {
        if (seen.has(s.role)) ctx.addIssue({ code: "custom", path: [i, "role"], message: `the role "${s.role}" is signed twice` });
        seen.add(s.role);
      });
    }),
  superseded: z.boolean({ error: "superseded must be true or false" }).default(false),
  calcNumber: z.string({ error: "calcNumber must be text" }).max(100, { error: "calcNumber must be at most 100 characters" }).optional(),
  importedUnsigned: z.boolean({ error: "importedUnsigned must be true or false" }).default(false),
  keyFingerprint: z
    .string({ error: "keyFingerprint must be text" })
    .regex(/^[0-9a-f]{64}$/, { error: "keyFingerprint must be 64 hexadecimal digits" })
    .optional(),
});

export interface SheetLayoutOptions {
  paper: "A4" | "Letter";
  revision?: number;
  signoffs: SignOff[];
  superseded: boolean;
  calcNumber?: string;
  importedUnsigned: boolean;
  keyFingerprint?: string;
}

export function parseSheetOptions(opts: unknown): { ok: true; value: SheetLayoutOptions } | { ok: false; errors: FieldError[] } {
  const parsed = optionsSchema.safeParse(opts);
  if (parsed.success) return { ok: true, value: parsed.data };
  return { ok: false, errors: toFieldErrors(parsed.error.issues, opts, "(sheet)") };
}
