/**
 * @module cli/sheet
 * The two commands about the printed sheet. `sheet` prints a check to PDF through the sheet
 * builder (src/sheet/sheet.ts, which renders in Chromium through src/pdf) and writes it so that an
 * interrupted run never leaves half a file under the name asked for. `verify` reads a sheet back,
 * recomputes it from its attached input (src/sheet/verify.ts) and checks its signed sign-offs
 * against the public keys given in a file (--key) or fetched from a records server (--records);
 * its report is printed for a person or as JSON. Each is handed the arguments and the Io (io.ts)
 * and answers an exit code. The small option parser both use is here too.
 */
import { readFileSync, renameSync, rmSync, writeFileSync } from "node:fs";
import { closeSharedPool } from "../pdf/browser.ts";
import { BrowserCrashedError, BrowserUnavailableError, PoolBusyError, RenderTimeoutError } from "../pdf/errors.ts";
import { renderSheet } from "../sheet/sheet.ts";
import { verifySheet, type VerifyReport } from "../sheet/verify.ts";
import { readJsonArg, type Io } from "./io.ts";

type ArgErrors = { path: string; message: string }[];

/**
 * `sheet FILE|- --out SHEET.pdf [--paper A4|Letter]`: print the check sheet.
 * Exit 0 written; 2 for invalid input or arguments (the errors document on standard output);
 * 1 with a plain message when the PDF cannot be made (no Chromium, a render that fails) or written.
 * `--out -` writes the PDF to standard output.
 */
export async function sheetCommand(args: string[], io: Io): Promise<number> {
  const parsed = parseArgs(args, { values: ["--out", "--paper"], flags: [] });
  const errors: ArgErrors = [...parsed.errors];
  const out = parsed.values["--out"];
  const paper = parsed.values["--paper"] ?? "A4";
  if (parsed.positional.length !== 1) errors.push({ path: "(file)", message: "give one check file, or - to read standard input" });
  if (!out) errors.push({ path: "--out", message: "give the PDF to write with --out SHEET.pdf (or --out - for standard output)" });
  if (paper !== "A4" && paper !== "Letter") errors.push({ path: "--paper", message: `the paper must be A4 or Letter (got "${paper}")` });
  if (errors.length) return fail(io, errors);

  const doc = await readJsonArg(parsed.positional[0], io);
  if (!doc.ok) return fail(io, doc.errors);
  try {
    const sheet = await renderSheet(doc.value, { paper: paper as "A4" | "Letter" });
    if (!sheet.ok) return fail(io, sheet.errors);
    if (out === "-") io.stdout.write(sheet.pdf);
    else writeAtomically(out!, sheet.pdf);
    io.stderr.write(
      `wrote ${out === "-" ? "the sheet to standard output" : out}: verdict ${sheet.result.verdict} (${sheet.result.verdictMeaning}), fingerprint ${sheet.fingerprint}\n`,
    );
    return 0;
  } catch (err) {
    if (isRenderError(err)) {
      io.stderr.write(`hoopwise: cannot make the sheet: ${err.message}\n`);
      return 1;
    }
    if ((err as NodeJS.ErrnoException).code) {
      io.stderr.write(`hoopwise: cannot write ${out}: ${(err as NodeJS.ErrnoException).code}\n`);
      return 1;
    }
    throw err;
  } finally {
    // A running Chromium would keep the process alive after the command is done.
    await closeSharedPool();
  }
}

/**
 * `verify SHEET.pdf [--json]`: recompute a sheet from its attached input.
 * Exit 0 when it verifies, 1 when it does not (with the report saying why), 2 when the
 * arguments are wrong or the file cannot be read.
 */
export async function verifyCommand(args: string[], io: Io): Promise<number> {
  const parsed = parseArgs(args, { values: ["--key", "--records"], flags: ["--json"] });
  const json = parsed.flags.has("--json");
  const errors: ArgErrors = [...parsed.errors];
  if (parsed.positional.length !== 1) errors.push({ path: "(file)", message: "give one sheet to verify: verify SHEET.pdf" });
  const publicKeys: string[] = [];
  const keyFile = parsed.values["--key"];
  if (keyFile) {
    try {
      publicKeys.push(readFileSync(keyFile, "utf8"));
    } catch (err) {
      errors.push({ path: "--key", message: `cannot read ${keyFile}: ${(err as NodeJS.ErrnoException).code ?? (err as Error).message}` });
    }
  }
  const records = parsed.values["--records"];
  if (records) {
    const fetched = await fetchKeys(records);
    if (fetched.ok) publicKeys.push(...fetched.keys);
    else errors.push({ path: "--records", message: fetched.message });
  }
  if (errors.length) return json ? fail(io, errors) : usage(io, errors);
  const file = parsed.positional[0];
  let bytes: Uint8Array;
  try {
    bytes = readFileSync(file);
  } catch (err) {
    const e = [{ path: "(file)", message: `cannot read ${file}: ${(err as NodeJS.ErrnoException).code ?? (err as Error).message}` }];
    return json ? fail(io, e) : usage(io, e);
  }
  const report = await verifySheet(bytes, { publicKeys });
  io.stdout.write(json ? `${JSON.stringify(report, null, 2)}\n` : formatReport(file, report));
  return report.ok ? 0 : 1;
}

/** The records' public keys from GET /api/v1/keys at `base` (http or https). */
async function fetchKeys(base: string): Promise<{ ok: true; keys: string[] } | { ok: false; message: string }> {
  let url: URL;
  try {
    url = new URL("/api/v1/keys", base);
  } catch {
    return { ok: false, message: `"${base}" is not an address such as https://records.example.org` };
  }
  if (url.protocol !== "http:" && url.protocol !== "https:") return { ok: false, message: "give an http or https address" };
  try {
    const res = await fetch(url, { signal: AbortSignal.timeout(10_000) });
    if (!res.ok) return { ok: false, message: `${url} answered ${res.status}` };
    const body = (await res.json()) as { keys?: { publicKeyPem?: unknown }[] };
    const keys = (body.keys ?? []).map((k) => k.publicKeyPem).filter((k): k is string => typeof k === "string");
    return keys.length ? { ok: true, keys } : { ok: false, message: `${url} serves no public key` };
  } catch (err) {
    return { ok: false, message: `cannot fetch ${url}: ${(err as Error).message}` };
  }
}

/** The report as a person reads it in a terminal. */
export function formatReport(file: string, r: VerifyReport): string {
  const lines = [
    `Sheet ${file}: ${r.ok ? "VERIFIED" : "DOES NOT VERIFY"}`,
    "",
    `  Input attached        ${r.input.found ? (r.input.valid ? "yes, a valid check" : "yes, but not a valid check") : "no"}`,
    `  Fingerprint recorded  ${r.fingerprint.recorded ?? "none"}`,
    `  Fingerprint of input  ${r.fingerprint.recomputed ?? "—"}${r.fingerprint.recomputed ? (r.fingerprint.matches ? "  (matches)" : "  (DIFFERS)") : ""}`,
    `  Engine then / now     ${r.engine.recorded ?? "not named"} / ${r.engine.now}${r.engine.same ? "  (same)" : ""}`,
    `  Verdict then / now    ${r.results.verdictThen ?? "—"} / ${r.results.verdictNow ?? "—"}`,
    `  Results               ${!r.results.recorded ? "no record to compare" : r.results.verdictNow === null ? "not recomputed" : r.results.matches ? "the same as recorded" : `${r.results.differences.length} differ`}`,
  ];
  for (const d of r.results.differences.slice(0, 20)) lines.push(`      ${d.what}: then ${d.recorded}, now ${d.now}`);
  if (r.results.differences.length > 20) lines.push(`      … and ${r.results.differences.length - 20} more (use --json for all)`);
  for (const e of r.input.errors) lines.push(`      input ${e.path}: ${e.message}`);
  if (r.signoffs.attached) {
    lines.push(
      `  Sign-offs             ${r.signoffs.checked ? "checked with the key given" : "not checked (no key given)"}; records key ${r.signoffs.keyFingerprint}`,
    );
    for (const s of r.signoffs.each)
      lines.push(`      ${s.role} by ${s.name}, ${s.signedAt}: ${s.valid ? "signature valid" : `DOES NOT VERIFY (${s.why})`}`);
  } else {
    lines.push("  Sign-offs             none signed on this sheet");
  }
  if (r.problems.length) lines.push("", "Problems:", ...r.problems.map((p) => `  - ${p}`));
  if (r.notes.length) lines.push("", ...r.notes.map((n) => `  ${n}`));
  return `${lines.join("\n")}\n`;
}

function fail(io: Io, errors: ArgErrors): number {
  io.stdout.write(`${JSON.stringify({ errors }, null, 2)}\n`);
  return 2;
}

function usage(io: Io, errors: ArgErrors): number {
  for (const e of errors) io.stderr.write(`hoopwise: ${e.path}: ${e.message}\n`);
  return 2;
}

function isRenderError(err: unknown): err is Error {
  return (
    err instanceof BrowserUnavailableError ||
    err instanceof PoolBusyError ||
    err instanceof RenderTimeoutError ||
    err instanceof BrowserCrashedError
  );
}

/** Write beside the target and rename, so an interrupted run never leaves half a PDF under the name asked for. */
function writeAtomically(path: string, bytes: Uint8Array): void {
  const partial = `${path}.partial-${process.pid}`;
  try {
    writeFileSync(partial, bytes);
    renameSync(partial, path);
  } catch (err) {
    rmSync(partial, { force: true });
    throw err;
  }
}

interface Parsed {
  positional: string[];
  values: Record<string, string | undefined>;
  flags: Set<string>;
  errors: ArgErrors;
}

/** Options take their value as the next argument or after "="; a lone "-" is a file (standard input). */
function parseArgs(args: string[], spec: { values: string[]; flags: string[] }): Parsed {
  const out: Parsed = { positional: [], values: {}, flags: new Set(), errors: [] };
  for (let i = 0; i < args.length; i += 1) {
    const arg = args[i];
    if (!arg.startsWith("--")) {
      out.positional.push(arg);
      continue;
    }
    const [name, inline] = arg.includes("=") ? [arg.slice(0, arg.indexOf("=")), arg.slice(arg.indexOf("=") + 1)] : [arg, undefined];
    if (spec.flags.includes(name)) out.flags.add(name);
    else if (spec.values.includes(name)) {
      const value = inline ?? args[++i];
      if (value === undefined) out.errors.push({ path: name, message: `${name} needs a value` });
      else out.values[name] = value;
    } else out.errors.push({ path: name, message: `unknown option ${name}` });
  }
  return out;
}
