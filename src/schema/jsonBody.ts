import { illFormedAt, MAX_JSON_DEPTH, tooDeepAt } from "./depth.ts";

/** A received JSON text as a value, or the errors document that says why it is not one. Never throws. */
export type JsonBody =
  | { ok: true; value: unknown }
  | { ok: false; status: 400 | 422; body: { errors: { path: string; message: string }[] } };

const refused = (status: 400 | 422, path: string, message: string): JsonBody => ({
  ok: false,
  status,
  body: { errors: [{ path, message }] },
});

/** Malformed or absurdly nested JSON, or ill-formed Unicode, becomes an errors document naming where. */
export function jsonBody(text: string): JsonBody {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (err) {
    return refused(400, "(document)", `the body is not valid JSON: ${(err as Error).message}`);
  }
  const deep = tooDeepAt(value);
  if (deep !== undefined) return refused(422, deep, `nests deeper than ${MAX_JSON_DEPTH} levels; no field of Hoopwise nests that deep`);
  const bad = illFormedAt(value);
  if (bad !== undefined)
    return refused(422, bad, "holds ill-formed Unicode (a lone surrogate, half of a character); send the text as proper UTF-8");
  return { ok: true, value };
}
