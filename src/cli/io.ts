/**
 * @module cli/io
 * What every command is handed to talk to the world, and the reading they share: the Io streams
 * (standard input, output and error; buffers in the tests), reading a stream whole, and reading the
 * JSON document a command is given as a file or "-" for standard input, with an unreadable file or
 * text that is not JSON turned into an errors document rather than an exception. Relies on node:fs
 * alone.
 */
import { readFileSync } from "node:fs";

export interface Io {
  stdin: NodeJS.ReadableStream & { isTTY?: boolean };
  stdout: { write(s: string | Uint8Array): unknown };
  stderr: { write(s: string): unknown };
}

export async function readAll(stream: NodeJS.ReadableStream): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(Buffer.isBuffer(chunk) ? chunk : Buffer.from(chunk as string));
  return Buffer.concat(chunks).toString("utf8");
}

/** Read a JSON document from a file or "-" (standard input); problems come back as an errors document. */
export async function readJsonArg(
  file: string | undefined,
  io: Io,
): Promise<{ ok: true; value: unknown } | { ok: false; errors: { path: string; message: string }[] }> {
  if (!file) return { ok: false, errors: [{ path: "(file)", message: "give a check file, or - to read standard input" }] };
  let text: string;
  try {
    text = file === "-" ? await readAll(io.stdin) : readFileSync(file, "utf8");
  } catch (err) {
    return {
      ok: false,
      errors: [{ path: "(file)", message: `cannot read ${file}: ${(err as NodeJS.ErrnoException).code ?? (err as Error).message}` }],
    };
  }
  try {
    return { ok: true, value: JSON.parse(text) };
  } catch (err) {
    return { ok: false, errors: [{ path: "(document)", message: `not valid JSON: ${(err as Error).message}` }] };
  }
}
