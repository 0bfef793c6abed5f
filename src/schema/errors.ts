import type { z } from "zod";

/** One entry of the errors document `{"errors":[{path, message}]}`: the field in dot notation and the problem in words. */
export interface FieldError {
  path: string;
  message: string;
}

/** How unknown keys are worded: the check format names itself, a record of the store names itself. */
export interface IssueWords {
  unknownKey(key: string): string;
  blankKey(key: string): string;
  /** Word a missing value "is required" and an unknown discriminator by its choices (needs the raw input). */
  rewordFromInput: boolean;
}

export const CHECK_FORMAT_WORDS: IssueWords = {
  unknownKey: (key) => `"${key}" is not a field of the check format here; check its spelling`,
  blankKey: (key) => `a field with a blank name (${JSON.stringify(key)}) is not part of the check format`,
  rewordFromInput: true,
};

/**
 * Turn zod issues into the errors document: one entry per problem, `path` in dot notation,
 * `message` in words a user understands. The one translator for every zod schema of the
 * project (the check, the sheet's options, the records' fields). The schema carries its own
 * messages for ranges and types; this fills in the cases zod words for programmers. With the
 * raw input at hand (`rewordFromInput`), a missing value reads "is required" and an unknown discriminator names the
 * choices.
 */
export function toFieldErrors(
  issues: readonly z.core.$ZodIssue[],
  raw?: unknown,
  prefix = "",
  words: IssueWords = CHECK_FORMAT_WORDS,
): FieldError[] {
  const out: FieldError[] = [];
  for (const issue of issues) {
    const base = [prefix, issue.path.map(String).join(".")].filter(Boolean).join(".");
    if (issue.code === "unrecognized_keys") {
      for (const key of issue.keys) {
        // A key may be empty or blank; a path of spaces names nothing, so it names the object that holds the key.
        if (key.trim() === "") out.push({ path: base || "(document)", message: words.blankKey(key) });
        else out.push({ path: base ? `${base}.${key}` : key, message: words.unknownKey(key) });
      }
      continue;
    }
    let message = issue.message;
    if (words.rewordFromInput) {
      const present = valueAt(raw, issue.path) !== undefined;
      if (issue.code === "invalid_type" && !present) message = "is required";
      if (issue.code === "invalid_union" && "note" in issue && issue.note === "No matching discriminator") {
        message = present
          ? `must be one of ${(issue as { options?: unknown[] }).options?.map((o) => `"${String(o)}"`).join(", ")}`
          : "is required";
      }
    }
    out.push({ path: base || "(document)", message });
  }
  return dedupe(out);
}

function valueAt(raw: unknown, path: readonly PropertyKey[]): unknown {
  let v: unknown = raw;
  for (const key of path) {
    if (v === null || typeof v !== "object") return undefined;
    v = (v as Record<PropertyKey, unknown>)[key];
  }
  return v;
}

function dedupe(errors: FieldError[]): FieldError[] {
  const seen = new Set<string>();
  return errors.filter((e) => {
    const k = `${e.path}\u0000${e.message}`;
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
}
