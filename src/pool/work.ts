import { checkDocument } from "../engine/index.ts";
import { parseJsonText } from "../schema/jsonText.ts";
import { MAX_JSON_DEPTH, tooDeepAt } from "../schema/depth.ts";

/**
 * One check from the text of its document to the text of its answer: parse, depth guard, validate,
 * run, serialize. The same function runs on the request thread (small bodies) and in the worker
 * pool (large ones), so both give byte-for-byte the same answer. Never throws for bad input.
 */
export interface CheckAnswer {
  /** 200 for a result, 400 for text that is not JSON, 422 for an errors document. */
  status: 200 | 400 | 422;
  body: string;
}

const errorsText = (path: string, message: string) => JSON.stringify({ errors: [{ path, message }] });

/** `what` names the text in the message when it is not JSON ("the body", "the line"). */
export function checkText(text: string, what = "the body"): CheckAnswer {
  let value: unknown;
  try {
    value = parseJsonText(text);
  } catch (err) {
    return { status: 400, body: errorsText("(document)", `${what} is not valid JSON: ${(err as Error).message}`) };
  }
  return checkValue(value);
}

export function checkValue(value: unknown): CheckAnswer {
  const deep = tooDeepAt(value);
  if (deep !== undefined)
    return { status: 422, body: errorsText(deep, `nests deeper than ${MAX_JSON_DEPTH} levels; no field of Hoopwise nests that deep`) };
  const out = checkDocument(value);
  return out.ok ? { status: 200, body: JSON.stringify(out.result) } : { status: 422, body: JSON.stringify({ errors: out.errors }) };
}
