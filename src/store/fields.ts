import { z } from "zod";
import { type FieldError, type IssueWords, toFieldErrors } from "../schema/errors.ts";
import { InvalidRecordError } from "./errors.ts";
import { ROLES } from "./state.ts";

/**
 * The rules for every field the records take besides the check input itself,
 * written once: the store enforces them, the HTTP routes compose them into
 * request bodies so a user hears every problem in one answer.
 */

/** Long enough to be a phrase rather than a word; common practice for a shared-workstation secret. */
export const MIN_PASSPHRASE_LENGTH = 12;
/** Bounds the hashing work one request can ask for. */
export const MAX_PASSPHRASE_LENGTH = 1024;

const NO_CONTROL_CHARACTERS = /^[^\p{Cc}]*$/u;
/** A lone UTF-16 surrogate: half of a character, which no text encoding can carry. */
export const LONE_SURROGATE = /\p{Cs}/u;
export const ILL_FORMED = "holds ill-formed Unicode (a lone surrogate, half of a character); send the text as proper UTF-8";

function need(otherwise: string) {
  return (issue: { input?: unknown }) => (issue.input === undefined ? "is required" : otherwise);
}

function plainText(max: number) {
  return z
    .string({ error: need("must be text") })
    .trim()
    .min(1, "must not be empty")
    .max(max, `must be at most ${max} characters`)
    .regex(NO_CONTROL_CHARACTERS, "must not contain control characters such as line breaks")
    .refine((t) => !LONE_SURROGATE.test(t), ILL_FORMED);
}

export const titleField = plainText(200);

export const calcNumberField = plainText(40).regex(
  /^[A-Za-z0-9][A-Za-z0-9 ._/-]*$/,
  "must start with a letter or digit and hold only letters, digits, spaces and . _ / -",
);

/** A person's name as it is printed on a sheet: a signer, or whoever saved a revision. */
export const personNameField = plainText(100);

export const passphraseField = z
  .string({ error: need("must be text") })
  .refine((p) => !LONE_SURROGATE.test(p), ILL_FORMED)
  .refine((p) => [...p].length >= MIN_PASSPHRASE_LENGTH, `must be at least ${MIN_PASSPHRASE_LENGTH} characters`)
  .refine((p) => [...p].length <= MAX_PASSPHRASE_LENGTH, `must be at most ${MAX_PASSPHRASE_LENGTH} characters`);

/**
 * A passphrase offered for checking against a stored hash: no minimum, since
 * a rule tightened later must not lock anyone out; the maximum bounds the work.
 */
export const offeredPassphraseField = z
  .string({ error: need("must be text") })
  .refine((p) => !LONE_SURROGATE.test(p), ILL_FORMED)
  .refine((p) => [...p].length <= MAX_PASSPHRASE_LENGTH, `must be at most ${MAX_PASSPHRASE_LENGTH} characters`);

export const roleField = z.enum(ROLES, { error: need(`must be one of ${ROLES.map((r) => `"${r}"`).join(", ")}`) });

export const revisionNumberField = z.int({ error: need("must be a whole number") }).min(1, "must be 1 or more");

/** Turn zod's issues into Hoopwise's errors document entries, with dot paths under `prefix`. */
/** How the records word a key they do not take; the translation itself is the format's (src/schema/errors.ts). */
const RECORD_WORDS: IssueWords = {
  unknownKey: () => "is not a field this record takes",
  blankKey: (key) => `holds a field with a blank name (${JSON.stringify(key)}), which this record does not take`,
  rewordFromInput: false,
};

export function zodFieldErrors(error: z.ZodError, prefix = ""): FieldError[] {
  return toFieldErrors(error.issues, undefined, prefix, RECORD_WORDS);
}

export function joinPath(prefix: string, path: string): string {
  return prefix && path ? `${prefix}.${path}` : prefix || path;
}

/** Words for the problems the field schemas leave to zod's defaults: a missing or non-object record. */
const recordErrorMap: z.core.$ZodErrorMap = (issue) => {
  if (issue.code === "invalid_type" && issue.expected === "object") {
    return issue.input === undefined ? "is required" : "must be a JSON object";
  }
  return undefined;
};

export function safeParseFields<S extends z.ZodType>(schema: S, value: unknown): z.ZodSafeParseResult<z.output<S>> {
  return schema.safeParse(value, { error: recordErrorMap });
}

/** Parse with `schema` or throw an InvalidRecordError naming each bad field. */
export function parseFields<S extends z.ZodType>(schema: S, value: unknown, prefix = ""): z.output<S> {
  const r = safeParseFields(schema, value);
  if (!r.success) throw new InvalidRecordError(zodFieldErrors(r.error, prefix));
  return r.data;
}
