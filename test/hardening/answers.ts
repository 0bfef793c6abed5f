/** What every answer of the server must look like, whatever it was sent. */
import { expect } from "vitest";

/** Generous: a request that has not answered by then is taken as hung, whatever the machine. */
export const HANG_LIMIT_MS = 30_000;

/** The answer, or a rejection naming the request if none came within HANG_LIMIT_MS. */
export async function bounded<T>(what: string, answer: T | Promise<T>): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const hung = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`no answer within ${HANG_LIMIT_MS / 1000} s: ${what}`)), HANG_LIMIT_MS);
  });
  try {
    return await Promise.race([answer, hung]);
  } finally {
    clearTimeout(timer);
  }
}

/** An errors document: at least one entry, each naming where (path) and what (message). */
export function expectErrorsDoc(body: unknown): void {
  expect(body).toEqual({ errors: expect.any(Array) });
  const errors = (body as { errors: unknown[] }).errors;
  expect(errors.length).toBeGreaterThan(0);
  for (const e of errors) {
    expect(e).toEqual({ path: expect.any(String), message: expect.any(String) });
    const { path, message } = e as { path: string; message: string };
    expect(path.trim()).not.toBe("");
    expect(message.trim()).not.toBe("");
  }
}

/** Paths of numbers in `value` that JSON cannot carry (NaN, ±Infinity): JSON.stringify would turn them into null unseen. */
export function nonFiniteNumbers(value: unknown): string[] {
  const bad: string[] = [];
  const stack: { path: string; v: unknown }[] = [{ path: "", v: value }];
  for (let item = stack.pop(); item; item = stack.pop()) {
    const { path, v } = item;
    if (typeof v === "number" && !Number.isFinite(v)) bad.push(`${path || "(root)"} = ${v}`);
    else if (v !== null && typeof v === "object")
      for (const [k, c] of Object.entries(v)) stack.push({ path: path ? `${path}.${k}` : k, v: c });
  }
  return bad;
}

/** A result document as the format promises it: the verdict, and numbers that are finite or null. */
export function expectResult(body: unknown): void {
  expect(body).toMatchObject({
    format: "hoopwise.result/1",
    verdict: expect.stringMatching(/^(pass|fail|refer)$/),
    steps: expect.any(Array),
    warnings: expect.any(Array),
  });
  expect(nonFiniteNumbers(body)).toEqual([]);
}
