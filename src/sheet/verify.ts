/**
 * Verify a check sheet from the sheet alone:
 *
 *   const report = await verifySheet(pdfBytes);
 *   report.ok        // the input is intact and this engine gives the recorded results
 *   report.problems  // why not, in plain words
 *
 * 1. The attached input (INPUT_ATTACHMENT) is found and is a valid check.
 * 2. Its fingerprint, recomputed with the engine version the sheet names, equals the one the
 *    sheet records: the input has not been changed since the sheet was printed.
 * 3. This engine, run on that input, gives the verdict and results recorded in the sheet
 *    (RESULT_ATTACHMENT), to 1 part in 10⁹.
 *
 * 4. A sheet printed from the records carries its sign-offs with Ed25519 signatures
 *    (SIGNOFFS_ATTACHMENT). Given the records' public key (a file, or GET /api/v1/keys), each
 *    signature is checked over the check id, revision, fingerprint, role, user id, name and
 *    time, and the fingerprint it names must be the attached input's. A sheet whose sign-offs
 *    do not all verify does not verify. Without a key the sign-offs are reported unchecked.
 *
 * The fingerprint alone is a checksum, not a signature: someone who rewrites the input, the
 * record and the metadata together makes a consistent forgery of an unsigned sheet. The
 * signatures are what a forger cannot make without the records' private key.
 */
import { ENGINE_VERSION, InputError, runCheck, type CheckResult, type Verdict } from "../engine/index.ts";
import { fingerprint } from "../engine/fingerprint.ts";
import { parseCheck } from "../engine/input.ts";
import type { FieldError } from "../schema/errors.ts";
import { INPUT_ATTACHMENT } from "../schema/attachments.ts";
import { extractAttachment, readSheetInfo, type SheetInfoFound } from "./attach.ts";
import { compareRecords, readRecord, recordOf, RESULT_ATTACHMENT, type Difference, type SheetRecord } from "./record.ts";
import { checkSignoffs, publicKeyFrom, readSignoffs, type SheetSignoffs, type SignoffCheck } from "./signatures.ts";

function checkSignatures(
  report: VerifyReport,
  signed: SheetSignoffs | null,
  input: unknown,
  options: VerifyOptions,
  problem: (p: string) => void,
): void {
  if (!signed) {
    report.notes.push("The sheet carries no signed sign-offs: any names written on it are not proven by the records.");
    return;
  }
  report.signoffs.attached = true;
  report.signoffs.keyFingerprint = signed.keyFingerprint;
  const keys: { key: import("node:crypto").KeyObject; fingerprint: string }[] = [];
  for (const pem of options.publicKeys ?? []) {
    try {
      keys.push(publicKeyFrom(pem));
    } catch (err) {
      problem(`A key given to verify with cannot be read: ${(err as Error).message}.`);
    }
  }
  if (keys.length === 0) {
    if (signed.signoffs.length > 0)
      report.notes.push(
        `The sheet carries ${signed.signoffs.length} signed sign-off${signed.signoffs.length === 1 ? "" : "s"}, not checked: give the records' public key (--key KEY.pem, or --records URL) to check them.`,
      );
    return;
  }
  report.signoffs.checked = true;
  report.signoffs.each = checkSignoffs(signed, input, keys);
  for (const s of report.signoffs.each) {
    if (!s.valid) problem(`The ${s.role} sign-off by ${s.name} does not verify: ${s.why}.`);
  }
}

export interface VerifyReport {
  /** True when the input is intact and this engine reproduces the recorded results. */
  ok: boolean;
  input: { found: boolean; valid: boolean; errors: FieldError[] };
  fingerprint: {
    /** As recorded in the PDF's document information (and printed on every page). */
    recorded: string | null;
    /** Of the attached input, with the engine version the sheet names. */
    recomputed: string | null;
    matches: boolean;
    /** What a sheet printed now, by this engine, would carry. */
    thisEngine: string | null;
  };
  engine: { recorded: string | null; now: string; same: boolean };
  results: {
    /** Whether the sheet carries a results record. */
    recorded: boolean;
    verdictThen: Verdict | null;
    verdictNow: Verdict | null;
    matches: boolean;
    differences: Difference[];
  };
  signoffs: {
    /** Whether the sheet carries signed sign-offs. */
    attached: boolean;
    /** Whether a public key was given to check them with. */
    checked: boolean;
    keyFingerprint: string | null;
    each: SignoffCheck[];
  };
  /** Why the sheet does not verify, one sentence each; empty when it does. */
  problems: string[];
  /** Things worth knowing that do not fail the sheet. */
  notes: string[];
}

/**
 * A check may carry a pressure history of up to 5 000 000 points (the schema's limit), some
 * 100 MB of JSON at worst; the cap still refuses a small PDF that inflates without end.
 */
const MAX_INPUT_BYTES = 128 * 1024 * 1024;

export interface VerifyOptions {
  /** Public keys (PEM) to check the sign-off signatures with. */
  publicKeys?: readonly string[];
}

export async function verifySheet(pdf: Uint8Array, options: VerifyOptions = {}): Promise<VerifyReport> {
  const report: VerifyReport = {
    ok: false,
    input: { found: false, valid: false, errors: [] },
    fingerprint: { recorded: null, recomputed: null, matches: false, thisEngine: null },
    engine: { recorded: null, now: ENGINE_VERSION, same: false },
    results: { recorded: false, verdictThen: null, verdictNow: null, matches: false, differences: [] },
    signoffs: { attached: false, checked: false, keyFingerprint: null, each: [] },
    problems: [],
    notes: [],
  };
  const problem = (p: string) => report.problems.push(p);

  let info: SheetInfoFound;
  let inputBytes: Uint8Array | null;
  try {
    info = await readSheetInfo(pdf);
    inputBytes = await extractAttachment(pdf, INPUT_ATTACHMENT, { maxBytes: MAX_INPUT_BYTES });
  } catch (err) {
    problem(`The file cannot be read as a PDF: ${(err as Error).message}`);
    return report;
  }
  report.fingerprint.recorded = info.fingerprint ?? null;
  report.engine.recorded = info.engineVersion ?? null;
  report.engine.same = info.engineVersion === ENGINE_VERSION;
  if (!info.fingerprint)
    problem("The PDF records no fingerprint: it is not a Hoopwise check sheet, or its document information was rewritten.");
  if (!info.engineVersion) problem("The PDF does not name the engine version that made it.");

  let signed: SheetSignoffs | null = null;
  try {
    signed = await readSignoffs(pdf);
  } catch (err) {
    problem((err as Error).message);
  }

  let record: SheetRecord | null = null;
  try {
    record = await readRecord(pdf);
  } catch (err) {
    problem((err as Error).message);
  }
  report.results.recorded = record !== null;
  report.results.verdictThen = record?.verdict ?? null;
  if (!record) problem(`The PDF carries no results record (${RESULT_ATTACHMENT}), so its results cannot be compared.`);
  else if (info.fingerprint && record.fingerprint !== info.fingerprint) {
    problem("The results record and the document information carry different fingerprints: one of them was changed.");
  }

  if (!inputBytes) {
    problem(`No input is attached (${INPUT_ATTACHMENT}): the sheet cannot be recomputed.`);
    return report;
  }
  report.input.found = true;
  let json: unknown;
  try {
    json = JSON.parse(new TextDecoder("utf-8", { fatal: true }).decode(inputBytes));
  } catch (err) {
    problem(`The attached input is not valid JSON: ${(err as Error).message}`);
    return report;
  }
  const parsed = parseCheck(json);
  if (!parsed.ok) {
    report.input.errors = parsed.errors;
    problem(
      `The attached input is not a valid check (${parsed.errors.length} problem${parsed.errors.length === 1 ? "" : "s"}, listed under input.errors).`,
    );
    return report;
  }
  report.input.valid = true;
  const document = parsed.value.document;
  checkSignatures(report, signed, document, options, problem);
  report.fingerprint.thisEngine = fingerprint(document, ENGINE_VERSION);
  if (info.engineVersion) {
    report.fingerprint.recomputed = fingerprint(document, info.engineVersion);
    report.fingerprint.matches = report.fingerprint.recomputed === info.fingerprint;
    if (info.fingerprint && !report.fingerprint.matches) {
      problem("The attached input does not match the recorded fingerprint: the input was changed after the sheet was printed.");
    }
  }

  let result: CheckResult;
  try {
    result = runCheck(parsed.value);
  } catch (err) {
    if (!(err instanceof InputError)) throw err;
    report.input.errors = [{ path: err.path, message: err.message }];
    problem(`This engine cannot compute the attached input: ${err.message}`);
    return report;
  }
  report.results.verdictNow = result.verdict;
  if (record) {
    const differences = compareRecords(record, recordOf(result));
    report.results.differences = differences;
    report.results.matches = differences.length === 0;
    if (!report.results.matches) {
      problem(
        report.engine.same
          ? `This engine gives different results from those recorded (${differences.length} difference${differences.length === 1 ? "" : "s"}): the record was changed.`
          : `This engine (${ENGINE_VERSION}) gives different results from the one that printed the sheet (${info.engineVersion}): ${differences.length} difference${differences.length === 1 ? "" : "s"}. Re-issue the sheet.`,
      );
    }
  }
  if (info.engineVersion && !report.engine.same && report.results.matches) {
    report.notes.push(
      `Printed by ${info.engineVersion}; this engine is ${ENGINE_VERSION} and gives the same results. A sheet printed now would carry the fingerprint ${report.fingerprint.thisEngine}.`,
    );
  }
  report.notes.push("Compare the fingerprint above with the one printed on every page of the paper copy: the two must be the same.");
  report.ok = report.problems.length === 0;
  return report;
}
